package org.evanesce.solver;

import java.util.List;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.parallel.BandTeam;
import org.evanesce.solver.record.SharedRecorder;
import org.evanesce.solver.record.StepListener;
import org.evanesce.solver.record.StepView;

/**
 * The recorders of a simulation that its worker threads share (issue 18), and the view they get. Before a
 * step, {@link #prepare} calls each recorder's serial part on the run's thread; after the bands' two phases
 * (a barrier), the thread of band b of k does, of each recorder that takes this step, the units
 * ⌊U·j0/ny⌋ ≤ u &lt; ⌊U·j1/ny⌋ for its rows [j0, j1): the shares follow the bands, so the team's balancing,
 * which times each band's whole work, moves recorder work with the rows. Every unit is done by the same code
 * on any thread, so results do not depend on the split (see {@link SharedRecorder}).
 */
final class SharedRecorders implements BandTeam.After {

    /** The run, seen only through its view: the recorders need nothing more. */
    private final StepView sim;
    private final int workers;
    private SharedRecorder[] all = new SharedRecorder[0];
    /** The recorders that take the current step, first {@code count}. */
    private SharedRecorder[] taking = new SharedRecorder[0];
    private int count;
    /** The simulation as it will be after the step being taken: its step count is one ahead. */
    private final StepView ahead;

    SharedRecorders(StepView sim, int workers) {
        this.sim = sim;
        this.workers = workers;
        ahead = new Ahead();
    }

    /** Takes the shared recorders out of {@code listeners}, in order. */
    void use(List<StepListener> listeners) {
        all = listeners.stream().filter(l -> l instanceof SharedRecorder).toArray(SharedRecorder[]::new);
        taking = new SharedRecorder[all.length];
    }

    /** Whether a listener is run here rather than after the step. */
    static boolean isShared(StepListener l) {
        return l instanceof SharedRecorder;
    }

    /** The serial parts, before the step; returns the work for the band team, null when no recorder takes this step. */
    BandTeam.After prepare() {
        count = 0;
        for (SharedRecorder r : all) {
            if (r.prepare(ahead, workers)) {
                taking[count++] = r;
            }
        }
        return count > 0 ? this : null;
    }

    @Override
    public void run(int band, int j0, int j1) {
        long ny = sim.ny();
        for (int q = 0; q < count; q++) {
            SharedRecorder r = taking[q];
            long units = r.units();
            int u0 = (int) (units * j0 / ny);
            int u1 = (int) (units * j1 / ny);
            if (u0 < u1) {
                r.share(ahead, u0, u1, band);
            }
        }
    }

    /** The simulation's view with the step count of the step being taken (valid only inside the simulation's step). */
    private final class Ahead implements StepView {

        @Override
        public long stepCount() {
            return sim.stepCount() + 1;
        }

        @Override
        public double dt() {
            return sim.dt();
        }

        @Override
        public int nx() {
            return sim.nx();
        }

        @Override
        public int ny() {
            return sim.ny();
        }

        @Override
        public double cellSize() {
            return sim.cellSize();
        }

        @Override
        public void readRow(Component c, int j, int i0, int i1, double[] re, double[] im) {
            sim.readRow(c, j, i0, i1, re, im);
        }

        @Override
        public boolean readRowFloats(Component c, int j, int i0, int i1, float[] re, float[] im, int at) {
            return sim.readRowFloats(c, j, i0, i1, re, im, at);
        }

        @Override
        public boolean complexFields() {
            return sim.complexFields();
        }

        @Override
        public boolean singlePrecision() {
            return sim.singlePrecision();
        }

        @Override
        public double field(Component c, int i, int j) {
            return sim.field(c, i, j);
        }

        @Override
        public double fieldImag(Component c, int i, int j) {
            return sim.fieldImag(c, i, j);
        }

        @Override
        public double energy(int i0, int j0, int i1, int j1) {
            return sim.energy(i0, j0, i1, j1);
        }
    }
}
