package org.evanesce.solver.parallel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.atomic.AtomicIntegerArray;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;

/**
 * A band team on a machine that becomes busy and then quiet again, in virtual time
 * ({@link VirtualClock}): the team moves to the caller alone within two windows of the machine
 * becoming busy, leaves the worker idle except for ever rarer trials, and returns to both threads
 * once the machine is quiet; every step still updates every row exactly once.
 */
class BandTeamSizeTest {

    private static final int ROWS = 400;
    /** Virtual cost of one row of phase 1 on a thread that has its core, in nanoseconds. */
    private static final long ROW_NANOS = 1_000;
    /**
     * While the machine is busy, a step on two threads stalls for this long (in the caller's time): one
     * of the threads was descheduled and the other waited, as in issue #13's measurements where two
     * threads stepped four to six times slower than one.
     */
    private static final long STALL_NANOS = 1_000_000;

    private final VirtualClock clock = new VirtualClock();
    private final AtomicIntegerArray seen = new AtomicIntegerArray(ROWS);
    private volatile boolean busy;
    private final Thread caller = Thread.currentThread();
    private volatile boolean workerRan;
    private final BandTeam.Phase phase = (j0, j1, p) -> {
        if (p == 1) {
            for (int j = j0; j < j1; j++) {
                seen.incrementAndGet(j);
            }
            long cost = (j1 - j0) * ROW_NANOS;
            if (Thread.currentThread() != caller) {
                workerRan = true;
            } else if (busy && j1 - j0 < ROWS) {
                cost += STALL_NANOS;
            }
            clock.advance(cost);
        }
        return 0;
    };
    private final BandTeam team = new BandTeam(ROWS, 2, "size-test", BandTeam.WINDOW_NANOS, clock, true);

    @AfterEach
    void close() {
        team.close();
    }

    /** One step; returns whether the worker took part. */
    private boolean step() {
        workerRan = false;
        team.step(phase);
        for (int j = 0; j < ROWS; j++) {
            int jj = j;
            assertEquals(1, seen.getAndSet(j, 0), () -> "row " + jj + " in phase 1");
        }
        return workerRan;
    }

    @Test
    void theTeamStepsAloneWhileTheMachineIsBusyAndTogetherWhenItIsQuiet() {
        // quiet: both threads, balanced, efficiency 1 (no trials for MAX_GAP windows)
        for (int s = 0; s < 500; s++) {
            assertTrue(step(), "quiet step " + s + " uses the worker");
        }
        assertEquals(0, team.stepsOnFewerThreads());

        // busy: a window at two threads (17 steps of 1.2 ms), a trial of one thread (50 steps of 0.4 ms) that wins
        busy = true;
        int s = 0;
        while (team.activeThreads() == 2) {
            step();
            s++;
            assertTrue(s <= 17 + 50, "still on two threads after " + s + " busy steps");
        }
        int withWorker = 0;
        int trials = 0;
        boolean previous = false;
        int steps = 5000;
        long fewer0 = team.stepsOnFewerThreads();
        for (int k = 0; k < steps; k++) {
            boolean w = step();
            withWorker += w ? 1 : 0;
            trials += w && !previous ? 1 : 0;
            previous = w;
        }
        // 100 windows of 50 steps on one thread: trials of two threads after 8, 16 and 32 of them (the
        // next is due after 64 more), each a window of about 20 ms at 1.05-1.2 ms per step
        assertEquals(3, trials, "trials of two threads while busy");
        assertTrue(withWorker <= 3 * 20, "busy steps that used the worker: " + withWorker);
        assertEquals(steps - withWorker, team.stepsOnFewerThreads() - fewer0, "steps counted as on fewer threads");

        // quiet again: back on both threads at the next trial (after at most 256 windows of 50 steps)
        busy = false;
        int back = -1;
        for (int k = 0; k < 20_000 && back < 0; k++) {
            if (step() && team.activeThreads() == 2) {
                back = k;
            }
        }
        assertTrue(back >= 0, "back on two threads");
        for (int k = 0; k < 500; k++) {
            assertTrue(step(), "quiet again, step " + k + " uses the worker");
        }
    }
}
