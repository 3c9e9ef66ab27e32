package org.evanesce.solver.source;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.record.FarFieldBox;
import org.evanesce.solver.reference.CylinderSeries;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Scattering by a perfectly conducting cylinder lit by a total-field box, through the program's far-field contour
 * ({@link FarFieldBox}), against the exact series for a perfect conductor (C. A. Balanis, <i>Advanced Engineering
 * Electromagnetics</i>, 2nd ed., 2012, ch. 11: c_n = −J_n(x)/H_n(x) with Ez = 0 on the surface for s,
 * c_n = −J_n'(x)/H_n'(x) with ∂Hz/∂r = 0 for p; {@link CylinderSeries#conductor}), with the issue's bounds (σ within
 * 2 % forward and backward, 0.5 dB within 20 dB of the peak, C_sca within 1 %).
 *
 * <p>The conductor is a staircase (the rasteriser does not average it): the E sites inside it are held at zero. The
 * error is first order in the cell in both polarizations, with a far larger constant in p, whose E runs across the
 * faces and whose surface current follows the staircase: at 30 cells per wavelength, x = 2, s is off by −3.7 % in
 * C_sca and p by +15 %, with σ forward +56 %. A conductivity of 1e9 S/m instead (skin depth 0.7 nm, ca ≈ −0.999)
 * gives the same p error without smoothing (+56 % forward) and +64 % with it (its σ averaged into every cell the
 * face cuts makes the rod up to half a cell larger); an edge-length conformal update of Ex and Ey (εr/ℓ on an edge a
 * fraction ℓ outside, the full cell area in the Hz update) was tried and changed p's errors by a few tenths of their
 * size either way (C_sca +13.9 % at 30 cells, +2.4 % at 120; forward +64 %, +10.2 %), so it was not kept.
 */
class PecCylinderTest {

    static final double LAMBDA = CylinderScatteringTest.LAMBDA;
    static final double F = PhysicalConstants.C0 / LAMBDA;

    /**
     * One run of a cylinder of {@code material} (a perfect conductor or a good one), contour 3 cells outside the box.
     *
     * @param sizeParameter x = k a in the vacuum round the cylinder
     * @param cells         cells per vacuum wavelength
     */
    static CylinderScatteringTest.Result run(Polarization pol, double sizeParameter, int cells, double incidenceDegrees,
                                             Material material, Smoothing smoothing) {
        return run(pol, sizeParameter, cells, incidenceDegrees, material, smoothing, 3);
    }

    static CylinderScatteringTest.Result run(Polarization pol, double sizeParameter, int cells, double incidenceDegrees,
                                             Material material, Smoothing smoothing, int gap) {
        double dx = LAMBDA / cells;
        double radius = sizeParameter * LAMBDA / (2 * Math.PI);
        int r = (int) Math.ceil(radius / dx);
        int boxHalf = r + 4;
        int half = boxHalf + gap + 5 + BoxRuns.PML;
        int n = 2 * half + 1;
        // the centre a little off the nodes, so that the cylinder is not symmetric on the grid by accident
        double cx = (half + 0.23) * dx;
        double cy = (half + 0.41) * dx;
        Scene scene = Scene.builder(Material.VACUUM).add(Ellipse.disk(cx, cy, radius), material).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, dx, n, n), smoothing);
        double period = 1 / F;
        double dt = Courant.timeStep(Courant.DEFAULT, dx);
        long perPeriod = Math.round(period / dt);
        double incidence = Math.toRadians(incidenceDegrees);
        TotalFieldBox box = TotalFieldBox.plan(new TotalFieldBox.Spec(pol, incidence, 1.0,
                TimeSignal.rampedContinuous(F, 3 * period), cx, cy), grid, BoxRuns.sides(), Courant.DEFAULT,
                half - boxHalf, half - boxHalf, half + boxHalf, half + boxHalf);
        long steps = (long) (30 + 3 * sizeParameter) * perPeriod;
        double start = (steps - 4 * perPeriod - 0.25) * dt;
        int c = boxHalf + gap;
        FarFieldBox contour = new FarFieldBox(pol, half - c, half - c, half + c - 1, half + c - 1, F).window(start,
                start + 4 * period);
        try (Simulation sim = BoxRuns.builder(grid, pol, Precision.FLOAT, box, 1).listener(contour).build()) {
            sim.run(steps);
        }
        CylinderSeries exact = (material.conductivity() == 0
                ? CylinderSeries.dielectric(pol, radius, Complex.real(Math.sqrt(material.relativePermittivity())), 1.0,
                        LAMBDA)
                : CylinderSeries.conductor(pol, radius, 1.0, LAMBDA)).incidentAlong(incidence);
        long[] samples = contour.box().sides()[0].samples();
        double duration = (pol == Polarization.S ? samples[0] : samples[1]) * dt;
        Complex incident = box.zPhasorAt(cx, cy, F).times(0.5 * duration);
        return new CylinderScatteringTest.Result(exact, contour.farField(0, 1.0, 0, 0, dx, cx, cy), incidence, incident);
    }

    static CylinderScatteringTest.Errors errors(Polarization pol, double x, int cells) {
        CylinderScatteringTest.Errors e = CylinderScatteringTest.Errors.of(run(pol, x, cells, 0,
                Material.perfectConductor("pec"), Smoothing.ANISOTROPIC));
        e.print("perfect conductor, " + pol + " x=" + x + " " + cells + " cells/λ");
        return e;
    }

    /**
     * p at 180 cells per wavelength, x = 2, where p is still outside the issue's bounds: measured (2026-12-04) forward
     * +6.2 %, backward +2.4 %, worst 0.262 dB, C_sca +1.57 %, C_ext/C_sca − 1 +0.01 %. The staircase's first-order
     * error (see the class comment); bounds about 1.5x those (a 10x bound would pass a conductor a cell too large),
     * the theorem at the issue's 1 %.
     */
    static final CylinderScatteringTest.Bounds P_AT_180 = new CylinderScatteringTest.Bounds(0.10, 0.4, 0.025,
            CylinderScatteringTest.ISSUE.theorem());
    /**
     * The least order of convergence accepted for C_sca (first order expected of a staircase): measured 1.06 (s, 30 →
     * 120 cells: −3.66 % → −0.84 %) and 1.11 (p, 60 → 180 cells: +5.30 % → +1.57 %).
     */
    static final double MIN_ORDER = 0.8;

    /**
     * s (Ez, tangential to every face: the staircase of Ez nodes inside the conductor held at zero) at 30 and 120 cells
     * per wavelength, x = 2: the issue's bounds at 120 (measured 2026-12-04: forward −1.51 %, backward +0.79 %, worst
     * 0.100 dB, C_sca −0.84 %, C_ext/C_sca − 1 +0.01 %) and first-order convergence of C_sca from 30 cells (−3.66 %).
     * Further: −1.55 % at 60, −0.57 % at 180 cells; x = 5: −0.73 % at 60, −0.38 % at 120, −0.25 % at 180.
     */
    @org.junit.jupiter.api.Test
    void sMeetsTheIssueBoundsAt120CellsAndConvergesAtFirstOrder() {
        CylinderScatteringTest.Errors coarse = errors(Polarization.S, 2, 30);
        CylinderScatteringTest.Errors fine = errors(Polarization.S, 2, 120);
        String fails = CylinderScatteringTest.check(fine, "s x=2 120 cells/λ", CylinderScatteringTest.ISSUE);
        assertTrue(fails.isEmpty(), fails);
        double order = Math.log(Math.abs(coarse.total() / fine.total())) / Math.log(4);
        assertTrue(order >= MIN_ORDER, String.format("s: C_sca's error %+.4f at 30, %+.4f at 120 cells/λ: order %.2f",
                coarse.total(), fine.total(), order));
    }

    /**
     * p (Hz; Ex and Ey inside the conductor held at zero, a staircase for the field across the faces too) at 60 and
     * 180 cells per wavelength, x = 2: within {@link #P_AT_180} at 180 and converging at first order. p needs far finer
     * cells than s for the issue's bounds: forward +56 %, +19 %, +13 %, +9.8 %, +6.2 %, +2.9 %, +1.6 % at 30, 60, 90,
     * 120, 180, 360 and 720 cells (every bound of the issue holds at 720; {@link #pMeetsTheIssueBoundsAtFineCells}).
     */
    @org.junit.jupiter.api.Test
    void pIsWithinItsStaircaseErrorAt180CellsAndConvergesAtFirstOrder() {
        CylinderScatteringTest.Errors coarse = errors(Polarization.P, 2, 60);
        CylinderScatteringTest.Errors fine = errors(Polarization.P, 2, 180);
        String fails = CylinderScatteringTest.check(fine, "p x=2 180 cells/λ", P_AT_180);
        assertTrue(fails.isEmpty(), fails);
        double order = Math.log(Math.abs(coarse.total() / fine.total())) / Math.log(3);
        assertTrue(order >= MIN_ORDER, String.format("p: C_sca's error %+.4f at 60, %+.4f at 180 cells/λ: order %.2f",
                coarse.total(), fine.total(), order));
    }

    /**
     * The issue's bounds in p at the cells where they hold: x = 2 at 720 cells per wavelength (measured 2026-12-04:
     * forward +1.61 %, backward +0.77 %, worst 0.069 dB, C_sca +0.61 %, C_ext/C_sca − 1 −0.15 %), x = 5 at 360
     * (+1.64 %, −0.52 %, 0.351 dB, +0.52 %, 0.00 %). About 25 s of CPU each (a minute of wall time each on the loaded
     * 2-core machine).
     */
    @Tag("accuracy")
    @ParameterizedTest(name = "p x={0} at {1} cells per wavelength")
    @CsvSource({"2, 720", "5, 360"})
    void pMeetsTheIssueBoundsAtFineCells(double x, int cells) {
        CylinderScatteringTest.Errors e = errors(Polarization.P, x, cells);
        String fails = CylinderScatteringTest.check(e, "p x=" + x + " " + cells + " cells/λ", CylinderScatteringTest.ISSUE);
        assertTrue(fails.isEmpty(), fails);
    }
}
