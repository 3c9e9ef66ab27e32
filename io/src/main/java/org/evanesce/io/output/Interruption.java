package org.evanesce.io.output;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;

/**
 * What a stopped process removes on its way out. A run stopped by a signal (Ctrl-C, {@code kill}, a batch
 * system's time limit) does not unwind its {@code try} blocks, so without this its unfinished results folder
 * ({@code .NAME.partial-TAG/}) and any file it was writing ({@code .NAME.TAG.tmp}) would stay until the next run
 * of the same target cleans them ({@link Leftovers}). {@link #install} adds one JVM shutdown hook that removes
 * every results folder not yet finished and every temporary file still open, and says so in one line.
 * Finished results, finished checkpoints and finished sweep points are never touched.
 *
 * <p>A normal exit calls {@link #finished} first, and the hook then does nothing. A folder being renamed into
 * place when the signal arrives finishes its rename first ({@link RunFolder#abandon} waits for it).
 */
public final class Interruption {

    private static final Set<RunFolder> FOLDERS = ConcurrentHashMap.newKeySet();
    private static final Set<Path> TEMPORARIES = ConcurrentHashMap.newKeySet();
    private static volatile boolean finished;
    private static Thread hook;

    private Interruption() {
    }

    /** Adds the shutdown hook, which reports on {@code err} (once per process; later calls do nothing). */
    public static synchronized void install(PrintStream err) {
        if (hook == null) {
            hook = new Thread(() -> stop(err), "evanesce-stop");
            Runtime.getRuntime().addShutdownHook(hook);
        }
    }

    /** The command has finished and the process is exiting normally: the hook leaves everything as it is. */
    public static void finished() {
        finished = true;
    }

    static void opened(RunFolder f) {
        FOLDERS.add(f);
    }

    static void closed(RunFolder f) {
        FOLDERS.remove(f);
    }

    static void writing(Path tmp) {
        TEMPORARIES.add(tmp);
    }

    static void written(Path tmp) {
        TEMPORARIES.remove(tmp);
    }

    /** The hook's work: removes what is unfinished and says what went (no line after a normal exit). */
    static void stop(PrintStream err) {
        if (finished) {
            return;
        }
        List<String> removed = removeUnfinished();
        err.println(message(removed));
        err.flush();
    }

    /** Removes every unfinished results folder and open temporary file; returns the folders removed. */
    static List<String> removeUnfinished() {
        List<String> removed = new ArrayList<>();
        List<RunFolder> open = new ArrayList<>(FOLDERS);
        // outer folders first: a folder inside one already removed is not reported again
        open.sort(java.util.Comparator.comparingInt(f -> f.dir().getNameCount()));
        for (RunFolder f : open) {
            Path gone = f.abandon();
            if (gone != null) {
                removed.add(gone.toString());
            }
        }
        for (Path tmp : List.copyOf(TEMPORARIES)) {
            try {
                Files.deleteIfExists(tmp);
            } catch (IOException e) {
                // the next run of the same target removes it (Leftovers)
            }
        }
        return removed;
    }

    static String message(List<String> removed) {
        if (removed.isEmpty()) {
            return "evanesce: stopped before it finished (no results folder was being written; finished results "
                    + "and checkpoints stay)";
        }
        return "evanesce: stopped before it finished; removed the unfinished results folder"
                + (removed.size() == 1 ? " " : "s ") + String.join(", ", removed)
                + " (finished results and checkpoints stay)";
    }
}
