package org.evanesce.io.sweep;

import java.util.Locale;

/** How the sweep's derived tables (extrema, dip shifts) write their numbers. */
final class TableText {

    private TableText() {
    }

    /** A finite number with ten significant digits ({@code %.9e}); empty for NaN or an infinity. */
    static String e(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%.9e", v) : "";
    }

    /** A number without trailing zeros: 633.000000 becomes 633; anything not a number as it is. */
    static String plain(String v) {
        try {
            return new java.math.BigDecimal(v).stripTrailingZeros().toPlainString();
        } catch (NumberFormatException e) {
            return v;
        }
    }
}
