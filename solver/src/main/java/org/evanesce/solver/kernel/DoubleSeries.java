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
 * its cell, {@link SeriesCoefficients}) in double precision, and their post-pass: the port of
 * {@link SeriesCoefficients#postPass}, run after the row's ordinary update (with the stand-in's ca = 1,
 * cb_ref), CPML corrections and sources. Such sites line the faces of metals (a row or a column each), so
 * the pass is a plain loop over each row's cells. State per cell as {@link SeriesCoefficients} lists it,
 * one array per value over the group's cells.
 * Generated from {@link FloatSeries} by tools/regen-double-kernels.sh: edit that file, not this one.
 */
final class DoubleSeries {

    private final double[] field;
    private final Group[] groups;

    /** The cells of one series material at one site, their state and the coefficients. */
    private static final class Group {
        final int[] rowStart, cell;
        /** [0] the site's E⁰; then per part its E⁰, Drude j, Lorentz (j, q): {@link SeriesCoefficients#stateSize()} arrays. */
        final double[][] state;
        final int parts;
        final int[] nd, nl, base;
        final double[] fraction, ratio, ca;
        final double[][] kD, bD, cD, alpha, xi, bL, cL;
        final double[] cq;

        Group(SeriesCoefficients c, int[] rowStart, int[] cell) {
            this.rowStart = rowStart;
            this.cell = cell;
            state = new double[c.stateSize()][cell.length];
            AdeCoefficients[] p = c.parts();
            parts = p.length;
            nd = new int[parts];
            nl = new int[parts];
            base = new int[parts];
            fraction = toDouble(c.fractions());
            ratio = toDouble(c.ratios());
            ca = new double[parts];
            kD = new double[parts][];
            bD = new double[parts][];
            cD = new double[parts][];
            alpha = new double[parts][];
            xi = new double[parts][];
            bL = new double[parts][];
            cL = new double[parts][];
            cq = new double[parts];
            int s = 1;
            for (int k = 0; k < parts; k++) {
                nd[k] = p[k].drudeCount();
                nl[k] = p[k].lorentzCount();
                base[k] = s;
                s += 1 + nd[k] + 2 * nl[k];
                ca[k] = p[k].ca();
                kD[k] = toDouble(p[k].drudeDecay());
                bD[k] = toDouble(p[k].drudeDrive());
                cD[k] = toDouble(p[k].drudeCorrection());
                alpha[k] = toDouble(p[k].lorentzCurrent());
                xi[k] = toDouble(p[k].lorentzMemory());
                bL[k] = toDouble(p[k].lorentzDrive());
                cL[k] = toDouble(p[k].lorentzCorrection());
                cq[k] = p[k].memoryCorrection();
            }
        }
    }

    private DoubleSeries(double[] field, Group[] groups) {
        this.field = field;
        this.groups = groups;
    }

    /**
     * The series sites of component c, or null when it has none.
     *
     * @param series by material index: the coefficients of a series material, else null
     */
    static DoubleSeries of(MaterialGrid grid, Component c, double[] field, SeriesCoefficients[] series,
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
        return out.isEmpty() ? null : new DoubleSeries(field, out.toArray(new Group[0]));
    }

    private static double[] toDouble(double[] a) {
        double[] f = new double[a.length];
        for (int i = 0; i < a.length; i++) {
            f[i] = a[i];
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
            double[][] st = g.state;
            for (int t = g.rowStart[j], end = g.rowStart[j + 1]; t < end; t++) {
                int k = g.cell[t];
                double d = field[k] - st[0][t];
                double e1 = 0.0;
                for (int q = 0; q < g.parts; q++) {
                    int s = g.base[q];
                    double ek = g.ca[q] * st[s][t] + g.ratio[q] * d;
                    int nd = g.nd[q];
                    int nl = g.nl[q];
                    if (nd + nl > 0) {
                        double corr = 0.0;
                        for (int p = 0; p < nd; p++) {
                            corr += g.cD[q][p] * st[s + 1 + p][t];
                        }
                        for (int p = 0; p < nl; p++) {
                            corr += g.cL[q][p] * st[s + 1 + nd + 2 * p][t] + g.cq[q] * st[s + 2 + nd + 2 * p][t];
                        }
                        double old = st[s][t];
                        ek = ek - corr;
                        double sum = ek + old;
                        for (int p = 0; p < nd; p++) {
                            st[s + 1 + p][t] = g.kD[q][p] * st[s + 1 + p][t] + g.bD[q][p] * sum;
                        }
                        for (int p = 0; p < nl; p++) {
                            double jp = st[s + 1 + nd + 2 * p][t];
                            double qp = st[s + 2 + nd + 2 * p][t];
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

    /** Flushes the state of row j's cells as the field is flushed (values below the threshold set to zero; vl: the engine's vector bound, {@link DoubleKernels#flush}). */
    void flushRow(int j, int vl) {
        for (Group g : groups) {
            int a = g.rowStart[j];
            int b = g.rowStart[j + 1];
            if (b > a) {
                for (double[] s : g.state) {
                    DoubleKernels.flush(s, a, b, vl);
                }
            }
        }
    }

    /** Sets cell k's field to v (if it is a series site): the site's E⁰ and every part's E⁰ become v. */
    void setField(int k, double v) {
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
            b += (long) g.cell.length * g.state.length * Double.BYTES
                    + (long) Integer.BYTES * (g.cell.length + g.rowStart.length);
        }
        return b;
    }

    void writeState(java.io.DataOutput out) throws java.io.IOException {
        out.writeInt(groups.length);
        for (Group g : groups) {
            out.writeInt(g.cell.length);
            out.writeInt(g.state.length);
            for (double[] s : g.state) {
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
            for (double[] s : g.state) {
                StateIO.read(in, s);
            }
        }
    }
}
