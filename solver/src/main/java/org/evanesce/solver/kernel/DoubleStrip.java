package org.evanesce.solver.kernel;

import org.evanesce.solver.boundary.PmlProfile;

/**
 * One side's CPML coefficients in double precision, with the auxiliary ψ of the two components it corrects.
 * Generated from {@link FloatStrip} by tools/regen-double-kernels.sh: edit that file, not this one.
 */
final class DoubleStrip {
    final int start;
    /** Cells per row (x strips) or rows (y strips) covered; ψ is {@code width} wide along the axis. */
    final int width;
    /** Electric local indices corrected: [eFrom, eTo). */
    final int eFrom, eTo;
    final double[] bE, cE, kE, bH, cH, kH;
    /** ψ of the magnetic and electric component this strip corrects; sized to the strip only. */
    final double[] psiH, psiE;

    DoubleStrip(PmlProfile p, int psiLength) {
        start = p.start;
        width = p.width;
        eFrom = p.eFrom;
        eTo = p.eTo;
        bE = DoubleEngine.toDouble(p.bE, p.bE.length);
        cE = DoubleEngine.toDouble(p.cE, p.cE.length);
        kE = DoubleEngine.toDouble(p.kappaTermE, p.kappaTermE.length);
        bH = DoubleEngine.toDouble(p.bH, p.bH.length);
        cH = DoubleEngine.toDouble(p.cH, p.cH.length);
        kH = DoubleEngine.toDouble(p.kappaTermH, p.kappaTermH.length);
        psiH = new double[psiLength];
        psiE = new double[psiLength];
    }

    /**
     * A y strip's six coefficients per cell, {@code [jj*nx + i]} as ψ, for flat runs over its rows
     * ({@link DoubleFlat#yH}, {@link DoubleFlat#yE}); null until {@link #perCell} makes them.
     */
    double[] bEc, cEc, kEc, bHc, cHc, kHc;

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
    private double[] spread(double[] a, int nx) {
        double[] out = new double[width * nx];
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
