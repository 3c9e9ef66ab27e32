package org.evanesce.solver.parallel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.atomic.AtomicIntegerArray;
import org.junit.jupiter.api.Test;

/**
 * The band team's balancing (common practice for dynamic load balancing: measure each worker's
 * time, move work from slow to fast): when one thread is slower per row, the bands move until
 * both take about the same time, and at every step every row is still handled exactly once in
 * each phase.
 */
class BandBalanceTest {

    private static final int ROWS = 400;
    /** Busy time per row of phase 1: the caller (band 0) is four times faster than the worker. */
    private static final long FAST_NANOS = 1_000;
    private static final long SLOW_NANOS = 4_000;

    @Test
    void bandsMoveTowardsEqualTimesAndStillCoverEveryRowOnce() {
        AtomicIntegerArray[] seen = {new AtomicIntegerArray(ROWS), new AtomicIntegerArray(ROWS)};
        Thread caller = Thread.currentThread();
        BandTeam.Phase phase = (j0, j1, p) -> {
            if (p == 0) {
                seen[0].incrementAndGet(j1 - 1);
                return 0;
            }
            long perRow = Thread.currentThread() == caller ? FAST_NANOS : SLOW_NANOS;
            for (int j = j0; j < j1; j++) {
                seen[1].incrementAndGet(j);
                long until = System.nanoTime() + perRow;
                while (System.nanoTime() < until) {
                    Thread.onSpinWait();
                }
            }
            return j1 - j0;
        };
        try (BandTeam team = new BandTeam(ROWS, 2, "balance-test")) {
            assertEquals(ROWS / 2, team.bandStart(1), "bands start equal");
            for (int step = 1; step <= 800; step++) {
                team.step(phase);
                int s = team.bandStart(1);
                assertTrue(s >= ROWS / 8 && s <= ROWS - ROWS / 8, "each band keeps a quarter of its equal share: " + s);
                for (int j = 0; j < ROWS; j++) {
                    int jj = j;
                    int st = step;
                    // phase 0 touches each band's last row; phase 1 every row once
                    int want0 = j == ROWS - 1 ? step : -1;
                    assertEquals(step, seen[1].get(j), () -> "row " + jj + " in phase 1 after step " + st);
                    if (want0 > 0) {
                        assertEquals(want0, seen[0].get(j), () -> "last row in phase 0 after step " + st);
                    }
                }
            }
            // equal times at 4 : 1 speeds: the caller's band holds 4/5 of the rows (320)
            int s = team.bandStart(1);
            assertTrue(s >= 280 && s <= 350, "the fast band should hold about 320 of 400 rows, holds " + s);
        }
    }
}
