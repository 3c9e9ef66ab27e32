package org.evanesce.geometry;

import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.shape.Bounds;
import org.evanesce.geometry.shape.PixelCut;
import org.evanesce.geometry.shape.Shape;

/**
 * Turns a {@link Scene} into a {@link MaterialGrid} on a {@link GridSpec}.
 *
 * <h2>Without smoothing</h2>
 * Each site (Ez at node (i, j), Ex at (i + ½, j), Ey at (i, j + ½), in cells) takes the material of
 * the last scene entry containing the site point, else the background. Shapes are filled row by row
 * from their inside intervals, so the cost is one write per covered site.
 *
 * <h2>Anisotropic subpixel smoothing</h2>
 * Each site owns the Δ × Δ pixel centred on it. Pixels that an interface crosses are found by
 * tracing each shape's boundary (segments of at most one cell) and marking the pixels near each
 * segment; all other pixels are uniform and keep the point-sampled material. In a cut pixel with
 * materials of relative permittivity ε_m filling fractions f_m (Σ f_m = 1):
 * <ul>
 *   <li>⟨ε⟩ = Σ f_m ε_m and ⟨1/ε⟩ = Σ f_m/ε_m;</li>
 *   <li>Ez, always tangential to an interface in 2D: ε_eff = ⟨ε⟩;</li>
 *   <li>Ex and Ey, field direction u = x̂ or ŷ: 1/ε_eff = (u·n)² ⟨1/ε⟩ + (1 − (u·n)²)/⟨ε⟩,
 *       n the interface normal: the harmonic mean for the field normal to the interface and the
 *       arithmetic mean for the tangential one (A. Farjadpour et al., "Improving accuracy by subpixel
 *       smoothing in the finite-difference time domain", Opt. Lett. 31, 2972 (2006); A. F. Oskooi,
 *       C. Kottke, S. G. Johnson, Opt. Lett. 34, 2778 (2009));</li>
 *   <li>a perfect conductor ({@link Material#isPerfectConductor}) is not averaged: a pixel it cuts keeps the
 *       point-sampled material, a staircase (first order; the fraction-weighted σ below would make every
 *       site its boundary touches a conductor, growing it by up to half a cell);</li>
 *   <li>conductivity: the fraction-weighted mean σ_eff = Σ f_m σ_m (a simple choice of ours,
 *       consistent with the arithmetic mean of the complex permittivity ε + iσ/(ωε0) for a field
 *       tangential to the interface, but not the harmonic mean a normal field would need, so the
 *       loss of a lossy interface seen by a normal field may converge more slowly; not tested).</li>
 * </ul>
 *
 * <p>The in-plane sites also get the tensor's off-diagonal element, (ε⁻¹)_xy = T_xy (⟨1/ε⟩ − 1/⟨ε⟩) (n_x n_y (…) for
 * a straight interface), in the grid's {@link CrossTerms}, which the solver applies with the other in-plane
 * component averaged onto the site: without it a field across a curved face carries a first-order error (measured on
 * a dielectric cylinder in p: the backward scattering width converged at first order, −3.2 % to −1.5 % from 45 to 90
 * cells per wavelength; with it −0.5 % to −0.2 %). None for lossy or rule-resolved pixels (those keep the diagonal).
 *
 * <p>(u·n)² is generalised to uᵀTu with T the orientation tensor of the boundary inside the pixel
 * ({@link PixelCut}): equal to (u·n)² for a straight interface, a length-weighted blend at corners
 * and where several interfaces cross one pixel, and correct for a strip thinner than the pixel
 * (whose two faces have opposite normals). A pixel without boundary information uses ½.
 *
 * <p>Pixels with more than two materials (two or more shapes' boundaries inside one pixel): each
 * shape's own fraction f_k is exact; the part of it hidden by later shapes is estimated with
 * {@value #SUBSAMPLES} × {@value #SUBSAMPLES} subsamples, f_k,visible = f_k · (subsamples of shape k
 * not covered by a later shape)/(subsamples of shape k), so shapes that do not overlap inside the
 * pixel keep exact fractions; the background (or the shape under them all) takes the remainder. T
 * sums the boundaries of all these shapes, hidden parts included. Such pixels lie only where
 * interfaces meet, so this first-order estimate does not change the convergence order of an
 * interface.
 *
 * <p>Each cut site gets a material named after its constituents; ε_eff and σ_eff are rounded to
 * 36 stored mantissa bits (relative change below 1.5e-11, far below float precision) so that
 * sites with the same geometry, such as all cut sites along a straight grid-aligned interface,
 * share one table entry.
 */
public final class Rasterizer {

    /** Subsamples per axis, only in pixels where two or more shapes' boundaries meet. */
    public static final int SUBSAMPLES = 16;
    /**
     * Fill fractions within this of 0 or 1 count as uniform: rounding of pixel corners that lie on
     * an interface leaves fractions of order 1e-15, far below it; a real sliver this thin changes ε by
     * less than one part in 1e9.
     */
    public static final double FRACTION_TOLERANCE = 1e-9;
    /** Edge, in cells, of the tiles that index shapes by position. */
    private static final int TILE = 32;

    private Rasterizer() {
    }

    /**
     * The materials of {@code scene} on {@code grid} for every electric site.
     *
     * @param scene     shapes in metres; not modified
     * @param grid      where the nodes lie
     * @param smoothing {@link Smoothing#NONE} for point sampling, {@link Smoothing#ANISOTROPIC} for
     *                  subpixel smoothing
     */
    public static MaterialGrid rasterize(Scene scene, GridSpec grid, Smoothing smoothing) {
        return new Run(scene, grid).rasterize(smoothing);
    }

    /**
     * The same, with pixels cut by a face of a material {@code rule} {@linkplain FaceRule#applies applies to}
     * resolved by the rule instead of the subpixel average (for dispersive materials, whose table entry is a
     * stand-in holding ε∞ only, so that the average of the entries would mean nothing).
     */
    public static MaterialGrid rasterize(Scene scene, GridSpec grid, Smoothing smoothing, FaceRule rule) {
        Run run = new Run(scene, grid);
        run.rule = rule;
        return run.rasterize(smoothing);
    }

    /** How a cut pixel with a material that may not be averaged by its table entry is resolved. */
    public interface FaceRule {

        /** Whether {@code m}'s faces are resolved by {@link #mix}. */
        boolean applies(Material m);

        /**
         * The material of a cut site, or null to keep the point-sampled one (a staircase there).
         *
         * @param constituents the materials in the site's pixel (not modified)
         * @param fractions    their filling fractions, summing to 1 (not modified)
         * @param normalWeight (u·n)² of the site's field direction u and the face normal n, generalised as in the
         *                     class comment: 0 for a field tangential to every face in the pixel (always for Ez)
         */
        Material mix(FieldSite site, Material[] constituents, double[] fractions, double normalWeight);
    }

    /** State of one rasterisation. */
    private static final class Run {
        private final GridSpec g;
        private final int nx;
        private final int ny;
        private final double d;
        private final Shape[] shapes;
        private final Bounds[] bounds;
        private final Material[] materials;
        /** Table id per entry, and of the background at index {@code shapes.length}. */
        private final int[] ids;
        private final MaterialGrid.Builder builder;
        private final Map<Long, String> names = new HashMap<>();
        private int[] tileStart;
        private int[] tileShapes;
        private int tilesX;
        /** Resolves pixels cut by faces of materials not averaged by their entries; null: none. */
        private FaceRule rule;
        /** (ε⁻¹)_xy of the pixel {@link #mix} resolved last (0: none). */
        private double cross;
        /** Cross terms found so far, per in-plane site (Ex, Ey): cells and values. */
        private final int[][] crossCells = new int[2][];
        private final double[][] crossValues = new double[2][];

        Run(Scene scene, GridSpec grid) {
            g = grid;
            nx = grid.nx();
            ny = grid.ny();
            d = grid.cellSize();
            List<Scene.Entry> entries = scene.entries();
            int k = entries.size();
            shapes = new Shape[k];
            bounds = new Bounds[k];
            materials = new Material[k + 1];
            ids = new int[k + 1];
            builder = MaterialGrid.builder(grid, scene.background());
            for (int q = 0; q < k; q++) {
                shapes[q] = entries.get(q).shape();
                bounds[q] = shapes[q].bounds();
                materials[q] = entries.get(q).material();
                ids[q] = builder.idOf(materials[q]);
            }
            materials[k] = scene.background();
            ids[k] = builder.idOf(scene.background());
        }

        MaterialGrid rasterize(Smoothing smoothing) {
            for (FieldSite s : FieldSite.values()) {
                pointSample(s);
            }
            if (smoothing == Smoothing.ANISOTROPIC && shapes.length > 0) {
                buildTiles();
                for (FieldSite s : FieldSite.values()) {
                    smooth(s);
                }
                if (crossCells[0] != null) {
                    builder.crossTerms(new CrossTerms(crossCells[0], crossValues[0], crossCells[1], crossValues[1]));
                }
            }
            return builder.buildAndRelease();
        }

        private static int clampCeil(double v, int lo, int hi) {
            return (int) Math.max(lo, Math.min(hi, Math.ceil(v)));
        }

        private static int clampFloor(double v, int lo, int hi) {
            return (int) Math.max(lo, Math.min(hi, Math.floor(v)));
        }

        private void pointSample(FieldSite site) {
            for (int k = 0; k < shapes.length; k++) {
                Bounds b = bounds[k];
                int jLo = clampCeil((b.yMin() - g.y0()) / d - site.dy, 0, ny);
                int jHi = clampFloor((b.yMax() - g.y0()) / d - site.dy, -1, ny - 1);
                int id = ids[k];
                for (int j = jLo; j <= jHi; j++) {
                    int row = j * nx;
                    shapes[k].spans(g.siteY(site, j), (xl, xr) -> {
                        int iLo = clampCeil((xl - g.x0()) / d - site.dx, 0, nx);
                        int iHi = clampFloor((xr - g.x0()) / d - site.dx, -1, nx - 1);
                        if (iLo <= iHi) {
                            builder.fill(site, row + iLo, row + iHi + 1, id);
                        }
                    });
                }
            }
        }

        /** Lists, for each TILE × TILE block of cells, the shapes whose bounds come near it, ascending. */
        private void buildTiles() {
            tilesX = (nx + TILE - 1) / TILE;
            int tilesY = (ny + TILE - 1) / TILE;
            int[][] range = new int[shapes.length][];
            int[] count = new int[tilesX * tilesY + 1];
            for (int k = 0; k < shapes.length; k++) {
                Bounds b = bounds[k];
                // two cells of slack cover the half-cell site offsets and the pixels' half widths
                int i0 = clampFloor(((b.xMin() - g.x0()) / d - 2) / TILE, 0, tilesX - 1);
                int i1 = clampFloor(((b.xMax() - g.x0()) / d + 2) / TILE, 0, tilesX - 1);
                int j0 = clampFloor(((b.yMin() - g.y0()) / d - 2) / TILE, 0, tilesY - 1);
                int j1 = clampFloor(((b.yMax() - g.y0()) / d + 2) / TILE, 0, tilesY - 1);
                if (b.xMax() < g.x0() - 2 * d || b.yMax() < g.y0() - 2 * d
                        || b.xMin() > g.x(nx - 1) + 2 * d || b.yMin() > g.y(ny - 1) + 2 * d) {
                    continue;
                }
                range[k] = new int[] {i0, i1, j0, j1};
                for (int tj = j0; tj <= j1; tj++) {
                    for (int ti = i0; ti <= i1; ti++) {
                        count[tj * tilesX + ti + 1]++;
                    }
                }
            }
            for (int t = 1; t < count.length; t++) {
                count[t] += count[t - 1];
            }
            tileStart = count.clone();
            tileShapes = new int[count[count.length - 1]];
            int[] next = Arrays.copyOf(count, count.length - 1);
            for (int k = 0; k < shapes.length; k++) {
                int[] r = range[k];
                if (r == null) {
                    continue;
                }
                for (int tj = r[2]; tj <= r[3]; tj++) {
                    for (int ti = r[0]; ti <= r[1]; ti++) {
                        tileShapes[next[tj * tilesX + ti]++] = k;
                    }
                }
            }
        }

        private void smooth(FieldSite site) {
            int k = shapes.length;
            LongList keys = new LongList();
            Bounds window = new Bounds(g.x0() - 2 * d, g.y0() - 2 * d, g.x(nx) + 2 * d, g.y(ny) + 2 * d);
            double slack = 1e-9 * d;
            for (int q = 0; q < k; q++) {
                int shape = q;
                shapes[q].traceBoundary(window, d, (x1, y1, x2, y2, margin) -> {
                    double m = margin + slack;
                    // pixel i spans [x0 + (i + dx − ½)Δ, x0 + (i + dx + ½)Δ]
                    int iLo = clampCeil((Math.min(x1, x2) - m - g.x0()) / d - site.dx - 0.5, 0, nx);
                    int iHi = clampFloor((Math.max(x1, x2) + m - g.x0()) / d - site.dx + 0.5, -1, nx - 1);
                    int jLo = clampCeil((Math.min(y1, y2) - m - g.y0()) / d - site.dy - 0.5, 0, ny);
                    int jHi = clampFloor((Math.max(y1, y2) + m - g.y0()) / d - site.dy + 0.5, -1, ny - 1);
                    for (int j = jLo; j <= jHi; j++) {
                        for (int i = iLo; i <= iHi; i++) {
                            keys.add(((long) j * nx + i) * k + shape);
                        }
                    }
                });
            }
            long[] a = keys.sorted();
            int n = a.length;
            int[] cells = new int[16];
            double[] values = new double[16];
            int crossing = 0;
            int[] cut = new int[k];
            for (int s = 0; s < n; ) {
                long pixel = a[s] / k;
                int m = 0;
                for (; s < n && a[s] / k == pixel; s++) {
                    int shape = (int) (a[s] % k);
                    if (m == 0 || cut[m - 1] != shape) {
                        cut[m++] = shape;
                    }
                }
                int p = (int) pixel;
                cross = 0;
                int id = resolve(site, p % nx, p / nx, cut, m);
                if (id >= 0) {
                    builder.put(site, p, id);
                }
                // two cells of margin: the solver averages the other component's four neighbouring sites
                int i = p % nx;
                int j = p / nx;
                if (cross != 0 && i >= 2 && i < nx - 2 && j >= 2 && j < ny - 2) {
                    if (crossing == cells.length) {
                        cells = Arrays.copyOf(cells, 2 * crossing);
                        values = Arrays.copyOf(values, 2 * crossing);
                    }
                    cells[crossing] = p;
                    values[crossing++] = cross;
                }
            }
            if (site != FieldSite.EZ) {
                int q = site == FieldSite.EX ? 0 : 1;
                crossCells[q] = Arrays.copyOf(cells, crossing);
                crossValues[q] = Arrays.copyOf(values, crossing);
            }
        }

        /**
         * The material id of the pixel of (site, i, j), given the shapes whose boundary may cross it
         * ({@code cut[0..m)}, ascending).
         */
        private int resolve(FieldSite site, int i, int j, int[] cut, int m) {
            double xc = g.siteX(site, i);
            double yc = g.siteY(site, j);
            int tile = (j / TILE) * tilesX + i / TILE;
            int a = tileStart[tile + 1] - 1;
            int aEnd = tileStart[tile];
            int c = m - 1;
            int base = shapes.length;
            int[] partial = new int[m];
            PixelCut[] cuts = new PixelCut[m];
            int np = 0;
            // walk the shapes near the pixel from the last (topmost) down to the first that covers it
            while (a >= aEnd || c >= 0) {
                int ka = a >= aEnd ? tileShapes[a] : -1;
                int kc = c >= 0 ? cut[c] : -1;
                int k = Math.max(ka, kc);
                if (ka == k) {
                    a--;
                }
                if (kc == k) {
                    c--;
                    PixelCut pc = shapes[k].cut(xc, yc, d);
                    if (pc.fraction() >= 1 - FRACTION_TOLERANCE) {
                        base = k;
                        break;
                    }
                    if (pc.fraction() > FRACTION_TOLERANCE) {
                        partial[np] = k;
                        cuts[np++] = pc;
                    }
                } else if (bounds[k].contains(xc, yc) && shapes[k].contains(xc, yc)) {
                    base = k; // its boundary does not reach the pixel, so it covers it all
                    break;
                }
            }
            if (np == 0) {
                return ids[base];
            }
            double[] frac = new double[np];
            if (np == 1) {
                frac[0] = cuts[0].fraction();
            } else {
                visibleFractions(xc, yc, partial, cuts, np, frac);
            }
            return mix(site, base, partial, cuts, frac, np);
        }

        /** Fractions of the partial shapes (topmost first) not hidden by shapes above them. */
        private void visibleFractions(double xc, double yc, int[] partial, PixelCut[] cuts, int np, double[] frac) {
            int[] in = new int[np];
            int[] visible = new int[np];
            double h = d / SUBSAMPLES;
            for (int b = 0; b < SUBSAMPLES; b++) {
                double y = yc - 0.5 * d + (b + 0.5) * h;
                for (int a = 0; a < SUBSAMPLES; a++) {
                    double x = xc - 0.5 * d + (a + 0.5) * h;
                    boolean covered = false;
                    for (int q = 0; q < np; q++) {
                        if (shapes[partial[q]].contains(x, y)) {
                            in[q]++;
                            if (!covered) {
                                visible[q]++;
                                covered = true;
                            }
                        }
                    }
                }
            }
            double sum = 0;
            for (int q = 0; q < np; q++) {
                frac[q] = cuts[q].fraction() * (in[q] > 0 ? (double) visible[q] / in[q] : 1.0);
                sum += frac[q];
            }
            if (sum > 1) {
                for (int q = 0; q < np; q++) {
                    frac[q] /= sum;
                }
            }
        }

        /**
         * The smoothed material of a cut pixel: partial shapes with fractions over the base; with a {@link #rule}
         * that applies to one of them, the rule's material, or −1 (the pixel keeps its point-sampled material).
         */
        private int mix(FieldSite site, int base, int[] partial, PixelCut[] cuts, double[] frac, int np) {
            double baseFrac = 1;
            double eps = 0;
            double inv = 0;
            double sigma = 0;
            double len = 0;
            double txx = 0;
            double txy = 0;
            double tyy = 0;
            boolean lossless = materials[base].conductivity() == 0;
            boolean single = true;
            int first = ids[base];
            for (int q = 0; q < np; q++) {
                Material mat = materials[partial[q]];
                eps += frac[q] * mat.relativePermittivity();
                inv += frac[q] / mat.relativePermittivity();
                sigma += frac[q] * mat.conductivity();
                baseFrac -= frac[q];
                single &= ids[partial[q]] == first;
                double l = cuts[q].boundaryLength();
                len += l;
                txx += l * cuts[q].txx();
                txy += l * cuts[q].txy();
                tyy += l * cuts[q].tyy();
                lossless &= mat.conductivity() == 0;
            }
            if (single) {
                return first;
            }
            if (materials[base].isPerfectConductor() || anyPerfectConductor(partial, np)) {
                return -1; // a staircase: the point-sampled material
            }
            baseFrac = Math.max(0, baseFrac);
            if (rule != null) {
                boolean applies = rule.applies(materials[base]);
                for (int q = 0; q < np; q++) {
                    applies |= rule.applies(materials[partial[q]]);
                }
                if (applies) {
                    Material[] ms = new Material[np + 1];
                    double[] fs = new double[np + 1];
                    for (int q = 0; q < np; q++) {
                        ms[q] = materials[partial[q]];
                        fs[q] = frac[q];
                    }
                    ms[np] = materials[base];
                    fs[np] = baseFrac;
                    double w = site == FieldSite.EZ ? 0 : len > 0 ? (site == FieldSite.EX ? txx : tyy) / len : 0.5;
                    Material r = rule.mix(site, ms, fs, w);
                    return r == null ? -1 : builder.idOf(r); // -1: keep the point-sampled material
                }
            }
            Material bm = materials[base];
            eps += baseFrac * bm.relativePermittivity();
            inv += baseFrac / bm.relativePermittivity();
            sigma += baseFrac * bm.conductivity();
            double effective;
            if (site == FieldSite.EZ) {
                effective = eps;
            } else {
                double w = len > 0 ? (site == FieldSite.EX ? txx : tyy) / len : 0.5;
                effective = 1 / (w * inv + (1 - w) / eps);
                // a face parallel to an axis leaves T_xy of order 1e-16 from rounding: no cross term there
                cross = lossless && Math.abs(txy) > 1e-9 * len ? rounded(txy / len * (inv - 1 / eps)) : 0;
            }
            return builder.idOf(new Material(name(base, partial, np), rounded(effective), rounded(sigma)));
        }

        private boolean anyPerfectConductor(int[] partial, int np) {
            for (int q = 0; q < np; q++) {
                if (materials[partial[q]].isPerfectConductor()) {
                    return true;
                }
            }
            return false;
        }

        /**
         * v rounded to 36 stored mantissa bits (relative change below 1.5e-11): positions in metres carry
         * rounding of about 1e-14 of a cell into the fractions, and this lets sites with the same
         * geometry share one table entry.
         */
        private static double rounded(double v) {
            long bits = Double.doubleToRawLongBits(v);
            return Double.longBitsToDouble((bits + 0x8000L) & ~0xFFFFL);
        }

        private String name(int base, int[] partial, int np) {
            if (np == 1) {
                long key = ((long) ids[base] << 32) | ids[partial[0]];
                return names.computeIfAbsent(key, x -> materials[partial[0]].name() + "|" + materials[base].name()
                        + " (smoothed)");
            }
            StringBuilder sb = new StringBuilder();
            for (int q = 0; q < np; q++) {
                sb.append(materials[partial[q]].name()).append('|');
            }
            return sb.append(materials[base].name()).append(" (smoothed)").toString();
        }
    }

    /** A growable list of longs: candidate keys (pixel · shapes + shape). */
    private static final class LongList {
        private long[] a = new long[1024];
        private int n;

        void add(long v) {
            if (n == a.length) {
                a = Arrays.copyOf(a, 2 * n);
            }
            a[n++] = v;
        }

        long[] sorted() {
            long[] out = Arrays.copyOf(a, n);
            Arrays.sort(out);
            return out;
        }
    }
}
