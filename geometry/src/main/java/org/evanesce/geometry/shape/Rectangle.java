package org.evanesce.geometry.shape;

/**
 * A rectangle of given width and height centred on (centreX, centreY), rotated counter-clockwise
 * by {@code rotation} radians about its centre: the width lies along (cos θ, sin θ) and the height
 * along (−sin θ, cos θ).
 */
public final class Rectangle implements Shape {

    private final double centreX;
    private final double centreY;
    private final double width;
    private final double height;
    private final double rotation;
    private final ConvexRegion region;
    private final Bounds bounds;

    /**
     * @param centreX  x of the centre, m
     * @param centreY  y of the centre, m
     * @param width    side along the rotated x axis, m; finite and &gt; 0
     * @param height   side along the rotated y axis, m; finite and &gt; 0
     * @param rotation counter-clockwise angle, radians; finite
     */
    public Rectangle(double centreX, double centreY, double width, double height, double rotation) {
        this.centreX = Checks.finite("rectangle centre x", centreX, "m");
        this.centreY = Checks.finite("rectangle centre y", centreY, "m");
        this.width = Checks.positive("rectangle width", width, "m");
        this.height = Checks.positive("rectangle height", height, "m");
        this.rotation = Checks.finite("rectangle rotation", rotation, "rad");
        double c = Math.cos(rotation);
        double s = Math.sin(rotation);
        double uc = c * centreX + s * centreY;
        double vc = -s * centreX + c * centreY;
        region = new ConvexRegion(new double[] {c, -c, -s, s}, new double[] {s, -s, c, -c},
                new double[] {uc + 0.5 * width, -uc + 0.5 * width, vc + 0.5 * height, -vc + 0.5 * height});
        double hx = 0.5 * (Math.abs(c) * width + Math.abs(s) * height);
        double hy = 0.5 * (Math.abs(s) * width + Math.abs(c) * height);
        bounds = new Bounds(centreX - hx, centreY - hy, centreX + hx, centreY + hy);
    }

    /** The axis-aligned rectangle [x0, x1] × [y0, y1] (corners in any order, sides &gt; 0). */
    public static Rectangle ofCorners(double x0, double y0, double x1, double y1) {
        return new Rectangle(0.5 * (x0 + x1), 0.5 * (y0 + y1), Math.abs(x1 - x0), Math.abs(y1 - y0), 0);
    }

    public double centreX() {
        return centreX;
    }

    public double centreY() {
        return centreY;
    }

    public double width() {
        return width;
    }

    public double height() {
        return height;
    }

    /** Counter-clockwise angle, radians. */
    public double rotation() {
        return rotation;
    }

    @Override
    public boolean contains(double x, double y) {
        return region.contains(x, y);
    }

    @Override
    public Bounds bounds() {
        return bounds;
    }

    @Override
    public PixelCut cut(double cx, double cy, double size) {
        return region.cut(cx, cy, size);
    }

    @Override
    public Rectangle rotated(double angle, double pivotX, double pivotY) {
        double[] p = Shape.rotatePoint(centreX, centreY, angle, pivotX, pivotY);
        return new Rectangle(p[0], p[1], width, height, rotation + angle);
    }

    @Override
    public Rectangle translated(double dx, double dy) {
        return new Rectangle(centreX + dx, centreY + dy, width, height, rotation);
    }

    @Override
    public void spans(double y, SpanSink sink) {
        if (y >= bounds.yMin() && y <= bounds.yMax()) {
            region.spans(y, sink);
        }
    }

    @Override
    public void traceBoundary(Bounds window, double maxLength, SegmentSink sink) {
        if (window.intersects(bounds)) {
            region.traceBoundary(window, maxLength, sink);
        }
    }

    @Override
    public String toString() {
        return String.format("rectangle %g × %g m centred on (%g, %g) m, rotated %g rad", width, height, centreX,
                centreY, rotation);
    }
}
