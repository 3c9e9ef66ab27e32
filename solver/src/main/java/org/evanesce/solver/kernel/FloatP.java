package org.evanesce.solver.kernel;

import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.boundary.PmlProfile;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Side;

/**
 * p polarization (Hz, Ex, Ey) in single precision. Ex and Ey have their own coefficients, so the
 * per-component permittivities of subpixel smoothing apply. {@link DoubleP} is the same in
 * double; change both together.
 */
final class FloatP extends Engine {

    final float[] hz, ex, ey, cbx, cby;
    /** ca per cell, or null when every cell at that site is lossless (ca = 1). */
    final float[] cax, cay;
    private final float s;
    /** x strips correct Hz (ψH) and Ey (ψE); y strips correct Hz (ψH) and Ex (ψE). */
    private final FloatStrip[] xs, ys;

    FloatP(MaterialGrid grid, double courant, double dt, Map<Side, Boundary> sides) {
        super(grid.nx(), grid.ny(), courant, sides);
        int n = nx * ny;
        s = (float) courant;
        double[][] cx = coefficients(grid, FieldSite.EX, courant, dt);
        double[][] cy = coefficients(grid, FieldSite.EY, courant, dt);
        // allocated one after the other with staggered lengths (see Engine.staggeredLength)
        int len = Engine.staggeredLength(n, Float.BYTES);
        hz = new float[len];
        ex = new float[len];
        ey = new float[len];
        cbx = FloatS.toFloat(cx[1], len);
        cby = FloatS.toFloat(cy[1], len);
        cax = Engine.allOnes(cx[0]) ? null : FloatS.toFloat(cx[0], len);
        cay = Engine.allOnes(cy[0]) ? null : FloatS.toFloat(cy[0], len);
        xs = new FloatStrip[xProfiles.length];
        for (int q = 0; q < xs.length; q++) {
            // widened to whole vectors so the per-row corrections have no scalar remainder
            PmlProfile p = xProfiles[q].padded(FloatKernels.roundUpToLanes(xProfiles[q].layers), nx);
            // a padded left strip's electric range [1, width] ends in the next row's local 0, which
            // no electric update uses; Ey stops at row ny−2, so no spare ψ is needed (see FloatS)
            xs[q] = new FloatStrip(p, ny * p.width);
        }
        ys = new FloatStrip[yProfiles.length];
        for (int q = 0; q < ys.length; q++) {
            ys[q] = new FloatStrip(yProfiles[q], nx * yProfiles[q].layers);
        }
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
        for (int j = a; j < hb; j++) {
            hCore(j);
        }
        hStrips(a, hb);
        double max = 0;
        for (int j = a; j < b; j++) {
            if (j < hb) {
                hYStrip(j);
            }
            max = Math.max(max, hFinish(j, flush));
        }
        return max;
    }

    /** Row j's magnetic update without the CPML corrections (j ≤ ny−2). */
    private void hCore(int j) {
        FloatKernels.pH(hz, ex, ey, nx, j, s);
        if (blochX) {
            int k = j * nx + nx - 1;
            hz[k] += s * ((ex[k + nx] - ex[k]) - ((float) ghostE[j] - ey[k]));
        }
    }

    /** The x-side CPML corrections of Hz in rows [a, b). */
    private void hStrips(int a, int b) {
        for (FloatStrip x : xs) {
            FloatKernels.pmlXH(hz, ey, -s, nx, a, b, x, x.psiH);
        }
    }

    /** The y-side CPML correction of Hz in row j, if it lies in a y strip. */
    private void hYStrip(int j) {
        int q = yStripOfRow[j];
        if (q >= 0) {
            FloatStrip y = ys[q];
            FloatKernels.pmlYH(hz, ex, s, nx, j - y.start, y, y.psiH, blochX ? nx : nx - 1);
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
        for (int j = a; j < b; j++) {
            eCore(j);
        }
        eStrips(a, Math.min(b, ny - 1));
        double max = 0;
        for (int j = a; j < b; j++) {
            max = Math.max(max, eFinish(j, flush));
        }
        return max;
    }

    /** Row j's electric update (walls and the y-side CPML of Ex included) without the x-side CPML of Ey. */
    private void eCore(int j) {
        boolean wallRow = j == 0 || j == ny - 1;
        // Ex: interior rows, or a PMC wall row; with Bloch boundaries the last column too
        int exEnd = blochX ? nx : nx - 1;
        if (!wallRow) {
            FloatKernels.pEx(hz, ex, cax, cbx, nx, j);
            if (blochX) {
                FloatKernels.pExEdge(hz, ex, cax, cbx, nx, nx - 1, j);
            }
        } else if (j == 0 ? pmcBottom : pmcTop) {
            for (int i = 0; i < exEnd; i++) {
                FloatKernels.pExEdge(hz, ex, cax, cbx, nx, i, j);
            }
        }
        boolean exUpdated = !wallRow || (j == 0 ? pmcBottom : pmcTop);
        int q = yStripOfRow[j];
        if (exUpdated && q >= 0) {
            FloatStrip y = ys[q];
            int jj = j - y.start;
            if (jj >= 1) {
                FloatKernels.pmlYE(ex, hz, cbx, false, nx, jj, y, y.psiE, 0, exEnd);
            }
        }
        // Ey: rows 0..ny-2
        if (j < ny - 1) {
            FloatKernels.pEy(hz, ey, cay, cby, nx, j);
            if (pmcLeft || blochX) {
                FloatKernels.pEyEdge(hz, ey, cay, cby, nx, 0, j, blochX ? (float) ghostW[j] : 0f);
            }
            if (pmcRight || blochX) {
                FloatKernels.pEyEdge(hz, ey, cay, cby, nx, nx - 1, j, 0f);
            }
        }
    }

    /** The x-side CPML corrections of Ey in rows [a, b) (rows ≤ ny−2). */
    private void eStrips(int a, int b) {
        for (FloatStrip x : xs) {
            FloatKernels.pmlXE(ey, hz, cby, true, nx, a, b, x, x.psiE);
        }
    }

    @Override
    protected void addSource(Component c, int k, double v) {
        switch (c) {
            case EX -> ex[k] -= (float) (cbx[k] * v);
            case EY -> ey[k] -= (float) (cby[k] * v);
            case HZ -> hz[k] -= (float) (s * v);
            default -> throw new IllegalArgumentException(c + " is not a p-polarization component");
        }
    }

    @Override
    protected double flushH(int j) {
        int r = j * nx;
        return FloatKernels.flush(hz, r, r + nx);
    }

    @Override
    protected double flushE(int j) {
        int r = j * nx;
        return Math.max(FloatKernels.flush(ex, r, r + nx), FloatKernels.flush(ey, r, r + nx));
    }

    private float[] array(Component c) {
        return switch (c) {
            case HZ -> hz;
            case EX -> ex;
            case EY -> ey;
            default -> throw new IllegalArgumentException(c + " is not a p-polarization component");
        };
    }

    @Override
    public double get(Component c, int k) {
        return array(c)[k];
    }

    @Override
    public void set(Component c, int k, double v) {
        array(c)[k] = (float) v;
    }

    @Override
    public double energy(int i0, int j0, int i1, int j1) {
        double w = 0;
        for (int j = j0; j < j1; j++) {
            for (int i = i0; i < i1; i++) {
                int k = j * nx + i;
                double epsX = courant * (1.0 + (cax == null ? 1.0 : cax[k])) / (2.0 * cbx[k]);
                double epsY = courant * (1.0 + (cay == null ? 1.0 : cay[k])) / (2.0 * cby[k]);
                double hzNext = i < nx - 1 && j < ny - 1
                        ? hz[k] + s * ((ex[k + nx] - ex[k]) - (ey[k + 1] - ey[k])) : 0.0;
                w += epsX * ex[k] * ex[k] + epsY * ey[k] * ey[k] + hz[k] * hzNext;
            }
        }
        return w;
    }

    @Override
    public long bytes() {
        long b = bytesPerCell() * (long) nx * ny;
        for (FloatStrip x : xs) {
            b += x.bytes();
        }
        for (FloatStrip y : ys) {
            b += y.bytes();
        }
        return b;
    }

    @Override
    public int bytesPerCell() {
        return (5 + (cax == null ? 0 : 1) + (cay == null ? 0 : 1)) * 4;
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        StateIO.write(out, hz);
        StateIO.write(out, ex);
        StateIO.write(out, ey);
        for (FloatStrip x : xs) {
            x.writeState(out);
        }
        for (FloatStrip y : ys) {
            y.writeState(out);
        }
    }

    @Override
    public void readState(java.io.DataInput in) throws java.io.IOException {
        StateIO.read(in, hz);
        StateIO.read(in, ex);
        StateIO.read(in, ey);
        for (FloatStrip x : xs) {
            x.readState(in);
        }
        for (FloatStrip y : ys) {
            y.readState(in);
        }
    }
}
