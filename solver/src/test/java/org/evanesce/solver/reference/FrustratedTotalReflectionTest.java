package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Tunnelling through a gap of index n2 between two media of index n1 beyond the critical angle.
 *
 * <p>The closed form is 1/T = 1 + α sinh²(κd), κ = k0 sqrt(n1² sin²θ − n2²) (S. Zhu, A. W. Yu, D. Hawley,
 * R. Roy, "Frustrated total internal reflection: a demonstration and review", Am. J. Phys. 54, 601 (1986);
 * the equation form is from memory). We derive α independently here. In the gap kz = iκ, so with the
 * admittances Q1 (medium 1) and Q2 = iG (gap) — s: Q1 = k1z, G = κ; p: Q1 = k1z/n1², G = κ/n2² (a common
 * factor 1/k0 dropped) — the gap's characteristic matrix (Born &amp; Wolf sec. 1.6) is
 * <pre>
 *     M = [ cosh κd        −i sinh κd / G ]
 *         [ i G sinh κd     cosh κd        ]
 * </pre>
 * and t = 2Q1/D with D = Q1(m11 + m12 Q1) + m21 + m22 Q1 = 2 Q1 cosh κd + i (G − Q1²/G) sinh κd. The outer
 * media are equal, so T = |t|² and
 * <pre>
 *     1/T = |D|²/(4Q1²) = cosh² κd + (G² − Q1²)²/(4 Q1² G²) sinh² κd = 1 + (Q1² + G²)²/(4 Q1² G²) sinh² κd,
 * </pre>
 * i.e. α = (Q1² + G²)²/(4 Q1² G²):
 * α_s = (k1z² + κ²)²/(4 k1z² κ²) and α_p = (n2⁴ k1z² + n1⁴ κ²)²/(4 n1⁴ n2⁴ k1z² κ²).
 * With k1z² + κ² = k0²(n1² − n2²) and n = n1/n2 these become Zhu et al.'s angle forms
 * α_s = (n² − 1)²/(4 n² cos²θ (n² sin²θ − 1)) and α_p = α_s ((n² + 1) sin²θ − 1)², which the test also checks.
 * The test then shows that the closed form and the transfer matrix agree to machine precision; that agreement,
 * not the recollection of the paper, is the check.
 */
class FrustratedTotalReflectionTest {

    /**
     * Relative agreement of 1/T, in units of ε·c where ε = 2.2e-16 is the double epsilon and c the condition
     * number of the problem, c = 1/cos²θ + n2²/(n1² sin²θ − n2²) + 2κd: both sides get k1z and κ as square roots of
     * differences that cancel near grazing incidence and near the critical angle, and sinh² κd turns the
     * rounding of κd into a relative error 2κd·ε. So: a few ulps of a well-conditioned problem (measured at most
     * about 3, i.e. 6e-13 relative, at 88 deg or for κd = 14).
     */
    private static final double MACHINE_ULPS = 8;
    /** On T itself against the closed form: measured at most 1.9e-14, about 10 times below this. */
    private static final double CLOSED_FORM = 2e-13;
    private static final double WAVELENGTH = 633e-9;

    private static double alphaFromWavenumbers(Polarization pol, double n1, double n2, double theta) {
        double k0 = 2 * Math.PI / WAVELENGTH;
        double k1z = k0 * n1 * Math.cos(theta);
        double kappa = Evanescent.decayConstant(n1, n2, theta, WAVELENGTH);
        if (pol == Polarization.S) {
            double a = k1z * k1z + kappa * kappa;
            return a * a / (4 * k1z * k1z * kappa * kappa);
        }
        double a = Math.pow(n2, 4) * k1z * k1z + Math.pow(n1, 4) * kappa * kappa;
        return a * a / (4 * Math.pow(n1 * n2, 4) * k1z * k1z * kappa * kappa);
    }

    /** Zhu, Yu, Hawley, Roy (1986), with n = n1/n2 (form from memory). */
    private static double alphaZhu(Polarization pol, double n1, double n2, double theta) {
        double n = n1 / n2;
        double s2 = Math.sin(theta) * Math.sin(theta);
        double c2 = 1 - s2;
        double as = (n * n - 1) * (n * n - 1) / (4 * n * n * c2 * (n * n * s2 - 1));
        if (pol == Polarization.S) {
            return as;
        }
        double f = (n * n + 1) * s2 - 1;
        return as * f * f;
    }

    private static PlanarStack gap(double n1, double n2, double d) {
        return new PlanarStack(n1, List.of(new PlanarStack.Layer(Complex.real(n2), d)), Complex.real(n1));
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void transferMatrixAgreesWithTheClosedFormToMachinePrecision(Polarization pol) {
        double worst = 0;
        double worstRelative = 0;
        for (double[] media : new double[][] {{1.5, 1.0}, {1.515, 1.333}, {3.5, 1.0}, {1.8, 1.45}}) {
            double n1 = media[0];
            double n2 = media[1];
            double critical = Math.toDegrees(Math.asin(n2 / n1));
            for (double deg : new double[] {critical + 0.5, 45, 50, 60, 75, 88}) {
                if (deg <= critical) {
                    continue;
                }
                double th = Math.toRadians(deg);
                double alpha = alphaFromWavenumbers(pol, n1, n2, th);
                assertEquals(alphaZhu(pol, n1, n2, th), alpha, 1e-12 * alpha, "the two forms of alpha");
                double kappa = Evanescent.decayConstant(n1, n2, th, WAVELENGTH);
                for (double d = 0; d <= 1.5 * WAVELENGTH; d += WAVELENGTH / 37) {
                    double sh = Math.sinh(kappa * d);
                    double inverse = 1 + alpha * sh * sh;
                    PlanarStack.Response resp = gap(n1, n2, d).atAngle(pol, WAVELENGTH, th);
                    String what = String.format("%s %g | %g gap %g nm | %g at %g deg", pol, n1, n2, d * 1e9, n1, deg);
                    double rel = Math.abs(1 / resp.transmittance() - inverse) / inverse;
                    double u = n1 * n1 * Math.sin(th) * Math.sin(th) - n2 * n2;
                    double condition = 1 / (Math.cos(th) * Math.cos(th)) + n2 * n2 / u + 2 * kappa * d;
                    double ulps = rel / (Math.ulp(1.0) * condition);
                    worst = Math.max(worst, ulps);
                    worstRelative = Math.max(worstRelative, rel);
                    assertTrue(ulps <= MACHINE_ULPS, what + ": 1/T relative deviation " + rel + " = " + ulps
                            + " eps times the condition number " + condition);
                    assertEquals(1 / inverse, resp.transmittance(), CLOSED_FORM, what);
                    assertEquals(1.0, resp.reflectance() + resp.transmittance(), 1e-14, what + " R + T");
                }
            }
        }
        System.out.printf("FTIR %s: largest relative deviation of 1/T from the closed form %.3g (%.3g eps times the "
                + "condition number)%n", pol, worstRelative, worst);
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void transmittanceGoesContinuouslyToOneAsTheGapCloses(Polarization pol) {
        // with equal outer media a vanishing gap transmits everything; for small d, 1 − T ≈ α (κd)² (the
        // expansion of the closed form above)
        double th = Math.toRadians(50);
        double kappa = Evanescent.decayConstant(1.5, 1.0, th, WAVELENGTH);
        double alpha = alphaFromWavenumbers(pol, 1.5, 1.0, th);
        PlanarStack.Response closed = gap(1.5, 1.0, 0).atAngle(pol, WAVELENGTH, th);
        assertEquals(1.0, closed.transmittance(), 1e-15, "zero gap");
        assertEquals(0.0, closed.reflectance(), 1e-30, "zero gap");
        double previous = 0;
        for (double d = 1e-8; d >= 1e-14; d /= 10) {
            double loss = 1 - gap(1.5, 1.0, d).atAngle(pol, WAVELENGTH, th).transmittance();
            double expected = alpha * kappa * kappa * d * d;
            assertEquals(expected, loss, 1e-2 * expected + 1e-15, "gap " + d + " m: 1 − T");
            assertTrue(previous == 0 || loss < previous, "1 − T decreases as the gap closes");
            previous = loss;
        }
    }

    @Test
    void veryThickGapsDoNotOverflow() {
        // 200 decay lengths: cosh κd would overflow an unscaled product; T ≈ (1/α)·4 e^{−2κd} underflows to ~0 and R = 1
        double th = Math.toRadians(60);
        double kappa = Evanescent.decayConstant(1.5, 1.0, th, WAVELENGTH);
        for (Polarization pol : Polarization.values()) {
            PlanarStack.Response resp = gap(1.5, 1.0, 800 / kappa).atAngle(pol, WAVELENGTH, th);
            assertEquals(1.0, resp.reflectance(), 1e-15, pol + " R");
            assertTrue(resp.transmittance() >= 0 && resp.transmittance() < 1e-300, pol + " T = " + resp.transmittance());
            assertTrue(resp.r().isFinite() && resp.t().isFinite(), pol + " finite");
            // and the single-interface reflection phase is reached (Hecht sec. 4.7)
            Complex single = PlanarStack.interfaceBetween(1.5, Complex.real(1.0)).atAngle(pol, WAVELENGTH, th).r();
            assertTrue(single.minus(resp.r()).abs() < 1e-15, pol + " r");
        }
    }
}
