package org.evanesce.io.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.atomic.AtomicReference;
import org.evanesce.io.Cli;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.evanesce.io.run.RunOutputs;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The permittivity preview drawn beside a run's stepping (issue 18's fixed costs): the same file as drawn after the
 * run, its failure reported as before, and nothing written after the caller stopped waiting. Common practice (a
 * change of when, not of what).
 */
class BesideTheRunTest {

    /** The shipped plane-wave gap example (19 x 191 cells: it steps on one thread). */
    private static final Path CASE = Path.of("../cases/gap-tunnelling-plane-wave.yaml");

    @Test
    void thePreviewOfARunIsTheSameFileAsDrawnAlone(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("res");
        Cli.Outcome o = Cli.run("run", CASE.toString(), "--out", out.toString(), "--set", "gap=150 nm");
        assertEquals(0, o.code(), o::toString);
        CasePlan plan = CasePlanner.plan(CaseLoader.read(CASE, Map.of("gap", "150 nm"), ReadOptions.defaults()).spec(), null);
        assertEquals(1, plan.builder().effectiveThreads(), "the example steps on one thread, so its preview goes beside it");
        Path alone = dir.resolve("alone.png");
        RunOutputs.preview(plan, alone);
        assertArrayEquals(Files.readAllBytes(alone), Files.readAllBytes(out.resolve("preview.png")),
                "preview.png drawn beside the run against the same plan's preview drawn alone");
    }

    @Test
    void aFailureBesideTheRunIsThrownWhereItIsAwaited() {
        IOException full = new IOException("No space left on device");
        BesideTheRun b = BesideTheRun.start(0, () -> {
            throw full;
        });
        assertSame(full, assertThrows(IOException.class, b::await), "the output's own exception");
        BesideTheRun here = BesideTheRun.start(Integer.MAX_VALUE, () -> {
            throw full;
        });
        assertSame(full, assertThrows(IOException.class, here::await), "written where awaited when no core is idle");
    }

    @Test
    void waitingQuietlyWaitsForTheOutputToEnd() throws Exception {
        CountDownLatch started = new CountDownLatch(1);
        AtomicReference<Boolean> finished = new AtomicReference<>(false);
        BesideTheRun b = BesideTheRun.start(0, () -> {
            started.countDown();
            try {
                Thread.sleep(200);
            } catch (InterruptedException e) {
                throw new IOException(e);
            }
            finished.set(true);
            throw new IOException("the folder was removed");
        });
        started.await();
        b.awaitQuietly();
        assertEquals(true, finished.get(), "returns only when the output has ended (its failure dropped)");
        assertFalse(Thread.currentThread().isInterrupted());
    }
}
