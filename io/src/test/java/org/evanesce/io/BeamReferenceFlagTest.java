package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * A Gaussian beam's angular-spectrum reference is either converged and printed, or flagged and left out. The
 * stack is a prism coupler (prism 1.8 | air gap | film 1.6, 500 nm | substrate 1.45) lit at 59°, where the
 * film's guided mode is a resonance of the stack whose width in kx falls as e^{−2γd} with the gap d
 * (AngularSpectrumConvergenceTest): at 150 nm the reference converges, at 500 nm its half-width is about
 * 2 rad/m and no sampling the program allows resolves it. The simulation itself (40 steps on a coarse grid)
 * is beside the point here.
 */
class BeamReferenceFlagTest {

    @TempDir
    Path tmp;

    private static final String CASE = """
            title: prism coupler reference
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 40 um, height: 4 um, background: prism}
            grid: {cells_per_wavelength: 8}
            materials:
              prism: {index: 1.8}
              film_layer: {index: 1.6}
              substrate: {index: 1.45}
              gap_air: {index: 1.0}
            shapes:
              - half_plane: {through: [0, -1 um], fill: below, material: substrate}
              - layer_stack: {start: [0, -1 um], layers: [{material: film_layer, thickness: 500 nm}, {material: gap_air, thickness: GAP}]}
            boundaries: {all: pml 0.5 um}
            sources:
              - gaussian_beam:
                  y: 1 um
                  waist: 4 um
                  waist_at: [0, 0]
                  angle: 59 deg
                  direction: down
                  signal: {pulse: {wavelength: 633 nm, bandwidth: 10 nm}}
            flux:
              wavelengths: [633 nm]
              lines:
                - {y: 1.3 um, measures: reflected}
                - {y: -1.3 um, measures: transmitted}
              transfer_matrix: true
            until: {steps: 40}
            """;

    @ParameterizedTest(name = "gap {0} nm")
    @ValueSource(ints = {150, 500})
    void referenceIsPrintedOnlyWhenConverged(int gapNm) throws IOException {
        Path f = tmp.resolve("gap" + gapNm + ".yaml");
        Files.writeString(f, CASE.replace("GAP", gapNm + " nm"));
        Path out = tmp.resolve("gap" + gapNm);
        Cli.Outcome o = Cli.run("run", f.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), () -> o.toString());
        List<String> csv = Files.readAllLines(out.resolve("flux.csv"));
        List<String> header = List.of(csv.get(0).split(","));
        String[] row = csv.get(1).split(",", -1);
        String flag = row[header.indexOf("beam_reference_converged")];
        String rBeam = row[header.indexOf("R_reflected_beam")];
        String shiftBeam = row[header.indexOf("shift_reflected_beam_um")];
        String summary = Files.readString(out.resolve("summary.json"));
        String runJson = Files.readString(out.resolve("run.json"));
        String what = "gap " + gapNm + " nm: flux.csv " + csv + "\n" + o;
        boolean converges = gapNm == 150;
        assertEquals(converges ? "1" : "0", flag, what);
        assertEquals(converges, summary.contains("\"beam_reference_converged\": true"), what);
        assertEquals(!converges, summary.contains("\"beam_reference_converged\": false"), what);
        assertEquals(!converges, o.out().contains("warning: results: the angular-spectrum reference at 633.00 nm did not "
                + "converge"), what);
        assertEquals(!converges, runJson.contains("did not converge"), what);
        if (converges) {
            // total reflection: R of the reference is 1; the mode shifts the beam by about 19 um
            assertEquals(1.0, Double.parseDouble(rBeam), 1e-5, what);
            assertTrue(Double.parseDouble(shiftBeam) > 10, what);
        } else {
            assertEquals("", rBeam, what);
            assertEquals("", shiftBeam, what);
            assertEquals("", row[header.indexOf("R_reflected_diff")], what);
        }
    }
}
