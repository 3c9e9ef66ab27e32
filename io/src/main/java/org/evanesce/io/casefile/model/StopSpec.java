package org.evanesce.io.casefile.model;

import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

/** When a run ends. */
public sealed interface StopSpec {

    /**
     * The most time steps a run may take: about a day of stepping for a grid of ten thousand cells; more is
     * almost surely a mistyped time, Courant number or cell size.
     */
    long MAX_STEPS = 1_000_000_000L;

    /**
     * The energy fraction of {@code until: {latest: ...}} when {@code energy_below} is not given: the largest of
     * 1e-3 ... 1e-7 whose error in T and R, against a run to 1e-9, was below 1e-4 on the examples, some 25 times below
     * their discretisation error at 20 cells per wavelength (2.4e-3 in T and R against the plane-wave and beam
     * values). Measured with {@code tools/energy-fraction-study.sh CASE} (largest change over the flux wavelengths):
     *
     * <pre>
     * cases/two-prism-attenuator-beam.yaml       cases/gap-tunnelling-plane-wave.yaml
     * fraction  left     |dT|    |dR|    steps   every fraction: 0 change, 6048 steps (the check starts once
     * 1e-3      8.5e-4   7.6e-6  5.7e-3  7776    the source has faded, and by then 1e-12 is left)
     * 1e-4      7.9e-5   5.8e-7  1.5e-3  8032
     * 1e-5      7.1e-6   6.2e-8  3.7e-4  8256    the same case cut short by until.time (ungated):
     * 1e-6      7.0e-7   8.0e-9  8.7e-5  8448    5.1e-6 left: |dR| 1.0e-3; 8.2e-8 left: |dR| 1.0e-4
     * 1e-7      8.5e-8   1.0e-9  2.2e-5  8608
     * </pre>
     *
     * Each decade costs about 2 % more steps on the beam. A case whose energy falls exactly to the fraction
     * as the check starts, like the plane wave cut short, can err by about 0.4 √fraction (4e-4 at 1e-6).
     */
    double DEFAULT_ENERGY_FRACTION = 1e-6;

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
