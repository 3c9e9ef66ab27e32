package org.evanesce.io;

import org.evanesce.geometry.Complex;

/**
 * Reflectance and transmittance of one absorbing film between two transparent media, by the Airy
 * summation of the multiply reflected waves (M. Born &amp; E. Wolf, <i>Principles of Optics</i>, 7th ed.,
 * 1999, sec. 1.6.4, eqs. (57)-(58) for a single film, and sec. 13.4 for an absorbing one, where the film's
 * index is complex; equation numbers from memory). Written here from the Fresnel coefficients alone, not
 * through the program's characteristic matrix, so that it checks that matrix and the simulation.
 *
 * <p>Time dependence exp(−iωt). With kx the in-plane wavenumber and kz_j = sqrt(ε_j k0² − kx²) (Im ≥ 0),
 * the admittance-like q_j is kz_j for s (E amplitudes) and kz_j/ε_j for p (H amplitudes); the interface
 * coefficients are r_jk = (q_j − q_k)/(q_j + q_k), t_jk = 2q_j/(q_j + q_k); with β = kz_1 d:
 * r = (r01 + r12 e^{2iβ})/(1 + r01 r12 e^{2iβ}), t = t01 t12 e^{iβ}/(1 + r01 r12 e^{2iβ}),
 * R = |r|², T = Re q_2/Re q_0 |t|² (the Poynting flux along the normal, Hecht, <i>Optics</i>, 4th ed., sec. 4.6).
 */
final class AbsorbingFilmAiry {

    /** R and T of the film. */
    record Result(double reflectance, double transmittance) {
    }

    private AbsorbingFilmAiry() {
    }

    /**
     * @param p          true for p polarization (H along the film's face), false for s
     * @param n0         the incidence medium's (real) index
     * @param film       the film's relative permittivity (Im ≥ 0 for loss)
     * @param thickness  the film's thickness in metres
     * @param n2         the exit medium's (real) index
     * @param wavelength the vacuum wavelength in metres
     * @param theta      the angle of incidence in the incidence medium, radians
     */
    static Result of(boolean p, double n0, Complex film, double thickness, double n2, double wavelength, double theta) {
        double k0 = 2 * Math.PI / wavelength;
        double kx = k0 * n0 * Math.sin(theta);
        Complex[] eps = {Complex.real(n0 * n0), film, Complex.real(n2 * n2)};
        Complex[] kz = new Complex[3];
        Complex[] q = new Complex[3];
        for (int j = 0; j < 3; j++) {
            kz[j] = eps[j].times(k0 * k0).minus(kx * kx).sqrtUpper();
            q[j] = p ? kz[j].divide(eps[j]) : kz[j];
        }
        Complex r01 = q[0].minus(q[1]).divide(q[0].plus(q[1]));
        Complex r12 = q[1].minus(q[2]).divide(q[1].plus(q[2]));
        Complex t01 = q[0].times(2).divide(q[0].plus(q[1]));
        Complex t12 = q[1].times(2).divide(q[1].plus(q[2]));
        Complex once = kz[1].times(thickness).timesI().exp();
        Complex twice = once.square();
        Complex denominator = Complex.ONE.plus(r01.times(r12).times(twice));
        Complex r = r01.plus(r12.times(twice)).divide(denominator);
        Complex t = t01.times(t12).times(once).divide(denominator);
        return new Result(r.norm(), q[2].re() / q[0].re() * t.norm());
    }
}
