package org.evanesce.solver.record;

import org.evanesce.solver.grid.Component;

/**
 * What a step listener may read of a running simulation, between steps. After step n the
 * electric field is at time nΔt and the magnetic field at (n − ½)Δt.
 */
public interface StepView {

    /** Steps completed. */
    long stepCount();

    /** Time step Δt, seconds. */
    double dt();

    /** Time of the electric field now, nΔt. */
    default double time() {
        return stepCount() * dt();
    }

    /** Time at which a component's current values hold. */
    default double time(Component c) {
        return c.electric ? time() : time() - 0.5 * dt();
    }

    int nx();

    int ny();

    /** Cell size Δ, metres. */
    double cellSize();

    /**
     * Reads a component along row j from node i0 (inclusive) to i1 (exclusive) into {@code re} (and, when not
     * null, the imaginary parts into {@code im}), from index 0: what {@link #field} gives, value for value.
     */
    default void readRow(Component c, int j, int i0, int i1, double[] re, double[] im) {
        for (int i = i0; i < i1; i++) {
            re[i - i0] = field(c, i, j);
            if (im != null) {
                im[i - i0] = fieldImag(c, i, j);
            }
        }
    }

    /**
     * As {@link #readRow} into single-precision arrays from index {@code at}, where the fields are single precision
     * ({@link #singlePrecision}): the values as stored, without conversion. Returns false, reading nothing, where
     * they are not.
     */
    default boolean readRowFloats(Component c, int j, int i0, int i1, float[] re, float[] im, int at) {
        return false;
    }

    /**
     * Whether the fields are complex (Bloch-periodic sides); when false every {@link #fieldImag} is zero and
     * recorders may leave the imaginary parts out of their work.
     */
    default boolean complexFields() {
        return false;
    }

    /**
     * Whether every field value is a single-precision float (widened to double by {@link #field} and
     * {@link #readRow}), so that a recorder may hold values as floats without changing them.
     */
    default boolean singlePrecision() {
        return false;
    }

    /** A component's value at node (i, j) (its site is offset per {@link Component}); the real part if complex. */
    double field(Component c, int i, int j);

    /** The imaginary part of a component at node (i, j): zero unless the run has Bloch-periodic boundaries. */
    default double fieldImag(Component c, int i, int j) {
        return 0.0;
    }

    /**
     * Electromagnetic energy per unit length along z (J/m) in the cells i0 ≤ i &lt; i1,
     * j0 ≤ j &lt; j1, in the staggered form the Yee scheme conserves; see the solver's documentation.
     */
    double energy(int i0, int j0, int i1, int j1);
}
