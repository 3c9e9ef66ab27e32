package org.evanesce.solver.grid;

/** The four sides of the rectangular domain. */
public enum Side {
    /** x = 0 (i = 0). */
    LEFT,
    /** x = (nx − 1)Δ. */
    RIGHT,
    /** y = 0 (j = 0). */
    BOTTOM,
    /** y = (ny − 1)Δ. */
    TOP
}
