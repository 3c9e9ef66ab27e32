package org.evanesce.io.fit;

/** Bad input to a fit (the measured curve, the free parameters, a trial case that cannot be read): exit code 2. */
public final class FitInputException extends Exception {

    private static final long serialVersionUID = 1L;

    public FitInputException(String message) {
        super(message);
    }
}
