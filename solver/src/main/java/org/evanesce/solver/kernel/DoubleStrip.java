package org.evanesce.solver.kernel;

import org.evanesce.solver.boundary.PmlProfile;

/** One side's CPML coefficients in double precision, with the auxiliary ψ of the two components it corrects. */
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
        bE = p.bE.clone();
        cE = p.cE.clone();
        kE = p.kappaTermE.clone();
        bH = p.bH.clone();
        cH = p.cH.clone();
        kH = p.kappaTermH.clone();
        psiH = new double[psiLength];
        psiE = new double[psiLength];
    }

    /** Bytes of the two ψ arrays. */
    long bytes() {
        return 2L * Double.BYTES * psiH.length;
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
