package org.evanesce.solver.kernel;

import jdk.incubator.vector.DoubleVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * Row kernels for the rows of a y-side CPML strip, with the strip's correction fused into the plain
 * update: each cell is read once, updated as {@link DoubleKernels}' row kernel does, corrected as
 * {@link DoubleKernels#pmlYH} or {@link DoubleKernels#pmlYE} does (ψ ← bψ + c·d, flushed below
 * {@link DoubleKernels#TINY}; f ± coef·(kappaTerm·d + ψ)), and written once. The operations and their
 * order per cell are those of the two separate passes, so the bits are the same. A cell that an x-side
 * strip also corrects must take the x correction first: the engines fuse only the columns
 * [a, b) that no x strip touches ({@link #fusedFrom}, {@link #fusedTo}) and correct the others after
 * the x strips, as before. Arrays are row-major, {@code f[j*nx + i]}, and are modified in place; ψ of
 * the strip's local row jj is {@code psi[jj*nx + i]}.
 * Generated from {@link FloatPmlRows} by tools/regen-double-kernels.sh: edit that file, not this one.
 */
final class DoublePmlRows {

    private static final VectorSpecies<Double> SP = DoubleKernels.SP;
    private static final int VL = SP.length();
    private static final double TINY = DoubleKernels.TINY;

    private DoublePmlRows() {
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
     * s, row j ≤ ny−2 in a y strip (local row jj): {@link DoubleKernels#sH} with the strip's correction
     * of Hx (coefficient −s) over the whole row, which no x strip corrects.
     */
    static void sH(double[] ez, double[] hx, double[] hy, int nx, int j, double s, DoubleStrip st, int jj, int vl) {
        int r = j * nx;
        int pb = jj * nx - r;
        double[] psi = st.psiH;
        double coef = -s;
        double b = st.bH[jj];
        double c = st.cH[jj];
        double kt = st.kH[jj];
        int n = nx - 1;
        int i = 0;
        if (vl <= nx) {
            DoubleVector vs = DoubleVector.broadcast(SP, s);
            DoubleVector vc = DoubleVector.broadcast(SP, coef);
            DoubleVector vb = DoubleVector.broadcast(SP, b);
            DoubleVector vcc = DoubleVector.broadcast(SP, c);
            DoubleVector vk = DoubleVector.broadcast(SP, kt);
            for (; i <= n - vl; i += VL) {
                int k = r + i;
                DoubleVector e0 = DoubleVector.fromArray(SP, ez, k);
                DoubleVector e1 = DoubleVector.fromArray(SP, ez, k + 1);
                DoubleVector d = DoubleVector.fromArray(SP, ez, k + nx).sub(e0);
                DoubleVector h = DoubleVector.fromArray(SP, hx, k).sub(vs.mul(d));
                DoubleVector ps = vb.mul(DoubleVector.fromArray(SP, psi, pb + k)).add(vcc.mul(d));
                ps = ps.blend(0.0, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + k);
                h.add(vc.mul(vk.mul(d).add(ps))).intoArray(hx, k);
                DoubleVector.fromArray(SP, hy, k).add(vs.mul(e1.sub(e0))).intoArray(hy, k);
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
    private static double sHx(double[] ez, double[] hx, int nx, int k, double s, double coef, double b, double c, double kt,
                             double[] psi, int pb) {
        double d = ez[k + nx] - ez[k];
        double h = hx[k] - s * d;
        double ps = b * psi[pb + k] + c * d;
        if (Math.abs(ps) < TINY) {
            ps = 0.0;
        }
        psi[pb + k] = ps;
        return h + coef * (kt * d + ps);
    }

    /**
     * s, interior row j in a y strip (local row jj ≥ 1): {@link DoubleKernels#sE} over columns [1, nx−1)
     * with the strip's correction of Ez (subtracted) fused into columns [a, b) ⊂ [1, nx−1).
     */
    static void sE(double[] ez, double[] hx, double[] hy, double[] ca, double[] cb, int nx, int j, DoubleStrip st, int jj,
                   int a, int b, int vl) {
        DoubleKernels.sE(ez, hx, hy, ca, cb, nx, j, 1, a, vl);
        int r = j * nx;
        int pb = jj * nx - r;
        double[] psi = st.psiE;
        double bb = st.bE[jj];
        double c = st.cE[jj];
        double kt = st.kE[jj];
        int i = a;
        if (vl <= nx) {
            DoubleVector vb = DoubleVector.broadcast(SP, bb);
            DoubleVector vcc = DoubleVector.broadcast(SP, c);
            DoubleVector vk = DoubleVector.broadcast(SP, kt);
            for (; i <= b - vl; i += VL) {
                int k = r + i;
                DoubleVector d = DoubleVector.fromArray(SP, hx, k).sub(DoubleVector.fromArray(SP, hx, k - nx));
                DoubleVector curl = DoubleVector.fromArray(SP, hy, k).sub(DoubleVector.fromArray(SP, hy, k - 1)).sub(d);
                DoubleVector vcb = DoubleVector.fromArray(SP, cb, k);
                DoubleVector e = DoubleVector.fromArray(SP, ez, k);
                e = (ca == null ? e : DoubleVector.fromArray(SP, ca, k).mul(e)).add(vcb.mul(curl));
                DoubleVector ps = vb.mul(DoubleVector.fromArray(SP, psi, pb + k)).add(vcc.mul(d));
                ps = ps.blend(0.0, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + k);
                e.sub(vcb.mul(vk.mul(d).add(ps))).intoArray(ez, k);
            }
        }
        for (; i < b; i++) {
            int k = r + i;
            double d = hx[k] - hx[k - nx];
            double curl = (hy[k] - hy[k - 1]) - d;
            double e = (ca == null ? ez[k] : ca[k] * ez[k]) + cb[k] * curl;
            double ps = bb * psi[pb + k] + c * d;
            if (Math.abs(ps) < TINY) {
                ps = 0.0;
            }
            psi[pb + k] = ps;
            ez[k] = e - cb[k] * (kt * d + ps);
        }
        DoubleKernels.sE(ez, hx, hy, ca, cb, nx, j, b, nx - 1, vl);
    }

    /**
     * p, row j ≤ ny−2 in a y strip (local row jj): {@link DoubleKernels#pH} over columns [0, nx−1) with
     * the strip's correction of Hz (coefficient s) fused into columns [a, b) ⊂ [0, nx−1).
     */
    static void pH(double[] hz, double[] ex, double[] ey, int nx, int j, double s, DoubleStrip st, int jj, int a, int b,
                   int vl) {
        DoubleKernels.pH(hz, ex, ey, nx, j, 0, a, s, vl);
        int r = j * nx;
        int pb = jj * nx - r;
        double[] psi = st.psiH;
        double bb = st.bH[jj];
        double c = st.cH[jj];
        double kt = st.kH[jj];
        int i = a;
        if (vl <= nx) {
            DoubleVector vs = DoubleVector.broadcast(SP, s);
            DoubleVector vb = DoubleVector.broadcast(SP, bb);
            DoubleVector vcc = DoubleVector.broadcast(SP, c);
            DoubleVector vk = DoubleVector.broadcast(SP, kt);
            for (; i <= b - vl; i += VL) {
                int k = r + i;
                DoubleVector d = DoubleVector.fromArray(SP, ex, k + nx).sub(DoubleVector.fromArray(SP, ex, k));
                DoubleVector dEy = DoubleVector.fromArray(SP, ey, k + 1).sub(DoubleVector.fromArray(SP, ey, k));
                DoubleVector h = DoubleVector.fromArray(SP, hz, k).add(vs.mul(d.sub(dEy)));
                DoubleVector ps = vb.mul(DoubleVector.fromArray(SP, psi, pb + k)).add(vcc.mul(d));
                ps = ps.blend(0.0, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + k);
                h.add(vs.mul(vk.mul(d).add(ps))).intoArray(hz, k);
            }
        }
        for (; i < b; i++) {
            int k = r + i;
            double d = ex[k + nx] - ex[k];
            double h = hz[k] + s * (d - (ey[k + 1] - ey[k]));
            double ps = bb * psi[pb + k] + c * d;
            if (Math.abs(ps) < TINY) {
                ps = 0.0;
            }
            psi[pb + k] = ps;
            hz[k] = h + s * (kt * d + ps);
        }
        DoubleKernels.pH(hz, ex, ey, nx, j, b, nx - 1, s, vl);
    }

    /**
     * p, interior row j in a y strip (local row jj ≥ 1): {@link DoubleKernels#pEx} with the strip's
     * correction of Ex (added) over the whole row [0, nx−1), which no x strip corrects.
     */
    static void pEx(double[] hz, double[] ex, double[] ca, double[] cb, int nx, int j, DoubleStrip st, int jj, int vl) {
        int r = j * nx;
        int pb = jj * nx - r;
        double[] psi = st.psiE;
        double bb = st.bE[jj];
        double c = st.cE[jj];
        double kt = st.kE[jj];
        int n = nx - 1;
        int i = 0;
        if (vl <= nx) {
            DoubleVector vb = DoubleVector.broadcast(SP, bb);
            DoubleVector vcc = DoubleVector.broadcast(SP, c);
            DoubleVector vk = DoubleVector.broadcast(SP, kt);
            for (; i <= n - vl; i += VL) {
                int k = r + i;
                DoubleVector d = DoubleVector.fromArray(SP, hz, k).sub(DoubleVector.fromArray(SP, hz, k - nx));
                DoubleVector vcb = DoubleVector.fromArray(SP, cb, k);
                DoubleVector e = DoubleVector.fromArray(SP, ex, k);
                e = (ca == null ? e : DoubleVector.fromArray(SP, ca, k).mul(e)).add(vcb.mul(d));
                DoubleVector ps = vb.mul(DoubleVector.fromArray(SP, psi, pb + k)).add(vcc.mul(d));
                ps = ps.blend(0.0, ps.abs().lt(TINY));
                ps.intoArray(psi, pb + k);
                e.add(vcb.mul(vk.mul(d).add(ps))).intoArray(ex, k);
            }
        }
        for (; i < n; i++) {
            int k = r + i;
            double d = hz[k] - hz[k - nx];
            double e = (ca == null ? ex[k] : ca[k] * ex[k]) + cb[k] * d;
            double ps = bb * psi[pb + k] + c * d;
            if (Math.abs(ps) < TINY) {
                ps = 0.0;
            }
            psi[pb + k] = ps;
            ex[k] = e + cb[k] * (kt * d + ps);
        }
    }
}
