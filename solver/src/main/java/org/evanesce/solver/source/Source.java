package org.evanesce.solver.source;

import java.util.Arrays;
import org.evanesce.solver.grid.Component;

/**
 * A soft current source on a set of cells: each step, cell t of {@link #cells} receives
 * amplitude[t]·g(t) as a current density of the given component (electric for E components,
 * magnetic for H components), in normalised units (η0Δ·J for an electric current J).
 * A point source has one cell; a line source lists the cells along its line, each with its own
 * amplitude, which is how spatial profiles such as a beam's are imposed.
 *
 * <p>With Bloch-periodic boundaries the fields are complex and so may the amplitudes be: a line
 * source with amplitudes e^{i kx x} launches a plane wave with in-plane wavenumber kx.
 *
 * @param component       the field component driven
 * @param cells           flat cell indices j·nx + i
 * @param amplitudes      one amplitude per cell (the real part)
 * @param imagAmplitudes  the imaginary parts, one per cell (all zero for a real source)
 * @param signal          the time dependence
 */
public record Source(Component component, int[] cells, double[] amplitudes, double[] imagAmplitudes, TimeSignal signal) {

    /** A real source. */
    public Source(Component component, int[] cells, double[] amplitudes, TimeSignal signal) {
        this(component, cells, amplitudes, new double[amplitudes.length], signal);
    }

    public Source {
        if (cells.length != amplitudes.length || cells.length != imagAmplitudes.length) {
            throw new IllegalArgumentException("source has " + cells.length + " cells but " + amplitudes.length
                    + " amplitudes and " + imagAmplitudes.length + " imaginary parts");
        }
        if (cells.length == 0) {
            throw new IllegalArgumentException("source has no cells");
        }
        for (int t = 0; t < cells.length; t++) {
            if (!Double.isFinite(amplitudes[t]) || !Double.isFinite(imagAmplitudes[t])) {
                throw new IllegalArgumentException("source amplitude " + amplitudes[t] + " + " + imagAmplitudes[t]
                        + "i is not finite");
            }
        }
        cells = cells.clone();
        amplitudes = amplitudes.clone();
        imagAmplitudes = imagAmplitudes.clone();
    }

    /** Whether any amplitude has an imaginary part. */
    public boolean isComplex() {
        for (double a : imagAmplitudes) {
            if (a != 0) {
                return true;
            }
        }
        return false;
    }

    /**
     * A plane-wave line source along x at row j for a Bloch-periodic run: amplitude e^{i kx x} at
     * every node of the row (x = x0 + iΔ, with the component's site offset).
     */
    public static Source blochRow(Component c, int nx, int j, double x0, double cellSize, double kx, TimeSignal g) {
        return blochRow(c, nx, j, x0, cellSize, kx, 1.0, g);
    }

    /** {@link #blochRow(Component, int, int, double, double, double, TimeSignal)} with amplitude a e^{i kx x}. */
    public static Source blochRow(Component c, int nx, int j, double x0, double cellSize, double kx, double a, TimeSignal g) {
        int[] cells = new int[nx];
        double[] re = new double[nx];
        double[] im = new double[nx];
        for (int i = 0; i < nx; i++) {
            double x = x0 + (i + c.dx) * cellSize;
            cells[i] = j * nx + i;
            re[i] = a * Math.cos(kx * x);
            im[i] = a * Math.sin(kx * x);
        }
        return new Source(c, cells, re, im, g);
    }

    /** A point source of amplitude a at node (i, j) of a grid nx wide. */
    public static Source point(Component c, int nx, int i, int j, double a, TimeSignal g) {
        return new Source(c, new int[] {j * nx + i}, new double[] {a}, g);
    }

    /** A uniform line source along x from i0 to i1 inclusive at row j. */
    public static Source rowLine(Component c, int nx, int i0, int i1, int j, double a, TimeSignal g) {
        int n = i1 - i0 + 1;
        int[] cells = new int[n];
        for (int t = 0; t < n; t++) {
            cells[t] = j * nx + i0 + t;
        }
        double[] amp = new double[n];
        Arrays.fill(amp, a);
        return new Source(c, cells, amp, g);
    }

    /** A uniform line source along y from j0 to j1 inclusive at column i. */
    public static Source columnLine(Component c, int nx, int i, int j0, int j1, double a, TimeSignal g) {
        int n = j1 - j0 + 1;
        int[] cells = new int[n];
        for (int t = 0; t < n; t++) {
            cells[t] = (j0 + t) * nx + i;
        }
        double[] amp = new double[n];
        Arrays.fill(amp, a);
        return new Source(c, cells, amp, g);
    }

    @Override
    public int[] cells() {
        return cells.clone();
    }

    @Override
    public double[] amplitudes() {
        return amplitudes.clone();
    }

    @Override
    public double[] imagAmplitudes() {
        return imagAmplitudes.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Source s && s.component == component && Arrays.equals(s.cells, cells)
                && Arrays.equals(s.amplitudes, amplitudes) && Arrays.equals(s.imagAmplitudes, imagAmplitudes)
                && s.signal.equals(signal);
    }

    @Override
    public int hashCode() {
        return 31 * (31 * component.hashCode() + Arrays.hashCode(cells)) + Arrays.hashCode(amplitudes);
    }

    @Override
    public String toString() {
        return "Source[" + component + ", " + cells.length + " cells, " + signal + "]";
    }
}
