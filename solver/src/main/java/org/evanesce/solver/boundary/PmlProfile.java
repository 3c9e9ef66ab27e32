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
 * inner face (high side) and is never corrected; magnetic indices 0..L−1 all are. Unused
 * entries hold b = c = kappaTerm = 0, a correction of exactly zero.
 */
public final class PmlProfile {

    public final Side side;
    /** Thickness of the layer in cells. */
    public final int layers;
    /** Cells covered along the normal axis: {@link #layers}, or more when {@link #padded}. */
    public final int width;
    /** First node index (along the side's normal axis) covered by the strip. */
    public final int start;
    /** Electric local indices to correct: [eFrom, eTo). */
    public final int eFrom, eTo;
    /** Coefficients per local index; length width + 1. Magnetic local indices [0, width) are corrected. */
    public final double[] bE, cE, kappaTermE;
    public final double[] bH, cH, kappaTermH;

    private PmlProfile(Side side, int layers, int width, int start, int eFrom, int eTo) {
        this.side = side;
        this.layers = layers;
        this.width = width;
        this.start = start;
        this.eFrom = eFrom;
        this.eTo = eTo;
        bE = new double[width + 1];
        cE = new double[width + 1];
        kappaTermE = new double[width + 1];
        bH = new double[width + 1];
        cH = new double[width + 1];
        kappaTermH = new double[width + 1];
    }

    /**
     * @param nodes   number of nodes along the axis normal to {@code side}
     * @param courant S = cΔt/Δ
     */
    public static PmlProfile of(Side side, PmlParameters p, int nodes, double courant) {
        int n = p.layers();
        boolean low = side == Side.LEFT || side == Side.BOTTOM;
        PmlProfile pr = new PmlProfile(side, n, n, low ? 0 : nodes - 1 - n, 1, n);
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

    /**
     * The same profile widened to {@code w} ≥ layers cells by cells of zero correction (b = c = 0,
     * kappaTerm = 0) on the interior side, so that a vector loop covers the strip with no
     * remainder. The correction of the added cells adds exactly zero to the field.
     *
     * @param nodes number of nodes along the axis; the widened strip must stay inside the walls
     * @return the widened profile, or this one when it would not fit
     */
    public PmlProfile padded(int w, int nodes) {
        if (paddedWidth(layers, w, nodes) == layers) {
            return this;
        }
        boolean low = side == Side.LEFT || side == Side.BOTTOM;
        int shift = low ? 0 : w - layers;
        PmlProfile pr = low ? new PmlProfile(side, layers, w, 0, 1, w + 1)
                : new PmlProfile(side, layers, w, start - shift, 0, w);
        for (int ii = 0; ii < layers; ii++) {
            pr.bH[ii + shift] = bH[ii];
            pr.cH[ii + shift] = cH[ii];
            pr.kappaTermH[ii + shift] = kappaTermH[ii];
            if (ii >= 1) {
                pr.bE[ii + shift] = bE[ii];
                pr.cE[ii + shift] = cE[ii];
                pr.kappaTermE[ii + shift] = kappaTermE[ii];
            }
        }
        return pr;
    }

    /**
     * The width {@link #padded} gives a strip of {@code layers} cells asked to widen to {@code w}:
     * w where it is wider and stays inside the walls ({@code w ≤ nodes − 2}), else layers.
     */
    public static int paddedWidth(int layers, int w, int nodes) {
        return w <= layers || w > nodes - 2 ? layers : w;
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
