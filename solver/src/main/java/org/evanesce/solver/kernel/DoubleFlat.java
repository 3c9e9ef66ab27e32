package org.evanesce.solver.kernel;

import jdk.incubator.vector.DoubleVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * The plain Yee updates of {@link DoubleKernels} over a flat range of cells [k0, k1) that spans whole
 * rows, in one loop: for narrow grids, whose rows of a few cells are mostly loop set-up and scalar
 * tails when updated one at a time. Each cell gets the operations of the row kernel in the same
 * order, with the same vector and scalar parts, so the bits are the same; but a cell in column 0 or
 * nx−1 sees the neighbour across the row's end (the last cell of the row before, the first of the
 * row after) where the row kernel leaves that cell out or takes a wall's or seam's value. The
 * engines keep those cells' old values before the flat pass and put them right after it, exactly as
 * the row path computes them ({@link DoubleS}, {@link DoubleP}).
 * Generated from {@link FloatFlat} by tools/regen-double-kernels.sh: edit that file, not this one.
 */
final class DoubleFlat {

    private static final VectorSpecies<Double> SP = DoubleKernels.SP;
    private static final int VL = SP.length();

    private DoubleFlat() {
    }

    /**
     * s, cells [k0, k1) of rows ≤ ny−2: Hx −= s·(Ez(j+1) − Ez(j)) and Hy += s·(Ez(k+1) − Ez(k)), as
     * {@link DoubleKernels#sH}; the last column's Hy is wrong (it reads the next row's first Ez).
     */
    static void sH(double[] ez, double[] hx, double[] hy, int nx, int k0, int k1, double s, int vl) {
        int k = k0;
        if (vl <= k1 - k0) {
            DoubleVector vs = DoubleVector.broadcast(SP, s);
            for (; k <= k1 - vl; k += VL) {
                DoubleVector e0 = DoubleVector.fromArray(SP, ez, k);
                DoubleVector e1 = DoubleVector.fromArray(SP, ez, k + 1);
                DoubleVector en = DoubleVector.fromArray(SP, ez, k + nx);
                DoubleVector.fromArray(SP, hx, k).sub(vs.mul(en.sub(e0))).intoArray(hx, k);
                DoubleVector.fromArray(SP, hy, k).add(vs.mul(e1.sub(e0))).intoArray(hy, k);
            }
        }
        for (; k < k1; k++) {
            hx[k] -= s * (ez[k + nx] - ez[k]);
            hy[k] += s * (ez[k + 1] - ez[k]);
        }
    }

    /**
     * s, cells [k0, k1) of interior rows: Ez ← ca·Ez + cb·((Hy(k) − Hy(k−1)) − (Hx(j) − Hx(j−1))), as
     * {@link DoubleKernels#sE}; column 0 is wrong (it reads the row before's last Hy), and columns 0 and
     * nx−1 are updated though a wall may hold them.
     */
    static void sE(double[] ez, double[] hx, double[] hy, double[] ca, double[] cb, int nx, int k0, int k1, int vl) {
        // the row kernel over one "row" that starts at k0 and is k1 − k0 long
        DoubleKernels.sE(ez, hx, hy, ca, cb, nx, 0, k0, k1, vl);
    }

    /** p, cells [k0, k1) of rows ≤ ny−2: Hz += s·((Ex(j+1) − Ex(j)) − (Ey(k+1) − Ey(k))); the last column is wrong. */
    static void pH(double[] hz, double[] ex, double[] ey, int nx, int k0, int k1, double s, int vl) {
        int k = k0;
        if (vl <= k1 - k0) {
            DoubleVector vs = DoubleVector.broadcast(SP, s);
            for (; k <= k1 - vl; k += VL) {
                DoubleVector dEx = DoubleVector.fromArray(SP, ex, k + nx).sub(DoubleVector.fromArray(SP, ex, k));
                DoubleVector dEy = DoubleVector.fromArray(SP, ey, k + 1).sub(DoubleVector.fromArray(SP, ey, k));
                DoubleVector.fromArray(SP, hz, k).add(vs.mul(dEx.sub(dEy))).intoArray(hz, k);
            }
        }
        for (; k < k1; k++) {
            hz[k] += s * ((ex[k + nx] - ex[k]) - (ey[k + 1] - ey[k]));
        }
    }

    /** p, cells [k0, k1) of interior rows: Ex ← cax·Ex + cbx·(Hz(j) − Hz(j−1)), as {@link DoubleKernels#pEx}; every column. */
    static void pEx(double[] hz, double[] ex, double[] ca, double[] cb, int nx, int k0, int k1, int vl) {
        int k = k0;
        if (ca == null) {
            for (; k <= k1 - vl; k += VL) {
                DoubleVector d = DoubleVector.fromArray(SP, hz, k).sub(DoubleVector.fromArray(SP, hz, k - nx));
                DoubleVector.fromArray(SP, ex, k).add(DoubleVector.fromArray(SP, cb, k).mul(d)).intoArray(ex, k);
            }
            for (; k < k1; k++) {
                ex[k] = ex[k] + cb[k] * (hz[k] - hz[k - nx]);
            }
            return;
        }
        for (; k <= k1 - vl; k += VL) {
            DoubleVector d = DoubleVector.fromArray(SP, hz, k).sub(DoubleVector.fromArray(SP, hz, k - nx));
            DoubleVector.fromArray(SP, ca, k).mul(DoubleVector.fromArray(SP, ex, k))
                    .add(DoubleVector.fromArray(SP, cb, k).mul(d)).intoArray(ex, k);
        }
        for (; k < k1; k++) {
            ex[k] = ca[k] * ex[k] + cb[k] * (hz[k] - hz[k - nx]);
        }
    }

    /**
     * p, cells [k0, k1) of rows ≤ ny−2: Ey ← cay·Ey − cby·(Hz(k) − Hz(k−1)), as {@link DoubleKernels#pEy};
     * column 0 is wrong (it reads the row before's last Hz).
     */
    static void pEy(double[] hz, double[] ey, double[] ca, double[] cb, int k0, int k1, int vl) {
        int k = k0;
        if (ca == null) {
            for (; k <= k1 - vl; k += VL) {
                DoubleVector d = DoubleVector.fromArray(SP, hz, k).sub(DoubleVector.fromArray(SP, hz, k - 1));
                DoubleVector.fromArray(SP, ey, k).sub(DoubleVector.fromArray(SP, cb, k).mul(d)).intoArray(ey, k);
            }
            for (; k < k1; k++) {
                ey[k] = ey[k] - cb[k] * (hz[k] - hz[k - 1]);
            }
            return;
        }
        for (; k <= k1 - vl; k += VL) {
            DoubleVector d = DoubleVector.fromArray(SP, hz, k).sub(DoubleVector.fromArray(SP, hz, k - 1));
            DoubleVector.fromArray(SP, ca, k).mul(DoubleVector.fromArray(SP, ey, k))
                    .sub(DoubleVector.fromArray(SP, cb, k).mul(d)).intoArray(ey, k);
        }
        for (; k < k1; k++) {
            ey[k] = ca[k] * ey[k] - cb[k] * (hz[k] - hz[k - 1]);
        }
    }

    /**
     * CPML correction of a magnetic component along y over cells [k0, k1) of one strip's rows, as
     * {@link DoubleKernels#pmlYH} does row by row: d = g(k+nx) − g(k), ψ ← bψ + c·d (flushed below
     * {@link DoubleKernels#TINY}), f += coef·(kappaTerm·d + ψ), with cell k's ψ and per-cell coefficients
     * ({@link DoubleStrip#perCell}) at k − base.
     */
    static void yH(double[] f, double[] g, double coef, int nx, int k0, int k1, int base, DoubleStrip st, int vl) {
        double[] psi = st.psiH;
        double[] b = st.bHc;
        double[] c = st.cHc;
        double[] kt = st.kHc;
        int k = k0;
        if (vl <= k1 - k0) {
            DoubleVector vc = DoubleVector.broadcast(SP, coef);
            for (; k <= k1 - vl; k += VL) {
                int p = k - base;
                DoubleVector d = DoubleVector.fromArray(SP, g, k + nx).sub(DoubleVector.fromArray(SP, g, k));
                DoubleVector ps = DoubleVector.fromArray(SP, b, p).mul(DoubleVector.fromArray(SP, psi, p))
                        .add(DoubleVector.fromArray(SP, c, p).mul(d));
                ps = ps.blend(0.0, ps.abs().lt(DoubleKernels.TINY));
                ps.intoArray(psi, p);
                DoubleVector.fromArray(SP, f, k).add(vc.mul(DoubleVector.fromArray(SP, kt, p).mul(d).add(ps)))
                        .intoArray(f, k);
            }
        }
        for (; k < k1; k++) {
            int p = k - base;
            double d = g[k + nx] - g[k];
            double ps = b[p] * psi[p] + c[p] * d;
            if (Math.abs(ps) < DoubleKernels.TINY) {
                ps = 0.0;
            }
            psi[p] = ps;
            f[k] = f[k] + coef * (kt[p] * d + ps);
        }
    }

    /**
     * CPML correction of an electric component along y over cells [k0, k1) of one strip's rows, as
     * {@link DoubleKernels#pmlYE} does row by row: d = g(k) − g(k−nx), f ± = cb·(kappaTerm·d + ψ)
     * (subtracted when {@code subtract}); ψ and coefficients as {@link #yH}.
     */
    static void yE(double[] f, double[] g, double[] cb, boolean subtract, int nx, int k0, int k1, int base, DoubleStrip st,
                   int vl) {
        double[] psi = st.psiE;
        double[] b = st.bEc;
        double[] c = st.cEc;
        double[] kt = st.kEc;
        int k = k0;
        for (; k <= k1 - vl; k += VL) {
            int p = k - base;
            DoubleVector d = DoubleVector.fromArray(SP, g, k).sub(DoubleVector.fromArray(SP, g, k - nx));
            DoubleVector ps = DoubleVector.fromArray(SP, b, p).mul(DoubleVector.fromArray(SP, psi, p))
                    .add(DoubleVector.fromArray(SP, c, p).mul(d));
            ps = ps.blend(0.0, ps.abs().lt(DoubleKernels.TINY));
            ps.intoArray(psi, p);
            DoubleVector t = DoubleVector.fromArray(SP, cb, k).mul(DoubleVector.fromArray(SP, kt, p).mul(d).add(ps));
            DoubleVector fv = DoubleVector.fromArray(SP, f, k);
            (subtract ? fv.sub(t) : fv.add(t)).intoArray(f, k);
        }
        for (; k < k1; k++) {
            int p = k - base;
            double d = g[k] - g[k - nx];
            double ps = b[p] * psi[p] + c[p] * d;
            if (Math.abs(ps) < DoubleKernels.TINY) {
                ps = 0.0;
            }
            psi[p] = ps;
            double t = cb[k] * (kt[p] * d + ps);
            f[k] = subtract ? f[k] - t : f[k] + t;
        }
    }
}
