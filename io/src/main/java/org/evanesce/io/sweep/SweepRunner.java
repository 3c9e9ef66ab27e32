package org.evanesce.io.sweep;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.io.UncheckedIOException;
import org.evanesce.io.output.Faults;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.OutputRefusedException;
import org.evanesce.io.output.RunFolder;

/**
 * Runs a sweep's points, one after another or several at once, each into its own results folder
 * written atomically ({@link RunFolder}: a temporary name renamed when the run has finished; an old
 * folder of the same point is replaced only then). Each folder gets a {@code point.json} with the
 * point's number, overrides and hash before it is renamed, so a folder under a point's name always
 * holds a finished run, and the hash says of which point. Progress lines carry the sweep's state:
 * points done out of all, and the time left estimated from the points' wall times so far.
 */
public final class SweepRunner {

    /** A point could not be computed (it diverged, or the solver refused it); the sweep carries on with the others. */
    public static final class PointFailed extends Exception {
        private static final long serialVersionUID = 1L;

        public PointFailed(String message, Throwable cause) {
            super(message, cause);
        }
    }

    /** Computes one point into an open results folder. */
    @FunctionalInterface
    public interface PointRun {
        /**
         * @param folder  the point's folder, not yet renamed into place
         * @param out     the point's output (prefixed with the sweep's progress)
         * @param threads threads the point may use
         */
        void run(SweepPoint point, RunFolder folder, PrintWriter out, int threads) throws PointFailed, IOException;
    }

    /** A point to run and the record its folder gets ({@code point.json}). */
    public record Task(SweepPoint point, Map<String, Object> record) { }

    /**
     * @param ran    points computed now
     * @param failed point number → why it failed
     */
    public record Outcome(int ran, Map<Integer, String> failed) { }

    private final SweepFolder folder;
    private final int total;
    private final PrintWriter out;
    private final boolean terminal;
    private final Object lock = new Object();
    private int done;
    private final List<Double> wallTimes = new ArrayList<>();
    private final Map<Integer, Long> running = new LinkedHashMap<>();
    private int notStarted;
    private int parallel;

    /**
     * @param total     points in the whole sweep
     * @param doneEarly points already finished before this run (or by other shards)
     * @param terminal  whether the output is a terminal (progress lines are rewritten in place)
     */
    public SweepRunner(SweepFolder folder, int total, int doneEarly, PrintWriter out, boolean terminal) {
        this.folder = folder;
        this.total = total;
        this.done = doneEarly;
        this.out = out;
        this.terminal = terminal;
    }

    /** The record a point's folder gets. */
    public static Map<String, Object> pointRecord(SweepPoint p, Map<String, String> overrides, String hash, String version,
                                                  String build) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("program", "evanesce");
        m.put("schema", "evanesce-sweep-point-1");
        m.put("point", p.number());
        m.put("values", p.overrides());
        m.put("overrides", new TreeMap<>(overrides));
        m.put("version", version);
        m.put("build", build);
        m.put("point_hash", hash);
        return m;
    }

    /**
     * Runs the tasks in order, {@code parallel} at once with {@code threads} threads each. A point that
     * fails with {@link PointFailed} (also when its folder cannot be written: a full disk, a folder
     * evanesce may not replace) is reported and the others go on; any other exception stops the sweep
     * once the points already running have ended, and is thrown.
     */
    public Outcome run(List<Task> tasks, int parallel, int threads, PointRun runner) throws IOException {
        this.parallel = parallel;
        this.notStarted = tasks.size();
        Map<Integer, String> failed = new TreeMap<>();
        AtomicInteger next = new AtomicInteger();
        AtomicInteger ran = new AtomicInteger();
        List<Throwable> fatal = new ArrayList<>();
        ExecutorService pool = Executors.newFixedThreadPool(parallel, r -> {
            Thread t = new Thread(r, "sweep-point");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<?>> workers = new ArrayList<>();
            for (int w = 0; w < parallel; w++) {
                workers.add(pool.submit(() -> {
                    while (true) {
                        int k = next.getAndIncrement();
                        synchronized (lock) {
                            if (k >= tasks.size() || !fatal.isEmpty()) {
                                return;
                            }
                        }
                        Task t = tasks.get(k);
                        try {
                            runOne(t, threads, runner);
                            ran.incrementAndGet();
                        } catch (PointFailed e) {
                            synchronized (lock) {
                                failed.put(t.point().number(), e.getMessage());
                                running.remove(t.point().number());
                            }
                            synchronized (out) {
                                out.printf(Locale.ROOT, "point %d (%s) failed: %s%n", t.point().number(), t.point().describe(),
                                        e.getMessage());
                                out.flush();
                            }
                        } catch (Throwable e) {
                            synchronized (lock) {
                                fatal.add(e);
                                running.remove(t.point().number());
                            }
                            return;
                        }
                    }
                }));
            }
            for (Future<?> f : workers) {
                try {
                    f.get();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new IOException("interrupted while the sweep's points ran", e);
                } catch (java.util.concurrent.ExecutionException e) {
                    fatal.add(e.getCause());
                }
            }
        } finally {
            pool.shutdownNow();
        }
        if (!fatal.isEmpty()) {
            Throwable e = fatal.get(0);
            if (e instanceof IOException io) {
                throw io;
            } else if (e instanceof RuntimeException r) {
                throw r;
            } else if (e instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(e);
        }
        return new Outcome(ran.get(), failed);
    }

    private void runOne(Task t, int threads, PointRun runner) throws PointFailed, IOException {
        SweepPoint p = t.point();
        long t0 = System.nanoTime();
        synchronized (lock) {
            notStarted--;
            running.put(p.number(), t0);
        }
        PrintWriter pw = new PrintWriter(new LinePrefixWriter(out, () -> prefix(p), terminal && parallel > 1), true);
        try (RunFolder rf = RunFolder.begin(folder.point(p.number()), true)) {
            rf.cleaned().forEach(line -> pw.println("note: " + line));
            runner.run(p, rf, pw, threads);
            rf.writeText(SweepFolder.POINT_RECORD, Json.write(t.record()));
            rf.commit();
        } catch (OutputRefusedException e) {
            throw new PointFailed(e.getMessage(), e);
        } catch (IOException | UncheckedIOException e) {
            // a full disk, a folder that cannot be written: this point failed, the others may still fit
            throw new PointFailed(Faults.sentence(Faults.ioCause(e)), e);
        }
        pw.flush();
        double seconds = (System.nanoTime() - t0) * 1e-9;
        synchronized (lock) {
            running.remove(p.number());
            wallTimes.add(seconds);
            done++;
        }
        synchronized (out) {
            out.printf(Locale.ROOT, "%spoint %d (%s) finished in %.1f s%n", prefix(-1), p.number(), p.describe(), seconds);
            out.flush();
        }
    }

    private String prefix(SweepPoint p) {
        return prefix(p.number());
    }

    /** {@code [sweep 3/12 done, 0:01:10 left] point 4: }. */
    private String prefix(int point) {
        synchronized (lock) {
            return String.format(Locale.ROOT, "[sweep %d/%d done, %s left] %s", done, total, duration(secondsLeft()),
                    point >= 0 ? "point " + point + ": " : "");
        }
    }

    /**
     * The time left: the points not started times the mean wall time of a finished point, plus what the
     * running ones still need at that mean, shared among the points that run at once. Unknown (NaN)
     * until a point has finished.
     */
    private double secondsLeft() {
        if (wallTimes.isEmpty()) {
            return Double.NaN;
        }
        double mean = wallTimes.stream().mapToDouble(Double::doubleValue).average().orElse(Double.NaN);
        double work = notStarted * mean;
        long now = System.nanoTime();
        for (long start : running.values()) {
            work += Math.max(0, mean - (now - start) * 1e-9);
        }
        return work / Math.max(1, Math.min(parallel, notStarted + running.size()));
    }

    /** A wall-clock duration as h:mm:ss, or "?" when unknown. */
    static String duration(double s) {
        if (!Double.isFinite(s)) {
            return "?";
        }
        long t = Math.round(s);
        return String.format(Locale.ROOT, "%d:%02d:%02d", t / 3600, t / 60 % 60, t % 60);
    }
}
