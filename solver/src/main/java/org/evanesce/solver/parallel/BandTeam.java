package org.evanesce.solver.parallel;

import java.util.concurrent.atomic.AtomicReference;

/**
 * Persistent worker threads that split rows into bands and run a two-phase step on them, with
 * one barrier between the phases and one hand-over to the calling thread after the step
 * (DESIGN.md: the same workers for the whole run, no task submission per step). The calling
 * thread is worker 0; band b covers rows [start(b), start(b+1)), and the last band takes the
 * remainder.
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

    /** First row of band b. */
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
        try {
            m0 = p.run(start[band], start[band + 1], 0);
        } catch (Throwable e) {
            failure.compareAndSet(null, e);
        }
        mid.await();
        try {
            m1 = p.run(start[band], start[band + 1], 1);
        } catch (Throwable e) {
            failure.compareAndSet(null, e);
        }
        return Math.max(m0, m1);
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
