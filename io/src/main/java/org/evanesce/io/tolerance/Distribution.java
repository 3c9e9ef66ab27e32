package org.evanesce.io.tolerance;

import java.util.Locale;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Units;
import org.hipparchus.special.Erf;

/**
 * How one parameter of a case varies from part to part: written {@code NAME=normal(MEAN,SD)},
 * {@code NAME=normal(MEAN,SD,LOW,HIGH)} (truncated to [LOW, HIGH]) or {@code NAME=uniform(LOW,HIGH)},
 * values with units (e.g. {@code gap=normal(200nm,5nm)}).
 *
 * @param name      the case parameter
 * @param kind      normal, truncated normal or uniform
 * @param dimension the values' dimension
 * @param a         mean (normal) or lower bound (uniform), SI
 * @param b         standard deviation (normal) or upper bound (uniform), SI
 * @param low       truncation's lower bound (normal only; −∞ without), SI
 * @param high      truncation's upper bound (normal only; +∞ without), SI
 * @param written   as given on the command line
 */
public record Distribution(String name, Kind kind, Dimension dimension, double a, double b, double low, double high,
                           String written) {

    /** The kinds of distribution. */
    public enum Kind {
        NORMAL, UNIFORM
    }

    /** A truncated normal that keeps less than this share of its mass is refused (its draws would be far from normal). */
    static final double MIN_MASS = 1e-3;

    private static final Pattern FORM = Pattern.compile("([A-Za-z_][A-Za-z0-9_]*)=(normal|uniform)\\((.*)\\)");

    /**
     * Parses a --vary option.
     *
     * @throws ToleranceInputException naming the option and what was expected
     */
    public static Distribution parse(String written) throws ToleranceInputException {
        Matcher m = FORM.matcher(written.strip());
        if (!m.matches()) {
            throw new ToleranceInputException("--vary " + written + ": expected NAME=normal(MEAN,SD), NAME=normal(MEAN,SD,LOW,HIGH) "
                    + "or NAME=uniform(LOW,HIGH), e.g. --vary gap=normal(200nm,5nm)");
        }
        String[] parts = m.group(3).split(",", -1);
        Quantity[] q = new Quantity[parts.length];
        for (int k = 0; k < parts.length; k++) {
            q[k] = value(written, parts[k]);
            if (!q[k].dimension().equals(q[0].dimension())) {
                throw new ToleranceInputException("--vary " + written + ": the values have different dimensions ("
                        + q[0].dimension().describe() + " and " + q[k].dimension().describe() + ")");
            }
        }
        String name = m.group(1);
        Dimension d = q[0].dimension();
        if (m.group(2).equals("uniform")) {
            if (parts.length != 2) {
                throw new ToleranceInputException("--vary " + written + ": uniform takes two values, LOW and HIGH");
            }
            if (!(q[1].value() > q[0].value())) {
                throw new ToleranceInputException("--vary " + written + ": HIGH must be larger than LOW");
            }
            return new Distribution(name, Kind.UNIFORM, d, q[0].value(), q[1].value(), q[0].value(), q[1].value(), written);
        }
        if (parts.length != 2 && parts.length != 4) {
            throw new ToleranceInputException("--vary " + written + ": normal takes MEAN,SD or MEAN,SD,LOW,HIGH");
        }
        if (!(q[1].value() > 0)) {
            throw new ToleranceInputException("--vary " + written + ": the standard deviation must be positive");
        }
        double lo = parts.length == 4 ? q[2].value() : Double.NEGATIVE_INFINITY;
        double hi = parts.length == 4 ? q[3].value() : Double.POSITIVE_INFINITY;
        Distribution dist = new Distribution(name, Kind.NORMAL, d, q[0].value(), q[1].value(), lo, hi, written);
        if (!(hi > lo) || dist.mass() < MIN_MASS) {
            throw new ToleranceInputException(String.format(Locale.ROOT, "--vary %s: the bounds keep %.2g of the normal "
                    + "distribution's mass; expected LOW < HIGH around the mean (at least %.0e of the mass)", written,
                    hi > lo ? dist.mass() : 0.0, MIN_MASS));
        }
        return dist;
    }

    private static Quantity value(String written, String text) throws ToleranceInputException {
        return Units.parse(text).orElseThrow(() -> new ToleranceInputException("--vary " + written + ": '" + text.strip()
                + "' is not a number with an optional unit (units: " + String.join(", ", Units.all().keySet()) + ")"));
    }

    /** The share of a normal distribution's mass inside [low, high] (1 when not truncated). */
    double mass() {
        return kind == Kind.UNIFORM ? 1 : cdf((high - a) / b) - cdf((low - a) / b);
    }

    /** The standard normal distribution function, Φ(z) = (1 + erf(z/√2))/2 (Abramowitz & Stegun 26.2.29). */
    static double cdf(double z) {
        return z == Double.POSITIVE_INFINITY ? 1 : z == Double.NEGATIVE_INFINITY ? 0 : 0.5 * (1 + Erf.erf(z / Math.sqrt(2)));
    }

    /** One draw (a truncated normal by rejection: at most 1/{@link #MIN_MASS} tries on average). */
    public double draw(Random rnd) {
        if (kind == Kind.UNIFORM) {
            return a + (b - a) * rnd.nextDouble();
        }
        while (true) {
            double v = a + b * rnd.nextGaussian();
            if (v >= low && v <= high) {
                return v;
            }
        }
    }

    /** A value of the parameter as a case-file override: every digit, in SI units. */
    public String override(double si) {
        return Units.override(si, dimension);
    }
}
