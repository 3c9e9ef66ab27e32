package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.CylinderSeries;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Scattering widths written directly by a case file: a rod in a plane-wave box with a far-field contour outside it
 * and the default {@code incident} norm, whose powers are then widths in metres, against the exact series of a
 * cylinder (C. F. Bohren &amp; D. R. Huffman, <i>Absorption and Scattering of Light by Small Particles</i>, 1983,
 * ch. 8, §8.4: σ(φ), C_sca, C_abs).
 */
class ScatteringWidthRunTest {

    static final double LAMBDA = 633e-9;
    static final double RADIUS = 200e-9;

    /** A rod of ROD (glass or lossy) in a plane-wave box, 20 cells per wavelength in the glass; placeholder POL. */
    private static final String CASE = """
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 3.2 um, height: 3.2 um}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
              lossy: {index: 1.5, conductivity: 5e4 S/m}
            shapes:
              - disk: {centre: [0, 0], radius: 200 nm, material: ROD}
            boundaries: {all: pml 0.5 um}
            sources:
              - plane_wave_box:
                  from: [-0.5 um, -0.5 um]
                  to: [0.5 um, 0.5 um]
                  heading: 30 deg
                  signal: {ramped_wave: {wavelength: 633 nm}}
            surfaces:
              boxes:
                - {name: rod, from: [-0.35 um, -0.35 um], to: [0.35 um, 0.35 um]}
              far_field:
                - {name: ring, from: [-0.8 um, -0.8 um], to: [0.8 um, 0.8 um], angles: 360}
            until: {time: 150 fs}
            """;

    private static SurfaceResults run(String pol, String rod) throws Exception {
        CasePlan p = CasePlanner.plan(CaseLoader.parse(CASE.replace("POL", pol).replace("ROD", rod), "t.yaml", Map.of(),
                ReadOptions.defaults()).spec(), 2);
        CaseRunner.run(p, null, 1);
        return SurfaceResults.of(p.surfaces().orElseThrow());
    }

    private static double value(SurfaceResults r, String column) {
        return r.rows()[0][r.columns().indexOf(column)];
    }

    /**
     * C_sca in metres against the series: measured +0.67 % (s) and +0.53 % (p) at 20 cells per wavelength in the
     * glass (30 in the vacuum round it), 2026-12-04 (the grid's error at this resolution, falling as Δ²:
     * CylinderScatteringTest); the bound, 1 %.
     */
    static final double TOTAL = 0.01;
    /**
     * σ(φ) at the forward and backward angles against the series: measured +0.8 %, −0.6 % (s), +0.9 %, +1.0 % (p);
     * the 2 % is checked at finer cells (CylinderScatteringTest); here about 3.5x the worst measurement.
     */
    static final double EDGES = 0.035;
    /**
     * C_ext from the optical theorem against C_sca for the lossless rod: measured −0.14 % (s) and −0.08 % (p) at this
     * heading of 30° (2026-12-04); the bound, 1 %. Before the transformation followed the grid's own waves
     * (phases with the continuum's k), +0.6 % and +0.9 % here, +1.2 % and +1.7 % at 0°, growing with the contour.
     */
    static final double THEOREM = 0.01;
    /** −(net power out of a box round the lossy rod) against the series' C_abs: measured −0.2 % (and its C_sca −0.5 %), s; about 6x that. */
    static final double ABSORPTION = 0.03;

    private static CylinderSeries series(String pol, Complex index) {
        return CylinderSeries.dielectric(Polarization.valueOf(pol.toUpperCase()), RADIUS, index, 1.0, LAMBDA)
                .incidentAlong(Math.toRadians(30));
    }

    @ParameterizedTest
    @ValueSource(strings = {"s", "p"})
    void aRodInAPlaneWaveBoxHasTheSeriesScatteringWidths(String pol) throws Exception {
        SurfaceResults r = run(pol, "glass");
        CylinderSeries exact = series(pol, Complex.real(1.5));
        double sca = value(r, "ring_far_total");
        double ext = value(r, "ring_extinction");
        SurfaceResults.Pattern ring = r.farFields().get(0);
        // angles every degree from +x: the forward direction is 30°, the backward 210°
        double forward = ring.values()[0][30] / exact.scatteringWidth(0) - 1;
        double backward = ring.values()[0][210] / exact.scatteringWidth(Math.PI) - 1;
        System.out.printf("%s: C_sca %.5g m (series %.5g, %+.4f), forward %+.4f, backward %+.4f, C_ext/C_sca %+.4f%n", pol,
                sca, exact.scatteringWidthTotal(), sca / exact.scatteringWidthTotal() - 1, forward, backward, ext / sca - 1);
        assertTrue(r.plan().widths(), "the incident norm with a plane-wave box gives widths");
        assertEquals(exact.scatteringWidthTotal(), sca, TOTAL * exact.scatteringWidthTotal(), pol + ": C_sca, m");
        assertEquals(0, forward, EDGES, pol + ": σ forward");
        assertEquals(0, backward, EDGES, pol + ": σ backward");
        assertEquals(sca, ext, THEOREM * sca, pol + ": C_ext from the optical theorem against C_sca (lossless)");
        assertTrue(r.patternCsv(ring).startsWith("angle_deg,sigma_m_633.000nm\n"), "the far-field table holds σ in m");
    }

    @ParameterizedTest
    @ValueSource(strings = {"s"})
    void aBoxRoundALossyRodInsideThePlaneWaveBoxMeasuresItsAbsorptionWidth(String pol) throws Exception {
        SurfaceResults r = run(pol, "lossy");
        double omega = 2 * Math.PI * PhysicalConstants.C0 / LAMBDA;
        // ε = n² + iσ/(ωε0) (exp(−iωt)), N its root with a positive imaginary part
        Complex eps = new Complex(2.25, 5e4 / (omega * PhysicalConstants.EPS0));
        CylinderSeries exact = series(pol, eps.sqrt());
        double abs = -value(r, "rod_out");
        double sca = value(r, "ring_far_total");
        System.out.printf("%s lossy: C_abs %.5g m (series %.5g, %+.4f), C_sca %.5g m (series %.5g, %+.4f)%n", pol, abs,
                exact.absorptionWidth(), abs / exact.absorptionWidth() - 1, sca, exact.scatteringWidthTotal(),
                sca / exact.scatteringWidthTotal() - 1);
        assertEquals(exact.absorptionWidth(), abs, ABSORPTION * exact.absorptionWidth(), pol + ": C_abs, m");
        assertEquals(exact.scatteringWidthTotal(), sca, ABSORPTION * exact.scatteringWidthTotal(), pol + ": C_sca, m");
    }
}
