package org.evanesce.geometry;

import org.evanesce.geometry.shape.Bounds;

/**
 * Where the Yee grid lies in the scene: node (i, j) is at (x0 + iΔ, y0 + jΔ) metres, for
 * 0 ≤ i &lt; nx and 0 ≤ j &lt; ny. The electric sites are offset from the nodes as in
 * {@link FieldSite}.
 *
 * @param x0       x of node (0, 0), m; finite
 * @param y0       y of node (0, 0), m; finite
 * @param cellSize Δ, m; finite and &gt; 0
 * @param nx       nodes along x, at least 3
 * @param ny       nodes along y, at least 3
 */
public record GridSpec(double x0, double y0, double cellSize, int nx, int ny) {

    public GridSpec {
        if (!Double.isFinite(x0) || !Double.isFinite(y0)) {
            throw new IllegalArgumentException(String.format("grid origin (%g, %g) m must be finite", x0, y0));
        }
        if (!(cellSize > 0) || Double.isInfinite(cellSize)) {
            throw new IllegalArgumentException(String.format("grid cell size %g m must be finite and > 0", cellSize));
        }
        if (nx < 3 || ny < 3) {
            throw new IllegalArgumentException(String.format(
                    "grid %d × %d nodes: need at least 3 along each axis", nx, ny));
        }
        if ((long) nx * ny > Integer.MAX_VALUE - 64) {
            throw new IllegalArgumentException(String.format(
                    "grid %d × %d has more cells than one Java array can index (%d)", nx, ny, Integer.MAX_VALUE - 64));
        }
    }

    /**
     * The grid of cell size Δ whose node (0, 0) is at (xMin, yMin) and whose last node is the first
     * at or beyond (xMax, yMax): nx = ⌈(xMax − xMin)/Δ⌉ + 1 (to within 1e-9 of a cell), likewise ny.
     */
    public static GridSpec covering(double xMin, double yMin, double xMax, double yMax, double cellSize) {
        if (!(cellSize > 0) || Double.isInfinite(cellSize)) {
            throw new IllegalArgumentException(String.format("grid cell size %g m must be finite and > 0", cellSize));
        }
        if (!(xMax > xMin) || !(yMax > yMin) || !Double.isFinite(xMax - xMin) || !Double.isFinite(yMax - yMin)) {
            throw new IllegalArgumentException(String.format(
                    "grid extent [%g, %g] × [%g, %g] m must be finite with each maximum above its minimum",
                    xMin, xMax, yMin, yMax));
        }
        double cx = Math.ceil((xMax - xMin) / cellSize - 1e-9);
        double cy = Math.ceil((yMax - yMin) / cellSize - 1e-9);
        if (cx + 1 > Integer.MAX_VALUE || cy + 1 > Integer.MAX_VALUE) {
            throw new IllegalArgumentException(String.format(
                    "grid extent %g × %g m at cell size %g m needs too many cells", xMax - xMin, yMax - yMin, cellSize));
        }
        return new GridSpec(xMin, yMin, cellSize, (int) cx + 1, (int) cy + 1);
    }

    /** x of node column i, m. */
    public double x(int i) {
        return x0 + i * cellSize;
    }

    /** y of node row j, m. */
    public double y(int j) {
        return y0 + j * cellSize;
    }

    /** x of the given site of cell (i, j), m. */
    public double siteX(FieldSite site, int i) {
        return x0 + (i + site.dx) * cellSize;
    }

    /** y of the given site of cell (i, j), m. */
    public double siteY(FieldSite site, int j) {
        return y0 + (j + site.dy) * cellSize;
    }

    /** The box from node (0, 0) to node (nx − 1, ny − 1). */
    public Bounds nodeBounds() {
        return new Bounds(x0, y0, x(nx - 1), y(ny - 1));
    }
}
