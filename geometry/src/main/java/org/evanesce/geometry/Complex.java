package org.evanesce.geometry;

/**
 * An immutable complex number {@code re + i·im}: the one complex type of the project, for the
 * permittivities and indices of materials here and the plane-wave references and far-field
 * transforms of the solver. Every operation returns a new value; none changes this one.
 *
 * <p>Two square roots are offered: {@link #sqrt()} is the principal root (Re ≥ 0, branch cut along
 * the negative real axis), and {@link #sqrtUpper()} is the root with non-negative imaginary part,
 * the branch this project uses for normal wavenumbers and for a material's index n + iκ (κ ≥ 0).
 */
public record Complex(double re, double im) {

    public static final Complex ZERO = new Complex(0, 0);
    public static final Complex ONE = new Complex(1, 0);
    public static final Complex I = new Complex(0, 1);

    public static Complex of(double re, double im) {
        return new Complex(re, im);
    }

    public static Complex real(double re) {
        return new Complex(re, 0);
    }

    /** {@code r·exp(iφ)}. */
    public static Complex polar(double r, double phi) {
        return new Complex(r * Math.cos(phi), r * Math.sin(phi));
    }

    public Complex plus(Complex o) {
        return new Complex(re + o.re, im + o.im);
    }

    public Complex plus(double x) {
        return new Complex(re + x, im);
    }

    public Complex minus(Complex o) {
        return new Complex(re - o.re, im - o.im);
    }

    public Complex minus(double x) {
        return new Complex(re - x, im);
    }

    public Complex times(Complex o) {
        return new Complex(re * o.re - im * o.im, re * o.im + im * o.re);
    }

    public Complex times(double x) {
        return new Complex(re * x, im * x);
    }

    /** {@code this · i}. */
    public Complex timesI() {
        return new Complex(-im, re);
    }

    /** Division by Smith's method (no overflow for large or small divisors of either sign). */
    public Complex divide(Complex o) {
        double c = o.re;
        double d = o.im;
        if (Math.abs(c) >= Math.abs(d)) {
            if (c == 0 && d == 0) {
                throw new ArithmeticException("complex division by zero: " + this + " / " + o);
            }
            double q = d / c;
            double den = c + d * q;
            return new Complex((re + im * q) / den, (im - re * q) / den);
        }
        double q = c / d;
        double den = c * q + d;
        return new Complex((re * q + im) / den, (im * q - re) / den);
    }

    public Complex divide(double x) {
        return new Complex(re / x, im / x);
    }

    /** {@code 1 / this}. */
    public Complex reciprocal() {
        return ONE.divide(this);
    }

    public Complex negate() {
        return new Complex(-re, -im);
    }

    public Complex conjugate() {
        return new Complex(re, -im);
    }

    public Complex square() {
        return new Complex(re * re - im * im, 2 * re * im);
    }

    /** |z|, without overflow. */
    public double abs() {
        return Math.hypot(re, im);
    }

    /** |z|². */
    public double norm() {
        return re * re + im * im;
    }

    /** The argument in (−π, π]. */
    public double arg() {
        return Math.atan2(im, re);
    }

    /** The principal square root: Re ≥ 0, and Im has the sign of this number's imaginary part. */
    public Complex sqrt() {
        if (re == 0 && im == 0) {
            return ZERO;
        }
        double a = Math.sqrt((Math.abs(re) + abs()) / 2);
        if (re >= 0) {
            return new Complex(a, im / (2 * a));
        }
        return new Complex(Math.abs(im) / (2 * a), Math.copySign(a, im));
    }

    /**
     * The square root with non-negative imaginary part; of the two roots of a positive real number
     * it is the positive one, and a negative real number gives {@code +i·sqrt(|x|)} whatever the
     * sign of its zero imaginary part. For a normal wavenumber {@code kz = sqrt(n²k0² − kx²)} this
     * is the wave that decays (or, without loss, keeps its amplitude) along +z.
     */
    public Complex sqrtUpper() {
        Complex w = sqrt();
        if (w.im < 0 || (w.im == 0 && w.re < 0)) {
            w = w.negate();
        }
        // turn a −0.0 into +0.0 so that printing and later sign tests see a plain zero
        return new Complex(w.re + 0.0, w.im + 0.0);
    }

    public Complex exp() {
        return polar(Math.exp(re), im);
    }

    public Complex sin() {
        return new Complex(Math.sin(re) * Math.cosh(im), Math.cos(re) * Math.sinh(im));
    }

    public Complex cos() {
        return new Complex(Math.cos(re) * Math.cosh(im), -Math.sin(re) * Math.sinh(im));
    }

    public boolean isFinite() {
        return Double.isFinite(re) && Double.isFinite(im);
    }

    /** E.g. {@code 1.5+0.01i}, {@code 0.2-3.4i} (shortest decimal that reads back exactly). */
    @Override
    public String toString() {
        return re + (Math.copySign(1.0, im) < 0 ? "-" : "+") + Math.abs(im) + "i";
    }
}
