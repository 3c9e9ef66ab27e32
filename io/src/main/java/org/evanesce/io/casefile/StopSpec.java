package org.evanesce.io.casefile;

/** When a run ends. */
public sealed interface StopSpec {

    /**
     * The most time steps a run may take: about a day of stepping for a grid of ten thousand cells; more is
     * almost surely a mistyped time, Courant number or cell size.
     */
    long MAX_STEPS = 1_000_000_000L;

    /**
     * The energy fraction of {@code until: {latest: ...}} when {@code energy_below} is not given: the figure the examples
     * and the settling rule used so far (Settling.FIXED_LENGTH_FRACTION).
     */
    double DEFAULT_ENERGY_FRACTION = 1e-5;

    /** Where the stopping rule was written. */
    SourcePosition at();

    /** After a simulated time, seconds. */
    record AfterTime(Value time) implements StopSpec {
        @Override
        public SourcePosition at() {
            return time.at();
        }
    }

    /** After a number of time steps. */
    record AfterSteps(Located<Long> steps) implements StopSpec {
        @Override
        public SourcePosition at() {
            return steps.at();
        }
    }

    /**
     * When the field energy in the domain has fallen below {@code fraction} of its largest value
     * (checked only once every source has faded), or at {@code latest} seconds of simulated time,
     * whichever comes first.
     */
    record WhenEnergyBelow(Value fraction, Value latest) implements StopSpec {
        @Override
        public SourcePosition at() {
            return latest.at();
        }
    }
}
