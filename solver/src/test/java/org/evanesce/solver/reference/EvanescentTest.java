package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.junit.jupiter.api.Test;

/** Critical angle and evanescent decay (Hecht, Optics, 4th ed., sec. 4.7). */
class EvanescentTest {

    private static final double WAVELENGTH = 633e-9;
    /** The two routes compute the same square root of a difference; a few ulps apart (measured ~1e-16). */
    private static final double ROUNDING = 1e-14;

    @Test
    void criticalAngleOfGlassAndAir() {
        // Hecht sec. 4.7: θc = arcsin(n_t/n_i); for n = 1.5 into air, θc = arcsin(2/3) = 41.81 deg (Hecht quotes
        // "about 42°" for glass–air)
        assertEquals(41.8103149, Math.toDegrees(Evanescent.criticalAngle(1.5, 1.0)), 1e-7);
        assertTrue(Evanescent.isBeyondCritical(1.5, 1.0, Math.toRadians(41.82)));
        assertFalse(Evanescent.isBeyondCritical(1.5, 1.0, Math.toRadians(41.80)));
        assertThrows(IllegalArgumentException.class, () -> Evanescent.criticalAngle(1.0, 1.5));
        assertThrows(IllegalArgumentException.class, () -> Evanescent.decayConstant(1.5, 1.0, Math.toRadians(30), WAVELENGTH));
    }

    @Test
    void depthIsTheInverseOfTheImaginaryNormalWavenumber() {
        // Hecht sec. 4.7: the transmitted field varies as exp(−κz), κ = k0 sqrt(n1² sin²θ − n2²); on our branch
        // that κ is Im kz of the rarer medium, which the transfer matrix uses
        for (double deg = 42; deg < 90; deg += 3) {
            double th = Math.toRadians(deg);
            PlanarStack st = PlanarStack.interfaceBetween(1.5, Complex.real(1.0));
            Complex kz = st.normalWavenumber(1, WAVELENGTH, st.transverseWavenumber(WAVELENGTH, th));
            double kappa = Evanescent.decayConstant(1.5, 1.0, th, WAVELENGTH);
            assertEquals(0.0, kz.re(), 0.0, "purely evanescent at " + deg);
            assertEquals(kappa, kz.im(), ROUNDING * kappa, "at " + deg);
            assertEquals(1 / kappa, Evanescent.amplitudeDepth(1.5, 1.0, th, WAVELENGTH), ROUNDING / kappa);
            assertEquals(0.5 / kappa, Evanescent.intensityDepth(1.5, 1.0, th, WAVELENGTH), ROUNDING / kappa);
        }
        // λ0/(2π sqrt(1.5² sin²45° − 1)) = 633 nm / (2π · 0.353553) = 284.95 nm (computed by hand from Hecht's form)
        assertEquals(284.95e-9, Evanescent.amplitudeDepth(1.5, 1.0, Math.toRadians(45), WAVELENGTH), 0.01e-9);
    }
}
