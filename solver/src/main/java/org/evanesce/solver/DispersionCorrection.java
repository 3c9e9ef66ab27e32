package org.evanesce.solver;

import org.evanesce.geometry.PhysicalConstants;

/**
 * Cancels the Yee grid's numerical dispersion for one plane-wave direction at one frequency, by
 * replacing each lossless material's relative permittivity with the value for which the
 * scheme's discrete normal wavenumber equals the exact one.
 *
 * <p>In a homogeneous medium of relative permittivity ε the 2D Yee scheme (square cells Δ, time
 * step Δt) carries e^{i(kx x + ky y − ωt)} when (Taflove &amp; Hagness, ch. 4)
 * ε sin²(ωΔt/2)/(c0Δt)² = sin²(kxΔ/2)/Δ² + sin²(kyΔ/2)/Δ², with sin²(kyΔ/2) → −sinh²(κΔ/2) for an
 * evanescent wave e^{−κy}. With kx fixed exactly (Bloch-periodic sides) and ky (or κ) set to the
 * continuum value, √(ε k0² − kx²), the relation gives the permittivity ε' the grid must use:
 * ε' = [sin²(kxΔ/2) ± sin²/sinh²(·Δ/2)] / Δ² · (c0Δt)² / sin²(ωΔt/2). Then the phase of a
 * propagating wave across a layer and the decay of an evanescent one (what sets the tunnelling
 * through a gap) are exact at that frequency and in-plane wavenumber; what remains is the error
 * at interfaces. Scaling material constants to cancel the phase error at one frequency is common
 * practice (e.g., from memory, J. S. Juntunen and T. D. Tsiboukis, IEEE Trans. Microwave Theory
 * Tech. 48, 582 (2000), with an anisotropic scaling for all directions).
 */
public final class DispersionCorrection {

    private DispersionCorrection() {
    }

    /**
     * @param epsilon relative permittivity of the lossless material, > 0
     * @param kx      the in-plane wavenumber of the run, rad/m
     * @param omega   angular frequency, rad/s
     * @param dx      cell size Δ, m
     * @param dt      time step Δt, s
     * @return ε' for the grid, > 0
     * @throws IllegalArgumentException when the grid cannot carry the wave at all (ε' would not be positive)
     */
    public static double permittivity(double epsilon, double kx, double omega, double dx, double dt) {
        if (!(epsilon > 0) || !(omega > 0) || !(dx > 0) || !(dt > 0) || !Double.isFinite(kx)) {
            throw new IllegalArgumentException(String.format("dispersion correction needs ε > 0, ω > 0, Δ > 0, Δt > 0 and "
                    + "a finite kx; got ε = %g, ω = %g, Δ = %g, Δt = %g, kx = %g", epsilon, omega, dx, dt, kx));
        }
        double k0 = omega / PhysicalConstants.C0;
        double q = epsilon * k0 * k0 - kx * kx;
        double half = Math.sqrt(Math.abs(q)) * dx / 2;
        double normal = q >= 0 ? Math.pow(Math.sin(half), 2) : -Math.pow(Math.sinh(half), 2);
        double time = Math.pow(Math.sin(omega * dt / 2) / (PhysicalConstants.C0 * dt), 2);
        double corrected = (Math.pow(Math.sin(kx * dx / 2), 2) + normal) / (dx * dx * time);
        if (!(corrected > 0)) {
            throw new IllegalArgumentException(String.format("the grid (Δ = %g m) cannot carry a wave of kx = %g rad/m in a "
                    + "medium of ε = %g: the corrected permittivity would be %g; refine the grid", dx, kx, epsilon, corrected));
        }
        return corrected;
    }
}
