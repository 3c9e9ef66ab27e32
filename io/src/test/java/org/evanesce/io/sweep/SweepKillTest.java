package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue #7: a sweep killed with SIGKILL at a random moment and re-run gives the same merged CSV as an
 * uninterrupted sweep, and leaves no temporary folders. The sweep runs in a child JVM (the test's own
 * java and class path), which {@link Process#destroyForcibly()} kills (SIGKILL on Linux) after a
 * random delay within the duration of an uninterrupted child sweep; the seed is printed and may be set with
 * {@code -Dsweep.kill.seed=N}. Two sweeps are killed at different moments, each re-run in this JVM.
 */
class SweepKillTest {

    /** Six points: gap 100, 150 and 200 nm (slowest), theta 45 and 50 degrees. */
    private static final String SIX_POINTS = """
            sweep:
              parameters:
                gap: {from: 100 nm, to: 200 nm, count: 3}
                theta: [45 deg, 50 deg]
            """;

    /** Longest wait for the child to finish reading the sweep (a JVM start and six case readings). */
    static final long START_TIMEOUT_S = 60;
    /** Longest wait for an uninterrupted child sweep (six points of well under a second). */
    static final long RUN_TIMEOUT_S = 120;

    @TempDir
    Path tmp;

    @Test
    void killedAndRerunGivesTheUninterruptedTable() throws IOException, InterruptedException {
        long seed = Long.getLong("sweep.kill.seed", System.nanoTime() % 100_000);
        System.out.println("SweepKillTest: seed " + seed + " (rerun with -Dsweep.kill.seed=" + seed + ")");
        Random random = new Random(seed);
        Path c = SweepCases.write(tmp, "gap.yaml", SweepCases.gapCase(SIX_POINTS));

        // the uninterrupted sweep, in a child like the killed ones: its duration is the range of the kill times
        Path reference = tmp.resolve("reference");
        Process whole = child(c, reference, tmp.resolve("reference.log"));
        double seconds;
        try {
            long t0 = awaitStart(whole, tmp.resolve("reference.log"));
            assertTrue(whole.waitFor(RUN_TIMEOUT_S, TimeUnit.SECONDS), "the uninterrupted sweep ends");
            seconds = (System.nanoTime() - t0) * 1e-9;
            assertEquals(0, whole.exitValue(), Files.readString(tmp.resolve("reference.log")));
        } finally {
            whole.destroyForcibly();
        }
        byte[] expected = Files.readAllBytes(reference.resolve("sweep.csv"));

        for (int round = 1; round <= 2; round++) {
            Path killed = tmp.resolve("killed" + round);
            double delay = random.nextDouble() * seconds;
            Path log = tmp.resolve("child" + round + ".log");
            Process p = child(c, killed, log);
            try {
                awaitStart(p, log);
                Thread.sleep((long) (delay * 1000));
                boolean alive = p.isAlive();
                p.destroyForcibly();
                assertTrue(p.waitFor(30, TimeUnit.SECONDS), "the child ends when killed");
                System.out.printf(Locale.ROOT, "SweepKillTest: round %d: killed %.2f s into a sweep of %.2f s%s; left: %s%n",
                        round, delay, seconds, alive ? "" : " (it had finished already)", listing(killed));
            } finally {
                p.destroyForcibly();
            }
            SweepCases.Outcome rerun = SweepCases.ok("sweep", c.toString(), "--out", killed.toString());
            assertArrayEquals(expected, Files.readAllBytes(killed.resolve("sweep.csv")),
                    "round " + round + ": the re-run's table against the uninterrupted sweep's (seed " + seed + ")\n" + rerun);
            assertEquals(List.of(), SweepCases.hidden(killed), "round " + round + ": no temporary folders or files remain (seed "
                    + seed + ")");
            // issue 13: inside the points too, only what a finished run writes (its contents list is the one hidden file)
            for (String point : killed.toFile().list((d, n) -> n.startsWith("point-"))) {
                assertEquals(List.of(org.evanesce.io.output.FolderContents.NAME), SweepCases.hidden(killed.resolve(point)),
                        "round " + round + ": " + point);
            }
        }
    }

    /** The sweep in a child JVM with this JVM's java, modules and class path; its output goes to {@code log}. */
    private static Process child(Path caseFile, Path out, Path log) throws IOException {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "--add-modules", "jdk.incubator.vector", "-Djava.awt.headless=true", "-cp", System.getProperty("java.class.path"),
                "org.evanesce.io.Main", "sweep", caseFile.toString(), "--out", out.toString()));
        return new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(log.toFile()).start();
    }

    /**
     * Waits until the child has read every point and starts running them ("sweep of ..."), and returns
     * that moment ({@link System#nanoTime()}).
     */
    private static long awaitStart(Process p, Path log) throws IOException, InterruptedException {
        long end = System.nanoTime() + START_TIMEOUT_S * 1_000_000_000L;
        while (System.nanoTime() < end) {
            if (Files.exists(log) && Files.readString(log).contains("sweep of ")) {
                return System.nanoTime();
            }
            if (!p.isAlive()) {
                throw new AssertionError("the child sweep ended before it started:\n" + Files.readString(log));
            }
            Thread.sleep(10);
        }
        throw new AssertionError("the child sweep did not start within " + START_TIMEOUT_S + " s:\n" + Files.readString(log));
    }

    private static String listing(Path dir) throws IOException {
        if (!Files.isDirectory(dir)) {
            return "nothing";
        }
        try (var s = Files.list(dir)) {
            return String.join(" ", s.map(p -> p.getFileName().toString()).sorted().toList());
        }
    }
}
