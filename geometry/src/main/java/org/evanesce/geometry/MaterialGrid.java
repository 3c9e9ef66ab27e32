package org.evanesce.geometry;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * The materials of a scene sampled on an nx × ny Yee grid: for each electric field site
 * ({@link FieldSite}) a small material index per cell, {@code id[j*nx + i]}, into a table of
 * materials. Cells cut by an interface may carry their own (smoothed) table entry.
 *
 * <p>Immutable; build it with {@link #builder}.
 */
public final class MaterialGrid {

    private final int nx;
    private final int ny;
    private final double cellSize;
    private final List<Material> table;
    private final Map<FieldSite, short[]> ids;

    private MaterialGrid(int nx, int ny, double cellSize, List<Material> table, Map<FieldSite, short[]> ids) {
        this.nx = nx;
        this.ny = ny;
        this.cellSize = cellSize;
        this.table = List.copyOf(table);
        this.ids = ids;
    }

    /** Number of nodes along x. */
    public int nx() {
        return nx;
    }

    /** Number of nodes along y. */
    public int ny() {
        return ny;
    }

    /** Cell size Δ (equal along x and y), in metres. */
    public double cellSize() {
        return cellSize;
    }

    /** The distinct materials referenced by the grid, indexed by material id. */
    public List<Material> materials() {
        return table;
    }

    /** Material id at a site of cell (i, j). */
    public int id(FieldSite site, int i, int j) {
        return ids.get(site)[j * nx + i];
    }

    /** Material at a site of cell (i, j). */
    public Material material(FieldSite site, int i, int j) {
        return table.get(id(site, i, j));
    }

    /** The smallest relative permittivity anywhere on the grid (it sets the stability limit). */
    public double minPermittivity() {
        double m = Double.POSITIVE_INFINITY;
        for (Material mat : table) {
            m = Math.min(m, mat.relativePermittivity());
        }
        return m;
    }

    /** A builder whose every site starts as {@code background}. */
    public static Builder builder(int nx, int ny, double cellSize, Material background) {
        return new Builder(nx, ny, cellSize, background);
    }

    /** Paints materials site by site; later paints win. */
    public static final class Builder {
        private final int nx;
        private final int ny;
        private final double cellSize;
        private final List<Material> table = new ArrayList<>();
        private final Map<FieldSite, short[]> ids = new EnumMap<>(FieldSite.class);

        private Builder(int nx, int ny, double cellSize, Material background) {
            if (nx < 3 || ny < 3) {
                throw new IllegalArgumentException(String.format(
                        "grid %d × %d: need at least 3 nodes along each axis", nx, ny));
            }
            if ((long) nx * ny > Integer.MAX_VALUE - 64) {
                throw new IllegalArgumentException(String.format(
                        "grid %d × %d has more cells than one Java array can index (%d)", nx, ny, Integer.MAX_VALUE));
            }
            if (!(cellSize > 0) || Double.isInfinite(cellSize)) {
                throw new IllegalArgumentException(String.format("cell size %g m must be finite and > 0", cellSize));
            }
            this.nx = nx;
            this.ny = ny;
            this.cellSize = cellSize;
            table.add(background);
            for (FieldSite s : FieldSite.values()) {
                ids.put(s, new short[nx * ny]);
            }
        }

        /** Sets every site whose position (in cell units) lies in {@code region} to {@code material}. */
        public Builder paint(CellRegion region, Material material) {
            short id = idOf(material);
            for (FieldSite s : FieldSite.values()) {
                short[] a = ids.get(s);
                for (int j = 0; j < ny; j++) {
                    int row = j * nx;
                    for (int i = 0; i < nx; i++) {
                        if (region.contains(i + s.dx, j + s.dy)) {
                            a[row + i] = id;
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
            ids.get(site)[j * nx + i] = idOf(material);
            return this;
        }

        private short idOf(Material m) {
            int k = table.indexOf(m);
            if (k < 0) {
                if (table.size() > Short.MAX_VALUE) {
                    throw new IllegalStateException("more than " + Short.MAX_VALUE + " distinct materials");
                }
                table.add(m);
                k = table.size() - 1;
            }
            return (short) k;
        }

        public MaterialGrid build() {
            Map<FieldSite, short[]> copy = new EnumMap<>(FieldSite.class);
            ids.forEach((s, a) -> copy.put(s, Arrays.copyOf(a, a.length)));
            return new MaterialGrid(nx, ny, cellSize, table, copy);
        }
    }
}
