package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeSet;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.ShapeSpec;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.solver.reference.PlanarStack;

/**
 * Whether a case's scene is a stack of horizontal layers over a range of x, and the plane-wave
 * reference ({@link PlanarStack}) of that stack. A layered scene is the one whose simulated
 * transmittance can be compared with the exact transfer matrix.
 *
 * <h2>How the scene is read</h2>
 * Only through {@link CaseSpec#materialAt}: along one column x the material is sampled every
 * {@code cellSize / 64} in y, and each change between two samples is bisected until it is bracketed
 * to 1e-6 of a cell; the edge is the middle of the bracket. A layer thinner than {@code cellSize / 64}
 * that falls between two samples is therefore missed, and so is a feature narrower than that in y.
 *
 * <p>The scene counts as invariant along x when the band sequences of several columns agree: both
 * ends of the x range (nudged inwards by 1e-9 of its width, off a shape edge that sits exactly on the
 * end), nine columns placed at fractions {i·0.618…} of the width (the golden-ratio sequence, so that
 * no pattern with a period of width/k looks the same at every column), and the middle of every
 * finite shape's bounding box that meets the range. A shape that misses all of these columns, e.g. a
 * narrow polygon whose bounding box centre lies outside it, can go unnoticed.
 */
public final class LayeredProfile {

    /** Samples per cell along y before bisection: finds layers down to 1/64 of a cell. */
    static final int SAMPLES_PER_CELL = 64;
    /**
     * Columns are compared with this tolerance, a fraction of a cell: edges are bisected to adjacent
     * doubles, but a shape's inside test may round differently at different x.
     */
    static final double EDGE_RESOLUTION = 1e-6;
    /** Ends of the x range moved inwards by this fraction of its width. */
    static final double END_NUDGE = 1e-9;
    /** Interior columns at fractions {i·GOLDEN} of the width, i = 1 … INTERIOR_COLUMNS. */
    static final int INTERIOR_COLUMNS = 9;
    private static final double GOLDEN = (Math.sqrt(5) - 1) / 2;

    private LayeredProfile() {
    }

    /** The direction a plane wave crosses the layers in. */
    public enum Direction {
        /** towards +y: the lowest band is the incidence medium */
        UP,
        /** towards −y: the highest band is the incidence medium */
        DOWN
    }

    /**
     * One homogeneous band [yLow, yHigh) of a material.
     *
     * @param material the material's name in the case
     * @param yLow     lower edge, m
     * @param yHigh    upper edge, m; above yLow
     */
    public record Band(String material, double yLow, double yHigh) {
        public Band {
            if (material == null || !(yLow < yHigh)) {
                throw new IllegalArgumentException(String.format(
                        "band of %s: y from %g m to %g m must be a material and an increasing range", material, yLow, yHigh));
            }
        }

        /** yHigh − yLow, m. */
        public double thickness() {
            return yHigh - yLow;
        }
    }

    /**
     * The outcome of {@link #of}: the bands from bottom to top when the scene is layered, else a
     * sentence saying where it is not.
     *
     * @param bands  present when layered; contiguous, increasing y, neighbours of different materials;
     *               the first starts at yFrom and the last ends at yTo
     * @param whyNot empty when layered, else e.g. "at y = 1.2 um the material is glass at x = -3 um
     *               but air at x = 2 um"
     */
    public record Result(Optional<List<Band>> bands, String whyNot) {
        public Result {
            bands = bands.map(List::copyOf);
            if (bands.isPresent() == !whyNot.isEmpty()) {
                throw new IllegalArgumentException("a result has either bands or a reason, not both");
            }
        }

        static Result layered(List<Band> bands) {
            return new Result(Optional.of(bands), "");
        }

        static Result notLayered(String whyNot) {
            return new Result(Optional.empty(), whyNot);
        }

        public boolean isLayered() {
            return bands.isPresent();
        }
    }

    /**
     * The bands along y in [yFrom, yTo] if the scene is the same at every x in [xMin, xMax] (see the class
     * comment for how that is checked, and what can be missed).
     *
     * @param spec     the case
     * @param xMin     left end of the range that must be invariant, m
     * @param xMax     right end, m; at least xMin
     * @param yFrom    bottom of the profile, m
     * @param yTo      top of the profile, m; above yFrom
     * @param cellSize sets the sampling (cellSize/64) and the edge accuracy (1e-6 cellSize), m; the grid's
     *                 cell size
     * @return the bands, bottom first, edges within 1e-6 cellSize of the true ones; or why the scene is not
     *         layered
     */
    public static Result of(CaseSpec spec, double xMin, double xMax, double yFrom, double yTo, double cellSize) {
        if (!(xMin <= xMax) || !Double.isFinite(xMin) || !Double.isFinite(xMax)) {
            throw new IllegalArgumentException(String.format(
                    "x range from %g m to %g m must be finite with xMin <= xMax", xMin, xMax));
        }
        if (!(yFrom < yTo) || !Double.isFinite(yFrom) || !Double.isFinite(yTo)) {
            throw new IllegalArgumentException(String.format(
                    "y range from %g m to %g m must be finite with yFrom < yTo", yFrom, yTo));
        }
        if (!(cellSize > 0) || Double.isInfinite(cellSize)) {
            throw new IllegalArgumentException(String.format("cell size %g m must be finite and > 0", cellSize));
        }
        double[] xs = columns(spec, xMin, xMax);
        List<Band> reference = bandsAt(spec, xs[0], yFrom, yTo, cellSize);
        double tolerance = EDGE_RESOLUTION * cellSize;
        for (int c = 1; c < xs.length; c++) {
            List<Band> other = bandsAt(spec, xs[c], yFrom, yTo, cellSize);
            Optional<String> difference = firstDifference(reference, xs[0], other, xs[c], yFrom, tolerance);
            if (difference.isPresent()) {
                return Result.notLayered(difference.get());
            }
        }
        return Result.layered(reference);
    }

    /**
     * The plane-wave stack a wave crossing the bands meets: the first band it crosses is the
     * incidence medium, the last the exit medium, the ones between are layers with their thicknesses
     * (the outer bands' extents do not matter). Each material's complex index is {@link #complexIndex}
     * at {@code vacuumWavelength}.
     *
     * @param bands            contiguous, from bottom to top (as {@link #of} gives them); one band gives
     *                         a stack with no layers and the same medium on both sides
     * @param materials        every band's material by name (the case's {@link CaseSpec#materials()})
     * @param vacuumWavelength m
     * @param direction        UP: incidence from the bottom band; DOWN: from the top band
     * @throws IllegalArgumentException if a material is missing, the bands are not contiguous and increasing,
     *                                  or the incidence medium is not transparent (conductivity not zero or
     *                                  permittivity not positive): the reference needs a real incident index
     */
    public static PlanarStack stack(List<Band> bands, Map<String, MaterialSpec> materials, double vacuumWavelength,
            Direction direction) {
        return stack(bands, materials, vacuumWavelength, direction, 0);
    }

    /**
     * The same, with each dispersive material's discrete permittivity ε_d(ω, Δt) at time step {@code dt}
     * (what the grid's update realises, {@code DispersiveMaterial.discretePermittivity}) when dt &gt; 0, so that
     * a run compared with it differs by the spatial grid alone; dt = 0 gives the continuous model.
     */
    public static PlanarStack stack(List<Band> bands, Map<String, MaterialSpec> materials, double vacuumWavelength,
            Direction direction, double dt) {
        if (bands.isEmpty()) {
            throw new IllegalArgumentException("a stack needs at least one band");
        }
        for (int k = 1; k < bands.size(); k++) {
            if (bands.get(k).yLow() != bands.get(k - 1).yHigh()) {
                throw new IllegalArgumentException(String.format(
                        "bands %d and %d: %s ends at y = %g m but %s starts at y = %g m; bands must be contiguous, bottom first",
                        k - 1, k, bands.get(k - 1).material(), bands.get(k - 1).yHigh(), bands.get(k).material(),
                        bands.get(k).yLow()));
            }
        }
        List<Band> crossed = new ArrayList<>(bands);
        if (direction == Direction.DOWN) {
            Collections.reverse(crossed);
        }
        MaterialSpec incidence = material(materials, crossed.get(0));
        if (incidence.isPerfectConductor()) {
            throw new IllegalArgumentException("incidence medium " + incidence.name() + " is a perfect conductor; the "
                    + "plane-wave reference needs a transparent one");
        }
        for (int k = 1; k < crossed.size(); k++) {
            if (material(materials, crossed.get(k)).isPerfectConductor()) {
                crossed = crossed.subList(0, k + 1); // no field reaches past the first perfect conductor
                break;
            }
        }
        if (incidence.conductivity().si() != 0 || !(incidence.relativePermittivity().si() > 0)) {
            throw new IllegalArgumentException(String.format(
                    "incidence medium %s (permittivity %s, conductivity %s): must be transparent, with conductivity 0 "
                            + "and permittivity > 0, for the plane-wave reference",
                    incidence.name(), Units.number(incidence.relativePermittivity().si()),
                    Units.format(incidence.conductivity().si(), Dimension.CONDUCTIVITY)));
        }
        List<PlanarStack.Layer> layers = new ArrayList<>();
        for (Band b : crossed.subList(1, Math.max(1, crossed.size() - 1))) {
            layers.add(new PlanarStack.Layer(complexIndex(material(materials, b), vacuumWavelength, dt), b.thickness()));
        }
        Complex exit = complexIndex(material(materials, crossed.get(crossed.size() - 1)), vacuumWavelength, dt);
        return new PlanarStack(incidence.index(), layers, exit);
    }

    /**
     * The index that stands for a perfect conductor (the exit medium of a stack that meets one: nothing passes it).
     * As |n| → ∞ the exit admittance tends to ∞ for s (Ez = 0 on the face) and to 0 for p (tangential E = 0), so
     * r → −1 for the tangential E in both; at |n| = 1.4e9 r and R differ from that limit, and T from 0, by about
     * 4/|n| (below 1e-8; {@code PerfectConductorStackTest}).
     */
    public static final Complex PERFECT_CONDUCTOR_INDEX = Complex.of(1e9, 1e9);

    /**
     * The complex refractive index n + iκ = sqrt(εr + iσ/(ω ε0)), principal branch (κ ≥ 0 since σ ≥ 0),
     * for time dependence exp(−iωt) and ω = 2π c0 / λ0.
     *
     * @param vacuumWavelength λ0, m
     */
    public static Complex complexIndex(MaterialSpec material, double vacuumWavelength) {
        return complexIndex(material, vacuumWavelength, 0);
    }

    /**
     * The complex index; a dispersive material's from its model, continuous ({@code dt} = 0) or discrete at
     * time step dt &gt; 0 (s).
     */
    public static Complex complexIndex(MaterialSpec material, double vacuumWavelength, double dt) {
        if (!(vacuumWavelength > 0) || Double.isInfinite(vacuumWavelength)) {
            throw new IllegalArgumentException(String.format("wavelength %g m must be finite and > 0", vacuumWavelength));
        }
        if (material.isPerfectConductor()) {
            return PERFECT_CONDUCTOR_INDEX;
        }
        double omega = 2 * Math.PI * PhysicalConstants.C0 / vacuumWavelength;
        if (material.isDispersive()) {
            var d = material.dispersion().orElseThrow().material();
            return dt > 0 ? d.discreteIndex(omega, dt) : d.index(omega);
        }
        double sigma = material.conductivity().si();
        return Complex.of(material.relativePermittivity().si(), sigma / (omega * PhysicalConstants.EPS0)).sqrt();
    }

    private static MaterialSpec material(Map<String, MaterialSpec> materials, Band band) {
        MaterialSpec m = materials.get(band.material());
        if (m == null) {
            throw new IllegalArgumentException("band material " + band.material() + " is not among the materials "
                    + materials.keySet());
        }
        return m;
    }

    /** The columns compared, increasing x, without repeats (one when xMin = xMax). */
    static double[] columns(CaseSpec spec, double xMin, double xMax) {
        double width = xMax - xMin;
        double lo = xMin + END_NUDGE * width;
        double hi = xMax - END_NUDGE * width;
        TreeSet<Double> xs = new TreeSet<>();
        xs.add(lo);
        xs.add(hi);
        for (int i = 1; i <= INTERIOR_COLUMNS; i++) {
            double f = i * GOLDEN - Math.floor(i * GOLDEN);
            xs.add(xMin + f * width);
        }
        for (ShapeSpec shape : spec.shapes()) {
            double[] b = shape.bounds();
            double left = Math.max(b[0], lo);
            double right = Math.min(b[2], hi);
            if (Double.isFinite(b[0]) && Double.isFinite(b[2]) && left <= right) {
                xs.add((left + right) / 2);
            }
        }
        return xs.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /** The bands along the column x from yFrom to yTo, bottom first. */
    static List<Band> bandsAt(CaseSpec spec, double x, double yFrom, double yTo, double cellSize) {
        double step = cellSize / SAMPLES_PER_CELL;
        long samples = (long) Math.ceil((yTo - yFrom) / step);
        List<Band> bands = new ArrayList<>();
        String current = spec.materialAt(x, yFrom);
        double bandStart = yFrom;
        double previous = yFrom;
        for (long k = 1; k <= samples; k++) {
            double y = k == samples ? yTo : yFrom + k * step;
            String sampled = spec.materialAt(x, y);
            double lo = previous;
            while (!sampled.equals(current)) {
                // current at lo, something else at y: bisect to the first change above lo
                double a = lo;
                double b = y;
                while (true) {
                    // down to adjacent doubles: the transfer matrix then sees the written thickness to round-off
                    double mid = 0.5 * (a + b);
                    if (mid <= a || mid >= b) {
                        break; // the bracket is down to adjacent doubles
                    }
                    if (spec.materialAt(x, mid).equals(current)) {
                        a = mid;
                    } else {
                        b = mid;
                    }
                }
                double edge = 0.5 * (a + b);
                // a band thinner than EDGE_RESOLUTION cells is round-off where two shapes' faces meet, not a layer:
                // the plasmon-sensor beam example's layer_stack top and the half_plane through it left a 5e-23 m
                // sliver of the background at some x and not at others, and its footprint check flagged that
                if (edge - bandStart > EDGE_RESOLUTION * cellSize || bands.isEmpty() && edge > bandStart) {
                    bands.add(new Band(current, bandStart, edge));
                    bandStart = edge;
                } // else: a sliver where two shapes' faces meet (a point, or a round-off width, of neither), no band
                current = spec.materialAt(x, b);
                lo = b;
            }
            previous = y;
        }
        bands.add(new Band(current, bandStart, yTo));
        return bands;
    }

    /**
     * The lowest y where two columns' bands differ in material over more than {@code tolerance} of y,
     * as a sentence; empty when they agree.
     */
    private static Optional<String> firstDifference(List<Band> a, double xa, List<Band> b, double xb, double yFrom,
            double tolerance) {
        int i = 0;
        int j = 0;
        double lo = yFrom;
        while (i < a.size() && j < b.size()) {
            Band ba = a.get(i);
            Band bb = b.get(j);
            double hi = Math.min(ba.yHigh(), bb.yHigh());
            if (!ba.material().equals(bb.material()) && hi - lo > tolerance) {
                return Optional.of(String.format("at y = %s the material is %s at x = %s but %s at x = %s",
                        length(0.5 * (lo + hi)), ba.material(), length(xa), bb.material(), length(xb)));
            }
            if (ba.yHigh() == hi) {
                i++;
            }
            if (bb.yHigh() == hi) {
                j++;
            }
            lo = hi;
        }
        return Optional.empty();
    }

    private static String length(double metres) {
        return Units.format(metres, Dimension.LENGTH);
    }
}
