package org.evanesce.solver.parallel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.concurrent.atomic.AtomicIntegerArray;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;

/**
 * When waiting threads stop spinning ({@link SpinThenPark}, with a clock the test sets), and that
 * a team whose every wait parks still hands over every step (no lost wake-up).
 */
class SpinThenParkTest {

    @Test
    void theBudgetIsHalfAStepCycleWithinItsBounds() {
        assertEquals(165_000, SpinThenPark.budgetFor(330_000), "1024², 2 threads: a 330 µs cycle");
        assertEquals(SpinThenPark.MIN_NANOS, SpinThenPark.budgetFor(10_000), "a tiny grid's cycle");
        assertEquals(SpinThenPark.MAX_NANOS, SpinThenPark.budgetFor(6e6), "4096²: a 6 ms cycle");
        assertEquals(SpinThenPark.INITIAL_NANOS, SpinThenPark.budgetFor(Double.NaN), "nothing measured yet");
        assertEquals(SpinThenPark.INITIAL_NANOS, SpinThenPark.budgetFor(0), "nothing measured yet");
    }

    @Test
    void aWaitSpinsUntilTheBudgetHasPassedThenParks() {
        AtomicLong now = new AtomicLong(5_000_000);
        SpinThenPark w = new SpinThenPark(now::get);
        w.cycle(200_000);
        long budget = w.budget();
        assertEquals(100_000, budget);
        long start = w.start();
        int n = 0;
        for (int k = 0; k < 10 * SpinThenPark.PAUSES_PER_READ; k++) {
            assertTrue(w.spinOn(++n, start), "within the budget, pause " + n);
        }
        now.addAndGet(budget - 1);
        while (n % SpinThenPark.PAUSES_PER_READ != SpinThenPark.PAUSES_PER_READ - 1) {
            assertTrue(w.spinOn(++n, start), "one nanosecond before the budget, pause " + n);
        }
        assertTrue(w.spinOn(++n, start), "one nanosecond before the budget, at a clock read");
        now.addAndGet(1);
        boolean parked = false;
        for (int k = 0; k < SpinThenPark.PAUSES_PER_READ && !parked; k++) {
            parked = !w.spinOn(++n, start);
        }
        assertTrue(parked, "the first clock read after the budget says park");
    }

    @Test
    void aClockThatStandsStillCannotKeepAThreadSpinning() {
        AtomicLong now = new AtomicLong();
        SpinThenPark w = new SpinThenPark(now::get);
        long start = w.start();
        int n = 0;
        while (w.spinOn(++n, start)) {
            assertTrue(n < SpinThenPark.MAX_PAUSES, "still spinning after " + n + " pauses");
        }
        assertEquals(SpinThenPark.MAX_PAUSES, n);
    }

    private int parkedSeen;

    /** Waits until {@code count} threads whose names start with {@code prefix} are parked. */
    private void awaitParkedWorkers(String prefix, int count) throws InterruptedException {
        while (true) {
            long parked = Thread.getAllStackTraces().keySet().stream()
                    .filter(t -> t.getName().startsWith(prefix) && t.getState() == Thread.State.WAITING).count();
            if (parked == count) {
                parkedSeen += count;
                return;
            }
            Thread.sleep(1);
        }
    }

    @Test
    void aTeamWhoseWaitsParkStillHandsOverEveryStep() {
        // The timing clock moves a nanosecond at every read, so the measured cycle is tiny and the spin
        // budget the shortest (20 µs of real time): the waits park whenever a partner is that late, and
        // every 500 steps the caller waits until both workers have parked. Stepping thousands of times
        // exercises park and wake-up at all three waits (between the phases, the hand-over to the
        // workers, the caller's wait for them); a lost wake-up would hang the test.
        AtomicLong jumps = new AtomicLong();
        int rows = 30;
        int steps = 3000;
        AtomicIntegerArray seen = new AtomicIntegerArray(rows);
        assertTimeoutPreemptively(Duration.ofSeconds(60), () -> {
            try (BandTeam team = new BandTeam(rows, 3, "park-test", 0, jumps::incrementAndGet, false)) {
                for (int s = 1; s <= steps; s++) {
                    if (s % 500 == 0) {
                        awaitParkedWorkers("park-test", 2);
                    }
                    team.step((j0, j1, p) -> {
                        if (p == 1) {
                            for (int j = j0; j < j1; j++) {
                                seen.incrementAndGet(j);
                            }
                        }
                        return 0;
                    });
                }
            }
        });
        for (int j = 0; j < rows; j++) {
            assertEquals(steps, seen.get(j), "row " + j);
        }
        assertTrue(parkedSeen >= 2 * (steps / 500), "workers seen parked: " + parkedSeen);
        assertFalse(Thread.getAllStackTraces().keySet().stream().anyMatch(t -> t.getName().startsWith("park-test")),
                "closing stops the workers");
    }
}
