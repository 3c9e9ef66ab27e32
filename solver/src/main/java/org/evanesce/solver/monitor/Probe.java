package org.evanesce.solver.monitor;

import java.util.Arrays;
import org.evanesce.solver.grid.Component;

/**
 * Records one component at one node after every step: a time series with its time stamps (and
 * the imaginary parts, which only Bloch-periodic runs have).
 */
public final class Probe implements StepListener {

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
}
