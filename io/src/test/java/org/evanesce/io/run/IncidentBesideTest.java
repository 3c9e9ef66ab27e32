package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.evanesce.solver.DivergenceException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The incident-power run stepped beside the case's run ({@link IncidentBeside}) gives the same bits as stepped after it
 * (its own simulation; the flux table's values compared by their bits), runs only where the number of steps is known
 * before the run and a thread is spare, and stops when the case's run fails. The case: IncidentPowerCacheTest's
 * periodic gap under a continuous wave (its incident power is stepped on a 3-column strip).
 */
class IncidentBesideTest {

    private static CasePlan plan(String text, int threads) throws Exception {
        return CasePlanner.plan(CaseLoader.parse(text, "gap.yaml", Map.of(), ReadOptions.defaults()).spec(), threads);
    }

    private static boolean besideThreadAlive() {
        return Thread.getAllStackTraces().keySet().stream()
                .anyMatch(t -> t instanceof IncidentBeside.Stepper && t.isAlive());
    }

    @Test
    void besideTheRunGivesTheSameBitsAsAfterIt() throws Exception {
        assumeTrue(Runtime.getRuntime().availableProcessors() >= 2, "needs 2 processors: the run's and the strip's");
        String cw = IncidentPowerCacheTest.text(false);
        CasePlan after = plan(cw, 1);
        CaseRunner.Result a = CaseRunner.run(after, null, 1, null, null, IncidentPowerCache.none());
        assertFalse(a.stopReason().contains("beside"), a.stopReason());
        CasePlan beside = plan(cw, 2);
        assertEquals(1, beside.builder().effectiveThreads(), "the grid is small: one thread steps it, one is spare");
        CaseRunner.Result b = CaseRunner.run(beside, null, 1, null, null, IncidentPowerCache.none());
        assertTrue(b.stopReason().contains("stepped beside the case's run"), b.stopReason());
        assertEquals(a.steps(), b.steps());
        assertArrayEquals(IncidentPowerCacheTest.bits(after), IncidentPowerCacheTest.bits(beside), "the flux table");
        List<byte[]> sa = IncidentPowerCacheTest.states(after);
        List<byte[]> sb = IncidentPowerCacheTest.states(beside);
        for (int k = 0; k < sa.size(); k++) {
            assertArrayEquals(sa.get(k), sb.get(k), "recorder " + k);
        }
        assertEquals(Double.doubleToRawLongBits(a.incidentPowerRunFinalEnergy()),
                Double.doubleToRawLongBits(b.incidentPowerRunFinalEnergy()), "the strip's energy at its end");
        assertFalse(besideThreadAlive(), "its thread has ended");
    }

    @Test
    void besideTheRunOnlyWithAThreadToSpareAndKnownSteps() throws Exception {
        String cw = IncidentPowerCacheTest.text(false);
        assertFalse(IncidentBeside.besideTheRun(plan(cw, 1)), "one thread asked for: the run's");
        assertFalse(IncidentBeside.besideTheRun(plan(IncidentPowerCacheTest.text(true), 2)), "a stop on decay");
        assertEquals(Runtime.getRuntime().availableProcessors() >= 2, IncidentBeside.besideTheRun(plan(cw, 2)),
                "two threads asked for, the grid steps on one");
    }

    @Test
    void aStopOnDecayStepsItAfterTheRun() throws Exception {
        // the pulse stops when its energy has decayed: its number of steps is known only then
        CaseRunner.Result r = CaseRunner.run(plan(IncidentPowerCacheTest.text(true), 2), null, 1, null, null,
                IncidentPowerCache.none());
        assertFalse(r.stopReason().contains("beside"), r.stopReason());
    }

    @Test
    void aFailedRunStopsIt(@TempDir Path tmp) throws Exception {
        assumeTrue(Runtime.getRuntime().availableProcessors() >= 2, "needs 2 processors: the run's and the strip's");
        // a long run (about 60000 steps) that fails at its first check; a strip that finished would leave its result
        // in the cache's folder, a stopped one leaves nothing
        String text = IncidentPowerCacheTest.text(false).replace("{time: 250 fs}", "{time: 3000 fs}");
        assertTrue(text.contains("3000 fs"));
        IncidentPowerCache cache = IncidentPowerCache.inFolder(tmp, note -> { });
        CaseRunner.divergenceLimitForTests = p -> 1e-30;
        try {
            CasePlan plan = plan(text, 2);
            assertThrows(DivergenceException.class, () -> CaseRunner.run(plan, null, 1, null, null, cache));
        } finally {
            CaseRunner.divergenceLimitForTests = p -> Double.NaN;
        }
        assertFalse(besideThreadAlive(), "the strip's thread was stopped and waited for");
        try (Stream<Path> files = Files.list(tmp)) {
            assertEquals(List.of(), files.toList(), "no incident-power result: the strip was stopped, not finished");
        }
    }
}
