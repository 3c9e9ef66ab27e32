package org.evanesce.io.fit;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Units;

/**
 * A parameter the fit may change, between bounds. Written on the command line as
 * {@code NAME=LOW..HIGH} (e.g. {@code gap=100nm..300nm}); the fit starts from the case's value.
 * Two names belong to the fit itself rather than the case: {@code angle_offset} (added to every
 * measured angle: a goniometer's zero error; starts at 0) and {@code scale} (multiplies the model:
 * a detector's gain; starts at 1).
 *
 * @param name      the case parameter's name, or angle_offset or scale
 * @param dimension its dimension
 * @param low       lower bound, SI
 * @param high      upper bound, SI
 * @param written   as the command line gave it
 */
public record FreeParameter(String name, Dimension dimension, double low, double high, String written) {

    /** The fit's own parameter: an offset added to the measured angles. */
    public static final String ANGLE_OFFSET = "angle_offset";
    /** The fit's own parameter: a factor on the model's R or T. */
    public static final String SCALE = "scale";

    private static final Pattern FORM = Pattern.compile("([A-Za-z_][A-Za-z0-9_]*)=(.+?)\\.\\.(.+)");

    /** Whether the parameter belongs to the fit (not to the case). */
    public boolean own() {
        return name.equals(ANGLE_OFFSET) || name.equals(SCALE);
    }

    /** Its width, high − low. */
    public double span() {
        return high - low;
    }

    /**
     * Parses {@code NAME=LOW..HIGH}.
     *
     * @throws FitInputException naming the option and what was expected
     */
    public static FreeParameter parse(String written) throws FitInputException {
        Matcher m = FORM.matcher(written);
        if (!m.matches()) {
            throw new FitInputException("--free " + written + ": expected NAME=LOW..HIGH, e.g. --free gap=100nm..300nm");
        }
        Quantity low = value(written, m.group(2));
        Quantity high = value(written, m.group(3));
        if (!low.dimension().equals(high.dimension())) {
            throw new FitInputException("--free " + written + ": the bounds have different dimensions (" + low.dimension().describe()
                    + " and " + high.dimension().describe() + ")");
        }
        if (!(high.value() > low.value())) {
            throw new FitInputException("--free " + written + ": the upper bound must be larger than the lower one");
        }
        String name = m.group(1);
        if (name.equals(ANGLE_OFFSET) && !low.dimension().equals(Dimension.ANGLE)) {
            throw new FitInputException("--free " + written + ": angle_offset takes angles, e.g. angle_offset=-1deg..1deg");
        }
        if (name.equals(SCALE) && !low.dimension().isNone()) {
            throw new FitInputException("--free " + written + ": scale takes plain numbers, e.g. scale=0.8..1.2");
        }
        return new FreeParameter(name, low.dimension(), low.value(), high.value(), written);
    }

    private static Quantity value(String written, String text) throws FitInputException {
        return Units.parse(text).orElseThrow(() -> new FitInputException(String.format(Locale.ROOT, "--free %s: '%s' is not a "
                + "number with an optional unit (e.g. 100nm, -0.5deg, 1.2; units: %s)", written, text.strip(),
                String.join(", ", Units.all().keySet()))));
    }

    /** A value of this parameter as a case-file override: every digit, in SI units. */
    String override(double si) {
        return Units.override(si, dimension);
    }
}
