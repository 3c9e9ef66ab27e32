package org.evanesce.io.output.image;

import java.io.IOException;
import java.nio.file.Path;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.MaterialGrid;

/**
 * A quick-look picture of one field component on the grid, with the colour scale chosen from what
 * the values are:
 * <ul>
 *   <li>{@link Quantity#REAL}, a signed component such as Ez at one instant: the diverging
 *       {@link ColourMap#SHOAL} over ±max|v|, so zero is the map's middle colour; bar label
 *       "Ez (V/m)";</li>
 *   <li>{@link Quantity#MAGNITUDE}, values ≥ 0 such as |Ez| of a phasor: the sequential
 *       {@link ColourMap#LUMEN} from the minimum to the maximum; bar label "|Ez| (V/m)";</li>
 *   <li>with {@link #logScale} (either quantity): log10|v| over the top decades on
 *       {@link ColourMap#LUMEN}, bar label "|Ez| (V/m), log scale".</li>
 * </ul>
 * Material outlines ({@link #outlines}) are drawn over the field. Everything else is as for
 * {@link Heatmap}: values {@code v[j*nx + i]} (not copied, not modified) at grid node (i, j) plus
 * the site's offset, axes in a {@link DisplayUnit} chosen from the extent unless given.
 *
 * <p>Collects settings; {@link #heatmap()} builds the picture and {@link #writePng} writes it
 * atomically.
 */
public final class FieldPicture {

    /** What the values are, which decides the colour map. */
    public enum Quantity {
        /** A real, signed field component: diverging map centred on zero. */
        REAL,
        /** A magnitude, |v| ≥ 0: sequential map. */
        MAGNITUDE
    }

    private final Heatmap.Builder builder;
    private final GridSpec grid;
    private final String component;
    private final String fieldUnit;
    private final Quantity quantity;
    private FieldSite site = FieldSite.EZ;
    private double logDecades = Double.NaN;
    /** What the values are divided by, e.g. "|E_inc|", or null when they carry their unit. */
    private String per;

    private FieldPicture(Heatmap.Builder builder, GridSpec grid, String component, String fieldUnit, Quantity quantity) {
        if (component == null || component.isBlank()) {
            throw new IllegalArgumentException("field picture: the component name (e.g. \"Ez\") must be given");
        }
        if (quantity == null) {
            throw new IllegalArgumentException("field picture of " + component + ": the quantity must be given");
        }
        this.builder = builder.grid(grid).downsampling(Heatmap.Downsampling.LARGEST_MAGNITUDE);
        this.grid = grid;
        this.component = component.strip();
        this.fieldUnit = fieldUnit == null ? "" : fieldUnit.strip();
        this.quantity = quantity;
    }

    /**
     * A picture of {@code values[j*nx + i]} on {@code grid}'s nodes (the Ez site; see {@link #site}
     * and {@link #offset} for others).
     *
     * @param component the component's name, e.g. "Ez", without magnitude bars
     * @param fieldUnit the values' unit, e.g. "V/m"; empty for none
     * @throws IllegalArgumentException if the array length is not the grid's nx·ny
     */
    public static FieldPicture of(double[] values, GridSpec grid, String component, String fieldUnit, Quantity quantity) {
        return new FieldPicture(Heatmap.builder(values, grid.nx(), grid.ny()), grid, component, fieldUnit, quantity);
    }

    /** As {@link #of(double[], GridSpec, String, String, Quantity)}, for single-precision fields. */
    public static FieldPicture of(float[] values, GridSpec grid, String component, String fieldUnit, Quantity quantity) {
        return new FieldPicture(Heatmap.builder(values, grid.nx(), grid.ny()), grid, component, fieldUnit, quantity);
    }

    /**
     * The values lie at {@code s} of each cell: the picture is shifted by the site's offset, and
     * {@link #outlines(MaterialGrid)} takes the ids at that site. Default {@link FieldSite#EZ}.
     */
    public FieldPicture site(FieldSite s) {
        if (s == null) {
            throw new IllegalArgumentException("field picture of " + component + ": the site must be given");
        }
        site = s;
        return offset(s.dx, s.dy);
    }

    /**
     * The values lie at node (i, j) plus (dx, dy) cells, for components off the electric sites
     * (e.g. ½, ½ for Hz); keeps the site used for outlines.
     */
    public FieldPicture offset(double dxCells, double dyCells) {
        double d = grid.cellSize();
        builder.origin(grid.x0() + dxCells * d, grid.y0() + dyCells * d);
        return this;
    }

    /** Outlines where the material ids of {@code materials} at this picture's {@link #site} change. */
    public FieldPicture outlines(MaterialGrid materials) {
        builder.outlines(materials, site);
        return this;
    }

    /** Outlines where {@code materialIds[j*nx + i]} change (not copied); null for none. */
    public FieldPicture outlines(int[] materialIds) {
        builder.outlines(materialIds);
        return this;
    }

    /** log10|v| over the top {@code decades} decades below the maximum (see {@link Heatmap.Builder#logScale}). */
    public FieldPicture logScale(double decades) {
        builder.logScale(decades);
        logDecades = decades;
        return this;
    }

    /** The title line; empty (the default) for none. */
    public FieldPicture title(String text) {
        builder.title(text);
        return this;
    }

    /**
     * The values are ratios to {@code reference} (e.g. "|E_inc|"): the colour bar reads "Ez/|E_inc|" or
     * "|E|/|E_inc|" and shows no unit.
     */
    public FieldPicture relativeTo(String reference) {
        per = reference == null || reference.isBlank() ? null : reference.strip();
        return this;
    }

    /** The unit of the axes, e.g. the case's length unit; by default chosen from the extent. */
    public FieldPicture axisUnit(DisplayUnit unit) {
        builder.unit(unit);
        return this;
    }

    /** How large grids are reduced; by default the largest magnitude of each block, which keeps field peaks. */
    public FieldPicture downsampling(Heatmap.Downsampling d) {
        builder.downsampling(d);
        return this;
    }

    /**
     * The colour bar's label: "Ez (V/m)", "|Ez| (V/m)" or "|Ez| (V/m), log scale"; relative to a reference
     * "Ez/|E_inc|" or "|E|/|E_inc|, log scale".
     */
    public String colourBarLabel() {
        boolean log = !Double.isNaN(logDecades);
        String name = (quantity == Quantity.REAL && !log ? component : "|" + component + "|") + (per == null ? "" : "/" + per);
        String unit = fieldUnit.isEmpty() || per != null ? "" : " (" + fieldUnit + ")";
        return name + unit + (log ? ", log scale" : "");
    }

    /** The colour map the picture uses. */
    public ColourMap colourMap() {
        return quantity == Quantity.REAL && Double.isNaN(logDecades) ? ColourMap.SHOAL : ColourMap.LUMEN;
    }

    /** Builds the heat map. */
    public Heatmap heatmap() {
        return builder.colourMap(colourMap()).colourBarLabel(colourBarLabel()).build();
    }

    /**
     * Draws the picture and writes it as a PNG, atomically (see {@link Heatmap#writePng}).
     *
     * @return the absolute path written
     */
    public Path writePng(Path file) throws IOException {
        return heatmap().writePng(file);
    }
}
