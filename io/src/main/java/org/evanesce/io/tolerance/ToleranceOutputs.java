package org.evanesce.io.tolerance;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.output.image.LinePlot;

/** Prints a tolerance study and writes tolerance.json, samples.csv and a histogram per result. */
public final class ToleranceOutputs {

    /** Bins of the histograms. */
    static final int BINS = 40;

    private ToleranceOutputs() {
    }

    static void print(PrintWriter out, ToleranceStudy st, List<Requirement> reqs) {
        out.printf(Locale.ROOT, "%-3s %12s %12s %12s %12s %12s%n", "", "mean", "std dev", "5 %", "50 %", "95 %");
        for (Map.Entry<String, double[]> e : st.results().entrySet()) {
            double[] v = e.getValue();
            out.printf(Locale.ROOT, "%-3s %12.6f %12.6f %12.6f %12.6f %12.6f%n", e.getKey(), shown(Statistics.mean(v)),
                    shown(Statistics.standardDeviation(v)), shown(Statistics.quantile(v, 0.05)),
                    shown(Statistics.quantile(v, 0.5)), shown(Statistics.quantile(v, 0.95)));
        }
        if (!reqs.isEmpty()) {
            long k = st.passing(reqs);
            int n = st.t().length;
            double[] ci = Statistics.wilson(k, n);
            out.printf(Locale.ROOT, "yield: %d of %d parts meet %s: %.2f %% (95 %% interval %.2f %% to %.2f %%, Wilson)%n", k, n,
                    String.join(" and ", reqs.stream().map(Requirement::written).toList()), 100.0 * k / n, 100 * ci[0],
                    100 * ci[1]);
        }
    }

    static void write(RunFolder rf, String caseFile, ToleranceStudy st, List<Requirement> reqs, long seed, String caution)
            throws IOException {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("case", caseFile);
        m.put("model", "plane-wave response of the case's layered stack at its design wavelength and source angle");
        m.put("samples", st.t().length);
        m.put("seed", seed);
        List<Object> vary = new ArrayList<>();
        for (Distribution d : st.distributions()) {
            Map<String, Object> v = new LinkedHashMap<>();
            v.put("name", d.name());
            v.put("written", d.written());
            v.put("si_unit", d.dimension().siUnit());
            v.put("kind", d.kind().name().toLowerCase(Locale.ROOT));
            if (d.kind() == Distribution.Kind.NORMAL) {
                v.put("mean", d.a());
                v.put("standard_deviation", d.b());
                v.put("low", Double.isFinite(d.low()) ? d.low() : null);
                v.put("high", Double.isFinite(d.high()) ? d.high() : null);
            } else {
                v.put("low", d.a());
                v.put("high", d.b());
            }
            vary.add(v);
        }
        m.put("vary", vary);
        Map<String, Object> res = new LinkedHashMap<>();
        for (Map.Entry<String, double[]> e : st.results().entrySet()) {
            double[] v = e.getValue();
            Map<String, Object> s = new LinkedHashMap<>();
            s.put("mean", Statistics.mean(v));
            s.put("standard_deviation", Statistics.standardDeviation(v));
            s.put("percentile_5", Statistics.quantile(v, 0.05));
            s.put("percentile_50", Statistics.quantile(v, 0.5));
            s.put("percentile_95", Statistics.quantile(v, 0.95));
            res.put(e.getKey(), s);
        }
        m.put("results", res);
        if (!reqs.isEmpty()) {
            long k = st.passing(reqs);
            double[] ci = Statistics.wilson(k, st.t().length);
            Map<String, Object> y = new LinkedHashMap<>();
            y.put("requirements", reqs.stream().map(Requirement::written).toList());
            y.put("passing", k);
            y.put("yield", (double) k / st.t().length);
            y.put("interval_95_low", ci[0]);
            y.put("interval_95_high", ci[1]);
            y.put("interval_method", "Wilson score (Wilson 1927)");
            m.put("yield", y);
        }
        m.put("caution", caution);
        rf.writeText("tolerance.json", Json.write(m));
        StringBuilder csv = new StringBuilder("sample");
        for (Distribution d : st.distributions()) {
            csv.append(',').append(d.name()).append(d.dimension().siUnit().isEmpty() ? "" : "_" + d.dimension().siUnit()
                    .replace(' ', '_').replace('^', 'e'));
        }
        csv.append(",R,T,A").append(reqs.isEmpty() ? "" : ",meets").append('\n');
        for (int s = 0; s < st.t().length; s++) {
            csv.append(s + 1);
            for (double v : st.values()[s]) {
                csv.append(',').append(num(v));
            }
            csv.append(',').append(num(st.r()[s])).append(',').append(num(st.t()[s])).append(',').append(num(st.a()[s]));
            if (!reqs.isEmpty()) {
                csv.append(',').append(st.passes(reqs, s) ? 1 : 0);
            }
            csv.append('\n');
        }
        rf.writeText("samples.csv", csv.toString());
        for (Map.Entry<String, double[]> e : st.results().entrySet()) {
            histogram(e.getKey(), e.getValue(), reqs).writePng(rf.dir().resolve("histogram-" + e.getKey() + ".png"));
        }
    }

    /** A histogram drawn as a step outline, with the requirement's limits as vertical lines. */
    public static LinePlot histogram(String name, double[] v, List<Requirement> reqs) {
        double lo = Statistics.quantile(v, 0);
        double hi = Statistics.quantile(v, 1);
        if (!(hi > lo)) {
            hi = lo + Math.max(1e-9, Math.abs(lo) * 1e-9);
        }
        double w = (hi - lo) / BINS;
        int[] count = new int[BINS];
        for (double x : v) {
            count[Math.min(BINS - 1, (int) ((x - lo) / w))]++;
        }
        double[] xs = new double[2 * BINS + 2];
        double[] ys = new double[2 * BINS + 2];
        xs[0] = lo;
        for (int b = 0; b < BINS; b++) {
            xs[2 * b + 1] = lo + b * w;
            ys[2 * b + 1] = count[b];
            xs[2 * b + 2] = lo + (b + 1) * w;
            ys[2 * b + 2] = count[b];
        }
        xs[2 * BINS + 1] = hi;
        LinePlot.Builder p = LinePlot.builder().title(String.format(Locale.ROOT, "%s over %d samples", name, v.length))
                .series("samples per bin", xs, ys, LinePlot.Style.LINES).xTitle(name).yTitle("samples");
        for (Requirement q : reqs) {
            if (q.quantity().equals(name)) {
                int max = java.util.Arrays.stream(count).max().orElse(1);
                for (double limit : new double[] {q.low(), q.high()}) {
                    if (Double.isFinite(limit) && limit > lo - 5 * w && limit < hi + 5 * w) {
                        p.series("limit " + Units.number(limit), new double[] {limit, limit}, new double[] {0, max},
                                LinePlot.Style.LINES);
                    }
                }
            }
        }
        return p.build();
    }

    /** A value for the six-decimal table: round-off below its last digit (A = 1 − R − T ≈ −1e-16) shows as 0. */
    private static double shown(double v) {
        return Math.abs(v) < 5e-7 ? 0.0 : v;
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.9g", v);
    }
}
