package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.evanesce.io.run.RunOutputs;
import org.evanesce.io.tolerance.ToleranceInputException;
import org.evanesce.io.tolerance.ToleranceRun;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code evanesce tolerance}: how R, T and A spread over parts whose parameters vary, and the yield against limits. */
@Command(name = "tolerance", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"A tolerance study with the exact plane-wave model of a case's layered stack (as "
                + "flux.transfer_matrix gives it, at the case's design wavelength and source angle, in its polarization): "
                + "N parts with the varied parameters drawn from their distributions (a fixed seed, so a study repeats), "
                + "their R, T and A summarised (mean, standard deviation, 5/50/95 %% percentiles) and, against limits, the "
                + "yield with its 95 %% interval. Seconds for thousands of parts: size the tolerances first, then confirm "
                + "chosen parts with full simulations. Writes tolerance.json, samples.csv and histograms."})
public final class ToleranceCommand implements Callable<Integer> {

    @Spec
    private CommandSpec spec;

    @Parameters(index = "0", paramLabel = "CASE", description = "The case file (YAML).")
    private Path caseFile;

    @Option(names = "--vary", required = true, paramLabel = "NAME=DIST",
            description = "A parameter that varies: NAME=normal(MEAN,SD), NAME=normal(MEAN,SD,LOW,HIGH) (truncated) or "
                    + "NAME=uniform(LOW,HIGH), values with units, e.g. --vary gap=normal(200nm,5nm); repeat for several.")
    private List<String> vary = new ArrayList<>();

    @Option(names = "--require", paramLabel = "Q=LOW..HIGH",
            description = "A specification every part must meet, e.g. T=0.45..0.55, R=..0.01; repeat for several.")
    private List<String> require = new ArrayList<>();

    @Option(names = "--samples", paramLabel = "N", defaultValue = "2000", description = "Parts to draw (default: ${DEFAULT-VALUE}).")
    private int samples;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "The random generator's seed (default: ${DEFAULT-VALUE}).")
    private long seed;

    @Option(names = "--set", paramLabel = "NAME=VALUE", mapFallbackValue = "",
            description = "Override a parameter of the case; repeat for several.")
    private Map<String, String> overrides = new LinkedHashMap<>();

    @Option(names = "--out", paramLabel = "DIR", description = "Results folder (default: CASE's name with -tolerance, beside it).")
    private Path out;

    @Option(names = "--force", description = "Replace an existing results folder of a study (only once the new one has finished).")
    private boolean force;

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (!Files.exists(caseFile)) {
            err.println("evanesce tolerance: " + caseFile + ": no such file");
            return ExitCode.USAGE;
        }
        if (samples < 1 || samples > ToleranceRun.MAX_SAMPLES) {
            err.println("evanesce tolerance: --samples " + samples + ": expected 1 to " + ToleranceRun.MAX_SAMPLES);
            return ExitCode.USAGE;
        }
        Path folder = StudyFolder.target(out, caseFile, "-tolerance");
        try {
            ToleranceRun.Prepared p = ToleranceRun.prepare(caseFile, overrides, vary, require);
            return StudyFolder.write(folder, force, caseFile, o, err, "evanesce tolerance", "tolerance.json", rf -> {
                ToleranceRun.run(p, samples, seed, rf, o, RunOutputs.CAUTION);
                return List.<String>of();
            });
        } catch (ToleranceInputException e) {
            err.println("evanesce tolerance: " + e.getMessage());
            err.println("evanesce tolerance: nothing was written (see 'evanesce tolerance --help')");
            return ExitCode.USAGE;
        }
    }
}
