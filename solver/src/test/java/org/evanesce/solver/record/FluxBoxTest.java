package org.evanesce.solver.record;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Power through closed rectangles (vertical and horizontal flux lines together) against Poynting's
 * theorem (Born &amp; Wolf, Principles of Optics, sec. 1.1.4): in a lossless medium the power leaving
 * any rectangle around a source is the same, and the net power out of a rectangle with no source in
 * it is zero, or minus what an absorber inside takes; and, by the grid's mirror symmetry about a
 * source, the four sides of a centred square carry the same power.
 */
class FluxBoxTest {

    private static final int N = 121;
    private static final double DX = 20e-9;
    private static final double F = 4e14;
    private static final double[] FREQS = {0.9 * F, F, 1.1 * F};
    private static final int STEPS = 2400;

    private static Simulation.Builder builder(Scene scene, Polarization pol, int si, int sj) {
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, DX, N, N), Smoothing.ANISOTROPIC);
        Component z = pol == Polarization.S ? Component.EZ : Component.HZ;
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).threads(2).minCellsPerThread(64)
                .source(Source.point(z, N, si, sj, 1, TimeSignal.gaussianPulse(F, F / 3)));
        for (Side s : Side.values()) {
            b.boundary(s, Boundary.pml(14));
        }
        return b;
    }

    private static double sumOfSides(FluxBox box, int q) {
        double s = 0;
        for (int k = 0; k < 4; k++) {
            s += Math.abs(box.outThrough(k, q, DX));
        }
        return s;
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void everyRectangleAroundASourceCarriesItsPowerAndTheSidesAgreeBySymmetry(Polarization pol) {
        // the source's site: Ez on node (60, 60) for s, Hz at (60.5, 60.5) for p; the square's sides symmetric about it
        int l = pol == Polarization.S ? 39 : 40;
        FluxBox square = new FluxBox(pol, l, l, 80, 80, FREQS);
        FluxBox wide = new FluxBox(pol, 24, 30, 95, 88, FREQS);
        try (Simulation sim = builder(Scene.builder(Material.VACUUM).build(), pol, 60, 60).listener(square).listener(wide).build()) {
            sim.run(STEPS);
        }
        for (int q = 0; q < FREQS.length; q++) {
            double a = square.outward(q, DX);
            double b = wide.outward(q, DX);
            assertTrue(a > 0, "power leaves the square: " + a);
            // measured: the two rectangles agree to 1.7e-7 (s and p; the issue asks 1e-3); 10x that
            assertEquals(a, b, 2e-6 * a, pol + " frequency " + q);
            double side = square.outThrough(1, q, DX);
            for (int k = 0; k < 4; k++) {
                // mirror images of each other on the grid: measured within 1.4e-8 (s) and 2.4e-6 (p, bottom and left
                // against top and right); 10x the larger
                assertEquals(side, square.outThrough(k, q, DX), 3e-5 * side, pol + " side " + k + " frequency " + q);
            }
        }
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void noNetPowerLeavesALosslessInsideAndAnAbsorberTakesSome(Polarization pol) {
        Scene lossless = Scene.builder(Material.VACUUM).add(Ellipse.disk(75 * DX, 60 * DX, 8 * DX), Material.ofIndex("glass", 1.5))
                .build();
        Scene lossy = Scene.builder(Material.VACUUM).add(Ellipse.disk(75 * DX, 60 * DX, 8 * DX), new Material("absorber", 2.0, 5e5))
                .build();
        FluxBox clear = new FluxBox(pol, 60, 44, 92, 76, FREQS);
        FluxBox absorbing = new FluxBox(pol, 60, 44, 92, 76, FREQS);
        try (Simulation sim = builder(lossless, pol, 40, 60).listener(clear).build()) {
            sim.run(STEPS);
        }
        try (Simulation sim = builder(lossy, pol, 40, 60).listener(absorbing).build()) {
            sim.run(STEPS);
        }
        for (int q = 0; q < FREQS.length; q++) {
            double through = sumOfSides(clear, q);
            // measured: |net| at most 2.1e-8 of the power through the sides; 10x that
            assertEquals(0, clear.outward(q, DX), 2e-7 * through, pol + " frequency " + q);
            // measured: the absorber takes 14-21 % of the power through the sides
            assertTrue(absorbing.outward(q, DX) < -0.1 * sumOfSides(absorbing, q), pol + " absorbs at frequency " + q);
        }
    }
}
