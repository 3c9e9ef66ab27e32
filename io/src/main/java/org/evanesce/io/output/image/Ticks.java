package org.evanesce.io.output.image;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Locale;

/**
 * Axis ticks at "nice" steps: 1, 2 or 5 times a power of ten, placed at whole multiples of the
 * step (so 0 is a tick whenever the range contains it), with labels that all carry the same number
 * of decimals.
 */
public final class Ticks {

    /** Labels switch to the form 1.5e-7 when the largest tick reaches this magnitude... */
    static final double LARGE = 1e6;
    /** ...or when the step falls below this one. */
    static final double SMALL_STEP = 1e-3;
    /** Multiples this close to the range ends (in steps) still count as inside: rounding slack. */
    private static final double SLACK = 1e-9;

    private Ticks() {
    }

    /**
     * The smallest nice step that puts at most {@code maxCount} multiples of itself inside
     * [lo, hi]; for lo = 0, hi = 6.4 and maxCount = 5 it is 2 (ticks 0, 2, 4, 6).
     *
     * @param lo       lower end; finite
     * @param hi       upper end; finite and &gt; lo
     * @param maxCount most ticks wanted, ≥ 1
     */
    public static double step(double lo, double hi, int maxCount) {
        checkRange(lo, hi);
        if (maxCount < 1) {
            throw new IllegalArgumentException("tick count " + maxCount + ": need at least 1");
        }
        double s = Math.pow(10, Math.floor(Math.log10(hi - lo)) - 2);
        while (count(lo, hi, s) > maxCount) {
            s = next(s);
        }
        return s;
    }

    /** The next larger nice step: 1 → 2 → 5 → 10 times the same power of ten. */
    public static double next(double step) {
        double p = Math.pow(10, Math.floor(Math.log10(step) + SLACK));
        double m = Math.round(step / p);
        return m < 2 ? 2 * p : m < 5 ? 5 * p : 10 * p;
    }

    /** The multiples of {@code step} inside [lo, hi], ascending; may be empty. */
    public static double[] values(double lo, double hi, double step) {
        checkRange(lo, hi);
        long k0 = (long) Math.ceil(lo / step - SLACK);
        long k1 = (long) Math.floor(hi / step + SLACK);
        int n = (int) Math.max(0, k1 - k0 + 1);
        double[] v = new double[n];
        for (int q = 0; q < n; q++) {
            v[q] = (k0 + q) * step + 0.0; // + 0.0 turns −0 into 0
        }
        return v;
    }

    /**
     * Ticks for [lo, hi] with at most {@code maxCount} of them: {@link #values} at {@link #step};
     * never empty (if no multiple of the chosen step lies inside, the one of the next smaller
     * step nearest the middle).
     */
    public static double[] choose(double lo, double hi, int maxCount) {
        double s = step(lo, hi, maxCount);
        double[] v = values(lo, hi, s);
        return v.length > 0 ? v : nearestMiddle(lo, hi, s);
    }

    /** One tick: the multiple of the step below {@code step} nearest the middle of [lo, hi]. */
    static double[] nearestMiddle(double lo, double hi, double step) {
        double s = step;
        double mid = 0.5 * (lo + hi);
        for (int guard = 0; guard < 64; guard++) {
            s = previous(s);
            double v = Math.round(mid / s) * s + 0.0;
            if (v >= lo && v <= hi) {
                return new double[] {v};
            }
        }
        return new double[] {mid};
    }

    private static double previous(double step) {
        double p = Math.pow(10, Math.floor(Math.log10(step) + SLACK));
        double m = Math.round(step / p);
        return m > 5 ? 5 * p : m > 2 ? 2 * p : m > 1 ? p : 0.5 * p;
    }

    /**
     * Labels for ticks spaced {@code step} apart: fixed decimals enough for the step (0 for a step
     * of 1 or more, 1 for 0.5 or 0.2, 2 for 0.05, ...), or a mantissa and exponent such as
     * {@code 2.5e-7} when the values are very large or the step very small.
     */
    public static String[] labels(double[] ticks, double step) {
        double maxAbs = 0;
        for (double v : ticks) {
            maxAbs = Math.max(maxAbs, Math.abs(v));
        }
        String[] out = new String[ticks.length];
        if (maxAbs >= LARGE || step < SMALL_STEP) {
            int e = (int) Math.floor(Math.log10(Math.max(maxAbs, step)) + SLACK);
            int decimals = Math.max(0, e - (int) Math.floor(Math.log10(step) + SLACK));
            for (int q = 0; q < ticks.length; q++) {
                out[q] = ticks[q] == 0 ? "0"
                        : String.format(Locale.ROOT, "%." + decimals + "fe%d", ticks[q] / Math.pow(10, e), e);
            }
            return out;
        }
        int decimals = Math.max(0, -(int) Math.floor(Math.log10(step) + SLACK));
        for (int q = 0; q < ticks.length; q++) {
            out[q] = String.format(Locale.ROOT, "%." + decimals + "f", ticks[q]);
        }
        return out;
    }

    /**
     * A single value written with up to six significant digits and no trailing zeros: 2.25, 1,
     * 0.0123, or 3.5e-9 outside [1e-3, 1e6).
     */
    public static String single(double v) {
        if (!Double.isFinite(v)) {
            return Double.toString(v);
        }
        if (v == 0) {
            return "0";
        }
        BigDecimal d = new BigDecimal(v).round(new MathContext(6)).stripTrailingZeros();
        double a = Math.abs(v);
        if (a >= SMALL_STEP && a < LARGE) {
            return d.toPlainString();
        }
        int e = d.precision() - d.scale() - 1;
        return d.movePointLeft(e).toPlainString() + "e" + e;
    }

    private static long count(double lo, double hi, double step) {
        long k0 = (long) Math.ceil(lo / step - SLACK);
        long k1 = (long) Math.floor(hi / step + SLACK);
        return Math.max(0, k1 - k0 + 1);
    }

    private static void checkRange(double lo, double hi) {
        if (!Double.isFinite(lo) || !Double.isFinite(hi) || !(hi > lo)) {
            throw new IllegalArgumentException(String.format(
                    "tick range [%g, %g]: need finite ends with the upper above the lower", lo, hi));
        }
    }
}
