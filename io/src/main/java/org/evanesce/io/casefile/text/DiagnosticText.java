package org.evanesce.io.casefile.text;

import java.util.List;
import java.util.Map;

/** Diagnostics as one message: one per line, then the overrides the case was read with, where there were any. */
public final class DiagnosticText {

    private DiagnosticText() {
    }

    /** The diagnostics, one per line. */
    public static String lines(List<Diagnostic> diagnostics) {
        return String.join("\n", diagnostics.stream().map(Diagnostic::toString).toList());
    }

    /**
     * The diagnostics one per line, then "(with k=v, ...)" naming the overrides (the values a fit or a study put in);
     * no such line when there were none: the case as written is at fault.
     */
    public static String withOverrides(List<Diagnostic> diagnostics, Map<String, String> set) {
        StringBuilder w = new StringBuilder();
        set.forEach((k, v) -> w.append(w.length() == 0 ? "" : ", ").append(k).append('=').append(v));
        return lines(diagnostics) + (set.isEmpty() ? "" : "\n(with " + w + ")");
    }
}
