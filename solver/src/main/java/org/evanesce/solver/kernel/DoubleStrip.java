package org.evanesce.solver.kernel;

import org.evanesce.solver.boundary.PmlProfile;

/** One side's CPML coefficients in double precision, with the auxiliary ψ of the two components it corrects. */
final class DoubleStrip {
    final int start;
    final int layers;
    final double[] bE, cE, kE, bH, cH, kH;
    /** ψ of the magnetic and electric component this strip corrects; sized to the strip only. */
    final double[] psiH, psiE;

    DoubleStrip(PmlProfile p, int psiLength) {
        start = p.start;
        layers = p.layers;
        bE = p.bE.clone();
        cE = p.cE.clone();
        kE = p.kappaTermE.clone();
        bH = p.bH.clone();
        cH = p.cH.clone();
        kH = p.kappaTermH.clone();
        psiH = new double[psiLength];
        psiE = new double[psiLength];
    }

}
