package org.evanesce.solver.kernel;

import java.util.Map;
import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorOperators;
import jdk.incubator.vector.VectorSpecies;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.geometry.dispersion.SeriesCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;

/**
 * s polarization (Ez, Hx, Hy) in single precision: the order of the updates and the energy; the
 * arrays and their plumbing are {@link FloatEngine}'s.
 * Edit this file; {@link DoubleS} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatS extends FloatEngine {

    private static final VectorSpecies<Float> SP = FloatKernels.SP;
    private static final int VL = SP.length();

    final float[] ez, hx, hy, cb;
    /** ca per cell, or null when every cell is lossless (ca = 1). */
    final float[] ca;
    /** The columns of Ez that rows of a y strip correct in their plain update: [eFused0, eFused1). */
    private final int eFused0, eFused1;

    FloatS(MaterialGrid grid, double courant, double[] caOfMaterial, double[] cbOfMaterial, AdeCoefficients[] adeOf,
            SeriesCoefficients[] seriesOf, Map<Side, Boundary> sides) {
        super(grid, Polarization.S, courant, caOfMaterial, cbOfMaterial, adeOf, seriesOf, sides);
        ez = field(Component.EZ);
        hx = field(Component.HX);
        hy = field(Component.HY);
        cb = cb(Component.EZ);
        ca = ca(Component.EZ);
        eFused0 = Math.min(FloatPmlRows.fusedFrom(1, xFree0), nx - 1);
        eFused1 = FloatPmlRows.fusedTo(eFused0, Math.min(xFree1, nx - 1));
    }

    @Override
    protected void hRow(int j) {
        hCore(j);
        hStrips(j, j + 1);
    }

    @Override
    protected double hRows(int a, int b, boolean flush) {
        for (int j = a; j < b; ) {
            int r = flat ? plainRun(j, b, 0, ny - 1) : j;
            int y = r > j ? j : stripRun(j, b, 0, ny - 1, 0);
            if (r > j) {
                hFlat(j, r);
                j = r;
            } else if (y > j) {
                // the strip's rows: the plain update, then the correction of Hx (all columns)
                hFlat(j, y);
                FloatStrip st = ys[yStripOfRow[j]];
                FloatFlat.yH(hx, ez, -s, nx, j * nx, y * nx, st.start * nx, st, vl);
                j = y;
            } else {
                hCore(j++);
            }
        }
        hStrips(a, b);
        double max = 0;
        for (int j = a; j < b; j++) {
            max = Math.max(max, hFinish(j, flush));
        }
        return max;
    }

    /**
     * Row j's magnetic update with the y-side CPML correction of Hx (which no x strip corrects; fused
     * into the update in a y strip's rows) and without the x-side corrections of Hy.
     */
    private void hCore(int j) {
        int q = yStripOfRow[j];
        if (q >= 0) {
            FloatStrip y = ys[q];
            FloatPmlRows.sH(ez, hx, hy, nx, j, s, y, j - y.start, vl);
        } else {
            FloatKernels.sH(ez, hx, hy, nx, ny, j, s, vl);
        }
        if (blochX) {
            int k = j * nx + nx - 1;
            hy[k] += s * ((float) ghostE[j] - ez[k]);
        }
    }

    /**
     * The plain magnetic update of rows [r0, r1) below the last row (plain rows, or a y strip's rows whose
     * correction follows) as one flat pass:
     * the last column's Hy, which the pass computes from the next row's first Ez, is put back and
     * updated as hCore does (left alone, or from the Bloch seam).
     */
    private void hFlat(int r0, int r1) {
        for (int j = r0; j < r1; j++) {
            keep[j] = hy[j * nx + nx - 1];
        }
        FloatFlat.sH(ez, hx, hy, nx, r0 * nx, r1 * nx, s, vl);
        for (int j = r0; j < r1; j++) {
            int k = j * nx + nx - 1;
            hy[k] = keep[j];
            if (blochX) {
                hy[k] += s * ((float) ghostE[j] - ez[k]);
            }
        }
    }

    /** The x-side CPML corrections of Hy in rows [a, b). */
    private void hStrips(int a, int b) {
        for (FloatStrip x : xs) {
            FloatKernels.pmlXH(hy, ez, s, nx, a, b, x, x.psiH, vl);
        }
    }

    @Override
    protected void eRow(int j) {
        if (eCore(j)) {
            eStrips(j, j + 1);
            eYStrip(j);
        }
    }

    @Override
    protected double eRows(int a, int b, boolean flush) {
        for (int j = a; j < b; ) {
            int r = flat ? plainRun(j, b, 1, ny - 1) : j;
            int y = r > j ? j : stripRun(j, b, 1, ny - 1, 1);
            if (r > j) {
                eFlat(j, r);
                j = r;
            } else if (y > j) {
                // the strip's interior rows past its first: the plain update, then the correction (all columns)
                eFlat(j, y);
                FloatStrip st = ys[yStripOfRow[j]];
                FloatFlat.yE(ez, hx, cb, true, nx, j * nx, y * nx, st.start * nx, st, vl);
                j = y;
            } else {
                eCore(j++);
            }
        }
        // the rows eCore updates: the interior ones, and a wall row only on a PMC wall
        eStrips(Math.max(a, pmcBottom ? 0 : 1), Math.min(b, pmcTop ? ny : ny - 1));
        for (int j = a; j < b; j++) {
            if (eUpdated(j) && !yFlat) { // with yFlat, stripRun corrected every strip row that has a correction
                eYStrip(j);
            }
        }
        // eYStrip reads H alone, so the rows' finishing may follow all of them
        return eFinishRows(a, b, flush);
    }

    /** Whether row j's electric field is updated at all: interior rows, and wall rows on a PMC wall. */
    private boolean eUpdated(int j) {
        return j > 0 && j < ny - 1 || (j == 0 ? pmcBottom : pmcTop);
    }

    /** Row j's electric update (walls included) without the CPML corrections; false if the row is not updated. */
    private boolean eCore(int j) {
        boolean wallRow = j == 0 || j == ny - 1;
        boolean first = pmcLeft || blochX;
        boolean last = pmcRight || blochX;
        float west = blochX ? (float) ghostW[j] : 0f;
        if (!wallRow) {
            int q = yStripOfRow[j];
            if (q >= 0 && j > ys[q].start) {
                FloatStrip y = ys[q];
                FloatPmlRows.sE(ez, hx, hy, ca, cb, nx, j, y, j - y.start, eFused0, eFused1, vl);
            } else {
                FloatKernels.sE(ez, hx, hy, ca, cb, nx, j, vl);
            }
            if (first) {
                FloatKernels.sEdge(ez, hx, hy, ca, cb, nx, 0, j, west);
            }
            if (last) {
                FloatKernels.sEdge(ez, hx, hy, ca, cb, nx, nx - 1, j, west);
            }
            return true;
        } else if (j == 0 ? pmcBottom : pmcTop) {
            for (int i = first ? 0 : 1; i <= (last ? nx - 1 : nx - 2); i++) {
                FloatKernels.sEdge(ez, hx, hy, ca, cb, nx, i, j, west);
            }
            return true;
        }
        return false;
    }

    /**
     * The plain electric update of interior rows [r0, r1) (plain rows, or a y strip's rows whose correction
     * follows) as one flat pass: column 0 (which the pass computes
     * from the row before's last Hy) is put back and, on a PMC wall or the Bloch seam, updated as
     * eCore does; column nx − 1 is put back where eCore leaves it alone (elsewhere the pass computed
     * it as eCore does).
     */
    private void eFlat(int r0, int r1) {
        boolean first = pmcLeft || blochX;
        boolean last = pmcRight || blochX;
        for (int j = r0; j < r1; j++) {
            keep[j] = ez[j * nx];
            keep[ny + j] = ez[j * nx + nx - 1];
        }
        FloatFlat.sE(ez, hx, hy, ca, cb, nx, r0 * nx, r1 * nx, vl);
        for (int j = r0; j < r1; j++) {
            int k = j * nx;
            ez[k] = keep[j];
            if (first) {
                FloatKernels.sEdge(ez, hx, hy, ca, cb, nx, 0, j, blochX ? (float) ghostW[j] : 0f);
            }
            if (!last) {
                ez[k + nx - 1] = keep[ny + j];
            }
        }
    }

    /** The x-side CPML corrections of Ez in rows [a, b) (all updated rows). */
    private void eStrips(int a, int b) {
        for (FloatStrip x : xs) {
            FloatKernels.pmlXE(ez, hy, cb, false, nx, a, b, x, x.psiE, vl);
        }
    }

    /**
     * The y-side CPML correction of Ez in row j, if it lies in a y strip, in the columns that eCore
     * did not correct (those an x strip corrects first, and the walls' or seam's edge columns).
     */
    private void eYStrip(int j) {
        int q = yStripOfRow[j];
        if (q >= 0) {
            FloatStrip y = ys[q];
            int jj = j - y.start;
            if (jj >= 1) {
                boolean first = pmcLeft || blochX;
                boolean last = pmcRight || blochX;
                int i0 = first ? 0 : 1;
                int i1 = last ? nx : nx - 1;
                if (j == 0 || j == ny - 1) {
                    FloatKernels.pmlYE(ez, hx, cb, true, nx, jj, y, y.psiE, i0, i1, vl);
                } else {
                    FloatKernels.pmlYE(ez, hx, cb, true, nx, jj, y, y.psiE, i0, eFused0, vl);
                    FloatKernels.pmlYE(ez, hx, cb, true, nx, jj, y, y.psiE, eFused1, i1, vl);
                }
            }
        }
    }

    @Override
    public double energy(int i0, int j0, int i1, int j1) {
        double w = 0;
        float[] lanes = new float[VL];
        float num0 = (1f + 1f) * (float) courant;
        for (int j = j0; j < j1; j++) {
            // the cells with both next neighbours (j < ny − 1, i < nx − 1) in lanes; the others as before
            int iEnd = j < ny - 1 ? Math.max(i0, Math.min(i1, nx - 1)) : i0;
            java.util.Arrays.fill(lanes, 0f);
            int i = i0;
            if (iEnd - i0 >= vl) {
                FloatVector acc = FloatVector.zero(SP);
                FloatVector vs = FloatVector.broadcast(SP, s);
                for (; i <= iEnd - vl; i += VL) {
                    int k = j * nx + i;
                    FloatVector e = FloatVector.fromArray(SP, ez, k);
                    FloatVector c = FloatVector.fromArray(SP, cb, k);
                    FloatVector num = ca == null ? FloatVector.broadcast(SP, num0)
                            : FloatVector.fromArray(SP, ca, k).add(1f).mul((float) courant);
                    // cb = 0: a perfect conductor, where E stays zero and holds no energy
                    FloatVector eps = num.div(c.mul(2f)).blend(0f, c.compare(VectorOperators.EQ, 0f));
                    FloatVector x = FloatVector.fromArray(SP, hx, k);
                    FloatVector y = FloatVector.fromArray(SP, hy, k);
                    FloatVector xNext = x.sub(FloatVector.fromArray(SP, ez, k + nx).sub(e).mul(vs));
                    FloatVector yNext = y.add(FloatVector.fromArray(SP, ez, k + 1).sub(e).mul(vs));
                    acc = acc.add(eps.mul(e).mul(e).add(x.mul(xNext)).add(y.mul(yNext)));
                }
                acc.intoArray(lanes, 0);
            }
            for (; i < iEnd; i++) {
                int k = j * nx + i;
                float e = ez[k];
                float c = cb[k];
                float num = ca == null ? num0 : (ca[k] + 1f) * (float) courant;
                float eps = c == 0f ? 0f : num / (c * 2f);
                float x = hx[k];
                float y = hy[k];
                float xNext = x - (ez[k + nx] - e) * s;
                float yNext = y + (ez[k + 1] - e) * s;
                lanes[(i - i0) % VL] += eps * e * e + x * xNext + y * yNext;
            }
            for (float v : lanes) {
                w += v;
            }
            for (i = iEnd; i < i1; i++) {
                w += cellEnergy(i, j);
            }
        }
        return w;
    }

    /**
     * One cell's energy in double, as the whole sum was before it took lanes (tests compare with it): the cells in
     * the last row or column,
     * whose H has no next neighbour to average with.
     */
    double cellEnergy(int i, int j) {
        int k = j * nx + i;
        double e = ez[k];
        double eps = cb[k] == 0 ? 0.0 : courant * (1.0 + (ca == null ? 1.0 : ca[k])) / (2.0 * cb[k]);
        double hxNext = j < ny - 1 ? hx[k] - s * (ez[k + nx] - e) : 0.0;
        double hyNext = i < nx - 1 ? hy[k] + s * (ez[k + 1] - e) : 0.0;
        return eps * e * e + hx[k] * hxNext + hy[k] * hyNext;
    }
}
