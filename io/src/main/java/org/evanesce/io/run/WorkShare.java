package org.evanesce.io.run;

import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.IntConsumer;

/**
 * Independent pieces of work after a run (each wavelength's far-field transform, each wavelength's beam reference)
 * shared out over the run's threads. Each piece is computed on its own, so the numbers do not depend on the thread count.
 */
final class WorkShare {

    private WorkShare() {
    }

    /**
     * Runs {@code work} for 0 ≤ q &lt; n, on up to {@code threads} threads (the caller's among them), each taking the
     * next q not yet taken; returns when all are done, throwing the first failure.
     */
    static void each(int n, int threads, IntConsumer work) {
        int k = Math.max(1, Math.min(threads, n));
        AtomicInteger next = new AtomicInteger();
        AtomicReference<Throwable> failure = new AtomicReference<>();
        Runnable take = () -> {
            try {
                for (int q = next.getAndIncrement(); q < n && failure.get() == null; q = next.getAndIncrement()) {
                    work.accept(q);
                }
            } catch (RuntimeException | Error e) {
                failure.compareAndSet(null, e);
            }
        };
        Thread[] helpers = new Thread[k - 1];
        for (int t = 0; t < helpers.length; t++) {
            helpers[t] = new Thread(take, "evanesce work share " + (t + 1));
            helpers[t].setDaemon(true);
            helpers[t].start();
        }
        take.run();
        for (Thread t : helpers) {
            boolean interrupted = false;
            while (true) {
                try {
                    t.join();
                    break;
                } catch (InterruptedException e) {
                    interrupted = true;
                }
            }
            if (interrupted) {
                Thread.currentThread().interrupt();
            }
        }
        Throwable f = failure.get();
        if (f instanceof RuntimeException re) {
            throw re;
        }
        if (f instanceof Error er) {
            throw er;
        }
    }
}
