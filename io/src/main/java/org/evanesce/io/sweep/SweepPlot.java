package org.evanesce.io.sweep;

import java.io.IOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.output.image.LinePlot;
import org.evanesce.io.run.FluxPlot;

/**
 * The sweep's plots: the main results against the first numeric swept parameter, one series per value
 * and combination of the other parameters.
 *
 * <p>With flux, T of each transmitted line, R of each reflected line and A, each point's flux.csv row
 * nearest to the asked wavelength ({@code sweep --plot-wavelength}), by default the design wavelength
 * (run.json's {@code resolved_case.design_wavelength_m} of the first point; the first row where it is
 * missing); of two rows equally near, the shorter wavelength. Where the table has the exact value ({@code X_beam}, else
 * {@code X_exact}) the simulated values are markers and the exact ones a line in the same colour. When
 * the swept parameter is an angle and the chosen rows' {@code angle_deg} differs from it (a pulsed
 * plane wave: the case's angle holds at the centre frequency, kx is fixed, so the angle changes with
 * wavelength), the x axis is the angle of incidence at the plotted wavelength. {@code log} plots
 * log10 T (the T series only) when the positive T values span more than a decade, else is null.
 * With decay fits only, the decay lengths in nm.
 *
 * @param linear     sweep.png's plot
 * @param log        sweep-log.png's plot, or null
 * @param wavelength the plotted wavelength in nm (NaN for decay lengths)
 */
record SweepPlot(LinePlot linear, LinePlot log, double wavelength) {

    /** The log plot is drawn when the largest positive T is more than this times the smallest. */
    static final double DECADE = 10;

    /** Two angles closer than this (degrees) are the same: flux.csv prints angle_deg with 6 decimals. */
    static final double SAME_ANGLE_DEG = 1e-5;

    /** The plots at the design wavelength, or null when there is nothing to plot. */
    static SweepPlot of(List<SweepMerge.Found> found, List<Dimension> kinds, String title) {
        return of(found, kinds, title, Double.NaN);
    }

    /**
     * The plots, or null when there is nothing to plot.
     *
     * @param askedM the wavelength to draw, m; NaN for the design wavelength
     */
    static SweepPlot of(List<SweepMerge.Found> found, List<Dimension> kinds, String title, double askedM) {
        if (found.isEmpty()) {
            return null;
        }
        SweepMerge.Found first = found.get(0);
        // along the first numeric parameter (the polarization, s, p or both, is none)
        int xi = 0;
        while (xi < kinds.size() && !Double.isFinite(first.point().si()[xi])) {
            xi++;
        }
        if (xi == kinds.size()) {
            return null;
        }
        String name = (title == null || title.isBlank() ? "sweep" : title) + ": ";
        if (first.fluxHeader().isEmpty()) {
            return first.decays().isEmpty() ? null : decays(found, kinds, xi, name);
        }
        List<String> columns = new ArrayList<>(first.fluxLines());
        if (first.fluxHeader().contains("A")) {
            columns.add("A");
        }
        int wl = first.fluxHeader().indexOf("wavelength_nm");
        boolean asked = Double.isFinite(askedM);
        double target = asked ? askedM * 1e9 : Double.isFinite(first.design()) ? first.design() * 1e9
                : wl >= 0 && !first.fluxRows().isEmpty() ? number(first.fluxRows().get(0)[wl]) : Double.NaN;
        int[] rows = new int[found.size()];
        for (int k = 0; k < rows.length; k++) {
            rows[k] = nearest(found.get(k), target);
        }
        double at = wl >= 0 && !first.fluxRows().isEmpty() ? number(first.fluxRows().get(rows[0])[wl]) : Double.NaN;
        String where = Double.isNaN(at) ? " at the first frequency" : " at " + plain(at) + " nm"
                + (asked ? (Math.abs(at - target) < 1e-6 ? "" : " (asked: " + plain(target) + " nm)")
                : !Double.isFinite(first.design()) ? "" : Math.abs(at - target) < 1e-6 ? " (design wavelength)"
                : " (design: " + plain(target) + " nm)");
        String yTitle = first.fluxHeader().contains("A") || first.fluxLines().stream().anyMatch(c -> c.startsWith("T_")
                || c.startsWith("R_")) ? "flux / incident power" : "surface power (see summary.json)";
        // x: the parameter, or for a pulsed plane wave's angle the angle at this wavelength
        double[] x = new double[found.size()];
        String xTitle;
        if (angleAtWavelength(found, rows, kinds, xi)) {
            for (int k = 0; k < x.length; k++) {
                x[k] = number(found.get(k).fluxRows().get(rows[k])[found.get(k).fluxHeader().indexOf("angle_deg")]);
            }
            xTitle = "angle of incidence at " + plain(at) + " nm (deg)";
        } else {
            xTitle = parameter(found, kinds, xi, x);
        }
        List<String> letters = new ArrayList<>();
        for (String k : List.of("R", "T", "A")) {
            if (columns.stream().anyMatch(c -> c.equals(k) || c.startsWith(k + "_"))) {
                letters.add(k);
            }
        }
        String what = letters.isEmpty() || yTitle.startsWith("surface") ? String.join(", ", columns) : String.join(", ", letters);
        LinePlot.Builder linear = LinePlot.builder().title(name + what + where).xTitle(xTitle).yTitle(yTitle);
        LinePlot.Builder log = LinePlot.builder().title(name + "log10 T" + where).xTitle(xTitle).yTitle("log10(T)");
        double low = Double.POSITIVE_INFINITY;
        double high = 0;
        int colour = 0;
        boolean anyT = false;
        for (String c : columns) {
            String exact = FluxPlot.exactColumn(first.fluxHeader(), c);
            for (Map.Entry<String, List<Integer>> g : groups(found, xi).entrySet()) {
                List<Integer> members = sorted(g.getValue(), x);
                double[] gx = members.stream().mapToDouble(k -> x[k]).toArray();
                double[] sim = members.stream().mapToDouble(k -> value(found.get(k), rows[k], c)).toArray();
                double[] ex = exact == null ? null : members.stream().mapToDouble(k -> value(found.get(k), rows[k], exact)).toArray();
                int rgb = LinePlot.PALETTE.get(colour++ % LinePlot.PALETTE.size());
                String label = c + g.getKey();
                add(linear, label, gx, sim, ex == null ? null : exact + g.getKey(), ex, rgb);
                if (c.startsWith("T_")) {
                    anyT = true;
                    for (double[] ys : ex == null ? new double[][] {sim} : new double[][] {sim, ex}) {
                        for (double y : ys) {
                            if (y > 0 && Double.isFinite(y)) {
                                low = Math.min(low, y);
                                high = Math.max(high, y);
                            }
                        }
                    }
                    add(log, label, gx, log10(sim), ex == null ? null : exact + g.getKey(), ex == null ? null : log10(ex), rgb);
                }
            }
        }
        boolean decades = anyT && high > DECADE * low;
        return new SweepPlot(linear.build(), decades ? log.build() : null, at);
    }

    /** Simulated values as markers with the exact values as a line in the same colour; without exact values, lines and markers. */
    private static void add(LinePlot.Builder b, String label, double[] x, double[] sim, String exactLabel, double[] exact, int rgb) {
        if (exact == null) {
            b.series(label, x, sim, LinePlot.Style.LINES_AND_MARKERS, rgb);
            return;
        }
        b.series(label, x, sim, LinePlot.Style.MARKERS, rgb);
        b.series(exactLabel, x, exact, x.length > 1 ? LinePlot.Style.LINES : LinePlot.Style.MARKERS, rgb);
    }

    private static double[] log10(double[] v) {
        double[] out = new double[v.length];
        for (int k = 0; k < v.length; k++) {
            out[k] = v[k] > 0 ? Math.log10(v[k]) : Double.NaN;
        }
        return out;
    }

    /**
     * Whether x is the angle at the plotted wavelength: the parameter is an angle, every chosen row has
     * angle_deg, and at some point it differs from the parameter.
     */
    static boolean angleAtWavelength(List<SweepMerge.Found> found, int[] rows, List<Dimension> kinds, int xi) {
        if (!kinds.get(xi).equals(Dimension.ANGLE)) {
            return false;
        }
        boolean differs = false;
        for (int k = 0; k < rows.length; k++) {
            SweepMerge.Found f = found.get(k);
            int ai = f.fluxHeader().indexOf("angle_deg");
            double a = ai < 0 || f.fluxRows().isEmpty() ? Double.NaN : number(f.fluxRows().get(rows[k])[ai]);
            if (!Double.isFinite(a)) {
                return false;
            }
            differs |= Math.abs(a - Math.toDegrees(f.point().si()[xi])) > SAME_ANGLE_DEG;
        }
        return differs;
    }

    /**
     * The index of the point's flux row whose wavelength_nm is nearest to the target; of two equally near, the shorter
     * wavelength's (the first of equal ones); 0 without.
     */
    static int nearest(SweepMerge.Found f, double targetNm) {
        int wl = f.fluxHeader().indexOf("wavelength_nm");
        if (wl < 0 || Double.isNaN(targetNm)) {
            return 0;
        }
        int best = 0;
        double gap = Double.POSITIVE_INFINITY;
        for (int r = 0; r < f.fluxRows().size(); r++) {
            double w = number(f.fluxRows().get(r)[wl]);
            double d = Math.abs(w - targetNm);
            if (d < gap || d == gap && w < number(f.fluxRows().get(best)[wl])) {
                gap = d;
                best = r;
            }
        }
        return best;
    }

    /** Fills x with the parameter in its display unit; the axis title. */
    private static String parameter(List<SweepMerge.Found> found, List<Dimension> kinds, int xi, double[] x) {
        double max = 0;
        for (SweepMerge.Found f : found) {
            max = Math.max(max, Math.abs(f.point().si()[xi]));
        }
        SweepMerge.DisplayUnit unit = SweepMerge.DisplayUnit.of(kinds.get(xi), max);
        for (int k = 0; k < x.length; k++) {
            x[k] = found.get(k).point().si()[xi] / unit.factor();
        }
        return found.get(0).point().point().names().get(xi) + (unit.name().isEmpty() ? "" : " (" + unit.name() + ")");
    }

    private static SweepPlot decays(List<SweepMerge.Found> found, List<Dimension> kinds, int xi, String name) {
        double[] x = new double[found.size()];
        LinePlot.Builder b = LinePlot.builder().title(name + "decay lengths").xTitle(parameter(found, kinds, xi, x))
                .yTitle("decay length (nm)");
        for (String c : found.get(0).decays().keySet()) {
            for (Map.Entry<String, List<Integer>> g : groups(found, xi).entrySet()) {
                List<Integer> members = sorted(g.getValue(), x);
                b.series(c + g.getKey(), members.stream().mapToDouble(k -> x[k]).toArray(), members.stream().mapToDouble(k -> {
                    Double[] v = found.get(k).decays().get(c);
                    return v == null || v[0] == null ? Double.NaN : v[0] * 1e9;
                }).toArray());
            }
        }
        return new SweepPlot(b.build(), null, Double.NaN);
    }

    /** The points grouped by the values of the other parameters: label suffix " (a=1, b=2)" or "" to point indices. */
    private static Map<String, List<Integer>> groups(List<SweepMerge.Found> found, int xi) {
        Map<String, List<Integer>> groups = new LinkedHashMap<>();
        for (int k = 0; k < found.size(); k++) {
            SweepPoint p = found.get(k).point().point();
            List<String> parts = new ArrayList<>();
            for (int j = 0; j < p.names().size(); j++) {
                if (j != xi) {
                    parts.add(p.names().get(j) + "=" + p.texts().get(j));
                }
            }
            groups.computeIfAbsent(parts.isEmpty() ? "" : " (" + String.join(", ", parts) + ")", s -> new ArrayList<>()).add(k);
        }
        return groups;
    }

    private static List<Integer> sorted(List<Integer> members, double[] x) {
        List<Integer> out = new ArrayList<>(members);
        out.sort((a, b) -> Double.compare(x[a], x[b]));
        return out;
    }

    /** A value column of the point's flux row, NaN where empty or absent. */
    private static double value(SweepMerge.Found f, int row, String column) {
        int at = f.fluxHeader().indexOf(column);
        if (at < 0 || row >= f.fluxRows().size() || at >= f.fluxRows().get(row).length) {
            return Double.NaN;
        }
        return number(f.fluxRows().get(row)[at]);
    }

    private static double number(String s) {
        try {
            return s.isEmpty() ? Double.NaN : Double.parseDouble(s);
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

    /** A wavelength without trailing zeros: 633.000000 becomes 633. */
    private static String plain(double nm) {
        return new java.math.BigDecimal(String.format(Locale.ROOT, "%.6f", nm)).stripTrailingZeros().toPlainString();
    }

    /** The plot as PNG bytes (the program's own encoder, with its mark). */
    static byte[] png(LinePlot p) throws IOException {
        return org.evanesce.io.output.image.PngFile.encode(p.render());
    }
}
