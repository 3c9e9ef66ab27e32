package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.jhdf.HdfFile;
import io.jhdf.api.Dataset;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.evanesce.geometry.GridSpec;
import org.evanesce.io.output.image.FieldPicture;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Maps relative to the incident field ({@code maps.normalise: incident}): |E|/|E_inc| beyond a totally reflecting
 * glass/vacuum face against the Fresnel transmission coefficient and the evanescent decay length, the standing wave
 * in the glass against 1 + |r| = 2, a Gaussian beam at its waist centre against 1, what the files say, and the
 * cases that are refused.
 */
class IncidentRelativeMapsTest {

    static final double N_GLASS = 1.5;
    static final double N_VACUUM = 1.0;
    static final double ANGLE = Math.toRadians(60);
    static final double WAVELENGTH = 633e-9;

    /**
     * |E|/|E_inc| extrapolated to the face by the exponential fit, against the Fresnel value, at 30 cells per
     * wavelength in the glass. Measured: s pulse −1.93e-3, s ramped wave −1.72e-3, p pulse +5.1e-4 (the grid's
     * reflection at a smoothed face differs from the continuous one at second order in the cell).
     */
    static final double FACE_TOLERANCE = 2e-2;
    /**
     * The fitted decay length against Hecht's: measured −2.9e-8 (s pulse), −1.5e-5 (s ramped wave), −3.6e-8 (p pulse)
     * at 30 cells per wavelength (the grid's permittivities carry the dispersion correction for the plane wave's kx).
     */
    static final double DECAY_TOLERANCE = 2e-4;
    /**
     * Allowance beyond the range 2 cos(k_y Δ/2) … 2 for the standing wave's sampled crest (s): measured 1.997592
     * (pulse) and 1.998111 (ramped wave), inside the range 1.997259 … 2; the allowance is the size of the grid's
     * reflection error measured at the face (1.9e-3), rounded up.
     */
    static final double CREST_TOLERANCE = 3e-3;
    /**
     * |E|/|E_inc| at a beam's waist centre against 1, at 20 cells per wavelength: measured −2.3e-7 (s) and +2.2e-4 (p;
     * its |E| comes from the grid's curl of Hz, read between nodes).
     */
    static final double WAIST_TOLERANCE = 2e-3;

    /**
     * A plane-wave box's |E|/|E_inc| at the face against the Fresnel value, at 30 cells per wavelength in the glass:
     * measured −1.50e-3 (s) and +2.19e-3 (p); 10x that.
     */
    static final double BOX_FACE_TOLERANCE = 2e-2;
    /**
     * A plane-wave box's decay length against Hecht's: measured +1.3e-3 (s and p; the box's wave has the grid's own
     * wavenumber, without the plane wave's dispersion correction of the permittivities); 10x that.
     */
    static final double BOX_DECAY_TOLERANCE = 1.5e-2;

    @TempDir
    Path dir;

    /** Glass below y = 0, vacuum above, a plane wave from the glass at 60° (beyond the critical angle, 41.8°). */
    private static final String TIR_CASE = """
            title: Evanescent field relative to the incident field
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 0.1 um, height: 4 um, background: glass}
            grid: {cells_per_wavelength: 30}
            materials:
              glass: {index: 1.5}
              vac: {index: 1.0}
            shapes:
              - half_plane: {through: [0, 0], fill: above, material: vac}
            boundaries: {left: periodic, right: periodic, all: pml 0.6 um}
            sources:
              - plane_wave: {y: -1 um, angle: 60, amplitude: 3, signal: {SIGNAL}}
            maps:
              wavelengths: 633 nm
              region: {from: [-0.05 um, -0.8 um], to: [0.05 um, 1 um]}
              normalise: incident
            until: UNTIL
            """;

    /**
     * The Fresnel transmission coefficients' size for the electric field (M. Born and E. Wolf, Principles of Optics,
     * 7th ed. 1999, sec. 1.5.2, the Fresnel formulae, and sec. 1.5.4, total reflection, with n2 cos θt =
     * i √(n1² sin²θ − n2²)): s, |t| = |2 n1 cos θ / (n1 cos θ + n2 cos θt)|; p, the parallel amplitude
     * |2 n1 cos θ / (n2 cos θ + n1 cos θt)| times |(cos θt, sin θt)| = √(|cos θt|² + sin²θt), the length of the
     * evanescent wave's field vector whose direction has the complex cosine.
     */
    static double fresnel(String pol) {
        double sinT = N_GLASS * Math.sin(ANGLE) / N_VACUUM;
        double cosTim = Math.sqrt(sinT * sinT - 1); // cos θt = i·cosTim
        double c = Math.cos(ANGLE);
        if (pol.equals("s")) {
            return 2 * N_GLASS * c / Math.hypot(N_GLASS * c, N_VACUUM * cosTim);
        }
        double t = 2 * N_GLASS * c / Math.hypot(N_VACUUM * c, N_GLASS * cosTim);
        return t * Math.sqrt(cosTim * cosTim + sinT * sinT);
    }

    /** The 1/e decay length of the evanescent amplitude, λ0 / (2π √(n1² sin²θ − n2²)) (E. Hecht, Optics, 4th ed., sec. 4.7). */
    static double hecht() {
        double s = N_GLASS * Math.sin(ANGLE);
        return WAVELENGTH / (2 * Math.PI * Math.sqrt(s * s - N_VACUUM * N_VACUUM));
    }

    /** The same face lit by a plane-wave box from the glass, heading 30° from +x (60° from the face's normal). */
    private static final String BOX_CASE = """
            title: Evanescent field inside a plane-wave box
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 1.6 um, height: 1.6 um}
            grid: {cells_per_wavelength: 30}
            materials:
              glass: {index: 1.5}
            shapes:
              - half_plane: {through: [0, 0], fill: below, material: glass}
            boundaries: {all: pml 0.4 um}
            sources:
              - plane_wave_box:
                  from: [-0.35 um, -0.35 um]
                  to: [0.35 um, 0.35 um]
                  heading: 30 deg
                  amplitude: 3
                  signal: {ramped_wave: {wavelength: 633 nm}}
            maps:
              wavelengths: 633 nm
              region: {from: [-0.1 um, -0.3 um], to: [0.1 um, 0.34 um]}
              normalise: incident
            until: {time: 100 fs}
            """;

    /** The exponential fit of ln|E| over the vacuum nodes of column i: {|E| at the face, decay length (m)}. */
    static double[] fit(Layer m, int i, double delta) {
        double sy = 0;
        double sl = 0;
        double syy = 0;
        double syl = 0;
        int n = 0;
        for (int j = 0; j < m.v().length; j++) {
            double y = m.y(j);
            if (y >= 3 * m.cell() && y <= 3 * delta) {
                double l = Math.log(m.v()[j][i]);
                sy += y;
                sl += l;
                syy += y * y;
                syl += y * l;
                n++;
            }
        }
        assertTrue(n >= 10, n + " nodes in the fit");
        double slope = (n * syl - sy * sl) / (n * syy - sy * sy);
        return new double[] {Math.exp((sl - slope * sy) / n), -1 / slope};
    }

    /**
     * Inside a plane-wave box the wave it launches is the incident field: beyond the totally reflecting face
     * |E|/|E_inc| is the Fresnel transmission coefficient (Born and Wolf, as above) and decays with Hecht's length.
     */
    @ParameterizedTest
    @CsvSource({"s", "p"})
    void aPlaneWaveBoxsEvanescentFieldIsTheFresnelTransmission(String pol) throws IOException {
        Path out = run("box-" + pol, BOX_CASE.replace("POL", pol));
        Layer m = layer(out.resolve("maps.h5"), "E_magnitude");
        double[] f = fit(m, m.v()[0].length / 2, hecht());
        double t = fresnel(pol);
        String at = String.format(Locale.ROOT, "box %s: |E|/|E_inc| at the face %.6f against |t| = %.6f (%+.2e); decay length "
                + "%.4g nm against %.4g nm (%+.2e)", pol, f[0], t, f[0] / t - 1, f[1] * 1e9, hecht() * 1e9, f[1] / hecht() - 1);
        System.out.println(at);
        assertEquals(t, f[0], BOX_FACE_TOLERANCE * t, at);
        assertEquals(hecht(), f[1], BOX_DECAY_TOLERANCE * hecht(), at);
        try (HdfFile h = new HdfFile(out.resolve("maps.h5"))) {
            assertEquals("|E_inc|", h.getDatasetByPath("/E_magnitude").getAttribute("relative_to").getData());
        }
    }

    private Path run(String name, String text) throws IOException {
        Path file = dir.resolve(name + ".yaml");
        Files.writeString(file, text);
        Path out = dir.resolve(name + "-out");
        Cli.Outcome o = Cli.run("run", file.toString(), "--out", out.toString());
        assertEquals(0, o.code(), () -> name + ": " + o);
        assertTrue(!o.err().contains("warning"), () -> name + ": no warnings expected: " + o);
        return out;
    }

    /** Layer 0 of a stack of maps.h5 as [ny][nx], with its origin and cell size. */
    record Layer(double[][] v, double x0, double y0, double cell) {
        double y(int j) {
            return y0 + j * cell;
        }
    }

    static Layer layer(Path maps, String name) throws IOException {
        try (HdfFile h = new HdfFile(maps)) {
            Dataset d = h.getDatasetByPath("/" + name);
            float[][][] f = (float[][][]) d.getData();
            double[][] v = new double[f[0].length][f[0][0].length];
            for (int j = 0; j < v.length; j++) {
                for (int i = 0; i < v[0].length; i++) {
                    v[j][i] = f[0][j][i];
                }
            }
            double[] origin = (double[]) d.getAttribute("origin_m").getData();
            double cell = ((Number) scalar(d.getAttribute("cell_size_m").getData())).doubleValue();
            return new Layer(v, origin[0], origin[1], cell);
        }
    }

    static Object scalar(Object data) {
        return data instanceof double[] a ? a[0] : data;
    }

    @ParameterizedTest(name = "{0}, {1}")
    @CsvSource({
            "s, 'pulse: {wavelength: 633 nm, bandwidth: 30 nm}', '{energy_below: 1e-6, latest: 300 fs}'",
            "s, 'ramped_wave: {wavelength: 633 nm}', '{time: 250 fs}'",
            "p, 'pulse: {wavelength: 633 nm, bandwidth: 30 nm}', '{energy_below: 1e-6, latest: 300 fs}'",
    })
    void evanescentFieldAtTheFaceIsTheFresnelTransmission(String pol, String signal, String until) throws IOException {
        String name = pol + "-" + signal.substring(0, signal.indexOf(':'));
        Path out = run(name, TIR_CASE.replace("POL", pol).replace("SIGNAL", signal).replace("UNTIL", until));
        Layer m = layer(out.resolve("maps.h5"), "E_magnitude");
        double delta = hecht();
        // ln|E| = ln A − y/L over the vacuum nodes from 3 cells above the face (the face's own rows mix the two media)
        // to 3 decay lengths, least squares (the field is the same along x: column 0)
        double sy = 0;
        double sl = 0;
        double syy = 0;
        double syl = 0;
        int n = 0;
        for (int j = 0; j < m.v().length; j++) {
            double y = m.y(j);
            if (y >= 3 * m.cell() && y <= 3 * delta) {
                double l = Math.log(m.v()[j][0]);
                sy += y;
                sl += l;
                syy += y * y;
                syl += y * l;
                n++;
            }
        }
        assertTrue(n >= 10, name + ": " + n + " nodes in the fit");
        double slope = (n * syl - sy * sl) / (n * syy - sy * sy);
        double atFace = Math.exp((sl - slope * sy) / n);
        double length = -1 / slope;
        double t = fresnel(pol);
        String at = String.format(Locale.ROOT, "%s: |E|/|E_inc| at the face %.6f against |t| = %.6f (%+.2e); decay length %.4g nm "
                + "against %.4g nm (%+.2e)", name, atFace, t, atFace / t - 1, length * 1e9, delta * 1e9, length / delta - 1);
        System.out.println(at);
        assertEquals(t, atFace, FACE_TOLERANCE * t, at);
        assertEquals(delta, length, DECAY_TOLERANCE * delta, at);
        if (pol.equals("s")) {
            // in the glass the incident and the totally reflected wave (|r| = 1) stand: |E|/|E_inc| = |1 + r e^{iφ}|
            // reaches 2 at its crests, which the nodes miss by at most half a cell: 2 cos(k_y Δ/2)
            double crest = 0;
            for (int j = 0; j < m.v().length; j++) {
                if (m.y(j) < -3 * m.cell()) {
                    crest = Math.max(crest, m.v()[j][0]);
                }
            }
            double ky = 2 * Math.PI * N_GLASS * Math.cos(ANGLE) / WAVELENGTH;
            double low = 2 * Math.cos(ky * m.cell() / 2);
            String c = String.format(Locale.ROOT, "%s: the standing wave's crest %.6f (at least %.6f, at most 2)", name, crest, low);
            System.out.println(c);
            assertTrue(crest > low - CREST_TOLERANCE && crest < 2 + CREST_TOLERANCE, c);
        }
        try (HdfFile h = new HdfFile(out.resolve("maps.h5"))) {
            for (String stack : new String[] {"E_magnitude", pol.equals("s") ? "E_z_real" : "H_z_imaginary"}) {
                Dataset d = h.getDatasetByPath("/" + stack);
                assertEquals("1", d.getAttribute("unit").getData(), stack);
                assertEquals("|E_inc|", d.getAttribute("relative_to").getData(), stack);
            }
            double[] inc = (double[]) h.getDatasetByPath("/incident_field_amplitude").getData();
            assertEquals(1, inc.length);
            assertTrue(inc[0] > 0, "incident field amplitude " + inc[0]);
            assertEquals("V*s/m", h.getDatasetByPath("/incident_field_amplitude").getAttribute("unit").getData());
        }
        assertTrue(Files.readString(out.resolve("maps.xmf")).contains("relative to the incident field |E_inc|"));
        Cli.Outcome redraw = Cli.run("redraw", out.toString());
        assertEquals(0, redraw.code(), () -> "redraw: " + redraw);
    }

    /** A Gaussian beam through glass; the waist centre at (0, 0.5 µm). */
    private static final String BEAM_CASE = """
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 10 um, height: 5 um, background: glass}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
            boundaries: {all: pml 0.6 um}
            sources:
              - gaussian_beam: {y: -1.5 um, waist: 1 um, waist_at: [0, 0.5 um], angle: 20 deg, amplitude: 2,
                                signal: {pulse: {wavelength: 633 nm, bandwidth: 30 nm}}}
            maps:
              region: {from: [-0.5 um, 0.2 um], to: [0.5 um, 0.8 um]}
              normalise: incident
            until: {energy_below: 1e-6, latest: 300 fs}
            """;

    /**
     * A Gaussian beam's field peaks at its waist centre (A. E. Siegman, Lasers, 1986, ch. 17, the lowest-order
     * Gaussian beam): there |E|/|E_inc| = 1 by the definition of |E_inc| (docs/case-file.md, maps).
     */
    @ParameterizedTest
    @CsvSource({"s", "p"})
    void aBeamIsOneAtItsWaistCentre(String pol) throws IOException {
        Path out = run("beam-" + pol, BEAM_CASE.replace("POL", pol));
        Layer m = layer(out.resolve("maps.h5"), "E_magnitude");
        double fi = (0 - m.x0()) / m.cell();
        double fj = (0.5e-6 - m.y0()) / m.cell();
        int i = (int) fi;
        int j = (int) fj;
        double a = fi - i;
        double b = fj - j;
        double[][] v = m.v();
        double centre = (1 - a) * (1 - b) * v[j][i] + a * (1 - b) * v[j][i + 1] + (1 - a) * b * v[j + 1][i] + a * b * v[j + 1][i + 1];
        String at = String.format(Locale.ROOT, "%s beam: |E|/|E_inc| at the waist centre %.6f (%+.2e)", pol, centre, centre - 1);
        System.out.println(at);
        assertEquals(1, centre, WAIST_TOLERANCE, at);
    }

    /** The colour bar of a relative picture names the ratio and no unit. */
    @Test
    void picturesSayWhatTheyAreRelativeTo() {
        GridSpec g = new GridSpec(0, 0, 1e-8, 4, 3);
        double[] v = new double[12];
        java.util.Arrays.fill(v, 0.5);
        assertEquals("|E|/|E_inc|, log scale", FieldPicture.of(v, g, "E", "V*s/m", FieldPicture.Quantity.MAGNITUDE)
                .relativeTo("|E_inc|").logScale(4).colourBarLabel());
        assertEquals("Ez/|E_inc|", FieldPicture.of(v, g, "Ez", "V*s/m", FieldPicture.Quantity.REAL).relativeTo("|E_inc|")
                .colourBarLabel());
        assertEquals("|E| (V*s/m), log scale", FieldPicture.of(v, g, "E", "V*s/m", FieldPicture.Quantity.MAGNITUDE).logScale(4)
                .colourBarLabel());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "a point source | 'sources:\n  - point: {at: [0, -1 um], signal: {pulse: {wavelength: 633 nm, bandwidth: 30 nm}}}' "
                    + "| 'and this case has none'",
            "a box and a point | 'sources:\n  - plane_wave_box: {from: [-0.3 um, -0.3 um], to: [0.3 um, 0.3 um], signal: "
                    + "{ramped_wave: {wavelength: 633 nm}}}\n  - point: {at: [0, -1.2 um], signal: {pulse: {wavelength: 633 nm, "
                    + "bandwidth: 30 nm}}}' | 'sources[1].point is a point source'",
            "a box at another wavelength | 'sources:\n  - plane_wave_box: {from: [-0.3 um, -0.3 um], to: [0.3 um, 0.3 um], "
                    + "signal: {ramped_wave: {wavelength: 600 nm}}}' | 'a ramped wave carries only its own frequency'",
            "a second source | 'sources:\n  - gaussian_beam: {y: -1 um, waist: 0.8 um, waist_at: [0, 0], signal: {pulse: "
                    + "{wavelength: 633 nm, bandwidth: 30 nm}}}\n  - point: {at: [0, -1.2 um], signal: {pulse: {wavelength: "
                    + "633 nm, bandwidth: 30 nm}}}' | 'sources[1].point is a point source'",
            "a ramped wave elsewhere | 'sources:\n  - gaussian_beam: {y: -1 um, waist: 0.8 um, waist_at: [0, 0], signal: "
                    + "{ramped_wave: {wavelength: 600 nm}}}' | 'a ramped wave carries only its own frequency'",
    })
    void refusedWithoutAnIncidentField(String what, String sources, String message) throws IOException {
        String text = """
                design_wavelength: 633 nm
                polarization: s
                domain: {width: 4 um, height: 4 um, background: glass}
                grid: {cells_per_wavelength: 15}
                materials:
                  glass: {index: 1.5}
                boundaries: {all: pml 0.6 um}
                SOURCES
                maps:
                  wavelengths: 633 nm
                  normalise: incident
                until: {time: 100 fs}
                """.replace("SOURCES", sources);
        Path file = dir.resolve("refused.yaml");
        Files.writeString(file, text);
        Cli.Outcome o = Cli.run("check", file.toString());
        assertEquals(2, o.code(), () -> what + ": " + o);
        assertTrue(o.err().contains("maps") && o.err().contains(message), () -> what + ": " + o);
        assertTrue(!o.err().contains("Exception"), () -> what + ": " + o);
    }

    /** A plane wave whose in-plane wavenumber exceeds the medium's at a map wavelength has no incident field there. */
    @Test
    void refusedWhereThePlaneWaveDoesNotPropagate() throws IOException {
        String text = TIR_CASE.replace("POL", "s").replace("SIGNAL", "pulse: {wavelength: 633 nm, bandwidth: 100 nm}")
                .replace("UNTIL", "{time: 100 fs}").replace("wavelengths: 633 nm", "wavelengths: [633 nm, 750 nm]");
        Path file = dir.resolve("evanescent.yaml");
        Files.writeString(file, text);
        Cli.Outcome o = Cli.run("check", file.toString());
        assertEquals(2, o.code(), () -> o.toString());
        assertTrue(o.err().contains("no incident wave propagates there to divide by"), () -> o.toString());
    }
}
