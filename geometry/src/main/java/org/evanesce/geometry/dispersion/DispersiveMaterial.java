package org.evanesce.geometry.dispersion;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.PhysicalConstants;

/**
 * A linear isotropic non-magnetic material whose permittivity depends on frequency: a background
 * permittivity, a conductivity, and any number of Drude and Lorentz terms.
 *
 * <h2>Continuous model</h2>
 * Time dependence exp(−iωt) (the project's convention, docs/architecture.md), ω in rad/s:
 * <pre>
 *     ε(ω) = ε∞ + iσ/(ε0 ω) − Σ_Drude ωp²/(ω² + iγω) + Σ_Lorentz W/(ω0² − ω² − iγω)
 * </pre>
 * so that ε = ε' + iε'' with ε'' ≥ 0 in a lossy (passive) material, and the complex index
 * n + iκ = √ε on the branch κ ≥ 0. Every term's imaginary part is ≥ 0 at every ω &gt; 0 when
 * σ ≥ 0 (the terms themselves refuse negative parameters), which is {@link #isPassive()}.
 *
 * <h2>Discrete model</h2>
 * The time stepping of {@link AdeCoefficients} realises, at a frequency ω and step Δt, the
 * permittivity
 * <pre>
 *     ε_d(ω, Δt) = ε(ω̃),   ω̃ = (2/Δt) tan(ωΔt/2)
 * </pre>
 * exactly: for fields ∝ exp(−iωnΔt) its discrete Ampère law reads −iΩ ε0 ε_d E = ∇×H with
 * Ω = (2/Δt) sin(ωΔt/2), the same Ω as in the vacuum Yee update, so the grid behaves as a Yee grid
 * filled with a material of permittivity ε_d (derivation in {@link AdeCoefficients}). Since ω̃ is
 * real, ε_d is passive wherever ε is; since ω̃ = ω(1 + (ωΔt)²/12 + …), ε_d − ε = O(Δt²).
 *
 * @param name         a label for messages and outputs
 * @param epsInfinity  ε∞, the background (high-frequency) relative permittivity; finite and &gt; 0
 *                     (the 2D Courant limit of a grid of this material is √ε∞/√2, see {@link #courantLimit})
 * @param conductivity σ in S/m, finite; negative values (gain) are accepted but are not passive
 * @param drude        the Drude terms (copied; may be empty)
 * @param lorentz      the Lorentz terms (copied; may be empty)
 */
public record DispersiveMaterial(String name, double epsInfinity, double conductivity, List<DrudeTerm> drude,
                                 List<LorentzTerm> lorentz) {

    public DispersiveMaterial {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("material name must not be blank");
        }
        if (!(epsInfinity > 0) || Double.isInfinite(epsInfinity)) {
            throw new IllegalArgumentException(String.format(
                    "material '%s': background permittivity ε∞ %g must be finite and > 0", name, epsInfinity));
        }
        if (!Double.isFinite(conductivity)) {
            throw new IllegalArgumentException(String.format(
                    "material '%s': conductivity %g S/m must be finite", name, conductivity));
        }
        drude = List.copyOf(drude);
        lorentz = List.copyOf(lorentz);
    }

    /** A material without poles: the same physics as {@link Material} (ε∞ = εr, the same σ). */
    public static DispersiveMaterial of(Material material) {
        return new DispersiveMaterial(material.name(), material.relativePermittivity(), material.conductivity(),
                List.of(), List.of());
    }

    /** Whether the material has Drude or Lorentz terms (and so needs the auxiliary currents). */
    public boolean hasPoles() {
        return !drude.isEmpty() || !lorentz.isEmpty();
    }

    /** Im ε(ω) ≥ 0 at every ω &gt; 0: true exactly when σ ≥ 0 (every term is passive by construction). */
    public boolean isPassive() {
        return conductivity >= 0;
    }

    /** ε(ω) of the continuous model at ω &gt; 0 (rad/s). */
    public Complex permittivity(double omega) {
        if (!(omega > 0) || Double.isInfinite(omega)) {
            throw new IllegalArgumentException(String.format(
                    "material '%s': angular frequency %g rad/s must be finite and > 0", name, omega));
        }
        Complex e = new Complex(epsInfinity, conductivity / (PhysicalConstants.EPS0 * omega));
        for (DrudeTerm d : drude) {
            e = e.plus(d.susceptibility(omega));
        }
        for (LorentzTerm l : lorentz) {
            e = e.plus(l.susceptibility(omega));
        }
        return e;
    }

    /** ε at a vacuum wavelength λ in metres. */
    public Complex permittivityAtWavelength(double wavelength) {
        return permittivity(Spectral.omegaOfWavelength(wavelength));
    }

    /**
     * ε_d(ω, Δt) = ε((2/Δt) tan(ωΔt/2)): what the time stepping of {@link AdeCoefficients} realises
     * at ω (see the class comment). Requires 0 &lt; ωΔt &lt; π (below the grid's Nyquist frequency).
     */
    public Complex discretePermittivity(double omega, double dt) {
        return permittivity(warpedFrequency(omega, dt));
    }

    /** n + iκ = √ε(ω) with κ ≥ 0. */
    public Complex index(double omega) {
        return permittivity(omega).sqrtUpper();
    }

    /** n + iκ = √ε_d(ω, Δt) with κ ≥ 0. */
    public Complex discreteIndex(double omega, double dt) {
        return discretePermittivity(omega, dt).sqrtUpper();
    }

    /**
     * The largest stable Courant number S = c0Δt/Δ of a uniform grid of this material in
     * {@code dimensions} (1 or 2) dimensions: √ε∞/√d. The discrete susceptibility of every term
     * vanishes at the Nyquist frequency (ω̃ → ∞), where the material is ε∞ alone, so the poles do
     * not lower the limit (tested by {@code AdeStabilityTest}); a grid that also holds vacuum is
     * limited by the vacuum's 1/√d when ε∞ ≥ 1.
     */
    public double courantLimit(int dimensions) {
        if (dimensions < 1 || dimensions > 3) {
            throw new IllegalArgumentException("dimensions " + dimensions + " must be 1, 2 or 3");
        }
        return Math.sqrt(epsInfinity / dimensions);
    }

    /**
     * ω̃ = (2/Δt) tan(ωΔt/2), the frequency at which the continuous model equals the discrete one
     * (the bilinear transform's frequency warping).
     */
    public static double warpedFrequency(double omega, double dt) {
        if (!(omega > 0) || !(dt > 0) || !(omega * dt < Math.PI)) {
            throw new IllegalArgumentException(String.format(
                    "discrete permittivity needs ω > 0, Δt > 0 and ωΔt < π (below Nyquist): ω = %g rad/s, Δt = %g s",
                    omega, dt));
        }
        return 2 / dt * Math.tan(omega * dt / 2);
    }

    /** Floats of auxiliary state each dispersive cell keeps: 1 + (Drude terms) + 2 × (Lorentz terms), or 0 without poles. */
    public int stateSize() {
        return hasPoles() ? 1 + drude.size() + 2 * lorentz.size() : 0;
    }

    /** The same model under another name. */
    public DispersiveMaterial withName(String newName) {
        return new DispersiveMaterial(newName, epsInfinity, conductivity, drude, lorentz);
    }
}
