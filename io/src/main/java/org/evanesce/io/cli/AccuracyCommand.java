package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.evanesce.io.Main;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.run.FluxResults;
import org.evanesce.io.run.RunOutputs;
import org.evanesce.io.study.AccuracyStudy;
import org.evanesce.io.study.Richardson;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * {@code evanesce accuracy CASE}: runs a case with a flux section at its own resolution and at one or
 * two finer ones, and reports each flux value extrapolated to zero cell size with an error estimate.
 */
@Command(name = "accuracy", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, sortOptions = false,
        description = {"Run a case at two or three resolutions (its own, then finer by --ratio each time) and extrapolate "
                + "every flux value (T, R, A per frequency) to zero cell size (Richardson), with an error estimate "
                + "(Roache's grid convergence index). Writes accuracy.csv, accuracy.json and one results folder per level.",
            "Each finer level costs about ratio^3 times the one before (ratio^2 cells, ratio times the steps)."})
public final class AccuracyCommand implements Callable<Integer> {

    @Spec
    private CommandSpec spec;

    @Mixin
    private CaseOptions options;

    @Option(names = "--levels", paramLabel = "2|3", defaultValue = "2",
            description = "Resolutions to run (default: ${DEFAULT-VALUE}); three also measure the order of convergence.")
    private int levels;

    @Option(names = "--ratio", paramLabel = "R", defaultValue = "2",
            description = "Refinement between levels: each level's cells per wavelength are R times the last's (default: "
                    + "${DEFAULT-VALUE}).")
    private double ratio;

    @Option(names = "--out", paramLabel = "DIR", description = "Study folder (default: the case's output folder + '-accuracy').")
    private Path out;

    @Option(names = "--force", description = "Replace an existing study folder (only once the new study has finished).")
    private boolean force;

    @Option(names = "--progress-seconds", paramLabel = "S", defaultValue = "10",
            description = "Seconds between progress lines when the output is not a terminal (default: ${DEFAULT-VALUE}).")
    private double progressSeconds;

    @Override
    public Integer call() throws IOException {
        if (levels < 2 || levels > 3) {
            throw new ParameterException(spec.commandLine(), "--levels " + levels + ": expected 2 or 3");
        }
        if (!(ratio >= 1.1 && ratio <= 4)) {
            throw new ParameterException(spec.commandLine(), "--ratio " + ratio + ": expected a refinement between 1.1 and 4");
        }
        PrintWriter o = spec.commandLine().getOut();
        List<CaseOptions.Loaded> loaded = new ArrayList<>();
        for (int l = 0; l < levels; l++) {
            // every level is read and planned before anything runs, so a bad level costs nothing
            try {
                loaded.add(options.load(spec.commandLine().getErr(),
                        ReadOptions.defaults().withResolutionScale(Math.pow(ratio, l))));
            } catch (CaseOptions.BadInput e) {
                throw new ParameterException(spec.commandLine(), (l > 0 ? "level " + (l + 1) + ": " : "") + e.getMessage());
            }
        }
        if (loaded.get(0).plan().flux().isEmpty()) {
            throw new ParameterException(spec.commandLine(), options.caseFile + ": an accuracy study extrapolates the flux "
                    + "table; the case has no flux section");
        }
        Path base = RunCommand.defaultFolder(options.caseFile, loaded.get(0).plan().spec());
        Path folder = out != null ? out : base.resolveSibling(base.getFileName() + "-accuracy");
        try (RunFolder study = RunFolder.begin(folder, force)) {
            List<FluxResults> tables = new ArrayList<>();
            double[] cells = new double[levels];
            for (int l = 0; l < levels; l++) {
                CaseOptions.Loaded c = loaded.get(l);
                cells[l] = c.plan().grid().cellSize();
                o.printf(Locale.ROOT, "level %d of %d: cell %.4g nm%n", l + 1, levels, cells[l] * 1e9);
                try (RunFolder rf = RunFolder.begin(study.dir().resolve("level" + (l + 1)), false)) {
                    tables.add(CaseExecution.run(c, options.overrides, rf, o, progressSeconds).flux());
                    rf.commit();
                }
            }
            AccuracyStudy s = AccuracyStudy.of(tables, cells[0] / cells[1], cells);
            study.writeText("accuracy.csv", s.csv());
            java.util.Map<String, Object> json = new java.util.LinkedHashMap<>();
            json.put("program", "evanesce");
            json.put("case_file", options.caseFile.toString());
            json.put("overrides", new java.util.LinkedHashMap<>(options.overrides));
            json.put("caution", RunOutputs.CAUTION);
            json.putAll(s.summary());
            study.writeText("accuracy.json", Json.write(json));
            study.commit();
            print(o, s);
            o.println("results: " + study.target());
            o.println("Caution: " + RunOutputs.CAUTION);
            return Main.OK;
        } catch (FileAlreadyExistsException e) {
            throw new ParameterException(spec.commandLine(), e.getFile() + ": " + e.getReason());
        }
    }

    private static void print(PrintWriter o, AccuracyStudy s) {
        StringBuilder h = new StringBuilder(String.format(Locale.ROOT, "%13s %9s %8s", "wavelength_nm", "angle_deg", "value"));
        for (int l = 0; l < s.cellSizes().length; l++) {
            h.append(String.format(Locale.ROOT, " %10s", "level" + (l + 1)));
        }
        h.append(String.format(Locale.ROOT, " %12s %10s %6s", "extrapolated", "± estimate", "order"));
        if (s.hasExact()) {
            h.append(String.format(Locale.ROOT, " %10s %10s", "exact", "extr-exact"));
        }
        o.println(h);
        for (AccuracyStudy.Row r : s.rows()) {
            for (int k = 0; k < s.columns().size(); k++) {
                StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "%13.3f %9.4f %8s", r.wavelength() * 1e9,
                        r.angle(), s.columns().get(k)));
                for (double v : r.levels()[k]) {
                    sb.append(String.format(Locale.ROOT, " %10.6f", v));
                }
                Richardson.Estimate e = r.estimates()[k];
                sb.append(String.format(Locale.ROOT, " %12.6f %10.2e %6.2f", e.extrapolated(), e.errorEstimate(), e.order()));
                if (s.hasExact()) {
                    sb.append(String.format(Locale.ROOT, " %10.6f %+10.2e", r.exact()[k], e.extrapolated() - r.exact()[k]));
                }
                o.println(sb);
            }
        }
    }
}
