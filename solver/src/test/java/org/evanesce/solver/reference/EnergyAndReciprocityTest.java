package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/** Invariants of the transfer matrix: energy, reciprocity, the absorbed power and the matrix itself. */
class EnergyAndReciprocityTest {

    /**
     * R + T = 1 without loss: the algebra conserves flux exactly, so only rounding remains. About 1e-15 for a gap
     * or a slab; stacks several microns thick of index up to 2.5, with guided-mode resonances between evanescent
     * layers, amplify it to a few 1e-14 (measured).
     */
    private static final double LOSSLESS = 1e-13;
    /** T from either side: the same algebra in another order; rounding only (measured ~1e-15 relative). */
    private static final double RECIPROCAL = 1e-13;
    /**
     * A from Poynting's theorem: Simpson's rule on 4000 intervals per layer; the integrand varies on the
     * scale of a wavelength or a skin depth (20 nm in a micron of metal-like layer), so the rule's h⁴ error is
     * about 1e-11 to 1e-10 (measured at most 1.4e-10).
     */
    private static final double POYNTING = 1e-9;
    private static final double WAVELENGTH = 633e-9;

    private static PlanarStack randomStack(Random rnd, boolean lossy, double n1, double ne) {
        int count = 1 + rnd.nextInt(6);
        List<PlanarStack.Layer> layers = new ArrayList<>();
        for (int k = 0; k < count; k++) {
            double n = 1.0 + 1.5 * rnd.nextDouble();
            double kappa = lossy ? (rnd.nextInt(4) == 0 ? 3 * rnd.nextDouble() : 0.1 * rnd.nextDouble()) : 0;
            layers.add(new PlanarStack.Layer(Complex.of(n, kappa), 1e-6 * rnd.nextDouble()));
        }
        return new PlanarStack(n1, layers, Complex.real(ne));
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void losslessStacksConserveEnergyAtAllAnglesIncludingBeyondCritical(Polarization pol) {
        // common practice: without absorption, what is not reflected is transmitted (Born & Wolf sec. 1.6);
        // gaps of index 1.0 in 1.5–1.8 glass make many of these angles tunnelling ones
        Random rnd = new Random(4);
        double worst = 0;
        for (int c = 0; c < 300; c++) {
            double n1 = 1.5 + 0.3 * rnd.nextDouble();
            PlanarStack st = randomStack(rnd, false, n1, c % 3 == 0 ? 1.0 : n1);
            for (int a = 0; a < 31; a++) {
                double deg = 2.9 * a;
                PlanarStack.Response resp = st.atAngle(pol, WAVELENGTH, Math.toRadians(deg));
                double sum = resp.reflectance() + resp.transmittance();
                worst = Math.max(worst, Math.abs(sum - 1));
                assertEquals(1.0, sum, LOSSLESS, () -> pol + " " + st + " at " + deg + " deg");
                assertTrue(resp.transmittance() >= 0 && resp.reflectance() >= 0, () -> st + " at " + deg + " deg");
            }
        }
        System.out.printf("lossless %s: largest |R + T − 1| = %.3g%n", pol, worst);
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void transmittanceIsTheSameFromEitherSideEvenWithLoss(Polarization pol) {
        // reciprocity of transmission through any linear, reciprocal stack, lossy or not (Yeh, Optical Waves in
        // Layered Media, ch. 5; common practice). Reflectance differs from the two sides when the stack absorbs,
        // which the test also sees, so the check is not trivially symmetric.
        Random rnd = new Random(11);
        double worst = 0;
        int differentR = 0;
        for (int c = 0; c < 200; c++) {
            double n1 = 1.0 + 0.8 * rnd.nextDouble();
            double ne = 1.0 + 0.8 * rnd.nextDouble();
            PlanarStack st = randomStack(rnd, true, n1, ne);
            PlanarStack back = st.reversed();
            double k0 = 2 * Math.PI / WAVELENGTH;
            for (double f = 0; f < 0.999; f += 0.061) {
                double kx = f * Math.min(n1, ne) * k0;
                PlanarStack.Response a = st.atTransverseWavenumber(pol, WAVELENGTH, kx);
                PlanarStack.Response b = back.atTransverseWavenumber(pol, WAVELENGTH, kx);
                double rel = Math.abs(a.transmittance() - b.transmittance()) / Math.max(a.transmittance(), 1e-300);
                worst = Math.max(worst, rel);
                double fx = f;
                assertTrue(rel <= RECIPROCAL, () -> pol + " " + st + " kx/(n k0) " + fx + ": T " + a.transmittance()
                        + " forward, " + b.transmittance() + " back");
                if (Math.abs(a.reflectance() - b.reflectance()) > 1e-3) {
                    differentR++;
                }
            }
        }
        assertTrue(differentR > 100, "lossy stacks should reflect differently from the two sides: " + differentR);
        System.out.printf("reciprocity %s: largest relative T difference %.3g%n", pol, worst);
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void absorptanceIsNonNegativeAndEqualsThePowerDissipatedInTheLayers(Polarization pol) {
        // Poynting's theorem for time-harmonic fields (J. D. Jackson, Classical Electrodynamics, 3rd ed., sec. 6.9;
        // section number from memory): the power absorbed per unit volume is ½ ω ε0 Im(ε) |E|². We rebuild the
        // field inside the layers by propagating (U, V) from the top of the stack ourselves, integrate, divide by
        // the incident flux and compare with A = 1 − R − T. Dividing out ½ and the constants (see PlanarStack):
        //   s: A = k0 Im ε ∫|U|² dz / Re Q1,   p: A = Im ε ∫ (k0 |V|² + (kx²/k0) |U|²/|ε|²) dz / Re Q1,
        // with U = E_y (s) or H_y (p), V = ∂U/∂z / (i k0 f), f = 1 (s) or ε (p), and for p E_x = (k0/ωε0) V,
        // E_z = −kx H_y/(ωε0 ε). Here Q1 = k1z/k0 (s) or k1z/(k0 n1²) (p).
        Random rnd = new Random(7);
        double worst = 0;
        for (int c = 0; c < 40; c++) {
            double n1 = 1.4 + 0.4 * rnd.nextDouble();
            PlanarStack st = randomStack(rnd, true, n1, 1.0 + 0.5 * rnd.nextDouble());
            for (int a = 0; a < 8; a++) {
                double deg = 11.3 * a;
                double th = Math.toRadians(deg);
                PlanarStack.Response resp = st.atAngle(pol, WAVELENGTH, th);
                double dissipated = dissipated(pol, st, th, resp);
                worst = Math.max(worst, Math.abs(dissipated - resp.absorptance()));
                assertEquals(dissipated, resp.absorptance(), POYNTING, () -> pol + " " + st + " at " + deg + " deg");
                assertTrue(resp.absorptance() >= -LOSSLESS, () -> pol + " " + st + " at " + deg + " deg: A < 0");
            }
        }
        // a strongly absorbing film beyond the critical angle: glass | metal-like film 50 nm | air (index from
        // memory, for illustration): every angle, A between 0 and 1
        PlanarStack film = new PlanarStack(1.515, List.of(new PlanarStack.Layer(Complex.of(0.2, 3.4), 50e-9)),
                Complex.real(1.0));
        for (double deg = 0; deg < 89.95; deg += 0.1) {
            double th = Math.toRadians(deg);
            PlanarStack.Response resp = film.atAngle(pol, WAVELENGTH, th);
            assertTrue(resp.absorptance() >= 0 && resp.absorptance() <= 1, pol + " film at " + deg + " deg: A = "
                    + resp.absorptance());
            assertEquals(dissipated(pol, film, th, resp), resp.absorptance(), POYNTING, pol + " film at " + deg);
        }
        System.out.printf("Poynting %s: largest |A − dissipated| = %.3g%n", pol, worst);
    }

    /**
     * The power dissipated in the layers over the incident power, by Simpson's rule (see the test above). The
     * fields come from the transmitted wave (U, V) = (t, Qe t) at the bottom of the stack, carried upward layer by
     * layer with each layer's matrix (the direction in which the dominant, decaying-downward wave grows, so nothing
     * cancels); inside a layer the field is split into a downward wave referred to the layer's top and an upward
     * one referred to its bottom, U(z) = A e^{ikz z} + B e^{ikz(d − z)}, both bounded. On arrival at the top the
     * fields must be (1 + r, Q1 (1 − r)), which checks r against t as well.
     */
    private static double dissipated(Polarization pol, PlanarStack st, double theta, PlanarStack.Response resp) {
        double k0 = 2 * Math.PI / WAVELENGTH;
        double n1 = st.incidentIndex();
        double kx = n1 * k0 * Math.sin(theta);
        double q1 = pol == Polarization.S ? n1 * Math.cos(theta) : Math.cos(theta) / n1;
        int count = st.layers().size();
        Complex[] kz = new Complex[count];
        Complex[] q = new Complex[count];
        Complex[] u = new Complex[count + 1]; // U at the top of layer j; u[count] at the bottom of the stack
        Complex[] v = new Complex[count + 1];
        Complex ne = st.exitIndex();
        Complex kze = ne.square().times(k0 * k0).minus(kx * kx).sqrtUpper();
        Complex qe = pol == Polarization.S ? kze.divide(k0) : kze.divide(ne.square().times(k0));
        u[count] = resp.t();
        v[count] = qe.times(resp.t());
        for (int j = count - 1; j >= 0; j--) {
            PlanarStack.Layer layer = st.layers().get(j);
            Complex eps = layer.index().square();
            kz[j] = eps.times(k0 * k0).minus(kx * kx).sqrtUpper();
            q[j] = kz[j].divide((pol == Polarization.S ? Complex.ONE : eps).times(k0));
            Complex delta = kz[j].times(layer.thickness());
            Complex c = delta.cos();
            Complex s = delta.sin();
            // (U, V)_top = [cos δ, −i sin δ / Q; −i Q sin δ, cos δ] (U, V)_bottom
            u[j] = u[j + 1].times(c).minus(v[j + 1].times(s).divide(q[j]).timesI());
            v[j] = v[j + 1].times(c).minus(q[j].times(u[j + 1]).times(s).timesI());
        }
        Complex topU = Complex.ONE.plus(resp.r());
        Complex topV = Complex.ONE.minus(resp.r()).times(q1);
        assertTrue(topU.minus(u[0]).abs() <= RECIPROCAL * Math.max(1, u[0].abs())
                && topV.minus(v[0]).abs() <= RECIPROCAL * Math.max(1, v[0].abs()),
                () -> pol + " " + st + ": fields carried up from t = " + resp.t() + " give U, V = " + u[0] + ", " + v[0]
                        + " at the top, not " + topU + ", " + topV);
        double total = 0;
        for (int j = 0; j < count; j++) {
            PlanarStack.Layer layer = st.layers().get(j);
            Complex eps = layer.index().square();
            double d = layer.thickness();
            Complex down = u[j].plus(v[j].divide(q[j])).times(0.5);
            Complex up = u[j + 1].minus(v[j + 1].divide(q[j])).times(0.5);
            int steps = 4000;
            double h = d / steps;
            double sum = 0;
            for (int i = 0; i <= steps; i++) {
                double z = i * h;
                Complex a = down.times(kz[j].times(z).timesI().exp());
                Complex b = up.times(kz[j].times(d - z).timesI().exp());
                Complex uz = a.plus(b);
                Complex vz = q[j].times(a.minus(b));
                double w = i == 0 || i == steps ? 1 : (i % 2 == 1 ? 4 : 2);
                double density = pol == Polarization.S ? k0 * uz.norm()
                        : k0 * vz.norm() + kx * kx / k0 * uz.norm() / eps.norm();
                sum += w * density;
            }
            total += eps.im() * sum * h / 3;
        }
        return total / q1;
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void characteristicMatrixIsUnimodular(Polarization pol) {
        // Born & Wolf sec. 1.6.2: det M = 1 for every layer and so for the stack, lossy or evanescent
        Random rnd = new Random(3);
        for (int c = 0; c < 100; c++) {
            PlanarStack st = randomStack(rnd, c % 2 == 0, 1.6, 1.0);
            double kx = 0.97 * 1.6 * 2 * Math.PI / WAVELENGTH * rnd.nextDouble();
            PlanarStack.Matrix m = st.characteristicMatrix(pol, WAVELENGTH, kx);
            double scale = Math.max(m.m11().times(m.m22()).abs(), m.m12().times(m.m21()).abs());
            assertTrue(m.determinant().minus(Complex.ONE).abs() <= 1e-13 * Math.max(1, scale), st + ": det " + m.determinant());
        }
    }
}
