package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.api.Test;

/** The Courant bound is enforced before stepping, and a run that blows up stops with a located message. */
class StabilityTest {

    private static MaterialGrid vacuum(int n) {
        return MaterialGrid.builder(n, n, 50e-9, Material.VACUUM).build();
    }

    @Test
    void courantNumberAboveTheTwoDimensionalLimitIsRefused() {
        // 2D limit 1/√2 ≈ 0.7071 (Taflove & Hagness ch. 4)
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Simulation.builder(vacuum(40)).courant(0.72).build());
        assertTrue(e.getMessage().contains("0.72") && e.getMessage().contains("0.707"), e.getMessage());
        try (Simulation s = Simulation.builder(vacuum(40)).courant(0.70).build()) {
            assertTrue(s.courant() == 0.70);
        }
    }

    @Test
    void permittivityBelowOneLowersTheLimit() {
        MaterialGrid g = MaterialGrid.builder(40, 40, 50e-9, Material.VACUUM)
                .paint(CellRegion.box(10, 10, 20, 20), new Material("low", 0.5, 0)).build();
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Simulation.builder(g).courant(0.6).build());
        assertTrue(e.getMessage().contains("0.5"), e.getMessage());
    }

    @Test
    void runawayGrowthStopsWithinTheCheckIntervalAndNamesStepTimeAndCell() {
        // a gain medium (negative conductivity) grows without bound
        MaterialGrid g = MaterialGrid.builder(64, 64, 50e-9, Material.VACUUM)
                .paint(CellRegion.box(20, 20, 44, 44), new Material("gain", 1.0, -4e6)).build();
        double f = PhysicalConstants.C0 / (20 * 50e-9);
        int interval = 16;
        try (Simulation s = Simulation.builder(g).polarization(Polarization.S).boundaries(Boundary.pec())
                .flushInterval(interval).divergenceLimit(1e6)
                .source(Source.point(Component.EZ, 64, 32, 32, 1.0, TimeSignal.gaussianPulse(f, f / 2))).build()) {
            DivergenceException e = assertThrows(DivergenceException.class, () -> s.run(100_000));
            String m = e.getMessage();
            assertTrue(m.contains("step " + e.step()) && m.contains("t = ") && m.contains("cell ("), m);
            assertTrue(e.step() % interval == 0, "detected at a check step: " + e.step());
            assertTrue(e.step() < 100_000, m);
        }
    }

    @Test
    void notANumberIsReported() {
        try (Simulation s = Simulation.builder(vacuum(48)).boundaries(Boundary.pec()).flushInterval(4).build()) {
            s.setField(Component.EZ, 20, 21, Double.NaN);
            DivergenceException e = assertThrows(DivergenceException.class, () -> s.run(100));
            assertTrue(e.getMessage().contains("NaN"), e.getMessage());
            assertTrue(e.step() <= 4, e.getMessage());
        }
    }
}
