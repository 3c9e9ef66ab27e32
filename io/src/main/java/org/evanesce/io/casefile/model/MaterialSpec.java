package org.evanesce.io.casefile.model;

import java.util.Optional;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

/**
 * A non-dispersive material as the run uses it, at the case's design wavelength.
 *
 * @param name                 the name shapes refer to
 * @param relativePermittivity εr (n² for a material given by index or from the library)
 * @param conductivity         σ in S/m
 * @param library              the built-in fit it was evaluated from, if any
 * @param at                   where it was defined (for a library material used directly, the first use)
 */
public record MaterialSpec(String name, Value relativePermittivity, Value conductivity,
        Optional<LibraryMaterial> library, SourcePosition at) {

    /** Refractive index √εr (the real part; conductivity ignored). */
    public double index() {
        return Math.sqrt(relativePermittivity.si());
    }
}
