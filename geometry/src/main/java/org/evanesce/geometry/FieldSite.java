package org.evanesce.geometry;

/**
 * Where on the Yee cell an electric field component sits, in cell units relative to the node (i, j).
 * Materials are sampled (and later smoothed) separately for each site, because the
 * s polarization needs ε at the Ez site and the p polarization at the Ex and Ey sites.
 */
public enum FieldSite {
    /** Ez, at the node (i, j). */
    EZ(0.0, 0.0),
    /** Ex, at (i + 1/2, j). */
    EX(0.5, 0.0),
    /** Ey, at (i, j + 1/2). */
    EY(0.0, 0.5);

    /** Offset along x from the node, in cells. */
    public final double dx;
    /** Offset along y from the node, in cells. */
    public final double dy;

    FieldSite(double dx, double dy) {
        this.dx = dx;
        this.dy = dy;
    }
}
