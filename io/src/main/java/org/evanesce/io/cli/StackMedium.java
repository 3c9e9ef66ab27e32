package org.evanesce.io.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.geometry.dispersion.SourcedMaterial;
import org.evanesce.geometry.dispersion.Spectral;
import org.evanesce.geometry.dispersion.WavelengthBand;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.LibraryMaterial;
import picocli.CommandLine.TypeConversionException;

/**
 * A medium of {@code evanesce stack}: a fixed complex index ({@code 1.5}, {@code 0.2,3.4}), or a library
 * material by name, evaluated at each wavelength: a metal of {@link MetalLibrary} ({@code gold}, {@code gold-jc},
 * {@code silver}, ...; the model's continuous ε(ω), or its discrete ε_d(ω, Δt) at a time step) or a dielectric of
 * {@link LibraryMaterial} ({@code water}, {@code borosilicate_crown}, ...); or a case's metal ({@link #ofModel}).
 *
 * @param text       what the user wrote
 * @param fixed      the index, for a fixed medium (else null)
 * @param metal      the library metal (else null)
 * @param dielectric the library dielectric (else null)
 */
record StackMedium(String text, Complex fixed, SourcedMaterial metal, LibraryMaterial dielectric) {

    /** A layer: a medium and its thickness, m. */
    record Layer(StackMedium medium, double thickness) {
    }

    static StackMedium of(Complex index) {
        return new StackMedium(index.toString(), index, null, null);
    }

    /** Whether the index depends on the wavelength (a library material). */
    boolean isLibrary() {
        return fixed == null;
    }

    /** A case's metal (a dispersive material), named by the case's name for it. */
    static StackMedium ofModel(SourcedMaterial model) {
        return new StackMedium(model.key(), null, model, null);
    }

    /** The complex index n + iκ (κ ≥ 0) at vacuum wavelength {@code wavelength}, m. */
    Complex index(double wavelength) {
        return index(wavelength, 0);
    }

    /**
     * The same, a metal's from its continuous ε(ω) ({@code dt} = 0) or its discrete ε_d(ω, Δt) at time step
     * {@code dt} &gt; 0, s; other media are the same either way.
     */
    Complex index(double wavelength, double dt) {
        if (fixed != null) {
            return fixed;
        }
        if (metal != null) {
            return permittivity(wavelength, dt).sqrtUpper();
        }
        return Complex.real(dielectric.index(wavelength));
    }

    /** The relative permittivity at {@code wavelength}, m; a metal's continuous (dt = 0) or discrete at dt &gt; 0, s. */
    Complex permittivity(double wavelength, double dt) {
        if (metal == null) {
            return index(wavelength).square();
        }
        return dt > 0 ? metal.material().discretePermittivity(Spectral.omegaOfWavelength(wavelength), dt)
                : metal.material().permittivityAtWavelength(wavelength);
    }

    /** The name a library material was given by, e.g. {@code gold}. */
    String name() {
        return metal != null ? metal.key() : dielectric != null ? dielectric.caseName() : text;
    }

    /**
     * One line naming a library material's model and its ε at the wavelengths {@code first} and {@code last}
     * (equal for a single wavelength), m, with a note where they leave the fit's band.
     */
    String describe(String role, double first, double last) {
        return describe(role, first, last, 0);
    }

    /**
     * The same with a metal's discrete ε_d at time step {@code dt} &gt; 0, s ({@code ε_d = ...}, then the model's
     * continuous ε beside it); dt = 0 as {@link #describe(String, double, double)}.
     */
    String describe(String role, double first, double last, double dt) {
        boolean discrete = dt > 0 && metal != null;
        StringBuilder s = new StringBuilder(role).append(": ").append(name()).append(discrete ? ", ε_d = " : ", ε = ")
                .append(eps(permittivity(first, dt))).append(" (n = ").append(nk(index(first, dt))).append(") at ")
                .append(Units.format(first, Dimension.LENGTH));
        if (last != first) {
            s.append(" to ").append(eps(permittivity(last, dt))).append(" (n = ").append(nk(index(last, dt))).append(") at ")
                    .append(Units.format(last, Dimension.LENGTH));
        }
        if (discrete) {
            s.append("; the model's ε = ").append(eps(permittivity(first, 0)));
            if (last != first) {
                s.append(" to ").append(eps(permittivity(last, 0)));
            }
        }
        WavelengthBand run = new WavelengthBand(Math.min(first, last), Math.max(first, last));
        if (metal != null) {
            s.append("; model: ").append(metal.citation()).append("; fitted to: ").append(metal.fittedTo());
            if (!metal.covers(run)) {
                s.append("; the wavelengths leave the fit's band ").append(metal.validity()).append(": ε there is an extrapolation");
            }
        } else {
            s.append("; model: ").append(dielectric.source());
            if (!dielectric.covers(run.shortest()) || !dielectric.covers(run.longest())) {
                s.append(String.format(Locale.ROOT, "; the wavelengths leave the fit's band %.4g-%.4g nm: an extrapolation",
                        dielectric.minWavelength() * 1e9, dielectric.maxWavelength() * 1e9));
            }
        }
        return s.toString();
    }

    /** The names {@link #parse} accepts, for messages. */
    static List<String> names() {
        List<String> all = new ArrayList<>(MetalLibrary.keys());
        for (LibraryMaterial m : LibraryMaterial.values()) {
            all.add(m.caseName());
        }
        return all;
    }

    /** An index ({@link StackCommand#parseIndex}) or a library material's name (case-insensitive). */
    static StackMedium parse(String text) {
        String key = text.strip().toLowerCase(Locale.ROOT);
        if (!key.isEmpty() && Character.isLetter(key.charAt(0))) {
            if (MetalLibrary.keys().contains(key) || "aluminum".equals(key)) {
                return new StackMedium(text, null, MetalLibrary.get(key), null);
            }
            LibraryMaterial d = LibraryMaterial.byName(key);
            if (d != null) {
                return new StackMedium(text, null, null, d);
            }
            throw new TypeConversionException("'" + text.strip() + "' is neither an index nor a library material; expected "
                    + "n (1.5), n+ki (1.5+0.01i), n,k (0.2,3.4) or one of " + String.join(", ", names()));
        }
        return new StackMedium(text.strip(), StackCommand.parseIndex(text), null, null);
    }

    /** ε for people, e.g. {@code -9.811+1.964i}, or {@code 1.774} when real. */
    static String eps(Complex e) {
        return e.im() == 0 ? String.format(Locale.ROOT, "%.4g", e.re())
                : String.format(Locale.ROOT, "%.4g%+.4gi", e.re(), e.im());
    }

    private static String nk(Complex n) {
        return eps(n);
    }
}
