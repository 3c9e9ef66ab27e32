package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * {@code evanesce accuracy}: a two-level study (20 and 40 cells per wavelength, four grid offsets each)
 * of tunnelling through a vacuum gap, s and p. Against the closed-form transmittance (written out in
 * {@link PlaneWaveRunTest#tunnelling}, S. Zhu, A. W. Yu, D. Hawley, R. Roy, Am. J. Phys. 54, 601
 * (1986)) the extrapolated value is within issue #4's 0.001 and the error estimate bounds the distance
 * of both the extrapolated and the finer value; and the command's usage errors.
 */
class AccuracyCommandTest {

    /** The coarse level's cells per wavelength in the glass; the second level has twice as many. */
    static final int COARSE_CPW = 20;
    /** Issue #4: Richardson extrapolation from 20 and 40 cells per wavelength within 0.001 of exact. */
    static final double RICHARDSON_TOL = 0.001;
    /** The flux wavelengths, m (the case asks for 620 to 646 nm in three steps). */
    static final double[] WAVELENGTHS = {620e-9, 633e-9, 646e-9};
    /** accuracy.csv prints wavelengths in nm with 6 decimals; rows are matched to this. */
    static final double WAVELENGTH_MATCH_NM = 1e-3;
    /** Value columns of the flux table, in the order of the case's flux lines, then A. */
    static final List<String> VALUES = List.of("R_reflected", "T_transmitted", "A");

    @TempDir
    Path tmp;

    /** 45 degrees, 150 nm vacuum gap between glass of index 1.5, 20 cells per 633 nm in glass. */
    private static final String CASE = """
            title: accuracy of tunnelling through a vacuum gap
            parameters:
              cpw: CPW
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 0.1 um, height: 3.2 um, background: glass}
            grid: {cells_per_wavelength: cpw}
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
            FLUX
            until: {energy_below: 1e-6, latest: 400 fs}
            """.replace("CPW", Integer.toString(COARSE_CPW));

    private static final String FLUX = """
            flux:
              wavelengths: {from: 620 nm, to: 646 nm, count: 3}
              lines:
                - {y: -0.95 um, measures: reflected}
                - {y: 0.7 um, measures: transmitted}
              transfer_matrix: true""";



    private Path write(String name, String text) throws IOException {
        Path f = tmp.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    /** The header accuracy.csv documents for two levels with a transfer-matrix reference. */
    static List<String> expectedHeader() {
        List<String> h = new ArrayList<>(List.of("wavelength_nm", "angle_deg"));
        for (String c : VALUES) {
            for (String s : List.of("_level1", "_level2", "_level1_spread", "_level2_spread", "_extrapolated",
                    "_error_estimate", "_order", "_exact", "_extrapolated_diff")) {
                h.add(c + s);
            }
        }
        return h;
    }

    @ParameterizedTest(name = "{0} polarization")
    @ValueSource(strings = {"s", "p"})
    void twoLevelEstimateBoundsTheDistanceToTheClosedForm(String pol) throws IOException {
        Path out = tmp.resolve("study");
        Cli.Outcome o = Cli.run("accuracy", write("gap.yaml", CASE.replace("FLUX", FLUX).replace("POL", pol)).toString(),
                "--levels", "2", "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        for (String level : List.of("level1", "level2")) {
            for (int k = 0; k < 4; k++) {
                Path run = out.resolve(level).resolve("offset" + k);
                assertTrue(Files.isRegularFile(run.resolve("flux.csv")), () -> "no " + run + "/flux.csv: " + o);
                assertTrue(Files.isRegularFile(run.resolve("run.json")), () -> "no " + run + "/run.json: " + o);
            }
        }
        assertTrue(Files.isRegularFile(out.resolve("accuracy.json")), () -> "no accuracy.json: " + o);
        assertFalse(Files.exists(out.resolve("level3")), "two levels asked, a third written");

        List<String> lines = Files.readAllLines(out.resolve("accuracy.csv"));
        List<String> header = List.of(lines.get(0).split(","));
        assertEquals(expectedHeader(), header, "accuracy.csv columns");
        List<double[]> rows = lines.subList(1, lines.size()).stream().filter(l -> !l.isBlank())
                .map(l -> Arrays.stream(l.split(",", -1))
                        .mapToDouble(s -> s.isEmpty() ? Double.NaN : Double.parseDouble(s)).toArray())
                .toList();
        assertEquals(WAVELENGTHS.length, rows.size(), "one row per flux wavelength");

        double theta0 = Math.toRadians(45);
        for (int q = 0; q < WAVELENGTHS.length; q++) {
            double wl = WAVELENGTHS[q];
            double[] row = rows.get(q);
            assertEquals(wl * 1e9, row[header.indexOf("wavelength_nm")], WAVELENGTH_MATCH_NM, "row order");
            double theta = PlaneWaveRunTest.angleAt(theta0, wl);
            double t = PlaneWaveRunTest.tunnelling(pol, PlaneWaveRunTest.N_GLASS, PlaneWaveRunTest.N_GAP, PlaneWaveRunTest.GAP,
                    theta, wl);
            // lossless: what is not transmitted is reflected
            double[] truths = {1 - t, t};
            for (int k = 0; k < 2; k++) {
                String c = VALUES.get(k);
                double exact = truths[k];
                double level2 = row[header.indexOf(c + "_level2")];
                double extrapolated = row[header.indexOf(c + "_extrapolated")];
                double estimate = row[header.indexOf(c + "_error_estimate")];
                String what = String.format("%s, 45 deg, 150 nm gap, %d and %d cells per wavelength, %s at %g nm: exact %.6f, "
                        + "level2 %.6f, extrapolated %.6f, error estimate %.3g", pol, COARSE_CPW, 2 * COARSE_CPW, c, wl * 1e9,
                        exact, level2, extrapolated, estimate);
                if (Boolean.getBoolean("evanesce.printTables")) {
                    System.out.println(what);
                }
                assertTrue(Math.abs(extrapolated - exact) <= RICHARDSON_TOL,
                        () -> what + ": |extrapolated − exact| = " + Math.abs(extrapolated - exact) + " exceeds 0.001");
                assertTrue(Double.isFinite(estimate) && estimate > 0, () -> what + ": no usable error estimate");
                assertTrue(Math.abs(extrapolated - exact) <= estimate,
                        () -> what + ": |extrapolated − exact| = " + Math.abs(extrapolated - exact) + " exceeds the estimate");
                assertTrue(Math.abs(level2 - exact) <= estimate,
                        () -> what + ": |level2 − exact| = " + Math.abs(level2 - exact) + " exceeds the estimate");
            }
        }
    }

    @Test
    void fourLevelsAreRefused() throws IOException {
        Path out = tmp.resolve("four");
        Cli.Outcome o = Cli.run("accuracy", write("gap.yaml", CASE.replace("FLUX", FLUX).replace("POL", "s")).toString(), "--levels", "4",
                "--out", out.toString());
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("--levels"), () -> "the message should name --levels: " + o);
        assertFalse(Files.exists(out), "a refused study wrote its folder");
    }

    @Test
    void caseWithoutFluxIsRefused() throws IOException {
        Path out = tmp.resolve("no-flux");
        Cli.Outcome o = Cli.run("accuracy", write("no-flux.yaml", CASE.replace("FLUX", "").replace("POL", "s")).toString(), "--out",
                out.toString());
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("flux"), () -> "the message should mention flux: " + o);
        assertFalse(Files.exists(out), "a refused study wrote its folder");
    }
}
