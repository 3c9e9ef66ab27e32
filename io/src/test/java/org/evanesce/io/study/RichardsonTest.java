package org.evanesce.io.study;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.io.study.Richardson.Estimate;
import org.evanesce.io.study.Richardson.OrderSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Richardson extrapolation (L. F. Richardson, Phil. Trans. R. Soc. A 210, 307 (1911)) and Roache's
 * grid convergence index (P. J. Roache, J. Fluids Eng. 116, 405 (1994)) on sequences generated from
 * the error model f(h) = f0 + c·h<sup>p</sup> + c2·h<sup>p+1</sup>, whose limit, order and errors are
 * known in closed form.
 */
class RichardsonTest {

    /** Values are O(1) and the divisor r^p − 1 is at least 0.5 here, so a few ulps stay well under this. */
    private static final double EXACT_TOL = 1e-12;
    /** ln of a ratio of differences of size ~1e-3, each carrying ~1e-16 rounding: ~1e-13, far under this. */
    private static final double ORDER_TOL = 1e-9;

    private static final double F0 = 0.37;
    private static final double C = 0.8;
    private static final double H1 = 0.1;

    private static double model(double h, double p, double c2) {
        return F0 + C * Math.pow(h, p) + c2 * Math.pow(h, p + 1);
    }

    @ParameterizedTest(name = "p {0}, ratio {1}")
    @CsvSource({"2, 2", "2, 1.5", "1, 2", "4, 3"})
    void twoLevelsRecoverThePureModelLimit(double p, double r) {
        double coarse = model(H1, p, 0);
        double fine = model(H1 / r, p, 0);
        Estimate e = Richardson.twoLevels(coarse, fine, r, p);
        String ctx = "p " + p + ", ratio " + r + ": " + e;
        assertEquals(F0, e.extrapolated(), EXACT_TOL, ctx);
        assertEquals(OrderSource.FORMAL, e.orderSource(), ctx);
        assertEquals(p, e.order(), 0, ctx);
        // pure model: |f2 − f1|/(r^p − 1) = |c|·h2^p = |fine − f0| exactly, so the GCI is 3 × the true error
        assertEquals(3 * Math.abs(fine - F0), e.errorEstimate(), EXACT_TOL, ctx);
        assertTrue(e.note().contains("assumed order"), ctx);
    }

    /**
     * With f = f0 + c h^p + c2 h^(p+1), Richardson's formula leaves the error
     * c2·h2^(p+1)·r^p·(1 − r)/(r^p − 1), one order higher than the fine value's.
     */
    @ParameterizedTest(name = "p {0}, ratio {1}, c2 {2}")
    @CsvSource({"2, 2, 0.5", "2, 2, -1.5", "2, 1.5, 0.7", "1, 2, 0.3"})
    void twoLevelsWithAHigherOrderTermImproveOnTheFineValueAndTheGciBoundsIt(double p, double r, double c2) {
        double h2 = H1 / r;
        double coarse = model(H1, p, c2);
        double fine = model(h2, p, c2);
        Estimate e = Richardson.twoLevels(coarse, fine, r, p);
        String ctx = "p " + p + ", ratio " + r + ", c2 " + c2 + ": " + e;
        double rp = Math.pow(r, p);
        double expectedError = c2 * Math.pow(h2, p + 1) * rp * (1 - r) / (rp - 1);
        assertEquals(expectedError, e.extrapolated() - F0, EXACT_TOL, ctx);
        double fineError = Math.abs(fine - F0);
        assertTrue(Math.abs(e.extrapolated() - F0) < fineError, ctx + ", fine error " + fineError);
        assertTrue(e.errorEstimate() >= fineError, ctx + ", fine error " + fineError);
        // documented: the extrapolated value lies errorEstimate/Fs from the fine value
        assertEquals(e.errorEstimate() / Richardson.ASSUMED_ORDER_SAFETY_FACTOR, Math.abs(e.extrapolated() - fine),
                EXACT_TOL, ctx);
    }

    @ParameterizedTest(name = "p {0}, ratio {1}")
    @CsvSource({"2, 2", "1, 2", "2, 1.5", "1.5, 3", "3.9, 2"})
    void threeLevelsRecoverTheObservedOrderOfAPureModel(double p, double r) {
        double formal = 2;
        double f1 = model(H1, p, 0);
        double f2 = model(H1 / r, p, 0);
        double f3 = model(H1 / (r * r), p, 0);
        Estimate e = Richardson.threeLevels(f1, f2, f3, r, formal);
        String ctx = "p " + p + ", ratio " + r + ", formal 2: " + e;
        assertEquals(OrderSource.OBSERVED, e.orderSource(), ctx);
        assertEquals(p, e.order(), ORDER_TOL, ctx);
        assertEquals(F0, e.extrapolated(), EXACT_TOL, ctx);
        // pure model: the Fs = 1.25 GCI is 1.25 × the fine value's true error
        assertEquals(Richardson.OBSERVED_ORDER_SAFETY_FACTOR * Math.abs(f3 - F0), e.errorEstimate(), EXACT_TOL, ctx);
        assertTrue(e.note().startsWith("observed order"), ctx);
    }

    /** A transmittance of order 1e-8 still gives its order: the round-off test is relative, not absolute. */
    @Test
    void smallValuesAreNotMistakenForRoundOff() {
        double f0 = 3e-9;
        double c = 4e-7;
        double r = 2;
        double[] f = new double[3];
        for (int k = 0; k < 3; k++) {
            f[k] = f0 + c * Math.pow(H1 / Math.pow(r, k), 2);
        }
        Estimate e = Richardson.threeLevels(f[0], f[1], f[2], r, 2);
        String ctx = "f0 3e-9, c 4e-7, p 2: " + e;
        assertEquals(OrderSource.OBSERVED, e.orderSource(), ctx);
        assertEquals(2, e.order(), 1e-6, ctx);
        assertEquals(f0, e.extrapolated(), 1e-20, ctx);
    }

    @Test
    void anOscillatingSequenceFallsBackToTheFormalOrderOnTheTwoFinerLevels() {
        Estimate e = Richardson.threeLevels(1.0, 0.9, 0.95, 2, 2);
        String ctx = "1.0, 0.9, 0.95: " + e;
        assertEquals(OrderSource.FORMAL, e.orderSource(), ctx);
        assertEquals(2, e.order(), 0, ctx);
        assertTrue(e.note().contains("not converging monotonically"), ctx);
        assertTrue(e.note().contains("assumed order 2 from the two finer levels"), ctx);
        assertEquals(0.95 + 0.05 / 3, e.extrapolated(), EXACT_TOL, ctx);
        assertEquals(3 * 0.05 / 3, e.errorEstimate(), EXACT_TOL, ctx);
    }

    @Test
    void differencesAtRoundOffFallBackToTheFormalOrder() {
        Estimate e = Richardson.threeLevels(0.5, 0.501, 0.501 + 1e-15, 2, 2);
        String ctx = "0.5, 0.501, 0.501 + 1e-15: " + e;
        assertEquals(OrderSource.FORMAL, e.orderSource(), ctx);
        assertTrue(e.note().contains("round-off"), ctx);
        assertTrue(e.errorEstimate() < 1e-14, ctx);
    }

    @Test
    void anObservedOrderAboveTwiceTheFormalOrderIsReplacedByTheFormalOrder() {
        double r = 2;
        double f1 = model(H1, 5, 0);
        double f2 = model(H1 / r, 5, 0);
        double f3 = model(H1 / (r * r), 5, 0);
        Estimate e = Richardson.threeLevels(f1, f2, f3, r, 2);
        String ctx = "pure p 5, formal 2: " + e;
        assertEquals(OrderSource.FORMAL, e.orderSource(), ctx);
        assertEquals(2, e.order(), 0, ctx);
        assertTrue(e.note().contains("observed order 5.00 above 2 × formal order 2"), ctx);
        // the formal (lower) order gives the wider band, which still bounds the fine error
        assertTrue(e.errorEstimate() >= Math.abs(f3 - F0), ctx);
    }

    /**
     * A pure model of order 0.25 is clamped to 0.5 with Fs = 3; the band 3·(2^0.25 − 1)/(2^0.5 − 1) ≈ 1.37
     * times the true fine error still covers it.
     */
    @Test
    void anObservedOrderBelowOneHalfIsClampedAndFlagged() {
        double r = 2;
        double f1 = model(H1, 0.25, 0);
        double f2 = model(H1 / r, 0.25, 0);
        double f3 = model(H1 / (r * r), 0.25, 0);
        Estimate e = Richardson.threeLevels(f1, f2, f3, r, 2);
        String ctx = "pure p 0.25, formal 2: " + e;
        assertEquals(OrderSource.CLAMPED, e.orderSource(), ctx);
        assertEquals(Richardson.MIN_OBSERVED_ORDER, e.order(), 0, ctx);
        assertTrue(e.note().contains("observed order 0.250 below 0.5"), ctx);
        double expectedRatio = 3 * (Math.pow(2, 0.25) - 1) / (Math.sqrt(2) - 1);
        assertEquals(expectedRatio, e.errorEstimate() / Math.abs(f3 - F0), 1e-9, ctx);
    }

    @Test
    void aDivergingSequenceIsFlagged() {
        Estimate e = Richardson.threeLevels(1.0, 1.1, 1.3, 2, 2);
        String ctx = "1.0, 1.1, 1.3: " + e;
        assertEquals(OrderSource.CLAMPED, e.orderSource(), ctx);
        assertTrue(e.note().contains("observed order -1.00 below 0.5"), ctx);
    }

    @Test
    void identicalValuesGiveTheFineValueAndZeroError() {
        Estimate two = Richardson.twoLevels(0.25, 0.25, 2, 2);
        assertEquals(0.25, two.extrapolated(), 0, two.toString());
        assertEquals(0, two.errorEstimate(), 0, two.toString());
        assertTrue(two.note().contains("identical"), two.toString());
        Estimate three = Richardson.threeLevels(0.25, 0.25, 0.25, 2, 2);
        assertEquals(0.25, three.extrapolated(), 0, three.toString());
        assertEquals(0, three.errorEstimate(), 0, three.toString());
        assertTrue(three.note().contains("identical"), three.toString());
    }

    @Test
    void nonFiniteInputGivesNaNWithANote() {
        Estimate two = Richardson.twoLevels(Double.NaN, 0.5, 2, 2);
        assertTrue(Double.isNaN(two.extrapolated()) && Double.isNaN(two.errorEstimate()), two.toString());
        assertEquals(OrderSource.UNDEFINED, two.orderSource(), two.toString());
        assertTrue(two.note().contains("coarse NaN"), two.toString());
        Estimate three = Richardson.threeLevels(0.1, Double.POSITIVE_INFINITY, 0.2, 2, 2);
        assertTrue(Double.isNaN(three.extrapolated()) && Double.isNaN(three.errorEstimate()), three.toString());
        assertTrue(three.note().contains("medium Infinity"), three.toString());
    }

    @Test
    void anInvalidRatioOrOrderIsRefusedWithItsValue() {
        IllegalArgumentException ratio = assertThrows(IllegalArgumentException.class,
                () -> Richardson.twoLevels(1, 2, 1, 2));
        assertTrue(ratio.getMessage().contains("refinement ratio 1.00000"), ratio.getMessage());
        IllegalArgumentException order = assertThrows(IllegalArgumentException.class,
                () -> Richardson.threeLevels(1, 2, 3, 2, Double.NaN));
        assertTrue(order.getMessage().contains("formal order NaN"), order.getMessage());
    }
}
