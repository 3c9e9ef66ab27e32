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
import org.evanesce.geometry.dispersion.FaceMixtures;
import org.evanesce.geometry.dispersion.SeriesMaterial;

/**
 * What a field site gets where a metal (dispersive material) meets another material inside its pixel
 * ({@link FaceMixtures}; f_m the fill fractions of the site's pixel).
 *
 * <ul>
 * <li>A field <b>tangential</b> to the face (Ez always; Ex at a horizontal face, Ey at a vertical one): the
 *     <b>arithmetic mean of the complex permittivities</b>, ε_eff(ω) = Σ f_m ε_m(ω), which is again a
 *     Drude–Lorentz material (ε∞ and σ averaged, each metal's Drude ωp² and Lorentz weights multiplied by its
 *     fraction), exact at every frequency, passive, and stable at the metal's Courant limit. The tangential
 *     field is continuous across the face, so this is the right mean for it (A. Farjadpour et al., Opt. Lett.
 *     31, 2972 (2006)).</li>
 * <li>A field <b>normal</b> to a face along a grid axis (Ey at a horizontal face, Ex at a vertical one): the
 *     <b>harmonic mean</b>, 1/ε_eff(ω) = Σ f_m/ε_m(ω), stepped exactly as the materials in series (one
 *     sub-field per constituent, {@link SeriesMaterial}). With both means a planar face anywhere in a cell is
 *     second order (KretschmannConvergenceTest in solver); with the normal site point-sampled (the rule before)
 *     a face off the node rows was first order: the normal field saw the face at the nearest node row, the
 *     tangential one at its true place.</li>
 * <li>A normal site at a tilted face (0 &lt; (u·n)² &lt; 1): point-sampled (a staircase), first order.</li>
 * </ul>
 * The mixtures get table entries of their own (a stand-in holding ε∞ of the mixture, like a metal's).
 */
final class MetalFaces implements Rasterizer.FaceRule {

    /** A normal weight (u·n)² below this counts as tangential, above 1 minus it as normal: round-off of a grid-aligned face's orientation. */
    static final double TANGENTIAL = 1e-9;

    private final Map<Material, DispersiveMaterial> metals;
    private final Map<String, Mixture> mixtures = new LinkedHashMap<>();
    private final Map<String, Series> series = new LinkedHashMap<>();

    /** A mixture's stand-in entry and its model. */
    record Mixture(Material standIn, DispersiveMaterial model) { }

    /** A series mixture's stand-in entry and its model. */
    record Series(Material standIn, SeriesMaterial model) { }

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
        boolean normal = normalWeight >= 1 - TANGENTIAL;
        if (normalWeight > TANGENTIAL && !normal) {
            return null;
        }
        StringBuilder name = new StringBuilder();
        double[] f = new double[fractions.length];
        List<DispersiveMaterial> parts = new ArrayList<>();
        for (int k = 0; k < fractions.length; k++) {
            // rounded so that sites with the same geometry share one entry
            f[k] = Math.rint(fractions[k] * 1e9) / 1e9;
            name.append(k == 0 ? "" : "|").append(constituents[k].name()).append(String.format(Locale.ROOT, ":%.9f", f[k]));
            DispersiveMaterial d = metals.get(constituents[k]);
            parts.add(d != null ? d : DispersiveMaterial.of(constituents[k]));
        }
        if (normal) {
            String key = name.append(" (face, in series)").toString();
            Series m = series.computeIfAbsent(key, n -> {
                SeriesMaterial sm = FaceMixtures.series(n, parts, normalised(f));
                return new Series(new Material(n, sm.epsInfinity(), 0), sm);
            });
            return m.standIn();
        }
        String key = name.append(" (face average)").toString();
        Mixture m = mixtures.computeIfAbsent(key, n -> {
            DispersiveMaterial d = FaceMixtures.parallel(n, parts, f);
            return new Mixture(new Material(n, d.epsInfinity(), 0), d);
        });
        return m.standIn();
    }

    /** The fractions scaled to add up to 1 exactly enough for {@link SeriesMaterial} (they were rounded to 1e-9). */
    private static double[] normalised(double[] f) {
        double sum = 0;
        for (double x : f) {
            sum += x;
        }
        double[] out = new double[f.length];
        for (int k = 0; k < f.length; k++) {
            out[k] = f[k] / sum;
        }
        return out;
    }

    /** The mixtures made so far, by stand-in entry. */
    Map<Material, DispersiveMaterial> mixtures() {
        Map<Material, DispersiveMaterial> out = new LinkedHashMap<>();
        for (Mixture m : mixtures.values()) {
            out.put(m.standIn(), m.model());
        }
        return out;
    }

    /** The series mixtures made so far, by stand-in entry. */
    Map<Material, SeriesMaterial> seriesMixtures() {
        Map<Material, SeriesMaterial> out = new LinkedHashMap<>();
        for (Series m : series.values()) {
            out.put(m.standIn(), m.model());
        }
        return out;
    }
}
