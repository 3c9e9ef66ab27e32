package org.evanesce.geometry.dispersion;

import org.evanesce.geometry.Complex;

/**
 * A free-electron (Drude) term of a permittivity, time dependence exp(−iωt):
 * <pre>
 *     χ(ω) = −ωp² / (ω² + iγω)
 * </pre>
 * Im χ = γωp²/(ω(ω² + γ²)) ≥ 0 for ω &gt; 0 and γ ≥ 0 (loss). In the time domain the current
 * J = ∂P/∂t obeys ∂J/∂t + γJ = ε0 ωp² E (Taflove &amp; Hagness, <i>Computational Electrodynamics</i>,
 * 3rd ed. (2005), sec. 9.4, from memory).
 *
 * @param plasmaFrequency ωp in rad/s, finite and ≥ 0
 * @param damping         γ in rad/s (collision rate), finite and ≥ 0
 */
public record DrudeTerm(double plasmaFrequency, double damping) {

    public DrudeTerm {
        Terms.checkRate("Drude plasma frequency", plasmaFrequency);
        Terms.checkRate("Drude damping", damping);
    }

    /** A term from ħωp and ħγ in eV. */
    public static DrudeTerm ofElectronVolts(double plasmaEv, double dampingEv) {
        return new DrudeTerm(Spectral.omegaOfElectronVolts(plasmaEv), Spectral.omegaOfElectronVolts(dampingEv));
    }

    /** χ(ω) of this term alone, for ω &gt; 0 in rad/s. */
    public Complex susceptibility(double omega) {
        // −ωp²/(ω² + iγω)
        return Complex.real(-plasmaFrequency * plasmaFrequency).divide(new Complex(omega * omega, damping * omega));
    }
}
