package org.evanesce.geometry.dispersion;

/**
 * A closed band of vacuum wavelengths [shortest, longest] in metres.
 *
 * @param shortest m, finite and &gt; 0
 * @param longest  m, finite and ≥ shortest
 */
public record WavelengthBand(double shortest, double longest) {

    public WavelengthBand {
        if (!(shortest > 0) || Double.isInfinite(longest) || !(longest >= shortest)) {
            throw new IllegalArgumentException(String.format(
                    "wavelength band [%g m, %g m] must have 0 < shortest <= longest, both finite", shortest, longest));
        }
    }

    /** The band of photon energies [lowEv, highEv] in eV (λ = hc/E). */
    public static WavelengthBand ofElectronVolts(double lowEv, double highEv) {
        return new WavelengthBand(Spectral.wavelengthOfOmega(Spectral.omegaOfElectronVolts(highEv)),
                Spectral.wavelengthOfOmega(Spectral.omegaOfElectronVolts(lowEv)));
    }

    /** A band given in nanometres. */
    public static WavelengthBand ofNanometres(double shortestNm, double longestNm) {
        return new WavelengthBand(shortestNm * 1e-9, longestNm * 1e-9);
    }

    public boolean contains(double wavelength) {
        return wavelength >= shortest && wavelength <= longest;
    }

    /** Whether {@code other} lies wholly inside this band. */
    public boolean contains(WavelengthBand other) {
        return other.shortest >= shortest && other.longest <= longest;
    }

    /** E.g. {@code 400–1000 nm}. */
    @Override
    public String toString() {
        return String.format("%.4g–%.4g nm", shortest * 1e9, longest * 1e9);
    }
}
