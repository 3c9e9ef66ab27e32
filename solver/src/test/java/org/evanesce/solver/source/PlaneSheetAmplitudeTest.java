package org.evanesce.solver.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The grid's launch factor of a plane-wave current sheet against the continuous sheet's, and the pulse's spectrum
 * against a direct sum over time steps.
 */
class PlaneSheetAmplitudeTest {

    static final double COURANT = 0.5;
    /**
     * Second order in the cell: the error should fall 4× when the cells halve (20 to 40 cells per wavelength).
     * Measured ratios 4.054 (s, p at 0°), 4.083 (s, 50°), 3.977 (p, 50°); 0.5 allows for the next order.
     */
    static final double ORDER_TOLERANCE = 0.5;
    /** The error at 400 cells per wavelength: measured 3.1e-5 at most (0°), about (2π/400)²/8. */
    static final double FINE_TOLERANCE = 3e-4;
    /**
     * Closed form (the whole integral) against the sum over 2^16 steps of Δt = τ/40 from t = 0, relative to the peak:
     * the sum misses the envelope's tail before t = 0 (it starts at e^−18 of its peak), about 1e-9 of the spectrum;
     * measured 8.8e-10 at f0, 4.2e-10 and 5.6e-10 at 0.9 f0 and 1.2 f0 (aliasing, e^{−(2π·40)²/2}, is nothing).
     */
    static final double SPECTRUM_TOLERANCE = 1e-8;

    /**
     * The continuous sheet: a current sheet radiates each way a plane wave with E = J/(2n cos θ) (s, J in V/m as η0
     * times the current per metre) or E = M/(2 cos θ) (p), from the jump of the tangential field across it (common
     * practice); the launch factor's relative error at c cells per wavelength in the medium.
     */
    static double error(Polarization pol, double n, double theta, double cells) {
        double dx = 1e-8;
        double lambdaMedium = cells * dx;
        double k = 2 * Math.PI / lambdaMedium;
        double omega = k / n * 299_792_458.0;
        double dt = COURANT * dx / 299_792_458.0;
        double got = PlaneSheetAmplitude.electricPerCurrent(pol, Precision.DOUBLE, COURANT, n * n, k * Math.sin(theta) * dx,
                omega * dt);
        double continuous = pol == Polarization.S ? 1 / (2 * n * Math.cos(theta)) : 1 / (2 * Math.cos(theta));
        return got / continuous - 1;
    }

    @ParameterizedTest
    @CsvSource({"S, 0", "S, 50", "P, 0", "P, 50"})
    void tendsToTheContinuousSheetAtSecondOrder(Polarization pol, double degrees) {
        double theta = Math.toRadians(degrees);
        double coarse = error(pol, 1.5, theta, 20);
        double fine = error(pol, 1.5, theta, 40);
        assertEquals(4, coarse / fine, ORDER_TOLERANCE, pol + " at " + degrees + " deg: errors " + coarse + ", " + fine);
        assertEquals(0, error(pol, 1.5, theta, 400), FINE_TOLERANCE, pol + " at " + degrees + " deg, 400 cells per wavelength");
    }

    @Test
    void refusesAWaveThatDoesNotPropagate() {
        // kx above the medium's wavenumber: evanescent
        double dx = 1e-8;
        double k = 2 * Math.PI / (20 * dx);
        double omega = k / 1.5 * 299_792_458.0;
        double dt = COURANT * dx / 299_792_458.0;
        assertThrows(IllegalArgumentException.class, () -> PlaneSheetAmplitude.electricPerCurrent(Polarization.S,
                Precision.DOUBLE, COURANT, 2.25, 1.2 * k * dx, omega * dt));
    }

    @ParameterizedTest
    @CsvSource({"1.0", "0.9", "1.2"})
    void pulseSpectrumIsTheSumOverSteps(double fOverF0) {
        GaussianPulse p = new GaussianPulse(4.7e14, 2e13);
        double dt = p.tau() / 40;
        double omega = 2 * Math.PI * fOverF0 * 4.7e14;
        double re = 0;
        double im = 0;
        for (int n = 0; n < 1 << 16; n++) {
            double t = n * dt;
            re += p.value(t) * Math.cos(omega * t) * dt;
            im += p.value(t) * Math.sin(omega * t) * dt;
        }
        double sum = Math.hypot(re, im);
        double closed = p.amplitudeSpectrum(fOverF0 * 4.7e14);
        assertEquals(sum, closed, SPECTRUM_TOLERANCE * p.amplitudeSpectrum(4.7e14), "f/f0 = " + fOverF0);
    }
}
