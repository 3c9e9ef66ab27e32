package org.evanesce.solver.kernel;

import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.boundary.PmlProfile;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Side;

/** s polarization (Ez, Hx, Hy) in double precision. {@link FloatS} is the same in single precision; change both together. */
final class DoubleS extends Engine {

    final double[] ez, hx, hy, cb;
    /** ca per cell, or null when every cell is lossless (ca = 1). */
    final double[] ca;
    private final double s;
    /** x strips correct Hy (ψH) and Ez (ψE); y strips correct Hx (ψH) and Ez (ψE). */
    private final DoubleStrip[] xs, ys;

    DoubleS(MaterialGrid grid, double courant, double dt, Map<Side, Boundary> sides) {
        super(grid.nx(), grid.ny(), courant, sides);
        int n = nx * ny;
        s = courant;
        double[][] c = coefficients(grid, FieldSite.EZ, courant, dt);
        // allocated one after the other with staggered lengths (see Engine.staggeredLength)
        int len = Engine.staggeredLength(n, Double.BYTES);
        ez = new double[len];
        hx = new double[len];
        hy = new double[len];
        cb = toDouble(c[1], len);
        ca = Engine.allOnes(c[0]) ? null : toDouble(c[0], len);
        xs = new DoubleStrip[xProfiles.length];
        for (int q = 0; q < xs.length; q++) {
            // widened to whole vectors so the per-row corrections have no scalar remainder
            PmlProfile p = xProfiles[q].padded(DoubleKernels.roundUpToLanes(xProfiles[q].layers), nx);
            // one spare ψ: a padded left strip's electric range [1, width] ends one past its row's ψ
            // (in the next row's local 0, which no electric update uses), also in the last row
            xs[q] = new DoubleStrip(p, ny * p.width + 1);
        }
        ys = new DoubleStrip[yProfiles.length];
        for (int q = 0; q < ys.length; q++) {
            ys[q] = new DoubleStrip(yProfiles[q], nx * yProfiles[q].layers);
        }
    }

    /** The values of {@code a} in an array of {@code length} ≥ a.length values (zeros after them). */
    static double[] toDouble(double[] a, int length) {
        double[] f = new double[length];
        for (int i = 0; i < a.length; i++) {
            f[i] = a[i];
        }
        return f;
    }

    @Override
    protected void hRow(int j) {
        hCore(j);
        hStrips(j, j + 1);
        hYStrip(j);
    }

    @Override
    protected double hRows(int a, int b, boolean flush) {
        for (int j = a; j < b; j++) {
            hCore(j);
        }
        hStrips(a, b);
        double max = 0;
        for (int j = a; j < b; j++) {
            hYStrip(j);
            max = Math.max(max, hFinish(j, flush));
        }
        return max;
    }

    /** Row j's magnetic update without the CPML corrections. */
    private void hCore(int j) {
        DoubleKernels.sH(ez, hx, hy, nx, ny, j, s);
        if (blochX) {
            int k = j * nx + nx - 1;
            hy[k] += s * (ghostE[j] - ez[k]);
        }
    }

    /** The x-side CPML corrections of Hy in rows [a, b). */
    private void hStrips(int a, int b) {
        for (DoubleStrip x : xs) {
            DoubleKernels.pmlXH(hy, ez, s, nx, a, b, x, x.psiH);
        }
    }

    /** The y-side CPML correction of Hx in row j, if it lies in a y strip. */
    private void hYStrip(int j) {
        int q = yStripOfRow[j];
        if (q >= 0) {
            DoubleStrip y = ys[q];
            DoubleKernels.pmlYH(hx, ez, -s, nx, j - y.start, y, y.psiH, nx);
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
        for (int j = a; j < b; j++) {
            eCore(j);
        }
        // the rows eCore updates: the interior ones, and a wall row only on a PMC wall
        eStrips(Math.max(a, pmcBottom ? 0 : 1), Math.min(b, pmcTop ? ny : ny - 1));
        double max = 0;
        for (int j = a; j < b; j++) {
            if (eUpdated(j)) {
                eYStrip(j);
            }
            max = Math.max(max, eFinish(j, flush));
        }
        return max;
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
        double west = blochX ? ghostW[j] : 0.0;
        if (!wallRow) {
            DoubleKernels.sE(ez, hx, hy, ca, cb, nx, j);
            if (first) {
                DoubleKernels.sEdge(ez, hx, hy, ca, cb, nx, 0, j, west);
            }
            if (last) {
                DoubleKernels.sEdge(ez, hx, hy, ca, cb, nx, nx - 1, j, west);
            }
            return true;
        } else if (j == 0 ? pmcBottom : pmcTop) {
            for (int i = first ? 0 : 1; i <= (last ? nx - 1 : nx - 2); i++) {
                DoubleKernels.sEdge(ez, hx, hy, ca, cb, nx, i, j, west);
            }
            return true;
        }
        return false;
    }

    /** The x-side CPML corrections of Ez in rows [a, b) (all updated rows). */
    private void eStrips(int a, int b) {
        for (DoubleStrip x : xs) {
            DoubleKernels.pmlXE(ez, hy, cb, false, nx, a, b, x, x.psiE);
        }
    }

    /** The y-side CPML correction of Ez in row j, if it lies in a y strip. */
    private void eYStrip(int j) {
        int q = yStripOfRow[j];
        if (q >= 0) {
            DoubleStrip y = ys[q];
            int jj = j - y.start;
            if (jj >= 1) {
                boolean first = pmcLeft || blochX;
                boolean last = pmcRight || blochX;
                DoubleKernels.pmlYE(ez, hx, cb, true, nx, jj, y, y.psiE, first ? 0 : 1, last ? nx : nx - 1);
            }
        }
    }

    @Override
    protected void addSource(Component c, int k, double v) {
        switch (c) {
            case EZ -> ez[k] -= (cb[k] * v);
            case HX -> hx[k] -= (s * v);
            case HY -> hy[k] -= (s * v);
            default -> throw new IllegalArgumentException(c + " is not an s-polarization component");
        }
    }

    @Override
    protected double flushH(int j) {
        int r = j * nx;
        return Math.max(DoubleKernels.flush(hx, r, r + nx), DoubleKernels.flush(hy, r, r + nx));
    }

    @Override
    protected double flushE(int j) {
        int r = j * nx;
        return DoubleKernels.flush(ez, r, r + nx);
    }

    private double[] array(Component c) {
        return switch (c) {
            case EZ -> ez;
            case HX -> hx;
            case HY -> hy;
            default -> throw new IllegalArgumentException(c + " is not an s-polarization component");
        };
    }

    @Override
    public double get(Component c, int k) {
        return array(c)[k];
    }

    @Override
    public void set(Component c, int k, double v) {
        array(c)[k] = v;
    }

    @Override
    public double energy(int i0, int j0, int i1, int j1) {
        double w = 0;
        for (int j = j0; j < j1; j++) {
            for (int i = i0; i < i1; i++) {
                int k = j * nx + i;
                double e = ez[k];
                double eps = courant * (1.0 + (ca == null ? 1.0 : ca[k])) / (2.0 * cb[k]);
                double hxNext = j < ny - 1 ? hx[k] - s * (ez[k + nx] - e) : 0.0;
                double hyNext = i < nx - 1 ? hy[k] + s * (ez[k + 1] - e) : 0.0;
                w += eps * e * e + hx[k] * hxNext + hy[k] * hyNext;
            }
        }
        return w;
    }

    @Override
    public long bytes() {
        long b = bytesPerCell() * (long) nx * ny;
        for (DoubleStrip x : xs) {
            b += x.bytes();
        }
        for (DoubleStrip y : ys) {
            b += y.bytes();
        }
        return b;
    }

    @Override
    public int bytesPerCell() {
        return (ca == null ? 4 : 5) * 8;
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        StateIO.write(out, ez);
        StateIO.write(out, hx);
        StateIO.write(out, hy);
        for (DoubleStrip x : xs) {
            x.writeState(out);
        }
        for (DoubleStrip y : ys) {
            y.writeState(out);
        }
    }

    @Override
    public void readState(java.io.DataInput in) throws java.io.IOException {
        StateIO.read(in, ez);
        StateIO.read(in, hx);
        StateIO.read(in, hy);
        for (DoubleStrip x : xs) {
            x.readState(in);
        }
        for (DoubleStrip y : ys) {
            y.readState(in);
        }
    }
}
