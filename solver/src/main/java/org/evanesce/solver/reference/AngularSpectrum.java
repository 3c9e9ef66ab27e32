package org.evanesce.solver.reference;

import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;
import org.jtransforms.fft.DoubleFFT_1D;

/**
 * The finite-beam plane-wave reference (issue #5): a 2D Gaussian beam decomposed into plane waves, each passed
 * through the transfer matrix of a {@link PlanarStack}, and recombined by FFT. It gives the reflected profile along
 * the first interface, the transmitted profile along the last, the beam's total R and T, and the lateral shifts of
 * both beams, with no edges and no grid.
 *
 * <h2>Geometry</h2>
 * The stack's own axes (see {@link PlanarStack}): z normal, the incidence medium (real index n1) at z &lt; 0, the
 * first interface at z = 0 and the last at z = L (the sum of the layer thicknesses); x along the interfaces. The
 * field U is the stack's tangential scalar, E_y for s and H_y for p, so r and t apply to it unchanged. Time
 * dependence exp(−iωt). Along a line z = const every field is a sum of plane waves
 * <pre>
 *     U(x) = ∫ A(kx) exp(i kx x) dkx / 2π,
 * </pre>
 * the incident one on z = 0 with spectrum A, the reflected one on z = 0 with r(kx)·A, the transmitted one on z = L
 * with t(kx)·A. The reflected beam runs along +x like the incident one, so no profile is mirrored.
 *
 * <h2>The incident spectrum, built exactly</h2>
 * Rather than sampling the tilted beam on z = 0 and transforming it (which needs the beam off its waist plane),
 * the spectrum is written down. In the beam's own frame (ξ across, ζ along the axis, the axis at angle θ from z
 * and meeting the first interface at x = 0) the beam is a sum of plane waves with transverse wavenumber k_t:
 * <pre>
 *     U(ξ, ζ) = ∫ a(k_t) exp(i(k_t ξ + k_ζ ζ)) dk_t / 2π,   a(k_t) = w0 √π exp(−w0² k_t² / 4),   k_ζ = sqrt(k² − k_t²),
 * </pre>
 * k = n1 k0, |k_t| &lt; k, which is exactly exp(−ξ²/w0²) (unit amplitude) on the waist plane ζ = 0 up to the
 * truncation at |k_t| = k (a relative exp(−k²w0²/4), nothing for w0 above a wavelength). The component at angle ψ
 * from the axis (k_t = k sin ψ) has kx = k sin(θ + ψ); the change of variable from k_t to kx gives
 * <pre>
 *     A(kx) = a(k sin ψ) · (dk_t/dkx) · exp(i k_ζ s) = a(k sin ψ) · (cos ψ / cos(θ + ψ)) · exp(i k s cos ψ),
 *     ψ = arcsin(kx / k) − θ,
 * </pre>
 * with s the distance along the axis from the waist to the interface (the plane-wave phase from the waist to the
 * origin). Components with θ + ψ outside (−90°, 90°) never reach the interface and are left out (their share of
 * the power is of order exp(−(k w0 cos θ)²/2)); an in-plane wavenumber whose ψ would exceed 90° belongs to no
 * forward component of the beam and gets A = 0. The Jacobian cos ψ / cos(θ + ψ) is what makes the beam Gaussian on its waist plane rather than
 * merely along the interface; it matters at small waists (for w0 → ∞ it is 1/cos θ, a constant).
 *
 * <h2>Sampling</h2>
 * The spectrum is sampled on kx_m = (m − c)·Δk, m = 0 … N − 1, c = ⌊N/2⌋, Δk = 2π/W, and the profiles come out
 * at x_j = −W/2 + j·Δx, Δx = W/N, by one inverse DFT each (JTransforms):
 * U(x_j) = (Δk/2π) Σ_m A_m exp(i kx_m x_j). That is the profile made periodic with period W, so the window W must
 * hold the beams (several footprints w0/cos θ, plus the shifts), and Δx ≤ λ0/(2 n1) so that the kx range holds
 * every propagating incident component (|kx| &lt; n1 k0). Only components with |kx| &lt; n1 k0 and a nonzero A
 * are passed through the stack.
 *
 * <h2>Powers (time-averaged Poynting flux along z, per unit length along y)</h2>
 * For s, U = E_y and Faraday's law (∇×E = iωμ0 H) gives H_x = −(kz/(ωμ0))·U for each plane wave; for p, U = H_y
 * and Ampère's (∇×H = −iωε0 ε E) gives E_x = (kz/(ωε0 ε))·U. The flux through a line z = const of a field made of
 * waves all running one way is ∫ S_z dx with S_z = ½ Re(E_x H_y* − E_y H_x*), and Parseval's theorem turns the
 * product of two fields that share the factor exp(i kx x) into a single integral over kx, with no cross terms
 * between different kx:
 * <pre>
 *     s:  P = (1/(2ωμ0)) ∫ Re(kz)      |U(kx)|² dkx/2π        p:  P = (1/(2ωε0)) ∫ Re(kz/ε) |U(kx)|² dkx/2π,
 * </pre>
 * i.e. P ∝ ∫ Re(Q) |U|² with the stack's admittance Q (kz/k0 for s, kz/(k0 ε) for p), the same constant on both
 * sides. Hence, as sums over the sampled spectrum,
 * <pre>
 *     P_inc = Σ Q1 |A|²,   R = Σ Q1 |r A|² / P_inc,   T = Σ Re(Qe) |t A|² / P_inc.
 * </pre>
 * In the incidence medium the incident and reflected waves of one kx carry their fluxes separately because Q1 is
 * real there (every incident component propagates). Components evanescent in the exit medium have Re(Qe) = 0 and
 * carry no power; in a lossy exit medium T is what enters it. The discrete sums are the trapezoidal rule for a
 * smooth spectrum that vanishes at the ends, and by the discrete Parseval identity also equal the flux summed over
 * the sampled, periodic profiles.
 *
 * <h2>Shifts</h2>
 * The lateral shift of a beam is the centroid Σ x_j |U_j|² / Σ |U_j|² of its profile minus that of the incident
 * profile; for the reflected beam beyond the critical angle it tends to Artmann's −d(arg r)/dkx
 * ({@link PlanarStack#goosHanchenShift}) as the waist grows. On a line a distance d from the interface the
 * reflected centroid is weighted by the flux density ({@link #reflectedCentroid}) and its shift is taken from the
 * mirrored incident beam's centroid on the same line ({@link #specularCentroid}), not from d·tan θ: a narrow beam's
 * flux centroid moves at the flux-weighted mean of tan over its plane waves.
 *
 * <h2>Sharp features and convergence</h2>
 * A stack with a weakly coupled mode (a guided mode of a film reached across a gap, a surface plasmon) has an r
 * or t that changes over a range of kx far narrower than the beam's spectrum: a resonance of width Γ in kx. The
 * sums above then need Δk = 2π/W well below Γ, and the light the mode carries away and re-radiates forms a tail
 * of length about 1/Γ that must fit in the window W (the profiles are periodic in W; a tail that wraps round
 * lands on the wrong side of the centroid). {@link #converged} finds the narrowest such resonance from the peaks of
 * |t| ({@link Resonances}) and doubles W and N together (Δx fixed, so Δk halves) until Δk is at most half its
 * half-width and R, T and the reflected centroid change by less than stated tolerances from one doubling to the
 * next, and says so when the largest sampling allowed is reached first.
 */
public final class AngularSpectrum {

    private AngularSpectrum() {
    }

    /**
     * A 2D Gaussian beam in the incidence medium of a stack, its axis meeting the first interface at x = 0.
     *
     * @param waist         w0, m: the 1/e half-width of the field amplitude on the waist plane; finite, &gt; 0
     * @param angle         θ, rad: the axis's angle from the stack normal, in the incidence medium; |θ| &lt; π/2
     * @param wavelength    λ0, m: the vacuum wavelength; finite, &gt; 0
     * @param waistDistance s, m: the distance along the axis from the waist to the interface; 0 puts the waist on
     *                      the interface, positive before it, negative beyond it (a virtual waist); finite
     */
    public record GaussianBeam(double waist, double angle, double wavelength, double waistDistance) {
        public GaussianBeam {
            if (!(waist > 0) || Double.isInfinite(waist)) {
                throw new IllegalArgumentException(String.format("beam waist %g m must be finite and > 0", waist));
            }
            if (!(Math.abs(angle) < Math.PI / 2)) {
                throw new IllegalArgumentException(String.format(
                        "beam angle of incidence %g deg must be within (-90, 90) deg", Math.toDegrees(angle)));
            }
            if (!(wavelength > 0) || Double.isInfinite(wavelength)) {
                throw new IllegalArgumentException(String.format("beam wavelength %g m must be finite and > 0", wavelength));
            }
            if (!Double.isFinite(waistDistance)) {
                throw new IllegalArgumentException(String.format("beam waist distance %g m must be finite", waistDistance));
            }
        }

        /** A beam with its waist on the first interface. */
        public GaussianBeam(double waist, double angle, double wavelength) {
            this(waist, angle, wavelength, 0);
        }

        /** w0 / |cos θ|, m: the 1/e amplitude half-width of the beam's footprint along the interface. */
        public double footprint() {
            return waist / Math.cos(angle);
        }

        /**
         * The power density |a|² of the beam's plane wave at grazing incidence (ψ = 90° − |θ| from the axis) over
         * that on its axis, exp(−(k w0 cos θ)²/2), k = n1 k0. Where it is not negligible, ∫ kx |A|² dkx diverges
         * logarithmically (|A|² ∝ 1/kz² there), so the flux-weighted centroids on a line, and the shift between
         * them, depend on the line's length ({@link #shiftOnSegment}).
         *
         * @param incidentIndex n1
         */
        public double grazingPowerRatio(double incidentIndex) {
            double kw = incidentIndex * 2 * Math.PI / wavelength * waist * Math.cos(angle);
            return Math.exp(-kw * kw / 2);
        }
    }

    /**
     * What the reference gives. Profiles are complex U (E_y for s, H_y for p) at x_j = start + j·spacing,
     * j = 0 … samples − 1, interleaved: {@code profile[2*j]} is Re U(x_j), {@code profile[2*j + 1]} Im U(x_j); the
     * incident and reflected ones on the first interface (z = 0), the transmitted one on the last (z = L), all in
     * units of the incident beam's amplitude at its waist centre. The array accessors return copies.
     *
     * @param start            x_0, m
     * @param spacing          Δx, m
     * @param incident         the incident profile on z = 0
     * @param reflected        the reflected profile on z = 0
     * @param transmitted      the transmitted profile on z = L
     * @param reflectance      R: reflected over incident power
     * @param transmittance    T: power into the exit medium over incident power
     * @param incidentCentroid centroid of |U|² of the incident profile, m
     * @param reflectedShift   centroid of the reflected |U|² minus the incident one, m (NaN with no reflected beam)
     * @param transmittedShift centroid of the transmitted |U|² minus the incident one, m (NaN with no transmitted beam)
     */
    public record Result(double start, double spacing, double[] incident, double[] reflected, double[] transmitted,
                         double reflectance, double transmittance, double incidentCentroid, double reflectedShift,
                         double transmittedShift) {
        public Result {
            incident = incident.clone();
            reflected = reflected.clone();
            transmitted = transmitted.clone();
        }

        @Override
        public double[] incident() {
            return incident.clone();
        }

        @Override
        public double[] reflected() {
            return reflected.clone();
        }

        @Override
        public double[] transmitted() {
            return transmitted.clone();
        }

        /** The number of samples in each profile. */
        public int samples() {
            return incident.length / 2;
        }

        /** x_j, m. */
        public double x(int j) {
            return start + j * spacing;
        }
    }

    /**
     * The beam's response to the stack (see the class comment for the method).
     *
     * @param stack        the layered geometry; the beam travels in its incidence medium
     * @param polarization s (U = E_y) or p (U = H_y)
     * @param beam         the incident beam
     * @param samples      N, the number of samples of the spectrum and the profiles; ≥ 2 (a product of small
     *                     primes is fastest)
     * @param window       W, m: the period of the profiles; at least 4 footprints, and Δx = W/N at most λ0/(2 n1)
     * @throws IllegalArgumentException if the window or the sampling cannot hold the beam
     */
    public static Result of(PlanarStack stack, Polarization polarization, GaussianBeam beam, int samples, double window) {
        return profiles(spectra(stack, polarization, beam, samples, window, null));
    }

    /**
     * One sampling's spectra before the transforms (A_m with the sign (−1)^(m−c), r·A_m, t·A_m, interleaved) and its power sums, with the stack's
     * responses at each kx_m (null where the beam has no component), which the next doubling reuses: its even samples
     * lie at the same kx, bit for bit (W and Δk = 2π/W scale by powers of two exactly).
     */
    private record Spectra(Polarization polarization, int samples, double window, double[] incident, double[] reflected, double[] transmitted,
                           double pInc, double pRef, double pTra, Complex[] r, Complex[] t, double[] qe, double[] phases) {
        double reflectance() {
            return pRef / pInc;
        }

        double transmittance() {
            return pTra / pInc;
        }
    }

    /**
     * The sampled spectra of the class comment and their power sums; {@code coarser}, when not null, is the sampling
     * at half the window and half the samples, whose responses are taken where the kx coincide (the same numbers as
     * evaluating the stack again).
     */
    private static Spectra spectra(PlanarStack stack, Polarization polarization, GaussianBeam beam, int samples, double window,
                                   Spectra coarser) {
        double n1 = stack.incidentIndex();
        double lambda = beam.wavelength();
        checkSampling(stack, beam, samples, window);
        double k0 = 2 * Math.PI / lambda;
        double k = n1 * k0;
        double dk = 2 * Math.PI / window;
        int c = samples / 2;
        int lastMedium = stack.media() - 1;
        double f1 = polarization == Polarization.S ? 1 : n1 * n1;
        Complex fe = polarization == Polarization.S ? Complex.ONE : stack.exitIndex().square();
        // the coarser sampling's sample m0 lies at this one's c + 2(m0 − c0) when both are even-sized doublings
        boolean reuse = coarser != null && 2 * coarser.samples == samples && coarser.window * 2 == window
                && samples % 4 == 0;
        int c0 = reuse ? coarser.samples / 2 : 0;

        double[] inc = new double[2 * samples];
        double[] ref = new double[2 * samples];
        double[] tra = new double[2 * samples];
        Complex[] rs = new Complex[samples];
        Complex[] ts = new Complex[samples];
        double[] qes = new double[samples];
        double pInc = 0;
        double pRef = 0;
        double pTra = 0;
        for (int m = 0; m < samples; m++) {
            double kx = (m - c) * dk;
            Complex a = incident(beam, k, kx, m - c);
            if (a == null) {
                continue;
            }
            double kz1 = Math.sqrt((k - kx) * (k + kx));
            int m0 = reuse && ((m - c) & 1) == 0 ? c0 + (m - c) / 2 : -1;
            if (m0 >= 0 && coarser.r[m0] != null) {
                rs[m] = coarser.r[m0];
                ts[m] = coarser.t[m0];
                qes[m] = coarser.qe[m0];
            } else {
                PlanarStack.Response resp = stack.atTransverseWavenumber(polarization, lambda, kx);
                rs[m] = resp.r();
                ts[m] = resp.t();
                qes[m] = stack.normalWavenumber(lastMedium, lambda, kx).divide(fe.times(k0)).re();
            }
            Complex r = a.times(rs[m]);
            Complex t = a.times(ts[m]);
            put(inc, m, a);
            put(ref, m, r);
            put(tra, m, t);
            double q1 = kz1 / (k0 * f1);
            pInc += q1 * a.norm();
            pRef += q1 * r.norm();
            pTra += qes[m] * t.norm();
        }
        return new Spectra(polarization, samples, window, inc, ref, tra, pInc, pRef, pTra, rs, ts, qes,
                windowPhases(samples, c, dk / (2 * Math.PI)));
    }

    /** The profiles of a sampling: its spectra transformed (the spectra are left as they are). */
    private static Result profiles(Spectra s) {
        int samples = s.samples;
        double window = s.window;
        double dx = window / samples;
        double[] inc = s.incident.clone();
        double[] ref = s.reflected.clone();
        double[] tra = s.transmitted.clone();
        DoubleFFT_1D fft = new DoubleFFT_1D(samples);
        for (double[] u : new double[][] {inc, ref, tra}) {
            fft.complexInverse(u, false);
            shiftToWindow(u, s.phases);
        }
        double start = -window / 2;
        double incCentroid = centroid(inc, start, dx);
        return new Result(start, dx, inc, ref, tra, s.reflectance(), s.transmittance(), incCentroid,
                centroid(ref, start, dx) - incCentroid, centroid(tra, start, dx) - incCentroid);
    }

    /** Tolerances of {@link #converged}: R and T (absolute) and the reflected centroids (m). */
    public record Tolerance(double power, double position) {
        public Tolerance {
            if (!(power > 0) || !(position > 0)) {
                throw new IllegalArgumentException(String.format("tolerances %g (power) and %g m (position) must be > 0",
                        power, position));
            }
        }
    }

    /**
     * What {@link #converged} found.
     *
     * @param result             the result at the last sampling tried
     * @param reflectedCentroids the flux-weighted centroid of the reflected beam on each line asked for
     *                           ({@link #reflectedCentroid}), m, at that sampling
     * @param specularCentroids  the same for the incident beam sent back by a mirror that reflects every plane wave
     *                           unchanged (r = 1; {@link #specularCentroid}), m: the reflected beam's position with
     *                           no shift, the baseline of the lateral shift on that line
     * @param converged          whether R, T and every centroid changed by less than the tolerances on the last
     *                           doubling, both samplings resolving every resonance
     * @param doublings          how many times the window was doubled
     * @param change             the largest change of the last doubling: {ΔR, ΔT, Δcentroid (m)} (NaN with none)
     * @param resonance          kx of the narrowest resonance of the stack found in the beam's spectrum (the peak
     *                           of |t|², {@link Resonances}), rad/m; NaN with none
     * @param narrowest          its half-width at half height of |t|², rad/m; infinite with none
     * @param incidentSpectrum   the incident spectrum A_m of that sampling before the transforms, with the sign
     *                           (−1)^(m−c), interleaved ({@link #fluxDensity(PlanarStack, Polarization, GaussianBeam,
     *                           Converged, double, boolean)} and {@link #shiftOnSegment(PlanarStack, Polarization,
     *                           GaussianBeam, Converged, double, double, double)} start from it)
     * @param reflectedSpectrum  the reflected one, r·A_m, likewise
     */
    public record Converged(Result result, double[] reflectedCentroids, double[] specularCentroids, boolean converged,
                            int doublings, double[] change, double resonance, double narrowest, double[] incidentSpectrum,
                            double[] reflectedSpectrum) {
        public Converged {
            reflectedCentroids = reflectedCentroids.clone();
            specularCentroids = specularCentroids.clone();
            change = change.clone();
            incidentSpectrum = incidentSpectrum.clone();
            reflectedSpectrum = reflectedSpectrum.clone();
        }

        @Override
        public double[] incidentSpectrum() {
            return incidentSpectrum.clone();
        }

        @Override
        public double[] reflectedSpectrum() {
            return reflectedSpectrum.clone();
        }

        @Override
        public double[] reflectedCentroids() {
            return reflectedCentroids.clone();
        }

        @Override
        public double[] specularCentroids() {
            return specularCentroids.clone();
        }

        /**
         * The lateral shift of the reflected beam on line k: its centroid minus the specular one,
         * {@code reflectedCentroids[k] − specularCentroids[k]}, m.
         */
        public double shift(int k) {
            return reflectedCentroids[k] - specularCentroids[k];
        }

        @Override
        public double[] change() {
            return change.clone();
        }
    }

    /**
     * The beam's response sampled finely enough for sharp features of the stack (see the class comment): starting
     * from {@code samples} over {@code window}, the window and the number of samples are doubled together until
     * the spacing Δk = 2π/W is at most half the half-width of the narrowest resonance of the stack inside the
     * beam's spectrum ({@link Resonances}), and R, T and the reflected centroid on each line at the
     * {@code distances} (as {@link #reflectedCentroid}) change by at most the tolerances between two samplings
     * that both resolve it (a peak missed by both is impossible: see {@link Resonances}). It gives up, with
     * {@code converged} false, when that would take more than {@code maxSamples}.
     *
     * @param distances d ≥ 0 of the lines whose reflected centroids are wanted, m (may be empty)
     */
    public static Converged converged(PlanarStack stack, Polarization polarization, GaussianBeam beam, int samples,
                                      double window, double[] distances, Tolerance tolerance, int maxSamples) {
        checkSampling(stack, beam, samples, window);
        for (double d : distances) {
            if (!(d >= 0) || Double.isInfinite(d)) {
                throw new IllegalArgumentException(String.format("distance %g m must be finite and >= 0", d));
            }
        }
        Sampled prev = sample(stack, polarization, beam, samples, window, distances, null);
        int doublings = 0;
        double[] change = {Double.NaN, Double.NaN, Double.NaN};
        while (true) {
            double dk = 2 * Math.PI / window;
            // the samples the narrowest resonance needs (Δk at most half its half-width)
            double needed = prev.narrowest > 0 ? samples * (2 * dk / prev.narrowest) : Double.POSITIVE_INFINITY;
            if ((long) samples * 2 > maxSamples || needed > maxSamples) {
                return prev.converged(false, doublings, change);
            }
            samples *= 2;
            window *= 2;
            doublings++;
            Sampled cur = sample(stack, polarization, beam, samples, window, distances, prev.spectra);
            change = new double[] {Math.abs(cur.spectra.reflectance() - prev.spectra.reflectance()),
                Math.abs(cur.spectra.transmittance() - prev.spectra.transmittance()), 0};
            boolean small = change[0] <= tolerance.power() && change[1] <= tolerance.power();
            for (int k = 0; k < distances.length; k++) {
                for (double[][] c : new double[][][] {{cur.centroids, prev.centroids}, {cur.specular, prev.specular}}) {
                    double a = c[0][k];
                    double b = c[1][k];
                    double dc = Double.isNaN(a) && Double.isNaN(b) ? 0 : Math.abs(a - b);
                    change[2] = Math.max(change[2], Double.isNaN(dc) ? Double.POSITIVE_INFINITY : dc);
                    small &= dc <= tolerance.position();
                }
            }
            boolean resolved = dk <= prev.narrowest / 2 && 2 * Math.PI / window <= cur.narrowest / 2;
            prev = cur;
            if (small && resolved) {
                return cur.converged(true, doublings, change);
            }
        }
    }

    /**
     * One sampling's spectra, reflected and specular centroids and narrowest resonance; its profiles
     * ({@link #profiles}, three transforms) are made only for the sampling {@link #converged} returns.
     */
    private record Sampled(Spectra spectra, double[] centroids, double[] specular, double resonance, double narrowest) {
        Converged converged(boolean converged, int doublings, double[] change) {
            return new Converged(profiles(spectra), centroids, specular, converged, doublings, change, resonance, narrowest,
                    spectra.incident, spectra.reflected);
        }
    }

    /**
     * The spectra, {@link #reflectedCentroid} and {@link #specularCentroid} at each distance and the resonances, from
     * one pass through the stack (its responses taken from {@code coarser} where the kx coincide).
     */
    private static Sampled sample(PlanarStack stack, Polarization polarization, GaussianBeam beam, int samples,
                                  double window, double[] distances, Spectra coarser) {
        Spectra s = spectra(stack, polarization, beam, samples, window, coarser);
        double[] centroids = new double[distances.length];
        double[] specular = new double[distances.length];
        for (int k = 0; k < distances.length; k++) {
            centroids[k] = centroidAt(stack, beam, s, distances[k], s.reflected, Double.NEGATIVE_INFINITY,
                    Double.POSITIVE_INFINITY);
            specular[k] = centroidAt(stack, beam, s, distances[k], s.incident, Double.NEGATIVE_INFINITY,
                    Double.POSITIVE_INFINITY);
        }
        double dk = 2 * Math.PI / window;
        double[] narrowest = Resonances.narrowest(stack, polarization, beam.wavelength(), s.incident, s.transmitted,
                -(samples / 2) * dk, dk);
        return new Sampled(s, centroids, specular, narrowest[0], narrowest[1]);
    }

    /**
     * The centroid of the reflected beam's power on the line a distance d back into the incidence medium
     * from the first interface (z = −d), weighted by the flux density across the line, in the stack's
     * x (the incident axis meets the interface at x = 0). A beam whose components are reflected
     * unequally leaves at a slightly different mean angle from the specular one, so this centroid
     * moves with d by more than d·tan θ; a simulated beam measured on a line below the interface is
     * compared with it there. The reflected field is Σ r A e^{i(kx x + kz d)}; its flux density along
     * −z is ½ Re(U V*) with V = Σ Q1 r A e^{i(kx x + kz d)} (Q1 = kz/k0 for s, kz/(k0 n1²) for p, as in
     * the class comment), up to a constant.
     *
     * @param distance d ≥ 0, m
     */
    public static double reflectedCentroid(PlanarStack stack, Polarization polarization, GaussianBeam beam, int samples,
                                           double window, double distance) {
        checkSampling(stack, beam, samples, window);
        if (!(distance >= 0) || Double.isInfinite(distance)) {
            throw new IllegalArgumentException(String.format("distance %g m must be finite and >= 0", distance));
        }
        Spectra s = spectra(stack, polarization, beam, samples, window, null);
        return centroidAt(stack, beam, s, distance, s.reflected, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
    }

    /**
     * The centroid, as {@link #reflectedCentroid} weighs it, of the incident beam sent back by a mirror that reflects
     * every plane wave unchanged (r = 1 for every kx) on the line a distance d back into the incidence medium: the
     * mirror image of the incident beam carried on through a transparent first interface to a distance d beyond
     * it. It is where the reflected beam would lie with no shift, the baseline of the lateral shift on that line.
     *
     * <p>It is not the geometric d·tan θ. The flux-weighted centroid of a beam in a homogeneous medium moves along
     * a straight line, but at the slope ∫S_x dx / ∫S_z dx = Σ kx Q|A|² / Σ kz Q|A|² (Parseval; common practice),
     * the flux-weighted mean of tan over its plane waves, which exceeds tan θ because tan is convex: at θ = 74.8°
     * with w0 = 1 um in glass at 633 nm (plane waves spread over ±7.6°) the slope is 3.988 against tan θ = 3.681,
     * 0.14 um over 0.445 um (measured 2026-12-04). A simulated beam's measured path (the incident-power run's
     * centroids) moves at the same slope, so shifts from the two sides compare only against the same baseline.
     *
     * @param distance d ≥ 0, m
     */
    public static double specularCentroid(PlanarStack stack, Polarization polarization, GaussianBeam beam, int samples,
                                          double window, double distance) {
        checkSampling(stack, beam, samples, window);
        if (!(distance >= 0) || Double.isInfinite(distance)) {
            throw new IllegalArgumentException(String.format("distance %g m must be finite and >= 0", distance));
        }
        Spectra s = spectra(stack, polarization, beam, samples, window, null);
        return centroidAt(stack, beam, s, distance, s.incident, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
    }

    /**
     * The lateral shift on the line a distance d back into the incidence medium as a line of finite length sees it:
     * the reflected and the mirrored centroids ({@link #reflectedCentroid}, {@link #specularCentroid}) taken over
     * from ≤ x ≤ to only (the stack's x, the incident axis meeting the interface at x = 0), m. The window must hold
     * the segment.
     */
    public static double shiftOnSegment(PlanarStack stack, Polarization polarization, GaussianBeam beam, int samples,
                                        double window, double distance, double from, double to) {
        checkSampling(stack, beam, samples, window);
        if (!(from < to) || !(from >= -window / 2) || !(to <= window / 2)) {
            throw new IllegalArgumentException(String.format("segment from %g m to %g m must be increasing and inside the "
                    + "window of %g m about x = 0", from, to, window));
        }
        return segmentShift(stack, beam, spectra(stack, polarization, beam, samples, window, null), distance, from, to);
    }

    /**
     * {@link #shiftOnSegment} at the sampling {@link #converged} returned, from the spectra it kept (no second pass
     * through the stack).
     *
     * @param reference what {@link #converged} returned for this stack, polarization and beam
     */
    public static double shiftOnSegment(PlanarStack stack, Polarization polarization, GaussianBeam beam,
                                        Converged reference, double distance, double from, double to) {
        Spectra s = kept(polarization, reference);
        if (!(from < to) || !(from >= -s.window / 2) || !(to <= s.window / 2)) {
            throw new IllegalArgumentException(String.format("segment from %g m to %g m must be increasing and inside the "
                    + "window of %g m about x = 0", from, to, s.window));
        }
        return segmentShift(stack, beam, s, distance, from, to);
    }

    private static double segmentShift(PlanarStack stack, GaussianBeam beam, Spectra s, double distance, double from,
                                       double to) {
        return centroidAt(stack, beam, s, distance, s.reflected, from, to)
                - centroidAt(stack, beam, s, distance, s.incident, from, to);
    }

    /** The spectra a {@link Converged} kept, as a sampling (without the stack's responses). */
    private static Spectra kept(Polarization polarization, Converged c) {
        int samples = c.result().samples();
        double window = -2 * c.result().start();
        return new Spectra(polarization, samples, window, c.incidentSpectrum, c.reflectedSpectrum, null, Double.NaN,
                Double.NaN, Double.NaN, null, null, null, windowPhases(samples, samples / 2, (2 * Math.PI / window) / (2 * Math.PI)));
    }

    /**
     * {@link #reflectedCentroid} from a sampling's spectra over the samples with from ≤ x ≤ to: the spectrum
     * {@code reflected} (r·A, or A for the mirrored beam) carried a distance d back into the incidence medium (times
     * e^{i kz d}) and its admittance-weighted copy, transformed.
     */
    private static double centroidAt(PlanarStack stack, GaussianBeam beam, Spectra s, double distance, double[] reflected,
                                     double from, double to) {
        double[] flux = fluxAt(stack, beam, s, distance, reflected);
        double start = -s.window / 2;
        double dx = s.window / s.samples;
        double sum = 0;
        double moment = 0;
        for (int j = 0; j < s.samples; j++) {
            double x = start + j * dx;
            if (!(x >= from && x <= to)) {
                continue;
            }
            sum += flux[j];
            moment += x * flux[j];
        }
        return sum > 0 ? moment / sum : Double.NaN;
    }

    /**
     * The flux density towards −z across the line z = −d of the beam whose spectrum on the first interface is
     * {@code reflected} (as {@link Spectra} holds it), at x_j = −W/2 + j·W/N: Re(U V*) with V = Q1·U plane wave by plane
     * wave (Q1 = kz/k0 for s, kz/(k0 n1²) for p; {@link #reflectedCentroid}).
     */
    private static double[] fluxAt(PlanarStack stack, GaussianBeam beam, Spectra s, double distance, double[] reflected) {
        int samples = s.samples;
        double[] incident = s.incident;
        double n1 = stack.incidentIndex();
        double k0 = 2 * Math.PI / beam.wavelength();
        double k = n1 * k0;
        double dk = 2 * Math.PI / s.window;
        int c = samples / 2;
        double f1 = s.polarization == Polarization.S ? 1 : n1 * n1;
        double[] u = new double[2 * samples];
        double[] v = new double[2 * samples];
        for (int m = 0; m < samples; m++) {
            double kx = (m - c) * dk;
            if (incident[2 * m] == 0 && incident[2 * m + 1] == 0 || !(Math.abs(kx) < k)) {
                continue;
            }
            double kz1 = Math.sqrt((k - kx) * (k + kx));
            Complex r = new Complex(reflected[2 * m], reflected[2 * m + 1]).times(Complex.polar(1, kz1 * distance));
            put(u, m, r);
            put(v, m, r.times(kz1 / (k0 * f1)));
        }
        DoubleFFT_1D fft = new DoubleFFT_1D(samples);
        for (double[] x : new double[][] {u, v}) {
            fft.complexInverse(x, false);
            shiftToWindow(x, s.phases);
        }
        double[] flux = new double[samples];
        for (int j = 0; j < samples; j++) {
            flux[j] = u[2 * j] * v[2 * j] + u[2 * j + 1] * v[2 * j + 1];
        }
        return flux;
    }

    /**
     * The flux density across the line a distance d back into the incidence medium of the reflected beam
     * ({@code mirrored} false) or of the incident beam sent back unchanged by a perfect mirror (true), at
     * x_j = −W/2 + j·W/N in the stack's x: the profiles whose centroids are {@link #reflectedCentroid} and
     * {@link #specularCentroid}; Q1|U|² in the units of {@link Result}'s profiles (the mirrored one at d = 0 is the
     * incident beam's own on the interface). A new array.
     *
     * @param distance d ≥ 0, m
     */
    public static double[] fluxDensity(PlanarStack stack, Polarization polarization, GaussianBeam beam, int samples,
                                       double window, double distance, boolean mirrored) {
        checkSampling(stack, beam, samples, window);
        if (!(distance >= 0) || Double.isInfinite(distance)) {
            throw new IllegalArgumentException(String.format("distance %g m must be finite and >= 0", distance));
        }
        Spectra s = spectra(stack, polarization, beam, samples, window, null);
        return fluxAt(stack, beam, s, distance, mirrored ? s.incident : s.reflected);
    }

    /**
     * {@link #fluxDensity} at the sampling {@link #converged} returned, from the spectra it kept (no second pass
     * through the stack).
     *
     * @param reference what {@link #converged} returned for this stack, polarization and beam
     */
    public static double[] fluxDensity(PlanarStack stack, Polarization polarization, GaussianBeam beam, Converged reference,
                                       double distance, boolean mirrored) {
        if (!(distance >= 0) || Double.isInfinite(distance)) {
            throw new IllegalArgumentException(String.format("distance %g m must be finite and >= 0", distance));
        }
        Spectra s = kept(polarization, reference);
        return fluxAt(stack, beam, s, distance, mirrored ? s.incident : s.reflected);
    }

    /**
     * The incident spectrum A(kx) of the class comment for sample m − c, with the sign (−1)^(m−c) that moves
     * the profile's origin to x_0 = −W/2
     * (see shiftToWindow); null for a kx outside the beam (evanescent in the incidence medium, a backward
     * wave in the beam's frame, or an amplitude that underflows).
     */
    private static Complex incident(GaussianBeam beam, double k, double kx, int mc) {
        if (!(Math.abs(kx) < k)) {
            return null;
        }
        double psi = Math.asin(kx / k) - beam.angle();
        double cosPsi = Math.cos(psi);
        if (!(cosPsi > 0)) {
            return null; // a backward wave in the beam's frame: not part of the beam
        }
        double kt = k * Math.sin(psi);
        double kz1 = Math.sqrt((k - kx) * (k + kx));
        double w = beam.waist();
        double mag = w * Math.sqrt(Math.PI) * Math.exp(-w * w * kt * kt / 4) * (k * cosPsi / kz1);
        if (mag == 0) {
            return null;
        }
        Complex a = Complex.polar(mag, k * cosPsi * beam.waistDistance());
        return (mc & 1) != 0 ? a.negate() : a;
    }

    /** Refuses a window or a sampling that cannot hold the beam. */
    private static void checkSampling(PlanarStack stack, GaussianBeam beam, int samples, double window) {
        double n1 = stack.incidentIndex();
        double lambda = beam.wavelength();
        double dx = window / samples;
        if (samples < 2) {
            throw new IllegalArgumentException(String.format("samples %d must be >= 2", samples));
        }
        if (!(window >= 4 * beam.footprint()) || Double.isInfinite(window)) {
            throw new IllegalArgumentException(String.format(
                    "window %g m must be finite and at least 4 beam footprints w0/cos(theta) = %g m", window,
                    4 * beam.footprint()));
        }
        if (!(dx <= lambda / (2 * n1))) {
            throw new IllegalArgumentException(String.format(
                    "sample spacing window/samples = %g m must be at most lambda0/(2 n1) = %g m, so that every "
                            + "propagating plane wave (|kx| < n1 k0) is sampled", dx, lambda / (2 * n1)));
        }
    }

    private static void put(double[] u, int m, Complex z) {
        u[2 * m] = z.re();
        u[2 * m + 1] = z.im();
    }

    /**
     * Turns F_j = Σ_m B_m exp(2πi mj/N), with B_m = (−1)^(m−c) A_m, into U(x_j) = scale · exp(−2πi c j/N) · F_j,
     * since kx_m x_j = −π(m − c) + 2π mj/N − 2π cj/N: the factors, {scale·cos φ_j, scale·sin φ_j} interleaved. The
     * phase c·j is reduced mod N first so that it stays exact.
     */
    private static double[] windowPhases(int n, int c, double scale) {
        double[] out = new double[2 * n];
        for (int j = 0; j < n; j++) {
            double phi = -2 * Math.PI * (int) (((long) c * j) % n) / n;
            out[2 * j] = Math.cos(phi) * scale;
            out[2 * j + 1] = Math.sin(phi) * scale;
        }
        return out;
    }

    /** Multiplies F_j by the factors of {@link #windowPhases}; modifies {@code u} in place. */
    private static void shiftToWindow(double[] u, double[] phases) {
        for (int j = 0; j < phases.length / 2; j++) {
            double cs = phases[2 * j];
            double sn = phases[2 * j + 1];
            double re = u[2 * j];
            double im = u[2 * j + 1];
            u[2 * j] = re * cs - im * sn;
            u[2 * j + 1] = re * sn + im * cs;
        }
    }

    /** Σ x_j |U_j|² / Σ |U_j|², m; NaN for a zero profile. */
    private static double centroid(double[] u, double start, double dx) {
        double sum = 0;
        double moment = 0;
        for (int j = 0; j < u.length / 2; j++) {
            double p = u[2 * j] * u[2 * j] + u[2 * j + 1] * u[2 * j + 1];
            sum += p;
            moment += (start + j * dx) * p;
        }
        return sum > 0 ? moment / sum : Double.NaN;
    }
}
