package org.evanesce.solver.parallel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;

/**
 * Bands weighted by the expected work of their rows ({@link RowWork}; common practice for static load
 * balancing: partition by an estimate of the cost, then correct by measurement). A grid whose first 50
 * of 400 rows cost three times as much (as CPML rows do) and two threads of equal speed: by rows the
 * split is 200/200, with 300 and 200 units of work; by work it is 150/250, 250 units each. Time is a
 * {@link VirtualClock} that each band's work advances by its rows' cost, so the measurements are exact.
 */
class WeightedBandsTest {

    private static final int ROWS = 400;
    private static final int HEAVY = 50;
    private static final long NANOS_PER_WORK = 1_000;

    private final VirtualClock clock = new VirtualClock();
    private BandTeam team;

    @Test
    void bandsStartWithEqualWorkAndStayWhenTheThreadsAreEqual() {
        List<Integer> starts = run(weights(), 1, 1, 300);
        assertEquals(150, starts.get(0), "the rows [0, 150) hold half of the 500 units");
        assertEquals(List.of(150), starts, "equal threads on equal work: nothing to move");
    }

    @Test
    void byRowsTheSameGridStartsUnequalAndMustMove() {
        team = new BandTeam(ROWS, 2, "weighted-test", BandTeam.WINDOW_NANOS, clock, false);
        List<Integer> starts = run(weights(), 1, 1, 1500);
        assertEquals(200, starts.get(0), "equal rows");
        assertTrue(Math.abs(starts.get(starts.size() - 1) - 150) <= 1, "ends at the equal-work split: " + starts);
        assertTrue(starts.size() > 2, "it takes several windows to get there: " + starts);
    }

    @Test
    void balancingMovesBoundariesByWork() {
        // the worker four times slower: equal times when the caller holds 4/5 of the work, 400 units = rows [0, 300)
        List<Integer> starts = run(weights(), 1, 4, 2000);
        assertEquals(150, starts.get(0));
        assertTrue(Math.abs(starts.get(starts.size() - 1) - 300) <= 1, "settles at 300: " + starts);
    }

    @Test
    void theCallersWorkBetweenStepsMovesRowsToTheWorker() {
        // equal threads, 500 units of work per step, and the caller busy for 100 units between steps (sources,
        // listeners): equal times when the caller's band holds 200 units, rows [0, 100)
        List<Integer> starts = run(weights(), 1, 1, 3000, 100 * NANOS_PER_WORK);
        assertEquals(150, starts.get(0));
        assertTrue(Math.abs(starts.get(starts.size() - 1) - 100) <= 1, "settles at 100: " + starts);
    }

    @Test
    void aHeavyRowOneRowFromItsTargetIsCrossedWhenThatBalancesBetter() {
        // 101 rows of 1 unit but row 60 of 30 (a metal film's row), the worker twice as slow: at 60 the bands
        // take 60 and 2 x 70 = 140 units of time; at 61, 90 and 2 x 40 = 80. The equal-time split lies at 86.7
        // units, nearest row 61, one row away: halving the way would never move
        double[] w = new double[101];
        Arrays.fill(w, 1.0);
        w[60] = 30;
        List<Integer> starts = run(w, 1, 2, 500);
        assertEquals(60, starts.get(0), "equal work: the boundary before the heavy row");
        assertEquals(61, starts.get(starts.size() - 1), "crosses it: " + starts);
    }

    @Test
    void rowNearPicksTheNearestBoundaryAndRefusesBadWork() {
        RowWork w = RowWork.of(new double[] {1, 3, 1, 1});
        assertEquals(0, w.rowNear(0.4));
        assertEquals(1, w.rowNear(2.5), "work before row 1 is 1, before row 2 is 4: 2.5 is a tie, the lower");
        assertEquals(2, w.rowNear(2.6));
        assertEquals(4, w.rowNear(99));
        assertEquals(6.0, w.total());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> RowWork.of(new double[] {1, 0}));
        assertTrue(e.getMessage().contains("row 1") && e.getMessage().contains("> 0"), e.getMessage());
    }

    private static double[] weights() {
        double[] w = new double[ROWS];
        Arrays.fill(w, 1.0);
        Arrays.fill(w, 0, HEAVY, 3.0);
        return w;
    }

    /**
     * Steps a two-band team (weighted by {@code work} unless a test made one) with phase-1 costs of each
     * row's work times the caller's and the worker's slowness; returns band 1's start at the beginning and
     * after every window that moved it.
     */
    private List<Integer> run(double[] work, long callerSlow, long workerSlow, int count) {
        return run(work, callerSlow, workerSlow, count, 0);
    }

    /** The same, the caller busy for {@code between} nanoseconds after every step. */
    private List<Integer> run(double[] work, long callerSlow, long workerSlow, int count, long between) {
        Thread caller = Thread.currentThread();
        RowWork rw = RowWork.of(work);
        if (team == null) {
            team = new BandTeam(rw, 2, "weighted-test", BandTeam.WINDOW_NANOS, clock, false);
        }
        BandTeam.Phase phase = (j0, j1, p) -> {
            if (p == 1) {
                long slow = Thread.currentThread() == caller ? callerSlow : workerSlow;
                clock.advance(Math.round(rw.between(j0, j1) * NANOS_PER_WORK * slow));
            }
            return 0;
        };
        List<Integer> starts = new ArrayList<>();
        starts.add(team.bandStart(1));
        for (int n = 0; n < count; n++) {
            int before = team.bandStart(1);
            team.step(phase);
            clock.advance(between);
            if (team.bandStart(1) != before) {
                starts.add(team.bandStart(1));
            }
        }
        return starts;
    }

    @AfterEach
    void close() {
        if (team != null) {
            team.close();
        }
    }
}
