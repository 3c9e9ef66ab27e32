package org.evanesce.geometry.shape;

/**
 * An axis-aligned box [xMin, xMax] × [yMin, yMax] in metres that contains a shape. Sides may be
 * infinite (a half-plane or a slab is unbounded along its faces).
 *
 * @param xMin smallest x, m (may be −∞)
 * @param yMin smallest y, m (may be −∞)
 * @param xMax largest x, m (may be +∞)
 * @param yMax largest y, m (may be +∞)
 */
public record Bounds(double xMin, double yMin, double xMax, double yMax) {

    /** The whole plane. */
    public static final Bounds EVERYWHERE = new Bounds(Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY,
            Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY);

    public Bounds {
        if (Double.isNaN(xMin) || Double.isNaN(yMin) || Double.isNaN(xMax) || Double.isNaN(yMax)) {
            throw new IllegalArgumentException(String.format(
                    "bounds [%g, %g] × [%g, %g] m must not contain NaN", xMin, xMax, yMin, yMax));
        }
        if (xMin > xMax || yMin > yMax) {
            throw new IllegalArgumentException(String.format(
                    "bounds [%g, %g] × [%g, %g] m: each minimum must not exceed its maximum", xMin, xMax, yMin, yMax));
        }
    }

    /** Whether the closed boxes share at least one point. */
    public boolean intersects(Bounds o) {
        return xMin <= o.xMax && o.xMin <= xMax && yMin <= o.yMax && o.yMin <= yMax;
    }

    /** Whether (x, y) lies in the closed box. */
    public boolean contains(double x, double y) {
        return x >= xMin && x <= xMax && y >= yMin && y <= yMax;
    }

    /** Whether all four sides are finite. */
    public boolean isFinite() {
        return Double.isFinite(xMin) && Double.isFinite(yMin) && Double.isFinite(xMax) && Double.isFinite(yMax);
    }

    /** This box grown by {@code margin} on every side. */
    public Bounds expandedBy(double margin) {
        return new Bounds(xMin - margin, yMin - margin, xMax + margin, yMax + margin);
    }
}
