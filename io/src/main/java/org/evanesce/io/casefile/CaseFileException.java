package org.evanesce.io.casefile;

import java.util.List;
import java.util.stream.Collectors;
import org.evanesce.io.casefile.text.Diagnostic;

/**
 * A case file that cannot run. Carries every finding at once: all errors, and the warnings and
 * notes found alongside them, in file order. The command line prints them one per line
 * ({@link #getMessage()}) and exits with code 2.
 */
public final class CaseFileException extends Exception {

    private static final long serialVersionUID = 1L;

    private final transient List<Diagnostic> diagnostics;

    public CaseFileException(List<Diagnostic> diagnostics) {
        super(diagnostics.stream().map(Diagnostic::toString).collect(Collectors.joining("\n")));
        this.diagnostics = List.copyOf(diagnostics);
    }

    /** Every finding, errors and warnings, in file order. */
    public List<Diagnostic> diagnostics() {
        return diagnostics;
    }

    /** The errors only. */
    public List<Diagnostic> errors() {
        return diagnostics.stream().filter(Diagnostic::isError).toList();
    }
}
