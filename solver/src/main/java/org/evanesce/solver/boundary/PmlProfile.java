package org.evanesce.solver.boundary;

import org.evanesce.solver.grid.Side;

/**
 * The CPML recursive-convolution coefficients of one side, per layer cell (local index ii along
 * the axis normal to the side, counted from the strip's first node {@link #start}).
 * Coefficients follow Roden &amp; Gedney, Microwave Opt. Technol. Lett. 27, 334 (2000):
 * <pre>
 *   b = exp(−(σ'/κ + α')),   c = σ' (b − 1) / (σ' κ + κ² α'),   kappaTerm = 1/κ − 1
 * </pre>
 * with σ' = σΔt/ε0 and α' = αΔt/ε0. An auxiliary ψ is updated as ψ ← bψ + c·∂, and the field
 * update uses ∂/κ + ψ in place of ∂ (∂ the difference of the neighbouring field across the cell).
 *
 * <p>Electric sites sit on nodes (depth (L − ii)/L on a low side, ii/L on a high side); magnetic
 * sites sit half a cell further along the axis. Electric index 0 is the wall (low side) or the
 * inner face (high side) and is never corrected; magnetic indices 0..L−1 all are.
 */
public final class PmlProfile {

    public final Side side;
    public final int layers;
    /** First node index (along the side's normal axis) covered by the strip. */
    public final int start;
    public final double[] bE, cE, kappaTermE;
    public final double[] bH, cH, kappaTermH;

    private PmlProfile(Side side, int layers, int start) {
        this.side = side;
        this.layers = layers;
        this.start = start;
        bE = new double[layers];
        cE = new double[layers];
        kappaTermE = new double[layers];
        bH = new double[layers];
        cH = new double[layers];
        kappaTermH = new double[layers];
    }

    /**
     * @param nodes   number of nodes along the axis normal to {@code side}
     * @param courant S = cΔt/Δ
     */
    public static PmlProfile of(Side side, PmlParameters p, int nodes, double courant) {
        int n = p.layers();
        boolean low = side == Side.LEFT || side == Side.BOTTOM;
        PmlProfile pr = new PmlProfile(side, n, low ? 0 : nodes - 1 - n);
        double sigmaMax = p.sigmaFactor() * 0.8 * (p.order() + 1) * courant; // σmax Δt/ε0 at η = η0
        for (int ii = 0; ii < n; ii++) {
            double dE = low ? (double) (n - ii) / n : (double) ii / n;
            double dH = low ? (n - ii - 0.5) / n : (ii + 0.5) / n;
            boolean usedE = ii >= 1;
            set(pr.bE, pr.cE, pr.kappaTermE, ii, usedE ? dE : 0.0, p, sigmaMax);
            set(pr.bH, pr.cH, pr.kappaTermH, ii, dH, p, sigmaMax);
        }
        return pr;
    }

    private static void set(double[] b, double[] c, double[] kt, int ii, double d, PmlParameters p, double sigmaMax) {
        double g = Math.pow(d, p.order());
        double sigma = sigmaMax * g;
        double kappa = 1.0 + (p.kappaMax() - 1.0) * g;
        double alpha = p.alphaMax() * (1.0 - d);
        b[ii] = Math.exp(-(sigma / kappa + alpha));
        c[ii] = sigma == 0.0 ? 0.0 : sigma * (b[ii] - 1.0) / (sigma * kappa + kappa * kappa * alpha);
        kt[ii] = 1.0 / kappa - 1.0;
    }
}
