package org.evanesce.io.output.image;

import java.util.Locale;
import java.util.Optional;

/** A length unit for axis labels; positions are stored in metres and divided by {@link #metres}. */
public enum DisplayUnit {
    NM("nm", 1e-9),
    UM("um", 1e-6),
    MM("mm", 1e-3),
    M("m", 1.0);

    /** The symbol written on axes, as in case files ("um", not "µm"). */
    public final String symbol;
    /** Length of one unit in metres. */
    public final double metres;

    DisplayUnit(String symbol, double metres) {
        this.symbol = symbol;
        this.metres = metres;
    }

    /**
     * The unit in which {@code extentMetres} reads as a number from 1 to below 1000: the largest
     * unit in which it is at least 1, else nanometres (so 6.4e-6 m gives um, 8e-7 m gives nm
     * and 0.0015 m gives mm).
     *
     * @param extentMetres the length to be shown, m; finite and &gt; 0
     */
    public static DisplayUnit forExtent(double extentMetres) {
        if (!(extentMetres > 0) || Double.isInfinite(extentMetres)) {
            throw new IllegalArgumentException(String.format(
                    "extent %g m: need a finite length > 0 to choose a display unit", extentMetres));
        }
        DisplayUnit[] all = values();
        for (int k = all.length - 1; k > 0; k--) {
            // a relative slack keeps 1e-6 m (a rounded 1 um) in um
            if (extentMetres / all[k].metres >= 1 - 1e-9) {
                return all[k];
            }
        }
        return NM;
    }

    /** The unit with the given symbol ("nm", "um", "µm", "mm", "m"; case-insensitive), if any. */
    public static Optional<DisplayUnit> fromSymbol(String symbol) {
        String s = symbol.trim().toLowerCase(Locale.ROOT).replace('\u00b5', 'u').replace('\u03bc', 'u');
        for (DisplayUnit u : values()) {
            if (u.symbol.equals(s)) {
                return Optional.of(u);
            }
        }
        return Optional.empty();
    }
}
