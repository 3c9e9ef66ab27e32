package org.evanesce.solver.parallel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The decisions of {@link TeamSize}, driven window by window with made-up rates and efficiencies
 * (a machine whose speed for each team size the test decides): the team moves to fewer threads
 * when fewer are faster, returns when more are faster again, spaces its trials further apart while
 * a trial keeps failing, and does not move for differences inside the hysteresis band.
 */
class TeamSizeTest {

    /** Rates (steps per unit time) and efficiencies of a made-up machine, by team size. */
    private record Machine(double twoRate, double twoEfficiency, double oneRate) {
        double rate(int threads) {
            return threads == 2 ? twoRate : oneRate;
        }

        double efficiency(int threads) {
            return threads == 2 ? twoEfficiency : 1.0;
        }
    }

    /** Quiet 2-core machine: two threads 1.8 times one, balanced bands (efficiency 0.95). */
    private static final Machine QUIET = new Machine(1.8, 0.95, 1.0);
    /** Busy: two threads stall each other (rate 0.25 of one, efficiency 0.4), as measured under load in issue #13. */
    private static final Machine BUSY = new Machine(0.25, 0.4, 1.0);

    /** Runs {@code windows} windows on the machine and returns the size each window ran at. */
    private static List<Integer> run(TeamSize size, Machine m, int windows) {
        List<Integer> ran = new ArrayList<>();
        for (int w = 0; w < windows; w++) {
            int t = size.threads();
            ran.add(t);
            size.windowEnded(m.rate(t), m.efficiency(t));
        }
        return ran;
    }

    private static int count(List<Integer> ran, int threads) {
        return (int) ran.stream().filter(t -> t == threads).count();
    }

    @Test
    void laddersHalveDownToOne() {
        assertArrayEquals(new int[] {16, 8, 4, 2, 1}, new TeamSize(16, true).sizes());
        assertArrayEquals(new int[] {3, 2, 1}, new TeamSize(3, true).sizes());
        assertArrayEquals(new int[] {2, 1}, new TeamSize(2, true).sizes());
        assertArrayEquals(new int[] {1}, new TeamSize(1, true).sizes());
    }

    @Test
    void aQuietMachineKeepsTheWholeTeamWithARareTrial() {
        TeamSize size = new TeamSize(2, true);
        List<Integer> ran = run(size, QUIET, 4 * TeamSize.MAX_GAP + 4);
        // one unconditional trial of one thread every MAX_GAP windows at full size, never a move
        assertEquals(4, count(ran, 1), "trials of one thread: " + ran.indexOf(1));
        assertEquals(2, size.threads());
        for (int w = 0; w < ran.size(); w++) {
            if (ran.get(w) == 1) {
                assertEquals(0, (w + 1) % (TeamSize.MAX_GAP + 1), "trial at window " + w);
            }
        }
    }

    @Test
    void aBusyMachineMovesToOneThreadAfterOneWindowAndTriesTwoEverMoreRarely() {
        TeamSize size = new TeamSize(2, true);
        List<Integer> ran = run(size, BUSY, 2000);
        assertEquals(List.of(2, 1, 1), ran.subList(0, 3), "first window at 2 (efficiency 0.4), a trial of 1 that wins, then 1");
        List<Integer> trials = new ArrayList<>();
        for (int w = 2; w < ran.size(); w++) {
            if (ran.get(w) == 2) {
                trials.add(w);
            }
        }
        // windows at one thread between trials of two: 8, 16, 32, ... up to MAX_GAP
        int gap = TeamSize.FIRST_UP_GAP;
        int previous = 1;
        for (int t : trials) {
            assertEquals(gap, t - previous - 1, "windows before the trial at " + t + ": " + trials);
            previous = t;
            gap = Math.min(2 * gap, TeamSize.MAX_GAP);
        }
        assertTrue(trials.size() >= 8, "trials: " + trials);
        // the trials cost under 1 % of the windows once spaced out
        assertTrue(count(ran, 2) < 0.01 * ran.size(), "windows at 2 threads: " + count(ran, 2));
    }

    @Test
    void theTeamReturnsAtTheNextTrialWhenTheLoadGoesAway() {
        TeamSize size = new TeamSize(2, true);
        run(size, BUSY, 100);
        assertEquals(1, size.threads(), "on one thread after 100 busy windows");
        // the trials of two threads came after 8, 16 and 32 windows; the next is due 64 windows after the last
        List<Integer> ran = run(size, QUIET, 200);
        int back = ran.indexOf(2);
        assertTrue(back >= 0 && back <= 64, "the next trial comes within 64 windows: " + ran);
        assertTrue(ran.subList(back, ran.size()).stream().allMatch(t -> t == 2), "and stays: " + ran.subList(back, ran.size()));
    }

    @Test
    void aChanceWinThatIsUndoneAtOnceCountsAsAFailedTrial() {
        TeamSize size = new TeamSize(2, true);
        List<Integer> ran = run(size, BUSY, 10);
        assertEquals(List.of(2, 1, 1, 1, 1, 1, 1, 1, 1, 1), ran, "busy: to one thread, 8 windows before the first trial");
        assertTrue(size.tryingLarger());
        // the trial wins by chance (the machine was briefly quiet), and the team moves up
        size.windowEnded(QUIET.rate(2), QUIET.efficiency(2));
        assertEquals(2, size.threads());
        assertFalse(size.trial());
        // busy again: two windows at two threads (after the first, the median of the two windows since the
        // move is still the quiet one's efficiency), a trial of one that wins, then 16 windows (not 8) before
        // the next trial
        List<Integer> after = run(size, BUSY, 40);
        assertEquals(List.of(2, 2, 1), after.subList(0, 3));
        assertEquals(19, 3 + after.subList(3, after.size()).indexOf(2), "the next trial of two threads: " + after);
    }

    @Test
    void aLoneSlowWindowNeitherCallsForATrialNorWinsOne() {
        // quiet, but every 30th window one thread is descheduled for part of it (two threads at 0.7 of one
        // thread's rate, efficiency 0.5: as in a quiet two-prism run, where such windows came every 30-70);
        // compared with that window alone a trial of one thread would win (1.0 >= 1.25 x 0.7)
        TeamSize size = new TeamSize(2, true);
        Machine hiccup = new Machine(0.7, 0.5, 1.0);
        List<Integer> ran = new ArrayList<>();
        for (int w = 0; w < 3 * TeamSize.MAX_GAP; w++) {
            int t = size.threads();
            ran.add(t);
            Machine m = w % 30 == 29 ? hiccup : QUIET;
            size.windowEnded(m.rate(t), m.efficiency(t));
        }
        assertEquals(2, size.threads());
        // only the unconditional trials of one thread, every MAX_GAP windows
        assertEquals(2, count(ran, 1), "windows at one thread: " + count(ran, 1));
        // two slow windows in a row still do not; a third (the median of five) does
        TeamSize again = new TeamSize(2, true);
        run(again, QUIET, 10);
        again.windowEnded(hiccup.rate(2), hiccup.efficiency(2));
        again.windowEnded(hiccup.rate(2), hiccup.efficiency(2));
        assertFalse(again.trial(), "two slow windows");
        again.windowEnded(hiccup.rate(2), hiccup.efficiency(2));
        assertTrue(again.trial(), "three slow windows: a trial");
    }

    @Test
    void whileTheJitCompilesFailedTrialsDoNotSpaceTheNextOnesOut() {
        // the run's first seconds: the JIT compiler holds one of two cores, so one thread is faster; its trials
        // of two threads fail, but come back every FIRST_UP_GAP windows, and the team returns within that
        // many windows of the compiling's end (without the signal the gaps would have grown to 8, 16, 32, 64, ...)
        TeamSize size = new TeamSize(2, true);
        List<Integer> ran = new ArrayList<>();
        for (int w = 0; w < 200; w++) {
            int t = size.threads();
            ran.add(t);
            size.windowEnded(BUSY.rate(t), BUSY.efficiency(t), true);
        }
        List<Integer> trials = new ArrayList<>();
        for (int w = 2; w < ran.size(); w++) {
            if (ran.get(w) == 2) {
                trials.add(w);
            }
        }
        for (int k = 1; k < trials.size(); k++) {
            assertEquals(TeamSize.FIRST_UP_GAP + 1, trials.get(k) - trials.get(k - 1), "trials: " + trials);
        }
        assertTrue(trials.size() >= 20, "trials: " + trials);
        List<Integer> quiet = run(size, QUIET, 20);
        int back = quiet.indexOf(2);
        assertTrue(back >= 0 && back <= TeamSize.FIRST_UP_GAP, "back within FIRST_UP_GAP windows: " + quiet);
        assertTrue(quiet.subList(back, quiet.size()).stream().allMatch(t -> t == 2), "and stays: " + quiet);
    }

    @Test
    void differencesInsideTheHysteresisBandMoveNothing() {
        // two threads 0.85 times one: kept when there (one thread is not 1.25 times as fast), not
        // returned to from one (two are not 1.15 times as fast)
        Machine between = new Machine(0.85, 0.5, 1.0);
        TeamSize atTwo = new TeamSize(2, true);
        List<Integer> ran = run(atTwo, between, 300);
        assertEquals(2, atTwo.threads(), "stays at two threads");
        assertTrue(count(ran, 1) > 0, "though it tries one (low efficiency)");
        TeamSize atOne = new TeamSize(2, true);
        run(atOne, BUSY, 3);
        assertEquals(1, atOne.threads());
        List<Integer> later = run(atOne, between, 300);
        assertEquals(1, atOne.threads(), "stays at one thread");
        assertTrue(count(later, 2) > 0, "though it tries two");
    }

    @Test
    void lowEfficiencyTrialsThatFailAreSpacedOut() {
        // an uneven but still faster team: two threads 1.5 times one with efficiency 0.6
        TeamSize size = new TeamSize(2, true);
        List<Integer> ran = run(size, new Machine(1.5, 0.6, 1.0), 300);
        List<Integer> trials = new ArrayList<>();
        for (int w = 0; w < ran.size(); w++) {
            if (ran.get(w) == 1) {
                trials.add(w);
            }
        }
        // trials after 1, 2, 4, 8, ... windows at two threads
        assertEquals(List.of(1, 4, 9, 18, 35, 68, 133, 262), trials);
        assertEquals(2, size.threads());
    }

    @Test
    void aLargeTeamStepsDownTheLadderToTheFastestSize() {
        // 8 threads on a machine where 2 is the fastest: 8 → 4 → 2, and 1 is tried and refused
        TeamSize size = new TeamSize(8, true);
        double[] rateBySize = new double[9];
        rateBySize[8] = 0.5;
        rateBySize[4] = 1.2;
        rateBySize[2] = 1.6;
        rateBySize[1] = 1.0;
        List<Integer> ran = new ArrayList<>();
        for (int w = 0; w < 40; w++) {
            int t = size.threads();
            ran.add(t);
            size.windowEnded(rateBySize[t], t == 1 ? 1.0 : 0.5);
        }
        assertEquals(List.of(8, 4, 4, 2, 2, 1, 2), ran.subList(0, 7), "steps down, refuses 1: " + ran);
        assertEquals(2, size.threads());
        assertTrue(ran.subList(7, ran.size()).stream().allMatch(t -> t <= 4), "tries 4 now and then, never 8 directly: " + ran);
    }

    @Test
    void aFixedTeamNeverMoves() {
        TeamSize size = new TeamSize(2, false);
        List<Integer> ran = run(size, BUSY, 1000);
        assertEquals(1000, count(ran, 2));
        assertFalse(size.trial());
    }
}
