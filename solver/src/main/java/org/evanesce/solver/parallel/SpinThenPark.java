package org.evanesce.solver.parallel;

import java.util.function.LongSupplier;

/**
 * How a band team's threads wait: spin for a short budget, then park until woken. Spinning keeps a
 * hand-over well under a microsecond while every thread has its own core; parking frees the core
 * when the awaited thread is not running (descheduled by other work on a busy machine, or the
 * caller busy between steps), where spinning would take the very core that thread needs.
 *
 * <p>The budget follows the team's measured step cycle: half a cycle, within
 * [{@link #MIN_NANOS}, {@link #MAX_NANOS}]. On a machine where every thread runs, a wait lasts the
 * bands' imbalance and the caller's work between steps, a small part of a cycle; a thread still
 * missing after half a cycle is almost surely not running. Spinning about as long as parking and
 * waking would cost and then blocking is the classic competitive rule (Karlin, Li, Manasse and
 * Owicki, "Empirical studies of competitive spinning for a shared-memory multiprocessor", SOSP
 * 1991); here the cost of a late wake-up is a stall of the whole team, so the budget scales with
 * the step. Before, threads spun 2^16 pauses (about 2 ms) before even yielding: under load they
 * burned the cores the descheduled threads needed.
 */
final class SpinThenPark {

    /** Shortest budget: a wake-up from park costs some tens of microseconds on the 2-core VMs (common practice for Linux futex wake-ups under KVM). */
    static final long MIN_NANOS = 20_000;
    /** Longest budget: a waiting thread never burns more than half a millisecond of a core at a time. */
    static final long MAX_NANOS = 500_000;
    /** Budget before the first measured cycle. */
    static final long INITIAL_NANOS = 100_000;
    /** Pauses between clock reads, and the most pauses whatever the clock says (a clock that stands still cannot keep a thread spinning). */
    static final int PAUSES_PER_READ = 64;
    static final int MAX_PAUSES = 1 << 16;

    private final LongSupplier clock;
    private volatile long budget = INITIAL_NANOS;

    SpinThenPark(LongSupplier clock) {
        this.clock = clock;
    }

    /** The spin budget for a measured mean step cycle, in nanoseconds. */
    static long budgetFor(double cycleNanos) {
        if (!(cycleNanos > 0)) {
            return INITIAL_NANOS;
        }
        return (long) Math.max(MIN_NANOS, Math.min(MAX_NANOS, 0.5 * cycleNanos));
    }

    /** Sets the budget from the mean step cycle of the last window (called by the team's caller). */
    void cycle(double cycleNanos) {
        budget = budgetFor(cycleNanos);
    }

    long budget() {
        return budget;
    }

    /** The start of a wait, for {@link #spinOn}. */
    long start() {
        return clock.getAsLong();
    }

    /**
     * Whether a wait that began at {@code start} and has made {@code pauses} checks so far should
     * go on spinning; pauses once when it should. False: park now.
     */
    boolean spinOn(int pauses, long start) {
        if (pauses % PAUSES_PER_READ == 0 && (pauses >= MAX_PAUSES || clock.getAsLong() - start >= budget)) {
            return false;
        }
        Thread.onSpinWait();
        return true;
    }
}
