package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.DrudeTerm;
import org.evanesce.geometry.dispersion.LorentzTerm;

/**
 * What a field site gets where a metal (dispersive material) meets another material inside its pixel.
 *
 * <ul>
 * <li>A field <b>tangential</b> to the face (Ez always; Ex at a horizontal face, Ey at a vertical one): the
 *     fill-fraction-weighted <b>arithmetic mean of the complex permittivities</b>, ε_eff(ω) = Σ f_m ε_m(ω),
 *     which is again a Drude–Lorentz material (ε∞ and σ averaged, each metal's Drude ωp² and Lorentz weights
 *     multiplied by its fraction), so it is exact at every frequency, passive, and stable at the metal's
 *     Courant limit. The tangential field is continuous across the face, so this is the right mean for it
 *     (A. Farjadpour et al., Opt. Lett. 31, 2972 (2006)); at a face through a row of tangential sites it is
 *     the second-order rule of J.-Y. Hwang &amp; A. C. Cangellaris's effective permittivity for planar faces
 *     on the grid (IEEE Microwave Wireless Compon. Lett. 11, 158 (2001): the mean of the two sides, from
 *     memory).</li>
 * <li>A field with a <b>normal</b> part (the harmonic mean would be needed, which is not a sum of Drude and
 *     Lorentz terms with the metal's poles): the site keeps the material at its own point, a staircase. A face
 *     through a row of tangential sites leaves every normal site whole on one side, so such faces (a film
 *     whose faces lie on node rows) are second order; other faces are first order.</li>
 * </ul>
 * The mixtures get table entries of their own (a stand-in holding ε∞ of the mixture, like a metal's).
 */
final class MetalFaces implements Rasterizer.FaceRule {

    /** A normal weight (u·n)² below this counts as tangential: round-off of a grid-aligned face's orientation. */
    static final double TANGENTIAL = 1e-9;

    private final Map<Material, DispersiveMaterial> metals;
    private final Map<String, Mixture> mixtures = new LinkedHashMap<>();

    /** A mixture's stand-in entry and its model. */
    record Mixture(Material standIn, DispersiveMaterial model) { }

    /** @param metals each metal's stand-in entry and model */
    MetalFaces(Map<Material, DispersiveMaterial> metals) {
        this.metals = Map.copyOf(metals);
    }

    @Override
    public boolean applies(Material m) {
        return metals.containsKey(m);
    }

    @Override
    public Material mix(FieldSite site, Material[] constituents, double[] fractions, double normalWeight) {
        if (normalWeight > TANGENTIAL) {
            return null;
        }
        StringBuilder name = new StringBuilder();
        double[] f = new double[fractions.length];
        for (int k = 0; k < fractions.length; k++) {
            // rounded so that sites with the same geometry share one entry
            f[k] = Math.rint(fractions[k] * 1e9) / 1e9;
            name.append(k == 0 ? "" : "|").append(constituents[k].name()).append(String.format(Locale.ROOT, ":%.9f", f[k]));
        }
        String key = name.append(" (face average)").toString();
        Mixture m = mixtures.get(key);
        if (m == null) {
            double epsInf = 0;
            double sigma = 0;
            List<DrudeTerm> drude = new ArrayList<>();
            List<LorentzTerm> lorentz = new ArrayList<>();
            for (int k = 0; k < f.length; k++) {
                DispersiveMaterial d = metals.get(constituents[k]);
                if (d == null) {
                    epsInf += f[k] * constituents[k].relativePermittivity();
                    sigma += f[k] * constituents[k].conductivity();
                    continue;
                }
                epsInf += f[k] * d.epsInfinity();
                sigma += f[k] * d.conductivity();
                if (f[k] > 0) {
                    for (DrudeTerm t : d.drude()) {
                        drude.add(new DrudeTerm(Math.sqrt(f[k]) * t.plasmaFrequency(), t.damping()));
                    }
                    for (LorentzTerm t : d.lorentz()) {
                        lorentz.add(new LorentzTerm(f[k] * t.weight(), t.resonance(), t.damping()));
                    }
                }
            }
            m = new Mixture(new Material(key, epsInf, 0), new DispersiveMaterial(key, epsInf, sigma, drude, lorentz));
            mixtures.put(key, m);
        }
        return m.standIn();
    }

    /** The mixtures made so far, by stand-in entry. */
    Map<Material, DispersiveMaterial> mixtures() {
        Map<Material, DispersiveMaterial> out = new LinkedHashMap<>();
        for (Mixture m : mixtures.values()) {
            out.put(m.standIn(), m.model());
        }
        return out;
    }
}
