package org.evanesce.io.sweep;

import static org.evanesce.io.sweep.TableText.e;
import static org.evanesce.io.sweep.TableText.plain;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.evanesce.io.casefile.expr.Dimension;

/**
 * The extrema of a sweep's flux columns against each numeric swept parameter ({@link Extremum}), and a
 * sensor's sensitivity, from sweep.csv alone (so one run, shards and resumed runs give the same bytes).
 *
 * <p>{@code sweep-extrema.csv}: per numeric swept parameter with 3 or more distinct values, per wavelength
 * and combination of the other swept parameters, per flux column ({@code A}, {@code T_*}, {@code R_*} and
 * their companions but the {@code _diff} ones) with 3 or more values: its minimum (with the full width at
 * half depth) and its maximum.
 *
 * <p>{@code sweep-sensitivity.csv}: when exactly two numeric parameters are swept, one an angle and the
 * other a plain number (a refractive index), the shift of each column's interpolated minimum (the dip)
 * per unit of the number, by finite difference between consecutive values of it.
 */
public final class SweepExtrema {

    public static final String EXTREMA = "sweep-extrema.csv";
    public static final String SENSITIVITY = "sweep-sensitivity.csv";
    /** At most this many minima are printed; the rest are in the file. */
    private static final int PRINTED = 8;

    /**
     * @param extrema     sweep-extrema.csv's text
     * @param sensitivity sweep-sensitivity.csv's text, or null when the sweep has no angle and index pair
     * @param summary     the lines the merge prints
     */
    public record Written(String extrema, String sensitivity, String summary) { }

    /** One minimum or maximum of a column in a group. */
    private record Row(int parameter, String wavelength, String[] texts, double[] si, String column, boolean min,
                       Extremum.Found found) { }

    private SweepExtrema() {
    }

    /**
     * Writes sweep-extrema.csv (and sweep-sensitivity.csv) into the folder from the merged table.
     *
     * @param csv   sweep.csv's text
     * @param names the swept parameters, in the sweep's order
     * @param kinds their dimensions, in the same order
     * @return what was written, or null when nothing is swept over 3 values with a flux column (an earlier
     *         merge's tables are then removed)
     */
    public static Written write(SweepFolder folder, String csv, List<String> names, List<Dimension> kinds) throws IOException {
        Written w = compute(csv, names, kinds);
        // an earlier merge's tables go when this merge has none (they would describe other points)
        if (w != null) {
            folder.write(EXTREMA, w.extrema().getBytes(StandardCharsets.UTF_8));
        } else {
            Files.deleteIfExists(folder.dir().resolve(EXTREMA));
        }
        if (w != null && w.sensitivity() != null) {
            folder.write(SENSITIVITY, w.sensitivity().getBytes(StandardCharsets.UTF_8));
        } else {
            Files.deleteIfExists(folder.dir().resolve(SENSITIVITY));
        }
        return w;
    }

    /** The tables and the summary, or null when there is nothing to report. */
    static Written compute(String csv, List<String> names, List<Dimension> kinds) {
        List<String[]> table = SampleSummary.parse(csv);
        if (table.size() < 2) {
            return null;
        }
        List<String> header = List.of(table.get(0));
        List<String[]> rows = table.subList(1, table.size());
        int wl = header.indexOf("wavelength_nm");
        List<String> columns = header.stream().filter(SweepExtrema::fluxColumn).toList();
        if (wl < 0 || columns.isEmpty()) {
            return null;
        }
        int np = names.size();
        int[] textAt = new int[np];
        int[] siAt = new int[np];
        for (int k = 0; k < np; k++) {
            textAt[k] = header.indexOf(names.get(k));
            siAt[k] = header.indexOf(names.get(k) + "_si");
        }
        List<Row> found = new ArrayList<>();
        List<Integer> numeric = new ArrayList<>();
        for (int p = 0; p < np; p++) {
            final int xAt = siAt[p];
            if (numeric(rows, xAt)) {
                numeric.add(p);
            }
            if (!numeric(rows, xAt) || rows.stream().map(r -> r[xAt]).distinct().count() < 3) {
                continue;
            }
            // groups: per wavelength and the other parameters' values, in first-seen order
            Map<String, List<String[]>> groups = new LinkedHashMap<>();
            for (String[] r : rows) {
                StringBuilder key = new StringBuilder(r[wl]);
                for (int k = 0; k < np; k++) {
                    if (k != p) {
                        key.append('\u0000').append(r[textAt[k]]);
                    }
                }
                groups.computeIfAbsent(key.toString(), q -> new ArrayList<>()).add(r);
            }
            for (List<String[]> g : groups.values()) {
                String[] first = g.get(0);
                String[] texts = new String[np];
                double[] si = new double[np];
                for (int k = 0; k < np; k++) {
                    texts[k] = k == p ? "" : first[textAt[k]];
                    si[k] = k == p ? Double.NaN : number(first[siAt[k]]);
                }
                for (String c : columns) {
                    double[][] xy = samples(g, siAt[p], header.indexOf(c));
                    if (xy == null) {
                        continue;
                    }
                    found.add(new Row(p, first[wl], texts, si, c, true, Extremum.minimum(xy[0], xy[1])));
                    found.add(new Row(p, first[wl], texts, si, c, false, Extremum.maximum(xy[0], xy[1])));
                }
            }
        }
        if (found.isEmpty()) {
            return null;
        }
        StringBuilder sb = new StringBuilder("wavelength_nm");
        names.forEach(n -> sb.append(',').append(SweepMerge.quote(n)));
        sb.append(",parameter,column,kind,parameter_si,value,bracketed,width_si,width_complete\n");
        for (Row r : found) {
            sb.append(r.wavelength());
            for (String t : r.texts()) {
                sb.append(',').append(SweepMerge.quote(t));
            }
            Extremum.Found f = r.found();
            sb.append(',').append(SweepMerge.quote(names.get(r.parameter()))).append(',').append(r.column())
                    .append(',').append(r.min() ? "min" : "max").append(',').append(e(f.x())).append(',').append(e(f.value()))
                    .append(',').append(f.bracketed()).append(',').append(r.min() ? e(f.width()) : "")
                    .append(',').append(r.min() && Double.isFinite(f.width()) ? f.complete() : "").append('\n');
        }
        String sensitivity = sensitivity(found, names, kinds, numeric);
        return new Written(sb.toString(), sensitivity, summary(found, names, kinds, rows, siAt, sensitivity));
    }

    /** A column whose extrema are reported: A, T_*, R_* (and A_*), not the differences to the exact values. */
    static boolean fluxColumn(String c) {
        return (c.equals("A") || c.startsWith("T_") || c.startsWith("R_") || c.startsWith("A_")) && !c.endsWith("_diff");
    }

    /** The group's (x, y) samples sorted by x; null with fewer than 3 values or a repeated x. */
    private static double[][] samples(List<String[]> g, int xAt, int yAt) {
        TreeMap<Double, Double> xy = new TreeMap<>();
        for (String[] r : g) {
            double x = number(r[xAt]);
            double y = yAt < r.length ? number(r[yAt]) : Double.NaN;
            if (Double.isFinite(x) && Double.isFinite(y) && xy.put(x, y) != null) {
                return null;
            }
        }
        if (xy.size() < 3) {
            return null;
        }
        double[][] out = new double[2][xy.size()];
        int k = 0;
        for (Map.Entry<Double, Double> e : xy.entrySet()) {
            out[0][k] = e.getKey();
            out[1][k++] = e.getValue();
        }
        return out;
    }

    /**
     * The dip's shift per unit of the index: with exactly two numeric parameters, one an angle and one a
     * plain number, per wavelength, other parameters and column, between consecutive index values.
     */
    private static String sensitivity(List<Row> found, List<String> names, List<Dimension> kinds, List<Integer> numeric) {
        if (numeric.size() != 2) {
            return null;
        }
        int angle = -1;
        int index = -1;
        for (int k : numeric) {
            if (kinds.get(k).equals(Dimension.ANGLE)) {
                angle = k;
            } else if (kinds.get(k).equals(Dimension.NONE)) {
                index = k;
            }
        }
        if (angle < 0 || index < 0) {
            return null;
        }
        final int a = angle;
        final int n = index;
        // the minima against the angle, per wavelength, other parameters and column, by index value
        Map<String, TreeMap<Double, Row>> series = new LinkedHashMap<>();
        for (Row r : found) {
            if (r.parameter() != a || !r.min()) {
                continue;
            }
            StringBuilder key = new StringBuilder(r.wavelength()).append('\u0000').append(r.column());
            for (int k = 0; k < names.size(); k++) {
                if (k != n) {
                    key.append('\u0000').append(r.texts()[k]);
                }
            }
            series.computeIfAbsent(key.toString(), q -> new TreeMap<>()).put(r.si()[n], r);
        }
        StringBuilder sb = new StringBuilder("wavelength_nm");
        for (int k = 0; k < names.size(); k++) {
            if (k != a && k != n) {
                sb.append(',').append(SweepMerge.quote(names.get(k)));
            }
        }
        sb.append(",column,angle,index,index_from,index_to,dip_from_deg,dip_to_deg,shift_deg_per_index_unit,bracketed\n");
        int lines = 0;
        for (TreeMap<Double, Row> s : series.values()) {
            Row prev = null;
            for (Row r : s.values()) {
                if (prev != null) {
                    double d0 = Math.toDegrees(prev.found().x());
                    double d1 = Math.toDegrees(r.found().x());
                    sb.append(r.wavelength());
                    for (int k = 0; k < names.size(); k++) {
                        if (k != a && k != n) {
                            sb.append(',').append(SweepMerge.quote(r.texts()[k]));
                        }
                    }
                    sb.append(',').append(r.column()).append(',').append(SweepMerge.quote(names.get(a))).append(',')
                            .append(SweepMerge.quote(names.get(n))).append(',').append(e(prev.si()[n])).append(',')
                            .append(e(r.si()[n])).append(',').append(e(d0)).append(',').append(e(d1)).append(',')
                            .append(e((d1 - d0) / (r.si()[n] - prev.si()[n]))).append(',')
                            .append(prev.found().bracketed() && r.found().bracketed()).append('\n');
                    lines++;
                }
                prev = r;
            }
        }
        return lines == 0 ? null : sb.toString();
    }

    /**
     * Dips shallower than this (below the larger end value, in R, T or A: fractions of the incident power) are not
     * printed: a plane wave's R and T are within about 1e-3 of exact at 20 cells per wavelength (README), so a
     * shallower dip cannot be told from the grid's error and noise (a lossless scene's A of a few 1e-6 shows
     * such "dips"). They stay in the file.
     */
    static final double PRINTED_DEPTH = 1e-3;

    /** The merge's printed block: the minima (at most {@link #PRINTED}) and the sensitivities. */
    private static String summary(List<Row> found, List<String> names, List<Dimension> kinds, List<String[]> rows, int[] siAt,
                                  String sensitivity) {
        StringBuilder sb = new StringBuilder();
        List<Row> minima = found.stream().filter(Row::min).toList();
        List<Row> dips = minima.stream().filter(r -> r.found().bracketed() && r.found().depth() >= PRINTED_DEPTH).toList();
        long shallow = minima.stream().filter(r -> r.found().bracketed() && !(r.found().depth() >= PRINTED_DEPTH)).count();
        sb.append(String.format(Locale.ROOT, "extrema of the flux columns in %s (parabola through the lowest or highest point "
                + "and its neighbours; width at half depth below the larger end value); the dips at least %.0e deep:%n",
                EXTREMA, PRINTED_DEPTH));
        for (Row r : dips.subList(0, Math.min(PRINTED, dips.size()))) {
            int p = r.parameter();
            double max = rows.stream().mapToDouble(q -> Math.abs(number(q[siAt[p]]))).filter(Double::isFinite).max().orElse(1);
            SweepMerge.DisplayUnit u = SweepMerge.DisplayUnit.of(kinds.get(p), max);
            String unit = u.name().isEmpty() ? "" : " " + u.name();
            List<String> at = new ArrayList<>();
            at.add(plain(r.wavelength()) + " nm");
            for (int k = 0; k < names.size(); k++) {
                if (k != p) {
                    at.add(names.get(k) + "=" + r.texts()[k]);
                }
            }
            Extremum.Found f = r.found();
            sb.append(String.format(Locale.ROOT, "  %s (%s): min %.4g at %s=%.6g%s", r.column(), String.join(", ", at),
                    f.value(), names.get(p), f.x() / u.factor(), unit));
            if (Double.isFinite(f.width())) {
                sb.append(String.format(Locale.ROOT, ", width %.4g%s%s", f.width() / u.factor(), unit,
                        f.complete() ? "" : " (a side does not cross half depth in the range: a lower bound)"));
            }
            sb.append(System.lineSeparator());
        }
        if (dips.isEmpty()) {
            sb.append(String.format(Locale.ROOT, "  none: no minimum that deep lies inside the range%n"));
        }
        long ends = minima.stream().filter(r -> !r.found().bracketed()).count();
        sb.append(String.format(Locale.ROOT, "  (%s%s%d minima at an end of the range, not bracketed, and the maxima: "
                + "in the file)%n",
                dips.size() > PRINTED ? (dips.size() - PRINTED) + " more dips, " : "",
                shallow > 0 ? shallow + " shallower dips (within the simulation's accuracy: noise can make them), " : "", ends));
        if (sensitivity != null) {
            List<String[]> t = SampleSummary.parse(sensitivity);
            List<String> h = List.of(t.get(0));
            sb.append(String.format(Locale.ROOT, "dip shift per unit of %s in %s (both dips bracketed):%n",
                    t.get(1)[h.indexOf("index")], SENSITIVITY));
            int printed = 0;
            int skipped = 0;
            for (String[] r : t.subList(1, t.size())) {
                if (!r[h.indexOf("bracketed")].equals("true")) {
                    skipped++;
                } else if (printed++ < PRINTED) {
                    sb.append(String.format(Locale.ROOT, "  %s (%s nm, %s %s to %s): %.4g deg per unit%n", r[h.indexOf("column")],
                            plain(r[0]), r[h.indexOf("index")], plain(r[h.indexOf("index_from")]),
                            plain(r[h.indexOf("index_to")]), number(r[h.indexOf("shift_deg_per_index_unit")])));
                }
            }
            if (printed == 0) {
                sb.append(String.format(Locale.ROOT, "  none: widen the angle range%n"));
            }
            if (skipped > 0 || printed > PRINTED) {
                sb.append(String.format(Locale.ROOT, "  (%d more, %d with a dip at an end of the range: in the file)%n",
                        Math.max(0, printed - PRINTED) + skipped, skipped));
            }
        }
        return sb.toString();
    }

    private static boolean numeric(List<String[]> rows, int at) {
        return at >= 0 && rows.stream().allMatch(r -> at < r.length && Double.isFinite(number(r[at])));
    }

    private static double number(String s) {
        try {
            return s.isEmpty() ? Double.NaN : Double.parseDouble(s);
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

}
