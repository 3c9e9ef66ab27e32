package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.model.SweepSpec;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The sweep section becomes points in the documented order and count, ranges take the values
 * computed here independently, and bad input is refused with exit code 2 at file:line:column with the
 * key path, before anything runs or is written.
 */
class SweepExpansionTest {

    /**
     * Two range values and the value computed here differ by the 12 significant digits a range's
     * values are written with (relative 5e-13) plus a few roundings of the evaluation.
     */
    static final double RANGE_TOLERANCE = 1e-11;

    private static final ReadOptions ENOUGH_MEMORY = new ReadOptions(1L << 34);

    /** A valid case with a sweep (lines numbered from 1; the sweep starts on line 11). */
    private static final String BASE = """
            parameters:
              gap: 100 nm
              theta: 45 deg
              loss: 0.01
            polarization: s
            domain: {width: 4 um, height: 3 um}
            grid: {cell: 20 nm}
            sources:
              - point: {at: [0, 0], signal: {pulse: {wavelength: 633 nm, bandwidth: 40 nm}}}
            until: {time: 100 fs}
            sweep:
              parameters:
                gap: {from: 100 nm, to: 300 nm, count: 5}
                theta: [40 deg, 45 deg, 50 deg]
                loss: {from: 1e-3, to: 1, count: 4, spacing: log}
              combine: product
            """;

    @TempDir
    Path tmp;

    private static CaseSpec read(String text, Map<String, String> overrides) throws CaseFileException {
        return CaseLoader.parse(text, "case.yaml", overrides, ENOUGH_MEMORY).spec();
    }

    private static String replace(String what, String with) {
        assertTrue(BASE.contains(what), what);
        return BASE.replace(what, with);
    }

    /** The SI value of a parameter after the point's overrides, read as the sweep reads it. */
    private static double valueAt(String text, SweepPoint p, String name) throws CaseFileException {
        return read(text, p.overrides()).parameters().get(name).value().value();
    }

    @Test
    void productVariesTheFirstParameterSlowest() throws CaseFileException {
        SweepSpec s = read(BASE, Map.of()).sweep().orElseThrow();
        assertEquals(SweepSpec.Combine.PRODUCT, s.combine());
        List<SweepPoint> pts = SweepPoint.expand(s);
        assertEquals(5 * 3 * 4, pts.size());
        assertEquals(60, s.pointCount());
        List<String> expectedFirst = List.of("100 nm", "40 deg", "0.001");
        assertEquals(expectedFirst, pts.get(0).texts());
        assertEquals(List.of("100 nm", "40 deg", "0.01"), pts.get(1).texts(), "the last parameter varies fastest");
        assertEquals(List.of("100 nm", "45 deg", "0.001"), pts.get(4).texts());
        assertEquals(List.of("150 nm", "40 deg", "0.001"), pts.get(12).texts());
        assertEquals(List.of("300 nm", "50 deg", "1"), pts.get(59).texts());
        for (int k = 0; k < pts.size(); k++) {
            assertEquals(k, pts.get(k).number());
            // point k = (g, t, l) with k = (g*3 + t)*4 + l
            int g = k / 12;
            int t = k / 4 % 3;
            int l = k % 4;
            assertEquals(s.parameters().get(0).values().get(g), pts.get(k).texts().get(0), "point " + k);
            assertEquals(s.parameters().get(1).values().get(t), pts.get(k).texts().get(1), "point " + k);
            assertEquals(s.parameters().get(2).values().get(l), pts.get(k).texts().get(2), "point " + k);
        }
        assertEquals("gap=100 nm, theta=40 deg, loss=0.001", pts.get(0).describe());
        assertEquals("point-0059", pts.get(59).folderName());
    }

    @Test
    void zipPairsTheNthValues() throws CaseFileException {
        String text = replace("theta: [40 deg, 45 deg, 50 deg]", "theta: [40 deg, 45 deg, 50 deg, 55 deg, 60 deg]")
                .replace("count: 4, spacing: log", "count: 5, spacing: log").replace("combine: product", "combine: zip");
        SweepSpec s = read(text, Map.of()).sweep().orElseThrow();
        List<SweepPoint> pts = SweepPoint.expand(s);
        assertEquals(5, pts.size());
        for (int k = 0; k < 5; k++) {
            assertEquals(List.of(s.parameters().get(0).values().get(k), s.parameters().get(1).values().get(k),
                    s.parameters().get(2).values().get(k)), pts.get(k).texts());
        }
        assertEquals(List.of("200 nm", "50 deg", "0.0316227766017"), pts.get(2).texts());
    }

    @Test
    void linearAndLogRangesTakeTheValuesComputedHere() throws CaseFileException {
        String text = replace("loss: {from: 1e-3, to: 1, count: 4, spacing: log}", "loss: {from: -1, to: -100, count: 3, spacing: log}")
                .replace("gap: {from: 100 nm, to: 300 nm, count: 5}", "gap: {from: -0.35 um, to: 1.1 um, count: 7}");
        List<SweepPoint> pts = SweepPoint.expand(read(text, Map.of()).sweep().orElseThrow());
        assertEquals(7 * 3 * 3, pts.size());
        // linear: a + (b - a) k / (n - 1); log: a (b / a)^(k / (n - 1))
        for (int g = 0; g < 7; g++) {
            double expected = -0.35e-6 + (1.1e-6 - -0.35e-6) * g / 6;
            double got = valueAt(text, pts.get(g * 9), "gap");
            assertEquals(expected, got, RANGE_TOLERANCE * 1.1e-6, "gap value " + g + " (" + pts.get(g * 9).texts().get(0) + ")");
        }
        for (int l = 0; l < 3; l++) {
            double expected = -1 * Math.pow(100, l / 2.0);
            assertEquals(expected, valueAt(text, pts.get(l), "loss"), RANGE_TOLERANCE * Math.abs(expected), "loss value " + l);
        }
        String logText = BASE;
        List<SweepPoint> logPts = SweepPoint.expand(read(logText, Map.of()).sweep().orElseThrow());
        for (int l = 0; l < 4; l++) {
            double expected = 1e-3 * Math.pow(1 / 1e-3, l / 3.0);
            assertEquals(expected, valueAt(logText, logPts.get(l), "loss"), RANGE_TOLERANCE * expected, "log value " + l);
        }
        // the angle list is applied as written
        assertEquals(Math.toRadians(45), valueAt(BASE, SweepPoint.expand(read(BASE, Map.of()).sweep().orElseThrow()).get(4), "theta"),
                1e-15);
    }

    @Test
    void runAndCheckUseTheCaseAsWrittenAndSaySo() throws IOException {
        Path f = SweepCases.write(tmp, "case.yaml", BASE);
        SweepCases.Outcome c = SweepCases.ok("check", f.toString(), "--trial-seconds", "0", "--preview", tmp.resolve("p.png").toString());
        assertTrue(c.err().contains(f + ":11:1: note: sweep: 60 points (product of gap, theta, loss); this command uses the case "
                + "as written, 'evanesce sweep' runs the points\n"), c.toString());
        assertEquals(1, c.err().lines().filter(l -> l.contains("sweep")).count(), "one line about the sweep\n" + c);
    }

    /** Runs the sweep command on a broken case: exit 2, the expected message, nothing written. */
    private void refused(String text, String expected) throws IOException {
        Path f = SweepCases.write(tmp, "case.yaml", text);
        Path out = tmp.resolve("out");
        SweepCases.Outcome o = SweepCases.run("sweep", f.toString(), "--out", out.toString());
        assertEquals(2, o.code(), o.toString());
        String line = expected.replace("FILE", f.toString());
        assertTrue(o.err().lines().anyMatch(line::equals), "expected the line\n" + line + "\n" + o);
        assertFalse(Files.exists(out), "nothing is written");
    }

    @Test
    void unknownParameter() throws IOException {
        refused(replace("    gap: {from", "    gapp: {from"), "FILE:13:5: sweep.parameters.gapp: the case has no parameter "
                + "'gapp' to sweep (did you mean 'gap'?); it defines gap, theta, loss");
    }

    @Test
    void wrongKind() throws IOException {
        refused(replace("[40 deg, 45 deg, 50 deg]", "[40, 45 deg]"),
                "FILE:14:13: sweep.parameters.theta[0]: 40 has no unit, expected an angle like the parameter theta (45 deg)");
        refused(replace("to: 300 nm", "to: 3 fs"),
                "FILE:13:29: sweep.parameters.gap.to: got 3 fs (a time), expected a length like the parameter gap (100 nm)");
    }

    @Test
    void zipOfUnequalLengths() throws IOException {
        refused(replace("combine: product", "combine: zip"), "FILE:16:12: sweep.combine: zip takes the n-th value of every "
                + "parameter, so all need the same number of values; gap has 5, theta has 3, loss has 4 (use product for every "
                + "combination)");
    }

    @Test
    void logRangeThroughZero() throws IOException {
        refused(replace("from: 1e-3", "from: -1e-3"), "FILE:15:51: sweep.parameters.loss.spacing: a logarithmic range needs "
                + "both ends non-zero and of the same sign, got from -0.001 to 1 (use spacing: linear, or move the ends)");
        refused(replace("from: 1e-3", "from: 0"), "FILE:15:47: sweep.parameters.loss.spacing: a logarithmic range needs "
                + "both ends non-zero and of the same sign, got from 0 to 1 (use spacing: linear, or move the ends)");
    }

    @Test
    void countBelowTwo() throws IOException {
        refused(replace("count: 5", "count: 1"), "FILE:13:44: sweep.parameters.gap.count: must be at least 2, got 1");
    }

    @Test
    void everyPointIsReadBeforeAnythingRuns() throws IOException {
        // the disk's radius is the swept gap: the first two points (-100 nm, 0) are not valid cases
        String text = replace("until: {time: 100 fs}", "shapes:\n  - disk: {centre: [0, 0], radius: gap, material: water}\nuntil: "
                + "{time: 100 fs}").replace("gap: {from: 100 nm, to: 300 nm, count: 5}", "gap: {from: -100 nm, to: 100 nm, count: 3}");
        Path f = SweepCases.write(tmp, "case.yaml", text);
        Path out = tmp.resolve("out");
        SweepCases.Outcome o = SweepCases.run("sweep", f.toString(), "--out", out.toString());
        assertEquals(2, o.code(), o.toString());
        List<String> lines = new ArrayList<>(o.err().lines().filter(l -> l.startsWith("point ")).toList());
        assertEquals("point 0 (gap=-100 nm, theta=40 deg, loss=0.001): " + f + ":11:36: shapes[0].disk.radius: must be positive, "
                + "got -100 nm", lines.get(0), o.toString());
        assertTrue(lines.stream().anyMatch(l -> l.startsWith("point 12 (gap=0 nm, theta=40 deg, loss=0.001): ")), o.toString());
        assertTrue(lines.stream().noneMatch(l -> l.startsWith("point 24 ")), "the third gap is valid\n" + o);
        assertTrue(o.err().contains("24 of 36 points of " + f + " have errors (the first 20 are shown); nothing was run or written"),
                o.toString());
        assertFalse(Files.exists(out), "nothing is written");
    }

    @Test
    void aSweptParameterCannotAlsoBeSet() throws IOException {
        Path f = SweepCases.write(tmp, "case.yaml", BASE);
        SweepCases.Outcome o = SweepCases.run("sweep", f.toString(), "--out", tmp.resolve("out").toString(), "--set", "gap=120 nm");
        assertEquals(2, o.code(), o.toString());
        assertTrue(o.err().contains("--set gap=120 nm: gap is swept (" + f + ":13); remove it from --set or from the sweep"),
                o.toString());
    }

    @Test
    void aCaseWithoutSweepIsRefused() throws IOException {
        Path f = SweepCases.write(tmp, "case.yaml", BASE.substring(0, BASE.indexOf("sweep:")));
        SweepCases.Outcome o = SweepCases.run("sweep", f.toString());
        assertEquals(2, o.code(), o.toString());
        assertTrue(o.err().contains(f + ": the case has no sweep section"), o.toString());
    }

    @Test
    void severalPointsRunAtOnceOnlyWhenAGridCannotUseEveryCore() {
        long memory = 1L << 34;
        // 765 cells: one thread is all the solver gives such a grid, so 16 cores run 16 points at once
        Parallelism small = Parallelism.choose(16, 765, 153, 765 * 56, memory, 40, null);
        assertEquals(16, small.parallel(), small.reason());
        assertEquals(1, small.threadsPerPoint());
        assertEquals(5, Parallelism.choose(16, 765, 153, 765 * 56, memory, 5, null).parallel(), "no more than the points");
        // 100 000 cells: three threads (one per 32768 cells), so five points share the 16 threads
        Parallelism medium = Parallelism.choose(16, 100_000, 400, 100_000 * 56, memory, 40, null);
        assertEquals(5, medium.parallel(), medium.reason());
        assertEquals(3, medium.threadsPerPoint());
        // a grid that uses every core runs alone
        Parallelism large = Parallelism.choose(16, 4_000_000, 2000, 4_000_000L * 56, memory, 40, null);
        assertEquals(1, large.parallel(), large.reason());
        assertEquals(16, large.threadsPerPoint());
        // memory bounds the points at once; --parallel decides instead
        assertEquals(3, Parallelism.choose(16, 765, 153, memory / 4, memory, 40, null).parallel(), "80 % of the heap, a quarter each");
        Parallelism forced = Parallelism.choose(16, 4_000_000, 2000, 1, memory, 40, 4);
        assertEquals(4, forced.parallel());
        assertEquals(4, forced.threadsPerPoint());
    }
}
