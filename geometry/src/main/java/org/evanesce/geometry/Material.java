package org.evanesce.geometry;

/**
 * A non-dispersive isotropic material: relative permittivity and electric conductivity.
 *
 * @param name                 a label for messages and outputs
 * @param relativePermittivity εr, dimensionless; must be finite and positive
 * @param conductivity         σ in S/m; negative values describe gain and are allowed
 */
public record Material(String name, double relativePermittivity, double conductivity) {

    /** Vacuum (and, to the accuracy that matters here, air): εr = 1, σ = 0. */
    public static final Material VACUUM = new Material("vacuum", 1.0, 0.0);

    public Material {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("material name must not be blank");
        }
        if (!(relativePermittivity > 0) || Double.isInfinite(relativePermittivity)) {
            throw new IllegalArgumentException(String.format(
                    "material '%s': relative permittivity %g must be finite and > 0", name, relativePermittivity));
        }
        if (!Double.isFinite(conductivity)) {
            throw new IllegalArgumentException(String.format(
                    "material '%s': conductivity %g S/m must be finite", name, conductivity));
        }
    }

    /** A lossless dielectric of refractive index {@code n} (εr = n²). */
    public static Material ofIndex(String name, double n) {
        return new Material(name, n * n, 0.0);
    }
}
