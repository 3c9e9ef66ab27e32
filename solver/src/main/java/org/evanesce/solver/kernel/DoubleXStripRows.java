package org.evanesce.solver.kernel;

import jdk.incubator.vector.DoubleVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * Row kernels that correct the cells of the x-side CPML strips in the same pass as their plain update:
 * each row runs the left strip's cells, the interior, then the right strip's cells. A strip cell is read
 * once, updated as {@link DoubleKernels}' row kernel does, corrected as {@link DoubleKernels#pmlXH} or
 * {@link DoubleKernels#pmlXE} does (ψ ← bψ + c·d, flushed below {@link DoubleKernels#TINY}; f ±
 * coef·(kappaTerm·d + ψ)), and written once. The operations and their order per cell are those of the
 * row pass followed by the column pass, so the bits are the same (a row's update reads only the other
 * kind of field, so the order between cells does not matter). The engines use these only for rows that
 * no y-side strip corrects the same component in; ψ of an x strip is {@code psi[j*width + ii]} as before,
 * so a row touches contiguous ψ. Arrays are row-major, {@code f[j*nx + i]}, and are modified in place.
 * Generated from {@link FloatXStripRows} by tools/regen-double-kernels.sh: edit that file, not this one.
 */
final class DoubleXStripRows {

    private static final VectorSpecies<Double> SP = DoubleKernels.SP;
    private static final int VL = SP.length();
    private static final double TINY = DoubleKernels.TINY;

    private DoubleXStripRows() {
    }

    /**
     * Where a row's x-strip cells lie within the columns [from, to) a row kernel updates: the left strip's
     * cells [from, leftEnd), the right strip's [rightStart, to); either strip may be absent (null).
     */
    record Split(DoubleStrip left, int leftEnd, DoubleStrip right, int rightStart) {
    }

    /**
     * The split of [from, to) for the magnetic ({@code electric} false) or electric cells of these x
     * strips, or null where the kernels here do not apply: no strip, two strips on one side, a strip
     * whose cells do not start (left) or end (right) at the row kernel's bounds, or strips whose cells
     * meet or overlap (then the engines keep the separate column pass).
     */
    static Split split(DoubleStrip[] xs, boolean electric, int from, int to) {
        DoubleStrip left = null;
        DoubleStrip right = null;
        for (DoubleStrip x : xs) {
            if (x.start == 0 && left == null) {
                left = x;
            } else if (x.start > 0 && right == null) {
                right = x;
            } else {
                return null;
            }
        }
        if (left == null && right == null) {
            return null;
        }
        int leftEnd = from;
        int rightStart = to;
        if (left != null) {
            if (first(left, electric) != from) {
                return null;
            }
            leftEnd = end(left, electric);
        }
        if (right != null) {
            if (end(right, electric) != to) {
                return null;
            }
            rightStart = first(right, electric);
        }
        return leftEnd <= rightStart ? new Split(left, leftEnd, right, rightStart) : null;
    }

    private static int first(DoubleStrip x, boolean electric) {
        return x.start + (electric ? x.eFrom : 0);
    }

    private static int end(DoubleStrip x, boolean electric) {
        return x.start + (electric ? x.eTo : x.width);
    }

    /**
     * s, row j ≤ ny−2: {@link DoubleKernels#sH} with the x strips' correction of Hy (coefficient s) in
     * their cells.
     */
    static void sH(double[] ez, double[] hx, double[] hy, int nx, int j, double s, Split sp, int vl) {
        int n = nx - 1;
        if (sp.left != null) {
            sHStrip(ez, hx, hy, nx, j, s, 0, sp.leftEnd, sp.left, vl);
        }
        sHPlain(ez, hx, hy, nx, j, s, sp.leftEnd, sp.rightStart, vl);
        if (sp.right != null) {
            sHStrip(ez, hx, hy, nx, j, s, sp.rightStart, n, sp.right, vl);
        }
        int k = j * nx + n;
        hx[k] -= s * (ez[k + nx] - ez[k]);
    }

    /** {@link DoubleKernels#sH}'s loop over the columns [i0, i1) of a row j ≤ ny−2. */
    private static void sHPlain(double[] ez, double[] hx, double[] hy, int nx, int j, double s, int i0, int i1, int vl) {
        int r = j * nx;
        int i = i0;
        if (vl <= nx) {
            DoubleVector vs = DoubleVector.broadcast(SP, s);
            for (; i <= i1 - vl; i += VL) {
                int k = r + i;
                DoubleVector e0 = DoubleVector.fromArray(SP, ez, k);
                DoubleVector e1 = DoubleVector.fromArray(SP, ez, k + 1);
                DoubleVector en = DoubleVector.fromArray(SP, ez, k + nx);
                DoubleVector.fromArray(SP, hx, k).sub(vs.mul(en.sub(e0))).intoArray(hx, k);
                DoubleVector.fromArray(SP, hy, k).add(vs.mul(e1.sub(e0))).intoArray(hy, k);
            }
        }
        for (; i < i1; i++) {
            int k = r + i;
            hx[k] -= s * (ez[k + nx] - ez[k]);
            hy[k] += s * (ez[k + 1] - ez[k]);
        }
    }

    /** {@link #sHPlain} over the cells [i0, i1) of strip x, with its correction of Hy after the update. */
    private static void sHStrip(double[] ez, double[] hx, double[] hy, int nx, int j, double s, int i0, int i1,
                                DoubleStrip x, int vl) {
        int r = j * nx;
        int pb = j * x.width - x.start;
        double[] psi = x.psiH;
        int i = i0;
        if (vl <= nx) {
            DoubleVector vs = DoubleVector.broadcast(SP, s);
            for (; i <= i1 - vl; i += VL) {
                int k = r + i;
                int ii = i - x.start;
                DoubleVector e0 = DoubleVector.fromArray(SP, ez, k);
                DoubleVector e1 = DoubleVector.fromArray(SP, ez, k + 1);
                DoubleVector en = DoubleVector.fromArray(SP, ez, k + nx);
                DoubleVector.fromArray(SP, hx, k).sub(vs.mul(en.sub(e0))).intoArray(hx, k);
                DoubleVector d = e1.sub(e0);
                DoubleVector h = DoubleVector.fromArray(SP, hy, k).add(vs.mul(d));
                DoubleVector ps = DoubleVector.fromArray(SP, x.bH, ii).mul(DoubleVector.fromArray(SP, psi, pb + i))
                        .add(DoubleVector.fromArray(SP, x.cH, ii).mul(d));
                ps = ps.blend(0.0, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + i);
                h.add(vs.mul(DoubleVector.fromArray(SP, x.kH, ii).mul(d).add(ps))).intoArray(hy, k);
            }
        }
        for (; i < i1; i++) {
            int k = r + i;
            int ii = i - x.start;
            hx[k] -= s * (ez[k + nx] - ez[k]);
            double d = ez[k + 1] - ez[k];
            double h = hy[k] + s * d;
            double ps = x.bH[ii] * psi[pb + i] + x.cH[ii] * d;
            if (Math.abs(ps) < TINY) {
                ps = 0.0;
            }
            psi[pb + i] = ps;
            hy[k] = h + s * (x.kH[ii] * d + ps);
        }
    }

    /**
     * s, interior row 1 ≤ j ≤ ny−2, columns [1, nx−1): {@link DoubleKernels#sE} with the x strips'
     * correction of Ez (added) in their cells.
     */
    static void sE(double[] ez, double[] hx, double[] hy, double[] ca, double[] cb, int nx, int j, Split sp, int vl) {
        if (sp.left != null) {
            sEStrip(ez, hx, hy, ca, cb, nx, j, 1, sp.leftEnd, sp.left, vl);
        }
        DoubleKernels.sE(ez, hx, hy, ca, cb, nx, j, sp.leftEnd, sp.rightStart, vl);
        if (sp.right != null) {
            sEStrip(ez, hx, hy, ca, cb, nx, j, sp.rightStart, nx - 1, sp.right, vl);
        }
    }

    /** {@link DoubleKernels#sE} over the cells [i0, i1) of strip x, with its correction of Ez after the update. */
    private static void sEStrip(double[] ez, double[] hx, double[] hy, double[] ca, double[] cb, int nx, int j, int i0,
                                int i1, DoubleStrip x, int vl) {
        int r = j * nx;
        int pb = j * x.width - x.start;
        double[] psi = x.psiE;
        int i = i0;
        for (; i <= i1 - vl; i += VL) {
            int k = r + i;
            int ii = i - x.start;
            DoubleVector d = DoubleVector.fromArray(SP, hy, k).sub(DoubleVector.fromArray(SP, hy, k - 1));
            DoubleVector curl = d.sub(DoubleVector.fromArray(SP, hx, k).sub(DoubleVector.fromArray(SP, hx, k - nx)));
            DoubleVector vcb = DoubleVector.fromArray(SP, cb, k);
            DoubleVector e = DoubleVector.fromArray(SP, ez, k);
            e = (ca == null ? e : DoubleVector.fromArray(SP, ca, k).mul(e)).add(vcb.mul(curl));
            DoubleVector ps = DoubleVector.fromArray(SP, x.bE, ii).mul(DoubleVector.fromArray(SP, psi, pb + i))
                    .add(DoubleVector.fromArray(SP, x.cE, ii).mul(d));
            ps = ps.blend(0.0, ps.abs().lt(TINY));
            ps.intoArray(psi, pb + i);
            e.add(vcb.mul(DoubleVector.fromArray(SP, x.kE, ii).mul(d).add(ps))).intoArray(ez, k);
        }
        for (; i < i1; i++) {
            int k = r + i;
            int ii = i - x.start;
            double d = hy[k] - hy[k - 1];
            double curl = d - (hx[k] - hx[k - nx]);
            double e = (ca == null ? ez[k] : ca[k] * ez[k]) + cb[k] * curl;
            double ps = x.bE[ii] * psi[pb + i] + x.cE[ii] * d;
            if (Math.abs(ps) < TINY) {
                ps = 0.0;
            }
            psi[pb + i] = ps;
            ez[k] = e + cb[k] * (x.kE[ii] * d + ps);
        }
    }

    /**
     * p, row j ≤ ny−2, columns [0, nx−1): {@link DoubleKernels#pH} with the x strips' correction of Hz
     * (coefficient −s) in their cells.
     */
    static void pH(double[] hz, double[] ex, double[] ey, int nx, int j, double s, Split sp, int vl) {
        if (sp.left != null) {
            pHStrip(hz, ex, ey, nx, j, s, 0, sp.leftEnd, sp.left, vl);
        }
        DoubleKernels.pH(hz, ex, ey, nx, j, sp.leftEnd, sp.rightStart, s, vl);
        if (sp.right != null) {
            pHStrip(hz, ex, ey, nx, j, s, sp.rightStart, nx - 1, sp.right, vl);
        }
    }

    /** {@link DoubleKernels#pH} over the cells [i0, i1) of strip x, with its correction of Hz after the update. */
    private static void pHStrip(double[] hz, double[] ex, double[] ey, int nx, int j, double s, int i0, int i1,
                                DoubleStrip x, int vl) {
        int r = j * nx;
        int pb = j * x.width - x.start;
        double[] psi = x.psiH;
        double coef = -s;
        int i = i0;
        if (vl <= nx) {
            DoubleVector vs = DoubleVector.broadcast(SP, s);
            DoubleVector vc = DoubleVector.broadcast(SP, coef);
            for (; i <= i1 - vl; i += VL) {
                int k = r + i;
                int ii = i - x.start;
                DoubleVector dEx = DoubleVector.fromArray(SP, ex, k + nx).sub(DoubleVector.fromArray(SP, ex, k));
                DoubleVector d = DoubleVector.fromArray(SP, ey, k + 1).sub(DoubleVector.fromArray(SP, ey, k));
                DoubleVector h = DoubleVector.fromArray(SP, hz, k).add(vs.mul(dEx.sub(d)));
                DoubleVector ps = DoubleVector.fromArray(SP, x.bH, ii).mul(DoubleVector.fromArray(SP, psi, pb + i))
                        .add(DoubleVector.fromArray(SP, x.cH, ii).mul(d));
                ps = ps.blend(0.0, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + i);
                h.add(vc.mul(DoubleVector.fromArray(SP, x.kH, ii).mul(d).add(ps))).intoArray(hz, k);
            }
        }
        for (; i < i1; i++) {
            int k = r + i;
            int ii = i - x.start;
            double d = ey[k + 1] - ey[k];
            double h = hz[k] + s * ((ex[k + nx] - ex[k]) - d);
            double ps = x.bH[ii] * psi[pb + i] + x.cH[ii] * d;
            if (Math.abs(ps) < TINY) {
                ps = 0.0;
            }
            psi[pb + i] = ps;
            hz[k] = h + coef * (x.kH[ii] * d + ps);
        }
    }

    /**
     * p, row j ≤ ny−2, columns [1, nx−1): {@link DoubleKernels#pEy} with the x strips' correction of Ey
     * (subtracted) in their cells.
     */
    static void pEy(double[] hz, double[] ey, double[] ca, double[] cb, int nx, int j, Split sp, int vl) {
        if (sp.left != null) {
            pEyStrip(hz, ey, ca, cb, nx, j, 1, sp.leftEnd, sp.left, vl);
        }
        pEyPlain(hz, ey, ca, cb, nx, j, sp.leftEnd, sp.rightStart, vl);
        if (sp.right != null) {
            pEyStrip(hz, ey, ca, cb, nx, j, sp.rightStart, nx - 1, sp.right, vl);
        }
    }

    /** {@link DoubleKernels#pEy}'s loop over the columns [i0, i1). */
    private static void pEyPlain(double[] hz, double[] ey, double[] ca, double[] cb, int nx, int j, int i0, int i1, int vl) {
        int r = j * nx;
        int i = i0;
        for (; i <= i1 - vl; i += VL) {
            int k = r + i;
            DoubleVector d = DoubleVector.fromArray(SP, hz, k).sub(DoubleVector.fromArray(SP, hz, k - 1));
            DoubleVector e = DoubleVector.fromArray(SP, ey, k);
            (ca == null ? e : DoubleVector.fromArray(SP, ca, k).mul(e))
                    .sub(DoubleVector.fromArray(SP, cb, k).mul(d)).intoArray(ey, k);
        }
        for (; i < i1; i++) {
            int k = r + i;
            ey[k] = (ca == null ? ey[k] : ca[k] * ey[k]) - cb[k] * (hz[k] - hz[k - 1]);
        }
    }

    /** {@link #pEyPlain} over the cells [i0, i1) of strip x, with its correction of Ey after the update. */
    private static void pEyStrip(double[] hz, double[] ey, double[] ca, double[] cb, int nx, int j, int i0, int i1,
                                 DoubleStrip x, int vl) {
        int r = j * nx;
        int pb = j * x.width - x.start;
        double[] psi = x.psiE;
        int i = i0;
        for (; i <= i1 - vl; i += VL) {
            int k = r + i;
            int ii = i - x.start;
            DoubleVector d = DoubleVector.fromArray(SP, hz, k).sub(DoubleVector.fromArray(SP, hz, k - 1));
            DoubleVector vcb = DoubleVector.fromArray(SP, cb, k);
            DoubleVector e = DoubleVector.fromArray(SP, ey, k);
            e = (ca == null ? e : DoubleVector.fromArray(SP, ca, k).mul(e)).sub(vcb.mul(d));
            DoubleVector ps = DoubleVector.fromArray(SP, x.bE, ii).mul(DoubleVector.fromArray(SP, psi, pb + i))
                    .add(DoubleVector.fromArray(SP, x.cE, ii).mul(d));
            ps = ps.blend(0.0, ps.abs().lt(TINY));
            ps.intoArray(psi, pb + i);
            e.sub(vcb.mul(DoubleVector.fromArray(SP, x.kE, ii).mul(d).add(ps))).intoArray(ey, k);
        }
        for (; i < i1; i++) {
            int k = r + i;
            int ii = i - x.start;
            double d = hz[k] - hz[k - 1];
            double e = (ca == null ? ey[k] : ca[k] * ey[k]) - cb[k] * d;
            double ps = x.bE[ii] * psi[pb + i] + x.cE[ii] * d;
            if (Math.abs(ps) < TINY) {
                ps = 0.0;
            }
            psi[pb + i] = ps;
            ey[k] = e - cb[k] * (x.kE[ii] * d + ps);
        }
    }
}
