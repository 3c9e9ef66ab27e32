package org.evanesce.geometry.shape;

import java.util.Arrays;

/**
 * Plane-geometry routines shared by the shapes: polygon clipping, areas, segment clipping and the
 * accumulation of boundary integrals. Coordinates in metres; arrays are not modified unless stated.
 */
final class Planar {

    private Planar() {
    }

    /** Signed (shoelace) area of the polygon (x[k], y[k]), k &lt; n; positive when counter-clockwise. */
    static double signedArea(double[] x, double[] y, int n) {
        if (n < 3) {
            return 0;
        }
        // relative to the first vertex, which keeps the sum accurate far from the origin
        double ox = x[0];
        double oy = y[0];
        double s = 0;
        for (int k = 1; k < n - 1; k++) {
            s += (x[k] - ox) * (y[k + 1] - oy) - (x[k + 1] - ox) * (y[k] - oy);
        }
        return 0.5 * s;
    }

    /**
     * Signed area of the part of polygon (x, y) (n vertices, any simple polygon, either
     * orientation) inside the box [x0, x1] × [y0, y1], by Sutherland–Hodgman clipping against
     * the four sides (a convex clip window, so the result is exact even for concave polygons:
     * the degenerate edges the method may add along the window have no area).
     *
     * <p>Before clipping, each run of three or more consecutive vertices lying beyond the same side
     * of the box is cut to its first and last vertex: the clipping pass for that side drops the run
     * and keeps only the crossings of the edges into and out of it, which are unchanged, so the
     * result is the same and a long polygon costs little per pixel.
     */
    static double clippedArea(double[] x, double[] y, int n, double x0, double y0, double x1, double y1) {
        int start = -1;
        for (int k = 0; k < n; k++) {
            if (region(x[k], y[k], x0, y0, x1, y1) != region(x[(k + n - 1) % n], y[(k + n - 1) % n], x0, y0, x1, y1)) {
                start = k;
                break;
            }
        }
        if (start < 0) {
            // every vertex in one region: wholly inside, or wholly beyond one side
            return region(x[0], y[0], x0, y0, x1, y1) == INSIDE ? signedArea(x, y, n) : 0;
        }
        double[] ax = new double[16];
        double[] ay = new double[16];
        int m = 0;
        int prev = region(x[(start + n - 1) % n], y[(start + n - 1) % n], x0, y0, x1, y1);
        int cur = region(x[start], y[start], x0, y0, x1, y1);
        for (int q = 0; q < n; q++) {
            int k = (start + q) % n;
            int k1 = (k + 1) % n;
            int next = region(x[k1], y[k1], x0, y0, x1, y1);
            if (cur == INSIDE || cur != prev || cur != next) {
                if (m == ax.length) {
                    ax = Arrays.copyOf(ax, 2 * m);
                    ay = Arrays.copyOf(ay, 2 * m);
                }
                ax[m] = x[k];
                ay[m] = y[k];
                m++;
            }
            prev = cur;
            cur = next;
        }
        int cap = 2 * m + 8;
        double[] bx = new double[cap];
        double[] by = new double[cap];
        ax = Arrays.copyOf(ax, cap);
        ay = Arrays.copyOf(ay, cap);
        m = clipAxis(ax, ay, m, bx, by, 0, x0, false);
        m = clipAxis(bx, by, m, ax, ay, 0, x1, true);
        m = clipAxis(ax, ay, m, bx, by, 1, y0, false);
        m = clipAxis(bx, by, m, ax, ay, 1, y1, true);
        return signedArea(ax, ay, m);
    }

    private static final int INSIDE = 0;

    /**
     * Which clipping pass removes the point: 1 for x &lt; x0, 2 for x &gt; x1, 3 for y &lt; y0
     * (x in range), 4 for y &gt; y1 (x in range), 0 inside. A run of one code is removed whole by the
     * pass of that code, before which the earlier passes keep it unchanged.
     */
    private static int region(double px, double py, double x0, double y0, double x1, double y1) {
        if (px < x0) {
            return 1;
        }
        if (px > x1) {
            return 2;
        }
        if (py < y0) {
            return 3;
        }
        return py > y1 ? 4 : INSIDE;
    }

    /** One Sutherland–Hodgman pass: keeps coordinate {@code axis} ≥ c (or ≤ c when {@code upper}). */
    private static int clipAxis(double[] sx, double[] sy, int n, double[] ox, double[] oy, int axis, double c,
                                boolean upper) {
        if (n == 0) {
            return 0;
        }
        int m = 0;
        double px = sx[n - 1];
        double py = sy[n - 1];
        double pv = axis == 0 ? px : py;
        boolean pIn = upper ? pv <= c : pv >= c;
        for (int k = 0; k < n; k++) {
            double qx = sx[k];
            double qy = sy[k];
            double qv = axis == 0 ? qx : qy;
            boolean qIn = upper ? qv <= c : qv >= c;
            if (qIn != pIn) {
                double t = (c - pv) / (qv - pv);
                if (axis == 0) {
                    ox[m] = c;
                    oy[m] = py + t * (qy - py);
                } else {
                    ox[m] = px + t * (qx - px);
                    oy[m] = c;
                }
                m++;
            }
            if (qIn) {
                ox[m] = qx;
                oy[m] = qy;
                m++;
            }
            px = qx;
            py = qy;
            pv = qv;
            pIn = qIn;
        }
        return m;
    }

    /**
     * Clips the convex polygon (x, y) (n vertices) to the half-plane a·r ≤ b, writing the result
     * to (ox, oy) and returning its vertex count. The output arrays need n + 1 places.
     */
    static int clipHalfPlane(double[] x, double[] y, int n, double ax, double ay, double b, double[] ox, double[] oy) {
        if (n == 0) {
            return 0;
        }
        int m = 0;
        double px = x[n - 1];
        double py = y[n - 1];
        double pd = ax * px + ay * py - b;
        for (int k = 0; k < n; k++) {
            double qx = x[k];
            double qy = y[k];
            double qd = ax * qx + ay * qy - b;
            if ((qd <= 0) != (pd <= 0)) {
                double t = pd / (pd - qd);
                ox[m] = px + t * (qx - px);
                oy[m] = py + t * (qy - py);
                m++;
            }
            if (qd <= 0) {
                ox[m] = qx;
                oy[m] = qy;
                m++;
            }
            px = qx;
            py = qy;
            pd = qd;
        }
        return m;
    }

    /**
     * Liang–Barsky: narrows the parameter interval {t0, t1} (in {@code range}, modified) of the
     * line p + t·d to where it satisfies a·(p + t d) ≤ b. Returns false once it is empty.
     * A line parallel to the constraint keeps its interval when it lies inside (within
     * {@code slack}) and is emptied otherwise.
     */
    static boolean narrow(double[] range, double px, double py, double dx, double dy, double ax, double ay, double b,
                          double slack) {
        double den = ax * dx + ay * dy;
        double num = b - (ax * px + ay * py);
        if (Math.abs(den) <= 1e-14 * Math.hypot(dx, dy) * Math.hypot(ax, ay)) {
            if (num < -slack) {
                range[1] = range[0] - 1;
                return false;
            }
            return range[1] > range[0];
        }
        double t = num / den;
        if (den > 0) {
            range[1] = Math.min(range[1], t);
        } else {
            range[0] = Math.max(range[0], t);
        }
        return range[1] > range[0];
    }

    /**
     * Narrows {@code range} for the segment p + t d to the box [x0, x1] × [y0, y1].
     * Returns false once it is empty.
     */
    static boolean narrowToBox(double[] range, double px, double py, double dx, double dy,
                               double x0, double y0, double x1, double y1) {
        return narrow(range, px, py, dx, dy, -1, 0, -x0, 0) && narrow(range, px, py, dx, dy, 1, 0, x1, 0)
                && narrow(range, px, py, dx, dy, 0, -1, -y0, 0) && narrow(range, px, py, dx, dy, 0, 1, y1, 0);
    }

    /**
     * Signed area of the unit disk's intersection with the convex polygon (x, y), n vertices, in
     * the disk's own frame (centre at the origin). Sum over edges of the signed area of
     * disk ∩ triangle(O, p_k, p_k+1): each edge is split where it crosses the circle, and each piece
     * contributes its triangle with O when inside the disk and the circular sector otherwise
     * (common practice in computational geometry).
     */
    static double unitDiskPolygonArea(double[] x, double[] y, int n) {
        double s = 0;
        for (int k = 0; k < n; k++) {
            int k1 = k + 1 == n ? 0 : k + 1;
            s += unitDiskTriangleArea(x[k], y[k], x[k1], y[k1]);
        }
        return s;
    }

    private static double unitDiskTriangleArea(double ax, double ay, double bx, double by) {
        double dx = bx - ax;
        double dy = by - ay;
        double a = dx * dx + dy * dy;
        if (a == 0) {
            return 0;
        }
        double b = ax * dx + ay * dy;
        double c = ax * ax + ay * ay - 1;
        double disc = b * b - a * c;
        double[] ts = {0, 0, 0, 1};
        int m = 1;
        if (disc > 0) {
            double sq = Math.sqrt(disc);
            double t1 = (-b - sq) / a;
            double t2 = (-b + sq) / a;
            if (t1 > 0 && t1 < 1) {
                ts[m++] = t1;
            }
            if (t2 > 0 && t2 < 1) {
                ts[m++] = t2;
            }
        }
        ts[m++] = 1;
        double s = 0;
        for (int q = 0; q + 1 < m; q++) {
            double px = ax + ts[q] * dx;
            double py = ay + ts[q] * dy;
            double qx = ax + ts[q + 1] * dx;
            double qy = ay + ts[q + 1] * dy;
            double mx = 0.5 * (px + qx);
            double my = 0.5 * (py + qy);
            double cross = px * qy - py * qx;
            if (mx * mx + my * my <= 1) {
                s += 0.5 * cross;
            } else {
                s += 0.5 * Math.atan2(cross, px * qx + py * qy);
            }
        }
        return s;
    }

    /** Accumulates ∫ ds, ∫ n ds and ∫ n nᵀ ds over pieces of boundary. */
    static final class BoundarySum {
        double length;
        double nx;
        double ny;
        double nnxx;
        double nnxy;
        double nnyy;

        /** Adds a straight piece of length {@code l} with unit outward normal (ux, uy). */
        void add(double l, double ux, double uy) {
            length += l;
            nx += l * ux;
            ny += l * uy;
            nnxx += l * ux * ux;
            nnxy += l * ux * uy;
            nnyy += l * uy * uy;
        }

        PixelCut cut(double fraction) {
            return PixelCut.of(fraction, length, nx, ny, nnxx, nnxy, nnyy);
        }
    }
}
