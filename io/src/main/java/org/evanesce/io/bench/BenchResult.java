package org.evanesce.io.bench;

/**
 * The timing of one {@link BenchCase}. A cell update is one cell's three field components
 * updated once, so one step of an N × N grid is N² cell updates.
 *
 * @param benchCase     what was measured
 * @param threadsUsed   threads the solver actually stepped with
 * @param warmUpSeconds  untimed stepping before the timing, in seconds
 * @param settled       whether the warm-up's step rate settled (false: the machine was busy or the
 *                      JIT still compiling when the warm-up's time limit ran out)
 * @param stepsPerRepeat steps timed in each repeat
 * @param repeats       timed repeats
 * @param cellsPerSecond median over the repeats of cell updates per second (wall clock)
 * @param slowest       the slowest repeat's cell updates per second
 * @param fastest       the fastest repeat's cell updates per second
 * @param bytesPerCell  bytes of the arrays spanning the whole grid, per cell (Simulation.bytesPerCell)
 * @param bytes         bytes of field, coefficient and CPML arrays and of the metal's auxiliary state held by the
 *                      run (Simulation.bytes)
 * @param dispersiveBytes the part of {@code bytes} held by the metal cells' auxiliary state (Simulation.dispersiveBytes)
 * @param fewerThreads  fraction of the timed steps that ran on fewer threads than {@code threadsUsed}
 *                      (the solver measured that fewer were faster: cores taken by other work)
 */
public record BenchResult(BenchCase benchCase, int threadsUsed, double warmUpSeconds, boolean settled,
                          long stepsPerRepeat, int repeats,
                          double cellsPerSecond, double slowest, double fastest, int bytesPerCell, long bytes,
                          long dispersiveBytes, double fewerThreads) {

    /** Bytes per cell of the arrays spanning the grid plus the metal's auxiliary state spread over every cell. */
    public double bytesPerCellWithMetal() {
        return bytesPerCell + dispersiveBytes / (double) benchCase.cells();
    }

    /** Median cell updates per second, in millions. */
    public double megacellsPerSecond() {
        return cellsPerSecond / 1e6;
    }

    /** Wall-clock nanoseconds per cell update (all threads together), at the median rate. */
    public double nanosPerCell() {
        return 1e9 / cellsPerSecond;
    }

    /** Whole time steps per second at the median rate. */
    public double stepsPerSecond() {
        return cellsPerSecond / benchCase.cells();
    }

    /** (fastest − slowest) / median, in percent: how noisy the measurement was. */
    public double spreadPercent() {
        return 100 * (fastest - slowest) / cellsPerSecond;
    }

    /** {@link #bytes} in MiB. */
    public double mebibytes() {
        return bytes / (1024.0 * 1024.0);
    }
}
