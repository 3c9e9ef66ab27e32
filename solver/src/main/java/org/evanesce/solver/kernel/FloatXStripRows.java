package org.evanesce.solver.kernel;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * Row kernels that correct the cells of the x-side CPML strips in the same pass as their plain update:
 * each row runs the left strip's cells, the interior, then the right strip's cells. A strip cell is read
 * once, updated as {@link FloatKernels}' row kernel does, corrected as {@link FloatKernels#pmlXH} or
 * {@link FloatKernels#pmlXE} does (ψ ← bψ + c·d, flushed below {@link FloatKernels#TINY}; f ±
 * coef·(kappaTerm·d + ψ)), and written once. The operations and their order per cell are those of the
 * row pass followed by the column pass, so the bits are the same (a row's update reads only the other
 * kind of field, so the order between cells does not matter). The engines use these only for rows that
 * no y-side strip corrects the same component in; ψ of an x strip is {@code psi[j*width + ii]} as before,
 * so a row touches contiguous ψ. Arrays are row-major, {@code f[j*nx + i]}, and are modified in place.
 * Edit this file; {@link DoubleXStripRows} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatXStripRows {

    private static final VectorSpecies<Float> SP = FloatKernels.SP;
    private static final int VL = SP.length();
    private static final float TINY = FloatKernels.TINY;

    private FloatXStripRows() {
    }

    /**
     * Where a row's x-strip cells lie within the columns [from, to) a row kernel updates: the left strip's
     * cells [from, leftEnd), the right strip's [rightStart, to); either strip may be absent (null).
     */
    record Split(FloatStrip left, int leftEnd, FloatStrip right, int rightStart) {
    }

    /**
     * The split of [from, to) for the magnetic ({@code electric} false) or electric cells of these x
     * strips, or null where the kernels here do not apply: no strip, two strips on one side, a strip
     * whose cells do not start (left) or end (right) at the row kernel's bounds, or strips whose cells
     * meet or overlap (then the engines keep the separate column pass).
     */
    static Split split(FloatStrip[] xs, boolean electric, int from, int to) {
        FloatStrip left = null;
        FloatStrip right = null;
        for (FloatStrip x : xs) {
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

    private static int first(FloatStrip x, boolean electric) {
        return x.start + (electric ? x.eFrom : 0);
    }

    private static int end(FloatStrip x, boolean electric) {
        return x.start + (electric ? x.eTo : x.width);
    }

    /**
     * s, row j ≤ ny−2: {@link FloatKernels#sH} with the x strips' correction of Hy (coefficient s) in
     * their cells.
     */
    static void sH(float[] ez, float[] hx, float[] hy, int nx, int j, float s, Split sp, int vl) {
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

    /** {@link FloatKernels#sH}'s loop over the columns [i0, i1) of a row j ≤ ny−2. */
    private static void sHPlain(float[] ez, float[] hx, float[] hy, int nx, int j, float s, int i0, int i1, int vl) {
        int r = j * nx;
        int i = i0;
        if (vl <= nx) {
            FloatVector vs = FloatVector.broadcast(SP, s);
            for (; i <= i1 - vl; i += VL) {
                int k = r + i;
                FloatVector e0 = FloatVector.fromArray(SP, ez, k);
                FloatVector e1 = FloatVector.fromArray(SP, ez, k + 1);
                FloatVector en = FloatVector.fromArray(SP, ez, k + nx);
                FloatVector.fromArray(SP, hx, k).sub(vs.mul(en.sub(e0))).intoArray(hx, k);
                FloatVector.fromArray(SP, hy, k).add(vs.mul(e1.sub(e0))).intoArray(hy, k);
            }
        }
        for (; i < i1; i++) {
            int k = r + i;
            hx[k] -= s * (ez[k + nx] - ez[k]);
            hy[k] += s * (ez[k + 1] - ez[k]);
        }
    }

    /** {@link #sHPlain} over the cells [i0, i1) of strip x, with its correction of Hy after the update. */
    private static void sHStrip(float[] ez, float[] hx, float[] hy, int nx, int j, float s, int i0, int i1,
                                FloatStrip x, int vl) {
        int r = j * nx;
        int pb = j * x.width - x.start;
        float[] psi = x.psiH;
        int i = i0;
        if (vl <= nx) {
            FloatVector vs = FloatVector.broadcast(SP, s);
            for (; i <= i1 - vl; i += VL) {
                int k = r + i;
                int ii = i - x.start;
                FloatVector e0 = FloatVector.fromArray(SP, ez, k);
                FloatVector e1 = FloatVector.fromArray(SP, ez, k + 1);
                FloatVector en = FloatVector.fromArray(SP, ez, k + nx);
                FloatVector.fromArray(SP, hx, k).sub(vs.mul(en.sub(e0))).intoArray(hx, k);
                FloatVector d = e1.sub(e0);
                FloatVector h = FloatVector.fromArray(SP, hy, k).add(vs.mul(d));
                FloatVector ps = FloatVector.fromArray(SP, x.bH, ii).mul(FloatVector.fromArray(SP, psi, pb + i))
                        .add(FloatVector.fromArray(SP, x.cH, ii).mul(d));
                ps = ps.blend(0f, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + i);
                h.add(vs.mul(FloatVector.fromArray(SP, x.kH, ii).mul(d).add(ps))).intoArray(hy, k);
            }
        }
        for (; i < i1; i++) {
            int k = r + i;
            int ii = i - x.start;
            hx[k] -= s * (ez[k + nx] - ez[k]);
            float d = ez[k + 1] - ez[k];
            float h = hy[k] + s * d;
            float ps = x.bH[ii] * psi[pb + i] + x.cH[ii] * d;
            if (Math.abs(ps) < TINY) {
                ps = 0f;
            }
            psi[pb + i] = ps;
            hy[k] = h + s * (x.kH[ii] * d + ps);
        }
    }

    /**
     * s, interior row 1 ≤ j ≤ ny−2, columns [1, nx−1): {@link FloatKernels#sE} with the x strips'
     * correction of Ez (added) in their cells.
     */
    static void sE(float[] ez, float[] hx, float[] hy, float[] ca, float[] cb, int nx, int j, Split sp, int vl) {
        if (sp.left != null) {
            sEStrip(ez, hx, hy, ca, cb, nx, j, 1, sp.leftEnd, sp.left, vl);
        }
        FloatKernels.sE(ez, hx, hy, ca, cb, nx, j, sp.leftEnd, sp.rightStart, vl);
        if (sp.right != null) {
            sEStrip(ez, hx, hy, ca, cb, nx, j, sp.rightStart, nx - 1, sp.right, vl);
        }
    }

    /** {@link FloatKernels#sE} over the cells [i0, i1) of strip x, with its correction of Ez after the update. */
    private static void sEStrip(float[] ez, float[] hx, float[] hy, float[] ca, float[] cb, int nx, int j, int i0,
                                int i1, FloatStrip x, int vl) {
        int r = j * nx;
        int pb = j * x.width - x.start;
        float[] psi = x.psiE;
        int i = i0;
        for (; i <= i1 - vl; i += VL) {
            int k = r + i;
            int ii = i - x.start;
            FloatVector d = FloatVector.fromArray(SP, hy, k).sub(FloatVector.fromArray(SP, hy, k - 1));
            FloatVector curl = d.sub(FloatVector.fromArray(SP, hx, k).sub(FloatVector.fromArray(SP, hx, k - nx)));
            FloatVector vcb = FloatVector.fromArray(SP, cb, k);
            FloatVector e = FloatVector.fromArray(SP, ez, k);
            e = (ca == null ? e : FloatVector.fromArray(SP, ca, k).mul(e)).add(vcb.mul(curl));
            FloatVector ps = FloatVector.fromArray(SP, x.bE, ii).mul(FloatVector.fromArray(SP, psi, pb + i))
                    .add(FloatVector.fromArray(SP, x.cE, ii).mul(d));
            ps = ps.blend(0f, ps.abs().lt(TINY));
            ps.intoArray(psi, pb + i);
            e.add(vcb.mul(FloatVector.fromArray(SP, x.kE, ii).mul(d).add(ps))).intoArray(ez, k);
        }
        for (; i < i1; i++) {
            int k = r + i;
            int ii = i - x.start;
            float d = hy[k] - hy[k - 1];
            float curl = d - (hx[k] - hx[k - nx]);
            float e = (ca == null ? ez[k] : ca[k] * ez[k]) + cb[k] * curl;
            float ps = x.bE[ii] * psi[pb + i] + x.cE[ii] * d;
            if (Math.abs(ps) < TINY) {
                ps = 0f;
            }
            psi[pb + i] = ps;
            ez[k] = e + cb[k] * (x.kE[ii] * d + ps);
        }
    }

    /**
     * p, row j ≤ ny−2, columns [0, nx−1): {@link FloatKernels#pH} with the x strips' correction of Hz
     * (coefficient −s) in their cells.
     */
    static void pH(float[] hz, float[] ex, float[] ey, int nx, int j, float s, Split sp, int vl) {
        if (sp.left != null) {
            pHStrip(hz, ex, ey, nx, j, s, 0, sp.leftEnd, sp.left, vl);
        }
        FloatKernels.pH(hz, ex, ey, nx, j, sp.leftEnd, sp.rightStart, s, vl);
        if (sp.right != null) {
            pHStrip(hz, ex, ey, nx, j, s, sp.rightStart, nx - 1, sp.right, vl);
        }
    }

    /** {@link FloatKernels#pH} over the cells [i0, i1) of strip x, with its correction of Hz after the update. */
    private static void pHStrip(float[] hz, float[] ex, float[] ey, int nx, int j, float s, int i0, int i1,
                                FloatStrip x, int vl) {
        int r = j * nx;
        int pb = j * x.width - x.start;
        float[] psi = x.psiH;
        float coef = -s;
        int i = i0;
        if (vl <= nx) {
            FloatVector vs = FloatVector.broadcast(SP, s);
            FloatVector vc = FloatVector.broadcast(SP, coef);
            for (; i <= i1 - vl; i += VL) {
                int k = r + i;
                int ii = i - x.start;
                FloatVector dEx = FloatVector.fromArray(SP, ex, k + nx).sub(FloatVector.fromArray(SP, ex, k));
                FloatVector d = FloatVector.fromArray(SP, ey, k + 1).sub(FloatVector.fromArray(SP, ey, k));
                FloatVector h = FloatVector.fromArray(SP, hz, k).add(vs.mul(dEx.sub(d)));
                FloatVector ps = FloatVector.fromArray(SP, x.bH, ii).mul(FloatVector.fromArray(SP, psi, pb + i))
                        .add(FloatVector.fromArray(SP, x.cH, ii).mul(d));
                ps = ps.blend(0f, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + i);
                h.add(vc.mul(FloatVector.fromArray(SP, x.kH, ii).mul(d).add(ps))).intoArray(hz, k);
            }
        }
        for (; i < i1; i++) {
            int k = r + i;
            int ii = i - x.start;
            float d = ey[k + 1] - ey[k];
            float h = hz[k] + s * ((ex[k + nx] - ex[k]) - d);
            float ps = x.bH[ii] * psi[pb + i] + x.cH[ii] * d;
            if (Math.abs(ps) < TINY) {
                ps = 0f;
            }
            psi[pb + i] = ps;
            hz[k] = h + coef * (x.kH[ii] * d + ps);
        }
    }

    /**
     * p, row j ≤ ny−2, columns [1, nx−1): {@link FloatKernels#pEy} with the x strips' correction of Ey
     * (subtracted) in their cells.
     */
    static void pEy(float[] hz, float[] ey, float[] ca, float[] cb, int nx, int j, Split sp, int vl) {
        if (sp.left != null) {
            pEyStrip(hz, ey, ca, cb, nx, j, 1, sp.leftEnd, sp.left, vl);
        }
        pEyPlain(hz, ey, ca, cb, nx, j, sp.leftEnd, sp.rightStart, vl);
        if (sp.right != null) {
            pEyStrip(hz, ey, ca, cb, nx, j, sp.rightStart, nx - 1, sp.right, vl);
        }
    }

    /** {@link FloatKernels#pEy}'s loop over the columns [i0, i1). */
    private static void pEyPlain(float[] hz, float[] ey, float[] ca, float[] cb, int nx, int j, int i0, int i1, int vl) {
        int r = j * nx;
        int i = i0;
        for (; i <= i1 - vl; i += VL) {
            int k = r + i;
            FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - 1));
            FloatVector e = FloatVector.fromArray(SP, ey, k);
            (ca == null ? e : FloatVector.fromArray(SP, ca, k).mul(e))
                    .sub(FloatVector.fromArray(SP, cb, k).mul(d)).intoArray(ey, k);
        }
        for (; i < i1; i++) {
            int k = r + i;
            ey[k] = (ca == null ? ey[k] : ca[k] * ey[k]) - cb[k] * (hz[k] - hz[k - 1]);
        }
    }

    /** {@link #pEyPlain} over the cells [i0, i1) of strip x, with its correction of Ey after the update. */
    private static void pEyStrip(float[] hz, float[] ey, float[] ca, float[] cb, int nx, int j, int i0, int i1,
                                 FloatStrip x, int vl) {
        int r = j * nx;
        int pb = j * x.width - x.start;
        float[] psi = x.psiE;
        int i = i0;
        for (; i <= i1 - vl; i += VL) {
            int k = r + i;
            int ii = i - x.start;
            FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - 1));
            FloatVector vcb = FloatVector.fromArray(SP, cb, k);
            FloatVector e = FloatVector.fromArray(SP, ey, k);
            e = (ca == null ? e : FloatVector.fromArray(SP, ca, k).mul(e)).sub(vcb.mul(d));
            FloatVector ps = FloatVector.fromArray(SP, x.bE, ii).mul(FloatVector.fromArray(SP, psi, pb + i))
                    .add(FloatVector.fromArray(SP, x.cE, ii).mul(d));
            ps = ps.blend(0f, ps.abs().lt(TINY));
            ps.intoArray(psi, pb + i);
            e.sub(vcb.mul(FloatVector.fromArray(SP, x.kE, ii).mul(d).add(ps))).intoArray(ey, k);
        }
        for (; i < i1; i++) {
            int k = r + i;
            int ii = i - x.start;
            float d = hz[k] - hz[k - 1];
            float e = (ca == null ? ey[k] : ca[k] * ey[k]) - cb[k] * d;
            float ps = x.bE[ii] * psi[pb + i] + x.cE[ii] * d;
            if (Math.abs(ps) < TINY) {
                ps = 0f;
            }
            psi[pb + i] = ps;
            ey[k] = e - cb[k] * (x.kE[ii] * d + ps);
        }
    }
}
