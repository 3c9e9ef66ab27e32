package org.evanesce.io.casefile.expr;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * The units a case file may write after a number, and the formatting of quantities for messages.
 * A unit name on its own is also a value: {@code 5e6 S/m} is (5e6 S) divided by one metre.
 */
public final class Units {

    private static final Map<String, Quantity> UNITS;

    static {
        Map<String, Quantity> u = new LinkedHashMap<>();
        u.put("nm", new Quantity(1e-9, Dimension.LENGTH));
        u.put("um", new Quantity(1e-6, Dimension.LENGTH));
        u.put("mm", new Quantity(1e-3, Dimension.LENGTH));
        u.put("m", new Quantity(1.0, Dimension.LENGTH));
        u.put("fs", new Quantity(1e-15, Dimension.TIME));
        u.put("ps", new Quantity(1e-12, Dimension.TIME));
        u.put("ns", new Quantity(1e-9, Dimension.TIME));
        u.put("s", new Quantity(1.0, Dimension.TIME));
        u.put("Hz", new Quantity(1.0, Dimension.FREQUENCY));
        u.put("GHz", new Quantity(1e9, Dimension.FREQUENCY));
        u.put("THz", new Quantity(1e12, Dimension.FREQUENCY));
        u.put("PHz", new Quantity(1e15, Dimension.FREQUENCY));
        u.put("deg", new Quantity(Math.PI / 180.0, Dimension.ANGLE));
        u.put("rad", new Quantity(1.0, Dimension.ANGLE));
        u.put("S", new Quantity(1.0, new Dimension(0, 0, 0, 1)));
        UNITS = Collections.unmodifiableMap(u);
    }

    private Units() {
    }

    /** Every unit name, in the order documented. */
    public static Map<String, Quantity> all() {
        return UNITS;
    }

    public static boolean isUnit(String name) {
        return UNITS.containsKey(name);
    }

    /**
     * {@code number} of unit {@code name} in SI, rounded once: a unit below 1 divides by its exact
     * reciprocal (so that {@code 10 um} is the double nearest 1e-5, not 10 × 1e-6), degrees use π/180.
     */
    public static Quantity times(double number, String name) {
        Quantity u = UNITS.get(name);
        double v;
        if (name.equals("deg")) {
            v = number * Math.PI / 180.0;
        } else if (u.value() < 1) {
            v = number / Math.rint(1.0 / u.value());
        } else {
            v = number * u.value();
        }
        return new Quantity(v, u.dimension());
    }

    private static final java.util.regex.Pattern NUMBER_WITH_UNIT = java.util.regex.Pattern.compile(
            "\\s*([-+]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][-+]?\\d+)?)\\s*([A-Za-z]*)\\s*");

    /**
     * A number with an optional unit as a command-line option writes it ({@code 100nm}, {@code -0.5 deg},
     * {@code 1.2}), in SI; empty when the text is not one, or the unit is unknown.
     */
    public static java.util.Optional<Quantity> parse(String text) {
        java.util.regex.Matcher m = NUMBER_WITH_UNIT.matcher(text);
        if (!m.matches()) {
            return java.util.Optional.empty();
        }
        double number = Double.parseDouble(m.group(1));
        String unit = m.group(2);
        if (unit.isEmpty()) {
            return java.util.Optional.of(Quantity.plain(number));
        }
        return isUnit(unit) ? java.util.Optional.of(times(number, unit)) : java.util.Optional.empty();
    }

    /** A value as a case-file override ({@code --set}): every digit, in SI units ({@code 2.3E-7 m}). */
    public static String override(double si, Dimension d) {
        String unit = d.siUnit();
        return unit.isEmpty() ? Double.toString(si) : Double.toString(si) + " " + unit;
    }

    /** The value of one of {@code name}, or null when it is not a unit. */
    public static Quantity unit(String name) {
        return UNITS.get(name);
    }

    /**
     * A quantity for people: lengths in nm, um, mm or m, times in fs, ps, ns or s, frequencies in
     * THz (or Hz, GHz, PHz when far from optical), angles in degrees, conductivity in S/m, other
     * kinds in SI base units. Numbers have up to six significant digits without trailing zeros.
     */
    public static String format(double si, Dimension d) {
        return format(si, d, 6);
    }

    /**
     * The same with up to {@code digits} significant digits; for lengths, times, frequencies, angles,
     * conductivities and plain numbers the text reads back as an expression of the same value (to those
     * digits).
     */
    public static String format(double si, Dimension d, int digits) {
        if (d.isNone()) {
            return number(si, digits);
        }
        double a = Math.abs(si);
        if (d.equals(Dimension.LENGTH)) {
            return a == 0 ? "0 um" : a < 1e-6 ? number(si / 1e-9, digits) + " nm" : a < 1e-3 ? number(si / 1e-6, digits) + " um"
                    : a < 1.0 ? number(si / 1e-3, digits) + " mm" : number(si, digits) + " m";
        } else if (d.equals(Dimension.TIME)) {
            return a == 0 ? "0 fs" : a < 1e-12 ? number(si / 1e-15, digits) + " fs" : a < 1e-9 ? number(si / 1e-12, digits) + " ps"
                    : a < 1e-6 ? number(si / 1e-9, digits) + " ns" : number(si, digits) + " s";
        } else if (d.equals(Dimension.FREQUENCY)) {
            return a == 0 ? "0 THz" : a < 1e9 ? number(si, digits) + " Hz" : a < 1e12 ? number(si / 1e9, digits) + " GHz"
                    : a < 1e15 ? number(si / 1e12, digits) + " THz" : number(si / 1e15, digits) + " PHz";
        } else if (d.equals(Dimension.ANGLE)) {
            return number(Math.toDegrees(si), digits) + " deg";
        } else if (d.equals(Dimension.CONDUCTIVITY)) {
            return number(si, digits) + " S/m";
        }
        return number(si, digits) + " " + d.siUnit();
    }

    /** A number with up to six significant digits, trailing zeros removed ({@code %g} style). */
    public static String number(double v) {
        return number(v, 6);
    }

    /** A number with up to {@code digits} significant digits, trailing zeros removed. */
    public static String number(double v, int digits) {
        if (v == 0) {
            return "0";
        }
        if (!Double.isFinite(v)) {
            return Double.toString(v);
        }
        String s = String.format(Locale.ROOT, "%." + digits + "g", v);
        int e = s.indexOf('e');
        String mantissa = e < 0 ? s : s.substring(0, e);
        String exponent = e < 0 ? "" : s.substring(e);
        if (mantissa.indexOf('.') >= 0) {
            mantissa = mantissa.replaceAll("0+$", "");
            if (mantissa.endsWith(".")) {
                mantissa = mantissa.substring(0, mantissa.length() - 1);
            }
        }
        if (!exponent.isEmpty()) {
            // e+05 -> e+5, e-07 -> e-7
            exponent = exponent.replaceFirst("e([+-])0*(\\d)", "e$1$2");
        }
        return mantissa + exponent;
    }
}
