package org.evanesce.geometry.dispersion;

/**
 * A table of measured optical constants that cannot be used, naming the row: its source line (as
 * given by the reader, for messages of the form file:line), the column and value at fault, and what
 * was expected. {@link #getMessage()} is a complete sentence without the file name, which the
 * reader that knows the file prefixes.
 */
public final class MaterialDataException extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    private final int line;
    private final String column;

    public MaterialDataException(int line, String column, String message) {
        super(message);
        this.line = line;
        this.column = column;
    }

    /** Source line of the row at fault (1-based), or 0 for a problem of the whole table. */
    public int line() {
        return line;
    }

    /** The column at fault ({@code wavelength}, {@code n}, {@code k}), or empty for the whole table. */
    public String column() {
        return column;
    }
}
