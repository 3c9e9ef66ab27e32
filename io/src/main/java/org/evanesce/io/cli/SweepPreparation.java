package org.evanesce.io.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.evanesce.io.plan.CasePlan;

/**
 * What a sweep does with every point before it runs any: reading each point's case and planning each point about
 * to run, spread over the threads the sweep may use (each point is independent), with everything printed
 * afterwards in point order. The cases read are kept for the points' runs, and so are the plans while they fit
 * {@link #PLAN_HEAP_SHARE a share of the heap}, so that a point is read and planned once, not once to check it
 * and again to run it.
 */
final class SweepPreparation {

    /**
     * Kept plans may fill at most 1/8 of the JVM's heap, counted by their memory estimates (which include the
     * run's fields, so the plans themselves hold less): the points' runs need the rest. A plan that does not fit
     * is dropped and made again when its point runs.
     */
    static final int PLAN_HEAP_SHARE = 8;

    /** One item's work, which may fail with a checked exception (a case that does not read or plan). */
    @FunctionalInterface
    interface Work<T, R> {
        R apply(T item) throws Exception;
    }

    /** One item's outcome: its value, or the exception its work ended with. */
    record Attempt<R>(R value, Exception error) { }

    private SweepPreparation() {
    }

    /**
     * Does {@code work} for every item on up to {@code threads} threads and returns the outcomes in the items'
     * order. Errors and other throwables (not exceptions) end the whole call.
     */
    static <T, R> List<Attempt<R>> each(List<T> items, int threads, Work<T, R> work) {
        int n = Math.max(1, Math.min(threads, items.size()));
        if (n == 1) {
            List<Attempt<R>> out = new ArrayList<>();
            for (T item : items) {
                out.add(attempt(item, work));
            }
            return out;
        }
        ExecutorService pool = Executors.newFixedThreadPool(n, r -> {
            Thread t = new Thread(r, "sweep-prepare");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<Attempt<R>>> futures = new ArrayList<>();
            for (T item : items) {
                futures.add(pool.submit(() -> attempt(item, work)));
            }
            List<Attempt<R>> out = new ArrayList<>();
            for (Future<Attempt<R>> f : futures) {
                out.add(f.get());
            }
            return out;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while the sweep's points were read", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(e.getCause());
        } finally {
            pool.shutdownNow();
        }
    }

    private static <T, R> Attempt<R> attempt(T item, Work<T, R> work) {
        try {
            return new Attempt<>(work.apply(item), null);
        } catch (Exception e) {
            return new Attempt<>(null, e);
        }
    }

    /**
     * Plans made while checking the points, kept for their runs while their memory estimates together stay
     * within the budget; each is handed out once.
     */
    static final class Plans {
        private final Map<Integer, CasePlan> kept = new ConcurrentHashMap<>();
        private final long budget;
        private long used;

        /** Plans of at most {@code budget} bytes (by their memory estimates) in all. */
        Plans(long budget) {
            this.budget = budget;
        }

        /** Keeps a point's plan if it fits the budget. */
        synchronized void offer(int point, CasePlan plan) {
            long bytes = plan.memory().total();
            if (used + bytes <= budget) {
                used += bytes;
                kept.put(point, plan);
            }
        }

        /**
         * The point's kept plan, set to step with {@code threads} threads (as if planned with them: the thread
         * count changes nothing else in a plan), and forgotten here; null when it was not kept.
         */
        CasePlan take(int point, int threads) {
            CasePlan plan = kept.remove(point);
            if (plan != null) {
                synchronized (this) {
                    used -= plan.memory().total();
                }
                plan.builder().threads(threads);
                plan.referenceRun().ifPresent(b -> b.threads(threads));
            }
            return plan;
        }

        /**
         * Drops every kept plan unless they fit beside {@code running} bytes (the points that run at once) in a heap of
         * {@code heap} bytes: a point never runs short of memory because later points' plans are kept.
         */
        synchronized void fitBeside(long running, long heap) {
            if (used > 0 && running > heap - used) {
                kept.clear();
                used = 0;
            }
        }

        /** Plans kept now (for tests). */
        int size() {
            return kept.size();
        }
    }
}
