package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.junit.jupiter.api.Test;

/**
 * Bessel functions J_n, Y_n of integer order against handbook values and against identities that do not depend on
 * remembered numbers. Equation numbers of M. Abramowitz &amp; I. A. Stegun, <i>Handbook of Mathematical
 * Functions</i>, 1964 (A&amp;S), are recalled from memory; each identity is stated in full beside its check.
 */
class BesselTest {

    /** Handbook and reference-library values, relative to the value: measured at most 1.4e-15 (complex: 2e-15). */
    private static final double TABLE = 2e-14;
    /**
     * Identities (Wronskian, sums of squares, cosine series, integral representations), as an error relative to
     * the size of the terms that enter them: measured at most 5.9e-15 (Wronskian), 1.4e-15 (sums), 6.0e-15 (real
     * integrals), 1.9e-15 (complex integral, relative to e^{|Im z|}), 3.2e-15 (ratios).
     */
    private static final double IDENTITY = 6e-14;
    /**
     * Neumann series against Hankel's expansion for Y_0, Y_1 on 17 ≤ x ≤ 40, relative to |H_ν|: measured 3.0e-15.
     * (Below about 17 the expansion's smallest term, about e^{−2x}, exceeds the tolerance.)
     */
    private static final double METHODS_AGREE = 3e-14;
    /**
     * A five-point central difference with h = 1e-3·min(1, x/(n + 1)) (a thousandth of the scale on which Z_n
     * changes) errs by about (h/scale)⁴/30 + 1e-16·scale/h ≈ 1e-13 of
     * |Z_n'|: measured 4.0e-12.
     */
    private static final double FINITE_DIFFERENCE = 4e-11;
    /** The power series of J_n at x ≤ 4 loses little to cancellation (terms below e^x): measured 3.2e-15. */
    private static final double POWER_SERIES = 3e-14;

    private static void assertRelative(double expected, double actual, double tol, String what) {
        assertTrue(Math.abs(actual - expected) <= tol * Math.abs(expected),
                () -> String.format("%s: expected %.17g, got %.17g (relative error %.2g, tolerance %.1g)", what, expected,
                        actual, Math.abs(actual - expected) / Math.abs(expected), tol));
    }

    /**
     * A&amp;S Table 9.1 (J_0, J_1, Y_0, Y_1 at x = 1, 2, 5, 10), the first 16 digits recalled from memory; every
     * value agrees with mpmath 1.3.0 (F. Johansson et al., arbitrary-precision library) at 30 digits, which was
     * run during development to confirm them.
     */
    @Test
    void handbookTableOfOrdersZeroAndOne() {
        double[][] rows = {
            // x, J0, J1, Y0, Y1
            {1, 0.7651976865579666, 0.4400505857449335, 0.08825696421567696, -0.7812128213002887},
            {2, 0.2238907791412357, 0.5767248077568734, 0.5103756726497451, -0.1070324315409375},
            {5, -0.1775967713143383, -0.3275791375914652, -0.3085176252490338, 0.1478631433912268},
            {10, -0.2459357644513483, 0.04347274616886144, 0.05567116728359939, 0.2490154242069539},
        };
        for (double[] row : rows) {
            double x = row[0];
            double[] j = Bessel.besselJ(1, x);
            double[] y = Bessel.besselY(1, x);
            assertRelative(row[1], j[0], TABLE, "J0(" + x + ")");
            assertRelative(row[2], j[1], TABLE, "J1(" + x + ")");
            assertRelative(row[3], y[0], TABLE, "Y0(" + x + ")");
            assertRelative(row[4], y[1], TABLE, "Y1(" + x + ")");
        }
    }

    /**
     * Higher orders: J_2(1), Y_2(1), J_10(10), Y_10(10) recalled from memory (A&amp;S Tables 9.2 and 9.4 list
     * them to fewer digits); the others computed with mpmath 1.3.0 at 30 digits during development (orders beyond
     * the argument, where J_n is tiny and Y_n huge, test the recurrences' far end).
     */
    @Test
    void higherOrders() {
        double[][] rows = {
            // n, x, J_n(x), Y_n(x)
            {2, 1, 0.11490348493190048, -1.6506826068162544},
            {10, 10, 0.20748610663335886, -0.35981415218340272},
            {30, 10, 1.551096078257467e-12, -7256142316.1003306},
            {5, 50, -0.08140024769656964, -0.078548413913081653},
            {50, 50, 0.12140902189761506, -0.21031655464397741},
            {100, 50, 1.1159273690838093e-21, -3.2938001882026666e+18},
            {20, 0.5, 3.7272019617047145e-31, -4.2714301215659064e+28},
        };
        for (double[] row : rows) {
            int n = (int) row[0];
            double x = row[1];
            assertRelative(row[2], Bessel.besselJ(n, x)[n], TABLE, "J_" + n + "(" + x + ")");
            assertRelative(row[3], Bessel.besselY(n, x)[n], TABLE, "Y_" + n + "(" + x + ")");
        }
    }

    private static final double[] ARGUMENTS = {0.05, 0.3, 1, 3.7, 9.9, 19.99, 20, 20.01, 33, 50, 120, 200};

    /** The Wronskian J_{n+1}(x) Y_n(x) − J_n(x) Y_{n+1}(x) = 2/(πx) (A&amp;S 9.1.16), every order up to x + 60. */
    @Test
    void wronskian() {
        for (double x : ARGUMENTS) {
            int top = (int) x + 60;
            double[] j = Bessel.besselJ(top + 1, x);
            double[] y = Bessel.besselY(top + 1, x);
            for (int n = 0; n <= top; n++) {
                double a = j[n + 1] * y[n];
                double b = j[n] * y[n + 1];
                if (!Double.isFinite(a) || !Double.isFinite(b)) {
                    break; // Y_n overflowed (n far above a small x)
                }
                double err = Math.abs(a - b - 2 / (Math.PI * x)) / (Math.abs(a) + Math.abs(b));
                final int order = n;
                assertTrue(err <= IDENTITY, () -> String.format("Wronskian at n = %d, x = %g: relative error %.2g", order,
                        x, err));
            }
        }
    }

    /**
     * Sums that the normalisation does not use: 1 = J_0² + 2 Σ J_n² (A&amp;S 9.1.76), cos x = J_0 + 2 Σ (−1)^k J_{2k}
     * and sin x = 2 Σ (−1)^k J_{2k+1} (generating function at t = i, A&amp;S 9.1.41). Miller's recurrence is
     * normalised by 1 = J_0 + 2 Σ J_{2k} instead, so these test the relative values of all orders.
     */
    @Test
    void sumsOfTheGeneratingFunction() {
        for (double x : ARGUMENTS) {
            int top = (int) (x + 10 * Math.cbrt(x) + 30);
            double[] j = Bessel.besselJ(top, x);
            double squares = j[0] * j[0];
            double cos = j[0];
            double sin = 0;
            double scale = Math.abs(j[0]);
            for (int n = 1; n <= top; n++) {
                squares += 2 * j[n] * j[n];
                double sign = ((n / 2) & 1) == 0 ? 1 : -1;
                if ((n & 1) == 0) {
                    cos += 2 * sign * j[n];
                } else {
                    sin += 2 * sign * j[n];
                }
                scale += 2 * Math.abs(j[n]);
            }
            assertTrue(Math.abs(squares - 1) <= IDENTITY, "sum of squares at x = " + x + ": " + squares);
            assertTrue(Math.abs(cos - Math.cos(x)) <= IDENTITY * scale, "cosine series at x = " + x + ": " + cos);
            assertTrue(Math.abs(sin - Math.sin(x)) <= IDENTITY * scale, "sine series at x = " + x + ": " + sin);
        }
    }

    /**
     * Integral representations (A&amp;S 9.1.21 and 9.1.22): J_n(x) = (1/π)∫_0^π cos(x sin θ − nθ) dθ, here as the
     * periodic mean (1/2π)∫_0^{2π} cos(x sin θ − nθ) dθ by the trapezoid rule (exponentially accurate for a smooth
     * periodic integrand), and Y_n(x) = (1/π)∫_0^π sin(x sin θ − nθ) dθ − (1/π)∫_0^∞ (e^{nt} + (−1)^n e^{−nt})
     * e^{−x sinh t} dt by composite Gauss–Legendre quadrature, the second integral cut where its integrand has
     * fallen below e^{−50} of its largest value.
     */
    @Test
    void integralRepresentations() {
        GaussLegendre rule = new GaussLegendre(20);
        for (double x : new double[] {0.5, 3, 12, 25, 45}) {
            for (int n : new int[] {0, 1, 2, 7, 20}) {
                double jn = trapezoidJ(n, x, 512);
                double yFirst = rule.integrate(t -> Math.sin(x * Math.sin(t) - n * t), 0, Math.PI, 64) / Math.PI;
                double sign = (n & 1) == 0 ? 1 : -1;
                // the exponent n t − x sinh t peaks at cosh t = n/x; the integrand falls monotonically past it
                double peak = n > x ? acosh(n / x) : 0;
                double top = peak;
                double logPeak = n * peak - x * Math.sinh(peak);
                while (n * top - x * Math.sinh(top) > logPeak - 50) {
                    top += 0.05;
                }
                double yTail = rule.integrate(t -> (Math.exp(n * t - x * Math.sinh(t))
                        + sign * Math.exp(-n * t - x * Math.sinh(t))), 0, top, 200) / Math.PI;
                double yn = yFirst - yTail;
                double[] j = Bessel.besselJ(n, x);
                double[] y = Bessel.besselY(n, x);
                double size = Math.hypot(jn, yn);
                final int order = n;
                assertTrue(Math.abs(j[n] - jn) <= IDENTITY * size, () -> String.format(
                        "J_%d(%g): %.17g against the integral %.17g", order, x, j[order], jn));
                assertTrue(Math.abs(y[n] - yn) <= IDENTITY * size, () -> String.format(
                        "Y_%d(%g): %.17g against the integral %.17g", order, x, y[order], yn));
            }
        }
    }

    private static double acosh(double v) {
        return Math.log(v + Math.sqrt(v * v - 1));
    }

    private static double trapezoidJ(int n, double x, int points) {
        double s = 0;
        for (int q = 0; q < points; q++) {
            double t = 2 * Math.PI * q / points;
            s += Math.cos(x * Math.sin(t) - n * t);
        }
        return s / points;
    }

    /**
     * The power series J_n(x) = Σ_k (−1)^k (x/2)^{2k+n} / (k! (n+k)!) (A&amp;S 9.1.10), summed directly for x ≤ 4
     * where its terms stay below e^x and do not cancel much: the tiny high orders that the cylinder series needs
     * at small size parameters.
     */
    @Test
    void powerSeriesAtSmallArguments() {
        for (double x : new double[] {1e-3, 0.1, 0.9, 2.5, 4}) {
            double[] j = Bessel.besselJ(40, x);
            for (int n = 0; n <= 40; n++) {
                double term = 1;
                for (int i = 1; i <= n; i++) {
                    term *= x / 2 / i;
                }
                double sum = 0;
                for (int k = 0; k < 60 && term != 0; k++) {
                    sum += term;
                    term *= -(x / 2) * (x / 2) / ((k + 1.0) * (n + k + 1.0));
                }
                assertRelative(sum, j[n], POWER_SERIES, "J_" + n + "(" + x + ") against its power series");
            }
        }
    }

    /** Y_0 and Y_1 by the Neumann series and by Hankel's expansion, two independent formulas, where both apply. */
    @Test
    void neumannSeriesAndHankelExpansionAgree() {
        for (double x = 17; x <= 40; x += 0.37) {
            double[] a = Bessel.neumannY01(x);
            double[] b = Bessel.asymptoticY01(x);
            double[] j = Bessel.besselJ(1, x);
            for (int nu = 0; nu <= 1; nu++) {
                double size = Math.hypot(j[nu], a[nu]);
                final double arg = x;
                final int order = nu;
                assertTrue(Math.abs(a[nu] - b[nu]) <= METHODS_AGREE * size, () -> String.format(
                        "Y_%d(%g): Neumann %.17g, Hankel %.17g", order, arg, a[order], b[order]));
            }
        }
    }

    /** Z_n' = (Z_{n−1} − Z_{n+1})/2 (A&amp;S 9.1.27) against a five-point central difference in x. */
    @Test
    void derivativesByFiniteDifferences() {
        for (double x : new double[] {0.7, 4.2, 19.5, 21, 60}) {
            for (int n = 1; n <= 12; n++) {
                double h = 1e-3 * Math.min(1, x / (n + 1));
                double[][] j = new double[5][];
                double[][] y = new double[5][];
                for (int s = -2; s <= 2; s++) {
                    j[s + 2] = Bessel.besselJ(n + 1, x + s * h);
                    y[s + 2] = Bessel.besselY(n + 1, x + s * h);
                }
                double[] j0 = Bessel.besselJ(n + 1, x);
                double[] y0 = Bessel.besselY(n + 1, x);
                double fdJ = (j[0][n] - 8 * j[1][n] + 8 * j[3][n] - j[4][n]) / (12 * h);
                double fdY = (y[0][n] - 8 * y[1][n] + 8 * y[3][n] - y[4][n]) / (12 * h);
                double size = Math.hypot(j0[n - 1] - j0[n + 1], y0[n - 1] - y0[n + 1]) / 2;
                assertTrue(Math.abs(fdJ - (j0[n - 1] - j0[n + 1]) / 2) <= FINITE_DIFFERENCE * size,
                        "J_" + n + "'(" + x + ")");
                assertTrue(Math.abs(fdY - (y0[n - 1] - y0[n + 1]) / 2) <= FINITE_DIFFERENCE * size,
                        "Y_" + n + "'(" + x + ")");
            }
        }
    }

    /**
     * Complex arguments: against the periodic integral J_n(z) = (1/2π)∫_0^{2π} e^{i(z sin θ − nθ)} dθ (A&amp;S
     * 9.1.21, trapezoid rule), against mpmath 1.3.0 values computed during development, along the real axis
     * against the real routine, and the ratios r_n = J_{n−1}/J_n against the quotients, including a metal-like
     * argument with Im z = 300.
     */
    @Test
    void complexArguments() {
        Complex[] zs = {Complex.of(0.3, 0.2), Complex.of(5, 0.5), Complex.of(75, 0.5), Complex.of(2, 34),
                        Complex.of(-3, -7), Complex.of(150, 2), Complex.of(20, 300), Complex.of(0.5, -40)};
        for (Complex z : zs) {
            Complex[] j = Bessel.besselJ(60, z);
            Complex[] r = Bessel.ratios(60, z);
            int points = 2 * (int) (z.abs() + 120);
            double scale = Math.exp(Math.abs(z.im()));
            for (int n = 0; n <= 60; n++) {
                Complex integral = Complex.ZERO;
                for (int q = 0; q < points; q++) {
                    double t = 2 * Math.PI * q / points;
                    integral = integral.plus(z.times(Math.sin(t)).minus(n * t).timesI().exp());
                }
                integral = integral.divide(points);
                final int order = n;
                final Complex value = integral;
                assertTrue(j[n].minus(integral).abs() <= IDENTITY * scale, () -> String.format(
                        "J_%d(%s) = %s against the integral %s", order, z, j[order], value));
                if (n >= 1 && j[n].abs() > 1e-250) {
                    Complex quotient = j[n - 1].divide(j[n]);
                    assertTrue(r[n].minus(quotient).abs() <= IDENTITY * quotient.abs(), () -> String.format(
                            "ratio J_%d/J_%d at %s: %s against %s", order - 1, order, z, r[order], quotient));
                }
            }
        }
        Object[][] mp = {
            {Complex.of(3, 1), 0, Complex.of(-0.46049214388225846, -0.36956500001486358)},
            {Complex.of(3, 1), 5, Complex.of(0.013112369826747122, 0.05734462303455614)},
            {Complex.of(10, -2), 1, Complex.of(0.07327564051642578, 0.89904785616975115)},
            {Complex.of(30, 0.4), 5, Complex.of(-0.15460442209877456, -0.011746508237671353)},
        };
        for (Object[] row : mp) {
            Complex z = (Complex) row[0];
            int n = (Integer) row[1];
            Complex expected = (Complex) row[2];
            Complex got = Bessel.besselJ(n, z)[n];
            assertTrue(got.minus(expected).abs() <= TABLE * expected.abs(), "J_" + n + "(" + z + ") = " + got);
        }
        for (double x : new double[] {0.4, 7, 63}) {
            double[] real = Bessel.besselJ(30, x);
            Complex[] cpx = Bessel.besselJ(30, Complex.real(x));
            for (int n = 0; n <= 30; n++) {
                assertTrue(cpx[n].minus(Complex.real(real[n])).abs() <= TABLE * Math.abs(real[n]),
                        "complex and real J_" + n + "(" + x + "): " + cpx[n] + " against " + real[n]);
            }
        }
    }

    @Test
    void refusesArgumentsOutOfReach() {
        assertThrows(IllegalArgumentException.class, () -> Bessel.besselY(3, 0));
        assertThrows(IllegalArgumentException.class, () -> Bessel.besselY(3, -1));
        assertThrows(IllegalArgumentException.class, () -> Bessel.besselJ(-1, 1.0));
        assertThrows(IllegalArgumentException.class, () -> Bessel.besselJ(3, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> Bessel.besselJ(3, Complex.of(1, 800)));
        assertThrows(IllegalArgumentException.class, () -> Bessel.ratios(3, Complex.ZERO));
    }
}
