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
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The field map's transforms against probes' time series transformed here, a plane wave's phase against the
 * Yee grid's dispersion relation, and its memory count.
 */
class FieldMapTest {

    private static final double WAVELENGTH = 633e-9;
    private static final double COURANT = 0.5;
    private static final int PML = 20;
    /**
     * The map and the hand transform add the same products in the same order, up to where Δt is multiplied in:
     * rounding of a few hundred terms, relative to the largest transform (measured ~1e-16).
     */
    private static final double SAME_SUM = 1e-12;
    /** Issue: the phase steps within 1e-3 rad of kxΔ and of the grid's kyΔ. */
    private static final double PHASE_TOL = 1e-3;

    /**
     * Every cell of a 3 × 4 map, and of a one-cell map, equals X(f) = Σ (re + i im) e^{i2πft} Δt of a probe's
     * recorded series at that cell, each component at its own sample times, with and without a time window,
     * at two frequencies; a Bloch run, so the imaginary parts are exercised.
     */
    @ParameterizedTest(name = "{0}")
    @EnumSource(Polarization.class)
    void cellsEqualTheTransformOfAProbesSeries(Polarization pol) {
        int nx = 7;
        int ny = 2 * PML + 30;
        double dx = WAVELENGTH / 20;
        double f = PhysicalConstants.C0 / WAVELENGTH;
        double kx = 0.4 * 2 * Math.PI / WAVELENGTH;
        double[] freqs = {f, 1.13 * f};
        int i0 = 2;
        int j0 = PML + 12;
        FieldMap map = new FieldMap(pol, i0, j0, i0 + 3, j0 + 4, freqs);
        FieldMap single = new FieldMap(pol, 4, j0 + 2, 5, j0 + 3, freqs);
        int steps = 300;
        double dt = COURANT * dx / PhysicalConstants.C0;
        double start = 60.2 * dt;
        double end = 211.7 * dt;
        FieldMap windowed = new FieldMap(pol, i0, j0, i0 + 3, j0 + 4, freqs).window(start, end);
        List<Probe> probes = new ArrayList<>();
        Simulation.Builder b = Simulation.builder(vacuum(dx, nx, ny)).polarization(pol).courant(COURANT)
                .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                .boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML)).threads(1)
                .source(Source.blochRow(pol.components()[0], nx, PML + 5, 0.0, dx, kx, TimeSignal.gaussianPulse(f, f / 3)))
                .listener(map).listener(single).listener(windowed);
        for (Component c : pol.components()) {
            for (int j = j0; j < j0 + 4; j++) {
                for (int i = i0; i < i0 + 3; i++) {
                    Probe p = new Probe(c, i, j);
                    probes.add(p);
                    b.listener(p);
                }
            }
        }
        try (Simulation s = b.build()) {
            assertEquals(dt, s.dt(), 1e-15 * dt);
            s.run(steps);
        }
        for (int q = 0; q < freqs.length; q++) {
            double peak = 0;
            for (Probe p : probes) {
                peak = Math.max(peak, Math.hypot(hand(p, freqs[q], -1, 1)[0], hand(p, freqs[q], -1, 1)[1]));
            }
            assertTrue(peak > 0, pol + ": no field reached the map");
            int k = 0;
            for (Component c : pol.components()) {
                double[][] all = map.transform(c, q);
                double[][] win = windowed.transform(c, q);
                for (int j = j0; j < j0 + 4; j++) {
                    for (int i = i0; i < i0 + 3; i++) {
                        Probe p = probes.get(k++);
                        String ctx = String.format("%s %s at cell (%d, %d), frequency %d", pol, c, i, j, q);
                        int t = (j - j0) * 3 + (i - i0);
                        double[] x = hand(p, freqs[q], Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
                        assertEquals(x[0], all[0][t], SAME_SUM * peak, ctx);
                        assertEquals(x[1], all[1][t], SAME_SUM * peak, ctx);
                        assertArrayEquals(new double[] {all[0][t], all[1][t]}, map.transform(c, q, i, j), 0.0, ctx);
                        double[] xw = hand(p, freqs[q], start, end);
                        assertEquals(xw[0], win[0][t], SAME_SUM * peak, ctx + ", windowed");
                        assertEquals(xw[1], win[1][t], SAME_SUM * peak, ctx + ", windowed");
                        assertTrue(Math.abs(xw[0] - x[0]) + Math.abs(xw[1] - x[1]) > 1e3 * SAME_SUM * peak,
                                ctx + ": the window made no difference");
                        if (i == 4 && j == j0 + 2) {
                            assertArrayEquals(map.transform(c, q, i, j), single.transform(c, q, i, j), SAME_SUM * peak, ctx);
                        }
                    }
                }
            }
        }
    }

    /** X(f) of a probe's series over sample times in [start, end), by the definition. */
    private static double[] hand(Probe p, double f, double start, double end) {
        double[] v = p.values();
        double[] w = p.imagValues();
        double[] t = p.times();
        double dt = t[1] - t[0];
        double re = 0;
        double im = 0;
        for (int n = 0; n < v.length; n++) {
            if (t[n] >= start && t[n] < end) {
                double a = 2 * Math.PI * f * t[n];
                re += (v[n] * Math.cos(a) - w[n] * Math.sin(a)) * dt;
                im += (v[n] * Math.sin(a) + w[n] * Math.cos(a)) * dt;
            }
        }
        return new double[] {re, im};
    }

    /**
     * A plane wave at 30° in vacuum with Bloch sides, launched upward from a row: in the map above the source every
     * component's phase advances by kxΔ per cell along x and by the grid's kyΔ per cell along y, where the 2D Yee
     * scheme's dispersion relation (Taflove &amp; Hagness, Computational Electrodynamics, 3rd ed., ch. 4; from memory)
     * sin²(ωΔt/2)/(cΔt)² = sin²(kxΔ/2)/Δ² + sin²(kyΔ/2)/Δ² fixes ky. At 8 cells per wavelength the continuum ky
     * differs from it by much more than the tolerance, which the test checks, so it tells the two apart (grid kyΔ
     * 0.68938, continuum 0.68017). Measured largest errors per cell: along x 1e-7 rad, along y 7e-6 rad (s and p);
     * what is left is the top PML's reflection.
     */
    @ParameterizedTest(name = "{0}")
    @EnumSource(Polarization.class)
    void planeWavePhaseFollowsTheGridsDispersion(Polarization pol) {
        int nx = 6;
        double dx = WAVELENGTH / 8;
        double f = PhysicalConstants.C0 / WAVELENGTH;
        double k0 = 2 * Math.PI / WAVELENGTH;
        double kx = k0 * Math.sin(Math.toRadians(30));
        int source = PML + 5;
        int j0 = source + 10;
        int h = 20;
        int ny = j0 + h + 20 + PML;
        FieldMap map = new FieldMap(pol, 0, j0, nx, j0 + h, f);
        double dt;
        try (Simulation s = Simulation.builder(vacuum(dx, nx, ny)).polarization(pol).courant(COURANT)
                .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                .boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML)).threads(1)
                .source(Source.blochRow(pol.components()[0], nx, source, 0.0, dx, kx, TimeSignal.gaussianPulse(f, f / 10)))
                .listener(map).build()) {
            dt = s.dt();
            // the pulse lasts 12τ, τ = 1/(2π f/10); then the grid is crossed a few times
            s.run((long) (12 * 10 / (2 * Math.PI) / (f * dt)) + 8L * ny);
        }
        double a = Math.sin(Math.PI * f * dt) / (PhysicalConstants.C0 * dt) * dx;
        double kyGrid = 2 * Math.asin(Math.sqrt(a * a - Math.pow(Math.sin(kx * dx / 2), 2))) / dx;
        double kyContinuum = Math.sqrt(k0 * k0 - kx * kx);
        assertTrue(Math.abs(kyGrid - kyContinuum) * dx > 5 * PHASE_TOL, String.format(
                "kyΔ of the grid %g and of the continuum %g are too close to tell apart", kyGrid * dx, kyContinuum * dx));
        double worstX = 0;
        double worstY = 0;
        for (Component c : pol.components()) {
            double[][] z = map.transform(c, 0);
            for (int j = 0; j < h; j++) {
                for (int i = 0; i < nx; i++) {
                    int t = j * nx + i;
                    if (i + 1 < nx) {
                        worstX = Math.max(worstX, Math.abs(phaseStep(z, t, t + 1) - kx * dx));
                    }
                    if (j + 1 < h) {
                        worstY = Math.max(worstY, Math.abs(phaseStep(z, t, t + nx) - kyGrid * dx));
                    }
                }
            }
        }
        String ctx = String.format("%s, 30°, 8 cells/λ, S = %g: largest phase error per cell along x %.2e rad (kxΔ %.5f), "
                + "along y %.2e rad (grid kyΔ %.5f, continuum %.5f)", pol, COURANT, worstX, kx * dx, worstY, kyGrid * dx,
                kyContinuum * dx);
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.println(ctx);
        }
        assertTrue(worstX < PHASE_TOL, ctx);
        assertTrue(worstY < PHASE_TOL, ctx);
    }

    /** arg(z[b] · conj(z[a])), in (−π, π]. */
    private static double phaseStep(double[][] z, int a, int b) {
        double re = z[0][b] * z[0][a] + z[1][b] * z[1][a];
        double im = z[1][b] * z[0][a] - z[0][b] * z[1][a];
        return Math.atan2(im, re);
    }

    @Test
    void bytesCountTwoDoublesPerCellComponentAndFrequency() {
        FieldMap map = new FieldMap(Polarization.P, 3, 5, 10, 10, 1e14, 2e14, 3e14);
        // 7 × 5 cells, 3 components, 3 frequencies, re and im, 8 bytes each (documented in FieldMap)
        assertEquals(7L * 5 * 3 * 3 * 2 * 8, map.bytes());
        long arrays = 0;
        for (Component c : map.components()) {
            for (int q = 0; q < map.frequencyCount(); q++) {
                double[][] z = map.transform(c, q);
                arrays += (long) (z[0].length + z[1].length) * Double.BYTES;
            }
        }
        assertEquals(arrays, map.bytes());
        assertArrayEquals(new double[] {1e14, 2e14, 3e14}, map.frequencies(), 1e-2);
        assertEquals(7, map.width());
        assertEquals(5, map.height());
    }

    @Test
    void refusesBadRectanglesComponentsAndWindows() {
        assertThrows(IllegalArgumentException.class, () -> new FieldMap(Polarization.S, 3, 0, 3, 4, 1e14));
        assertThrows(IllegalArgumentException.class, () -> new FieldMap(Polarization.S, -1, 0, 3, 4, 1e14));
        assertThrows(IllegalArgumentException.class, () -> new FieldMap(Polarization.S, 0, 0, 3, 4));
        FieldMap map = new FieldMap(Polarization.S, 0, 0, 3, 4, 1e14);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> map.transform(Component.HZ, 0));
        assertTrue(e.getMessage().contains("HZ"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> map.transform(Component.EZ, 0, 3, 0));
        assertThrows(IllegalArgumentException.class, () -> map.window(2e-15, 1e-15));
        FieldMap tooBig = new FieldMap(Polarization.S, 0, 0, 5, 4, 1e14);
        Simulation.Builder b = Simulation.builder(vacuum(1e-8, 4, 2 * PML + 4)).polarization(Polarization.S)
                .boundary(Side.LEFT, Boundary.bloch(0)).boundary(Side.RIGHT, Boundary.bloch(0)).boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML)).listener(tooBig);
        try (Simulation s = b.build()) {
            IllegalStateException x = assertThrows(IllegalStateException.class, s::step);
            assertTrue(x.getMessage().contains("4 × 44"), x.getMessage());
        }
    }

    private static MaterialGrid vacuum(double dx, int nx, int ny) {
        return Rasterizer.rasterize(Scene.builder(Material.VACUUM).build(), new GridSpec(0, 0, dx, nx, ny), Smoothing.NONE);
    }
}
