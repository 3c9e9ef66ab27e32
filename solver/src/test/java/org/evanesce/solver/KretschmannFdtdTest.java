package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.reference.PlanarStack;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The Kretschmann configuration simulated in full (E. Kretschmann &amp; H. Raether, Z. Naturforsch. 23a,
 * 2135 (1968)): crown glass n = 1.515 / 50 nm of Rakić's gold / air, 633 nm, p polarization, a plane
 * wave at a fixed in-plane wavenumber (Bloch-periodic sides) incident from the glass beyond the critical
 * angle. The reflectance at angles around the surface-plasmon dip is compared with the transfer matrix
 * of the same stack (the characteristic matrix of M. Born &amp; E. Wolf, <i>Principles of Optics</i>,
 * 7th ed. (1999), sec. 1.6.2; P. Yeh, <i>Optical Waves in Layered Media</i> (1988), ch. 5, in
 * {@link PlanarStack}) evaluated with the gold's discrete permittivity ε_d(ω, Δt) at the run's time step,
 * so the difference measures the spatial grid alone (film faces, grid dispersion), not the time
 * discretisation of the model.
 *
 * <p>The film is staircased (here no site is averaged; the planner's face means are tested by
 * {@link KretschmannConvergenceTest}): its faces lie a quarter cell
 * above a node, so it holds 20 samples of Ex and 20 of Ey at 2.5 nm. The normal component Ey then sees
 * the metal from a Hz node on at the bottom face and the air from a Hz node on at the top face, an O(Δ)
 * error in where the plasmon's face is, and the plasmon is very sensitive to it: measured at 43.8°,
 * 44.4°, 45.0° (TMM R 0.2975, 0.0452, 0.1722), R_sim − R_TMM is −0.241, +0.117, +0.162 at 5 nm cells,
 * −0.160, +0.038, +0.087 at 2.5 nm and −0.089, +0.010, +0.047 at 1.25 nm: first order on the dip's
 * flanks (the simulated dip sits low in angle and converges up). The limits (dip within 0.1°,
 * R_min within 0.02) need averaged permittivities at the faces ({@link KretschmannConvergenceTest}); the tests
 * here (tag {@code accuracy}) show the staircase's convergence to the transfer matrix with ε_d and its order.
 */
class KretschmannFdtdTest {

    static final double LAMBDA = 633e-9;
    static final double F = PhysicalConstants.C0 / LAMBDA;
    static final double GLASS = 1.515;
    static final double FILM = 50e-9;
    static final DispersiveMaterial GOLD = MetalLibrary.get("gold").material();
    /**
     * Periods stepped after the pulse in the metal run: the plasmon at the run's kx rings (Rakić gold at
     * 633 nm: a propagation length of the order of 10 µm, i.e. a lifetime of some 15 periods, halved by
     * the coupling to the prism).
     */
    static final double SETTLE_PERIODS = 40;
    /**
     * The order of |R_sim − R_TMM| at 45.0° from 5 and 2.5 nm cells: first order expected for a
     * staircased interface (common practice); measured 0.89 (float).
     */
    static final double MIN_ORDER = 0.6;
    static final double MAX_ORDER = 1.4;
    /**
     * The first-order extrapolation 2 R(Δ/2) − R(Δ) against the transfer matrix at 45.0°: measured
     * 0.013 from 5 and 2.5 nm (float; 0.008 from 2.5 and 1.25 nm in double); the pair is not yet fully asymptotic, so
     * the limit is the 0.02 widened to 0.04 rather than ten times the measurement.
     */
    static final double EXTRAPOLATED_TOL = 0.04;

    record Point(double angleDeg, double simulated, double transferMatrix) {
    }

    /** The stack with the gold's discrete index at the run's time step. */
    static PlanarStack stack(double dx) {
        double dt = Courant.timeStep(Courant.DEFAULT, dx);
        Complex n = GOLD.discreteIndex(2 * Math.PI * F, dt);
        return new PlanarStack(GLASS, List.of(new PlanarStack.Layer(n, FILM)), Complex.real(1.0));
    }

    /** R of the full run and the TMM at one angle, cells of dx (the film is FILM/dx cells thick). */
    static Point point(double angleDeg, double dx) {
        int filmCells = (int) Math.round(FILM / dx);
        double kx = 2 * Math.PI / LAMBDA * GLASS * Math.sin(Math.toRadians(angleDeg));
        int source = MetalRuns.PML + 10;
        double face = source + 20 + Math.round(100e-9 / dx) + 0.25;
        // air above: about 2.5 decay lengths of the evanescent field at 42° (the slowest decay here) before the PML
        int air = (int) Math.round(800e-9 / dx);
        int ny = (int) face + filmCells + air + MetalRuns.PML;
        List<MetalRuns.Layer> layers = List.of(new MetalRuns.Layer(face, face + filmCells, null, GOLD),
                new MetalRuns.Layer(face + filmCells, ny + 1, Material.VACUUM, null));
        int top = (int) face + filmCells + 5;
        Material glass = Material.ofIndex("glass", GLASS);
        MetalRuns.Result run = MetalRuns.run(Polarization.P, Precision.FLOAT, 4, ny, dx, kx, F, 8, SETTLE_PERIODS, glass,
                layers, top, 1);
        MetalRuns.Result ref = MetalRuns.run(Polarization.P, Precision.FLOAT, 4, ny, dx, kx, F, 8, 0, glass, List.of(), top, 1);
        double r = MetalRuns.reflectance(run, ref, dx);
        double tmm = stack(dx).atTransverseWavenumber(Polarization.P, LAMBDA, kx).reflectance();
        return new Point(angleDeg, r, tmm);
    }

    /** Tag {@code accuracy}: the plain staircase, superseded by the face means of {@link KretschmannConvergenceTest}. */
    @Test
    @Tag("accuracy")
    void reflectanceOnTheDipsFlankConvergesToTheTransferMatrixAtFirstOrder() {
        double angle = 45.0;
        Point coarse = point(angle, 5e-9);
        Point fine = point(angle, 2.5e-9);
        double e1 = Math.abs(coarse.simulated() - coarse.transferMatrix());
        double e2 = Math.abs(fine.simulated() - fine.transferMatrix());
        double order = Math.log(e1 / e2) / Math.log(2);
        double extrapolated = 2 * fine.simulated() - coarse.simulated();
        String ctx = String.format("glass/50 nm gold/air, p, 633 nm, %.1f°: R_TMM(ε_d) %.5f; R_sim %.5f (5 nm), %.5f (2.5 nm); "
                        + "order %.2f; extrapolated %.5f (diff %+.5f)", angle, fine.transferMatrix(), coarse.simulated(),
                fine.simulated(), order, extrapolated, extrapolated - fine.transferMatrix());
        System.out.println(ctx);
        assertTrue(order > MIN_ORDER && order < MAX_ORDER, ctx);
        assertTrue(Math.abs(extrapolated - fine.transferMatrix()) <= EXTRAPOLATED_TOL, ctx);
    }

    /**
     * The study (tag {@code accuracy}, a few minutes): three angles across the dip at 5, 2.5 and 1.25 nm
     * cells; the error falls at each angle, and the first-order extrapolation from the two finer grids
     * lies within {@link #EXTRAPOLATED_TOL} of the transfer matrix (measured 0.017, 0.018, 0.008).
     */
    @Test
    @Tag("accuracy")
    void convergenceStudyAcrossTheDip() {
        double[] dx = {5e-9, 2.5e-9, 1.25e-9};
        StringBuilder t = new StringBuilder();
        boolean ok = true;
        for (double angle : new double[] {43.8, 44.4, 45.0}) {
            double[] r = new double[3];
            double tmm = 0;
            for (int q = 0; q < 3; q++) {
                Point p = point(angle, dx[q]);
                r[q] = p.simulated();
                tmm = p.transferMatrix();
            }
            double extrapolated = 2 * r[2] - r[1];
            t.append(String.format("%n  %.1f°: R_TMM %.5f; R_sim %.5f %.5f %.5f (5, 2.5, 1.25 nm); extrapolated %.5f",
                    angle, tmm, r[0], r[1], r[2], extrapolated));
            ok &= Math.abs(r[2] - tmm) < Math.abs(r[1] - tmm) && Math.abs(r[1] - tmm) < Math.abs(r[0] - tmm)
                    && Math.abs(extrapolated - tmm) <= EXTRAPOLATED_TOL;
        }
        System.out.println("Kretschmann convergence:" + t);
        assertTrue(ok, t.toString());
    }
}
