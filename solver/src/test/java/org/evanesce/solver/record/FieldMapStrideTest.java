package org.evanesce.solver.record;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
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
 * A field map that reads every N-th step ({@link FieldMap#stride}): each cell is the definition's sum over those
 * steps, and for a pulse whose spectrum the stride does not alias onto the mapped frequency it is the every-step
 * map (the sampling theorem: C. E. Shannon, "Communication in the presence of noise", Proc. IRE 37, 10–21, 1949,
 * Theorem 1; the Poisson summation formula), while a stride that folds the pulse's negative frequencies onto the
 * mapped one is not.
 */
class FieldMapStrideTest {

    private static final double WAVELENGTH = 633e-9;
    private static final double COURANT = 0.5;
    private static final int PML = 20;
    /** As FieldMapTest: the map and the hand sum add the same products, up to where Δt is multiplied in (~1e-16). */
    private static final double SAME_SUM = 1e-12;
    /**
     * A stride within the rule against every step, relative to the largest transform: what is left is the float
     * fields' rounding and the pulse's start at e^−18 of its peak; measured 1.5e-7 (s), 1.9e-7 (p) at stride 7.
     */
    private static final double SAME_TRANSFORM = 2e-6;
    /** A stride with 1/(NΔt) = 2f folds −f onto f: the test needs at least this departure (measured 1.0, s and p). */
    private static final double ALIASED = 1e-2;

    /**
     * A plane wave at 30° in vacuum (Bloch sides), a pulse at f with σf = f/10, run until it has left: the maps with
     * stride 1, with the largest stride for which 1/(NΔt) ≥ 2 (f + f + 6σf) (the planner's rule, io.plan.MapStride) and
     * with 1/(NΔt) = 2f. 40 steps per period at S = 0.5 and 20 cells per wavelength.
     */
    @ParameterizedTest(name = "{0}")
    @EnumSource(Polarization.class)
    void aStrideThatAliasesNothingGivesTheEveryStepMap(Polarization pol) {
        int nx = 6;
        double dx = WAVELENGTH / 20;
        double f = PhysicalConstants.C0 / WAVELENGTH;
        double kx = 0.5 * 2 * Math.PI / WAVELENGTH;
        int source = PML + 5;
        int j0 = source + 6;
        int h = 12;
        int ny = j0 + h + 10 + PML;
        double dt = COURANT * dx / PhysicalConstants.C0;
        double top = f + 6 * f / 10;
        int within = (int) Math.floor(1 / (2 * dt * (f + top)));
        int folding = (int) Math.round(1 / (2 * f * dt));
        assertTrue(within > 1 && folding > within, "strides " + within + " and " + folding);
        FieldMap every = new FieldMap(pol, 0, j0, nx, j0 + h, f);
        FieldMap strided = new FieldMap(pol, 0, j0, nx, j0 + h, f).stride(within);
        FieldMap aliased = new FieldMap(pol, 0, j0, nx, j0 + h, f).stride(folding);
        List<Probe> probes = new ArrayList<>();
        Simulation.Builder b = Simulation.builder(vacuum(dx, nx, ny)).polarization(pol).courant(COURANT)
                .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                .boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML)).threads(2)
                .source(Source.blochRow(pol.components()[0], nx, source, 0.0, dx, kx, TimeSignal.gaussianPulse(f, f / 10)))
                .listener(every).listener(strided).listener(aliased);
        for (Component c : pol.components()) {
            Probe p = new Probe(c, 3, j0 + 5);
            probes.add(p);
            b.listener(p);
        }
        try (Simulation s = b.build()) {
            assertEquals(dt, s.dt(), 1e-15 * dt);
            // the pulse lasts 12τ, τ = 1/(2π f/10); then a few crossings of the grid into the PMLs
            s.run((long) (12 * 10 / (2 * Math.PI) / (f * dt)) + 8L * ny);
        }
        double peak = 0;
        for (Component c : pol.components()) {
            double[][] z = every.transform(c, 0);
            for (int t = 0; t < z[0].length; t++) {
                peak = Math.max(peak, Math.hypot(z[0][t], z[1][t]));
            }
        }
        assertTrue(peak > 0, pol + ": no field reached the map");
        double worst = 0;
        double worstAliased = 0;
        int k = 0;
        for (Component c : pol.components()) {
            double[][] z = every.transform(c, 0);
            double[][] y = strided.transform(c, 0);
            double[][] a = aliased.transform(c, 0);
            for (int t = 0; t < z[0].length; t++) {
                worst = Math.max(worst, Math.hypot(y[0][t] - z[0][t], y[1][t] - z[1][t]) / peak);
                worstAliased = Math.max(worstAliased, Math.hypot(a[0][t] - z[0][t], a[1][t] - z[1][t]) / peak);
            }
            double[] hand = hand(probes.get(k++), f, within);
            double[] cell = strided.transform(c, 0, 3, j0 + 5);
            String ctx = String.format("%s %s at (3, %d), stride %d", pol, c, j0 + 5, within);
            assertEquals(hand[0], cell[0], SAME_SUM * peak, ctx);
            assertEquals(hand[1], cell[1], SAME_SUM * peak, ctx);
        }
        String ctx = String.format("%s, %.1f steps per period: stride %d differs from every step by %.2e of the largest "
                + "transform, stride %d (1/(NΔt) = 2f) by %.2e", pol, 1 / (f * dt), within, worst, folding, worstAliased);
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.println(ctx);
        }
        assertTrue(worst < SAME_TRANSFORM, ctx);
        assertTrue(worstAliased > ALIASED, ctx);
    }

    /**
     * The map's scalar loop, its vector loop and the choice by timing (which mixes them within a step) give the same
     * bits: 2 threads, real and Bloch (complex) fields, a map width that leaves a scalar remainder.
     */
    @ParameterizedTest(name = "{0}")
    @EnumSource(Polarization.class)
    void theScalarAndTheVectorLoopGiveTheSameBits(Polarization pol) {
        for (double kx : new double[] {0, 0.3 * 2 * Math.PI / WAVELENGTH}) {
            // each band's share of the map (about 59 × 38 cells) exceeds FieldMap.TRIAL_CELLS: the timed map mixes
            // the loops within a call
            int nx = 61;
            int ny = 2 * PML + 81;
            double dx = WAVELENGTH / 20;
            double f = PhysicalConstants.C0 / WAVELENGTH;
            FieldMap[] maps = new FieldMap[3];
            Simulation.Builder b = Simulation.builder(vacuum(dx, nx, ny)).polarization(pol).courant(COURANT)
                    .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                    .boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML)).threads(2)
                    .source(Source.point(pol.components()[0], nx, nx / 2, PML + 8, 1.0, TimeSignal.gaussianPulse(f, f / 4)));
            for (int k = 0; k < maps.length; k++) {
                maps[k] = new FieldMap(pol, 1, PML + 2, nx - 1, ny - PML - 2, f, 1.2 * f).stride(3);
                maps[k].forceVectors = k == 0 ? Boolean.FALSE : k == 1 ? Boolean.TRUE : null;
                b.listener(maps[k]);
            }
            try (Simulation s = b.build()) {
                s.run(401);
            }
            for (Component c : pol.components()) {
                for (int q = 0; q < 2; q++) {
                    double[][] scalar = maps[0].transform(c, q);
                    String ctx = String.format("%s %s, kx %g, frequency %d", pol, c, kx, q);
                    for (int k = 1; k < maps.length; k++) {
                        assertArrayEquals(scalar[0], maps[k].transform(c, q)[0], 0.0, ctx + (k == 1 ? ", vectors" : ", timed"));
                        assertArrayEquals(scalar[1], maps[k].transform(c, q)[1], 0.0, ctx + (k == 1 ? ", vectors" : ", timed"));
                    }
                }
            }
        }
    }

    @ParameterizedTest(name = "{0}")
    @EnumSource(Polarization.class)
    void aStrideBelowOneIsRefused(Polarization pol) {
        FieldMap m = new FieldMap(pol, 0, 0, 3, 3, 1e14);
        assertThrows(IllegalArgumentException.class, () -> m.stride(0));
        assertEquals(1, m.stride());
    }

    /** X(f) = Σ (re + i im) e^{i2πft} NΔt over the probe's samples at steps that are multiples of N (the first is step 1). */
    private static double[] hand(Probe p, double f, int n) {
        double[] v = p.values();
        double[] w = p.imagValues();
        double[] t = p.times();
        double dt = t[1] - t[0];
        double re = 0;
        double im = 0;
        for (int s = n - 1; s < v.length; s += n) {
            double a = 2 * Math.PI * f * t[s];
            re += (v[s] * Math.cos(a) - w[s] * Math.sin(a)) * (n * dt);
            im += (v[s] * Math.sin(a) + w[s] * Math.cos(a)) * (n * dt);
        }
        return new double[] {re, im};
    }

    private static MaterialGrid vacuum(double dx, int nx, int ny) {
        return Rasterizer.rasterize(Scene.builder(Material.VACUUM).build(), new GridSpec(0, 0, dx, nx, ny), Smoothing.NONE);
    }
}
