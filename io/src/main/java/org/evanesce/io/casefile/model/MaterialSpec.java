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
 * @param conductivity         σ in S/m (for a dispersive material, the model's own σ); +∞ for a perfect conductor
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

    /** A perfect electric conductor ({@code perfect_conductor: true}): σ = +∞, εr a placeholder of 1. */
    public static MaterialSpec perfectConductor(String name, SourcePosition at) {
        return new MaterialSpec(name, new Value(1, at), new Value(Double.POSITIVE_INFINITY, at), Optional.empty(), at);
    }

    /** Whether this is a perfect electric conductor (σ = +∞): no field inside, tangential E zero on its faces. */
    public boolean isPerfectConductor() {
        return conductivity.si() == Double.POSITIVE_INFINITY;
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
