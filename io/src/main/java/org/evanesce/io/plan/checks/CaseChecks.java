package org.evanesce.io.plan.checks;

import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.BoundarySpec;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.DomainSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.OutputSpec;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.model.ShapeSpec;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.model.StopSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.text.KeyPaths;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.io.plan.grid.GridPlan;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;

/**
 * Checks that look at several parts of a case together: where things sit in the domain and the
 * PML, resolution, evanescent decay, memory. They read the finished {@link CaseSpec} (they run once
 * every section was read without errors), the key paths its parts came from and the grid derived
 * from it; they never see the parser.
 */
public final class CaseChecks {

    /** Fewer cells per wavelength than this in any material gives visible numerical dispersion (common practice). */
    static final double MIN_CELLS_PER_WAVELENGTH = 10;
    /** A PML thinner than this reflects noticeably (common practice: 8 to 16 cells). */
    static final int MIN_PML_CELLS = 8;
    /** An evanescent field decaying in fewer cells than this is poorly resolved. */
    static final double MIN_DECAY_CELLS = 4;

    private final CaseSpec spec;
    private final KeyPaths paths;
    private final GridPlan grid;
    private final long memoryLimit;
    private final List<Diagnostic> out;

    private CaseChecks(CaseSpec spec, KeyPaths paths, GridPlan grid, long memoryLimit, List<Diagnostic> out) {
        this.spec = spec;
        this.paths = paths;
        this.grid = grid;
        this.memoryLimit = memoryLimit;
        this.out = out;
    }

    /**
     * Runs every check on a finished case and adds what it finds to {@code out}.
     *
     * @param paths       the key paths the case's parts were written under
     * @param grid        the grid derived from the case
     * @param memoryLimit bytes the run may use for its grid; a larger estimate is an error
     */
    public static void run(CaseSpec spec, KeyPaths paths, GridPlan grid, long memoryLimit, List<Diagnostic> out) {
        new CaseChecks(spec, paths, grid, memoryLimit, out).run();
    }

    private void run() {
        shapesInDomain();
        pml();
        placement();
        resolution();
        evanescent();
        memory();
        decayWithContinuousWave();
        sourcesWithinTheRun();
        framesWithinTheRun();
        new PlaneWaveChecks(spec, paths, this).run();
        new SurfaceChecks(spec, this).run();
        new ConductorFaceChecks(spec, paths, this).run();
    }

    void error(SourcePosition at, String path, String message) {
        out.add(new Diagnostic(Diagnostic.Severity.ERROR, at, path, message));
    }

    void warn(SourcePosition at, String path, String message) {
        out.add(new Diagnostic(Diagnostic.Severity.WARNING, at, path, message));
    }

    private String fmt(double metres) {
        return Units.format(metres, Dimension.LENGTH);
    }

    private String domainText() {
        DomainSpec d = spec.domain();
        return String.format("x from %s to %s, y from %s to %s", fmt(d.xMin()), fmt(d.xMax()), fmt(d.yMin()), fmt(d.yMax()));
    }

    private void shapesInDomain() {
        DomainSpec d = spec.domain();
        double[][] corners = {{d.xMin(), d.yMin()}, {d.xMax(), d.yMin()}, {d.xMin(), d.yMax()}, {d.xMax(), d.yMax()}};
        for (int k = 0; k < spec.shapes().size(); k++) {
            ShapeSpec s = spec.shapes().get(k);
            boolean outside;
            if (s instanceof ShapeSpec.HalfPlane h) {
                double most = Double.NEGATIVE_INFINITY;
                for (double[] c : corners) {
                    most = Math.max(most, h.depth(c[0], c[1]));
                }
                outside = most < 0;
            } else if (s instanceof ShapeSpec.LayerStack st) {
                double lo = Double.POSITIVE_INFINITY;
                double hi = Double.NEGATIVE_INFINITY;
                double c = Math.cos(st.rotation().si());
                double sn = Math.sin(st.rotation().si());
                for (double[] q : corners) {
                    double h = -sn * (q[0] - st.start().x().si()) + c * (q[1] - st.start().y().si());
                    lo = Math.min(lo, h);
                    hi = Math.max(hi, h);
                }
                outside = hi <= 0 || lo >= st.thickness();
            } else {
                double[] b = s.bounds();
                outside = b[2] < d.xMin() || b[0] > d.xMax() || b[3] < d.yMin() || b[1] > d.yMax();
            }
            if (outside) {
                warn(s.at(), paths.shapes().get(k), "lies entirely outside the domain (" + domainText() + ") and has no effect");
            }
        }
    }

    private int pmlCells(Side side) {
        return grid.pmlCells(side);
    }

    /** The cell size, metres. */
    double cell() {
        return grid.cellSize().si();
    }

    private void pml() {
        Set<SourcePosition> warned = new HashSet<>();
        for (Map.Entry<Side, BoundarySpec> e : spec.boundaries().entrySet()) {
            int cells = pmlCells(e.getKey());
            if (e.getValue() instanceof BoundarySpec.Pml pml && cells < MIN_PML_CELLS && warned.add(pml.at())) {
                warn(pml.at(), paths.boundaries().get(e.getKey()), String.format("a PML of %d cells (%s) is thinner than %d cells and reflects noticeably; use at least %d",
                        cells, fmt(cells * cell()), MIN_PML_CELLS, MIN_PML_CELLS));
            }
        }
        if (spec.boundaries().get(Side.LEFT) instanceof BoundarySpec.Periodic per && grid.nx() - 1 < 3) {
            // the node at x = +W/2 is the image of the one at −W/2, so a period holds one column fewer
            error(per.at(), paths.boundaries().get(Side.LEFT), String.format("with periodic sides a period needs at least 3 "
                    + "cells across, but the domain's width is %d cells of %s; use a smaller cell or a wider domain",
                    grid.nx() - 1, fmt(grid.cellSize().si())));
        }
        across(Side.LEFT, Side.RIGHT, grid.nx() - 1, "wide");
        across(Side.BOTTOM, Side.TOP, grid.ny() - 1, "high");
    }

    private void across(Side a, Side b, int cells, String what) {
        long used = (long) pmlCells(a) + pmlCells(b); // long: a thickness may be written as a huge count
        // the solver needs at least two interior cells between the layers
        if (used > cells - 2) {
            BoundarySpec where = spec.boundaries().get(pmlCells(b) > 0 ? b : a);
            error(where.at(), paths.boundaries().get(pmlCells(b) > 0 ? b : a), String.format(
                    "the %s and %s PMLs (%d + %d cells) leave no interior in a grid %d cells %s; thin them or enlarge the domain",
                    a.name().toLowerCase(Locale.ROOT), b.name().toLowerCase(Locale.ROOT), pmlCells(a), pmlCells(b), cells, what));
        }
    }

    /** Sources and probes: outside the domain is an error, inside a PML a warning. */
    private void placement() {
        double[] in = interior();
        if (in[0] >= in[2] || in[1] >= in[3]) {
            return; // the PMLs leave no interior, already an error
        }
        for (int k = 0; k < spec.sources().size(); k++) {
            SourceSpec s = spec.sources().get(k);
            String path = paths.sources().get(k);
            if (s instanceof SourceSpec.PointSource ps) {
                place(ps.location(), path + ".at", "the source");
            } else if (s instanceof SourceSpec.PlaneWave w && spec.domain().contains(0, w.y().si()) && pmlAt(0, w.y().si()) != null) {
                warn(w.y().at(), path + ".y", String.format("the launching line at y = %s lies inside the %s; sources belong in "
                        + "the interior (%s)", fmt(w.y().si()), pmlAt(0, w.y().si()), interiorText()));
            } else if (s instanceof SourceSpec.LineSource ls) {
                // both ends inside the interior keep the whole segment there (the interior is convex)
                place(ls.from(), path + ".from", "the line's start");
                place(ls.to(), path + ".to", "the line's end");
            }
        }
        for (int k = 0; k < spec.probes().size(); k++) {
            place(spec.probes().get(k).location(), paths.probes().get(k) + ".at", "the probe");
        }
    }

    /** Checks one point; returns false when it lies outside the domain. */
    private boolean place(Point pt, String path, String what) {
        double x = pt.x().si();
        double y = pt.y().si();
        if (!spec.domain().contains(x, y)) {
            error(pt.at(), path, String.format("%s at (%s, %s) lies outside the domain (%s)", what, fmt(x), fmt(y), domainText()));
            return false;
        }
        String side = pmlAt(x, y);
        if (side != null) {
            warn(pt.at(), path, String.format("%s at (%s, %s) lies inside the %s; sources and probes belong in the interior (%s)",
                    what, fmt(x), fmt(y), side, interiorText()));
        }
        return true;
    }

    /** The interior (outside every PML) as {xmin, ymin, xmax, ymax}, metres. */
    double[] interior() {
        double d = grid.cellSize().si();
        return new double[] {grid.x(0) + pmlCells(Side.LEFT) * d, grid.y(0) + pmlCells(Side.BOTTOM) * d,
            grid.x(grid.nx() - 1) - pmlCells(Side.RIGHT) * d, grid.y(grid.ny() - 1) - pmlCells(Side.TOP) * d};
    }

    private String interiorText() {
        double[] in = interior();
        return String.format("x from %s to %s, y from %s to %s", fmt(in[0]), fmt(in[2]), fmt(in[1]), fmt(in[3]));
    }

    /** "left PML" etc. when (x, y) lies in a PML, else null. */
    private String pmlAt(double x, double y) {
        double[] in = interior();
        double tol = 1e-6 * grid.cellSize().si();
        if (x < in[0] - tol) {
            return "left PML";
        } else if (x > in[2] + tol) {
            return "right PML";
        } else if (y < in[1] - tol) {
            return "bottom PML";
        } else if (y > in[3] + tol) {
            return "top PML";
        }
        return null;
    }

    /** Cells per wavelength in the densest material at the shortest wavelength any source carries. */
    private void resolution() {
        double shortest = spec.designWavelength().si();
        for (SourceSpec s : spec.sources()) {
            shortest = Math.min(shortest, s.signal().shortestWavelength());
        }
        MaterialSpec densest = null;
        for (MaterialSpec m : spec.materials().values()) {
            if (densest == null || m.index() > densest.index()) {
                densest = m;
            }
        }
        if (densest == null) {
            return;
        }
        double cells = shortest / (densest.index() * grid.cellSize().si());
        if (cells < MIN_CELLS_PER_WAVELENGTH) {
            warn(grid.cellSize().at(), spec.grid().path(), String.format(
                    "%s cells per wavelength in %s (n = %s) at %s with a %s cell, below %s; numerical dispersion will be visible, use a cell of at most %s",
                    Units.number(cells), densest.name(), Units.number(densest.index()), fmt(shortest), fmt(grid.cellSize().si()),
                    Units.number(MIN_CELLS_PER_WAVELENGTH), fmt(shortest / (densest.index() * MIN_CELLS_PER_WAVELENGTH))));
        }
    }

    /**
     * A tilted line source beyond the critical angle of some material launches a field that decays
     * there over 1/e amplitude length λ0 / (2π sqrt(n1² sin²θ − n2²)) (Hecht, Optics, 4th ed., sec. 4.7).
     * Point sources radiate at every angle, so only tilted line sources can be checked.
     */
    private void evanescent() {
        double cell = grid.cellSize().si();
        for (int k = 0; k < spec.sources().size(); k++) {
            if (!(spec.sources().get(k) instanceof SourceSpec.LineSource ls) || ls.angle().si() == 0) {
                continue;
            }
            double[] c = ls.centre();
            MaterialSpec here = spec.materials().get(spec.materialAt(c[0], c[1]));
            if (here == null) {
                continue;
            }
            double transverse = here.index() * Math.abs(Math.sin(ls.angle().si()));
            double wl = ls.signal().wavelength();
            MaterialSpec worst = null;
            double shortest = Double.POSITIVE_INFINITY;
            for (MaterialSpec m : spec.materials().values()) {
                if (m.index() < transverse) {
                    double decay = wl / (2 * Math.PI * Math.sqrt(transverse * transverse - m.index() * m.index()));
                    if (decay < shortest) {
                        shortest = decay;
                        worst = m;
                    }
                }
            }
            if (worst != null && shortest < MIN_DECAY_CELLS * cell) {
                warn(ls.angle().at(), paths.sources().get(k) + ".angle", String.format(
                        "at %s in %s (n = %s) the wave is evanescent in %s (n = %s) with a 1/e decay length of %s at %s, %s cells; "
                                + "fewer than %s cells resolve it poorly, use a cell of at most %s",
                        Units.format(ls.angle().si(), Dimension.ANGLE), here.name(), Units.number(here.index()), worst.name(),
                        Units.number(worst.index()), fmt(shortest), fmt(wl), Units.number(shortest / cell),
                        Units.number(MIN_DECAY_CELLS), fmt(shortest / MIN_DECAY_CELLS)));
            }
        }
    }

    private void memory() {
        Precision precision = spec.numerics().precision().value();
        double bytes = grid.estimatedBytes(precision);
        if (bytes > memoryLimit) {
            error(grid.cellSize().at(), spec.grid().path(), String.format(
                    "the grid of %d x %d nodes needs about %s in %s (%d bytes per cell) but the JVM can use at most %s; "
                            + "use a larger cell or a smaller domain, or give the JVM more memory (-Xmx)",
                    grid.nx(), grid.ny(), gib(bytes), precision.name().toLowerCase(Locale.ROOT), GridPlan.bytesPerCell(precision),
                    gib(memoryLimit)));
        }
    }

    private static String gib(double bytes) {
        return Units.number(bytes / (1L << 30)) + " GiB";
    }

    /** The run's end in seconds from a time or a latest time; NaN for a number of steps. */
    private double runEnd() {
        return spec.stop() instanceof StopSpec.AfterTime t ? t.time().si()
                : spec.stop() instanceof StopSpec.WhenEnergyBelow d ? d.latest().si() : Double.NaN;
    }

    /** Frames asked for after the run's end are never written; an interval longer than the run gives none. */
    private void framesWithinTheRun() {
        double end = runEnd();
        if (!(end > 0) || !spec.output().writes(OutputSpec.Item.FIELD_FRAMES)) {
            return;
        }
        for (int k = 0; k < spec.output().frameTimes().size(); k++) {
            Value t = spec.output().frameTimes().get(k);
            if (t.si() > end) {
                warn(t.at(), "output.frame_times[" + k + "]", String.format("%s is after the run ends at %s; no frame is "
                        + "written for it", Units.format(t.si(), Dimension.TIME), Units.format(end, Dimension.TIME)));
            }
        }
        spec.output().frameInterval().filter(i -> i.si() > end).ifPresent(i -> warn(i.at(), "output.frame_interval",
                String.format("%s is longer than the run (%s); no frame is written", Units.format(i.si(), Dimension.TIME),
                        Units.format(end, Dimension.TIME))));
    }

    /** A source whose pulse peaks (or whose ramp ends) after the run's end is most likely a mistyped value. */
    private void sourcesWithinTheRun() {
        double end = runEnd();
        if (!(end > 0)) {
            return;
        }
        for (int k = 0; k < spec.sources().size(); k++) {
            SignalSpec s = spec.sources().get(k).signal();
            if (s.peakTime() > end) {
                warn(s.at(), paths.sources().get(k) + ".signal", String.format("the %s %s at %s, after the run ends at %s; "
                        + "the run sees %s of it (%s)", s.kind().replace('_', ' '), s instanceof SignalSpec.RampedWave
                                ? "reaches full amplitude" : "peaks", Units.format(s.peakTime(), Dimension.TIME),
                        Units.format(end, Dimension.TIME), s instanceof SignalSpec.RampedWave ? "only the switch-on" : "little",
                        s instanceof SignalSpec.RampedWave ? "shorten the ramp or run longer" : "widen the bandwidth or run longer"));
            }
        }
    }

    private void decayWithContinuousWave() {
        if (!(spec.stop() instanceof StopSpec.WhenEnergyBelow d)) {
            return;
        }
        for (int k = 0; k < spec.sources().size(); k++) {
            if (spec.sources().get(k).signal() instanceof SignalSpec.RampedWave) {
                warn(d.fraction().at(), "until", String.format("%s drives a ramped wave, whose field energy never falls; the run "
                        + "will end at the latest time %s", paths.sources().get(k), Units.format(d.latest().si(), Dimension.TIME)));
                return;
            }
        }
    }
}
