package org.evanesce.io.output;

import java.util.Formatter;
import java.util.Locale;

/**
 * Writes a double as {@code String.format(Locale.ROOT, "%.9e", x)} does, character for character, about ten times
 * faster (issue 18: the probes' CSV of a 4576-step, 7-probe example took about 10 % of the command's samples in
 * java.util.Formatter).
 *
 * <p>How the JDK (17) writes %.Ne: the decimal digits of x that {@code Double.toString} also uses (the shortest
 * that read back as x), rounded half-up to N + 1 significant digits (sun.misc.FormattedFloatingDecimal). Its digit
 * generator differs from Double.toString's in one respect only: it never stops after the first digit, where
 * Double.toString may ("0.5", "3.0"). So a value whose Double.toString has one significant digit, and NaN, the
 * infinities and zeros, go to {@link Formatter}; every other value takes Double.toString's digits.
 * ScientificTest compares the two on millions of values. An instance is for one thread; {@link #format} is the
 * form for any thread.
 */
public final class Scientific {

    /** Significant digits after the point. */
    private final int precision;
    private final char[] digits = new char[32];
    private final StringBuilder fallbackText = new StringBuilder();
    /** Made on the first value that needs it (most tables never do). */
    private Formatter fallback;
    private final String pattern;

    /** @param precision digits after the point, 1 to 16 (as %.{precision}e) */
    public Scientific(int precision) {
        if (precision < 1 || precision > 16) {
            throw new IllegalArgumentException(String.format("precision %d: expected 1 to 16 digits", precision));
        }
        this.precision = precision;
        this.pattern = "%." + precision + "e";
    }

    /**
     * {@code v} as {@code String.format(Locale.ROOT, "%." + decimals + "e", v)} writes it.
     *
     * @param decimals digits after the point, 1 to 16
     */
    public static String format(double v, int decimals) {
        StringBuilder sb = new StringBuilder(decimals + 8);
        new Scientific(decimals).append(sb, v);
        return sb.toString();
    }

    /** Appends x to sb as %.{precision}e in Locale.ROOT. */
    public void append(StringBuilder sb, double x) {
        if (x == 0 || !Double.isFinite(x)) {
            slow(sb, x);
            return;
        }
        String s = Double.toString(Math.abs(x));
        // s is "ddd.ddd" or "d.dddE[-]n": collect the significant digits and the decimal exponent of the first
        int n = 0;
        int exp10 = 0;
        int point = -1;
        int firstNonZero = -1;
        int len = s.length();
        int e = s.indexOf('E');
        int end = e < 0 ? len : e;
        for (int k = 0; k < end; k++) {
            char c = s.charAt(k);
            if (c == '.') {
                point = k;
                continue;
            }
            if (firstNonZero < 0) {
                if (c == '0') {
                    continue;
                }
                firstNonZero = k;
            }
            digits[n++] = c;
        }
        // the first significant digit's power of ten, from its place relative to the point
        int before = point - firstNonZero; // digits from the first significant one to the point
        exp10 = firstNonZero < point ? before - 1 : before;
        if (e >= 0) {
            exp10 += Integer.parseInt(s, e + 1, len, 10);
        }
        while (n > 1 && digits[n - 1] == '0') {
            n--;
        }
        if (n < 2) {
            slow(sb, x);
            return;
        }
        int keep = precision + 1;
        if (n > keep) {
            if (digits[keep] >= '5') {
                int k = keep - 1;
                while (k >= 0 && digits[k] == '9') {
                    digits[k] = '0';
                    k--;
                }
                if (k < 0) {
                    digits[0] = '1';
                    exp10++;
                } else {
                    digits[k]++;
                }
            }
            n = keep;
        }
        if (x < 0) {
            sb.append('-');
        }
        sb.append(digits[0]).append('.');
        for (int k = 1; k < keep; k++) {
            sb.append(k < n ? digits[k] : '0');
        }
        sb.append('e').append(exp10 < 0 ? '-' : '+');
        int a = Math.abs(exp10);
        if (a < 10) {
            sb.append('0');
        }
        sb.append(a);
    }

    private void slow(StringBuilder sb, double x) {
        fallbackText.setLength(0);
        if (fallback == null) {
            fallback = new Formatter(fallbackText, Locale.ROOT);
        }
        fallback.format(pattern, x);
        sb.append(fallbackText);
    }
}
