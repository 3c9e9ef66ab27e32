package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.evanesce.io.fit.FitInputException;
import org.evanesce.io.fit.FitRun;
import org.evanesce.io.run.RunOutputs;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code evanesce fit}: the free parameters of a case that best reproduce a measured curve. */
@Command(name = "fit", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Find the values of a case's parameters (a gap, a film's thickness or index, an angle offset, a "
                + "detector's gain) that best reproduce a measured curve of R or T against angle, wavelength or a case "
                + "parameter, by least squares (Levenberg-Marquardt) with the case's layered stack as the model (the exact "
                + "plane-wave answer, as flux.transfer_matrix gives it). Prints the best values with their standard errors "
                + "and writes fit.json, fit.csv and fit.png to the results folder.",
            "The curve is a CSV file: a header such as 'angle (deg),R,u' (the swept quantity with its unit; R or T; "
                + "optionally u, the standard uncertainty of each value), then one row per point."})
public final class FitCommand implements Callable<Integer> {

    @Spec
    private CommandSpec spec;

    @Parameters(index = "0", paramLabel = "CASE", description = "The case file (YAML); its parameters' values are where the fit starts.")
    private Path caseFile;

    @Option(names = "--data", required = true, paramLabel = "CSV", description = "The measured curve.")
    private Path data;

    @Option(names = "--free", required = true, paramLabel = "NAME=LOW..HIGH",
            description = "A parameter the fit may change, between bounds, e.g. --free gap=100nm..300nm; repeat for several. "
                    + "angle_offset (added to the measured angles) and scale (multiplies the model) are the fit's own.")
    private List<String> free = new ArrayList<>();

    @Option(names = "--set", paramLabel = "NAME=VALUE", mapFallbackValue = "",
            description = "Override a parameter of the case (also a free one's starting value); repeat for several.")
    private Map<String, String> overrides = new LinkedHashMap<>();

    @Option(names = "--out", paramLabel = "DIR", description = "Results folder (default: CASE's name with -fit, beside it).")
    private Path out;

    @Option(names = "--force", description = "Replace an existing results folder of a fit (only once the new fit has finished).")
    private boolean force;

    @Option(names = "--model", paramLabel = "MODEL", defaultValue = "transfer-matrix",
            description = "The forward model: transfer-matrix (the plane wave; default), angular-spectrum (the case's "
                    + "Gaussian beam through its stack) or simulation (the case run in full for each point and trial; runs are "
                    + "cached in FOLDER.evaluations beside the results folder, so an interrupted fit continues).")
    private String model;

    @Option(names = "--threads", paramLabel = "N", description = "Threads of each simulation (--model simulation).")
    private Integer threads;

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        for (Path p : new Path[] {caseFile, data}) {
            if (!Files.exists(p)) {
                err.println("evanesce fit: " + p + ": no such file");
                return ExitCode.USAGE;
            }
        }
        Path folder = StudyFolder.target(out, caseFile, "-fit");
        try {
            org.evanesce.io.fit.ForwardModel kind = org.evanesce.io.fit.ForwardModel.of(model);
            if (threads != null && (threads < 1 || kind != org.evanesce.io.fit.ForwardModel.SIMULATION)) {
                throw new org.evanesce.io.fit.FitInputException("--threads " + threads + ": expected a number of threads, at "
                        + "least 1, for --model simulation");
            }
            Path cache = folder.resolveSibling(folder.getFileName() + ".evaluations");
            FitRun.Prepared prepared = FitRun.prepare(caseFile, overrides, data, free, kind, cache, threads, o);
            return StudyFolder.write(folder, force, caseFile, o, err, "evanesce fit", "fit.json",
                    rf -> FitRun.run(prepared, rf, o, RunOutputs.CAUTION));
        } catch (NoSuchFileException e) {
            err.println("evanesce fit: " + e.getFile() + ": no such file");
            return ExitCode.USAGE;
        } catch (FitInputException e) {
            err.println("evanesce fit: " + e.getMessage());
            err.println("evanesce fit: nothing was written (see 'evanesce fit --help')");
            return ExitCode.USAGE;
        }
    }
}
