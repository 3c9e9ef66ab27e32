package org.evanesce.io.casefile.text;

/**
 * Where a value came from: a file with a 1-based line and column, or (line 0) a command-line
 * setting such as {@code --set gap=0.3 um}.
 *
 * @param source the file name as given, or the command-line text
 * @param line   1-based line, or 0 when the value did not come from a file
 * @param column 1-based column, or 0 when the value did not come from a file
 */
public record SourcePosition(String source, int line, int column) {

    /** A value given on the command line as {@code --set name=value}. */
    public static SourcePosition commandLine(String name, String value) {
        return new SourcePosition("--set " + name + "=" + value, 0, 0);
    }

    public boolean inFile() {
        return line > 0;
    }

    /** The same line, {@code columns} further right (for a place inside an expression). */
    public SourcePosition shifted(int columns) {
        return inFile() ? new SourcePosition(source, line, column + columns) : this;
    }

    /** {@code file:line:column}, or the command-line text. */
    @Override
    public String toString() {
        return inFile() ? source + ":" + line + ":" + column : source;
    }
}
