package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class TicksTest {

    /** Tick values are whole multiples of the step computed as k·step: compare to rounding. */
    private static final double EXACT = 1e-12;

    @Test
    void zeroToSixPointFourGivesEvenSteps() {
        assertEquals(2.0, Ticks.step(0, 6.4, 5), EXACT);
        assertArrayEquals(new double[] {0, 2, 4, 6}, Ticks.choose(0, 6.4, 5), EXACT);
        assertArrayEquals(new String[] {"0", "2", "4", "6"}, Ticks.labels(Ticks.choose(0, 6.4, 5), 2));
        assertArrayEquals(new double[] {0, 1, 2, 3, 4, 5, 6}, Ticks.choose(0, 6.4, 7), EXACT);
    }

    @Test
    void stepsRunOneTwoFive() {
        assertEquals(2e-3, Ticks.next(1e-3), 1e-15);
        assertEquals(5e-3, Ticks.next(2e-3), 1e-15);
        assertEquals(1e-2, Ticks.next(5e-3), 1e-15);
        assertEquals(200.0, Ticks.next(100), EXACT);
        assertEquals(0.5, Ticks.step(1, 3.1, 5), EXACT);
    }

    @Test
    void ticksStraddleZeroOnNegativeRanges() {
        double[] v = Ticks.choose(-3.025, 2.975, 6);
        assertArrayEquals(new double[] {-3, -2, -1, 0, 1, 2}, v, EXACT);
        assertEquals("0", Ticks.labels(v, 1)[3], "no negative zero");
        assertEquals(0x0L, Double.doubleToRawLongBits(v[3]), "zero is +0");
        assertArrayEquals(new double[] {-2, 0, 2}, Ticks.choose(-3.025, 2.975, 5), EXACT);
    }

    @Test
    void labelsShareTheirDecimals() {
        assertArrayEquals(new String[] {"1.0", "1.2", "1.4"}, Ticks.labels(new double[] {1, 1.2, 1.4}, 0.2));
        assertArrayEquals(new String[] {"0.00", "0.05", "0.10"},
                Ticks.labels(new double[] {0, 0.05, 0.1}, 0.05));
        assertArrayEquals(new String[] {"-20", "0", "20"}, Ticks.labels(new double[] {-20, 0, 20}, 20));
    }

    @Test
    void tinyAndHugeValuesUseExponents() {
        assertArrayEquals(new String[] {"0", "2e-7", "4e-7"}, Ticks.labels(new double[] {0, 2e-7, 4e-7}, 2e-7));
        assertArrayEquals(new String[] {"2.5e-7", "3.0e-7"}, Ticks.labels(new double[] {2.5e-7, 3e-7}, 5e-8));
        assertArrayEquals(new String[] {"2e6", "4e6"}, Ticks.labels(new double[] {2e6, 4e6}, 2e6));
    }

    @Test
    void singleValuesAreShort() {
        assertEquals("2.25", Ticks.single(2.25));
        assertEquals("1", Ticks.single(1.0));
        assertEquals("12.1104", Ticks.single(3.48 * 3.48));
        assertEquals("0", Ticks.single(0.0));
        assertEquals("-3.5e-9", Ticks.single(-3.5e-9));
        assertEquals("1.5e7", Ticks.single(1.5e7));
    }

    @Test
    void aNarrowRangeStillGetsOneTick() {
        double[] v = Ticks.choose(0.21, 0.29, 1);
        assertEquals(1, v.length);
        assertTrue(v[0] >= 0.21 && v[0] <= 0.29, "tick " + v[0] + " inside [0.21, 0.29]");
        double[] w = Ticks.nearestMiddle(0.2501, 0.2502, 1);
        assertTrue(w.length == 1 && w[0] >= 0.2501 && w[0] <= 0.2502, "tick " + w[0] + " inside the range");
    }

    @Test
    void badRangesAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> Ticks.step(1, 1, 3));
        assertThrows(IllegalArgumentException.class, () -> Ticks.step(0, Double.NaN, 3));
        assertThrows(IllegalArgumentException.class, () -> Ticks.step(0, 1, 0));
    }
}
