package org.evanesce.solver.parallel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.concurrent.atomic.AtomicIntegerArray;
import java.util.concurrent.atomic.AtomicReferenceArray;
import org.junit.jupiter.api.Test;

/**
 * {@link BandTeam#each}: work between steps on every band, from the band's own thread with its rows; every row
 * exactly once, steps before and after unaffected, a worker's exception rethrown on the caller.
 */
class BandEachTest {

    @Test
    void everyRowOnceOnItsBandsThreadBetweenSteps() {
        int rows = 90;
        AtomicIntegerArray stepped = new AtomicIntegerArray(rows);
        BandTeam.Phase phase = (j0, j1, p) -> {
            if (p == 1) {
                for (int j = j0; j < j1; j++) {
                    stepped.incrementAndGet(j);
                }
            }
            return 0;
        };
        try (BandTeam team = new BandTeam(rows, 3, "each-test", 0, System::nanoTime, false)) {
            for (int round = 0; round < 20; round++) {
                team.step(phase);
                AtomicIntegerArray seen = new AtomicIntegerArray(rows);
                AtomicReferenceArray<Thread> by = new AtomicReferenceArray<>(rows);
                int[] bands = {team.bandStart(0), team.bandStart(1), team.bandStart(2), rows};
                team.each((band, j0, j1) -> {
                    assertEquals(bands[band], j0);
                    assertEquals(bands[band + 1], j1);
                    for (int j = j0; j < j1; j++) {
                        seen.incrementAndGet(j);
                        by.set(j, Thread.currentThread());
                    }
                });
                for (int j = 0; j < rows; j++) {
                    assertEquals(1, seen.get(j), "row " + j);
                    assertEquals(1 + round, stepped.get(j), "row " + j + " stepped");
                }
                assertSame(Thread.currentThread(), by.get(0), "band 0 is the caller's");
                assertEquals("each-test-2", by.get(rows - 1).getName(), "the last band is its worker's");
            }
            IllegalStateException e = assertThrows(IllegalStateException.class, () -> team.each((band, j0, j1) -> {
                if (band == 1) {
                    throw new IllegalStateException("worker " + band);
                }
            }));
            assertEquals("worker 1", e.getMessage());
            team.step(phase);
            assertEquals(21, stepped.get(0), "steps go on after a failed task");
        }
    }
}
