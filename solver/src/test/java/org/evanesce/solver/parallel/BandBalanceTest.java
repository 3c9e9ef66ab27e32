package org.evanesce.solver.parallel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicIntegerArray;
import org.junit.jupiter.api.Test;

/**
 * The band team's balancing (common practice for dynamic load balancing: measure each worker's
 * time, move work from slow to fast): when one thread is slower per row, the bands move until
 * both take the same time, and at every step every row is still handled exactly once in each
 * phase. The time is a {@link VirtualClock} that each band's work advances by its cost, so the
 * measurements and therefore the boundaries are the same on every run, whatever else the machine
 * is doing.
 */
class BandBalanceTest {

    private static final int ROWS = 400;
    /** Virtual time per row of phase 1 on the faster thread, in nanoseconds. */
    private static final long FAST_NANOS = 1_000;
    private static final long WINDOW = BandTeam.WINDOW_NANOS;

    @Test
    void bandsMoveHalfwayTowardsEqualTimesAndStillCoverEveryRowOnce() {
        // the caller (band 0) four times faster than the worker: equal times when it holds 4/5 of the rows (320)
        List<Integer> boundaries = balance(FAST_NANOS, 4 * FAST_NANOS, 1000);
        assertEquals(200, boundaries.get(0), "bands start equal");
        assertEquals(260, boundaries.get(1), "the first window moves the boundary halfway from 200 towards 320");
        for (int w = 2; w < boundaries.size(); w++) {
            int before = Math.abs(320 - boundaries.get(w - 1));
            int after = Math.abs(320 - boundaries.get(w));
            assertTrue(after <= (before + 1) / 2, "window " + w + " should halve the distance to 320: " + boundaries);
        }
        assertTrue(Math.abs(boundaries.get(boundaries.size() - 1) - 320) <= 1, "ends within a row of 320: " + boundaries);
    }

    @Test
    void bandsFollowWhenTheSlowThreadChanges() {
        // first the worker is slow, then the caller (as when another process moves between cores)
        List<Integer> boundaries = balance(FAST_NANOS, 4 * FAST_NANOS, 600);
        assertTrue(Math.abs(boundaries.get(boundaries.size() - 1) - 320) <= 1, "settles at 320 first: " + boundaries);
        List<Integer> after = balance(4 * FAST_NANOS, FAST_NANOS, 2000);
        assertTrue(Math.abs(after.get(after.size() - 1) - 80) <= 1, "then at 80: " + after);
    }

    @Test
    void everyBandKeepsAQuarterOfItsEqualShare() {
        // a worker 100 times slower would get 4 of 400 rows; the bound keeps 50 (a quarter of 200)
        List<Integer> boundaries = balance(FAST_NANOS, 100 * FAST_NANOS, 3000);
        assertEquals(ROWS - ROWS / 8, boundaries.get(boundaries.size() - 1), "stops at the bound: " + boundaries);
        assertTrue(boundaries.stream().allMatch(s -> s >= ROWS / 8 && s <= ROWS - ROWS / 8), "within the bounds: " + boundaries);
    }

    private final VirtualClock clock = new VirtualClock();
    private final AtomicIntegerArray[] seen = {new AtomicIntegerArray(ROWS), new AtomicIntegerArray(ROWS)};
    private BandTeam team;
    private int steps;

    /**
     * Steps the team with the given virtual costs per row of phase 1 for the caller's band and the
     * worker's, checking each step's coverage, and returns band 1's start at the beginning and
     * after every window that moved it.
     */
    private List<Integer> balance(long callerNanos, long workerNanos, int count) {
        Thread caller = Thread.currentThread();
        BandTeam.Phase phase = (j0, j1, p) -> {
            if (p == 0) {
                seen[0].incrementAndGet(j1 - 1);
                return 0;
            }
            for (int j = j0; j < j1; j++) {
                seen[1].incrementAndGet(j);
            }
            clock.advance((j1 - j0) * (Thread.currentThread() == caller ? callerNanos : workerNanos));
            return j1 - j0;
        };
        if (team == null) {
            team = new BandTeam(ROWS, 2, "balance-test", WINDOW, clock, false);
        }
        List<Integer> boundaries = new ArrayList<>();
        boundaries.add(team.bandStart(1));
        for (int n = 0; n < count; n++) {
            int before = team.bandStart(1);
            team.step(phase);
            steps++;
            for (int j = 0; j < ROWS; j++) {
                int jj = j;
                // phase 1 updates every row once; phase 0 the last row of each band
                assertEquals(1, seen[1].getAndSet(j, 0), () -> "row " + jj + " in phase 1 of step " + steps);
                int want0 = j == before - 1 || j == ROWS - 1 ? 1 : 0;
                assertEquals(want0, seen[0].getAndSet(j, 0), () -> "row " + jj + " in phase 0 of step " + steps);
            }
            if (team.bandStart(1) != before) {
                boundaries.add(team.bandStart(1));
            }
        }
        return boundaries;
    }

    @org.junit.jupiter.api.AfterEach
    void close() {
        if (team != null) {
            team.close();
        }
    }
}
