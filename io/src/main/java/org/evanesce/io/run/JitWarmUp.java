package org.evanesce.io.run;

import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;

/**
 * Runs the update kernels on a small throw-away grid so the JIT compiles them before the real
 * run starts: until then the Vector API runs in a slow generic form, which on a small case
 * costs more than the run itself, and would spoil a timed trial.
 */
public final class JitWarmUp {

    /** Steps of a 96 × 96 grid with a lossy block and PMLs: enough calls of every kernel for the optimising compiler. */
    static final int STEPS = 400;

    private JitWarmUp() {
    }

    /** Warms up the kernels of one polarization and precision; takes about a second on a 2-core machine. */
    public static void run(Polarization pol, Precision precision) {
        int n = 96;
        MaterialGrid g = MaterialGrid.builder(n, n, 50e-9, Material.VACUUM)
                .paint((x, y) -> x > 40 && x < 60 && y > 40 && y < 60, new Material("warm-up", 2.0, 1e5)).build();
        try (Simulation s = Simulation.builder(g).polarization(pol).precision(precision).threads(1)
                .boundaries(Boundary.pml(12)).build()) {
            s.setField(pol.components()[0], n / 2, n / 2, 1.0);
            s.run(STEPS);
        }
    }
}
