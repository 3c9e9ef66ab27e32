package org.evanesce.io.casefile.text;

/**
 * One finding about a case file, printed as {@code file:line:column: key.path: what is wrong, what
 * was expected} for an error, with {@code warning: } or {@code note: } after the position for the
 * other severities.
 *
 * @param severity how serious it is
 * @param at       where in the case file (or on the command line)
 * @param path     the key path, e.g. {@code shapes[2].rectangle.size}; empty for the file as a whole
 * @param message  what is wrong and what was expected, values printed with units
 */
public record Diagnostic(Severity severity, SourcePosition at, String path, String message) {

    /** Errors stop the run; warnings and notes are printed and recorded in run.json. */
    public enum Severity {
        /** The case cannot run. */
        ERROR,
        /** The case runs but the result may be poor. */
        WARNING,
        /** Something the program decided for the user, e.g. the cell size it picked. */
        NOTE
    }

    public boolean isError() {
        return severity == Severity.ERROR;
    }

    @Override
    public String toString() {
        String kind = switch (severity) {
            case ERROR -> "";
            case WARNING -> "warning: ";
            case NOTE -> "note: ";
        };
        return at + ": " + kind + (path.isEmpty() ? "" : path + ": ") + message;
    }
}
