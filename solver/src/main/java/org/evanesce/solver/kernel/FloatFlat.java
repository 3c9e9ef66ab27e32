package org.evanesce.solver.kernel;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * The plain Yee updates of {@link FloatKernels} over a flat range of cells [k0, k1) that spans whole
 * rows, in one loop: for narrow grids, whose rows of a few cells are mostly loop set-up and scalar
 * tails when updated one at a time. Each cell gets the operations of the row kernel in the same
 * order, with the same vector and scalar parts, so the bits are the same; but a cell in column 0 or
 * nx−1 sees the neighbour across the row's end (the last cell of the row before, the first of the
 * row after) where the row kernel leaves that cell out or takes a wall's or seam's value. The
 * engines keep those cells' old values before the flat pass and put them right after it, exactly as
 * the row path computes them ({@link FloatS}, {@link FloatP}).
 * Edit this file; {@link DoubleFlat} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatFlat {

    private static final VectorSpecies<Float> SP = FloatKernels.SP;
    private static final int VL = SP.length();

    private FloatFlat() {
    }

    /**
     * s, cells [k0, k1) of rows ≤ ny−2: Hx −= s·(Ez(j+1) − Ez(j)) and Hy += s·(Ez(k+1) − Ez(k)), as
     * {@link FloatKernels#sH}; the last column's Hy is wrong (it reads the next row's first Ez).
     */
    static void sH(float[] ez, float[] hx, float[] hy, int nx, int k0, int k1, float s, int vl) {
        int k = k0;
        if (vl <= k1 - k0) {
            FloatVector vs = FloatVector.broadcast(SP, s);
            for (; k <= k1 - vl; k += VL) {
                FloatVector e0 = FloatVector.fromArray(SP, ez, k);
                FloatVector e1 = FloatVector.fromArray(SP, ez, k + 1);
                FloatVector en = FloatVector.fromArray(SP, ez, k + nx);
                FloatVector.fromArray(SP, hx, k).sub(vs.mul(en.sub(e0))).intoArray(hx, k);
                FloatVector.fromArray(SP, hy, k).add(vs.mul(e1.sub(e0))).intoArray(hy, k);
            }
        }
        for (; k < k1; k++) {
            hx[k] -= s * (ez[k + nx] - ez[k]);
            hy[k] += s * (ez[k + 1] - ez[k]);
        }
    }

    /**
     * s, cells [k0, k1) of interior rows: Ez ← ca·Ez + cb·((Hy(k) − Hy(k−1)) − (Hx(j) − Hx(j−1))), as
     * {@link FloatKernels#sE}; column 0 is wrong (it reads the row before's last Hy), and columns 0 and
     * nx−1 are updated though a wall may hold them.
     */
    static void sE(float[] ez, float[] hx, float[] hy, float[] ca, float[] cb, int nx, int k0, int k1, int vl) {
        // the row kernel over one "row" that starts at k0 and is k1 − k0 long
        FloatKernels.sE(ez, hx, hy, ca, cb, nx, 0, k0, k1, vl);
    }

    /** p, cells [k0, k1) of rows ≤ ny−2: Hz += s·((Ex(j+1) − Ex(j)) − (Ey(k+1) − Ey(k))); the last column is wrong. */
    static void pH(float[] hz, float[] ex, float[] ey, int nx, int k0, int k1, float s, int vl) {
        int k = k0;
        if (vl <= k1 - k0) {
            FloatVector vs = FloatVector.broadcast(SP, s);
            for (; k <= k1 - vl; k += VL) {
                FloatVector dEx = FloatVector.fromArray(SP, ex, k + nx).sub(FloatVector.fromArray(SP, ex, k));
                FloatVector dEy = FloatVector.fromArray(SP, ey, k + 1).sub(FloatVector.fromArray(SP, ey, k));
                FloatVector.fromArray(SP, hz, k).add(vs.mul(dEx.sub(dEy))).intoArray(hz, k);
            }
        }
        for (; k < k1; k++) {
            hz[k] += s * ((ex[k + nx] - ex[k]) - (ey[k + 1] - ey[k]));
        }
    }

    /** p, cells [k0, k1) of interior rows: Ex ← cax·Ex + cbx·(Hz(j) − Hz(j−1)), as {@link FloatKernels#pEx}; every column. */
    static void pEx(float[] hz, float[] ex, float[] ca, float[] cb, int nx, int k0, int k1, int vl) {
        int k = k0;
        if (ca == null) {
            for (; k <= k1 - vl; k += VL) {
                FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - nx));
                FloatVector.fromArray(SP, ex, k).add(FloatVector.fromArray(SP, cb, k).mul(d)).intoArray(ex, k);
            }
            for (; k < k1; k++) {
                ex[k] = ex[k] + cb[k] * (hz[k] - hz[k - nx]);
            }
            return;
        }
        for (; k <= k1 - vl; k += VL) {
            FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - nx));
            FloatVector.fromArray(SP, ca, k).mul(FloatVector.fromArray(SP, ex, k))
                    .add(FloatVector.fromArray(SP, cb, k).mul(d)).intoArray(ex, k);
        }
        for (; k < k1; k++) {
            ex[k] = ca[k] * ex[k] + cb[k] * (hz[k] - hz[k - nx]);
        }
    }

    /**
     * p, cells [k0, k1) of rows ≤ ny−2: Ey ← cay·Ey − cby·(Hz(k) − Hz(k−1)), as {@link FloatKernels#pEy};
     * column 0 is wrong (it reads the row before's last Hz).
     */
    static void pEy(float[] hz, float[] ey, float[] ca, float[] cb, int k0, int k1, int vl) {
        int k = k0;
        if (ca == null) {
            for (; k <= k1 - vl; k += VL) {
                FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - 1));
                FloatVector.fromArray(SP, ey, k).sub(FloatVector.fromArray(SP, cb, k).mul(d)).intoArray(ey, k);
            }
            for (; k < k1; k++) {
                ey[k] = ey[k] - cb[k] * (hz[k] - hz[k - 1]);
            }
            return;
        }
        for (; k <= k1 - vl; k += VL) {
            FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - 1));
            FloatVector.fromArray(SP, ca, k).mul(FloatVector.fromArray(SP, ey, k))
                    .sub(FloatVector.fromArray(SP, cb, k).mul(d)).intoArray(ey, k);
        }
        for (; k < k1; k++) {
            ey[k] = ca[k] * ey[k] - cb[k] * (hz[k] - hz[k - 1]);
        }
    }

    /**
     * CPML correction of a magnetic component along y over cells [k0, k1) of one strip's rows, as
     * {@link FloatKernels#pmlYH} does row by row: d = g(k+nx) − g(k), ψ ← bψ + c·d (flushed below
     * {@link FloatKernels#TINY}), f += coef·(kappaTerm·d + ψ), with cell k's ψ and per-cell coefficients
     * ({@link FloatStrip#perCell}) at k − base.
     */
    static void yH(float[] f, float[] g, float coef, int nx, int k0, int k1, int base, FloatStrip st, int vl) {
        float[] psi = st.psiH;
        float[] b = st.bHc;
        float[] c = st.cHc;
        float[] kt = st.kHc;
        int k = k0;
        if (vl <= k1 - k0) {
            FloatVector vc = FloatVector.broadcast(SP, coef);
            for (; k <= k1 - vl; k += VL) {
                int p = k - base;
                FloatVector d = FloatVector.fromArray(SP, g, k + nx).sub(FloatVector.fromArray(SP, g, k));
                FloatVector ps = FloatVector.fromArray(SP, b, p).mul(FloatVector.fromArray(SP, psi, p))
                        .add(FloatVector.fromArray(SP, c, p).mul(d));
                ps = ps.blend(0f, ps.abs().lt(FloatKernels.TINY));
                ps.intoArray(psi, p);
                FloatVector.fromArray(SP, f, k).add(vc.mul(FloatVector.fromArray(SP, kt, p).mul(d).add(ps)))
                        .intoArray(f, k);
            }
        }
        for (; k < k1; k++) {
            int p = k - base;
            float d = g[k + nx] - g[k];
            float ps = b[p] * psi[p] + c[p] * d;
            if (Math.abs(ps) < FloatKernels.TINY) {
                ps = 0f;
            }
            psi[p] = ps;
            f[k] = f[k] + coef * (kt[p] * d + ps);
        }
    }

    /**
     * CPML correction of an electric component along y over cells [k0, k1) of one strip's rows, as
     * {@link FloatKernels#pmlYE} does row by row: d = g(k) − g(k−nx), f ± = cb·(kappaTerm·d + ψ)
     * (subtracted when {@code subtract}); ψ and coefficients as {@link #yH}.
     */
    static void yE(float[] f, float[] g, float[] cb, boolean subtract, int nx, int k0, int k1, int base, FloatStrip st,
                   int vl) {
        float[] psi = st.psiE;
        float[] b = st.bEc;
        float[] c = st.cEc;
        float[] kt = st.kEc;
        int k = k0;
        for (; k <= k1 - vl; k += VL) {
            int p = k - base;
            FloatVector d = FloatVector.fromArray(SP, g, k).sub(FloatVector.fromArray(SP, g, k - nx));
            FloatVector ps = FloatVector.fromArray(SP, b, p).mul(FloatVector.fromArray(SP, psi, p))
                    .add(FloatVector.fromArray(SP, c, p).mul(d));
            ps = ps.blend(0f, ps.abs().lt(FloatKernels.TINY));
            ps.intoArray(psi, p);
            FloatVector t = FloatVector.fromArray(SP, cb, k).mul(FloatVector.fromArray(SP, kt, p).mul(d).add(ps));
            FloatVector fv = FloatVector.fromArray(SP, f, k);
            (subtract ? fv.sub(t) : fv.add(t)).intoArray(f, k);
        }
        for (; k < k1; k++) {
            int p = k - base;
            float d = g[k] - g[k - nx];
            float ps = b[p] * psi[p] + c[p] * d;
            if (Math.abs(ps) < FloatKernels.TINY) {
                ps = 0f;
            }
            psi[p] = ps;
            float t = cb[k] * (kt[p] * d + ps);
            f[k] = subtract ? f[k] - t : f[k] + t;
        }
    }
}
