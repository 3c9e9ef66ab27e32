package org.evanesce.solver.source;

import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.YeeDispersion;

/**
 * The 2D Yee grid's own plane wave in a homogeneous lossless medium: its numerical wavenumber at a
 * direction and the ratios of its components, so that a source can hand the grid a wave that the
 * grid itself carries unchanged (the basis of a total-field/scattered-field boundary without
 * leakage; A. Taflove &amp; S. C. Hagness, <i>Computational Electrodynamics</i>, 3rd ed., 2005, ch. 4
 * for the dispersion relation, ch. 5 for its use in the incident field).
 *
 * <p>Units as in the kernels: S = c0Δt/Δ, fields Ez, Ex, Ey in V/m and H as η0·H. With
 * e^{i(k̃x x + k̃y y − ωt)}, W = sin(ωΔt/2), the scheme's dispersion relation is
 * <pre>  sin²(k̃xΔ/2) + sin²(k̃yΔ/2) = ε W²/S²,  </pre>
 * and the update equations tie the components (each at its own site and time, E at whole and H at
 * half steps; derived from the kernels' update lines):
 * s: η0Hx = S sin(k̃yΔ/2)/W · Ez, η0Hy = −S sin(k̃xΔ/2)/W · Ez;
 * p: Ex = −(S/ε) sin(k̃yΔ/2)/W · η0Hz, Ey = (S/ε) sin(k̃xΔ/2)/W · η0Hz.
 * As Δ → 0 these tend to the continuum's k_y/k0, −k_x/k0, −k_y/(εk0), k_x/(εk0).
 */
public final class GridWave {

    private GridWave() {
    }

    /**
     * The numerical wavenumber k̃ of the grid's plane wave along (cos φ, sin φ), rad/m, or NaN beyond the grid's
     * cut-off: {@link YeeDispersion#wavenumber} (the relation lives in the lowest package, so that the far-field
     * transformation asks it too).
     */
    public static double wavenumber(double epsilon, double direction, double omega, double dx, double courant) {
        return YeeDispersion.wavenumber(epsilon, direction, omega, dx, courant);
    }

    /**
     * The ratio of component {@code c} to the z component (Ez for s, η0Hz for p) of the grid's plane wave
     * with wavenumber (kx, ky), both at the same place, each at its own time level: the factors of the class
     * comment (1 for the z component). Real for a propagating wave.
     *
     * @param w sin(ωΔt/2)
     */
    public static double ratio(Component c, double kx, double ky, double epsilon, double dx, double courant, double w) {
        return switch (c) {
            case EZ, HZ -> 1.0;
            case HX -> courant * Math.sin(ky * dx / 2) / w;
            case HY -> -courant * Math.sin(kx * dx / 2) / w;
            case EX -> -courant / epsilon * Math.sin(ky * dx / 2) / w;
            case EY -> courant / epsilon * Math.sin(kx * dx / 2) / w;
        };
    }

    /** e^{i(kx x + ky y)}. */
    static Complex phase(double kx, double ky, double x, double y) {
        return Complex.polar(1, kx * x + ky * y);
    }
}
