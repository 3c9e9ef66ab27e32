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
 * Issue #7: a single run killed (SIGKILL) after a checkpoint and started again with the same command
 * continues from the checkpoint and gives flux results identical, byte for byte, to an uninterrupted
 * run. Issue 13: the rerun removes what the kill left (the temporary results folder, a checkpoint
 * being written), so nothing remains beside the results. The killed run is a child JVM; the moment of the kill is random (seeded, printed) but after the
 * first checkpoint file has appeared.
 */
class RunCheckpointTest {

    @TempDir
    Path tmp;

    /** A plane wave through a gap, fine enough that its main run lasts a few seconds. */
    static final String CASE = """
            parameters:
              cpw: 60
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 0.1 um, height: 4 um, background: glass}
            grid: {cells_per_wavelength: cpw}
            materials:
              glass: {index: 1.5}
              gap_fill: {index: 1.0}
            shapes:
              - layer_stack: {start: [0, -75 nm], layers: [{material: gap_fill, thickness: 150 nm}]}
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave: {y: -1 um, angle: 45 deg, signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}}
            flux:
              wavelengths: [625 nm, 633 nm, 641 nm]
              lines:
                - {y: -1.3 um, measures: reflected}
                - {y: 1 um, measures: transmitted}
            until: {energy_below: 1e-6, latest: 600 fs}
            """;



    @Test
    void killedRunContinuesFromItsCheckpointBitForBit() throws IOException, InterruptedException {
        Path caseFile = tmp.resolve("gap.yaml");
        Files.writeString(caseFile, CASE);
        Path whole = tmp.resolve("whole");
        long t0 = System.nanoTime();
        Cli.Outcome w = Cli.run("run", caseFile.toString(), "--out", whole.toString(), "--checkpoint-minutes", "0", "--threads", "1");
        long wholeMillis = (System.nanoTime() - t0) / 1_000_000;
        assertEquals(ExitCode.OK, w.code(), w.err());

        Path killed = tmp.resolve("killed");
        Path checkpoint = tmp.resolve("killed.checkpoint");
        long seed = System.nanoTime();
        System.out.println("RunCheckpointTest: kill delay seed " + seed);
        Random random = new Random(seed);
        Process child = new ProcessBuilder(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "--add-modules", "jdk.incubator.vector", "-cp", System.getProperty("java.class.path"), "org.evanesce.io.Main",
                "run", caseFile.toString(), "--out", killed.toString(), "--checkpoint-minutes", "0.002", "--threads", "1"))
                .redirectErrorStream(true).redirectOutput(tmp.resolve("child.log").toFile()).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (!Files.exists(checkpoint) && child.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(20);
        }
        assertTrue(Files.exists(checkpoint), "no checkpoint appeared before the child ended: " + Files.readString(tmp.resolve("child.log")));
        // a moment inside the run: at most half the uninterrupted run's time in this JVM (the child, a fresh JVM, steps
        // slower), so the kill does not land after the results are in place
        Thread.sleep(random.nextInt((int) Math.max(1, Math.min(1000, wholeMillis / 2))));
        assertTrue(child.isAlive(), "the child finished before it could be killed; lengthen the case");
        child.destroyForcibly().waitFor();
        assertFalse(Files.exists(killed), "a killed run must not leave a results folder");
        List<String> left = hidden(tmp);
        System.out.println("RunCheckpointTest: the killed run left " + left);

        Cli.Outcome again = Cli.run("run", caseFile.toString(), "--out", killed.toString(), "--checkpoint-minutes", "0.002", "--threads", "2");
        assertEquals(ExitCode.OK, again.code(), again.err());
        assertTrue(again.out().contains("continued from the checkpoint at step"), again.out());
        assertArrayEquals(Files.readAllBytes(whole.resolve("flux.csv")), Files.readAllBytes(killed.resolve("flux.csv")),
                "flux.csv of the restarted run differs from the uninterrupted one");
        assertFalse(Files.exists(checkpoint), "the checkpoint is removed once the results are in place");
        // issue 13: what the kill left (its temporary folder, perhaps a half-written checkpoint) the rerun removed
        assertEquals(List.of(), hidden(tmp), "temporaries left after the rerun; the kill had left " + left + "\n" + again.out());
        if (!left.isEmpty()) {
            assertTrue(again.out().contains("note: removed "), again.out());
        }
    }

    /** Names in a folder that start with '.' (evanesce's temporaries), sorted. */
    static List<String> hidden(Path dir) throws IOException {
        try (java.util.stream.Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).filter(n -> n.startsWith(".")).sorted().toList();
        }
    }
}
