package org.evanesce.io.sweep;

/**
 * The minimum or maximum of a sampled curve y(x), with x interpolated, and a dip's full width at half
 * depth. Pure functions of the samples; the arrays are not modified.
 *
 * <p>The extremum: the lowest (highest) sample and its two neighbours define a parabola whose vertex is
 * the interpolated position (Press, Teukolsky, Vetterling &amp; Flannery, <i>Numerical Recipes</i>, 3rd
 * ed., 2007, §10.3, eq. 10.3.1, which holds for unequal spacing); the value is that parabola's value at
 * the vertex. A lowest (highest) sample at either end of the range is not bracketed: the end sample is
 * returned as it is, with {@code bracketed} false.
 *
 * <p>The width of a dip: the half-depth level is (baseline + minimum)/2, with the baseline the larger of
 * the two end values and the minimum the interpolated one; walking out from the lowest sample on each
 * side, the first crossing of that level is found by linear interpolation between the two samples that
 * straddle it. Where a side does not reach the level within the range, that side's end of the range is
 * used instead and {@code complete} is false (the width is then a lower bound). A minimum at an end of
 * the range is no dip and has no width.
 */
final class Extremum {

    /**
     * @param x         the interpolated position (the end sample's x when not bracketed)
     * @param value     the parabola's value at x (the sample's value when not bracketed)
     * @param bracketed whether the extremum lies inside the range (a sample on each side of it)
     * @param width     a bracketed minimum's full width at half depth (NaN for a maximum, a minimum at an end
     *                  of the range, or a flat curve)
     * @param complete  whether both sides crossed the half-depth level within the range
     */
    record Found(double x, double value, boolean bracketed, double width, boolean complete, double depth) {
        Found(double x, double value, boolean bracketed, double width, boolean complete) {
            this(x, value, bracketed, width, complete, Double.NaN);
        }
    }

    private Extremum() {
    }

    /** The minimum of y over strictly increasing x (3 samples or more), with its width at half depth. */
    static Found minimum(double[] x, double[] y) {
        int i = 0;
        for (int k = 1; k < y.length; k++) {
            if (y[k] < y[i]) {
                i = k;
            }
        }
        double[] v = vertex(x, y, i);
        boolean bracketed = i > 0 && i < y.length - 1;
        double baseline = Math.max(y[0], y[y.length - 1]);
        double half = 0.5 * (baseline + v[1]);
        if (!bracketed || !(y[i] < half)) {
            // not a dip: a minimum at an end of the range, or a flat curve, has no width
            return new Found(v[0], v[1], bracketed, Double.NaN, false, baseline - v[1]);
        }
        boolean complete = true;
        int k = i;
        while (k > 0 && y[k - 1] < half) {
            k--;
        }
        double left;
        if (k == 0) {
            left = x[0];
            complete = false;
        } else {
            left = cross(x[k - 1], y[k - 1], x[k], y[k], half);
        }
        k = i;
        int n = y.length - 1;
        while (k < n && y[k + 1] < half) {
            k++;
        }
        double right;
        if (k == n) {
            right = x[n];
            complete = false;
        } else {
            right = cross(x[k], y[k], x[k + 1], y[k + 1], half);
        }
        return new Found(v[0], v[1], bracketed, right - left, complete, baseline - v[1]);
    }

    /** The maximum of y over strictly increasing x (3 samples or more); no width. */
    static Found maximum(double[] x, double[] y) {
        int i = 0;
        for (int k = 1; k < y.length; k++) {
            if (y[k] > y[i]) {
                i = k;
            }
        }
        double[] v = vertex(x, y, i);
        return new Found(v[0], v[1], i > 0 && i < y.length - 1, Double.NaN, false);
    }

    /**
     * The vertex {x, y} of the parabola through samples i-1, i, i+1 (Numerical Recipes eq. 10.3.1); the
     * sample itself at an end of the range or where the three points are collinear.
     */
    static double[] vertex(double[] x, double[] y, int i) {
        if (i == 0 || i == y.length - 1) {
            return new double[] {x[i], y[i]};
        }
        double a = x[i - 1];
        double b = x[i];
        double c = x[i + 1];
        double fa = y[i - 1];
        double fb = y[i];
        double fc = y[i + 1];
        double p = (b - a) * (b - a) * (fb - fc) - (b - c) * (b - c) * (fb - fa);
        double q = (b - a) * (fb - fc) - (b - c) * (fb - fa);
        if (q == 0) {
            return new double[] {b, fb};
        }
        double xv = b - 0.5 * p / q;
        // the parabola's value at the vertex, in Lagrange form through the three samples
        double yv = fa * (xv - b) * (xv - c) / ((a - b) * (a - c)) + fb * (xv - a) * (xv - c) / ((b - a) * (b - c))
                + fc * (xv - a) * (xv - b) / ((c - a) * (c - b));
        return new double[] {xv, yv};
    }

    /** Where the straight line through (x0, y0) and (x1, y1) reaches the level. */
    private static double cross(double x0, double y0, double x1, double y1, double level) {
        return x0 + (level - y0) * (x1 - x0) / (y1 - y0);
    }
}
