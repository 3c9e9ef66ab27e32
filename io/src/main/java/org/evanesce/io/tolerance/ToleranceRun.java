package org.evanesce.io.tolerance;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.output.RunFolder;

/** A whole tolerance study: options checked, parts drawn and evaluated, results printed and written. */
public final class ToleranceRun {

    /** The most parts one study draws (a million plane-wave evaluations take some minutes). */
    public static final int MAX_SAMPLES = 1_000_000;

    private ToleranceRun() {
    }

    /** A study whose options and case were checked. */
    public record Prepared(Path caseFile, Map<String, String> overrides, List<Distribution> vary, List<Requirement> require) { }

    /**
     * Checks the options and that the case's mean part can be evaluated (one part drawn with seed 0).
     *
     * @throws ToleranceInputException what is wrong, naming the option or the case's line
     */
    public static Prepared prepare(Path caseFile, Map<String, String> overrides, List<String> vary, List<String> require)
            throws IOException, ToleranceInputException {
        List<Distribution> d = new ArrayList<>();
        for (String v : vary) {
            Distribution x = Distribution.parse(v);
            if (d.stream().anyMatch(y -> y.name().equals(x.name()))) {
                throw new ToleranceInputException("--vary " + v + ": " + x.name() + " varies twice; give each parameter once");
            }
            d.add(x);
        }
        List<Requirement> r = new ArrayList<>();
        for (String q : require) {
            r.add(Requirement.parse(q));
        }
        ToleranceStudy.run(caseFile, overrides, d, 1, 0);
        return new Prepared(caseFile, Map.copyOf(overrides), List.copyOf(d), List.copyOf(r));
    }

    public static void run(Prepared p, int samples, long seed, RunFolder rf, PrintWriter out, String caution)
            throws IOException, ToleranceInputException {
        long t0 = System.nanoTime();
        ToleranceStudy st = ToleranceStudy.run(p.caseFile(), p.overrides(), p.vary(), samples, seed);
        out.printf(Locale.ROOT, "%s: %d parts (seed %d) varying %s; plane-wave model, %.1f s%n", p.caseFile(), samples, seed,
                String.join(", ", p.vary().stream().map(Distribution::written).toList()), (System.nanoTime() - t0) * 1e-9);
        ToleranceOutputs.print(out, st, p.require());
        ToleranceOutputs.write(rf, p.caseFile().toString(), st, p.require(), seed, caution);
    }
}
