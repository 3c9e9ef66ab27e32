package org.evanesce.solver.record;

import jdk.incubator.vector.DoubleVector;
import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorOperators;
import jdk.incubator.vector.VectorSpecies;

import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;

/**
 * Running discrete Fourier transforms of every field component of a run's polarization (s: Ez, Hx, Hy;
 * p: Hz, Ex, Ey) on a rectangle of cells [i0, i1) × [j0, j1), at a few frequencies (time dependence
 * exp(−iωt), docs/architecture.md).
 *
 * <p>Each component is transformed at its own sample time (E at nΔt, H at (n − ½)Δt, as {@link FluxLine}):
 * X(f) = Σ F(t) e^{i2πft} Δt, with complex (Bloch-periodic) fields taken as re + i·im. Node (i, j) of a
 * component stands for its site on the Yee cell ({@link Component#dx}, {@link Component#dy}); no
 * averaging onto common points is done. Each step reads every cell of the rectangle once per component
 * and accumulates all frequencies from that reading. With a stride N ({@link #stride(int)}) only the steps
 * whose number is a multiple of N are read, each weighted NΔt: X(f) = Σ F(t_{kN}) e^{i2πf t_{kN}} NΔt, the
 * same transform as long as the fields hold no frequency that N steps alias onto a mapped one (see
 * {@link #stride(int)}). A simulation shares the rows among its worker threads
 * ({@link SharedRecorder}); each cell's sums see the same operations in the same order on any thread.
 *
 * <p>Memory: the accumulators hold 2 doubles (re, im) per cell per component per frequency, so
 * {@link #bytes()} = 16 · w · h · 3 · F bytes for a w × h rectangle and F frequencies (e.g. 16 × 200
 * cells at 2 frequencies: 307 200 bytes). A single-precision run also holds {@link #HELD_STEPS} steps of the
 * fields as floats ({@link #HELD_BYTES_PER_CELL} per cell, twice that with complex fields), which {@link #bytes()}
 * does not count. The per-row scratch (6w doubles per worker thread) and the frequency tables
 * (4F doubles per held step) are not counted either. The accumulators are double; a float variant is not
 * offered, its accuracy over runs of thousands of steps not having been measured.
 */
public final class FieldMap implements StatefulListener, SharedRecorder {

    /**
     * Steps whose fields a single-precision run holds before adding them to the sums: the sums (48 bytes per
     * cell and frequency, read and written) then move once per 8 steps, the held floats 12 bytes per cell and
     * step written and read once. Each sum still adds the same products in the same order, so the results are
     * bitwise those of adding every step at once.
     */
    public static final int HELD_STEPS = 8;

    /** Bytes per cell of the map that holding steps adds in a single-precision run (twice that with complex fields). */
    public static final long HELD_BYTES_PER_CELL = 3L * HELD_STEPS * Float.BYTES;

    private final Component[] components;
    private final int i0;
    private final int j0;
    private final int i1;
    private final int j1;
    private final double[] omega;
    /** DFT accumulators [component][frequency][(j − j0)·w + (i − i0)], real and imaginary parts. */
    private final double[][][] re;
    private final double[][][] im;
    /** This step's row of every component, real and imaginary parts, per worker: [worker][component][i − i0]. */
    private double[][][] rowRe;
    private double[][][] rowIm;
    /** Whether this step's fields are complex (set by {@link #prepare}). */
    private boolean complex;
    /**
     * e^{iωt}Δt per frequency and held step, for the electric and the magnetic sample times: [q][slot]
     * (one slot unless steps are held).
     */
    private final double[][] cosE, sinE, cosH, sinH;
    /**
     * Single-precision runs: the fields of up to {@link #HELD_STEPS} steps, held as the floats they are and
     * added to the sums together, so that each sum is read and written once per {@link #HELD_STEPS} steps
     * instead of every step: [component][slot · w · h + (j − j0)·w + (i − i0)]; the imaginary parts only for
     * complex fields. Null until the first step decides (double precision holds nothing).
     */
    private float[][] heldRe, heldIm;
    /** Whether steps are held (the fields are single precision); decided at the first step. */
    private boolean holding;
    private boolean decided;
    /** Steps held and not yet added; {@link #HELD_STEPS} once the step that filled the slots has added them. */
    private int pending;
    /**
     * Per worker, for {@link #addHeld}: calls so far and the last measured nanoseconds per cell and slot of the
     * scalar and the vector loop. Until the JIT has compiled the vector loop it runs the Vector API's Java
     * fallback, several times slower than the scalar loop (issue 18: most of the map's samples in a profile of the
     * tail example once it read every 8th step); both loops give every sum the same bits, so the choice is made on
     * time alone: the faster so far, the other tried on a few cells every {@link #RETRY_EVERY} calls.
     */
    private long[] heldCalls = new long[1];
    private double[] scalarCost = {Double.NaN};
    private double[] vectorCost = {Double.NaN};
    /** Calls between trials of the slower loop. */
    static final int RETRY_EVERY = 16;
    /** Cells (times the slots) the slower loop does on a trial: a few per cent of a 300 × 300 map's rows per band. */
    static final int TRIAL_CELLS = 2048;
    /** Tests: null lets the timings choose, else always the vector (true) or the scalar (false) loop. */
    Boolean forceVectors;
    /** Steps between samples: 1 reads every step. */
    private int stride = 1;
    private double windowStart = Double.NEGATIVE_INFINITY;
    private double windowEnd = Double.POSITIVE_INFINITY;
    private boolean checked;

    /**
     * @param pol         the run's polarization: which three components are transformed
     * @param i0          first column (inclusive), ≥ 0
     * @param j0          first row (inclusive), ≥ 0
     * @param i1          last column (exclusive), &gt; i0 and ≤ the grid's nx (checked at the first step)
     * @param j1          last row (exclusive), &gt; j0 and ≤ the grid's ny (checked at the first step)
     * @param frequencies in Hz, at least one; not modified
     */
    public FieldMap(Polarization pol, int i0, int j0, int i1, int j1, double... frequencies) {
        if (i0 < 0 || j0 < 0 || i1 <= i0 || j1 <= j0) {
            throw new IllegalArgumentException(String.format(
                    "field map cells [%d, %d) × [%d, %d): need 0 <= i0 < i1 and 0 <= j0 < j1", i0, i1, j0, j1));
        }
        if (frequencies.length == 0) {
            throw new IllegalArgumentException("field map needs at least one frequency");
        }
        for (double f : frequencies) {
            if (!Double.isFinite(f)) {
                throw new IllegalArgumentException(String.format("field map frequency %g Hz is not finite", f));
            }
        }
        components = pol.components();
        this.i0 = i0;
        this.j0 = j0;
        this.i1 = i1;
        this.j1 = j1;
        int nf = frequencies.length;
        omega = new double[nf];
        for (int q = 0; q < nf; q++) {
            omega[q] = 2 * Math.PI * frequencies[q];
        }
        int w = i1 - i0;
        int cells = w * (j1 - j0);
        re = new double[components.length][nf][cells];
        im = new double[components.length][nf][cells];
        rowRe = new double[1][components.length][w];
        rowIm = new double[1][components.length][w];
        cosE = new double[nf][HELD_STEPS];
        sinE = new double[nf][HELD_STEPS];
        cosH = new double[nf][HELD_STEPS];
        sinH = new double[nf][HELD_STEPS];
    }

    /**
     * Transforms only the samples taken at times in [start, end), s (see {@link FluxLine#window}). Each
     * component keeps its own sample times, so E and H windows differ by at most one step.
     */
    public FieldMap window(double start, double end) {
        if (!(end > start)) {
            throw new IllegalArgumentException(String.format("field map window [%g, %g) s is empty", start, end));
        }
        windowStart = start;
        windowEnd = end;
        return this;
    }

    /**
     * Reads the fields only at steps whose number is a multiple of {@code steps}, each sample weighted
     * steps·Δt (call before the first step). The caller must know that the fields hold no frequency f'
     * with f' ≡ ±f (mod 1/(steps·Δt)) other than f itself for a mapped frequency f: by the Poisson summation
     * formula the strided sum is the every-step sum plus the fields' spectrum at f + k/(steps·Δt), k ≠ 0
     * (the sampling theorem: C. E. Shannon, "Communication in the presence of noise", Proc. IRE 37, 10–21,
     * 1949, Theorem 1). For fields band-limited to |f'| ≤ f_top (a linear grid passes on only its sources'
     * frequencies, modulo 1/Δt) that holds when 1/(steps·Δt) &gt; f + f_top.
     *
     * @param steps steps between samples, ≥ 1
     */
    public FieldMap stride(int steps) {
        if (steps < 1) {
            throw new IllegalArgumentException(String.format("field map stride %d steps: expected at least 1", steps));
        }
        stride = steps;
        return this;
    }

    /** Steps between samples (1: every step). */
    public int stride() {
        return stride;
    }

    @Override
    public boolean prepare(StepView v, int workers) {
        if (!checked) {
            if (i1 > v.nx() || j1 > v.ny()) {
                throw new IllegalStateException(String.format(
                        "field map cells [%d, %d) × [%d, %d) exceed the %d × %d grid", i0, i1, j0, j1, v.nx(), v.ny()));
            }
            checked = true;
        }
        if (stride > 1 && v.stepCount() % stride != 0) {
            return false;
        }
        double te = v.time();
        double th = te - 0.5 * v.dt();
        double weight = stride * v.dt();
        double we = te >= windowStart && te < windowEnd ? weight : 0;
        double wh = th >= windowStart && th < windowEnd ? weight : 0;
        if (we == 0 && wh == 0) {
            return false;
        }
        if (pending == HELD_STEPS) {
            pending = 0;
        }
        complex = v.complexFields();
        if (!decided) {
            holding = v.singlePrecision();
            if (holding) {
                int cells = (i1 - i0) * (j1 - j0);
                heldRe = new float[components.length][HELD_STEPS * cells];
                heldIm = complex ? new float[components.length][HELD_STEPS * cells] : null;
            }
            decided = true;
        }
        int slot = holding ? pending++ : 0;
        for (int q = 0; q < omega.length; q++) {
            cosE[q][slot] = Math.cos(omega[q] * te) * we;
            sinE[q][slot] = Math.sin(omega[q] * te) * we;
            cosH[q][slot] = Math.cos(omega[q] * th) * wh;
            sinH[q][slot] = Math.sin(omega[q] * th) * wh;
        }
        if (rowRe.length < workers) {
            int w = i1 - i0;
            rowRe = new double[workers][components.length][w];
            rowIm = new double[workers][components.length][w];
        }
        if (heldCalls.length < workers) {
            heldCalls = java.util.Arrays.copyOf(heldCalls, workers);
            scalarCost = java.util.Arrays.copyOf(scalarCost, workers);
            vectorCost = java.util.Arrays.copyOf(vectorCost, workers);
            for (int k = 0; k < workers; k++) {
                if (heldCalls[k] == 0) {
                    scalarCost[k] = Double.NaN;
                    vectorCost[k] = Double.NaN;
                }
            }
        }
        return true;
    }

    /** The rows of the map: unit u is row j0 + u. */
    @Override
    public int units() {
        return j1 - j0;
    }

    @Override
    public void share(StepView v, int u0, int u1, int worker) {
        int w = i1 - i0;
        double[][] rowsRe = rowRe[worker];
        double[][] rowsIm = rowIm[worker];
        int cells = w * (j1 - j0);
        for (int j = j0 + u0; j < j0 + u1; j++) {
            int row = (j - j0) * w;
            if (holding) {
                int at = (pending - 1) * cells + row;
                for (int c = 0; c < components.length; c++) {
                    if (!v.readRowFloats(components[c], j, i0, i1, heldRe[c], complex ? heldIm[c] : null, at)) {
                        throw new IllegalStateException("field map: the view said single precision but gave no single-precision row");
                    }
                }
                continue;
            }
            for (int c = 0; c < components.length; c++) {
                v.readRow(components[c], j, i0, i1, rowsRe[c], complex ? rowsIm[c] : null);
            }
            add(rowsRe, rowsIm, row, w);
        }
        if (holding && pending == HELD_STEPS) {
            addHeld(u0 * w, (u1 - u0) * w, HELD_STEPS, worker);
        }
    }

    /** Four doubles a vector (256 bits: the width the kernels measured best, docs/architecture.md) and the floats they come from. */
    private static final VectorSpecies<Double> DS = DoubleVector.SPECIES_256;
    private static final VectorSpecies<Float> FS = FloatVector.SPECIES_128;

    /**
     * Adds held slots 0 .. slots − 1 of the cells [first, first + count) (flat map indices) to the sums, by the
     * loop that has been faster for this worker ({@link #heldCalls}); every {@link #RETRY_EVERY} calls (and on
     * the first) the other loop does the first {@link #TRIAL_CELLS} cells, timed apart, so that a loop not yet
     * compiled costs little to try. Both loops give every cell the same bits.
     */
    private void addHeld(int first, int count, int slots, int worker) {
        if (count == 0) {
            return;
        }
        boolean vectors;
        boolean trial;
        if (forceVectors != null) {
            vectors = forceVectors;
            trial = false;
        } else {
            long n = heldCalls[worker]++;
            boolean unknown = Double.isNaN(scalarCost[worker]) || Double.isNaN(vectorCost[worker]);
            // unknown: the loop not yet timed is the trial
            vectors = unknown ? !Double.isNaN(vectorCost[worker]) : vectorCost[worker] < scalarCost[worker];
            trial = unknown || n % RETRY_EVERY == 0;
        }
        int done = first;
        if (trial) {
            int k = Math.min(count, TRIAL_CELLS);
            long t0 = System.nanoTime();
            addHeld(first, k, slots, !vectors);
            record(worker, !vectors, System.nanoTime() - t0, (long) k * slots);
            done = first + k;
        }
        if (done < first + count) {
            long t0 = System.nanoTime();
            addHeld(done, first + count - done, slots, vectors);
            record(worker, vectors, System.nanoTime() - t0, (long) (first + count - done) * slots);
        }
    }

    /** Keeps the latest cost, in nanoseconds per cell and slot, of one loop. */
    private void record(int worker, boolean vectors, long nanos, long cellSlots) {
        double cost = nanos / (double) cellSlots;
        if (vectors) {
            vectorCost[worker] = cost;
        } else {
            scalarCost[worker] = cost;
        }
    }

    /**
     * Adds held slots 0 .. slots − 1 of the cells [first, first + count) to the sums: with {@code vectors} four cells
     * at a time with the sums in registers over the slots, the rest (or all) one cell at a time; each sum gets, slot
     * after slot, the products and sums of the one-step form (no fused multiply-add), so the bits are those of
     * adding every step at once, whichever loop.
     */
    private void addHeld(int first, int count, int slots, boolean vectors) {
        int cells = (i1 - i0) * (j1 - j0);
        int vectorEnd = vectors ? first + count - count % DS.length() : first;
        for (int c = 0; c < components.length; c++) {
            boolean electric = components[c].electric;
            float[] a = heldRe[c];
            float[] b = complex ? heldIm[c] : null;
            for (int q = 0; q < omega.length; q++) {
                double[] cs = electric ? cosE[q] : cosH[q];
                double[] sn = electric ? sinE[q] : sinH[q];
                double[] xr = re[c][q];
                double[] xi = im[c][q];
                int t = first;
                for (; t < vectorEnd; t += DS.length()) {
                    DoubleVector r = DoubleVector.fromArray(DS, xr, t);
                    DoubleVector i = DoubleVector.fromArray(DS, xi, t);
                    for (int slot = 0; slot < slots; slot++) {
                        if (cs[slot] == 0 && sn[slot] == 0) {
                            continue;
                        }
                        int at = slot * cells + t;
                        DoubleVector f = (DoubleVector) FloatVector.fromArray(FS, a, at).convertShape(VectorOperators.F2D, DS, 0);
                        if (b == null) {
                            r = r.add(f.mul(cs[slot]));
                            i = i.add(f.mul(sn[slot]));
                        } else {
                            DoubleVector g = (DoubleVector) FloatVector.fromArray(FS, b, at).convertShape(VectorOperators.F2D, DS, 0);
                            r = r.add(f.mul(cs[slot]).sub(g.mul(sn[slot])));
                            i = i.add(f.mul(sn[slot]).add(g.mul(cs[slot])));
                        }
                    }
                    r.intoArray(xr, t);
                    i.intoArray(xi, t);
                }
                // one cell at a time, its sums in locals over the slots (not read and written back per slot)
                int end = first + count;
                for (; t < end; t++) {
                    double r = xr[t];
                    double i = xi[t];
                    for (int slot = 0; slot < slots; slot++) {
                        double c0 = cs[slot];
                        double s0 = sn[slot];
                        if (c0 == 0 && s0 == 0) {
                            continue;
                        }
                        double u = a[slot * cells + t];
                        if (b == null) {
                            r += u * c0;
                            i += u * s0;
                        } else {
                            double w = b[slot * cells + t];
                            r += u * c0 - w * s0;
                            i += u * s0 + w * c0;
                        }
                    }
                    xr[t] = r;
                    xi[t] = i;
                }
            }
        }
    }

    /** Adds one step's row of every component (read into {@code rowsRe}, {@code rowsIm}) to the sums of cells [row, row + w). */
    private void add(double[][] rowsRe, double[][] rowsIm, int row, int w) {
        int slot = 0;
        for (int c = 0; c < components.length; c++) {
            boolean electric = components[c].electric;
            double[] a = rowsRe[c];
            double[] b = rowsIm[c];
            for (int q = 0; q < omega.length; q++) {
                double cs = electric ? cosE[q][slot] : cosH[q][slot];
                double sn = electric ? sinE[q][slot] : sinH[q][slot];
                if (cs == 0 && sn == 0) {
                    continue;
                }
                double[] xr = re[c][q];
                double[] xi = im[c][q];
                if (!complex) {
                    // real fields: the imaginary parts are zero, and so are their products
                    for (int k = 0; k < w; k++) {
                        xr[row + k] += a[k] * cs;
                        xi[row + k] += a[k] * sn;
                    }
                    continue;
                }
                for (int k = 0; k < w; k++) {
                    xr[row + k] += a[k] * cs - b[k] * sn;
                    xi[row + k] += a[k] * sn + b[k] * cs;
                }
            }
        }
    }

    /** Adds the steps still held (between steps: before the sums are read or saved). */
    private void settle() {
        if (holding && pending > 0 && pending < HELD_STEPS) {
            addHeld(0, (i1 - i0) * (j1 - j0), pending, 0);
        }
        pending = 0;
    }

    /**
     * A copy of the transform of component c at frequency number q: {re[], im[]}, row-major within the
     * rectangle, cell (i, j) at index (j − j0)·w + (i − i0); units V/m·s (η0·H for magnetic components).
     *
     * @throws IllegalArgumentException if c is not a component of this map's polarization
     */
    public double[][] transform(Component c, int q) {
        settle();
        int k = index(c);
        return new double[][] {re[k][q].clone(), im[k][q].clone()};
    }

    /** The transform of component c at frequency q and cell (i, j): {re, im}. */
    public double[] transform(Component c, int q, int i, int j) {
        if (i < i0 || i >= i1 || j < j0 || j >= j1) {
            throw new IllegalArgumentException(String.format("cell (%d, %d) is outside the field map [%d, %d) × [%d, %d)",
                    i, j, i0, i1, j0, j1));
        }
        settle();
        int k = index(c);
        int t = (j - j0) * (i1 - i0) + (i - i0);
        return new double[] {re[k][q][t], im[k][q][t]};
    }

    private int index(Component c) {
        for (int k = 0; k < components.length; k++) {
            if (components[k] == c) {
                return k;
            }
        }
        throw new IllegalArgumentException(String.format("component %s is not transformed by this %s field map", c,
                components[0].polarization));
    }

    /** The three components transformed (a copy). */
    public Component[] components() {
        return components.clone();
    }

    /** First column (inclusive). */
    public int firstColumn() {
        return i0;
    }

    /** First row (inclusive). */
    public int firstRow() {
        return j0;
    }

    /** Last column (exclusive). */
    public int endColumn() {
        return i1;
    }

    /** Last row (exclusive). */
    public int endRow() {
        return j1;
    }

    /** Width w = i1 − i0, cells. */
    public int width() {
        return i1 - i0;
    }

    /** Height h = j1 − j0, cells. */
    public int height() {
        return j1 - j0;
    }

    /** Number of frequencies F. */
    public int frequencyCount() {
        return omega.length;
    }

    /** Frequency number q, Hz. */
    public double frequency(int q) {
        return omega[q] / (2 * Math.PI);
    }

    /** The frequencies, Hz (a copy). */
    public double[] frequencies() {
        double[] f = new double[omega.length];
        for (int q = 0; q < f.length; q++) {
            f[q] = frequency(q);
        }
        return f;
    }

    /** Bytes held by the accumulators: 16 · w · h · 3 · F (2 doubles per cell, component and frequency). */
    public long bytes() {
        return 2L * Double.BYTES * width() * height() * components.length * omega.length;
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        settle();
        for (double[][][] a : new double[][][][] {re, im}) {
            out.writeInt(a.length);
            for (double[][] b : a) {
                out.writeInt(b.length);
                for (double[] c : b) {
                    org.evanesce.solver.kernel.StateIO.write(out, c);
                }
            }
        }
    }

    @Override
    public void readState(java.io.DataInput in) throws java.io.IOException {
        pending = 0;
        for (double[][][] a : new double[][][][] {re, im}) {
            if (in.readInt() != a.length) {
                throw new java.io.IOException("checkpoint's field map has another shape");
            }
            for (double[][] b : a) {
                if (in.readInt() != b.length) {
                    throw new java.io.IOException("checkpoint's field map has another shape");
                }
                for (double[] c : b) {
                    org.evanesce.solver.kernel.StateIO.read(in, c);
                }
            }
        }
    }
}
