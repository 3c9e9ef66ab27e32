package org.evanesce.solver.kernel;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorMask;
import jdk.incubator.vector.VectorOperators;
import jdk.incubator.vector.VectorSpecies;

/**
 * Single-precision Yee update kernels, one grid row at a time. Arrays are row-major,
 * {@code f[j*nx + i]}, all of length nx·ny, and are modified in place. Units are normalised:
 * s = cΔt/Δ (Courant number), H is η0·H, and the electric update is e ← ca·e + cb·curl with the
 * per-cell ca = (1 − L)/(1 + L), cb = s/(εr (1 + L)), L = σΔt/(2ε0εr).
 *
 * <p>Vector and scalar parts use the same operations in the same order (no fused multiply-add),
 * so every cell gets the same bits whichever part computes it. The row kernels take the vector
 * parts' bound {@code vl}: the vector length, or {@link Engine#SCALAR_ONLY} to run the scalar parts
 * alone (what an engine does while a run is young: see {@link Engine#vectorAfter}).
 * Edit this file; {@link DoubleKernels} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatKernels {

    static final VectorSpecies<Float> SP = Lanes.floatSpecies();
    private static final int VL = SP.length();
    /**
     * Values below this magnitude are flushed to zero: 8 orders above the subnormal range (which
     * starts below about 1.2e-38 in single and 2.2e-308 in double precision).
     */
    static final float TINY = 1e-30f;

    private FloatKernels() {
    }

    /** s: Hx(i,j) −= s·(Ez(i,j+1) − Ez(i,j)) for j ≤ ny−2, all i; Hy(i,j) += s·(Ez(i+1,j) − Ez(i,j)) for i ≤ nx−2. */
    static void sH(float[] ez, float[] hx, float[] hy, int nx, int ny, int j, float s, int vl) {
        int r = j * nx;
        int n = nx - 1;
        int i = 0;
        FloatVector vs = vl <= nx ? FloatVector.broadcast(SP, s) : null;
        if (j < ny - 1) {
            for (; i <= n - vl; i += VL) {
                int k = r + i;
                FloatVector e0 = FloatVector.fromArray(SP, ez, k);
                FloatVector e1 = FloatVector.fromArray(SP, ez, k + 1);
                FloatVector en = FloatVector.fromArray(SP, ez, k + nx);
                FloatVector.fromArray(SP, hx, k).sub(vs.mul(en.sub(e0))).intoArray(hx, k);
                FloatVector.fromArray(SP, hy, k).add(vs.mul(e1.sub(e0))).intoArray(hy, k);
            }
            for (; i < n; i++) {
                int k = r + i;
                hx[k] -= s * (ez[k + nx] - ez[k]);
                hy[k] += s * (ez[k + 1] - ez[k]);
            }
            int k = r + n;
            hx[k] -= s * (ez[k + nx] - ez[k]);
        } else {
            for (; i <= n - vl; i += VL) {
                int k = r + i;
                FloatVector e0 = FloatVector.fromArray(SP, ez, k);
                FloatVector e1 = FloatVector.fromArray(SP, ez, k + 1);
                FloatVector.fromArray(SP, hy, k).add(vs.mul(e1.sub(e0))).intoArray(hy, k);
            }
            for (; i < n; i++) {
                int k = r + i;
                hy[k] += s * (ez[k + 1] - ez[k]);
            }
        }
    }

    /**
     * s, interior row 1 ≤ j ≤ ny−2, columns 1..nx−2: Ez ← ca·Ez + cb·((Hy(i) − Hy(i−1)) − (Hx(j) − Hx(j−1))).
     * {@code ca == null} means ca = 1 everywhere (no conductivity): one array less to stream.
     */
    static void sE(float[] ez, float[] hx, float[] hy, float[] ca, float[] cb, int nx, int j, int vl) {
        sE(ez, hx, hy, ca, cb, nx, j, 1, nx - 1, vl);
    }

    /** {@link #sE(float[], float[], float[], float[], float[], int, int, int)} over the columns [i0, end) only. */
    static void sE(float[] ez, float[] hx, float[] hy, float[] ca, float[] cb, int nx, int j, int i0, int end, int vl) {
        int r = j * nx;
        int i = i0;
        if (ca == null) {
            for (; i <= end - vl; i += VL) {
                int k = r + i;
                FloatVector curl = FloatVector.fromArray(SP, hy, k).sub(FloatVector.fromArray(SP, hy, k - 1))
                        .sub(FloatVector.fromArray(SP, hx, k).sub(FloatVector.fromArray(SP, hx, k - nx)));
                FloatVector.fromArray(SP, ez, k).add(FloatVector.fromArray(SP, cb, k).mul(curl)).intoArray(ez, k);
            }
            for (; i < end; i++) {
                int k = r + i;
                float curl = (hy[k] - hy[k - 1]) - (hx[k] - hx[k - nx]);
                ez[k] = ez[k] + cb[k] * curl;
            }
            return;
        }
        for (; i <= end - vl; i += VL) {
            int k = r + i;
            FloatVector curl = FloatVector.fromArray(SP, hy, k).sub(FloatVector.fromArray(SP, hy, k - 1))
                    .sub(FloatVector.fromArray(SP, hx, k).sub(FloatVector.fromArray(SP, hx, k - nx)));
            FloatVector.fromArray(SP, ca, k).mul(FloatVector.fromArray(SP, ez, k))
                    .add(FloatVector.fromArray(SP, cb, k).mul(curl)).intoArray(ez, k);
        }
        for (; i < end; i++) {
            int k = r + i;
            float curl = (hy[k] - hy[k - 1]) - (hx[k] - hx[k - nx]);
            ez[k] = ca[k] * ez[k] + cb[k] * curl;
        }
    }

    /**
     * s, a cell the vector kernel leaves out (a PMC wall, or a Bloch seam): the same update, with the
     * Hy west of column 0 taken as {@code west} (zero for a PMC wall) and the Hx below row 0 as zero.
     */
    static void sEdge(float[] ez, float[] hx, float[] hy, float[] ca, float[] cb, int nx, int i, int j, float west) {
        int k = j * nx + i;
        float hyW = i > 0 ? hy[k - 1] : west;
        float hxS = j > 0 ? hx[k - nx] : 0f;
        float curl = (hy[k] - hyW) - (hx[k] - hxS);
        ez[k] = (ca == null ? ez[k] : ca[k] * ez[k]) + cb[k] * curl;
    }

    /** p, row j ≤ ny−2, columns 0..nx−2: Hz += s·((Ex(j+1) − Ex(j)) − (Ey(i+1) − Ey(i))). */
    static void pH(float[] hz, float[] ex, float[] ey, int nx, int j, float s, int vl) {
        pH(hz, ex, ey, nx, j, 0, nx - 1, s, vl);
    }

    /** {@link #pH(float[], float[], float[], int, int, float, int)} over the columns [i0, n) only. */
    static void pH(float[] hz, float[] ex, float[] ey, int nx, int j, int i0, int n, float s, int vl) {
        int r = j * nx;
        int i = i0;
        FloatVector vs = vl <= nx ? FloatVector.broadcast(SP, s) : null;
        for (; i <= n - vl; i += VL) {
            int k = r + i;
            FloatVector dEx = FloatVector.fromArray(SP, ex, k + nx).sub(FloatVector.fromArray(SP, ex, k));
            FloatVector dEy = FloatVector.fromArray(SP, ey, k + 1).sub(FloatVector.fromArray(SP, ey, k));
            FloatVector.fromArray(SP, hz, k).add(vs.mul(dEx.sub(dEy))).intoArray(hz, k);
        }
        for (; i < n; i++) {
            int k = r + i;
            hz[k] += s * ((ex[k + nx] - ex[k]) - (ey[k + 1] - ey[k]));
        }
    }

    /** p, interior row 1 ≤ j ≤ ny−2, columns 0..nx−2: Ex ← cax·Ex + cbx·(Hz(j) − Hz(j−1)); {@code ca == null} means 1. */
    static void pEx(float[] hz, float[] ex, float[] ca, float[] cb, int nx, int j, int vl) {
        int r = j * nx;
        int n = nx - 1;
        int i = 0;
        if (ca == null) {
            for (; i <= n - vl; i += VL) {
                int k = r + i;
                FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - nx));
                FloatVector.fromArray(SP, ex, k).add(FloatVector.fromArray(SP, cb, k).mul(d)).intoArray(ex, k);
            }
            for (; i < n; i++) {
                int k = r + i;
                ex[k] = ex[k] + cb[k] * (hz[k] - hz[k - nx]);
            }
            return;
        }
        for (; i <= n - vl; i += VL) {
            int k = r + i;
            FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - nx));
            FloatVector.fromArray(SP, ca, k).mul(FloatVector.fromArray(SP, ex, k))
                    .add(FloatVector.fromArray(SP, cb, k).mul(d)).intoArray(ex, k);
        }
        for (; i < n; i++) {
            int k = r + i;
            ex[k] = ca[k] * ex[k] + cb[k] * (hz[k] - hz[k - nx]);
        }
    }

    /** p, row j ≤ ny−2, columns 1..nx−2: Ey ← cay·Ey − cby·(Hz(i) − Hz(i−1)); {@code ca == null} means 1. */
    static void pEy(float[] hz, float[] ey, float[] ca, float[] cb, int nx, int j, int vl) {
        int r = j * nx;
        int end = nx - 1;
        int i = 1;
        if (ca == null) {
            for (; i <= end - vl; i += VL) {
                int k = r + i;
                FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - 1));
                FloatVector.fromArray(SP, ey, k).sub(FloatVector.fromArray(SP, cb, k).mul(d)).intoArray(ey, k);
            }
            for (; i < end; i++) {
                int k = r + i;
                ey[k] = ey[k] - cb[k] * (hz[k] - hz[k - 1]);
            }
            return;
        }
        for (; i <= end - vl; i += VL) {
            int k = r + i;
            FloatVector d = FloatVector.fromArray(SP, hz, k).sub(FloatVector.fromArray(SP, hz, k - 1));
            FloatVector.fromArray(SP, ca, k).mul(FloatVector.fromArray(SP, ey, k))
                    .sub(FloatVector.fromArray(SP, cb, k).mul(d)).intoArray(ey, k);
        }
        for (; i < end; i++) {
            int k = r + i;
            ey[k] = ca[k] * ey[k] - cb[k] * (hz[k] - hz[k - 1]);
        }
    }

    /** p, Ex on a PMC wall row (j = 0 or ny−1) or in the last column of a Bloch run, with Hz below row 0 taken as zero. */
    static void pExEdge(float[] hz, float[] ex, float[] ca, float[] cb, int nx, int i, int j) {
        int k = j * nx + i;
        float hzS = j > 0 ? hz[k - nx] : 0f;
        ex[k] = (ca == null ? ex[k] : ca[k] * ex[k]) + cb[k] * (hz[k] - hzS);
    }

    /** p, Ey in column 0 or nx−1 (a PMC wall or a Bloch seam), with the Hz west of column 0 taken as {@code west}. */
    static void pEyEdge(float[] hz, float[] ey, float[] ca, float[] cb, int nx, int i, int j, float west) {
        int k = j * nx + i;
        float hzW = i > 0 ? hz[k - 1] : west;
        ey[k] = (ca == null ? ey[k] : ca[k] * ey[k]) - cb[k] * (hz[k] - hzW);
    }

    /**
     * CPML correction of a magnetic component along x in rows [j0, j1), cells i = start + ii for ii
     * in [0, width): with d = g(i+1) − g(i), ψ ← bψ + c·d and f += coef·(kappaTerm·d + ψ), where
     * coef is ±s. ψ is indexed {@code psi[j*width + ii]}; values of ψ below {@link #TINY} are set to zero.
     * The loops run down the columns of the strip, a vector of columns at a time, so the
     * coefficients stay in registers and the short strip rows cost no loop set-up each.
     */
    static void pmlXH(float[] f, float[] g, float coef, int nx, int j0, int j1, FloatStrip st, float[] psi, int vl) {
        int w = st.width;
        FloatVector vc = vl <= nx ? FloatVector.broadcast(SP, coef) : null;
        int ii = 0;
        // two vectors of columns per row where they fit: two independent chains per iteration
        for (; ii <= w - 2 * vl; ii += 2 * VL) {
            FloatVector b0 = FloatVector.fromArray(SP, st.bH, ii);
            FloatVector c0 = FloatVector.fromArray(SP, st.cH, ii);
            FloatVector kt0 = FloatVector.fromArray(SP, st.kH, ii);
            FloatVector b1 = FloatVector.fromArray(SP, st.bH, ii + VL);
            FloatVector c1 = FloatVector.fromArray(SP, st.cH, ii + VL);
            FloatVector kt1 = FloatVector.fromArray(SP, st.kH, ii + VL);
            int k = j0 * nx + st.start + ii;
            int p = j0 * w + ii;
            for (int j = j0; j < j1; j++, k += nx, p += w) {
                xh(f, g, vc, psi, b0, c0, kt0, k, p);
                xh(f, g, vc, psi, b1, c1, kt1, k + VL, p + VL);
            }
        }
        for (; ii <= w - vl; ii += VL) {
            FloatVector b = FloatVector.fromArray(SP, st.bH, ii);
            FloatVector c = FloatVector.fromArray(SP, st.cH, ii);
            FloatVector kt = FloatVector.fromArray(SP, st.kH, ii);
            int k = j0 * nx + st.start + ii;
            int p = j0 * w + ii;
            for (int j = j0; j < j1; j++, k += nx, p += w) {
                xh(f, g, vc, psi, b, c, kt, k, p);
            }
        }
        for (; ii < w; ii++) {
            int k = j0 * nx + st.start + ii;
            int p = j0 * w + ii;
            for (int j = j0; j < j1; j++, k += nx, p += w) {
                float d = g[k + 1] - g[k];
                float ps = st.bH[ii] * psi[p] + st.cH[ii] * d;
                if (Math.abs(ps) < TINY) {
                    ps = 0f;
                }
                psi[p] = ps;
                f[k] = f[k] + coef * (st.kH[ii] * d + ps);
            }
        }
    }

    /**
     * CPML correction of an electric component along x in rows [j0, j1), cells i = start + ii for
     * ii in [eFrom, eTo): with d = g(i) − g(i−1), ψ ← bψ + c·d and f ± = cb(i)·(kappaTerm·d + ψ)
     * (subtracted when {@code subtract}). ψ is indexed {@code psi[j*width + ii]}; loops as {@link #pmlXH}.
     */
    static void pmlXE(float[] f, float[] g, float[] cb, boolean subtract, int nx, int j0, int j1, FloatStrip st,
                      float[] psi, int vl) {
        int w = st.width;
        int ii = st.eFrom;
        for (; ii <= st.eTo - 2 * vl; ii += 2 * VL) {
            FloatVector b0 = FloatVector.fromArray(SP, st.bE, ii);
            FloatVector c0 = FloatVector.fromArray(SP, st.cE, ii);
            FloatVector kt0 = FloatVector.fromArray(SP, st.kE, ii);
            FloatVector b1 = FloatVector.fromArray(SP, st.bE, ii + VL);
            FloatVector c1 = FloatVector.fromArray(SP, st.cE, ii + VL);
            FloatVector kt1 = FloatVector.fromArray(SP, st.kE, ii + VL);
            int k = j0 * nx + st.start + ii;
            int p = j0 * w + ii;
            for (int j = j0; j < j1; j++, k += nx, p += w) {
                xe(f, g, cb, subtract, psi, b0, c0, kt0, k, p);
                xe(f, g, cb, subtract, psi, b1, c1, kt1, k + VL, p + VL);
            }
        }
        for (; ii <= st.eTo - vl; ii += VL) {
            FloatVector b = FloatVector.fromArray(SP, st.bE, ii);
            FloatVector c = FloatVector.fromArray(SP, st.cE, ii);
            FloatVector kt = FloatVector.fromArray(SP, st.kE, ii);
            int k = j0 * nx + st.start + ii;
            int p = j0 * w + ii;
            for (int j = j0; j < j1; j++, k += nx, p += w) {
                xe(f, g, cb, subtract, psi, b, c, kt, k, p);
            }
        }
        for (; ii < st.eTo; ii++) {
            int k = j0 * nx + st.start + ii;
            int p = j0 * w + ii;
            for (int j = j0; j < j1; j++, k += nx, p += w) {
                float d = g[k] - g[k - 1];
                float ps = st.bE[ii] * psi[p] + st.cE[ii] * d;
                if (Math.abs(ps) < TINY) {
                    ps = 0f;
                }
                psi[p] = ps;
                float t = cb[k] * (st.kE[ii] * d + ps);
                f[k] = subtract ? f[k] - t : f[k] + t;
            }
        }
    }

    /** One vector of {@link #pmlXH}: cells k.., ψ at p.. (inlined by the compiler). */
    private static void xh(float[] f, float[] g, FloatVector vc, float[] psi, FloatVector b, FloatVector c,
                           FloatVector kt, int k, int p) {
        FloatVector d = FloatVector.fromArray(SP, g, k + 1).sub(FloatVector.fromArray(SP, g, k));
        FloatVector ps = b.mul(FloatVector.fromArray(SP, psi, p)).add(c.mul(d));
        ps = ps.blend(0f, ps.abs().lt(TINY));
        ps.intoArray(psi, p);
        FloatVector.fromArray(SP, f, k).add(vc.mul(kt.mul(d).add(ps))).intoArray(f, k);
    }

    /** One vector of {@link #pmlXE}: cells k.., ψ at p.. (inlined by the compiler). */
    private static void xe(float[] f, float[] g, float[] cb, boolean subtract, float[] psi, FloatVector b,
                           FloatVector c, FloatVector kt, int k, int p) {
        FloatVector d = FloatVector.fromArray(SP, g, k).sub(FloatVector.fromArray(SP, g, k - 1));
        FloatVector ps = b.mul(FloatVector.fromArray(SP, psi, p)).add(c.mul(d));
        ps = ps.blend(0f, ps.abs().lt(TINY));
        ps.intoArray(psi, p);
        FloatVector t = FloatVector.fromArray(SP, cb, k).mul(kt.mul(d).add(ps));
        FloatVector fv = FloatVector.fromArray(SP, f, k);
        (subtract ? fv.sub(t) : fv.add(t)).intoArray(f, k);
    }

    /**
     * CPML correction of a magnetic component along y in row j = start + jj, cells i in [i0, i1):
     * d = g(j+1) − g(j), otherwise as {@link #pmlXH}; ψ is indexed {@code psi[jj*nx + i]}.
     */
    static void pmlYH(float[] f, float[] g, float coef, int nx, int jj, FloatStrip st, float[] psi, int i0, int i1,
                      int vl) {
        int r = (st.start + jj) * nx;
        int pb = jj * nx;
        float b = st.bH[jj];
        float c = st.cH[jj];
        float kt = st.kH[jj];
        FloatVector vb = vl <= nx ? FloatVector.broadcast(SP, b) : null;
        FloatVector vcc = vl <= nx ? FloatVector.broadcast(SP, c) : null;
        FloatVector vk = vl <= nx ? FloatVector.broadcast(SP, kt) : null;
        FloatVector vc = vl <= nx ? FloatVector.broadcast(SP, coef) : null;
        int i = i0;
        for (; i <= i1 - vl; i += VL) {
            int k = r + i;
            FloatVector d = FloatVector.fromArray(SP, g, k + nx).sub(FloatVector.fromArray(SP, g, k));
            FloatVector ps = vb.mul(FloatVector.fromArray(SP, psi, pb + i)).add(vcc.mul(d));
            ps = ps.blend(0f, ps.abs().lt(TINY));
            ps.intoArray(psi, pb + i);
            FloatVector.fromArray(SP, f, k).add(vc.mul(vk.mul(d).add(ps))).intoArray(f, k);
        }
        for (; i < i1; i++) {
            int k = r + i;
            float d = g[k + nx] - g[k];
            float ps = b * psi[pb + i] + c * d;
            if (Math.abs(ps) < TINY) {
                ps = 0f;
            }
            psi[pb + i] = ps;
            f[k] = f[k] + coef * (kt * d + ps);
        }
    }

    /**
     * CPML correction of an electric component along y in row j = start + jj, cells i in [i0, i1):
     * d = g(j) − g(j−1), otherwise as {@link #pmlXE}; ψ is indexed {@code psi[jj*nx + i]}.
     */
    static void pmlYE(float[] f, float[] g, float[] cb, boolean subtract, int nx, int jj, FloatStrip st, float[] psi,
                      int i0, int i1, int vl) {
        int r = (st.start + jj) * nx;
        int pb = jj * nx;
        float b = st.bE[jj];
        float c = st.cE[jj];
        float kt = st.kE[jj];
        FloatVector vb = vl <= nx ? FloatVector.broadcast(SP, b) : null;
        FloatVector vcc = vl <= nx ? FloatVector.broadcast(SP, c) : null;
        FloatVector vk = vl <= nx ? FloatVector.broadcast(SP, kt) : null;
        int i = i0;
        for (; i <= i1 - vl; i += VL) {
            int k = r + i;
            FloatVector d = FloatVector.fromArray(SP, g, k).sub(FloatVector.fromArray(SP, g, k - nx));
            FloatVector ps = vb.mul(FloatVector.fromArray(SP, psi, pb + i)).add(vcc.mul(d));
            ps = ps.blend(0f, ps.abs().lt(TINY));
            ps.intoArray(psi, pb + i);
            FloatVector t = FloatVector.fromArray(SP, cb, k).mul(vk.mul(d).add(ps));
            FloatVector fv = FloatVector.fromArray(SP, f, k);
            (subtract ? fv.sub(t) : fv.add(t)).intoArray(f, k);
        }
        for (; i < i1; i++) {
            int k = r + i;
            float d = g[k] - g[k - nx];
            float ps = b * psi[pb + i] + c * d;
            if (Math.abs(ps) < TINY) {
                ps = 0f;
            }
            psi[pb + i] = ps;
            float t = cb[k] * (kt * d + ps);
            f[k] = subtract ? f[k] - t : f[k] + t;
        }
    }

    /**
     * Sets every nonzero value of a[from, to) with magnitude below {@link #TINY} to zero, so decaying
     * runs never compute on subnormal numbers, and returns the largest magnitude seen (NaN if any
     * value is NaN). vl is the vector bound as for the row kernels: {@link Engine#SCALAR_ONLY} while
     * the run is young runs the scalar loop alone (the vector loop runs its library's slow fallback
     * until the JIT compiles it; issue 18's profile of a 3-second example: 11 % of its samples).
     * Both loops leave zeros as they are (a −0 stays −0), so the bits do not depend on vl. A range shorter
     * than a vector (a row of a narrow grid, a few dispersive cells) takes the scalar loop without touching
     * a vector at all: the flush runs once every many steps, so the JIT compiles it late, and until then
     * even an empty vector loop's set-up and reduction cost more than the few values (the plane-wave
     * plasmon sensor, 4 cells wide: 15 % of its stepping samples on a busy machine).
     */
    static double flush(float[] a, int from, int to, int vl) {
        int i = from;
        float m = 0f;
        if (to - from >= vl) {
            FloatVector vmax = FloatVector.zero(SP);
            for (; i <= to - vl; i += VL) {
                FloatVector v = FloatVector.fromArray(SP, a, i);
                FloatVector av = v.abs();
                VectorMask<Float> small = av.lt(TINY).and(av.compare(VectorOperators.NE, 0f));
                if (small.anyTrue()) {
                    v.blend(0f, small).intoArray(a, i);
                }
                vmax = vmax.max(av);
            }
            m = vmax.reduceLanes(VectorOperators.MAX);
        }
        for (; i < to; i++) {
            float av = Math.abs(a[i]);
            if (av < TINY && av != 0f) {
                a[i] = 0f;
            }
            m = Math.max(m, av);
        }
        return m;
    }
}
