package org.evanesce.solver.reference;

import java.util.function.DoubleUnaryOperator;
import org.evanesce.geometry.Complex;

/**
 * The power a line dipole (uniform along z) radiates at height z above a flat face between its own medium
 * (permittivity ε1, above) and a lossless half-space (ε2, below), relative to the same dipole in the unbounded
 * medium ε1: F(z) = P(z)/P∞, counting what goes up and what goes into the half-space. The two-dimensional
 * counterpart (our derivation) of the three-dimensional result of W. Lukosz &amp; R. E. Kunz, "Light emission by
 * magnetic and electric dipoles close to a plane interface. I. Total radiated power", J. Opt. Soc. Am. 67, 1607
 * (1977) (from memory), derived the same way with the two-dimensional Green's function written as its plane-wave
 * spectrum (the Weyl-type expansion of
 * (i/4) H0⁽¹⁾(k r), e.g. W. C. Chew, <i>Waves and Fields in Inhomogeneous Media</i>, 1990, ch. 2; from memory):
 * the radiated power is Im of the reflected field at the dipole over Im of the free one, which gives, with
 * k = k0√ε1, kz = √(k² − kx²) (Im kz ≥ 0) in the upper medium and the Fresnel reflection coefficients of the
 * face for the z-directed E (s) and the z-directed H (p),
 * <pre>
 *     dipole along z (s polarization, Ez):   F = 1 + (1/π)      Re ∫ r_s e^{2i kz z} / kz dkx
 *     along y (normal to the face, p):        F = 1 + (2/πk²)    Re ∫ r_p kx² e^{2i kz z} / kz dkx
 *     along x (tangential, in the plane, p):  F = 1 − (2/πk²)    Re ∫ r_p kz e^{2i kz z} dkx
 * </pre>
 * over all real kx, with r_s = (kz1 − kz2)/(kz1 + kz2) and r_p = (ε2 kz1 − ε1 kz2)/(ε2 kz1 + ε1 kz2). The free
 * parts (the 1) are (1/4) for Ez and k²/8 for each in-plane component, the Im of the free Green's function and
 * of its dyadic at the source. Checked against image theory over a near-perfect conductor (LineDipoleEmissionTest)
 * and against the program's own point sources (EvanescentParticleTest: within 0.12 % at 60 cells per wavelength).
 */
public final class LineDipoleEmission {

    /** Orientation of the line dipole. */
    public enum Axis {
        /** Along z, the axis of the line: the dipole of the Ez (s) polarization. */
        Z,
        /** Along x, in the plane and parallel to the face (Hz, p polarization). */
        X,
        /** Along y, normal to the face (Hz, p polarization). */
        Y
    }

    /** Simpson intervals per piece of the kx range: far more than the smooth integrands need. */
    private static final int INTERVALS = 4000;
    /** The evanescent range stops where e^{2i kz z} has fallen to e^{−40}. */
    private static final double DECAY_CUT = 40;

    private LineDipoleEmission() {
    }

    /**
     * F(z) for a dipole along {@code axis} at height {@code z} (m) above the face, vacuum wavenumber k0 (1/m),
     * permittivities eps1 (the dipole's medium) and eps2 (the half-space), both real and positive.
     */
    public static double relativePower(Axis axis, double z, double k0, double eps1, double eps2) {
        if (!(z > 0) || !(k0 > 0) || !(eps1 > 0) || !(eps2 > 0) || Double.isInfinite(z) || Double.isInfinite(k0)
                || Double.isInfinite(eps1) || Double.isInfinite(eps2)) {
            throw new IllegalArgumentException(String.format("line dipole at height %g m, k0 %g 1/m, permittivities %g"
                    + " and %g: all must be finite and > 0", z, k0, eps1, eps2));
        }
        double k = k0 * Math.sqrt(eps1);
        // propagating part: kx = k sin t, dkx = k cos t dt = kz dt
        double propagating = simpson(0, Math.PI / 2, t -> timesKz(axis, k * Math.sin(t), z, k0, eps1, eps2).re());
        // evanescent part: kx = k cosh u, dkx = k sinh u du = −i kz du; split where kz2 turns imaginary (a kink)
        double uEnd = asinh(DECAY_CUT / (2 * k * z));
        double uKink = Math.log(Math.sqrt(eps2 / eps1) + Math.sqrt(eps2 / eps1 - 1));
        DoubleUnaryOperator ev = u -> timesKz(axis, k * Math.cosh(u), z, k0, eps1, eps2).im();
        double evanescent = eps2 > eps1 && uKink < uEnd ? simpson(0, uKink, ev) + simpson(uKink, uEnd, ev)
                : simpson(0, uEnd, ev);
        double integral = 2 * (propagating + evanescent);
        return switch (axis) {
            case Z -> 1 + integral / Math.PI;
            case Y -> 1 + 2 * integral / (Math.PI * k * k);
            case X -> 1 - 2 * integral / (Math.PI * k * k);
        };
    }

    /** The integrand times kz1, which stays finite where kz1 = 0 (Re(−i w) = Im w gives the evanescent part). */
    private static Complex timesKz(Axis axis, double kx, double z, double k0, double eps1, double eps2) {
        Complex kz1 = Complex.real(eps1 * k0 * k0 - kx * kx).sqrtUpper();
        Complex kz2 = Complex.real(eps2 * k0 * k0 - kx * kx).sqrtUpper();
        Complex phase = kz1.times(2 * z).timesI().exp();
        return switch (axis) {
            case Z -> kz1.minus(kz2).divide(kz1.plus(kz2)).times(phase);
            case Y -> rp(kz1, kz2, eps1, eps2).times(phase).times(kx * kx);
            case X -> rp(kz1, kz2, eps1, eps2).times(phase).times(kz1.square());
        };
    }

    private static Complex rp(Complex kz1, Complex kz2, double eps1, double eps2) {
        return kz1.times(eps2).minus(kz2.times(eps1)).divide(kz1.times(eps2).plus(kz2.times(eps1)));
    }

    private static double simpson(double a, double b, DoubleUnaryOperator f) {
        double h = (b - a) / INTERVALS;
        double sum = f.applyAsDouble(a) + f.applyAsDouble(b);
        for (int i = 1; i < INTERVALS; i++) {
            sum += f.applyAsDouble(a + i * h) * (i % 2 == 0 ? 2 : 4);
        }
        return sum * h / 3;
    }

    private static double asinh(double x) {
        return Math.log(x + Math.sqrt(x * x + 1));
    }
}
