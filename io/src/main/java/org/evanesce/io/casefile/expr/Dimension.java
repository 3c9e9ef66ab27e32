package org.evanesce.io.casefile.expr;

import java.util.ArrayList;
import java.util.List;

/**
 * The physical kind of a quantity as integer exponents of four base units: metre, second,
 * radian and siemens. Angles carry their own exponent so that a plain number can never be
 * mistaken for one; a frequency is time⁻¹ and a conductivity is S·m⁻¹.
 */
public record Dimension(int length, int time, int angle, int siemens) {

    public static final Dimension NONE = new Dimension(0, 0, 0, 0);
    public static final Dimension LENGTH = new Dimension(1, 0, 0, 0);
    public static final Dimension TIME = new Dimension(0, 1, 0, 0);
    public static final Dimension FREQUENCY = new Dimension(0, -1, 0, 0);
    public static final Dimension ANGLE = new Dimension(0, 0, 1, 0);
    public static final Dimension CONDUCTIVITY = new Dimension(-1, 0, 0, 1);

    public Dimension times(Dimension o) {
        return new Dimension(length + o.length, time + o.time, angle + o.angle, siemens + o.siemens);
    }

    public Dimension over(Dimension o) {
        return new Dimension(length - o.length, time - o.time, angle - o.angle, siemens - o.siemens);
    }

    /** True when every exponent is even, so that a square root has a dimension. */
    public boolean hasSquareRoot() {
        return length % 2 == 0 && time % 2 == 0 && angle % 2 == 0 && siemens % 2 == 0;
    }

    /** Half of every exponent; call only when {@link #hasSquareRoot()}. */
    public Dimension squareRoot() {
        return new Dimension(length / 2, time / 2, angle / 2, siemens / 2);
    }

    public boolean isNone() {
        return equals(NONE);
    }

    /** A phrase for messages: "a length", "a plain number", "a quantity in m^2". */
    public String describe() {
        if (equals(NONE)) {
            return "a plain number";
        } else if (equals(LENGTH)) {
            return "a length";
        } else if (equals(TIME)) {
            return "a time";
        } else if (equals(FREQUENCY)) {
            return "a frequency";
        } else if (equals(ANGLE)) {
            return "an angle";
        } else if (equals(CONDUCTIVITY)) {
            return "a conductivity";
        }
        return "a quantity in " + siUnit();
    }

    /** The SI unit written out, e.g. {@code m^2 s^-1}; empty for a plain number. */
    public String siUnit() {
        List<String> parts = new ArrayList<>();
        add(parts, "m", length);
        add(parts, "s", time);
        add(parts, "rad", angle);
        add(parts, "S", siemens);
        return String.join(" ", parts);
    }

    private static void add(List<String> parts, String unit, int exponent) {
        if (exponent == 1) {
            parts.add(unit);
        } else if (exponent != 0) {
            parts.add(unit + "^" + exponent);
        }
    }
}
