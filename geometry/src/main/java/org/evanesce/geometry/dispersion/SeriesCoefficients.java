package org.evanesce.geometry.dispersion;

/**
 * The time stepping of a {@link SeriesMaterial}: one sub-field per part, each updated as a cell of that
 * part alone would be ({@link AdeCoefficients}), all driven by the same curl of H, and the site's field
 * their fraction-weighted sum.
 *
 * <h2>How the engine applies it</h2>
 * The site's entry in the grid's table is a lossless stand-in: ca = 1, cb_ref = S/ε_ref with
 * ε_ref = {@link SeriesMaterial#epsInfinity()}. The ordinary update (with CPML corrections and sources,
 * all with cb_ref) leaves E_ord = E⁰ + cb_ref·X, X being everything the update adds; a post-pass then
 * gives each part k the same X through its own coefficients, r_k = cb_k/cb_ref:
 * <pre>
 *   d = E_ord − E⁰
 *   E_k,ord = ca_k E_k⁰ + r_k d,   E_k¹ = postPass_k(E_k,ord)   (poles, as in {@link AdeCoefficients#postPass})
 *   E¹ = Σ f_k E_k¹,   E⁰ ← E¹
 * </pre>
 * For fields ∝ exp(−iωnΔt) each part obeys −iΩ ε0 ε_d,k E_k = ∇×H with the same ∇×H, so
 * E = Σ f_k E_k = ∇×H Σ f_k/(−iΩ ε0 ε_d,k): the site realises exactly 1/ε_d = Σ f_k/ε_d,k
 * ({@link SeriesMaterial#discretePermittivity}). State per cell, in this order:
 * <pre>
 *   [ E⁰,  then per part: E_k⁰, j_1 … (Drude), j_1, q_1, … (Lorentz) ]
 * </pre>
 *
 * @param fractions f_k (copied)
 * @param parts     each part's ADE coefficients (copied)
 * @param ratios    r_k = cb_k/cb_ref (copied)
 * @param cb        cb_ref = S/ε_ref, the stand-in's cb
 */
public record SeriesCoefficients(double[] fractions, AdeCoefficients[] parts, double[] ratios, double cb) {

    public SeriesCoefficients {
        fractions = fractions.clone();
        parts = parts.clone();
        ratios = ratios.clone();
    }

    /** The coefficients of {@code material} at Courant number S and step Δt (s). */
    public static SeriesCoefficients of(SeriesMaterial material, double courant, double dt) {
        double cbRef = courant / material.epsInfinity();
        int n = material.parts().size();
        AdeCoefficients[] parts = new AdeCoefficients[n];
        double[] ratios = new double[n];
        for (int k = 0; k < n; k++) {
            parts[k] = AdeCoefficients.of(material.parts().get(k), courant, dt);
            ratios[k] = parts[k].cb() / cbRef;
        }
        return new SeriesCoefficients(material.fractions(), parts, ratios, cbRef);
    }

    @Override
    public double[] fractions() {
        return fractions.clone();
    }

    @Override
    public AdeCoefficients[] parts() {
        return parts.clone();
    }

    @Override
    public double[] ratios() {
        return ratios.clone();
    }

    /** Values of state per cell (see the class comment). */
    public int stateSize() {
        int s = 1;
        for (AdeCoefficients p : parts) {
            s += 1 + p.drudeCount() + 2 * p.lorentzCount();
        }
        return s;
    }

    /**
     * One cell's post-pass, the reference the kernels port: from E_ord returns E¹ and advances the state in
     * {@code state[offset … offset + stateSize())} in place (parts in order; each part's poles as
     * {@link AdeCoefficients#postPass}, after its E_k⁰ slot).
     */
    public static double postPass(SeriesCoefficients c, double[] state, int offset, double eOrdinary) {
        double d = eOrdinary - state[offset];
        double e1 = 0;
        int s = offset + 1;
        for (int k = 0; k < c.parts.length; k++) {
            AdeCoefficients p = c.parts[k];
            double ek = p.ca() * state[s] + c.ratios[k] * d;
            if (p.stateSize() > 0) {
                ek = AdeCoefficients.postPass(p, state, s, ek);
            } else {
                state[s] = ek;
            }
            e1 += c.fractions[k] * ek;
            s += 1 + p.drudeCount() + 2 * p.lorentzCount();
        }
        state[offset] = e1;
        return e1;
    }
}
