package org.evanesce.geometry.shape;

/**
 * The intersection of half-planes a_k·r ≤ b_k with unit outward normals a_k: the common core of
 * {@link HalfPlane}, {@link Slab} and {@link Rectangle}. Immutable; the arrays are owned.
 */
final class ConvexRegion {

    private final double[] ax;
    private final double[] ay;
    private final double[] b;

    /** Takes ownership of the arrays; each (ax[k], ay[k]) must be a unit vector. */
    ConvexRegion(double[] ax, double[] ay, double[] b) {
        this.ax = ax;
        this.ay = ay;
        this.b = b;
    }

    boolean contains(double x, double y) {
        for (int k = 0; k < b.length; k++) {
            if (ax[k] * x + ay[k] * y > b[k]) {
                return false;
            }
        }
        return true;
    }

    void spans(double y, Shape.SpanSink sink) {
        double lo = Double.NEGATIVE_INFINITY;
        double hi = Double.POSITIVE_INFINITY;
        for (int k = 0; k < b.length; k++) {
            double rhs = b[k] - ay[k] * y;
            if (ax[k] > 0) {
                hi = Math.min(hi, rhs / ax[k]);
            } else if (ax[k] < 0) {
                lo = Math.max(lo, rhs / ax[k]);
            } else if (rhs < 0) {
                return;
            }
        }
        if (lo <= hi) {
            sink.span(lo, hi);
        }
    }

    PixelCut cut(double cx, double cy, double size) {
        double h = 0.5 * size;
        double x0 = cx - h;
        double x1 = cx + h;
        double y0 = cy - h;
        double y1 = cy + h;
        int n = b.length;
        boolean[] active = new boolean[n];
        boolean any = false;
        for (int k = 0; k < n; k++) {
            // the extreme values of a·r − b over the square's corners
            double mid = ax[k] * cx + ay[k] * cy - b[k];
            double spread = h * (Math.abs(ax[k]) + Math.abs(ay[k]));
            if (mid - spread >= 0) {
                return PixelCut.EMPTY;
            }
            if (mid + spread > 0) {
                active[k] = true;
                any = true;
            }
        }
        if (!any) {
            return PixelCut.FULL;
        }
        double[] px = {x0, x1, x1, x0};
        double[] py = {y0, y0, y1, y1};
        int m = 4;
        for (int k = 0; k < n && m > 0; k++) {
            if (active[k]) {
                double[] qx = new double[m + 1];
                double[] qy = new double[m + 1];
                m = Planar.clipHalfPlane(px, py, m, ax[k], ay[k], b[k], qx, qy);
                px = qx;
                py = qy;
            }
        }
        double area = Math.abs(Planar.signedArea(px, py, m));
        Planar.BoundarySum sum = new Planar.BoundarySum();
        double[] range = new double[2];
        for (int k = 0; k < n; k++) {
            if (active[k] && lineRange(k, cx, cy, x0, y0, x1, y1, range, 1e-12 * size)) {
                sum.add(range[1] - range[0], ax[k], ay[k]);
            }
        }
        return sum.cut(area / (size * size));
    }

    /**
     * The parameter range of the part of line k inside the box and inside the other half-planes,
     * parametrised by arc length from the foot of the perpendicular from (cx, cy). Returns false
     * when empty.
     */
    private boolean lineRange(int k, double cx, double cy, double x0, double y0, double x1, double y1,
                              double[] range, double slack) {
        double dist = ax[k] * cx + ay[k] * cy - b[k];
        double px = cx - dist * ax[k];
        double py = cy - dist * ay[k];
        double dx = -ay[k];
        double dy = ax[k];
        range[0] = Double.NEGATIVE_INFINITY;
        range[1] = Double.POSITIVE_INFINITY;
        if (!Planar.narrowToBox(range, px, py, dx, dy, x0, y0, x1, y1)) {
            return false;
        }
        for (int j = 0; j < b.length; j++) {
            if (j != k && !Planar.narrow(range, px, py, dx, dy, ax[j], ay[j], b[j], slack)) {
                return false;
            }
        }
        return true;
    }

    void traceBoundary(Bounds window, double maxLength, Shape.SegmentSink sink) {
        double cx = 0.5 * (window.xMin() + window.xMax());
        double cy = 0.5 * (window.yMin() + window.yMax());
        double[] range = new double[2];
        double slack = 1e-12 * Math.max(window.xMax() - window.xMin(), window.yMax() - window.yMin());
        for (int k = 0; k < b.length; k++) {
            if (!lineRange(k, cx, cy, window.xMin(), window.yMin(), window.xMax(), window.yMax(), range, slack)) {
                continue;
            }
            double dist = ax[k] * cx + ay[k] * cy - b[k];
            double px = cx - dist * ax[k];
            double py = cy - dist * ay[k];
            double dx = -ay[k];
            double dy = ax[k];
            int pieces = (int) Math.max(1, Math.ceil((range[1] - range[0]) / maxLength));
            double step = (range[1] - range[0]) / pieces;
            for (int q = 0; q < pieces; q++) {
                double t0 = range[0] + q * step;
                double t1 = q + 1 == pieces ? range[1] : t0 + step;
                sink.segment(px + t0 * dx, py + t0 * dy, px + t1 * dx, py + t1 * dy, 0);
            }
        }
    }
}
