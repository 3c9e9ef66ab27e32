package org.evanesce.io.run;

import java.io.PrintWriter;
import java.util.Locale;

/** Prints a run's normalised flux as an aligned table for people (flux.csv holds every digit). */
public final class FluxTable {

    /** Frequencies shown on the console; flux.csv has them all. */
    static final int MAX_ROWS = 25;

    private FluxTable() {
    }

    public static void print(PrintWriter o, FluxResults r) {
        StringBuilder h = new StringBuilder(String.format(Locale.ROOT, "%13s %9s", "wavelength_nm", "angle_deg"));
        for (String c : r.columns()) {
            h.append(String.format(Locale.ROOT, " %" + Math.max(10, c.length()) + "s", c));
        }
        o.println(h);
        int shown = 0;
        for (FluxResults.Row row : r.rows()) {
            if (shown++ == MAX_ROWS) {
                o.printf(Locale.ROOT, "... %d more rows in flux.csv%n", r.rows().size() - MAX_ROWS);
                break;
            }
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "%13.3f %9.4f", row.wavelength() * 1e9,
                    row.angleDegrees()));
            for (int k = 0; k < r.columns().size(); k++) {
                sb.append(String.format(Locale.ROOT, " %" + Math.max(10, r.columns().get(k).length()) + ".6f", row.values()[k]));
            }
            o.println(sb);
        }
    }
}
