package org.evanesce.geometry.dispersion;

import org.evanesce.geometry.Complex;

/**
 * A bound-electron (Lorentz) term of a permittivity, time dependence exp(−iωt):
 * <pre>
 *     χ(ω) = W / (ω0² − ω² − iγω),   W = Δε·ω0² = f·ωp²
 * </pre>
 * with strength Δε (the term's contribution to the static permittivity), resonance ω0 and damping γ;
 * Rakić et al. write the same term with an oscillator strength f and the metal's plasma frequency ωp
 * (A. D. Rakić, A. B. Djurišić, J. M. Elazar, M. L. Majewski, Appl. Opt. 37, 5271 (1998), their
 * ε_r^(b) = Σ f_j ωp² / ((ω_j² − ω²) + iωΓ_j), from memory; they use exp(+iωt), so only the sign of
 * Im ε differs from ours). The weight W is stored, so a term with ω0 = 0 is allowed (it is then a
 * Drude term of plasma frequency √W). Im χ = Wγω/((ω0² − ω²)² + γ²ω²) ≥ 0 for ω &gt; 0 (loss). In the time
 * domain J = ∂P/∂t obeys ∂²J/∂t² + γ∂J/∂t + ω0²J = ε0 W ∂E/∂t (Taflove &amp; Hagness 3rd ed.
 * sec. 9.4, from memory).
 *
 * @param weight    W = Δε·ω0² in rad²/s², finite and ≥ 0
 * @param resonance ω0 in rad/s, finite and ≥ 0
 * @param damping   γ in rad/s, finite and ≥ 0
 */
public record LorentzTerm(double weight, double resonance, double damping) {

    public LorentzTerm {
        if (!(weight >= 0) || Double.isInfinite(weight)) {
            throw new IllegalArgumentException(String.format(
                    "Lorentz weight Δε·ω0² %g rad²/s² must be finite and >= 0", weight));
        }
        Terms.checkRate("Lorentz resonance", resonance);
        Terms.checkRate("Lorentz damping", damping);
    }

    /** A term from its strength Δε (≥ 0), resonance ω0 and damping γ in rad/s. */
    public static LorentzTerm ofStrength(double strength, double resonance, double damping) {
        if (!(strength >= 0) || Double.isInfinite(strength)) {
            throw new IllegalArgumentException(String.format("Lorentz strength Δε %g must be finite and >= 0", strength));
        }
        return new LorentzTerm(strength * resonance * resonance, resonance, damping);
    }

    /** A term from Δε and ħω0, ħγ in eV. */
    public static LorentzTerm ofStrengthElectronVolts(double strength, double resonanceEv, double dampingEv) {
        return ofStrength(strength, Spectral.omegaOfElectronVolts(resonanceEv), Spectral.omegaOfElectronVolts(dampingEv));
    }

    /** A term in Rakić et al.'s form: oscillator strength f, plasma frequency ωp, resonance ω0, damping γ (rad/s). */
    public static LorentzTerm ofOscillator(double strength, double plasmaFrequency, double resonance, double damping) {
        if (!(strength >= 0) || Double.isInfinite(strength)) {
            throw new IllegalArgumentException(String.format("oscillator strength f %g must be finite and >= 0", strength));
        }
        Terms.checkRate("plasma frequency", plasmaFrequency);
        return new LorentzTerm(strength * plasmaFrequency * plasmaFrequency, resonance, damping);
    }

    /** {@link #ofOscillator} with ħωp, ħω0, ħγ in eV. */
    public static LorentzTerm ofOscillatorElectronVolts(double strength, double plasmaEv, double resonanceEv,
                                                        double dampingEv) {
        return ofOscillator(strength, Spectral.omegaOfElectronVolts(plasmaEv), Spectral.omegaOfElectronVolts(resonanceEv),
                Spectral.omegaOfElectronVolts(dampingEv));
    }

    /** Δε = W/ω0² (infinite when ω0 = 0 and W &gt; 0). */
    public double strength() {
        return weight / (resonance * resonance);
    }

    /** χ(ω) of this term alone, for ω &gt; 0 in rad/s. */
    public Complex susceptibility(double omega) {
        return Complex.real(weight).divide(new Complex(resonance * resonance - omega * omega, -damping * omega));
    }
}
