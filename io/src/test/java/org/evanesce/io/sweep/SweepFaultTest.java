package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.io.output.SafeFiles;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 13: a sweep point that fails on a fault (here a simulated full disk while its flux.csv is
 * written) is reported as failed with one sentence naming the file and the cause, the sweep goes on
 * with the other points and merges them, exits 3, and leaves no temporaries; running it again
 * computes only the failed point. A sweep folder that is not one (foreign files, no sweep.json) or the
 * case's own folder is refused before anything runs.
 */
class SweepFaultTest {

    @TempDir
    Path tmp;

    @Test
    void aPointThatHitsAFullDiskFailsAndTheOthersGoOn() throws IOException {
        Path c = SweepCases.write(tmp, "gap.yaml", SweepCases.gapCase(SweepCases.FOUR_POINTS));
        Path out = tmp.resolve("out");
        System.setProperty(SafeFiles.NO_SPACE_PROPERTY, "/\\.point-0002\\.partial-[^/]*/flux\\.csv$");
        SweepCases.Outcome o;
        try {
            o = SweepCases.run("sweep", c.toString(), "--out", out.toString(), "--parallel", "1");
        } finally {
            System.clearProperty(SafeFiles.NO_SPACE_PROPERTY);
        }
        assertEquals(ExitCode.RUN_FAILED, o.code(), o::toString);
        assertTrue(o.out().contains("point 2 (") && o.out().contains(out.resolve("point-0002").resolve("flux.csv")
                + ": no space left on the device"), o::toString);
        assertTrue(o.err().contains("1 point(s) failed: 2"), o::toString);
        assertTrue(o.out().contains("merged 3 of 4 points"), o::toString);
        for (int k : new int[] {0, 1, 3}) {
            assertTrue(Files.isRegularFile(out.resolve(String.format("point-%04d", k)).resolve("run.json")), "point " + k);
        }
        assertFalse(Files.exists(out.resolve("point-0002")));
        assertEquals(List.of(), SweepCases.hidden(out), "no temporaries");

        SweepCases.Outcome again = SweepCases.ok("sweep", c.toString(), "--out", out.toString());
        assertTrue(again.out().contains("3 finished already, 1 to run"), again.toString());
        assertTrue(again.out().contains("merged 4 of 4 points"), again.toString());
    }

    @Test
    void aFolderThatIsNotASweepIsRefused() throws IOException {
        Path c = SweepCases.write(tmp, "gap.yaml", SweepCases.gapCase(SweepCases.FOUR_POINTS));
        Path mine = Files.createDirectories(tmp.resolve("mine"));
        Files.writeString(mine.resolve("thesis.tex"), "mine");
        for (String dir : new String[] {mine.toString(), tmp.toString(), tmp.getParent().toString()}) {
            for (String mode : new String[] {"", "--merge-only", "--slurm-script"}) {
                List<String> args = new java.util.ArrayList<>(List.of("sweep", c.toString(), "--out", dir));
                if (!mode.isEmpty()) {
                    args.add(mode);
                }
                if (mode.equals("--slurm-script")) {
                    args.add("2");
                }
                SweepCases.Outcome o = SweepCases.run(args.toArray(new String[0]));
                assertEquals(ExitCode.USAGE, o.code(), () -> args + ": " + o);
                assertTrue(o.err().contains(dir), o::toString);
            }
        }
        assertEquals(List.of("thesis.tex"), List.of(mine.toFile().list()));
        assertEquals(List.of("gap.yaml", "mine"), java.util.Arrays.stream(tmp.toFile().list()).sorted().toList());
    }
}
