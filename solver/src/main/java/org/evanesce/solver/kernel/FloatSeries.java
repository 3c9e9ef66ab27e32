package org.evanesce.solver.kernel;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.geometry.dispersion.SeriesCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Side;

/**
 * The sites of one electric component that hold materials in series (a field normal to a face through
 * its cell, {@link SeriesCoefficients}) in single precision, and their post-pass: the port of
 * {@link SeriesCoefficients#postPass}, run after the row's ordinary update (with the stand-in's ca = 1,
 * cb_ref), CPML corrections and sources. Such sites line the faces of metals (a row or a column each), so
 * the pass is a plain loop over each row's cells. State per cell as {@link SeriesCoefficients} lists it,
 * one array per value over the group's cells.
 * Edit this file; {@link DoubleSeries} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatSeries {

    private final float[] field;
    private final Group[] groups;

    /** The cells of one series material at one site, their state and the coefficients. */
    private static final class Group {
        final int[] rowStart, cell;
        /** [0] the site's E⁰; then per part its E⁰, Drude j, Lorentz (j, q): {@link SeriesCoefficients#stateSize()} arrays. */
        final float[][] state;
        final int parts;
        final int[] nd, nl, base;
        final float[] fraction, ratio, ca;
        final float[][] kD, bD, cD, alpha, xi, bL, cL;
        final float[] cq;

        Group(SeriesCoefficients c, int[] rowStart, int[] cell) {
            this.rowStart = rowStart;
            this.cell = cell;
            state = new float[c.stateSize()][cell.length];
            AdeCoefficients[] p = c.parts();
            parts = p.length;
            nd = new int[parts];
            nl = new int[parts];
            base = new int[parts];
            fraction = toFloat(c.fractions());
            ratio = toFloat(c.ratios());
            ca = new float[parts];
            kD = new float[parts][];
            bD = new float[parts][];
            cD = new float[parts][];
            alpha = new float[parts][];
            xi = new float[parts][];
            bL = new float[parts][];
            cL = new float[parts][];
            cq = new float[parts];
            int s = 1;
            for (int k = 0; k < parts; k++) {
                nd[k] = p[k].drudeCount();
                nl[k] = p[k].lorentzCount();
                base[k] = s;
                s += 1 + nd[k] + 2 * nl[k];
                ca[k] = (float) p[k].ca();
                kD[k] = toFloat(p[k].drudeDecay());
                bD[k] = toFloat(p[k].drudeDrive());
                cD[k] = toFloat(p[k].drudeCorrection());
                alpha[k] = toFloat(p[k].lorentzCurrent());
                xi[k] = toFloat(p[k].lorentzMemory());
                bL[k] = toFloat(p[k].lorentzDrive());
                cL[k] = toFloat(p[k].lorentzCorrection());
                cq[k] = (float) p[k].memoryCorrection();
            }
        }
    }

    private FloatSeries(float[] field, Group[] groups) {
        this.field = field;
        this.groups = groups;
    }

    /**
     * The series sites of component c, or null when it has none.
     *
     * @param series by material index: the coefficients of a series material, else null
     */
    static FloatSeries of(MaterialGrid grid, Component c, float[] field, SeriesCoefficients[] series,
                          Map<Side, Boundary> sides) {
        if (series == null) {
            return null;
        }
        int nx = grid.nx();
        int ny = grid.ny();
        FieldSite site = Engine.site(c);
        List<Group> out = new ArrayList<>();
        for (int m = 0; m < series.length; m++) {
            if (series[m] == null) {
                continue;
            }
            int[] rowStart = new int[ny + 1];
            List<Integer> cells = new ArrayList<>();
            for (int j = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++) {
                    if (grid.id(site, i, j) == m && Engine.wouldUpdate(sides, nx, ny, c, i, j)) {
                        cells.add(j * nx + i);
                    }
                }
                rowStart[j + 1] = cells.size();
            }
            if (!cells.isEmpty()) {
                out.add(new Group(series[m], rowStart, cells.stream().mapToInt(Integer::intValue).toArray()));
            }
        }
        return out.isEmpty() ? null : new FloatSeries(field, out.toArray(new Group[0]));
    }

    private static float[] toFloat(double[] a) {
        float[] f = new float[a.length];
        for (int i = 0; i < a.length; i++) {
            f[i] = (float) a[i];
        }
        return f;
    }

    /** Whether row j holds a series site of this component. */
    boolean holdsRow(int j) {
        for (Group g : groups) {
            if (g.rowStart[j + 1] > g.rowStart[j]) {
                return true;
            }
        }
        return false;
    }

    /** The post-pass of row j ({@link SeriesCoefficients#postPass} per cell, the same sums in the same order). */
    void row(int j) {
        for (Group g : groups) {
            float[][] st = g.state;
            for (int t = g.rowStart[j], end = g.rowStart[j + 1]; t < end; t++) {
                int k = g.cell[t];
                float d = field[k] - st[0][t];
                float e1 = 0f;
                for (int q = 0; q < g.parts; q++) {
                    int s = g.base[q];
                    float ek = g.ca[q] * st[s][t] + g.ratio[q] * d;
                    int nd = g.nd[q];
                    int nl = g.nl[q];
                    if (nd + nl > 0) {
                        float corr = 0f;
                        for (int p = 0; p < nd; p++) {
                            corr += g.cD[q][p] * st[s + 1 + p][t];
                        }
                        for (int p = 0; p < nl; p++) {
                            corr += g.cL[q][p] * st[s + 1 + nd + 2 * p][t] + g.cq[q] * st[s + 2 + nd + 2 * p][t];
                        }
                        float old = st[s][t];
                        ek = ek - corr;
                        float sum = ek + old;
                        for (int p = 0; p < nd; p++) {
                            st[s + 1 + p][t] = g.kD[q][p] * st[s + 1 + p][t] + g.bD[q][p] * sum;
                        }
                        for (int p = 0; p < nl; p++) {
                            float jp = st[s + 1 + nd + 2 * p][t];
                            float qp = st[s + 2 + nd + 2 * p][t];
                            st[s + 1 + nd + 2 * p][t] = g.alpha[q][p] * jp + qp + g.bL[q][p] * ek;
                            st[s + 2 + nd + 2 * p][t] = g.xi[q][p] * jp - g.bL[q][p] * old;
                        }
                    }
                    st[s][t] = ek;
                    e1 += g.fraction[q] * ek;
                }
                st[0][t] = e1;
                field[k] = e1;
            }
        }
    }

    /** Flushes the state of row j's cells as the field is flushed (values below the threshold set to zero; vl: the engine's vector bound, {@link FloatKernels#flush}). */
    void flushRow(int j, int vl) {
        for (Group g : groups) {
            int a = g.rowStart[j];
            int b = g.rowStart[j + 1];
            if (b > a) {
                for (float[] s : g.state) {
                    FloatKernels.flush(s, a, b, vl);
                }
            }
        }
    }

    /** Sets cell k's field to v (if it is a series site): the site's E⁰ and every part's E⁰ become v. */
    void setField(int k, float v) {
        for (Group g : groups) {
            int t = java.util.Arrays.binarySearch(g.cell, k);
            if (t >= 0) {
                g.state[0][t] = v;
                for (int q = 0; q < g.parts; q++) {
                    g.state[g.base[q]][t] = v;
                }
            }
        }
    }

    /** Values held: state, cell indices and row starts. */
    long bytes() {
        long b = 0;
        for (Group g : groups) {
            b += (long) g.cell.length * g.state.length * Float.BYTES
                    + (long) Integer.BYTES * (g.cell.length + g.rowStart.length);
        }
        return b;
    }

    void writeState(java.io.DataOutput out) throws java.io.IOException {
        out.writeInt(groups.length);
        for (Group g : groups) {
            out.writeInt(g.cell.length);
            out.writeInt(g.state.length);
            for (float[] s : g.state) {
                StateIO.write(out, s);
            }
        }
    }

    void readState(java.io.DataInput in) throws java.io.IOException {
        int n = in.readInt();
        if (n != groups.length) {
            throw new java.io.IOException(String.format(
                    "checkpoint holds %d series materials at this field site; this run has %d", n, groups.length));
        }
        for (Group g : groups) {
            int cells = in.readInt();
            int size = in.readInt();
            if (cells != g.cell.length || size != g.state.length) {
                throw new java.io.IOException(String.format("checkpoint holds series state for %d cells of %d values;"
                        + " this run has %d cells of %d values", cells, size, g.cell.length, g.state.length));
            }
            for (float[] s : g.state) {
                StateIO.read(in, s);
            }
        }
    }
}
