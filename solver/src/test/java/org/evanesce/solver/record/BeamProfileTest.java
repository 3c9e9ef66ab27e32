package org.evanesce.solver.record;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.record.BeamProfile.PlaneWaveSpectrum;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Beam moments and plane-wave spectra against closed forms: the moments of a Gaussian, the Fourier pair
 * exp(−x²/w²) ↔ w√π exp(−k²w²/4) (any table of Fourier transforms, e.g. Bracewell, The Fourier Transform
 * and Its Applications; from memory), Parseval's theorem and Fourier-series orthogonality.
 */
class BeamProfileTest {

    private static final double WAVELENGTH = 1e-6;
    private static final double WAIST = 3e-6;
    /** Twenty cells per wavelength, as the solver's tests use. */
    private static final double CELL = WAVELENGTH / 20;
    /**
     * A Gaussian sampled at w/60 and cut at ±7w: by Poisson summation the discrete moments differ from the
     * integrals by about exp(−2π²(w/2Δ)²) and the cut by exp(−98), both far below rounding (measured ~1e-14).
     */
    private static final double SAMPLED_GAUSSIAN = 1e-10;
    /** Sums of a few thousand terms of order 1: rounding only (measured ~1e-15 of the peak). */
    private static final double ROUNDING = 1e-12;

    /** A Gaussian profile S = S0 exp(−2(x − x0)²/w²) centred off the grid. */
    @ParameterizedTest(name = "x0 = {0} µm, sign {1}")
    @CsvSource({"0.3183, 1", "-2.71828, 1", "1.234, -1"})
    void gaussianCentroidWidthAndPower(double centreMicrons, double sign) {
        double x0 = centreMicrons * 1e-6;
        double s0 = 2.5 * sign;
        double first = x0 - 7 * WAIST;
        int n = (int) Math.ceil(14 * WAIST / CELL);
        double[] s = new double[n];
        for (int k = 0; k < n; k++) {
            double d = first + k * CELL - x0;
            s[k] = s0 * Math.exp(-2 * d * d / (WAIST * WAIST));
        }
        BeamProfile b = BeamProfile.fromFluxDensity(first, CELL, s);
        String ctx = String.format("Gaussian w = %g m at x0 = %g m, Δ = %g m, %d cells", WAIST, x0, CELL, n);
        // centroid x0; σ² = w²/4 so 2σ = w (ISO 11146-1 second-moment width, from memory); ∫ S0 exp(−2x²/w²) dx = S0 w sqrt(π/2)
        assertEquals(x0, b.centroid(), SAMPLED_GAUSSIAN * WAIST, ctx);
        assertEquals(WAIST, b.width(), SAMPLED_GAUSSIAN * WAIST, ctx);
        assertEquals(s0 * WAIST * Math.sqrt(Math.PI / 2), b.total(), SAMPLED_GAUSSIAN * Math.abs(s0) * WAIST, ctx);
        assertEquals(first + (n - 1) * CELL, b.x()[n - 1], ROUNDING * WAIST, ctx);
    }

    @Test
    void topHatHasTheMidpointRuleSecondMoment() {
        // a top hat of half-width a sampled at cell centres: Σ x² Δ / 2a = a²/3 − Δ²/12 exactly (midpoint rule for x²),
        // so 2σ = 2 sqrt(a²/3 − Δ²/12), not the Gaussian w; computed by hand
        int n = 40;
        double a = n * CELL / 2;
        double[] re = new double[n];
        double[] im = new double[n];
        for (int k = 0; k < n; k++) {
            re[k] = 0.6;
            im[k] = -0.8; // |E|² = 1
        }
        BeamProfile b = BeamProfile.fromIntensity(-a + CELL / 2, CELL, re, im);
        assertEquals(0.0, b.centroid(), ROUNDING * a, "top hat centroid");
        assertEquals(2 * Math.sqrt(a * a / 3 - CELL * CELL / 12), b.width(), ROUNDING * a, "top hat width");
        assertEquals(2 * a, b.total(), ROUNDING * a, "top hat ∫|E|² dx");
        assertTrue(Double.isNaN(BeamProfile.fromFluxDensity(0, CELL, new double[] {1, -1}).centroid()), "zero net flux");
    }

    /** The tilted Gaussian E = exp(−x²/w²) e^{i kx0 x}: A(k) = w√π exp(−(k − kx0)²w²/4), real. */
    @ParameterizedTest(name = "sin θ = {0}, oversampling {1}")
    @CsvSource({"0.3, 8", "-0.55, 8", "0.123, 1", "0.5, 3"})
    void tiltedGaussianSpectrum(double sine, int oversampling) {
        double kx0 = 2 * Math.PI / WAVELENGTH * sine;
        double first = -6 * WAIST + 0.37 * CELL; // off-centre samples: the phase origin must still be x = 0
        int n = (int) Math.ceil(12 * WAIST / CELL);
        double[] re = new double[n];
        double[] im = new double[n];
        double energy = 0;
        for (int k = 0; k < n; k++) {
            double x = first + k * CELL;
            double g = Math.exp(-x * x / (WAIST * WAIST));
            re[k] = g * Math.cos(kx0 * x);
            im[k] = g * Math.sin(kx0 * x);
            energy += g * g * CELL;
        }
        PlaneWaveSpectrum a = PlaneWaveSpectrum.finiteLine(first, CELL, re, im, oversampling);
        String ctx = String.format("kx0 = %g rad/m, w = %g m, Δ = %g m, %d cells, oversampling %d", kx0, WAIST, CELL, n,
                oversampling);
        double peak = WAIST * Math.sqrt(Math.PI);
        double dk = a.wavenumber()[1] - a.wavenumber()[0];
        assertEquals(2 * Math.PI / (n * oversampling * CELL), dk, ROUNDING * dk, ctx);
        double[] p = a.power();
        double parseval = 0;
        for (int j = 0; j < p.length; j++) {
            double d = a.wavenumber()[j] - kx0;
            double exact = peak * Math.exp(-d * d * WAIST * WAIST / 4);
            assertEquals(exact, a.re()[j], SAMPLED_GAUSSIAN * peak, ctx + " Re A at kx = " + a.wavenumber()[j]);
            assertEquals(0.0, a.im()[j], SAMPLED_GAUSSIAN * peak, ctx + " Im A at kx = " + a.wavenumber()[j]);
            parseval += p[j] * dk;
        }
        // Parseval: ∫|A|² dk = 2π ∫|E|² dx, exact for the DFT with these scalings
        assertEquals(2 * Math.PI * energy, parseval, ROUNDING * parseval, ctx + " Parseval");
        // the log-parabola through three grid points is exact for a Gaussian spectrum
        assertEquals(kx0, a.peakWavenumber(), SAMPLED_GAUSSIAN * Math.abs(kx0), ctx + " peak");
        assertEquals(kx0, a.meanWavenumber(), SAMPLED_GAUSSIAN * Math.abs(kx0), ctx + " mean");
        // |A|² ∝ exp(−k²w²/2) = exp(−2k²/(2/w)²): 1/e² half-width, and 2σ_k, equal 2/w
        assertEquals(2 / WAIST, a.width(), SAMPLED_GAUSSIAN * 2 / WAIST, ctx + " spectral width");
        assertEquals(Math.asin(sine), PlaneWaveSpectrum.angle(a.peakWavenumber(), 1.0, WAVELENGTH),
                SAMPLED_GAUSSIAN, ctx + " angle");
    }

    @Test
    void blochPeriodicFieldGivesItsPlaneWaveAmplitudes() {
        // E(x) = e^{i kB x} (a0 + a1 e^{2πix/L} + a₋₂ e^{−4πix/L}) on one period: by orthogonality of the
        // harmonics on N points, the amplitudes come back exactly at kB, kB + 2π/L, kB − 4π/L and nothing else
        int n = 37; // odd, awkward length
        double period = n * CELL;
        double kb = 0.41 * 2 * Math.PI / WAVELENGTH;
        double first = 0.29e-6;
        double[][] amp = {{0.7, -0.2}, {-0.3, 0.45}, {0.05, 0.11}};
        int[] harmonic = {0, 1, -2};
        double[] re = new double[n];
        double[] im = new double[n];
        for (int k = 0; k < n; k++) {
            double x = first + k * CELL;
            for (int h = 0; h < harmonic.length; h++) {
                double ph = (kb + 2 * Math.PI * harmonic[h] / period) * x;
                re[k] += amp[h][0] * Math.cos(ph) - amp[h][1] * Math.sin(ph);
                im[k] += amp[h][0] * Math.sin(ph) + amp[h][1] * Math.cos(ph);
            }
        }
        PlaneWaveSpectrum a = PlaneWaveSpectrum.periodic(first, CELL, re, im, kb);
        assertEquals(n, a.wavenumber().length, "one wavenumber per sample");
        int found = 0;
        for (int j = 0; j < n; j++) {
            double m = (a.wavenumber()[j] - kb) * period / (2 * Math.PI);
            long mi = Math.round(m);
            assertEquals(mi, m, 1e-9, "harmonics on the Bloch grid");
            double er = 0;
            double ei = 0;
            for (int h = 0; h < harmonic.length; h++) {
                if (harmonic[h] == mi) {
                    er = amp[h][0];
                    ei = amp[h][1];
                    found++;
                }
            }
            assertEquals(er, a.re()[j], ROUNDING, "Re c_" + mi);
            assertEquals(ei, a.im()[j], ROUNDING, "Im c_" + mi);
        }
        assertEquals(harmonic.length, found, "every harmonic inside the grid");
    }

    @Test
    void angleInAMedium() {
        // kx = n k0 sin 30° gives 30° back (asin, to rounding); beyond n k0 the wave is evanescent
        double n = 1.5;
        double nk0 = n * 2 * Math.PI / WAVELENGTH;
        assertEquals(30.0, Math.toDegrees(PlaneWaveSpectrum.angle(nk0 * Math.sin(Math.toRadians(30)), n, WAVELENGTH)), 1e-6);
        assertEquals(-30.0, Math.toDegrees(PlaneWaveSpectrum.angle(-nk0 * 0.5, n, WAVELENGTH)), 1e-6);
        assertThrows(IllegalArgumentException.class, () -> PlaneWaveSpectrum.angle(1.01 * nk0, n, WAVELENGTH));
    }

    /**
     * A flux line fed by a fake step view with arbitrary fields: the per-cell density sums to the line's flux, its
     * sign follows E × H* (Born &amp; Wolf sec. 1.1), and the profile's positions follow the component's site.
     */
    @ParameterizedTest(name = "{0}")
    @CsvSource({"S", "P"})
    void fluxDensitySumsToTheLinesFlux(Polarization pol) {
        int nx = 23;
        double dt = 1e-17;
        double f = 3.1e14;
        FluxLine line = new FluxLine(pol, 4, 3, 19, f);
        Component e = pol == Polarization.S ? Component.EZ : Component.EX;
        for (long step = 1; step <= 60; step++) {
            line.afterStep(new FakeView(step, dt, nx, 2 * Math.PI * f));
        }
        double[] s = line.fluxDensity(0);
        double sum = 0;
        for (double v : s) {
            sum += v * CELL;
        }
        double flux = line.flux(0, CELL);
        assertEquals(flux, sum, ROUNDING * Math.abs(flux), pol + " Σ S Δ = flux");
        assertEquals(16, line.cells(), pol + " cells");
        assertEquals(f, line.frequency(0), ROUNDING * f, pol + " frequency");
        // E and η0·H take the same values, H half a step earlier: H̃ = Ẽ e^{−iωΔt/2}, so
        // S = ±½|Ẽ|² cos(ωΔt/2)/η0 along +y, + for s (Ez Hx*) and − for p (−Ex Hz*); computed by hand
        double[][] ef = line.electricTransform(0);
        double[][] hf = line.magneticTransform(0);
        double e2 = ef[0][0] * ef[0][0] + ef[1][0] * ef[1][0];
        double expected = (pol == Polarization.S ? 0.5 : -0.5) * e2 * Math.cos(Math.PI * f * dt) / PhysicalConstants.ETA0;
        assertEquals(expected, s[0], ROUNDING * Math.abs(expected), pol + " density at the first cell");
        assertEquals(Math.sqrt(e2), Math.hypot(hf[0][0], hf[1][0]), ROUNDING * Math.sqrt(e2), pol + " |H̃| = |Ẽ|");
        BeamProfile b = BeamProfile.of(line, 0, CELL, -1e-6);
        assertEquals(-1e-6 + (3 + e.dx) * CELL, b.x()[0], ROUNDING * 1e-6, pol + " first site");
        assertEquals(flux, b.total(), ROUNDING * Math.abs(flux), pol + " profile total");
    }

    /** Every component equals (1 + i/10)·cos(ω nΔt + i) after step n, whatever its own sample time. */
    private record FakeView(long stepCount, double dt, int nx, double omega) implements StepView {
        @Override
        public int ny() {
            return 9;
        }

        @Override
        public double cellSize() {
            return CELL;
        }

        @Override
        public double field(Component c, int i, int j) {
            return (1 + 0.1 * i) * Math.cos(omega * stepCount * dt + i);
        }

        @Override
        public double energy(int i0, int j0, int i1, int j1) {
            return 0;
        }
    }
}
