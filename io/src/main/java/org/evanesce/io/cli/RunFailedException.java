package org.evanesce.io.cli;

/**
 * A command could not complete for a reason outside the user's input (the solver diverged, the
 * grid did not fit in memory). {@code Main} prints the message on one line and exits with
 * {@link ExitCode#RUN_FAILED}.
 */
public final class RunFailedException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    public RunFailedException(String message, Throwable cause) {
        super(message, cause);
    }
}
