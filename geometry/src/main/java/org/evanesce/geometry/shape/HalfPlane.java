package org.evanesce.geometry.shape;

/**
 * The half-plane {r : (r − p)·n ≤ 0} bounded by the line through the point p with outward unit
 * normal n (the normal points away from the filled side).
 */
public final class HalfPlane implements Shape {

    private final double pointX;
    private final double pointY;
    private final double normalX;
    private final double normalY;
    private final ConvexRegion region;

    /**
     * @param pointX  x of a point on the boundary line, m
     * @param pointY  y of a point on the boundary line, m
     * @param normalX x of the outward normal (any non-zero length; it is normalised)
     * @param normalY y of the outward normal
     */
    public HalfPlane(double pointX, double pointY, double normalX, double normalY) {
        this.pointX = Checks.finite("half-plane point x", pointX, "m");
        this.pointY = Checks.finite("half-plane point y", pointY, "m");
        double[] n = Checks.direction("half-plane outward normal", normalX, normalY);
        this.normalX = n[0];
        this.normalY = n[1];
        region = new ConvexRegion(new double[] {n[0]}, new double[] {n[1]},
                new double[] {n[0] * pointX + n[1] * pointY});
    }

    /**
     * The half-plane to the left of the directed line from (x1, y1) to (x2, y2), i.e. on the
     * counter-clockwise side; its outward normal is the direction rotated clockwise.
     */
    public static HalfPlane leftOf(double x1, double y1, double x2, double y2) {
        Checks.finite("half-plane line start x", x1, "m");
        Checks.finite("half-plane line start y", y1, "m");
        Checks.finite("half-plane line end x", x2, "m");
        Checks.finite("half-plane line end y", y2, "m");
        if (x1 == x2 && y1 == y2) {
            throw new IllegalArgumentException(String.format(
                    "half-plane line from (%g, %g) m to (%g, %g) m: the two points must differ", x1, y1, x2, y2));
        }
        return new HalfPlane(x1, y1, y2 - y1, -(x2 - x1));
    }

    public double pointX() {
        return pointX;
    }

    public double pointY() {
        return pointY;
    }

    /** x of the unit outward normal. */
    public double normalX() {
        return normalX;
    }

    /** y of the unit outward normal. */
    public double normalY() {
        return normalY;
    }

    @Override
    public boolean contains(double x, double y) {
        return region.contains(x, y);
    }

    @Override
    public Bounds bounds() {
        double inf = Double.POSITIVE_INFINITY;
        if (normalY == 0) {
            return normalX > 0 ? new Bounds(-inf, -inf, pointX, inf) : new Bounds(pointX, -inf, inf, inf);
        }
        if (normalX == 0) {
            return normalY > 0 ? new Bounds(-inf, -inf, inf, pointY) : new Bounds(-inf, pointY, inf, inf);
        }
        return Bounds.EVERYWHERE;
    }

    @Override
    public PixelCut cut(double centreX, double centreY, double size) {
        return region.cut(centreX, centreY, size);
    }

    @Override
    public HalfPlane rotated(double angle, double pivotX, double pivotY) {
        double[] p = Shape.rotatePoint(pointX, pointY, angle, pivotX, pivotY);
        double[] n = Shape.rotatePoint(normalX, normalY, angle, 0, 0);
        return new HalfPlane(p[0], p[1], n[0], n[1]);
    }

    @Override
    public HalfPlane translated(double dx, double dy) {
        return new HalfPlane(pointX + dx, pointY + dy, normalX, normalY);
    }

    @Override
    public void spans(double y, SpanSink sink) {
        region.spans(y, sink);
    }

    @Override
    public void traceBoundary(Bounds window, double maxLength, SegmentSink sink) {
        region.traceBoundary(window, maxLength, sink);
    }

    @Override
    public String toString() {
        return String.format("half-plane through (%g, %g) m, outward normal (%g, %g)", pointX, pointY, normalX, normalY);
    }
}
