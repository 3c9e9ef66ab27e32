package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.source.ComputedIncident;

/** Plans a case's flux lines, the incident-power run that normalises them and, for a layered scene, the exact stack. */
final class FluxPlanner {

    /** The incident power is read this many cells ahead of the launching line (clear of the source row's own cells). */
    static final int INCIDENT_OFFSET = 3;

    private FluxPlanner() {
    }

    /**
     * @param interior   the nodes outside every PML, {i0, j0, i1, j1} (i1, j1 exclusive)
     * @param run        the case's run, to which the lines are added
     * @param configured makes a builder with the case's sources, sides and numerics for a material grid
     * @param setup      what {@code configured} configures besides the material grid (for the incident-power run's key)
     * @param stop       when the run ends (a continuous wave's window ends there)
     * @param dt         the time step, s
     * @param surfacesFrequencies the frequencies (Hz) of a {@code surfaces} section whose powers are normalised by the
     *                   incident power: its incident line rides on this incident-power run (a recorder of the run, part
     *                   of its key and of the strip); null without one
     * @param errors     receives what cannot be planned
     */
    static FluxPlan plan(CaseSpec spec, GridSpec grid, int[] interior, Map<String, Material> materials,
                         Simulation.Builder run, Function<MaterialGrid, Simulation.Builder> configured,
                         IncidentKey.Setup setup, CasePlan.Stop stop, double dt, double[] surfacesFrequencies,
                         List<Diagnostic> errors) {
        FluxSpec f = spec.flux().orElseThrow();
        SourceSpec.Launched w = PlaneWaves.launched(spec).orElseThrow();
        // lines span the whole width with periodic sides, else the interior between the side PMLs
        boolean periodic = w instanceof SourceSpec.PlaneWave;
        int i0 = periodic ? 0 : interior[0];
        int i1 = periodic ? grid.nx() : interior[2];
        MaterialSpec medium = PlaneWaves.medium(spec, w);
        double[] freqs = f.frequencies().stream().mapToDouble(v -> v.si()).toArray();
        double dx = grid.cellSize();
        int dir = w.direction().value().sign();
        var pol = spec.polarization().value();
        MaterialGrid homogeneous = Rasterizer.rasterize(Scene.builder(materials.get(medium.name())).build(), grid,
                Smoothing.ANISOTROPIC);
        SteadyState steady = w.signal() instanceof SignalSpec.RampedWave rw
                ? continuousWindow(spec, grid, rw, stop.maxSteps() * dt, errors) : null;
        // pulses: every few steps is the same transform (MapStride, as field maps; issue 18); a continuous wave's
        // window of whole periods keeps every step
        int stride = steady != null ? 1 : MapStride.of(spec.sources().stream().map(x -> x.signal()).toList(), freqs, dt);
        Recorders reference = new Recorders(configured.apply(homogeneous), new IncidentKey(setup, homogeneous), freqs,
                steady, stride, pol);
        Optional<org.evanesce.solver.source.SheetResponse> sheets = BeamIncident.of(spec, f, w, medium,
                materials.get(medium.name()), setup, grid.nx());
        sheets.ifPresent(c -> reference.key.method("computed from the beam's sheets, FFT of " + c.size()));
        // a plane wave in one lossless medium, open above and below: the one-dimensional problem in closed form
        Optional<ComputedIncident> computed = sheets.<ComputedIncident>map(c -> c).or(() -> PlaneWaveIncident.of(f, w, medium,
                materials.get(medium.name()), setup, grid.nx(), dx, dt));
        if (sheets.isEmpty()) {
            computed.ifPresent(c -> reference.key.method("computed from the plane wave's sheet, one wavenumber"));
        }
        FluxSpec.IncidentRun how = f.incidentRun().value();
        if (how == FluxSpec.IncidentRun.STRIP && !periodic) {
            errors.add(new Diagnostic(Diagnostic.Severity.ERROR, f.incidentRun().at(), "flux.incident_run", "'strip' "
                    + "steps a strip of a plane wave with periodic sides, and this case's source is a " + w.kind()
                    + "; expected auto or full"));
        }
        if (computed.isEmpty() && periodic && how != FluxSpec.IncidentRun.FULL && grid.nx() > STRIP_COLUMNS) {
            reference.strip(setup, materials.get(medium.name()), grid);
        }
        List<FluxPlan.Line> lines = new ArrayList<>();
        List<FluxLine[]> runHalves = new ArrayList<>();
        List<FluxLine[]> referenceHalves = new ArrayList<>();
        for (FluxSpec.Line l : f.lines()) {
            int row = CasePlanner.nearest(l.y().si(), grid.y0(), dx, 0.5);
            FluxLine a = windowed(new FluxLine(pol, row, i0, i1, freqs), steady, stride);
            FluxLine b = windowed(new FluxLine(pol, row, i0, i1, freqs), steady, stride);
            run.listener(a);
            reference.add("line", b);
            lines.add(new FluxPlan.Line(l, row, grid.y0() + (row + 0.5) * dx, a, b));
            if (steady != null) {
                runHalves.add(halves(steady, a, freqs, pol, run));
                referenceHalves.add(reference.halves(steady, b, freqs, pol));
            }
        }
        int sourceRow = CasePlanner.nearest(w.y().si(), grid.y0(), dx, w.component().value().dy);
        // the line at (row + ½)Δ lies INCIDENT_OFFSET cells from the source row in the direction of travel
        int incidentRow = dir > 0 ? sourceRow + INCIDENT_OFFSET - 1 : sourceRow - INCIDENT_OFFSET;
        if (incidentRow < 1 || incidentRow + 2 >= grid.ny()) {
            errors.add(new Diagnostic(Diagnostic.Severity.ERROR, w.at(), "sources", String.format("the incident power is "
                    + "read %d cells ahead of the launching line, which is outside the grid; move the line away from "
                    + "the %s edge", INCIDENT_OFFSET, dir > 0 ? "top" : "bottom")));
        }
        FluxLine incident = windowed(new FluxLine(pol, Math.max(0, incidentRow), i0, i1, freqs), steady, stride);
        reference.add("incident line", incident);
        Optional<FluxPlan.Steady> check = steady == null ? Optional.empty() : Optional.of(new FluxPlan.Steady(steady,
                runHalves, referenceHalves, reference.halves(steady, incident, freqs, pol)));
        Optional<FluxLine> surfacesIncident = Optional.empty();
        if (surfacesFrequencies != null) {
            FluxLine l = windowed(new FluxLine(pol, Math.max(0, incidentRow), i0, i1, surfacesFrequencies), steady, stride);
            reference.add("surfaces' incident line", l, -1, surfacesFrequencies);
            surfacesIncident = Optional.of(l);
        }
        Optional<FluxPlan.Exact> exact = f.transferMatrix().value()
                ? transferMatrix(spec, grid, w, interior, errors, f.referencePermittivity().value(), dt, true)
                : Optional.empty();
        Optional<SourceSpec.GaussianBeamSource> beam = w instanceof SourceSpec.GaussianBeamSource b
                ? Optional.of(b) : Optional.empty();
        Optional<FluxPlan.Path> path = Optional.empty();
        if (beam.isPresent() && exact.isPresent()) {
            int row = pathRow(lines, exact.get().firstInterface(), incidentRow, dir, grid, interior);
            if (row >= 0) {
                FluxLine l = windowed(new FluxLine(pol, row, i0, i1, freqs), steady, stride);
                reference.add("path line", l);
                path = Optional.of(new FluxPlan.Path(l, grid.y0() + (row + 0.5) * dx));
            }
        }
        return new FluxPlan(freqs, PlaneWaves.kx(spec), medium.name(), medium.index(), dir, lines, incident,
                grid.y0() + (incidentRow + 0.5) * dx, reference.builder, dx, exact, beam, grid.x0(),
                (x, y) -> spec.materials().get(spec.materialAt(x, y)).index(), check, (i1 - i0) * dx,
                w.amplitude().si(), path, reference.key.hex(), reference.lines, reference.strip(), computed, surfacesIncident);
    }

    /** Columns of the strip that stands for a Bloch-periodic plane wave's incident-power run. */
    static final int STRIP_COLUMNS = 3;

    /**
     * The incident-power run's builder, its recorders in the order registered, and its key over them; for a plane
     * wave with periodic sides also the strip of {@value #STRIP_COLUMNS} columns that computes the same recorders
     * (each full-width recorder has its strip twin, see {@link FluxPlan.Strip}).
     */
    private static final class Recorders {
        final Simulation.Builder builder;
        final IncidentKey key;
        final List<FluxLine> lines = new ArrayList<>();
        final double[] freqs;
        final SteadyState steady;
        final int stride;
        final org.evanesce.solver.grid.Polarization pol;
        private Simulation.Builder strip;
        private final List<FluxLine> stripLines = new ArrayList<>();

        Recorders(Simulation.Builder builder, IncidentKey key, double[] freqs, SteadyState steady, int stride,
                  org.evanesce.solver.grid.Polarization pol) {
            this.builder = builder;
            this.key = key;
            this.freqs = freqs;
            this.steady = steady;
            this.stride = stride;
            this.pol = pol;
        }

        /**
         * Adds the strip: the incident medium on {@value #STRIP_COLUMNS} columns of the grid's height with the same
         * Bloch sides, PMLs and numerics, driven by the sources' first columns (a plane wave's row repeats with the
         * phase e^{i kx x}, so these are the same terms). Call before any recorder is added.
         */
        void strip(IncidentKey.Setup setup, Material medium, GridSpec grid) {
            GridSpec g = new GridSpec(grid.x0(), grid.y0(), grid.cellSize(), STRIP_COLUMNS, grid.ny());
            MaterialGrid m = Rasterizer.rasterize(Scene.builder(medium).build(), g, Smoothing.ANISOTROPIC);
            Simulation.Builder b = Simulation.builder(m).polarization(setup.polarization()).precision(setup.precision())
                    .courant(setup.courant()).threads(1);
            setup.sides().forEach(b::boundary);
            for (org.evanesce.solver.source.Source s : setup.sources()) {
                List<Integer> cells = new ArrayList<>();
                List<double[]> amp = new ArrayList<>();
                for (int t = 0; t < s.cells().length; t++) {
                    int i = s.cells()[t] % grid.nx();
                    int j = s.cells()[t] / grid.nx();
                    if (i < STRIP_COLUMNS) {
                        cells.add(j * STRIP_COLUMNS + i);
                        amp.add(new double[] {s.amplitudes()[t], s.imagAmplitudes()[t]});
                    }
                }
                b.source(new org.evanesce.solver.source.Source(s.component(), cells.stream().mapToInt(Integer::intValue).toArray(),
                        amp.stream().mapToDouble(a -> a[0]).toArray(), amp.stream().mapToDouble(a -> a[1]).toArray(), s.signal()));
            }
            strip = b;
            key.method("strip of " + STRIP_COLUMNS + " columns");
        }

        Optional<FluxPlan.Strip> strip() {
            return strip == null ? Optional.empty() : Optional.of(new FluxPlan.Strip(strip, stripLines, STRIP_COLUMNS));
        }

        void add(String what, FluxLine l) {
            add(what, l, -1, freqs);
        }

        /**
         * @param half −1 for the whole window, 0 or 1 for a continuous wave's early or late half
         * @param f    the line's frequencies, Hz
         */
        private void add(String what, FluxLine l, int half, double[] f) {
            builder.listener(l);
            lines.add(l);
            String window = steady == null ? "whole run" : steady + (half < 0 ? "" : half == 0 ? " early half" : " late half");
            if (stride > 1) {
                window += ", every " + stride + " steps";
            }
            key.recorder(what, l.row(), l.firstCell(), l.cells(), f, window);
            if (strip != null) {
                FluxLine s = new FluxLine(pol, l.row(), 0, STRIP_COLUMNS, f);
                s = half >= 0 ? steady.halfLine(s, half, f, pol) : windowed(s, steady, stride);
                strip.listener(s);
                stripLines.add(s);
            }
        }

        FluxLine[] halves(SteadyState steady, FluxLine like, double[] frequencies, org.evanesce.solver.grid.Polarization pol) {
            FluxLine[] h = {steady.halfLine(like, 0, frequencies, pol), steady.halfLine(like, 1, frequencies, pol)};
            add("early half", h[0], 0, freqs);
            add("late half", h[1], 1, freqs);
            return h;
        }
    }

    /** The path line lies at least this many cells along the beam's travel from the incident line, or is left out. */
    static final int MIN_PATH_CELLS = 10;

    /**
     * The incident-power run's row for the beam's path line: the mirror image, through the first interface, of the
     * reflected line farthest from it (where the incident beam would be after the same vertical travel as the
     * reflected one), moved inside the interior (one cell clear of its edges) if it falls outside; −1 when the
     * case has no reflected line or the row would lie fewer than {@value #MIN_PATH_CELLS} cells beyond the
     * incident line.
     */
    private static int pathRow(List<FluxPlan.Line> lines, double firstInterface, int incidentRow, int dir, GridSpec grid,
                               int[] interior) {
        double far = -1;
        for (FluxPlan.Line l : lines) {
            if (l.spec().measures().value() == FluxSpec.Measure.REFLECTED) {
                far = Math.max(far, Math.abs(firstInterface - l.y()));
            }
        }
        if (far < 0) {
            return -1;
        }
        int row = CasePlanner.nearest(firstInterface + dir * far, grid.y0(), grid.cellSize(), 0.5);
        row = Math.max(interior[1] + 1, Math.min(interior[3] - 3, row));
        return (row - incidentRow) * dir >= MIN_PATH_CELLS ? row : -1;
    }

    /** A continuous wave's window on {@code l}, or a pulse's stride (1: every step). */
    private static FluxLine windowed(FluxLine l, SteadyState steady, int stride) {
        return steady == null ? l.stride(stride) : l.window(steady.start(), steady.end() + 1e-6 * steady.period());
    }

    /** The early and late halves of a windowed line, registered on {@code sim}. */
    private static FluxLine[] halves(SteadyState steady, FluxLine like, double[] freqs,
                                     org.evanesce.solver.grid.Polarization pol, Simulation.Builder sim) {
        FluxLine[] h = {steady.halfLine(like, 0, freqs, pol), steady.halfLine(like, 1, freqs, pol)};
        sim.listener(h[0]);
        sim.listener(h[1]);
        return h;
    }

    /**
     * A continuous wave's flux is transformed over the last whole periods of the run once the fields
     * have settled (after three ramps and two crossings of the domain's height at the slowest speed), so
     * the switch-on and the different arrival times at different lines do not bias the ratios.
     *
     * @param end the run's end, s
     * @return the window, or null (error reported) when fewer than {@value #MIN_PERIODS} periods remain
     */
    static SteadyState continuousWindow(CaseSpec spec, GridSpec grid, SignalSpec.RampedWave rw, double end,
                                     List<Diagnostic> errors) {
        double nMax = 1;
        for (MaterialSpec m : spec.materials().values()) {
            nMax = Math.max(nMax, m.index());
        }
        double settle = 3 * rw.rampTime().si() + 2 * grid.ny() * grid.cellSize() * nMax / PhysicalConstants.C0;
        double period = 1 / rw.frequency().si();
        long periods = (long) Math.floor((end - settle) / period);
        if (periods < MIN_PERIODS) {
            errors.add(new Diagnostic(Diagnostic.Severity.ERROR, spec.stop().at(), "until", String.format(java.util.Locale.ROOT,
                    "a continuous wave's flux is read over whole periods after the fields have settled (%s: three ramps and "
                            + "two crossings of the domain); the run ends at %s, leaving %d periods, fewer than %d; run until at "
                            + "least %s (or use a pulse)", Units.format(settle, Dimension.TIME), Units.format(end, Dimension.TIME),
                    Math.max(0, periods), MIN_PERIODS, Units.format(settle + MIN_PERIODS * period, Dimension.TIME))));
            return null;
        }
        return new SteadyState(end - periods * period, end, period, periods);
    }

    /** Fewest whole periods a continuous wave's flux is transformed over. */
    static final int MIN_PERIODS = 10;

    /**
     * The exact reference. For a plane wave the scene must be layered (the same at every x over the
     * interior). For a Gaussian beam it is the stack under the beam: the bands along the vertical
     * through the point where the beam's axis meets the first interface, whatever lies elsewhere (the
     * edges are what the simulation adds). Either way the wave must be launched in the outermost
     * medium, transmitted lines lie in the last medium and reflected ones in the first.
     */
    /**
     * The exact stack under the case's plane wave or beam, with the flux lines checked against it when the case
     * has a flux section (without one, as for a fit, only the stack is read; findings then point at the source).
     */
    static Optional<FluxPlan.Exact> transferMatrix(CaseSpec spec, GridSpec grid, SourceSpec.Launched w,
                                                          int[] interior, List<Diagnostic> errors,
                                                          FluxSpec.ReferencePermittivity permittivity, double dt,
                                                          boolean checkFootprint) {
        FluxSpec f = spec.flux().orElse(null);
        double dx = grid.cellSize();
        double yLow = grid.y0() + interior[1] * dx;
        double yHigh = grid.y0() + (interior[3] - 1) * dx;
        String path = "flux.transfer_matrix";
        boolean up = w.direction().value() == SourceSpec.Direction.UP;
        List<LayeredProfile.Band> bands;
        double column = 0;
        if (w instanceof SourceSpec.GaussianBeamSource b) {
            column = axisHit(spec, b, up ? yHigh : yLow, dx);
            bands = LayeredProfile.bandsAt(spec, column, yLow, yHigh, dx);
        } else {
            LayeredProfile.Result r = LayeredProfile.of(spec, grid.x0(), grid.x0() + grid.nx() * dx, yLow, yHigh, dx);
            if (!r.isLayered()) {
                errors.add(new Diagnostic(Diagnostic.Severity.ERROR, f != null ? f.transferMatrix().at() : w.at(),
                        f != null ? path : "sources", "the scene is not layered (the "
                        + "same at every x across the domain), so it has no exact plane-wave answer: " + r.whyNot()
                        + "; expected horizontal layers (half_plane, layer_stack, or full-width rectangles) or "
                        + "transfer_matrix: false"));
                return Optional.empty();
            }
            bands = r.bands().orElseThrow();
        }
        LayeredProfile.Band first = up ? bands.get(0) : bands.get(bands.size() - 1);
        LayeredProfile.Band last = up ? bands.get(bands.size() - 1) : bands.get(0);
        double ys = w.y().si();
        if (ys < first.yLow() || ys > first.yHigh()) {
            double edge = up ? first.yHigh() : first.yLow();
            errors.add(new Diagnostic(Diagnostic.Severity.ERROR, w.y().at(), path, String.format("the source at y = %s "
                    + "has an interface behind it (at y = %s, %s meets %s%s); the exact answer is for a stack lit from one "
                    + "side: launch the wave in the outermost medium", len(ys), len(edge), first.material(),
                    bands.get(up ? 1 : bands.size() - 2).material(),
                    w instanceof SourceSpec.GaussianBeamSource ? ", under the beam at x = " + len(column) : "")));
            return Optional.empty();
        }
        for (int k = 0; f != null && k < f.lines().size(); k++) {
            FluxSpec.Line l = f.lines().get(k);
            boolean t = l.measures().value() == FluxSpec.Measure.TRANSMITTED;
            LayeredProfile.Band b = t ? last : first;
            double y = l.y().si();
            if (y < b.yLow() || y > b.yHigh() || bands.size() == 1 && t != (up == y > ys)) {
                errors.add(new Diagnostic(Diagnostic.Severity.ERROR, l.y().at(), "flux.lines[" + k + "].y", String.format(
                        "compared with the exact answer, a %s line belongs in the %s medium (%s, y from %s to %s); it is at y = %s",
                        l.measures().value().caseName(), t ? "exit" : "incident", b.material(), len(b.yLow()), len(b.yHigh()),
                        len(y))));
            }
        }
        LayeredProfile.Direction dir = up ? LayeredProfile.Direction.UP : LayeredProfile.Direction.DOWN;
        double firstInterface = up ? first.yHigh() : first.yLow();
        // only a run reports the check (FluxResults); fits and tolerance studies read the stack thousands of times
        double differsAt = checkFootprint && w instanceof SourceSpec.GaussianBeamSource b
                ? stackDiffersAt(spec, bands, column, b.waist().si() / Math.cos(b.angle().si()), yLow, yHigh, dx) : Double.NaN;
        double stackDt = permittivity == FluxSpec.ReferencePermittivity.DISCRETE ? dt : 0;
        List<String> media = new ArrayList<>();
        for (LayeredProfile.Band b : bands) {
            media.add(b.material());
        }
        if (!up) {
            java.util.Collections.reverse(media);
        }
        for (int k = 1; k < media.size(); k++) {
            MaterialSpec mk = spec.materials().get(media.get(k));
            if (mk != null && mk.isPerfectConductor()) {
                media.subList(k + 1, media.size()).clear(); // the stack ends at the first perfect conductor
                break;
            }
        }
        if (media.size() == 1) {
            media.add(media.get(0)); // the same medium on both sides, no layers (LayeredProfile.stack)
        }
        return Optional.of(new FluxPlan.Exact(wl -> LayeredProfile.stack(bands, spec.materials(), wl, dir, stackDt),
                firstInterface, column, differsAt, media, permittivity, dt));
    }

    /** Verticals compared on each side of the column. */
    private static final int VERTICALS_PER_SIDE = 8;

    /**
     * The x nearest {@code column} within ±{@link FluxPlan.Exact#FOOTPRINTS_CHECKED} footprints where the layers differ from
     * {@code bands} (another sequence of materials, or an interface more than half a cell away), or NaN. The outer
     * edges of the first and last bands are not compared (they lie behind the source or beyond the lines).
     */
    static double stackDiffersAt(CaseSpec spec, List<LayeredProfile.Band> bands, double column, double footprint,
                                 double yLow, double yHigh, double dx) {
        for (int n = 1; n <= VERTICALS_PER_SIDE; n++) {
            for (int side : new int[] {-1, 1}) {
                double x = column + side * FluxPlan.Exact.FOOTPRINTS_CHECKED * footprint * n / VERTICALS_PER_SIDE;
                List<LayeredProfile.Band> other = LayeredProfile.bandsAt(spec, x, yLow, yHigh, dx);
                if (!sameLayers(bands, other, 0.5 * dx)) {
                    return x;
                }
            }
        }
        return Double.NaN;
    }

    private static boolean sameLayers(List<LayeredProfile.Band> a, List<LayeredProfile.Band> b, double slack) {
        if (a.size() != b.size()) {
            return false;
        }
        for (int k = 0; k < a.size(); k++) {
            if (!a.get(k).material().equals(b.get(k).material())) {
                return false;
            }
            if (k > 0 && Math.abs(a.get(k).yLow() - b.get(k).yLow()) > slack) {
                return false;
            }
        }
        return true;
    }

    /**
     * x where a beam's axis, followed from its launching line in its direction, first meets another
     * material (bisected to 1e-6 of a cell); the axis's crossing of {@code yEnd} when it meets none.
     */
    static double axisHit(CaseSpec spec, SourceSpec.GaussianBeamSource b, double yEnd, double cell) {
        double x0 = b.axisAtLine();
        double y0 = b.y().si();
        double tan = Math.tan(b.angle().si()) * b.direction().value().sign();
        String start = spec.materialAt(x0, y0);
        double length = Math.abs(yEnd - y0);
        double step = cell / 8;
        double prev = 0;
        for (double d = step; d <= length + step; d += step) {
            double s = Math.min(d, length);
            double y = y0 + s * b.direction().value().sign();
            if (!spec.materialAt(x0 + (y - y0) * tan, y).equals(start)) {
                double a = prev;
                double c = s;
                while (c - a > 1e-6 * cell) {
                    double m = 0.5 * (a + c);
                    double ym = y0 + m * b.direction().value().sign();
                    if (spec.materialAt(x0 + (ym - y0) * tan, ym).equals(start)) {
                        a = m;
                    } else {
                        c = m;
                    }
                }
                return x0 + c * b.direction().value().sign() * tan;
            }
            prev = s;
            if (s == length) {
                break;
            }
        }
        return x0 + (yEnd - y0) * tan;
    }

    private static String len(double metres) {
        return Units.format(metres, Dimension.LENGTH);
    }
}
