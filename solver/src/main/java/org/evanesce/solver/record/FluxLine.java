package org.evanesce.solver.record;

import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;

/**
 * Running discrete Fourier transforms of the tangential fields on a horizontal (or vertical) line,
 * and the Poynting flux through it per frequency (time dependence exp(−iωt), docs/architecture.md).
 *
 * <p>A vertical line ({@link #vertical}) is the same with x and y exchanged: at x = (col + ½)Δ,
 * Hy(col, j) with Ez averaged over columns col and col + 1 (s), Hz(col, j) with Ey averaged over
 * them (p); its flux is along +x: S_x = −½ Re(Ez Hy*) for s, +½ Re(Ey Hz*) for p.
 *
 * <p>The line lies at y = (row + ½)Δ, where the magnetic component that pairs with the
 * electric one sits: for s, Hx(i, row) with Ez averaged over rows row and row + 1; for p,
 * Hz(i, row) with Ex averaged over the same two rows. Each component is transformed at its own
 * time (E at nΔt, H at (n − ½)Δt), so no correction for the leapfrog offset is needed:
 * X(f) = Σ F(t) e^{i2πft} Δt. Complex (Bloch-periodic) fields are transformed as re + i·im.
 *
 * <p>The flux along +y per unit length in z, summed over the line's cells, is
 * S = ½ Re Σ E·H̃* Δ / η0 with H̃ = η0·H as stored: for s, S_y = ½ Re(Ez Hx*), for p,
 * S_y = −½ Re(Ex Hz*) (E × H* along ŷ; Born &amp; Wolf sec. 1.1, common practice).
 *
 * <p>That "DFT flux" grows with the square of the transform window; ratios of two lines' fluxes
 * (T, R) are all it is good for. Two normalised forms carry units of their own:
 * <ul>
 * <li>{@link #meanPower}: a continuous wave E(t) = Re(Ê e^{−iωt}) transformed over whole periods
 * gives X = ½ Ê D, D = Σ Δt the duration of the samples taken (the e^{+iωt} half sums to nearly
 * nothing over whole periods: a residue below one step in D), so the time-averaged flux
 * ½ Re(Ê Ĥ*)/η0 is 4·(DFT flux)/(D_E D_H), W per metre of z;</li>
 * <li>{@link #spectralEnergy}: for fields that have died out inside the window, Parseval's theorem
 * ∫ E(t) H(t) dt = 2 ∫_0^∞ Re(X_E X_H*) df makes 4·(DFT flux) the energy that crossed the line per
 * hertz of positive frequency, J per metre of z per Hz (its integral over f &gt; 0 is the energy
 * that crossed the line).</li>
 * </ul>
 * Complex (Bloch-periodic) fields driven by a real signal times e^{i kx x} give the same numbers
 * as the single travelling plane wave they stand for: the transform at f &gt; 0 picks only its
 * e^{i(kx x − ωt)} part, the e^{+iωt} part belonging to the mirror wave.
 *
 * <p>A simulation shares the line's cells among its worker threads ({@link SharedRecorder}); each cell's
 * sums see the same operations in the same order on any thread.
 */
public final class FluxLine implements StatefulListener, SharedRecorder {

    private final Component e;
    private final Component h;
    private final double sign;
    private final boolean vertical;
    private final int row;
    private final int i0;
    private final int i1;
    private final double[] omega;
    /** DFT accumulators [frequency][cell], real and imaginary parts. */
    private final double[][] eRe, eIm, hRe, hIm;
    /**
     * Per worker: this step's fields on its range of the line (E averaged onto it), real and imaginary parts,
     * and E on the row above the line before averaging: [worker][ea, eb, ha, hb, e1a, e1b][cell − first of range].
     */
    private double[][][] scratch;
    /**
     * Hold-and-add: each sampled step's line values go into slot {@link #slot} of the hold ([slot][cell]: E averaged
     * onto the line and H, real and imaginary parts) with that step's e^{iωt}Δt per frequency at the electric and the
     * magnetic sample times (zero outside the window) in [slot][frequency]; when the last of {@value #HOLD} slots is
     * filled, each cell adds the slots' sum to its accumulators, so they are read and written once per
     * {@value #HOLD} steps rather than every step. The slots filled since, {@link #held}, are part of the state.
     */
    private final double[][] holdE, holdEi, holdH, holdHi;
    private final double[][] ce, se, ch, sh;
    /** The slot this step fills, and how many slots hold values not yet added (after the step's prepare). */
    private int slot;
    private int held;
    /** Whether this step's fields are complex (set by {@link #prepare}). */
    private boolean complex;
    /** Only field samples at times in [windowStart, windowEnd) are transformed. */
    private double windowStart = Double.NEGATIVE_INFINITY;
    private double windowEnd = Double.POSITIVE_INFINITY;
    /** Samples transformed so far: electric, magnetic. */
    private long eSamples, hSamples;
    /** The time step, s (set by every step; 0 before the first). */
    private double dt;
    /** Steps between samples: 1 reads every step ({@link #stride(int)}). */
    private int stride = 1;

    /**
     * @param pol         the run's polarization
     * @param row         the line is at y = (row + ½)Δ; needs row + 1 < ny
     * @param i0          first cell (inclusive)
     * @param i1          last cell (exclusive)
     * @param frequencies in Hz
     */
    public FluxLine(Polarization pol, int row, int i0, int i1, double... frequencies) {
        this(pol, false, row, i0, i1, frequencies);
    }

    /**
     * A vertical line at x = (col + ½)Δ over the cells j0 ≤ j &lt; j1, measuring the flux along +x.
     *
     * @param col needs col + 1 &lt; nx
     */
    public static FluxLine vertical(Polarization pol, int col, int j0, int j1, double... frequencies) {
        return new FluxLine(pol, true, col, j0, j1, frequencies);
    }

    private FluxLine(Polarization pol, boolean vertical, int row, int i0, int i1, double... frequencies) {
        if (i1 <= i0 || row < 0) {
            throw new IllegalArgumentException(String.format("flux line cells [%d, %d) at %s %d: need a first cell below the "
                    + "last and a non-negative %s", i0, i1, vertical ? "column" : "row", row, vertical ? "column" : "row"));
        }
        boolean s = pol == Polarization.S;
        e = s ? Component.EZ : vertical ? Component.EY : Component.EX;
        h = s ? vertical ? Component.HY : Component.HX : Component.HZ;
        sign = s == !vertical ? 1.0 : -1.0;
        this.vertical = vertical;
        this.row = row;
        this.i0 = i0;
        this.i1 = i1;
        omega = new double[frequencies.length];
        for (int q = 0; q < omega.length; q++) {
            omega[q] = 2 * Math.PI * frequencies[q];
        }
        int n = i1 - i0;
        eRe = new double[omega.length][n];
        eIm = new double[omega.length][n];
        hRe = new double[omega.length][n];
        hIm = new double[omega.length][n];
        scratch = new double[1][6][n];
        holdE = new double[HOLD][n];
        holdEi = new double[HOLD][n];
        holdH = new double[HOLD][n];
        holdHi = new double[HOLD][n];
        ce = new double[HOLD][omega.length];
        se = new double[HOLD][omega.length];
        ch = new double[HOLD][omega.length];
        sh = new double[HOLD][omega.length];
    }

    /** Steps held before their values are added to the accumulators. */
    static final int HOLD = 8;

    /**
     * Transforms only the samples taken at times in [start, end), s: for a continuous wave, a window of
     * whole periods after the fields have settled gives the steady-state phasors without the switch-on.
     * Each component keeps its own sample times, so E and H windows differ by at most one step.
     */
    public FluxLine window(double start, double end) {
        if (!(end > start)) {
            throw new IllegalArgumentException("flux window [" + start + ", " + end + ") s is empty");
        }
        windowStart = start;
        windowEnd = end;
        return this;
    }

    /**
     * Reads the fields only at steps whose number is a multiple of {@code steps}, each sample weighted steps·Δt
     * (call before the first step), as {@link FieldMap#stride} does: X(f) = Σ F(t_{kN}) e^{i2πf t_{kN}} NΔt. The
     * caller must know that the fields hold no frequency f' ≡ ±f (mod 1/(steps·Δt)) other than f itself at a
     * transformed frequency f: by the Poisson summation formula the strided sum is the every-step sum plus the
     * fields' spectrum at f + k/(steps·Δt), k ≠ 0 (C. E. Shannon, "Communication in the presence of noise", Proc.
     * IRE 37, 10–21, 1949, Theorem 1). Meant for pulses that have died out inside the window; a continuous wave's
     * window of whole periods ({@link #meanPower}) keeps stride 1, its ends falling within a step, not a stride,
     * of whole periods.
     *
     * @param steps steps between samples, ≥ 1
     * @return this line
     */
    public FluxLine stride(int steps) {
        if (steps < 1) {
            throw new IllegalArgumentException("flux line stride " + steps + " steps: expected at least 1");
        }
        stride = steps;
        return this;
    }

    /** Steps between samples (1: every step). */
    public int stride() {
        return stride;
    }

    /** The start of the window ({@link #window}), s; −∞ without one. */
    public double windowStart() {
        return windowStart;
    }

    /** The end of the window (exclusive), s; +∞ without one. */
    public double windowEnd() {
        return windowEnd;
    }

    @Override
    public boolean prepare(StepView v, int workers) {
        return prepare(v, workers, null);
    }

    /**
     * {@link #prepare}, taking this step's e^{iωt}Δt factors from {@code model} (prepared just before, for the same
     * step) where they are bound to be equal: the same frequencies, window and slot, and components sampled at the
     * same times (an electric and a magnetic one). The four sides of a box ({@link FluxBox}, {@link FarFieldBox})
     * compute them once instead of four times; the values are those this line would compute, bit for bit.
     */
    boolean prepare(StepView v, int workers, FluxLine model) {
        if (stride > 1 && v.stepCount() % stride != 0) {
            return false;
        }
        double te = v.time(e);
        double th = v.time(h);
        boolean eIn = te >= windowStart && te < windowEnd;
        boolean hIn = th >= windowStart && th < windowEnd;
        if (!eIn && !hIn) {
            return false;
        }
        return open(v, workers, model, te, th, eIn, hIn);
    }

    /**
     * The part of {@link #prepare} for a step inside the window, kept apart from the early returns: the JIT compiles
     * prepare while the window is still closed, and would then throw the compiled code away (deoptimise) when the
     * window opens if this part were inlined there as never taken; on its own it is compiled when it runs.
     */
    private boolean open(StepView v, int workers, FluxLine model, double te, double th, boolean eIn, boolean hIn) {
        eSamples += eIn ? 1 : 0;
        hSamples += hIn ? 1 : 0;
        complex = v.complexFields();
        double dt = v.dt();
        double we = eIn ? stride * dt : 0;
        double wh = hIn ? stride * dt : 0;
        this.dt = dt;
        slot = held;
        held = (held + 1) % HOLD;
        if (model != null && model.slot == slot && model.dt == dt && model.stride == stride && model.windowStart == windowStart
                && model.windowEnd == windowEnd && model.e.electric == e.electric && model.h.electric == h.electric
                && java.util.Arrays.equals(model.omega, omega)) {
            System.arraycopy(model.ce[slot], 0, ce[slot], 0, omega.length);
            System.arraycopy(model.se[slot], 0, se[slot], 0, omega.length);
            System.arraycopy(model.ch[slot], 0, ch[slot], 0, omega.length);
            System.arraycopy(model.sh[slot], 0, sh[slot], 0, omega.length);
        } else {
            for (int q = 0; q < omega.length; q++) {
                ce[slot][q] = Math.cos(omega[q] * te) * we;
                se[slot][q] = Math.sin(omega[q] * te) * we;
                ch[slot][q] = Math.cos(omega[q] * th) * wh;
                sh[slot][q] = Math.sin(omega[q] * th) * wh;
            }
        }
        if (scratch.length < workers) {
            scratch = new double[workers][6][i1 - i0];
        }
        return true;
    }

    /** The line's cells: unit u is cell i0 + u. */
    @Override
    public int units() {
        return i1 - i0;
    }

    @Override
    public void share(StepView v, int u0, int u1, int worker) {
        double[][] rows = scratch[worker];
        double[] ea = rows[0];
        double[] eb = rows[1];
        double[] ha = rows[2];
        double[] hb = rows[3];
        double[] e1a = rows[4];
        double[] e1b = rows[5];
        int n = u1 - u0;
        // read this range of the line once per step (from index 0), then accumulate every frequency from the copies
        if (vertical) {
            for (int j = i0 + u0; j < i0 + u1; j++) {
                int k = j - i0 - u0;
                ea[k] = 0.5 * (v.field(e, row, j) + v.field(e, row + 1, j));
                ha[k] = v.field(h, row, j);
            }
            // real fields: the imaginary parts are zero and not held (see below)
            for (int j = i0 + u0; complex && j < i0 + u1; j++) {
                int k = j - i0 - u0;
                eb[k] = 0.5 * (v.fieldImag(e, row, j) + v.fieldImag(e, row + 1, j));
                hb[k] = v.fieldImag(h, row, j);
            }
        } else {
            // whole rows at once: E on rows row and row + 1 (averaged onto the line), H on row
            v.readRow(e, row, i0 + u0, i0 + u1, ea, complex ? eb : null);
            v.readRow(e, row + 1, i0 + u0, i0 + u1, e1a, complex ? e1b : null);
            v.readRow(h, row, i0 + u0, i0 + u1, ha, complex ? hb : null);
            for (int k = 0; k < n; k++) {
                ea[k] = 0.5 * (ea[k] + e1a[k]);
                eb[k] = 0.5 * (eb[k] + e1b[k]);
            }
        }
        // hold this step's values; the step that fills the last slot adds all of them for its range
        double[] he = holdE[slot];
        double[] hei = holdEi[slot];
        double[] hh = holdH[slot];
        double[] hhi = holdHi[slot];
        System.arraycopy(ea, 0, he, u0, n);
        System.arraycopy(ha, 0, hh, u0, n);
        if (complex) {
            System.arraycopy(eb, 0, hei, u0, n);
            System.arraycopy(hb, 0, hhi, u0, n);
        }
        if (slot == HOLD - 1) {
            addHeld(u0, u1, complex, rows[4]);
        }
    }

    /**
     * Adds the {@value #HOLD} held steps of cells u0 ≤ u &lt; u1 to the accumulators: per cell and frequency the slots'
     * products summed in slot order, then added (the same operations in the same order on any thread).
     *
     * @param sum a row of the worker's scratch, at least u1 long
     */
    private void addHeld(int u0, int u1, boolean complex, double[] sum) {
        for (int q = 0; q < omega.length; q++) {
            if (complex) {
                addHeldComplex(q, u0, u1);
                continue;
            }
            // real fields: the imaginary parts are zero, and so are their products (half the work)
            addSlots(holdE, ce, q, eRe[q], u0, u1, sum);
            addSlots(holdE, se, q, eIm[q], u0, u1, sum);
            addSlots(holdH, ch, q, hRe[q], u0, u1, sum);
            addSlots(holdH, sh, q, hIm[q], u0, u1, sum);
        }
    }

    /**
     * acc[k] += x_0[k]·f_0 + x_1[k]·f_1 + … + x_7[k]·f_7 (f_t = factor[t][q], summed left to right, then added) for
     * u0 ≤ k &lt; u1. Written as two loops of four slots each, through {@code sum}: each value sees the same operations
     * in the same order as in the one long expression, but the JIT turns loops this short into vector instructions
     * and leaves the long one scalar (500 cells, 10 frequencies, a fresh JVM: 0.15 s against 0.30 s for the 60 000
     * calls of a 6000-step run with four sides, 2026-12-04, machine under load).
     */
    private static void addSlots(double[][] x, double[][] factor, int q, double[] acc, int u0, int u1, double[] sum) {
        double[] x0 = x[0], x1 = x[1], x2 = x[2], x3 = x[3], x4 = x[4], x5 = x[5], x6 = x[6], x7 = x[7];
        double f0 = factor[0][q], f1 = factor[1][q], f2 = factor[2][q], f3 = factor[3][q];
        double f4 = factor[4][q], f5 = factor[5][q], f6 = factor[6][q], f7 = factor[7][q];
        for (int k = u0; k < u1; k++) {
            sum[k] = x0[k] * f0 + x1[k] * f1 + x2[k] * f2 + x3[k] * f3;
        }
        for (int k = u0; k < u1; k++) {
            acc[k] += sum[k] + x4[k] * f4 + x5[k] * f5 + x6[k] * f6 + x7[k] * f7;
        }
    }

    /** {@link #addHeld} for complex fields at frequency q, slot by slot into per-cell sums (the same order per cell). */
    private void addHeldComplex(int q, int u0, int u1) {
        for (int k = u0; k < u1; k++) {
            double[] sum = heldSum(q, k, HOLD, true);
            eRe[q][k] += sum[0];
            eIm[q][k] += sum[1];
            hRe[q][k] += sum[2];
            hIm[q][k] += sum[3];
        }
    }

    /**
     * The sum over the first {@code slots} held steps of cell k's products at frequency q, {E re, E im, H re, H im},
     * in slot order (for real fields, with the same operations as {@link #addHeld}'s unrolled sums).
     */
    private double[] heldSum(int q, int k, int slots, boolean complex) {
        double er = 0;
        double ei = 0;
        double hr = 0;
        double hi = 0;
        for (int t = 0; t < slots; t++) {
            double a = holdE[t][k];
            double h = holdH[t][k];
            if (complex) {
                double b = holdEi[t][k];
                double g = holdHi[t][k];
                er += a * ce[t][q] - b * se[t][q];
                ei += a * se[t][q] + b * ce[t][q];
                hr += h * ch[t][q] - g * sh[t][q];
                hi += h * sh[t][q] + g * ch[t][q];
            } else {
                er = t == 0 ? a * ce[t][q] : er + a * ce[t][q];
                ei = t == 0 ? a * se[t][q] : ei + a * se[t][q];
                hr = t == 0 ? h * ch[t][q] : hr + h * ch[t][q];
                hi = t == 0 ? h * sh[t][q] : hi + h * sh[t][q];
            }
        }
        return new double[] {er, ei, hr, hi};
    }

    /**
     * The accumulators at frequency q with the steps held but not yet added included: {E re, E im, H re, H im} per
     * cell. The live arrays when nothing is held, else copies (reading never changes the state, so a run read in
     * the middle continues bit for bit as one that was not).
     */
    private double[][] settled(int q) {
        if (held == 0) {
            return new double[][] {eRe[q], eIm[q], hRe[q], hIm[q]};
        }
        int n = i1 - i0;
        double[][] out = {eRe[q].clone(), eIm[q].clone(), hRe[q].clone(), hIm[q].clone()};
        for (int k = 0; k < n; k++) {
            double[] sum = heldSum(q, k, held, complex);
            out[0][k] += sum[0];
            out[1][k] += sum[1];
            out[2][k] += sum[2];
            out[3][k] += sum[3];
        }
        return out;
    }

    /** The flux along +y through the line at frequency number q, W per metre of z (times the source's units squared). */
    public double flux(int q, double cellSize) {
        return flux(q, cellSize, null);
    }

    /**
     * The flux of the difference of two runs' fields at frequency number q: this run's transforms
     * minus {@code reference}'s, on the same cells. With the incident field as reference this is the
     * scattered (e.g. reflected) flux.
     */
    public double flux(int q, double cellSize, FluxLine reference) {
        double sum = 0;
        for (double d : fluxDensity(q, reference)) {
            sum += d;
        }
        return sum * cellSize;
    }

    /**
     * The time-averaged flux along +y of a continuous wave at frequency q, W per metre of z (for the
     * fields' own amplitudes): 4·{@link #flux(int, double)}/(D_E D_H), D = (samples transformed)·Δt the
     * duration of the samples (see the class comment; samples·stride·Δt with a {@link #stride}). Meaningful when the
     * window holds whole periods of a settled wave; NaN before any sample was taken.
     */
    public double meanPower(int q, double cellSize) {
        double de = eSamples * stride * dt;
        double dh = hSamples * stride * dt;
        return de > 0 && dh > 0 ? 4 * flux(q, cellSize) / (de * dh) : Double.NaN;
    }

    /**
     * 4/(D_E D_H), 1/s²: the factor that turns this line's "DFT flux" (and any power computed from its transforms,
     * such as a far field's) into a continuous wave's time-averaged power ({@link #meanPower}); NaN before any sample.
     */
    public double meanPowerScale() {
        double de = eSamples * stride * dt;
        double dh = hSamples * stride * dt;
        return de > 0 && dh > 0 ? 4 / (de * dh) : Double.NaN;
    }

    /**
     * The energy that crossed the line along +y per hertz of positive frequency at frequency q, J per
     * metre of z per Hz: 4·{@link #flux(int, double)} (Parseval; see the class comment). Meaningful when
     * the fields have died out inside the window (a pulse that has passed).
     */
    public double spectralEnergy(int q, double cellSize) {
        return 4 * flux(q, cellSize);
    }

    /** The transformed electric field (averaged onto the line) at frequency q and cell i: {re, im}. */
    public double[] electric(int q, int i) {
        double[][] a = settled(q);
        return new double[] {a[0][i - i0], a[1][i - i0]};
    }

    /** First cell of the line (inclusive). */
    public int firstCell() {
        return i0;
    }

    /** Number of cells on the line, i1 − i0. */
    public int cells() {
        return i1 - i0;
    }

    /** The line lies at y = (row + ½)Δ (a vertical line: at x = (row + ½)Δ, see {@link #isVertical}). */
    public int row() {
        return row;
    }

    /** Whether the line is vertical (its cells run along y and its flux is along +x). */
    public boolean isVertical() {
        return vertical;
    }

    /** The electric component transformed; its site's x offset ({@link Component#dx}) places cell i at x = (i + dx)Δ. */
    public Component electricComponent() {
        return e;
    }

    /**
     * The number of electric and of magnetic samples transformed so far: a window of whole periods holds
     * a whole number of time steps only by chance, so two windows of equal length may differ by a sample,
     * which scales their transforms by that sample's weight.
     */
    public long[] samples() {
        return new long[] {eSamples, hSamples};
    }

    /** The number of frequencies transformed. */
    public int frequencyCount() {
        return omega.length;
    }

    /** Frequency number q, Hz. */
    public double frequency(int q) {
        return omega[q] / (2 * Math.PI);
    }

    /** A copy of the transformed electric field (averaged onto the line) at frequency q on every cell: {re[], im[]}. */
    public double[][] electricTransform(int q) {
        double[][] a = settled(q);
        return new double[][] {a[0].clone(), a[1].clone()};
    }

    /** A copy of the transformed magnetic field (η0·H as stored) at frequency q on every cell: {re[], im[]}. */
    public double[][] magneticTransform(int q) {
        double[][] a = settled(q);
        return new double[][] {a[2].clone(), a[3].clone()};
    }

    /**
     * The flux density along +y at frequency q on every cell, W/m² (times the source's units squared), with the
     * sign and normalisation of {@link #flux(int, double)}: its sum times the cell size is the flux.
     */
    public double[] fluxDensity(int q) {
        return fluxDensity(q, null);
    }

    /** The per-cell flux density of the difference of this line's transforms and {@code reference}'s (as {@link #flux(int, double, FluxLine)}). */
    public double[] fluxDensity(int q, FluxLine reference) {
        double[] s = new double[eRe[q].length];
        double[][] a = settled(q);
        double[][] r = reference == null ? null : reference.settled(q);
        for (int k = 0; k < s.length; k++) {
            double er = a[0][k];
            double ei = a[1][k];
            double hr = a[2][k];
            double hi = a[3][k];
            if (reference != null) {
                er -= r[0][k];
                ei -= r[1][k];
                hr -= r[2][k];
                hi -= r[3][k];
            }
            s[k] = sign * 0.5 * (er * hr + ei * hi) / PhysicalConstants.ETA0;
        }
        return s;
    }

    /**
     * Sets this line's transforms to those of the full width of a Bloch-periodic plane wave recorded on a narrow
     * strip: the fields of a wave with in-plane wavenumber kx differ from cell to cell only by the phase
     * e^{i kx Δx}, so cell i here gets cell 0 of {@code strip} times e^{i kx (i − i0') Δ}, i0' the strip's first
     * cell (the strip's cell 0 is taken for every cell, so each carries the same flux). The sample counts and
     * the time step are copied. The two lines must be horizontal, on the same row, with the same frequencies
     * and windows; {@code strip} is not modified.
     *
     * @param kx       the in-plane wavenumber, rad/m
     * @param cellSize Δ, m
     */
    public void spreadFrom(FluxLine strip, double kx, double cellSize) {
        if (vertical || strip.vertical || strip.row != row || strip.omega.length != omega.length || strip.e != e
                || strip.stride != stride) {
            throw new IllegalArgumentException("a line is spread only from a horizontal line of the same row, component, "
                    + "frequencies and stride");
        }
        eSamples = strip.eSamples;
        hSamples = strip.hSamples;
        dt = strip.dt;
        held = 0;
        for (int q = 0; q < omega.length; q++) {
            double[][] a = strip.settled(q);
            double er = a[0][0];
            double ei = a[1][0];
            double hr = a[2][0];
            double hi = a[3][0];
            for (int k = 0; k < eRe[q].length; k++) {
                double phase = kx * (i0 + k - strip.i0) * cellSize;
                double c = Math.cos(phase);
                double sn = Math.sin(phase);
                eRe[q][k] = er * c - ei * sn;
                eIm[q][k] = er * sn + ei * c;
                hRe[q][k] = hr * c - hi * sn;
                hIm[q][k] = hr * sn + hi * c;
            }
        }
    }

    /**
     * Sets the transforms at frequency q on every cell to values computed without stepping (see
     * {@link org.evanesce.solver.source.SheetResponse}); the arrays hold one value per cell and are copied.
     */
    public void setTransforms(int q, double[] eReal, double[] eImag, double[] hReal, double[] hImag) {
        int n = i1 - i0;
        if (eReal.length != n || eImag.length != n || hReal.length != n || hImag.length != n) {
            throw new IllegalArgumentException("a line of " + n + " cells gets " + n + " values per part");
        }
        held = 0;
        System.arraycopy(eReal, 0, eRe[q], 0, n);
        System.arraycopy(eImag, 0, eIm[q], 0, n);
        System.arraycopy(hReal, 0, hRe[q], 0, n);
        System.arraycopy(hImag, 0, hIm[q], 0, n);
    }

    /** Sets the sample counts and the time step that go with transforms set by {@link #setTransforms}. */
    public void setSamples(long electricSamples, long magneticSamples, double timeStep) {
        eSamples = electricSamples;
        hSamples = magneticSamples;
        dt = timeStep;
    }

    /** Bytes held by the accumulators and the per-step scratch ({@link #bytesFor}). */
    public long bytes() {
        return bytesFor(i1 - i0, omega.length);
    }

    /**
     * Bytes a line of n cells transforming F frequencies holds: 8 · (n · (4F + 6 + 4H) + 4HF) (four accumulators
     * per frequency, six rows of per-step scratch, the H = {@value #HOLD} held steps' four rows and their factors;
     * each further worker thread that shares the line adds up to six rows more, not counted). The one count of
     * it: memory estimates call this.
     */
    public static long bytesFor(long cells, long frequencies) {
        return Double.BYTES * (cells * (4L * frequencies + 6 + 4L * HOLD) + 4L * HOLD * frequencies);
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        out.writeLong(eSamples);
        out.writeLong(hSamples);
        out.writeDouble(dt);
        for (double[][] a : new double[][][] {eRe, eIm, hRe, hIm}) {
            out.writeInt(a.length);
            for (double[] row : a) {
                org.evanesce.solver.kernel.StateIO.write(out, row);
            }
        }
        // the steps held but not yet added, whole (every slot, so the state's size does not vary)
        out.writeInt(held);
        out.writeBoolean(complex);
        for (double[][] a : new double[][][] {holdE, holdEi, holdH, holdHi, ce, se, ch, sh}) {
            for (double[] row : a) {
                org.evanesce.solver.kernel.StateIO.write(out, row);
            }
        }
    }

    @Override
    public void readState(java.io.DataInput in) throws java.io.IOException {
        eSamples = in.readLong();
        hSamples = in.readLong();
        // the time step too, so that a restored line that takes no further step still gives its mean power
        dt = in.readDouble();
        for (double[][] a : new double[][][] {eRe, eIm, hRe, hIm}) {
            if (in.readInt() != a.length) {
                throw new java.io.IOException("checkpoint's flux line has another number of frequencies");
            }
            for (double[] row : a) {
                org.evanesce.solver.kernel.StateIO.read(in, row);
            }
        }
        held = in.readInt();
        if (held < 0 || held >= HOLD) {
            throw new java.io.IOException("checkpoint's flux line holds " + held + " steps (at most " + (HOLD - 1) + ")");
        }
        complex = in.readBoolean();
        for (double[][] a : new double[][][] {holdE, holdEi, holdH, holdHi, ce, se, ch, sh}) {
            for (double[] row : a) {
                org.evanesce.solver.kernel.StateIO.read(in, row);
            }
        }
    }
}
