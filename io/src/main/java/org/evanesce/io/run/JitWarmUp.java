package org.evanesce.io.run;

import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.GaussianPulse;
import org.evanesce.solver.source.IncidentSheet;
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
     * The warm-up grids: lossless (no ca array) with PMLs of {@link #THICK_PML} cells on two sides and three fewer on
     * the others, lossy with {@link #THIN_PML}; each in two widths, one whose nx − 1 and one whose nx − 2 is a
     * multiple of the vector length (the loops over nx − 1 and nx − 2 columns, each with and without a scalar tail).
     * The x strips are widened to whole vectors; their loops take two vectors of columns at a time, then one where an
     * odd number is left: 40 and 12 (or 37) cells give an odd and an even number of vectors at 2, 4 and 8 lanes.
     */
    private static final int THICK_PML = 40;
    private static final int THIN_PML = 12;
    private static final int[] THICK_N = {2 * THICK_PML + 33, 2 * THICK_PML + 34};
    private static final int[] THIN_N = {97, 98};

    private static final java.util.concurrent.atomic.AtomicInteger WARM_UPS = new java.util.concurrent.atomic.AtomicInteger();

    /** Warm-ups done in this process (tests). */
    static int warmUps() {
        return WARM_UPS.get();
    }

    /** The warm-up grids' widths in nodes (tests: the loops' tails they cover). */
    static int[] widths() {
        return new int[] {THICK_N[0], THICK_N[1], THIN_N[0], THIN_N[1]};
    }

    /** The warm-up grids' PML thicknesses in cells (tests: the PML loops' branches they cover). */
    static int[] pmlThicknesses() {
        return new int[] {THICK_PML, THICK_PML - 3, THIN_PML};
    }

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
     * paired and alternating, warm-up and vectors against scalar parts alone, updates made (limit): with the
     * warm-up of two grids, the touch plate 3.8e8 (5.5e8) 1.02–1.10x the wall time, the cube splitter 5.7e8 (5.7e8)
     * 0.95–1.05x, the attenuator corner 7.5e8 (1.05e9) 0.82–0.84x, the tail 8.5e8 (1.44e9) 0.86–0.98x; with the
     * warm-up of four grids (fewer kernels compiled again during the run, see {@link #warmUp}) the touch plate
     * 0.86–0.93x (stepping 0.5–0.6 s against 1.3–1.6 s scalar) and the cube splitter even (stepping 0.7–1.1 s against
     * 1.7–2.3 s: the warm-up takes what the steps gain), hence 4e8.
     */
    public static final double WORTH_CELL_UPDATES = 4e8;

    /** Whether a run of this plan warms up and steps the vector parts (see {@link #WORTH_CELL_UPDATES}). */
    public static boolean worth(CasePlan plan) {
        return worth(plan.builder(), plan.stop().maxSteps());
    }

    /**
     * Whether a run built by {@code b} of at most {@code steps} steps warms up and steps the vector parts: not on a
     * grid narrow enough to step in flat runs (fewer than 64 nodes across), where the vectors gain little on what the
     * warm-up costs. Whole commands, paired: a 15 x 569 Bloch-periodic gap (4.4e8 cell updates at its limit, 1.6e8
     * made) 2.76/2.87/3.51 s with the warm-up against 2.29/2.30/2.40 scalar; the 4 x 321 plasmon sensor's stepping
     * was no faster with vectors.
     */
    public static boolean worth(Simulation.Builder b, long steps) {
        return !b.flat() && worth(b.cells(), steps);
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
        if (worth(b, steps)) {
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
                WARM_UPS.incrementAndGet();
            }
        }
    }

    /**
     * Four grids stepped in turn, so that the JIT's profile has seen both ways of the kernels' branches before it
     * compiles them; a branch the profile never saw taken is compiled as a trap, and the run that takes it goes back to
     * the interpreter until the kernel is compiled again. JFR deoptimisation events in the examples' first steps
     * showed which: after a warm-up on one lossy grid, the lossless update, the PML loops, the per-row source loops,
     * the flush and the energy sum (two-prism example); after two square grids whose nx − 1 were both multiples of the
     * vector length, the scalar tails of the p kernels' rows (cube splitter: 431 nodes wide), the lossless Ex tail,
     * the PML rows' tails, and the beams' per-row sheet values (the lossless grid now carries a pair of sheets with
     * delays that differ cell by cell, as a tilted beam's do). Each recompiled kernel ran interpreted meanwhile:
     * the cube splitter's first 35 steps after the warm-up took 0.25 s. Now two widths of each kind, one whose
     * nx − 1 and one whose nx − 2 is a multiple of the vector length, and PMLs of two thicknesses on the lossless grids
     * (JitWarmUpTest). Whole commands, paired and alternating, 2-core machine, against the warm-up of two grids:
     * attenuator corner 2.42/2.57/2.38 s against 2.77/2.75/2.62 (0.91x), tail 4.27/3.71/3.26/3.26 against
     * 4.65/4.07/3.76/3.54 (0.91x), prism coupler 7.28/7.29/7.37 against 7.90/7.66/7.55 (0.95x), two-prism even
     * within the machine's drift; same bits (flux and probe tables). A p run's cross terms (a tilted or curved
     * interface smoothed with the tensor) are added by a pass of their own each step: the lossless grids' block is a
     * smoothed disk, so that pass is compiled too (cube splitter, paired: 2.22/2.10/2.21/2.28 s against
     * 2.26/2.49/2.33/2.47, stepping 0.5 s against 0.8 s).
     */
    private static void warmUp(Polarization pol, Precision precision) {
        Simulation[] grids = new Simulation[4];
        try {
            for (int q = 0; q < 2; q++) {
                grids[q] = grid(pol, precision, false, THICK_N[q]);
                grids[2 + q] = grid(pol, precision, true, THIN_N[q]);
            }
            for (int k = 0; k < STEPS; k += 2) {
                for (int q = 0; q < grids.length; q++) {
                    Simulation s = grids[q];
                    s.run(2);
                    int n = s.nx();
                    int p = q < 2 ? THICK_PML : THIN_PML;
                    // over the interior, as the stopping rule sums it (a sum from column 0 alone left compiled code
                    // whose loop predicates failed on the run's first interior sum), and over the whole grid
                    s.energy(p, p, n - p, n - p);
                    if (k % 16 == 0) {
                        s.energy(0, 0, n, n);
                    }
                }
            }
        } finally {
            for (Simulation s : grids) {
                if (s != null) {
                    s.close();
                }
            }
        }
    }

    /**
     * A warm-up grid: a block in the middle (lossless: a smoothed disk with cross terms; lossy: a square), a point pulse
     * beside it, the flush every fourth step.
     */
    private static Simulation grid(Polarization pol, Precision precision, boolean lossy, int n) {
        double dx = 50e-9;
        double f = PhysicalConstants.C0 / (20 * dx);
        int c = n / 2;
        // lossless: a disk smoothed with the tensor, whose cross terms a p run adds after each step (CrossCoupling)
        MaterialGrid g = lossy
                ? MaterialGrid.builder(n, n, dx, Material.VACUUM)
                        .paint((x, y) -> Math.abs(x - c) < 10 && Math.abs(y - c) < 10, new Material("warm-up", 2.0, 1e5))
                        .build()
                : Rasterizer.rasterize(Scene.builder(Material.VACUUM).add(Ellipse.disk(c * dx, c * dx, 10.3 * dx),
                        new Material("warm-up", 2.25, 0)).build(), new GridSpec(0, 0, dx, n, n), Smoothing.ANISOTROPIC);
        GaussianPulse pulse = new GaussianPulse(f, 0.3 * f);
        Simulation.Builder b = Simulation.builder(g).polarization(pol).precision(precision).threads(1)
                .boundaries(Boundary.pml(lossy ? THIN_PML : THICK_PML)).vectorsFromStart().flushInterval(4)
                .source(Source.point(pol.components()[0], n, c - 15, c - 15, 1.0, pulse));
        if (!lossy) {
            b.boundary(Side.RIGHT, Boundary.pml(THICK_PML - 3)).boundary(Side.TOP, Boundary.pml(THICK_PML - 3));
            // a beam's pair of sheets on two rows: the bands' per-row source values
            int from = THICK_PML + 2;
            int[] cells = new int[n - 2 * from];
            double[] re = new double[cells.length];
            double[] delays = new double[cells.length];
            for (int t = 0; t < cells.length; t++) {
                re[t] = 1;
                delays[t] = t * 1e-17;
            }
            for (int q = 0; q < 2; q++) {
                int row = c + 12 + q;
                for (int t = 0; t < cells.length; t++) {
                    cells[t] = row * n + from + t;
                }
                b.incident(new IncidentSheet(pol.components()[q], cells, re, new double[cells.length], delays, pulse));
            }
        }
        Simulation s = b.build();
        s.setField(pol.components()[0], c, c, 1.0);
        return s;
    }
}
