package org.evanesce.geometry.dispersion;

import java.util.ArrayList;
import java.util.List;

/**
 * The permittivity a field site gets where a face between materials cuts the cell around it, for a
 * face parallel to a grid axis (a planar face on the grid). With f_k the fraction of the site's cell
 * that material k fills:
 * <ul>
 * <li>a field <b>tangential</b> to the face sees the constituents side by side (the same E in each): the
 *     arithmetic mean ε = Σ f_k ε_k(ω), {@link #parallel}, again a Drude–Lorentz material;</li>
 * <li>a field <b>normal</b> to the face sees them one after the other (the same D in each): the harmonic
 *     mean 1/ε = Σ f_k/ε_k(ω), {@link #series}, which the engine steps as one sub-field per constituent
 *     ({@link SeriesCoefficients}).</li>
 * </ul>
 * Taken over the cell of each site (Ex, Ey, Ez at their own points), these are the effective permittivities
 * of a layered medium (the arithmetic mean for E along the layers, the harmonic mean across them: common
 * practice; A. Farjadpour et al., Opt. Lett. 31, 2972 (2006), for the same pair of means in subpixel
 * averaging), and with them a planar face anywhere in a cell is second order
 * ({@code KretschmannConvergenceTest}).
 */
public final class FaceMixtures {

    private FaceMixtures() {
    }

    /**
     * ε(ω) = Σ f_k ε_k(ω) as a Drude–Lorentz material: ε∞ and σ averaged, each Drude ωp² and each Lorentz
     * weight multiplied by its material's fraction; exact at every frequency and passive where the parts are.
     *
     * @param fractions each part's fraction of the cell, ≥ 0 (they should add up to 1)
     */
    public static DispersiveMaterial parallel(String name, List<DispersiveMaterial> parts, double[] fractions) {
        check(parts, fractions);
        double epsInf = 0;
        double sigma = 0;
        List<DrudeTerm> drude = new ArrayList<>();
        List<LorentzTerm> lorentz = new ArrayList<>();
        for (int k = 0; k < fractions.length; k++) {
            DispersiveMaterial d = parts.get(k);
            double f = fractions[k];
            epsInf += f * d.epsInfinity();
            sigma += f * d.conductivity();
            if (f > 0) {
                for (DrudeTerm t : d.drude()) {
                    drude.add(new DrudeTerm(Math.sqrt(f) * t.plasmaFrequency(), t.damping()));
                }
                for (LorentzTerm t : d.lorentz()) {
                    lorentz.add(new LorentzTerm(f * t.weight(), t.resonance(), t.damping()));
                }
            }
        }
        return new DispersiveMaterial(name, epsInf, sigma, drude, lorentz);
    }

    /** 1/ε(ω) = Σ f_k/ε_k(ω): the parts in series (parts of zero fraction are dropped). */
    public static SeriesMaterial series(String name, List<DispersiveMaterial> parts, double[] fractions) {
        check(parts, fractions);
        List<DispersiveMaterial> kept = new ArrayList<>();
        List<Double> f = new ArrayList<>();
        for (int k = 0; k < fractions.length; k++) {
            if (fractions[k] > 0) {
                kept.add(parts.get(k));
                f.add(fractions[k]);
            }
        }
        return new SeriesMaterial(name, kept, f.stream().mapToDouble(Double::doubleValue).toArray());
    }

    private static void check(List<DispersiveMaterial> parts, double[] fractions) {
        if (parts.size() != fractions.length || parts.isEmpty()) {
            throw new IllegalArgumentException(String.format("%d parts and %d fractions given; need the same number, ≥ 1",
                    parts.size(), fractions.length));
        }
        for (double f : fractions) {
            if (!(f >= 0) || f > 1) {
                throw new IllegalArgumentException(String.format("fraction %g must lie in [0, 1]", f));
            }
        }
    }
}
