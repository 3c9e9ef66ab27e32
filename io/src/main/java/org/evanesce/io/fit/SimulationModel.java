package org.evanesce.io.fit;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.LoadedCase;
import org.evanesce.io.casefile.model.PolarizationChoice;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.output.BuildInfo;
import org.evanesce.io.output.SafeFiles;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.evanesce.io.plan.PlanException;
import org.evanesce.io.run.CaseRunner;
import org.evanesce.io.run.FluxResults;
import org.evanesce.io.sweep.PointHash;
import org.evanesce.solver.DivergenceException;

/**
 * The full-simulation model of a fit: the case run with the trial values (and, for a curve against a
 * case parameter, the point's value) set as overrides; R or T is the case's first reflected or
 * transmitted flux line, at the design wavelength (a curve against a parameter) or interpolated
 * linearly between the flux wavelengths (a curve against wavelength). Every run's flux table is cached
 * in a folder of its own, one file per set of overrides, named by the hash of the case file's text,
 * the overrides, the program's version and build ({@link PointHash}): a fit run again (after a kill,
 * or with other bounds) takes what was computed from there. Each file is written atomically and
 * carries its hash and a SHA-256 of its content, and is used only when both check; a damaged one is
 * computed again and replaced.
 */
final class SimulationModel {

    /** The first line of a cache file. */
    static final String MAGIC = "evanesce fit evaluation 1";

    private final Path caseFile;
    private final byte[] caseBytes;
    private final String caseText;
    private final Path cache;
    private final Integer threads;
    private final PrintWriter out;
    private final MeasuredCurve.Measured measured;
    private int runs;
    private int reused;

    /**
     * @param cache   the cache folder (created when the first run finishes)
     * @param threads threads per run (null: the case's or all cores)
     * @throws FitInputException a case without flux lines, a curve against angle, polarization both
     */
    SimulationModel(Path caseFile, Map<String, String> overrides, MeasuredCurve curve, Path cache, Integer threads,
                    PrintWriter out) throws IOException, FitInputException {
        this.caseFile = caseFile;
        this.caseBytes = Files.readAllBytes(caseFile);
        this.caseText = new String(caseBytes, StandardCharsets.UTF_8);
        this.cache = cache;
        this.threads = threads;
        this.out = out;
        this.measured = curve.measured();
        if (curve.swept().equals("angle")) {
            throw new FitInputException("--model simulation: " + curve.file() + " is a curve against angle; the simulation "
                    + "takes a curve against wavelength or a case parameter (define the angle as a parameter, e.g. theta, "
                    + "and write the header 'theta (deg)')");
        }
        CaseSpec spec = spec(overrides);
        if (spec.flux().isEmpty()) {
            throw new FitInputException("--model simulation: " + caseFile + " has no flux section; the simulation model reads "
                    + "R or T from its flux lines");
        }
        if (spec.polarizations() == PolarizationChoice.BOTH) {
            throw new FitInputException("--model simulation: " + caseFile + " has polarization both; fit one polarization "
                    + "(--set polarization=s or p)");
        }
    }

    int runs() {
        return runs;
    }

    int reused() {
        return reused;
    }

    /** The model's R or T at every point of the curve for the overrides {@code set} (the free parameters' values). */
    double[] values(Map<String, String> set, MeasuredCurve curve, Dimension swept, double angleOffset)
            throws IOException, FitInputException {
        double[] v = new double[curve.size()];
        if (curve.swept().equals("wavelength")) {
            Table t = table(set);
            for (int i = 0; i < v.length; i++) {
                v[i] = t.at(curve.x()[i], curve.file() + ":" + curve.lines()[i]);
            }
            return v;
        }
        for (int i = 0; i < v.length; i++) {
            Map<String, String> p = new LinkedHashMap<>(set);
            p.put(curve.swept(), Units.override(curve.x()[i], swept));
            Table t = table(p);
            v[i] = t.at(t.design, curve.file() + ":" + curve.lines()[i]);
        }
        return v;
    }

    /** A run's flux table: wavelengths (m, ascending) and the measured column. */
    private record Table(double[] wavelength, double[] value, double design) {
        double at(double wl, String where) throws FitInputException {
            if (wavelength.length == 1) {
                if (Math.abs(wl - wavelength[0]) > 1e-6 * wl) {
                    throw new FitInputException(String.format(Locale.ROOT, "%s: the case's flux has only %.3f nm; give the "
                            + "case flux wavelengths that cover the curve", where, wavelength[0] * 1e9));
                }
                return value[0];
            }
            for (int k = 0; k + 1 < wavelength.length; k++) {
                if (wl >= wavelength[k] * (1 - 1e-9) && wl <= wavelength[k + 1] * (1 + 1e-9)) {
                    double f = (wl - wavelength[k]) / (wavelength[k + 1] - wavelength[k]);
                    return value[k] + f * (value[k + 1] - value[k]);
                }
            }
            throw new FitInputException(String.format(Locale.ROOT, "%s: %.3f nm lies outside the case's flux wavelengths "
                    + "(%.3f to %.3f nm); widen flux.wavelengths", where, wl * 1e9, wavelength[0] * 1e9,
                    wavelength[wavelength.length - 1] * 1e9));
        }
    }

    private Table table(Map<String, String> set) throws IOException, FitInputException {
        BuildInfo b = BuildInfo.current();
        String hash = PointHash.of(caseBytes, set, b.version(), b.id());
        Path f = cache.resolve(hash + ".txt");
        String csv = read(f, hash);
        if (csv != null) {
            reused++;
        } else {
            csv = run(set);
            Files.createDirectories(cache);
            StringBuilder body = new StringBuilder(MAGIC).append('\n').append("hash ").append(hash).append('\n');
            new java.util.TreeMap<>(set).forEach((k, v) -> body.append("set ").append(k).append('=').append(v).append('\n'));
            body.append(csv);
            String text = body + "sha256 " + PointHash.sha256(body.toString().getBytes(StandardCharsets.UTF_8)) + "\n";
            SafeFiles.writeString(f, text);
            runs++;
        }
        return parse(csv, spec(set).designWavelength().si());
    }

    /** The flux.csv held by a cache file, or null when it is missing or does not check (then it is computed again). */
    static String read(Path f, String hash) throws IOException {
        if (!Files.isRegularFile(f)) {
            return null;
        }
        String text = Files.readString(f, StandardCharsets.UTF_8);
        int last = text.lastIndexOf("sha256 ");
        if (!text.startsWith(MAGIC + "\nhash " + hash + "\n") || last < 0 || !text.endsWith("\n")) {
            return null;
        }
        String body = text.substring(0, last);
        if (!text.substring(last + 7, text.length() - 1).equals(PointHash.sha256(body.getBytes(StandardCharsets.UTF_8)))) {
            return null;
        }
        int start = body.indexOf("wavelength_nm");
        return start < 0 ? null : body.substring(start);
    }

    private Table parse(String csv, double design) throws FitInputException {
        List<String> lines = csv.lines().filter(l -> !l.isBlank()).toList();
        List<String> header = List.of(lines.get(0).split(",", -1));
        int col = -1;
        for (int k = 0; k < header.size() && col < 0; k++) {
            if (header.get(k).startsWith(measured == MeasuredCurve.Measured.R ? "R_" : "T_")
                    && !header.get(k).matches(".*_(exact|diff|plane_wave|beam)$")) {
                col = k;
            }
        }
        if (col < 0) {
            throw new FitInputException("--model simulation: " + caseFile + " has no " + (measured == MeasuredCurve.Measured.R
                    ? "reflected" : "transmitted") + " flux line for the measured " + measured);
        }
        List<double[]> rows = new ArrayList<>();
        for (String l : lines.subList(1, lines.size())) {
            String[] c = l.split(",", -1);
            rows.add(new double[] {Double.parseDouble(c[0]) * 1e-9, c[col].isEmpty() ? Double.NaN : Double.parseDouble(c[col])});
        }
        rows.sort((a, b) -> Double.compare(a[0], b[0]));
        double[] wl = rows.stream().mapToDouble(r -> r[0]).toArray();
        double[] v = rows.stream().mapToDouble(r -> r[1]).toArray();
        // a curve against a parameter reads the flux wavelength nearest the design wavelength
        double nearest = wl[0];
        for (double w : wl) {
            nearest = Math.abs(w - design) < Math.abs(nearest - design) ? w : nearest;
        }
        return new Table(wl, v, nearest);
    }

    private CaseSpec spec(Map<String, String> set) throws FitInputException {
        try {
            return CaseLoader.parse(caseText, caseFile.toString(), set, ReadOptions.defaults()).spec();
        } catch (CaseFileException e) {
            throw FitInputException.ofCase(e.errors(), set);
        }
    }

    /** Runs the case with the overrides; its flux.csv. */
    private String run(Map<String, String> set) throws FitInputException {
        long t0 = System.nanoTime();
        try {
            LoadedCase lc = CaseLoader.parse(caseText, caseFile.toString(), set, ReadOptions.defaults());
            CasePlan plan = CasePlanner.plan(lc.spec(), threads);
            CaseRunner.Result r = CaseRunner.run(plan, null, 10);
            String csv = FluxResults.of(plan.flux().orElseThrow(), lc.spec().polarization().value()).csv();
            out.printf(Locale.ROOT, "  simulation %d (%s): %d steps in %.1f s%n", runs + 1, describe(set), r.steps(),
                    (System.nanoTime() - t0) * 1e-9);
            out.flush();
            return csv;
        } catch (CaseFileException e) {
            throw FitInputException.ofCase(e.errors(), set);
        } catch (PlanException e) {
            throw FitInputException.ofCase(e.diagnostics(), set);
        } catch (DivergenceException | CaseRunner.RefusedException e) {
            throw new FitInputException("the simulation with " + set + " failed: " + e.getMessage());
        }
    }

    private static String describe(Map<String, String> set) {
        List<String> parts = new ArrayList<>();
        set.forEach((k, v) -> parts.add(k + "=" + v));
        return String.join(", ", parts);
    }
}
