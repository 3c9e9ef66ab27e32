package org.evanesce.solver;

import java.util.List;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;

/**
 * Plane-wave runs through layered media with a dispersive layer, for the metal tests: Bloch-periodic
 * x sides (a fixed in-plane wavenumber), CPML at the bottom and top, a Bloch-row source in the
 * incidence medium, and two flux lines (below the layers, to read the reflected flux by the
 * difference with an incident-power run of the incidence medium alone, and above them). Every electric
 * site takes the material at its own y position (staircase, no averaging), so a layer whose faces
 * lie a quarter cell above a node holds the same number of Ez, Ex and Ey samples.
 */
final class MetalRuns {

    static final int PML = Integer.getInteger("pml", 30);

    private MetalRuns() {
    }

    /** A layer from y0 to y1 (in cells), of an ordinary or a dispersive material (the other null). */
    record Layer(double y0, double y1, Material plain, DispersiveMaterial metal) {
    }

    record Result(FluxLine bottom, FluxLine top, long steps) {
    }

    /**
     * The grid: {@code background} everywhere, then each layer over it in order.
     */
    static MaterialGrid grid(int nx, int ny, double dx, Material background, List<Layer> layers) {
        MaterialGrid.Builder b = MaterialGrid.builder(nx, ny, dx, background);
        for (FieldSite s : FieldSite.values()) {
            for (int j = 0; j < ny; j++) {
                double y = j + s.dy;
                for (Layer l : layers) {
                    if (y >= l.y0() && y < l.y1()) {
                        Material m = l.plain() != null ? l.plain() : placeholder(l.metal());
                        for (int i = 0; i < nx; i++) {
                            b.set(s, i, j, m);
                        }
                    }
                }
            }
        }
        return b.build();
    }

    /** The grid entry standing for a dispersive material (its εr, σ are replaced by the ADE update). */
    static Material placeholder(DispersiveMaterial m) {
        return new Material(m.name(), m.epsInfinity(), 0);
    }

    /** Declares every dispersive layer's grid entry dispersive. */
    static Simulation.Builder withMetals(Simulation.Builder b, MaterialGrid grid, List<Layer> layers) {
        for (Layer l : layers) {
            if (l.metal() != null) {
                b.dispersive(grid.materials().indexOf(placeholder(l.metal())), l.metal());
            }
        }
        return b;
    }

    /**
     * One run: source on row PML + 10, bottom line 20 rows above it, top line at {@code topLine};
     * a narrow Gaussian pulse (bandwidth f/relWidth), stepped until it has passed and the slowest
     * part crossed the grid, and then {@code settlePeriods} periods more (a resonance, such as a
     * surface plasmon at the in-plane wavenumber of the run, rings for tens of periods; a transform cut
     * off while it rings is wrong at its frequency).
     */
    static Result run(Polarization pol, Precision precision, int nx, int ny, double dx, double kx, double f,
                      double relWidth, double settlePeriods, Material background, List<Layer> layers, int topLine,
                      int threads) {
        MaterialGrid grid = grid(nx, ny, dx, background, layers);
        return run(pol, precision, grid, kx, f, relWidth, settlePeriods, b -> withMetals(b, grid, layers), topLine,
                threads);
    }

    /** {@link #run} on a given grid, {@code metals} declaring its dispersive (and series) entries. */
    static Result run(Polarization pol, Precision precision, MaterialGrid grid, double kx, double f, double relWidth,
                      double settlePeriods, java.util.function.Consumer<Simulation.Builder> metals, int topLine,
                      int threads) {
        int nx = grid.nx();
        int ny = grid.ny();
        int source = PML + 10;
        FluxLine bottom = new FluxLine(pol, source + 20, 0, nx, f);
        FluxLine top = new FluxLine(pol, topLine, 0, nx, f);
        Component c = pol == Polarization.S ? Component.EZ : Component.HZ;
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(precision).courant(Courant.DEFAULT)
                .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                .boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML))
                .threads(threads).minCellsPerThread(64)
                .source(Source.blochRow(c, nx, source, 0.0, grid.cellSize(), kx, TimeSignal.gaussianPulse(f, f / relWidth)))
                .listener(bottom).listener(top);
        metals.accept(b);
        try (Simulation s = b.build()) {
            double periods = 12 * relWidth / (2 * Math.PI) + settlePeriods;
            long steps = (long) (periods / (f * s.dt())) + 6L * ny;
            s.run(steps);
            return new Result(bottom, top, steps);
        }
    }

    /** R from a run and its incident-power run of the incidence medium alone: −(reflected flux)/(incident flux). */
    static double reflectance(Result run, Result reference, double dx) {
        return -run.bottom().flux(0, dx, reference.bottom()) / reference.bottom().flux(0, dx);
    }
}
