package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/**
 * {@link LineDipoleEmission} in its two limits with closed forms: no face at all (F = 1), and a face of very high
 * permittivity, where the reflection is that of a perfect conductor and the image method gives the power as the
 * free dipole's plus its image's field at the source (image theory: C. A. Balanis, <i>Advanced Engineering
 * Electromagnetics</i>, 1989, §7.4; the 2D free-space Green's function (i/4) H0⁽¹⁾(kr) and its dyadic, from memory):
 * with u = 2kz, F = 1 − J0(u) along z (image −p), 1 − 2[J0(u) − J1(u)/u] along x (image −p, the image's field
 * transverse), 1 + 2 J1(u)/u along y (image +p, field along the separation).
 */
class LineDipoleEmissionTest {

    static final double K0 = 2 * Math.PI / 600e-9;
    /**
     * ε2 = 1e12 leaves r within about 2|kz1|/|kz2| of ∓1, which matters only for the far evanescent plane waves that
     * a dipole very close to the face feeds (with ε2 = 1e8, F along z at k z = 0.05 is 0.00379 against 1 − J0 =
     * 0.00250). Measured largest difference 3.1e-4, along y at k z = 0.05 and 0.3: the quadrature's, at the grazing
     * end kx = k where r_p swings from +1 to −1 within kz1 ≈ kz2/ε2, a conductor's feature (ten times the
     * intervals give 1.2e-5 and 3.3e-5; for glass, ε2 = 2.25, they change F by 1e-6). Along z and x: 1.3e-5 and
     * 2.6e-5 (scipy's quad on the same integrals agrees to 1e-12).
     */
    static final double CONDUCTOR_TOLERANCE = 3e-3;
    /** With ε2 = ε1 nothing reflects: the integrals vanish to rounding. */
    static final double NO_FACE_TOLERANCE = 1e-12;

    @Test
    void aVeryDenseFaceActsAsAnImage() {
        double worst = 0;
        for (double kz : new double[] {0.05, 0.3, 1.0, 2.5, 6.0}) {
            double z = kz / K0;
            double u = 2 * kz;
            double[] j = Bessel.besselJ(1, u);
            double[] expected = {1 - j[0], 1 - 2 * (j[0] - j[1] / u), 1 + 2 * j[1] / u};
            for (LineDipoleEmission.Axis a : LineDipoleEmission.Axis.values()) {
                double f = LineDipoleEmission.relativePower(a, z, K0, 1, 1e12);
                worst = Math.max(worst, Math.abs(f - expected[a.ordinal()]));
                assertEquals(expected[a.ordinal()], f, CONDUCTOR_TOLERANCE, "along " + a + " at k z = " + kz);
            }
        }
        System.out.println("line dipole over a near-conductor, largest difference from the image: " + worst);
    }

    @Test
    void withoutAFaceNothingChanges() {
        for (LineDipoleEmission.Axis a : LineDipoleEmission.Axis.values()) {
            assertEquals(1, LineDipoleEmission.relativePower(a, 30e-9, K0, 2.25, 2.25), NO_FACE_TOLERANCE, a.toString());
        }
    }

    @Test
    void refusesNonsense() {
        assertThrows(IllegalArgumentException.class,
                () -> LineDipoleEmission.relativePower(LineDipoleEmission.Axis.Z, 0, K0, 1, 2.25));
        assertThrows(IllegalArgumentException.class,
                () -> LineDipoleEmission.relativePower(LineDipoleEmission.Axis.Y, 1e-8, K0, 1, -2));
    }
}
