package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Slab;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.reference.PlanarStack;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Frustrated total internal reflection with an exact plane wave: a gap of index 1.0 between two
 * half-spaces of index 1.5, beyond the critical angle, simulated with Bloch-periodic sides (fixed
 * in-plane wavenumber) and compared with the transfer matrix of the same stack (Born &amp; Wolf sec.
 * 1.6; the transfer matrix itself is checked against the closed form 1/T = 1 + α sinh²(κd) of
 * S. Zhu et al., Am. J. Phys. 54, 601 (1986) in FrustratedTotalReflectionTest). Transmittance and reflectance are
 * flux ratios at the design frequency, normalised by an all-glass incident-power run of the same source;
 * the reflected flux is that of the difference between the two runs' fields.
 */
class GapTunnellingTest {

    private static final double WAVELENGTH = 633e-9;
    private static final double N_GLASS = 1.5;
    private static final double COURANT = 0.5;
    /**
     * Issue #4: |T_sim − T_exact| ≤ 0.005 (s) and 0.010 (p) at 20 cells per wavelength in the glass,
     * 0.0015 (s) and 0.003 (p) at 40; the p field normal to the gap's faces makes them harder.
     */
    private static double tolerance(Polarization pol, int cellsPerWavelength) {
        boolean s = pol == Polarization.S;
        return cellsPerWavelength >= 40 ? (s ? 0.0015 : 0.003) : (s ? 0.005 : 0.010);
    }

    /** Issue #4: the evanescent decay rate within 1 %. */
    private static final double DECAY_TOL = 0.01;
    /**
     * Against the discrete rate: measured within 1.4e-4; the margin covers the top PML's reflection of
     * the slowly decaying field (which, 40 rows closer, had put 45° off by 4e-3).
     */
    private static final double DECAY_GRID_TOL = 1e-3;

    /** Issue #4: Richardson extrapolation from 20 and 40 cells per wavelength lands within 0.001 of exact. */
    private static final double RICHARDSON_TOL = 0.001;
    /** R + T = 1 for a lossless stack, to the flux measurement's accuracy (issue #4). */
    private static final double ENERGY_TOL = 1e-3;
    private static final int NX = 16;
    /** Issue #4: the fitted order with smoothing must exceed 1.7. */
    private static final double MIN_ORDER = 1.7;
    private static final int PML = 30;

    @ParameterizedTest(name = "{0} at {1} degrees, {2} cells per wavelength in glass")
    @CsvSource({"S, 45, 20", "P, 45, 20", "S, 60, 20", "P, 60, 20", "S, 45, 40", "P, 60, 40"})
    void transmissionThroughTheGapMatchesTheTransferMatrix(Polarization pol, double degrees, int cellsPerWavelength) {
        double dx = WAVELENGTH / (N_GLASS * cellsPerWavelength);
        double theta = Math.toRadians(degrees);
        double kx = 2 * Math.PI / WAVELENGTH * N_GLASS * Math.sin(theta);
        double f = PhysicalConstants.C0 / WAVELENGTH;
        double worst = 0;
        StringBuilder table = new StringBuilder();
        Run reference = run(pol, dx, kx, f, 0.0, cellsPerWavelength);
        for (double gapWavelengths : new double[] {0.05, 0.13, 0.27, 0.41, 0.6}) {
            double d = gapWavelengths * WAVELENGTH;
            Run s = run(pol, dx, kx, f, d, cellsPerWavelength);
            double incident = reference.top.flux(0, dx);
            double t = s.top.flux(0, dx) / incident;
            double r = -s.bottom.flux(0, dx, reference.bottom) / reference.bottom.flux(0, dx);
            PlanarStack stack = new PlanarStack(N_GLASS, List.of(new PlanarStack.Layer(Complex.real(1.0), d)),
                    Complex.real(N_GLASS));
            double exact = stack.atTransverseWavenumber(pol, WAVELENGTH, kx).transmittance();
            table.append(String.format("%n  gap %.3f λ (%.2f cells): T_sim %.5f, T_exact %.5f, diff %+.5f, R+T %.5f",
                    gapWavelengths, d / dx, t, exact, t - exact, r + t));
            worst = Math.max(worst, Math.abs(t - exact));
            assertTrue(Math.abs(r + t - 1) < ENERGY_TOL, String.format("%s %g°: R + T = %.6f%s", pol, degrees, r + t, table));
        }
        double tol = tolerance(pol, cellsPerWavelength);
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.printf("%s %g° %d cells/λ:%s%n", pol, degrees, cellsPerWavelength, table);
        }
        assertTrue(worst <= tol, String.format("%s %g°, %d cells/λ in glass, S = %g: largest |T_sim − T_exact| %.5f > %.4f%s",
                pol, degrees, cellsPerWavelength, COURANT, worst, tol, table));
    }

    private record Run(FluxLine top, FluxLine bottom) { }

    /**
     * With the dispersion correction the grid's phase and decay rates are exact at the run's
     * frequency and kx, so what remains is the error at the gap's faces. Over six gaps, including
     * the steep 0.18 λ where the plain s run at 60° is off by 0.006 (issue #4's accuracy study), the
     * corrected runs at 20 cells per wavelength are within the limits and closer than the
     * plain ones. Measured largest |ΔT| corrected / plain: s 45° 0.0018 / 0.0025, p 45° 0.0007 /
     * 0.0074, s 60° 0.0003 / 0.0060, p 60° 0.0050 / 0.0083.
     */
    @ParameterizedTest(name = "{0} at {1} degrees, 20 cells per wavelength, corrected")
    @CsvSource({"S, 45", "P, 45", "S, 60", "P, 60"})
    void dispersionCorrectionLeavesOnlyTheInterfaceError(Polarization pol, double degrees) {
        int cpw = 20;
        double dx = WAVELENGTH / (N_GLASS * cpw);
        double kx = 2 * Math.PI / WAVELENGTH * N_GLASS * Math.sin(Math.toRadians(degrees));
        double f = PhysicalConstants.C0 / WAVELENGTH;
        Run reference = run(pol, dx, kx, f, 0.0, Smoothing.ANISOTROPIC, true);
        Run plainReference = run(pol, dx, kx, f, 0.0, Smoothing.ANISOTROPIC, false);
        double worst = 0;
        double worstPlain = 0;
        StringBuilder table = new StringBuilder();
        for (double gapWavelengths : new double[] {0.05, 0.13, 0.18, 0.27, 0.41, 0.6}) {
            double d = gapWavelengths * WAVELENGTH;
            double t = run(pol, dx, kx, f, d, Smoothing.ANISOTROPIC, true).top.flux(0, dx) / reference.top.flux(0, dx);
            double plain = run(pol, dx, kx, f, d, Smoothing.ANISOTROPIC, false).top.flux(0, dx)
                    / plainReference.top.flux(0, dx);
            double exact = new PlanarStack(N_GLASS, List.of(new PlanarStack.Layer(Complex.real(1.0), d)), Complex.real(N_GLASS))
                    .atTransverseWavenumber(pol, WAVELENGTH, kx).transmittance();
            table.append(String.format("%n  gap %.3f λ: T_exact %.5f, corrected %+.5f, plain %+.5f", gapWavelengths, exact,
                    t - exact, plain - exact));
            worst = Math.max(worst, Math.abs(t - exact));
            worstPlain = Math.max(worstPlain, Math.abs(plain - exact));
        }
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.printf("%s %g°, 20 cells/λ, T_sim − T_exact:%s%n", pol, degrees, table);
        }
        double tol = tolerance(pol, cpw);
        String ctx = String.format("%s %g°: largest |ΔT| corrected %.5f (limit %.4f), plain %.5f%s", pol, degrees, worst, tol,
                worstPlain, table);
        assertTrue(worst <= tol, ctx);
        assertTrue(worst < worstPlain, ctx);
    }

    /**
     * Convergence with resolution (issue #4): with subpixel smoothing the error of T falls at second
     * order (fitted order above 1.7 over three resolutions, Farjadpour et al., Opt. Lett. 31, 2972
     * (2006)); the same runs with a staircase gap show the first-order behaviour smoothing removes.
     * The gap is about 0.27 λ: a whole number of cells plus 0.4, so that its faces sit 0.3 and 0.7
     * of a cell above a node at every resolution (the staircase error then keeps its sign and
     * shows its order); the transfer matrix is evaluated for each exact thickness.
     */
    @ParameterizedTest(name = "{0} at 45 degrees")
    @CsvSource({"S", "P"})
    void errorFallsAtSecondOrderWithSmoothingAndFirstWithout(Polarization pol) {
        int[] cpw = {10, 20, 40};
        double[] smooth = new double[3];
        double[] stair = new double[3];
        for (int q = 0; q < 3; q++) {
            smooth[q] = error(pol, 45, cpw[q], 0.27, Smoothing.ANISOTROPIC);
            stair[q] = error(pol, 45, cpw[q], 0.27, Smoothing.NONE);
        }
        double orderSmooth = fittedOrder(cpw, smooth);
        double orderStair = fittedOrder(cpw, stair);
        String ctx = String.format("%s 45°, gap 0.27 λ: |ΔT| smoothed %.2e %.2e %.2e (order %.2f), staircase %.2e %.2e %.2e "
                + "(order %.2f) at %d/%d/%d cells per wavelength", pol, smooth[0], smooth[1], smooth[2], orderSmooth,
                stair[0], stair[1], stair[2], orderStair, cpw[0], cpw[1], cpw[2]);
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.println(ctx);
        }
        assertTrue(orderSmooth > MIN_ORDER, ctx);
        assertTrue(orderStair > 0.5 && orderStair < 1.5, ctx);
    }

    /**
     * Richardson extrapolation (L. F. Richardson, Phil. Trans. R. Soc. A 210, 307 (1911); common
     * practice): with an error falling as Δ², T ≈ T40 + (T40 − T20)/3.
     */
    @ParameterizedTest(name = "{0} at 45 degrees")
    @CsvSource({"S", "P"})
    void richardsonExtrapolationFromTwentyAndFortyCellsPerWavelength(Polarization pol) {
        double kx = 2 * Math.PI / WAVELENGTH * N_GLASS * Math.sin(Math.toRadians(45));
        double f = PhysicalConstants.C0 / WAVELENGTH;
        StringBuilder table = new StringBuilder();
        double worst = 0;
        for (double gap : new double[] {0.13, 0.27, 0.41}) {
            double d = gap * WAVELENGTH;
            double[] t = new double[2];
            int[] cpw = {20, 40};
            for (int q = 0; q < 2; q++) {
                double dx = WAVELENGTH / (N_GLASS * cpw[q]);
                t[q] = run(pol, dx, kx, f, d, Smoothing.ANISOTROPIC).top.flux(0, dx)
                        / run(pol, dx, kx, f, 0, Smoothing.ANISOTROPIC).top.flux(0, dx);
            }
            double extrapolated = t[1] + (t[1] - t[0]) / 3;
            double exact = new PlanarStack(N_GLASS, List.of(new PlanarStack.Layer(Complex.real(1.0), d)), Complex.real(N_GLASS))
                    .atTransverseWavenumber(pol, WAVELENGTH, kx).transmittance();
            table.append(String.format("%n  gap %.2f λ: T20 %.5f, T40 %.5f, extrapolated %.5f, exact %.5f, diff %+.5f",
                    gap, t[0], t[1], extrapolated, exact, extrapolated - exact));
            worst = Math.max(worst, Math.abs(extrapolated - exact));
        }
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.printf("%s Richardson:%s%n", pol, table);
        }
        assertTrue(worst < RICHARDSON_TOL, pol + " 45°: largest |T_extrapolated − T_exact| " + worst + table);
    }

    /**
     * Beyond the critical angle the field past a single glass-air interface decays as e^{−κy} with
     * κ = k0 √(n1² sin²θ − n2²) (Hecht, Optics 4th ed., sec. 4.7); read from the transformed field on
 * rows above the interface, the simulated rate is within 1 % of it (issue #4). Close to the critical
     * angle κ² = kx² − k0² is a small difference, so the grid's own dispersion (k̃0 a little above k0)
     * weighs more: at 45° it takes 40 cells per wavelength (20 gave 2.1 %), at 60° 20 suffice. The
     * rate of the discrete scheme, sinh²(κ̃Δ/2) = sin²(kxΔ/2) − sin²(ωΔt/2)/S² (the Yee dispersion
     * relation with an imaginary normal wavenumber, Taflove &amp; Hagness ch. 4, from memory), is met
     * much more closely.
     */
    @ParameterizedTest(name = "{0} at {1} degrees, {2} cells per wavelength in glass")
    @CsvSource({"S, 45, 40", "P, 45, 40", "S, 60, 20", "P, 60, 20"})
    void evanescentFieldDecaysAtTheHechtRate(Polarization pol, double degrees, int cpw) {
        double dx = WAVELENGTH / (N_GLASS * cpw);
        double theta = Math.toRadians(degrees);
        double kx = 2 * Math.PI / WAVELENGTH * N_GLASS * Math.sin(theta);
        double f = PhysicalConstants.C0 / WAVELENGTH;
        int source = PML + 10;
        double interfaceRow = source + 30.3;
        int first = (int) interfaceRow + 3;
        int rows = 12;
        int ny = first + rows + 100 + PML;
        Scene scene = Scene.builder(Material.ofIndex("glass", N_GLASS))
                .add(new Slab(0, interfaceRow * dx, 0, 1, 1.0), Material.VACUUM).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, dx, NX, ny), Smoothing.ANISOTROPIC);
        Component c = pol == Polarization.S ? Component.EZ : Component.HZ;
        FluxLine[] lines = new FluxLine[rows];
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).courant(COURANT)
                .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                .boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML)).threads(1)
                .source(Source.blochRow(c, NX, source, 0.0, dx, kx, TimeSignal.gaussianPulse(f, f / 25)));
        for (int q = 0; q < rows; q++) {
            lines[q] = new FluxLine(pol, first + q, 0, NX, f);
            b.listener(lines[q]);
        }
        try (Simulation s = b.build()) {
            s.run((long) (12 * 25 / (2 * Math.PI) / (f * s.dt())) + 6L * ny);
        }
        // least-squares slope of ln|E| against the row
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        for (int q = 0; q < rows; q++) {
            double y = Math.log(Math.hypot(lines[q].electric(0, 3)[0], lines[q].electric(0, 3)[1]));
            sx += q;
            sy += y;
            sxx += (double) q * q;
            sxy += q * y;
        }
        double kappaSim = -(rows * sxy - sx * sy) / (rows * sxx - sx * sx) / dx;
        double kappa = 2 * Math.PI / WAVELENGTH * Math.sqrt(N_GLASS * N_GLASS * Math.sin(theta) * Math.sin(theta) - 1.0);
        double omega = 2 * Math.PI * f * COURANT * dx / PhysicalConstants.C0;
        double kxCells = kx * dx;
        double sinh2 = Math.pow(Math.sin(kxCells / 2), 2) - Math.pow(Math.sin(omega / 2) / COURANT, 2);
        double kappaGrid = 2 * Math.log(Math.sqrt(sinh2) + Math.sqrt(sinh2 + 1)) / dx;
        String ctx = String.format("%s %g°, %d cells/λ: κ_sim = %.6g /m, κ (Hecht) = %.6g /m, ratio %.5f; grid κ̃ %.6g /m, "
                + "ratio %.5f", pol, degrees, cpw, kappaSim, kappa, kappaSim / kappa, kappaGrid, kappaSim / kappaGrid);
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.println(ctx);
        }
        assertTrue(Math.abs(kappaSim / kappa - 1) < DECAY_TOL, ctx);
        assertTrue(Math.abs(kappaSim / kappaGrid - 1) < DECAY_GRID_TOL, ctx);
    }

    /** Least-squares slope of log(error) against log(cell size). */
    static double fittedOrder(int[] cpw, double[] err) {
        int n = cpw.length;
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        for (int q = 0; q < n; q++) {
            double x = Math.log(1.0 / cpw[q]);
            double y = Math.log(err[q]);
            sx += x;
            sy += y;
            sxx += x * x;
            sxy += x * y;
        }
        return (n * sxy - sx * sy) / (n * sxx - sx * sx);
    }

    private static double error(Polarization pol, double degrees, int cellsPerWavelength, double gapWavelengths,
                                Smoothing smoothing) {
        double dx = WAVELENGTH / (N_GLASS * cellsPerWavelength);
        double kx = 2 * Math.PI / WAVELENGTH * N_GLASS * Math.sin(Math.toRadians(degrees));
        double f = PhysicalConstants.C0 / WAVELENGTH;
        double d = (Math.rint(gapWavelengths * WAVELENGTH / dx) + 0.4) * dx;
        double t = run(pol, dx, kx, f, d, smoothing).top.flux(0, dx) / run(pol, dx, kx, f, 0, smoothing).top.flux(0, dx);
        PlanarStack stack = new PlanarStack(N_GLASS, List.of(new PlanarStack.Layer(Complex.real(1.0), d)), Complex.real(N_GLASS));
        return Math.abs(t - stack.atTransverseWavenumber(pol, WAVELENGTH, kx).transmittance());
    }

    private static Run run(Polarization pol, double dx, double kx, double f, double d, int cpw) {
        return run(pol, dx, kx, f, d, Smoothing.ANISOTROPIC);
    }

    private static Run run(Polarization pol, double dx, double kx, double f, double d, Smoothing smoothing) {
        return run(pol, dx, kx, f, d, smoothing, false);
    }

    /**
     * A run with a gap of thickness d (none when d = 0) starting 0.3 cells above a node; with
     * {@code corrected} the glass and the gap get the permittivities of {@link DispersionCorrection}
     * for this kx at f.
     */
    private static Run run(Polarization pol, double dx, double kx, double f, double d, Smoothing smoothing,
                           boolean corrected) {
        int source = PML + 10;
        int bottomLine = source + 20;
        double gapStart = bottomLine + 30.3;
        int gapCells = (int) Math.ceil(d / dx);
        int topLine = (int) gapStart + gapCells + 30;
        int ny = topLine + 20 + PML;
        double dt = COURANT * dx / PhysicalConstants.C0;
        Material glass = corrected
                ? new Material("glass", DispersionCorrection.permittivity(N_GLASS * N_GLASS, kx, 2 * Math.PI * f, dx, dt), 0)
                : Material.ofIndex("glass", N_GLASS);
        Material gap = corrected ? new Material("gap", DispersionCorrection.permittivity(1.0, kx, 2 * Math.PI * f, dx, dt), 0)
                : Material.VACUUM;
        Scene.Builder sb = Scene.builder(glass);
        if (d > 0) {
            sb.add(new Slab(0, gapStart * dx, 0, 1, d), gap);
        }
        MaterialGrid grid = Rasterizer.rasterize(sb.build(), new GridSpec(0, 0, dx, NX, ny), smoothing);
        Component c = pol == Polarization.S ? Component.EZ : Component.HZ;
        FluxLine top = new FluxLine(pol, topLine, 0, NX, f);
        FluxLine bottom = new FluxLine(pol, bottomLine, 0, NX, f);
        // narrow band: every frequency near f is beyond the critical angle at this kx
        TimeSignal pulse = TimeSignal.gaussianPulse(f, f / 25);
        try (Simulation s = Simulation.builder(grid).polarization(pol).precision(Precision.FLOAT).courant(COURANT)
                .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                .boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML))
                .threads(1)
                .source(Source.blochRow(c, NX, source, 0.0, dx, kx, pulse))
                .listener(top).listener(bottom).build()) {
            // the pulse lasts 12τ, τ = 1/(2π·f/25) ≈ 4 periods; then the slowest part (group velocity
            // c/n·cosθ, at least a quarter of a cell per step here) crosses the grid
            double periods = 12 * 25 / (2 * Math.PI);
            long steps = (long) (periods / (f * s.dt())) + 6L * ny;
            s.run(steps);
        }
        return new Run(top, bottom);
    }
}
