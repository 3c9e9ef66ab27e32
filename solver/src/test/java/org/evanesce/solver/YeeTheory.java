package org.evanesce.solver;

/**
 * Closed forms of the discrete Yee scheme used as test oracles, in cell units (Δ = 1, Δt = 1
 * step; wavenumbers in radians per cell, ω in radians per step).
 */
final class YeeTheory {

    private YeeTheory() {
    }

    /**
     * Numerical wavenumber along a grid axis in a medium εr: the 2D Yee dispersion relation
     * [sin(ωΔt/2)/(cΔt)]² = [sin(k̃xΔx/2)/Δx]² + [sin(k̃yΔy/2)/Δy]² (Taflove &amp; Hagness,
     * ch. 4, from memory) with k̃y = 0 and c = c0/√εr gives sin(k̃/2) = √εr sin(ω/2)/S.
     */
    static double axisWavenumber(double omega, double courant, double eps) {
        return 2 * Math.asin(Math.sqrt(eps) * Math.sin(omega / 2) / courant);
    }

    /** The same relation along the diagonal, k̃x = k̃y = k̃/√2: sin(k̃/(2√2)) = sin(ω/2)/(S√2). */
    static double diagonalWavenumber(double omega, double courant) {
        return 2 * Math.sqrt(2) * Math.asin(Math.sin(omega / 2) / (courant * Math.sqrt(2)));
    }

    /**
     * Exact reflection coefficient of the discrete scheme at a permittivity step at normal
     * incidence, for the electric field sampled on nodes, with ε1 on nodes i &lt; m and ε2 on
     * nodes i ≥ m, referred to node m: r = (e^{−ik1} − e^{−ik2}) / (e^{−ik2} − e^{ik1}).
     * This is the finite-grid coefficient of J. B. Schneider, Understanding the FDTD Method
     * (2010), chapter on dispersion, impedance, reflection and transmission; it is derived here
     * again from the update equations (continuity of the node field at m and the update at node m),
     * and its continuum limit is the Fresnel (n1 − n2)/(n1 + n2). Returns {re, im}.
     */
    static double[] stepReflection(double k1, double k2) {
        double[] num = {Math.cos(k1) - Math.cos(k2), -Math.sin(k1) + Math.sin(k2)};
        double[] den = {Math.cos(k2) - Math.cos(k1), -Math.sin(k2) - Math.sin(k1)};
        return Dft.div(num, den);
    }
}
