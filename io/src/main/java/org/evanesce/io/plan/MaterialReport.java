package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeSet;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.DrudeTerm;
import org.evanesce.geometry.dispersion.LorentzTerm;
import org.evanesce.geometry.dispersion.Spectral;
import org.evanesce.geometry.dispersion.SourcedMaterial;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.MetalSpec;

/**
 * Every material's permittivity at the run's wavelengths, and each dispersive material's model and the data
 * it comes from: the {@code materials} section of summary.json and the lines {@code evanesce check} prints.
 * The run's wavelengths are the design wavelength and those of the flux spectra and the maps, each once,
 * increasing.
 */
public final class MaterialReport {

    private MaterialReport() {
    }

    /** The run's vacuum wavelengths, m, increasing. */
    public static List<Double> wavelengths(CaseSpec spec) {
        TreeSet<Double> wl = new TreeSet<>();
        wl.add(spec.designWavelength().si());
        spec.flux().ifPresent(f -> f.frequencies().forEach(v -> wl.add(PhysicalConstants.C0 / v.si())));
        spec.maps().ifPresent(m -> m.frequencies().forEach(v -> wl.add(PhysicalConstants.C0 / v.si())));
        // one entry for wavelengths that differ by round-off only (633 nm as written and as c0/f)
        List<Double> out = new ArrayList<>();
        for (double w : wl) {
            if (out.isEmpty() || w - out.get(out.size() - 1) > 1e-9 * w) {
                out.add(w);
            }
        }
        return out;
    }

    /** ε of a material at ω: the model's (continuous, or discrete at dt &gt; 0), or εr + iσ/(ε0 ω). */
    public static Complex permittivity(MaterialSpec m, double omega, double dt) {
        if (m.isDispersive()) {
            DispersiveMaterial d = m.dispersion().orElseThrow().material();
            return dt > 0 ? d.discretePermittivity(omega, dt) : d.permittivity(omega);
        }
        return new Complex(m.relativePermittivity().si(), m.conductivity().si() / (PhysicalConstants.EPS0 * omega));
    }

    /** The summary.json entries, by material name. */
    public static Map<String, Object> summary(CaseSpec spec, double dt) {
        Map<String, Object> out = new LinkedHashMap<>();
        List<Double> wls = wavelengths(spec);
        for (MaterialSpec m : spec.materials().values()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("dispersive", m.isDispersive());
            if (m.isPerfectConductor()) {
                e.put("perfect_conductor", true); // no permittivity: no field inside
                out.put(m.name(), e);
                continue;
            }
            if (m.isDispersive()) {
                MetalSpec ms = m.dispersion().orElseThrow();
                SourcedMaterial sm = ms.model();
                e.put("given_as", ms.kind().text());
                e.put("model", model(sm.material()));
                e.put("citation", sm.citation());
                e.put("data_source", sm.fittedTo());
                if (ms.kind() != MetalSpec.Kind.TERMS) {
                    e.put("validity_m", List.of(sm.validity().shortest(), sm.validity().longest()));
                }
                e.put("notes", sm.notes());
            } else {
                e.put("relative_permittivity", m.relativePermittivity().si());
                e.put("conductivity_s_per_m", m.conductivity().si());
            }
            List<Object> at = new ArrayList<>();
            for (double wl : wls) {
                double omega = Spectral.omegaOfWavelength(wl);
                Complex c = permittivity(m, omega, 0);
                Map<String, Object> p = new LinkedHashMap<>();
                p.put("wavelength_m", wl);
                p.put("epsilon_real", c.re());
                p.put("epsilon_imaginary", c.im());
                if (m.isDispersive()) {
                    Complex d = permittivity(m, omega, dt);
                    p.put("grid_epsilon_real", d.re());
                    p.put("grid_epsilon_imaginary", d.im());
                }
                at.add(p);
            }
            e.put("permittivity", at);
            out.put(m.name(), e);
        }
        return out;
    }

    /** The model's parameters, in rad/s and eV. */
    static Map<String, Object> model(DispersiveMaterial d) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("epsilon_infinity", d.epsInfinity());
        m.put("conductivity_s_per_m", d.conductivity());
        List<Object> drude = new ArrayList<>();
        for (DrudeTerm t : d.drude()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("plasma_frequency_rad_per_s", t.plasmaFrequency());
            e.put("damping_rad_per_s", t.damping());
            e.put("plasma_frequency_ev", Spectral.electronVoltsOfOmega(t.plasmaFrequency()));
            e.put("damping_ev", Spectral.electronVoltsOfOmega(t.damping()));
            drude.add(e);
        }
        m.put("drude", drude);
        List<Object> lorentz = new ArrayList<>();
        for (LorentzTerm t : d.lorentz()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("strength", t.strength());
            e.put("resonance_rad_per_s", t.resonance());
            e.put("damping_rad_per_s", t.damping());
            e.put("resonance_ev", Spectral.electronVoltsOfOmega(t.resonance()));
            e.put("damping_ev", Spectral.electronVoltsOfOmega(t.damping()));
            lorentz.add(e);
        }
        m.put("lorentz", lorentz);
        return m;
    }

    /** Lines for {@code evanesce check}: each dispersive material's source and ε at the run's wavelengths. */
    public static List<String> lines(CaseSpec spec, double dt) {
        List<String> out = new ArrayList<>();
        List<Double> wls = wavelengths(spec);
        for (MaterialSpec m : spec.materials().values()) {
            if (!m.isDispersive()) {
                continue;
            }
            MetalSpec ms = m.dispersion().orElseThrow();
            SourcedMaterial sm = ms.model();
            DispersiveMaterial d = sm.material();
            out.add(String.format(Locale.ROOT, "material %s: dispersive (%s; eps_inf %.4g, %d Drude, %d Lorentz terms); %s; data: %s%s",
                    m.name(), ms.kind().text(), d.epsInfinity(), d.drude().size(), d.lorentz().size(), sm.citation(),
                    sm.fittedTo(), sm.notes().isEmpty() ? "" : "; " + sm.notes()));
            StringBuilder sb = new StringBuilder("  eps (model | on the grid):");
            int shown = 0;
            for (int k = 0; k < wls.size(); k++) {
                // at most 7 wavelengths: the ends and evenly spaced ones between
                if (wls.size() > 7 && k != wls.size() - 1 && k % ((wls.size() + 5) / 6) != 0) {
                    continue;
                }
                double omega = Spectral.omegaOfWavelength(wls.get(k));
                Complex c = d.permittivity(omega);
                Complex g = d.discretePermittivity(omega, dt);
                sb.append(String.format(Locale.ROOT, "%s %.4g nm: %.4g%+.4gi | %.4g%+.4gi", shown++ == 0 ? "" : ";",
                        wls.get(k) * 1e9, c.re(), c.im(), g.re(), g.im()));
            }
            out.add(sb.toString());
        }
        return out;
    }
}
