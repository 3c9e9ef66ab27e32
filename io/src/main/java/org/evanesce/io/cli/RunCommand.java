package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.evanesce.io.Main;
import org.evanesce.io.casefile.CaseSpec;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.run.RunOutputs;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * {@code evanesce run CASE}: validates, plans and runs a case, and writes its results folder
 * atomically (a temporary name renamed at the end), never replacing a finished folder unless told to.
 */
@Command(name = "run", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, sortOptions = false,
        description = {"Run a case file and write its results folder (run.json always; probes.csv and preview.png when "
                + "the case asks). The folder appears only when the run has finished."})
public final class RunCommand implements Callable<Integer> {

    @Spec
    private CommandSpec spec;

    @Mixin
    private CaseOptions options;

    @Option(names = "--out", paramLabel = "DIR", description = "Results folder (default: the case's output folder).")
    private Path out;

    @Option(names = "--force", description = "Replace an existing results folder (only once the new run has finished).")
    private boolean force;

    @Option(names = "--progress-seconds", paramLabel = "S", defaultValue = "10",
            description = "Seconds between progress lines when the output is not a terminal (default: ${DEFAULT-VALUE}).")
    private double progressSeconds;

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        CaseOptions.Loaded l = options.load(spec);
        Path folder = out != null ? out : defaultFolder(options.caseFile, l.plan().spec());
        try (RunFolder rf = RunFolder.begin(folder, force)) {
            CaseExecution.run(l, options.overrides, rf, o, progressSeconds, true);
            rf.commit();
            o.println("results: " + rf.target());
            o.println("Caution: " + RunOutputs.CAUTION);
            return Main.OK;
        } catch (FileAlreadyExistsException e) {
            throw new ParameterException(spec.commandLine(), e.getFile() + ": " + e.getReason());
        }
    }

    /** The case's output folder (relative to the case file's folder), else the case file's name without extension. */
    static Path defaultFolder(Path caseFile, CaseSpec s) {
        Path dir = caseFile.toAbsolutePath().getParent();
        if (s.output().folder().isPresent()) {
            return dir.resolve(s.output().folder().get().value());
        }
        String name = caseFile.getFileName().toString();
        int dot = name.lastIndexOf('.');
        return dir.resolve(dot > 0 ? name.substring(0, dot) : name + ".out");
    }
}
