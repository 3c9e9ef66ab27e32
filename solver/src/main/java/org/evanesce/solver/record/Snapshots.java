package org.evanesce.solver.record;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.Arrays;
import org.evanesce.solver.grid.Component;

/**
 * Takes frames of chosen field components over a region at chosen steps and hands each to a
 * {@link Sink} at once, so memory stays bounded however many frames a run takes: one frame's
 * values (components × region cells doubles) plus whatever the sink keeps.
 *
 * <p>Each frame's values are the components averaged onto the cell nodes ({@link Nodes}); a
 * component's values hold at its own time (E at nΔt, H at (n − ½)Δt after step n). Complex
 * (Bloch) runs give the real part; the sink also receives the imaginary parts when the run has them.
 */
public final class Snapshots implements StepListener {

    /** Receives frames as they are taken. */
    public interface Sink {
        /**
         * @param step   steps completed
         * @param times  each component's time, s
         * @param real   each component's node values (region row-major), real part
         * @param imag   the imaginary parts, or null for a real run
         */
        void frame(long step, double[] times, double[][] real, double[][] imag) throws IOException;
    }

    private final Component[] components;
    private final int i0;
    private final int j0;
    private final int w;
    private final int h;
    private final long[] steps;
    private final boolean complex;
    private final Sink sink;
    private int next;

    /**
     * @param steps   the steps after which to take a frame (any order; duplicates and steps never reached are ignored)
     * @param complex whether to read imaginary parts too (Bloch-periodic runs)
     */
    public Snapshots(Component[] components, int i0, int j0, int i1, int j1, long[] steps, boolean complex, Sink sink) {
        if (i1 <= i0 || j1 <= j0 || i0 < 0 || j0 < 0 || components.length == 0) {
            throw new IllegalArgumentException(String.format("snapshot region [%d, %d) x [%d, %d) with %d components: need a "
                    + "non-empty region inside the grid and at least one component", i0, i1, j0, j1, components.length));
        }
        this.components = components.clone();
        this.i0 = i0;
        this.j0 = j0;
        this.w = i1 - i0;
        this.h = j1 - j0;
        this.steps = Arrays.stream(steps).filter(s -> s > 0).sorted().distinct().toArray();
        this.complex = complex;
        this.sink = sink;
    }

    /** Bytes of the one frame held while it is handed over. */
    public long frameBytes() {
        return (long) components.length * w * h * Double.BYTES * (complex ? 2 : 1) * 2;
    }

    @Override
    public void afterStep(StepView v) {
        while (next < steps.length && steps[next] < v.stepCount()) {
            next++;
        }
        if (next >= steps.length || steps[next] != v.stepCount()) {
            return;
        }
        next++;
        double[][] re = new double[components.length][];
        double[][] im = complex ? new double[components.length][] : null;
        double[] times = new double[components.length];
        for (int c = 0; c < components.length; c++) {
            Component comp = components[c];
            times[c] = v.time(comp);
            double[] a = new double[w * h];
            double[] b = complex ? new double[w * h] : null;
            for (int j = 0; j < h; j++) {
                for (int i = 0; i < w; i++) {
                    a[j * w + i] = v.field(comp, i0 + i, j0 + j);
                    if (complex) {
                        b[j * w + i] = v.fieldImag(comp, i0 + i, j0 + j);
                    }
                }
            }
            re[c] = Nodes.average(comp, a, w, h);
            if (complex) {
                im[c] = Nodes.average(comp, b, w, h);
            }
        }
        try {
            sink.frame(v.stepCount(), times, re, im);
        } catch (IOException e) {
            throw new UncheckedIOException("writing the field frame after step " + v.stepCount() + ": " + e.getMessage(), e);
        }
    }
}
