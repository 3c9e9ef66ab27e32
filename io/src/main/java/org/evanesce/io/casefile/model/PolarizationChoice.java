package org.evanesce.io.casefile.model;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.solver.grid.Polarization;

/**
 * The case's {@code polarization}: s, p, or both (two runs, s and p, reported side by side with their
 * unpolarised average). It is set in the file, with {@code --set polarization=VALUE}, or per point of
 * a sweep ({@code sweep.parameters.polarization: [s, p]}).
 */
public enum PolarizationChoice {
    /** Ez, Hx, Hy. */
    S,
    /** Hz, Ex, Ey. */
    P,
    /** An s run and a p run. */
    BOTH;

    /** The key in the case file and the name {@code --set} and sweeps use. */
    public static final String KEY = "polarization";

    /** The values by the words case files use. */
    public static final Map<String, PolarizationChoice> BY_NAME;

    static {
        Map<String, PolarizationChoice> m = new LinkedHashMap<>();
        for (PolarizationChoice c : values()) {
            m.put(c.caseName(), c);
        }
        BY_NAME = java.util.Collections.unmodifiableMap(m);
    }

    /** The word used in case files: s, p or both. */
    public String caseName() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** The polarizations run, in order. */
    public List<Polarization> runs() {
        return switch (this) {
            case S -> List.of(Polarization.S);
            case P -> List.of(Polarization.P);
            case BOTH -> List.of(Polarization.S, Polarization.P);
        };
    }

    /** The choice written {@code text} (s, p or both, any case), or null. */
    public static PolarizationChoice of(String text) {
        return BY_NAME.get(text.strip().toLowerCase(Locale.ROOT));
    }
}
