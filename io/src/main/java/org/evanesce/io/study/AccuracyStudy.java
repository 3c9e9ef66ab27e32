package org.evanesce.io.study;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.run.FluxResults;

/**
 * One case's flux table at two or three resolutions, each value extrapolated to zero cell size
 * by {@link Richardson} with an error estimate (Roache's grid convergence index). The formal
 * order is 2: the Yee scheme with subpixel smoothing converges at second order (checked in the
 * solver's tests).
 *
 * <p>At each resolution the case may run several times with the grid's nodes moved by a fraction
 * of a cell (offsets k/N). Where an interface falls between nodes adds a second-order error whose
 * coefficient swings with that position, so the values at one offset do not fall smoothly with
 * the cell size and extrapolating them can miss; their mean over the offsets does fall smoothly
 * (common practice in convergence studies). The extrapolation uses the means; the spread over the
 * offsets (largest minus smallest) shows how much the position alone moves a value.
 *
 * @param ratio     the refinement ratio between successive levels (cell size of one over the next)
 * @param cellSizes Δ of each level, coarse first, m
 * @param offsets   runs per level, at grid offsets k/offsets of a cell
 * @param columns   the simulated columns (T_*, R_*, A) that are extrapolated
 * @param rows      one per frequency
 */
public record AccuracyStudy(double ratio, double[] cellSizes, int offsets, List<String> columns, List<Row> rows) {

    /** The order of the scheme with subpixel smoothing. */
    public static final double FORMAL_ORDER = 2;

    /**
     * @param wavelength  vacuum wavelength, m
     * @param angle       angle of incidence, degrees
     * @param levels      [column][level] simulated values (means over the offsets)
     * @param spreads     [column][level] largest minus smallest value over the offsets (0 with one offset)
     * @param estimates   [column] extrapolation
     * @param exact       [column] the transfer-matrix value, NaN when the case has none
     */
    public record Row(double wavelength, double angle, double[][] levels, double[][] spreads, Richardson.Estimate[] estimates,
                      double[] exact) { }

    /**
     * Builds the study from each level's flux tables, one per grid offset (same case, same frequencies).
     *
     * @param levels [level][offset]
     */
    public static AccuracyStudy of(List<List<FluxResults>> levels, double ratio, double[] cellSizes) {
        if (levels.size() < 2 || levels.size() > 3 || cellSizes.length != levels.size()) {
            throw new IllegalArgumentException("an accuracy study has 2 or 3 levels, got " + levels.size());
        }
        int offsets = levels.get(0).size();
        if (offsets < 1 || levels.stream().anyMatch(l -> l.size() != offsets)) {
            throw new IllegalArgumentException("every level needs the same number (at least 1) of offset runs");
        }
        FluxResults first = levels.get(0).get(0);
        List<String> columns = new ArrayList<>();
        for (String c : first.columns()) {
            if (!c.endsWith("_exact") && !c.endsWith("_diff") && !c.equals(FluxResults.CONVERGED_COLUMN)) {
                columns.add(c);
            }
        }
        List<Row> rows = new ArrayList<>();
        for (int q = 0; q < first.rows().size(); q++) {
            double[][] values = new double[columns.size()][levels.size()];
            double[][] spreads = new double[columns.size()][levels.size()];
            Richardson.Estimate[] est = new Richardson.Estimate[columns.size()];
            double[] exact = new double[columns.size()];
            for (int k = 0; k < columns.size(); k++) {
                for (int l = 0; l < levels.size(); l++) {
                    double sum = 0;
                    double lo = Double.POSITIVE_INFINITY;
                    double hi = Double.NEGATIVE_INFINITY;
                    for (FluxResults run : levels.get(l)) {
                        double v = value(run, q, columns.get(k));
                        sum += v;
                        lo = Math.min(lo, v);
                        hi = Math.max(hi, v);
                    }
                    values[k][l] = sum / offsets;
                    spreads[k][l] = hi - lo;
                }
                double[] v = values[k];
                est[k] = v.length == 2 ? Richardson.twoLevels(v[0], v[1], ratio, FORMAL_ORDER)
                        : Richardson.threeLevels(v[0], v[1], v[2], ratio, FORMAL_ORDER);
                exact[k] = value(first, q, columns.get(k) + "_exact");
            }
            FluxResults.Row r = first.rows().get(q);
            rows.add(new Row(r.wavelength(), r.angleDegrees(), values, spreads, est, exact));
        }
        return new AccuracyStudy(ratio, cellSizes.clone(), offsets, List.copyOf(columns), List.copyOf(rows));
    }

    private static double value(FluxResults f, int row, String column) {
        int k = f.columns().indexOf(column);
        return k < 0 ? Double.NaN : f.rows().get(row).values()[k];
    }

    /** Whether the case had a transfer-matrix reference. */
    public boolean hasExact() {
        return !rows.isEmpty() && !Double.isNaN(rows.get(0).exact()[0]);
    }

    /** accuracy.csv: per frequency, each column at every level, extrapolated, its error estimate and order. */
    public String csv() {
        StringBuilder sb = new StringBuilder("wavelength_nm,angle_deg");
        for (String c : columns) {
            for (int l = 0; l < cellSizes.length; l++) {
                sb.append(',').append(c).append("_level").append(l + 1);
            }
            for (int l = 0; l < cellSizes.length; l++) {
                sb.append(',').append(c).append("_level").append(l + 1).append("_spread");
            }
            sb.append(',').append(c).append("_extrapolated,").append(c).append("_error_estimate,").append(c).append("_order");
            if (hasExact()) {
                sb.append(',').append(c).append("_exact,").append(c).append("_extrapolated_diff");
            }
        }
        sb.append('\n');
        for (Row r : rows) {
            sb.append(String.format(Locale.ROOT, "%.6f,%.6f", r.wavelength() * 1e9, r.angle()));
            for (int k = 0; k < columns.size(); k++) {
                for (double v : r.levels()[k]) {
                    sb.append(',').append(num(v));
                }
                for (double v : r.spreads()[k]) {
                    sb.append(',').append(num(v));
                }
                Richardson.Estimate e = r.estimates()[k];
                sb.append(',').append(num(e.extrapolated())).append(',').append(num(e.errorEstimate()))
                        .append(',').append(Double.isFinite(e.order()) ? String.format(Locale.ROOT, "%.3f", e.order()) : "");
                if (hasExact()) {
                    sb.append(',').append(num(r.exact()[k])).append(',').append(num(e.extrapolated() - r.exact()[k]));
                }
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private static String num(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%.9f", v) : "";
    }

    /** accuracy.json's content. */
    public Map<String, Object> summary() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("method", "Richardson extrapolation (L. F. Richardson, Phil. Trans. R. Soc. A 210, 307 (1911)) with the "
                + "grid convergence index of P. J. Roache, J. Fluids Eng. 116, 405 (1994) as error estimate: "
                + "Fs |f_fine - f_coarser| / (r^p - 1), Fs = 3 with the formal order p = 2 (two levels), 1.25 with the "
                + "observed order (three levels); it bounds the error of the finest level's value with that safety factor");
        m.put("offsets", "each level ran at " + offsets + " grid offset(s), k/" + offsets + " of a cell along x and y; "
                + "the levels' values are the means over them and spreads their largest minus smallest (common practice: "
                + "the mean falls smoothly with the cell size where one offset's value need not)");
        m.put("offset_count", offsets);
        m.put("refinement_ratio", ratio);
        m.put("cell_sizes_m", cellSizes.clone());
        List<Object> out = new ArrayList<>();
        for (Row r : rows) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("wavelength_m", r.wavelength());
            e.put("angle_deg", r.angle());
            for (int k = 0; k < columns.size(); k++) {
                Map<String, Object> c = new LinkedHashMap<>();
                c.put("levels", r.levels()[k].clone());
                c.put("spreads", r.spreads()[k].clone());
                Richardson.Estimate est = r.estimates()[k];
                c.put("extrapolated", est.extrapolated());
                c.put("error_estimate", est.errorEstimate());
                c.put("order", est.order());
                c.put("order_source", est.orderSource().name().toLowerCase(Locale.ROOT));
                c.put("note", est.note());
                if (hasExact()) {
                    c.put("exact", r.exact()[k]);
                }
                e.put(columns.get(k), c);
            }
            out.add(e);
        }
        m.put("frequencies", out);
        return m;
    }
}
