package org.evanesce.io.run;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The s and p runs of one case ({@code polarization: both}) side by side: per frequency every value
 * column of each run, and for the power ratios (T, R, A and their reference and difference columns)
 * their unpolarised average. Unpolarised light carries equal, incoherent power in s and p, so each
 * of its power ratios is the mean of the s and p ones (M. Born and E. Wolf, <i>Principles of
 * Optics</i>, 7th ed., 1999, §1.5.3, the reflectivity of natural light, R = (R_s + R_p)/2).
 */
public final class PolarizationAverage {

    /** Frequencies of the two runs that differ by more than this relative amount are not the same row. */
    static final double SAME_FREQUENCY = 1e-12;

    private PolarizationAverage() {
    }

    /**
     * Whether a column is a power ratio (averaged), not a beam's position, width, angle or shift, nor the
     * reference's convergence flag (given per polarization only).
     */
    static boolean averaged(String column) {
        return !(column.equals(FluxResults.CONVERGED_COLUMN) || column.startsWith("centroid_") || column.startsWith("width_")
                || column.startsWith("angle_") || column.startsWith("shift_"));
    }

    /**
     * The unpolarised table: the averaged columns only, named as in each run, with the s run's incident
     * values (printed as the run's table; flux.csv has both runs' incident values).
     *
     * @throws IllegalArgumentException when the runs' columns or frequencies differ (they are one case)
     */
    public static FluxResults average(FluxResults s, FluxResults p) {
        check(s, p);
        List<String> columns = new ArrayList<>();
        List<Integer> at = new ArrayList<>();
        for (int k = 0; k < s.columns().size(); k++) {
            if (averaged(s.columns().get(k))) {
                columns.add(s.columns().get(k));
                at.add(k);
            }
        }
        List<FluxResults.Row> rows = new ArrayList<>();
        for (int q = 0; q < s.rows().size(); q++) {
            FluxResults.Row a = s.rows().get(q);
            FluxResults.Row b = p.rows().get(q);
            double[] v = new double[at.size()];
            for (int k = 0; k < v.length; k++) {
                v[k] = 0.5 * (a.values()[at.get(k)] + b.values()[at.get(k)]);
            }
            rows.add(new FluxResults.Row(a.frequency(), a.wavelength(), a.angleDegrees(), a.incident(), v));
        }
        List<String> warnings = new ArrayList<>();
        s.warnings().forEach(w -> warnings.add("s: " + w));
        p.warnings().forEach(w -> warnings.add("p: " + w));
        return new FluxResults(columns, rows, s.incident(), warnings);
    }

    /** The columns of the combined flux.csv after wavelength, frequency and angle. */
    public static List<String> csvColumns(FluxResults s) {
        List<String> out = new ArrayList<>();
        for (String c : s.columns()) {
            if (averaged(c)) {
                out.add(c);
            }
            out.add(c + "_s");
            out.add(c + "_p");
        }
        out.add(s.incident().column + "_s");
        out.add(s.incident().column + "_p");
        return out;
    }

    /**
     * The combined flux.csv: {@code wavelength_nm, frequency_thz, angle_deg}, then per value column C of
     * the runs {@code C} (the average, power ratios only), {@code C_s}, {@code C_p}, and last the incident
     * column of each run. Numbers as in a single run's flux.csv.
     */
    public static String csv(FluxResults s, FluxResults p) {
        check(s, p);
        StringBuilder sb = new StringBuilder("wavelength_nm,frequency_thz,angle_deg");
        csvColumns(s).forEach(c -> sb.append(',').append(c));
        sb.append('\n');
        for (int q = 0; q < s.rows().size(); q++) {
            FluxResults.Row a = s.rows().get(q);
            FluxResults.Row b = p.rows().get(q);
            sb.append(String.format(Locale.ROOT, "%.6f,%.6f,%.6f", a.wavelength() * 1e9, a.frequency() * 1e-12, a.angleDegrees()));
            for (int k = 0; k < s.columns().size(); k++) {
                String c = s.columns().get(k);
                String f = c.equals(FluxResults.CONVERGED_COLUMN) ? "%.0f" : "%.9f";
                if (averaged(c)) {
                    sb.append(',').append(number(f, 0.5 * (a.values()[k] + b.values()[k])));
                }
                sb.append(',').append(number(f, a.values()[k])).append(',').append(number(f, b.values()[k]));
            }
            sb.append(String.format(Locale.ROOT, ",%.9e,%.9e%n", a.incident(), b.incident()));
        }
        return sb.toString();
    }

    private static String number(String format, double x) {
        return Double.isFinite(x) ? String.format(Locale.ROOT, format, x) : "";
    }

    private static void check(FluxResults s, FluxResults p) {
        if (!s.columns().equals(p.columns()) || s.rows().size() != p.rows().size()) {
            throw new IllegalArgumentException("the s and p runs measured different things: columns " + s.columns() + " and "
                    + p.columns() + ", " + s.rows().size() + " and " + p.rows().size() + " frequencies");
        }
        for (int q = 0; q < s.rows().size(); q++) {
            double f = s.rows().get(q).frequency();
            double g = p.rows().get(q).frequency();
            if (Math.abs(f - g) > SAME_FREQUENCY * Math.abs(f)) {
                throw new IllegalArgumentException(String.format(Locale.ROOT, "the s and p runs' frequency %d differs: %g and "
                        + "%g Hz", q, f, g));
            }
        }
    }

    /**
     * The combined summary.json: the polarization ({@code both}), how the average is formed, whether both
     * runs settled, both runs' warnings, a {@code flux} part naming the columns and the lines (the flux.csv
     * columns without suffix are the averages), and each run's own summary under {@code s} and {@code p}.
     */
    public static Map<String, Object> summary(Object sSummary, Object pSummary, FluxResults s, Boolean settled,
                                              List<String> warnings) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("program", "evanesce");
        m.put("schema", "evanesce-summary-1");
        m.put("polarization", "both");
        m.put("average", "unpolarised: each power ratio is the mean of the s and p runs' (equal incoherent power in "
                + "each); flux.csv column C is the average, C_s and C_p the runs'");
        if (sSummary instanceof Map<?, ?> sm) {
            m.put("case_file", sm.get("case_file"));
            m.put("title", sm.get("title"));
            m.put("caution", sm.get("caution"));
        }
        m.put("settled", settled);
        m.put("warnings", warnings);
        if (s != null && sSummary instanceof Map<?, ?> sm && sm.get("flux") instanceof Map<?, ?> f) {
            Map<String, Object> flux = new LinkedHashMap<>();
            flux.put("columns", csvColumns(s));
            flux.put("lines", f.get("lines"));
            flux.put("incident", "per run: " + s.incident().column + "_s and _p");
            m.put("flux", flux);
        }
        m.put("s", sSummary);
        m.put("p", pSummary);
        return m;
    }

    /** Both runs' settling: false when either did not settle, null when neither was judged. */
    public static Boolean settled(Boolean s, Boolean p) {
        if (Boolean.FALSE.equals(s) || Boolean.FALSE.equals(p)) {
            return false;
        }
        return s == null && p == null ? null : Boolean.TRUE;
    }
}
