package org.evanesce.solver.record;

import org.jtransforms.fft.DoubleFFT_1D;

/**
 * A beam's power, centroid and width across a line at one frequency, from a weight per cell: the Poynting
 * flux density S(x) through a {@link FluxLine}, or |E|² where there is no flux to speak of (near and
 * evanescent fields).
 *
 * <p>Definitions, with x_k the cell positions, Δ the cell size and S_k the weights:
 * <ul>
 * <li>total = Σ S_k Δ (the power through the line, W per metre of z, for a flux density);</li>
 * <li>centroid c = Σ x_k S_k / Σ S_k (first moment);</li>
 * <li>width = 2σ with σ² = Σ (x_k − c)² S_k / Σ S_k: half the second-moment diameter D4σ of ISO 11146-1
 * (the published definition of the second-moment beam width; from memory). For a Gaussian, |E|² ∝ exp(−2x²/w²) has
 * σ = w/2, so the width is the 1/e² intensity half-width, the waist w.</li>
 * </ul>
 * The moments use the weights as given, with no background subtraction or clipped integration range
 * (which ISO 11146 prescribes for measured, noisy profiles; from memory), so a tail or a reflected part
 * of the other sign moves them. They are meaningful when the weights have one sign, as for a beam that
 * crosses the line one way (all negative works too); centroid and width are NaN when Σ S_k is 0, and the
 * width is NaN when mixed signs make the second moment negative.
 *
 * <p>The arrays are the record's own: the factories copy their inputs, and callers must not modify them.
 *
 * @param total    Σ S_k Δ; W/m for a flux density, V² (times the source's units squared) for |E|²
 * @param centroid first moment of the weights, metres
 * @param width    2σ, metres (the 1/e² intensity half-width of a Gaussian beam)
 * @param x        cell positions, metres
 * @param weight   the per-cell weights S_k
 */
public record BeamProfile(double total, double centroid, double width, double[] x, double[] weight) {

    /**
     * Moments of a weight sampled on uniform cells x_k = firstX + kΔ.
     *
     * @param firstX   position of the first sample, metres
     * @param cellSize Δ, metres; positive
     * @param weight   S_k, e.g. the flux density in W/m²; not modified
     */
    public static BeamProfile fromFluxDensity(double firstX, double cellSize, double[] weight) {
        if (!(cellSize > 0) || weight.length == 0) {
            throw new IllegalArgumentException(String.format("beam profile: need cellSize > 0 m and at least one cell, got %g m and %d",
                    cellSize, weight.length));
        }
        double[] x = new double[weight.length];
        double sum = 0;
        double first = 0;
        for (int k = 0; k < x.length; k++) {
            x[k] = firstX + k * cellSize;
            sum += weight[k];
            first += x[k] * weight[k];
        }
        double c = sum != 0 ? first / sum : Double.NaN;
        double second = 0;
        for (int k = 0; k < x.length; k++) {
            double d = x[k] - c;
            second += d * d * weight[k];
        }
        double width = sum != 0 ? 2 * Math.sqrt(second / sum) : Double.NaN;
        return new BeamProfile(sum * cellSize, c, width, x, weight.clone());
    }

    /**
     * Moments of |E|² = re² + im² on uniform cells x_k = firstX + kΔ (see {@link #fromFluxDensity}); the arrays
     * are not modified.
     */
    public static BeamProfile fromIntensity(double firstX, double cellSize, double[] re, double[] im) {
        requireSameLength(re, im);
        double[] w = new double[re.length];
        for (int k = 0; k < w.length; k++) {
            w[k] = re[k] * re[k] + im[k] * im[k];
        }
        return fromFluxDensity(firstX, cellSize, w);
    }

    /**
     * The flux profile through a line at frequency number q: weights {@link FluxLine#fluxDensity(int)}, cell i
     * at x = originX + (i + dx)Δ with dx the electric component's offset on the Yee cell.
     *
     * @param originX x of grid node 0, metres
     */
    public static BeamProfile of(FluxLine line, int q, double cellSize, double originX) {
        return fromFluxDensity(firstSite(line, cellSize, originX), cellSize, line.fluxDensity(q));
    }

    /** The profile of the difference of {@code line}'s fields and {@code reference}'s (the scattered beam). */
    public static BeamProfile of(FluxLine line, FluxLine reference, int q, double cellSize, double originX) {
        return fromFluxDensity(firstSite(line, cellSize, originX), cellSize, line.fluxDensity(q, reference));
    }

    /** Where the first cell's electric field sits, metres. */
    static double firstSite(FluxLine line, double cellSize, double originX) {
        if (line.isVertical()) {
            throw new IllegalArgumentException("a beam profile is taken across a horizontal line; this one is vertical");
        }
        return originX + (line.firstCell() + line.electricComponent().dx) * cellSize;
    }

    private static void requireSameLength(double[] re, double[] im) {
        if (re.length != im.length || re.length == 0) {
            throw new IllegalArgumentException(String.format("field samples: re has %d, im has %d; need the same, non-zero count",
                    re.length, im.length));
        }
    }

    /**
     * The plane-wave (angular) spectrum of a line's field E(x): A(kx) on a grid of transverse wavenumbers,
     * with time dependence exp(−iωt) so that E ∝ e^{i kx x} travels towards +x for kx > 0.
     *
     * <p>Its moments use |A|² as weight, like {@link BeamProfile}'s: the mean kx, and the width 2σ_k,
     * which for a Gaussian E ∝ exp(−x²/w²) (|A|² ∝ exp(−k²w²/2)) is 2/w, the 1/e² half-width of |A|².
     *
     * @param wavenumber kx, rad/m, increasing
     * @param re         Re A(kx)
     * @param im         Im A(kx)
     */
    public record PlaneWaveSpectrum(double[] wavenumber, double[] re, double[] im) {

        /**
         * The spectrum of a finite line: A(k_m) = Δ Σ_n E(x_n) e^{−i k_m x_n}, x_n = firstX + nΔ, which
         * approximates the Fourier integral ∫ E(x) e^{−ikx} dx of a field that vanishes off the line. Zero
         * padding to M = oversampling·N samples puts k_m = 2πm/(MΔ), m = −⌊M/2⌋ … M − 1 − ⌊M/2⌋, at a
         * spacing 2π/(MΔ); it interpolates the same transform, it does not sharpen it.
         *
         * @param re           Re E at the N samples; not modified
         * @param im           Im E; not modified
         * @param oversampling M/N, at least 1
         */
        public static PlaneWaveSpectrum finiteLine(double firstX, double cellSize, double[] re, double[] im, int oversampling) {
            requireSameLength(re, im);
            if (!(cellSize > 0) || oversampling < 1) {
                throw new IllegalArgumentException(String.format(
                        "plane-wave spectrum: need cellSize > 0 m and oversampling >= 1, got %g m and %d", cellSize, oversampling));
            }
            int m = Math.multiplyExact(re.length, oversampling);
            return transform(firstX, cellSize, re, im, m, 0.0, cellSize);
        }

        /**
         * The spectrum of one period of a Bloch-periodic field, E(x + L) = e^{i kB L} E(x) with L = NΔ: the
         * amplitudes c_m = (1/N) Σ_n E(x_n) e^{−i k_m x_n} of its plane waves, E(x) = Σ_m c_m e^{i k_m x}, at
         * k_m = kB + 2πm/L (only these are present, so no padding). A plane wave of amplitude a gives c = a.
         *
         * @param blochWavenumber kB, rad/m
         */
        public static PlaneWaveSpectrum periodic(double firstX, double cellSize, double[] re, double[] im, double blochWavenumber) {
            requireSameLength(re, im);
            if (!(cellSize > 0)) {
                throw new IllegalArgumentException(String.format("plane-wave spectrum: need cellSize > 0 m, got %g m", cellSize));
            }
            return transform(firstX, cellSize, re, im, re.length, blochWavenumber, 1.0 / re.length);
        }

        /** The spectrum of a line's transformed electric field at frequency q (see {@link #finiteLine}). */
        public static PlaneWaveSpectrum of(FluxLine line, int q, double cellSize, double originX, int oversampling) {
            double[][] e = line.electricTransform(q);
            return finiteLine(firstSite(line, cellSize, originX), cellSize, e[0], e[1], oversampling);
        }

        /** Demodulates by e^{−i kB nΔ}, pads to m, transforms, reorders by k and puts the phase origin at x = 0. */
        private static PlaneWaveSpectrum transform(double firstX, double dx, double[] re, double[] im, int m, double kb,
                double scale) {
            double[] a = new double[2 * m];
            for (int n = 0; n < re.length; n++) {
                double c = Math.cos(kb * n * dx);
                double s = -Math.sin(kb * n * dx);
                a[2 * n] = re[n] * c - im[n] * s;
                a[2 * n + 1] = re[n] * s + im[n] * c;
            }
            new DoubleFFT_1D(m).complexForward(a); // a_m = Σ a_n e^{−2πi mn/M}
            double dk = 2 * Math.PI / (m * dx);
            double[] k = new double[m];
            double[] ar = new double[m];
            double[] ai = new double[m];
            for (int j = 0; j < m; j++) {
                int harmonic = j - m / 2;
                int bin = Math.floorMod(harmonic, m);
                k[j] = kb + harmonic * dk;
                // e^{−i k x_n} = e^{−i k firstX} · e^{−i kB nΔ} · e^{−2πi·harmonic·n/M}
                double c = Math.cos(k[j] * firstX) * scale;
                double s = -Math.sin(k[j] * firstX) * scale;
                ar[j] = a[2 * bin] * c - a[2 * bin + 1] * s;
                ai[j] = a[2 * bin] * s + a[2 * bin + 1] * c;
            }
            return new PlaneWaveSpectrum(k, ar, ai);
        }

        /** |A(kx)|² per grid point; a new array. */
        public double[] power() {
            double[] p = new double[re.length];
            for (int j = 0; j < p.length; j++) {
                p[j] = re[j] * re[j] + im[j] * im[j];
            }
            return p;
        }

        /**
         * The kx of the largest |A|², refined between grid points by the parabola through ln|A|² at the peak
         * and its two neighbours (exact for a Gaussian spectrum; common practice); the grid value itself at
         * either end of the grid or next to a zero. rad/m.
         */
        public double peakWavenumber() {
            double[] p = power();
            int best = 0;
            for (int j = 1; j < p.length; j++) {
                if (p[j] > p[best]) {
                    best = j;
                }
            }
            if (best == 0 || best == p.length - 1 || !(p[best - 1] > 0) || !(p[best + 1] > 0)) {
                return wavenumber[best];
            }
            double a = Math.log(p[best - 1]);
            double b = Math.log(p[best]);
            double c = Math.log(p[best + 1]);
            double curvature = a - 2 * b + c;
            double shift = curvature < 0 ? 0.5 * (a - c) / curvature : 0.0;
            return wavenumber[best] + shift * (wavenumber[best + 1] - wavenumber[best]);
        }

        /** Σ kx |A|² / Σ |A|², rad/m; NaN for a zero spectrum. */
        public double meanWavenumber() {
            double[] p = power();
            double sum = 0;
            double first = 0;
            for (int j = 0; j < p.length; j++) {
                sum += p[j];
                first += wavenumber[j] * p[j];
            }
            return sum > 0 ? first / sum : Double.NaN;
        }

        /** 2σ_k with σ_k² = Σ (kx − mean)² |A|² / Σ |A|², rad/m (2/w for a Gaussian beam of waist w). */
        public double width() {
            double[] p = power();
            double mean = meanWavenumber();
            double sum = 0;
            double second = 0;
            for (int j = 0; j < p.length; j++) {
                double d = wavenumber[j] - mean;
                sum += p[j];
                second += d * d * p[j];
            }
            return sum > 0 ? 2 * Math.sqrt(second / sum) : Double.NaN;
        }

        /**
         * The propagation angle from the line's normal of a plane wave with transverse wavenumber kx in a medium
         * of refractive index n: asin(kx / (n k0)), k0 = 2π/λ0; radians, positive towards +x.
         *
         * @throws IllegalArgumentException if |kx| &gt; n k0 (an evanescent wave has no angle)
         */
        public static double angle(double kx, double index, double vacuumWavelength) {
            double nk0 = index * 2 * Math.PI / vacuumWavelength;
            if (!(nk0 > 0) || !(Math.abs(kx) <= nk0)) {
                throw new IllegalArgumentException(String.format(
                        "angle: need |kx| <= n k0 with n k0 > 0; kx = %g rad/m, n = %g, vacuum wavelength = %g m (n k0 = %g rad/m)",
                        kx, index, vacuumWavelength, nk0));
            }
            return Math.asin(kx / nk0);
        }
    }
}
