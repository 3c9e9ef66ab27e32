package org.evanesce.io.sweep;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.evanesce.io.casefile.expr.Dimension;

/**
 * Gathers the finished points of a sweep into {@code sweep.csv} and {@code sweep.png} ({@link SweepPlot}). A point counts
 * when its folder holds a finished run with the point hash expected now; the others are listed as
 * missing. Values are copied as the point's own files print them (flux.csv), or printed with fixed
 * formats, and rows come in point order, so merging the same finished points always gives the same
 * bytes, whichever runs or shards computed them.
 *
 * <p>Columns: {@code point}; per swept parameter its expression text ({@code NAME}) and SI value
 * ({@code NAME_si}); then, with a flux section, one row per point and frequency with the flux.csv
 * columns (and with a surfaces section the surfaces.csv columns, {@link SurfaceColumns}); with decay fits of {@code maps}, per fit and wavelength {@code decay_NAME_WLnm_m},
 * {@code ..._uncertainty_m} and {@code ..._plane_wave_m}; with neither, one row per point with
 * {@code steps}, {@code wall_time_s} and {@code stop_reason} from run.json; last, {@code settled} from
 * run.json ({@code true}, {@code false}, or empty where the run was not judged).
 */
public final class SweepMerge {

    /** A point as the merge sees it: its values (SI, in the sweep's order) and the hash its results must carry. */
    public record Point(SweepPoint point, double[] si, String hash) {
        public Point {
            si = si.clone();
        }

        @Override
        public double[] si() {
            return si.clone();
        }
    }

    /**
     * @param csv      the merged table
     * @param missing  the numbers of the points without a finished run, in order
     * @param finished how many points were merged
     * @param png      whether sweep.png was written (it needs flux or decay fits and a finished point)
     * @param unsettled the numbers of the merged points whose run did not settle (run.json), in order
     */
    public record Result(String csv, List<Integer> missing, int finished, boolean png, List<Integer> unsettled) {
        public Result {
            missing = List.copyOf(missing);
            unsettled = List.copyOf(unsettled);
        }
    }

    /**
     * One finished point's results, read from its folder; {@code settled} as run.json has it ("" when not judged),
     * {@code design} its design wavelength in m (run.json's resolved case; NaN when absent).
     */
    record Found(Point point, List<String> fluxHeader, List<String[]> fluxRows, List<String> fluxLines,
                 Map<String, Double[]> decays, String steps, double wall, String reason, String settled, double design) { }

    private SweepMerge() {
    }

    /** Merges, writes sweep.csv (and sweep.png when there is something to plot) into the folder. */
    public static Result write(SweepFolder folder, List<Point> points, List<Dimension> kinds, String title) throws IOException {
        return write(folder, points, kinds, title, Double.NaN);
    }

    /** As {@link #write(SweepFolder, List, List, String)}, the plots at {@code plotWavelength} (m; NaN: the design wavelength). */
    public static Result write(SweepFolder folder, List<Point> points, List<Dimension> kinds, String title, double plotWavelength)
            throws IOException {
        // the points' folders are read side by side (each on its own), then taken in point order
        List<java.util.Optional<Found>> each;
        try {
            each = points.parallelStream().map(p -> {
                try {
                    return folder.finished(p.point().number(), p.hash())
                            ? java.util.Optional.of(read(folder.point(p.point().number()), p)) : java.util.Optional.<Found>empty();
                } catch (IOException e) {
                    throw new java.io.UncheckedIOException(e);
                }
            }).toList();
        } catch (java.io.UncheckedIOException e) {
            throw e.getCause();
        }
        List<Found> found = new ArrayList<>();
        List<Integer> missing = new ArrayList<>();
        for (int k = 0; k < points.size(); k++) {
            if (each.get(k).isPresent()) {
                found.add(each.get(k).get());
            } else {
                missing.add(points.get(k).point().number());
            }
        }
        String csv = csv(points.isEmpty() ? List.of() : points.get(0).point().names(), found);
        folder.write(SweepFolder.CSV, csv.getBytes(StandardCharsets.UTF_8));
        SweepPlot plot = SweepPlot.of(found, kinds, title, plotWavelength);
        byte[] png = plot == null ? null : SweepPlot.png(plot.linear());
        if (png != null) {
            folder.write(SweepFolder.PNG, png);
        }
        if (plot != null && plot.log() != null) {
            folder.write(SweepFolder.LOG_PNG, SweepPlot.png(plot.log()));
        } else if (png != null) {
            Files.deleteIfExists(folder.dir().resolve(SweepFolder.LOG_PNG)); // an earlier merge's, beside a new sweep.png
        }
        List<Integer> unsettled = found.stream().filter(f -> f.settled().equals("false")).map(f -> f.point().point().number())
                .toList();
        return new Result(csv, missing, found.size(), png != null, unsettled);
    }

    private static Found read(Path dir, Point p) throws IOException {
        List<String> header = List.of();
        List<String[]> rows = new ArrayList<>();
        Path flux = dir.resolve("flux.csv");
        if (Files.isRegularFile(flux)) {
            List<String> lines = Files.readAllLines(flux, StandardCharsets.UTF_8);
            header = List.of(lines.get(0).split(",", -1));
            for (String l : lines.subList(1, lines.size())) {
                if (!l.isEmpty()) {
                    rows.add(l.split(",", -1));
                }
            }
        }
        List<String> fluxLines = new ArrayList<>();
        Map<String, Double[]> decays = new LinkedHashMap<>();
        Path summary = dir.resolve("summary.json");
        if (Files.isRegularFile(summary) && SweepFolder.readJson(summary) instanceof Map<?, ?> s) {
            if (s.get("flux") instanceof Map<?, ?> f && f.get("lines") instanceof List<?> ls) {
                for (Object o : ls) {
                    if (o instanceof Map<?, ?> l) {
                        fluxLines.add(String.valueOf(l.get("column")));
                    }
                }
            }
            if (s.get("decay_fits") instanceof List<?> fits) {
                for (Object o : fits) {
                    if (o instanceof Map<?, ?> d) {
                        String key = "decay_" + d.get("name") + "_" + String.format(Locale.ROOT, "%.3fnm",
                                number(d.get("wavelength_m")) * 1e9);
                        decays.put(key, new Double[] {number(d.get("decay_length_m")), number(d.get("decay_length_uncertainty_m")),
                            number(d.get("plane_wave_decay_length_m"))});
                    }
                }
            }
        }
        if (Files.isRegularFile(dir.resolve("surfaces.csv"))) {
            List<String> joined = new ArrayList<>(header);
            SurfaceColumns.join(dir, joined, rows, fluxLines);
            header = joined;
        }
        Object run = SweepFolder.readJson(dir.resolve("run.json"));
        String steps = "";
        double wall = Double.NaN;
        String reason = "";
        String settled = "";
        double design = Double.NaN;
        if (run instanceof Map<?, ?> r && r.get("resolved_case") instanceof Map<?, ?> rc) {
            design = number(rc.get("design_wavelength_m"));
        }
        if (run instanceof Map<?, ?> r && r.get("run") instanceof Map<?, ?> rr) {
            steps = String.valueOf(rr.get("steps"));
            wall = number(rr.get("wall_time_s"));
            reason = String.valueOf(rr.get("stop_reason"));
            if (rr.get("settling") instanceof Map<?, ?> st && st.get("settled") instanceof Boolean b) {
                settled = b.toString();
            }
        } else {
            throw new NoSuchFileException(dir.resolve("run.json") + " has no run section");
        }
        return new Found(p, header, rows, fluxLines, decays, steps, wall, reason, settled, design);
    }

    private static double number(Object o) {
        return o instanceof Number n ? n.doubleValue() : Double.NaN;
    }

    static String csv(List<String> names, List<Found> found) {
        // the flux columns (wavelength, frequency, angle, values, incident power) and decay fits, in first-seen order
        List<String> flux = new ArrayList<>();
        List<String> decay = new ArrayList<>();
        for (Found f : found) {
            f.fluxHeader().stream().filter(c -> !flux.contains(c)).forEach(flux::add);
            f.decays().keySet().stream().filter(c -> !decay.contains(c)).forEach(decay::add);
        }
        boolean neither = flux.isEmpty() && decay.isEmpty();
        List<String> header = new ArrayList<>();
        header.add("point");
        for (String n : names) {
            header.add(n);
            header.add(n + "_si");
        }
        header.addAll(flux);
        for (String d : decay) {
            header.add(d + "_m");
            header.add(d + "_uncertainty_m");
            header.add(d + "_plane_wave_m");
        }
        if (neither) {
            header.addAll(List.of("steps", "wall_time_s", "stop_reason"));
        }
        header.add("settled");
        StringBuilder sb = new StringBuilder(String.join(",", header)).append('\n');
        for (Found f : found) {
            StringBuilder lead = new StringBuilder().append(f.point().point().number());
            double[] si = f.point().si();
            for (int k = 0; k < names.size(); k++) {
                lead.append(',').append(quote(f.point().point().texts().get(k)));
                lead.append(',').append(Double.isFinite(si[k]) ? String.format(Locale.ROOT, "%.12e", si[k]) : "");
            }
            StringBuilder tail = new StringBuilder();
            for (String d : decay) {
                Double[] v = f.decays().get(d);
                for (int k = 0; k < 3; k++) {
                    tail.append(',').append(v == null || !Double.isFinite(v[k]) ? "" : String.format(Locale.ROOT, "%.9e", v[k]));
                }
            }
            if (neither) {
                tail.append(',').append(f.steps()).append(',').append(Double.isFinite(f.wall())
                        ? String.format(Locale.ROOT, "%.3f", f.wall()) : "").append(',').append(quote(f.reason()));
            }
            tail.append(',').append(f.settled());
            if (flux.isEmpty()) {
                sb.append(lead).append(tail).append('\n');
                continue;
            }
            for (String[] row : f.fluxRows()) {
                sb.append(lead);
                for (String c : flux) {
                    int at = f.fluxHeader().indexOf(c);
                    sb.append(',').append(at >= 0 && at < row.length ? row[at] : "");
                }
                sb.append(tail).append('\n');
            }
        }
        return sb.toString();
    }

    /** A CSV field, quoted when it holds a comma, a quote or a line break. */
    static String quote(String s) {
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }

    /** The unit a parameter is plotted in: lengths, times and frequencies with a prefix that suits the values. */
    record DisplayUnit(String name, double factor) {

        static DisplayUnit of(Dimension d, double maxAbs) {
            if (d.equals(Dimension.LENGTH)) {
                return maxAbs < 1e-6 ? new DisplayUnit("nm", 1e-9) : maxAbs < 1e-3 ? new DisplayUnit("um", 1e-6)
                        : maxAbs < 1 ? new DisplayUnit("mm", 1e-3) : new DisplayUnit("m", 1);
            } else if (d.equals(Dimension.TIME)) {
                return maxAbs < 1e-12 ? new DisplayUnit("fs", 1e-15) : maxAbs < 1e-9 ? new DisplayUnit("ps", 1e-12)
                        : maxAbs < 1e-6 ? new DisplayUnit("ns", 1e-9) : new DisplayUnit("s", 1);
            } else if (d.equals(Dimension.FREQUENCY)) {
                return maxAbs < 1e9 ? new DisplayUnit("Hz", 1) : maxAbs < 1e12 ? new DisplayUnit("GHz", 1e9)
                        : maxAbs < 1e15 ? new DisplayUnit("THz", 1e12) : new DisplayUnit("PHz", 1e15);
            } else if (d.equals(Dimension.ANGLE)) {
                return new DisplayUnit("deg", Math.PI / 180);
            }
            return new DisplayUnit(d.siUnit(), 1);
        }
    }

    /** The point numbers as ranges for messages: {@code 1, 3-5, 9}. */
    public static String ranges(List<Integer> numbers) {
        TreeMap<Integer, Integer> runs = new TreeMap<>();
        int start = -2;
        int last = -2;
        for (int n : numbers) {
            if (n != last + 1) {
                if (start >= 0) {
                    runs.put(start, last);
                }
                start = n;
            }
            last = n;
        }
        if (start >= 0) {
            runs.put(start, last);
        }
        List<String> parts = new ArrayList<>();
        runs.forEach((a, z) -> parts.add(a.equals(z) ? a.toString() : a + "-" + z));
        return String.join(", ", parts);
    }
}
