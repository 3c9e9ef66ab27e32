package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 13: the generated Slurm script stays correct for any path: every path is quoted (also in
 * {@code #SBATCH --output}), paths a batch script cannot hold are refused with exit 2 and nothing is
 * written, and {@code --threads} goes with a matching {@code --cpus-per-task}. bash itself parses the
 * script (bash -n) and prints the arguments a task would get.
 */
class SlurmScriptTest {

    @TempDir
    Path tmp;

    @Test
    void awkwardButLegalPathsAreQuotedSoThatBashSeesThemWhole() throws Exception {
        Path dir = tmp.resolve("my sweep's $HOME `x` ; (a)");
        Path launcher = tmp.resolve("bin dir").resolve("evanesce");
        Path c = tmp.resolve("case 'one'.yaml");
        assertNull(SlurmScript.problem(launcher, c, dir, List.of("--set", "gap=100 nm")));
        String text = SlurmScript.text(launcher, c, dir, 3, 9, SlurmScript.extraArguments(4, java.util.Map.of("gap", "100 nm")),
                "evanesce-x");
        assertTrue(text.contains("#SBATCH --output=\"" + dir + "/slurm-%A_%a.out\"\n"), text);
        assertTrue(text.contains("#SBATCH --cpus-per-task=4\n") && text.contains(" --threads 4 "), text);
        // bash parses it; with echo as the launcher the task's arguments come out one per line
        Path script = Files.writeString(tmp.resolve("s.sh"), text.replace(SlurmScript.quote(launcher.toString()), "printf '%s\\n'"));
        ProcessBuilder pb = new ProcessBuilder("bash", script.toString()).redirectErrorStream(true);
        pb.environment().put("SLURM_ARRAY_TASK_ID", "1");
        Process p = pb.start();
        p.getOutputStream().close();
        String got;
        try {
            got = new String(p.getInputStream().readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
        } finally {
            p.waitFor(30, TimeUnit.SECONDS);
        }
        assertEquals(List.of("sweep", c.toString(), "--out", dir.toString(), "--threads", "4", "--set", "gap=100 nm", "--shard",
                "1/3"), got.lines().toList(), "bash runs task 1 with exactly these arguments\n" + text);
    }

    @Test
    void theMergeCommandKeepsThePlotWavelengthThatTheTasksDoNotTake() {
        Path launcher = tmp.resolve("evanesce");
        String text = SlurmScript.text(launcher, tmp.resolve("c.yaml"), tmp.resolve("d"), 2, 4, List.of(), "evanesce-c",
                List.of("--plot-wavelength", "640nm"));
        String merge = text.lines().filter(l -> l.contains("--merge-only")).findFirst().orElseThrow();
        assertTrue(merge.endsWith(" --merge-only --plot-wavelength 640nm"), text);
        String task = text.lines().filter(l -> l.contains("--shard")).findFirst().orElseThrow();
        assertTrue(!task.contains("--plot-wavelength"), text);
    }

    @Test
    void pathsAScriptCannotHoldAreRefused() throws IOException {
        Path launcher = tmp.resolve("evanesce");
        Path c = tmp.resolve("c.yaml");
        assertTrue(SlurmScript.problem(launcher, c, tmp.resolve("a\nb"), List.of()).contains("line break"));
        assertTrue(SlurmScript.problem(launcher, tmp.resolve("c\r.yaml"), tmp.resolve("d"), List.of()).contains("line break"));
        assertTrue(SlurmScript.problem(launcher, c, tmp.resolve("50%"), List.of()).contains("'%'"));
        assertTrue(SlurmScript.problem(launcher, c, tmp.resolve("say \"hi\""), List.of()).contains("'\"'"));
        assertTrue(SlurmScript.problem(launcher, c, tmp.resolve("d"), List.of("--set", "a=1\nrm -rf ~")).contains("line break"));
        assertTrue(SlurmScript.problem(launcher, c, tmp.resolve("t\tab"), List.of()).contains("U+0009"));

        Path cf = SweepCases.write(tmp, "gap.yaml", SweepCases.gapCase(SweepCases.FOUR_POINTS));
        Path bad = tmp.resolve("out\nx");
        SweepCases.Outcome o = SweepCases.run("sweep", cf.toString(), "--out", bad.toString(), "--slurm-script", "2");
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("line break"), o::toString);
        assertEquals(List.of("gap.yaml"), List.of(tmp.toFile().list()), "nothing written");
    }
}
