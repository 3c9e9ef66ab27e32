package org.evanesce.solver.reference;

/**
 * The evanescent field beyond a totally reflecting interface between a denser medium of index n1 and a
 * rarer one of index n2 (both real): E. Hecht, <i>Optics</i>, 4th ed. (2002), sec. 4.7; J. D. Jackson,
 * <i>Classical Electrodynamics</i>, 3rd ed., sec. 7.4. Beyond the critical angle the transmitted field
 * varies as exp(i kx x − κ z) with
 * <pre>
 *     κ = k0 sqrt(n1² sin²θ − n2²),   k0 = 2π/λ0,
 * </pre>
 * which is Im kz in the rarer medium on the branch {@link PlanarStack} uses. The amplitude falls to 1/e in
 * 1/κ = λ0 / (2π sqrt(n1² sin²θ − n2²)); the intensity in half of that. Angles in radians, lengths in m.
 */
public final class Evanescent {

    private Evanescent() {
    }

    /** arcsin(n2/n1), radians; needs 0 &lt; n2 &lt; n1. */
    public static double criticalAngle(double n1, double n2) {
        if (!(n2 > 0 && n2 < n1) || Double.isInfinite(n1)) {
            throw new IllegalArgumentException(String.format(
                    "no critical angle from index %g into index %g: it needs 0 < n2 < n1", n1, n2));
        }
        return Math.asin(n2 / n1);
    }

    /** True when n1 sin θ &gt; n2: the wave in the medium of index n2 is evanescent. */
    public static boolean isBeyondCritical(double n1, double n2, double angle) {
        return n1 * Math.abs(Math.sin(angle)) > n2;
    }

    /** κ = k0 sqrt(n1² sin²θ − n2²), 1/m, beyond the critical angle only. */
    public static double decayConstant(double n1, double n2, double angle, double wavelength) {
        if (!(wavelength > 0) || Double.isInfinite(wavelength)) {
            throw new IllegalArgumentException(String.format("wavelength %g m must be finite and > 0", wavelength));
        }
        double s = n1 * Math.abs(Math.sin(angle));
        double u = (s - n2) * (s + n2); // not s² − n2²: no cancellation of squares near the critical angle
        if (!(u > 0)) {
            throw new IllegalArgumentException(String.format(
                    "angle %g deg is not beyond the critical angle from index %g into index %g",
                    Math.toDegrees(angle), n1, n2));
        }
        return 2 * Math.PI / wavelength * Math.sqrt(u);
    }

    /** 1/κ = λ0 / (2π sqrt(n1² sin²θ − n2²)): the depth at which the field amplitude is 1/e of its value at the interface, m. */
    public static double amplitudeDepth(double n1, double n2, double angle, double wavelength) {
        return 1 / decayConstant(n1, n2, angle, wavelength);
    }

    /** 1/(2κ): the depth at which the intensity is 1/e of its value at the interface, m. */
    public static double intensityDepth(double n1, double n2, double angle, double wavelength) {
        return 0.5 / decayConstant(n1, n2, angle, wavelength);
    }
}
