package org.evanesce.io.casefile.expr;

/**
 * A number with its dimension, the value in SI base units (metres, seconds, radians, siemens).
 */
public record Quantity(double value, Dimension dimension) {

    public static Quantity plain(double value) {
        return new Quantity(value, Dimension.NONE);
    }

    /** The value in the unit people read best, e.g. {@code 633 nm}, {@code 45 deg}, {@code 2.5}. */
    @Override
    public String toString() {
        return Units.format(value, dimension);
    }
}
