package org.evanesce.io.bench;

import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;

/**
 * One benchmark configuration: a square {@code size} × {@code size} vacuum grid stepped with
 * {@code threads} requested threads.
 *
 * @param size              nodes along each axis
 * @param threads           threads requested (the solver may use fewer on small grids)
 * @param precision         field precision
 * @param polarization      s (Ez, Hx, Hy) or p (Hz, Ex, Ey)
 * @param minCellsPerThread the solver's threading threshold, or {@link #SOLVER_DEFAULT} to keep its default
 * @param metalFraction     fraction of the grid's cells, in [0, 0.5], made of Rakić's gold (whole rows, see
 *                          {@link Bench#metalRows}); 0 for the plain vacuum grid
 */
public record BenchCase(int size, int threads, Precision precision, Polarization polarization, int minCellsPerThread,
                        double metalFraction) {

    /** Keep the solver's own threading threshold. */
    public static final int SOLVER_DEFAULT = 0;

    /** Smallest grid the bench builds: two 12-cell CPMLs plus the 3 interior nodes the solver requires. */
    public static final int MIN_SIZE = 2 * Bench.PML_LAYERS + 3;

    /** Largest grid: size² cells must fit in one Java array. */
    public static final int MAX_SIZE = 46340;

    public BenchCase {
        if (size < MIN_SIZE || size > MAX_SIZE) {
            throw new IllegalArgumentException(String.format(
                    "grid size %d nodes must lie in [%d, %d] (two %d-cell CPMLs need an interior; size² must fit one array)",
                    size, MIN_SIZE, MAX_SIZE, Bench.PML_LAYERS));
        }
        if (threads < 1) {
            throw new IllegalArgumentException("threads " + threads + " must be >= 1");
        }
        if (!(metalFraction >= 0 && metalFraction <= MAX_METAL_FRACTION)) {
            throw new IllegalArgumentException(String.format(
                    "--metal-fraction %s must lie in [0, %s]", metalFraction, MAX_METAL_FRACTION));
        }
        if (minCellsPerThread < 0) {
            throw new IllegalArgumentException("minimum cells per thread " + minCellsPerThread + " must be >= 1 (or 0 for the solver's default)");
        }
    }

    /** Largest metal fraction: beyond half the grid the rows of metal would touch each other. */
    public static final double MAX_METAL_FRACTION = 0.5;

    /** A vacuum grid without metal. */
    public BenchCase(int size, int threads, Precision precision, Polarization polarization, int minCellsPerThread) {
        this(size, threads, precision, polarization, minCellsPerThread, 0);
    }

    /** Cells in the grid, size². */
    public long cells() {
        return (long) size * size;
    }
}
