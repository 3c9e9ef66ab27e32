package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.evanesce.geometry.PhysicalConstants;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Power through surfaces from case files, run in-process: Poynting's theorem for boxes (Born &amp; Wolf,
 * <i>Principles of Optics</i>, sec. 1.1.4), the far field of a line source against the 2D Green's function's
 * isotropic pattern and its total against the measured source power (Taflove &amp; Hagness, <i>Computational
 * Electrodynamics</i>, 3rd ed., 2005, ch. 8), and a Gaussian beam's angular spectrum through an exit line against
 * its analytic plane-wave spectrum (the Fourier pair of exp(−s²/w0²): a(k_s) = exp(−k_s² w0²/4); common practice,
 * e.g. Mandel &amp; Wolf, <i>Optical Coherence and Quantum Optics</i>, 1995, sec. 3.2).
 */
class SurfacesRunTest {

    private static CasePlan plan(String text) throws Exception {
        return CasePlanner.plan(CaseLoader.parse(text, "t.yaml", Map.of(), ReadOptions.defaults()).spec(), 2);
    }

    private static SurfaceResults run(String text) throws Exception {
        CasePlan p = plan(text);
        CaseRunner.run(p, null, 1);
        return SurfaceResults.of(p.surfaces().orElseThrow());
    }

    private static double value(SurfaceResults r, String column, int q) {
        return r.rows()[q][r.columns().indexOf(column)];
    }

    /** A point source beside a glass rod (lossless) or a lossy rod; placeholders POL, ROD. */
    private static final String ROD = """
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 5 um, height: 5 um, background: air}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
              lossy: {index: 1.5, conductivity: 2e5 S/m}
            shapes:
              - disk: {centre: [0.8 um, 0], radius: 0.35 um, material: ROD}
            sources:
              - point: {at: [-0.6 um, 0.1 um], signal: {pulse: {wavelength: 633 nm, bandwidth: 60 nm}}}
            surfaces:
              wavelengths: {from: 600 nm, to: 670 nm, count: 3}
              boxes:
                - {name: rod, from: [0.3 um, -0.6 um], to: [1.4 um, 0.6 um]}
                - {name: all, from: [-1.5 um, -1.5 um], to: [1.7 um, 1.5 um]}
              far_field:
                - {name: ring, from: [-1.6 um, -1.6 um], to: [1.8 um, 1.6 um], angles: 72}
            until: {energy_below: 1e-6, latest: 300 fs}
            """;

    /**
     * Net power out of a box round a lossless rod (no source inside), over the source's power: measured at most
     * 7.3e-6 here (s and p, three wavelengths; 6e-5 in the run of docs/case-file.md's example); 10x that (the issue
     * asks 1e-3).
     */
    static final double CONSERVATION = 7e-5;
    /**
     * Far-field total against the contour's net flux: they differ at O((kΔ)²), since the far field counts the grid's
     * outgoing waves by their amplitudes with the continuum's intensity (NearToFarField#onYeeGrid) and the flux is the
     * grid's own Poynting flux (for a plane wave leaving a side normally, cos(k̃Δ/2) of the continuum's): measured
     * 4.2e-3 (s and p, 600 nm) at 20 cells per wavelength, 2026-12-04 (4.1e-4 with the continuum's transformation, whose
     * phase errors the optical theorem showed); about 2.4x that.
     */
    static final double FAR_TOTAL = 1e-2;

    @ParameterizedTest
    @ValueSource(strings = {"s", "p"})
    void aBoxRoundALosslessScenePassesNoNetPowerAndTheFarFieldCarriesTheRest(String pol) throws Exception {
        SurfaceResults clear = run(ROD.replace("POL", pol).replace("ROD", "glass"));
        SurfaceResults lossy = run(ROD.replace("POL", pol).replace("ROD", "lossy"));
        for (int q = 0; q < 3; q++) {
            double rod = value(clear, "rod_out", q);
            double all = value(clear, "all_out", q);
            assertEquals(0, rod, CONSERVATION, pol + " frequency " + q + ": net power out of the lossless rod's box");
            // the source's power leaves through the big box: the rod scatters some of it back onto the source,
            // which changes what the source gives out by a few per cent (measured 0.97-1.03)
            assertTrue(all > 0.8 && all < 1.2, pol + " frequency " + q + ": power out of the box round everything " + all);
            assertEquals(value(clear, "ring_net_out", q), value(clear, "ring_far_total", q),
                    FAR_TOTAL * value(clear, "ring_net_out", q), pol + " frequency " + q + ": far-field total");
            // an absorbing rod takes power: measured 6-9 % of the source's
            assertTrue(value(lossy, "rod_out", q) < -0.01, pol + " frequency " + q + ": the lossy rod absorbs");
        }
    }

    /** A Gaussian beam in glass leaving upwards through a line; placeholders POL, ANGLE. */
    private static final String BEAM = """
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 12 um, height: 4 um, background: glass}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
            sources:
              - gaussian_beam:
                  y: -1 um
                  waist: 1.2 um
                  waist_at: [0, -1 um]
                  angle: ANGLE deg
                  direction: up
                  signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}
            surfaces:
              wavelengths: 633 nm
              exit_spectra:
                - {name: top, y: 0.8 um, towards: up, numerical_aperture: 0.3}
            until: {energy_below: 1e-6, latest: 300 fs}
            """;

    /**
     * The simulated angular distribution against the analytic one, both over their peaks, at every propagating bin:
     * measured at most 2.6e-4 of the peak (s at 20°; 8e-5 at 0°, s and p); 10x that (the issue asks 1 %).
     */
    static final double SPECTRUM = 3e-3;

    @ParameterizedTest
    @ValueSource(strings = {"s 0", "p 0", "s 20"})
    void aGaussianBeamLeavesThroughALineWithItsAnalyticAngularSpectrum(String polAndAngle) throws Exception {
        String pol = polAndAngle.split(" ")[0];
        double tilt = Math.toRadians(Double.parseDouble(polAndAngle.split(" ")[1]));
        SurfaceResults r = run(BEAM.replace("POL", pol).replace("ANGLE", polAndAngle.split(" ")[1]));
        SurfaceResults.Spectrum s = r.exits().get(0);
        double[] a = s.anglesDegrees().get(0);
        double[] p = s.perRadian().get(0);
        double k = 1.5 * 2 * Math.PI * r.plan().frequencies()[0] / PhysicalConstants.C0;
        double w0 = 1.2e-6;
        double simPeak = 0;
        double refPeak = 0;
        double[] ref = new double[a.length];
        for (int b = 0; b < a.length; b++) {
            // dP/dθ ∝ cos²ψ exp(−k² w0² sin²ψ / 2), ψ = θ − tilt the angle from the beam's axis (the Jacobian
            // k cos ψ / k_y of the spectrum in kx times dκ/dθ = k cos θ, with the plane wave's power ∝ k_y |A|²)
            double psi = Math.toRadians(a[b]) - tilt;
            double c = Math.cos(psi);
            ref[b] = c * c * Math.exp(-k * k * w0 * w0 * Math.sin(psi) * Math.sin(psi) / 2);
            simPeak = Math.max(simPeak, p[b]);
            refPeak = Math.max(refPeak, ref[b]);
        }
        double worst = 0;
        for (int b = 0; b < a.length; b++) {
            worst = Math.max(worst, Math.abs(p[b] / simPeak - ref[b] / refPeak));
        }
        assertTrue(worst < SPECTRUM, polAndAngle + ": largest difference from the analytic spectrum " + worst + " of the peak");
        // everything the beam carries leaves through the line (the incident power is measured on the same beam)
        // measured 1.00002 for all three; 10x that difference is 2e-4
        assertEquals(1, s.outgoing()[0], 5e-4, polAndAngle + ": outgoing power over the incident power");
    }

    /** A plane wave through an air gap between glass (frustrated total reflection) with an exit line above it. */
    private static final String GAP = """
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 0.4 um, height: 4 um, background: glass}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
            shapes:
              - layer_stack: {start: [0, -100 nm], layers: [{material: air, thickness: 200 nm}]}
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave: {y: -1 um, angle: 45 deg, signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}}
            flux:
              wavelengths: [620 nm, 646 nm]
              lines:
                - {y: 1 um, measures: transmitted}
              transfer_matrix: true
            surfaces:
              wavelengths: [620 nm, 646 nm]
              exit_spectra:
                - {name: up, y: 1.2 um, towards: up, numerical_aperture: 1.2}
            until: {energy_below: 1e-6, latest: 400 fs}
            """;

    /**
     * The exit line's one Bloch order against the flux line's T (the same wave through two lines 0.2 um apart, two
     * recorders): measured at most 4.3e-6 (s and p, two wavelengths); 10x that.
     */
    static final double SAME_WAVE = 4e-5;
    /**
     * Against the transfer matrix (Born &amp; Wolf, <i>Principles of Optics</i>, sec. 1.6, the characteristic matrix):
     * the grid's discretisation error at 20 cells per wavelength, measured at most 6.1e-3 relative (s; p 5.4e-4); 10x
     * that.
     */
    static final double EXACT = 6e-2;

    @ParameterizedTest
    @ValueSource(strings = {"s", "p"})
    void aPlaneWaveLeavesInOneOrderWithTheTransferMatrixTransmittance(String pol) throws Exception {
        CasePlan p = plan(GAP.replace("POL", pol));
        CaseRunner.run(p, null, 1);
        SurfaceResults r = SurfaceResults.of(p.surfaces().orElseThrow());
        FluxResults f = FluxResults.of(p.flux().orElseThrow(), p.spec().polarization().value());
        int t = f.columns().indexOf("T_transmitted");
        int exact = f.columns().indexOf("T_transmitted_exact");
        for (int q = 0; q < 2; q++) {
            double up = value(r, "up_out", q);
            double ft = f.rows().get(q).values()[t];
            double te = f.rows().get(q).values()[exact];
            assertEquals(ft, up, SAME_WAVE, pol + " frequency " + q + ": exit line against the flux line");
            assertEquals(te, up, EXACT * te, pol + " frequency " + q + ": exit line against the transfer matrix");
            assertEquals(up, value(r, "up_within_na", q), 1e-12, pol + " frequency " + q + ": the order is within NA 1.2");
            // the one order leaves at the transmitted angle: the incident angle at that frequency, by Snell's law
            double[] angles = r.exits().get(0).anglesDegrees().get(q);
            double[] power = r.exits().get(0).perRadian().get(q);
            int best = 0;
            for (int b = 1; b < power.length; b++) {
                best = power[b] > power[best] ? b : best;
            }
            assertEquals(f.rows().get(q).angleDegrees(), angles[best], 1e-9, pol + " frequency " + q + ": exit angle");
        }
    }

    /**
     * A plane-wave box gives out no net power of its own: a 'source' norm would divide by about zero; 'incident' (the
     * default with a box) divides by its wave's intensity, and 'absolute' by nothing.
     */
    @ParameterizedTest
    @ValueSource(strings = {"", "  normalise: incident\n", "  normalise: absolute\n"})
    void aPlaneWaveBoxTakesIncidentOrAbsoluteButNotSourcePowers(String normalise) {
        String text = """
                design_wavelength: 633 nm
                polarization: s
                domain: {width: 3.2 um, height: 3.2 um}
                grid: {cells_per_wavelength: 20}
                materials:
                  glass: {index: 1.5}
                shapes:
                  - disk: {centre: [0, 0], radius: 200 nm, material: glass}
                boundaries: {all: pml 0.5 um}
                sources:
                  - plane_wave_box:
                      from: [-0.5 um, -0.5 um]
                      to: [0.5 um, 0.5 um]
                      signal: {ramped_wave: {wavelength: 633 nm}}
                surfaces:
                """ + normalise + """
                  far_field:
                    - {name: ring, from: [-0.9 um, -0.9 um], to: [0.9 um, 0.9 um]}
                until: {time: 120 fs}
                """;
        assertDoesNotThrow(() -> CaseLoader.parse(text, "t.yaml", Map.of(), ReadOptions.defaults()));
        String source = normalise.isEmpty() ? text.replace("surfaces:\n", "surfaces:\n  normalise: source\n")
                : text.replace(normalise, "  normalise: source\n");
        CaseFileException e = assertThrows(CaseFileException.class, () -> CaseLoader.parse(source, "t.yaml", Map.of(),
                ReadOptions.defaults()));
        assertTrue(e.getMessage().contains("surfaces.normalise: 'source' divides by the power point and line sources "
                + "radiate, and a plane_wave_box gives out none of its own"), e.getMessage());
    }
}
