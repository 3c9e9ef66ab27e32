package org.evanesce.io.study;

import java.util.Locale;

/**
 * Grid-refinement study of one result value (a transmittance at one frequency, say) computed at two
 * or three cell sizes h1 &gt; h2 &gt; h3 with a constant refinement ratio r = h1/h2 = h2/h3 &gt; 1.
 *
 * <p>With a discretization error that falls as C·h<sup>p</sup>, Richardson extrapolation
 * (L. F. Richardson, Phil. Trans. R. Soc. A 210, 307 (1911)) removes the leading term:
 * <pre>  f_extrapolated = f_fine + (f_fine − f_coarser) / (r<sup>p</sup> − 1)</pre>
 * where f_coarser is the next coarser level. The error band is Roache's grid convergence index of
 * the fine solution (P. J. Roache, "Perspective: a method for uniform reporting of grid refinement
 * studies", J. Fluids Eng. 116, 405 (1994)) in its absolute form,
 * <pre>  GCI_fine = Fs · |f_fine − f_coarser| / (r<sup>p</sup> − 1)</pre>
 * with safety factor Fs = 3 when the order is assumed and Fs = 1.25 when it is observed from three
 * levels. The absolute form (rather than Roache's relative ε = (f_fine − f_coarser)/f_fine) is used
 * because tunnelling transmittances can be close to 0, where the relative form blows up.
 *
 * <p>Results carry a note for the report. Nothing here throws on data: a NaN or infinite value gives
 * a NaN estimate with a note; only an invalid ratio or formal order (a programming or case-file
 * error) throws.
 */
public final class Richardson {

    /** Roache's safety factor when the order is assumed (two levels, or a three-level fallback). */
    public static final double ASSUMED_ORDER_SAFETY_FACTOR = 3.0;
    /** Roache's safety factor when the order is observed from three levels. */
    public static final double OBSERVED_ORDER_SAFETY_FACTOR = 1.25;
    /** Observed orders below this are taken as outside the asymptotic range and raised to it. */
    public static final double MIN_OBSERVED_ORDER = 0.5;
    /** Observed orders above this multiple of the formal order are distrusted; the formal order is used. */
    public static final double MAX_ORDER_OVER_FORMAL = 2.0;
    /**
     * Differences between levels at or below this fraction of the largest |value| are treated as
     * round-off: about 10<sup>4</sup> ulps, what sums over thousands of time steps in double can leave,
     * and far below any discretization error worth extrapolating.
     */
    public static final double ROUND_OFF_RELATIVE = 1e-12;

    /** Where the order used for extrapolation came from. */
    public enum OrderSource {
        /** The scheme's formal order, assumed (two levels, or a three-level fallback); Fs = 3. */
        FORMAL,
        /** Observed from three levels and within [{@link #MIN_OBSERVED_ORDER}, 2 × formal]; Fs = 1.25. */
        OBSERVED,
        /** Observed below {@link #MIN_OBSERVED_ORDER} and raised to it; Fs = 3. */
        CLAMPED,
        /** Input was NaN or infinite; nothing is estimated. */
        UNDEFINED
    }

    /**
     * The outcome for one quantity.
     *
     * @param extrapolated  Richardson value f_fine + (f_fine − f_coarser)/(r<sup>p</sup> − 1) with p = {@code order};
     *                      equals the fine value when the levels agree; NaN for NaN input
     * @param errorEstimate Roache's absolute GCI of the fine solution, Fs·|f_fine − f_coarser|/(r<sup>p</sup> − 1),
     *                      in the unit of the values. It is a band on |f_fine − exact| with safety factor Fs;
     *                      quoted with the extrapolated value it is conservative, since the extrapolated
     *                      value lies inside that band (at distance errorEstimate/Fs from the fine value) and
     *                      its own error is normally of higher order. 0 when the levels agree; NaN for NaN input
     * @param order         the order p used (assumed, observed, or clamped; see {@code orderSource})
     * @param orderSource   where {@code order} came from, which also fixes Fs
     * @param note          one line for the report, e.g. "assumed order 2", "observed order 1.93",
     *                      "not converging monotonically ...: assumed order 2 from the two finer levels"
     */
    public record Estimate(double extrapolated, double errorEstimate, double order, OrderSource orderSource,
            String note) {}

    private Richardson() {}

    /**
     * Two levels, coarse (cell h) then fine (cell h/r), with the scheme's formal order p
     * (2 for this project's smoothed grids). Safety factor 3.
     *
     * @throws IllegalArgumentException if ratio is not finite and above 1, or formalOrder not finite and positive
     */
    public static Estimate twoLevels(double coarse, double fine, double ratio, double formalOrder) {
        checkRefinement(ratio, formalOrder);
        if (!Double.isFinite(coarse) || !Double.isFinite(fine)) {
            return undefined(String.format(Locale.ROOT, "value not finite (coarse %g, fine %g): no estimate",
                    coarse, fine));
        }
        String note = coarse == fine
                ? "coarse and fine values identical: no change with refinement, assumed order " + orderText(formalOrder)
                : "assumed order " + orderText(formalOrder);
        return fromPair(coarse, fine, ratio, formalOrder, OrderSource.FORMAL, note);
    }

    /**
     * Three levels, coarse, medium, fine (cells h, h/r, h/r²). The observed order is
     * p = ln((f1 − f2)/(f2 − f3)) / ln r (Roache 1994) when both differences share a sign and exceed
     * round-off ({@link #ROUND_OFF_RELATIVE} of the largest |value|); then Fs = 1.25. Otherwise:
     * <ul>
     * <li>all values identical: extrapolated = fine, errorEstimate 0;</li>
     * <li>a difference at round-off, or differences of opposite sign (oscillating): the formal order with
     *     the two finer levels, Fs = 3, and the note says why;</li>
     * <li>observed order above {@link #MAX_ORDER_OVER_FORMAL} × formal: the formal order (which gives the
     *     larger, safer band) with the two finer levels, Fs = 3;</li>
     * <li>observed order below {@link #MIN_OBSERVED_ORDER} (including diverging sequences): order raised
     *     to {@link #MIN_OBSERVED_ORDER}, Fs = 3, flagged as outside the asymptotic range.</li>
     * </ul>
     *
     * @throws IllegalArgumentException if ratio is not finite and above 1, or formalOrder not finite and positive
     */
    public static Estimate threeLevels(double coarse, double medium, double fine, double ratio, double formalOrder) {
        checkRefinement(ratio, formalOrder);
        if (!Double.isFinite(coarse) || !Double.isFinite(medium) || !Double.isFinite(fine)) {
            return undefined(String.format(Locale.ROOT,
                    "value not finite (coarse %g, medium %g, fine %g): no estimate", coarse, medium, fine));
        }
        double d12 = coarse - medium;
        double d23 = medium - fine;
        String assumed = "assumed order " + orderText(formalOrder) + " from the two finer levels";
        if (d12 == 0 && d23 == 0) {
            return fromPair(medium, fine, ratio, formalOrder, OrderSource.FORMAL,
                    "all three values identical: no change with refinement, " + assumed);
        }
        double roundOff = ROUND_OFF_RELATIVE * Math.max(Math.abs(coarse), Math.max(Math.abs(medium), Math.abs(fine)));
        if (Math.abs(d12) <= roundOff || Math.abs(d23) <= roundOff) {
            return fromPair(medium, fine, ratio, formalOrder, OrderSource.FORMAL, String.format(Locale.ROOT,
                    "differences %g and %g at round-off level (at most %g): observed order undefined, %s",
                    d12, d23, roundOff, assumed));
        }
        if (Math.signum(d12) != Math.signum(d23)) {
            return fromPair(medium, fine, ratio, formalOrder, OrderSource.FORMAL, String.format(Locale.ROOT,
                    "not converging monotonically (differences %g then %g): %s", d12, d23, assumed));
        }
        double observed = Math.log(d12 / d23) / Math.log(ratio);
        if (observed > MAX_ORDER_OVER_FORMAL * formalOrder) {
            return fromPair(medium, fine, ratio, formalOrder, OrderSource.FORMAL, String.format(Locale.ROOT,
                    "observed order %.3g above %s × formal order %s: %s", observed, orderText(MAX_ORDER_OVER_FORMAL),
                    orderText(formalOrder), assumed));
        }
        if (observed < MIN_OBSERVED_ORDER) {
            return fromPair(medium, fine, ratio, MIN_OBSERVED_ORDER, OrderSource.CLAMPED, String.format(Locale.ROOT,
                    "observed order %.3g below %s: not in the asymptotic range, order %s used with the two finer levels",
                    observed, orderText(MIN_OBSERVED_ORDER), orderText(MIN_OBSERVED_ORDER)));
        }
        return fromPair(medium, fine, ratio, observed, OrderSource.OBSERVED,
                String.format(Locale.ROOT, "observed order %.3g", observed));
    }

    private static Estimate fromPair(double coarser, double fine, double ratio, double order, OrderSource source,
            String note) {
        double safety = source == OrderSource.OBSERVED ? OBSERVED_ORDER_SAFETY_FACTOR : ASSUMED_ORDER_SAFETY_FACTOR;
        double change = fine - coarser;
        double denominator = Math.pow(ratio, order) - 1;
        return new Estimate(fine + change / denominator, safety * Math.abs(change) / denominator, order, source, note);
    }

    private static Estimate undefined(String note) {
        return new Estimate(Double.NaN, Double.NaN, Double.NaN, OrderSource.UNDEFINED, note);
    }

    private static void checkRefinement(double ratio, double formalOrder) {
        if (!(Double.isFinite(ratio) && ratio > 1)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "refinement ratio %g must be finite and above 1 (coarser cell size over finer cell size)", ratio));
        }
        if (!(Double.isFinite(formalOrder) && formalOrder > 0)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "formal order %g must be finite and above 0", formalOrder));
        }
    }

    /** An order as short text: "2" for 2.0, "1.5" for 1.5, three significant digits otherwise. */
    private static String orderText(double p) {
        if (p == Math.rint(p) && Math.abs(p) < 1e6) {
            return Long.toString((long) p);
        }
        String s = String.format(Locale.ROOT, "%.3g", p);
        return s.contains(".") ? s.replaceAll("0+$", "").replaceAll("\\.$", "") : s;
    }
}
