package org.evanesce.solver.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumMap;
import java.util.Map;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.MaterialCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The blocked sweep (rows of a block first, then the x-side CPML strips of the whole block) gives
 * the same bits as updating one complete row after the other, for every block size: every cell
 * must see the same operations in the same order (the ordering argument of Engine.sweep).
 * CPML of different thicknesses on three sides, a PMC wall on the fourth, a dielectric and a
 * lossy block reaching into the layers, sources of both kinds and the periodic flush.
 */
class BlockEqualityTest {

    private static final int NX = 53;
    private static final int NY = 41;
    private static final int STEPS = 200;
    private static final int FLUSH_EVERY = 16;

    @ParameterizedTest(name = "{0} {1} {2}")
    @CsvSource({"S, FLOAT, PMC", "P, FLOAT, PMC", "S, DOUBLE, PMC", "P, DOUBLE, PMC",
        "S, FLOAT, PML", "P, FLOAT, PML", "S, DOUBLE, PEC", "P, DOUBLE, PEC"})
    void everyBlockSizeGivesTheBitsOfTheRowByRowUpdate(Polarization pol, Precision precision, String top) {
        double[][] rowByRow = run(pol, precision, top, 0);
        for (int block : new int[] {1, 3, 7, 64}) {
            double[][] blocked = run(pol, precision, top, block);
            for (int q = 0; q < rowByRow.length; q++) {
                for (int k = 0; k < NX * NY; k++) {
                    int c = q;
                    int cell = k;
                    assertEquals(Double.doubleToRawLongBits(rowByRow[q][k]), Double.doubleToRawLongBits(blocked[q][k]),
                            () -> String.format("%s %s top %s, blocks of %d rows: %s differs at (%d, %d)", pol, precision,
                                    top, block, pol.components()[c], cell % NX, cell / NX));
                }
            }
        }
    }

    /** Runs the set-up; {@code block} 0 means row by row through hRowFull/eRowFull, as before blocking. */
    private static double[][] run(Polarization pol, Precision precision, String top, int block) {
        MaterialGrid grid = MaterialGrid.builder(NX, NY, 40e-9, Material.VACUUM)
                .paint(CellRegion.below(15.5), Material.ofIndex("glass", 1.5))
                .paint(CellRegion.box(30, 20, 60, 45), new Material("lossy", 2.0, 4e5))
                .build();
        Map<Side, Boundary> sides = new EnumMap<>(Side.class);
        sides.put(Side.LEFT, Boundary.pml(5));
        sides.put(Side.RIGHT, Boundary.pml(12));
        sides.put(Side.BOTTOM, Boundary.pml(7));
        sides.put(Side.TOP, switch (top) {
            case "PMC" -> Boundary.pmc();
            case "PEC" -> Boundary.pec();
            default -> Boundary.pml(9);
        });
        double courant = 0.6;
        double[][] coefficients = MaterialCoefficients.of(grid.materials(), courant, Courant.timeStep(courant, 40e-9));
        Engine e = Engine.create(grid, pol, precision, courant, coefficients[0], coefficients[1], null, sides);
        Component[] comps = pol.components();
        // one electric and one magnetic source term, inside the left and bottom layers' reach
        e.setSources(new int[] {20 * NX + 9, 6 * NX + 26}, new Component[] {comps[pol == Polarization.S ? 0 : 1],
            comps[pol == Polarization.S ? 1 : 0]});
        if (block > 0) {
            e.blockRows = block;
        }
        double largest = 0;
        for (int n = 0; n < STEPS; n++) {
            double v = Math.sin(0.3 * n) * Math.exp(-Math.pow((n - 40) / 15.0, 2));
            e.sourceValue(0, v);
            e.sourceValue(1, 0.5 * v);
            boolean flush = n % FLUSH_EVERY == 0;
            if (block > 0) {
                e.sweep(0, NY, 0, flush);
                largest = Math.max(largest, e.sweep(0, NY, 1, flush));
            } else {
                e.hRowFull(NY - 1, flush);
                for (int j = 0; j < NY; j++) {
                    if (j < NY - 1) {
                        e.hRowFull(j, flush);
                    }
                    largest = Math.max(largest, e.eRowFull(j, flush));
                }
            }
        }
        assertTrue(largest > 1e-3, "the fields must not have vanished: " + largest);
        double[][] out = new double[3][NX * NY];
        for (int q = 0; q < 3; q++) {
            for (int k = 0; k < NX * NY; k++) {
                out[q][k] = e.get(comps[q], k);
            }
        }
        return out;
    }
}
