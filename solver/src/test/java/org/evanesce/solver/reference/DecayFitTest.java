package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Slab;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.FieldMap;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The exponential-decay fit against exact exponentials, the closed-form weighted straight-line fit, and
 * the evanescent field of a simulated totally reflecting interface (issue #6).
 */
class DecayFitTest {

    /** An exact exponential: ln m is linear to rounding, so L comes back to rounding (measured ~1e-15). */
    private static final double EXACT = 1e-12;
    /** The closed-form sums and the QR solution differ by rounding of sums of a few terms (measured ~1e-15). */
    private static final double CLOSED_FORM = 1e-10;

    private static final double WAVELENGTH = 633e-9;
    private static final double N_GLASS = 1.5;
    private static final double COURANT = 0.5;
    private static final int NX = 8;
    private static final int PML = 30;
    /** Issue #6: the fitted decay length within 2 % of Hecht's. */
    private static final double HECHT_TOL = 0.02;
    /**
     * Against the grid's own decay length, and |E| against |Hz|: measured within 1e-6 (what is left is the
     * truncated pulse and the PML); the margin allows for a different kernel's rounding.
     */
    private static final double GRID_TOL = 1e-4;

    @Test
    void exactExponentialGivesItsLengthAndNoUncertainty() {
        double length = 2.7e-7;
        double amplitude = 3.5;
        int n = 25;
        double[] s = new double[n];
        double[] m = new double[n];
        for (int k = 0; k < n; k++) {
            s[k] = 40e-9 + k * 13e-9;
            m[k] = amplitude * Math.exp(-s[k] / length);
        }
        DecayFit fit = DecayFit.fit(s, m);
        String ctx = String.format("L = %g m, A = %g, %d points: %s", length, amplitude, n, fit);
        assertEquals(length, fit.length(), EXACT * length, ctx);
        assertEquals(amplitude, fit.amplitude(), EXACT * amplitude, ctx);
        assertTrue(fit.lengthUncertainty() < EXACT * length, ctx);
        assertTrue(fit.rmsResidual() < EXACT, ctx);
        assertEquals(n, fit.points(), ctx);
    }

    /**
     * A relative ripple of 1e-3 (deterministic, about three samples a period, so close to independent from sample to
     * sample): L within the bias bound computed below, σ_L &gt; 0 and |L − L_true| &lt; 3σ_L. Measured: L off by 1.2e-4
     * relative, σ_L 2.3e-4 relative, rms residual 7.1e-4.
     */
    @Test
    void rippleGivesABoundedBiasAndAnHonestUncertainty() {
        double length = 1.3e-7;
        double eps = 1e-3;
        int n = 40;
        double[] s = new double[n];
        double[] m = new double[n];
        for (int k = 0; k < n; k++) {
            s[k] = k * 10e-9;
            m[k] = Math.exp(-s[k] / length) * (1 + eps * Math.sin(2.3 * k + 0.4));
        }
        DecayFit fit = DecayFit.fit(s, m);
        // bound on the slope's bias: |Δβ| = |Σ w (s − s̄) r| / Σ w (s − s̄)² ≤ max|r| Σ w |s − s̄| / Σ w (s − s̄)², with
        // |r| = |ln(1 + ε sin)| ≤ −ln(1 − ε), weights w = m², s̄ their weighted mean; then |ΔL| ≤ L² |Δβ| (1 + small)
        double sw = 0;
        double sws = 0;
        for (int k = 0; k < n; k++) {
            sw += m[k] * m[k];
            sws += m[k] * m[k] * s[k];
        }
        double mean = sws / sw;
        double abs = 0;
        double sq = 0;
        for (int k = 0; k < n; k++) {
            abs += m[k] * m[k] * Math.abs(s[k] - mean);
            sq += m[k] * m[k] * (s[k] - mean) * (s[k] - mean);
        }
        double betaBias = -Math.log(1 - eps) * abs / sq;
        double lengthBias = length * length * betaBias / (1 - length * betaBias);
        String ctx = String.format("L = %g m with a ripple of %g: %s, bias bound %g m", length, eps, fit, lengthBias);
        assertTrue(Math.abs(fit.length() - length) <= lengthBias, ctx);
        assertTrue(fit.lengthUncertainty() > 0, ctx);
        assertTrue(Math.abs(fit.length() - length) < 3 * fit.lengthUncertainty(), ctx);
        assertTrue(fit.rmsResidual() > 0.5 * eps / Math.sqrt(2) && fit.rmsResidual() < eps, ctx);
    }

    /**
     * The fit of an arbitrary decaying set against the closed-form weighted straight-line fit of ln m, written
     * out with sums (Press et al., Numerical Recipes, 3rd ed., sec. 15.2, from memory): with weights w = m²,
     * Δ = Σw Σws² − (Σws)², slope β = (Σw Σwsy − Σws Σwy)/Δ, intercept α = (Σws² Σwy − Σws Σwsy)/Δ,
     * σ_β² = Σw/Δ · χ²/(n − 2).
     */
    @Test
    void matchesTheClosedFormWeightedLine() {
        double[] s = {0.0, 1.1e-7, 1.9e-7, 3.2e-7, 4.0e-7, 5.5e-7, 6.1e-7};
        double[] m = {2.0, 1.2, 0.75, 0.41, 0.30, 0.12, 0.11};
        double w = 0;
        double ws = 0;
        double wss = 0;
        double wy = 0;
        double wsy = 0;
        for (int k = 0; k < s.length; k++) {
            double wk = m[k] * m[k];
            double y = Math.log(m[k]);
            w += wk;
            ws += wk * s[k];
            wss += wk * s[k] * s[k];
            wy += wk * y;
            wsy += wk * s[k] * y;
        }
        double delta = w * wss - ws * ws;
        double beta = (w * wsy - ws * wy) / delta;
        double alpha = (wss * wy - ws * wsy) / delta;
        double chi2 = 0;
        double r2 = 0;
        for (int k = 0; k < s.length; k++) {
            double r = Math.log(m[k]) - alpha - beta * s[k];
            chi2 += m[k] * m[k] * r * r;
            r2 += r * r;
        }
        double sigmaBeta = Math.sqrt(w / delta * chi2 / (s.length - 2));
        DecayFit fit = DecayFit.fit(s, m);
        String ctx = fit.toString();
        assertEquals(-1 / beta, fit.length(), CLOSED_FORM * fit.length(), ctx);
        assertEquals(sigmaBeta / (beta * beta), fit.lengthUncertainty(), CLOSED_FORM * fit.lengthUncertainty(), ctx);
        assertEquals(Math.exp(alpha), fit.amplitude(), CLOSED_FORM * fit.amplitude(), ctx);
        assertEquals(Math.sqrt(r2 / s.length), fit.rmsResidual(), CLOSED_FORM * fit.rmsResidual(), ctx);
    }

    @Test
    void refusesTooFewPointsAndNonPositiveMagnitudes() {
        IllegalArgumentException few = assertThrows(IllegalArgumentException.class,
                () -> DecayFit.fit(new double[] {0, 1}, new double[] {1, 0.5}));
        assertTrue(few.getMessage().contains("at least 3"), few.getMessage());
        IllegalArgumentException zero = assertThrows(IllegalArgumentException.class,
                () -> DecayFit.fit(new double[] {0, 1, 2, 3}, new double[] {1, 0.5, 0.0, 0.1}));
        assertTrue(zero.getMessage().contains("magnitude 2"), zero.getMessage());
        IllegalArgumentException negative = assertThrows(IllegalArgumentException.class,
                () -> DecayFit.fit(new double[] {0, 1, 2}, new double[] {-1, 0.5, 0.2}));
        assertTrue(negative.getMessage().contains("magnitude 0"), negative.getMessage());
        assertThrows(IllegalArgumentException.class, () -> DecayFit.fit(new double[] {0, 1, 2}, new double[] {1, 0.5, Double.NaN}));
        assertThrows(IllegalArgumentException.class, () -> DecayFit.fit(new double[] {0, 1, 2}, new double[] {1, 2, 4}));
        assertThrows(IllegalArgumentException.class, () -> DecayFit.fit(new double[] {1, 1, 1}, new double[] {1, 0.5, 0.2}));
    }

    /**
     * Issue #6: the evanescent field beyond a glass (n1 = 1.5) – vacuum interface at 45° and 60°, from a Bloch
     * plane wave, decays over Hecht's 1/κ = λ0 / (2π sqrt(n1² sin²θ − n2²)) (E. Hecht, Optics, 4th ed., sec. 4.7)
     * within 2 %. The fitted magnitude is |Ez| for s; for p it is the electric field's, sqrt(|Ex|² + |Ey|²) with Ey
     * averaged (as complex values) from rows j ± ½ onto Ex's row j: the issue asks about |E|, which is what an
     * intensity near the surface is made of; both components decay as e^{−κy}, so averaging only scales Ey.
     * The magnitude of a Bloch wave does not depend on x, so the half-cell x offset between Ex and Ey is
     * irrelevant. |Hz| (continuous across the interface) is fitted as well and must agree.
     *
     * <p>The fit starts 3 rows beyond the interface (the smoothed cells), spans 3 decay lengths and ends 5 decay
     * lengths short of the top PML (a reflection there returns e^{−10} of the field). The pulse's spectrum must
     * hold nothing above f_c = f n1 sinθ / n2, where the wave at this kx starts to propagate in vacuum: those
     * grazing waves linger and leak into the transform (with σf = f/25 at 45° they left 1 % ripples on the fitted
     * rows). So σf = (f_c − f)/6: f/100 at 45°, f/20 at 60°.
     *
     * <p>Resolution: close to the critical angle κ² = kx² − k0² is a small difference and the grid's own
     * dispersion weighs more. Measured L/L_Hecht: 45° 1.0154 / 1.0066 / 1.0036 at 20 / 30 / 40 cells per
     * wavelength in glass; 60° 1.0335 / 1.0147 / 1.0082 at 10 / 15 / 20; s and p alike. So 30 at 45° and 20 at 60°.
     * Against the discrete rate sinh²(κ̃Δ/2) = sin²(kxΔ/2) − sin²(ωΔt/2)/S² (Yee dispersion relation with an
     * imaginary normal wavenumber, Taflove &amp; Hagness ch. 4, from memory) the fit is within 1e-6.
     */
    @ParameterizedTest(name = "{0} at {1} degrees, {2} cells per wavelength in glass")
    @CsvSource({"S, 45, 30", "P, 45, 30", "S, 60, 20", "P, 60, 20"})
    void evanescentDecayLengthMatchesHecht(Polarization pol, double degrees, int cpw) {
        double dx = WAVELENGTH / (N_GLASS * cpw);
        double theta = Math.toRadians(degrees);
        double kx = 2 * Math.PI / WAVELENGTH * N_GLASS * Math.sin(theta);
        double f = PhysicalConstants.C0 / WAVELENGTH;
        double cutoff = f * N_GLASS * Math.sin(theta);
        double bandwidth = (cutoff - f) / 6;
        double hecht = Evanescent.amplitudeDepth(N_GLASS, 1.0, theta, WAVELENGTH);
        int decayCells = (int) Math.ceil(hecht / dx);
        int source = PML + 10;
        double interfaceRow = source + 30.3;
        int first = (int) interfaceRow + 3;
        int rows = 3 * decayCells + 1;
        int ny = first + rows + 5 * decayCells + PML;
        Scene scene = Scene.builder(Material.ofIndex("glass", N_GLASS))
                .add(new Slab(0, interfaceRow * dx, 0, 1, 1.0), Material.VACUUM).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, dx, NX, ny), Smoothing.ANISOTROPIC);
        Component c = pol == Polarization.S ? Component.EZ : Component.HZ;
        // one column: the magnitudes of a Bloch wave are the same in every column; one row below for Ey's average
        FieldMap map = new FieldMap(pol, 0, first - 1, 1, first + rows, f);
        try (Simulation sim = Simulation.builder(grid).polarization(pol).courant(COURANT)
                .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                .boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML)).threads(1)
                .source(Source.blochRow(c, NX, source, 0.0, dx, kx, TimeSignal.gaussianPulse(f, bandwidth)))
                .listener(map).build()) {
            // the pulse lasts 12τ, τ = 1/(2πσf); then time for the slow parts to cross the grid (as GapTunnellingTest)
            sim.run((long) (12 / (2 * Math.PI * bandwidth) / sim.dt()) + 6L * ny);
        }
        double[] s = new double[rows];
        double[] e = new double[rows];
        double[] h = new double[rows];
        for (int k = 0; k < rows; k++) {
            int j = first + k;
            s[k] = (j - interfaceRow) * dx;
            if (pol == Polarization.S) {
                e[k] = abs(map.transform(Component.EZ, 0, 0, j));
                h[k] = e[k];
            } else {
                double[] ex = map.transform(Component.EX, 0, 0, j);
                double[] below = map.transform(Component.EY, 0, 0, j - 1);
                double[] above = map.transform(Component.EY, 0, 0, j);
                double eyRe = 0.5 * (below[0] + above[0]);
                double eyIm = 0.5 * (below[1] + above[1]);
                e[k] = Math.sqrt(ex[0] * ex[0] + ex[1] * ex[1] + eyRe * eyRe + eyIm * eyIm);
                h[k] = abs(map.transform(Component.HZ, 0, 0, j));
            }
        }
        DecayFit fit = DecayFit.fit(s, e);
        DecayFit fitH = DecayFit.fit(s, h);
        double omegaDt = 2 * Math.PI * f * COURANT * dx / PhysicalConstants.C0;
        double sinh2 = Math.pow(Math.sin(kx * dx / 2), 2) - Math.pow(Math.sin(omegaDt / 2) / COURANT, 2);
        double gridLength = dx / (2 * Math.log(Math.sqrt(sinh2) + Math.sqrt(sinh2 + 1)));
        String ctx = String.format("%s %g°, %d cells/λ in glass, %d rows from %.1f cells beyond the interface: L = %.6g m "
                + "± %.2g, Hecht %.6g m, ratio %.5f; discrete-grid L̃ %.6g m, ratio %.7f; |Hz| fit ratio %.7f; rms residual %.2g",
                pol, degrees, cpw, rows, first - interfaceRow, fit.length(), fit.lengthUncertainty(), hecht,
                fit.length() / hecht, gridLength, fit.length() / gridLength, fitH.length() / fit.length(), fit.rmsResidual());
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.println(ctx);
        }
        assertTrue(Math.abs(fit.length() / hecht - 1) < HECHT_TOL, ctx);
        assertTrue(Math.abs(fit.length() / gridLength - 1) < GRID_TOL, ctx);
        assertTrue(Math.abs(fitH.length() / fit.length() - 1) < GRID_TOL, ctx);
    }

    private static double abs(double[] z) {
        return Math.hypot(z[0], z[1]);
    }
}
