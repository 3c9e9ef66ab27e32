package org.evanesce.solver.parallel;

import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReferenceArray;
import java.util.concurrent.locks.LockSupport;

/**
 * A reusable barrier for the threads of a band team that are stepping: each waits by
 * {@link SpinThenPark} (spin a short budget, then park until the last one arrives and wakes it).
 * The number of parties may change between uses, while no one waits at it.
 */
final class SpinBarrier {

    private final SpinThenPark waiting;
    private final AtomicInteger arrived = new AtomicInteger();
    /** Threads parked at the barrier, by party (null: not parked). */
    private final AtomicReferenceArray<Thread> sleepers;
    private volatile int generation;
    private int parties;

    SpinBarrier(int maxParties, SpinThenPark waiting) {
        this.waiting = waiting;
        sleepers = new AtomicReferenceArray<>(maxParties);
        parties = maxParties;
    }

    /** Sets the number of parties; only between uses (the caller publishes it with the step's hand-over). */
    void parties(int p) {
        parties = p;
    }

    /** Party {@code party} (0 ≤ party &lt; parties) arrives; every party returns once the last one has arrived. */
    void await(int party) {
        int g = generation;
        if (arrived.incrementAndGet() == parties) {
            arrived.set(0);
            generation = g + 1;
            for (int p = 0; p < parties; p++) {
                Thread t = sleepers.get(p);
                if (t != null) {
                    LockSupport.unpark(t);
                }
            }
            return;
        }
        long t0 = waiting.start();
        int n = 0;
        while (generation == g) {
            if (!waiting.spinOn(++n, t0)) {
                // Published before the generation is read again: the last arrival writes the
                // generation before it reads the sleepers, so one of the two sees the other.
                sleepers.set(party, Thread.currentThread());
                while (generation == g) {
                    LockSupport.park(this);
                }
                sleepers.set(party, null);
                return;
            }
        }
    }
}
