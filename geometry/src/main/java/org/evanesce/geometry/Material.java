package org.evanesce.geometry;

/**
 * A non-dispersive isotropic material: relative permittivity and electric conductivity.
 *
 * <p>A perfect electric conductor is the limit σ → ∞ and is stored as such ({@link #perfectConductor}): no
 * field inside it, the tangential E zero on its faces. Its εr is a placeholder (1) that nothing reads: the
 * solver holds E at zero on its sites, the rasteriser does not average it (a staircase), and references
 * treat it as a total reflector.
 *
 * @param name                 a label for messages and outputs
 * @param relativePermittivity εr, dimensionless; must be finite and positive
 * @param conductivity         σ in S/m; negative values describe gain and are allowed; +∞ is a perfect conductor
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
        if (Double.isNaN(conductivity) || conductivity == Double.NEGATIVE_INFINITY) {
            throw new IllegalArgumentException(String.format(
                    "material '%s': conductivity %g S/m must be finite (or +∞ for a perfect conductor)", name,
                    conductivity));
        }
    }

    /** A perfect electric conductor: σ = +∞ (εr a placeholder of 1). */
    public static Material perfectConductor(String name) {
        return new Material(name, 1.0, Double.POSITIVE_INFINITY);
    }

    /** Whether this is a perfect electric conductor (σ = +∞). */
    public boolean isPerfectConductor() {
        return conductivity == Double.POSITIVE_INFINITY;
    }

    /** A lossless dielectric of refractive index {@code n} (εr = n²). */
    public static Material ofIndex(String name, double n) {
        return new Material(name, n * n, 0.0);
    }
}
