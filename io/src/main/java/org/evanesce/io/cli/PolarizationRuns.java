package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.model.PolarizationChoice;
import org.evanesce.io.output.BuildInfo;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.run.FluxResults;
import org.evanesce.io.run.FluxTable;
import org.evanesce.io.run.PolarizationAverage;
import org.evanesce.io.run.RunOutputs;
import org.evanesce.io.sweep.SweepFolder;

/**
 * A case with {@code polarization: both}: an s run into {@code s/} and a p run into {@code p/} of the
 * results folder (each a complete results folder), then {@code flux.csv}, {@code summary.json} and
 * {@code run.json} at the top with both runs and their unpolarised average ({@link PolarizationAverage}).
 */
final class PolarizationRuns {

    /** The sub-folders of the two runs. */
    static final String S = "s";
    static final String P = "p";

    /**
     * @param s        the s run (planned)
     * @param p        the p run
     * @param averaged the unpolarised flux table, null without flux
     * @param settled  false when either run did not settle
     * @param warnings both runs' warnings, each prefixed with its polarization
     */
    record Both(CaseExecution.Finished s, CaseExecution.Finished p, FluxResults averaged, Boolean settled,
                List<String> warnings) { }

    private PolarizationRuns() {
    }

    /** The overrides of one run of a both case: the given ones with {@code polarization} set. */
    static Map<String, String> overrides(Map<String, String> overrides, PolarizationChoice run) {
        Map<String, String> m = new LinkedHashMap<>(overrides);
        m.put(PolarizationChoice.KEY, run.caseName());
        return m;
    }

    /**
     * Runs both into the open folder {@code rf} and writes the combined files.
     *
     * @param overrides the run's overrides (without the polarization each run adds)
     * @param table     print the averaged flux table
     */
    static Both run(CaseOptions.Loaded s, CaseOptions.Loaded p, Map<String, String> overrides, RunFolder rf, PrintWriter o,
                    double progressSeconds, boolean table, List<String> commandLine) throws IOException {
        return run(s, p, overrides, rf, o, progressSeconds, table, commandLine, null, null);
    }

    /**
     * As {@link #run(CaseOptions.Loaded, CaseOptions.Loaded, Map, RunFolder, PrintWriter, double, boolean, List)}, the s
     * and p runs saving to and continuing from their own checkpoints (null: none), which the caller deletes once the
     * results are in place.
     */
    static Both run(CaseOptions.Loaded s, CaseOptions.Loaded p, Map<String, String> overrides, RunFolder rf, PrintWriter o,
                    double progressSeconds, boolean table, List<String> commandLine, org.evanesce.io.run.Checkpoints sCheckpoints,
                    org.evanesce.io.run.Checkpoints pCheckpoints) throws IOException {
        o.println("polarization: both: an s run into " + S + "/, then a p run into " + P + "/");
        CaseExecution.Finished fs = one(S, s, overrides(overrides, PolarizationChoice.S), rf, o, progressSeconds, commandLine,
                sCheckpoints);
        CaseExecution.Finished fp = one(P, p, overrides(overrides, PolarizationChoice.P), rf, o, progressSeconds, commandLine,
                pCheckpoints);
        List<String> warnings = new ArrayList<>();
        fs.warnings().forEach(w -> warnings.add("s: " + w));
        fp.warnings().forEach(w -> warnings.add("p: " + w));
        Boolean settled = PolarizationAverage.settled(fs.settling().settled(), fp.settling().settled());
        FluxResults averaged = null;
        if (fs.flux() != null && fp.flux() != null) {
            averaged = PolarizationAverage.average(fs.flux(), fp.flux());
            rf.writeText("flux.csv", PolarizationAverage.csv(fs.flux(), fp.flux()));
            org.evanesce.io.run.FluxPlot.write(averaged, s.plan().spec().title().orElse("") + " (unpolarised)", rf.dir());
        }
        Path sSummary = rf.dir().resolve(S).resolve("summary.json");
        if (Files.isRegularFile(sSummary)) {
            Object a = SweepFolder.readJson(sSummary);
            Object b = SweepFolder.readJson(rf.dir().resolve(P).resolve("summary.json"));
            rf.writeText("summary.json", Json.write(PolarizationAverage.summary(a, b, fs.flux(), settled, warnings)));
        }
        rf.writeText("run.json", Json.write(record(s, fs, fp, settled, warnings, overrides, commandLine)));
        if (averaged != null && table) {
            o.println("unpolarised average (s and p in flux.csv):");
            FluxTable.print(o, averaged);
        }
        return new Both(fs, fp, averaged, settled, List.copyOf(warnings));
    }

    private static CaseExecution.Finished one(String name, CaseOptions.Loaded l, Map<String, String> overrides, RunFolder rf,
                                              PrintWriter o, double progressSeconds, List<String> commandLine,
                                              org.evanesce.io.run.Checkpoints checkpoints) throws IOException {
        try (RunFolder sub = RunFolder.begin(rf.dir().resolve(name), false)) {
            CaseExecution.Finished f = CaseExecution.run(l, overrides, sub, o, progressSeconds, false, checkpoints, commandLine);
            sub.commit();
            return f;
        }
    }

    /**
     * The top run.json: what ran (as each run's run.json has it in detail), and a {@code run} part summing
     * the two runs (steps, wall time), with both stop reasons and the combined settling.
     */
    private static Map<String, Object> record(CaseOptions.Loaded s, CaseExecution.Finished fs, CaseExecution.Finished fp,
                                              Boolean settled, List<String> warnings, Map<String, String> overrides,
                                              List<String> commandLine) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("program", "evanesce");
        BuildInfo build = BuildInfo.current();
        m.put("version", build.version());
        m.put("build", build.record());
        List<String> cl = new ArrayList<>(List.of("evanesce"));
        cl.addAll(commandLine);
        m.put("command_line", cl);
        m.put("case_file", s.plan().spec().source());
        m.put("case_sha256", s.sha256());
        m.put("overrides", new LinkedHashMap<>(overrides));
        m.put("polarization", "both");
        Map<String, Object> runs = new LinkedHashMap<>();
        runs.put(S, S + "/run.json");
        runs.put(P, P + "/run.json");
        m.put("runs", runs);
        m.put("caution", RunOutputs.CAUTION);
        Map<String, Object> run = new LinkedHashMap<>();
        run.put("steps", fs.result().steps() + fp.result().steps());
        run.put("wall_time_s", fs.result().wallSeconds() + fp.result().wallSeconds());
        run.put("stop_reason", String.format(Locale.ROOT, "s: %s; p: %s", fs.result().stopReason(), fp.result().stopReason()));
        Map<String, Object> st = new LinkedHashMap<>();
        st.put("settled", settled);
        st.put("rule", "both runs settled (their own run.json has the details)");
        run.put("settling", st);
        m.put("run", run);
        m.put("warnings", warnings);
        return m;
    }
}
