package org.evanesce.geometry;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The materials of a scene sampled on an nx × ny Yee grid: for each electric field site
 * ({@link FieldSite}) a material index per cell, {@code id[j*nx + i]}, into a table of
 * materials. Cells cut by an interface may carry their own (smoothed) table entry; equal materials
 * share one entry.
 *
 * <p>Ids are stored in 16 bits (2 bytes per site) while the table holds at most 65 536
 * materials and in 32 bits beyond that, so smoothed grids with long interfaces fit.
 *
 * <p>Immutable; build it with {@link #builder}.
 */
public final class MaterialGrid {

    /** Most materials whose ids fit the 16-bit storage. */
    static final int NARROW_LIMIT = 1 << 16;

    private final GridSpec spec;
    private final List<Material> table;
    /** Per site (by ordinal): 16-bit ids, or null when {@link #wide} is used. */
    private final char[][] narrow;
    private final int[][] wide;
    /** The smoothed inverse permittivity's off-diagonal element at cut in-plane sites. */
    private final CrossTerms crossTerms;

    private MaterialGrid(GridSpec spec, List<Material> table, char[][] narrow, int[][] wide, CrossTerms crossTerms) {
        this.spec = spec;
        this.table = List.copyOf(table);
        this.narrow = narrow;
        this.wide = wide;
        this.crossTerms = crossTerms;
    }

    /** The off-diagonal element of the inverse permittivity where smoothing gave one ({@link CrossTerms#NONE} if none). */
    public CrossTerms crossTerms() {
        return crossTerms;
    }

    /** Number of nodes along x. */
    public int nx() {
        return spec.nx();
    }

    /** Number of nodes along y. */
    public int ny() {
        return spec.ny();
    }

    /** Cell size Δ (equal along x and y), in metres. */
    public double cellSize() {
        return spec.cellSize();
    }

    /** x of node (0, 0), m (0 unless the grid was built from a {@link GridSpec} that says otherwise). */
    public double x0() {
        return spec.x0();
    }

    /** y of node (0, 0), m. */
    public double y0() {
        return spec.y0();
    }

    /** Origin, cell size and node counts. */
    public GridSpec spec() {
        return spec;
    }

    /** The distinct materials referenced by the grid, indexed by material id. */
    public List<Material> materials() {
        return table;
    }

    /** Material id at a site of cell (i, j). */
    public int id(FieldSite site, int i, int j) {
        int k = j * spec.nx() + i;
        return narrow != null ? narrow[site.ordinal()][k] : wide[site.ordinal()][k];
    }

    /** Material at a site of cell (i, j). */
    public Material material(FieldSite site, int i, int j) {
        return table.get(id(site, i, j));
    }

    /** A copy of the ids at one site, {@code ids[j*nx + i]}. */
    public int[] ids(FieldSite site) {
        if (narrow == null) {
            return wide[site.ordinal()].clone();
        }
        char[] a = narrow[site.ordinal()];
        int[] out = new int[a.length];
        for (int k = 0; k < a.length; k++) {
            out[k] = a[k];
        }
        return out;
    }

    /** The smallest relative permittivity anywhere on the grid (it sets the stability limit). */
    public double minPermittivity() {
        double m = Double.POSITIVE_INFINITY;
        for (Material mat : table) {
            m = Math.min(m, mat.relativePermittivity());
        }
        return m;
    }

    /** A builder with node (0, 0) at the origin whose every site starts as {@code background}. */
    public static Builder builder(int nx, int ny, double cellSize, Material background) {
        if (nx < 3 || ny < 3) {
            throw new IllegalArgumentException(String.format(
                    "grid %d × %d: need at least 3 nodes along each axis", nx, ny));
        }
        return new Builder(new GridSpec(0, 0, cellSize, nx, ny), background);
    }

    /** A builder on the given grid whose every site starts as {@code background}. */
    public static Builder builder(GridSpec spec, Material background) {
        return new Builder(spec, background);
    }

    /** Paints materials site by site; later paints win. */
    public static final class Builder {
        private final GridSpec spec;
        private final int nx;
        private final int ny;
        private final List<Material> table = new ArrayList<>();
        private final Map<Material, Integer> index = new HashMap<>();
        private char[][] narrow = new char[FieldSite.values().length][];
        private int[][] wide;
        private CrossTerms crossTerms = CrossTerms.NONE;

        private Builder(GridSpec spec, Material background) {
            if (background == null) {
                throw new IllegalArgumentException("background material must be given");
            }
            this.spec = spec;
            this.nx = spec.nx();
            this.ny = spec.ny();
            idOf(background);
            for (int s = 0; s < narrow.length; s++) {
                narrow[s] = new char[nx * ny];
            }
        }

        /** Sets every site whose position (in cell units) lies in {@code region} to {@code material}. */
        public Builder paint(CellRegion region, Material material) {
            int id = idOf(material);
            for (FieldSite s : FieldSite.values()) {
                for (int j = 0; j < ny; j++) {
                    int row = j * nx;
                    for (int i = 0; i < nx; i++) {
                        if (region.contains(i + s.dx, j + s.dy)) {
                            put(s, row + i, id);
                        }
                    }
                }
            }
            return this;
        }

        /** Sets one site of cell (i, j) to {@code material}. */
        public Builder set(FieldSite site, int i, int j, Material material) {
            if (i < 0 || i >= nx || j < 0 || j >= ny) {
                throw new IndexOutOfBoundsException(String.format("cell (%d, %d) outside %d × %d", i, j, nx, ny));
            }
            put(site, j * nx + i, idOf(material));
            return this;
        }

        /** The table index of {@code m}, adding it if new (equal materials share one index). */
        int idOf(Material m) {
            Integer k = index.get(m);
            if (k != null) {
                return k;
            }
            if (table.size() == Integer.MAX_VALUE) {
                throw new IllegalStateException("more than " + Integer.MAX_VALUE + " distinct materials");
            }
            int id = table.size();
            table.add(m);
            index.put(m, id);
            if (id >= NARROW_LIMIT && wide == null) {
                widen();
            }
            return id;
        }

        private void widen() {
            wide = new int[narrow.length][];
            for (int s = 0; s < narrow.length; s++) {
                char[] a = narrow[s];
                int[] w = new int[a.length];
                for (int k = 0; k < a.length; k++) {
                    w[k] = a[k];
                }
                wide[s] = w;
                narrow[s] = null;
            }
            narrow = null;
        }

        /** Sets the off-diagonal elements of the inverse permittivity (replacing any set before). */
        Builder crossTerms(CrossTerms terms) {
            crossTerms = terms;
            return this;
        }

        /** Sets the id of one site, index {@code k = j*nx + i}. */
        void put(FieldSite site, int k, int id) {
            if (wide != null) {
                wide[site.ordinal()][k] = id;
            } else {
                narrow[site.ordinal()][k] = (char) id;
            }
        }

        /** Sets the ids of sites {@code from} (inclusive) to {@code to} (exclusive) of the flat index. */
        void fill(FieldSite site, int from, int to, int id) {
            if (wide != null) {
                Arrays.fill(wide[site.ordinal()], from, to, id);
            } else {
                Arrays.fill(narrow[site.ordinal()], from, to, (char) id);
            }
        }

        public MaterialGrid build() {
            if (wide != null) {
                int[][] w = new int[wide.length][];
                for (int s = 0; s < w.length; s++) {
                    w[s] = wide[s].clone();
                }
                return new MaterialGrid(spec, table, null, w, crossTerms);
            }
            char[][] c = new char[narrow.length][];
            for (int s = 0; s < c.length; s++) {
                c[s] = narrow[s].clone();
            }
            return new MaterialGrid(spec, table, c, null, crossTerms);
        }

        /** Builds without copying the id arrays; the builder must not be used afterwards. */
        MaterialGrid buildAndRelease() {
            MaterialGrid g = new MaterialGrid(spec, table, narrow, wide, crossTerms);
            narrow = null;
            wide = null;
            return g;
        }
    }
}
