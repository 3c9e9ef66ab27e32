package org.evanesce.solver.record;

/**
 * A step listener whose per-step work the run's worker threads share, instead of the run's thread doing it
 * alone after the step (issue 18). The work is a number of units (a map's rows, a line's cells) that are
 * independent: each unit's accumulators are written by that unit's work only, and nothing is summed across
 * units during a step, so every unit sees the same operations in the same order whichever thread does it,
 * and results are bitwise those of {@link #afterStep} for any number of threads.
 *
 * <p>A simulation calls, for every step: {@link #prepare} on its own thread, before the step's fields are
 * computed (only the times, the time step, the grid's size and {@link StepView#complexFields} may be read
 * then: the view already answers for the step being taken); then, once the step's fields stand, {@link #share}
 * on disjoint ranges of [0, {@link #units}) that together cover it, from up to {@code workers} threads at
 * once, each with its own worker number. Elsewhere (a listener list without threads) {@link #afterStep} does
 * both on the caller.
 */
public interface SharedRecorder extends StepListener {

    /**
     * The serial part of a step: the sample times and weights, the step's factors. Returns false when this
     * step needs no shared part (outside the window). May allocate scratch for {@code workers} threads.
     *
     * @param v       the view of the step being taken (its {@link StepView#stepCount} is the count after it)
     * @param workers the most threads that may call {@link #share} at once, numbered 0 .. workers − 1
     */
    boolean prepare(StepView v, int workers);

    /** The units of work of every step (fixed for the recorder's life), at least 1. */
    int units();

    /**
     * Does units u0 ≤ u &lt; u1 of the step that {@link #prepare} announced, reading the fields through the
     * view; called from several threads at once on disjoint ranges, each with its own {@code worker} number.
     */
    void share(StepView v, int u0, int u1, int worker);

    @Override
    default void afterStep(StepView v) {
        if (prepare(v, 1)) {
            share(v, 0, units(), 0);
        }
    }
}
