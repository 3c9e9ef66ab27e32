package org.evanesce.solver.reference;

import org.evanesce.solver.grid.Polarization;

/**
 * The narrowest resonance of a stack inside a sampled beam spectrum, for {@link AngularSpectrum#converged}.
 *
 * <p>A resonance of the stack (a guided mode reached across a gap, a surface plasmon) is a zero of the
 * characteristic matrix's denominator D near the real kx axis, D ≈ c·(kx − β − iΓ); r = N/D and t = 2Q1/D
 * share it, so |t|² has a Lorentzian peak of half-width Γ at its half height (Born &amp; Wolf sec. 1.6 for r
 * and t; the pole form is common practice). A lossless resonance leaves |r| = 1 and is invisible in |r|, but
 * not in |t|: even a peak much narrower than the sample spacing Δk shows as a local maximum of the sampled
 * |t|² (its height falls as 1/|kx − β|² on either side, far faster than the smooth background). Each local
 * maximum where the beam carries power is refined by a golden-section search between its neighbours, and
 * its half-width is found by bisection, so the doubling can go on until Δk is at most half the narrowest
 * half-width: then the sums resolve the peak (the trapezoidal rule's error on a Lorentzian falls as
 * e^{−2πΓ/Δk}) and the tail of length about 1/(2Γ) it puts on the beam fits in the window 2π/Δk.
 */
final class Resonances {

    /** Peaks where the beam's spectral power |A|² is below this fraction of its largest are ignored. */
    static final double NEGLIGIBLE_POWER = 1e-12;
    /** Golden-section and bisection steps: enough to shrink a bracket by 1e-20 (far below the round-off of kx). */
    private static final int STEPS = 100;

    private Resonances() {
    }

    /** Outward search for the half height goes at most this many samples from a peak. */
    private static final int REACH = 1024;

    /**
     * The narrowest peak of |t|² found on the sampled spectrum: {its kx, its half-width at half height}, rad/m;
     * {NaN, ∞} when there is none (or none that falls to half height within {@value #REACH} samples).
     *
     * @param incident    A_m (interleaved re, im; zero where the beam has no component)
     * @param transmitted t·A_m, likewise
     * @param kx0         kx of sample 0, rad/m
     * @param dk          the spacing, rad/m
     */
    static double[] narrowest(PlanarStack stack, Polarization pol, double wavelength, double[] incident,
                              double[] transmitted, double kx0, double dk) {
        int n = incident.length / 2;
        double[] a2 = new double[n];
        double[] t2 = new double[n];
        double peakPower = 0;
        for (int m = 0; m < n; m++) {
            a2[m] = incident[2 * m] * incident[2 * m] + incident[2 * m + 1] * incident[2 * m + 1];
            double ta2 = transmitted[2 * m] * transmitted[2 * m] + transmitted[2 * m + 1] * transmitted[2 * m + 1];
            t2[m] = a2[m] > 0 ? ta2 / a2[m] : Double.NaN;
            peakPower = Math.max(peakPower, a2[m]);
        }
        double[] narrowest = {Double.NaN, Double.POSITIVE_INFINITY};
        for (int m = 1; m < n - 1; m++) {
            if (!(a2[m] > NEGLIGIBLE_POWER * peakPower) || !(t2[m] > t2[m - 1]) || !(t2[m] >= t2[m + 1])) {
                continue; // not a local maximum of |t|² (NaN neighbours: the spectrum's edge) where the beam has power
            }
            double k = kx0 + m * dk;
            double[] peak = peak(stack, pol, wavelength, k - dk, k + dk, dk);
            if (peak[1] < narrowest[1]) {
                narrowest = peak;
            }
        }
        return narrowest;
    }

    /** |t(kx)|². */
    private static double t2(PlanarStack stack, Polarization pol, double wavelength, double kx) {
        return stack.atTransverseWavenumber(pol, wavelength, kx).t().norm();
    }

    /**
     * The peak of |t|² inside (lo, hi) and its half-width at half height: {kx, half-width}, rad/m. The peak by
     * golden-section search, then each side by bisection once a point below half height is found going out from
     * it (half a sample, then doubling the distance, up to {@value #REACH} samples); the half-width is the
     * smaller side's, infinite when neither side falls to half height.
     */
    private static double[] peak(PlanarStack stack, Polarization pol, double wl, double lo, double hi, double dk) {
        double g = (Math.sqrt(5) - 1) / 2;
        double a = lo;
        double b = hi;
        double c = b - g * (b - a);
        double d = a + g * (b - a);
        double fc = inside(stack, pol, wl, c);
        double fd = inside(stack, pol, wl, d);
        for (int i = 0; i < STEPS && b - a > 0; i++) {
            if (fc >= fd) {
                b = d;
                d = c;
                fd = fc;
                c = b - g * (b - a);
                fc = inside(stack, pol, wl, c);
            } else {
                a = c;
                c = d;
                fc = fd;
                d = a + g * (b - a);
                fd = inside(stack, pol, wl, d);
            }
        }
        double beta = fc >= fd ? c : d;
        double half = Math.max(fc, fd) / 2;
        double width = Double.POSITIVE_INFINITY;
        for (int side = -1; side <= 1; side += 2) {
            double out = Double.NaN;
            for (double delta = dk / 2; delta <= REACH * dk; delta *= 2) {
                double k = beta + side * delta;
                if (!(t2Safe(stack, pol, wl, k) >= half)) {
                    out = delta;
                    break;
                }
            }
            if (Double.isNaN(out)) {
                continue; // no half height on this side
            }
            double in = out / 2 >= dk / 2 ? out / 2 : 0;
            for (int i = 0; i < STEPS && out - in > 0; i++) {
                double mid = 0.5 * (in + out);
                if (mid == in || mid == out) {
                    break;
                }
                if (t2Safe(stack, pol, wl, beta + side * mid) >= half) {
                    in = mid;
                } else {
                    out = mid;
                }
            }
            width = Math.min(width, out);
        }
        return new double[] {beta, width};
    }

    /** |t|², −1 outside the propagating range of the incidence medium (never a maximum). */
    private static double inside(PlanarStack stack, Polarization pol, double wl, double kx) {
        double v = t2Safe(stack, pol, wl, kx);
        return Double.isNaN(v) ? -1 : v;
    }

    /** |t|², NaN outside the propagating range of the incidence medium. */
    private static double t2Safe(PlanarStack stack, Polarization pol, double wl, double kx) {
        double k = stack.incidentIndex() * 2 * Math.PI / wl;
        return Math.abs(kx) < k ? t2(stack, pol, wl, kx) : Double.NaN;
    }
}
