package org.evanesce.io.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.geometry.dispersion.SourcedMaterial;
import org.evanesce.geometry.dispersion.WavelengthBand;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.LibraryMaterial;
import picocli.CommandLine.TypeConversionException;

/**
 * A medium of {@code evanesce stack}: a fixed complex index ({@code 1.5}, {@code 0.2,3.4}), or a library
 * material by name, evaluated at each wavelength: a metal of {@link MetalLibrary} ({@code gold}, {@code gold-jc},
 * {@code silver}, ...; the model's continuous ε(ω), no grid) or a dielectric of {@link LibraryMaterial}
 * ({@code water}, {@code borosilicate_crown}, ...).
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

    /** The complex index n + iκ (κ ≥ 0) at vacuum wavelength {@code wavelength}, m. */
    Complex index(double wavelength) {
        if (fixed != null) {
            return fixed;
        }
        if (metal != null) {
            return metal.material().permittivityAtWavelength(wavelength).sqrtUpper();
        }
        return Complex.real(dielectric.index(wavelength));
    }

    /** The relative permittivity at {@code wavelength}, m. */
    Complex permittivity(double wavelength) {
        return metal != null ? metal.material().permittivityAtWavelength(wavelength) : index(wavelength).square();
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
        StringBuilder s = new StringBuilder(role).append(": ").append(name()).append(", ε = ")
                .append(eps(permittivity(first))).append(" (n = ").append(nk(index(first))).append(") at ")
                .append(Units.format(first, Dimension.LENGTH));
        if (last != first) {
            s.append(" to ").append(eps(permittivity(last))).append(" (n = ").append(nk(index(last))).append(") at ")
                    .append(Units.format(last, Dimension.LENGTH));
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
