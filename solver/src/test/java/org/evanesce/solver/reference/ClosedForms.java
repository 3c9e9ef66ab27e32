package org.evanesce.solver.reference;

import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;

/**
 * Textbook closed forms the transfer matrix is tested against, written from the books' angle forms
 * (n cos θ), not from the admittances {@link PlanarStack} uses.
 */
final class ClosedForms {

    private ClosedForms() {
    }

    /**
     * n_j cos θ_j in medium j of index n for an incident ray n1 sin θ1 (Snell's law), with the root
     * taken so that Im ≥ 0 (complex cos θ beyond the critical angle or in a lossy medium; Born &amp; Wolf
     * sec. 1.5.4 and sec. 14.2, where the Fresnel formulae keep their form with complex angles).
     */
    static Complex nCos(Complex n, double n1SinTheta) {
        return n.square().minus(n1SinTheta * n1SinTheta).sqrtUpper();
    }

    /**
     * Fresnel amplitude reflection coefficient for E, Hecht, Optics, 4th ed., sec. 4.6, eqs. (4.34) for ⊥ and
     * (4.40) for ∥ (equation numbers from memory):
     * r⊥ = (n_i cos θi − n_t cos θt)/(n_i cos θi + n_t cos θt),
     * r∥ = (n_t cos θi − n_i cos θt)/(n_i cos θt + n_t cos θi).
     * Hecht's r∥ is also the ratio of reflected to incident H (his sign convention for E∥).
     */
    static Complex fresnelR(Polarization pol, Complex ni, Complex nt, double n1SinTheta) {
        Complex ci = nCos(ni, n1SinTheta).divide(ni); // cos θi
        Complex ct = nCos(nt, n1SinTheta).divide(nt); // cos θt
        if (pol == Polarization.S) {
            Complex a = ni.times(ci);
            Complex b = nt.times(ct);
            return a.minus(b).divide(a.plus(b));
        }
        Complex a = nt.times(ci);
        Complex b = ni.times(ct);
        return a.minus(b).divide(a.plus(b));
    }

    /**
     * Fresnel amplitude transmission coefficient for E, Hecht sec. 4.6, eqs. (4.35) and (4.41) (numbers
     * from memory): t⊥ = 2 n_i cos θi/(n_i cos θi + n_t cos θt), t∥ = 2 n_i cos θi/(n_i cos θt + n_t cos θi).
     */
    static Complex fresnelTE(Polarization pol, Complex ni, Complex nt, double n1SinTheta) {
        Complex ci = nCos(ni, n1SinTheta).divide(ni);
        Complex ct = nCos(nt, n1SinTheta).divide(nt);
        Complex num = ni.times(ci).times(2);
        if (pol == Polarization.S) {
            return num.divide(ni.times(ci).plus(nt.times(ct)));
        }
        return num.divide(ni.times(ct).plus(nt.times(ci)));
    }

    /**
     * The transmission coefficient in the amplitudes {@link PlanarStack} uses: E for s; H for p, where
     * |H| = n|E|/η0 turns Hecht's t∥ into (n_t/n_i)·t∥ (common practice).
     */
    static Complex fresnelT(Polarization pol, Complex ni, Complex nt, double n1SinTheta) {
        Complex t = fresnelTE(pol, ni, nt, n1SinTheta);
        return pol == Polarization.S ? t : t.times(nt).divide(ni);
    }

    /** Hecht sec. 4.6, T = (n_t cos θt)/(n_i cos θi)·|t|² for either polarization with E amplitudes (real media). */
    static double fresnelPowerT(Polarization pol, double ni, double nt, double n1SinTheta) {
        Complex t = fresnelTE(pol, Complex.real(ni), Complex.real(nt), n1SinTheta);
        double ct = nCos(Complex.real(nt), n1SinTheta).re();
        double ci = nCos(Complex.real(ni), n1SinTheta).re();
        return ct / ci * t.norm();
    }
}
