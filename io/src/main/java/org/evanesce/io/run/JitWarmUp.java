package org.evanesce.io.run;

import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;

/**
 * Runs the update kernels' vector parts on a small throw-away grid so the JIT compiles them before
 * a run reaches them: until then the Vector API runs in a slow generic form, which would spoil a
 * timed trial. A run steps scalar for its first cell updates (see {@link Simulation#scalarStartCellUpdates()}), so
 * the warm-up can run beside it ({@link #start}) and only runs that reach the vector parts need one
 * ({@link #needed}). Compiled code stays for the
 * life of the process, so each polarization and precision is warmed up once per process (a
 * sweep's later points, all in one process, skip it); a caller that asks while another warms
 * the same kernels up waits for it instead of doing the same work again.
 */
public final class JitWarmUp {

    /** Steps of a 96 × 96 grid with a lossy block and PMLs: enough calls of every kernel for the optimising compiler. */
    static final int STEPS = 400;

    /** One polarization and precision's warm-up: done or not, and the lock a second caller waits on. */
    private static final class Once {
        private volatile boolean done;
    }

    private record Kernels(Polarization pol, Precision precision) { }

    private static final java.util.Map<Kernels, Once> WARM = new java.util.concurrent.ConcurrentHashMap<>();

    private JitWarmUp() {
    }

    /**
     * Whether a run of this plan reaches the kernels' vector parts: an engine runs their scalar parts
     * alone for its first {@link Simulation#scalarStartCellUpdates()} cell updates (they need no warm-up), so a
     * smaller run gains nothing from one.
     */
    public static boolean needed(CasePlan plan) {
        return (double) plan.grid().nx() * plan.grid().ny() * plan.stop().maxSteps() >= Simulation.scalarStartCellUpdates();
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
     * Says whether the warm-up of one polarization and precision is done (for {@link
     * org.evanesce.solver.Simulation.Builder#vectorsWhen}); cheap enough to ask once per step.
     */
    public static java.util.function.BooleanSupplier done(Polarization pol, Precision precision) {
        Once once = WARM.computeIfAbsent(new Kernels(pol, precision), k -> new Once());
        return () -> once.done;
    }

    /**
     * Starts the warm-up of one polarization and precision on a background (daemon) thread, so that it overlaps
     * the work before the first run (a sweep reads and plans its points meanwhile); a run's own call then finds it
     * done or waits for it. A warm-up that fails here is left to that call, which does it again.
     */
    public static void start(Polarization pol, Precision precision) {
        Thread t = new Thread(() -> {
            try {
                run(pol, precision);
            } catch (RuntimeException | OutOfMemoryError e) {
                // not done: the run's own call warms up (and reports what goes wrong there)
            }
        }, "kernel-warm-up");
        t.setDaemon(true);
        t.start();
    }

    private static void warmUp(Polarization pol, Precision precision) {
        int n = 96;
        MaterialGrid g = MaterialGrid.builder(n, n, 50e-9, Material.VACUUM)
                .paint((x, y) -> x > 40 && x < 60 && y > 40 && y < 60, new Material("warm-up", 2.0, 1e5)).build();
        try (Simulation s = Simulation.builder(g).polarization(pol).precision(precision).threads(1)
                .boundaries(Boundary.pml(12)).vectorsFromStart().build()) {
            s.setField(pol.components()[0], n / 2, n / 2, 1.0);
            s.run(STEPS);
        }
    }
}
