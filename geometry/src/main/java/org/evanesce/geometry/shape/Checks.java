package org.evanesce.geometry.shape;

/** Argument checks with messages naming the parameter, value, bound and unit (docs/architecture.md, code conventions). */
final class Checks {

    private Checks() {
    }

    static double finite(String what, double v, String unit) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException(String.format("%s %g %s must be finite", what, v, unit));
        }
        return v;
    }

    static double positive(String what, double v, String unit) {
        if (!(v > 0) || Double.isInfinite(v)) {
            throw new IllegalArgumentException(String.format("%s %g %s must be finite and > 0", what, v, unit));
        }
        return v;
    }

    /** Returns the unit vector along (x, y); the vector must be finite and non-zero. */
    static double[] direction(String what, double x, double y) {
        double n = Math.hypot(x, y);
        if (!Double.isFinite(x) || !Double.isFinite(y) || !(n > 0) || Double.isInfinite(n)) {
            throw new IllegalArgumentException(String.format(
                    "%s (%g, %g) must be finite and non-zero", what, x, y));
        }
        return new double[] {x / n, y / n};
    }
}
