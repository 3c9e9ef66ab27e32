package org.evanesce.io.fit;

/** Bad input to a fit (the measured curve, the free parameters, a trial case that cannot be read): exit code 2. */
public final class FitInputException extends Exception {

    private static final long serialVersionUID = 1L;

    public FitInputException(String message) {
        super(message);
    }

    /** A trial case that cannot be read or planned: its diagnostics, then the overrides it was read with. */
    static FitInputException ofCase(java.util.List<org.evanesce.io.casefile.text.Diagnostic> diagnostics,
                                    java.util.Map<String, String> set) {
        return new FitInputException(org.evanesce.io.casefile.text.DiagnosticText.withOverrides(diagnostics, set));
    }
}
