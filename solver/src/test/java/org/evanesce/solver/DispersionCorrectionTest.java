package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.PhysicalConstants;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The corrected permittivity puts the continuum normal wavenumber into the 2D Yee dispersion
 * relation (Taflove &amp; Hagness, ch. 4): ε' sin²(ωΔt/2)/(c0Δt)² = sin²(kxΔ/2)/Δ² + sin²(kyΔ/2)/Δ²
 * with ky = √(ε k0² − kx²), or −sinh²(κΔ/2)/Δ² with κ = √(kx² − ε k0²) beyond the critical angle
 * (Hecht, Optics, 4th ed., sec. 4.7). Solving that relation back for the normal wavenumber
 * recovers the continuum one, and the correction vanishes as Δ² (the scheme's order).
 */
class DispersionCorrectionTest {

    private static final double WAVELENGTH = 633e-9;
    private static final double OMEGA = 2 * Math.PI * PhysicalConstants.C0 / WAVELENGTH;
    /** Round-off of the arcsine and arcsinh inversions. */
    private static final double INVERSION_TOL = 1e-11;

    @ParameterizedTest(name = "ε {0}, kx = n k0 sin {1}° in glass, {2} cells per wavelength")
    @CsvSource({"2.25, 45, 20", "1.0, 45, 20", "1.0, 60, 10", "2.25, 0, 20", "1.0, 20, 40", "1.769, 70, 15"})
    void theGridsNormalWavenumberBecomesTheContinuumOne(double eps, double degrees, int cpw) {
        double dx = WAVELENGTH / (1.5 * cpw);
        double dt = 0.5 * dx / PhysicalConstants.C0;
        double k0 = OMEGA / PhysicalConstants.C0;
        double kx = k0 * 1.5 * Math.sin(Math.toRadians(degrees));
        double corrected = DispersionCorrection.permittivity(eps, kx, OMEGA, dx, dt);
        double rhs = corrected * Math.pow(Math.sin(OMEGA * dt / 2) / (PhysicalConstants.C0 * dt), 2) * dx * dx
                - Math.pow(Math.sin(kx * dx / 2), 2);
        double q = eps * k0 * k0 - kx * kx;
        if (q > 0) {
            double ky = 2 / dx * Math.asin(Math.sqrt(rhs));
            assertEquals(Math.sqrt(q), ky, INVERSION_TOL * Math.sqrt(q));
        } else {
            double kappa = 2 / dx * asinh(Math.sqrt(-rhs));
            assertEquals(Math.sqrt(-q), kappa, INVERSION_TOL * Math.sqrt(-q));
        }
        // second order: halving the cell (and the step) divides ε' − ε by about 4
        double finer = DispersionCorrection.permittivity(eps, kx, OMEGA, dx / 2, dt / 2);
        double ratio = (corrected - eps) / (finer - eps);
        assertTrue(Math.abs(ratio - 4) < 0.1, "ε' − ε falls by " + ratio + " when Δ halves; expected about 4");
    }

    private static double asinh(double x) {
        return Math.log(x + Math.sqrt(x * x + 1));
    }

    @ParameterizedTest(name = "ε = {0}")
    @CsvSource({"0", "-1", "NaN"})
    void refusesANonPositivePermittivity(double eps) {
        assertThrows(IllegalArgumentException.class, () -> DispersionCorrection.permittivity(eps, 0, OMEGA, 1e-8, 1e-17));
    }
}
