package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The interpolated extremum and the width at half depth against closed forms: a parabola (which the
 * three-point vertex formula of Press et al., Numerical Recipes, 3rd ed., 2007, eq. 10.3.1, reproduces
 * exactly) and a Lorentzian dip 1 - D g^2/((x - x0)^2 + g^2), whose full width at half depth is 2g
 * (common practice: the Lorentzian's half width at half maximum is g).
 */
class ExtremumTest {

    /** Rounding only: the formula is exact for a parabola (measured 0 in x and in y for the samples below). */
    private static final double PARABOLA_TOLERANCE = 1e-12;

    @Test
    void aParabolasVertexIsRecoveredExactlyAlsoWithUnevenSpacing() {
        double x0 = 0.3137;
        double y0 = 0.42;
        double[] x = {-0.4, -0.15, 0.05, 0.21, 0.38, 0.6, 0.93, 1.2};
        double[] up = new double[x.length];
        double[] down = new double[x.length];
        for (int k = 0; k < x.length; k++) {
            up[k] = 2.5 * (x[k] - x0) * (x[k] - x0) + y0;
            down[k] = -up[k];
        }
        Extremum.Found min = Extremum.minimum(x, up);
        assertEquals(x0, min.x(), PARABOLA_TOLERANCE);
        assertEquals(y0, min.value(), PARABOLA_TOLERANCE);
        assertTrue(min.bracketed());
        Extremum.Found max = Extremum.maximum(x, down);
        assertEquals(x0, max.x(), PARABOLA_TOLERANCE);
        assertEquals(-y0, max.value(), PARABOLA_TOLERANCE);
        assertTrue(max.bracketed());
    }

    /**
     * The parabola through the three lowest samples of a Lorentzian dip misses its centre by at most
     * 0.0374 h^2/g at h = g/5 and by 0.0096 h^2/g at h = g/20 (measured over 41 offsets of the centre
     * between two samples: 1.49e-3 g and 2.4e-5 g, so the error falls faster than h^2); the tolerance is
     * 10x the coarser figure, and at h = g/20 it is 16x tighter.
     */
    private static final double POSITION_PER_H2 = 0.4;

    @Test
    void aLorentzianDipsPositionFallsAsTheSquareOfTheSpacing() {
        for (double h : new double[] {0.2, 0.05}) {
            double worst = 0;
            for (int j = 0; j <= 40; j++) {
                double x0 = 0.013 + h * j / 40.0;
                Extremum.Found f = Extremum.minimum(grid(h), lorentzian(grid(h), x0));
                assertTrue(f.bracketed());
                worst = Math.max(worst, Math.abs(f.x() - x0));
            }
            assertTrue(worst < POSITION_PER_H2 * h * h / G, "h = " + h + ": worst position error " + worst);
        }
    }

    /**
     * The full width at half depth against 2g. Sampling error (stated, not fitted): the crossings are found by
     * linear interpolation, which misses a crossing by at most h^2/8 |f''/f'| = h^2/(8g) at the Lorentzian's
     * half depth (common practice: the linear interpolation error bound h^2/8 max|f''|), twice for the two
     * sides; and the baseline, the end value 1 - D g^2/(50^2 + g^2) rather than 1, narrows the width by
     * 2g * g^2/(50^2 + g^2). Measured 1.074e-2 against this bound of 1.080e-2 at h = g/5, and 7.7e-4
     * against 1.42e-3 at h = g/20 (worst over 41 offsets of the centre).
     */
    @Test
    void aLorentzianDipsWidthIsTwiceItsHalfWidthWithinTheSamplingError() {
        for (double h : new double[] {0.2, 0.05}) {
            double bound = 2 * h * h / (8 * G) + 2 * G * G * G / (50 * 50 + G * G);
            for (int j = 0; j <= 40; j++) {
                double x0 = 0.013 + h * j / 40.0;
                Extremum.Found f = Extremum.minimum(grid(h), lorentzian(grid(h), x0));
                assertTrue(f.complete());
                assertEquals(2 * G, f.width(), bound, "h = " + h + ", centre " + x0);
            }
        }
    }

    @Test
    void aMinimumAtAnEndOfTheRangeIsFlaggedAndHasNoWidth() {
        double[] x = {1, 2, 3, 4, 5};
        double[] y = {0.9, 0.7, 0.6, 0.55, 0.52};
        Extremum.Found f = Extremum.minimum(x, y);
        assertFalse(f.bracketed());
        assertEquals(5, f.x());
        assertEquals(0.52, f.value());
        assertTrue(Double.isNaN(f.width()));
        Extremum.Found top = Extremum.maximum(x, y);
        assertFalse(top.bracketed());
        assertEquals(1, top.x());
    }

    @Test
    void aDipWhoseSideDoesNotReachHalfDepthIsALowerBound() {
        // baseline 1.0 (left end), minimum 0.2: half depth 0.6; the right side only climbs to 0.5
        double[] x = {0, 1, 2, 3, 4, 5};
        double[] y = {1.0, 0.8, 0.4, 0.2, 0.3, 0.5};
        Extremum.Found f = Extremum.minimum(x, y);
        assertTrue(f.bracketed());
        assertFalse(f.complete());
        double half = 0.5 * (1.0 + f.value());
        double left = 1 + (half - 0.8) / (0.4 - 0.8);
        assertEquals(5 - left, f.width(), 1e-12);
    }

    private static final double G = 1.0;

    private static double[] grid(double h) {
        int n = (int) Math.round(100 / h) + 1;
        double[] x = new double[n];
        for (int k = 0; k < n; k++) {
            x[k] = -50 + h * k;
        }
        return x;
    }

    private static double[] lorentzian(double[] x, double x0) {
        double[] y = new double[x.length];
        for (int k = 0; k < x.length; k++) {
            y[k] = 1 - 0.9 * G * G / ((x[k] - x0) * (x[k] - x0) + G * G);
        }
        return y;
    }
}
