package org.evanesce.io.casefile.model;

import java.util.Optional;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

/**
 * A material as the run uses it: a non-dispersive one at the case's design wavelength, or a dispersive
 * one (a metal) whose ε(ω) comes from a model.
 *
 * @param name                 the name shapes refer to
 * @param relativePermittivity εr (n² for a material given by index or from the library); for a dispersive
 *                             material its background permittivity ε∞, which the grid's stand-in entry holds
 * @param conductivity         σ in S/m (for a dispersive material, the model's own σ)
 * @param library              the built-in dielectric fit it was evaluated from, if any
 * @param at                   where it was defined (for a library material used directly, the first use)
 * @param dispersion           the model of a dispersive material, with where its numbers come from
 */
public record MaterialSpec(String name, Value relativePermittivity, Value conductivity,
        Optional<LibraryMaterial> library, SourcePosition at, Optional<MetalSpec> dispersion) {

    /** A non-dispersive material. */
    public MaterialSpec(String name, Value relativePermittivity, Value conductivity, Optional<LibraryMaterial> library,
            SourcePosition at) {
        this(name, relativePermittivity, conductivity, library, at, Optional.empty());
    }

    /** Refractive index √εr (the real part; conductivity ignored; √ε∞ for a dispersive material). */
    public double index() {
        return Math.sqrt(relativePermittivity.si());
    }

    /** Whether ε depends on frequency (the run steps auxiliary currents in its cells). */
    public boolean isDispersive() {
        return dispersion.isPresent();
    }
}
