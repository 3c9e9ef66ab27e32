package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.OutputFolders;
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

    @Option(names = "--offsets", paramLabel = "N", defaultValue = "4",
            description = "Runs per level with the grid moved by k/N of a cell (default: ${DEFAULT-VALUE}); the levels' "
                    + "means extrapolate smoothly where single runs need not, and their spread shows how much where "
                    + "interfaces fall between nodes matters. 1 runs each level once.")
    private int offsets;

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
        if (offsets < 1 || offsets > 16) {
            throw new ParameterException(spec.commandLine(), "--offsets " + offsets + ": expected 1 to 16");
        }
        if (!(ratio >= 1.1 && ratio <= 4)) {
            throw new ParameterException(spec.commandLine(), "--ratio " + ratio + ": expected a refinement between 1.1 and 4");
        }
        PrintWriter o = spec.commandLine().getOut();
        // every level and offset is read and planned before anything runs, so a bad one costs nothing;
        // warnings and notes are printed once, for the case as written
        List<List<CaseOptions.Loaded>> loaded = new ArrayList<>();
        PrintWriter quiet = new PrintWriter(java.io.Writer.nullWriter());
        for (int l = 0; l < levels; l++) {
            List<CaseOptions.Loaded> level = new ArrayList<>();
            for (int k = 0; k < offsets; k++) {
                try {
                    level.add(options.load(l == 0 && k == 0 ? spec.commandLine().getErr() : quiet,
                            ReadOptions.defaults().withResolutionScale(Math.pow(ratio, l)).withGridOffset((double) k / offsets)));
                } catch (CaseOptions.BadInput e) {
                    if (l == 0 && k == 0) {
                        throw new ParameterException(spec.commandLine(), e.getMessage());
                    }
                    // repeat the reading with messages, so the user sees why this level failed
                    try {
                        options.load(spec.commandLine().getErr(), ReadOptions.defaults()
                                .withResolutionScale(Math.pow(ratio, l)).withGridOffset((double) k / offsets));
                    } catch (CaseOptions.BadInput again) {
                        // reported above
                    }
                    throw new ParameterException(spec.commandLine(), String.format("level %d (offset %d/%d): %s", l + 1, k,
                            offsets, e.getMessage()));
                }
            }
            loaded.add(level);
        }
        if (loaded.get(0).get(0).plan().spec().polarizations() == org.evanesce.io.casefile.model.PolarizationChoice.BOTH) {
            throw new ParameterException(spec.commandLine(), options.caseFile + ": polarization both: an accuracy study "
                    + "takes one polarization at a time; add --set polarization=s (or p)");
        }
        if (loaded.get(0).get(0).plan().flux().isEmpty()) {
            throw new ParameterException(spec.commandLine(), options.caseFile + ": an accuracy study extrapolates the flux "
                    + "table; the case has no flux section");
        }
        Path base = RunCommand.defaultFolder(options.caseFile, loaded.get(0).get(0).plan().spec());
        Path folder = out != null ? out : base.resolveSibling(base.getFileName() + "-accuracy");
        try (RunFolder study = RunFolder.begin(folder, force, OutputFolders.around(options.caseFile))) {
            study.cleaned().forEach(line -> o.println("note: " + line));
            List<List<FluxResults>> tables = new ArrayList<>();
            double[] cells = new double[levels];
            for (int l = 0; l < levels; l++) {
                cells[l] = loaded.get(l).get(0).plan().grid().cellSize();
                List<FluxResults> level = new ArrayList<>();
                for (int k = 0; k < offsets; k++) {
                    CaseOptions.Loaded c = loaded.get(l).get(k);
                    o.printf(Locale.ROOT, "level %d of %d: cell %.4g nm, grid offset %d/%d of a cell%n", l + 1, levels,
                            cells[l] * 1e9, k, offsets);
                    Path dir = study.dir().resolve("level" + (l + 1));
                    java.nio.file.Files.createDirectories(dir);
                    try (RunFolder rf = RunFolder.begin(offsets == 1 ? dir.resolve("run") : dir.resolve("offset" + k), false)) {
                        level.add(CaseExecution.run(c, options.overrides, rf, o, progressSeconds, false,
                                spec.commandLine().getParseResult().originalArgs()).flux());
                        rf.commit();
                    }
                }
                tables.add(level);
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
            return ExitCode.OK;
        }
    }

    private static void print(PrintWriter o, AccuracyStudy s) {
        StringBuilder h = new StringBuilder(String.format(Locale.ROOT, "%13s %9s %8s", "wavelength_nm", "angle_deg", "value"));
        for (int l = 0; l < s.cellSizes().length; l++) {
            h.append(String.format(Locale.ROOT, " %10s", "level" + (l + 1)));
        }
        h.append(String.format(Locale.ROOT, " %10s %12s %10s %6s", "spread", "extrapolated", "± estimate", "order"));
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
                double[] spread = r.spreads()[k];
                sb.append(String.format(Locale.ROOT, " %10.2e %12.6f %10.2e %6.2f", spread[spread.length - 1], e.extrapolated(),
                        e.errorEstimate(), e.order()));
                if (s.hasExact()) {
                    sb.append(String.format(Locale.ROOT, " %10.6f %+10.2e", r.exact()[k], e.extrapolated() - r.exact()[k]));
                }
                o.println(sb);
            }
        }
    }
}
