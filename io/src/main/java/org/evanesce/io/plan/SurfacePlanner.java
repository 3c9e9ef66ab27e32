package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.model.SurfacesSpec;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.FarFieldBox;
import org.evanesce.solver.record.FluxBox;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.source.TotalFieldBox;
import org.evanesce.geometry.PhysicalConstants;

/** Plans a case's {@code surfaces} section: its recorders on the case's run and the norm in a reference run. */
final class SurfacePlanner {

    private static final int SOURCE_MARGIN = SurfacePlan.SOURCE_MARGIN;

    private SurfacePlanner() {
    }

    /**
     * @param interior   the nodes outside every PML, {i0, j0, i1, j1} (i1, j1 exclusive)
     * @param run        the case's run, to which the recorders are added
     * @param configured makes a builder with the case's sources, sides and numerics for a material grid
     * @param sites      where each source drives the grid
     * @param flux       the flux plan, whose incident-power run the incident norm rides on when there is one
     * @param lightBoxes the case's planned plane-wave boxes (the incident norm is then their wave's intensity)
     * @param setup      what {@code configured} configures besides the material grid (sources, sheets, sides)
     * @param errors     receives what cannot be planned
     */
    static SurfacePlan plan(CaseSpec spec, GridSpec grid, int[] interior, Map<String, Material> materials,
                            Simulation.Builder run, Function<MaterialGrid, Simulation.Builder> configured,
                            CasePlan.Stop stop, double dt, List<CasePlan.SourceSite> sites, Optional<FluxPlan> flux,
                            List<TotalFieldBox> lightBoxes, IncidentKey.Setup setup, List<Diagnostic> errors) {
        SurfacesSpec s = spec.surfaces().orElseThrow();
        double[] freqs = s.frequencies().stream().mapToDouble(v -> v.si()).toArray();
        Polarization pol = spec.polarization().value();
        double dx = grid.cellSize();
        SignalSpec signal = spec.sources().get(0).signal();
        SteadyState steady = signal instanceof SignalSpec.RampedWave rw
                ? FluxPlanner.continuousWindow(spec, grid, rw, stop.maxSteps() * dt, errors) : null;
        // pulses: the segments, boxes and exit lines read every few steps, as the flux section's lines (MapStride)
        int stride = steady != null ? 1 : MapStride.of(spec.sources().stream().map(x -> x.signal()).toList(), freqs, dt);
        boolean periodic = PlaneWaves.of(spec).isPresent();
        int i0 = periodic ? 0 : interior[0];
        int i1 = periodic ? grid.nx() : interior[2];
        // every recorder's cells stay inside the grid with the neighbour its E averaging reads
        int maxCol = grid.nx() - 2;
        int maxRow = grid.ny() - 2;

        List<SurfacePlan.Segment> segments = new ArrayList<>();
        for (int k = 0; k < s.segments().size(); k++) {
            SurfacesSpec.Segment g = s.segments().get(k);
            String path = "surfaces.segments[" + k + "]";
            boolean vertical = g.vertical();
            double along0 = vertical ? Math.min(g.from().y().si(), g.to().y().si()) : Math.min(g.from().x().si(), g.to().x().si());
            double along1 = vertical ? Math.max(g.from().y().si(), g.to().y().si()) : Math.max(g.from().x().si(), g.to().x().si());
            double origin = vertical ? grid.y0() : grid.x0();
            int a = CasePlanner.nearest(along0, origin, dx, 0.5);
            int b = CasePlanner.nearest(along1, origin, dx, 0.5);
            int across = vertical ? CasePlanner.nearest(g.from().x().si(), grid.x0(), dx, 0.5)
                    : CasePlanner.nearest(g.from().y().si(), grid.y0(), dx, 0.5);
            if (!fits(errors, g.at(), path, b > a, "shorter than a cell") || !fits(errors, g.at(), path,
                    a >= 0 && across >= 0 && b <= (vertical ? maxRow : maxCol) + 1 && across <= (vertical ? maxCol : maxRow),
                    "reaching beyond the grid's last cells; move it inward by a cell")) {
                continue;
            }
            int c0 = pol == Polarization.S ? a + 1 : a;
            FluxLine line = vertical ? FluxLine.vertical(pol, across, c0, b + 1, freqs) : new FluxLine(pol, across, c0, b + 1, freqs);
            run.listener(windowed(line, steady, stride));
            double at = (vertical ? grid.x0() : grid.y0()) + (across + 0.5) * dx;
            segments.add(new SurfacePlan.Segment(g, line, origin + (a + 0.5) * dx, origin + (b + 0.5) * dx, at));
        }
        List<SurfacePlan.Box> boxes = new ArrayList<>();
        for (int k = 0; k < s.boxes().size(); k++) {
            SurfacesSpec.Box b = s.boxes().get(k);
            int[] lbrt = sides(grid, b.from(), b.to(), errors, b.at(), "surfaces.boxes[" + k + "]", maxCol, maxRow);
            if (lbrt == null) {
                continue;
            }
            FluxBox box = new FluxBox(pol, lbrt[0], lbrt[1], lbrt[2], lbrt[3], freqs);
            windowed(box, steady, stride);
            run.listener(box);
            boxes.add(new SurfacePlan.Box(b, box, x(grid, lbrt[0]), y(grid, lbrt[1]), x(grid, lbrt[2]), y(grid, lbrt[3])));
        }
        List<SurfacePlan.FarField> farFields = new ArrayList<>();
        for (int k = 0; k < s.farFields().size(); k++) {
            SurfacesSpec.FarField f = s.farFields().get(k);
            int[] lbrt = sides(grid, f.from(), f.to(), errors, f.at(), "surfaces.far_field[" + k + "]", maxCol, maxRow);
            if (lbrt == null) {
                continue;
            }
            FarFieldBox contour = new FarFieldBox(pol, lbrt[0], lbrt[1], lbrt[2], lbrt[3], freqs);
            if (steady != null) {
                contour.window(steady.start(), steady.end() + 1e-6 * steady.period());
            }
            run.listener(contour);
            String medium = spec.materialAt(f.from().x().si(), f.from().y().si());
            // the grid's wavenumbers round the contour follow the permittivity the grid has (dispersion correction)
            contour.gridPermittivity(materials.get(medium).relativePermittivity());
            double l = x(grid, lbrt[0]);
            double r = x(grid, lbrt[2]);
            double bo = y(grid, lbrt[1]);
            double t = y(grid, lbrt[3]);
            farFields.add(new SurfacePlan.FarField(f, contour, medium, spec.materials().get(medium).index(), l, bo, r, t,
                    0.5 * (l + r), 0.5 * (bo + t)));
        }
        List<SurfacePlan.Exit> exits = new ArrayList<>();
        Component e = pol == Polarization.S ? Component.EZ : Component.EX;
        for (int k = 0; k < s.exitSpectra().size(); k++) {
            SurfacesSpec.ExitSpectrum x = s.exitSpectra().get(k);
            int row = CasePlanner.nearest(x.y().si(), grid.y0(), dx, 0.5);
            if (!fits(errors, x.at(), "surfaces.exit_spectra[" + k + "]", row >= 0 && row <= maxRow,
                    "reaching beyond the grid's last rows; move it inward by a cell")) {
                continue;
            }
            FluxLine line = new FluxLine(pol, row, i0, i1, freqs);
            run.listener(windowed(line, steady, stride));
            String medium = spec.materialAt(0, x.y().si());
            exits.add(new SurfacePlan.Exit(x, line, medium, spec.materials().get(medium).index(),
                    x.towards().value() == SurfacesSpec.Towards.UP ? Side.TOP : Side.BOTTOM, grid.x0() + (i0 + e.dx) * dx,
                    grid.y0() + (row + 0.5) * dx, periodic, periodic ? PlaneWaves.kx(spec) : 0));
        }

        Optional<FluxLine> incident = Optional.empty();
        Optional<FluxBox> sourceBox = Optional.empty();
        Optional<Simulation.Builder> own = Optional.empty();
        Optional<String> normMedium = Optional.empty();
        int direction = 0;
        Optional<SurfacePlan.BoxWave> boxWave = Optional.empty();
        Optional<org.evanesce.solver.source.SheetResponse> computed = Optional.empty();
        if (s.normalise().value() == SurfacesSpec.Normalise.INCIDENT && !lightBoxes.isEmpty()) {
            boxWave = Optional.of(boxWave(spec, grid, interior, lightBoxes.get(0)));
            normMedium = Optional.of(boxWave.get().medium());
        } else if (s.normalise().value() == SurfacesSpec.Normalise.INCIDENT) {
            SourceSpec.Launched w = PlaneWaves.launched(spec).orElseThrow();
            String medium = PlaneWaves.medium(spec, w).name();
            normMedium = Optional.of(medium);
            direction = w.direction().value().sign();
            int sourceRow = CasePlanner.nearest(w.y().si(), grid.y0(), dx, w.component().value().dy);
            int row = direction > 0 ? sourceRow + FluxPlanner.INCIDENT_OFFSET - 1 : sourceRow - FluxPlanner.INCIDENT_OFFSET;
            if (flux.isPresent()) {
                // the flux section's incident-power run records it (FluxPlanner: in its key, strip and reuse)
                incident = Optional.of(flux.get().surfacesIncident().orElseThrow());
            } else if (row >= 1 && row + 2 < grid.ny()) {
                computed = BeamIncident.forSurfaces(spec, w, PlaneWaves.medium(spec, w), materials.get(medium), setup, grid.nx());
                FluxLine line = windowed(new FluxLine(pol, row, i0, i1, freqs), steady, stride);
                if (computed.isEmpty()) { // else computed after the run from the beam's sheets
                    Simulation.Builder ref = configured.apply(homogeneous(materials.get(medium), grid));
                    own = Optional.of(ref);
                    ref.listener(line);
                }
                incident = Optional.of(line);
            } else {
                errors.add(new Diagnostic(Diagnostic.Severity.ERROR, w.at(), "sources", String.format("the incident power is "
                        + "read %d cells ahead of the launching line, which is outside the grid; move the line away from the %s "
                        + "edge", FluxPlanner.INCIDENT_OFFSET, direction > 0 ? "top" : "bottom")));
            }
        } else if (s.normalise().value() == SurfacesSpec.Normalise.SOURCE) {
            int l = Integer.MAX_VALUE;
            int b = Integer.MAX_VALUE;
            int r = Integer.MIN_VALUE;
            int t = Integer.MIN_VALUE;
            for (CasePlan.SourceSite site : sites) {
                l = Math.min(l, site.i0());
                b = Math.min(b, site.j0());
                r = Math.max(r, site.i1());
                t = Math.max(t, site.j1());
            }
            // sides at (l + ½)Δ … (r + ½)Δ clear of every site (a site's offset is at most ½ cell)
            l = Math.max(interior[0], l - SOURCE_MARGIN);
            b = Math.max(interior[1], b - SOURCE_MARGIN);
            r = Math.min(interior[2] - 2, r + SOURCE_MARGIN);
            t = Math.min(interior[3] - 2, t + SOURCE_MARGIN);
            CasePlan.SourceSite first = sites.get(0);
            double sx = grid.x0() + (first.i0() + first.component().dx) * dx;
            double sy = grid.y0() + (first.j0() + first.component().dy) * dx;
            String medium = spec.materialAt(sx, sy);
            normMedium = Optional.of(medium);
            if (r > l && t > b) {
                Simulation.Builder ref = configured.apply(homogeneous(materials.get(medium), grid));
                own = Optional.of(ref);
                FluxBox box = new FluxBox(pol, l, b, r, t, freqs);
                windowed(box, steady, stride);
                ref.listener(box);
                sourceBox = Optional.of(box);
            } else {
                errors.add(new Diagnostic(Diagnostic.Severity.ERROR, s.normalise().at(), "surfaces.normalise", "the power the "
                        + "sources radiate is measured by a box round them inside the interior, and they lie too close to a PML "
                        + "for one; move them inward or use normalise: absolute"));
            }
        }
        return new SurfacePlan(freqs, pol, s.normalise().value(), segments, boxes, farFields, exits, incident, direction,
                sourceBox, own, Optional.ofNullable(steady), grid.x0(), grid.y0(), dx, normMedium, boxWave, computed);
    }

    /** A plane-wave box's wave: the medium it comes from (just left of the box) and its intensity there. */
    private static SurfacePlan.BoxWave boxWave(CaseSpec spec, GridSpec grid, int[] interior, TotalFieldBox box) {
        int[] n = box.nodes();
        double x = grid.x0() + (n[0] - 1) * grid.cellSize();
        double y = !box.layered() ? grid.y0() + 0.5 * (n[1] + n[3]) * grid.cellSize()
                : Math.sin(box.spec().direction()) > 0 ? grid.y0() + interior[1] * grid.cellSize()
                : grid.y0() + (interior[3] - 1) * grid.cellSize();
        String medium = spec.materialAt(x, y);
        double index = Math.sqrt(box.incidenceMediumPermittivity());
        double a = box.spec().amplitude();
        double intensity = box.spec().polarization() == Polarization.S ? a * a * index / (2 * PhysicalConstants.ETA0)
                : a * a / (2 * index * PhysicalConstants.ETA0);
        return new SurfacePlan.BoxWave(box, medium, index, intensity);
    }

    private static MaterialGrid homogeneous(Material m, GridSpec grid) {
        return Rasterizer.rasterize(Scene.builder(m).build(), grid, Smoothing.ANISOTROPIC);
    }

    private static FluxLine windowed(FluxLine l, SteadyState steady, int stride) {
        return steady == null ? l.stride(stride) : l.window(steady.start(), steady.end() + 1e-6 * steady.period());
    }

    /** A continuous wave's window on a box's sides, or a pulse's stride (1: every step). */
    private static void windowed(FluxBox box, SteadyState steady, int stride) {
        if (steady == null) {
            box.stride(stride);
        } else {
            box.window(steady.start(), steady.end() + 1e-6 * steady.period());
        }
    }

    private static double x(GridSpec g, int col) {
        return g.x0() + (col + 0.5) * g.cellSize();
    }

    private static double y(GridSpec g, int row) {
        return g.y0() + (row + 0.5) * g.cellSize();
    }

    /** A rectangle's sides {l, b, r, t} (each at (k + ½)Δ), or null (error reported). */
    private static int[] sides(GridSpec grid, Point from, Point to, List<Diagnostic> errors, SourcePosition at, String path,
                               int maxCol, int maxRow) {
        double dx = grid.cellSize();
        int l = CasePlanner.nearest(from.x().si(), grid.x0(), dx, 0.5);
        int r = CasePlanner.nearest(to.x().si(), grid.x0(), dx, 0.5);
        int b = CasePlanner.nearest(from.y().si(), grid.y0(), dx, 0.5);
        int t = CasePlanner.nearest(to.y().si(), grid.y0(), dx, 0.5);
        if (!fits(errors, at, path, r > l && t > b, String.format("narrower than a cell (%s)",
                Units.format(dx, Dimension.LENGTH)))) {
            return null;
        }
        return fits(errors, at, path, l >= 0 && b >= 0 && r <= maxCol && t <= maxRow,
                "reaching beyond the grid's last cells; move it inward by a cell")
                ? new int[] {l, b, r, t} : null;
    }

    private static boolean fits(List<Diagnostic> errors, SourcePosition at, String path, boolean ok, String problem) {
        if (!ok) {
            errors.add(new Diagnostic(Diagnostic.Severity.ERROR, at, path, "on the grid this surface is " + problem));
        }
        return ok;
    }
}
