package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.Probe;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Phase velocity on the grid against the 2D Yee dispersion relation
 * [sin(ωΔt/2)/(cΔt)]² = [sin(k̃xΔx/2)/Δx]² + [sin(k̃yΔy/2)/Δy]² (A. Taflove &amp; S. C. Hagness,
 * Computational Electrodynamics, 3rd ed., 2005, ch. 4; from memory), along a grid axis and along
 * the diagonal, at 10 and 20 cells per vacuum wavelength, for s (Ez) and p (Ey, Hz).
 *
 * <p>Method: the DFT at the source's centre frequency f of one component at two probes on the
 * same ray, a distance D apart; k̃ = Δφ/D, the 2π multiples of Δφ resolved with the expected k̃
 * (the Yee and continuum values of k̃D differ by at most 1.6 rad here, less than π, so both
 * resolve to the same multiple and a wave at the continuum speed would be measured as such).
 * The phase velocity is ω/k̃, so its relative error equals |k̃th/k̃ − 1|. In cell units
 * (Δ = 1, Δt = 1 step) ω = 2πS/N for N cells per wavelength.
 */
class NumericalDispersionTest {

    /**
     * The requirement on the relative error of the phase velocity. The method's own error
     * is far smaller: CPML reflections of ~1e-4 move each probe phase by ~1e-4 rad against a
     * phase difference Δφ of 60 to 130 rad, the cylindrical-wave correction is applied (and is
     * 4e-5 relative before correction), and float rounding is ~1e-7.
     */
    private static final double TOLERANCE = 1e-3;
    private static final double COURANT = 0.5;
    private static final double DX = 20e-9;
    private static final int PML = 16;
    private static final int THREADS = 2;

    /** Axis strip: a plane wave along x between walls that keep it uniform in y. */
    private static final int AXIS_NX = 360;
    private static final int AXIS_NY = 4;
    private static final int AXIS_SOURCE = 30;
    private static final int AXIS_PROBE1 = 100;
    private static final int AXIS_PROBE2 = 300;

    /** Diagonal probes at about 5 and 15 wavelengths from a point source. */
    private static final double DIAGONAL_R1 = 5;
    private static final double DIAGONAL_R2 = 15;
    /** Cells between the outer probe and the PML. */
    private static final int DIAGONAL_MARGIN = 8;

    @ParameterizedTest(name = "axis, {0}, {1} cells per wavelength")
    @CsvSource({"S, 10", "S, 20", "P, 10", "P, 20"})
    void planeWaveAlongAxisMatchesYeeDispersion(Polarization pol, int cellsPerWavelength) {
        double omega = 2 * Math.PI * COURANT / cellsPerWavelength;
        double kYee = YeeTheory.axisWavenumber(omega, COURANT, 1.0);
        // s: PMC above and below keeps Ez uniform in y; p: PEC keeps Ey (and Hz) uniform
        // (common practice: a 1D plane wave in a 2D code between symmetry walls)
        Boundary wall = pol == Polarization.S ? Boundary.pmc() : Boundary.pec();
        Component c = pol == Polarization.S ? Component.EZ : Component.EY;
        int j1 = pol == Polarization.S ? AXIS_NY - 1 : AXIS_NY - 2;
        TimeSignal pulse = pulse(cellsPerWavelength);
        Probe p1 = new Probe(c, AXIS_PROBE1, 1);
        Probe p2 = new Probe(c, AXIS_PROBE2, 1);
        Simulation.Builder b = Simulation.builder(MaterialGrid.builder(AXIS_NX, AXIS_NY, DX, Material.VACUUM).build())
                .polarization(pol).courant(COURANT).threads(THREADS)
                .boundary(Side.LEFT, Boundary.pml(PML)).boundary(Side.RIGHT, Boundary.pml(PML))
                .boundary(Side.BOTTOM, wall).boundary(Side.TOP, wall)
                .source(Source.columnLine(c, AXIS_NX, AXIS_SOURCE, 0, j1, 1.0, pulse))
                .listener(p1).listener(p2);
        int steps = steps(AXIS_PROBE2 - AXIS_SOURCE, cellsPerWavelength);
        try (Simulation s = b.build()) {
            s.run(steps);
        }
        double d = AXIS_PROBE2 - AXIS_PROBE1;
        double k = measuredWavenumber(p1, p2, d, kYee, frequency(cellsPerWavelength), 0);
        String ctx = String.format("axis (x), %s (%s), %d cells/λ, S = %g, grid %d×%d, probes %d and %d, %d steps",
                pol, c, cellsPerWavelength, COURANT, AXIS_NX, AXIS_NY, AXIS_PROBE1, AXIS_PROBE2, steps);
        check(ctx, omega, k, kYee, cellsPerWavelength);
    }

    @ParameterizedTest(name = "diagonal, {0}, {1} cells per wavelength")
    @CsvSource({"S, 10", "S, 20", "P, 10", "P, 20"})
    void cylindricalWaveAlongDiagonalMatchesYeeDispersion(Polarization pol, int cellsPerWavelength) {
        double omega = 2 * Math.PI * COURANT / cellsPerWavelength;
        double kYee = YeeTheory.diagonalWavenumber(omega, COURANT);
        // probes at offsets (m, m) from the source: on the 45° ray through the source's own site
        // (the node for Ez, the cell centre for Hz), at r = m√2 cells
        int m1 = (int) Math.round(DIAGONAL_R1 * cellsPerWavelength / Math.sqrt(2));
        int m2 = (int) Math.round(DIAGONAL_R2 * cellsPerWavelength / Math.sqrt(2));
        int centre = m2 + DIAGONAL_MARGIN + PML;
        int n = 2 * centre + 1;
        Component c = pol == Polarization.S ? Component.EZ : Component.HZ;
        Probe p1 = new Probe(c, centre + m1, centre + m1);
        Probe p2 = new Probe(c, centre + m2, centre + m2);
        Simulation.Builder b = Simulation.builder(MaterialGrid.builder(n, n, DX, Material.VACUUM).build())
                .polarization(pol).courant(COURANT).threads(THREADS)
                .boundaries(Boundary.pml(PML))
                .source(Source.point(c, n, centre, centre, 1.0, pulse(cellsPerWavelength)))
                .listener(p1).listener(p2);
        double r1 = m1 * Math.sqrt(2);
        double r2 = m2 * Math.sqrt(2);
        int steps = steps(r2, cellsPerWavelength);
        try (Simulation s = b.build()) {
            s.run(steps);
        }
        // A line source radiates H0(1)(k̃r) (exp(−iωt) convention), whose phase for large k̃r is
        // k̃r − π/4 − 1/(8k̃r) + O((k̃r)^−3) (M. Abramowitz & I. A. Stegun, Handbook of Mathematical
        // Functions, 1964, 9.2.5–9.2.10, equation numbers from memory): the phase runs ahead of k̃r
        // as r grows, by 1/(8k̃r1) − 1/(8k̃r2) = 0.0027 rad between the probes at both resolutions
        // (the radii scale with the wavelength), 4.2e-5 of Δφ. It is removed here with k̃ = k̃Yee;
        // the next term is below 1e-5 rad. On the lattice the 1/r term's coefficient differs from
        // the isotropic 1/8 by an amount that falls with resolution: the residual left after the
        // correction measured about 1.2e-5 (10 cells/λ) and 3e-6 (20 cells/λ), falling as 1/r1 when
        // r1 was moved from 3λ to 8λ, and unchanged when the record was doubled or the margin to the
        // PML widened from 8 to 40 cells; either way far inside the tolerance.
        double nearField = 1 / (8 * kYee * r1) - 1 / (8 * kYee * r2);
        double k = measuredWavenumber(p1, p2, r2 - r1, kYee, frequency(cellsPerWavelength), nearField);
        String ctx = String.format("diagonal (45°), %s (%s), %d cells/λ, S = %g, grid %d×%d, point source at (%d, %d), "
                        + "probes at r = %.2f and %.2f cells, %d steps",
                pol, c, cellsPerWavelength, COURANT, n, n, centre, centre, r1, r2, steps);
        check(ctx, omega, k, kYee, cellsPerWavelength);
    }

    /**
     * k̃ from the DFT phases at two probes D apart: Δφ = arg(X2/X1) + 2πq, q chosen to put Δφ
     * nearest to k̃expected·D + nearField, then k̃ = (Δφ − nearField)/D, where nearField is the
     * phase the ideal wave gains between the probes beyond k̃D (zero for a plane wave).
     */
    private static double measuredWavenumber(Probe p1, Probe p2, double d, double kExpected, double f, double nearField) {
        double[] x1 = Dft.at(p1.values(), p1.times(), f);
        double[] x2 = Dft.at(p2.values(), p2.times(), f);
        double[] ratio = Dft.div(x2, x1);
        double wrapped = Math.atan2(ratio[1], ratio[0]);
        double q = Math.rint((kExpected * d + nearField - wrapped) / (2 * Math.PI));
        return (wrapped + 2 * Math.PI * q - nearField) / d;
    }

    private static void check(String ctx, double omega, double k, double kYee, int cellsPerWavelength) {
        double kContinuum = omega / COURANT;
        // phase velocity in units of c: v/c = ω/(S k̃) in cell units
        double v = omega / (COURANT * k);
        double vYee = omega / (COURANT * kYee);
        double errYee = Math.abs(v / vYee - 1);
        double errContinuum = Math.abs(v - 1);
        String msg = String.format("%s: measured k̃ = %.6f rad/cell (v/c = %.6f), Yee relation k̃ = %.6f (v/c = %.6f), "
                + "continuum k = %.6f (v/c = 1); relative phase-velocity error %.3g vs Yee, %.3g vs continuum, tolerance %g",
                ctx, k, v, kYee, vYee, kContinuum, errYee, errContinuum, TOLERANCE);
        assertTrue(errYee < TOLERANCE, msg);
        // the same tolerance rejects the continuum phase velocity at 10 cells per wavelength, so the test can fail
        if (cellsPerWavelength == 10) {
            assertTrue(errContinuum > TOLERANCE, msg);
        }
    }

    /** Centre frequency for N cells per vacuum wavelength, Hz. */
    private static double frequency(int cellsPerWavelength) {
        return PhysicalConstants.C0 / (cellsPerWavelength * DX);
    }

    /** A Gaussian pulse at the test frequency with σf = f/5 (spectrum from about 0.4f to 1.6f). */
    private static TimeSignal pulse(int cellsPerWavelength) {
        double f = frequency(cellsPerWavelength);
        return TimeSignal.gaussianPulse(f, f / 5);
    }

    /**
     * Steps for the pulse (12τ long, τ = 5N/(2πS) steps) to pass a probe {@code distance} cells
     * away, with half as much again for the slower high-frequency components and the tail.
     */
    private static int steps(double distance, int cellsPerWavelength) {
        double tau = 5.0 * cellsPerWavelength / (2 * Math.PI * COURANT);
        return (int) Math.ceil(1.5 * (distance / COURANT + 12 * tau));
    }
}
