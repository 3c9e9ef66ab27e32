package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The Goos–Hänchen shift −d(arg r)/dkx (K. Artmann, Ann. Physik 2, 87 (1948)), which {@link PlanarStack}
 * takes by a numerical derivative of the transfer-matrix phase, against the closed form for a single interface
 * beyond the critical angle.
 *
 * <p>The closed form, derived here: with k1z = k0 n1 cos θ and κ = k0 sqrt(n1² sin²θ − n2²), the total-reflection
 * phase is arg r = −2 arctan(ν κ / k1z), ν = 1 for s and n1²/n2² for p (Hecht sec. 4.7; the form of φ from
 * memory, checked against the matrix in {@code FresnelTest}). Since dκ/dkx = kx/κ and dk1z/dkx = −kx/k1z,
 * <pre>
 *     D = −d(arg r)/dkx = 2ν kx (k1z² + κ²) / (κ k1z (k1z² + ν² κ²)),
 * </pre>
 * which for s is D_s = 2 tan θ / κ = λ0 tan θ / (π sqrt(n1² sin²θ − n2²)), and for p is
 * D_p = D_s · m² / ((1 + m²) sin²θ − m²) with m = n2/n1: Artmann's pair as reviewed by R. H. Renard, J. Opt. Soc.
 * Am. 54, 1190 (1964) (the forms from memory; they follow from the line above).
 */
class GoosHanchenTest {

    /**
     * Relative accuracy of the numerical derivative: five-point differences at 1e-3 of the distance to the nearest
     * branch point truncate at about 1e-12; rounding of arg r over the small phase step adds about 1e-11 close to the
     * critical angle (measured at most 1.4e-11). Well below anything a finite beam resolves.
     */
    private static final double DERIVATIVE = 1e-9;
    private static final double WAVELENGTH = 633e-9;

    private static double closedForm(Polarization pol, double n1, double n2, double theta) {
        double k0 = 2 * Math.PI / WAVELENGTH;
        double kx = k0 * n1 * Math.sin(theta);
        double k1z = k0 * n1 * Math.cos(theta);
        double kappa = Evanescent.decayConstant(n1, n2, theta, WAVELENGTH);
        double nu = pol == Polarization.S ? 1 : n1 * n1 / (n2 * n2);
        return 2 * nu * kx * (k1z * k1z + kappa * kappa) / (kappa * k1z * (k1z * k1z + nu * nu * kappa * kappa));
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void numericalDerivativeMatchesArtmannsClosedForm(Polarization pol) {
        double worst = 0;
        for (double[] media : new double[][] {{1.5, 1.0}, {1.515, 1.333}, {3.5, 1.0}}) {
            double n1 = media[0];
            double n2 = media[1];
            double critical = Math.toDegrees(Math.asin(n2 / n1));
            PlanarStack st = PlanarStack.interfaceBetween(n1, Complex.real(n2));
            for (double deg : new double[] {critical + 0.01, critical + 0.5, critical + 2, 45, 50, 60, 70, 80, 89}) {
                if (deg <= critical) {
                    continue;
                }
                double th = Math.toRadians(deg);
                double expected = closedForm(pol, n1, n2, th);
                double got = st.goosHanchenShift(pol, WAVELENGTH, th);
                double rel = Math.abs(got - expected) / expected;
                worst = Math.max(worst, rel);
                assertEquals(expected, got, DERIVATIVE * expected,
                        String.format("%s %g -> %g at %g deg (critical %g deg)", pol, n1, n2, deg, critical));
            }
        }
        // the explicit angle forms (Renard 1964, from memory) agree with the derivative form above
        double th = Math.toRadians(50);
        double m = 1.0 / 1.5;
        double ds = WAVELENGTH * Math.tan(th) / (Math.PI * Math.sqrt(1.5 * 1.5 * Math.sin(th) * Math.sin(th) - 1));
        double dp = ds * m * m / ((1 + m * m) * Math.sin(th) * Math.sin(th) - m * m);
        assertEquals(pol == Polarization.S ? ds : dp, closedForm(pol, 1.5, 1.0, th), 1e-12 * ds);
        System.out.printf("Goos-Hänchen %s: largest relative deviation from the closed form %.3g%n", pol, worst);
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void shiftIsForwardAndAThickGapLeavesItUnchanged(Polarization pol) {
        // a gap of many decay lengths reflects like the bare interface (common practice), so its shift is the
        // single-interface one; at 45 deg, 1.5 → 1.0, 633 nm, the s shift is 2 tan 45° / κ = 570 nm
        double th = Math.toRadians(45);
        double single = closedForm(pol, 1.5, 1.0, th);
        assertTrue(single > 0, "the shift is along kx");
        if (pol == Polarization.S) {
            assertEquals(569.9e-9, single, 0.1e-9);
        }
        double kappa = Evanescent.decayConstant(1.5, 1.0, th, WAVELENGTH);
        PlanarStack gap = new PlanarStack(1.5, List.of(new PlanarStack.Layer(Complex.real(1.0), 20 / kappa)),
                Complex.real(1.5));
        assertEquals(single, gap.goosHanchenShift(pol, WAVELENGTH, th), DERIVATIVE * single);
        // no reflected beam, no shift: matched media
        assertTrue(Double.isNaN(PlanarStack.interfaceBetween(1.5, Complex.real(1.5)).goosHanchenShift(pol, WAVELENGTH, th)));
        // and it is odd in the angle
        assertEquals(-single, PlanarStack.interfaceBetween(1.5, Complex.real(1.0)).goosHanchenShift(pol, WAVELENGTH, -th),
                DERIVATIVE * single);
    }
}
