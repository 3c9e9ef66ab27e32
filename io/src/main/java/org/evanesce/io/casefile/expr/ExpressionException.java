package org.evanesce.io.casefile.expr;

/**
 * A problem in an expression, located by its character offset in the expression's text.
 * A <em>quiet</em> exception stands for a problem already reported elsewhere (an expression that
 * uses a parameter whose own definition failed) and should not be reported again.
 */
public final class ExpressionException extends Exception {

    private static final long serialVersionUID = 1L;

    private final int offset;
    private final boolean quiet;

    public ExpressionException(int offset, String message) {
        this(offset, message, false);
    }

    private ExpressionException(int offset, String message, boolean quiet) {
        super(message, null, false, false);
        this.offset = offset;
        this.quiet = quiet;
    }

    /** An exception for a failure that has already been reported. */
    public static ExpressionException quiet(int offset) {
        return new ExpressionException(offset, "(already reported)", true);
    }

    /** Character offset of the problem in the expression text (0 = first character). */
    public int offset() {
        return offset;
    }

    public boolean isQuiet() {
        return quiet;
    }
}
