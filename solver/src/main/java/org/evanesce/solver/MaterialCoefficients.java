package org.evanesce.solver;

import java.util.List;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.PhysicalConstants;

/**
 * The electric update coefficients of each material, e ← ca·e + cb·curl in the kernels'
 * normalised units (H stored as η0·H):
 * <pre>
 *   ca = (1 − L)/(1 + L),   cb = S/(εr (1 + L)),   L = σΔt/(2ε0εr)
 * </pre>
 * (Taflove &amp; Hagness, Computational Electrodynamics, 3rd ed. 2005, ch. 3, the lossy-dielectric
 * update, chapter from memory; here with H scaled by η0 and S = c0Δt/Δ). Computed here, beside the physical constants, once
 * per material; the kernels spread them over the cells. A perfect conductor ({@link Material#isPerfectConductor})
 * gets ca = cb = 0, the limit σ → ∞ of cb and the value that holds E at zero on its sites from the first step (the
 * limit of ca is −1, which would leave any E present there flipping sign each step).
 */
public final class MaterialCoefficients {

    private MaterialCoefficients() {
    }

    /**
     * {ca, cb}, each indexed like {@code materials}.
     *
     * @param courant S = c0Δt/Δ
     * @param dt      the time step, seconds
     */
    public static double[][] of(List<Material> materials, double courant, double dt) {
        int nm = materials.size();
        double[] ca = new double[nm];
        double[] cb = new double[nm];
        for (int m = 0; m < nm; m++) {
            Material mat = materials.get(m);
            if (mat.isPerfectConductor()) {
                ca[m] = 0;
                cb[m] = 0;
                continue;
            }
            double l = mat.conductivity() * dt / (2 * PhysicalConstants.EPS0 * mat.relativePermittivity());
            ca[m] = (1 - l) / (1 + l);
            cb[m] = courant / (mat.relativePermittivity() * (1 + l));
        }
        return new double[][] {ca, cb};
    }
}
