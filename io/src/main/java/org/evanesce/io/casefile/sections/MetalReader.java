package org.evanesce.io.casefile.sections;

import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.MetalSpec;
import org.evanesce.io.casefile.text.Scalar;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.DrudeTerm;
import org.evanesce.geometry.dispersion.LorentzTerm;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.geometry.dispersion.SingleIndexModel;
import org.evanesce.geometry.dispersion.SourcedMaterial;
import org.evanesce.geometry.dispersion.Spectral;
import org.evanesce.geometry.dispersion.WavelengthBand;
import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.ScalarNode;

/**
 * Reads the dispersive materials of a case (metals): {@code drude}/{@code lorentz} terms with a
 * background permittivity and conductivity, {@code library: gold} and the other metals of
 * {@link MetalLibrary}, a single measured index {@code index: 0.18+3.43i at 633 nm}, and an n, k
 * {@code table} beside the case ({@link NkTableReader}). A material is read when the materials section is;
 * its model is settled once the run's band of wavelengths is known ({@link Pending#resolve}), because the
 * warnings (a library fit's validity, a single-wavelength model's values at the band's ends) and a
 * table's fit depend on it.
 */
final class MetalReader {

    /** A complex index with the wavelength it was measured at: {@code n+ki at WAVELENGTH}, also {@code n at WAVELENGTH}. */
    private static final Pattern MEASURED = Pattern.compile(
            "\\s*([0-9]*\\.?[0-9]+(?:[eE][-+]?[0-9]+)?)\\s*(?:([-+])\\s*([0-9]*\\.?[0-9]+(?:[eE][-+]?[0-9]+)?)\\s*\\*?\\s*[ij])?"
                    + "\\s+at\\s+(.+)");
    /** A complex number without a wavelength, to give advice. */
    private static final Pattern COMPLEX = Pattern.compile(".*[0-9.]\\s*\\*?\\s*[ij]\\s*");
    /** A frequency in eV or rad/s (the number part is an expression). */
    private static final Pattern EV = Pattern.compile("(.+?)\\s*eV\\s*");
    private static final Pattern RAD_PER_S = Pattern.compile("(.+?)\\s*rad\\s*/\\s*s\\s*");
    static final String FREQUENCY_EXAMPLE = "a frequency such as 9.03 eV, 1.37e16 rad/s or 2180 THz";

    private final Context ctx;
    private final String caseFile;

    MetalReader(Context ctx) {
        this.ctx = ctx;
        this.caseFile = ctx.source;
    }

    /** Whether the material's mapping describes a dispersive material (then {@link #read} reads it). */
    static boolean isMetal(MapView v) {
        if (v.has("drude") || v.has("lorentz") || v.has("table")) {
            return true;
        }
        if (v.has("library") && v.get("library") instanceof ScalarNode s && isLibraryMetal(s.getValue())) {
            return true;
        }
        return v.has("index") && v.get("index") instanceof ScalarNode s
                && (MEASURED.matcher(s.getValue()).matches() || COMPLEX.matcher(s.getValue()).matches());
    }

    static boolean isLibraryMetal(String key) {
        return MetalLibrary.keys().contains(key.toLowerCase(Locale.ROOT)) || "aluminum".equalsIgnoreCase(key);
    }

    /** A metal whose model waits for the run's band. */
    interface Pending {
        /** The material, or null after reporting why not. */
        MaterialSpec resolve(WavelengthBand band);
    }

    /** Reads a dispersive material; null after reporting what is wrong. */
    Pending read(MapView v, String name, SourcePosition at) {
        boolean terms = v.has("drude") || v.has("lorentz");
        String how = v.oneOf(false, "index", "library", "table", terms ? "drude" : "lorentz");
        if (how == null) {
            return null;
        }
        if (!terms) {
            for (String k : List.of("permittivity", "conductivity")) {
                if (v.has(k)) {
                    ctx.error(v.keyAt(k), v.path(k), "'" + k + "' is read with drude/lorentz terms only; a " + how
                            + " material brings its own ε(ω)");
                    return null;
                }
            }
        }
        if (!"table".equals(how) && v.has("fit_tolerance")) {
            ctx.error(v.keyAt("fit_tolerance"), v.path("fit_tolerance"), "fit_tolerance is read with a table only");
            return null;
        }
        return switch (how) {
            case "library" -> library(v, name, at);
            case "index" -> measured(v, name, at);
            case "table" -> new NkTableReader(ctx, caseFile).read(v, name, at);
            default -> terms(v, name, at);
        };
    }

    private Pending library(MapView v, String name, SourcePosition at) {
        Node n = v.get("library");
        SourcedMaterial lib = MetalLibrary.get(((ScalarNode) n).getValue());
        SourcedMaterial m = new SourcedMaterial(name, lib.material().withName(name), lib.citation(), lib.fittedTo(),
                lib.validity(), lib.notes());
        SourcePosition where = ctx.pos(n);
        String path = v.path("library");
        return band -> {
            if (!m.covers(band)) {
                ctx.warn(where, path, String.format("%s: the library's %s model is fitted over %s; the run's band %s leaves it, "
                        + "so ε there is an extrapolation", name, lib.key(), lib.validity(), band));
            }
            return spec(name, m, MetalSpec.Kind.LIBRARY, at);
        };
    }

    private Pending measured(MapView v, String name, SourcePosition at) {
        Node node = v.get("index");
        Scalar s = ctx.scalar(node, v.path("index"), "a complex index measured at a wavelength, such as 0.18+3.43i at 633 nm");
        if (s == null) {
            return null;
        }
        Matcher m = MEASURED.matcher(s.text());
        if (!m.matches()) {
            ctx.error(s.start(), v.path("index"), "a complex index needs the wavelength it was measured at: write it as '"
                    + s.text().strip() + " at 633 nm' (n+ki, k >= 0 for a lossy material), with your wavelength");
            return null;
        }
        double n = Double.parseDouble(m.group(1));
        double k = m.group(3) == null ? 0 : Double.parseDouble(m.group(3)) * ("-".equals(m.group(2)) ? -1 : 1);
        Value wl = ctx.value(s.from(m.start(4)), v.path("index"), Expect.LENGTH);
        if (wl == null) {
            return null;
        }
        if (!(wl.si() > 0)) {
            ctx.error(wl.at(), v.path("index"), "the wavelength must be positive, got " + Units.format(wl.si(), Dimension.LENGTH));
            return null;
        }
        if (k < 0) {
            ctx.error(s.start(), v.path("index"), String.format(Locale.ROOT, "k = %s is negative: that is gain, not a passive "
                    + "material (time dependence exp(-iwt), a lossy material has k >= 0); expected n+ki with k >= 0",
                    Units.number(k)));
            return null;
        }
        SingleIndexModel model;
        try {
            model = SingleIndexModel.of(name, n, k, wl.si());
        } catch (IllegalArgumentException e) {
            ctx.error(s.start(), v.path("index"), e.getMessage());
            return null;
        }
        SourcePosition where = s.start();
        String path = v.path("index");
        String data = String.format(Locale.ROOT, "measured index %s at %s (%s, line %d)", model.index(),
                Units.format(wl.si(), Dimension.LENGTH), caseFile, where.line());
        return band -> {
            Complex[] ends = model.atBandEnds(band);
            Complex at0 = model.material().permittivityAtWavelength(wl.si());
            String kind = model.kind() == SingleIndexModel.Kind.DRUDE ? "ε∞ = 1 and one Drude term" : "εr and a conductivity";
            String ends01 = band.shortest() == band.longest()
                    ? String.format(Locale.ROOT, "the run uses %s only, where ε = %s", Units.format(band.shortest(), Dimension.LENGTH),
                            eps(ends[0]))
                    : String.format(Locale.ROOT, "at the run's band ends ε = %s at %s and %s at %s", eps(ends[0]),
                            Units.format(band.shortest(), Dimension.LENGTH), eps(ends[1]), Units.format(band.longest(), Dimension.LENGTH));
            ctx.warn(where, path, String.format(Locale.ROOT, "%s is a single-wavelength model (%s): ε = %s at %s exactly; %s; "
                    + "give a table of n, k over the run's band for a better one", name, kind, eps(at0),
                    Units.format(wl.si(), Dimension.LENGTH), ends01));
            if (model.kind() == SingleIndexModel.Kind.CONDUCTIVE) {
                DispersiveMaterial d = model.material();
                return new MaterialSpec(name, new Value(d.epsInfinity(), where), new Value(d.conductivity(), where),
                        Optional.empty(), at);
            }
            return spec(name, model.sourced(name, data), MetalSpec.Kind.MEASURED_INDEX, at);
        };
    }

    private Pending terms(MapView v, String name, SourcePosition at) {
        Value epsInf = v.has("permittivity") ? ctx.positive(v.get("permittivity"), v.path("permittivity"), Expect.PLAIN)
                : new Value(1, at);
        Value sigma = v.has("conductivity") ? ctx.value(v.get("conductivity"), v.path("conductivity"), Expect.CONDUCTIVITY)
                : new Value(0, at);
        if (sigma != null && sigma.si() < 0) {
            ctx.error(sigma.at(), v.path("conductivity"), "a negative conductivity (" + Units.format(sigma.si(), Dimension.CONDUCTIVITY)
                    + ") is gain: the fields would grow without limit; expected 0 S/m or more");
            sigma = null;
        }
        List<DrudeTerm> drude = new ArrayList<>();
        List<LorentzTerm> lorentz = new ArrayList<>();
        boolean ok = epsInf != null && sigma != null;
        ok &= readTerms(v, "drude", Schema.DRUDE, (t, p) -> {
            Double wp = omega(t.require("plasma_frequency", FREQUENCY_EXAMPLE), t.path("plasma_frequency"), true);
            Double g = omega(t.require("damping", FREQUENCY_EXAMPLE), t.path("damping"), false);
            if (wp == null || g == null) {
                return false;
            }
            drude.add(new DrudeTerm(wp, g));
            return true;
        });
        ok &= readTerms(v, "lorentz", Schema.LORENTZ, (t, p) -> {
            Value strength = ctx.positive(t.require("strength", "a plain number such as 1.2 (the term's Δε)"), t.path("strength"),
                    Expect.PLAIN);
            Double w0 = omega(t.require("resonance", FREQUENCY_EXAMPLE), t.path("resonance"), true);
            Double g = omega(t.require("damping", FREQUENCY_EXAMPLE), t.path("damping"), false);
            if (strength == null || w0 == null || g == null) {
                return false;
            }
            lorentz.add(LorentzTerm.ofStrength(strength.si(), w0, g));
            return true;
        });
        if (!ok) {
            return null;
        }
        DispersiveMaterial d = new DispersiveMaterial(name, epsInf.si(), sigma.si(), drude, lorentz);
        SourcedMaterial m = new SourcedMaterial(name, d, "terms written in the case file", caseFile + ", line " + at.line(),
                new WavelengthBand(Double.MIN_NORMAL, Double.MAX_VALUE), "");
        return band -> spec(name, m, MetalSpec.Kind.TERMS, at);
    }

    private interface TermReader {
        boolean read(MapView term, String path);
    }

    private boolean readTerms(MapView v, String key, Schema.Section section, TermReader reader) {
        if (!v.has(key)) {
            return true;
        }
        List<Node> items = ctx.list(v.get(key), v.path(key), key + " terms such as '- {plasma_frequency: 9 eV, damping: 0.07 eV}'");
        if (items == null) {
            return false;
        }
        if (items.isEmpty()) {
            ctx.error(v.keyAt(key), v.path(key), "an empty list; give at least one term or leave the key out");
            return false;
        }
        boolean ok = true;
        for (int k = 0; k < items.size(); k++) {
            String p = v.path(key) + "[" + k + "]";
            MapView t = MapView.of(ctx, items.get(k), section, p, ctx.pos(items.get(k)));
            ok &= t != null && reader.read(t, p);
        }
        return ok;
    }

    /**
     * An angular frequency in rad/s from {@code 9.03 eV} (ħω), {@code 1.37e16 rad/s} or a frequency in Hz
     * ({@code 2180 THz}, ω = 2πf); null after reporting.
     *
     * @param positive whether 0 is refused (a plasma frequency or resonance) or accepted (a damping)
     */
    Double omega(Node node, String path, boolean positive) {
        Scalar s = ctx.scalar(node, path, FREQUENCY_EXAMPLE);
        if (s == null) {
            return null;
        }
        Matcher ev = EV.matcher(s.text());
        Matcher rad = RAD_PER_S.matcher(s.text());
        double omega;
        if (ev.matches() || rad.matches()) {
            Matcher m = ev.matches() ? ev : rad;
            Value v = ctx.value(new Scalar(m.group(1), s.start(), s.mapsColumns()), path, Expect.PLAIN);
            if (v == null) {
                return null;
            }
            omega = ev.matches() ? Spectral.omegaOfElectronVolts(v.si()) : v.si();
        } else {
            Value v = ctx.value(s, path, Expect.FREQUENCY);
            if (v == null) {
                return null;
            }
            omega = 2 * Math.PI * v.si();
        }
        if (!Double.isFinite(omega) || omega < 0 || positive && omega == 0) {
            ctx.error(s.start(), path, String.format(Locale.ROOT, "%s rad/s: expected a finite frequency %s 0",
                    Units.number(omega), positive ? ">" : ">="));
            return null;
        }
        return omega;
    }

    private static MaterialSpec spec(String name, SourcedMaterial m, MetalSpec.Kind kind, SourcePosition at) {
        DispersiveMaterial d = m.material();
        return new MaterialSpec(name, new Value(d.epsInfinity(), at), new Value(d.conductivity(), at), Optional.empty(), at,
                Optional.of(new MetalSpec(m, kind)));
    }

    /** ε for messages, e.g. {@code -11.7+1.26i}. */
    static String eps(Complex e) {
        return String.format(Locale.ROOT, "%.4g%+.4gi", e.re(), e.im());
    }
}
