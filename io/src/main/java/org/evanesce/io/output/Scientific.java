package org.evanesce.io.output;

/**
 * Numbers in scientific notation for tables, the same text as {@code String.format(Locale.ROOT, "%.Ne", v)} without
 * the formatter's parsing of its pattern on every call (in a far-field table of 360 angles × 10 wavelengths that
 * parsing, in a JVM that has not compiled it yet, was about 5 % of a 4 s run's CPU time).
 *
 * <p>The rule is the JDK's: the shortest decimal digits that name the double (those of {@link Double#toString}),
 * rounded half up at the requested digit (java.util.Formatter's "%e", JDK 17 documentation: "the value is rounded
 * using the round half up algorithm"); one digit before the point, N after it, and an exponent of at least two
 * digits with its sign. ScientificTest compares the two on several million values.
 */
public final class Scientific {

    private Scientific() {
    }

    /**
     * {@code v} as {@code String.format(Locale.ROOT, "%." + decimals + "e", v)} would write it.
     *
     * @param decimals digits after the point, 1 to 16
     * @throws IllegalArgumentException for a value that is not finite or decimals outside 1 to 16
     */
    public static String format(double v, int decimals) {
        StringBuilder sb = new StringBuilder(decimals + 8);
        append(sb, v, decimals);
        return sb.toString();
    }

    /** Appends {@link #format}'s text to {@code sb}. */
    public static void append(StringBuilder sb, double v, int decimals) {
        if (!Double.isFinite(v) || decimals < 1 || decimals > 16) {
            throw new IllegalArgumentException("scientific notation of " + v + " with " + decimals
                    + " decimals: need a finite value and 1 to 16 decimals");
        }
        // the formatter's sign test: -0.0 is written with its minus
        if (Double.compare(v, 0.0) < 0) {
            sb.append('-');
        }
        int n = decimals + 1;
        char[] digits = new char[n];
        java.util.Arrays.fill(digits, '0');
        int exponent = 0;
        if (v != 0) {
            String s = Double.toString(Math.abs(v));
            // the digits of "d.dddE±x" or "iii.fff", leading zeros dropped, and the power of ten of the first
            int e = s.indexOf('E');
            String mantissa = e < 0 ? s : s.substring(0, e);
            int point = mantissa.indexOf('.');
            int power = (e < 0 ? 0 : Integer.parseInt(s.substring(e + 1))) + point - 1;
            StringBuilder all = new StringBuilder(mantissa.length());
            for (int k = 0; k < mantissa.length(); k++) {
                char c = mantissa.charAt(k);
                if (c == '.') {
                    continue;
                }
                if (all.length() == 0 && c == '0') {
                    power--;
                    continue;
                }
                all.append(c);
            }
            int have = Math.min(n, all.length());
            all.getChars(0, have, digits, 0);
            exponent = power;
            if (all.length() > n && all.charAt(n) >= '5') {
                // round half up on the decimal digits, carrying through nines
                int k = n - 1;
                while (k >= 0 && digits[k] == '9') {
                    digits[k] = '0';
                    k--;
                }
                if (k < 0) {
                    digits[0] = '1';
                    exponent++;
                } else {
                    digits[k]++;
                }
            }
        }
        sb.append(digits[0]).append('.').append(digits, 1, n - 1).append('e').append(exponent < 0 ? '-' : '+');
        int a = Math.abs(exponent);
        if (a < 10) {
            sb.append('0');
        }
        sb.append(a);
    }
}
