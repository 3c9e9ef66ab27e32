package org.evanesce.solver.kernel;

import java.util.ArrayList;
import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorSpecies;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Side;

/**
 * The auxiliary currents of the dispersive cells of one electric component in single precision,
 * and their post-pass: the port of {@link AdeCoefficients#postPass} that runs after a row's
 * ordinary electric update (with ca', cb'), CPML corrections and sources.
 *
 * <p>Cells are grouped by material: each group keeps its cells' flat indices in row order, where each
 * row's cells start ({@code rowStart}), the runs of neighbouring cells in a row ({@code runT},
 * {@code runK}, {@code runLength}, each row's first run in {@code rowRun}), and the state of
 * {@link AdeCoefficients} (E⁰, j per Drude term, (j, q) per Lorentz term) as one array per quantity
 * over the group's cells, so that a run is updated a vector of cells at a time (the same operations in
 * the same order as {@link AdeCoefficients#postPass}, lane by lane). Only sites the update changes
 * ({@link Engine#wouldUpdate}) are held: a dispersive cell on a PEC wall keeps E = 0 without state. The
 * material of an electric component at cell k is the grid's at the component's own site
 * ({@link FieldSite#EZ}, {@link FieldSite#EX} at (i+½, j), {@link FieldSite#EY} at (i, j+½)).
 * Edit this file; {@link DoubleAde} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatAde {

    private static final VectorSpecies<Float> SP = FloatKernels.SP;
    private static final int VL = SP.length();

    /** The field this component's post-pass corrects. */
    private final float[] field;
    private final Group[] groups;

    /** The cells of one dispersive material at one site, their state and the material's coefficients. */
    private static final class Group {
        final int nd, nl;
        final int[] rowStart, cell, rowRun, runT, runK, runLength;
        /** E⁰ per cell; j per Drude term; j and q per Lorentz term (each indexed by the cell's place t). */
        final float[] e0;
        final float[][] jd, jl, ql;
        final float[] kD, bD, cD, alpha, xi, bL, cL;
        final float cq;
        /** ca' − 1 where the ordinary update ran with ca = 1 (see {@link #foldCa}), else 0. */
        final float caMinusOne;

        Group(AdeCoefficients c, int[] rowStart, int[] cell, int nx, boolean foldCa) {
            caMinusOne = foldCa ? (float) (c.ca() - 1) : 0f;
            nd = c.drudeCount();
            nl = c.lorentzCount();
            this.rowStart = rowStart;
            this.cell = cell;
            int n = cell.length;
            int ny = rowStart.length - 1;
            rowRun = new int[ny + 1];
            int runs = 0;
            for (int t = 0; t < n; t++) {
                if (t == 0 || cell[t] != cell[t - 1] + 1 || cell[t] / nx != cell[t - 1] / nx) {
                    runs++;
                }
            }
            runT = new int[runs];
            runK = new int[runs];
            runLength = new int[runs];
            int r = -1;
            for (int t = 0; t < n; t++) {
                if (t == 0 || cell[t] != cell[t - 1] + 1 || cell[t] / nx != cell[t - 1] / nx) {
                    r++;
                    runT[r] = t;
                    runK[r] = cell[t];
                    rowRun[cell[t] / nx + 1]++;
                }
                runLength[r]++;
            }
            for (int j = 0; j < ny; j++) {
                rowRun[j + 1] += rowRun[j];
            }
            e0 = new float[n];
            jd = new float[nd][n];
            jl = new float[nl][n];
            ql = new float[nl][n];
            kD = toFloat(c.drudeDecay());
            bD = toFloat(c.drudeDrive());
            cD = toFloat(c.drudeCorrection());
            alpha = toFloat(c.lorentzCurrent());
            xi = toFloat(c.lorentzMemory());
            bL = toFloat(c.lorentzDrive());
            cL = toFloat(c.lorentzCorrection());
            cq = (float) c.memoryCorrection();
        }

        /** Every state array: E⁰, the Drude j, then j and q of each Lorentz term. */
        float[][] arrays() {
            float[][] out = new float[1 + nd + 2 * nl][];
            out[0] = e0;
            for (int p = 0; p < nd; p++) {
                out[1 + p] = jd[p];
            }
            for (int p = 0; p < nl; p++) {
                out[1 + nd + 2 * p] = jl[p];
                out[2 + nd + 2 * p] = ql[p];
            }
            return out;
        }
    }

    private FloatAde(float[] field, Group[] groups) {
        this.field = field;
        this.groups = groups;
    }

    /**
     * The dispersive cells of component c, or null when it has none (then nothing is allocated and
     * the engine takes no extra step).
     *
     * @param ade    by material index: the coefficients of a material with poles, else null
     * @param foldCa whether the ordinary update of this component runs with ca = 1 in the dispersive cells
     *               ({@link #foldCa} returned true): the post-pass then adds (ca' − 1)·E⁰
     */
    static FloatAde of(MaterialGrid grid, Component c, float[] field, AdeCoefficients[] ade, Map<Side, Boundary> sides,
                       boolean foldCa) {
        int nx = grid.nx();
        int ny = grid.ny();
        FieldSite site = Engine.site(c);
        List<Group> out = new ArrayList<>();
        for (int m = 0; m < ade.length; m++) {
            if (ade[m] == null || ade[m].stateSize() == 0) {
                continue;
            }
            int[] rowStart = new int[ny + 1];
            int n = 0;
            for (int j = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++) {
                    if (grid.id(site, i, j) == m && Engine.wouldUpdate(sides, nx, ny, c, i, j)) {
                        n++;
                    }
                }
                rowStart[j + 1] = n;
            }
            if (n == 0) {
                continue;
            }
            int[] cell = new int[n];
            int t = 0;
            for (int j = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++) {
                    if (grid.id(site, i, j) == m && Engine.wouldUpdate(sides, nx, ny, c, i, j)) {
                        cell[t++] = j * nx + i;
                    }
                }
            }
            out.add(new Group(ade[m], rowStart, cell, nx, foldCa));
        }
        return out.isEmpty() ? null : new FloatAde(field, out.toArray(new Group[0]));
    }

    /**
     * Where no ordinary cell of a site has conductivity (every ca = 1 outside the materials with poles),
     * sets ca of the dispersive cells in {@code ca} (the site's per-cell ca, by flat index) to 1 and
     * returns true: the ordinary update then keeps its lossless branch without a ca array over the whole
     * grid (4 or 8 bytes per cell less to stream), and the post-pass adds (ca' − 1)·E⁰ itself, E⁰ being
     * the field the ordinary update started from. Otherwise changes nothing and returns false.
     */
    static boolean foldCa(MaterialGrid grid, FieldSite site, double[] ca, AdeCoefficients[] ade) {
        if (ade == null) {
            return false;
        }
        int nx = grid.nx();
        int ny = grid.ny();
        boolean any = false;
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                int m = grid.id(site, i, j);
                boolean poles = ade[m] != null && ade[m].stateSize() > 0;
                if (!poles && ca[j * nx + i] != 1.0) {
                    return false;
                }
                any |= poles;
            }
        }
        if (any) {
            for (int j = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++) {
                    int m = grid.id(site, i, j);
                    if (ade[m] != null && ade[m].stateSize() > 0) {
                        ca[j * nx + i] = 1.0;
                    }
                }
            }
        }
        return any;
    }

    private static float[] toFloat(double[] a) {
        float[] f = new float[a.length];
        for (int i = 0; i < a.length; i++) {
            f[i] = (float) a[i];
        }
        return f;
    }

    /** Whether row j holds a cell of this component's dispersive materials. */
    boolean holdsRow(int j) {
        for (Group g : groups) {
            if (g.rowStart[j + 1] > g.rowStart[j]) {
                return true;
            }
        }
        return false;
    }

    /**
     * The post-pass of row j: for each dispersive cell, E¹ = E_ord + (ca' − 1)·E⁰ (when folded) − the
     * currents' correction, then the currents advance ({@link AdeCoefficients#postPass}, the same sums
     * in the same order), a vector of neighbouring cells at a time.
     */
    void row(int j) {
        for (Group g : groups) {
            for (int r = g.rowRun[j], end = g.rowRun[j + 1]; r < end; r++) {
                run(g, g.runT[r], g.runK[r], g.runLength[r]);
            }
        }
    }

    /**
     * The post-pass of rows [a, b) at once: the same per cell as {@link #row} row after row, but runs that continue
     * from one row's end to the next row's start (a film across the whole grid's width) are joined into one run, so
     * a narrow grid's film is updated a vector of cells at a time rather than a few cells per row.
     */
    void rows(int a, int b) {
        for (Group g : groups) {
            int[] runK = g.runK;
            int[] runLength = g.runLength;
            int r = g.rowRun[a];
            int end = g.rowRun[b];
            while (r < end) {
                int k0 = runK[r];
                int len = runLength[r];
                int t0 = g.runT[r];
                r++;
                // the group's cells are in row order, so the next run's cells follow in t as well
                while (r < end && runK[r] == k0 + len) {
                    len += runLength[r];
                    r++;
                }
                run(g, t0, k0, len);
            }
        }
    }

    private void run(Group g, int t0, int k0, int len) {
        float[] f = field;
        float[] e0 = g.e0;
        float[][] jd = g.jd, jl = g.jl, ql = g.ql;
        float[] kD = g.kD, bD = g.bD, cD = g.cD, alpha = g.alpha, xi = g.xi, bL = g.bL, cL = g.cL;
        int nd = g.nd;
        int nl = g.nl;
        float cq = g.cq;
        float cam1 = g.caMinusOne;
        FloatVector vcq = FloatVector.broadcast(SP, cq);
        FloatVector vcam1 = FloatVector.broadcast(SP, cam1);
        int i = 0;
        for (; i <= len - VL; i += VL) {
            int t = t0 + i;
            int k = k0 + i;
            FloatVector corr = FloatVector.zero(SP);
            for (int p = 0; p < nd; p++) {
                corr = corr.add(FloatVector.broadcast(SP, cD[p]).mul(FloatVector.fromArray(SP, jd[p], t)));
            }
            for (int p = 0; p < nl; p++) {
                corr = corr.add(FloatVector.broadcast(SP, cL[p]).mul(FloatVector.fromArray(SP, jl[p], t))
                        .add(vcq.mul(FloatVector.fromArray(SP, ql[p], t))));
            }
            FloatVector old = FloatVector.fromArray(SP, e0, t);
            FloatVector e1 = FloatVector.fromArray(SP, f, k).add(vcam1.mul(old)).sub(corr);
            FloatVector sum = e1.add(old);
            for (int p = 0; p < nd; p++) {
                FloatVector.broadcast(SP, kD[p]).mul(FloatVector.fromArray(SP, jd[p], t))
                        .add(FloatVector.broadcast(SP, bD[p]).mul(sum)).intoArray(jd[p], t);
            }
            for (int p = 0; p < nl; p++) {
                FloatVector jp = FloatVector.fromArray(SP, jl[p], t);
                FloatVector qp = FloatVector.fromArray(SP, ql[p], t);
                FloatVector b = FloatVector.broadcast(SP, bL[p]);
                FloatVector.broadcast(SP, alpha[p]).mul(jp).add(qp).add(b.mul(e1)).intoArray(jl[p], t);
                FloatVector.broadcast(SP, xi[p]).mul(jp).sub(b.mul(old)).intoArray(ql[p], t);
            }
            e1.intoArray(e0, t);
            e1.intoArray(f, k);
        }
        for (; i < len; i++) {
            int t = t0 + i;
            int k = k0 + i;
            float corr = 0f;
            for (int p = 0; p < nd; p++) {
                corr += cD[p] * jd[p][t];
            }
            for (int p = 0; p < nl; p++) {
                corr += cL[p] * jl[p][t] + cq * ql[p][t];
            }
            float old = e0[t];
            float e1 = f[k] + cam1 * old - corr;
            float sum = e1 + old;
            for (int p = 0; p < nd; p++) {
                jd[p][t] = kD[p] * jd[p][t] + bD[p] * sum;
            }
            for (int p = 0; p < nl; p++) {
                float jp = jl[p][t];
                float qp = ql[p][t];
                jl[p][t] = alpha[p] * jp + qp + bL[p] * e1;
                ql[p][t] = xi[p] * jp - bL[p] * old;
            }
            e0[t] = e1;
            f[k] = e1;
        }
    }

    /**
     * Flushes the state of row j's cells as the field is flushed (values below the threshold set to
     * zero), so that E⁰ stays equal to the flushed field; vl is the engine's vector bound ({@link FloatKernels#flush}).
     */
    void flushRow(int j, int vl) {
        for (Group g : groups) {
            int a = g.rowStart[j];
            int b = g.rowStart[j + 1];
            if (b > a) {
                for (float[] s : g.arrays()) {
                    FloatKernels.flush(s, a, b, vl);
                }
            }
        }
    }

    /** Sets E⁰ of cell k (if dispersive) to v, as {@link Engine#set} changes the field there. */
    void setField(int k, float v) {
        for (Group g : groups) {
            int t = java.util.Arrays.binarySearch(g.cell, k);
            if (t >= 0) {
                g.e0[t] = v;
            }
        }
    }

    /** Values held: state, cell indices, row starts and runs (the coefficients, a few per material, are left out). */
    long bytes() {
        long b = 0;
        for (Group g : groups) {
            b += (long) g.cell.length * (1 + g.nd + 2 * g.nl) * Float.BYTES
                    + (long) Integer.BYTES * (g.cell.length + g.rowStart.length + g.rowRun.length + 3L * g.runT.length);
        }
        return b;
    }

    void writeState(java.io.DataOutput out) throws java.io.IOException {
        out.writeInt(groups.length);
        for (Group g : groups) {
            out.writeInt(g.cell.length);
            out.writeInt(1 + g.nd + 2 * g.nl);
            for (float[] s : g.arrays()) {
                StateIO.write(out, s);
            }
        }
    }

    void readState(java.io.DataInput in) throws java.io.IOException {
        int n = in.readInt();
        if (n != groups.length) {
            throw new java.io.IOException(String.format(
                    "checkpoint holds %d dispersive materials at this field site; this run has %d", n, groups.length));
        }
        for (Group g : groups) {
            int cells = in.readInt();
            int size = in.readInt();
            if (cells != g.cell.length || size != 1 + g.nd + 2 * g.nl) {
                throw new java.io.IOException(String.format("checkpoint holds dispersive state for %d cells of %d values;"
                        + " this run has %d cells of %d values", cells, size, g.cell.length, 1 + g.nd + 2 * g.nl));
            }
            for (float[] s : g.arrays()) {
                StateIO.read(in, s);
            }
        }
    }

    /** Writes "no dispersive cells" for a component that has none. */
    static void writeNone(java.io.DataOutput out) throws java.io.IOException {
        out.writeInt(0);
    }

    /** Reads the marker {@link #writeNone} wrote, refusing state that this run cannot hold. */
    static void readNone(java.io.DataInput in) throws java.io.IOException {
        int n = in.readInt();
        if (n != 0) {
            throw new java.io.IOException("checkpoint holds dispersive state for " + n
                    + " materials at a field site where this run has none");
        }
    }

    /**
     * Adds each row's expected work of this component's dispersive cells to {@code w} (relative to a plain cell's
     * update): {@code perValue} per value a cell keeps (E's previous value, one current per Drude term, two per
     * Lorentz term).
     */
    void addRowWork(double[] w, double perValue) {
        for (Group g : groups) {
            int values = 1 + g.nd + 2 * g.nl;
            for (int j = 0; j + 1 < g.rowStart.length && j < w.length; j++) {
                w[j] += perValue * values * (g.rowStart[j + 1] - g.rowStart[j]);
            }
        }
    }
}
