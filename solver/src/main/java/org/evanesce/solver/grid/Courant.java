package org.evanesce.solver.grid;

import java.util.Optional;
import org.evanesce.geometry.PhysicalConstants;

/**
 * The Courant number S = c0Δt/Δ and the time step it sets: the one place that decides the default
 * number, the stability limit and Δt from S and the cell size. The planner, the case-file reader
 * and {@link Simulation.Builder} all ask here.
 */
public final class Courant {

    /**
     * The 2D Courant limit of the Yee scheme on a square grid in vacuum, 1/√2 (Taflove &amp; Hagness,
     * Computational Electrodynamics, 3rd ed. 2005, ch. 4; chapter from memory).
     */
    public static final double LIMIT_2D = 1.0 / Math.sqrt(2.0);

    /**
     * The Courant number used when none is given: about 0.71 of {@link #LIMIT_2D}, a safe fraction of
     * the limit (common practice) that keeps numerical dispersion modest.
     */
    public static final double DEFAULT = 0.5;

    private Courant() {
    }

    /** The time step Δt = SΔ/c0, seconds, for Courant number S and cell size Δ in metres. */
    public static double timeStep(double courant, double cellSize) {
        return courant * cellSize / PhysicalConstants.C0;
    }

    /** The Courant number S = c0Δt/Δ of a time step (seconds) and a cell size (metres). */
    public static double of(double timeStep, double cellSize) {
        return PhysicalConstants.C0 * timeStep / cellSize;
    }

    /**
     * The largest stable Courant number on a grid whose smallest relative permittivity is
     * {@code minPermittivity}: {@link #LIMIT_2D}, scaled by √εr,min where εr,min &lt; 1 (light is faster
     * there than in vacuum).
     */
    public static double limit(double minPermittivity) {
        return LIMIT_2D * Math.sqrt(Math.min(1.0, minPermittivity));
    }

    /**
     * Why Courant number S cannot be used on such a grid, as a sentence naming the value and the
     * bound; empty when S lies in (0, {@link #limit}).
     */
    public static Optional<String> refusal(double courant, double minPermittivity) {
        double limit = limit(minPermittivity);
        if (courant > 0 && courant < limit) {
            return Optional.empty();
        }
        return Optional.of(String.format("Courant number %g must lie in (0, %g): the 2D Yee limit 1/sqrt(2)%s", courant, limit,
                limit < LIMIT_2D ? String.format(" scaled by sqrt(%g), the smallest permittivity", minPermittivity) : ""));
    }
}
