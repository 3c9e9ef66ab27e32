package org.evanesce.solver.kernel;

import org.evanesce.solver.boundary.PmlProfile;

/**
 * One side's CPML coefficients in single precision, with the auxiliary ψ of the two components it corrects.
 * Edit this file; {@link DoubleStrip} is generated from it (tools/regen-double-kernels.sh).
 */
final class FloatStrip {
    final int start;
    /** Cells per row (x strips) or rows (y strips) covered; ψ is {@code width} wide along the axis. */
    final int width;
    /** Electric local indices corrected: [eFrom, eTo). */
    final int eFrom, eTo;
    final float[] bE, cE, kE, bH, cH, kH;
    /** ψ of the magnetic and electric component this strip corrects; sized to the strip only. */
    final float[] psiH, psiE;

    FloatStrip(PmlProfile p, int psiLength) {
        start = p.start;
        width = p.width;
        eFrom = p.eFrom;
        eTo = p.eTo;
        bE = FloatEngine.toFloat(p.bE, p.bE.length);
        cE = FloatEngine.toFloat(p.cE, p.cE.length);
        kE = FloatEngine.toFloat(p.kappaTermE, p.kappaTermE.length);
        bH = FloatEngine.toFloat(p.bH, p.bH.length);
        cH = FloatEngine.toFloat(p.cH, p.cH.length);
        kH = FloatEngine.toFloat(p.kappaTermH, p.kappaTermH.length);
        psiH = new float[psiLength];
        psiE = new float[psiLength];
    }

    /**
     * A y strip's six coefficients per cell, {@code [jj*nx + i]} as ψ, for flat runs over its rows
     * ({@link FloatFlat#yH}, {@link FloatFlat#yE}); null until {@link #perCell} makes them.
     */
    float[] bEc, cEc, kEc, bHc, cHc, kHc;

    /** Makes the per-cell coefficients of a y strip of rows nx cells wide (once; before the first step). */
    void perCell(int nx) {
        if (bEc != null) {
            return;
        }
        bEc = spread(bE, nx);
        cEc = spread(cE, nx);
        kEc = spread(kE, nx);
        bHc = spread(bH, nx);
        cHc = spread(cH, nx);
        kHc = spread(kH, nx);
    }

    /** Row jj's value of a, once per cell of the row, for the strip's rows. */
    private float[] spread(float[] a, int nx) {
        float[] out = new float[width * nx];
        for (int jj = 0; jj < width; jj++) {
            java.util.Arrays.fill(out, jj * nx, (jj + 1) * nx, a[jj]);
        }
        return out;
    }

    /** Values held: the six coefficient arrays, the two ψ arrays and the per-cell coefficients when made. */
    long values() {
        long perCell = bEc == null ? 0 : 6L * bEc.length;
        return (long) bE.length + cE.length + kE.length + bH.length + cH.length + kH.length + psiH.length + psiE.length
                + perCell;
    }

    /** Writes both ψ arrays for a checkpoint (see {@link StateIO}). */
    void writeState(java.io.DataOutput out) throws java.io.IOException {
        StateIO.write(out, psiH);
        StateIO.write(out, psiE);
    }

    /** Reads what {@link #writeState} wrote. */
    void readState(java.io.DataInput in) throws java.io.IOException {
        StateIO.read(in, psiH);
        StateIO.read(in, psiE);
    }
}
