package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.reference.PlanarStack;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The Kretschmann surface-plasmon dip simulated in full with averaged metal faces (E. Kretschmann &amp;
 * H. Raether, Z. Naturforsch. 23a, 2135 (1968)): crown glass n = 1.515 / 50 nm of Rakić's gold / air,
 * 633 nm, p polarization, a plane wave at a fixed in-plane wavenumber (Bloch-periodic sides). The reference
 * is the transfer matrix of the same stack (M. Born &amp; E. Wolf, <i>Principles of Optics</i>, 7th ed. (1999),
 * sec. 1.6.2, in {@link PlanarStack}) with the gold's discrete permittivity ε_d(ω, Δt) at the run's time
 * step, so the difference measures the spatial grid alone. (Air rather than water: at the water dip, 74.7°,
 * the pulse's lower frequencies are near their grazing cut-off in the glass, ring in the bottom CPML and
 * leave an error of 1e-2 that changes with its thickness; at 44° the cut-off is far from the band.)
 *
 * <p>Both faces lie a fifth of a cell above a node row, off the rows of Ex and of Ey. Each site takes the
 * mean over its cell of {@link FacedFilm}: Ex (along the faces) the arithmetic mean of ε, Ey (across them)
 * the harmonic mean ({@link org.evanesce.geometry.dispersion.SeriesMaterial}). R at 44.0° (on the dip's
 * flank, R_TMM 0.156), float, measured:
 * <pre>
 *   cells      harmonic Ey: R − R_TMM     point-sampled Ey (the rule before)
 *   5 nm          −4.42e-3                     −8.57e-2
 *   2.5 nm        −3.41e-4                     −4.92e-2
 *   1.25 nm       +3.08e-4                     −2.58e-2
 * </pre>
 * Point-sampled Ey is first order (0.80, 0.93): Ey sees each face at the nearest node row, Ex at its true
 * place. With the harmonic mean the successive differences R(Δ) − R(Δ/2) are −3.87e-3 and −5.98e-4, order
 * log2 of their ratio 2.70, and the errors against the transfer matrix fall 13-fold from 5 to 2.5 nm (faces on
 * node rows: −6.03e-3, −7.16e-4, +6.9e-5). Both sequences extrapolate to R_TMM + 2e-4 … 5e-4: a floor of the
 * set-up (the CPML at the glass side and the finite run; R moves by 2e-4 with 60 layers and 80 periods), not of
 * the faces. The dip (five angles 0.2° apart, parabola through the lowest three, against the transfer matrix
 * sampled alike): +0.0032°, R +9.5e-4 at 5 nm; +0.0131°, R +1.6e-3 at 2.5 nm (the floor again).
 * A film whose thickness is not a whole number of cells (6, 3, 1.5 nm: 8⅓, 16⅔, 33⅓ cells) measured +1.81e-2,
 * +1.73e-3, +1.78e-3: the top face's fraction changes with the cell (0.53, 0.87, 0.53) and with it the error's
 * constant; between the two grids with the same fractions (6 and 1.5 nm) the error fell 10.2-fold (order 1.7;
 * 1.8 after the set-up's floor).
 */
class KretschmannConvergenceTest {

    static final double LAMBDA = 633e-9;
    static final double F = PhysicalConstants.C0 / LAMBDA;
    static final double GLASS = 1.515;
    static final double FILM = 50e-9;
    static final DispersiveMaterial GOLD = MetalLibrary.get("gold").material();
    /** The faces' place above a node row, in cells: off the Ex rows (0) and the Ey rows (½). */
    static final double FACE_OFFSET = 0.2;
    /** Periods stepped after the pulse: the plasmon rings for some tens of periods at the run's kx. */
    static final double SETTLE_PERIODS = 40;
    /** An angle on the dip's flank, where R moves fastest with the plasmon's place. */
    static final double FLANK_DEG = 44.0;
    /**
     * The order of |R − R_TMM| from 5 to 2.5 nm: measured 3.70 (the pair is not yet asymptotic); second order is
     * expected (common practice for harmonic/arithmetic face means), the rule before gave 0.80. Hence at least 1.5.
     */
    static final double MIN_ORDER = 1.5;
    /** |R − R_TMM| at 2.5 nm: measured 3.4e-4; the issue asks R_min within 0.02; ten times the measurement. */
    static final double ERROR_AT_2_5_NM = 3.4e-3;
    /**
     * The order from three resolutions, log2 of the ratio of successive differences (P. J. Roache, <i>Verification
     * and Validation in Computational Science and Engineering</i> (1998), ch. 5, from memory): measured 2.70.
     */
    static final double MIN_OBSERVED_ORDER = 1.7;
    static final double MAX_OBSERVED_ORDER = 3.5;
    /**
     * The Richardson extrapolation (order 2) from 2.5 and 1.25 nm against the transfer matrix: measured +5.1e-4,
     * the set-up's floor (see the class comment), so ten times that.
     */
    static final double EXTRAPOLATED_TOL = 5e-3;
    /**
     * Dip angle against the transfer matrix's: measured +0.0032° at 5 nm and +0.0131° at 2.5 nm (with the floor);
     * the issue's limit 0.1°, some ten times the larger.
     */
    static final double DIP_ANGLE_DEG = 0.1;
    /** Least R against the transfer matrix's: measured +9.5e-4 at 5 nm, +1.6e-3 at 2.5 nm (the issue asks 0.02). */
    static final double DIP_REFLECTANCE = 0.01;

    record Point(double angleDeg, double dx, double simulated, double transferMatrix) {
        double error() {
            return simulated - transferMatrix;
        }
    }

    /** The stack with the gold's discrete index at the time step of cells dx. */
    static PlanarStack stack(double dx) {
        double dt = Courant.timeStep(Courant.DEFAULT, dx);
        Complex n = GOLD.discreteIndex(2 * Math.PI * F, dt);
        return new PlanarStack(GLASS, List.of(new PlanarStack.Layer(n, FILM)), Complex.real(1.0));
    }

    /** R of the full run and of the transfer matrix at one angle, cells of dx, faces FACE_OFFSET above a node row. */
    static Point point(double angleDeg, double dx, boolean staircaseNormal) {
        double kx = 2 * Math.PI / LAMBDA * GLASS * Math.sin(Math.toRadians(angleDeg));
        int source = MetalRuns.PML + 10;
        double y0 = source + 20 + Math.round(100e-9 / dx) + FACE_OFFSET;
        double y1 = y0 + Math.round(FILM / dx);
        // air above: about 2.5 decay lengths of the evanescent field at 42° before the CPML
        int ny = (int) y1 + (int) Math.round(800e-9 / dx) + MetalRuns.PML;
        int top = (int) y1 + 5;
        int nx = 4;
        Material glass = Material.ofIndex("glass", GLASS);
        FacedFilm film = new FacedFilm(nx, ny, dx, glass, GOLD, y0, y1, Material.VACUUM, staircaseNormal);
        MetalRuns.Result run = MetalRuns.run(Polarization.P, Precision.FLOAT, film.grid, kx, F, 8, SETTLE_PERIODS,
                film::declare, top, 1);
        MetalRuns.Result ref = MetalRuns.run(Polarization.P, Precision.FLOAT, nx, ny, dx, kx, F, 8, 0, glass, List.of(), top, 1);
        double r = MetalRuns.reflectance(run, ref, dx);
        double tmm = stack(dx).atTransverseWavenumber(Polarization.P, LAMBDA, kx).reflectance();
        return new Point(angleDeg, dx, r, tmm);
    }

    @Test
    void reflectanceOnTheFlankConvergesAtSecondOrderWithFacesInsideCells() {
        Point coarse = point(FLANK_DEG, 5e-9, false);
        Point fine = point(FLANK_DEG, 2.5e-9, false);
        double order = Math.log(Math.abs(coarse.error() / fine.error())) / Math.log(2);
        String ctx = String.format("glass/50 nm gold/air, p, 633 nm, %.1f°, faces %.1f cell above a node row: R_TMM(ε_d)"
                        + " %.5f; R − R_TMM %+.3e (5 nm), %+.3e (2.5 nm); order %.2f", FLANK_DEG, FACE_OFFSET,
                fine.transferMatrix(), coarse.error(), fine.error(), order);
        System.out.println(ctx);
        assertTrue(order >= MIN_ORDER, ctx);
        assertTrue(Math.abs(fine.error()) <= ERROR_AT_2_5_NM, ctx);
    }

    /**
     * The study (tag {@code accuracy}, a few minutes): 5, 2.5 and 1.25 nm cells; the observed order from the
     * successive differences, and the order-2 extrapolation against the transfer matrix.
     */
    @Test
    @Tag("accuracy")
    void observedOrderFromThreeResolutions() {
        double[] dx = {5e-9, 2.5e-9, 1.25e-9};
        double[] r = new double[3];
        double tmm = 0;
        for (int q = 0; q < 3; q++) {
            Point p = point(FLANK_DEG, dx[q], false);
            r[q] = p.simulated();
            tmm = p.transferMatrix();
        }
        double order = Math.log((r[0] - r[1]) / (r[1] - r[2])) / Math.log(2);
        double extrapolated = r[2] + (r[2] - r[1]) / 3;
        String ctx = String.format("%.1f°: R %.6f %.6f %.6f (5, 2.5, 1.25 nm), R_TMM %.6f; observed order %.2f;"
                + " extrapolated %.6f (%+.2e)", FLANK_DEG, r[0], r[1], r[2], tmm, order, extrapolated, extrapolated - tmm);
        System.out.println(ctx);
        assertTrue(order >= MIN_OBSERVED_ORDER && order <= MAX_OBSERVED_ORDER, ctx);
        assertTrue(Math.abs(extrapolated - tmm) <= EXTRAPOLATED_TOL, ctx);
    }

    /**
     * The dip: five angles 0.2° apart around it at {@code dx}; the least R and its angle by a parabola through the
     * three lowest points, the same for the transfer matrix sampled at the same angles (the sampling's bias is
     * then common), and the transfer matrix's own dip on a 0.001° grid for the output.
     */
    static void checkDip(double dx) {
        double[] angles = {43.9, 44.1, 44.3, 44.5, 44.7};
        double[] sim = new double[angles.length];
        double[] ref = new double[angles.length];
        for (int q = 0; q < angles.length; q++) {
            Point p = point(angles[q], dx, false);
            sim[q] = p.simulated();
            ref[q] = p.transferMatrix();
        }
        double[] dipSim = parabolaMinimum(angles, sim);
        double[] dipRef = parabolaMinimum(angles, ref);
        PlanarStack stack = stack(dx);
        double best = 1;
        double bestAngle = 0;
        for (double a = 43.5; a <= 45.0; a += 0.001) {
            double rr = stack.atAngle(Polarization.P, LAMBDA, Math.toRadians(a)).reflectance();
            if (rr < best) {
                best = rr;
                bestAngle = a;
            }
        }
        String ctx = String.format("dip at %.2f nm cells: simulated %.4f° R %.5f; transfer matrix at the same angles %.4f° R"
                        + " %.5f (dense: %.4f° R %.5f); differences %+.4f°, %+.5f", dx * 1e9, dipSim[0], dipSim[1], dipRef[0],
                dipRef[1], bestAngle, best, dipSim[0] - dipRef[0], dipSim[1] - dipRef[1]);
        System.out.println(ctx);
        assertTrue(Math.abs(dipSim[0] - dipRef[0]) <= DIP_ANGLE_DEG, ctx);
        assertTrue(Math.abs(dipSim[1] - dipRef[1]) <= DIP_REFLECTANCE, ctx);
    }

    /** {angle, value} of the vertex of the parabola through the lowest sample and its two neighbours. */
    static double[] parabolaMinimum(double[] x, double[] y) {
        int k = 1;
        for (int q = 1; q < y.length - 1; q++) {
            if (y[q] < y[k]) {
                k = q;
            }
        }
        double h = x[k + 1] - x[k];
        double a = (y[k - 1] - 2 * y[k] + y[k + 1]) / (2 * h * h);
        double b = (y[k + 1] - y[k - 1]) / (2 * h);
        double dx = -b / (2 * a);
        return new double[] {x[k] + dx, y[k] + b * dx + a * dx * dx};
    }

    @Test
    void dipAtFiveNanometreCells() {
        checkDip(5e-9);
    }

    @Test
    @Tag("accuracy")
    void dipAtTwoAndAHalfNanometreCells() {
        checkDip(2.5e-9);
    }
}
