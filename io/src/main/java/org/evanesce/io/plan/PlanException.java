package org.evanesce.io.plan;

import java.util.List;
import org.evanesce.io.casefile.text.Diagnostic;

/** The case is valid as a file but cannot be planned; each finding names where in the file. Exit code 2. */
public final class PlanException extends Exception {

    private static final long serialVersionUID = 1L;

    private final transient List<Diagnostic> diagnostics;

    public PlanException(List<Diagnostic> diagnostics) {
        super(String.join("\n", diagnostics.stream().map(Diagnostic::toString).toList()));
        this.diagnostics = List.copyOf(diagnostics);
    }

    public List<Diagnostic> diagnostics() {
        return diagnostics;
    }
}
