package org.evanesce.io.casefile.model;

import java.util.Optional;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;

/**
 * The Yee grid the case asks for. The domain is covered by whole cells: nx − 1 cells of size Δ
 * along x, at least the domain's width, centred on the origin (the domain grows symmetrically
 * when its width is not a whole number of cells); likewise along y. Node (i, j) lies at
 * ({@link #x}(i), {@link #y}(j)), so the geometry module's grid is
 * {@code new GridSpec(x(0), y(0), cellSize, nx, ny)}; nx and ny are at least 3.
 *
 * @param cellSize           Δ in metres, given or picked by the program
 * @param nx                 nodes along x (the solver's array width)
 * @param ny                 nodes along y
 * @param cellsPerWavelength the rule the cell size was picked by, when it was not given
 * @param offset             the nodes are moved by this fraction of a cell along x and y from the centred
 *                           position (0 normally; an accuracy study's offset runs), in [0, 1)
 */
public record ResolutionSpec(Value cellSize, int nx, int ny, Optional<Value> cellsPerWavelength, double offset) {

    /**
     * Bytes per cell of a run's field and coefficient arrays before the polarization and materials
     * are known: the solver's figure for the largest case without Bloch sides (p polarization with
     * lossy cells: 28 in float, 56 in double; a lossless s run needs 16). The PML strips are left out,
     * small against the grid; the planner's {@code MemoryEstimate} counts everything.
     */
    public static int bytesPerCell(Precision precision) {
        return Simulation.predictBytesPerCell(Polarization.P, precision, true, false);
    }

    public long cells() {
        return (long) nx * ny;
    }

    /** Memory the fields and coefficients will need, bytes. */
    public double estimatedBytes(Precision precision) {
        return (double) nx * ny * bytesPerCell(precision);
    }

    /** x of node column i, metres. */
    public double x(int i) {
        return (i - (nx - 1) / 2.0 + offset) * cellSize.si();
    }

    /** y of node row j, metres. */
    public double y(int j) {
        return (j - (ny - 1) / 2.0 + offset) * cellSize.si();
    }
}
