package org.evanesce.io.sweep;

import java.util.Locale;
import org.evanesce.solver.Simulation;

/**
 * How many points of a sweep run at once, and with how many threads each. The solver gives a grid
 * one thread per {@link Simulation#MIN_CELLS_PER_THREAD} cells at most (its default threshold: a
 * thread hand-over costs more than a smaller band's step) and at most one per two rows, so a small grid
 * leaves cores idle; several points then run side by side with the cores shared out between them.
 * A grid large enough for every core runs alone with all of them. Results do not depend on the
 * choice (every thread count gives the same numbers, bit for bit).
 *
 * @param parallel        points at once
 * @param threadsPerPoint threads each point asks for
 * @param reason          the choice in words, for the output
 */
public record Parallelism(int parallel, int threadsPerPoint, String reason) {

    /** Share of the JVM's heap the points running at once may plan to use together. */
    static final double MEMORY_SHARE = 0.8;

    /**
     * The default choice, or the one forced by {@code --parallel}.
     *
     * @param cores        threads the sweep may use in all
     * @param cells        the largest grid of the points to run (nx × ny)
     * @param rows         the rows (ny) of that grid
     * @param bytesPerPoint memory one point needs (the planner's estimate: its grid, recorders and the
     *                     incident-power run's beside it)
     * @param memory       memory the JVM may use
     * @param points       points to run
     * @param forced       {@code --parallel}, or null
     */
    public static Parallelism choose(int cores, long cells, int rows, long bytesPerPoint, long memory, int points, Integer forced) {
        int useful = (int) Math.max(1, Math.min(Math.min(cores, cells / Simulation.MIN_CELLS_PER_THREAD), rows / 2));
        if (forced != null) {
            int p = Math.max(1, Math.min(forced, Math.max(1, points)));
            return new Parallelism(p, Math.max(1, cores / p), String.format(Locale.ROOT, "--parallel %d", forced));
        }
        int byCores = Math.max(1, cores / useful);
        long byMemory = Math.max(1, (long) (MEMORY_SHARE * memory / Math.max(1, bytesPerPoint)));
        int p = (int) Math.max(1, Math.min(Math.min(byCores, byMemory), Math.max(1, points)));
        String why;
        if (p == 1 && useful >= cores) {
            why = String.format(Locale.ROOT, "a grid of %d cells uses all %d threads", cells, cores);
        } else if (p == 1 && points <= 1) {
            why = "one point to run";
        } else if (p == 1) {
            why = String.format(Locale.ROOT, "a grid of %d cells uses %d of %d threads, but memory allows one point at a time",
                    cells, useful, cores);
        } else {
            why = String.format(Locale.ROOT, "a grid of %d cells uses at most %d thread(s) (one per %d cells), so %d "
                    + "points share the %d threads", cells, useful, Simulation.MIN_CELLS_PER_THREAD, p, cores);
        }
        return new Parallelism(p, Math.max(1, cores / p), why);
    }
}
