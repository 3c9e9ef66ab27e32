package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.solver.record.BeamProfile;
import org.junit.jupiter.api.Test;

/**
 * The curves of a beam plot: scale (relative to the incident beam's peak, not each curve's own), x range
 * (centroid ± 3 half-widths, clipped to the line) and the difference curve, on Gaussian profiles whose
 * flux density is known in closed form: a Gaussian beam's intensity exp(−2(x − c)²/w²), w the 1/e²
 * half-width (A. E. Siegman, "Lasers", University Science Books, 1986, ch. 16, eq. 16.6; from memory).
 */
class BeamSeriesTest {

    /** Sums and quotients of a few hundred doubles: round-off only. */
    static final double ROUND_OFF = 1e-12;
    /**
     * Linear interpolation of f between samples h apart errs by at most h² max|f''| / 8 (R. L. Burden and
     * J. D. Faires, "Numerical Analysis", 9th ed., 2011, Theorem 3.3 with n = 1). For b·exp(−2x²/w²),
     * max|f''| = 4b/w², so with h = w/20 and b ≤ 1 the bound is 1/800 = 1.25e-3; used as is (a bound, not a
     * measurement).
     */
    static final double INTERPOLATION_BOUND = 1.0 / 800;
    /** A cell, um, for the sampled ranges (the kept samples end within a cell of the range's ends). */
    static final double CELL_UM = 0.02;

    private static double[] grid(double fromUm, double toUm, double stepUm) {
        int n = (int) Math.round((toUm - fromUm) / stepUm) + 1;
        double[] x = new double[n];
        for (int k = 0; k < n; k++) {
            x[k] = (fromUm + k * stepUm) * 1e-6;
        }
        return x;
    }

    private static double[] gaussian(double[] x, double amplitude, double centre, double w) {
        double[] y = new double[x.length];
        for (int k = 0; k < x.length; k++) {
            double d = x[k] - centre;
            y[k] = amplitude * Math.exp(-2 * d * d / (w * w));
        }
        return y;
    }

    private static double max(double[] v) {
        double m = Double.NEGATIVE_INFINITY;
        for (double a : v) {
            m = Math.max(m, a);
        }
        return m;
    }

    @Test
    void reflectedBeamIsScaledByTheIncidentPeakAndShownAroundItsCentroid() {
        double w = 2e-6;
        double c = 5e-6;
        double incidentPeak = 3.7; // any units: the incident line's peak flux density
        double reflectance = 0.6;
        double[] x = grid(-25, 25, CELL_UM);
        // a reflected beam crosses its line towards -y: a negative flux density
        double[] s = gaussian(x, -reflectance * incidentPeak, c, w);
        BeamProfile p = BeamProfile.fromFluxDensity(x[0], CELL_UM * 1e-6, s);
        BeamSeries b = BeamSeries.of(p.x(), p.weight(), incidentPeak, p.centroid(), p.width(), null, null);
        // its own peak would be 1; relative to the incident beam's it is R, and positive
        assertEquals(reflectance, max(b.simulated()), ROUND_OFF, "the peak relative to the incident beam's");
        for (double v : b.simulated()) {
            assertTrue(v >= 0, "the beam's flux is drawn positive: " + v);
        }
        // the second-moment width of a Gaussian is w (BeamProfile), so the range is c ± 3w
        assertEquals((c - 3 * w) * 1e6, b.low(), CELL_UM, "range start");
        assertEquals((c + 3 * w) * 1e6, b.high(), CELL_UM, "range end");
        assertTrue(b.x()[0] >= b.low() && b.x()[b.x().length - 1] <= b.high(), "samples outside the range");
        assertEquals(6 * w * 1e6 / CELL_UM, b.x().length, 2, "the samples within c ± 3w");
        assertEquals(0, b.referenceX().length, "no reference");
        assertEquals(0, b.differenceX().length, "no difference without a reference");
    }

    @Test
    void rangeIsClippedToTheLineAndFallsBackToItWithoutAWidth() {
        double w = 2e-6;
        double[] x = grid(-10, 10, CELL_UM);
        double[] s = gaussian(x, 1, 8e-6, w); // centroid near the right end: c + 3w = 14 um lies beyond the line
        BeamSeries b = BeamSeries.of(x, s, 1, 8e-6, w, null, null);
        assertEquals(2, b.low(), CELL_UM, "range start c - 3w");
        assertEquals(10, b.high(), ROUND_OFF, "range end clipped to the line");
        BeamSeries all = BeamSeries.of(x, s, 1, Double.NaN, Double.NaN, null, null);
        assertEquals(-10, all.low(), ROUND_OFF, "no centroid: the whole line");
        assertEquals(10, all.high(), ROUND_OFF, "no centroid: the whole line");
        assertEquals(x.length, all.x().length, "no centroid: every sample");
    }

    @Test
    void differenceIsSimulatedMinusTheInterpolatedReference() {
        double w = 2e-6;
        double incidentPeak = 2;
        double[] x = grid(-20, 20, CELL_UM);
        double[] s = gaussian(x, 0.40 * incidentPeak, 0.3e-6, w);
        // the reference on its own, coarser grid (w/20 apart), relative to its incident peak: 0.38 at 0
        double[] rx = grid(-30, 30, w * 1e6 / 20);
        double[] r = gaussian(rx, 0.38, 0, w);
        BeamSeries b = BeamSeries.of(x, s, incidentPeak, 0.3e-6, w, rx, r);
        assertTrue(b.differenceX().length > 0.9 * b.x().length, "the reference covers the plotted range");
        for (int k = 0; k < b.differenceX().length; k++) {
            double xm = b.differenceX()[k] * 1e-6;
            double exact = 0.40 * Math.exp(-2 * Math.pow(xm - 0.3e-6, 2) / (w * w)) - 0.38 * Math.exp(-2 * xm * xm / (w * w));
            assertEquals(exact, b.difference()[k], INTERPOLATION_BOUND, "difference at x = " + b.differenceX()[k] + " um");
        }
        for (double v : b.referenceX()) {
            assertTrue(v >= b.low() && v <= b.high(), "a reference sample outside the range: " + v);
        }
        assertEquals(0.38, max(b.reference()), ROUND_OFF, "the reference keeps its own scale (its incident peak = 1)");
    }

    @Test
    void badInputIsRefused() {
        double[] x = grid(-1, 1, 0.5);
        assertThrows(IllegalArgumentException.class, () -> BeamSeries.of(x, new double[x.length], 0, 0, 1e-6, null, null));
        assertThrows(IllegalArgumentException.class, () -> BeamSeries.of(x, new double[2], 1, 0, 1e-6, null, null));
    }
}
