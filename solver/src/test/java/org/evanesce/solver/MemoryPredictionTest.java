package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumMap;
import java.util.Map;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * {@link Simulation#footprint} (the one count of the solver's memory, made before anything is
 * allocated: arrays + pml) equals exactly what the built engines count from the arrays they hold, for both
 * polarizations and precisions, with and without conductivity, on awkward grid sizes with PML
 * strips that are widened to whole vectors, strips too wide to widen, walls, and Bloch-periodic
 * sides (two parts and their seam values).
 */
class MemoryPredictionTest {

    private static final double DX = 30e-9;

    @ParameterizedTest(name = "{0} {1} lossy {2}, {3} sides, {4}×{5}")
    @CsvSource({
        "S, FLOAT, false, PML, 37, 29", "S, FLOAT, true, PML, 37, 29", "P, FLOAT, false, PML, 37, 29",
        "P, FLOAT, true, PML, 37, 29", "S, DOUBLE, false, PML, 41, 33", "S, DOUBLE, true, PML, 41, 33",
        "P, DOUBLE, false, PML, 41, 33", "P, DOUBLE, true, PML, 41, 33",
        "S, FLOAT, true, WALLS, 23, 31", "P, DOUBLE, false, WALLS, 23, 31",
        "S, FLOAT, false, BLOCH, 30, 47", "P, FLOAT, true, BLOCH, 30, 47", "S, DOUBLE, true, BLOCH, 30, 47",
        "P, DOUBLE, false, BLOCH, 30, 47",
        "S, FLOAT, false, NARROW, 17, 40", "P, DOUBLE, true, NARROW, 17, 40"})
    void predictionEqualsTheEnginesCount(Polarization pol, Precision precision, boolean lossy, String kind, int nx, int ny) {
        MaterialGrid.Builder gb = MaterialGrid.builder(nx, ny, DX, Material.VACUUM)
                .paint(CellRegion.below(ny / 3.0), Material.ofIndex("glass", 1.5));
        if (lossy) {
            gb.paint(CellRegion.box(nx / 4.0, ny / 4.0, nx / 2.0, ny / 2.0), new Material("lossy", 2.0, 1e5));
        }
        MaterialGrid grid = gb.build();
        Map<Side, Boundary> sides = sides(kind);
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(precision).threads(1);
        sides.forEach(b::boundary);
        boolean bloch = kind.equals("BLOCH");
        try (Simulation sim = b.build()) {
            String what = String.format("%s %s lossy %s, %s sides, %d×%d", pol, precision, lossy, kind, nx, ny);
            long[] f = Simulation.footprint(nx, ny, pol, precision, sides, lossy);
            assertEquals(f[0] + f[1], sim.bytes(), what);
            // the coefficients in double while building: two arrays of nx·ny per electric site
            assertEquals((pol == Polarization.S ? 2L : 4L) * Double.BYTES * nx * ny, f[2], what);
            assertEquals(Simulation.predictBytesPerCell(pol, precision, lossy, bloch), sim.bytesPerCell(), what);
            // at least the whole-grid arrays themselves
            assertTrue(sim.bytes() >= (long) sim.bytesPerCell() * nx * ny, what);
        }
    }

    private static Map<Side, Boundary> sides(String kind) {
        Map<Side, Boundary> m = new EnumMap<>(Side.class);
        switch (kind) {
            case "PML" -> {
                m.put(Side.LEFT, Boundary.pml(7));
                m.put(Side.RIGHT, Boundary.pml(12));
                m.put(Side.BOTTOM, Boundary.pml(5));
                m.put(Side.TOP, Boundary.pml(9));
            }
            case "WALLS" -> {
                m.put(Side.LEFT, Boundary.pmc());
                m.put(Side.RIGHT, Boundary.pec());
                m.put(Side.BOTTOM, Boundary.pml(6));
                m.put(Side.TOP, Boundary.pmc());
            }
            case "BLOCH" -> {
                m.put(Side.LEFT, Boundary.bloch(2e6));
                m.put(Side.RIGHT, Boundary.bloch(2e6));
                m.put(Side.BOTTOM, Boundary.pml(8));
                m.put(Side.TOP, Boundary.pml(10));
            }
            default -> {
                // a 17-node grid: a left strip of 11 cannot be widened to 16 (float) inside the walls
                m.put(Side.LEFT, Boundary.pml(11));
                m.put(Side.RIGHT, Boundary.pml(3));
                m.put(Side.BOTTOM, Boundary.pml(4));
                m.put(Side.TOP, Boundary.pml(4));
            }
        }
        return m;
    }
}
