package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.evanesce.io.plan.IncidentKey;
import org.evanesce.solver.record.FluxLine;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Reusing an incident-power run ({@link IncidentPowerCache}): a reused result is bit for bit what the case's own
 * incident-power run gives (in memory, through the folder's file, for a pulse and for a continuous wave), a damaged
 * file is not used, and the key changes with everything the incident-power run depends on and with nothing else
 * (common practice for a cache: equal keys only where the computation is the same).
 */
class IncidentPowerCacheTest {

    @TempDir
    Path tmp;

    /** A plane wave through a vacuum gap between glass blocks: 5 x 153 cells, a fraction of a second per run. */
    private static final String CASE = """
            title: vacuum gap between glass blocks
            parameters:
              gap: 150 nm
              theta: 45 deg
              cpw: 20
              front: -0.95 um
              src: -0.7 um
              n_glass: 1.5
              bw: 20 nm
              pml: 0.5 um
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 0.1 um, height: 3.2 um, background: glass}
            grid: {cells_per_wavelength: cpw}
            materials:
              glass: {index: n_glass}
              gap_vacuum: {index: 1.0}
            shapes:
              - layer_stack:
                  start: [0, -gap/2]
                  layers: [{material: gap_vacuum, thickness: gap}]
            boundaries: {left: periodic, right: periodic, bottom: pml pml, top: pml pml}
            sources:
              - plane_wave:
                  y: src
                  direction: up
                  angle: theta
                  signal: SIGNAL
            flux:
              wavelengths: WAVELENGTHS
              lines:
                - {name: front, y: front, measures: reflected}
                - {name: back, y: 0.7 um, measures: transmitted}
              transfer_matrix: true
              incident_run: strip
            until: STOP
            """;

    private static final String PULSE = "{pulse: {wavelength: 633 nm, bandwidth: bw}}";
    private static final String CW = "{ramped_wave: {wavelength: 633 nm}}";

    static String text(boolean pulse) {
        return CASE.replace("SIGNAL", pulse ? PULSE : CW)
                .replace("WAVELENGTHS", pulse ? "[633 nm, 640 nm]" : "633 nm")
                .replace("STOP", pulse ? "{energy_below: 1e-6, latest: 400 fs}" : "{time: 250 fs}");
    }

    static CasePlan plan(String text, Map<String, String> set) throws Exception {
        return CasePlanner.plan(CaseLoader.parse(text, "gap.yaml", set, ReadOptions.defaults()).spec(), 1);
    }

    private static CasePlan plan(Map<String, String> set) throws Exception {
        return plan(text(true), set);
    }

    /** Every recorder's state of the incident-power run, as bytes (doubles by their bits). */
    static List<byte[]> states(CasePlan plan) throws IOException {
        List<byte[]> out = new ArrayList<>();
        for (FluxLine l : plan.flux().orElseThrow().recorders()) {
            ByteArrayOutputStream b = new ByteArrayOutputStream();
            try (DataOutputStream d = new DataOutputStream(b)) {
                l.writeState(d);
            }
            out.add(b.toByteArray());
        }
        return out;
    }

    /** Every value of the flux table (and the incident column) by its bits. */
    static long[] bits(CasePlan plan) {
        FluxResults r = FluxResults.of(plan.flux().orElseThrow(), plan.spec().polarization().value());
        List<Long> out = new ArrayList<>();
        for (FluxResults.Row row : r.rows()) {
            out.add(Double.doubleToRawLongBits(row.incident()));
            for (double v : row.values()) {
                out.add(Double.doubleToRawLongBits(v));
            }
        }
        return out.stream().mapToLong(Long::longValue).toArray();
    }

    private static void assertSameStates(List<byte[]> expected, List<byte[]> actual, String what) {
        assertEquals(expected.size(), actual.size(), what + ": recorders");
        for (int k = 0; k < expected.size(); k++) {
            assertArrayEquals(expected.get(k), actual.get(k), what + ": recorder " + k);
        }
    }

    @ParameterizedTest(name = "pulse {0}")
    @ValueSource(booleans = {true, false})
    void reusedResultIsBitForBitTheFreshOne(boolean pulse) throws Exception {
        String text = text(pulse);
        List<String> notes = new ArrayList<>();
        IncidentPowerCache cache = IncidentPowerCache.inFolder(tmp, notes::add);
        // the first gap measures, the second reuses it: another scene, the same set-up
        CasePlan first = plan(text, Map.of("gap", "100 nm"));
        CaseRunner.Result a = CaseRunner.run(first, null, 1, null, null, cache);
        assertFalse(a.incidentPower().reused(), "the first point measures: " + a.incidentPower());
        assertTrue(a.incidentPowerRunWallSeconds() > 0, "the measuring run's wall time is its own");
        Path file = cache.file(a.incidentPower().key());
        assertTrue(Files.isRegularFile(file), "the result is kept in the folder: " + file);

        CasePlan reused = plan(text, Map.of("gap", "200 nm"));
        CaseRunner.Result b = CaseRunner.run(reused, null, 1, null, null, cache);
        assertTrue(b.incidentPower().reused(), "the second gap reuses it");
        assertEquals(a.incidentPower().key(), b.incidentPower().key());
        assertEquals(0.0, b.incidentPowerRunWallSeconds(), "no incident-power run in the reusing case");

        CasePlan fresh = plan(text, Map.of("gap", "200 nm"));
        CaseRunner.Result c = CaseRunner.run(fresh, null, 1, null, null, IncidentPowerCache.none());
        assertFalse(c.incidentPower().reused());
        assertEquals(b.steps(), c.steps());
        assertSameStates(states(fresh), states(reused), "reused in memory against measured");
        assertArrayEquals(bits(fresh), bits(reused), "every T, R, A and incident value, reused in memory against measured");
        assertEquals(Double.doubleToRawLongBits(c.incidentPowerRunEnergyFraction()),
                Double.doubleToRawLongBits(b.incidentPowerRunEnergyFraction()), "the settling check sees the same energies");

        // another process (a resumed or sharded sweep) reads the file
        CasePlan fromFile = plan(text, Map.of("gap", "200 nm"));
        CaseRunner.Result d = CaseRunner.run(fromFile, null, 1, null, null, IncidentPowerCache.inFolder(tmp, notes::add));
        assertTrue(d.incidentPower().reused() && d.incidentPower().origin().contains(file.toString()), d.incidentPower().origin());
        assertSameStates(states(fresh), states(fromFile), "reused from the file against measured");
        assertArrayEquals(bits(fresh), bits(fromFile), "every value, reused from the file against measured");
        assertEquals(List.of(), notes, "nothing to note");
    }

    /**
     * A pulse run for a fixed time (the run's length a parameter, the set-up the same), on the strip or on the full
     * width.
     */
    private static String timed(boolean strip) {
        String t = text(true).replace("{energy_below: 1e-6, latest: 400 fs}", "{time: dur}")
                .replace("  bw: 20 nm\n", "  bw: 20 nm\n  dur: 200 fs\n");
        return strip ? t : t.replace("  incident_run: strip\n", "  incident_run: full\n");
    }

    @ParameterizedTest(name = "strip {0}")
    @ValueSource(booleans = {true, false})
    void aRunOfAnotherLengthContinuesAKeptStateBitForBit(boolean strip) throws Exception {
        String text = timed(strip);
        assertTrue(text.contains("{time: dur}") && text.contains("dur: 200 fs") && (strip || text.contains("incident_run: full")));
        IncidentPowerCache cache = IncidentPowerCache.inMemory();
        // a short one (852 steps: the pulse is still arriving, so the energies after it decide the peak), a longer one
        // (continues the first's end), a longer one still, one between (continues a state kept on the way), the
        // second again (reused whole), one shorter than those (continues a state the second kept on the way)
        String[] lengths = {"30 fs", "150 fs", "260 fs", "210 fs", "150 fs", "100 fs"};
        long[] from = new long[lengths.length];
        for (int k = 0; k < lengths.length; k++) {
            CasePlan kept = plan(text, Map.of("dur", lengths[k], "gap", "120 nm"));
            CaseRunner.Result a = CaseRunner.run(kept, null, 1, null, null, cache);
            CasePlan fresh = plan(text, Map.of("dur", lengths[k], "gap", "120 nm"));
            CaseRunner.Result b = CaseRunner.run(fresh, null, 1, null, null, IncidentPowerCache.none());
            String what = lengths[k] + " (" + a.steps() + " steps, " + a.incidentPower().origin() + ")";
            assertEquals(a.steps(), b.steps(), what);
            assertEquals(strip, a.incidentPower().strip(), what);
            assertSameStates(states(fresh), states(kept), what);
            assertArrayEquals(bits(fresh), bits(kept), what + ": every T, R, A and incident value");
            assertEquals(Double.doubleToRawLongBits(b.incidentPowerRunFinalEnergy()),
                    Double.doubleToRawLongBits(a.incidentPowerRunFinalEnergy()), what + ": the final energy");
            assertEquals(Double.doubleToRawLongBits(b.incidentPowerRunPeakEnergy()),
                    Double.doubleToRawLongBits(a.incidentPowerRunPeakEnergy()), what + ": the peak energy");
            String o = a.incidentPower().origin();
            from[k] = o.contains("continuing from step ") ? Long.parseLong(o.replaceAll(".*continuing from step (\\d+).*", "$1")) : -1;
            assertTrue(from[k] < a.steps(), what);
        }
        assertEquals(-1, from[0], "the first run starts at step 0");
        assertTrue(from[1] > 0 && from[1] % Checkpoints.CHUNK != 0, "the longer run continues the first's end state, "
                + "between two energy measurements: " + from[1]);
        assertTrue(from[2] > from[1], "the longer one still continues the second's end: " + from[2]);
        assertTrue(from[3] >= from[2], "the run between continues a state kept on the way: " + from[3]);
        assertEquals(-1, from[4], "the second length again is reused, not measured: " + from[4]);
        assertTrue(from[5] > from[1] && from[5] % CaseRunner.KEEP_EVERY == 0, "a shorter run continues a state kept on the "
                + "way, every " + CaseRunner.KEEP_EVERY + " steps: " + from[5]);
    }

    /** The case with a surfaces section normalised by the incident power: an exit line above the gap. */
    private static final String SURFACES = """
            surfaces:
              wavelengths: [620 nm, 640 nm, 650 nm]
              exit_spectra:
                - {name: up, y: 0.8 um, towards: up, numerical_aperture: 1.2}
            """;

    @Test
    void aSurfacesSectionsIncidentLineIsReusedWithTheRunsOwn() throws Exception {
        String text = text(true).replace("until: ", SURFACES + "until: ");
        assertTrue(text.contains("exit_spectra"), text);
        IncidentPowerCache cache = IncidentPowerCache.inMemory();
        CaseRunner.Result a = CaseRunner.run(plan(text, Map.of("gap", "100 nm")), null, 1, null, null, cache);
        assertFalse(a.incidentPower().reused(), "the first point measures: " + a.incidentPower());
        assertTrue(a.incidentPower().strip(), "on the strip: " + a.incidentPower());
        CasePlan reused = plan(text, Map.of("gap", "200 nm"));
        CaseRunner.Result b = CaseRunner.run(reused, null, 1, null, null, cache);
        assertTrue(b.incidentPower().reused(), "the second gap reuses it: " + b.incidentPower());
        CasePlan fresh = plan(text, Map.of("gap", "200 nm"));
        CaseRunner.Result c = CaseRunner.run(fresh, null, 1, null, null, IncidentPowerCache.none());
        assertEquals(b.steps(), c.steps());
        var line = fresh.flux().orElseThrow().surfacesIncident();
        assertTrue(line.isPresent() && fresh.flux().orElseThrow().recorders().contains(line.get()),
                "the surfaces' incident line is a recorder of the incident-power run");
        assertSameStates(states(fresh), states(reused), "reused against measured, the surfaces' incident line among them");
        SurfaceResults r = SurfaceResults.of(reused.surfaces().orElseThrow());
        SurfaceResults f = SurfaceResults.of(fresh.surfaces().orElseThrow());
        assertEquals(f.columns(), r.columns());
        for (int q = 0; q < f.rows().length; q++) {
            assertArrayEquals(f.rows()[q], r.rows()[q], "every surfaces value at frequency " + q);
            assertEquals(f.norm()[q], r.norm()[q], "the norm at frequency " + q);
            assertTrue(f.norm()[q] > 0, "an incident power was measured: " + f.norm()[q]);
        }
        // the surfaces' frequencies are part of the key
        assertNotEquals(plan(text, Map.of()).flux().orElseThrow().setupKey(),
                plan(text.replace("[620 nm, 640 nm, 650 nm]", "[620 nm, 640 nm, 651 nm]"), Map.of()).flux().orElseThrow().setupKey());
        assertNotEquals(plan(text, Map.of()).flux().orElseThrow().setupKey(), plan(Map.of()).flux().orElseThrow().setupKey());
    }

    @Test
    void aDamagedFileIsNotUsedAndIsReplaced() throws Exception {
        List<String> notes = new ArrayList<>();
        CasePlan first = plan(Map.of());
        CaseRunner.Result a = CaseRunner.run(first, null, 1, null, null, IncidentPowerCache.inFolder(tmp, notes::add));
        Path file = IncidentPowerCache.inFolder(tmp, notes::add).file(a.incidentPower().key());
        byte[] good = Files.readAllBytes(file);
        List<byte[]> expected = states(first);
        byte[] bad = good.clone();
        bad[bad.length / 2] ^= 0x10;
        Files.write(file, bad);
        CasePlan again = plan(Map.of());
        CaseRunner.Result b = CaseRunner.run(again, null, 1, null, null, IncidentPowerCache.inFolder(tmp, notes::add));
        assertFalse(b.incidentPower().reused(), "a file that fails its check sum is not used");
        assertEquals(1, notes.size(), () -> "one note: " + notes);
        assertTrue(notes.get(0).contains("check sum") && notes.get(0).contains(file.toString()), notes.get(0));
        assertSameStates(expected, states(again), "measured again");
        assertEquals(good.length, Files.size(file), "the file is written anew (the same length; the wall time differs)");
        CasePlan read = plan(Map.of());
        assertTrue(CaseRunner.run(read, null, 1, null, null, IncidentPowerCache.inFolder(tmp, notes::add)).incidentPower().reused(),
                "the new file is used");
        assertSameStates(expected, states(read), "read from the new file");

        // cut short: not used either
        Files.write(file, java.util.Arrays.copyOf(good, good.length - 9));
        notes.clear();
        CaseRunner.Result c = CaseRunner.run(plan(Map.of()), null, 1, null, null, IncidentPowerCache.inFolder(tmp, notes::add));
        assertFalse(c.incidentPower().reused(), "a file cut short is not used");
        assertEquals(1, notes.size(), () -> "one note: " + notes);
    }

    /** The set-up key of the case with one override (and the base values otherwise). */
    private static String key(String name, String value) throws Exception {
        return plan(value == null ? Map.of() : Map.of(name, value)).flux().orElseThrow().setupKey();
    }

    @Test
    void theKeyChangesWithWhatTheIncidentPowerRunDependsOn() throws Exception {
        String base = key(null, null);
        assertEquals(64, base.length());
        assertEquals(base, key(null, null), "the same case, the same key");
        assertEquals(base, key("gap", "250 nm"), "the scene beyond the incident medium is not part of it");
        Map<String, String> changes = new LinkedHashMap<>();
        changes.put("theta", "50 deg");           // the source's in-plane wavenumber: its phases and the Bloch sides
        changes.put("cpw", "22");                 // the grid
        changes.put("front", "-1.0 um");          // a line's position
        changes.put("src", "-0.65 um");           // the source's position
        changes.put("n_glass", "1.52");           // the incident medium
        changes.put("bw", "30 nm");               // the signal
        changes.put("pml", "0.6 um");             // the boundaries
        Map<String, String> keys = new LinkedHashMap<>();
        for (Map.Entry<String, String> e : changes.entrySet()) {
            String k = key(e.getKey(), e.getValue());
            assertNotEquals(base, k, e.getKey() + "=" + e.getValue() + " changes the incident-power run, so its key");
            assertFalse(keys.containsValue(k), e.getKey() + ": a key of its own");
            keys.put(e.getKey(), k);
        }
        // keys the case file's own settings change: polarization, precision, Courant number, wavelengths
        String t = text(true);
        for (String[] r : new String[][] {{"polarization: s", "polarization: p"},
                {"grid: {cells_per_wavelength: cpw}", "grid: {cells_per_wavelength: cpw}\nnumerics: {precision: double}"},
                {"grid: {cells_per_wavelength: cpw}", "grid: {cells_per_wavelength: cpw}\nnumerics: {courant: 0.45}"},
                {"wavelengths: [633 nm, 640 nm]", "wavelengths: [633 nm, 641 nm]"}}) {
            assertTrue(t.contains(r[0]), r[0]);
            String k = plan(t.replace(r[0], r[1]), Map.of()).flux().orElseThrow().setupKey();
            assertNotEquals(base, k, r[1]);
            assertFalse(keys.containsValue(k), r[1] + ": a key of its own");
            keys.put(r[1], k);
        }
        // the run's length and the program's build complete the key
        assertNotEquals(IncidentKey.withSteps(base, 6000, "1", "b"), IncidentKey.withSteps(base, 6001, "1", "b"));
        assertNotEquals(IncidentKey.withSteps(base, 6000, "1", "b"), IncidentKey.withSteps(base, 6000, "1", "c"));
        assertNotEquals(IncidentKey.withSteps(base, 6000, "1", "b"), IncidentKey.withSteps(base, 6000, "2", "b"));
        assertNotNull(IncidentPowerCache.key(plan(Map.of()).flux().orElseThrow(), 1));
    }

    @Test
    void cacheFileNamesAreRecognised() {
        assertTrue(IncidentPowerCache.isCacheFile("incident-power-0123456789abcdef0123456789abcdef.bin"));
        assertFalse(IncidentPowerCache.isCacheFile("incident-power-0123.bin"));
        assertFalse(IncidentPowerCache.isCacheFile("incident-power-0123456789abcdef0123456789abcdef.bin.tmp"));
    }
}
