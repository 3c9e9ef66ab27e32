package org.evanesce.io.run;

import java.util.Locale;

/** Formatting of times for people. */
final class Units {

    private Units() {
    }

    /** A simulated time with an SI prefix, e.g. "12.3 fs". */
    static String time(double s) {
        String[] names = {"s", "ms", "us", "ns", "ps", "fs", "as"};
        double v = s;
        int k = 0;
        while (k < names.length - 1 && Math.abs(v) < 1 && v != 0) {
            v *= 1000;
            k++;
        }
        return String.format(Locale.ROOT, "%.4g %s", v, names[k]);
    }

    /** A wall-clock duration as h:mm:ss, or "?" if unknown. */
    static String duration(double s) {
        if (!Double.isFinite(s)) {
            return "?";
        }
        long t = Math.round(s);
        return String.format(Locale.ROOT, "%d:%02d:%02d", t / 3600, t / 60 % 60, t % 60);
    }
}
