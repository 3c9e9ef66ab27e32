package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A {@code polarization: both} run killed (SIGKILL) during its p run and started again with the same command: the s
 * run continues from its checkpoint ({@code DIR.checkpoint-s}, kept until the results are in place), the p run from
 * its own ({@code DIR.checkpoint-p}), and the averaged flux.csv and both runs' flux.csv are byte for byte those of an
 * uninterrupted run; nothing is left beside the results. The killed run is a child JVM, killed at a random (seeded,
 * printed) moment after the p checkpoint has appeared, within the first half of its p run (a delay of up to 1.5 s had
 * let a faster p run finish first).
 */
class BothCheckpointTest {

    @TempDir
    Path tmp;

    @Test
    void killedDuringThePRunContinuesBothBitForBit() throws IOException, InterruptedException {
        Path caseFile = tmp.resolve("gap.yaml");
        Files.writeString(caseFile, RunCheckpointTest.CASE.replace("polarization: s", "polarization: both"));
        Path whole = tmp.resolve("whole");
        long t0 = System.nanoTime();
        Cli.Outcome w = Cli.run("run", caseFile.toString(), "--out", whole.toString(), "--checkpoint-minutes", "0", "--threads", "1");
        long wholeMillis = (System.nanoTime() - t0) / 1_000_000;
        assertEquals(ExitCode.OK, w.code(), w.err());
        assertFalse(w.out().contains("not checkpointed"), w.out());

        Path killed = tmp.resolve("killed");
        Path pCheckpoint = tmp.resolve("killed.checkpoint-p");
        long seed = System.nanoTime();
        System.out.println("BothCheckpointTest: kill delay seed " + seed);
        Random random = new Random(seed);
        Process child = new ProcessBuilder(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "--add-modules", "jdk.incubator.vector", "-cp", System.getProperty("java.class.path"), "org.evanesce.io.Main",
                "run", caseFile.toString(), "--out", killed.toString(), "--checkpoint-minutes", "0.002", "--threads", "1"))
                .redirectErrorStream(true).redirectOutput(tmp.resolve("child.log").toFile()).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(180);
        while (!Files.exists(pCheckpoint) && child.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(20);
        }
        assertTrue(Files.exists(pCheckpoint), "no p checkpoint appeared before the child ended: "
                + Files.readString(tmp.resolve("child.log")));
        assertTrue(Files.exists(tmp.resolve("killed.checkpoint-s")), "the s run's checkpoint is kept while p runs");
        // a moment inside the p run: at most a quarter of the uninterrupted s and p runs' time in this JVM (about half
        // its p run; the child, a fresh JVM, steps slower), so the kill does not land after the results are in place
        Thread.sleep(random.nextInt((int) Math.max(1, Math.min(1500, wholeMillis / 4))));
        assertTrue(child.isAlive(), "the child finished before it could be killed; lengthen the case");
        child.destroyForcibly().waitFor();
        assertFalse(Files.exists(killed), "a killed run must not leave a results folder");

        Cli.Outcome again = Cli.run("run", caseFile.toString(), "--out", killed.toString(), "--checkpoint-minutes", "0.002",
                "--threads", "2");
        assertEquals(ExitCode.OK, again.code(), again.err());
        assertEquals(2, again.out().split("continued from the checkpoint at step", -1).length - 1,
                "both runs continue from their checkpoints: " + again.out());
        for (String f : new String[] {"flux.csv", "s/flux.csv", "p/flux.csv"}) {
            assertArrayEquals(Files.readAllBytes(whole.resolve(f)), Files.readAllBytes(killed.resolve(f)),
                    f + " of the restarted run differs from the uninterrupted one");
        }
        assertFalse(Files.exists(pCheckpoint) || Files.exists(tmp.resolve("killed.checkpoint-s")),
                "the checkpoints are removed once the results are in place");
        assertEquals(List.of(), RunCheckpointTest.hidden(tmp), "temporaries left after the rerun\n" + again.out());
    }
}
