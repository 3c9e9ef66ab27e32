package org.evanesce.solver.kernel;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * Row kernels for the rows of a y-side CPML strip, with the strip's correction fused into the plain
 * update: each cell is read once, updated as {@link FloatKernels}' row kernel does, corrected as
 * {@link FloatKernels#pmlYH} or {@link FloatKernels#pmlYE} does (ψ ← bψ + c·d, flushed below
 * {@link FloatKernels#TINY}; f ± coef·(kappaTerm·d + ψ)), and written once. The operations and their
 * order per cell are those of the two separate passes, so the bits are the same. A cell that an x-side
 * strip also corrects must take the x correction first: the engines fuse only the columns
 * [a, b) that no x strip touches ({@link #fusedFrom}, {@link #fusedTo}) and correct the others after
 * the x strips, as before. Arrays are row-major, {@code f[j*nx + i]}, and are modified in place; ψ of
 * the strip's local row jj is {@code psi[jj*nx + i]}.
 * Edit this file; {@link DoublePmlRows} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatPmlRows {

    private static final VectorSpecies<Float> SP = FloatKernels.SP;
    private static final int VL = SP.length();
    private static final float TINY = FloatKernels.TINY;

    private FloatPmlRows() {
    }

    /**
     * The first fused column for a row kernel that starts at column {@code first}, when columns from
     * {@code c0} on are free of x strips: c0 rounded up so that [first, a) is whole vectors.
     */
    static int fusedFrom(int first, int c0) {
        return c0 <= first ? first : first + (c0 - first + VL - 1) / VL * VL;
    }

    /** The end of the fused columns from {@code a} when columns before {@code c1} are free: whole vectors, at least a. */
    static int fusedTo(int a, int c1) {
        return c1 <= a ? a : a + (c1 - a) / VL * VL;
    }

    /**
     * s, row j ≤ ny−2 in a y strip (local row jj): {@link FloatKernels#sH} with the strip's correction
     * of Hx (coefficient −s) over the whole row, which no x strip corrects.
     */
    static void sH(float[] ez, float[] hx, float[] hy, int nx, int j, float s, FloatStrip st, int jj, int vl) {
        int r = j * nx;
        int pb = jj * nx - r;
        float[] psi = st.psiH;
        float coef = -s;
        float b = st.bH[jj];
        float c = st.cH[jj];
        float kt = st.kH[jj];
        int n = nx - 1;
        int i = 0;
        if (vl <= nx) {
            FloatVector vs = FloatVector.broadcast(SP, s);
            FloatVector vc = FloatVector.broadcast(SP, coef);
            FloatVector vb = FloatVector.broadcast(SP, b);
            FloatVector vcc = FloatVector.broadcast(SP, c);
            FloatVector vk = FloatVector.broadcast(SP, kt);
            for (; i <= n - vl; i += VL) {
                int k = r + i;
                FloatVector e0 = FloatVector.fromArray(SP, ez, k);
                FloatVector e1 = FloatVector.fromArray(SP, ez, k + 1);
                FloatVector d = FloatVector.fromArray(SP, ez, k + nx).sub(e0);
                FloatVector h = FloatVector.fromArray(SP, hx, k).sub(vs.mul(d));
                FloatVector ps = vb.mul(FloatVector.fromArray(SP, psi, pb + k)).add(vcc.mul(d));
                ps = ps.blend(0f, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + k);
                h.add(vc.mul(vk.mul(d).add(ps))).intoArray(hx, k);
                FloatVector.fromArray(SP, hy, k).add(vs.mul(e1.sub(e0))).intoArray(hy, k);
            }
        }
        for (; i < n; i++) {
            int k = r + i;
            hx[k] = sHx(ez, hx, nx, k, s, coef, b, c, kt, psi, pb);
            hy[k] += s * (ez[k + 1] - ez[k]);
        }
        hx[r + n] = sHx(ez, hx, nx, r + n, s, coef, b, c, kt, psi, pb);
    }

    /** One cell's Hx of {@link #sH}: the plain update, then ψ and the correction. */
    private static float sHx(float[] ez, float[] hx, int nx, int k, float s, float coef, float b, float c, float kt,
                             float[] psi, int pb) {
        float d = ez[k + nx] - ez[k];
        float h = hx[k] - s * d;
        float ps = b * psi[pb + k] + c * d;
        if (Math.abs(ps) < TINY) {
            ps = 0f;
        }
        psi[pb + k] = ps;
        return h + coef * (kt * d + ps);
    }

    /**
     * s, interior row j in a y strip (local row jj ≥ 1): {@link FloatKernels#sE} over columns [1, nx−1)
     * with the strip's correction of Ez (subtracted) fused into columns [a, b) ⊂ [1, nx−1).
     */
    static void sE(float[] ez, float[] hx, float[] hy, float[] ca, float[] cb, int nx, int j, FloatStrip st, int jj,
                   int a, int b, int vl) {
        FloatKernels.sE(ez, hx, hy, ca, cb, nx, j, 1, a, vl);
        int r = j * nx;
        int pb = jj * nx - r;
        float[] psi = st.psiE;
        float bb = st.bE[jj];
        float c = st.cE[jj];
        float kt = st.kE[jj];
        int i = a;
        if (vl <= nx) {
            FloatVector vb = FloatVector.broadcast(SP, bb);
            FloatVector vcc = FloatVector.broadcast(SP, c);
            FloatVector vk = FloatVector.broadcast(SP, kt);
            for (; i <= b - vl; i += VL) {
                int k = r + i;
                FloatVector d = FloatVector.fromArray(SP, hx, k).sub(FloatVector.fromArray(SP, hx, k - nx));
                FloatVector curl = FloatVector.fromArray(SP, hy, k).sub(FloatVector.fromArray(SP, hy, k - 1)).sub(d);
                FloatVector vcb = FloatVector.fromArray(SP, cb, k);
                FloatVector e = FloatVector.fromArray(SP, ez, k);
                e = (ca == null ? e : FloatVector.fromArray(SP, ca, k).mul(e)).add(vcb.mul(curl));
                FloatVector ps = vb.mul(FloatVector.fromArray(SP, psi, pb + k)).add(vcc.mul(d));
                ps = ps.blend(0f, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + k);
                e.sub(vcb.mul(vk.mul(d).add(ps))).intoArray(ez, k);
            }
        }
        for (; i < b; i++) {
            int k = r + i;
            float d = hx[k] - hx[k - nx];
            float curl = (hy[k] - hy[k - 1]) - d;
            float e = (ca == null ? ez[k] : ca[k] * ez[k]) + cb[k] * curl;
            float ps = bb * psi[pb + k] + c * d;
            if (Math.abs(ps) < TINY) {
                ps = 0f;
            }
            psi[pb + k] = ps;
            ez[k] = e - cb[k] * (kt * d + ps);
        }
        FloatKernels.sE(ez, hx, hy, ca, cb, nx, j, b, nx - 1, vl);
    }

    /**
     * p, row j ≤ ny−2 in a y strip (local row jj): {@link FloatKernels#pH} over columns [0, nx−1) with
     * the strip's correction of Hz (coefficient s) fused into columns [a, b) ⊂ [0, nx−1).
     */
    static void pH(float[] hz, float[] ex, float[] ey, int nx, int j, float s, FloatStrip st, int jj, int a, int b,
                   int vl) {
        FloatKernels.pH(hz, ex, ey, nx, j, 0, a, s, vl);
        int r = j * nx;
        int pb = jj * nx - r;
        float[] psi = st.psiH;
        float bb = st.bH[jj];
        float c = st.cH[jj];
        float kt = st.kH[jj];
        int i = a;
        if (vl <= nx) {
            FloatVector vs = FloatVector.broadcast(SP, s);
            FloatVector vb = FloatVector.broadcast(SP, bb);
            FloatVector vcc = FloatVector.broadcast(SP, c);
            FloatVector vk = FloatVector.broadcast(SP, kt);
            for (; i <= b - vl; i += VL) {
                int k = r + i;
                FloatVector d = FloatVector.fromArray(SP, ex, k + nx).sub(FloatVector.fromArray(SP, ex, k));
                FloatVector dEy = FloatVector.fromArray(SP, ey, k + 1).sub(FloatVector.fromArray(SP, ey, k));
                FloatVector h = FloatVector.fromArray(SP, hz, k).add(vs.mul(d.sub(dEy)));
                FloatVector ps = vb.mul(FloatVector.fromArray(SP, psi, pb + k)).add(vcc.mul(d));
                ps = ps.blend(0f, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + k);
                h.add(vs.mul(vk.mul(d).add(ps))).intoArray(hz, k);
            }
        }
        for (; i < b; i++) {
            int k = r + i;
            float d = ex[k + nx] - ex[k];
            float h = hz[k] + s * (d - (ey[k + 1] - ey[k]));
            float ps = bb * psi[pb + k] + c * d;
            if (Math.abs(ps) < TINY) {
                ps = 0f;
            }
            psi[pb + k] = ps;
            hz[k] = h + s * (kt * d + ps);
        }
        FloatKernels.pH(hz, ex, ey, nx, j, b, nx - 1, s, vl);
    }

    /**
     * p, interior row j in a y strip (local row jj ≥ 1): {@link FloatKernels#pEx} with the strip's
     * correction of Ex (added) over the whole row [0, nx−1), which no x strip corrects.
     */
    static void pEx(float[] hz, float[] ex, float[] ca, float[] cb, int nx, int j, FloatStrip st, int jj, int vl) {
        int r = j * nx;
        int pb = jj * nx - r;
        float[] psi = st.psiE;
        float bb = st.bE[jj];
        float c = st.cE[jj];
        float kt = st.kE[jj];
        int n = nx - 1;
        int i = 0;
        if (vl <= nx) {
            FloatVector vb = FloatVector.broadcast(SP, bb);
            FloatVector vcc = FloatVector.broadcast(SP, c);
            FloatVector vk = FloatVector.broadcast(SP, kt);
            for (; i <= n - vl; i += VL) {
                int k = r + i;
                FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - nx));
                FloatVector vcb = FloatVector.fromArray(SP, cb, k);
                FloatVector e = FloatVector.fromArray(SP, ex, k);
                e = (ca == null ? e : FloatVector.fromArray(SP, ca, k).mul(e)).add(vcb.mul(d));
                FloatVector ps = vb.mul(FloatVector.fromArray(SP, psi, pb + k)).add(vcc.mul(d));
                ps = ps.blend(0f, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + k);
                e.add(vcb.mul(vk.mul(d).add(ps))).intoArray(ex, k);
            }
        }
        for (; i < n; i++) {
            int k = r + i;
            float d = hz[k] - hz[k - nx];
            float e = (ca == null ? ex[k] : ca[k] * ex[k]) + cb[k] * d;
            float ps = bb * psi[pb + k] + c * d;
            if (Math.abs(ps) < TINY) {
                ps = 0f;
            }
            psi[pb + k] = ps;
            ex[k] = e + cb[k] * (kt * d + ps);
        }
    }
}
