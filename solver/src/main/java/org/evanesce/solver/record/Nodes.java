package org.evanesce.solver.record;

import org.evanesce.solver.grid.Component;

/**
 * Moves a component's values from its staggered sites to the cell nodes (x0 + iΔ, y0 + jΔ), so that
 * every component of a picture or a field file shares one grid: a site half a cell off along x is
 * the mean of the two sites either side of the node, likewise along y (Hz, half a cell off along
 * both, the mean of four). At the region's lower edges, where the neighbour below or to the left is
 * outside, the one site inside is used. Common practice for viewing staggered grids.
 */
public final class Nodes {

    private Nodes() {
    }

    /**
     * @param v values at the component's sites in a w × h region, row-major ((j·w) + i), site (i, j)
     *          being the component's site of node (i0 + i, j0 + j)
     * @return the node values, a new array
     */
    public static double[] average(Component c, double[] v, int w, int h) {
        if (v.length != w * h) {
            throw new IllegalArgumentException(String.format("%d values for a %d x %d region", v.length, w, h));
        }
        boolean halfX = c.dx != 0;
        boolean halfY = c.dy != 0;
        double[] out = new double[v.length];
        for (int j = 0; j < h; j++) {
            for (int i = 0; i < w; i++) {
                int il = halfX && i > 0 ? i - 1 : i;
                int jl = halfY && j > 0 ? j - 1 : j;
                out[j * w + i] = 0.25 * (v[j * w + i] + v[j * w + il] + v[jl * w + i] + v[jl * w + il]);
            }
        }
        return out;
    }
}
