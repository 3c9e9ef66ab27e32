package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.geometry.dispersion.Spectral;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.api.Test;

/**
 * The Kretschmann surface-plasmon dip (E. Kretschmann &amp; H. Raether, Z. Naturforsch. 23a, 2135
 * (1968)): crown glass n = 1.515 / gold film / water n = 1.333, 633 nm, p polarization, computed by
 * the transfer matrix with the dispersive gold of geometry's library, and compared with the surface
 * plasmon of the gold–water interface, k_spp = k0 √(εm εd/(εm + εd)) (H. Raether, <i>Surface Plasmons
 * on Smooth and Rough Surfaces and on Gratings</i> (1988), ch. 2, from memory): n_glass sin θ =
 * Re(k_spp)/k0.
 *
 * <p>The estimate ignores the prism, which shifts and broadens a thin film's resonance (radiation
 * damping, Raether ch. 2). In the three-media Airy form r = (r12 + r23 e)/(1 + r12 r23 e),
 * e = exp(2i kz_m d), the resonance is the pole of r in complex kx: with r_ij = (q_i − q_j)/(q_i + q_j),
 * q = kz/ε (p), it solves (q_m + q_w) + r12 (q_m − q_w) e = 0, which for d → ∞ (e → 0) is
 * q_m + q_w = 0, the plasmon's dispersion relation itself, so k_pole − k_spp ∝ exp(−2 Im kz_m d). The
 * angle of least reflectance is a poor locator for thick films: their dip is shallow on a sloping
 * background and moves back and forth around the estimate (measured with Rakić's gold: −0.54° at 50 nm,
 * +0.01° at 60 nm, +0.38° at 80 nm, −0.27° at 100 nm, none beyond 110 nm), so the thick-film limit is
 * shown on the pole.
 */
class KretschmannTest {

    static final double LAMBDA = 633e-9;
    static final double K0 = 2 * Math.PI / LAMBDA;
    static final double GLASS = 1.515;
    static final double WATER = 1.333;
    /**
     * Least-reflectance angle of a 50 nm film minus the estimate: measured −0.539° (Rakić gold) and
     * −0.251° (gold-jc); Raether's radiation shift of a near-critically coupled film is a fraction of
     * a degree, hence 1°.
     */
    static final double THIN_FILM_SHIFT_DEG = 1.0;
    /**
     * Pole angle of an 80 nm film minus the estimate: measured −0.001° (Rakić) and −0.003° (gold-jc),
     * against −0.606° and −0.265° at 50 nm; hence 0.03°.
     */
    static final double THICK_FILM_POLE_DEG = 0.03;
    /** The independent three-media formula against PlanarStack: rounding, measured 3.6e-15. */
    static final double AIRY_AGREEMENT = 4e-14;

    record Dip(double angleDeg, double reflectance) {
    }

    /** Minimum of R(θ), p, on a 0.002° grid, refined by a parabola through the three nearest points. */
    static Dip dip(Complex gold, double thickness) {
        PlanarStack stack = new PlanarStack(GLASS, List.of(new PlanarStack.Layer(gold, thickness)), Complex.real(WATER));
        double step = 0.002;
        double best = Double.POSITIVE_INFINITY;
        double bestAngle = 0;
        for (double a = 62; a <= 89; a += step) {
            double r = stack.atAngle(Polarization.P, LAMBDA, Math.toRadians(a)).reflectance();
            if (r < best) {
                best = r;
                bestAngle = a;
            }
        }
        double rm = stack.atAngle(Polarization.P, LAMBDA, Math.toRadians(bestAngle - step)).reflectance();
        double rp = stack.atAngle(Polarization.P, LAMBDA, Math.toRadians(bestAngle + step)).reflectance();
        double shift = 0.5 * step * (rm - rp) / (rm - 2 * best + rp);
        return new Dip(bestAngle + shift, best);
    }

    static Complex kz(Complex eps, Complex kx) {
        return eps.times(K0 * K0).minus(kx.times(kx)).sqrtUpper();
    }

    /** q = kz/ε of glass, metal, water at in-plane wavenumber kx (p polarization). */
    static Complex[] q(Complex epsMetal, Complex kx) {
        Complex eg = Complex.real(GLASS * GLASS);
        Complex ew = Complex.real(WATER * WATER);
        return new Complex[] {kz(eg, kx).divide(eg), kz(epsMetal, kx).divide(epsMetal), kz(ew, kx).divide(ew)};
    }

    /** The three-media Airy reflection coefficient (p), independent of PlanarStack. */
    static Complex airy(Complex epsMetal, double d, Complex kx) {
        Complex[] q = q(epsMetal, kx);
        Complex r12 = q[0].minus(q[1]).divide(q[0].plus(q[1]));
        Complex r23 = q[1].minus(q[2]).divide(q[1].plus(q[2]));
        Complex e = kz(epsMetal, kx).times(2 * d).timesI().exp();
        return r12.plus(r23.times(e)).divide(Complex.ONE.plus(r12.times(r23).times(e)));
    }

    /** (q_m + q_w) + r12 (q_m − q_w) e, whose zero is the pole of r. */
    static Complex poleFunction(Complex epsMetal, double d, Complex kx) {
        Complex[] q = q(epsMetal, kx);
        Complex r12 = q[0].minus(q[1]).divide(q[0].plus(q[1]));
        Complex e = kz(epsMetal, kx).times(2 * d).timesI().exp();
        return q[1].plus(q[2]).plus(r12.times(q[1].minus(q[2])).times(e));
    }

    /** The pole of r by the secant method from k_spp. */
    static Complex pole(Complex epsMetal, double d, Complex start) {
        Complex a = start;
        Complex b = start.times(1.001);
        Complex fa = poleFunction(epsMetal, d, a);
        for (int it = 0; it < 100; it++) {
            Complex fb = poleFunction(epsMetal, d, b);
            Complex next = b.minus(fb.times(b.minus(a)).divide(fb.minus(fa)));
            a = b;
            fa = fb;
            b = next;
            if (b.minus(a).abs() < 1e-13 * b.abs()) {
                return b;
            }
        }
        throw new AssertionError("pole search did not converge for d = " + d);
    }

    static double angleDeg(double kx) {
        return Math.toDegrees(Math.asin(kx / (K0 * GLASS)));
    }

    @Test
    void dipLiesNearTheSurfacePlasmonEstimateAndThePoleApproachesItForAThickFilm() {
        for (String key : List.of("gold", "gold-jc")) {
            DispersiveMaterial gold = MetalLibrary.get(key).material();
            double omega = Spectral.omegaOfWavelength(LAMBDA);
            Complex eps = gold.permittivity(omega);
            Complex n = gold.index(omega);
            Complex ew = Complex.real(WATER * WATER);
            Complex kspp = eps.times(ew).divide(eps.plus(ew)).sqrt().times(K0);
            double estimate = angleDeg(kspp.re());

            // the independent Airy form agrees with PlanarStack at real angles
            double airyWorst = 0;
            for (double deg = 60; deg < 85; deg += 0.7) {
                double kx = K0 * GLASS * Math.sin(Math.toRadians(deg));
                double rPs = new PlanarStack(GLASS, List.of(new PlanarStack.Layer(n, 50e-9)), Complex.real(WATER))
                        .atAngle(Polarization.P, LAMBDA, Math.toRadians(deg)).reflectance();
                double rAiry = airy(eps, 50e-9, Complex.real(kx)).norm();
                assertEquals(rPs, rAiry, AIRY_AGREEMENT, key + " at " + deg + "°");
                airyWorst = Math.max(airyWorst, Math.abs(rPs - rAiry));
            }
            System.out.printf("%s: Airy form against PlanarStack, largest |ΔR| %.2g%n", key, airyWorst);

            Dip thin = dip(n, 50e-9);
            Dip thick = dip(n, 80e-9);
            double pole50 = angleDeg(pole(eps, 50e-9, kspp).re());
            double pole80 = angleDeg(pole(eps, 80e-9, kspp).re());
            System.out.printf("%s: ε(633 nm) = %s; SPP estimate %.3f°; least R: 50 nm %.3f° (R %.4f), 80 nm %.3f°"
                            + " (R %.4f); pole of r: 50 nm %.3f°, 80 nm %.3f°%n", key, eps, estimate, thin.angleDeg(),
                    thin.reflectance(), thick.angleDeg(), thick.reflectance(), pole50, pole80);
            assertEquals(estimate, thin.angleDeg(), THIN_FILM_SHIFT_DEG, key + " 50 nm dip");
            assertTrue(thin.reflectance() < 0.2, key + ": a 50 nm film couples nearly critically");
            assertTrue(Math.abs(pole80 - estimate) < Math.abs(pole50 - estimate) / 3,
                    key + ": the pole should approach the estimate as the film thickens");
            assertEquals(estimate, pole80, THICK_FILM_POLE_DEG, key + " 80 nm pole");

            // the discrete ε at 20 cells per wavelength in the glass, S = 0.5: what a run would realise
            double dt = 0.5 * (LAMBDA / GLASS / 20) / PhysicalConstants.C0;
            Dip discrete = dip(gold.discreteIndex(omega, dt), 50e-9);
            System.out.printf("%s: with the discrete ε (20 cells per wavelength in glass, S = 0.5): 50 nm dip %.3f°%n",
                    key, discrete.angleDeg());
        }
    }
}
