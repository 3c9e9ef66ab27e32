package org.evanesce.io.cli;

/**
 * The exit codes of every command; {@code Main} maps exceptions to them and lists them in
 * {@code --help}.
 * <ul>
 * <li>{@value #OK}: success (also for {@code --help} and {@code --version});</li>
 * <li>{@value #USAGE}: bad input or usage: unknown option, a value out of range, a missing
 *     subcommand, a case file refused, an output folder evanesce will not write ({@link
 *     org.evanesce.io.output.OutputRefusedException}). One line on stderr says why;</li>
 * <li>{@value #RUN_FAILED}: the run failed: the solver diverged, a command gave up for a reason
 *     outside its input ({@link RunFailedException}, e.g. the grid did not fit in memory), a sweep
 *     had failed points, or a file could not be written or read (a full disk, a read-only folder,
 *     ...; one sentence naming the path and the cause, {@link org.evanesce.io.output.Faults});</li>
 * <li>{@value #INTERNAL}: an unexpected internal error (a bug): the stack trace goes to stderr.</li>
 * </ul>
 */
public final class ExitCode {

    public static final int OK = 0;
    public static final int INTERNAL = 1;
    public static final int USAGE = 2;
    public static final int RUN_FAILED = 3;

    private ExitCode() {
    }
}
