package org.evanesce.solver.kernel;

import java.util.Map;
import jdk.incubator.vector.DoubleVector;
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
 * p polarization (Hz, Ex, Ey) in double precision: the order of the updates and the energy; the
 * arrays and their plumbing are {@link DoubleEngine}'s. Ex and Ey have their own coefficients, so the
 * per-component permittivities of subpixel smoothing apply.
 * Generated from {@link FloatP} by tools/regen-double-kernels.sh: edit that file, not this one.
 */
final class DoubleP extends DoubleEngine {

    private static final VectorSpecies<Double> SP = DoubleKernels.SP;
    private static final int VL = SP.length();

    final double[] hz, ex, ey, cbx, cby;
    /** ca per cell, or null when every cell at that site is lossless (ca = 1). */
    final double[] cax, cay;
    /** The columns of Hz that rows of a y strip correct in their plain update: [hFused0, hFused1). */
    private final int hFused0, hFused1;

    DoubleP(MaterialGrid grid, double courant, double[] caOfMaterial, double[] cbOfMaterial, AdeCoefficients[] adeOf,
            SeriesCoefficients[] seriesOf, Map<Side, Boundary> sides) {
        super(grid, Polarization.P, courant, caOfMaterial, cbOfMaterial, adeOf, seriesOf, sides);
        hz = field(Component.HZ);
        ex = field(Component.EX);
        ey = field(Component.EY);
        cbx = cb(Component.EX);
        cby = cb(Component.EY);
        cax = ca(Component.EX);
        cay = ca(Component.EY);
        hFused0 = Math.min(DoublePmlRows.fusedFrom(0, xFree0), nx - 1);
        hFused1 = DoublePmlRows.fusedTo(hFused0, Math.min(xFree1, nx - 1));
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
                DoubleStrip st = ys[yStripOfRow[j]];
                DoubleFlat.yH(hz, ex, s, nx, j * nx, y * nx, st.start * nx, st, vl);
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
            DoubleStrip y = ys[q];
            DoublePmlRows.pH(hz, ex, ey, nx, j, s, y, j - y.start, hFused0, hFused1, vl);
        } else {
            DoubleKernels.pH(hz, ex, ey, nx, j, s, vl);
        }
        if (blochX) {
            int k = j * nx + nx - 1;
            hz[k] += s * ((ex[k + nx] - ex[k]) - (ghostE[j] - ey[k]));
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
        DoubleFlat.pH(hz, ex, ey, nx, r0 * nx, r1 * nx, s, vl);
        for (int j = r0; j < r1; j++) {
            int k = j * nx + nx - 1;
            hz[k] = keep[j];
            if (blochX) {
                hz[k] += s * ((ex[k + nx] - ex[k]) - (ghostE[j] - ey[k]));
            }
        }
    }

    /** The x-side CPML corrections of Hz in rows [a, b). */
    private void hStrips(int a, int b) {
        for (DoubleStrip x : xs) {
            DoubleKernels.pmlXH(hz, ey, -s, nx, a, b, x, x.psiH, vl);
        }
    }

    /** The y-side CPML correction of Hz in row j, if it lies in a y strip, in the columns hCore did not correct. */
    private void hYStrip(int j) {
        int q = yStripOfRow[j];
        if (q >= 0) {
            DoubleStrip y = ys[q];
            DoubleKernels.pmlYH(hz, ex, s, nx, j - y.start, y, y.psiH, 0, hFused0, vl);
            DoubleKernels.pmlYH(hz, ex, s, nx, j - y.start, y, y.psiH, hFused1, blochX ? nx : nx - 1, vl);
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
                DoubleStrip st = ys[yStripOfRow[j]];
                DoubleFlat.yE(ex, hz, cbx, false, nx, j * nx, y * nx, st.start * nx, st, vl);
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
                DoublePmlRows.pEx(hz, ex, cax, cbx, nx, j, ys[q], j - ys[q].start, vl);
            } else {
                DoubleKernels.pEx(hz, ex, cax, cbx, nx, j, vl);
            }
            if (blochX) {
                DoubleKernels.pExEdge(hz, ex, cax, cbx, nx, nx - 1, j);
                if (corrected) {
                    DoubleKernels.pmlYE(ex, hz, cbx, false, nx, j - ys[q].start, ys[q], ys[q].psiE, nx - 1, nx, vl);
                }
            }
        } else if (j == 0 ? pmcBottom : pmcTop) {
            for (int i = 0; i < exEnd; i++) {
                DoubleKernels.pExEdge(hz, ex, cax, cbx, nx, i, j);
            }
            if (corrected) {
                DoubleKernels.pmlYE(ex, hz, cbx, false, nx, j - ys[q].start, ys[q], ys[q].psiE, 0, exEnd, vl);
            }
        }
        // Ey: rows 0..ny-2
        if (j < ny - 1) {
            DoubleKernels.pEy(hz, ey, cay, cby, nx, j, vl);
            if (pmcLeft || blochX) {
                DoubleKernels.pEyEdge(hz, ey, cay, cby, nx, 0, j, blochX ? ghostW[j] : 0.0);
            }
            if (pmcRight || blochX) {
                DoubleKernels.pEyEdge(hz, ey, cay, cby, nx, nx - 1, j, 0.0);
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
        DoubleFlat.pEx(hz, ex, cax, cbx, nx, r0 * nx, r1 * nx, vl);
        DoubleFlat.pEy(hz, ey, cay, cby, r0 * nx, r1 * nx, vl);
        for (int j = r0; j < r1; j++) {
            int k = j * nx;
            if (!blochX) {
                ex[k + nx - 1] = keep[j];
            }
            ey[k] = keep[ny + j];
            if (first) {
                DoubleKernels.pEyEdge(hz, ey, cay, cby, nx, 0, j, blochX ? ghostW[j] : 0.0);
            }
            if (!last) {
                ey[k + nx - 1] = keep[2 * ny + j];
            }
        }
    }

    /** The x-side CPML corrections of Ey in rows [a, b) (rows ≤ ny−2). */
    private void eStrips(int a, int b) {
        for (DoubleStrip x : xs) {
            DoubleKernels.pmlXE(ey, hz, cby, true, nx, a, b, x, x.psiE, vl);
        }
    }

    @Override
    public double energy(int i0, int j0, int i1, int j1) {
        double w = 0;
        double[] lanes = new double[VL];
        double num0 = (1.0 + 1.0) * courant;
        for (int j = j0; j < j1; j++) {
            // the cells with both next neighbours (j < ny − 1, i < nx − 1) in lanes; the others as before
            int iEnd = j < ny - 1 ? Math.max(i0, Math.min(i1, nx - 1)) : i0;
            java.util.Arrays.fill(lanes, 0.0);
            int i = i0;
            if (iEnd - i0 >= vl) {
                DoubleVector acc = DoubleVector.zero(SP);
                DoubleVector vs = DoubleVector.broadcast(SP, s);
                for (; i <= iEnd - vl; i += VL) {
                    int k = j * nx + i;
                    DoubleVector x = DoubleVector.fromArray(SP, ex, k);
                    DoubleVector y = DoubleVector.fromArray(SP, ey, k);
                    DoubleVector cx = DoubleVector.fromArray(SP, cbx, k);
                    DoubleVector cy = DoubleVector.fromArray(SP, cby, k);
                    DoubleVector numX = cax == null ? DoubleVector.broadcast(SP, num0)
                            : DoubleVector.fromArray(SP, cax, k).add(1.0).mul(courant);
                    DoubleVector numY = cay == null ? DoubleVector.broadcast(SP, num0)
                            : DoubleVector.fromArray(SP, cay, k).add(1.0).mul(courant);
                    // cb = 0: a perfect conductor, where E stays zero and holds no energy
                    DoubleVector epsX = numX.div(cx.mul(2.0)).blend(0.0, cx.compare(VectorOperators.EQ, 0.0));
                    DoubleVector epsY = numY.div(cy.mul(2.0)).blend(0.0, cy.compare(VectorOperators.EQ, 0.0));
                    DoubleVector z = DoubleVector.fromArray(SP, hz, k);
                    DoubleVector curl = DoubleVector.fromArray(SP, ex, k + nx).sub(x)
                            .sub(DoubleVector.fromArray(SP, ey, k + 1).sub(y));
                    DoubleVector zNext = z.add(curl.mul(vs));
                    acc = acc.add(epsX.mul(x).mul(x).add(epsY.mul(y).mul(y)).add(z.mul(zNext)));
                }
                acc.intoArray(lanes, 0);
            }
            for (; i < iEnd; i++) {
                int k = j * nx + i;
                double x = ex[k];
                double y = ey[k];
                double cx = cbx[k];
                double cy = cby[k];
                double numX = cax == null ? num0 : (cax[k] + 1.0) * courant;
                double numY = cay == null ? num0 : (cay[k] + 1.0) * courant;
                double epsX = cx == 0.0 ? 0.0 : numX / (cx * 2.0);
                double epsY = cy == 0.0 ? 0.0 : numY / (cy * 2.0);
                double z = hz[k];
                double curl = ex[k + nx] - x - (ey[k + 1] - y);
                double zNext = z + curl * s;
                lanes[(i - i0) % VL] += epsX * x * x + epsY * y * y + z * zNext;
            }
            for (double v : lanes) {
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
