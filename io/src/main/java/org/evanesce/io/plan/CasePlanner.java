package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.LayerStack;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.geometry.shape.HalfPlane;
import org.evanesce.geometry.shape.Polygon;
import org.evanesce.geometry.shape.Rectangle;
import org.evanesce.geometry.shape.Shape;
import org.evanesce.io.casefile.model.BoundarySpec;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.model.OutputSpec;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.ProbeSpec;
import org.evanesce.io.casefile.model.ShapeSpec;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.model.StopSpec;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.plan.grid.GridDerivation;
import org.evanesce.io.plan.grid.GridPlan;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.DispersionCorrection;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.Probe;
import org.evanesce.solver.source.CarrierSignal;
import org.evanesce.solver.source.GaussianBeam;
import org.evanesce.solver.source.TotalFieldBox;
import org.evanesce.solver.source.GaussianPulse;
import org.evanesce.solver.source.IncidentSheet;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;

/**
 * Maps a validated {@link CaseSpec} onto the geometry and the solver (docs/architecture.md: CaseSpec →
 * Scene + GridSpec → MaterialGrid → the solver's plan). Whatever the file format allows but this
 * version cannot run is refused here with the case file's position.
 */
public final class CasePlanner {

    /** Steps between energy checks of a run that stops on decay: about one step's cost every 32 steps. */
    static final int DECAY_CHECK_INTERVAL = 32;

    private final CaseSpec spec;
    private final List<Diagnostic> errors = new ArrayList<>();

    private CasePlanner(CaseSpec spec) {
        this.spec = spec;
    }

    /**
     * Plans a case.
     *
     * @param threads the command line's thread count, which wins over the case's; null to use the case's
     * @throws PlanException listing everything that cannot be planned, with positions
     */
    public static CasePlan plan(CaseSpec spec, Integer threads) throws PlanException {
        return plan(spec, threads, Runtime.getRuntime().maxMemory());
    }

    /**
     * Plans a case that may use at most {@code memoryLimit} bytes of heap: one whose {@link MemoryEstimate}
     * is larger is refused before the grid is rasterised or anything large is allocated.
     */
    public static CasePlan plan(CaseSpec spec, Integer threads, long memoryLimit) throws PlanException {
        CasePlanner p = new CasePlanner(spec);
        p.memoryLimit = memoryLimit;
        return p.plan(threads);
    }

    private long memoryLimit = Long.MAX_VALUE;
    private GridPlan gridPlan;

    /** The case's grid; a case that {@link CaseLoader} read derives without errors. */
    static GridPlan grid(CaseSpec spec) throws PlanException {
        List<Diagnostic> found = new ArrayList<>();
        GridPlan g = GridDerivation.derive(spec, found);
        if (g == null) {
            throw new PlanException(found.stream().filter(Diagnostic::isError).toList());
        }
        return g;
    }

    private CasePlan plan(Integer threads) throws PlanException {
        gridPlan = grid(spec);
        double dx = gridPlan.cellSize().si();
        boolean periodic = spec.boundary(Side.LEFT) instanceof BoundarySpec.Periodic;
        GridSpec grid = gridPlan.solverGrid(periodic);
        double courant = spec.numerics().courant().map(v -> v.si()).orElse(Courant.DEFAULT);
        double dt = Courant.timeStep(courant, dx);
        Map<String, Material> materials = materials(dx, dt);
        stable(materials, courant);
        Scene scene = scene(materials);
        Map<Side, Boundary> sides = boundaries(PlaneWaves.kx(spec));
        List<Source> sources = new ArrayList<>();
        List<IncidentSheet> sheets = new ArrayList<>();
        List<Integer> boxes = new ArrayList<>();
        List<CasePlan.SourceSite> sites = new ArrayList<>();
        double fade = 0;
        for (int k = 0; k < spec.sources().size(); k++) {
            SourceSpec s = spec.sources().get(k);
            if (s instanceof SourceSpec.GaussianBeamSource beam) {
                List<IncidentSheet> pair = beam(beam, k, grid, sides, materials, dt);
                sheets.addAll(pair);
                siteOf("sources[" + k + "]." + s.kind(), pair, grid).ifPresent(sites::add);
                double latest = pair.stream().flatMapToDouble(p -> java.util.Arrays.stream(p.delays())).max().orElse(0);
                fade = Math.max(fade, fadeTime(signal(beam.signal())) + latest);
                continue;
            }
            if (s instanceof SourceSpec.PlaneWaveBox pb) {
                boxes.add(k);
                fade = Math.max(fade, fadeTime(signal(pb.signal())));
                continue;
            }
            Source src = source(s, k, grid, sides);
            if (src != null) {
                sources.add(src);
                sites.add(siteOf("sources[" + k + "]." + s.kind(), src.component(), src.cells(), grid));
                fade = Math.max(fade, fadeTime(src.signal()));
            }
        }
        List<CasePlan.NamedProbe> probes = new ArrayList<>();
        for (int k = 0; k < spec.probes().size(); k++) {
            CasePlan.NamedProbe p = probe(spec.probes().get(k), k, grid, sides);
            if (p != null) {
                probes.add(p);
            }
        }
        CasePlan.Stop stop = stop(dt, fade);
        if (!errors.isEmpty()) {
            throw new PlanException(errors);
        }
        MemoryEstimate memory = MemoryEstimate.of(spec, grid, sides, interior(sides, grid), stop.maxSteps(),
                spec.flux().isPresent() ? PlaneWaves.medium(spec, PlaneWaves.launched(spec).orElseThrow()) : null);
        // the incident-power run, which the flux plan may compute or step on a strip, counts once planned
        refuseBeyondLimit(memory.withIncidentRun(true, 0, grid.nx()));
        Integer t = threads != null ? threads : spec.numerics().threads().map(l -> l.value()).orElse(null);
        List<TotalFieldBox> planned = new ArrayList<>();
        Function<MaterialGrid, Simulation.Builder> configured = m -> {
            Simulation.Builder sb = Simulation.builder(m).polarization(spec.polarization().value())
                    .precision(spec.numerics().precision().value()).courant(courant);
            sides.forEach(sb::boundary);
            if (t != null) {
                sb.threads(t);
            }
            sources.forEach(sb::source);
            sheets.forEach(sb::incident);
            planned.forEach(sb::totalField);
            dispersive(m, materials).forEach(sb::dispersive);
            faceSeries.forEach((standIn, model) -> {
                int idx = m.materials().indexOf(standIn);
                if (idx >= 0) {
                    sb.series(idx, model);
                }
            });
            return sb;
        };
        Map<Material, org.evanesce.geometry.dispersion.DispersiveMaterial> standIns = new HashMap<>();
        spec.materials().values().stream().filter(MaterialSpec::isDispersive)
                .forEach(ms -> standIns.put(materials.get(ms.name()), ms.dispersion().orElseThrow().material()));
        MetalFaces faces = new MetalFaces(standIns);
        MaterialGrid mg = Rasterizer.rasterize(scene, grid, Smoothing.ANISOTROPIC, faces);
        faceMixtures = faces.mixtures();
        faceSeries = faces.seriesMixtures();
        for (int k : boxes) {
            SourceSpec.PlaneWaveBox pb = (SourceSpec.PlaneWaveBox) spec.sources().get(k);
            TotalFieldBox box = BoxPlanner.plan(pb, "sources[" + k + "]." + pb.kind(), mg, sides, courant, signal(pb.signal()),
                    errors);
            if (box != null) {
                planned.add(box);
                int[] n = box.nodes();
                sites.add(new CasePlan.SourceSite("sources[" + k + "]." + pb.kind(), pb.component().value(), n[0], n[1], n[2],
                        n[3]));
            }
        }
        if (!errors.isEmpty()) {
            throw new PlanException(errors);
        }
        if (!standIns.isEmpty()) {
            long metalBytes = Simulation.dispersiveFootprint(mg, spec.polarization().value(), spec.numerics().precision().value(),
                    sides, dispersive(mg, materials));
            MaterialSpec first = spec.materials().values().stream().filter(MaterialSpec::isDispersive).findFirst().orElseThrow();
            memory = memory.with(new MemoryEstimate.Item("dispersive cells' currents", metalBytes, first.at(),
                    "materials." + first.name(), "a larger cell or less metal"));
            if (memory.withIncidentRun(true, 0, grid.nx()).total() > memoryLimit) {
                error(first.at(), "materials." + first.name(), String.format("the run needs about %s of memory (%s) but the JVM "
                        + "may use at most %s; give the JVM more memory (e.g. JAVA_OPTS=-Xmx%dg) or use a larger cell",
                        MemoryEstimate.format(memory.total()), memory.breakdown(), MemoryEstimate.format(memoryLimit),
                        (long) Math.ceil(memory.total() * 1.25 / (1L << 30))));
                throw new PlanException(errors);
            }
        }
        Simulation.Builder b = configured.apply(mg);
        probes.forEach(p -> b.listener(p.probe()));
        Optional<FluxPlan> flux = Optional.empty();
        IncidentKey.Setup setup = new IncidentKey.Setup(spec.polarization().value(), spec.numerics().precision().value(),
                courant, sides, sources, sheets);
        if (spec.flux().isPresent()) {
            // a surfaces section normalised by the incident power reads it on a line of this incident-power run
            double[] surfacesFrequencies = spec.surfaces().filter(s -> s.normalise().value()
                    == org.evanesce.io.casefile.model.SurfacesSpec.Normalise.INCIDENT)
                    .map(s -> s.frequencies().stream().mapToDouble(v -> v.si()).toArray()).orElse(null);
            flux = Optional.of(FluxPlanner.plan(spec, grid, interior(sides, grid), materials, b, configured, setup, stop, dt,
                    surfacesFrequencies, errors));
            if (!errors.isEmpty()) {
                throw new PlanException(errors);
            }
            FluxPlan fp = flux.get();
            memory = memory.withIncidentRun(fp.computed().isPresent(), fp.strip().map(FluxPlan.Strip::columns).orElse(0),
                    grid.nx());
            refuseBeyondLimit(memory);
        }
        Optional<SurfacePlan> surfaces = Optional.empty();
        if (spec.surfaces().isPresent()) {
            surfaces = Optional.of(SurfacePlanner.plan(spec, grid, interior(sides, grid), materials, b, configured, stop, dt,
                    sites, flux, planned, setup, errors));
            if (!errors.isEmpty()) {
                throw new PlanException(errors);
            }
        }
        Map<String, Double> eps = new java.util.TreeMap<>();
        materials.forEach((name, m) -> eps.put(name, m.relativePermittivity()));
        FieldPlan fields = fieldPlan(grid, interior(sides, grid), stop, dt, b, sides);
        incidentOnGrid(eps, dx, dt, courant);
        if (!errors.isEmpty()) {
            throw new PlanException(errors);
        }
        return new CasePlan(spec, grid, mg, b, List.copyOf(probes), stop, dt, interior(sides, grid), flux, eps, fields,
                List.copyOf(sites), memory, surfaces, List.copyOf(planned));
    }

    /** Refuses the case (its largest part named) when the estimate exceeds the memory the JVM may use. */
    private void refuseBeyondLimit(MemoryEstimate memory) throws PlanException {
        if (memory.total() > memoryLimit) {
            MemoryEstimate.Item big = memory.largest();
            error(big.at(), big.path(), String.format("the run needs about %s of memory (%s) but the JVM may use at most %s; "
                    + "largest part: %s (%s), to reduce it: %s; or give the JVM more memory (e.g. JAVA_OPTS=-Xmx%dg)",
                    MemoryEstimate.format(memory.total()), memory.breakdown(), MemoryEstimate.format(memoryLimit), big.what(),
                    MemoryEstimate.format(big.bytes()), big.reduce(), (long) Math.ceil(memory.total() * 1.25 / (1L << 30))));
            throw new PlanException(errors);
        }
    }

    /** The span of sites a source drives (its cells are flat indices j·nx + i). */
    private static CasePlan.SourceSite siteOf(String path, Component c, int[] cells, GridSpec g) {
        int i0 = Integer.MAX_VALUE;
        int j0 = Integer.MAX_VALUE;
        int i1 = Integer.MIN_VALUE;
        int j1 = Integer.MIN_VALUE;
        for (int cell : cells) {
            int i = cell % g.nx();
            int j = cell / g.nx();
            i0 = Math.min(i0, i);
            j0 = Math.min(j0, j);
            i1 = Math.max(i1, i);
            j1 = Math.max(j1, j);
        }
        return new CasePlan.SourceSite(path, c, i0, j0, i1, j1);
    }

    /** y of row j of a component's sites, formatted with its unit. */
    private static String siteY(GridSpec g, int j, Component c) {
        return org.evanesce.io.casefile.expr.Units.format(g.y0() + (j + c.dy) * g.cellSize(),
                org.evanesce.io.casefile.expr.Dimension.LENGTH);
    }

    /** A beam's launching row: the electric sheet's sites. */
    private static Optional<CasePlan.SourceSite> siteOf(String path, List<IncidentSheet> pair, GridSpec g) {
        return pair.stream().filter(p -> p.component().electric).findFirst()
                .map(p -> siteOf(path, p.component(), p.cells(), g));
    }

    private void error(SourcePosition at, String path, String message) {
        errors.add(new Diagnostic(Diagnostic.Severity.ERROR, at, path, message));
    }

    /** The nodes inside a region, clamped to the grid: {i0, j0, i1, j1} (i1, j1 exclusive; may be empty). */
    static int[] nodeBox(OutputSpec.Region r, GridSpec g) {
        double d = g.cellSize();
        int i0 = (int) Math.max(0, Math.min(g.nx(), Math.ceil((r.xMin() - g.x0()) / d - 1e-9)));
        int i1 = (int) Math.max(0, Math.min(g.nx(), Math.floor((r.xMax() - g.x0()) / d + 1e-9) + 1));
        int j0 = (int) Math.max(0, Math.min(g.ny(), Math.ceil((r.yMin() - g.y0()) / d - 1e-9)));
        int j1 = (int) Math.max(0, Math.min(g.ny(), Math.floor((r.yMax() - g.y0()) / d + 1e-9) + 1));
        return new int[] {i0, j0, i1, j1};
    }

    /** The node box of a region (nodes inside it), or the interior; null (error reported) when it holds fewer than 3 x 3 nodes (the field files and maps need a grid of at least 3 along each axis). */
    private int[] box(Optional<OutputSpec.Region> region, String path, GridSpec g, int[] interior) {
        if (region.isEmpty()) {
            return interior.clone();
        }
        OutputSpec.Region r = region.get();
        double d = g.cellSize();
        int[] nb = nodeBox(r, g);
        int i0 = nb[0];
        int j0 = nb[1];
        int i1 = nb[2];
        int j1 = nb[3];
        if (i1 - i0 < 3 || j1 - j0 < 3) {
            error(r.at(), path, String.format("the region holds %d x %d grid nodes; it must hold at least 3 x 3 inside the grid "
                    + "(x from %.4g um to %.4g um, y from %.4g um to %.4g um)", Math.max(0, i1 - i0), Math.max(0, j1 - j0),
                    g.x0() * 1e6, (g.x0() + (g.nx() - 1) * d) * 1e6, g.y0() * 1e6, (g.y0() + (g.ny() - 1) * d) * 1e6));
            return null;
        }
        return new int[] {i0, j0, i1, j1};
    }

    /**
     * With {@code maps.normalise: incident} and a plane wave: whether the wave propagates on the grid at each map
     * frequency (the case's checks test the continuous medium; near grazing incidence the grid's dispersion can
     * make a frequency evanescent there), else an error: there would be no incident field to divide by.
     */
    private void incidentOnGrid(Map<String, Double> gridEps, double dx, double dt, double courant) {
        if (spec.maps().isEmpty() || spec.maps().get().normalise().value() != org.evanesce.io.casefile.model.MapsSpec.Normalise.INCIDENT
                || !(PlaneWaves.launched(spec).orElse(null) instanceof SourceSpec.PlaneWave w)) {
            return;
        }
        MaterialSpec medium = PlaneWaves.medium(spec, w);
        for (org.evanesce.io.casefile.text.Value f : spec.maps().get().frequencies()) {
            try {
                org.evanesce.solver.source.PlaneSheetAmplitude.electricPerCurrent(spec.polarization().value(),
                        spec.numerics().precision().value(), courant, gridEps.getOrDefault(medium.name(),
                                medium.relativePermittivity().si()), PlaneWaves.launchedKx(spec) * dx, 2 * Math.PI * f.si() * dt);
            } catch (IllegalArgumentException e) {
                error(f.at(), "maps", String.format("with normalise: incident, at %s the plane wave does not propagate on the "
                        + "grid in %s (its in-plane wavenumber is too close to the medium's, or the frequency beyond what the "
                        + "cells resolve): there is no incident field to divide by; expected a map wavelength further from "
                        + "grazing incidence, or smaller cells", org.evanesce.io.casefile.expr.Units.format(
                        org.evanesce.geometry.PhysicalConstants.C0 / f.si(), org.evanesce.io.casefile.expr.Dimension.LENGTH),
                        medium.name()));
            }
        }
    }

    /** Field files, frames and maps; maps are registered on the run. */
    private FieldPlan fieldPlan(GridSpec g, int[] interior, CasePlan.Stop stop, double dt, Simulation.Builder run,
                                Map<Side, Boundary> sides) {
        OutputSpec out = spec.output();
        int[] box = box(out.region(), "output.region", g, interior);
        List<Component> comps = out.components().isEmpty()
                ? List.of(spec.polarization().value().components())
                : out.components().stream().map(l -> l.value()).toList();
        long[] frames = new long[0];
        if (out.writes(OutputSpec.Item.FIELD_FRAMES)) {
            long last = stop.maxSteps();
            if (out.frameInterval().isPresent() || out.frameSteps().isPresent()) {
                long every = out.frameSteps().orElseGet(() -> Math.max(1, Math.round(out.frameInterval().get().si() / dt)));
                long count = last / every;
                if (count > 100_000) {
                    error(out.frameInterval().map(Value::at).orElse(out.write().get(0).at()), "output.frame_interval",
                            String.format("%d frames (one file each) is too "
                            + "many; expected an interval giving at most 100000 frames over the run's %d steps", count, last));
                } else {
                    frames = java.util.stream.LongStream.rangeClosed(1, count).map(k -> k * every).toArray();
                }
            } else {
                frames = out.frameTimes().stream().mapToLong(t -> Math.max(1, Math.round(t.si() / dt))).toArray();
            }
        }
        Optional<FieldPlan.Maps> maps = Optional.empty();
        if (spec.maps().isPresent()) {
            var m = spec.maps().get();
            int[] mbox = box(m.region().isPresent() ? m.region() : out.region(), m.region().isPresent() ? "maps.region"
                    : "output.region", g, interior);
            if (mbox != null) {
                double[] f = m.frequencies().stream().mapToDouble(v -> v.si()).toArray();
                org.evanesce.solver.record.FieldMap fm = new org.evanesce.solver.record.FieldMap(spec.polarization().value(),
                        mbox[0], mbox[1], mbox[2], mbox[3], f);
                // a continuous wave's maps: whole periods after the fields settle, as its flux, checked on the
                // region's middle row; with several sources there is no one period to window (flagged after the run)
                var ramped = spec.sources().stream().map(x -> x.signal())
                        .filter(x -> x instanceof org.evanesce.io.casefile.model.SignalSpec.RampedWave).findFirst();
                Optional<SteadyState> steady = Optional.empty();
                List<org.evanesce.solver.record.FluxLine> halves = List.of();
                if (ramped.isPresent() && spec.sources().size() == 1) {
                    SteadyState w = FluxPlanner.continuousWindow(spec, g,
                            (org.evanesce.io.casefile.model.SignalSpec.RampedWave) ramped.get(), stop.maxSteps() * dt, errors);
                    if (w != null) {
                        fm.window(w.start(), w.end() + 1e-6 * w.period());
                        steady = Optional.of(w);
                        var middle = new org.evanesce.solver.record.FluxLine(spec.polarization().value(),
                                (mbox[1] + mbox[3] - 1) / 2, mbox[0], mbox[2], f);
                        halves = List.of(w.halfLine(middle, 0, f, spec.polarization().value()),
                                w.halfLine(middle, 1, f, spec.polarization().value()));
                        halves.forEach(run::listener);
                    }
                }
                if (steady.isEmpty()) {
                    // pulses: every few steps is the same transform (MapStride; issue 18)
                    fm.stride(MapStride.of(spec.sources().stream().map(x -> x.signal()).toList(), f, dt));
                }
                run.listener(fm);
                for (int k = 0; k < m.decay().size(); k++) {
                    var l = m.decay().get(k);
                    for (var p : List.of(l.from(), l.to())) {
                        double i = (p.x().si() - g.x0()) / g.cellSize();
                        double j = (p.y().si() - g.y0()) / g.cellSize();
                        if (i < mbox[0] || i > mbox[2] - 1 || j < mbox[1] || j > mbox[3] - 1) {
                            error(p.at(), "maps.decay[" + k + "]", String.format("the point (%.4g um, %.4g um) lies outside the "
                                    + "mapped region; a decay line must lie inside it", p.x().si() * 1e6, p.y().si() * 1e6));
                        }
                    }
                }
                maps = Optional.of(new FieldPlan.Maps(m, fm, mbox, steady, halves, ramped.isPresent() && steady.isEmpty()));
            }
        }
        return new FieldPlan(box == null ? interior : box, comps, frames, maps);
    }

    /**
     * The materials as the grid uses them: with the dispersion correction (a plane-wave or beam case,
     * unless the case turns it off) each lossless material's permittivity is the one for which the
     * grid's normal wavenumber is exact at the centre frequency and kx of the plane wave (of a beam's
     * axis).
     */
    private Map<String, Material> materials(double dx, double dt) {
        Optional<SourceSpec.Launched> wave = PlaneWaves.launched(spec);
        boolean correct = spec.numerics().correctsDispersion(wave.isPresent());
        Map<String, Material> out = new HashMap<>();
        for (MaterialSpec m : spec.materials().values()) {
            double eps = m.relativePermittivity().si();
            if (m.isDispersive()) {
                // the grid's stand-in entry: the engine replaces its εr, σ by the model's update; ε∞ sets the Courant limit
                out.put(m.name(), new Material(m.name(), eps, 0));
                continue;
            }
            if (correct && m.conductivity().si() == 0) {
                double omega = 2 * Math.PI * wave.orElseThrow().signal().frequency().si();
                try {
                    eps = DispersionCorrection.permittivity(eps, PlaneWaves.launchedKx(spec), omega, dx, dt);
                    if (!(eps > 0) || Double.isInfinite(eps)) {
                        throw new IllegalArgumentException("the corrected relative permittivity " + Units.number(eps)
                                + " is not a positive number; the grid is too coarse for this material at this angle");
                    }
                } catch (IllegalArgumentException e) {
                    error(spec.numerics().dispersionCorrection().map(Located::at).orElse(wave.get().at()),
                            "numerics.dispersion_correction", "material " + m.name() + ": " + e.getMessage());
                    eps = m.relativePermittivity().si();
                }
            }
            out.put(m.name(), new Material(m.name(), eps, m.conductivity().si()));
        }
        return out;
    }

    /**
     * The dispersive materials of a grid by their stand-in entry's index (entries the grid does not hold, such as
     * a metal in the incident-power run, are left out).
     */
    private Map<Integer, org.evanesce.geometry.dispersion.DispersiveMaterial> dispersive(MaterialGrid grid,
            Map<String, Material> materials) {
        Map<Integer, org.evanesce.geometry.dispersion.DispersiveMaterial> out = new java.util.TreeMap<>();
        for (MaterialSpec m : spec.materials().values()) {
            if (m.isDispersive()) {
                int idx = grid.materials().indexOf(materials.get(m.name()));
                if (idx >= 0) {
                    out.put(idx, m.dispersion().orElseThrow().material());
                }
            }
        }
        faceMixtures.forEach((standIn, model) -> {
            int idx = grid.materials().indexOf(standIn);
            if (idx >= 0) {
                out.put(idx, model);
            }
        });
        return out;
    }

    /** The face averages of metals the rasteriser made ({@link MetalFaces}), by stand-in entry. */
    private Map<Material, org.evanesce.geometry.dispersion.DispersiveMaterial> faceMixtures = Map.of();
    /** The harmonic means at metal faces ({@link MetalFaces}, a field across the face), by stand-in entry. */
    private Map<Material, org.evanesce.geometry.dispersion.SeriesMaterial> faceSeries = Map.of();

    /**
     * The Courant number must lie below the 2D limit 1/√2 scaled by √εr of the smallest permittivity
     * below 1 (the grid's fastest wave): the solver would refuse it when the run is built.
     */
    private void stable(Map<String, Material> materials, double courant) {
        Material slowest = null;
        for (Material m : materials.values()) {
            if (slowest == null || m.relativePermittivity() < slowest.relativePermittivity()) {
                slowest = m;
            }
        }
        if (slowest == null || slowest.relativePermittivity() >= 1) {
            return;
        }
        double limit = Courant.limit(slowest.relativePermittivity());
        if (courant < limit) {
            return;
        }
        MaterialSpec m = spec.materials().get(slowest.name());
        Optional<Value> given = spec.numerics().courant();
        String text = String.format(java.util.Locale.ROOT, "the %sCourant number %s is unstable: material %s (line %d) has a "
                + "relative permittivity of %s on the grid, below 1, which lowers the limit 1/sqrt(2) to %s; %s",
                given.isPresent() ? "" : "default ", Units.number(courant), slowest.name(), m == null ? 0 : m.at().line(),
                Units.number(slowest.relativePermittivity()), Units.number(limit), "give numerics.courant below "
                        + Units.number(limit));
        if (given.isPresent()) {
            error(given.get().at(), "numerics.courant", text);
        } else {
            error(m != null ? m.at() : gridPlan.cellSize().at(), m != null ? "materials." + m.name() : "numerics.courant",
                    text);
        }
    }

    private Scene scene(Map<String, Material> materials) {
        Scene.Builder sb = Scene.builder(materials.get(spec.domain().background().value()));
        for (int k = 0; k < spec.shapes().size(); k++) {
            ShapeSpec s = spec.shapes().get(k);
            String path = "shapes[" + k + "]." + s.kind();
            try {
                if (s instanceof ShapeSpec.LayerStack ls) {
                    double a = ls.rotation().si();
                    List<LayerStack.Layer> layers = ls.layers().stream()
                            .map(l -> new LayerStack.Layer(materials.get(l.material().value()), l.thickness().si())).toList();
                    sb.add(new LayerStack(ls.start().x().si(), ls.start().y().si(), -Math.sin(a), Math.cos(a), layers));
                } else {
                    PeriodicImages.add(sb, shape(s), materials.get(s.materials().get(0).value()), periodicSpan());
                }
            } catch (IllegalArgumentException e) {
                error(s.at(), path, e.getMessage());
            }
        }
        return sb.build();
    }

    /**
     * The period's span along x with periodic sides, the domain's {x_min, x_max} (a whole number of cells, see
     * GridDerivation; an accuracy study's offset grid samples the same repeated structure), or null without.
     */
    private double[] periodicSpan() {
        if (!(spec.boundary(Side.LEFT) instanceof BoundarySpec.Periodic)) {
            return null;
        }
        return new double[] {spec.domain().xMin(), spec.domain().xMax()};
    }

    private static Shape shape(ShapeSpec s) {
        if (s instanceof ShapeSpec.Rectangle r) {
            return new Rectangle(r.centre().x().si(), r.centre().y().si(), r.width().si(), r.height().si(), r.rotation().si());
        }
        if (s instanceof ShapeSpec.Polygon p) {
            double[][] c = p.placedCorners();
            double[] xs = new double[c.length];
            double[] ys = new double[c.length];
            for (int k = 0; k < c.length; k++) {
                xs[k] = c[k][0];
                ys[k] = c[k][1];
            }
            return new Polygon(xs, ys);
        }
        if (s instanceof ShapeSpec.Disk d) {
            return Ellipse.disk(d.centre().x().si(), d.centre().y().si(), d.radius().si());
        }
        if (s instanceof ShapeSpec.Ellipse e) {
            return new Ellipse(e.centre().x().si(), e.centre().y().si(), e.radiusX().si(), e.radiusY().si(), e.rotation().si());
        }
        if (s instanceof ShapeSpec.HalfPlane h) {
            // the case gives the direction into the filled side; the shape takes the outward normal
            return new HalfPlane(h.through().x().si(), h.through().y().si(), -Math.cos(h.inward().si()), -Math.sin(h.inward().si()));
        }
        throw new IllegalStateException("unexpected shape kind " + s.kind());
    }

    /** The solver's sides; periodic ones carry the plane wave's in-plane wavenumber kx (rad/m). */
    private Map<Side, Boundary> boundaries(double kx) {
        Map<Side, Boundary> out = new java.util.EnumMap<>(Side.class);
        for (Side side : Side.values()) {
            BoundarySpec b = spec.boundary(side);
            out.put(side, b instanceof BoundarySpec.Pml ? Boundary.pml(gridPlan.pmlCells(side))
                    : b instanceof BoundarySpec.Pmc ? Boundary.pmc()
                    : b instanceof BoundarySpec.Periodic ? Boundary.bloch(kx) : Boundary.pec());
        }
        return out;
    }

    /**
     * A point half-way between two sites (to within this many cells) goes to the site with the larger
     * index: round-off in the grid coordinate (about 1e-12 of a cell here) can then never decide.
     */
    static final double TIE_TOLERANCE = 1e-9;

    /**
     * The index of the component site nearest to coordinate v along an axis: the site k lies at
     * origin + (k + siteOffset)Δ; a point half-way between two sites (within {@link #TIE_TOLERANCE} of a
     * cell) takes the larger index (round half up). So in p polarization a point on a node drives or
     * samples the Hz site half a cell above and to the right of it, in any domain whose nodes lie there.
     */
    static int nearest(double v, double origin, double dx, double siteOffset) {
        return (int) Math.floor((v - origin) / dx - siteOffset + 0.5 + TIE_TOLERANCE);
    }

    private Source source(SourceSpec s, int k, GridSpec g, Map<Side, Boundary> sides) {
        String path = "sources[" + k + "]." + s.kind();
        double dx = g.cellSize();
        TimeSignal signal = signal(s.signal());
        if (s instanceof SourceSpec.PlaneWave w) {
            Component c = w.component().value();
            int j = nearest(w.y().si(), g.y0(), dx, c.dy);
            if (!Simulation.isUpdated(sides, g.nx(), g.ny(), c, 0, j)) {
                error(w.at(), path + ".y", String.format("the nearest row of %s sites, %d (y = %s), is on a wall or outside the "
                        + "grid; expected a height inside the domain's walls", c, j, siteY(g, j, c)));
                return null;
            }
            return Source.blochRow(c, g.nx(), j, g.x0(), dx, PlaneWaves.kx(spec), w.amplitude().si(), signal);
        }
        if (s instanceof SourceSpec.PointSource p) {
                Component c = p.component().value();
                int i = nearest(p.location().x().si(), g.x0(), dx, c.dx);
                int j = nearest(p.location().y().si(), g.y0(), dx, c.dy);
                if (!Simulation.isUpdated(sides, g.nx(), g.ny(), c, i, j)) {
                    error(p.at(), path + ".at", String.format("the nearest %s site, index (%d, %d), is on a wall or outside "
                            + "the grid; expected a point inside the domain's walls", c, i, j));
                    return null;
                }
                return Source.point(c, g.nx(), i, j, p.amplitude().si(), signal);
        }
        SourceSpec.LineSource l = (SourceSpec.LineSource) s;
        {
                Component c = l.component().value();
                if (Math.abs(l.angle().si()) > 0 || l.waist().isPresent()) {
                    error(l.at(), path, "tilted or beam-shaped line sources (angle, waist) are not available in this "
                            + "version yet; expected a line source with neither");
                    return null;
                }
                int i0 = nearest(l.from().x().si(), g.x0(), dx, c.dx);
                int j0 = nearest(l.from().y().si(), g.y0(), dx, c.dy);
                int i1 = nearest(l.to().x().si(), g.x0(), dx, c.dx);
                int j1 = nearest(l.to().y().si(), g.y0(), dx, c.dy);
                if (i0 != i1 && j0 != j1) {
                    error(l.at(), path, String.format("the line from %s site (%d, %d) to (%d, %d) is neither horizontal nor "
                            + "vertical; expected a line along x or y", c, i0, j0, i1, j1));
                    return null;
                }
                int ia = Math.min(i0, i1);
                int ib = Math.max(i0, i1);
                int ja = Math.min(j0, j1);
                int jb = Math.max(j0, j1);
                List<Integer> cells = new ArrayList<>();
                for (int j = ja; j <= jb; j++) {
                    for (int i = ia; i <= ib; i++) {
                        // cells that fall on a wall are left out: a line may run from wall to wall
                        if (Simulation.isUpdated(sides, g.nx(), g.ny(), c, i, j)) {
                            cells.add(j * g.nx() + i);
                        }
                    }
                }
                if (cells.isEmpty()) {
                    error(l.at(), path, "the line has no site inside the domain's walls");
                    return null;
                }
                double[] amp = new double[cells.size()];
                java.util.Arrays.fill(amp, l.amplitude().si());
                return new Source(c, cells.stream().mapToInt(Integer::intValue).toArray(), amp, signal);
        }
    }

    /** The pair of total-field/scattered-field sheets of a Gaussian beam (GaussianBeam), or none (error reported). */
    private List<IncidentSheet> beam(SourceSpec.GaussianBeamSource b, int k, GridSpec g, Map<Side, Boundary> sides,
                                     Map<String, Material> materials, double dt) {
        String path = "sources[" + k + "].gaussian_beam";
        String name = spec.materialAt(b.axisAtLine(), b.y().si());
        Material medium = materials.get(name);
        double reach = b.reach();
        Component c = b.component().value() == Component.EZ ? Component.EZ : Component.EX;
        int row = nearest(b.y().si(), g.y0(), g.cellSize(), c.dy);
        GaussianBeam.Spec beam = new GaussianBeam.Spec(spec.polarization().value(), b.waist().si(), b.waistAt().x().si(),
                b.waistAt().y().si(), b.angle().si(), b.direction().value() == SourceSpec.Direction.UP,
                spec.materials().get(name).relativePermittivity().si(), medium.relativePermittivity(), b.amplitude().si(),
                (CarrierSignal) signal(b.signal()));
        try {
            return GaussianBeam.sheets(beam, sides, g.nx(), g.ny(), g.x0(), g.y0(), g.cellSize(), dt, row,
                    b.axisAtLine() - reach, b.axisAtLine() + reach);
        } catch (IllegalArgumentException e) {
            error(b.at(), path + ".y", e.getMessage());
            return List.of();
        }
    }

    private static TimeSignal signal(SignalSpec s) {
        if (s instanceof SignalSpec.Pulse p) {
            return TimeSignal.gaussianPulse(p.frequency().si(), p.spectrumSigma());
        }
        if (s instanceof SignalSpec.RampedWave w) {
            return TimeSignal.rampedContinuous(w.frequency().si(), w.rampTime().si());
        }
        return TimeSignal.differentiatedGaussian(((SignalSpec.GaussianDerivative) s).width());
    }

    /** When a signal has faded to e^−18 of its peak; infinite for a continuous wave. */
    static double fadeTime(TimeSignal s) {
        if (s instanceof GaussianPulse p) {
            return 2 * p.delay();
        }
        if (s instanceof org.evanesce.solver.source.DifferentiatedGaussian d) {
            return 12 * d.width();
        }
        return Double.POSITIVE_INFINITY;
    }

    private CasePlan.NamedProbe probe(ProbeSpec p, int k, GridSpec g, Map<Side, Boundary> sides) {
        Component c = p.component().value();
        int i = nearest(p.location().x().si(), g.x0(), g.cellSize(), c.dx);
        int j = nearest(p.location().y().si(), g.y0(), g.cellSize(), c.dy);
        if (i < 0 || j < 0 || i >= g.nx() || j >= g.ny()) {
            error(p.at(), "probes[" + k + "].at", String.format("the nearest %s site, index (%d, %d), is outside the grid "
                    + "(%d × %d nodes)", c, i, j, g.nx(), g.ny()));
            return null;
        }
        return new CasePlan.NamedProbe(p.name().value(), new Probe(c, i, j), i, j);
    }

    private CasePlan.Stop stop(double dt, double fade) {
        StopSpec st = spec.stop();
        if (st instanceof StopSpec.AfterSteps s) {
            return new CasePlan.Stop.Steps(s.steps().value());
        }
        if (st instanceof StopSpec.AfterTime t) {
            return new CasePlan.Stop.Steps(steps(t.time(), "until.time", dt));
        }
        StopSpec.WhenEnergyBelow d = (StopSpec.WhenEnergyBelow) st;
        long limit = steps(d.latest(), "until.latest", dt);
        long fadeSteps = Double.isFinite(fade) ? (long) Math.ceil(fade / dt) : limit;
        return new CasePlan.Stop.Decay(d.fraction().si(), Math.min(fadeSteps, limit), limit, DECAY_CHECK_INTERVAL);
    }

    /** The steps a simulated time takes (at least 1); more than {@link StopSpec#MAX_STEPS} is an error. */
    private long steps(Value time, String path, double dt) {
        double steps = Math.ceil(time.si() / dt);
        if (steps > StopSpec.MAX_STEPS) {
            Optional<Value> courant = spec.numerics().courant();
            error(time.at(), path, String.format(java.util.Locale.ROOT, "%s takes %.3g steps of %s, more than the limit of %d steps; "
                    + "the time step is the Courant number (%s%s) times the cell size (%s) over c0: shorten the run, or raise "
                    + "the Courant number or the cell size", Units.format(time.si(), Dimension.TIME), steps,
                    Units.format(dt, Dimension.TIME), StopSpec.MAX_STEPS, Units.number(courant.map(Value::si).orElse(Courant.DEFAULT)),
                    courant.map(c -> ", line " + c.at().line()).orElse(", the default"),
                    Units.format(gridPlan.cellSize().si(), Dimension.LENGTH)));
            return StopSpec.MAX_STEPS;
        }
        return Math.max(1, (long) steps);
    }

    private static int[] interior(Map<Side, Boundary> sides, GridSpec g) {
        return new int[] {layers(sides.get(Side.LEFT)), layers(sides.get(Side.BOTTOM)),
            g.nx() - layers(sides.get(Side.RIGHT)), g.ny() - layers(sides.get(Side.TOP))};
    }

    private static int layers(Boundary b) {
        return b instanceof Boundary.Pml p ? p.parameters().layers() : 0;
    }
}
