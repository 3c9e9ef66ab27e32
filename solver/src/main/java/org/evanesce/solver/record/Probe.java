package org.evanesce.solver.record;

import java.util.Arrays;
import org.evanesce.solver.grid.Component;

/**
 * Records one component at one node after every step: a time series with its time stamps (and
 * the imaginary parts, which only Bloch-periodic runs have).
 */
public final class Probe implements StatefulListener {

    private final Component component;
    private final int i;
    private final int j;
    private double[] values = new double[1024];
    private double[] imag = new double[1024];
    private double[] times = new double[1024];
    private int n;

    public Probe(Component component, int i, int j) {
        this.component = component;
        this.i = i;
        this.j = j;
    }

    @Override
    public void afterStep(StepView view) {
        if (n == values.length) {
            values = Arrays.copyOf(values, 2 * n);
            imag = Arrays.copyOf(imag, 2 * n);
            times = Arrays.copyOf(times, 2 * n);
        }
        values[n] = view.field(component, i, j);
        imag[n] = view.fieldImag(component, i, j);
        times[n] = view.time(component);
        n++;
    }

    public Component component() {
        return component;
    }

    /** The recorded values, one per step. */
    public double[] values() {
        return Arrays.copyOf(values, n);
    }

    /** The imaginary parts, one per step: zero unless the run has Bloch-periodic boundaries. */
    public double[] imagValues() {
        return Arrays.copyOf(imag, n);
    }

    /** The time of each recorded value, seconds. */
    public double[] times() {
        return Arrays.copyOf(times, n);
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        out.writeInt(n);
        org.evanesce.solver.kernel.StateIO.write(out, java.util.Arrays.copyOf(values, n));
        org.evanesce.solver.kernel.StateIO.write(out, java.util.Arrays.copyOf(imag, n));
        org.evanesce.solver.kernel.StateIO.write(out, java.util.Arrays.copyOf(times, n));
    }

    @Override
    public void readState(java.io.DataInput in) throws java.io.IOException {
        int count = in.readInt();
        double[] v = new double[count];
        double[] im = new double[count];
        double[] t = new double[count];
        org.evanesce.solver.kernel.StateIO.read(in, v);
        org.evanesce.solver.kernel.StateIO.read(in, im);
        org.evanesce.solver.kernel.StateIO.read(in, t);
        int capacity = Math.max(1024, Integer.highestOneBit(Math.max(1, count)) << 1);
        values = java.util.Arrays.copyOf(v, capacity);
        imag = java.util.Arrays.copyOf(im, capacity);
        times = java.util.Arrays.copyOf(t, capacity);
        n = count;
    }
}
