package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.record.FieldMap;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The surface plasmon of a gold–water interface, launched by a source with the plasmon's profile across the
 * interface, travels along it; its propagation length, fitted to |Hz|² along the interface in a field map (the
 * transform at 633 nm of a pulsed run), is compared with L = 1/(2 Im k_spp), k_spp = k0 √(εm εd/(εm + εd))
 * (H. Raether, <i>Surface Plasmons on Smooth and Rough Surfaces and on Gratings</i> (1988), eq. 2.2 and
 * sec. 2.2 for L, from memory), εm Rakić's gold at its discrete permittivity ε_d(ω, Δt) for the run's step,
 * εd water 1.333². The interface lies a fifth of a cell above a node row (faces averaged as
 * {@link FacedFilm} says).
 */
class PlasmonPropagationTest {

    static final double LAMBDA = 633e-9;
    static final double F = PhysicalConstants.C0 / LAMBDA;
    static final double WATER = 1.333;
    static final DispersiveMaterial GOLD = MetalLibrary.get("gold").material();
    static final int PML = 20;
    /** The fit's window along the interface, from the source: past its near field, before the right CPML. */
    static final double FIT_FROM = 1.0e-6;
    static final double FIT_TO = 4.5e-6;
    /**
     * Fitted L against 1/(2 Im k_spp): measured +1.31 % at 10 nm cells, +0.29 % at 5 nm (order 2.2); the issue's
     * limit 5 % (tighter than ten times the measurement).
     */
    static final double LENGTH_TOL = 0.05;
    /**
     * RMS residual of ln|Hz|² about the fitted line over the window: a pure exponential (one plasmon, no
     * interference with radiation or a reflection) leaves only the ripple: measured 0.016 (10 nm), 0.015 (5 nm).
     */
    static final double RESIDUAL_TOL = 0.15;

    /** L = 1/(2 Im k_spp) with the gold's discrete ε at step dt. */
    static double referenceLength(double dt) {
        double omega = 2 * Math.PI * F;
        Complex em = GOLD.discretePermittivity(omega, dt);
        Complex ed = Complex.real(WATER * WATER);
        Complex k = em.times(ed).divide(em.plus(ed)).sqrt().times(omega / PhysicalConstants.C0);
        return 1 / (2 * k.im());
    }

    /** {fitted L, reference L, RMS residual of ln|Hz|²} at cells of dx. */
    static double[] lengths(double dx) {
        double dt = Courant.timeStep(Courant.DEFAULT, dx);
        double interface0 = PML + Math.round(150e-9 / dx) + 0.2;
        int ny = (int) interface0 + (int) Math.round(900e-9 / dx) + PML;
        int source = PML + (int) Math.round(500e-9 / dx);
        int nx = source + (int) Math.round((FIT_TO + 0.7e-6) / dx) + PML;
        Material water = Material.ofIndex("water", WATER);
        // the gold fills everything below the interface (from below the grid)
        FacedFilm film = new FacedFilm(nx, ny, dx, water, GOLD, -10, interface0, water, false);
        // the plasmon's Hz across the interface: e^{−y/δ} into the water, e^{y/δm} into the gold (Raether eq. 2.4)
        double omega = 2 * Math.PI * F;
        double k0 = omega / PhysicalConstants.C0;
        Complex em = GOLD.discretePermittivity(omega, dt);
        Complex ed = Complex.real(WATER * WATER);
        Complex kspp = em.times(ed).divide(em.plus(ed)).sqrt().times(k0);
        double qd = ed.times(k0 * k0).minus(kspp.times(kspp)).sqrtUpper().im();
        double qm = em.times(k0 * k0).minus(kspp.times(kspp)).sqrtUpper().im();
        List<Integer> cells = new ArrayList<>();
        List<Double> amps = new ArrayList<>();
        for (int j = PML + 2; j < ny - PML - 2; j++) {
            double y = (j + 0.5 - interface0) * dx;
            double a = y > 0 ? Math.exp(-qd * y) : Math.exp(qm * y);
            if (a > 1e-4) {
                cells.add(j * nx + source);
                amps.add(a);
            }
        }
        Source src = new Source(Component.HZ, cells.stream().mapToInt(Integer::intValue).toArray(),
                amps.stream().mapToDouble(Double::doubleValue).toArray(), TimeSignal.gaussianPulse(F, F / 8));
        int row = (int) Math.floor(interface0 - 0.5) + 1;
        FieldMap map = new FieldMap(Polarization.P, 0, row, nx, row + 1, F);
        Simulation.Builder b = Simulation.builder(film.grid).polarization(Polarization.P).precision(Precision.FLOAT)
                .courant(Courant.DEFAULT).boundaries(Boundary.pml(PML)).threads(2).source(src).listener(map);
        film.declare(b);
        try (Simulation s = b.build()) {
            // the pulse, the plasmon's crossing at about c/1.5, and its ringing down
            double periods = 12 * 8 / (2 * Math.PI) + (FIT_TO + 1e-6) * 1.6 / LAMBDA + 30;
            s.run((long) (periods / (F * s.dt())));
        }
        double[][] hz = map.transform(Component.HZ, 0);
        // least squares of ln|Hz|² against x over the window: slope −1/L
        double sx = 0, sy = 0, sxx = 0, sxy = 0;
        int n = 0;
        for (int i = source + (int) Math.round(FIT_FROM / dx); i <= source + (int) Math.round(FIT_TO / dx); i++) {
            double x = (i - source) * dx;
            double p = Math.log(hz[0][i] * hz[0][i] + hz[1][i] * hz[1][i]);
            sx += x;
            sy += p;
            sxx += x * x;
            sxy += x * p;
            n++;
        }
        double slope = (n * sxy - sx * sy) / (n * sxx - sx * sx);
        double intercept = (sy - slope * sx) / n;
        double ss = 0;
        for (int i = source + (int) Math.round(FIT_FROM / dx); i <= source + (int) Math.round(FIT_TO / dx); i++) {
            double x = (i - source) * dx;
            double p = Math.log(hz[0][i] * hz[0][i] + hz[1][i] * hz[1][i]);
            ss += (p - intercept - slope * x) * (p - intercept - slope * x);
        }
        return new double[] {-1 / slope, referenceLength(dt), Math.sqrt(ss / n)};
    }

    static void check(double dx) {
        double[] l = lengths(dx);
        double rel = l[0] / l[1] - 1;
        String ctx = String.format("gold/water, 633 nm, %.1f nm cells: fitted L %.4f µm, 1/(2 Im k_spp) %.4f µm (ε_d), "
                + "difference %+.2f %%; RMS residual of ln|Hz|^2 %.2g", dx * 1e9, l[0] * 1e6, l[1] * 1e6, 100 * rel, l[2]);
        System.out.println(ctx);
        assertTrue(Math.abs(rel) <= LENGTH_TOL, ctx);
        assertTrue(l[2] <= RESIDUAL_TOL, ctx);
    }

    @Test
    void propagationLengthAtTenNanometreCells() {
        check(10e-9);
    }

    @Test
    @Tag("accuracy")
    void propagationLengthAtFiveNanometreCells() {
        check(5e-9);
    }
}
