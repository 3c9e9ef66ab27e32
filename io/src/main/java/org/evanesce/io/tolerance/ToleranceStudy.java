package org.evanesce.io.tolerance;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.DiagnosticText;
import org.evanesce.io.casefile.model.Parameter;
import org.evanesce.io.plan.ExactStack;
import org.evanesce.io.plan.PlanException;
import org.evanesce.solver.reference.PlanarStack;

/**
 * A tolerance study with the plane-wave model: N parts, each with the varied parameters drawn from
 * their distributions (one seeded generator, parameters drawn in the order given, so a study is
 * repeatable), and R, T and A of each part's layered stack at the case's design wavelength and source
 * angle, in its polarization.
 *
 * @param distributions what varies
 * @param values        per sample, the drawn values (SI), in the order of {@code distributions}
 * @param r             per sample
 * @param t             per sample
 * @param a             per sample (1 − R − T)
 */
public record ToleranceStudy(List<Distribution> distributions, double[][] values, double[] r, double[] t, double[] a) {

    /** The results by name, R, T, A. */
    public Map<String, double[]> results() {
        Map<String, double[]> m = new LinkedHashMap<>();
        m.put("R", r);
        m.put("T", t);
        m.put("A", a);
        return m;
    }

    /**
     * Runs the study.
     *
     * @throws ToleranceInputException a parameter the case does not have, or a drawn part the model cannot read
     */
    public static ToleranceStudy run(Path caseFile, Map<String, String> overrides, List<Distribution> dists, int samples,
                                     long seed) throws IOException, ToleranceInputException {
        CaseSpec base = read(caseFile, overrides);
        for (Distribution d : dists) {
            Parameter p = base.parameters().get(d.name());
            if (p == null) {
                throw new ToleranceInputException(String.format(Locale.ROOT, "--vary %s: %s has no parameter '%s'; its "
                        + "parameters are %s", d.written(), caseFile, d.name(), String.join(", ", base.parameters().keySet())));
            }
            if (!p.value().dimension().equals(d.dimension())) {
                throw new ToleranceInputException(String.format(Locale.ROOT, "--vary %s: the values are %s but %s is %s (%s)",
                        d.written(), d.dimension().describe(), d.name(), p.value().dimension().describe(), p.at()));
            }
        }
        Random rnd = new Random(seed);
        double[][] values = new double[samples][dists.size()];
        double[] r = new double[samples];
        double[] t = new double[samples];
        double[] a = new double[samples];
        for (int s = 0; s < samples; s++) {
            Map<String, String> set = new LinkedHashMap<>(overrides);
            for (int k = 0; k < dists.size(); k++) {
                values[s][k] = dists.get(k).draw(rnd);
                set.put(dists.get(k).name(), dists.get(k).override(values[s][k]));
            }
            ExactStack e;
            try {
                e = ExactStack.of(read(caseFile, set));
            } catch (PlanException x) {
                throw new ToleranceInputException(DiagnosticText.lines(x.diagnostics()) + "\n(sample " + (s + 1) + ": " + set + ")");
            }
            PlanarStack.Response resp;
            try {
                resp = e.stack().apply(e.wavelength()).atAngle(e.polarization(), e.wavelength(), e.angle());
            } catch (IllegalArgumentException x) {
                throw new ToleranceInputException("sample " + (s + 1) + " (" + set + "): the plane-wave model cannot be evaluated: "
                        + x.getMessage());
            }
            r[s] = resp.reflectance();
            t[s] = resp.transmittance();
            a[s] = resp.absorptance();
        }
        return new ToleranceStudy(List.copyOf(dists), values, r, t, a);
    }

    private static CaseSpec read(Path caseFile, Map<String, String> set) throws IOException, ToleranceInputException {
        try {
            return CaseLoader.read(caseFile, set).spec();
        } catch (CaseFileException e) {
            throw new ToleranceInputException(DiagnosticText.withOverrides(e.errors(), set));
        }
    }

    /** Samples meeting every requirement. */
    public long passing(List<Requirement> reqs) {
        long k = 0;
        for (int s = 0; s < t.length; s++) {
            if (passes(reqs, s)) {
                k++;
            }
        }
        return k;
    }

    boolean passes(List<Requirement> reqs, int s) {
        for (Requirement q : reqs) {
            if (!q.met(results().get(q.quantity())[s])) {
                return false;
            }
        }
        return true;
    }

    /** Lists used by the outputs. */
    static List<Object> list(double... v) {
        List<Object> l = new ArrayList<>();
        for (double x : v) {
            l.add(x);
        }
        return l;
    }
}
