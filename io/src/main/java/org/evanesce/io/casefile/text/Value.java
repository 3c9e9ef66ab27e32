package org.evanesce.io.casefile.text;

import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;

/**
 * A resolved number from the case file in SI units (metres, seconds, hertz, radians, S/m or a
 * plain number, as the field that holds it says), with the place it was written; a default
 * value carries the place of the section that left it out.
 */
public record Value(double si, SourcePosition at) {

    /** The value formatted with {@code kind}'s unit, for messages. */
    public String format(Dimension kind) {
        return Units.format(si, kind);
    }
}
