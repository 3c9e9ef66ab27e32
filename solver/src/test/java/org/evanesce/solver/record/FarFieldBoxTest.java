package org.evanesce.solver.record;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.farfield.NearToFarField;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The far field of a point source (a line current along z) in a homogeneous medium, from a contour of running
 * transforms, against the closed form of the 2D Green's function (A. Taflove &amp; S. C. Hagness, <i>Computational
 * Electrodynamics</i>, 3rd ed., 2005, ch. 8; C. A. Balanis, <i>Advanced Engineering Electromagnetics</i>, 2nd ed.,
 * 2012, sec. 11.3.2, the infinite line source): the pattern is isotropic, its total is the power through the
 * contour, and that power is P = k η |I|²/8 W/m for an electric line current I (A), k |K|²/(8η) for a magnetic one
 * K (V), η = η0/n, k = n k0.
 */
class FarFieldBoxTest {

    private static final int N = 121;
    private static final double DX = 20e-9;
    private static final double F = 4e14;
    private static final double[] FREQS = {0.85 * F, F, 1.15 * F};
    private static final int STEPS = 3000;

    /**
     * Box flux against the far field's total: measured at most 4.1e-3 (the grid's near field travels with the grid's
     * wavenumber, the transformation uses the continuum's; O((kΔ)²)); 10x that.
     */
    private static final double TOTAL_TOLERANCE = 4e-2;
    /**
     * Spread max/min − 1 of dP/dφ over 72 angles (the Yee grid's anisotropy, 22-44 cells per wavelength in the
     * medium): measured at most 1.5e-2 (n = 1.5, highest frequency); 10x that.
     */
    private static final double ISOTROPY_TOLERANCE = 0.15;
    /**
     * Closed form against the grid's radiated power (the lattice's own Green's function differs by O((kΔ)²)):
     * measured 2.3e-3 to 1.0e-2, growing with kΔ as expected; 10x the largest.
     */
    private static final double CLOSED_FORM_TOLERANCE = 0.1;

    @ParameterizedTest
    @CsvSource({"S, 1.0", "P, 1.0", "S, 1.5", "P, 1.5"})
    void aPointSourceRadiatesIsotropicallyItsClosedFormPower(Polarization pol, double index) {
        Material medium = Material.ofIndex("medium", index);
        MaterialGrid grid = Rasterizer.rasterize(Scene.builder(medium).build(), new GridSpec(0, 0, DX, N, N),
                Smoothing.ANISOTROPIC);
        Component z = pol == Polarization.S ? Component.EZ : Component.HZ;
        TimeSignal g = TimeSignal.gaussianPulse(F, F / 3);
        double amplitude = 2.0;
        int l = pol == Polarization.S ? 39 : 40;
        FarFieldBox contour = new FarFieldBox(pol, l, l, 80, 80, FREQS);
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).threads(1)
                .source(Source.point(z, N, 60, 60, amplitude, g)).listener(contour);
        for (Side s : Side.values()) {
            b.boundary(s, Boundary.pml(14));
        }
        double dt;
        try (Simulation sim = b.build()) {
            dt = sim.dt();
            sim.run(STEPS);
        }
        // the source's site: Ez at node (60, 60) for s, Hz at (60.5, 60.5) for p
        double ox = pol == Polarization.S ? 60 * DX : 60.5 * DX;
        for (int q = 0; q < FREQS.length; q++) {
            NearToFarField ff = contour.farField(q, index, 0, 0, DX, ox, ox);
            double total = ff.radiatedPower();
            double box = contour.box().outward(q, DX);
            assertEquals(box, total, TOTAL_TOLERANCE * box, pol + " n=" + index + " frequency " + q + ": far-field total");
            double lo = Double.POSITIVE_INFINITY;
            double hi = 0;
            for (int a = 0; a < 72; a++) {
                double p = ff.powerPerRadian(2 * Math.PI * a / 72);
                lo = Math.min(lo, p);
                hi = Math.max(hi, p);
            }
            assertTrue(hi / lo - 1 < ISOTROPY_TOLERANCE, pol + " frequency " + q + ": pattern max/min " + hi / lo);
            // the source adds amplitude·g(t)·(cb or S) at each step: a current η0 Δ J (electric) or Δ M (magnetic) per
            // cell (Source), so I = J Δ² = v Δ/η0 and K = M Δ² = v Δ with v the transform of amplitude·g
            double w = 2 * Math.PI * FREQS[q];
            double re = 0;
            double im = 0;
            double shift = pol == Polarization.S ? 0.5 : 0.0;
            for (int n = 0; n < STEPS; n++) {
                double t = (n + shift) * dt;
                re += g.value(t) * Math.cos(w * t) * dt;
                im += g.value(t) * Math.sin(w * t) * dt;
            }
            double v2 = amplitude * amplitude * (re * re + im * im);
            double k0 = w / PhysicalConstants.C0;
            // P = k0 η0 |I|²/8 (s; n cancels) and n² k0 |K|²/(8 η0) (p), in the transforms' units (FluxLine: ½ Re(E H*))
            double closed = (pol == Polarization.S ? 1 : index * index) * k0 * DX * DX * v2 / (8 * PhysicalConstants.ETA0);
            assertEquals(closed, box, CLOSED_FORM_TOLERANCE * closed, pol + " n=" + index + " frequency " + q + ": closed form");
        }
    }

    /**
     * The run's worker threads share the contour's cells: its transforms are bitwise those of one thread for 2 and 3
     * threads (threading threshold lowered), on an awkward grid with the contour's sides split unevenly, s and p,
     * float and double (STYLE.md item 5).
     */
    @ParameterizedTest(name = "{0} {1}")
    @CsvSource({"S, FLOAT", "P, FLOAT", "S, DOUBLE", "P, DOUBLE"})
    void threadedContoursEqualTheSingleThreadedOne(Polarization pol, org.evanesce.solver.grid.Precision precision) {
        double[][] one = contourTransforms(pol, precision, 1);
        for (int threads : new int[] {2, 3}) {
            double[][] many = contourTransforms(pol, precision, threads);
            for (int a = 0; a < one.length; a++) {
                for (int k = 0; k < one[a].length; k++) {
                    if (Double.doubleToRawLongBits(one[a][k]) != Double.doubleToRawLongBits(many[a][k])) {
                        throw new AssertionError(String.format("%s %s grid 67×43, %d threads vs 1: transform %d differs at "
                                + "sample %d after 400 steps (%s vs %s)", pol, precision, threads, a, k, many[a][k], one[a][k]));
                    }
                }
            }
        }
    }

    /** Every side's E and H transforms at every frequency, after a pulse from a point source on a 67 × 43 grid. */
    private static double[][] contourTransforms(Polarization pol, org.evanesce.solver.grid.Precision precision, int threads) {
        Material medium = Material.ofIndex("medium", 1.3);
        MaterialGrid grid = Rasterizer.rasterize(Scene.builder(medium).build(), new GridSpec(0, 0, DX, 67, 43),
                Smoothing.ANISOTROPIC);
        Component z = pol == Polarization.S ? Component.EZ : Component.HZ;
        FarFieldBox contour = new FarFieldBox(pol, 11, 9, 53, 31, FREQS);
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(precision).threads(threads)
                .minCellsPerThread(1).source(Source.point(z, 67, 30, 20, 1.0, TimeSignal.gaussianPulse(F, F / 3)))
                .listener(contour);
        for (Side s : Side.values()) {
            b.boundary(s, Boundary.pml(6));
        }
        try (Simulation sim = b.build()) {
            assertEquals(threads, sim.threads(), "threads actually used");
            sim.run(400);
        }
        java.util.List<double[]> out = new java.util.ArrayList<>();
        for (FluxLine side : contour.box().sides()) {
            for (int q = 0; q < FREQS.length; q++) {
                for (double[] part : side.electricTransform(q)) {
                    out.add(part);
                }
                for (double[] part : side.magneticTransform(q)) {
                    out.add(part);
                }
            }
        }
        return out.toArray(new double[0][]);
    }
}
