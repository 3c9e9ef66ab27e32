package org.evanesce.geometry;

/**
 * The SI constants of the whole program, decided here once (CODATA 2018 values, Tiesinga et al.,
 * "CODATA recommended values of the fundamental physical constants: 2018", Rev. Mod. Phys. 93,
 * 025010 (2021)); c0, e and h are exact by the 2019 SI definitions. They live in geometry, the
 * lowest module, because the material models here need c0 and ε0 as much as the solver does.
 */
public final class PhysicalConstants {

    /** Speed of light in vacuum, m/s (exact). */
    public static final double C0 = 299_792_458.0;
    /** Vacuum permittivity, F/m. */
    public static final double EPS0 = 8.8541878128e-12;
    /** Vacuum impedance, Ω. */
    public static final double ETA0 = 376.730313668;
    /** Elementary charge, C (exact). */
    public static final double ELEMENTARY_CHARGE = 1.602176634e-19;
    /** Reduced Planck constant ħ = h/2π, J·s (h = 6.62607015e-34 J·s exact). */
    public static final double HBAR = 6.62607015e-34 / (2 * Math.PI);

    private PhysicalConstants() {
    }
}
