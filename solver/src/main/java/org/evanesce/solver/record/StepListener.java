package org.evanesce.solver.record;

/** Observes a run: called on the run's thread after every completed step. Must not keep the view. */
@FunctionalInterface
public interface StepListener {

    void afterStep(StepView view);
}
