package org.evanesce.solver.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.DrudeTerm;
import org.evanesce.solver.MaterialCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.parallel.BandTeam;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Whole engines whose rows correct the x-side CPML strips in their own pass ({@link FloatXStripRows})
 * give the bits of the same engines correcting them down the columns after the rows, as before
 * (common practice: the ordering argument, checked on every field bit). Set-ups: CPML on all four
 * sides (the corners, where a cell takes the x correction and then the y one), on one x side with a
 * PMC or PEC wall on the other, a free-electron metal (auxiliary currents) and a lossy block reaching
 * into the strips, a dielectric across the grid, sources of both kinds, the periodic flush, scalar then
 * vector kernels, on 1 and 2 threads.
 */
class XStripRowsEngineTest {

    private static final int NX = 61;
    private static final int NY = 47;
    private static final int STEPS = 240;
    private static final double CELL = 20e-9;
    /** A free-electron metal (ħωp = 9 eV, ħγ = 0.07 eV; made up, as in MetalReflectanceTest). */
    private static final DispersiveMaterial DRUDE = new DispersiveMaterial("drude", 1.0, 0,
            List.of(DrudeTerm.ofElectronVolts(9.0, 0.07)), List.of());

    @ParameterizedTest(name = "{0} {1}, sides {2}, {3} threads")
    @CsvSource({"S, FLOAT, all, 1", "P, FLOAT, all, 1", "S, FLOAT, all, 2", "P, FLOAT, all, 2", "S, DOUBLE, all, 2",
        "P, DOUBLE, all, 1", "S, FLOAT, left, 1", "P, FLOAT, left, 2", "S, FLOAT, right, 2", "P, DOUBLE, right, 1"})
    void rowPassGivesTheBitsOfTheColumnPass(Polarization pol, Precision precision, String sides, int threads) {
        double[][] rows = run(pol, precision, sides, threads, false);
        double[][] columns = run(pol, precision, sides, threads, true);
        for (int q = 0; q < 3; q++) {
            for (int k = 0; k < NX * NY; k++) {
                int c = q;
                int cell = k;
                assertEquals(Double.doubleToRawLongBits(columns[q][k]), Double.doubleToRawLongBits(rows[q][k]),
                        () -> String.format("%s %s, sides %s, %d threads: %s differs at (%d, %d)", pol, precision, sides,
                                threads, pol.components()[c], cell % NX, cell / NX));
            }
        }
    }

    private static double[][] run(Polarization pol, Precision precision, String which, int threads, boolean columns) {
        Material metal = new Material("metal", 1.0, 0.0);
        Material lossy = new Material("lossy", 2.0, 4e5);
        MaterialGrid grid = MaterialGrid.builder(NX, NY, CELL, Material.VACUUM)
                .paint(CellRegion.below(15.5), Material.ofIndex("glass", 1.5))
                .paint(CellRegion.box(3, 18, 14, 30), metal)
                .paint(CellRegion.box(45, 30, 59, 45), lossy)
                .build();
        Map<Side, Boundary> sides = new EnumMap<>(Side.class);
        switch (which) {
            case "all" -> {
                sides.put(Side.LEFT, Boundary.pml(6));
                sides.put(Side.RIGHT, Boundary.pml(9));
                sides.put(Side.BOTTOM, Boundary.pml(7));
                sides.put(Side.TOP, Boundary.pml(8));
            }
            case "left" -> {
                sides.put(Side.LEFT, Boundary.pml(10));
                sides.put(Side.RIGHT, Boundary.pmc());
                sides.put(Side.BOTTOM, Boundary.pml(5));
                sides.put(Side.TOP, Boundary.pec());
            }
            default -> {
                sides.put(Side.LEFT, Boundary.pec());
                sides.put(Side.RIGHT, Boundary.pml(7));
                sides.put(Side.BOTTOM, Boundary.pmc());
                sides.put(Side.TOP, Boundary.pml(6));
            }
        }
        double courant = 0.6;
        double dt = Courant.timeStep(courant, CELL);
        double[][] coefficients = MaterialCoefficients.of(grid.materials(), courant, dt);
        AdeCoefficients[] ade = new AdeCoefficients[grid.materials().size()];
        int m = grid.materials().indexOf(metal);
        AdeCoefficients c = AdeCoefficients.of(DRUDE, courant, dt);
        coefficients[0][m] = c.ca();
        coefficients[1][m] = c.cb();
        ade[m] = c;
        Engine e = Engine.create(grid, pol, precision, courant, coefficients[0], coefficients[1], ade, sides);
        assertNotNull(split(e), "these strips must take the row pass");
        if (columns) {
            columnPass(e);
        }
        e.vectorAfter(100L * NX * NY);
        Component[] comps = pol.components();
        // one electric and one magnetic source term, inside the left strip and near the right one
        e.setSources(new int[] {20 * NX + 4, 26 * NX + 50}, new Component[] {comps[pol == Polarization.S ? 0 : 1],
            comps[pol == Polarization.S ? 1 : 0]});
        double largest = 0;
        try (BandTeam team = new BandTeam(NY, threads, "x-strip-rows-test")) {
            for (int n = 0; n < STEPS; n++) {
                double v = Math.sin(0.3 * n) * Math.exp(-Math.pow((n - 40) / 15.0, 2));
                e.sourceValue(0, v);
                e.sourceValue(1, 0.5 * v);
                boolean flush = n % 16 == 15;
                largest = Math.max(largest, team.step((j0, j1, p) -> e.sweep(j0, j1, p, flush)));
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

    /** The engine's split of its magnetic x-strip cells (null: the column pass). */
    private static Object split(Engine e) {
        if (e instanceof FloatEngine f) {
            return FloatXStripRows.split(f.xs, false, 0, NX - 1);
        }
        return DoubleXStripRows.split(((DoubleEngine) e).xs, false, 0, NX - 1);
    }

    private static void columnPass(Engine e) {
        if (e instanceof FloatS f) {
            f.columnPass();
        } else if (e instanceof FloatP f) {
            f.columnPass();
        } else if (e instanceof DoubleS d) {
            d.columnPass();
        } else {
            ((DoubleP) e).columnPass();
        }
    }
}
