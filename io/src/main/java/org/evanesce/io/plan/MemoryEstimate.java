package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.evanesce.geometry.GridSpec;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.OutputSpec;
import org.evanesce.io.casefile.model.ShapeSpec;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Side;

/**
 * The heap a case will use, estimated from the case alone before anything large is allocated, so
 * that {@code check} and {@code run} can refuse a case that cannot fit instead of failing part way.
 *
 * <p>The estimate is the sum of what stays allocated during the run (the material grid, the fields,
 * coefficients and CPML arrays, the recorders: flux lines, maps, probes; and for a flux case the
 * incident-power run's grid, fields and lines, which exist at the same time as the case's own) plus the
 * largest of what exists only for a while (the subpixel smoothing's work, the coefficients in double
 * while the fields are built, one output file or picture being written), plus a fixed allowance for
 * the program itself. It is an upper bound for the arrays the solver counts itself
 * ({@link Simulation#bytes()}, exact but for the few kilobytes of array padding), and for the rest
 * errs on the large side: see the constants for the figures behind it. It counts the heap as the
 * parallel collector (the launcher's) lays it out; the G1 collector gives an array of half a region
 * or more whole regions, up to a quarter more for grids of a few hundred thousand nodes.
 *
 * @param items what is counted, largest first
 */
public record MemoryEstimate(List<Item> items) {

    /**
     * Heap for the program itself (the kernels' warm-up grid, the libraries' buffers): a tiny case read, planned, run
     * and previewed in a 12 MiB heap and failed in 8 MiB (measured); 32 MiB leaves room.
     */
    static final long PROGRAM_BYTES = 32L << 20;
    /**
     * Distinct smoothed materials per cell of shape boundary, over the three electric sites: measured 3.5 to 3.8 for
     * disks of 3 to 500 cells radius (each cut site of a curved face gets its own effective permittivity).
     */
    static final double MATERIALS_PER_BOUNDARY_CELL = 4;
    /** Heap per smoothed material (record, name, table and map entries): measured 144 to 165 bytes. */
    static final long BYTES_PER_MATERIAL = 200;
    /**
     * Sites (Ex and Ey) with an off-diagonal inverse permittivity per cell of shape boundary, in p: measured 2.51 for a
     * disk of 50 cells radius and 2.34 for a tilted triangle (20 nm cells); rounded up.
     */
    static final double CROSS_SITES_PER_BOUNDARY_CELL = 3;
    /**
     * Bytes held per such site: the material grid's cross terms (an int and a double) and the solver's coupling (an
     * int, a reference and a double[4] of 48 bytes).
     */
    static final long CROSS_BYTES_PER_SITE = 12 + 4 + 4 + 48;
    /** Bytes per site while the coupling is built (a sorted map's entry and its boxed key), freed once built. */
    static final long CROSS_BUILD_BYTES_PER_SITE = 40 + 16;

    /**
     * Work of the smoothing per cell of boundary and site: candidate (pixel, shape) keys of 8 bytes, at most
     * 9 per boundary segment of one cell, held while growing and once more sorted.
     */
    static final long SMOOTHING_BYTES_PER_BOUNDARY_CELL = 9 * 8 * 3;
    /** Material ids fit 16 bits per site up to this many materials (MaterialGrid), 32 bits beyond. */
    static final long NARROW_MATERIALS = 1 << 16;
    /** Edge of the rasteriser's tiles, cells (Rasterizer.TILE). */
    static final int TILE = 32;
    /** Bytes a probe keeps per recorded step: the value, its imaginary part and the time, 8 bytes each. */
    static final long PROBE_BYTES_PER_STEP = 24;
    /** Steps a probe has room for from the start; the room doubles when it is full (Probe). */
    static final long PROBE_FIRST_ROOM = 1024;
    /**
     * Bytes per probe and step while probes.csv is written: the copies of the recorded arrays (16 bytes) and the
     * text, about 34 characters per probe and step, held about three times while it is built and written.
     */
    static final long PROBE_WRITE_BYTES_PER_STEP = 16 + 34 * 3;
    /**
     * Bytes per value of a field file while it is written: the raw values and the values averaged onto the
     * nodes (8 bytes each), a copy in rows for the HDF5 writer and its chunk buffer (about twice the data).
     */
    static final long WRITE_BYTES_PER_VALUE = 8 + 8 + 8 + 16;

    /** One part of the estimate. */
    public record Item(String what, long bytes, SourcePosition at, String path, String reduce) { }

    /**
     * The estimate with one more part held for the whole run (such as the dispersive cells' state, counted
     * once the grid is rasterised), kept largest first.
     */
    public MemoryEstimate with(Item held) {
        List<Item> all = new java.util.ArrayList<>(items);
        all.add(held);
        all.sort((a, b) -> Long.compare(b.bytes(), a.bytes()));
        return new MemoryEstimate(List.copyOf(all));
    }

    /** The name of the incident-power run's part, which {@link #withIncidentRun} resizes once the run is planned. */
    static final String INCIDENT_RUN = "incident-power run";

    /**
     * The estimate with the incident-power run's part as planned: none where the incident power is computed, a
     * strip's share ({@code columns} of the grid's {@code nx}) where a strip steps it, the whole grid's otherwise (as
     * first estimated, before the plan knew which).
     */
    public MemoryEstimate withIncidentRun(boolean computed, int columns, int nx) {
        List<Item> all = new java.util.ArrayList<>();
        for (Item i : items) {
            if (!i.what().equals(INCIDENT_RUN)) {
                all.add(i);
            } else if (!computed) {
                long bytes = columns > 0 && columns < nx ? (long) Math.ceil(i.bytes() * (double) columns / nx) : i.bytes();
                all.add(new Item(columns > 0 && columns < nx ? INCIDENT_RUN + " (strip)" : INCIDENT_RUN, bytes, i.at(),
                        i.path(), i.reduce()));
            }
        }
        all.sort((a, b) -> Long.compare(b.bytes(), a.bytes()));
        return new MemoryEstimate(List.copyOf(all));
    }

    /** The whole estimate, bytes (Long.MAX_VALUE when it does not fit a long). */
    public long total() {
        long sum = 0;
        for (Item i : items) {
            sum = i.bytes() > Long.MAX_VALUE - sum ? Long.MAX_VALUE : sum + i.bytes();
        }
        return sum;
    }

    /** The largest part the case decides (not the program's own allowance). */
    public Item largest() {
        return items.stream().filter(i -> !i.path().isEmpty()).findFirst().orElse(items.get(0));
    }

    /** "1.2 GiB" or "340 MiB". */
    public static String format(double bytes) {
        return bytes >= (1L << 30) ? String.format(Locale.ROOT, "%.3g GiB", bytes / (1L << 30))
                : String.format(Locale.ROOT, "%.3g MiB", bytes / (1L << 20));
    }

    /** "fields 1.1 GiB, probes 30 MiB, ..." for messages. */
    public String breakdown() {
        StringBuilder sb = new StringBuilder();
        for (Item i : items) {
            if (i.bytes() >= (1L << 20) || sb.length() == 0) {
                sb.append(sb.length() == 0 ? "" : ", ").append(i.what()).append(' ').append(format(i.bytes()));
            }
        }
        return sb.toString();
    }

    /**
     * The estimate of a planned case.
     *
     * @param grid     the case's grid
     * @param sides    the solver's sides
     * @param interior the nodes outside every PML, {i0, j0, i1, j1}
     * @param maxSteps the most steps the run can take
     * @param medium   the plane wave's or beam's medium, for the incident-power run (null without flux)
     */
    static MemoryEstimate of(CaseSpec spec, GridSpec grid, Map<Side, Boundary> sides, int[] interior, long maxSteps,
                             MaterialSpec medium) {
        List<Item> held = new ArrayList<>();
        List<Item> passing = new ArrayList<>();
        long nodes = (long) grid.nx() * grid.ny();
        SourcePosition res = spec.grid().at();
        String gridAdvice = "use a larger cell or a smaller domain";
        boolean lossy = spec.materials().values().stream().anyMatch(m -> m.conductivity().si() != 0);
        var pol = spec.polarization().value();
        var precision = spec.numerics().precision().value();

        double boundaryCells = boundaryCells(spec, grid);
        double materials = boundaryCells * MATERIALS_PER_BOUNDARY_CELL;
        long idBytes = materials > NARROW_MATERIALS ? 12 : 6;
        held.add(new Item("material grid", idBytes * nodes + (long) (materials * BYTES_PER_MATERIAL), res, "resolution",
                gridAdvice + ", or fewer or smaller curved shapes"));
        passing.add(new Item("shape smoothing", (long) (boundaryCells * SMOOTHING_BYTES_PER_BOUNDARY_CELL)
                + 4L * tileEntries(spec, grid) + (idBytes == 12 ? 12 * nodes : 0), res, "shapes", "fewer shapes"));
        if (pol == org.evanesce.solver.grid.Polarization.P) {
            // the off-diagonal inverse permittivity at faces that are not along the axes (p only)
            double crossSites = boundaryCells * CROSS_SITES_PER_BOUNDARY_CELL;
            held.add(new Item("cross terms at faces", (long) (crossSites * CROSS_BYTES_PER_SITE), res, "shapes",
                    "fewer or smaller tilted or curved shapes, or a larger cell"));
            passing.add(new Item("building the cross terms", (long) (crossSites * CROSS_BUILD_BYTES_PER_SITE), res, "shapes",
                    "fewer or smaller tilted or curved shapes"));
        }
        long[] f = Simulation.footprint(grid.nx(), grid.ny(), pol, precision, sides, lossy);
        held.add(new Item("fields and coefficients", f[0], res, "resolution", gridAdvice + ", or float precision"));
        held.add(new Item("PML", f[1], res, "boundaries", "use thinner PMLs or a larger cell"));
        passing.add(new Item("coefficients while building", f[2], res, "resolution", gridAdvice));

        if (spec.flux().isPresent() && medium != null) {
            var flux = spec.flux().get();
            boolean periodic = sides.get(Side.LEFT) instanceof Boundary.Bloch;
            long width = periodic ? grid.nx() : interior[2] - interior[0];
            long nf = flux.frequencies().size();
            long perLine = org.evanesce.solver.record.FluxLine.bytesFor(width, nf);
            int lines = flux.lines().size();
            held.add(new Item("flux lines", saturated(perLine, 2L * lines + 1), flux.at(), "flux", "fewer lines or wavelengths"));
            long[] r = Simulation.footprint(grid.nx(), grid.ny(), pol, precision, sides, medium.conductivity().si() != 0);
            held.add(new Item(INCIDENT_RUN, 6 * nodes + r[0] + r[1], flux.at(), "flux", gridAdvice));
        }
        if (spec.surfaces().isPresent()) {
            var sf = spec.surfaces().get();
            double dx = grid.cellSize();
            long cells = 0;
            for (var g : sf.segments()) {
                cells += 2 + (long) (Math.abs(g.to().x().si() - g.from().x().si() + g.to().y().si() - g.from().y().si()) / dx);
            }
            for (var b : sf.boxes()) {
                cells += 8 + 2 * (long) ((Math.abs(b.to().x().si() - b.from().x().si()) + Math.abs(b.to().y().si()
                        - b.from().y().si())) / dx);
            }
            for (var b : sf.farFields()) {
                cells += 8 + 2 * (long) ((Math.abs(b.to().x().si() - b.from().x().si()) + Math.abs(b.to().y().si()
                        - b.from().y().si())) / dx);
            }
            cells += (long) sf.exitSpectra().size() * grid.nx();
            held.add(new Item("surfaces", org.evanesce.solver.record.FluxLine.bytesFor(cells, sf.frequencies().size()),
                    sf.at(), "surfaces", "fewer or smaller surfaces, or fewer wavelengths"));
            if (sf.normalise().value() != org.evanesce.io.casefile.model.SurfacesSpec.Normalise.ABSOLUTE && spec.flux().isEmpty()) {
                long[] r = Simulation.footprint(grid.nx(), grid.ny(), pol, precision, sides, false);
                held.add(new Item("reference run of the surfaces' norm", 6 * nodes + r[0] + r[1], sf.normalise().at(),
                        "surfaces.normalise", gridAdvice + ", or normalise: absolute"));
            }
        }
        if (spec.maps().isPresent()) {
            var m = spec.maps().get();
            long cells = boxCells(m.region().isPresent() ? m.region() : spec.output().region(), grid, interior);
            long sums = 2L * 3 * m.frequencies().size() * cells * Double.BYTES;
            long bytes = sums;
            if (precision == org.evanesce.solver.grid.Precision.FLOAT) {
                // the steps a single-precision map holds before adding them (FieldMap.HELD_STEPS), both parts if complex
                boolean complex = sides.get(Side.LEFT) instanceof Boundary.Bloch;
                bytes += (complex ? 2 : 1) * org.evanesce.solver.record.FieldMap.HELD_BYTES_PER_CELL * cells;
            }
            SourcePosition at = m.region().map(OutputSpec.Region::at).orElse(m.at());
            String reduce = "a smaller maps.region or fewer wavelengths";
            held.add(new Item("maps", bytes, at, "maps", reduce));
            // maps.h5 is written at once: the maps averaged onto the nodes and |E| (56 bytes per cell and frequency, the
            // maps hold 48) are all held until then, and the writer adds its rows in single precision: about twice the maps
            passing.add(new Item("writing maps", 2 * sums, at, "maps", reduce));
        }
        if (!spec.probes().isEmpty()) {
            long probes = spec.probes().size();
            // room for the steps, doubled from the first room as needed: up to twice the steps
            long room = PROBE_FIRST_ROOM;
            while (room < maxSteps && room < Long.MAX_VALUE / 4) {
                room *= 2;
            }
            SourcePosition at = spec.probes().get(0).at();
            String reduce = "fewer probes or a shorter run";
            held.add(new Item("probes", saturated(probes, room * PROBE_BYTES_PER_STEP), at, "probes", reduce));
            // the last doubling holds the old room beside the new
            passing.add(new Item("growing the probes' room", saturated(probes, room / 2 * PROBE_BYTES_PER_STEP), at, "probes",
                    reduce));
            if (spec.output().writes(OutputSpec.Item.PROBES)) {
                passing.add(new Item("writing probes.csv", saturated(probes, maxSteps * PROBE_WRITE_BYTES_PER_STEP), at,
                        "probes", reduce));
            }
        }
        OutputSpec out = spec.output();
        long outCells = boxCells(out.region(), grid, interior);
        boolean complex = sides.get(Side.LEFT) instanceof Boundary.Bloch;
        int comps = out.components().isEmpty() ? 3 : out.components().size();
        SourcePosition outAt = out.region().map(OutputSpec.Region::at).orElse(res);
        if (out.writes(OutputSpec.Item.FIELDS) || out.writes(OutputSpec.Item.FIELD_FRAMES)) {
            passing.add(new Item("writing field files", comps * outCells * (complex ? 2 : 1) * WRITE_BYTES_PER_VALUE, outAt,
                    "output", "a smaller output.region or fewer components"));
        }
        if (out.writes(OutputSpec.Item.PERMITTIVITY)) {
            passing.add(new Item("writing the permittivity", 4 * outCells * WRITE_BYTES_PER_VALUE, outAt, "output",
                    "a smaller output.region"));
        }
        // the preview (also written by check): ids and permittivity per node, and the picture
        passing.add(new Item("preview picture", 12 * nodes, res, "resolution", gridAdvice));

        List<Item> all = new ArrayList<>(held);
        passing.stream().max(Comparator.comparingLong(Item::bytes)).ifPresent(all::add);
        all.add(new Item("the program", PROGRAM_BYTES, res, "", ""));
        all.sort(Comparator.comparingLong(Item::bytes).reversed());
        return new MemoryEstimate(List.copyOf(all));
    }

    /** a × b, or Long.MAX_VALUE when that does not fit a long. */
    private static long saturated(long a, long b) {
        return b != 0 && a > Long.MAX_VALUE / b ? Long.MAX_VALUE : a * b;
    }

    /** Nodes of a region's box on the grid (clamped to it), or of the interior without a region. */
    static long boxCells(Optional<OutputSpec.Region> region, GridSpec g, int[] interior) {
        if (region.isEmpty()) {
            return (long) Math.max(0, interior[2] - interior[0]) * Math.max(0, interior[3] - interior[1]);
        }
        int[] b = CasePlanner.nodeBox(region.get(), g);
        return (long) Math.max(0, b[2] - b[0]) * Math.max(0, b[3] - b[1]);
    }

    /**
     * Cells of shape boundary inside the grid, summed over the shapes, plus two per shape for the ends of the
     * tracing: a convex shape's boundary inside the grid is no longer than the grid's perimeter, a polygon's
     * edges are each cut to the grid's diagonal, a half plane's edge and a stack's faces are at most a diagonal.
     */
    static double boundaryCells(CaseSpec spec, GridSpec g) {
        double d = g.cellSize();
        double w = (g.nx() - 1) * d;
        double h = (g.ny() - 1) * d;
        double perimeter = 2 * (w + h);
        double diagonal = Math.hypot(w, h);
        double xMin = g.x0() - 2 * d;
        double yMin = g.y0() - 2 * d;
        double xMax = g.x0() + w + 2 * d;
        double yMax = g.y0() + h + 2 * d;
        double sum = 0;
        for (ShapeSpec s : spec.shapes()) {
            double[] b = s.bounds();
            if (b[2] < xMin || b[0] > xMax || b[3] < yMin || b[1] > yMax) {
                continue;
            }
            double length;
            if (s instanceof ShapeSpec.Rectangle r) {
                length = Math.min(2 * (r.width().si() + r.height().si()), perimeter);
            } else if (s instanceof ShapeSpec.Disk c) {
                length = Math.min(2 * Math.PI * c.radius().si(), perimeter);
            } else if (s instanceof ShapeSpec.Ellipse e) {
                double a = e.radiusX().si();
                double bb = e.radiusY().si();
                // Ramanujan's approximation of an ellipse's perimeter (within 0.04 % for any eccentricity)
                length = Math.min(Math.PI * (3 * (a + bb) - Math.sqrt((3 * a + bb) * (a + 3 * bb))), perimeter);
            } else if (s instanceof ShapeSpec.Polygon p) {
                double[][] c = p.placedCorners();
                length = 0;
                for (int k = 0; k < c.length; k++) {
                    double[] q = c[(k + 1) % c.length];
                    length += Math.min(Math.hypot(q[0] - c[k][0], q[1] - c[k][1]), diagonal);
                }
            } else if (s instanceof ShapeSpec.LayerStack st) {
                length = (st.layers().size() + 1) * diagonal;
            } else {
                length = diagonal;
            }
            sum += length / d + 2;
        }
        return sum;
    }

    /** Entries of the rasteriser's index of shapes by tile: each shape is listed in every tile its bounds touch. */
    static long tileEntries(CaseSpec spec, GridSpec g) {
        long tilesX = (g.nx() + TILE - 1) / TILE;
        long tilesY = (g.ny() + TILE - 1) / TILE;
        double d = g.cellSize();
        long sum = 0;
        for (ShapeSpec s : spec.shapes()) {
            double[] b = s.bounds();
            long i0 = clamp(((b[0] - g.x0()) / d - 2) / TILE, tilesX);
            long i1 = clamp(((b[2] - g.x0()) / d + 2) / TILE, tilesX);
            long j0 = clamp(((b[1] - g.y0()) / d - 2) / TILE, tilesY);
            long j1 = clamp(((b[3] - g.y0()) / d + 2) / TILE, tilesY);
            sum += (i1 - i0 + 1) * (j1 - j0 + 1);
        }
        return sum;
    }

    private static long clamp(double v, long tiles) {
        return (long) Math.max(0, Math.min(tiles - 1, Math.floor(v)));
    }
}
