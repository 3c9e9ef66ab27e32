package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code evanesce sweep} end to end on a four-point plane-wave gap sweep: the merged table holds exactly
 * the flux values of independent {@code evanesce run --set ...} runs of the same points, whatever the
 * number of points run at once; a re-run runs only the points whose folder is missing or holds another
 * point's results (checked by hash); a changed case is refused, naming the change, until {@code --restart}.
 */
class SweepRunTest {

    @TempDir
    Path tmp;

    /** The four points' overrides, in point order (gap slowest). */
    private static final List<Map<String, String>> POINTS = List.of(
            Map.of("gap", "100 nm", "theta", "45 deg"), Map.of("gap", "100 nm", "theta", "50 deg"),
            Map.of("gap", "200 nm", "theta", "45 deg"), Map.of("gap", "200 nm", "theta", "50 deg"));

    private Path sweep(Path caseFile, String name, String... extra) {
        Path out = tmp.resolve(name);
        String[] args = new String[4 + extra.length];
        args[0] = "sweep";
        args[1] = caseFile.toString();
        args[2] = "--out";
        args[3] = out.toString();
        System.arraycopy(extra, 0, args, 4, extra.length);
        SweepCases.ok(args);
        return out;
    }

    @Test
    void mergedFluxEqualsIndependentRunsWhateverRunsAtOnce() throws IOException {
        Path c = SweepCases.write(tmp, "gap.yaml", SweepCases.gapCase(SweepCases.FOUR_POINTS));
        Path two = sweep(c, "two", "--parallel", "2");
        Path one = sweep(c, "one", "--parallel", "1", "--threads", "2");
        byte[] csv = Files.readAllBytes(two.resolve("sweep.csv"));
        assertArrayEquals(csv, Files.readAllBytes(one.resolve("sweep.csv")), "two points at once against one at a time");
        assertTrue(Files.size(two.resolve("sweep.png")) > 1000, "sweep.png is written");

        List<String> rows = Files.readAllLines(two.resolve("sweep.csv"));
        String fluxHeader = null;
        int row = 1;
        for (int p = 0; p < POINTS.size(); p++) {
            // an independent run of the same point, without the sweep
            Path out = tmp.resolve("plain" + p);
            Map<String, String> set = POINTS.get(p);
            SweepCases.ok("run", c.toString(), "--out", out.toString(), "--set", "gap=" + set.get("gap"), "--set",
                    "theta=" + set.get("theta"));
            List<String> flux = Files.readAllLines(out.resolve("flux.csv"));
            fluxHeader = flux.get(0);
            for (String line : flux.subList(1, flux.size())) {
                String lead = String.format("%d,%s,%s,%s,%s,", p, set.get("gap"), p < 2 ? "1.000000000000e-07" : "2.000000000000e-07",
                        set.get("theta"), p % 2 == 0 ? "7.853981633974e-01" : "8.726646259972e-01");
                // the run settled (its run.json says so), the last column
                assertEquals(lead + line + ",true", rows.get(row), "point " + p + " against evanesce run --set gap=" + set.get("gap")
                        + " --set theta=" + set.get("theta"));
                row++;
            }
        }
        assertEquals(row, rows.size(), "one row per point and wavelength");
        assertEquals("point,gap,gap_si,theta,theta_si," + fluxHeader + ",settled", rows.get(0));
        assertEquals(List.of(), SweepCases.hidden(two), "no temporaries are left");
        for (int p = 0; p < 4; p++) {
            Path pf = two.resolve(String.format("point-%04d", p));
            assertTrue(Files.isRegularFile(pf.resolve("run.json")) && Files.isRegularFile(pf.resolve("point.json")), pf.toString());
        }
    }

    @Test
    void resumeRunsOnlyMissingAndMismatchedPointsAndRefusesAChangedCase() throws IOException {
        String text = SweepCases.gapCase(SweepCases.FOUR_POINTS);
        Path c = SweepCases.write(tmp, "gap.yaml", text);
        Path out = sweep(c, "out");
        byte[] csv = Files.readAllBytes(out.resolve("sweep.csv"));
        Map<Integer, FileTime> times = new HashMap<>();
        Map<Integer, String> runJson = new HashMap<>();
        for (int p = 0; p < 4; p++) {
            Path f = out.resolve(String.format("point-%04d/run.json", p));
            times.put(p, Files.getLastModifiedTime(f));
            runJson.put(p, Files.readString(f));
        }
        // point 1's folder is gone; point 2's folder holds another point's results (by hash), whatever its name
        SweepFolder.deleteTree(out.resolve("point-0001"));
        Path p2 = out.resolve("point-0002/point.json");
        Files.writeString(p2, Files.readString(p2).replaceAll("\"point_hash\": \"[0-9a-f]+\"", "\"point_hash\": \"" + "0".repeat(64)
                + "\""));

        SweepCases.Outcome again = SweepCases.ok("sweep", c.toString(), "--out", out.toString());
        assertTrue(again.out().contains("2 finished already, 2 to run"), again.toString());
        assertTrue(again.out().contains("point 1 (gap=100 nm, theta=50 deg) finished"), again.toString());
        assertTrue(again.out().contains("point 2 (gap=200 nm, theta=45 deg) finished"), again.toString());
        for (int p : new int[] {0, 3}) {
            Path f = out.resolve(String.format("point-%04d/run.json", p));
            assertEquals(times.get(p), Files.getLastModifiedTime(f), "point " + p + " was not run again");
            assertEquals(runJson.get(p), Files.readString(f), "point " + p + " was not run again");
        }
        assertNotEquals(runJson.get(2), Files.readString(out.resolve("point-0002/run.json")), "point 2 ran again (new wall time)");
        assertArrayEquals(csv, Files.readAllBytes(out.resolve("sweep.csv")), "the merged table is the same, byte for byte");
        assertTrue(SweepCases.ok("sweep", c.toString(), "--out", out.toString()).out().contains("4 finished already, 0 to run"));

        // a change outside the sweep section: refused, nothing touched
        SweepCases.write(tmp, "gap.yaml", text.replace("title: vacuum gap", "title: the vacuum gap"));
        SweepCases.Outcome changed = SweepCases.run("sweep", c.toString(), "--out", out.toString());
        assertEquals(2, changed.code(), changed.toString());
        assertTrue(changed.err().contains("the sweep in this folder was made from a different case: the case file changed outside "
                + "its sweep section (SHA-256 "), changed.toString());
        assertTrue(changed.err().contains("Run with --restart"), changed.toString());
        // a change of the sweep: named
        SweepCases.write(tmp, "gap.yaml", text.replace("theta: [45 deg, 50 deg]", "theta: [45 deg, 55 deg]"));
        changed = SweepCases.run("sweep", c.toString(), "--out", out.toString());
        assertEquals(2, changed.code(), changed.toString());
        assertTrue(changed.err().contains("parameter theta was [45 deg, 50 deg], now [45 deg, 55 deg]"), changed.toString());
        assertEquals(runJson.get(0), Files.readString(out.resolve("point-0000/run.json")), "a refused sweep touches nothing");

        // --restart: every point runs again (the case changed), each folder replaced when its new run is done
        SweepCases.Outcome restarted = SweepCases.ok("sweep", c.toString(), "--out", out.toString(), "--restart");
        assertTrue(restarted.out().contains("0 finished already, 4 to run"), restarted.toString());
        List<String> rows = Files.readAllLines(out.resolve("sweep.csv"));
        assertEquals(9, rows.size());
        assertTrue(rows.get(3).startsWith("1,100 nm,1.000000000000e-07,55 deg,9.599310885969e-01,633.000000,"), rows.get(3));
        assertTrue(SweepCases.ok("sweep", c.toString(), "--out", out.toString()).out().contains("4 finished already, 0 to run"));
        assertEquals(List.of(), SweepCases.hidden(out));
    }

    @Test
    void aCaseWithoutFluxOrMapsGivesStepsWallTimeAndStopReason() throws IOException {
        Path c = SweepCases.write(tmp, "tiny.yaml", """
                parameters:
                  wl: 633 nm
                polarization: s
                domain: {width: 2 um, height: 2 um}
                grid: {cell: 40 nm}
                sources:
                  - point: {at: [0, 0], signal: {pulse: {wavelength: wl, bandwidth: 100 nm}}}
                until: {steps: 40}
                sweep:
                  parameters:
                    wl: [600 nm, "max(633 nm, 640 nm)"]
                """);
        Path out = sweep(c, "out");
        List<String> rows = Files.readAllLines(out.resolve("sweep.csv"));
        assertEquals("point,wl,wl_si,steps,wall_time_s,stop_reason,settled", rows.get(0));
        assertEquals(3, rows.size());
        // a fixed-length run without flux or maps is not judged: settled is empty
        assertTrue(rows.get(1).matches("0,600 nm,6\\.000000000000e-07,40,[0-9.]+,ran the requested 40 steps,"), rows.get(1));
        assertTrue(rows.get(2).matches("1,\"max\\(633 nm, 640 nm\\)\",6\\.400000000000e-07,40,[0-9.]+,ran the requested 40 steps,"),
                rows.get(2));
        assertFalse(Files.exists(out.resolve("sweep.png")), "nothing to plot");
    }

    @Test
    void aPointThatDivergesFailsAloneAndIsRetriedByTheNextRun() throws IOException {
        // the point with sigma = 5e3 S/m is made to diverge through the runner's seam (gain, which diverged by
        // itself, is refused by the reader now); the others are ordinary blocks
        String text = """
                parameters:
                  sigma: 0 S/m
                design_wavelength: 633 nm
                polarization: s
                domain: {width: 2 um, height: 2 um}
                grid: {cell: 35 nm}
                materials:
                  block: {index: 1.5, conductivity: sigma}
                shapes:
                  - rectangle: {centre: [0, 0], size: [1 um, 1 um], material: block}
                sources:
                  - point: {at: [0, 0], signal: {pulse: {wavelength: 633 nm, bandwidth: 100 nm}}}
                until: {steps: 2000}
                sweep:
                  parameters:
                    sigma: [0 S/m, 5e3 S/m, 1e3 S/m]
                """;
        Path c = SweepCases.write(tmp, "gain.yaml", text);
        Path out = tmp.resolve("out");
        org.evanesce.io.run.CaseRunner.divergenceLimitForTests = plan ->
                plan.spec().parameters().get("sigma").value().value() == 5e3 ? 1e-30 : Double.NaN;
        try {
            diverging(c, out);
        } finally {
            org.evanesce.io.run.CaseRunner.divergenceLimitForTests = plan -> Double.NaN;
        }
    }

    private static void diverging(Path c, Path out) throws IOException {
        SweepCases.Outcome o = SweepCases.run("sweep", c.toString(), "--out", out.toString());
        assertEquals(3, o.code(), o.toString());
        assertTrue(o.out().contains("point 1 (sigma=5e3 S/m) failed: "), o.toString());
        assertTrue(o.err().contains("1 point(s) failed: 1 (see above); the others are kept"), o.toString());
        List<String> rows = Files.readAllLines(out.resolve("sweep.csv"));
        assertEquals(List.of("0", "2"), rows.subList(1, rows.size()).stream().map(r -> r.substring(0, r.indexOf(','))).toList());
        assertFalse(Files.exists(out.resolve("point-0001")));
        assertEquals(List.of(), SweepCases.hidden(out));
        SweepCases.Outcome again = SweepCases.run("sweep", c.toString(), "--out", out.toString());
        assertEquals(3, again.code(), again.toString());
        assertTrue(again.out().contains("2 finished already, 1 to run"), again.toString());
    }
}
