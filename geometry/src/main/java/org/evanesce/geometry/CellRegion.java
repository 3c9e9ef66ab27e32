package org.evanesce.geometry;

/**
 * A set of points of the plane, in cell units: x = i and y = j at the Yee node (i, j).
 * Used to paint materials onto a {@link MaterialGrid} point by point, without smoothing.
 */
@FunctionalInterface
public interface CellRegion {

    /** Whether the point (x, y), in cell units, lies inside. */
    boolean contains(double x, double y);

    /** The half-plane x ≥ x0. */
    static CellRegion rightOf(double x0) {
        return (x, y) -> x >= x0;
    }

    /** The half-plane y ≤ y0. */
    static CellRegion below(double y0) {
        return (x, y) -> y <= y0;
    }

    /** The closed box [x0, x1] × [y0, y1]. */
    static CellRegion box(double x0, double y0, double x1, double y1) {
        return (x, y) -> x >= x0 && x <= x1 && y >= y0 && y <= y1;
    }
}
