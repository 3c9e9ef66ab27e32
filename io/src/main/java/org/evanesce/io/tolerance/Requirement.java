package org.evanesce.io.tolerance;

import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A specification a part must meet: {@code T=0.45..0.55} (R, T or A between limits; either limit may
 * be left out: {@code R=..0.01}, {@code T=0.9..}).
 *
 * @param quantity R, T or A
 * @param low      lower limit (−∞ when none)
 * @param high     upper limit (+∞ when none)
 * @param written  as given
 */
public record Requirement(String quantity, double low, double high, String written) {

    private static final Pattern FORM = Pattern.compile("([RTA])=([-+0-9.eE]*)\\.\\.([-+0-9.eE]*)");

    /**
     * Parses a --require option.
     *
     * @throws ToleranceInputException naming the option and what was expected
     */
    public static Requirement parse(String written) throws ToleranceInputException {
        Matcher m = FORM.matcher(written.strip());
        if (!m.matches() || m.group(2).isEmpty() && m.group(3).isEmpty()) {
            throw new ToleranceInputException("--require " + written + ": expected R, T or A with limits, e.g. T=0.45..0.55, "
                    + "R=..0.01 or T=0.9..");
        }
        try {
            double lo = m.group(2).isEmpty() ? Double.NEGATIVE_INFINITY : Double.parseDouble(m.group(2));
            double hi = m.group(3).isEmpty() ? Double.POSITIVE_INFINITY : Double.parseDouble(m.group(3));
            if (!(hi > lo)) {
                throw new ToleranceInputException("--require " + written + ": the upper limit must be larger than the lower one");
            }
            return new Requirement(m.group(1), lo, hi, written);
        } catch (NumberFormatException e) {
            throw new ToleranceInputException("--require " + written + ": the limits must be numbers, e.g. T=0.45..0.55");
        }
    }

    /** Whether a value meets it. */
    boolean met(double v) {
        return v >= low && v <= high;
    }
}
