package org.evanesce.geometry.shape;

/**
 * A region of the plane, lengths in metres, angles in radians counter-clockwise. Shapes are
 * immutable closed sets (their boundary belongs to them) and answer what rasterisation needs:
 * point tests, a bounding box, the filled fraction and interface orientation of a square pixel,
 * the inside intervals of a horizontal line, and a trace of the boundary that finds cut pixels.
 *
 * <p>Accuracy of {@link #cut}: exact to rounding for every shape here (half-planes, slabs and
 * rectangles by clipping the pixel with half-planes, polygons by Sutherland–Hodgman clipping,
 * ellipses by the exact area of a disk cut by a parallelogram after an affine map to the unit
 * circle; the ellipse's orientation tensor by 4-point Gauss–Legendre quadrature on arcs of at
 * most π/16, relative error below 1e-9).
 */
public sealed interface Shape permits HalfPlane, Slab, Rectangle, Polygon, Ellipse {

    /** Whether (x, y), in metres, lies in the shape (boundary included, up to rounding). */
    boolean contains(double x, double y);

    /** A box containing the shape; sides may be infinite. */
    Bounds bounds();

    /**
     * The part of the square pixel of side {@code size} centred on (centreX, centreY) that the shape
     * fills, with the orientation of its boundary inside the pixel (see {@link PixelCut}).
     */
    PixelCut cut(double centreX, double centreY, double size);

    /** This shape rotated by {@code angle} radians counter-clockwise about (pivotX, pivotY). */
    Shape rotated(double angle, double pivotX, double pivotY);

    /** This shape moved by (dx, dy) metres. */
    Shape translated(double dx, double dy);

    /**
     * Reports the closed intervals [xFrom, xTo] of the horizontal line at height y that lie in the
     * shape, in increasing order and not overlapping. Ends may be infinite.
     */
    void spans(double y, SpanSink sink);

    /**
     * Reports straight segments, each at most {@code maxLength} long, such that every boundary
     * point inside {@code window} (a finite box) lies within the segment's {@code margin} of one of
     * them. Straight-edged shapes report pieces of their edges with margin 0; curved ones report
     * chords with the largest sag as margin.
     */
    void traceBoundary(Bounds window, double maxLength, SegmentSink sink);

    /** Receives inside intervals of a line; see {@link #spans}. */
    @FunctionalInterface
    interface SpanSink {
        void span(double xFrom, double xTo);
    }

    /** Receives boundary pieces; see {@link #traceBoundary}. */
    @FunctionalInterface
    interface SegmentSink {
        void segment(double x1, double y1, double x2, double y2, double margin);
    }

    /** Rotates (x, y) by {@code angle} about (px, py); returns {x', y'}. */
    static double[] rotatePoint(double x, double y, double angle, double px, double py) {
        double c = Math.cos(angle);
        double s = Math.sin(angle);
        double dx = x - px;
        double dy = y - py;
        return new double[] {px + c * dx - s * dy, py + s * dx + c * dy};
    }
}
