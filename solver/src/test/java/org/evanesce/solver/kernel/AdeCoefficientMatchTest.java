package org.evanesce.solver.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.Spectral;
import org.evanesce.solver.MaterialCoefficients;
import org.junit.jupiter.api.Test;

/**
 * geometry's ADE coefficients use the engine's normalisation: for a material without poles they are
 * the engine's ca and cb (MaterialCoefficients, spread by Engine.coefficients) bit for bit, so the planner can take every material's ca', cb'
 * from {@link AdeCoefficients} without changing a dielectric-only run.
 */
class AdeCoefficientMatchTest {

    @Test
    void poleFreeCoefficientsAreTheEnginesBitForBit() {
        List<Material> materials = List.of(Material.VACUUM, Material.ofIndex("glass", 1.515),
                new Material("lossy", 2.25, 4e4), new Material("conductor", 1, 5.8e7), new Material("gain", 3, -1e3));
        double dx = 20e-9;
        for (double courant : new double[] {0.3, 0.5, 0.7}) {
            double dt = courant * dx / PhysicalConstants.C0;
            for (Material m : materials) {
                MaterialGrid grid = MaterialGrid.builder(4, 4, dx, m).build();
                // what Simulation gives the engine, spread over the cells as the engine does
                double[][] perMaterial = MaterialCoefficients.of(grid.materials(), courant, dt);
                double[][] engine = Engine.coefficients(grid, FieldSite.EZ, perMaterial[0], perMaterial[1]);
                AdeCoefficients ade = AdeCoefficients.of(DispersiveMaterial.of(m), courant, dt);
                assertEquals(engine[0][5], ade.ca(), 0.0, m.name() + " ca at S = " + courant);
                assertEquals(engine[1][5], ade.cb(), 0.0, m.name() + " cb at S = " + courant);
            }
        }
    }
}
