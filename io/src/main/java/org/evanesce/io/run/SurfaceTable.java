package org.evanesce.io.run;

import java.io.PrintWriter;
import java.util.Locale;
import org.evanesce.geometry.PhysicalConstants;

/** Prints a run's surface powers as an aligned table for people (surfaces.csv holds every digit). */
public final class SurfaceTable {

    private SurfaceTable() {
    }

    public static void print(PrintWriter o, SurfaceResults r) {
        o.println("surfaces (" + r.unit() + "):");
        StringBuilder h = new StringBuilder(String.format(Locale.ROOT, "%13s", "wavelength_nm"));
        for (String c : r.columns()) {
            h.append(String.format(Locale.ROOT, " %" + Math.max(12, c.length()) + "s", c));
        }
        o.println(h);
        double[] f = r.plan().frequencies();
        for (int q = 0; q < f.length; q++) {
            if (q == FluxTable.MAX_ROWS) {
                o.printf(Locale.ROOT, "... %d more rows in surfaces.csv%n", f.length - q);
                break;
            }
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "%13.3f", PhysicalConstants.C0 / f[q] * 1e9));
            for (int k = 0; k < r.columns().size(); k++) {
                sb.append(String.format(Locale.ROOT, " %" + Math.max(12, r.columns().get(k).length()) + ".5g", r.rows()[q][k]));
            }
            o.println(sb);
        }
    }
}
