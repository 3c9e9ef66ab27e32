package org.evanesce.solver.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.EnumMap;
import java.util.Map;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.solver.MaterialCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The bands' expected work per row ({@link Engine#rowWork}) counts a row's dispersive cells: a film of
 * Rakić's gold (1 Drude and 5 Lorentz terms: 12 values per electric site with E before the update) three rows thick across a grid
 * with PEC sides adds {@link Engine#ADE_VALUE_WORK} × 12 per site of the film's rows, and nothing elsewhere
 * (s: one electric site per cell, Ez; p: two, Ex and Ey, both in the film).
 */
class DispersiveRowWorkTest {

    @ParameterizedTest(name = "{0} {1}")
    @CsvSource({"S, FLOAT", "P, FLOAT", "S, DOUBLE", "P, DOUBLE"})
    void theFilmsRowsCarryTheirCurrentsWork(Polarization pol, Precision precision) {
        int nx = 40;
        int ny = 30;
        DispersiveMaterial gold = MetalLibrary.get("gold").material();
        Material stand = new Material("gold", 1.0, 0.0);
        MaterialGrid grid = MaterialGrid.builder(nx, ny, 10e-9, Material.VACUUM)
                .paint(CellRegion.box(4.6, 11.6, 34.4, 14.4), stand).build();
        double courant = 0.6;
        double dt = Courant.timeStep(courant, 10e-9);
        double[][] c = MaterialCoefficients.of(grid.materials(), courant, dt);
        AdeCoefficients[] ade = new AdeCoefficients[grid.materials().size()];
        int m = grid.materials().indexOf(stand);
        ade[m] = AdeCoefficients.of(gold, courant, dt);
        c[0][m] = ade[m].ca();
        c[1][m] = ade[m].cb();
        Map<Side, Boundary> sides = new EnumMap<>(Side.class);
        for (Side s : Side.values()) {
            sides.put(s, Boundary.pec());
        }
        Engine e = Engine.create(grid, pol, precision, courant, c[0], c[1], ade, sides);
        double[] w = e.rowWork();
        int values = 1 + ade[m].drudeCount() + 2 * ade[m].lorentzCount();
        assertEquals(12, values, "Rakić's gold: E before the update, 1 Drude current, 5 x 2 Lorentz values");
        double plain = w[5];
        assertEquals(nx, plain, 1e-12, "a plain row: one per cell");
        double film = 0;
        for (int j = 0; j < ny; j++) {
            film += w[j] - plain;
        }
        // every site of the film (inside the walls), once per electric component
        int sites = 0;
        for (org.evanesce.solver.grid.Component comp : pol.components()) {
            if (comp.electric) {
                sites += countSites(grid, Engine.site(comp), m);
            }
        }
        assertEquals(pol == Polarization.S ? 30 * 3 : 2 * 30 * 3, sites, 1 + (pol == Polarization.S ? 0 : 2 * 30 + 2 * 3),
                "the film's sites (p: Ex and Ey sit half a cell off, so an edge row or column may differ)");
        assertEquals(Engine.ADE_VALUE_WORK * values * sites, film, 1e-9, "sites " + sites);
        assertEquals(plain, w[2], 1e-12, "rows away from the film");
        assertEquals(plain, w[ny - 3], 1e-12, "rows away from the film");
    }

    private static int countSites(MaterialGrid grid, org.evanesce.geometry.FieldSite site, int m) {
        int n = 0;
        for (int j = 0; j < grid.ny(); j++) {
            for (int i = 0; i < grid.nx(); i++) {
                if (grid.id(site, i, j) == m) {
                    n++;
                }
            }
        }
        return n;
    }
}
