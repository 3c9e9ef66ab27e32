package org.evanesce.geometry;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The constants agree with each other as the SI relations demand: η0 = 1/(ε0 c0) and ε0 μ0 c0² = 1,
 * with μ0 = 1.25663706212e-6 N/A² (CODATA 2018, Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)).
 */
class PhysicalConstantsTest {

    /** CODATA 2018 vacuum permeability, N/A². */
    static final double MU0 = 1.25663706212e-6;
    /** η0 is given to 12 digits: 1/(ε0 c0) differs by 3.0e-12 relative (measured); 10x that. */
    static final double IMPEDANCE_TOLERANCE = 3e-11;
    /** ε0 and μ0 are given to 11 digits: ε0 μ0 c0² − 1 = −4.3e-14 (measured); 10x that. */
    static final double PRODUCT_TOLERANCE = 5e-13;

    @Test
    void impedanceIsTheReciprocalOfPermittivityTimesSpeed() {
        double eta = 1 / (PhysicalConstants.EPS0 * PhysicalConstants.C0);
        assertEquals(1, PhysicalConstants.ETA0 / eta, IMPEDANCE_TOLERANCE, "η0 against 1/(ε0 c0)");
        assertEquals(1, PhysicalConstants.ETA0 / (MU0 * PhysicalConstants.C0), IMPEDANCE_TOLERANCE, "η0 against μ0 c0");
    }

    @Test
    void permittivityPermeabilityAndSpeedOfLight() {
        double c = PhysicalConstants.C0;
        assertEquals(1, PhysicalConstants.EPS0 * MU0 * c * c, PRODUCT_TOLERANCE, "ε0 μ0 c0²");
    }
}
