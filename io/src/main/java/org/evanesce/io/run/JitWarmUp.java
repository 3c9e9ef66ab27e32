package org.evanesce.io.run;

import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.source.GaussianPulse;
import org.evanesce.solver.source.Source;

/**
 * Chooses a run's kernels: a run of at least {@link #WORTH_CELL_UPDATES} cell updates first warms the kernels' vector
 * parts up on a small throw-away grid, so the JIT compiles them, and then steps them from its first step; a smaller
 * run steps their scalar parts alone (same bits), which compile at once. Until it is compiled the Vector API runs in
 * a slow generic form. Compiled code stays for the life of the process, so each polarization and precision is warmed
 * up once per process (a sweep's later points, all in one process, skip it); a caller that asks while another warms
 * the same kernels up waits for it instead of doing the same work again.
 *
 * <p>The warm-up blocks the run. Beside the run's first (scalar) steps, as it ran before, on a 2-core machine it
 * raced them for the cores and the JIT's compilers: the run's scalar code was slow (46 Mcell/s for the first 250
 * steps of the cube splitter) and its profile sent the kernels back to the compiler when the vectors took over.
 * Whole commands, paired and alternating, 2-core machine, quiet: cube splitter (5.7e8 cell updates) wall 0.84–0.88x
 * and CPU 0.84x of the side-by-side warm-up; two-prism attenuator 0.86–0.91x (CPU 0.83–0.85x), tail 0.84–0.93x,
 * attenuator corner 0.86–0.88x.
 */
public final class JitWarmUp {

    /**
     * Steps of each warm-up grid, its energy summed every second step: enough calls of every kernel and of the energy
     * sum for the optimising compiler.
     */
    static final int STEPS = 300;

    /**
     * The two warm-up grids: lossless (no ca array) with PMLs of {@link #THICK_PML} cells, lossy with {@link #THIN_PML};
     * widths that are no multiple of the vector length (the loops' scalar tails), and strips of one, two and three
     * vectors' width (the PML loops that take two vectors of columns at a time, then one).
     */
    private static final int THICK_PML = 40;
    private static final int THIN_PML = 12;
    private static final int THICK_N = 2 * THICK_PML + 33;
    private static final int THIN_N = 97;

    /** One polarization and precision's warm-up: done or not, and the lock a second caller waits on. */
    private static final class Once {
        private boolean done;
    }

    private record Kernels(Polarization pol, Precision precision) { }

    private static final java.util.Map<Kernels, Once> WARM = new java.util.concurrent.ConcurrentHashMap<>();

    private JitWarmUp() {
    }

    /**
     * The fewest cell updates (grid cells × the step limit, which for a stop on decay is the latest time's steps:
     * more than are made) for which the warm-up and the vector parts pay. Whole commands on a 2-core machine,
     * warm-up and vectors against scalar parts alone, updates made (limit): the touch plate 3.8e8 (5.5e8) 1.02–1.10x
     * the wall time and 1.10x the CPU, the cube splitter 5.7e8 (5.7e8) 0.95–1.05x and 1.02–1.10x, the attenuator
     * corner 7.5e8 (1.05e9) 0.82–0.84x and 0.80–0.87x, the tail 8.5e8 (1.44e9) 0.86–0.98x and 0.86–0.93x.
     */
    public static final double WORTH_CELL_UPDATES = 6e8;

    /** Whether a run of this plan warms up and steps the vector parts (see {@link #WORTH_CELL_UPDATES}). */
    public static boolean worth(CasePlan plan) {
        return worth((long) plan.grid().nx() * plan.grid().ny(), plan.stop().maxSteps());
    }

    /** Whether a run of {@code cells} cells and at most {@code steps} steps warms up and steps the vector parts. */
    public static boolean worth(long cells, long steps) {
        return (double) cells * steps >= WORTH_CELL_UPDATES;
    }

    /**
     * Sets a run's kernels: for a run worth it, warms the vector parts up (blocking, once per process) and has the
     * run step them from its first step; else the scalar parts alone.
     */
    public static void choose(Simulation.Builder b, long steps, Polarization pol, Precision precision) {
        if (worth(b.cells(), steps)) {
            run(pol, precision);
            b.vectorsFromStart();
        } else {
            b.scalarOnly();
        }
    }

    /**
     * Warms up the kernels of one polarization and precision, the first time they are asked for in this process
     * (about a second on a 2-core machine); later calls return at once.
     */
    public static void run(Polarization pol, Precision precision) {
        Once once = WARM.computeIfAbsent(new Kernels(pol, precision), k -> new Once());
        synchronized (once) {
            if (!once.done) {
                warmUp(pol, precision);
                once.done = true;
            }
        }
    }

    /**
     * Two grids stepped in turn, so that the JIT's profile has seen both ways of the kernels' branches before it
     * compiles them; a branch the profile never saw taken is compiled as a trap, and the run that takes it goes back to
     * the interpreter until the kernel is compiled again (JFR deoptimisation events in the two-prism example's run,
     * after a warm-up on one lossy 96 x 96 grid with 12-cell PMLs and no source: the lossless update, the PML loops of
     * its 38-cell strips, the per-row source loops, the flush and the energy sum, each compiled anew during the run).
     * Whole commands, paired, quiet: two-prism example 0.95x the wall time (stepping 2.98 s against 3.45 s), evanescent
     * tail and attenuator corner as before (the longer warm-up takes what the steps gain), gold-film beam (p, a
     * dispersive metal) as before.
     */
    private static void warmUp(Polarization pol, Precision precision) {
        try (Simulation thick = grid(pol, precision, false); Simulation thin = grid(pol, precision, true)) {
            for (int k = 0; k < STEPS; k += 2) {
                for (Simulation s : new Simulation[] {thick, thin}) {
                    s.run(2);
                    int n = s.nx();
                    int p = n == THICK_N ? THICK_PML : THIN_PML;
                    // over the interior, as the stopping rule sums it (a sum from column 0 alone left compiled code
                    // whose loop predicates failed on the run's first interior sum), and over the whole grid
                    s.energy(p, p, n - p, n - p);
                    if (k % 16 == 0) {
                        s.energy(0, 0, n, n);
                    }
                }
            }
        }
    }

    /** A warm-up grid: a square block in the middle, a point pulse beside it, the flush every fourth step. */
    private static Simulation grid(Polarization pol, Precision precision, boolean lossy) {
        int n = lossy ? THIN_N : THICK_N;
        double dx = 50e-9;
        double f = PhysicalConstants.C0 / (20 * dx);
        int c = n / 2;
        MaterialGrid g = MaterialGrid.builder(n, n, dx, Material.VACUUM)
                .paint((x, y) -> Math.abs(x - c) < 10 && Math.abs(y - c) < 10,
                        lossy ? new Material("warm-up", 2.0, 1e5) : new Material("warm-up", 2.25, 0))
                .build();
        Simulation s = Simulation.builder(g).polarization(pol).precision(precision).threads(1)
                .boundaries(Boundary.pml(lossy ? THIN_PML : THICK_PML)).vectorsFromStart().flushInterval(4)
                .source(Source.point(pol.components()[0], n, c - 15, c - 15, 1.0, new GaussianPulse(f, 0.3 * f)))
                .build();
        s.setField(pol.components()[0], c, c, 1.0);
        return s;
    }
}
