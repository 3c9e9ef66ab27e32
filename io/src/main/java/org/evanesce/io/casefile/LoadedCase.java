package org.evanesce.io.casefile;

import java.util.List;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.Diagnostic;

/**
 * A case that may run, with the warnings and notes found while reading it (in file order).
 */
public record LoadedCase(CaseSpec spec, List<Diagnostic> diagnostics) {

    public LoadedCase {
        diagnostics = List.copyOf(diagnostics);
    }

    public List<Diagnostic> warnings() {
        return diagnostics.stream().filter(d -> d.severity() == Diagnostic.Severity.WARNING).toList();
    }

    public List<Diagnostic> notes() {
        return diagnostics.stream().filter(d -> d.severity() == Diagnostic.Severity.NOTE).toList();
    }
}
