package org.evanesce.solver.farfield;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.source.GridWave;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * {@link NearToFarField#onYeeGrid} against the Yee grid's own plane waves: the 2D dispersion relation and the ratios
 * of the components that the update equations impose (Taflove &amp; Hagness, <i>Computational Electrodynamics</i>,
 * 3rd ed., 2005, ch. 4; {@link GridWave}), sampled on one side of a contour as a flux line samples them (U and V_t at
 * the side's points, the electric field the mean of its two sites across the side). Kirchhoff's integral over a side
 * picks the plane wave whose tangential wavenumber matches the direction φ (Taflove &amp; Hagness ch. 8): a wave
 * leaving through the side along φ must give F(φ) = ½ k (n̂·r̂) U L (the continuum's 2 k_n U per unit length, over 4),
 * and the same wave arriving (k_n reversed) nothing.
 */
class NearToFarFieldGridTest {

    private static final double LAMBDA = 633e-9;
    private static final double COURANT = 0.5;

    /**
     * Relative error of the leaving wave's F and the arriving wave's share: only rounding is left (measured at most
     * 2.7e-14 for every case here, the phase carried along the side by repeated multiplication); about 10x that.
     */
    private static final double ROUNDING = 3e-13;
    /**
     * The least error the continuum's transformation makes on the same samples, leaving or arriving (measured 1.7e-3
     * to 3.9e-2 here, about (kΔ)²/8 and more); the grid's samples must show it.
     */
    private static final double CONTINUUM_ERROR = 1e-3;

    /** F(φ) of a grid plane wave along φ (leaving: ky > 0) or along its mirror in the side (arriving), top side. */
    private static Complex[] sideAmplitudes(Polarization pol, double index, double epsilon, int cellsPerWavelength,
                                            double angle, boolean leaving) {
        double k0 = 2 * Math.PI / LAMBDA;
        double dx = LAMBDA / index / cellsPerWavelength;
        double omega = k0 * PhysicalConstants.C0;
        double w = Math.sin(omega * COURANT * dx / PhysicalConstants.C0 / 2);
        double kt = GridWave.wavenumber(epsilon, angle, omega, dx, COURANT);
        double kx = kt * Math.cos(angle);
        double ky = kt * Math.sin(angle) * (leaving ? 1 : -1);
        int n = 40;
        double ys = 0.37 * dx;
        double[] x = new double[n];
        double[] y = new double[n];
        double[] nx = new double[n];
        double[] ny = new double[n];
        double[] wt = new double[n];
        double[] ur = new double[n];
        double[] ui = new double[n];
        double[] vr = new double[n];
        double[] vi = new double[n];
        boolean s = pol == Polarization.S;
        Component e = s ? Component.EZ : Component.EX;
        Component h = s ? Component.HX : Component.HZ;
        for (int j = 0; j < n; j++) {
            x[j] = (j - 13.3) * dx;
            y[j] = ys;
            ny[j] = 1;
            wt[j] = dx;
            // the z component's phasor (amplitude 1) at each site; E from its two sites across the side
            Complex at = Complex.polar(1, kx * x[j] + ky * ys);
            Complex below = Complex.polar(1, kx * x[j] + ky * (ys - dx / 2));
            Complex above = Complex.polar(1, kx * x[j] + ky * (ys + dx / 2));
            double re = GridWave.ratio(e, kx, ky, epsilon, dx, COURANT, w);
            double rh = GridWave.ratio(h, kx, ky, epsilon, dx, COURANT, w);
            Complex electric = below.plus(above).times(0.5 * re);
            Complex magnetic = at.times(rh);
            Complex u = s ? electric : magnetic;
            // V_t = V · t̂, t̂ = ẑ × n̂ = (−1, 0) on a side whose normal is +y: −η0Hx (s), −Ex (p)
            Complex v = (s ? magnetic : electric).times(-1);
            ur[j] = u.re();
            ui[j] = u.im();
            vr[j] = v.re();
            vi[j] = v.im();
        }
        ContourPoints side = new ContourPoints(x, y, nx, ny, wt);
        NearToFarField continuum = new NearToFarField(pol, LAMBDA, index, side.scalar(ur, ui), side.scalar(vr, vi));
        NearToFarField grid = continuum.onYeeGrid(dx, COURANT, epsilon);
        return new Complex[] {grid.amplitude(angle), continuum.amplitude(angle), Complex.real(0.5 * index * k0
                * Math.sin(angle) * n * dx)};
    }

    @ParameterizedTest(name = "{0} n={1} ε={2} {3} cells/λ at {4} rad")
    @CsvSource({"S, 1.0, 1.0, 20, 1.2", "P, 1.0, 1.0, 20, 1.2", "S, 1.5, 2.25, 10, 0.4", "P, 1.5, 2.25, 10, 0.4",
            "S, 1.33, 1.7641, 30, 2.0", "P, 1.33, 1.7641, 30, 2.0", "P, 1.5, 2.243, 15, 0.9", "S, 1.5, 2.243, 15, 0.9"})
    void aLeavingGridWaveGivesTheContinuumsAmplitudeAndAnArrivingOneNothing(Polarization pol, double index,
                                                                             double epsilon, int cells, double angle) {
        Complex[] out = sideAmplitudes(pol, index, epsilon, cells, angle, true);
        Complex[] in = sideAmplitudes(pol, index, epsilon, cells, angle, false);
        double expected = out[2].re();
        double leaving = out[0].minus(out[2]).abs() / expected;
        double arriving = in[0].abs() / expected;
        double continuumLeaving = out[1].minus(out[2]).abs() / expected;
        double continuumArriving = in[1].abs() / expected;
        System.out.printf("%s n=%.2f ε=%.4f %d cells/λ: grid %.2e / %.2e, continuum %.2e / %.2e%n", pol, index, epsilon,
                cells, leaving, arriving, continuumLeaving, continuumArriving);
        assertTrue(leaving <= ROUNDING && arriving <= ROUNDING, String.format(
                "%s: leaving wave off by %.3g, arriving wave gives %.3g of the leaving one's amplitude", pol, leaving,
                arriving));
        // the samples are the grid's: the continuum's transformation must see the difference (the test can fail)
        assertTrue(Math.max(continuumLeaving, continuumArriving) >= CONTINUUM_ERROR, String.format(
                "%s: the continuum's transformation errs only %.3g / %.3g", pol, continuumLeaving, continuumArriving));
    }

    @Test
    void refusesAGridThatCarriesNoWave() {
        double[] one = {0};
        ContourPoints p = new ContourPoints(one, one, new double[] {1}, one, new double[] {1e-9});
        NearToFarField ff = new NearToFarField(Polarization.S, LAMBDA, 1.0, p.scalar(one, one), p.scalar(one, one));
        // 1.1 cells per wavelength: beyond the grid's cut-off at S = 0.5
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> ff.onYeeGrid(LAMBDA / 1.1, COURANT, 1.0));
        assertTrue(e.getMessage().contains("does not carry"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> ff.onYeeGrid(0, COURANT, 1.0));
        assertThrows(IllegalArgumentException.class, () -> ff.onYeeGrid(LAMBDA / 20, 0.8, 1.0));
        assertThrows(IllegalArgumentException.class, () -> ff.onYeeGrid(LAMBDA / 20, COURANT, -1));
    }
}
