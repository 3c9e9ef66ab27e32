package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInfo;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/** A single interface: the transfer matrix with no layers against the Fresnel formulae. */
class FresnelTest {

    /** The formulas agree to rounding: measured at most 1.4e-14, 10 times below this. */
    private static final double CLOSED_FORM = 1.5e-13;
    /** |r| = 1 beyond the critical angle holds to rounding: (a − ib)/(a + ib) with a, b real. */
    private static final double ROUNDING = 1e-14;
    private static final double WAVELENGTH = 633e-9;
    private static final double[] ANGLES_DEG = {0, 5, 15, 25, 30, 35, 40, 41, 41.8};

    /** The largest |expected − actual| seen by {@link #assertClose}, reported after each test. */
    private double worst;

    private void assertClose(Complex expected, Complex actual, double tol, String what) {
        worst = Math.max(worst, expected.minus(actual).abs());
        assertTrue(expected.minus(actual).abs() <= tol, () -> what + ": expected " + expected + ", got " + actual
                + ", |diff| = " + expected.minus(actual).abs());
    }

    @AfterEach
    void report(TestInfo info) {
        System.out.printf("Fresnel %s: largest |r or t − closed form| = %.3g%n", info.getDisplayName(), worst);
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void belowTheCriticalAngleMatchesHecht(Polarization pol) {
        // glass to air (internal) and air to glass (external), angles below 41.81 deg: Hecht sec. 4.6
        for (double[] media : new double[][] {{1.5, 1.0}, {1.0, 1.5}, {1.0, 3.5}, {1.333, 1.5}}) {
            PlanarStack st = PlanarStack.interfaceBetween(media[0], Complex.real(media[1]));
            for (double deg : ANGLES_DEG) {
                double th = Math.toRadians(deg);
                double s = media[0] * Math.sin(th);
                PlanarStack.Response resp = st.atAngle(pol, WAVELENGTH, th);
                String what = pol + " " + media[0] + " -> " + media[1] + " at " + deg + " deg";
                Complex ni = Complex.real(media[0]);
                Complex nt = Complex.real(media[1]);
                assertClose(ClosedForms.fresnelR(pol, ni, nt, s), resp.r(), CLOSED_FORM, what + " r");
                assertClose(ClosedForms.fresnelT(pol, ni, nt, s), resp.t(), CLOSED_FORM, what + " t");
                assertEquals(ClosedForms.fresnelR(pol, ni, nt, s).norm(), resp.reflectance(), CLOSED_FORM, what + " R");
                assertEquals(ClosedForms.fresnelPowerT(pol, media[0], media[1], s), resp.transmittance(), CLOSED_FORM,
                        what + " T");
            }
        }
    }

    @Test
    void normalIncidenceAndBrewsterAngle() {
        // Hecht sec. 4.6: R = ((n2 − n1)/(n2 + n1))² at normal incidence = 0.04 for 1 → 1.5;
        // r∥ = 0 at Brewster's angle tan θB = n2/n1 (Hecht sec. 8.6)
        PlanarStack st = PlanarStack.interfaceBetween(1.0, Complex.real(1.5));
        assertEquals(0.04, st.atAngle(Polarization.S, WAVELENGTH, 0).reflectance(), CLOSED_FORM);
        assertEquals(0.04, st.atAngle(Polarization.P, WAVELENGTH, 0).reflectance(), CLOSED_FORM);
        assertEquals(0.0, st.atAngle(Polarization.P, WAVELENGTH, Math.atan(1.5)).r().abs(), CLOSED_FORM);
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void beyondTheCriticalAngleReflectionIsTotalWithTheKnownPhase(Polarization pol) {
        // Hecht sec. 4.7 (and Born & Wolf sec. 1.5.4): |r| = 1 and, in our exp(−iωt) convention, r = exp(−iφ) with
        // tan(φs/2) = sqrt(n1² sin²θ − n2²)/(n1 cos θ) and tan(φp/2) = (n1²/n2²)·sqrt(n1² sin²θ − n2²)/(n1 cos θ)
        // (the phase forms from memory; the sign of φ depends on the time convention). Nothing is transmitted.
        for (double[] media : new double[][] {{1.5, 1.0}, {1.515, 1.333}, {3.5, 1.45}}) {
            double n1 = media[0];
            double n2 = media[1];
            PlanarStack st = PlanarStack.interfaceBetween(n1, Complex.real(n2));
            double critical = Math.toDegrees(Math.asin(n2 / n1));
            for (double deg = Math.ceil(critical * 10) / 10 + 0.1; deg < 90; deg += 3.7) {
                double th = Math.toRadians(deg);
                PlanarStack.Response resp = st.atAngle(pol, WAVELENGTH, th);
                String what = pol + " " + n1 + " -> " + n2 + " at " + deg + " deg";
                assertEquals(1.0, resp.r().abs(), ROUNDING, what);
                assertEquals(1.0, resp.reflectance(), ROUNDING, what);
                assertEquals(0.0, resp.transmittance(), 0.0, what);
                double g = Math.sqrt(n1 * n1 * Math.sin(th) * Math.sin(th) - n2 * n2) / (n1 * Math.cos(th));
                double phi = 2 * Math.atan(pol == Polarization.S ? g : n1 * n1 / (n2 * n2) * g);
                assertClose(Complex.polar(1, -phi), resp.r(), CLOSED_FORM, what + " r");
                // and against Hecht's r with complex cos θt
                assertClose(ClosedForms.fresnelR(pol, Complex.real(n1), Complex.real(n2), n1 * Math.sin(th)), resp.r(),
                        CLOSED_FORM, what + " r (complex angle)");
            }
        }
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void absorbingExitMediumMatchesFresnelWithAComplexIndex(Polarization pol) {
        // Born & Wolf sec. 14.2: the Fresnel formulae hold for an absorbing medium with n → n + iκ and complex
        // cos θt; a metal-like index (from memory, for illustration only) from glass, below and beyond 41.8 deg
        Complex metal = Complex.of(0.2, 3.4);
        PlanarStack st = PlanarStack.interfaceBetween(1.5, metal);
        for (double deg = 0; deg < 90; deg += 6.5) {
            double th = Math.toRadians(deg);
            double s = 1.5 * Math.sin(th);
            PlanarStack.Response resp = st.atAngle(pol, WAVELENGTH, th);
            String what = pol + " glass -> " + metal + " at " + deg + " deg";
            Complex ni = Complex.real(1.5);
            assertClose(ClosedForms.fresnelR(pol, ni, metal, s), resp.r(), CLOSED_FORM, what + " r");
            assertClose(ClosedForms.fresnelT(pol, ni, metal, s), resp.t(), CLOSED_FORM, what + " t");
            // all that is not reflected is absorbed in the metal
            assertEquals(1 - resp.reflectance(), resp.transmittance(), CLOSED_FORM, what + " T = 1 − R");
        }
    }
}
