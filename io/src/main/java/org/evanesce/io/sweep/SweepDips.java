package org.evanesce.io.sweep;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What {@link DipShift} reads from one merged sweep folder: the swept parameters (sweep.json), the minima of
 * the flux columns against the one swept angle (sweep-extrema.csv), and the case as its first point ran it
 * (that point's run.json: the resolved case with every material's permittivity at the run's wavelengths, and
 * the grid). Nothing in the folder is written.
 *
 * @param dir        the folder
 * @param caseFile   sweep.json's case file
 * @param caseSha256 sweep.json's hash of the case file's bytes
 * @param set        sweep.json's {@code --set} overrides
 * @param parameters the swept parameters in the sweep's order, each {@code name}, {@code kind}, {@code values}
 * @param angle      the index in {@code parameters} of the swept angle
 * @param dips       the minima against the angle, keyed by {@link Dip#key()}, in the file's order
 * @param runJson    the first point's run.json (for {@code polarization: both}, its s run's)
 * @param runJsonPath where that run.json is, for messages
 */
public record SweepDips(Path dir, String caseFile, String caseSha256, Map<String, Object> set, List<Parameter> parameters,
                        int angle, Map<String, Dip> dips, Map<String, Object> runJson, Path runJsonPath) {

    /** A swept parameter as sweep.json records it. */
    public record Parameter(String name, String kind, List<String> values) { }

    /**
     * One minimum of a column against the angle.
     *
     * @param wavelengthNm sweep-extrema.csv's wavelength text (nm)
     * @param others       the other swept parameters' texts, in the sweep's order (the angle's left out)
     * @param column       the flux column
     * @param angleRad     the interpolated angle of the minimum, radians
     * @param value        the column's value there
     * @param bracketed    false when the lowest point is an end of the angle range
     * @param span         the column's maximum over the angle range minus this minimum (sweep-extrema.csv's max row; NaN
     *                     without one): how deep the dip can be at most
     */
    public record Dip(String wavelengthNm, List<String> others, String column, double angleRad, double value, boolean bracketed,
                      double span) {
        /** Wavelength, other parameters and column: what pairs a dip of one sweep with the other's. */
        String key() {
            return wavelengthNm + "\u0000" + String.join("\u0000", others) + "\u0000" + column;
        }
    }

    /** A folder that cannot be used, with the reason in words naming the folder or file. */
    public static final class Unusable extends Exception {
        private static final long serialVersionUID = 1L;

        public Unusable(String message) {
            super(message);
        }
    }

    /**
     * Reads a merged sweep folder.
     *
     * @throws Unusable    when it is no merged sweep folder, has no minima against exactly one swept angle, or its
     *                     files cannot be read as evanesce wrote them
     * @throws IOException when a file exists but cannot be read
     */
    public static SweepDips read(Path dir) throws Unusable, IOException {
        if (!Files.isDirectory(dir)) {
            throw new Unusable(dir + ": " + (Files.exists(dir, LinkOption.NOFOLLOW_LINKS) ? "not a folder" : "no such folder")
                    + "; expected the folder of a merged sweep (evanesce sweep CASE --out DIR)");
        }
        Path record = dir.resolve(SweepFolder.RECORD);
        Object json;
        try {
            json = SweepFolder.readJson(record);
        } catch (NoSuchFileException e) {
            throw new Unusable(dir + ": no " + SweepFolder.RECORD + ": not a sweep's folder (expected the --out of evanesce sweep)");
        } catch (IOException e) {
            throw new Unusable(record + ": " + e.getMessage());
        }
        if (!(json instanceof Map<?, ?> m) || !(m.get("parameters") instanceof List<?> ps) || !(m.get("points") instanceof List<?> pts)) {
            throw new Unusable(record + ": not a sweep record of evanesce (no parameters or points)");
        }
        if (m.get("sample") != null || "sample".equals(m.get("combine"))) {
            throw new Unusable(record + ": a sample sweep (random points) has no dips against an angle");
        }
        List<Parameter> parameters = new ArrayList<>();
        int angle = -1;
        for (Object o : ps) {
            if (!(o instanceof Map<?, ?> p) || !(p.get("name") instanceof String name) || !(p.get("values") instanceof List<?> vs)) {
                throw new Unusable(record + ": a parameter without a name or values");
            }
            String kind = String.valueOf(p.get("kind"));
            if (kind.equals(org.evanesce.io.casefile.expr.Dimension.ANGLE.describe())) {
                if (angle >= 0) {
                    throw new Unusable(record + ": two swept angles (" + parameters.get(angle).name() + ", " + name
                            + "); expected one angle swept, so that each sweep gives one dip per wavelength and column");
                }
                angle = parameters.size();
            }
            parameters.add(new Parameter(name, kind, vs.stream().map(String::valueOf).toList()));
        }
        if (angle < 0) {
            throw new Unusable(record + ": no angle is swept (parameters: " + String.join(", ", parameters.stream()
                    .map(p -> p.name() + " (" + p.kind() + ")").toList()) + "); expected a sweep over an angle of incidence");
        }
        Map<String, Dip> dips = dips(dir, parameters, angle);
        Path runJsonPath = firstRun(dir, pts, record);
        Map<String, Object> run = map(runJsonPath);
        if (!(run.get("resolved_case") instanceof Map<?, ?>) && run.get("runs") instanceof Map<?, ?> runs && !runs.isEmpty()) {
            // polarization: both: the top run.json names its two runs; their cases differ only in the polarization
            runJsonPath = runJsonPath.resolveSibling(String.valueOf(runs.values().iterator().next()));
            run = map(runJsonPath);
        }
        if (!(run.get("resolved_case") instanceof Map<?, ?>)) {
            throw new Unusable(runJsonPath + ": holds no resolved_case (not a run record of this version of evanesce)");
        }
        return new SweepDips(dir, String.valueOf(m.get("case_file")), String.valueOf(m.get("case_sha256")),
                m.get("set") instanceof Map<?, ?> s ? cast(s) : Map.of(), List.copyOf(parameters), angle, dips, run,
                runJsonPath);
    }

    /** The resolved case of the first point's run. */
    @SuppressWarnings("unchecked")
    public Map<String, Object> resolvedCase() {
        return (Map<String, Object>) runJson.get("resolved_case");
    }

    /** The angle parameter. */
    public Parameter angleParameter() {
        return parameters.get(angle);
    }

    private static Map<String, Dip> dips(Path dir, List<Parameter> parameters, int angle) throws Unusable, IOException {
        Path file = dir.resolve(SweepExtrema.EXTREMA);
        if (!Files.isRegularFile(file)) {
            throw new Unusable(dir + ": no " + SweepExtrema.EXTREMA + " (a merged sweep writes it when it has a flux section and "
                    + "3 or more values of a swept number); run evanesce sweep with flux lines and 3 or more angles");
        }
        List<String[]> t = SampleSummary.parse(Files.readString(file));
        if (t.isEmpty()) {
            throw new Unusable(file + ": empty");
        }
        List<String> head = List.of(t.get(0));
        int wl = head.indexOf("wavelength_nm");
        int par = head.indexOf("parameter");
        int col = head.indexOf("column");
        int kind = head.indexOf("kind");
        int x = head.indexOf("parameter_si");
        int val = head.indexOf("value");
        int br = head.indexOf("bracketed");
        int[] at = new int[parameters.size()];
        for (int k = 0; k < at.length; k++) {
            at[k] = head.indexOf(parameters.get(k).name());
        }
        if (wl < 0 || par < 0 || col < 0 || kind < 0 || x < 0 || val < 0 || br < 0 || java.util.Arrays.stream(at).anyMatch(a -> a < 0)) {
            throw new Unusable(file + ": line 1: not the header evanesce writes (expected wavelength_nm, the swept "
                    + "parameters, parameter, column, kind, parameter_si, value, bracketed, ...)");
        }
        String angleName = parameters.get(angle).name();
        Map<String, Dip> out = new LinkedHashMap<>();
        Map<String, Double> maxima = new LinkedHashMap<>();
        for (int r = 1; r < t.size(); r++) {
            String[] row = t.get(r);
            if (row.length < head.size()) {
                throw new Unusable(file + ": line " + (r + 1) + ": " + row.length + " fields, expected " + head.size());
            }
            if (!row[par].equals(angleName) || !row[kind].equals("min") && !row[kind].equals("max")) {
                continue;
            }
            List<String> others = new ArrayList<>();
            for (int k = 0; k < at.length; k++) {
                if (k != angle) {
                    others.add(row[at[k]]);
                }
            }
            double a;
            double v;
            try {
                a = Double.parseDouble(row[x]);
                v = Double.parseDouble(row[val]);
            } catch (NumberFormatException e) {
                throw new Unusable(file + ": line " + (r + 1) + ": parameter_si '" + row[x] + "' or value '" + row[val]
                        + "': expected numbers");
            }
            Dip d = new Dip(row[wl], List.copyOf(others), row[col], a, v, Boolean.parseBoolean(row[br]), Double.NaN);
            if (row[kind].equals("max")) {
                maxima.put(d.key(), v);
            } else {
                out.put(d.key(), d);
            }
        }
        out.replaceAll((k, d) -> new Dip(d.wavelengthNm(), d.others(), d.column(), d.angleRad(), d.value(), d.bracketed(),
                maxima.getOrDefault(k, Double.NaN) - d.value()));
        if (out.isEmpty()) {
            throw new Unusable(file + ": no minimum against the angle " + angleName + " (is it swept over 3 or more values?)");
        }
        return out;
    }

    private static Path firstRun(Path dir, List<?> points, Path record) throws Unusable {
        for (Object o : points) {
            if (o instanceof Map<?, ?> p && p.get("folder") instanceof String f) {
                Path run = dir.resolve(f).resolve("run.json");
                if (Files.isRegularFile(run)) {
                    return run;
                }
            }
        }
        throw new Unusable(dir + ": no point folder with a run.json (the points named in " + record.getFileName()
                + "); the case each point ran is read from there");
    }

    private static Map<String, Object> map(Path file) throws Unusable, IOException {
        Object o;
        try {
            o = SweepFolder.readJson(file);
        } catch (NoSuchFileException e) {
            throw new Unusable(file + ": no such file");
        }
        if (!(o instanceof Map<?, ?> m)) {
            throw new Unusable(file + ": not a run record of evanesce");
        }
        return cast(m);
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> cast(Map<?, ?> m) {
        return (Map<String, Object>) m;
    }
}
