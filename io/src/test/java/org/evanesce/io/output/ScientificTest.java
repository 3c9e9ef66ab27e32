package org.evanesce.io.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * {@link Scientific} against the JDK's own java.util.Formatter (the reference: a general-purpose library), value by
 * value: random bit patterns (every exponent), field-like values (Gaussian times powers of ten), values that round
 * up through a run of nines, values at the 5 of the rounding digit, one-digit values, integers, zeros, NaN and the
 * infinities, subnormals and the extremes.
 */
class ScientificTest {

    /** Values per kind and precision of the random draws (300 000 also passed: 5.4 million values, 134 s under load). */
    private static final int DRAWS = 30_000;

    @Test
    void writesWhatTheFormatterWrites() {
        Random r = new Random(20261204L);
        for (int precision : new int[] {9, 3, 15}) {
            Scientific s = new Scientific(precision);
            String pattern = "%." + precision + "e";
            StringBuilder sb = new StringBuilder();
            for (int k = 0; k < DRAWS; k++) {
                check(s, pattern, sb, Double.longBitsToDouble(r.nextLong()));
                check(s, pattern, sb, r.nextGaussian() * Math.pow(10, r.nextInt(60) - 30));
                check(s, pattern, sb, r.nextInt(2_000_001) - 1_000_000);
                check(s, pattern, sb, (r.nextInt(19) - 9) * Math.pow(10, r.nextInt(40) - 20));
                // d.ddddddddd5 and runs of nines: the rounding digit at 5, carries into a new first digit
                long m = (long) (r.nextDouble() * 1e10);
                check(s, pattern, sb, Double.parseDouble(m + "5e" + (r.nextInt(40) - 20)));
                check(s, pattern, sb, Double.parseDouble("9.99999999" + r.nextInt(10) + r.nextInt(10) + "e" + (r.nextInt(40) - 20)));
            }
            for (double x : new double[] {0.0, -0.0, Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY,
                    Double.MIN_VALUE, -Double.MIN_VALUE, Double.MIN_NORMAL, Double.MAX_VALUE, -Double.MAX_VALUE, 1, -1, 0.5,
                    3.0, 1e-5, 1e7, 1e8, 1e-3, 1e-4, 9.9999999995, 9.9999999994999, 0.1, 0.2, 0.3, 123456789012345678.0}) {
                check(s, pattern, sb, x);
            }
        }
    }

    @Test
    void refusesAPrecisionOutsideOneToSixteen() {
        assertThrows(IllegalArgumentException.class, () -> new Scientific(0));
        assertThrows(IllegalArgumentException.class, () -> new Scientific(17));
    }

    /** The static form, on the values of the tables (the far-field ones), at every precision. */
    @Test
    void theStaticFormWritesWhatTheFormatterWrites() {
        java.util.SplittableRandom r = new java.util.SplittableRandom(20261204);
        for (int k = 0; k < 20_000; k++) {
            double bits = Double.longBitsToDouble(r.nextLong());
            same(bits, 9);
            // values with few digits, where rounding half up at the last digit shows (e.g. 1.0000000005)
            double decimal = r.nextInt(-2_000_000_000, 2_000_000_000) * Math.pow(10, r.nextInt(-25, 15));
            same(decimal, 9);
            same(decimal, 1 + r.nextInt(16));
            // the magnitudes the tables hold: powers, widths in metres, fractions
            double physical = (r.nextDouble() - 0.5) * Math.pow(10, r.nextInt(-40, 40));
            same(physical, 1 + r.nextInt(16));
        }
        double[] values = {0.0, -0.0, 1.0, -1.0, 9.9999999995, 9.99999999949, 0.99999999995, 1e-300, Double.MIN_VALUE,
            -Double.MIN_VALUE, Double.MIN_NORMAL, Double.MAX_VALUE, 1e100, 1.5e-7, 123456789012345.0, 5e-5, 0.00123,
            1234567.0, 12345678.0, 1.0000000005, 2.5, 0.1, 1e7, 1e-3, 9.5e-4, Double.NaN, Double.NEGATIVE_INFINITY};
        for (double v : values) {
            for (int d = 1; d <= 16; d++) {
                same(v, d);
            }
        }
        assertThrows(IllegalArgumentException.class, () -> Scientific.format(1, 0));
        assertThrows(IllegalArgumentException.class, () -> Scientific.format(1, 17));
    }

    private static void same(double v, int decimals) {
        String expected = String.format(Locale.ROOT, "%." + decimals + "e", v);
        assertEquals(expected, Scientific.format(v, decimals), () -> "value " + v + " (bits "
                + Long.toHexString(Double.doubleToRawLongBits(v)) + ") with " + decimals + " decimals");
    }

    private static void check(Scientific s, String pattern, StringBuilder sb, double x) {
        sb.setLength(0);
        s.append(sb, x);
        assertEquals(String.format(Locale.ROOT, pattern, x), sb.toString(), () -> "x = " + x + " (" + Double.toString(x)
                + ", bits " + Long.toHexString(Double.doubleToRawLongBits(x)) + ")");
    }
}
