package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Courant;
import org.junit.jupiter.api.Test;

/** The one home of the Courant number: the time step it sets, the stability limit and the refusal. */
class CourantTest {

    /** 1/c0 = 3.33564095 ns per metre (c0 = 299 792 458 m/s exactly, SI definition of the metre), given to 9 digits. */
    private static final double SECONDS_PER_METRE = 3.33564095e-9;
    /** Relative agreement with that 9-digit figure: its last digit. */
    private static final double NINE_DIGITS = 2e-9;

    @Test
    void timeStepIsTheCourantNumberTimesTheLightTransitTimeOfACell() {
        // S = 0.5 and a 1 µm cell: Δt = 0.5 × 1e-6 m × 3.33564095 ns/m = 1.667820475e-15 s
        double dt = Courant.timeStep(0.5, 1e-6);
        assertEquals(0.5 * 1e-6 * SECONDS_PER_METRE, dt, NINE_DIGITS * dt);
        assertEquals(0.5, Courant.of(dt, 1e-6), 1e-15);
        try (Simulation sim = Simulation.builder(MaterialGrid.builder(8, 8, 30e-9, Material.VACUUM).build())
                .boundaries(Boundary.pec()).build()) {
            assertEquals(Courant.timeStep(Courant.DEFAULT, 30e-9), sim.dt(), 0.0, "the builder's default time step is decided here");
        }
    }

    @Test
    void limitIsOneOverRootTwoScaledByTheSlowestFreeSpeed() {
        // 2D Yee limit 1/√2 = 0.70710678 (Taflove & Hagness ch. 4, from memory); where εr < 1 light is faster by 1/√εr
        assertEquals(0.70710678, Courant.LIMIT_2D, 1e-8);
        assertEquals(0.70710678, Courant.limit(2.25), 1e-8);
        assertEquals(0.5 * 0.70710678, Courant.limit(0.25), 1e-8);
        assertTrue(Courant.DEFAULT < Courant.LIMIT_2D);
    }

    @Test
    void refusesZeroNegativeNotANumberAndTheLimitItself() {
        for (double s : new double[] {0, -0.1, Double.NaN, Courant.LIMIT_2D, 0.72}) {
            Optional<String> r = Courant.refusal(s, 1.0);
            assertTrue(r.isPresent(), "S = " + s + " must be refused");
            assertTrue(r.get().contains(String.format("%g", s)) && r.get().contains("0.707107"), r.get());
        }
        assertEquals(Optional.empty(), Courant.refusal(0.70, 1.0));
        assertTrue(Courant.refusal(0.6, 0.5).orElseThrow().contains("sqrt(0.500000)"));
    }
}
