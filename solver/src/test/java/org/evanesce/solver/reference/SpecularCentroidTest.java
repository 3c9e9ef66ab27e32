package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.api.Test;

/**
 * The lateral shift of a narrow beam on a line below the interface, against the moment theorem. The stack is the
 * plasmon-sensor beam example's: glass (1.515) / 50 nm gold (the library's Rakić model at 633 nm) / water
 * (1.3321, from memory), p polarization, a 1 um waist on the gold, the reflected line 0.445 um below; the angle is
 * 60°, where the beam's plane waves (±7.6° at 1/e of the field) stay well clear of grazing incidence.
 *
 * <p>The moment theorem of the Fourier transform (Parseval applied to x·U, common practice; see
 * AngularSpectrumConvergenceTest) gives the flux-weighted centroid on the line z = −d of a beam whose spectrum A is
 * real (waist on the interface) with no window: ⟨x⟩ = ∫ Q1 |rA|² (−d arg r/dkx + d·kx/kz) dkx / ∫ Q1 |rA|² dkx.
 * With r = 1 (a perfect mirror) it is d·∫ kx |A|² dkx / ∫ kz |A|² dkx: the flux-weighted mean of tan over the
 * beam's plane waves, not tan θ (tan is convex): here 1.7651 against tan 60° = 1.7321, 14.7 nm over the 0.445 um.
 * The shift is the reflected centroid minus that mirrored one, as the simulated shift is measured.
 *
 * <p>At the example's own 74.8° the plane waves reach grazing incidence with |A|² still 4e-4 of its peak, and
 * ∫ kx |A|² dkx diverges logarithmically there (|A|² ∝ 1/kz²): the centroids on a line, and the shift, depend
 * on the line's length (BeamReference's warning); the moment integral then has no finite value to test against.
 */
class SpecularCentroidTest {

    private static final double WAVELENGTH = 633e-9;
    private static final double THETA = Math.toRadians(60);
    private static final double WAIST = 1e-6;
    private static final double LINE = 0.445e-6;
    private static final double N_GLASS = 1.515;

    /**
     * The reference's centroids and shift against the moment integral, m. Measured 2026-12-04: mirrored centroid
     * 2e-19 m, shift 2.7e-10 m (the program stops doubling its window when the centroids change by less than 1e-4
     * footprints, 0.2 nm here).
     */
    private static final double MOMENT_TOL = 2e-9;
    /**
     * The mirrored centroid's departure from d·tan θ (measured 14.4 nm) must exceed the tolerance by this factor, so
     * that measuring the shift from d·tan θ fails the test.
     */
    private static final double DEPARTURE_FACTOR = 5;

    private static PlanarStack sensor() {
        Complex gold = MetalLibrary.get("gold").material().permittivityAtWavelength(WAVELENGTH).sqrtUpper();
        return new PlanarStack(N_GLASS, List.of(new PlanarStack.Layer(gold, 50e-9)), Complex.real(1.3321));
    }

    /** {⟨x⟩ reflected, ⟨x⟩ mirrored} on z = −d by the moment integral (trapezoid in ψ up to grazing), m. */
    private static double[] moments(PlanarStack stack, double d) {
        double k = N_GLASS * 2 * Math.PI / WAVELENGTH;
        double psiLow = -Math.asin(Math.min(1, Math.sqrt(80) / (WAIST * k)));
        // up to 1 mrad short of grazing incidence, where |A|² is e^−28 of its peak at 60°
        double psiHigh = Math.min(-psiLow, Math.PI / 2 - THETA - 1e-3);
        int points = 400_000;
        double h = (psiHigh - psiLow) / points;
        double[] num = new double[2];
        double[] den = new double[2];
        for (int j = 0; j <= points; j++) {
            double psi = psiLow + j * h;
            double kx = k * Math.sin(THETA + psi);
            double kz = k * Math.cos(THETA + psi);
            double kt = k * Math.sin(psi);
            double a = Math.exp(-WAIST * WAIST * kt * kt / 4) * Math.cos(psi) / Math.cos(THETA + psi);
            double step = 1e-9 * k;
            Complex ratio = stack.atTransverseWavenumber(Polarization.P, WAVELENGTH, kx + step).r()
                    .divide(stack.atTransverseWavenumber(Polarization.P, WAVELENGTH, kx - step).r());
            double dPhase = Math.atan2(ratio.im(), ratio.re()) / (2 * step);
            double r2 = stack.atTransverseWavenumber(Polarization.P, WAVELENGTH, kx).r().norm();
            // weight Q1 |A|² dkx, dkx = kz dψ, Q1 ∝ kz (the constant 1/(k0 n1²) cancels)
            double w = kz * a * a * kz * (j == 0 || j == points ? 0.5 : 1);
            num[0] += w * r2 * (-dPhase + d * kx / kz);
            den[0] += w * r2;
            num[1] += w * d * kx / kz;
            den[1] += w;
        }
        return new double[] {num[0] / den[0], num[1] / den[1]};
    }

    @Test
    void theShiftIsMeasuredFromTheMirroredBeamNotFromTheGeometricPath() {
        PlanarStack stack = sensor();
        AngularSpectrum.GaussianBeam beam = new AngularSpectrum.GaussianBeam(WAIST, THETA, WAVELENGTH, 0);
        double window = 24 * beam.footprint();
        long needed = (long) Math.ceil(window / (WAVELENGTH / (4 * N_GLASS)));
        int samples = Integer.highestOneBit((int) needed - 1) << 1;
        AngularSpectrum.Converged c = AngularSpectrum.converged(stack, Polarization.P, beam, samples, window,
                new double[] {LINE}, new AngularSpectrum.Tolerance(1e-5, 1e-4 * beam.footprint()), 1 << 20);
        double[] m = moments(stack, LINE);
        double specular = c.specularCentroids()[0];
        double direct = AngularSpectrum.specularCentroid(stack, Polarization.P, beam, c.result().samples(),
                c.result().samples() * c.result().spacing(), LINE);
        String what = String.format("converged %s after %d doublings: specular centroid %.5f um (moment integral %.5f um, "
                + "d tan theta %.5f um), reflected %.5f um (%.5f um), shift %.5f um (%.5f um)", c.converged(), c.doublings(),
                specular * 1e6, m[1] * 1e6, LINE * Math.tan(THETA) * 1e6, c.reflectedCentroids()[0] * 1e6, m[0] * 1e6,
                c.shift(0) * 1e6, (m[0] - m[1]) * 1e6);
        System.out.printf("specular - moment %.3e m, shift - moment %.3e m, departure from d tan theta %.3e m%n",
                specular - m[1], c.shift(0) - (m[0] - m[1]), m[1] - LINE * Math.tan(THETA));
        System.out.println(what);
        assertTrue(c.converged(), what);
        assertEquals(specular, direct, 1e-15, what);
        assertEquals(m[1], specular, MOMENT_TOL, what);
        assertEquals(m[0] - m[1], c.shift(0), MOMENT_TOL, what);
        assertTrue(Math.abs(m[1] - LINE * Math.tan(THETA)) > DEPARTURE_FACTOR * MOMENT_TOL, what);
    }

    /**
     * The shift over a finite line at the example's own 74.8°, where it depends on the line's length, against a
     * direct integral over the same segment: independent of the reference's route (no FFT, no kx grid, no change of
     * variable to kx, no transfer matrix). The beam is a sum over κ, the wavenumber across its axis, of plane waves of
     * amplitude exp(−κ²w²/4) (the Fourier pair of the waist profile exp(−ξ²/w²); J. W. Goodman, Introduction to
     * Fourier Optics, 2nd ed. (1996), sec. 3.10, from memory) travelling at φ = θ + asin(κ/k) (those with φ ≥ 90°
     * never reach the interface), each reflected with Raether's r (H. Raether, Surface Plasmons on Smooth and Rough
     * Surfaces and on Gratings (1988), eq. (2.13)); on z = −d the reflected H is U(x) = ∫ a r e^{i(kx x + kz d)} dκ
     * and the flux density towards −z ∝ Re(U* V), V = ∫ a r kz e^{…} dκ. Trapezoid rule over κ, a sum over x at
     * 20 nm, r = 1 for the mirrored beam. The segment is the example's reflected line at 10 nm cells (26.29 um).
     */
    @Test
    void onAFiniteLineTheShiftIsTheDirectIntegrals() {
        double theta = Math.toRadians(74.8);
        Complex epsGold = MetalLibrary.get("gold").material().permittivityAtWavelength(WAVELENGTH);
        PlanarStack stack = new PlanarStack(N_GLASS, List.of(new PlanarStack.Layer(epsGold.sqrtUpper(), 50e-9)),
                Complex.real(1.3321));
        AngularSpectrum.GaussianBeam beam = new AngularSpectrum.GaussianBeam(WAIST, theta, WAVELENGTH, 0);
        double window = 24 * beam.footprint();
        long needed = (long) Math.ceil(window / (WAVELENGTH / (4 * N_GLASS)));
        int samples = Integer.highestOneBit((int) needed - 1) << 1;
        AngularSpectrum.Converged c = AngularSpectrum.converged(stack, Polarization.P, beam, samples, window,
                new double[] {LINE}, new AngularSpectrum.Tolerance(1e-5, 1e-4 * beam.footprint()), 1 << 20);
        double from = -13.145e-6;
        double to = 13.145e-6;
        double onLine = AngularSpectrum.shiftOnSegment(stack, Polarization.P, beam, c.result().samples(),
                c.result().samples() * c.result().spacing(), LINE, from, to);
        double[] direct = directCentroids(epsGold, Complex.real(1.3321 * 1.3321), theta, from, to);
        String what = String.format("74.8 deg: shift over %.2f um %.5f um (direct integral %.5f um), over the whole "
                + "window %.5f um; grazing power ratio %.2g", (to - from) * 1e6, onLine * 1e6, (direct[0] - direct[1]) * 1e6,
                c.shift(0) * 1e6, beam.grazingPowerRatio(N_GLASS));
        System.out.println(what);
        assertEquals(direct[0] - direct[1], onLine, SEGMENT_TOL, what);
        assertTrue(beam.grazingPowerRatio(N_GLASS) > 1e-4, what);
    }

    /**
     * The shift over the segment against the direct integral, m. Measured 2026-12-04: 1.3e-10 m (−0.88334 against
     * −0.88347 um; with the grid's gold ε the example's run printed −0.8853 um over its line, the direct integral
     * −0.88541 um).
     */
    private static final double SEGMENT_TOL = 2e-9;

    /** {reflected, mirrored} flux-weighted centroids over [from, to] on z = −LINE by the direct integral, m. */
    private static double[] directCentroids(Complex epsGold, Complex epsWater, double theta, double from, double to) {
        double k0 = 2 * Math.PI / WAVELENGTH;
        double k = N_GLASS * k0;
        int n = 3001;
        double[] kx = new double[n];
        double[] kz = new double[n];
        double[][] a = new double[2][n];
        double[] plain = new double[n];
        for (int i = 0; i < n; i++) {
            double kappa = (-6 + 12.0 * i / (n - 1)) / WAIST;
            double phi = theta + Math.asin(kappa / k);
            if (!(phi < Math.PI / 2)) {
                continue;
            }
            double weight = Math.exp(-kappa * kappa * WAIST * WAIST / 4) * (i == 0 || i == n - 1 ? 0.5 : 1);
            kx[i] = k * Math.sin(phi);
            kz[i] = k * Math.cos(phi);
            Complex[] eps = {Complex.real(N_GLASS * N_GLASS), epsGold, epsWater};
            Complex[] q = new Complex[3];
            Complex kzGold = null;
            for (int j = 0; j < 3; j++) {
                Complex kzj = eps[j].times(k0 * k0).minus(kx[i] * kx[i]).sqrtUpper();
                q[j] = kzj.divide(eps[j]);
                kzGold = j == 1 ? kzj : kzGold;
            }
            Complex r01 = q[0].minus(q[1]).divide(q[0].plus(q[1]));
            Complex r12 = q[1].minus(q[2]).divide(q[1].plus(q[2]));
            Complex phase = kzGold.times(2 * 50e-9).timesI().exp();
            Complex r = r01.plus(r12.times(phase)).divide(Complex.ONE.plus(r01.times(r12).times(phase)));
            a[0][i] = weight * r.re();
            a[1][i] = weight * r.im();
            plain[i] = weight;
        }
        return new double[] {direct(kx, kz, a[0], a[1], from, to), direct(kx, kz, plain, new double[n], from, to)};
    }

    private static double direct(double[] kx, double[] kz, double[] re, double[] im, double from, double to) {
        double step = 20e-9;
        int m = (int) Math.floor((to - from) / step) + 1;
        double sum = 0;
        double moment = 0;
        for (int j = 0; j < m; j++) {
            double x = from + j * step;
            double ur = 0;
            double ui = 0;
            double vr = 0;
            double vi = 0;
            for (int i = 0; i < kx.length; i++) {
                if (re[i] == 0 && im[i] == 0) {
                    continue;
                }
                double p = kx[i] * x + kz[i] * LINE;
                double cs = Math.cos(p);
                double sn = Math.sin(p);
                double fr = re[i] * cs - im[i] * sn;
                double fi = re[i] * sn + im[i] * cs;
                ur += fr;
                ui += fi;
                vr += kz[i] * fr;
                vi += kz[i] * fi;
            }
            double flux = ur * vr + ui * vi;
            sum += flux;
            moment += x * flux;
        }
        return moment / sum;
    }
}
