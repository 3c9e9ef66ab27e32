package org.evanesce.solver.kernel;

import java.util.ArrayList;
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
 * row's cells start ({@code rowStart}), and {@code 1 + N_D + 2 N_L} state values per cell
 * ([E⁰, j per Drude term, (j, q) per Lorentz term], the order of {@link AdeCoefficients}). Only
 * sites the update changes ({@link Engine#wouldUpdate}) are held: a dispersive cell on a PEC wall
 * keeps E = 0 without state. The material of an electric component at cell k is the grid's at the
 * component's own site ({@link FieldSite#EZ}, {@link FieldSite#EX} at (i+½, j), {@link FieldSite#EY}
 * at (i, j+½)).
 * Edit this file; {@link DoubleAde} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatAde {

    /** The field this component's post-pass corrects. */
    private final float[] field;
    private final Group[] groups;

    /** The cells of one dispersive material at one site, their state and the material's coefficients. */
    private static final class Group {
        final int size, nd, nl;
        final int[] rowStart, cell;
        final float[] state;
        final float[] kD, bD, cD, alpha, xi, bL, cL;
        final float cq;

        Group(AdeCoefficients c, int[] rowStart, int[] cell) {
            nd = c.drudeCount();
            nl = c.lorentzCount();
            size = c.stateSize();
            this.rowStart = rowStart;
            this.cell = cell;
            state = new float[cell.length * size];
            kD = toFloat(c.drudeDecay());
            bD = toFloat(c.drudeDrive());
            cD = toFloat(c.drudeCorrection());
            alpha = toFloat(c.lorentzCurrent());
            xi = toFloat(c.lorentzMemory());
            bL = toFloat(c.lorentzDrive());
            cL = toFloat(c.lorentzCorrection());
            cq = (float) c.memoryCorrection();
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
     * @param ade by material index: the coefficients of a material with poles, else null
     */
    static FloatAde of(MaterialGrid grid, Component c, float[] field, AdeCoefficients[] ade, Map<Side, Boundary> sides) {
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
            out.add(new Group(ade[m], rowStart, cell));
        }
        return out.isEmpty() ? null : new FloatAde(field, out.toArray(new Group[0]));
    }

    private static float[] toFloat(double[] a) {
        float[] f = new float[a.length];
        for (int i = 0; i < a.length; i++) {
            f[i] = (float) a[i];
        }
        return f;
    }

    /**
     * The post-pass of row j: for each dispersive cell, E¹ = E_ord − the currents' correction, then
     * the currents advance ({@link AdeCoefficients#postPass}, the same sums in the same order).
     */
    void row(int j) {
        float[] f = field;
        for (Group g : groups) {
            int nd = g.nd;
            int nl = g.nl;
            int size = g.size;
            float[] st = g.state;
            int[] cell = g.cell;
            float[] kD = g.kD, bD = g.bD, cD = g.cD, alpha = g.alpha, xi = g.xi, bL = g.bL, cL = g.cL;
            float cq = g.cq;
            for (int t = g.rowStart[j], end = g.rowStart[j + 1]; t < end; t++) {
                int o = t * size;
                int k = cell[t];
                float e0 = st[o];
                float corr = 0f;
                int d = o + 1;
                for (int p = 0; p < nd; p++) {
                    corr += cD[p] * st[d + p];
                }
                int l = d + nd;
                for (int p = 0; p < nl; p++) {
                    corr += cL[p] * st[l + 2 * p] + cq * st[l + 2 * p + 1];
                }
                float e1 = f[k] - corr;
                for (int p = 0; p < nd; p++) {
                    st[d + p] = kD[p] * st[d + p] + bD[p] * (e1 + e0);
                }
                for (int p = 0; p < nl; p++) {
                    float jp = st[l + 2 * p];
                    float qp = st[l + 2 * p + 1];
                    st[l + 2 * p] = alpha[p] * jp + qp + bL[p] * e1;
                    st[l + 2 * p + 1] = xi[p] * jp - bL[p] * e0;
                }
                st[o] = e1;
                f[k] = e1;
            }
        }
    }

    /**
     * Flushes the state of row j's cells as the field is flushed (values below the threshold set to
     * zero), so that E⁰ stays equal to the flushed field.
     */
    void flushRow(int j) {
        for (Group g : groups) {
            int a = g.rowStart[j] * g.size;
            int b = g.rowStart[j + 1] * g.size;
            if (b > a) {
                FloatKernels.flush(g.state, a, b);
            }
        }
    }

    /** Sets E⁰ of cell k (if dispersive) to v, as {@link Engine#set} changes the field there. */
    void setField(int k, float v) {
        for (Group g : groups) {
            int t = java.util.Arrays.binarySearch(g.cell, k);
            if (t >= 0) {
                g.state[t * g.size] = v;
            }
        }
    }

    /** Values held: state, cell indices and row starts (the coefficients, a few per material, are left out). */
    long bytes() {
        long b = 0;
        for (Group g : groups) {
            b += (long) g.state.length * Float.BYTES + (long) Integer.BYTES * (g.cell.length + g.rowStart.length);
        }
        return b;
    }

    void writeState(java.io.DataOutput out) throws java.io.IOException {
        out.writeInt(groups.length);
        for (Group g : groups) {
            out.writeInt(g.cell.length);
            out.writeInt(g.size);
            StateIO.write(out, g.state);
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
            if (cells != g.cell.length || size != g.size) {
                throw new java.io.IOException(String.format("checkpoint holds dispersive state for %d cells of %d values;"
                        + " this run has %d cells of %d values", cells, size, g.cell.length, g.size));
            }
            StateIO.read(in, g.state);
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
}
