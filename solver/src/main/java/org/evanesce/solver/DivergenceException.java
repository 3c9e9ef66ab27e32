package org.evanesce.solver;

/**
 * The run became unstable: a field value is not finite or has grown beyond the run's limit.
 * The message says at which step, time and cell.
 */
public final class DivergenceException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    private final long step;

    public DivergenceException(String message, long step) {
        super(message);
        this.step = step;
    }

    /** The step after which the divergence was detected. */
    public long step() {
        return step;
    }
}
