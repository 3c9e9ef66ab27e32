package org.evanesce.io.output.image;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.MaterialGrid;

/**
 * A quick-look picture of a scalar on the grid: the values as coloured cells, x and y axes with
 * lengths in a display unit, a colour bar with its own ticks and label, and a title line.
 *
 * <p>Values are row-major, {@code v[j*nx + i]}: i along x, j along y, y up, so row j = 0 is drawn
 * at the bottom. Value (i, j) is the sample at (x0 + iΔ, y0 + jΔ) metres and is drawn as the
 * Δ × Δ square centred there, so the picture spans [x0 − Δ/2, x0 + (nx − ½)Δ] along x.
 *
 * <p>Pixel size: grids whose longer side is at most {@value #MAX_PLOT_SIDE} cells are drawn with
 * every cell an s × s block of pixels, s a whole number chosen to bring the longer side near
 * {@value #TARGET_PLOT_SIDE} pixels (nearest-neighbour upscaling, so cells stay visible); larger
 * grids are reduced by a whole factor k so that the longer side fits, each pixel showing a k × k
 * block of cells by its {@link Downsampling}. Cells are always square.
 *
 * <p>Colour: the value range is given, or taken from the finite values (minimum to maximum for a
 * {@linkplain ColourMap.Kind#SEQUENTIAL sequential} map, ±max|v| for a
 * {@linkplain ColourMap.Kind#DIVERGING diverging} one). Values beyond the range take the end
 * colours; NaN takes the map's missing colour and the bar then shows a swatch with the count of NaN
 * cells. If every finite value is equal the picture is one colour (the map's middle) and the bar
 * has a single tick.
 *
 * <p>Log scale ({@link Builder#logScale}): the picture shows log10|v| over the top d decades below
 * the largest finite |v|, on a sequential map: t = (log10|v| − (log10 max|v| − d)) / d, so
 * 10<sup>−k</sup>·max|v| sits at t = 1 − k/d. Zero and magnitudes below the floor take the bottom
 * colour; NaN is drawn as above. The colour bar is ticked at powers of ten (labels such as "1e-3",
 * or plain "0.01" … "1000" when every tick lies in that span). When a large grid is reduced, MEAN
 * averages |v| over the block before the logarithm. A field that is zero everywhere is drawn in the
 * floor colour with an empty bar.
 *
 * <p>Material outlines ({@link Builder#outlines}): given one material id per value, a line is drawn
 * over the cells along every edge shared by two neighbouring cells (along x or y) of different ids.
 * The line is one pixel wide and lies on the cell on the +x side of the edge (for edges across x)
 * or on the +y side (for edges across y): with s × s pixels per cell, in that cell's leftmost
 * pixel column or bottom pixel row. On reduced grids a pixel is outlined when any cell of its
 * k × k block has a left or lower neighbour of another id (boundaries along the block's own left
 * and bottom sides included), so a straight boundary is still a one-pixel line. Each outline pixel
 * is drawn dashed ({@link #onDash}: {@value #DASH_ON} pixels on, then off up to {@value #DASH_PERIOD},
 * counted along x for an outline pixel with an outline pixel beside it in its row, else along y, so
 * horizontal, vertical and stepped lines are all dashed) and semi-transparent: a
 * dark grey laid over light colours, a light grey over dark ones, each at {@value #OUTLINE_OPACITY}
 * opacity ({@link #outlineColour}), so the field stays visible under the line and the line reads on
 * both ends of every map.
 *
 * <p>Text is drawn with {@link PixelFont}, so nothing depends on installed fonts; the picture is
 * built in a {@link BufferedImage} of type {@code TYPE_INT_RGB} and written by {@link PngFile}, which
 * works with {@code -Djava.awt.headless=true}.
 *
 * <p>Immutable once built. The value array is <em>not</em> copied (field arrays can be large):
 * do not change it while the heat map is in use.
 */
public final class Heatmap {

    /** How one pixel shows a block of cells when a large grid is reduced. */
    public enum Downsampling {
        /** The mean of the block; NaN if any cell of the block is NaN. */
        MEAN,
        /** The value of largest magnitude, sign kept (keeps peaks of oscillating fields); NaN as for MEAN. */
        LARGEST_MAGNITUDE
    }

    /** Longer side, in pixels, that small grids are upscaled towards. */
    public static final int TARGET_PLOT_SIDE = 640;
    /** Longer side, in pixels, beyond which grids are reduced. */
    public static final int MAX_PLOT_SIDE = 1000;
    /** Oklab lightness of a drawn colour from which its outline is dark rather than light. */
    static final double OUTLINE_SWITCH = 0.6;
    /** Outline ink over light colours: a dark grey. */
    static final int OUTLINE_DARK = 0x262626;
    /** Outline ink over dark colours: a light grey. */
    static final int OUTLINE_LIGHT = 0xf2f2f2;
    /** Opacity of the outline ink over the colour under it (sRGB components blended). */
    static final double OUTLINE_OPACITY = 0.75;
    /** Length of one dash and the gap after it, pixels. */
    static final int DASH_PERIOD = 6;
    /** Pixels drawn of each dash period. */
    static final int DASH_ON = 4;

    private final double[] doubles;
    private final float[] floats;
    private final int nx;
    private final int ny;
    private final double x0;
    private final double y0;
    private final double cellSize;
    private final DisplayUnit unit;
    private final String title;
    private final String barLabel;
    private final ColourMap colourMap;
    private final double rangeLow;
    private final double rangeHigh;
    private final Downsampling downsampling;
    private final int[] outlineIds;
    private final double logDecades;

    private Heatmap(Builder b) {
        doubles = b.doubles;
        floats = b.floats;
        nx = b.nx;
        ny = b.ny;
        x0 = b.x0;
        y0 = b.y0;
        cellSize = b.cellSize;
        unit = b.unit != null ? b.unit : DisplayUnit.forExtent(Math.max(nx, ny) * cellSize);
        title = b.title;
        barLabel = b.barLabel;
        colourMap = b.colourMap;
        rangeLow = b.rangeLow;
        rangeHigh = b.rangeHigh;
        downsampling = b.downsampling;
        outlineIds = b.outlineIds;
        logDecades = b.logDecades;
    }

    /**
     * Starts a heat map of {@code values[j*nx + i]} (not copied, not modified).
     *
     * @throws IllegalArgumentException if nx or ny is below 1 or the array length is not nx·ny
     */
    public static Builder builder(double[] values, int nx, int ny) {
        checkSize(values.length, nx, ny);
        return new Builder(values, null, nx, ny);
    }

    /** As {@link #builder(double[], int, int)}, for single-precision fields. */
    public static Builder builder(float[] values, int nx, int ny) {
        checkSize(values.length, nx, ny);
        return new Builder(null, values, nx, ny);
    }

    private static void checkSize(int length, int nx, int ny) {
        if (nx < 1 || ny < 1 || (long) nx * ny != length) {
            throw new IllegalArgumentException(String.format(
                    "heat map of %d × %d cells needs nx, ny ≥ 1 and an array of nx·ny values, but it has %d",
                    nx, ny, length));
        }
    }

    /** Value (i, j). */
    double value(int i, int j) {
        int k = j * nx + i;
        return doubles != null ? doubles[k] : floats[k];
    }

    /** Cells along x. */
    public int nx() {
        return nx;
    }

    /** Cells along y. */
    public int ny() {
        return ny;
    }

    /** x of value (0, 0), m. */
    public double x0() {
        return x0;
    }

    /** y of value (0, 0), m. */
    public double y0() {
        return y0;
    }

    /** Δ, m. */
    public double cellSize() {
        return cellSize;
    }

    /** The unit of the axis labels (chosen from the extent unless one was given). */
    public DisplayUnit unit() {
        return unit;
    }

    /** The title line; empty for none. */
    public String title() {
        return title;
    }

    /** The colour bar's label; empty for none. */
    public String colourBarLabel() {
        return barLabel;
    }

    /** The colour map. */
    public ColourMap colourMap() {
        return colourMap;
    }

    /** How large grids are reduced. */
    public Downsampling downsampling() {
        return downsampling;
    }

    /** The given lower end of the colour range, or NaN when it comes from the data. */
    double rangeLow() {
        return rangeLow;
    }

    /** The given upper end of the colour range, or NaN when it comes from the data. */
    double rangeHigh() {
        return rangeHigh;
    }

    /** The material id of cell (i, j); only when {@link #hasOutlines()}. */
    int outlineId(int i, int j) {
        return outlineIds[j * nx + i];
    }

    /** Whether material outlines are drawn. */
    public boolean hasOutlines() {
        return outlineIds != null;
    }

    /** Whether the picture shows log10|v| ({@link Builder#logScale}). */
    public boolean isLogScale() {
        return !Double.isNaN(logDecades);
    }

    /** Decades shown below the maximum on a log scale; NaN on a linear one. */
    public double logDecades() {
        return logDecades;
    }

    /**
     * The outline colour drawn over a pixel of colour {@code under} (0xRRGGBB): {@link #OUTLINE_DARK} or
     * {@link #OUTLINE_LIGHT}, chosen by the lightness under it, blended over it at {@link #OUTLINE_OPACITY}.
     */
    static int outlineColour(int under) {
        int ink = Oklab.fromRgb(under)[0] >= OUTLINE_SWITCH ? OUTLINE_DARK : OUTLINE_LIGHT;
        int out = 0;
        for (int shift = 16; shift >= 0; shift -= 8) {
            double u = (under >> shift) & 0xff;
            double o = (ink >> shift) & 0xff;
            out |= (int) Math.round(OUTLINE_OPACITY * o + (1 - OUTLINE_OPACITY) * u) << shift;
        }
        return out;
    }

    /** Whether an outline pixel at plot position {@code along} (x or y, see the class comment) is drawn. */
    static boolean onDash(int along) {
        return along % DASH_PERIOD < DASH_ON;
    }

    /** Where everything goes; package-private for tests. */
    HeatmapLayout layout() {
        return new HeatmapLayout(this);
    }

    /** Draws the picture. */
    public BufferedImage render() {
        return layout().draw().toImage();
    }

    /**
     * Writes the picture as a PNG file, atomically: it is written under a temporary name in the
     * same folder and renamed onto {@code file} when complete, replacing an earlier file of that
     * name; after a failure no temporary file is left. Missing parent folders are created.
     *
     * @return the absolute path written
     */
    public Path writePng(Path file) throws IOException {
        return PngFile.write(render(), file);
    }

    /** Collects the settings of a heat map; only the cell size must be given. */
    public static final class Builder {
        private final double[] doubles;
        private final float[] floats;
        private final int nx;
        private final int ny;
        private double x0;
        private double y0;
        private double cellSize = Double.NaN;
        private DisplayUnit unit;
        private String title = "";
        private String barLabel = "";
        private ColourMap colourMap = ColourMap.LUMEN;
        private double rangeLow = Double.NaN;
        private double rangeHigh = Double.NaN;
        private Downsampling downsampling = Downsampling.MEAN;
        private int[] outlineIds;
        private double logDecades = Double.NaN;

        private Builder(double[] doubles, float[] floats, int nx, int ny) {
            this.doubles = doubles;
            this.floats = floats;
            this.nx = nx;
            this.ny = ny;
        }

        /** Position of value (0, 0), m; default (0, 0). */
        public Builder origin(double x, double y) {
            if (!Double.isFinite(x) || !Double.isFinite(y)) {
                throw new IllegalArgumentException(String.format("heat map origin (%g, %g) m must be finite", x, y));
            }
            x0 = x;
            y0 = y;
            return this;
        }

        /** Δ, the spacing of the values along x and y, m; finite and &gt; 0. */
        public Builder cellSize(double metres) {
            if (!(metres > 0) || Double.isInfinite(metres)) {
                throw new IllegalArgumentException(String.format(
                        "heat map cell size %g m must be finite and > 0", metres));
            }
            cellSize = metres;
            return this;
        }

        /**
         * Origin and cell size of {@code grid}, for values at its nodes (the Ez site); add the site
         * offset to the origin for other sites.
         *
         * @throws IllegalArgumentException if the grid's node counts are not nx × ny
         */
        public Builder grid(GridSpec grid) {
            if (grid.nx() != nx || grid.ny() != ny) {
                throw new IllegalArgumentException(String.format(
                        "grid of %d × %d nodes does not match the %d × %d values", grid.nx(), grid.ny(), nx, ny));
            }
            origin(grid.x0(), grid.y0());
            return cellSize(grid.cellSize());
        }

        /** The unit of the axis labels; by default chosen from the extent ({@link DisplayUnit#forExtent}). */
        public Builder unit(DisplayUnit u) {
            unit = u;
            return this;
        }

        /** The title line (the first line of the text, cut to {@link PixelFont#MAX_TITLE_CHARACTERS}); empty (the default) for none. */
        public Builder title(String text) {
            title = PixelFont.titleLine(text);
            return this;
        }

        /** The colour bar's label, e.g. "relative permittivity (Ez site)"; empty for none. */
        public Builder colourBarLabel(String text) {
            barLabel = text == null ? "" : text.strip();
            return this;
        }

        /** The colour map; default {@link ColourMap#LUMEN}. */
        public Builder colourMap(ColourMap map) {
            if (map == null) {
                throw new IllegalArgumentException("heat map colour map must be given");
            }
            colourMap = map;
            return this;
        }

        /** A fixed colour range instead of one from the data; finite with low &lt; high. */
        public Builder range(double low, double high) {
            if (!Double.isFinite(low) || !Double.isFinite(high) || !(high > low)) {
                throw new IllegalArgumentException(String.format(
                        "heat map colour range [%g, %g]: need finite ends with the upper above the lower", low, high));
            }
            rangeLow = low;
            rangeHigh = high;
            return this;
        }

        /** How large grids are reduced; default {@link Downsampling#MEAN}. */
        public Builder downsampling(Downsampling d) {
            if (d == null) {
                throw new IllegalArgumentException("heat map downsampling must be given");
            }
            downsampling = d;
            return this;
        }

        /**
         * Draws material outlines from {@code materialIds[j*nx + i]}, one id per value (not copied,
         * not modified; only equality of ids matters); null for none (the default).
         *
         * @throws IllegalArgumentException if the array length is not nx·ny
         */
        public Builder outlines(int[] materialIds) {
            if (materialIds != null && materialIds.length != (long) nx * ny) {
                throw new IllegalArgumentException(String.format(
                        "heat map of %d × %d cells: outline ids need nx·ny = %d values, but there are %d",
                        nx, ny, (long) nx * ny, materialIds.length));
            }
            outlineIds = materialIds;
            return this;
        }

        /**
         * Outlines from the material ids of {@code materials} at {@code site}; pick the site of the
         * field shown (Ez, Ex or Ey), or the nearest one for other components.
         *
         * @throws IllegalArgumentException if the grid's node counts are not nx × ny
         */
        public Builder outlines(MaterialGrid materials, FieldSite site) {
            if (materials.nx() != nx || materials.ny() != ny) {
                throw new IllegalArgumentException(String.format(
                        "material grid of %d × %d nodes does not match the %d × %d values",
                        materials.nx(), materials.ny(), nx, ny));
            }
            return outlines(materials.ids(site));
        }

        /**
         * Shows log10|v| over the top {@code decades} decades below the largest finite |v| (see
         * the class comment); needs a sequential map and no fixed {@link #range}.
         *
         * @param decades finite, &gt; 0 and at most 300
         */
        public Builder logScale(double decades) {
            if (!(decades > 0 && decades <= 300)) {
                throw new IllegalArgumentException(String.format(
                        "heat map log scale of %g decades: need a number > 0 and at most 300", decades));
            }
            logDecades = decades;
            return this;
        }

        /**
         * @throws IllegalStateException if no cell size was given, or a log scale was asked for
         *                               with a diverging map or a fixed range
         */
        public Heatmap build() {
            if (Double.isNaN(cellSize)) {
                throw new IllegalStateException("heat map: the cell size was not given");
            }
            if (!Double.isNaN(logDecades) && colourMap.kind() != ColourMap.Kind.SEQUENTIAL) {
                throw new IllegalStateException("heat map: a log scale shows magnitudes and needs a sequential map, not "
                        + colourMap);
            }
            if (!Double.isNaN(logDecades) && !Double.isNaN(rangeLow)) {
                throw new IllegalStateException(String.format(
                        "heat map: a log scale takes its top from the data; a fixed range [%g, %g] cannot be combined with it",
                        rangeLow, rangeHigh));
            }
            return new Heatmap(this);
        }
    }
}
