package org.evanesce.solver.source;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.geometry.shape.HalfPlane;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * A small particle in the evanescent field above a totally reflecting glass face, lit by a layered total-field
 * box: the power it scatters falls with its height z as the evanescent intensity, exp(−2z/δ), δ = 1/κ,
 * κ = k0 √(n² sin²θ − 1) (dipole limit; a fact of the trade that total-internal-reflection microscopy relies on,
 * common practice; κ from M. Born &amp; E. Wolf, <i>Principles of Optics</i>, 7th ed., 1999, §1.5.4). The particle
 * moves by whole cells, so that it is rasterised the same at every height.
 */
class EvanescentParticleTest {

    static final double LAMBDA = 600e-9;
    static final double F = PhysicalConstants.C0 / LAMBDA;
    static final double N_GLASS = 1.5;
    static final double THETA = Math.toRadians(60);
    /** 60 cells per vacuum wavelength. */
    static final double DX = LAMBDA / 60;
    /** The bound over two decay lengths. */
    static final double TOLERANCE = 0.05;

    /** The scattered power (W/m) with the particle's centre {@code height} cells above the face. */
    static double scattered(Polarization pol, int height) {
        int half = 26;
        int below = 10;
        int above = 40;
        int contour = 3;
        int margin = 5 + BoxRuns.PML;
        int nx = 2 * (half + contour + margin) + 1;
        int ny = below + above + 2 * (contour + margin) + 1;
        int i0 = contour + margin;
        int j0 = contour + margin;
        double faceY = (j0 + below) * DX;
        double cx = (i0 + half) * DX;
        double radius = 1.6 * DX;
        Scene scene = Scene.builder(Material.ofIndex("air", 1.0))
                .add(new HalfPlane(0, faceY, 0, 1), Material.ofIndex("glass", N_GLASS))
                .add(Ellipse.disk(cx + 0.3 * DX, faceY + height * DX, radius), Material.ofIndex("particle", N_GLASS))
                .build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, DX, nx, ny), Smoothing.ANISOTROPIC);
        double period = 1 / F;
        long perPeriod = Math.round(period / Courant.timeStep(Courant.DEFAULT, DX));
        TotalFieldBox box = TotalFieldBox.plan(new TotalFieldBox.Spec(pol, Math.PI / 2 - THETA, 1.0,
                TimeSignal.rampedContinuous(F, 3 * period), cx, faceY), grid, BoxRuns.sides(), Courant.DEFAULT, i0, j0,
                i0 + 2 * half, j0 + below + above);
        long steps = 30 * perPeriod;
        ContourDfts c = new ContourDfts(pol, i0 - contour, j0 - contour, i0 + 2 * half + contour,
                j0 + below + above + contour, DX, cx, faceY, F, steps - 4 * perPeriod, steps);
        try (Simulation sim = BoxRuns.builder(grid, pol, Precision.DOUBLE, box, 1).listener(c).build()) {
            sim.run(steps);
        }
        return c.outwardPower();
    }

    @Tag("accuracy")
    @ParameterizedTest
    @EnumSource(Polarization.class)
    void scatteredPowerFollowsTheEvanescentIntensity(Polarization pol) {
        double kappa = 2 * Math.PI / LAMBDA * Math.sqrt(N_GLASS * N_GLASS * Math.sin(THETA) * Math.sin(THETA) - 1);
        double delta = 1 / kappa;
        int h0 = 3;
        double p0 = scattered(pol, h0);
        double worst = 0;
        StringBuilder table = new StringBuilder();
        for (int h = h0 + 6; h * DX <= h0 * DX + 2 * delta + DX; h += 6) {
            double ratio = scattered(pol, h) / p0;
            double expected = Math.exp(-2 * (h - h0) * DX / delta);
            worst = Math.max(worst, Math.abs(ratio / expected - 1));
            table.append(String.format("%n  z − z0 = %.3f δ: P/P0 %.5f, exp(−2z/δ) %.5f, %+.4f", (h - h0) * DX / delta, ratio,
                    expected, ratio / expected - 1));
        }
        System.out.println(pol + " particle above the face:" + table);
        assertTrue(worst <= TOLERANCE, pol + ": scattered power departs from exp(−2z/δ) by " + worst + table);
    }
}
