package org.evanesce.geometry.dispersion;

import java.util.List;
import java.util.Locale;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;

/**
 * A passive model that reproduces one measured complex index n + iκ at one wavelength exactly.
 * One measurement fixes two numbers, so the model is as simple as possible and is only trustworthy
 * near that wavelength: say so to users, and look at {@link #atBandEnds}.
 *
 * <ul>
 * <li>Re ε &lt; 1 (metals, and anything with n² − κ² below one): ε∞ = 1 and one Drude term. With
 *     ε = a + ib at ω, 1 − ε = ωp²/(ω² + iγω) gives in closed form
 *     <pre>  γ = ω b/(1 − a),   ωp² = ω² ((1 − a)² + b²)/(1 − a)  </pre>
 *     both ≥ 0 exactly when a &lt; 1 and b ≥ 0 (P. Drude's free-electron model; the algebra is
 *     checked in {@code SingleIndexModelTest} by evaluating ε back).</li>
 * <li>Re ε ≥ 1 (dielectrics, lossy or not): the Drude form has no solution with γ ≥ 0 and ωp² &gt; 0,
 *     so ε∞ = a and a conductivity σ = ε0 ω b (ε = ε∞ + iσ/(ε0ω)).</li>
 * </ul>
 * Both are passive for all ω &gt; 0 (γ, ωp², σ ≥ 0; {@link DispersiveMaterial#isPassive()}), and
 * both are stable on the grid at the vacuum Courant limit (ε∞ ≥ 1).
 *
 * @param material   the model
 * @param kind       which form was used
 * @param index      the measured n + iκ
 * @param wavelength the wavelength of the measurement, m
 */
public record SingleIndexModel(DispersiveMaterial material, Kind kind, Complex index, double wavelength) {

    /** The form of the model. */
    public enum Kind {
        /** ε∞ = 1 and one Drude term. */
        DRUDE,
        /** ε∞ = Re ε and a conductivity. */
        CONDUCTIVE
    }

    /**
     * The model of a measured index {@code n + iκ} at vacuum wavelength {@code wavelength} (m).
     *
     * @throws IllegalArgumentException if κ &lt; 0 (gain), n &lt; 0, n = κ = 0, a value is not finite,
     *         or the wavelength is not finite and positive
     */
    public static SingleIndexModel of(String name, double n, double k, double wavelength) {
        if (!Double.isFinite(n) || !Double.isFinite(k) || n < 0 || k < 0 || (n == 0 && k == 0)) {
            throw new IllegalArgumentException(String.format(
                    "material '%s': measured index %g%+gi must have finite n >= 0 and k >= 0, not both 0"
                            + " (k < 0 is gain, not a passive material)", name, n, k));
        }
        if (!(wavelength > 0) || Double.isInfinite(wavelength)) {
            throw new IllegalArgumentException(String.format(
                    "material '%s': wavelength %g m must be finite and > 0", name, wavelength));
        }
        double omega = Spectral.omegaOfWavelength(wavelength);
        Complex idx = new Complex(n, k);
        Complex eps = idx.square();
        double a = eps.re();
        double b = eps.im();
        if (a < 1) {
            double u = 1 - a;
            double gamma = omega * b / u;
            double wp2 = omega * omega * (u * u + b * b) / u;
            DispersiveMaterial m = new DispersiveMaterial(name, 1, 0,
                    List.of(new DrudeTerm(Math.sqrt(wp2), gamma)), List.of());
            return new SingleIndexModel(m, Kind.DRUDE, idx, wavelength);
        }
        double sigma = PhysicalConstants.EPS0 * omega * b;
        return new SingleIndexModel(new DispersiveMaterial(name, a, sigma, List.of(), List.of()), Kind.CONDUCTIVE,
                idx, wavelength);
    }

    /**
     * The model with its provenance; its validity is the single measured wavelength, so every run's
     * band leaves it and earns the single-wavelength warning.
     */
    public SourcedMaterial sourced(String key, String data) {
        return new SourcedMaterial(key, material, kind == Kind.DRUDE
                ? "single Drude term through one measured index (evanesce SingleIndexModel)"
                : "background permittivity and conductivity through one measured index (evanesce SingleIndexModel)",
                data, new WavelengthBand(wavelength, wavelength), String.format(Locale.ROOT,
                "exact only at %.4g nm (n + ik = %s); a single-wavelength model", wavelength * 1e9, index));
    }

    /** ε of the model at the band's shortest and longest wavelengths, in that order. */
    public Complex[] atBandEnds(WavelengthBand band) {
        return new Complex[] {material.permittivityAtWavelength(band.shortest()),
                material.permittivityAtWavelength(band.longest())};
    }
}
