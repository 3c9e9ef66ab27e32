package org.evanesce.solver.boundary;

/**
 * Grading of a convolutional PML (Roden &amp; Gedney, Microwave Opt. Technol. Lett. 27, 334 (2000)).
 * With d the depth into the layer as a fraction of its thickness (0 at the inner face, 1 at the
 * outer wall):
 * <pre>
 *   σ(d) = σmax d^m,   κ(d) = 1 + (κmax − 1) d^m,   α(d) = αmax (1 − d)
 *   σmax = sigmaFactor · 0.8 (m + 1) / (η0 Δ)        (Taflove &amp; Hagness ch. 7, the usual optimum)
 * </pre>
 * αmax is given in units of ε0/Δt (a dimensionless rate per time step); the complex-frequency
 * shift it introduces is what absorbs evanescent waves in the layer (Bérenger, IEEE TAP 47 (1999)).
 *
 * @param layers       thickness in cells (≥ 1)
 * @param order        grading exponent m (common practice: 3–4)
 * @param sigmaFactor  σmax relative to the optimum 0.8 (m + 1)/(η0 Δ)
 * @param kappaMax     largest coordinate stretch κ (≥ 1)
 * @param alphaMax     largest complex-frequency shift, α Δt / ε0 (≥ 0)
 */
public record PmlParameters(int layers, double order, double sigmaFactor, double kappaMax, double alphaMax) {

    /** Defaults chosen by the reflection tests of this project (PmlReflectionTest). */
    public static PmlParameters defaults(int layers) {
        return new PmlParameters(layers, 3.0, 1.0, 3.0, 0.02);
    }

    public PmlParameters {
        if (layers < 1) {
            throw new IllegalArgumentException("PML layers " + layers + " must be >= 1");
        }
        if (!(order >= 0 && order <= 10)) {
            throw new IllegalArgumentException(String.format("PML grading order %g must lie in [0, 10]", order));
        }
        if (!(sigmaFactor >= 0) || Double.isInfinite(sigmaFactor)) {
            throw new IllegalArgumentException(String.format("PML sigma factor %g must be finite and >= 0", sigmaFactor));
        }
        if (!(kappaMax >= 1) || Double.isInfinite(kappaMax)) {
            throw new IllegalArgumentException(String.format("PML kappa max %g must be finite and >= 1", kappaMax));
        }
        if (!(alphaMax >= 0) || Double.isInfinite(alphaMax)) {
            throw new IllegalArgumentException(String.format("PML alpha max %g must be finite and >= 0", alphaMax));
        }
    }
}
