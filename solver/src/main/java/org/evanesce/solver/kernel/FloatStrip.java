package org.evanesce.solver.kernel;

import org.evanesce.solver.boundary.PmlProfile;

/** One side's CPML coefficients in single precision, with the auxiliary ψ of the two components it corrects. */
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
        bE = toFloat(p.bE);
        cE = toFloat(p.cE);
        kE = toFloat(p.kappaTermE);
        bH = toFloat(p.bH);
        cH = toFloat(p.cH);
        kH = toFloat(p.kappaTermH);
        psiH = new float[psiLength];
        psiE = new float[psiLength];
    }

    /** Bytes of the two ψ arrays. */
    long bytes() {
        return 2L * Float.BYTES * psiH.length;
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

    private static float[] toFloat(double[] a) {
        float[] f = new float[a.length];
        for (int i = 0; i < a.length; i++) {
            f[i] = (float) a[i];
        }
        return f;
    }
}
