package org.evanesce.geometry.dispersion;

/**
 * An immutable complex number {@code re + i·im} for permittivities and indices. (The solver has its
 * own {@code reference.Complex}; geometry cannot see it, and the two convert by their parts.)
 */
public record ComplexNumber(double re, double im) {

    public static final ComplexNumber ZERO = new ComplexNumber(0, 0);
    public static final ComplexNumber ONE = new ComplexNumber(1, 0);

    public ComplexNumber plus(ComplexNumber o) {
        return new ComplexNumber(re + o.re, im + o.im);
    }

    public ComplexNumber plus(double x) {
        return new ComplexNumber(re + x, im);
    }

    public ComplexNumber minus(ComplexNumber o) {
        return new ComplexNumber(re - o.re, im - o.im);
    }

    public ComplexNumber times(ComplexNumber o) {
        return new ComplexNumber(re * o.re - im * o.im, re * o.im + im * o.re);
    }

    public ComplexNumber times(double x) {
        return new ComplexNumber(re * x, im * x);
    }

    /** Division by Smith's method (no overflow for divisors of either size). */
    public ComplexNumber divide(ComplexNumber o) {
        double c = o.re;
        double d = o.im;
        if (Math.abs(c) >= Math.abs(d)) {
            if (c == 0 && d == 0) {
                throw new ArithmeticException("complex division by zero: " + this + " / " + o);
            }
            double q = d / c;
            double den = c + d * q;
            return new ComplexNumber((re + im * q) / den, (im - re * q) / den);
        }
        double q = c / d;
        double den = c * q + d;
        return new ComplexNumber((re * q + im) / den, (im * q - re) / den);
    }

    /** {@code x / this}. */
    public ComplexNumber dividedInto(double x) {
        return new ComplexNumber(x, 0).divide(this);
    }

    public ComplexNumber square() {
        return new ComplexNumber(re * re - im * im, 2 * re * im);
    }

    /** |z| without overflow. */
    public double abs() {
        return Math.hypot(re, im);
    }

    /**
     * The square root with non-negative imaginary part (for a permittivity ε, the index n + iκ with
     * κ ≥ 0; a positive real ε gives the positive root).
     */
    public ComplexNumber sqrtUpper() {
        if (re == 0 && im == 0) {
            return ZERO;
        }
        double a = Math.sqrt((Math.abs(re) + abs()) / 2);
        double wr;
        double wi;
        if (re >= 0) {
            wr = a;
            wi = im / (2 * a);
        } else {
            wr = Math.abs(im) / (2 * a);
            wi = Math.copySign(a, im);
        }
        if (wi < 0 || (wi == 0 && wr < 0)) {
            wr = -wr;
            wi = -wi;
        }
        return new ComplexNumber(wr + 0.0, wi + 0.0);
    }

    public boolean isFinite() {
        return Double.isFinite(re) && Double.isFinite(im);
    }

    /** E.g. {@code -11.7+1.26i}, with every digit. */
    @Override
    public String toString() {
        return re + (Math.copySign(1.0, im) < 0 ? "-" : "+") + Math.abs(im) + "i";
    }
}
