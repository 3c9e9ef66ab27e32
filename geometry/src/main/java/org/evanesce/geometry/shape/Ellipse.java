package org.evanesce.geometry.shape;

import java.util.Arrays;

/**
 * An ellipse with semi-axes a (along (cos θ, sin θ)) and b (along (−sin θ, cos θ)) centred on
 * (centreX, centreY); a disk when a = b. Its boundary is r(t) = c + R(θ)(a cos t, b sin t).
 */
public final class Ellipse implements Shape {

    /** Gauss–Legendre nodes and weights on [−1, 1], 4 points (exact for polynomials of degree 7). */
    private static final double[] GL_X = {-0.8611363115940526, -0.3399810435848563, 0.3399810435848563,
        0.8611363115940526};
    private static final double[] GL_W = {0.3478548451374538, 0.6521451548625461, 0.6521451548625461,
        0.3478548451374538};
    /** Longest arc, in parameter t, integrated with one set of quadrature points. */
    private static final double MAX_ARC = Math.PI / 16;

    private final double centreX;
    private final double centreY;
    private final double a;
    private final double b;
    private final double rotation;
    private final double cos;
    private final double sin;
    private final Bounds bounds;

    /**
     * @param centreX   x of the centre, m
     * @param centreY   y of the centre, m
     * @param semiAxisX semi-axis along the rotated x axis, m; finite and &gt; 0
     * @param semiAxisY semi-axis along the rotated y axis, m; finite and &gt; 0
     * @param rotation  counter-clockwise angle of the first semi-axis, radians; finite
     */
    public Ellipse(double centreX, double centreY, double semiAxisX, double semiAxisY, double rotation) {
        this.centreX = Checks.finite("ellipse centre x", centreX, "m");
        this.centreY = Checks.finite("ellipse centre y", centreY, "m");
        this.a = Checks.positive("ellipse semi-axis x", semiAxisX, "m");
        this.b = Checks.positive("ellipse semi-axis y", semiAxisY, "m");
        this.rotation = Checks.finite("ellipse rotation", rotation, "rad");
        cos = Math.cos(rotation);
        sin = Math.sin(rotation);
        double hx = Math.sqrt(a * a * cos * cos + b * b * sin * sin);
        double hy = Math.sqrt(a * a * sin * sin + b * b * cos * cos);
        bounds = new Bounds(centreX - hx, centreY - hy, centreX + hx, centreY + hy);
    }

    /** The disk of the given radius. */
    public static Ellipse disk(double centreX, double centreY, double radius) {
        Checks.positive("disk radius", radius, "m");
        return new Ellipse(centreX, centreY, radius, radius, 0);
    }

    public double centreX() {
        return centreX;
    }

    public double centreY() {
        return centreY;
    }

    /** Semi-axis along (cos θ, sin θ), m. */
    public double semiAxisX() {
        return a;
    }

    /** Semi-axis along (−sin θ, cos θ), m. */
    public double semiAxisY() {
        return b;
    }

    /** Counter-clockwise angle θ, radians. */
    public double rotation() {
        return rotation;
    }

    /** Enclosed area πab, m². */
    public double area() {
        return Math.PI * a * b;
    }

    @Override
    public boolean contains(double x, double y) {
        double dx = x - centreX;
        double dy = y - centreY;
        double u = (cos * dx + sin * dy) / a;
        double v = (-sin * dx + cos * dy) / b;
        return u * u + v * v <= 1;
    }

    @Override
    public Bounds bounds() {
        return bounds;
    }

    @Override
    public PixelCut cut(double cx, double cy, double size) {
        double h = 0.5 * size;
        double x0 = cx - h;
        double x1 = cx + h;
        double y0 = cy - h;
        double y1 = cy + h;
        if (x1 < bounds.xMin() || x0 > bounds.xMax() || y1 < bounds.yMin() || y0 > bounds.yMax()) {
            return PixelCut.EMPTY;
        }
        if (contains(x0, y0) && contains(x1, y0) && contains(x1, y1) && contains(x0, y1)) {
            return PixelCut.FULL; // the ellipse is convex
        }
        double[] qx = new double[4];
        double[] qy = new double[4];
        toUnitFrame(x0, y0, x1, y1, qx, qy);
        double fraction = Planar.unitDiskPolygonArea(qx, qy, 4) * a * b / (size * size);
        Planar.BoundarySum sum = new Planar.BoundarySum();
        double[] arcs = arcsInside(qx, qy);
        for (int k = 0; k + 1 < arcs.length; k += 2) {
            integrate(arcs[k], arcs[k + 1], sum);
        }
        if (sum.length == 0) {
            return contains(cx, cy) ? PixelCut.FULL : PixelCut.EMPTY;
        }
        return sum.cut(fraction);
    }

    /** Maps the box's corners, counter-clockwise, to the frame where the ellipse is the unit circle. */
    private void toUnitFrame(double x0, double y0, double x1, double y1, double[] qx, double[] qy) {
        double[] cxs = {x0, x1, x1, x0};
        double[] cys = {y0, y0, y1, y1};
        for (int k = 0; k < 4; k++) {
            double dx = cxs[k] - centreX;
            double dy = cys[k] - centreY;
            qx[k] = (cos * dx + sin * dy) / a;
            qy[k] = (-sin * dx + cos * dy) / b;
        }
    }

    /**
     * The parameter intervals [t0, t1] (t1 &gt; t0, flattened pairs) of the unit circle inside the
     * convex counter-clockwise quadrilateral (qx, qy).
     */
    private static double[] arcsInside(double[] qx, double[] qy) {
        double[] ts = new double[8];
        int m = 0;
        for (int k = 0; k < 4; k++) {
            int k1 = (k + 1) & 3;
            double dx = qx[k1] - qx[k];
            double dy = qy[k1] - qy[k];
            double aa = dx * dx + dy * dy;
            double bb = qx[k] * dx + qy[k] * dy;
            double cc = qx[k] * qx[k] + qy[k] * qy[k] - 1;
            double disc = bb * bb - aa * cc;
            if (disc <= 0) {
                continue;
            }
            double sq = Math.sqrt(disc);
            for (double s : new double[] {(-bb - sq) / aa, (-bb + sq) / aa}) {
                if (s >= 0 && s <= 1) {
                    double t = Math.atan2(qy[k] + s * dy, qx[k] + s * dx);
                    ts[m++] = t < 0 ? t + 2 * Math.PI : t;
                }
            }
        }
        if (m == 0) {
            return insideQuad(qx, qy, 1, 0) ? new double[] {0, 2 * Math.PI} : new double[0];
        }
        Arrays.sort(ts, 0, m);
        double[] out = new double[2 * m];
        int o = 0;
        for (int k = 0; k < m; k++) {
            double t0 = ts[k];
            double t1 = k + 1 < m ? ts[k + 1] : ts[0] + 2 * Math.PI;
            if (t1 - t0 < 1e-15) {
                continue;
            }
            double tm = 0.5 * (t0 + t1);
            if (insideQuad(qx, qy, Math.cos(tm), Math.sin(tm))) {
                out[o++] = t0;
                out[o++] = t1;
            }
        }
        return Arrays.copyOf(out, o);
    }

    private static boolean insideQuad(double[] qx, double[] qy, double px, double py) {
        for (int k = 0; k < 4; k++) {
            int k1 = (k + 1) & 3;
            if ((qx[k1] - qx[k]) * (py - qy[k]) - (qy[k1] - qy[k]) * (px - qx[k]) < 0) {
                return false;
            }
        }
        return true;
    }

    /**
     * Adds ∫ ds, ∫ n ds and ∫ n nᵀ ds over the boundary for t in [t0, t1]. With m(t) = R(b cos t,
     * a sin t), the outward normal times |r'(t)|, n ds = m dt and n nᵀ ds = m mᵀ/|m| dt.
     */
    private void integrate(double t0, double t1, Planar.BoundarySum sum) {
        int pieces = (int) Math.ceil((t1 - t0) / MAX_ARC);
        double w = (t1 - t0) / pieces;
        for (int p = 0; p < pieces; p++) {
            double mid = t0 + (p + 0.5) * w;
            for (int g = 0; g < GL_X.length; g++) {
                double t = mid + 0.5 * w * GL_X[g];
                double wt = 0.5 * w * GL_W[g];
                double lx = b * Math.cos(t);
                double ly = a * Math.sin(t);
                double mx = cos * lx - sin * ly;
                double my = sin * lx + cos * ly;
                double len = Math.hypot(mx, my);
                sum.length += len * wt;
                sum.nx += mx * wt;
                sum.ny += my * wt;
                sum.nnxx += mx * mx / len * wt;
                sum.nnxy += mx * my / len * wt;
                sum.nnyy += my * my / len * wt;
            }
        }
    }

    @Override
    public Ellipse rotated(double angle, double pivotX, double pivotY) {
        double[] p = Shape.rotatePoint(centreX, centreY, angle, pivotX, pivotY);
        return new Ellipse(p[0], p[1], a, b, rotation + angle);
    }

    @Override
    public Ellipse translated(double dx, double dy) {
        return new Ellipse(centreX + dx, centreY + dy, a, b, rotation);
    }

    @Override
    public void spans(double y, SpanSink sink) {
        if (y < bounds.yMin() || y > bounds.yMax()) {
            return;
        }
        // (u/a)² + (v/b)² = 1 with u = c·dx + s·dy, v = −s·dx + c·dy, solved for dx
        double dy = y - centreY;
        double ia = 1 / (a * a);
        double ib = 1 / (b * b);
        double qa = cos * cos * ia + sin * sin * ib;
        double qb = 2 * dy * cos * sin * (ia - ib);
        double qc = dy * dy * (sin * sin * ia + cos * cos * ib) - 1;
        double disc = qb * qb - 4 * qa * qc;
        if (disc < 0) {
            return;
        }
        double sq = Math.sqrt(disc);
        sink.span(centreX + (-qb - sq) / (2 * qa), centreX + (-qb + sq) / (2 * qa));
    }

    @Override
    public void traceBoundary(Bounds window, double maxLength, SegmentSink sink) {
        if (!window.intersects(bounds)) {
            return;
        }
        double[] qx = new double[4];
        double[] qy = new double[4];
        toUnitFrame(window.xMin(), window.yMin(), window.xMax(), window.yMax(), qx, qy);
        double[] arcs = arcsInside(qx, qy);
        double big = Math.max(a, b);
        // a chord spanning dt in t is at most big·dt long, and the affine image of the circular
        // segment under it lies within big·(1 − cos(dt/2)) of the chord
        double dtMax = Math.min(MAX_ARC, maxLength / big);
        for (int k = 0; k + 1 < arcs.length; k += 2) {
            double t0 = arcs[k];
            double t1 = arcs[k + 1];
            int pieces = (int) Math.ceil((t1 - t0) / dtMax);
            double dt = (t1 - t0) / pieces;
            double margin = big * (1 - Math.cos(0.5 * dt)) + 1e-12 * big;
            double px = pointX(t0);
            double py = pointY(t0);
            for (int p = 1; p <= pieces; p++) {
                double t = p == pieces ? t1 : t0 + p * dt;
                double nx = pointX(t);
                double ny = pointY(t);
                sink.segment(px, py, nx, ny, margin);
                px = nx;
                py = ny;
            }
        }
    }

    private double pointX(double t) {
        return centreX + cos * a * Math.cos(t) - sin * b * Math.sin(t);
    }

    private double pointY(double t) {
        return centreY + sin * a * Math.cos(t) + cos * b * Math.sin(t);
    }

    @Override
    public String toString() {
        return String.format("ellipse with semi-axes %g and %g m centred on (%g, %g) m, rotated %g rad", a, b,
                centreX, centreY, rotation);
    }
}
