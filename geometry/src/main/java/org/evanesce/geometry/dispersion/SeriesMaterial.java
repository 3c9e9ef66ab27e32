package org.evanesce.geometry.dispersion;

import java.util.List;
import org.evanesce.geometry.Complex;

/**
 * Materials in series across a field site's cell (layers crossed by the field one after the other):
 * 1/ε(ω) = Σ f_k/ε_k(ω), the harmonic mean of the parts' permittivities. It is a rational function of ω
 * with poles of its own (not a sum of the parts' Drude and Lorentz terms), so the engine does not turn it
 * into one {@link DispersiveMaterial}: it keeps one sub-field per part, all driven by the same ∇×H (the
 * same D), and gives the site E = Σ f_k E_k ({@link SeriesCoefficients}). Each part is passive and stable
 * on its own; so is their series connection.
 *
 * @param name      a label for messages
 * @param parts     the constituents (copied), at least one
 * @param fractions each part's fraction of the cell, &gt; 0, adding up to 1 within 1e-9
 */
public record SeriesMaterial(String name, List<DispersiveMaterial> parts, double[] fractions) {

    /** How far the fractions' sum may be from 1: round-off of a rasteriser's fill fractions. */
    static final double SUM_TOLERANCE = 1e-9;

    public SeriesMaterial {
        parts = List.copyOf(parts);
        fractions = fractions.clone();
        if (parts.isEmpty() || parts.size() != fractions.length) {
            throw new IllegalArgumentException(String.format("series material '%s': %d parts and %d fractions; need the"
                    + " same number, ≥ 1", name, parts.size(), fractions.length));
        }
        double sum = 0;
        for (double f : fractions) {
            if (!(f > 0) || f > 1) {
                throw new IllegalArgumentException(String.format("series material '%s': fraction %g must lie in (0, 1]",
                        name, f));
            }
            sum += f;
        }
        if (Math.abs(sum - 1) > SUM_TOLERANCE) {
            throw new IllegalArgumentException(String.format("series material '%s': fractions add up to %.12g, not 1",
                    name, sum));
        }
    }

    @Override
    public double[] fractions() {
        return fractions.clone();
    }

    /** ε(ω) = 1/Σ f_k/ε_k(ω) of the continuous models. */
    public Complex permittivity(double omega) {
        Complex inv = Complex.ZERO;
        for (int k = 0; k < fractions.length; k++) {
            inv = inv.plus(parts.get(k).permittivity(omega).reciprocal().times(fractions[k]));
        }
        return inv.reciprocal();
    }

    /**
     * What the engine realises at ω and step Δt: 1/Σ f_k/ε_d,k(ω, Δt), i.e. the continuous value at the
     * warped frequency (every part's update is the same bilinear transform).
     */
    public Complex discretePermittivity(double omega, double dt) {
        return permittivity(DispersiveMaterial.warpedFrequency(omega, dt));
    }

    /** The high-frequency value 1/Σ f_k/ε∞_k: the permittivity of the site's stand-in entry in the grid's table. */
    public double epsInfinity() {
        double inv = 0;
        for (int k = 0; k < fractions.length; k++) {
            inv += fractions[k] / parts.get(k).epsInfinity();
        }
        return 1 / inv;
    }

    /** Values of state per cell in the engine: the site's E⁰, then per part its E⁰ and its poles' state. */
    public int stateSize() {
        int n = 1;
        for (DispersiveMaterial p : parts) {
            n += 1 + p.drude().size() + 2 * p.lorentz().size();
        }
        return n;
    }
}
