package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A sweep whose points stop after different numbers of steps: each point's incident-power run continues a state the
 * points before kept (same set-up, fewer steps) instead of starting at step 0, and every point's flux table is still
 * byte for byte that of an independent run of the point (no reuse at all), whatever order the points run in (common
 * practice: a cache must not change a result).
 */
class SweepIncidentContinuationTest {

    @TempDir
    Path tmp;

    /** The run's length is the swept parameter; the set-up of the incident-power run stays the same. */
    private static final String LENGTHS = """
            sweep:
              parameters:
                dur: [150 fs, 260 fs, 210 fs, 100 fs]
            """;

    @Test
    void pointsOfOtherLengthsContinueTheIncidentPowerRunAndMatchIndependentRuns() throws IOException {
        String text = SweepCases.gapCase(LENGTHS).replace("until: {energy_below: 1e-6, latest: 400 fs}", "until: {time: dur}")
                .replace("  theta: 45 deg\n", "  theta: 45 deg\n  dur: 200 fs\n")
                .replace("  transfer_matrix: true\n", "  transfer_matrix: true\n  incident_run: strip\n");
        assertTrue(text.contains("until: {time: dur}") && text.contains("dur: 200 fs") && text.contains("incident_run: strip"), text);
        Path c = SweepCases.write(tmp, "timed.yaml", text);
        Path one = tmp.resolve("one");
        SweepCases.Outcome o = SweepCases.ok("sweep", c.toString(), "--out", one.toString(), "--parallel", "1");
        assertTrue(o.out().contains("continuing from step "), "a later point continues an earlier one's state:\n" + o);
        Path two = tmp.resolve("two");
        SweepCases.ok("sweep", c.toString(), "--out", two.toString(), "--parallel", "2");
        assertArrayEquals(Files.readAllBytes(one.resolve("sweep.csv")), Files.readAllBytes(two.resolve("sweep.csv")),
                "one point at a time against two at once");
        String[] lengths = {"150 fs", "260 fs", "210 fs", "100 fs"};
        for (int p = 0; p < lengths.length; p++) {
            Path alone = tmp.resolve("alone" + p);
            SweepCases.ok("run", c.toString(), "--out", alone.toString(), "--set", "dur=" + lengths[p]);
            Path point = one.resolve(String.format("point-%04d", p));
            assertArrayEquals(Files.readAllBytes(alone.resolve("flux.csv")), Files.readAllBytes(point.resolve("flux.csv")),
                    "point " + p + " (dur=" + lengths[p] + ") against evanesce run --set dur=" + lengths[p]);
        }
    }
}
