package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

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
import org.evanesce.solver.record.Probe;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Transmission of a dielectric slab at normal incidence, its thickness never a whole number of
 * cells, against the Airy formula in the continuum (M. Born &amp; E. Wolf, Principles of Optics,
 * 7th ed., sec. 7.6) at four resolutions. With anisotropic subpixel smoothing the error must fall at
 * second order, and point sampling (a staircase) at first order (A. Farjadpour et al., Opt. Lett.
 * 31, 2972 (2006); A. F. Oskooi, C. Kottke, S. G. Johnson, Opt. Lett. 34, 2778 (2009)).
 *
 * <p>The slab's faces keep the same offsets from the grid at every resolution (the front face a
 * fixed fraction of a cell past a node, the thickness m + ½ cells), so the staircase's thickness
 * error is the same number of cells each time rather than changing sign from one resolution to the
 * next, and its first order shows cleanly in a fit. The simulated t = E_slab/E_vacuum is taken at a
 * probe beyond the slab, from one run with the slab and one without (the incident field), both
 * Fourier transformed at the design frequency; against it the Airy t, referred to the same vacuum
 * path, is t_Airy e^{−ik0 d}. The FDTD's own dispersion error is also of second order and is part
 * of what is measured.
 *
 * <p>At normal incidence the field is tangential to both faces in either polarization (s: Ez;
 * p: Ey), so this checks the arithmetic-mean part of the smoothing on the Ez and Ey sites; the
 * harmonic part (field normal to an interface) is checked on hand-computed cells in the geometry
 * module's tests.
 *
 * <p>Measured with this engine in double precision, complex error |t_sim − t_Airy| at 5.5, 11.5,
 * 23.5 and 47.5 cells across the slab (s and p agree to the digits shown), front face ¼ cell past
 * a node: smoothed 5.49e-2, 1.23e-2, 2.96e-3, 7.26e-4 (fitted order 2.00), staircase 1.32e-1,
 * 7.73e-2, 4.07e-2, 2.08e-2 (order 0.86); front face 0.6 cell past a node: smoothed 6.04e-2,
 * 1.33e-2, 3.15e-3, 7.65e-4 (order 2.03), staircase 2.26e-1, 9.86e-2, 4.58e-2, 2.21e-2 (order 1.08).
 */
class SlabConvergenceTest {

    private static final double WAVELENGTH = 1e-6;
    /** A film of index 2 in vacuum: |r| = 1/3 per face, so the slab's interference is strong. */
    private static final double SLAB_PERMITTIVITY = 4.0;
    /** 2π n d/λ0 = 1.2π: not a quarter- or half-wave thickness, where |t| would be stationary in d. */
    private static final double SLAB_THICKNESS = 0.3e-6;
    /** The slab is m + ½ cells thick; 9 to 80 cells per wavelength inside it. */
    private static final int[] WHOLE_CELLS = {5, 11, 23, 47};
    private static final double COURANT = 0.5;
    private static final int PML = 16;
    /** Record length: the pulse (about 10 periods) plus the slab's ringing, which falls by 9 per round trip. */
    private static final double PERIODS = 30;

    /** The threshold for second order. */
    private static final double MIN_SMOOTHED_ORDER = 1.8;
    /** Clearly below second order (measured 0.86 and 1.08); first order is about 1. */
    private static final double MAX_STAIRCASE_ORDER = 1.5;
    /** And clearly converging: an order near 1, not a stagnating error. */
    private static final double MIN_STAIRCASE_ORDER = 0.7;
    /**
     * The smoothed error at 80 cells per wavelength in the slab (measured 7.3e-4 and 7.7e-4, the
     * scheme's second-order error: 40 PML layers and a 45-period record change it by 3e-6).
     */
    private static final double FINEST_SMOOTHED_ERROR = 1.5e-3;
    /** The Airy formula and the characteristic matrix agree to rounding. */
    private static final double FORMULA_AGREEMENT = 1e-12;

    @ParameterizedTest(name = "{0}, front face {1} cell past a node")
    @CsvSource({"S, 0.25", "P, 0.25", "S, 0.6", "P, 0.6"})
    void smoothingConvergesAtSecondOrderAndTheStaircaseAtFirst(Polarization pol, double frontOffset) {
        int n = WHOLE_CELLS.length;
        double[] cellSize = new double[n];
        double[] smoothed = new double[n];
        double[] staircase = new double[n];
        double[] exact = Dft.mul(airy(1, Math.sqrt(SLAB_PERMITTIVITY), 1, SLAB_THICKNESS, WAVELENGTH),
                Dft.expi(-2 * Math.PI * SLAB_THICKNESS / WAVELENGTH));
        StringBuilder table = new StringBuilder();
        for (int q = 0; q < n; q++) {
            int m = WHOLE_CELLS[q];
            cellSize[q] = SLAB_THICKNESS / (m + 0.5);
            double[][] t = transmissions(pol, m, frontOffset);
            smoothed[q] = Dft.abs(Dft.sub(t[0], exact));
            staircase[q] = Dft.abs(Dft.sub(t[1], exact));
            table.append(String.format("%n  %.1f cells across: smoothed %.3e, staircase %.3e", m + 0.5, smoothed[q],
                    staircase[q]));
        }
        double pSmoothed = fittedOrder(cellSize, smoothed);
        double pStaircase = fittedOrder(cellSize, staircase);
        String ctx = String.format("%s slab ε = %g, %g µm thick, front face %g cell past a node, S = %g: "
                        + "fitted order smoothed %.3f, staircase %.3f; |t_sim − t_Airy|:%s",
                pol, SLAB_PERMITTIVITY, SLAB_THICKNESS * 1e6, frontOffset, COURANT, pSmoothed, pStaircase, table);
        assertTrue(pSmoothed > MIN_SMOOTHED_ORDER, ctx);
        assertTrue(pStaircase < MAX_STAIRCASE_ORDER && pStaircase > MIN_STAIRCASE_ORDER, ctx);
        assertTrue(smoothed[n - 1] < FINEST_SMOOTHED_ERROR, ctx);
        for (int q = 0; q < n; q++) {
            assertTrue(smoothed[q] < staircase[q], ctx);
        }
    }

    /** Least-squares slope of ln(error) against ln(cell size). */
    static double fittedOrder(double[] h, double[] err) {
        int n = h.length;
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        for (int k = 0; k < n; k++) {
            double x = Math.log(h[k]);
            double y = Math.log(err[k]);
            sx += x;
            sy += y;
            sxx += x * x;
            sxy += x * y;
        }
        return (n * sxy - sx * sy) / (n * sxx - sx * sx);
    }

    /**
     * Simulated t = E_slab/E_vacuum at the probe, {smoothed, staircase}, each {re, im}, for a slab
     * m + ½ cells thick whose front face lies {@code frontOffset} cells past a node.
     */
    private static double[][] transmissions(Polarization pol, int m, double frontOffset) {
        double dx = SLAB_THICKNESS / (m + 0.5);
        int gap = (int) Math.round(0.5e-6 / dx);
        int iSource = PML + gap;
        int iFront = iSource + 2 * gap;
        int iProbe = iFront + m + 2 + gap;
        int nx = iProbe + gap + PML;
        // the slab runs from x = 0 to x = d; node iFront sits frontOffset cells before it
        GridSpec spec = new GridSpec(-(iFront + frontOffset) * dx, 0, dx, nx, 4);
        double f = PhysicalConstants.C0 / WAVELENGTH;
        Scene slab = Scene.builder(Material.VACUUM)
                .add(new Slab(0, 0, 1, 0, SLAB_THICKNESS), new Material("film", SLAB_PERMITTIVITY, 0)).build();
        double[] incident = spectrum(pol, Rasterizer.rasterize(Scene.builder(Material.VACUUM).build(), spec,
                Smoothing.NONE), iSource, iProbe, f);
        double[] smooth = spectrum(pol, Rasterizer.rasterize(slab, spec, Smoothing.ANISOTROPIC), iSource, iProbe, f);
        double[] stair = spectrum(pol, Rasterizer.rasterize(slab, spec, Smoothing.NONE), iSource, iProbe, f);
        return new double[][] {Dft.div(smooth, incident), Dft.div(stair, incident)};
    }

    /** The probe's record Fourier transformed at f, after a pulse from a column line source. */
    private static double[] spectrum(Polarization pol, MaterialGrid grid, int iSource, int iProbe, double f) {
        int nx = grid.nx();
        int ny = grid.ny();
        // a plane wave along x: PMC above and below keeps Ez uniform (s); PEC keeps Ey uniform (p)
        Boundary wall = pol == Polarization.S ? Boundary.pmc() : Boundary.pec();
        Component c = pol == Polarization.S ? Component.EZ : Component.EY;
        int j1 = pol == Polarization.S ? ny - 1 : ny - 2;
        Probe probe = new Probe(c, iProbe, 1);
        double dt = COURANT * grid.cellSize() / PhysicalConstants.C0;
        long steps = Math.round(PERIODS / f / dt);
        try (Simulation s = Simulation.builder(grid).polarization(pol).precision(Precision.DOUBLE).courant(COURANT)
                .threads(2).boundary(Side.LEFT, Boundary.pml(PML)).boundary(Side.RIGHT, Boundary.pml(PML))
                .boundary(Side.BOTTOM, wall).boundary(Side.TOP, wall)
                .source(Source.columnLine(c, nx, iSource, 0, j1, 1.0, TimeSignal.gaussianPulse(f, f / 5)))
                .listener(probe).build()) {
            s.run(steps);
        }
        return Dft.at(probe.values(), probe.times(), f);
    }

    /**
     * Airy amplitude transmission of a plate of index n2 and thickness d between media n1 and n3
     * at normal incidence, field at the back face over incident field at the front face:
     * t = t12 t23 e^{iδ}/(1 + r12 r23 e^{2iδ}), δ = 2π n2 d/λ0, r_ab = (n_a − n_b)/(n_a + n_b),
     * t_ab = 2n_a/(n_a + n_b) (Born &amp; Wolf, 7th ed., sec. 7.6 and sec. 1.6; exp(−iωt)
     * convention). Returns {re, im}.
     */
    static double[] airy(double n1, double n2, double n3, double d, double lambda) {
        double delta = 2 * Math.PI * n2 * d / lambda;
        double r12 = (n1 - n2) / (n1 + n2);
        double r23 = (n2 - n3) / (n2 + n3);
        double t12 = 2 * n1 / (n1 + n2);
        double t23 = 2 * n2 / (n2 + n3);
        double[] e2 = Dft.expi(2 * delta);
        double[] den = {1 + r12 * r23 * e2[0], r12 * r23 * e2[1]};
        return Dft.div(Dft.mul(new double[] {t12 * t23, 0}, Dft.expi(delta)), den);
    }

    /** The Airy reflection r = (r12 + r23 e^{2iδ})/(1 + r12 r23 e^{2iδ}) (same source). */
    static double[] airyReflection(double n1, double n2, double n3, double d, double lambda) {
        double delta = 2 * Math.PI * n2 * d / lambda;
        double r12 = (n1 - n2) / (n1 + n2);
        double r23 = (n2 - n3) / (n2 + n3);
        double[] e2 = Dft.expi(2 * delta);
        double[] num = {r12 + r23 * e2[0], r23 * e2[1]};
        double[] den = {1 + r12 * r23 * e2[0], r12 * r23 * e2[1]};
        return Dft.div(num, den);
    }

    /**
     * The Airy formula checked against an independent derivation: the characteristic matrix of a
     * homogeneous layer at normal incidence, M = [[cos δ, −(i/n2) sin δ], [−i n2 sin δ, cos δ]],
     * t = 2n1/((m11 + m12 n3) n1 + m21 + m22 n3) (Born &amp; Wolf sec. 1.6, from memory), and
     * energy conservation |r|² + (n3/n1)|t|² = 1 for a lossless plate.
     */
    @Test
    void airyFormulaAgreesWithTheCharacteristicMatrix() {
        double n1 = 1.0;
        double n2 = 2.0;
        double n3 = 1.5;
        for (double d : new double[] {0, 0.05e-6, 0.3e-6, 0.125e-6, 0.77e-6}) {
            double delta = 2 * Math.PI * n2 * d / WAVELENGTH;
            double c = Math.cos(delta);
            double s = Math.sin(delta);
            // (m11 + m12 n3) n1 + m21 + m22 n3 with m12 = −i s/n2 and m21 = −i n2 s
            double[] den = {c * n1 + c * n3, -s * n3 * n1 / n2 - n2 * s};
            double[] tMatrix = Dft.div(new double[] {2 * n1, 0}, den);
            double[] t = airy(n1, n2, n3, d, WAVELENGTH);
            String ctx = String.format("plate n = %g, d = %g m between %g and %g", n2, d, n1, n3);
            assertEquals(0, Dft.abs(Dft.sub(t, tMatrix)), FORMULA_AGREEMENT, ctx);
            double[] r = airyReflection(n1, n2, n3, d, WAVELENGTH);
            double power = Math.pow(Dft.abs(r), 2) + n3 / n1 * Math.pow(Dft.abs(t), 2);
            assertEquals(1, power, FORMULA_AGREEMENT, ctx);
        }
    }
}
