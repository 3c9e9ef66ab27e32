package org.evanesce.io.run;

import java.util.concurrent.CancellationException;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.FluxPlan;

/**
 * The flux normalisation's incident-power run stepped on a thread of its own while the case's run steps, where the
 * number of steps is known before the run (a stop after a given time) and the case's run leaves one of the threads
 * it was given idle (a small grid steps on one thread: the periodic plasmon sensor's 4-column grid and its 3-column
 * strip). Its result is the same bit for bit: it is a simulation of its own and its steps do not depend on the case's.
 * A stop on decay learns its number of steps only at the end, and a run continued from a checkpoint steps its
 * incident-power run after it, as before.
 */
public final class IncidentBeside implements AutoCloseable {

    /** The thread the incident-power run steps on; {@link #cancelled} stops it between chunks. */
    static final class Stepper extends Thread {
        volatile boolean cancelled;

        Stepper(Runnable r) {
            super(r, "evanesce incident-power run beside the run");
        }
    }

    /** The steps it runs, −1 until started. */
    private long steps = -1;
    private Stepper thread;
    private CompletableFuture<IncidentPowerCache.Obtained> done;

    /**
     * Starts the plan's incident-power run beside the case's run, or leaves it to step after it (no flux section, a
     * computed incident power, a stop on decay, or no thread to spare: the case's run steps on as many threads as were
     * asked for, or the machine has no more processors).
     */
    void start(CasePlan plan, IncidentPowerCache incident, double progressSeconds) {
        if (thread != null || !besideTheRun(plan)) {
            return;
        }
        FluxPlan f = plan.flux().orElseThrow();
        long n = ((CasePlan.Stop.Steps) plan.stop()).steps();
        done = new CompletableFuture<>();
        thread = new Stepper(() -> {
            try {
                done.complete(incident.obtain(f, n, c -> {
                    double[] m = CaseRunner.measureIncidentPower(plan, n, null, progressSeconds, c);
                    return new IncidentPowerCache.Measured(m[0], m[1], m[2]);
                }));
            } catch (RuntimeException | Error e) {
                done.completeExceptionally(e);
            }
        });
        thread.setDaemon(true);
        thread.start();
        steps = n;
    }

    /**
     * Whether a run of this plan (not continued from a checkpoint) steps its incident-power run beside it: a flux section
     * whose incident power is stepped, a stop after a given time, and a thread to spare (the case's run and the
     * incident-power run together on no more threads than were asked for and the machine has).
     */
    public static boolean besideTheRun(CasePlan plan) {
        if (plan.flux().isEmpty() || !(plan.stop() instanceof CasePlan.Stop.Steps)) {
            return false;
        }
        FluxPlan f = plan.flux().get();
        if (f.computed().isPresent()) {
            return false;
        }
        int own = f.strip().isPresent() ? f.strip().get().builder().effectiveThreads() : f.reference().effectiveThreads();
        int asked = Math.min(plan.builder().requestedThreads(), Runtime.getRuntime().availableProcessors());
        return plan.builder().effectiveThreads() + own <= asked;
    }

    /** The steps it runs (its result serves a case's run of exactly these), −1 when not started. */
    long steps() {
        return steps;
    }

    /** Waits for its result (once started); what it threw is thrown here. */
    IncidentPowerCache.Obtained join() {
        try {
            return done.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new CancellationException("interrupted while waiting for the incident-power run");
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            if (e.getCause() instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(e.getCause());
        }
    }

    /** Stops it (when the case's run failed or its result was not wanted) and waits until its thread has ended. */
    @Override
    public void close() {
        if (thread == null) {
            return;
        }
        thread.cancelled = true;
        boolean interrupted = false;
        while (thread.isAlive()) {
            try {
                thread.join();
            } catch (InterruptedException e) {
                interrupted = true;
            }
        }
        if (interrupted) {
            Thread.currentThread().interrupt();
        }
    }

    /** Throws when the calling thread is a cancelled {@link Stepper} (checked between chunks of steps). */
    static void checkCancelled() {
        if (Thread.currentThread() instanceof Stepper t && t.cancelled) {
            throw new CancellationException("the incident-power run beside the run was stopped");
        }
    }
}
