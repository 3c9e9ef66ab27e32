package org.evanesce.solver;

/** SI constants (CODATA 2018 values; c0 is exact by definition of the metre). */
public final class PhysicalConstants {

    /** Speed of light in vacuum, m/s. */
    public static final double C0 = 299_792_458.0;
    /** Vacuum permittivity, F/m. */
    public static final double EPS0 = 8.8541878128e-12;
    /** Vacuum impedance, Ω. */
    public static final double ETA0 = 376.730313668;

    private PhysicalConstants() {
    }
}
