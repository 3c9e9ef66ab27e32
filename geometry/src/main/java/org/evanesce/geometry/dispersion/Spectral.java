package org.evanesce.geometry.dispersion;

import static org.evanesce.geometry.PhysicalConstants.C0;
import static org.evanesce.geometry.PhysicalConstants.ELEMENTARY_CHARGE;
import static org.evanesce.geometry.PhysicalConstants.HBAR;

/**
 * Conversions between angular frequency ω (rad/s), vacuum wavelength λ (m) and photon energy ħω
 * (eV), with the constants of {@link org.evanesce.geometry.PhysicalConstants} (the same ε0 the
 * solver's coefficients use, so that {@link AdeCoefficients} reproduces them bit for bit).
 */
public final class Spectral {

    /** Angular frequency of a photon of 1 eV: e/ħ ≈ 1.519267e15 rad/s. */
    public static final double RAD_PER_SECOND_PER_EV = ELEMENTARY_CHARGE / HBAR;

    private Spectral() {
    }

    /** ω = 2πc0/λ for a vacuum wavelength λ in metres. */
    public static double omegaOfWavelength(double wavelength) {
        return 2 * Math.PI * C0 / wavelength;
    }

    /** λ = 2πc0/ω in metres. */
    public static double wavelengthOfOmega(double omega) {
        return 2 * Math.PI * C0 / omega;
    }

    /** ω of a photon energy ħω given in eV. */
    public static double omegaOfElectronVolts(double electronVolts) {
        return electronVolts * RAD_PER_SECOND_PER_EV;
    }

    /** ħω in eV of an angular frequency in rad/s. */
    public static double electronVoltsOfOmega(double omega) {
        return omega / RAD_PER_SECOND_PER_EV;
    }
}
