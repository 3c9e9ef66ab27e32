package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import org.evanesce.io.output.OutputFolders;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.run.RunOutputs;

/**
 * What the study commands (fit, tolerance) share once their input is checked: the results folder beside
 * the case (refused before anything is written, finished atomically), the closing lines and the caution.
 */
final class StudyFolder {

    /** The study's work inside the folder; returns its warnings about the result (already printed). */
    @FunctionalInterface
    interface Work<X extends Exception> {
        List<String> into(RunFolder rf) throws IOException, X;
    }

    private StudyFolder() {
    }

    /** {@code out}, or the case's name with {@code suffix} beside the case, absolute. */
    static Path target(Path out, Path caseFile, String suffix) {
        String name = caseFile.getFileName().toString();
        int dot = name.lastIndexOf('.');
        Path p = out != null ? out : caseFile.toAbsolutePath().resolveSibling((dot > 0 ? name.substring(0, dot) : name) + suffix);
        return p.toAbsolutePath().normalize();
    }

    /**
     * Writes the study into {@code folder} and prints where it went.
     *
     * @param command the command's name for messages, e.g. "evanesce fit"
     * @param file    the file its warnings also went to, e.g. "fit.json"
     */
    static <X extends Exception> int write(Path folder, boolean force, Path caseFile, PrintWriter o, PrintWriter err,
                                           String command, String file, Work<X> work) throws IOException, X {
        List<OutputFolders.Protected> protect = OutputFolders.around(caseFile);
        // refused before anything is written (exit 2, see Main): nothing beside the folder is touched either
        OutputFolders.checkResults(folder, force, protect);
        try (RunFolder rf = RunFolder.begin(folder, force, protect)) {
            rf.cleaned().forEach(line -> o.println("note: " + line));
            List<String> warnings = work.into(rf);
            rf.commit();
            o.println("results: " + rf.target());
            if (!warnings.isEmpty()) {
                err.printf("%s: warning: %d warning(s) about the result (printed above, and in %s)%n", command,
                        warnings.size(), file);
            }
            o.println("Caution: " + RunOutputs.CAUTION);
            return ExitCode.OK;
        }
    }
}
