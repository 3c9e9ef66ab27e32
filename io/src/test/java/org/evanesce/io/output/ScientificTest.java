package org.evanesce.io.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * {@link Scientific} against the JDK's own formatter ({@code String.format(Locale.ROOT, "%.Ne", v)}, java.util.Formatter,
 * the general-purpose reference it replaces): the same text for every value tried.
 */
class ScientificTest {

    private static void same(double v, int decimals) {
        String expected = String.format(Locale.ROOT, "%." + decimals + "e", v);
        assertEquals(expected, Scientific.format(v, decimals), () -> "value " + v + " (bits "
                + Long.toHexString(Double.doubleToRawLongBits(v)) + ") with " + decimals + " decimals");
    }

    @Test
    void randomBitPatternsAndDecimalLookingValuesAreWrittenAsTheFormatterWritesThem() {
        SplittableRandom r = new SplittableRandom(20261204);
        for (int k = 0; k < 40_000; k++) {
            double bits = Double.longBitsToDouble(r.nextLong());
            if (Double.isFinite(bits)) {
                same(bits, 9);
            }
            // values with few digits, where rounding half up at the last digit shows (e.g. 1.0000000005)
            double decimal = r.nextInt(-2_000_000_000, 2_000_000_000) * Math.pow(10, r.nextInt(-25, 15));
            same(decimal, 9);
            same(decimal, 1 + r.nextInt(16));
            // the magnitudes the tables hold: powers, widths in metres, fractions
            double physical = (r.nextDouble() - 0.5) * Math.pow(10, r.nextInt(-40, 40));
            same(physical, 9);
            same(physical, 1 + r.nextInt(16));
        }
    }

    @Test
    void edgesAreWrittenAsTheFormatterWritesThem() {
        double[] values = {0.0, -0.0, 1.0, -1.0, 9.9999999995, 9.99999999949, 0.99999999995, 1e-300, Double.MIN_VALUE,
                -Double.MIN_VALUE, Double.MIN_NORMAL, Double.MAX_VALUE, 1e100, 1.5e-7, 123456789012345.0, 5e-5, 0.00123,
                1234567.0, 12345678.0, 1.0000000005, 2.5, 0.1, 1e7, 1e-3, 9.5e-4};
        for (double v : values) {
            for (int d = 1; d <= 16; d++) {
                same(v, d);
            }
        }
    }

    @Test
    void valuesThatAreNotFiniteAndDecimalsOutOfRangeAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> Scientific.format(Double.NaN, 9));
        assertThrows(IllegalArgumentException.class, () -> Scientific.format(Double.POSITIVE_INFINITY, 9));
        assertThrows(IllegalArgumentException.class, () -> Scientific.format(1, 0));
        assertThrows(IllegalArgumentException.class, () -> Scientific.format(1, 17));
    }
}
