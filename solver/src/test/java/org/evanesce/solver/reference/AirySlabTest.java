package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.TestInfo;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/** One layer between two media: the transfer matrix against the Airy (multiple-beam) formulae. */
class AirySlabTest {

    /**
     * The transfer matrix against the Airy formulae: measured at most 7.1e-14 (metal-like and evanescent
     * slabs), about 14 times below this.
     */
    private static final double CLOSED_FORM = 1e-12;
    private static final double WAVELENGTH = 633e-9;

    /**
     * Summing the multiply reflected waves in a slab of index n2 and thickness d between n1 and n3
     * (Born &amp; Wolf sec. 1.6.4 and sec. 7.6.1; Hecht sec. 9.6):
     * r = (r12 + r23 e^{2iβ})/(1 + r12 r23 e^{2iβ}), t = t12 t23 e^{iβ}/(1 + r12 r23 e^{2iβ}),
     * β = k0 n2 cos θ2 d, with the single-interface Fresnel coefficients (Hecht sec. 4.6). With exp(−iωt)
     * the phase of a wave crossing the slab is +β. Holds for complex n2 and complex θ2 as well.
     */
    private static Complex[] airy(Polarization pol, double n1, Complex n2, double n3, double d, double theta) {
        double s = n1 * Math.sin(theta);
        Complex c1 = Complex.real(n1);
        Complex c3 = Complex.real(n3);
        Complex r12 = ClosedForms.fresnelR(pol, c1, n2, s);
        Complex r23 = ClosedForms.fresnelR(pol, n2, c3, s);
        Complex t12 = ClosedForms.fresnelT(pol, c1, n2, s);
        Complex t23 = ClosedForms.fresnelT(pol, n2, c3, s);
        Complex beta = ClosedForms.nCos(n2, s).times(2 * Math.PI / WAVELENGTH * d);
        Complex e1 = beta.timesI().exp();
        Complex e2 = e1.square();
        Complex den = Complex.ONE.plus(r12.times(r23).times(e2));
        return new Complex[] {r12.plus(r23.times(e2)).divide(den), t12.times(t23).times(e1).divide(den)};
    }

    /** The largest |expected − actual| seen by {@link #assertClose}, reported after each test. */
    private double worst;

    private void assertClose(Complex expected, Complex actual, double tol, String what) {
        worst = Math.max(worst, expected.minus(actual).abs());
        assertTrue(expected.minus(actual).abs() <= tol, () -> what + ": expected " + expected + ", got " + actual);
    }

    @AfterEach
    void report(TestInfo info) {
        System.out.printf("Airy %s: largest |r or t − closed form| = %.3g%n", info.getDisplayName(), worst);
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void slabAmplitudesMatchTheMultipleBeamSum(Polarization pol) {
        // transparent, lossy and evanescent slabs (a 1.0 gap in glass beyond 41.8 deg), several thicknesses
        double[][] outer = {{1.5, 1.5}, {1.0, 1.52}, {1.5, 1.33}};
        Complex[] slabs = {Complex.real(2.2), Complex.real(1.0), Complex.of(1.7, 0.05), Complex.of(0.2, 3.4)};
        for (double[] o : outer) {
            for (Complex n2 : slabs) {
                for (double d : new double[] {0, 10e-9, 137e-9, 633e-9, 2.1e-6}) {
                    PlanarStack st = new PlanarStack(o[0], List.of(new PlanarStack.Layer(n2, d)), Complex.real(o[1]));
                    for (double deg = 0; deg < 89; deg += 7.3) {
                        double th = Math.toRadians(deg);
                        String what = String.format("%s %s | %s, %g m | %s at %g deg", pol, o[0], n2, d, o[1], deg);
                        Complex[] rt = airy(pol, o[0], n2, o[1], d, th);
                        PlanarStack.Response resp = st.atAngle(pol, WAVELENGTH, th);
                        assertClose(rt[0], resp.r(), CLOSED_FORM, what + " r");
                        assertClose(rt[1], resp.t(), CLOSED_FORM, what + " t");
                    }
                }
            }
        }
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void symmetricTransparentSlabFollowsTheAiryFunction(Polarization pol) {
        // Born & Wolf sec. 7.6.1, the Airy formula for a transparent slab in a single medium:
        // T = 1 / (1 + F sin²β), F = 4R/(1 − R)², R the single-surface reflectance (form from memory; it is the
        // |t|² of the multiple-beam sum above with r21 = −r12 and t12 t21 = 1 − R).
        double n1 = 1.0;
        double n2 = 1.5;
        for (double d : new double[] {50e-9, 211e-9, 1e-6, 10e-6}) {
            PlanarStack st = new PlanarStack(n1, List.of(new PlanarStack.Layer(Complex.real(n2), d)), Complex.real(n1));
            for (double deg = 0; deg < 89; deg += 4.1) {
                double th = Math.toRadians(deg);
                double s = n1 * Math.sin(th);
                double r1 = ClosedForms.fresnelR(pol, Complex.real(n1), Complex.real(n2), s).norm();
                double f = 4 * r1 / ((1 - r1) * (1 - r1));
                double beta = 2 * Math.PI / WAVELENGTH * d * Math.sqrt(n2 * n2 - s * s);
                double sin = Math.sin(beta);
                double expected = 1 / (1 + f * sin * sin);
                PlanarStack.Response resp = st.atAngle(pol, WAVELENGTH, th);
                String what = String.format("%s slab %g m at %g deg", pol, d, deg);
                worst = Math.max(worst, Math.abs(expected - resp.transmittance()));
                assertEquals(expected, resp.transmittance(), CLOSED_FORM, what + " T");
                assertEquals(1 - expected, resp.reflectance(), CLOSED_FORM, what + " R");
            }
        }
    }
}
