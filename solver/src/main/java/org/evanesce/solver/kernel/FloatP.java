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
 * p polarization (Hz, Ex, Ey) in single precision: the order of the updates and the energy; the
 * arrays and their plumbing are {@link FloatEngine}'s. Ex and Ey have their own coefficients, so the
 * per-component permittivities of subpixel smoothing apply.
 * Edit this file; {@link DoubleP} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatP extends FloatEngine {

    private static final VectorSpecies<Float> SP = FloatKernels.SP;
    private static final int VL = SP.length();

    final float[] hz, ex, ey, cbx, cby;
    /** ca per cell, or null when every cell at that site is lossless (ca = 1). */
    final float[] cax, cay;
    /** The columns of Hz that rows of a y strip correct in their plain update: [hFused0, hFused1). */
    private final int hFused0, hFused1;

    FloatP(MaterialGrid grid, double courant, double[] caOfMaterial, double[] cbOfMaterial, AdeCoefficients[] adeOf,
            SeriesCoefficients[] seriesOf, Map<Side, Boundary> sides) {
        super(grid, Polarization.P, courant, caOfMaterial, cbOfMaterial, adeOf, seriesOf, sides);
        hz = field(Component.HZ);
        ex = field(Component.EX);
        ey = field(Component.EY);
        cbx = cb(Component.EX);
        cby = cb(Component.EY);
        cax = ca(Component.EX);
        cay = ca(Component.EY);
        hFused0 = Math.min(FloatPmlRows.fusedFrom(0, xFree0), nx - 1);
        hFused1 = FloatPmlRows.fusedTo(hFused0, Math.min(xFree1, nx - 1));
    }

    @Override
    protected void hRow(int j) {
        if (j >= ny - 1) {
            return;
        }
        hCore(j);
        hStrips(j, j + 1);
        hYStrip(j);
    }

    @Override
    protected double hRows(int a, int b, boolean flush) {
        int hb = Math.min(b, ny - 1); // Hz lives on rows 0..ny-2
        for (int j = a; j < hb; ) {
            int r = flat ? plainRun(j, hb, 0, ny - 1) : j;
            int y = r > j ? j : stripRun(j, hb, 0, ny - 1, 0);
            if (r > j) {
                hFlat(j, r);
                j = r;
            } else if (y > j) {
                // the strip's rows: the plain update, then the correction of Hz (all columns)
                hFlat(j, y);
                FloatStrip st = ys[yStripOfRow[j]];
                FloatFlat.yH(hz, ex, s, nx, j * nx, y * nx, st.start * nx, st, vl);
                j = y;
            } else {
                hCore(j++);
            }
        }
        hStrips(a, hb);
        double max = 0;
        for (int j = a; j < b; j++) {
            if (j < hb && !yFlat) { // with yFlat, stripRun corrected every strip row below hb
                hYStrip(j);
            }
            max = Math.max(max, hFinish(j, flush));
        }
        return max;
    }

    /**
     * Row j's magnetic update (j ≤ ny−2) without the x-side CPML corrections; in a y strip's rows with
     * the y-side correction of the columns [hFused0, hFused1) that no x strip corrects.
     */
    private void hCore(int j) {
        int q = yStripOfRow[j];
        if (q >= 0) {
            FloatStrip y = ys[q];
            FloatPmlRows.pH(hz, ex, ey, nx, j, s, y, j - y.start, hFused0, hFused1, vl);
        } else {
            FloatKernels.pH(hz, ex, ey, nx, j, s, vl);
        }
        if (blochX) {
            int k = j * nx + nx - 1;
            hz[k] += s * ((ex[k + nx] - ex[k]) - ((float) ghostE[j] - ey[k]));
        }
    }

    /**
     * The plain magnetic update of rows [r0, r1), all ≤ ny−2 (plain rows, or a y strip's rows whose
     * correction follows) as one flat pass: the last
     * column's Hz, which the pass computes from the next row's first Ey, is put back and updated as
     * hCore does (left alone, or from the Bloch seam).
     */
    private void hFlat(int r0, int r1) {
        for (int j = r0; j < r1; j++) {
            keep[j] = hz[j * nx + nx - 1];
        }
        FloatFlat.pH(hz, ex, ey, nx, r0 * nx, r1 * nx, s, vl);
        for (int j = r0; j < r1; j++) {
            int k = j * nx + nx - 1;
            hz[k] = keep[j];
            if (blochX) {
                hz[k] += s * ((ex[k + nx] - ex[k]) - ((float) ghostE[j] - ey[k]));
            }
        }
    }

    /** The x-side CPML corrections of Hz in rows [a, b). */
    private void hStrips(int a, int b) {
        for (FloatStrip x : xs) {
            FloatKernels.pmlXH(hz, ey, -s, nx, a, b, x, x.psiH, vl);
        }
    }

    /** The y-side CPML correction of Hz in row j, if it lies in a y strip, in the columns hCore did not correct. */
    private void hYStrip(int j) {
        int q = yStripOfRow[j];
        if (q >= 0) {
            FloatStrip y = ys[q];
            FloatKernels.pmlYH(hz, ex, s, nx, j - y.start, y, y.psiH, 0, hFused0, vl);
            FloatKernels.pmlYH(hz, ex, s, nx, j - y.start, y, y.psiH, hFused1, blochX ? nx : nx - 1, vl);
        }
    }

    @Override
    protected void eRow(int j) {
        eCore(j);
        if (j < ny - 1) {
            eStrips(j, j + 1);
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
                // the strip's interior rows past its first: the plain update, then the correction of Ex (all columns)
                eFlat(j, y);
                FloatStrip st = ys[yStripOfRow[j]];
                FloatFlat.yE(ex, hz, cbx, false, nx, j * nx, y * nx, st.start * nx, st, vl);
                j = y;
            } else {
                eCore(j++);
            }
        }
        eStrips(a, Math.min(b, ny - 1));
        return eFinishRows(a, b, flush);
    }

    /** Row j's electric update (walls and the y-side CPML of Ex included) without the x-side CPML of Ey. */
    private void eCore(int j) {
        boolean wallRow = j == 0 || j == ny - 1;
        // Ex: interior rows, or a PMC wall row; with Bloch boundaries the last column too
        int exEnd = blochX ? nx : nx - 1;
        int q = yStripOfRow[j];
        // the y-side CPML correction of Ex (no x strip corrects Ex): in the same pass on an interior row
        boolean corrected = q >= 0 && j > ys[q].start;
        if (!wallRow) {
            if (corrected) {
                FloatPmlRows.pEx(hz, ex, cax, cbx, nx, j, ys[q], j - ys[q].start, vl);
            } else {
                FloatKernels.pEx(hz, ex, cax, cbx, nx, j, vl);
            }
            if (blochX) {
                FloatKernels.pExEdge(hz, ex, cax, cbx, nx, nx - 1, j);
                if (corrected) {
                    FloatKernels.pmlYE(ex, hz, cbx, false, nx, j - ys[q].start, ys[q], ys[q].psiE, nx - 1, nx, vl);
                }
            }
        } else if (j == 0 ? pmcBottom : pmcTop) {
            for (int i = 0; i < exEnd; i++) {
                FloatKernels.pExEdge(hz, ex, cax, cbx, nx, i, j);
            }
            if (corrected) {
                FloatKernels.pmlYE(ex, hz, cbx, false, nx, j - ys[q].start, ys[q], ys[q].psiE, 0, exEnd, vl);
            }
        }
        // Ey: rows 0..ny-2
        if (j < ny - 1) {
            FloatKernels.pEy(hz, ey, cay, cby, nx, j, vl);
            if (pmcLeft || blochX) {
                FloatKernels.pEyEdge(hz, ey, cay, cby, nx, 0, j, blochX ? (float) ghostW[j] : 0f);
            }
            if (pmcRight || blochX) {
                FloatKernels.pEyEdge(hz, ey, cay, cby, nx, nx - 1, j, 0f);
            }
        }
    }

    /**
     * The plain electric update of interior rows [r0, r1) (plain rows, or a y strip's rows whose correction
     * of Ex follows) as one flat pass of Ex and one of Ey. Put back after
     * them: Ex of column nx − 1 unless the Bloch seam updates it (the pass computed it as eCore does);
     * Ey of column 0 (computed from the row before's last Hz), then updated as eCore does on a PMC
     * wall or the seam; Ey of column nx − 1 where eCore leaves it alone.
     */
    private void eFlat(int r0, int r1) {
        boolean first = pmcLeft || blochX;
        boolean last = pmcRight || blochX;
        for (int j = r0; j < r1; j++) {
            keep[j] = ex[j * nx + nx - 1];
            keep[ny + j] = ey[j * nx];
            keep[2 * ny + j] = ey[j * nx + nx - 1];
        }
        FloatFlat.pEx(hz, ex, cax, cbx, nx, r0 * nx, r1 * nx, vl);
        FloatFlat.pEy(hz, ey, cay, cby, r0 * nx, r1 * nx, vl);
        for (int j = r0; j < r1; j++) {
            int k = j * nx;
            if (!blochX) {
                ex[k + nx - 1] = keep[j];
            }
            ey[k] = keep[ny + j];
            if (first) {
                FloatKernels.pEyEdge(hz, ey, cay, cby, nx, 0, j, blochX ? (float) ghostW[j] : 0f);
            }
            if (!last) {
                ey[k + nx - 1] = keep[2 * ny + j];
            }
        }
    }

    /** The x-side CPML corrections of Ey in rows [a, b) (rows ≤ ny−2). */
    private void eStrips(int a, int b) {
        for (FloatStrip x : xs) {
            FloatKernels.pmlXE(ey, hz, cby, true, nx, a, b, x, x.psiE, vl);
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
                    FloatVector x = FloatVector.fromArray(SP, ex, k);
                    FloatVector y = FloatVector.fromArray(SP, ey, k);
                    FloatVector cx = FloatVector.fromArray(SP, cbx, k);
                    FloatVector cy = FloatVector.fromArray(SP, cby, k);
                    FloatVector numX = cax == null ? FloatVector.broadcast(SP, num0)
                            : FloatVector.fromArray(SP, cax, k).add(1f).mul((float) courant);
                    FloatVector numY = cay == null ? FloatVector.broadcast(SP, num0)
                            : FloatVector.fromArray(SP, cay, k).add(1f).mul((float) courant);
                    // cb = 0: a perfect conductor, where E stays zero and holds no energy
                    FloatVector epsX = numX.div(cx.mul(2f)).blend(0f, cx.compare(VectorOperators.EQ, 0f));
                    FloatVector epsY = numY.div(cy.mul(2f)).blend(0f, cy.compare(VectorOperators.EQ, 0f));
                    FloatVector z = FloatVector.fromArray(SP, hz, k);
                    FloatVector curl = FloatVector.fromArray(SP, ex, k + nx).sub(x)
                            .sub(FloatVector.fromArray(SP, ey, k + 1).sub(y));
                    FloatVector zNext = z.add(curl.mul(vs));
                    acc = acc.add(epsX.mul(x).mul(x).add(epsY.mul(y).mul(y)).add(z.mul(zNext)));
                }
                acc.intoArray(lanes, 0);
            }
            for (; i < iEnd; i++) {
                int k = j * nx + i;
                float x = ex[k];
                float y = ey[k];
                float cx = cbx[k];
                float cy = cby[k];
                float numX = cax == null ? num0 : (cax[k] + 1f) * (float) courant;
                float numY = cay == null ? num0 : (cay[k] + 1f) * (float) courant;
                float epsX = cx == 0f ? 0f : numX / (cx * 2f);
                float epsY = cy == 0f ? 0f : numY / (cy * 2f);
                float z = hz[k];
                float curl = ex[k + nx] - x - (ey[k + 1] - y);
                float zNext = z + curl * s;
                lanes[(i - i0) % VL] += epsX * x * x + epsY * y * y + z * zNext;
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
     * whose Hz has no next value to average with.
     */
    double cellEnergy(int i, int j) {
        int k = j * nx + i;
        // cb = 0: a perfect conductor, where E stays zero and holds no energy
        double epsX = cbx[k] == 0 ? 0.0 : courant * (1.0 + (cax == null ? 1.0 : cax[k])) / (2.0 * cbx[k]);
        double epsY = cby[k] == 0 ? 0.0 : courant * (1.0 + (cay == null ? 1.0 : cay[k])) / (2.0 * cby[k]);
        double hzNext = i < nx - 1 && j < ny - 1
                ? hz[k] + s * ((ex[k + nx] - ex[k]) - (ey[k + 1] - ey[k])) : 0.0;
        return epsX * ex[k] * ex[k] + epsY * ey[k] * ey[k] + hz[k] * hzNext;
    }
}
