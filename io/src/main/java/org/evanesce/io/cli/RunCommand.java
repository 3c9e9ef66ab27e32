package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.PolarizationChoice;
import org.evanesce.io.output.OutputFolders;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.run.Checkpoints;
import org.evanesce.io.run.RunOutputs;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
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

    @Option(names = "--checkpoint-minutes", paramLabel = "M", defaultValue = "15",
            description = "Save the run's whole state every M minutes of wall time to FOLDER.checkpoint beside the results "
                    + "folder; running the same command again continues from it, bit for bit (default: ${DEFAULT-VALUE}; 0: "
                    + "never). Runs that write field frames do not checkpoint.")
    private double checkpointMinutes;

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        CaseOptions.Loaded l = options.load(spec);
        Path folder = (out != null ? out : defaultFolder(options.caseFile, l.plan().spec())).toAbsolutePath().normalize();
        List<OutputFolders.Protected> protect = OutputFolders.around(options.caseFile);
        // refused before anything is written (exit 2, see Main): nothing beside the folder is touched either
        OutputFolders.checkResults(folder, force, protect);
        boolean both = l.plan().spec().polarizations() == PolarizationChoice.BOTH;
        CaseOptions.Loaded lp = both ? options.loadPolarizationP(spec) : null;
        // polarization both: each run its own checkpoint (FOLDER.checkpoint-s, -p), both kept until the results are in
        // place, so a run killed during p continues s from its last checkpoint and p from its own
        Checkpoints ck;
        Checkpoints ckP = null;
        if (both) {
            ck = checkpoints(l, folder, o, "-" + PolarizationRuns.S, PolarizationRuns.overrides(options.overrides, PolarizationChoice.S));
            ckP = ck == null ? null : checkpoints(lp, folder, o, "-" + PolarizationRuns.P,
                    PolarizationRuns.overrides(options.overrides, PolarizationChoice.P));
        } else {
            ck = checkpoints(l, folder, o, "", options.overrides);
        }
        for (int attempt = 0; ; attempt++) {
            try (RunFolder rf = RunFolder.begin(folder, force, protect)) {
                rf.cleaned().forEach(line -> o.println("note: " + line));
                List<String> warnings;
                Boolean settled;
                boolean flux;
                if (both) {
                    PolarizationRuns.Both b = PolarizationRuns.run(l, lp, options.overrides, rf, o, progressSeconds, true,
                            spec.commandLine().getParseResult().originalArgs(), ck, ckP);
                    warnings = b.warnings();
                    settled = b.settled();
                    flux = b.averaged() != null;
                } else {
                    CaseExecution.Finished f = CaseExecution.run(l, options.overrides, rf, o, progressSeconds, true, ck,
                            spec.commandLine().getParseResult().originalArgs());
                    warnings = f.warnings();
                    settled = f.settling().settled();
                    flux = f.flux() != null;
                }
                rf.commit();
                if (ck != null) {
                    ck.delete();
                }
                if (ckP != null) {
                    ckP.delete();
                }
                if (!rf.target().equals(folder)) {
                    o.println("note: " + folder + " appeared during the run and may not be replaced; the results went to "
                            + rf.target() + " instead");
                }
                o.println("results: " + rf.target());
                if (!warnings.isEmpty()) {
                    spec.commandLine().getErr().printf(java.util.Locale.ROOT, "evanesce run: warning: %s%s (printed above, and "
                            + "in run.json%s)%n", Boolean.FALSE.equals(settled) ? "the results did not settle"
                            : "some results are doubtful", warnings.size() > 1 ? " and " + (warnings.size() - 1)
                            + " more warning(s)" : "", flux ? " and summary.json" : "");
                }
                o.println("Caution: " + RunOutputs.CAUTION);
                return ExitCode.OK;
            } catch (Checkpoints.Unusable e) {
                // polarization both: the s and the p checkpoint may each be set aside once
                if (attempt > (both ? 1 : 0)) {
                    throw new RunFailedException(e.getMessage(), e);
                }
                o.println("warning: " + e.getMessage() + "; the run starts from the beginning");
                l = options.load(spec);
                lp = both ? options.loadPolarizationP(spec) : null;
            }
        }
    }

    /**
     * The run's checkpoints, FOLDER.checkpoint + {@code suffix}, with the identity of a run with {@code overrides}, or
     * null when off or when the case writes field frames (they cannot be resumed).
     */
    private Checkpoints checkpoints(CaseOptions.Loaded l, Path folder, PrintWriter o, String suffix, Map<String, String> overrides)
            throws IOException {
        if (!(checkpointMinutes > 0)) {
            return null;
        }
        if (l.plan().fields().frameSteps().length > 0) {
            o.println("note: runs that write field frames are not checkpointed (frames taken before a checkpoint would be lost)");
            return null;
        }
        Path file = folder.toAbsolutePath().resolveSibling(folder.getFileName() + ".checkpoint" + suffix);
        if (java.nio.file.Files.exists(file, java.nio.file.LinkOption.NOFOLLOW_LINKS)
                && !java.nio.file.Files.isRegularFile(file, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            o.println("note: " + file + " is a folder or a link, not a checkpoint evanesce wrote; it is left alone and this run "
                    + "saves no checkpoints");
            return null;
        }
        return new Checkpoints(file, checkpointMinutes * 60, checkpointIdentity(l.sha256(),
                org.evanesce.io.output.BuildInfo.current(), overrides), o::println);
    }

    /**
     * A run's identity in its checkpoint: the case file's hash, the overrides, the program's version and its
     * build id (a rebuilt program may compute other numbers, and its listeners may save other state, so it
     * never continues another build's checkpoint).
     */
    static String checkpointIdentity(String caseSha256, org.evanesce.io.output.BuildInfo build, Map<String, String> overrides) {
        StringBuilder id = new StringBuilder(caseSha256).append('|').append(build.version()).append('|').append(build.id());
        new java.util.TreeMap<>(overrides).forEach((k, v) -> id.append('|').append(k).append('=').append(v));
        return id.toString();
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
