package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.evanesce.io.Main;
import org.evanesce.io.casefile.CaseSpec;
import org.evanesce.io.casefile.OutputSpec;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.run.CaseRunner;
import org.evanesce.io.run.ProgressLine;
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
        CasePlan plan = l.plan();
        CaseSpec s = plan.spec();
        Path folder = out != null ? out : defaultFolder(options.caseFile, s);
        boolean terminal = System.console() != null;
        try (RunFolder rf = RunFolder.begin(folder, force)) {
            o.printf(Locale.ROOT, "%s: %d x %d cells of %.4g nm, up to %d steps, %s polarization; writing %s%n",
                    s.source(), plan.grid().nx(), plan.grid().ny(), plan.grid().cellSize() * 1e9, plan.stop().maxSteps(),
                    s.polarization().value().name().toLowerCase(Locale.ROOT), rf.target());
            ProgressLine progress = new ProgressLine(o, terminal, plan.dt());
            CaseRunner.Result r;
            try {
                r = CaseRunner.run(plan, progress, terminal ? 0.5 : progressSeconds);
            } finally {
                progress.finish();
            }
            if (wants(s, OutputSpec.Item.PROBES)) {
                rf.writeText("probes.csv", RunOutputs.probesCsv(plan.probes()));
            }
            if (wants(s, OutputSpec.Item.PREVIEW)) {
                RunOutputs.preview(plan, rf.dir().resolve("preview.png"));
            }
            RunOutputs.writeRunRecord(rf, RunOutputs.runRecord(VersionProvider.version(), l.sha256(), plan, r,
                    l.loaded().diagnostics(), options.overrides));
            rf.commit();
            long cells = (long) plan.grid().nx() * plan.grid().ny();
            o.printf(Locale.ROOT, "done: %d steps in %.1f s (%.0f Mcell/s, %d threads); %s%n", r.steps(), r.wallSeconds(),
                    r.cellUpdatesPerSecond(cells) / 1e6, r.threads(), r.stopReason());
            o.println("results: " + rf.target());
            o.println("Caution: " + RunOutputs.CAUTION);
            return Main.OK;
        } catch (FileAlreadyExistsException e) {
            throw new ParameterException(spec.commandLine(), e.getFile() + ": " + e.getReason());
        }
    }

    private static boolean wants(CaseSpec s, OutputSpec.Item item) {
        return s.output().write().stream().anyMatch(w -> w.value() == item);
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
