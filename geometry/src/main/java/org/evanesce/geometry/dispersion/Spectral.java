package org.evanesce.geometry.dispersion;

/**
 * SI constants and conversions between angular frequency ω (rad/s), vacuum wavelength λ (m) and
 * photon energy ħω (eV). CODATA 2018 values; c0, e and h are exact by the 2019 SI definitions.
 * {@link #EPS0} is the value {@code solver.kernel.Engine} uses for its coefficients, so that
 * {@link AdeCoefficients} reproduces them bit for bit.
 */
public final class Spectral {

    /** Speed of light in vacuum, m/s. */
    public static final double C0 = 299_792_458.0;
    /** Vacuum permittivity, F/m. */
    public static final double EPS0 = 8.8541878128e-12;
    /** Elementary charge, C (exact). */
    public static final double ELEMENTARY_CHARGE = 1.602176634e-19;
    /** Reduced Planck constant ħ = h/2π, J·s (h = 6.62607015e-34 J·s exact). */
    public static final double HBAR = 6.62607015e-34 / (2 * Math.PI);
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
