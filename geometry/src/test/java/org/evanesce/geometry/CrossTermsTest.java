package org.evanesce.geometry;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.geometry.shape.HalfPlane;
import org.evanesce.geometry.shape.Rectangle;
import org.junit.jupiter.api.Test;

/**
 * The off-diagonal element of the smoothed inverse permittivity against the tensor of anisotropic smoothing,
 * ε⁻¹ = P⟨1/ε⟩ + (1 − P)/⟨ε⟩ with P = n nᵀ, so (ε⁻¹)_xy = n_x n_y (⟨1/ε⟩ − 1/⟨ε⟩) (A. Farjadpour et al., "Improving
 * accuracy by subpixel smoothing in the finite-difference time domain", Opt. Lett. 31, 2972 (2006), eq. 1).
 */
class CrossTermsTest {

    private static final double D = 20e-9;
    private static final Material GLASS = new Material("glass", 4.0, 0.0);
    /** Hand-computed values are given to seven significant figures. */
    private static final double HAND = 1e-7;
    /**
     * Against fill fractions from 400 × 400 subsamples per pixel (a straight cut's area off by well under one subsample
     * row, 1/400 of the pixel): measured at most 5.4e-6 over 64 sites (2026-12-04); about 10x that.
     */
    private static final double SUBSAMPLED = 5e-5;

    @Test
    void diagonalInterfaceByHand() {
        // the interface x + y = 5 cells, glass below it (as RasterizerTest): Ex at (4.5, 0) has 7/8 of its pixel in
        // glass: ⟨ε⟩ = 3.625, ⟨1/ε⟩ = 0.34375, n_x n_y = ½: (ε⁻¹)_xy = ½ (0.34375 − 1/3.625) = 0.03394397; the grid's
        // edges keep two cells free, so take the same line further in: x + y = 9 cells, Ex at (4.5, 4)
        Scene diagonal = Scene.builder(Material.VACUUM).add(new HalfPlane(9 * D, 0, 1, 1), GLASS).build();
        MaterialGrid g = Rasterizer.rasterize(diagonal, new GridSpec(0, 0, D, 16, 16), Smoothing.ANISOTROPIC);
        assertEquals(0.03394397, g.crossTerms().at(FieldSite.EX, 4, 4, 16), HAND);
        assertEquals(0.03394397, g.crossTerms().at(FieldSite.EY, 4, 4, 16), HAND, "Ey by symmetry");
        // the normal (1, −1)/√2 flips the sign of n_x n_y: the line x − y = 0, glass on the upper left
        Scene other = Scene.builder(Material.VACUUM).add(new HalfPlane(8 * D, 8 * D, 1, -1), GLASS).build();
        MaterialGrid h = Rasterizer.rasterize(other, new GridSpec(0, 0, D, 16, 16), Smoothing.ANISOTROPIC);
        // Ex at (6.5, 6): the pixel [6, 7] × [5.5, 6.5] has x − y ≤ 0 on 1/8 of it (glass); ⟨ε⟩ = 1.375,
        // ⟨1/ε⟩ = 0.90625: −½ (0.90625 − 1/1.375) = −0.08948864
        assertEquals(-0.08948864, h.crossTerms().at(FieldSite.EX, 6, 6, 16), HAND);
    }

    @Test
    void tiltedInterfaceAtEveryCutSite() {
        double theta = Math.toRadians(30);
        double nx = Math.cos(theta);
        double ny = Math.sin(theta);
        Scene scene = Scene.builder(Material.VACUUM).add(new HalfPlane(10.37 * D, 9.81 * D, nx, ny), GLASS).build();
        GridSpec spec = new GridSpec(0, 0, D, 24, 24);
        MaterialGrid g = Rasterizer.rasterize(scene, spec, Smoothing.ANISOTROPIC);
        int checked = 0;
        double worst = 0;
        for (FieldSite site : new FieldSite[] {FieldSite.EX, FieldSite.EY}) {
            int[] cells = g.crossTerms().cells(site);
            double[] values = g.crossTerms().values(site);
            for (int q = 0; q < cells.length; q++) {
                int i = cells[q] % 24;
                int j = cells[q] / 24;
                double f = glassFraction(spec.siteX(site, i), spec.siteY(site, j), 10.37 * D, 9.81 * D, nx, ny);
                double mean = f * 4 + (1 - f);
                double inverse = f / 4 + (1 - f);
                double expected = nx * ny * (inverse - 1 / mean);
                worst = Math.max(worst, Math.abs(values[q] - expected));
                assertEquals(expected, values[q], SUBSAMPLED, site + " at (" + i + ", " + j + "), f = " + f);
                checked++;
            }
        }
        System.out.printf("tilted interface: %d cut in-plane sites, worst departure %.2e%n", checked, worst);
        assertTrue(checked > 40, "a 30° line across 20 cells cuts more than 40 in-plane pixels; listed " + checked);
    }

    /** Glass's share of the pixel centred on (x, y), by subsampling: the side where (p − point)·n ≤ 0. */
    private static double glassFraction(double x, double y, double px, double py, double nx, double ny) {
        int n = 400;
        int in = 0;
        for (int b = 0; b < n; b++) {
            for (int a = 0; a < n; a++) {
                double sx = x + ((a + 0.5) / n - 0.5) * D;
                double sy = y + ((b + 0.5) / n - 0.5) * D;
                if ((sx - px) * nx + (sy - py) * ny <= 0) {
                    in++;
                }
            }
        }
        return (double) in / ((long) n * n);
    }

    @Test
    void noneWhereTheTensorIsDiagonal() {
        // faces along the axes: n_x n_y = 0
        Scene box = Scene.builder(Material.VACUUM).add(new Rectangle(9.75 * D, 9.15 * D, 8.9 * D, 9.1 * D, 0), GLASS).build();
        assertTrue(Rasterizer.rasterize(box, new GridSpec(0, 0, D, 20, 20), Smoothing.ANISOTROPIC).crossTerms().isEmpty());
        // no smoothing, and a lossy disk (its pixels keep the diagonal)
        Scene disk = Scene.builder(Material.VACUUM).add(Ellipse.disk(10.2 * D, 9.7 * D, 6 * D), GLASS).build();
        assertTrue(Rasterizer.rasterize(disk, new GridSpec(0, 0, D, 20, 20), Smoothing.NONE).crossTerms().isEmpty());
        Scene lossy = Scene.builder(Material.VACUUM).add(Ellipse.disk(10.2 * D, 9.7 * D, 6 * D),
                new Material("lossy", 2.0, 5e4)).build();
        assertTrue(Rasterizer.rasterize(lossy, new GridSpec(0, 0, D, 20, 20), Smoothing.ANISOTROPIC).crossTerms().isEmpty());
        // a smoothed disk has them, at Ex and Ey only, none within two cells of the grid's edges
        MaterialGrid g = Rasterizer.rasterize(disk, new GridSpec(0, 0, D, 20, 20), Smoothing.ANISOTROPIC);
        assertTrue(g.crossTerms().cells(FieldSite.EX).length > 10 && g.crossTerms().cells(FieldSite.EY).length > 10);
        assertEquals(0, g.crossTerms().cells(FieldSite.EZ).length);
        Scene edge = Scene.builder(Material.VACUUM).add(Ellipse.disk(0.4 * D, 0.3 * D, 6 * D), GLASS).build();
        MaterialGrid e = Rasterizer.rasterize(edge, new GridSpec(0, 0, D, 20, 20), Smoothing.ANISOTROPIC);
        for (FieldSite s : new FieldSite[] {FieldSite.EX, FieldSite.EY}) {
            for (int k : e.crossTerms().cells(s)) {
                assertTrue(k % 20 >= 2 && k / 20 >= 2, s + " cell " + k + " within two cells of the edge");
            }
        }
    }
}
