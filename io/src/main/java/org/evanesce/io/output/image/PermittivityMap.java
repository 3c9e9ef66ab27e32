package org.evanesce.io.output.image;

import java.util.List;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;

/**
 * The geometry preview: the rasterised relative permittivity at one electric site of a
 * {@link MaterialGrid}, as a {@link Heatmap} on the {@link ColourMap#LUMEN} map.
 */
public final class PermittivityMap {

    private PermittivityMap() {
    }

    /**
     * Relative permittivity at {@code site} of every cell, {@code eps[j*nx + i]}; a new array. A perfect conductor,
     * which has none, is NaN (drawn in the map's missing-value colour).
     */
    public static double[] values(MaterialGrid grid, FieldSite site) {
        List<Material> table = grid.materials();
        double[] byId = new double[table.size()];
        for (int m = 0; m < byId.length; m++) {
            byId[m] = table.get(m).isPerfectConductor() ? Double.NaN : table.get(m).relativePermittivity();
        }
        int[] ids = grid.ids(site);
        double[] eps = new double[ids.length];
        for (int k = 0; k < ids.length; k++) {
            eps[k] = byId[ids[k]];
        }
        return eps;
    }

    /**
     * A heat map of the permittivity at {@code site}, placed where that site lies (the node
     * position plus the site's offset), with the colour bar labelled
     * "relative permittivity (Ez site)" (or Ex, Ey). Title and unit can still be set.
     */
    public static Heatmap.Builder builder(MaterialGrid grid, FieldSite site) {
        double d = grid.cellSize();
        return Heatmap.builder(values(grid, site), grid.nx(), grid.ny())
                .origin(grid.x0() + site.dx * d, grid.y0() + site.dy * d)
                .cellSize(d)
                .colourMap(ColourMap.LUMEN)
                .colourBarLabel("relative permittivity (" + siteName(site) + " site)");
    }

    /** "Ez", "Ex" or "Ey". */
    static String siteName(FieldSite site) {
        String n = site.name();
        return n.charAt(0) + n.substring(1).toLowerCase(java.util.Locale.ROOT);
    }
}
