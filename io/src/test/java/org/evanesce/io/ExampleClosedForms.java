package org.evanesce.io;

/**
 * Closed forms the examples are checked against ({@link ExamplePhysicsTest}), written here from the
 * published formulas, independently of the program's own references (solver.reference).
 */
final class ExampleClosedForms {

    /** Vacuum speed of light, m/s (exact by the SI definition). */
    static final double C0 = 299_792_458.0;

    private ExampleClosedForms() {
    }

    /**
     * Transmittance of a film of index n2 and thickness d between two media of index n1 at normal
     * incidence (Airy formula): T = 1 / (1 + F sin²(δ/2)), F = 4R / (1 − R)², R = ((n1 − n2)/(n1 + n2))²,
     * δ = 4π n2 d / λ. M. Born &amp; E. Wolf, Principles of Optics, 7th ed. (1999), sec. 7.6.1; E. Hecht,
     * Optics, 4th ed. (2002), sec. 9.6 (equation numbers not given: from memory which they are).
     */
    static double airy(double n1, double n2, double d, double wavelength) {
        double r = (n1 - n2) / (n1 + n2);
        double reflectance = r * r;
        double f = 4 * reflectance / ((1 - reflectance) * (1 - reflectance));
        double s = Math.sin(2 * Math.PI * n2 * d / wavelength);
        return 1 / (1 + f * s * s);
    }

    /**
     * The 1/e depth of the field amplitude beyond a totally reflecting face, λ / (2π sqrt(n1² sin²θ − n2²)):
     * E. Hecht, Optics, 4th ed. (2002), sec. 4.7; J. D. Jackson, Classical Electrodynamics, 3rd ed., sec. 7.4.
     */
    static double decayLength(double n1, double n2, double theta, double wavelength) {
        double s = n1 * Math.sin(theta);
        return wavelength / (2 * Math.PI * Math.sqrt(s * s - n2 * n2));
    }

    /**
     * The field (Ez, s polarization) at (x, y) of a line source at (xs, ys) in a medium of index n, with a
     * gap of index ng between the planes y = a and y = b (ys &lt; a &lt; b &lt; y), by its plane-wave
     * (angular-spectrum) expansion: the line source's cylindrical wave is ∫ exp(i kx X + i kz |Y|) / kz dkx
     * (W. C. Chew, Waves and Fields in Inhomogeneous Media (1990), ch. 2, the Sommerfeld/Weyl identity of
     * the 2D Green's function; a common factor dropped), and each plane wave crosses the gap with the
     * transmission coefficient t(kx) of the gap's characteristic matrix (Born &amp; Wolf sec. 1.6), so
     * <pre>
     *     E = ∫ exp(i kx (x − xs)) t(kx) exp(i kz ((a − ys) + (y − b))) / kz dkx,   kz = sqrt(k² − kx²), Im kz ≥ 0.
     * </pre>
     * With a = b it is the homogeneous medium's field. The integral is taken over kx ≥ 0 (the integrand is
     * even in kx apart from exp(i kx X), which gives 2 cos(kx X)), with kx = k sin φ for the propagating
     * part (dkx / kz = dφ) and kx = k cosh u for the evanescent part (dkx / kz = −i du), by Simpson's rule.
     * Returns {re, im}.
     */
    static double[] lineSourceThroughGap(double n, double ng, double a, double b, double wavelength,
                                         double xs, double ys, double x, double y) {
        double k0 = 2 * Math.PI / wavelength;
        double k = n * k0;
        double bigX = x - xs;
        double depth = (a - ys) + (y - b);
        int steps = 4000;
        double[] sum = {0, 0};
        // propagating: φ in [0, π/2]
        double hPhi = (Math.PI / 2) / steps;
        for (int i = 0; i <= steps; i++) {
            double phi = i * hPhi;
            double kx = k * Math.sin(phi);
            double w = simpson(i, steps) * hPhi / 3;
            double[] kz = {k * Math.cos(phi), 0};
            double[] term = mul(gapT(kx, kz, k0 * ng, b - a), expI(new double[] {kz[0] * depth, kz[1] * depth}));
            double c = 2 * Math.cos(kx * bigX) * w;
            sum[0] += c * term[0];
            sum[1] += c * term[1];
        }
        // evanescent: u in [0, umax], where the factor exp(−k sinh u · depth) is below e^-40
        double uMax = asinh(40 / (k * depth));
        double hU = uMax / steps;
        for (int i = 0; i <= steps; i++) {
            double u = i * hU;
            double kx = k * Math.cosh(u);
            double w = simpson(i, steps) * hU / 3;
            double[] kz = {0, k * Math.sinh(u)};
            double[] term = mul(gapT(kx, kz, k0 * ng, b - a), new double[] {Math.exp(-kz[1] * depth), 0});
            double c = 2 * Math.cos(kx * bigX) * w;
            // times −i
            sum[0] += c * term[1];
            sum[1] -= c * term[0];
        }
        return sum;
    }

    /**
     * s-polarized amplitude transmission of a gap of thickness g and wavenumber kg = ng k0 between two equal
     * media with normal wavenumber kz, from the gap's characteristic matrix (Born &amp; Wolf sec. 1.6):
     * M = [[cos βg, −i sin βg / β], [−i β sin βg, cos βg]], β = sqrt(kg² − kx²), t = 2 kz / ((m11 + m12 kz) kz + m21 + m22 kz).
     */
    private static double[] gapT(double kx, double[] kz, double kg, double g) {
        if (g == 0) {
            return new double[] {1, 0};
        }
        double[] beta = sqrtUpper(kg * kg - kx * kx);
        if (Math.hypot(beta[0], beta[1]) * g < 1e-9) {
            beta = new double[] {1e-9 / g, 0};
        }
        double[] bg = {beta[0] * g, beta[1] * g};
        double[] cos = {Math.cos(bg[0]) * Math.cosh(bg[1]), -Math.sin(bg[0]) * Math.sinh(bg[1])};
        double[] sin = {Math.sin(bg[0]) * Math.cosh(bg[1]), Math.cos(bg[0]) * Math.sinh(bg[1])};
        double[] minusI = {0, -1};
        double[] m12 = mul(minusI, div(sin, beta));
        double[] m21 = mul(minusI, mul(beta, sin));
        double[] left = mul(add(cos, mul(m12, kz)), kz);
        double[] den = add(left, add(m21, mul(cos, kz)));
        return div(new double[] {2 * kz[0], 2 * kz[1]}, den);
    }

    private static double simpson(int i, int steps) {
        return i == 0 || i == steps ? 1 : (i % 2 == 1 ? 4 : 2);
    }

    private static double asinh(double v) {
        return Math.log(v + Math.sqrt(v * v + 1));
    }

    /** The square root of a real number with non-negative imaginary part. */
    private static double[] sqrtUpper(double v) {
        return v >= 0 ? new double[] {Math.sqrt(v), 0} : new double[] {0, Math.sqrt(-v)};
    }

    private static double[] expI(double[] z) {
        double m = Math.exp(-z[1]);
        return new double[] {m * Math.cos(z[0]), m * Math.sin(z[0])};
    }

    private static double[] add(double[] p, double[] q) {
        return new double[] {p[0] + q[0], p[1] + q[1]};
    }

    private static double[] mul(double[] p, double[] q) {
        return new double[] {p[0] * q[0] - p[1] * q[1], p[0] * q[1] + p[1] * q[0]};
    }

    private static double[] div(double[] p, double[] q) {
        double d = q[0] * q[0] + q[1] * q[1];
        return new double[] {(p[0] * q[0] + p[1] * q[1]) / d, (p[1] * q[0] - p[0] * q[1]) / d};
    }
}
