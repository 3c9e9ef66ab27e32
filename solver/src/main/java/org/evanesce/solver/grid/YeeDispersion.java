package org.evanesce.solver.grid;

/**
 * The 2D Yee grid's dispersion relation in a homogeneous lossless medium: the numerical wavenumber of the grid's
 * own plane wave along a direction (A. Taflove &amp; S. C. Hagness, <i>Computational Electrodynamics</i>, 3rd ed.,
 * 2005, ch. 4). With e^{i(k̃x x + k̃y y − ωt)}, S = c0Δt/Δ and W = sin(ωΔt/2),
 * <pre>  sin²(k̃xΔ/2) + sin²(k̃yΔ/2) = ε W²/S².  </pre>
 * In the lowest package so that both the sources (the incident field of a total-field box) and the far-field
 * transformation (the grid's outgoing waves) ask it, without a circle between them.
 */
public final class YeeDispersion {

    private YeeDispersion() {
    }

    /**
     * The numerical wavenumber k̃ of the grid's plane wave along (cos φ, sin φ), rad/m, or NaN when the
     * grid carries no propagating wave of this frequency in that direction (beyond its cut-off).
     *
     * @param epsilon   the grid's relative permittivity, &gt; 0
     * @param direction φ, radians from +x
     * @param omega     ω, rad/s (&gt; 0)
     * @param dx        Δ, m
     * @param courant   S
     */
    public static double wavenumber(double epsilon, double direction, double omega, double dx, double courant) {
        double dt = courant * dx / org.evanesce.geometry.PhysicalConstants.C0;
        double w = Math.sin(omega * dt / 2);
        double target = epsilon * w * w / (courant * courant);
        double c = Math.abs(Math.cos(direction));
        double s = Math.abs(Math.sin(direction));
        double hi = Math.PI / (dx * Math.max(c, s));
        if (!(target > 0) || target > residual(hi, c, s, dx, 0)) {
            return Double.NaN;
        }
        double lo = 0;
        for (int it = 0; it < 200 && hi - lo > 1e-15 * hi; it++) {
            double mid = 0.5 * (lo + hi);
            if (residual(mid, c, s, dx, target) < 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    private static double residual(double k, double c, double s, double dx, double target) {
        double a = Math.sin(k * c * dx / 2);
        double b = Math.sin(k * s * dx / 2);
        return a * a + b * b - target;
    }
}
