package org.evanesce.io.tolerance;

/** Bad input to a tolerance study (an option, a case the model cannot read): exit code 2. */
public final class ToleranceInputException extends Exception {

    private static final long serialVersionUID = 1L;

    public ToleranceInputException(String message) {
        super(message);
    }
}
