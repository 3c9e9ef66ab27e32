package org.evanesce.io.sweep;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.model.SampleSpec;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.image.LinePlot;
import org.evanesce.io.tolerance.Requirement;
import org.evanesce.io.tolerance.Statistics;
import org.evanesce.io.tolerance.ToleranceOutputs;

/**
 * The statistics of a sample sweep, computed from the merged sweep.csv (so shards, resumed runs and a
 * single run give the same bytes): per wavelength (one group when the case has no flux) and result
 * column the number of points, mean, standard deviation (n − 1) and the 5, 50 and 95 % percentiles
 * (linear interpolation between order statistics); against the case's limits the yield, the share of
 * points meeting every limit, with its 95 % Wilson score interval; and a histogram per main result
 * column (and per limited column) with the limits drawn in.
 */
public final class SampleSummary {

    /** The histograms' file names. */
    static final String HISTOGRAM_PATTERN = "sample-histogram-[A-Za-z0-9_.-]+\\.png";

    /** Columns of sweep.csv that are no results of a point (its number, the drawn values, bookkeeping). */
    private static final List<String> NOT_RESULTS = List.of("point", "wavelength_nm", "frequency_thz", "angle_deg", "settled",
            "steps", "wall_time_s", "stop_reason", "beam_reference_converged");

    /** A limit names a column that sweep.csv does not have: bad input (exit 2). */
    public static final class UnknownColumn extends Exception {
        private static final long serialVersionUID = 1L;

        UnknownColumn(String message) {
            super(message);
        }
    }

    /**
     * @param json the sample.json text
     * @param text the console report
     */
    public record Written(String json, String text) { }

    private SampleSummary() {
    }

    /**
     * Computes and writes sample.json and the histograms into the folder.
     *
     * @param csv      the merged sweep.csv
     * @param names    the drawn parameters, in order
     * @param total    the sample's points
     * @param missing  the points not finished (not in the csv)
     * @param caseFile the case file, for messages
     * @throws UnknownColumn a limit names a column sweep.csv lacks (nothing is written then)
     */
    public static Written write(SweepFolder folder, String csv, SampleSpec sample, List<String> names, int total,
                                List<Integer> missing, String caseFile, String caution) throws IOException, UnknownColumn {
        List<String[]> table = parse(csv);
        List<String> header = table.isEmpty() ? List.of() : List.of(table.get(0));
        List<String[]> rows = table.size() > 1 ? table.subList(1, table.size()) : List.of();
        List<String> results = new ArrayList<>();
        for (String c : header) {
            boolean drawn = names.contains(c) || names.stream().anyMatch(n -> c.equals(n + "_si"));
            if (!drawn && !NOT_RESULTS.contains(c) && !c.startsWith("incident_") && numeric(rows, header.indexOf(c))) {
                results.add(c);
            }
        }
        for (SampleSpec.Limit l : sample.require()) {
            if (!results.contains(l.column())) {
                throw new UnknownColumn(l.at() + ": sweep.sample.require." + l.column() + ": sweep.csv has no result column '"
                        + l.column() + "'" + (rows.isEmpty() ? " (no point has finished yet)" : "; its result columns are "
                        + String.join(", ", results)));
            }
        }
        // groups: one per wavelength, in the order the rows give them
        int wl = header.indexOf("wavelength_nm");
        Map<String, List<String[]>> groups = new LinkedHashMap<>();
        for (String[] r : rows) {
            groups.computeIfAbsent(wl >= 0 ? r[wl] : "", k -> new ArrayList<>()).add(r);
        }
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("program", "evanesce");
        m.put("schema", "evanesce-sample-1");
        m.put("case_file", caseFile);
        m.put("points", total);
        m.put("seed", sample.seed());
        m.put("finished", total - missing.size());
        m.put("missing", missing);
        List<Object> params = new ArrayList<>();
        for (SampleSpec.Varied v : sample.parameters()) {
            Map<String, Object> p = new LinkedHashMap<>();
            p.put("name", v.name());
            p.put("definition", v.definition());
            p.put("si_unit", v.dimension().siUnit());
            params.add(p);
        }
        m.put("parameters", params);
        List<Object> limits = new ArrayList<>();
        for (SampleSpec.Limit l : sample.require()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("column", l.column());
            e.put("min", Double.isFinite(l.min()) ? l.min() : null);
            e.put("max", Double.isFinite(l.max()) ? l.max() : null);
            limits.add(e);
        }
        m.put("require", limits);
        StringBuilder text = new StringBuilder();
        List<Object> out = new ArrayList<>();
        for (Map.Entry<String, List<String[]>> g : groups.entrySet()) {
            Map<String, Object> ge = new LinkedHashMap<>();
            ge.put("wavelength_nm", g.getKey().isEmpty() ? null : Double.parseDouble(g.getKey()));
            String suffix = groups.size() > 1 ? "-" + g.getKey() + "nm" : "";
            text.append(g.getKey().isEmpty() ? "" : "at " + g.getKey() + " nm:\n");
            text.append(String.format(Locale.ROOT, "%-22s %6s %12s %12s %12s %12s %12s%n", "", "n", "mean", "std dev", "5 %",
                    "50 %", "95 %"));
            Map<String, Object> cols = new LinkedHashMap<>();
            for (String c : results) {
                double[] v = values(g.getValue(), header.indexOf(c));
                Map<String, Object> s = new LinkedHashMap<>();
                s.put("n", v.length);
                if (v.length > 0) {
                    s.put("mean", Statistics.mean(v));
                    s.put("standard_deviation", Statistics.standardDeviation(v));
                    s.put("percentile_5", Statistics.quantile(v, 0.05));
                    s.put("percentile_50", Statistics.quantile(v, 0.5));
                    s.put("percentile_95", Statistics.quantile(v, 0.95));
                    text.append(String.format(Locale.ROOT, "%-22s %6d %12.6g %12.6g %12.6g %12.6g %12.6g%n", c, v.length,
                            Statistics.mean(v), Statistics.standardDeviation(v), Statistics.quantile(v, 0.05),
                            Statistics.quantile(v, 0.5), Statistics.quantile(v, 0.95)));
                }
                cols.put(c, s);
                if (v.length > 0 && (main(c) || sample.require().stream().anyMatch(l -> l.column().equals(c)))) {
                    List<Requirement> reqs = sample.require().stream().filter(l -> l.column().equals(c))
                            .map(l -> new Requirement(c, l.min(), l.max(), l.describe())).toList();
                    LinePlot plot = ToleranceOutputs.histogram(c, v, reqs);
                    folder.write("sample-histogram-" + c + suffix + ".png", png(plot));
                }
            }
            ge.put("columns", cols);
            if (!sample.require().isEmpty()) {
                int n = g.getValue().size();
                long k = g.getValue().stream().filter(r -> meets(r, header, sample.require())).count();
                double[] ci = Statistics.wilson(k, n);
                Map<String, Object> y = new LinkedHashMap<>();
                y.put("points", n);
                y.put("passing", k);
                y.put("yield", (double) k / n);
                y.put("interval_95_low", ci[0]);
                y.put("interval_95_high", ci[1]);
                y.put("interval_method", "Wilson score (Wilson 1927)");
                ge.put("yield", y);
                text.append(String.format(Locale.ROOT, "yield: %d of %d points meet %s: %.2f %% (95 %% interval %.2f %% to "
                        + "%.2f %%, Wilson)%n", k, n, String.join(" and ", sample.require().stream()
                        .map(SampleSpec.Limit::describe).toList()), 100.0 * k / n, 100 * ci[0], 100 * ci[1]));
            }
            out.add(ge);
        }
        m.put("groups", out);
        m.put("caution", caution);
        String json = Json.write(m);
        folder.write(SweepFolder.SAMPLE, json.getBytes(StandardCharsets.UTF_8));
        return new Written(json, text.toString());
    }

    /**
     * Checks before anything runs that each limit names a column the points will have: with {@code flux},
     * {@code T_NAME} or {@code R_NAME} of a line, or {@code A} with one line of each kind, each possibly
     * with {@code _exact}, {@code _plane_wave}, {@code _beam} or {@code _diff} and, with polarization both,
     * {@code _s} or {@code _p}; a decay fit's column {@code decay_...}.
     *
     * @throws UnknownColumn naming the limit, where it is written and the columns there will be
     */
    public static void checkLimits(SampleSpec sample, org.evanesce.io.casefile.model.CaseSpec spec) throws UnknownColumn {
        List<String> base = new ArrayList<>();
        int t = 0;
        int r = 0;
        if (spec.flux().isPresent()) {
            for (var l : spec.flux().get().lines()) {
                boolean tr = l.measures().value() == org.evanesce.io.casefile.model.FluxSpec.Measure.TRANSMITTED;
                base.add((tr ? "T_" : "R_") + l.name().value());
                t += tr ? 1 : 0;
                r += tr ? 0 : 1;
            }
            if (t == 1 && r == 1) {
                base.add("A");
            }
        }
        List<String> all = new ArrayList<>();
        for (String b : base) {
            for (String x : List.of("", "_exact", "_plane_wave", "_beam", "_diff")) {
                for (String pol : List.of("", "_s", "_p")) {
                    all.add(b + x + pol);
                }
            }
        }
        for (SampleSpec.Limit l : sample.require()) {
            if (!all.contains(l.column()) && !l.column().startsWith("decay_")) {
                throw new UnknownColumn(l.at() + ": sweep.sample.require." + l.column() + ": the points will have no result "
                        + "column '" + l.column() + "'" + (base.isEmpty() ? " (the case has no flux lines)" : "; expected one of "
                        + String.join(", ", base) + ", possibly with _exact, _plane_wave, _beam or _diff"));
            }
        }
    }

    /** A column drawn as a histogram: the simulated values, not their references or differences. */
    private static boolean main(String c) {
        return !(c.endsWith("_exact") || c.endsWith("_diff") || c.endsWith("_plane_wave") || c.endsWith("_beam")
                || c.endsWith("_s") || c.endsWith("_p") || c.endsWith("_uncertainty_m"));
    }

    /** Whether a row meets every limit (an empty cell meets none). */
    static boolean meets(String[] row, List<String> header, List<SampleSpec.Limit> limits) {
        for (SampleSpec.Limit l : limits) {
            int at = header.indexOf(l.column());
            double v = at < row.length ? number(row[at]) : Double.NaN;
            if (!(v >= l.min() && v <= l.max())) {
                return false;
            }
        }
        return true;
    }

    private static double[] values(List<String[]> rows, int column) {
        return rows.stream().mapToDouble(r -> column < r.length ? number(r[column]) : Double.NaN).filter(Double::isFinite)
                .toArray();
    }

    private static boolean numeric(List<String[]> rows, int column) {
        boolean any = false;
        for (String[] r : rows) {
            String s = column < r.length ? r[column] : "";
            if (s.isEmpty()) {
                continue;
            }
            if (Double.isNaN(number(s))) {
                return false;
            }
            any = true;
        }
        return any;
    }

    private static double number(String s) {
        try {
            return s.isEmpty() ? Double.NaN : Double.parseDouble(s);
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

    private static byte[] png(LinePlot plot) throws IOException {
        return org.evanesce.io.output.image.PngFile.encode(plot.render());
    }

    /** sweep.csv's rows: comma-separated fields, a field in double quotes when it holds a comma or a quote. */
    static List<String[]> parse(String csv) {
        List<String[]> out = new ArrayList<>();
        for (String line : csv.split("\n", -1)) {
            if (line.isEmpty()) {
                continue;
            }
            List<String> f = new ArrayList<>();
            StringBuilder cur = new StringBuilder();
            boolean quoted = false;
            for (int i = 0; i < line.length(); i++) {
                char ch = line.charAt(i);
                if (quoted) {
                    if (ch == '"' && i + 1 < line.length() && line.charAt(i + 1) == '"') {
                        cur.append('"');
                        i++;
                    } else if (ch == '"') {
                        quoted = false;
                    } else {
                        cur.append(ch);
                    }
                } else if (ch == '"') {
                    quoted = true;
                } else if (ch == ',') {
                    f.add(cur.toString());
                    cur.setLength(0);
                } else {
                    cur.append(ch);
                }
            }
            f.add(cur.toString());
            out.add(f.toArray(new String[0]));
        }
        return out;
    }

    /** Prints the report. */
    public static void print(PrintWriter o, Written w) {
        o.print(w.text());
    }
}
