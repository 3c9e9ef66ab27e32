package org.evanesce.io.plan.grid;

import java.util.Collections;
import java.util.EnumMap;
import java.util.Map;
import java.util.Optional;
import org.evanesce.geometry.GridSpec;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;

/**
 * The Yee grid a case runs on, derived from its request by {@link GridDerivation}. The domain is covered by
 * whole cells: nx − 1 cells of size Δ along x, at least the domain's width, centred on the origin (the domain
 * grows symmetrically when its width is not a whole number of cells); likewise along y. Node (i, j) lies at
 * ({@link #x}(i), {@link #y}(j)); nx and ny are at least 3.
 *
 * @param cellSize           Δ in metres, given or picked by the program, with the position of the request
 * @param nx                 nodes along x over the whole domain (a periodic run's solver grid has one column fewer)
 * @param ny                 nodes along y
 * @param cellsPerWavelength the rule the cell size was picked by, when it was not given (the study's scale applied)
 * @param offset             the nodes are moved by this fraction of a cell along x and y from the centred position
 * @param pmlCells           the PML's thickness in cells on each side that has one
 */
public record GridPlan(Value cellSize, int nx, int ny, Optional<Value> cellsPerWavelength, double offset,
        Map<Side, Integer> pmlCells) {

    public GridPlan {
        Map<Side, Integer> m = new EnumMap<>(Side.class);
        m.putAll(pmlCells);
        pmlCells = Collections.unmodifiableMap(m);
    }

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

    /** The PML's thickness on {@code side} in cells; 0 where the side has none. */
    public int pmlCells(Side side) {
        return pmlCells.getOrDefault(side, 0);
    }

    /**
     * The solver's grid: with periodic sides the width is one period, so the node at x = +W/2 is the image of
     * the one at −W/2 and is left out.
     */
    public GridSpec solverGrid(boolean periodic) {
        return new GridSpec(x(0), y(0), cellSize.si(), periodic ? nx - 1 : nx, ny);
    }
}
