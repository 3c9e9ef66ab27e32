package org.evanesce.solver.farfield;

import java.util.ArrayList;
import java.util.List;

/**
 * Points on a closed contour, each with its outward unit normal and its arc-length weight, for sampling fields
 * that {@link NearToFarField} and {@link SurfaceFlux} integrate: ∮ f dl ≈ Σ_j w_j f(r_j). Coordinates in metres.
 * The points of one contour can be used for one quantity and those of another (the same rectangle, shifted along
 * the sides) for another: the Yee grid keeps E and H at different places.
 *
 * <p>The arrays are copied in and out; instances are immutable.
 *
 * @param x       x_j, m
 * @param y       y_j, m
 * @param normalX n̂_x of the outward unit normal at point j
 * @param normalY n̂_y
 * @param weight  w_j ≥ 0, m: the length of contour that point j stands for
 */
public record ContourPoints(double[] x, double[] y, double[] normalX, double[] normalY, double[] weight) {

    /** How a straight side of length L = NΔ is sampled. */
    public enum Rule {
        /** N points at the middles of the N cells of length Δ, each of weight Δ (the midpoint rule, second order). */
        MIDPOINT,
        /**
         * N + 1 points at the cells' ends, weight Δ inside and Δ/2 at both ends (the trapezoid rule, second order); a
         * corner is then sampled twice, once with each side's normal.
         */
        TRAPEZOID
    }

    public ContourPoints {
        int n = x.length;
        if (n == 0 || y.length != n || normalX.length != n || normalY.length != n || weight.length != n) {
            throw new IllegalArgumentException(String.format(
                    "contour points: x, y, normalX, normalY and weight need the same nonzero length, got %d, %d, %d, %d, %d",
                    x.length, y.length, normalX.length, normalY.length, weight.length));
        }
        for (int j = 0; j < n; j++) {
            if (!Double.isFinite(x[j]) || !Double.isFinite(y[j])) {
                throw new IllegalArgumentException(String.format("contour point %d at (%g, %g) m is not finite", j, x[j],
                        y[j]));
            }
            double len = Math.hypot(normalX[j], normalY[j]);
            if (!(Math.abs(len - 1) <= 1e-9)) {
                throw new IllegalArgumentException(String.format(
                        "contour point %d: normal (%g, %g) must have unit length, has %g", j, normalX[j], normalY[j], len));
            }
            if (!(weight[j] >= 0) || Double.isInfinite(weight[j])) {
                throw new IllegalArgumentException(String.format("contour point %d: weight %g m must be finite and >= 0",
                        j, weight[j]));
            }
        }
        x = x.clone();
        y = y.clone();
        normalX = normalX.clone();
        normalY = normalY.clone();
        weight = weight.clone();
    }

    /**
     * The boundary of the rectangle [left, right] × [bottom, top], counter-clockwise from the bottom-left corner
     * (bottom side, right, top, left), each side of length NΔ sampled by {@code rule}.
     *
     * @param spacing Δ, m: every side must be a whole number of Δ (to 1e-9 relative)
     */
    public static ContourPoints rectangle(double left, double bottom, double right, double top, double spacing, Rule rule) {
        if (!(right > left) || !(top > bottom) || !Double.isFinite(right - left) || !Double.isFinite(top - bottom)) {
            throw new IllegalArgumentException(String.format(
                    "contour rectangle [%g, %g] x [%g, %g] m must have right > left and top > bottom", left, right, bottom,
                    top));
        }
        if (!(spacing > 0) || Double.isInfinite(spacing)) {
            throw new IllegalArgumentException(String.format("contour spacing %g m must be finite and > 0", spacing));
        }
        int nx = cells(right - left, spacing);
        int ny = cells(top - bottom, spacing);
        List<double[]> pts = new ArrayList<>();
        side(pts, left, bottom, 1, 0, nx, spacing, 0, -1, rule);   // bottom: along +x, normal −y
        side(pts, right, bottom, 0, 1, ny, spacing, 1, 0, rule);   // right: along +y, normal +x
        side(pts, right, top, -1, 0, nx, spacing, 0, 1, rule);     // top: along −x, normal +y
        side(pts, left, top, 0, -1, ny, spacing, -1, 0, rule);     // left: along −y, normal −x
        int n = pts.size();
        double[][] cols = new double[5][n];
        for (int j = 0; j < n; j++) {
            for (int c = 0; c < 5; c++) {
                cols[c][j] = pts.get(j)[c];
            }
        }
        return new ContourPoints(cols[0], cols[1], cols[2], cols[3], cols[4]);
    }

    private static int cells(double length, double spacing) {
        double ratio = length / spacing;
        long n = Math.round(ratio);
        if (n < 1 || n > 10_000_000 || Math.abs(ratio - n) > 1e-9 * ratio) {
            throw new IllegalArgumentException(String.format(
                    "contour side %g m is not a whole number of spacings %g m (%g)", length, spacing, ratio));
        }
        return (int) n;
    }

    private static void side(List<double[]> pts, double x0, double y0, double dx, double dy, int n, double h, double nx,
                             double ny, Rule rule) {
        if (rule == Rule.MIDPOINT) {
            for (int j = 0; j < n; j++) {
                double s = (j + 0.5) * h;
                pts.add(new double[] {x0 + s * dx, y0 + s * dy, nx, ny, h});
            }
        } else {
            for (int j = 0; j <= n; j++) {
                double s = j * h;
                pts.add(new double[] {x0 + s * dx, y0 + s * dy, nx, ny, j == 0 || j == n ? h / 2 : h});
            }
        }
    }

    @Override
    public double[] x() {
        return x.clone();
    }

    @Override
    public double[] y() {
        return y.clone();
    }

    @Override
    public double[] normalX() {
        return normalX.clone();
    }

    @Override
    public double[] normalY() {
        return normalY.clone();
    }

    @Override
    public double[] weight() {
        return weight.clone();
    }

    /** The number of points. */
    public int size() {
        return x.length;
    }

    /** Σ w_j, m: the contour's length as the rule sees it. */
    public double length() {
        double s = 0;
        for (double w : weight) {
            s += w;
        }
        return s;
    }

    /**
     * A scalar field sampled at these points: U (Ez for s, η0·Hz for p), complex amplitudes.
     *
     * @param re Re U_j; not modified
     * @param im Im U_j; not modified
     */
    public SurfaceSamples scalar(double[] re, double[] im) {
        return new SurfaceSamples(this, re, im);
    }

    /**
     * An in-plane vector field sampled at these points (η0·H for s, E for p), reduced to its tangential component
     * V_t = V · t̂ along t̂ = ẑ × n̂ = (−n̂_y, n̂_x), which runs counter-clockwise round a contour with outward
     * normals. The normal component does not enter (and may be given as zero, e.g. on an axis-aligned side where
     * the grid has only the tangential one).
     */
    public SurfaceSamples tangential(double[] xRe, double[] xIm, double[] yRe, double[] yIm) {
        int n = size();
        if (xRe.length != n || xIm.length != n || yRe.length != n || yIm.length != n) {
            throw new IllegalArgumentException(String.format(
                    "tangential samples: need %d values in each of the four arrays, got %d, %d, %d, %d", n, xRe.length,
                    xIm.length, yRe.length, yIm.length));
        }
        double[] re = new double[n];
        double[] im = new double[n];
        for (int j = 0; j < n; j++) {
            re[j] = -normalY[j] * xRe[j] + normalX[j] * yRe[j];
            im[j] = -normalY[j] * xIm[j] + normalX[j] * yIm[j];
        }
        return new SurfaceSamples(this, re, im);
    }
}
