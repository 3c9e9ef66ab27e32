package org.evanesce.io.fit;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.output.RunFolder;

/** A whole fit: read the curve, check the free parameters against the case, fit, print and write the results. */
public final class FitRun {

    private FitRun() {
    }

    /** A fit whose curve, free parameters and case were read and checked, ready to run. */
    public record Prepared(Path caseFile, MeasuredCurve curve, List<FreeParameter> params, FitModel model) { }

    /**
     * Reads and checks the curve, the free parameters and the case (before any folder is touched).
     *
     * @param free the --free options as written
     * @throws FitInputException bad data, options or a case the model cannot read (exit 2)
     */
    public static Prepared prepare(Path caseFile, Map<String, String> overrides, Path data, List<String> free)
            throws IOException, FitInputException {
        return prepare(caseFile, overrides, data, free, ForwardModel.TRANSFER_MATRIX, null, null, null);
    }

    /**
     * The same with a forward model.
     *
     * @param cache   the simulation model's cache folder (with {@link ForwardModel#SIMULATION})
     * @param threads the simulation's threads (null: the case's or all cores)
     * @param out     where the simulation model prints a line per run
     */
    public static Prepared prepare(Path caseFile, Map<String, String> overrides, Path data, List<String> free,
                                   ForwardModel kind, Path cache, Integer threads, PrintWriter out)
            throws IOException, FitInputException {
        MeasuredCurve curve = MeasuredCurve.read(data);
        List<FreeParameter> params = new java.util.ArrayList<>();
        for (String f : free) {
            FreeParameter p = FreeParameter.parse(f);
            if (params.stream().anyMatch(q -> q.name().equals(p.name()))) {
                throw new FitInputException("--free " + f + ": " + p.name() + " is free twice; give each parameter once");
            }
            params.add(p);
        }
        SimulationModel sim = null;
        if (kind == ForwardModel.SIMULATION) {
            if (params.stream().anyMatch(q -> q.name().equals(FreeParameter.ANGLE_OFFSET))) {
                throw new FitInputException("--free angle_offset: the simulation model takes a curve against wavelength or a "
                        + "case parameter, where no measured angle is offset");
            }
            sim = new SimulationModel(caseFile, overrides, curve, cache, threads, out);
        }
        FitModel model = new FitModel(caseFile, overrides, curve, params, kind, sim);
        CurveFit.check(model, curve, params);
        return new Prepared(caseFile, curve, params, model);
    }

    /**
     * Fits, prints the result to {@code out} and writes the files into {@code rf}.
     *
     * @return the fit's warnings (already printed)
     * @throws FitInputException a trial parameter set the model cannot evaluate (exit 2)
     */
    public static List<String> run(Prepared p, RunFolder rf, PrintWriter out, String caution) throws IOException, FitInputException {
        Path caseFile = p.caseFile();
        MeasuredCurve curve = p.curve();
        List<FreeParameter> params = p.params();
        FitModel model = p.model();
        long t0 = System.nanoTime();
        CurveFit.Result r = CurveFit.fit(model, curve, params);
        double seconds = (System.nanoTime() - t0) * 1e-9;
        out.printf(Locale.ROOT, "%s: %d points of %s against %s, %d free parameter(s); model: %s%n", caseFile, curve.size(),
                curve.measured(), curve.swept(), params.size(), model.kind().description);
        for (int k = 0; k < params.size(); k++) {
            FreeParameter f = params.get(k);
            out.printf(Locale.ROOT, "  %-14s %s +/- %s   (bounds %s .. %s)%n", f.name(), Units.format(r.values()[k], f.dimension(), 6),
                    Units.format(r.errors()[k], f.dimension(), 2), Units.format(f.low(), f.dimension()),
                    Units.format(f.high(), f.dimension()));
        }
        out.printf(Locale.ROOT, "chi-square %.6g for %d degrees of freedom (reduced %.4g)%s; %d iterations, %d evaluations, "
                        + "%d case reads in %.1f s%n", r.chiSquare(), r.dof(), r.reducedChiSquare(), curve.u() == null
                        ? "; no uncertainties given, so the standard errors are scaled by the reduced chi-square" : "",
                r.iterations(), r.evaluations(), model.caseReads(), seconds);
        if (model.simulations() != null) {
            out.println(model.simulations());
        }
        for (String w : r.warnings()) {
            out.println("warning: " + w);
        }
        FitOutputs.write(rf, caseFile, curve, params, r, caution, model.kind().description);
        return r.warnings();
    }
}
