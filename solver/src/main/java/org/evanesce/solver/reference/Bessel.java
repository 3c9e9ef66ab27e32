package org.evanesce.solver.reference;

import org.evanesce.geometry.Complex;

/**
 * Bessel functions of the first and second kind of integer order, J_n and Y_n, for the cylinder series
 * ({@link CylinderSeries}) and the 2D Green's function; all orders 0 … maxOrder in one call.
 *
 * <h2>Methods</h2>
 * <ul>
 * <li>J_n(z), real or complex z: Miller's backward recurrence J_{n−1} = (2n/z) J_n − J_{n+1} from a start order N
 * well above both maxOrder and |z| (N ≥ max(maxOrder, |z|) + 10 max(maxOrder, |z|)^{1/3} + 30, even), with the
 * values rescaled whenever they pass 1e250, normalised by a sum of the generating function
 * e^{(z/2)(t − 1/t)} = Σ t^n J_n(z) (Abramowitz &amp; Stegun, <i>Handbook of Mathematical Functions</i>, 1964,
 * 9.1.41): for real z at t = 1, 1 = J_0 + 2 Σ_k J_{2k} (9.1.46); for complex z at t = −iσ, σ = sign Im z,
 * e^{−iσz} = J_0 + 2 Σ_{n≥1} (−iσ)^n J_n, whose left side has the size of the largest terms, e^{|Im z|}, so the
 * sum does not cancel. The method: A&amp;S sec. 9.12 (backward recurrence; section number from memory) and
 * W. H. Press et al., <i>Numerical Recipes</i>, 3rd ed., 2007, sec. 6.5.</li>
 * <li>Y_0(x), Y_1(x), real x &gt; 0: for x &lt; {@value #ASYMPTOTIC_FROM} the Neumann series in the J's of the
 * same Miller run, Y_0 = (2/π)(ln(x/2) + γ) J_0 − (4/π) Σ_{k≥1} (−1)^k J_{2k}/k (A&amp;S 9.1.88), and its
 * derivative Y_1 = −Y_0' = (2/π)[(ln(x/2) + γ − 1) J_1 − J_0/x] + (2/π) Σ_{j≥2} (−1)^j (2j − 1) J_{2j−1}/(j(j − 1))
 * (obtained from 9.1.88 with J_{2k}' = (J_{2k−1} − J_{2k+1})/2, 9.1.27); for x ≥ {@value #ASYMPTOTIC_FROM}
 * Hankel's asymptotic expansions (A&amp;S 9.2.5, 9.2.9, 9.2.10), summed while their terms decrease (the smallest
 * term there is about e^{−2x} &lt; 1e-17).</li>
 * <li>Y_n(x), n ≥ 2: upward recurrence Y_{n+1} = (2n/x) Y_n − Y_{n−1} (9.1.27), stable for Y.</li>
 * </ul>
 * Accuracy (BesselTest, and against mpmath 1.3.0 at 40 digits during development, x ≤ 200, n ≤ 150): within a
 * few 1e-15 of |H_n(x)| = sqrt(J_n² + Y_n²), and J_n within about 1e-14 of itself also far into its decaying
 * tail (n ≫ x); the same for complex z relative to e^{|Im z|}. Equation numbers of A&amp;S are recalled from
 * memory.
 *
 * <p>Orders are integers ≥ 0; for negative orders use J_{−n} = (−1)^n J_n, Y_{−n} = (−1)^n Y_n (9.1.5).
 */
public final class Bessel {

    /** Y_0 and Y_1 come from Hankel's asymptotic expansion from this argument on (below: the Neumann series). */
    public static final double ASYMPTOTIC_FROM = 20;
    /** |Im z| above this would overflow J_n(z) ~ e^{|Im z|}; {@link #ratios} has no such limit. */
    public static final double MAX_IMAGINARY = 600;

    private static final double BIG = 1e250;
    private static final double EULER_GAMMA = 0.57721566490153286061;

    private Bessel() {
    }

    /** The start order of Miller's recurrence (even). */
    static int startOrder(int maxOrder, double size) {
        double m = Math.max(maxOrder, size);
        int n = (int) Math.ceil(m + 10 * Math.cbrt(m) + 30);
        return n + (n & 1);
    }

    private static void checkOrder(int maxOrder) {
        if (maxOrder < 0 || maxOrder > 100_000) {
            throw new IllegalArgumentException(String.format("Bessel: maximum order %d must be in [0, 100000]", maxOrder));
        }
    }

    /**
     * J_0(x) … J_maxOrder(x) for real x (any sign; J_n(−x) = (−1)^n J_n(x)).
     *
     * @return a new array of length maxOrder + 1
     */
    public static double[] besselJ(int maxOrder, double x) {
        checkOrder(maxOrder);
        if (!Double.isFinite(x) || Math.abs(x) > 1e7) {
            throw new IllegalArgumentException(String.format("Bessel J: argument %g must be finite, |x| <= 1e7", x));
        }
        double ax = Math.abs(x);
        double[] j = new double[maxOrder + 1];
        if (ax == 0) {
            j[0] = 1;
            return j;
        }
        double[] b = millerReal(maxOrder, ax);
        System.arraycopy(b, 0, j, 0, maxOrder + 1);
        if (x < 0) {
            for (int n = 1; n <= maxOrder; n += 2) {
                j[n] = -j[n];
            }
        }
        return j;
    }

    /** All normalised J_0 … J_N(x), x &gt; 0, from Miller's recurrence (N = startOrder). */
    private static double[] millerReal(int maxOrder, double x) {
        int top = startOrder(maxOrder, x);
        double[] b = new double[top + 2];
        b[top + 1] = 0;
        b[top] = 1;
        double twoOverX = 2 / x;
        for (int n = top; n >= 1; n--) {
            b[n - 1] = n * twoOverX * b[n] - b[n + 1];
            if (Math.abs(b[n - 1]) > BIG) {
                for (int k = n - 1; k <= top + 1; k++) {
                    b[k] /= BIG;
                }
            }
        }
        double sum = b[0];
        for (int n = 2; n <= top; n += 2) {
            sum += 2 * b[n];
        }
        for (int n = 0; n <= top; n++) {
            b[n] /= sum;
        }
        return b;
    }

    /**
     * Y_0(x) … Y_maxOrder(x) for real x &gt; 0. Large orders at small x overflow to −∞ (Y_n ~ −(n − 1)!(2/x)^n/π).
     *
     * @return a new array of length maxOrder + 1
     */
    public static double[] besselY(int maxOrder, double x) {
        checkOrder(maxOrder);
        if (!(x > 0) || x > 1e7) {
            throw new IllegalArgumentException(String.format("Bessel Y: argument %g must be in (0, 1e7]", x));
        }
        double[] y01 = x < ASYMPTOTIC_FROM ? neumannY01(x) : asymptoticY01(x);
        double[] y = new double[maxOrder + 1];
        y[0] = y01[0];
        if (maxOrder >= 1) {
            y[1] = y01[1];
        }
        for (int n = 1; n < maxOrder; n++) {
            y[n + 1] = 2 * n / x * y[n] - y[n - 1];
        }
        return y;
    }

    /** Y_0, Y_1 by the Neumann series (A&amp;S 9.1.88 and its derivative). */
    static double[] neumannY01(double x) {
        double[] j = millerReal(1, x);
        int top = j.length - 2;
        double log = Math.log(x / 2) + EULER_GAMMA;
        double s0 = 0;
        for (int k = top / 2; k >= 1; k--) {
            s0 += ((k & 1) == 0 ? 1 : -1) * j[2 * k] / k;
        }
        double y0 = 2 / Math.PI * log * j[0] - 4 / Math.PI * s0;
        double s1 = 0;
        for (int k = (top + 1) / 2; k >= 2; k--) {
            s1 += ((k & 1) == 0 ? 1 : -1) * (2.0 * k - 1) * j[2 * k - 1] / ((double) k * (k - 1));
        }
        double y1 = 2 / Math.PI * ((log - 1) * j[1] - j[0] / x) + 2 / Math.PI * s1;
        return new double[] {y0, y1};
    }

    /**
     * Y_0, Y_1 by Hankel's expansions: Y_ν = sqrt(2/(πx)) (P sin χ + Q cos χ), χ = x − (ν/2 + 1/4)π,
     * P ~ Σ_k (−1)^k a_{2k}(ν) x^{−2k}, Q ~ Σ_k (−1)^k a_{2k+1}(ν) x^{−2k−1},
     * a_k(ν) = (4ν² − 1)(4ν² − 9)…(4ν² − (2k − 1)²) / (k! 8^k) (A&amp;S 9.2.6, 9.2.9, 9.2.10).
     */
    static double[] asymptoticY01(double x) {
        double c = Math.cos(x);
        double s = Math.sin(x);
        double r2 = Math.sqrt(0.5);
        double amp = Math.sqrt(2 / (Math.PI * x));
        double[] pq0 = hankelPQ(0, x);
        double[] pq1 = hankelPQ(1, x);
        // χ0 = x − π/4, χ1 = x − 3π/4, expanded so that x itself enters cos and sin unchanged
        double cos0 = (c + s) * r2;
        double sin0 = (s - c) * r2;
        double cos1 = (s - c) * r2;
        double sin1 = -(s + c) * r2;
        double y0 = amp * (pq0[0] * sin0 + pq0[1] * cos0);
        double y1 = amp * (pq1[0] * sin1 + pq1[1] * cos1);
        return new double[] {y0, y1};
    }

    /** {P, Q} of Hankel's expansion for order ν, summed while the terms decrease. */
    private static double[] hankelPQ(int nu, double x) {
        double mu = 4.0 * nu * nu;
        double p = 1;
        double q = 0;
        double term = 1; // a_k(ν) / x^k with the sign (−1)^{⌊k/2⌋} folded in below
        double last = Double.POSITIVE_INFINITY;
        for (int k = 1; k < 200; k++) {
            double next = term * (mu - (2.0 * k - 1) * (2.0 * k - 1)) / (k * 8.0 * x);
            if (Math.abs(next) >= last || next == 0) {
                break;
            }
            last = Math.abs(next);
            term = next;
            // a_k / x^k enters P (k even) or Q (k odd) with the sign (−1)^{⌊k/2⌋}
            double signed = ((k / 2) & 1) == 0 ? term : -term;
            if ((k & 1) == 0) {
                p += signed;
            } else {
                q += signed;
            }
        }
        return new double[] {p, q};
    }

    /**
     * J_0(z) … J_maxOrder(z) for complex z with |Im z| ≤ {@value #MAX_IMAGINARY}.
     *
     * @return a new array of length maxOrder + 1
     */
    public static Complex[] besselJ(int maxOrder, Complex z) {
        checkOrder(maxOrder);
        if (!z.isFinite() || z.abs() > 1e7 || Math.abs(z.im()) > MAX_IMAGINARY) {
            throw new IllegalArgumentException(String.format(
                    "Bessel J: complex argument %s must be finite with |z| <= 1e7 and |Im z| <= %g", z, MAX_IMAGINARY));
        }
        Complex[] out = new Complex[maxOrder + 1];
        if (z.re() == 0 && z.im() == 0) {
            out[0] = Complex.ONE;
            for (int n = 1; n <= maxOrder; n++) {
                out[n] = Complex.ZERO;
            }
            return out;
        }
        int top = startOrder(maxOrder, z.abs());
        double[] re = new double[top + 2];
        double[] im = new double[top + 2];
        re[top] = 1;
        Complex inv = z.reciprocal();
        double ir = 2 * inv.re();
        double ii = 2 * inv.im();
        for (int n = top; n >= 1; n--) {
            // b_{n−1} = (2n/z) b_n − b_{n+1}
            double fr = n * ir;
            double fi = n * ii;
            re[n - 1] = fr * re[n] - fi * im[n] - re[n + 1];
            im[n - 1] = fr * im[n] + fi * re[n] - im[n + 1];
            if (Math.abs(re[n - 1]) + Math.abs(im[n - 1]) > BIG) {
                for (int k = n - 1; k <= top + 1; k++) {
                    re[k] /= BIG;
                    im[k] /= BIG;
                }
            }
        }
        // e^{−iσz} = b_0 + 2 Σ (−iσ)^n b_n (times the unknown scale); the weights cycle 1, −iσ, −1, +iσ
        double sigma = z.im() >= 0 ? 1 : -1;
        double sr = re[0];
        double si = im[0];
        for (int n = 1; n <= top; n++) {
            switch (n & 3) {
                case 0 -> {
                    sr += 2 * re[n];
                    si += 2 * im[n];
                }
                case 1 -> { // −iσ·b
                    sr += 2 * sigma * im[n];
                    si -= 2 * sigma * re[n];
                }
                case 2 -> {
                    sr -= 2 * re[n];
                    si -= 2 * im[n];
                }
                default -> { // +iσ·b
                    sr -= 2 * sigma * im[n];
                    si += 2 * sigma * re[n];
                }
            }
        }
        Complex target = z.times(Complex.of(0, -sigma)).exp();
        Complex scale = target.divide(Complex.of(sr, si));
        for (int n = 0; n <= maxOrder; n++) {
            out[n] = Complex.of(re[n], im[n]).times(scale);
        }
        return out;
    }

    /**
     * The ratios r_n = J_{n−1}(z)/J_n(z), n = 1 … maxOrder, for any nonzero complex z (no limit on Im z), by the
     * backward continued fraction r_n = 2n/z − 1/r_{n+1} from r_{N+1} = ∞ (the same start order as Miller's
     * recurrence). From them J_n'/J_n = r_n − n/z (A&amp;S 9.1.27). Near a zero of J_n, r_n is large (finite).
     *
     * @return a new array of length maxOrder + 1; element 0 is NaN
     */
    public static Complex[] ratios(int maxOrder, Complex z) {
        checkOrder(maxOrder);
        if (!z.isFinite() || z.abs() > 1e7 || (z.re() == 0 && z.im() == 0)) {
            throw new IllegalArgumentException(String.format(
                    "Bessel ratios: complex argument %s must be finite, nonzero, |z| <= 1e7", z));
        }
        int top = startOrder(maxOrder, z.abs());
        Complex[] out = new Complex[maxOrder + 1];
        out[0] = Complex.of(Double.NaN, Double.NaN);
        Complex inv = z.reciprocal().times(2);
        Complex next = Complex.ZERO; // 1/r_{n+1}
        for (int n = top; n >= 1; n--) {
            Complex r = inv.times(n).minus(next);
            if (r.norm() == 0) {
                r = Complex.of(1e-300, 0); // J_{n−1} = 0 to the last bit: a tiny ratio keeps the recurrence finite
            }
            if (n <= maxOrder) {
                out[n] = r;
            }
            next = r.reciprocal();
        }
        return out;
    }
}
