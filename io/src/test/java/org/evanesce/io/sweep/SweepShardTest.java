package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Sharded sweeps: two shards and {@code --merge-only} give the unsharded sweep's table byte for byte,
 * a merge with a shard missing exits 3 naming the missing points, and the Slurm array script's command
 * line, run here for each task (no Slurm: the task id is substituted by the test), does the same.
 */
class SweepShardTest {

    /** Five points: gap 100, 125, ..., 200 nm at 45 degrees. */
    private static final String FIVE_POINTS = """
            sweep:
              parameters:
                gap: {from: 100 nm, to: 200 nm, count: 5}
                theta: [45 deg]
            """;

    @TempDir
    Path tmp;

    @Test
    void shardsThenMergeEqualTheUnshardedSweepAndSlurmTasksToo() throws IOException {
        Path c = SweepCases.write(tmp, "gap.yaml", SweepCases.gapCase(FIVE_POINTS));
        Path whole = tmp.resolve("whole");
        SweepCases.ok("sweep", c.toString(), "--out", whole.toString());
        byte[] reference = Files.readAllBytes(whole.resolve("sweep.csv"));
        assertEquals(1 + 5 * 2, Files.readAllLines(whole.resolve("sweep.csv")).size());

        // shard 0 of 2 runs points 0, 2 and 4 only
        Path sharded = tmp.resolve("sharded");
        SweepCases.Outcome first = SweepCases.ok("sweep", c.toString(), "--out", sharded.toString(), "--shard", "0/2");
        assertTrue(first.out().contains("shard 0/2 has 3; 0 finished already, 3 to run"), first.toString());
        assertTrue(first.out().contains("merge with:"), first.toString());
        assertFalse(Files.exists(sharded.resolve("sweep.csv")), "a shard merges only a complete sweep");
        // the points' shared incident-power result (one set-up: only the gap changes) is kept beside them
        List<String> kept = names(sharded);
        assertEquals(1, kept.stream().filter(org.evanesce.io.run.IncidentPowerCache::isCacheFile).count(), kept.toString());
        assertEquals(List.of("point-0000", "point-0002", "point-0004", "sweep.json"),
                kept.stream().filter(n -> !org.evanesce.io.run.IncidentPowerCache.isCacheFile(n)).toList());

        SweepCases.Outcome partial = SweepCases.run("sweep", c.toString(), "--out", sharded.toString(), "--merge-only");
        assertEquals(3, partial.code(), partial.toString());
        assertTrue(partial.err().contains("2 of 5 points are missing (not finished, or computed from another case): 1, 3."),
                partial.toString());
        assertEquals(1 + 3 * 2, Files.readAllLines(sharded.resolve("sweep.csv")).size(), "the finished points are merged");

        SweepCases.Outcome second = SweepCases.ok("sweep", c.toString(), "--out", sharded.toString(), "--shard", "1/2");
        // the other shard (another process, as on a cluster) reads the first one's incident-power result
        assertTrue(second.out().contains("incident power reused") && !second.out().contains("incident-power run took"),
                second.toString());
        SweepCases.Outcome merged = SweepCases.ok("sweep", c.toString(), "--out", sharded.toString(), "--merge-only");
        assertTrue(merged.out().contains("merged 5 of 5 points"), merged.toString());
        assertArrayEquals(reference, Files.readAllBytes(sharded.resolve("sweep.csv")), "two shards + merge = the whole sweep");

        // the Slurm script: four array tasks
        Path slurmDir = tmp.resolve("slurm");
        SweepCases.Outcome wrote = SweepCases.ok("sweep", c.toString(), "--out", slurmDir.toString(), "--slurm-script", "4");
        Path script = slurmDir.resolve("sweep.slurm");
        String text = Files.readString(script);
        Path launcher = Path.of("..", "evanesce").toAbsolutePath().normalize();
        assertTrue(text.startsWith("#!/bin/bash\n"), text);
        assertTrue(text.contains("\n#SBATCH --array=0-3\n"), text);
        assertTrue(text.contains("\n#SBATCH --job-name=evanesce-gap\n"), text);
        assertTrue(text.contains("\n#SBATCH --output=\"" + slurmDir.toAbsolutePath() + "/slurm-%A_%a.out\"\n"), text);
        String command = text.lines().filter(l -> l.contains("SLURM_ARRAY_TASK_ID")).reduce((a, b) -> b).orElseThrow();
        assertEquals(launcher + " sweep " + c.toAbsolutePath() + " --out " + slurmDir.toAbsolutePath()
                + " --shard \"$SLURM_ARRAY_TASK_ID/4\"", command, "the launcher beside the program, absolute paths");
        assertTrue(Files.isExecutable(script), "the script can be run");
        assertTrue(wrote.out().contains("submit:  sbatch " + script.toAbsolutePath()), wrote.toString());
        String mergeLine = wrote.out().lines().filter(l -> l.startsWith("merge:")).findFirst().orElseThrow();
        assertFalse(Files.exists(slurmDir.resolve("point-0000")), "writing the script runs nothing");

        for (int task = 0; task < 4; task++) {
            List<String> words = shellWords(command.replace("$SLURM_ARRAY_TASK_ID", Integer.toString(task)));
            assertEquals(launcher.toString(), words.get(0));
            SweepCases.ok(words.subList(1, words.size()).toArray(new String[0]));
        }
        List<String> merge = shellWords(mergeLine.substring("merge:".length()).strip());
        assertEquals("--merge-only", merge.get(merge.size() - 1));
        SweepCases.ok(merge.subList(1, merge.size()).toArray(new String[0]));
        assertArrayEquals(reference, Files.readAllBytes(slurmDir.resolve("sweep.csv")), "four Slurm tasks + merge = the whole sweep");
        assertEquals(List.of(), SweepCases.hidden(slurmDir));
    }

    @Test
    void launcherAndOptionsAreChecked() throws IOException {
        Path c = SweepCases.write(tmp, "gap case.yaml", SweepCases.gapCase("sweep:\n  parameters:\n    gap: [100 nm, 200 nm]\n"));
        Path launcher = SweepCases.write(tmp, "my launcher", "#!/bin/sh\n");
        Path out = tmp.resolve("out dir");
        SweepCases.ok("sweep", c.toString(), "--out", out.toString(), "--slurm-script", "2", "--launcher", launcher.toString(),
                "--threads", "8", "--set", "theta=50 deg");
        String text = Files.readString(out.resolve("sweep.slurm"));
        assertTrue(text.contains("\n#SBATCH --cpus-per-task=8\n"), text);
        assertTrue(text.contains("'" + launcher.toAbsolutePath() + "' sweep '" + c.toAbsolutePath() + "' --out '" + out.toAbsolutePath()
                + "' --threads 8 --set 'theta=50 deg' --shard \"$SLURM_ARRAY_TASK_ID/2\"\n"), text);
        assertEquals(2, SweepCases.run("sweep", c.toString(), "--shard", "2/2").code(), "shard number out of range");
        assertEquals(2, SweepCases.run("sweep", c.toString(), "--shard", "1").code(), "shard without N");
        assertEquals(2, SweepCases.run("sweep", c.toString(), "--merge-only", "--shard", "0/2").code());
        assertEquals(2, SweepCases.run("sweep", c.toString(), "--parallel", "0").code());
        assertEquals(2, SweepCases.run("sweep", c.toString(), "--slurm-script", "0").code());
        SweepCases.Outcome missing = SweepCases.run("sweep", c.toString(), "--out", tmp.resolve("other").toString(), "--slurm-script", "2",
                "--launcher", tmp.resolve("nowhere").toString());
        assertEquals(2, missing.code(), missing.toString());
        assertTrue(missing.err().contains("--launcher " + tmp.resolve("nowhere") + ": no such file"), missing.toString());
    }

    private static List<String> names(Path dir) throws IOException {
        try (var s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    /** Splits a command line as the shell would for the quoting the script uses: '...' (with '\'' inside) and "...". */
    static List<String> shellWords(String line) {
        List<String> out = new ArrayList<>();
        StringBuilder w = new StringBuilder();
        boolean inWord = false;
        for (int k = 0; k < line.length(); k++) {
            char ch = line.charAt(k);
            if (ch == '\'') {
                int end = line.indexOf('\'', k + 1);
                w.append(line, k + 1, end);
                k = end;
                inWord = true;
            } else if (ch == '"') {
                int end = line.indexOf('"', k + 1);
                w.append(line, k + 1, end);
                k = end;
                inWord = true;
            } else if (ch == '\\' && k + 1 < line.length()) {
                w.append(line.charAt(++k));
                inWord = true;
            } else if (Character.isWhitespace(ch)) {
                if (inWord) {
                    out.add(w.toString());
                    w.setLength(0);
                    inWord = false;
                }
            } else {
                w.append(ch);
                inWord = true;
            }
        }
        if (inWord) {
            out.add(w.toString());
        }
        return out;
    }
}
