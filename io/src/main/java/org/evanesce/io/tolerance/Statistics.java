package org.evanesce.io.tolerance;

import java.util.Arrays;

/** The summaries a tolerance study and a sample sweep report. */
public final class Statistics {

    /** z for a two-sided 95 % interval: Φ⁻¹(0.975) (Abramowitz & Stegun, table 26.5). */
    public static final double Z95 = 1.959963984540054;

    private Statistics() {
    }

    public static double mean(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s / v.length;
    }

    /** The sample standard deviation (n − 1 in the denominator); 0 for one value. */
    public static double standardDeviation(double[] v) {
        if (v.length < 2) {
            return 0;
        }
        double m = mean(v);
        double s = 0;
        for (double x : v) {
            s += (x - m) * (x - m);
        }
        return Math.sqrt(s / (v.length - 1));
    }

    /**
     * The p-quantile by linear interpolation between order statistics, h = (n − 1)p (R. J. Hyndman and
     * Y. Fan, "Sample quantiles in statistical packages", Am. Stat. 50, 361 (1996), definition 7).
     */
    public static double quantile(double[] v, double p) {
        double[] s = v.clone();
        Arrays.sort(s);
        double h = (s.length - 1) * p;
        int lo = (int) Math.floor(h);
        int hi = Math.min(lo + 1, s.length - 1);
        return s[lo] + (h - lo) * (s[hi] - s[lo]);
    }

    /**
     * The Wilson score interval for a binomial proportion, k successes of n, at {@link #Z95} (E. B. Wilson,
     * "Probable inference, the law of succession, and statistical inference", J. Am. Stat. Assoc. 22, 209
     * (1927); R. G. Newcombe, Stat. Med. 17, 857 (1998), method 3): sound at yields near 0 or 1, where the
     * simple normal interval is not.
     *
     * @return {lower, upper}
     */
    public static double[] wilson(long k, long n) {
        double p = (double) k / n;
        double z2 = Z95 * Z95;
        double centre = (p + z2 / (2 * n)) / (1 + z2 / n);
        double half = Z95 / (1 + z2 / n) * Math.sqrt(p * (1 - p) / n + z2 / (4.0 * n * n));
        return new double[] {Math.max(0, centre - half), Math.min(1, centre + half)};
    }
}
