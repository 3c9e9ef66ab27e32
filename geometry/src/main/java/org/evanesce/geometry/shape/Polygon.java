package org.evanesce.geometry.shape;

import java.util.Arrays;

/**
 * A simple polygon (a prism's cross-section): vertices in either orientation, convex or not,
 * edges that do not cross or touch except at shared vertices. A closing vertex equal to the first
 * is dropped. The constructor checks simplicity in O(V²) time.
 */
public final class Polygon implements Shape {

    private final double[] x;
    private final double[] y;
    private final int n;
    /** +1 when the vertices run counter-clockwise, −1 otherwise. */
    private final double orientation;
    private final double area;
    private final Bounds bounds;

    /**
     * @param xs vertex x coordinates, m (copied)
     * @param ys vertex y coordinates, m (copied)
     */
    public Polygon(double[] xs, double[] ys) {
        if (xs == null || ys == null || xs.length != ys.length) {
            throw new IllegalArgumentException(String.format("polygon: %d x coordinates but %d y coordinates",
                    xs == null ? 0 : xs.length, ys == null ? 0 : ys.length));
        }
        int m = xs.length;
        if (m > 1 && xs[0] == xs[m - 1] && ys[0] == ys[m - 1]) {
            m--;
        }
        if (m < 3) {
            throw new IllegalArgumentException(String.format("polygon: %d distinct vertices, need at least 3", m));
        }
        for (int k = 0; k < m; k++) {
            Checks.finite("polygon vertex " + k + " x", xs[k], "m");
            Checks.finite("polygon vertex " + k + " y", ys[k], "m");
        }
        x = Arrays.copyOf(xs, m);
        y = Arrays.copyOf(ys, m);
        n = m;
        for (int k = 0; k < n; k++) {
            int k1 = (k + 1) % n;
            if (x[k] == x[k1] && y[k] == y[k1]) {
                throw new IllegalArgumentException(String.format(
                        "polygon: vertices %d and %d coincide at (%g, %g) m", k, k1, x[k], y[k]));
            }
        }
        checkSimple();
        double a = Planar.signedArea(x, y, n);
        double xMin = Double.POSITIVE_INFINITY;
        double yMin = Double.POSITIVE_INFINITY;
        double xMax = Double.NEGATIVE_INFINITY;
        double yMax = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < n; k++) {
            xMin = Math.min(xMin, x[k]);
            xMax = Math.max(xMax, x[k]);
            yMin = Math.min(yMin, y[k]);
            yMax = Math.max(yMax, y[k]);
        }
        if (!(Math.abs(a) > 1e-12 * (xMax - xMin) * (yMax - yMin))) {
            throw new IllegalArgumentException(String.format("polygon: area %g m² must be > 0", Math.abs(a)));
        }
        orientation = Math.signum(a);
        area = Math.abs(a);
        bounds = new Bounds(xMin, yMin, xMax, yMax);
    }

    /** A polygon from alternating coordinates x0, y0, x1, y1, … in metres. */
    public static Polygon of(double... xy) {
        if (xy.length % 2 != 0) {
            throw new IllegalArgumentException(String.format(
                    "polygon: %d coordinates given, need an even number (x, y pairs)", xy.length));
        }
        double[] xs = new double[xy.length / 2];
        double[] ys = new double[xy.length / 2];
        for (int k = 0; k < xs.length; k++) {
            xs[k] = xy[2 * k];
            ys[k] = xy[2 * k + 1];
        }
        return new Polygon(xs, ys);
    }

    private void checkSimple() {
        for (int a = 0; a < n; a++) {
            int a1 = (a + 1) % n;
            for (int c = a + 1; c < n; c++) {
                int c1 = (c + 1) % n;
                boolean adjacent = c == a1 || c1 == a;
                if (adjacent) {
                    // neighbours share one vertex; they must not fold back along each other
                    int shared = c == a1 ? a1 : a;
                    int p = c == a1 ? a : a1;
                    int q = c == a1 ? c1 : c;
                    double ux = x[p] - x[shared];
                    double uy = y[p] - y[shared];
                    double vx = x[q] - x[shared];
                    double vy = y[q] - y[shared];
                    if (ux * vy - uy * vx == 0 && ux * vx + uy * vy > 0) {
                        throw new IllegalArgumentException(String.format(
                                "polygon: edges %d and %d overlap; the polygon must be simple", a, c));
                    }
                } else if (segmentsMeet(x[a], y[a], x[a1], y[a1], x[c], y[c], x[c1], y[c1])) {
                    throw new IllegalArgumentException(String.format(
                            "polygon: edges %d (%g, %g)–(%g, %g) m and %d (%g, %g)–(%g, %g) m cross or touch; "
                                    + "the polygon must be simple", a, x[a], y[a], x[a1], y[a1], c, x[c], y[c], x[c1],
                            y[c1]));
                }
            }
        }
    }

    private static double orient(double ax, double ay, double bx, double by, double cx, double cy) {
        return Math.signum((bx - ax) * (cy - ay) - (by - ay) * (cx - ax));
    }

    private static boolean onSegment(double ax, double ay, double bx, double by, double px, double py) {
        return Math.min(ax, bx) <= px && px <= Math.max(ax, bx) && Math.min(ay, by) <= py && py <= Math.max(ay, by);
    }

    /** Whether the closed segments ab and cd share a point (common practice: orientation tests). */
    private static boolean segmentsMeet(double ax, double ay, double bx, double by,
                                        double cx, double cy, double dx, double dy) {
        if (Math.max(ax, bx) < Math.min(cx, dx) || Math.max(cx, dx) < Math.min(ax, bx)
                || Math.max(ay, by) < Math.min(cy, dy) || Math.max(cy, dy) < Math.min(ay, by)) {
            return false;
        }
        double o1 = orient(ax, ay, bx, by, cx, cy);
        double o2 = orient(ax, ay, bx, by, dx, dy);
        double o3 = orient(cx, cy, dx, dy, ax, ay);
        double o4 = orient(cx, cy, dx, dy, bx, by);
        if (o1 != o2 && o3 != o4) {
            return true;
        }
        return (o1 == 0 && onSegment(ax, ay, bx, by, cx, cy)) || (o2 == 0 && onSegment(ax, ay, bx, by, dx, dy))
                || (o3 == 0 && onSegment(cx, cy, dx, dy, ax, ay)) || (o4 == 0 && onSegment(cx, cy, dx, dy, bx, by));
    }

    /** Number of vertices. */
    public int size() {
        return n;
    }

    /** x of vertex k, m. */
    public double x(int k) {
        return x[k];
    }

    /** y of vertex k, m. */
    public double y(int k) {
        return y[k];
    }

    /** Enclosed area, m². */
    public double area() {
        return area;
    }

    /** x of the area centroid, m. */
    public double centroidX() {
        return centroid()[0];
    }

    /** y of the area centroid, m. */
    public double centroidY() {
        return centroid()[1];
    }

    private double[] centroid() {
        double ox = x[0];
        double oy = y[0];
        double sx = 0;
        double sy = 0;
        double s = 0;
        for (int k = 0; k < n; k++) {
            int k1 = (k + 1) % n;
            double ax = x[k] - ox;
            double ay = y[k] - oy;
            double bx = x[k1] - ox;
            double by = y[k1] - oy;
            double cr = ax * by - bx * ay;
            s += cr;
            sx += (ax + bx) * cr;
            sy += (ay + by) * cr;
        }
        return new double[] {ox + sx / (3 * s), oy + sy / (3 * s)};
    }

    @Override
    public boolean contains(double px, double py) {
        if (!bounds.contains(px, py)) {
            return false;
        }
        boolean in = false;
        for (int k = 0, k0 = n - 1; k < n; k0 = k++) {
            if ((y[k] > py) != (y[k0] > py)) {
                double xc = x[k] + (x[k0] - x[k]) * (py - y[k]) / (y[k0] - y[k]);
                if (px <= xc) {
                    in = !in;
                }
            }
        }
        return in;
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
        Planar.BoundarySum sum = new Planar.BoundarySum();
        double[] range = new double[2];
        for (int k = 0; k < n; k++) {
            int k1 = k + 1 == n ? 0 : k + 1;
            double dx = x[k1] - x[k];
            double dy = y[k1] - y[k];
            if (Math.max(x[k], x[k1]) < x0 || Math.min(x[k], x[k1]) > x1
                    || Math.max(y[k], y[k1]) < y0 || Math.min(y[k], y[k1]) > y1) {
                continue;
            }
            range[0] = 0;
            range[1] = 1;
            if (Planar.narrowToBox(range, x[k], y[k], dx, dy, x0, y0, x1, y1)) {
                double len = Math.hypot(dx, dy);
                sum.add((range[1] - range[0]) * len, orientation * dy / len, -orientation * dx / len);
            }
        }
        if (sum.length == 0) {
            return contains(cx, cy) ? PixelCut.FULL : PixelCut.EMPTY;
        }
        double a = Math.abs(Planar.clippedArea(x, y, n, x0, y0, x1, y1));
        return sum.cut(a / (size * size));
    }

    @Override
    public Polygon rotated(double angle, double pivotX, double pivotY) {
        double[] xs = new double[n];
        double[] ys = new double[n];
        for (int k = 0; k < n; k++) {
            double[] p = Shape.rotatePoint(x[k], y[k], angle, pivotX, pivotY);
            xs[k] = p[0];
            ys[k] = p[1];
        }
        return new Polygon(xs, ys);
    }

    @Override
    public Polygon translated(double dx, double dy) {
        double[] xs = new double[n];
        double[] ys = new double[n];
        for (int k = 0; k < n; k++) {
            xs[k] = x[k] + dx;
            ys[k] = y[k] + dy;
        }
        return new Polygon(xs, ys);
    }

    @Override
    public void spans(double py, SpanSink sink) {
        if (py < bounds.yMin() || py > bounds.yMax()) {
            return;
        }
        double[] xs = new double[n];
        int m = 0;
        for (int k = 0, k0 = n - 1; k < n; k0 = k++) {
            if ((y[k] > py) != (y[k0] > py)) {
                xs[m++] = x[k] + (x[k0] - x[k]) * (py - y[k]) / (y[k0] - y[k]);
            }
        }
        Arrays.sort(xs, 0, m);
        for (int q = 0; q + 1 < m; q += 2) {
            sink.span(xs[q], xs[q + 1]);
        }
    }

    @Override
    public void traceBoundary(Bounds window, double maxLength, SegmentSink sink) {
        if (!window.intersects(bounds)) {
            return;
        }
        double[] range = new double[2];
        for (int k = 0; k < n; k++) {
            int k1 = k + 1 == n ? 0 : k + 1;
            double dx = x[k1] - x[k];
            double dy = y[k1] - y[k];
            range[0] = 0;
            range[1] = 1;
            if (!Planar.narrowToBox(range, x[k], y[k], dx, dy, window.xMin(), window.yMin(), window.xMax(),
                    window.yMax())) {
                continue;
            }
            double len = Math.hypot(dx, dy) * (range[1] - range[0]);
            int pieces = (int) Math.max(1, Math.ceil(len / maxLength));
            double step = (range[1] - range[0]) / pieces;
            for (int q = 0; q < pieces; q++) {
                double t0 = range[0] + q * step;
                double t1 = q + 1 == pieces ? range[1] : t0 + step;
                sink.segment(x[k] + t0 * dx, y[k] + t0 * dy, x[k] + t1 * dx, y[k] + t1 * dy, 0);
            }
        }
    }

    @Override
    public String toString() {
        return String.format("polygon of %d vertices, bounds [%g, %g] × [%g, %g] m", n, bounds.xMin(), bounds.xMax(),
                bounds.yMin(), bounds.yMax());
    }
}
