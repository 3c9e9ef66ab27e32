package org.evanesce.solver.parallel;

import java.util.concurrent.atomic.AtomicReference;

/**
 * Persistent worker threads that split rows into bands and run a two-phase step on them, with
 * one barrier between the phases and one hand-over to the calling thread after the step
 * (DESIGN.md: the same workers for the whole run, no task submission per step). The calling
 * thread is worker 0; band b covers rows [start(b), start(b+1)).
 *
 * <p>The bands start equal and are then balanced by measurement: each band times its own work
 * (not its waits), and every {@link #BALANCE_NANOS} or so the caller moves the boundaries halfway
 * towards the split at which every band would take the same time. On shared machines one core is
 * often slower than the other for seconds at a time (interrupts, other tenants); equal bands then
 * leave the fast thread waiting at every barrier. The split never changes results: every row is
 * updated by the same code whichever band holds it.
 *
 * <p>A worker's exception is never swallowed: it is rethrown from {@link #step} on the caller.
 * Close the team to stop its threads.
 */
public final class BandTeam implements AutoCloseable {

    /** The work of one band in one phase; returns a value that is combined with {@link Math#max}. */
    @FunctionalInterface
    public interface Phase {
        double run(int j0, int j1, int phase);
    }

    private final int threads;
    private final int[] start;
    private final Thread[] workers;
    private final SpinBarrier mid;
    private final SpinBarrier handOver;
    private final double[] results;
    /** Nanoseconds each band spent on its phases (waits excluded) since the last balancing; written by its own thread. */
    private final long[] busy;
    /** Smallest band, in rows: a quarter of an equal share (at least 1). */
    private final int minRows;
    private final long balanceNanos;
    private final AtomicReference<Throwable> failure = new AtomicReference<>();
    private volatile Phase work;
    private volatile boolean closing;
    private boolean closed;

    /**
     * @param rows    number of rows to split
     * @param threads number of bands (≥ 1, ≤ rows); one thread per band
     * @param name    prefix of the worker threads' names
     */
    public BandTeam(int rows, int threads, String name) {
        this(rows, threads, name, BALANCE_NANOS);
    }

    /** As {@link #BandTeam(int, int, String)}, balancing after every {@code balanceNanos} of the caller's band work (tests). */
    BandTeam(int rows, int threads, String name, long balanceNanos) {
        if (threads < 1 || threads > rows) {
            throw new IllegalArgumentException("threads " + threads + " must lie in [1, " + rows + "]");
        }
        this.threads = threads;
        start = new int[threads + 1];
        int per = rows / threads;
        for (int b = 0; b < threads; b++) {
            start[b] = b * per;
        }
        start[threads] = rows;
        minRows = Math.max(1, rows / (4 * threads));
        this.balanceNanos = balanceNanos;
        busy = new long[threads];
        mid = new SpinBarrier(threads);
        handOver = new SpinBarrier(threads);
        results = new double[threads];
        workers = new Thread[threads - 1];
        for (int b = 1; b < threads; b++) {
            final int band = b;
            Thread t = new Thread(() -> workerLoop(band), name + "-" + b);
            t.setDaemon(true);
            workers[b - 1] = t;
            t.start();
        }
    }

    public int threads() {
        return threads;
    }

    /** First row of band b, as balanced so far (the bands move during a run). */
    public int bandStart(int b) {
        return start[b];
    }

    private void workerLoop(int band) {
        while (true) {
            handOver.arrive();
            if (closing) {
                return;
            }
            results[band] = runPhases(band);
        }
    }

    private double runPhases(int band) {
        Phase p = work;
        double m0 = 0;
        double m1 = 0;
        long t0 = System.nanoTime();
        try {
            m0 = p.run(start[band], start[band + 1], 0);
        } catch (Throwable e) {
            failure.compareAndSet(null, e);
        }
        long t1 = System.nanoTime();
        mid.await();
        long t2 = System.nanoTime();
        try {
            m1 = p.run(start[band], start[band + 1], 1);
        } catch (Throwable e) {
            failure.compareAndSet(null, e);
        }
        busy[band] += t1 - t0 + System.nanoTime() - t2;
        return Math.max(m0, m1);
    }

    /**
     * Time between balancings, measured by the caller's own band: 20 ms spans many steps of a large
     * grid's band and smooths over short interruptions, yet follows a slow core within a fraction
     * of a second (common practice for dynamic load balancing: rebalance over windows much longer
     * than one step, damped).
     */
    static final long BALANCE_NANOS = 20_000_000;

    /**
     * Moves each boundary halfway towards the split that would equalise the bands' measured times
     * (rows per nanosecond of each band times its share), keeping every band at least
     * {@link #minRows} rows; a boundary one row from its target stays. Called between steps, while
     * every worker waits.
     */
    private void balance() {
        double total = 0;
        double[] rate = new double[threads];
        for (int b = 0; b < threads; b++) {
            rate[b] = (start[b + 1] - start[b]) / (double) Math.max(1, busy[b]);
            total += rate[b];
        }
        java.util.Arrays.fill(busy, 0);
        int rows = start[threads];
        double share = 0;
        for (int b = 1; b < threads; b++) {
            share += rate[b - 1] / total * rows;
            int target = (int) Math.round(share);
            int moved = start[b] + (target - start[b]) / 2;
            start[b] = Math.max(start[b - 1] + minRows, Math.min(rows - (threads - b) * minRows, moved));
        }
    }

    /**
     * Runs phase 0 on every band, waits for all, then phase 1 on every band, and returns once all
     * bands have finished. Returns the maximum of the values the phases returned (NaN if any was NaN).
     */
    public double step(Phase phase) {
        if (closed) {
            throw new IllegalStateException("band team is closed");
        }
        work = phase;
        if (threads > 1) {
            handOver.awaitOthers();
            handOver.release();
        }
        double m = runPhases(0);
        if (threads > 1) {
            handOver.awaitOthers();
        }
        Throwable t = failure.getAndSet(null);
        if (t != null) {
            if (t instanceof RuntimeException r) {
                throw r;
            }
            if (t instanceof Error e) {
                throw e;
            }
            throw new IllegalStateException("worker failed", t);
        }
        for (int b = 1; b < threads; b++) {
            m = Math.max(m, results[b]);
        }
        if (threads > 1 && busy[0] >= balanceNanos) {
            balance();
        }
        return m;
    }

    @Override
    public void close() {
        if (closed) {
            return;
        }
        closed = true;
        if (threads > 1) {
            closing = true;
            handOver.awaitOthers();
            handOver.release();
            for (Thread t : workers) {
                try {
                    t.join();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    return;
                }
            }
        }
    }
}
