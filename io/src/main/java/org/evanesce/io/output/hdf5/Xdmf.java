package org.evanesce.io.output.hdf5;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * XDMF 3 documents (an open XML standard read by general viewers) that describe 2D field datasets
 * written by {@link Hdf5Writer}, so that a viewer opens a time series, or several maps, as one dataset.
 *
 * <p>Each {@link Grid} is a uniform mesh: a {@code 3DCoRectMesh} with one Z layer, node-centred
 * values, {@code Dimensions="1 ny nx"} matching the HDF5 shape {@code [ny][nx]}. XDMF writes every
 * triple slowest axis first (Z Y X), so the {@code ORIGIN_DXDYDZ} geometry holds origin
 * {@code "0 y0 x0"} and spacing {@code "d d d"}: the z spacing of a single layer is never used, but
 * it is given the cell size rather than 0 so that no reader sees a degenerate cell. A 2D field so
 * described lands in the viewer's XY plane, node (i, j) at (x0 + i·d, y0 + j·d).
 *
 * <p>A layer of a {@link FieldStack} (shape {@code [n][ny][nx]}) is selected with an XDMF
 * {@code HyperSlab} data item whose first child holds start, stride and count (slowest axis first)
 * and whose second names the whole 3D dataset.
 *
 * <p>Documents are returned as strings (UTF-8 XML, all names escaped); write them next to the HDF5
 * files, since file names in them are relative to the {@code .xmf} file's folder.
 */
public final class Xdmf {

    /**
     * One uniform 2D grid.
     *
     * @param name       the grid's name shown by viewers
     * @param time       the time of a frame in a temporal collection; {@code Double.NaN} for none
     * @param nx         nodes along x, at least 1
     * @param ny         nodes along y, at least 1
     * @param x0         x of node (0, 0)
     * @param y0         y of node (0, 0)
     * @param spacing    distance between neighbouring nodes, the same along x and y; positive
     * @param attributes the node-centred scalar fields on this grid, distinct names
     */
    public record Grid(String name, double time, int nx, int ny, double x0, double y0, double spacing,
            List<Attribute> attributes) {

        /** @throws IllegalArgumentException naming the grid and the value at fault */
        public Grid {
            if (name == null || name.isEmpty()) {
                throw new IllegalArgumentException("an XDMF grid needs a name");
            }
            if (nx < 1 || ny < 1) {
                throw new IllegalArgumentException("XDMF grid " + name + ": nx = " + nx + ", ny = " + ny
                        + "; both must be at least 1");
            }
            if (Double.isInfinite(time) || !Double.isFinite(x0) || !Double.isFinite(y0)) {
                throw new IllegalArgumentException(String.format(
                        "XDMF grid %s: time %g, x0 %g, y0 %g must be finite (time may be NaN: none)", name, time, x0, y0));
            }
            if (!(spacing > 0) || !Double.isFinite(spacing)) {
                throw new IllegalArgumentException(String.format(
                        "XDMF grid %s: spacing %g must be positive and finite", name, spacing));
            }
            attributes = List.copyOf(attributes);
            Set<String> names = new HashSet<>();
            for (Attribute a : attributes) {
                if (!names.add(a.name())) {
                    throw new IllegalArgumentException("XDMF grid " + name + ": attribute " + a.name() + " appears twice");
                }
            }
        }

        /** A grid without time, for {@link #spatial}. */
        public Grid(String name, int nx, int ny, double x0, double y0, double spacing, List<Attribute> attributes) {
            this(name, Double.NaN, nx, ny, x0, y0, spacing, attributes);
        }

        /** Whether this grid carries a time. */
        public boolean hasTime() {
            return !Double.isNaN(time);
        }
    }

    /**
     * One node-centred scalar field stored in an HDF5 file: a whole 2D dataset, or one layer of a
     * {@link FieldStack} (an XDMF {@code HyperSlab} of the 3D dataset: start {@code layer 0 0},
     * stride {@code 1 1 1}, count {@code 1 ny nx}).
     *
     * @param name      the field's name shown by viewers
     * @param file      the HDF5 file, relative to the folder of the {@code .xmf} file, '/' separated; no ':'
     * @param dataset   the dataset's path in that file, e.g. {@code /E_z} (a leading '/' is added if missing)
     * @param precision 4 (float32) or 8 (float64), as stored
     * @param layer     the layer of a 3D dataset, from 0; -1 for a 2D dataset
     * @param layers    the 3D dataset's layer count, above {@code layer}; 0 for a 2D dataset
     */
    public record Attribute(String name, String file, String dataset, int precision, int layer, int layers) {

        /** @throws IllegalArgumentException naming the attribute and the value at fault */
        public Attribute {
            if (name == null || name.isEmpty()) {
                throw new IllegalArgumentException("an XDMF attribute needs a name");
            }
            if (file == null || file.isEmpty() || file.contains(":") || file.startsWith("/")) {
                throw new IllegalArgumentException("XDMF attribute " + name + ": file '" + file
                        + "' must be a relative path without ':'");
            }
            if (dataset == null || dataset.isEmpty() || dataset.contains(":")) {
                throw new IllegalArgumentException("XDMF attribute " + name + ": dataset '" + dataset
                        + "' must be a path in the HDF5 file without ':'");
            }
            if (!dataset.startsWith("/")) {
                dataset = "/" + dataset;
            }
            if (precision != 4 && precision != 8) {
                throw new IllegalArgumentException("XDMF attribute " + name + ": precision " + precision
                        + " must be 4 (float32) or 8 (float64)");
            }
            if (!(layer == -1 && layers == 0) && !(layer >= 0 && layer < layers)) {
                throw new IllegalArgumentException("XDMF attribute " + name + ": layer " + layer + " of " + layers
                        + "; expected -1 of 0 (a 2D dataset) or 0 <= layer < layers");
            }
        }

        /** A whole 2D dataset. */
        public Attribute(String name, String file, String dataset, int precision) {
            this(name, file, dataset, precision, -1, 0);
        }

        /** The attribute for a 2D dataset written by {@link Hdf5Writer} to {@code file}. */
        public static Attribute of(String name, String file, FieldDataset dataset) {
            return new Attribute(name, file, dataset.name(), dataset.precision().bytes());
        }

        /** The attribute for layer {@code layer} of a stack written by {@link Hdf5Writer} to {@code file}. */
        public static Attribute of(String name, String file, FieldStack stack, int layer) {
            return new Attribute(name, file, stack.name(), stack.precision().bytes(), layer, stack.layers().size());
        }

        /** Whether this is one layer of a 3D dataset. */
        public boolean isLayer() {
            return layer >= 0;
        }
    }

    private Xdmf() {
    }

    /**
     * A time series: one temporal collection whose frames are shown as one dataset changing in time.
     *
     * @param frames at least one grid, each with a time, times strictly increasing
     * @throws IllegalArgumentException if a frame has no time or times do not increase
     */
    public static String temporal(String name, List<Grid> frames) {
        if (frames == null || frames.isEmpty()) {
            throw new IllegalArgumentException("XDMF time series " + name + " needs at least one frame");
        }
        double last = Double.NEGATIVE_INFINITY;
        for (Grid g : frames) {
            if (!g.hasTime()) {
                throw new IllegalArgumentException("XDMF time series " + name + ": frame " + g.name() + " has no time");
            }
            if (!(g.time() > last)) {
                throw new IllegalArgumentException(String.format(
                        "XDMF time series %s: frame %s at time %g does not come after %g", name, g.name(), g.time(), last));
            }
            last = g.time();
        }
        return document(name, "Temporal", frames);
    }

    /**
     * Several grids in one document, e.g. the real and imaginary parts of a frequency-domain map on
     * one grid and the permittivity map on another. Fields on the same nodes belong in one grid with
     * several attributes; separate grids suit fields on different nodes (staggered components).
     * Viewers read the grids as pieces of one dataset (ParaView 5.11: a vtkMultiPieceDataSet, each
     * piece with its own fields) and draw overlapping pieces over each other.
     *
     * @param grids at least one grid; their times, if any, are written too
     */
    public static String spatial(String name, List<Grid> grids) {
        if (grids == null || grids.isEmpty()) {
            throw new IllegalArgumentException("XDMF collection " + name + " needs at least one grid");
        }
        return document(name, "Spatial", grids);
    }

    private static String document(String name, String collectionType, List<Grid> grids) {
        if (name == null || name.isEmpty()) {
            throw new IllegalArgumentException("an XDMF collection needs a name");
        }
        StringBuilder s = new StringBuilder(1024 + 1024 * grids.size());
        s.append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
        s.append("<Xdmf Version=\"3.0\">\n");
        s.append("  <Domain>\n");
        s.append("    <Grid Name=\"").append(escape(name)).append("\" GridType=\"Collection\" CollectionType=\"")
                .append(collectionType).append("\">\n");
        for (Grid g : grids) {
            grid(s, g);
        }
        s.append("    </Grid>\n");
        s.append("  </Domain>\n");
        s.append("</Xdmf>\n");
        return s.toString();
    }

    private static void grid(StringBuilder s, Grid g) {
        String dims = "1 " + g.ny() + " " + g.nx();
        String d = number(g.spacing());
        s.append("      <Grid Name=\"").append(escape(g.name())).append("\" GridType=\"Uniform\">\n");
        if (g.hasTime()) {
            s.append("        <Time Value=\"").append(number(g.time())).append("\"/>\n");
        }
        s.append("        <Topology TopologyType=\"3DCoRectMesh\" Dimensions=\"").append(dims).append("\"/>\n");
        s.append("        <Geometry GeometryType=\"ORIGIN_DXDYDZ\">\n");
        s.append("          <DataItem Name=\"Origin\" Format=\"XML\" NumberType=\"Float\" Precision=\"8\" Dimensions=\"3\">")
                .append("0 ").append(number(g.y0())).append(' ').append(number(g.x0())).append("</DataItem>\n");
        s.append("          <DataItem Name=\"Spacing\" Format=\"XML\" NumberType=\"Float\" Precision=\"8\" Dimensions=\"3\">")
                .append(d).append(' ').append(d).append(' ').append(d).append("</DataItem>\n");
        s.append("        </Geometry>\n");
        for (Attribute a : g.attributes()) {
            s.append("        <Attribute Name=\"").append(escape(a.name()))
                    .append("\" AttributeType=\"Scalar\" Center=\"Node\">\n");
            if (a.isLayer()) {
                s.append("          <DataItem ItemType=\"HyperSlab\" Type=\"HyperSlab\" Dimensions=\"").append(dims).append("\">\n");
                s.append("            <DataItem Format=\"XML\" NumberType=\"Int\" Dimensions=\"3 3\">")
                        .append(a.layer()).append(" 0 0 1 1 1 1 ").append(g.ny()).append(' ').append(g.nx())
                        .append("</DataItem>\n");
                s.append("            <DataItem Format=\"HDF\" NumberType=\"Float\" Precision=\"").append(a.precision())
                        .append("\" Dimensions=\"").append(a.layers()).append(' ').append(g.ny()).append(' ').append(g.nx())
                        .append("\">").append(escape(a.file())).append(':').append(escape(a.dataset())).append("</DataItem>\n");
                s.append("          </DataItem>\n");
            } else {
                s.append("          <DataItem Format=\"HDF\" NumberType=\"Float\" Precision=\"").append(a.precision())
                        .append("\" Dimensions=\"").append(dims).append("\">")
                        .append(escape(a.file())).append(':').append(escape(a.dataset())).append("</DataItem>\n");
            }
            s.append("        </Attribute>\n");
        }
        s.append("      </Grid>\n");
    }

    /** Shortest text that reads back as the same double ({@link Double#toString}, e.g. {@code 1.0E-6}). */
    private static String number(double v) {
        return v == 0 ? "0" : Double.toString(v);
    }

    /** Escapes text for XML element content and double-quoted attribute values; rejects characters XML 1.0 cannot hold. */
    static String escape(String text) {
        StringBuilder s = new StringBuilder(text.length() + 8);
        for (int k = 0; k < text.length(); k++) {
            char c = text.charAt(k);
            switch (c) {
                case '&' -> s.append("&amp;");
                case '<' -> s.append("&lt;");
                case '>' -> s.append("&gt;");
                case '"' -> s.append("&quot;");
                case '\'' -> s.append("&apos;");
                case '\t', '\n', '\r' -> s.append("&#").append((int) c).append(';');
                default -> {
                    if (c < 0x20 || c == 0xFFFE || c == 0xFFFF) {
                        throw new IllegalArgumentException(String.format(
                                "character U+%04X in '%s' cannot appear in XML 1.0", (int) c, text));
                    }
                    s.append(c);
                }
            }
        }
        return s.toString();
    }
}
