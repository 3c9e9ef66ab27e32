package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.io.plan.SteadyState;
import org.evanesce.io.run.Settling;
import org.evanesce.io.sweep.SweepFolder;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A run whose fields have not decayed (or, for a continuous wave, not reached their steady state) when it
 * ends is flagged in every output: the console, run.json, summary.json, and a sweep's sweep.csv and merge;
 * a run that did settle is not. The case: a plane wave through a 150 nm vacuum gap between glass blocks at
 * 45° (as PlaneWaveRunTest, 5 x 153 cells, a fraction of a second per run).
 */
class SettlingTest {

    @TempDir
    Path tmp;

    /** STOP is replaced by the stopping rule. */
    static final String GAP = """
            title: vacuum gap between glass blocks
            parameters:
              end: 400 fs
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 0.1 um, height: 3.2 um, background: glass}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
              gap_vacuum: {index: 1.0}
            shapes:
              - layer_stack:
                  start: [0, -75 nm]
                  layers: [{material: gap_vacuum, thickness: 150 nm}]
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave:
                  y: -0.7 um
                  angle: 45 deg
                  signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}
            flux:
              wavelengths: [633 nm, 640 nm]
              lines:
                - {name: front, y: -0.95 um, measures: reflected}
                - {name: back, y: 0.7 um, measures: transmitted}
            STOP
            """;

    private Path write(String name, String text) throws IOException {
        Path f = tmp.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    private static Map<?, ?> json(Path f) throws IOException {
        return assertInstanceOf(Map.class, SweepFolder.readJson(f), f.toString());
    }

    private static Map<?, ?> settling(Map<?, ?> runJson) {
        return assertInstanceOf(Map.class, assertInstanceOf(Map.class, runJson.get("run")).get("settling"));
    }

    @Test
    void aDecayRunCutShortByItsLimitIsFlaggedEverywhereAndAFullOneIsNot() throws IOException {
        // the stepped strip (its window cut as short as the run's): a computed incident power is the whole pulse's, so
        // the short run's R and T then look plausible and only the settling warnings below flag it
        Path c = write("gap.yaml", GAP.replace("STOP", "until: {energy_below: 1e-6, latest: end}")
                .replace("measures: transmitted}\n", "measures: transmitted}\n  incident_run: strip\n"));
        assertTrue(Files.readString(c).contains("incident_run: strip"));
        // 40 fs: the pulse (about 30 fs long) has not yet passed the lines
        Path out = tmp.resolve("short");
        Cli.Outcome o = Cli.run("run", c.toString(), "--set", "end=40fs", "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), "flagged, not refused: " + o);
        assertTrue(o.out().contains("warning: results: the results did not settle: the run ended at 40"), o.toString());
        assertTrue(o.out().contains("warning: results: implausible flux: A = 1 − R − T = "), o.toString());
        assertTrue(o.err().contains("evanesce run: warning: the results did not settle"), o.toString());
        Map<?, ?> run = json(out.resolve("run.json"));
        assertEquals(false, settling(run).get("settled"), run.toString());
        double fraction = ((Number) settling(run).get("energy_fraction")).doubleValue();
        assertTrue(fraction > 1e-6, "energy fraction " + fraction);
        assertTrue(((List<?>) run.get("warnings")).stream().anyMatch(w -> w.toString().contains("did not settle")),
                run.toString());
        Map<?, ?> summary = json(out.resolve("summary.json"));
        assertEquals(false, summary.get("settled"));
        assertEquals(fraction, ((Number) summary.get("energy_fraction")).doubleValue());
        assertTrue(((List<?>) summary.get("warnings")).stream().anyMatch(w -> w.toString().contains("did not settle")),
                summary.toString());

        Path full = tmp.resolve("full");
        Cli.Outcome ok = Cli.run("run", c.toString(), "--out", full.toString());
        assertEquals(ExitCode.OK, ok.code(), ok.toString());
        assertFalse(ok.out().contains("warning: results:"), ok.toString());
        assertFalse(ok.err().contains("warning"), ok.toString());
        Map<?, ?> fullRun = json(full.resolve("run.json"));
        assertEquals(true, settling(fullRun).get("settled"), fullRun.toString());
        assertTrue(((Number) settling(fullRun).get("energy_fraction")).doubleValue() <= 1e-6);
        assertTrue(((Number) settling(fullRun).get("incident_power_run_energy_fraction")).doubleValue() <= 1e-6);
        assertEquals(true, json(full.resolve("summary.json")).get("settled"));
        assertEquals(List.of(), json(full.resolve("summary.json")).get("warnings"));
    }

    @Test
    void aFixedLengthRunIsJudgedByTheEnergyItLeft() throws IOException {
        Path c = write("gap.yaml", GAP.replace("STOP", "until: {time: end}"));
        Path out = tmp.resolve("short");
        Cli.Outcome o = Cli.run("run", c.toString(), "--set", "end=100fs", "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o.toString());
        Map<?, ?> s = settling(json(out.resolve("run.json")));
        double fraction = ((Number) s.get("energy_fraction")).doubleValue();
        assertEquals(fraction > Settling.FIXED_LENGTH_FRACTION, Boolean.FALSE.equals(s.get("settled")), s.toString());
        assertTrue(fraction > Settling.FIXED_LENGTH_FRACTION, "100 fs should leave the pulse in the domain: " + s);
        assertTrue(o.out().contains("did not settle"), o.toString());

        Path full = tmp.resolve("full");
        Cli.Outcome ok = Cli.run("run", c.toString(), "--set", "end=300fs", "--out", full.toString());
        assertEquals(ExitCode.OK, ok.code(), ok.toString());
        assertEquals(true, settling(json(full.resolve("run.json"))).get("settled"), ok.toString());
        assertFalse(ok.out().contains("warning: results:"), ok.toString());
    }

    @Test
    void aSweepMarksEachPointAndItsMergeCountsThoseThatDidNotSettle() throws IOException {
        Path c = write("gap.yaml", GAP.replace("STOP", """
                until: {energy_below: 1e-6, latest: end}
                sweep:
                  parameters:
                    end: [40 fs, 400 fs]"""));
        Path out = tmp.resolve("sweep");
        Cli.Outcome o = Cli.run("sweep", c.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o.toString());
        assertTrue(o.err().contains("evanesce sweep: warning: 1 of 2 merged points did not settle: 0 "), o.toString());
        List<String> rows = Files.readAllLines(out.resolve("sweep.csv"));
        assertTrue(rows.get(0).endsWith(",settled"), rows.get(0));
        assertEquals(5, rows.size(), rows.toString());
        for (String r : rows.subList(1, 5)) {
            assertTrue(r.endsWith(r.startsWith("0,") ? ",false" : ",true"), r);
        }
    }

    /**
     * A continuous plane wave (ramp 10 periods) totally reflected at glass (1.5) → vacuum at 45°, s, 12 cells
     * per wavelength, with a map over the evanescent side. 300 fs: the normalised flux changed by 6.5e-5
     * between the window's halves (the map's middle row by 4.6e-5) and R − 1 = 1.3e-5 (measured). 200 fs, just
     * past the planner's earliest end (173 fs): R changed by 3.3e-3 between the halves (the slow part is the
     * ramp's tail at the grazing frequency, kx = n k0, which hardly leaves the source), flagged. With the default
     * 5-period ramp that tail is stronger: R changed by 6e-4 to 1.5e-3 between 200 and 400 fs.
     */
    static final String TOTAL_REFLECTION = """
            parameters:
              t: 300 fs
            design_wavelength: 633 nm
            polarization: s
            # 6 whole cells of 633 nm / (1.5 x 12) = 35.17 nm: the period needs no finer cell (at 0.2 um the cell
            # shrinks to 33.3 nm, and the window's halves then differ by 1.17e-3 at 300 fs: flagged, as it should be)
            domain: {width: 211 nm, height: 2.5 um, background: glass}
            grid: {cells_per_wavelength: 12}
            materials:
              glass: {index: 1.5}
              vac: {index: 1.0}
            shapes:
              - half_plane: {through: [0, 0.4 um], fill: above, material: vac}
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave: {y: -0.4 um, angle: 45 deg, signal: {ramped_wave: {wavelength: 633 nm, ramp: 10}}}
            flux:
              lines:
                - {y: -0.6 um, measures: reflected}
            maps:
              region: {from: [-0.1 um, 0], to: [0.1 um, 0.7 um]}
            until: {time: t}
            """;

    /** Lossless total reflection: R = 1 exactly (Hecht, Optics, sec. 4.7); the rule's promise is its tolerance. */
    static final double TOTAL_REFLECTION_TOLERANCE = SteadyState.TOLERANCE;

    @Test
    void aContinuousWaveSettlesToTotalReflectionOrIsFlagged() throws IOException {
        Path c = write("tir.yaml", TOTAL_REFLECTION);
        Path out = tmp.resolve("settled");
        Cli.Outcome o = Cli.run("run", c.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o.toString());
        Map<?, ?> s = settling(json(out.resolve("run.json")));
        assertEquals(true, s.get("settled"), s.toString());
        Map<?, ?> changes = assertInstanceOf(Map.class, s.get("steady_state_changes"));
        assertEquals(java.util.Set.of("R_reflected", "incident_power", "maps"), changes.keySet());
        double r = readR(out);
        assertTrue(Math.abs(r - 1) <= TOTAL_REFLECTION_TOLERANCE, "R = " + r + ", " + s);
        assertFalse(o.out().contains("warning: results:"), o.toString());

        Path early = tmp.resolve("early");
        Cli.Outcome e = Cli.run("run", c.toString(), "--set", "t=200fs", "--out", early.toString());
        assertEquals(ExitCode.OK, e.code(), e.toString());
        Map<?, ?> se = settling(json(early.resolve("run.json")));
        assertEquals(false, se.get("settled"), se.toString());
        assertTrue(((Number) se.get("steady_state_change")).doubleValue() > SteadyState.TOLERANCE, se.toString());
        assertTrue(e.out().contains("warning: results: the results did not settle: R_reflected changed by "), e.toString());
        assertTrue(e.out().contains("the continuous wave had not reached its steady state"), e.toString());
        assertEquals(false, json(early.resolve("summary.json")).get("settled"));
    }

    private static double readR(Path out) throws IOException {
        List<String> rows = Files.readAllLines(out.resolve("flux.csv"));
        int k = List.of(rows.get(0).split(",")).indexOf("R_reflected");
        return Double.parseDouble(rows.get(1).split(",")[k]);
    }

    @Test
    void aRunWithoutFluxOrMapsOfFixedLengthIsNotJudged() throws IOException {
        Path c = write("probe.yaml", """
                polarization: s
                domain: {width: 2 um, height: 2 um}
                grid: {cell: 40 nm}
                sources:
                  - point: {at: [0, 0], signal: {pulse: {wavelength: 633 nm, bandwidth: 100 nm}}}
                probes:
                  - {at: [0.5 um, 0]}
                until: {steps: 40}
                """);
        Path out = tmp.resolve("out");
        Cli.Outcome o = Cli.run("run", c.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o.toString());
        Map<?, ?> s = settling(json(out.resolve("run.json")));
        assertTrue(s.containsKey("settled") && s.get("settled") == null, s.toString());
        assertTrue(((Number) s.get("energy_fraction")).doubleValue() > 0.1, "40 steps: the pulse is still there " + s);
        assertFalse(o.out().contains("warning: results:"), o.toString());
    }
}
