package org.evanesce.geometry.shape;

/**
 * The infinite strip {r : 0 ≤ (r − p)·n ≤ thickness} between two parallel lines: its lower face
 * passes through the point p and the unit normal n points from the lower face to the upper one.
 * Layer stacks expand into slabs.
 */
public final class Slab implements Shape {

    private final double pointX;
    private final double pointY;
    private final double normalX;
    private final double normalY;
    private final double thickness;
    private final ConvexRegion region;

    /**
     * @param pointX    x of a point on the lower face, m
     * @param pointY    y of a point on the lower face, m
     * @param normalX   x of the direction across the slab (any non-zero length)
     * @param normalY   y of the direction across the slab
     * @param thickness distance between the faces, m; finite and &gt; 0
     */
    public Slab(double pointX, double pointY, double normalX, double normalY, double thickness) {
        this.pointX = Checks.finite("slab point x", pointX, "m");
        this.pointY = Checks.finite("slab point y", pointY, "m");
        double[] n = Checks.direction("slab normal", normalX, normalY);
        this.normalX = n[0];
        this.normalY = n[1];
        this.thickness = Checks.positive("slab thickness", thickness, "m");
        double s0 = n[0] * pointX + n[1] * pointY;
        region = new ConvexRegion(new double[] {n[0], -n[0]}, new double[] {n[1], -n[1]},
                new double[] {s0 + thickness, -s0});
    }

    public double pointX() {
        return pointX;
    }

    public double pointY() {
        return pointY;
    }

    /** x of the unit normal, from the lower face to the upper one. */
    public double normalX() {
        return normalX;
    }

    /** y of the unit normal. */
    public double normalY() {
        return normalY;
    }

    /** Distance between the faces, m. */
    public double thickness() {
        return thickness;
    }

    @Override
    public boolean contains(double x, double y) {
        return region.contains(x, y);
    }

    @Override
    public Bounds bounds() {
        double inf = Double.POSITIVE_INFINITY;
        if (normalY == 0) {
            double a = pointX;
            double c = pointX + normalX * thickness;
            return new Bounds(Math.min(a, c), -inf, Math.max(a, c), inf);
        }
        if (normalX == 0) {
            double a = pointY;
            double c = pointY + normalY * thickness;
            return new Bounds(-inf, Math.min(a, c), inf, Math.max(a, c));
        }
        return Bounds.EVERYWHERE;
    }

    @Override
    public PixelCut cut(double centreX, double centreY, double size) {
        return region.cut(centreX, centreY, size);
    }

    @Override
    public Slab rotated(double angle, double pivotX, double pivotY) {
        double[] p = Shape.rotatePoint(pointX, pointY, angle, pivotX, pivotY);
        double[] n = Shape.rotatePoint(normalX, normalY, angle, 0, 0);
        return new Slab(p[0], p[1], n[0], n[1], thickness);
    }

    @Override
    public Slab translated(double dx, double dy) {
        return new Slab(pointX + dx, pointY + dy, normalX, normalY, thickness);
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
        return String.format("slab from (%g, %g) m along (%g, %g), %g m thick", pointX, pointY, normalX, normalY,
                thickness);
    }
}
