package org.evanesce.io;

import java.io.IOException;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.evanesce.io.cli.BenchCommand;
import org.evanesce.io.cli.CheckCommand;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.io.cli.RunCommand;
import org.evanesce.io.cli.RunFailedException;
import org.evanesce.io.cli.VersionProvider;
import org.evanesce.io.output.Faults;
import org.evanesce.solver.DivergenceException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * The {@code evanesce} command line. Each subcommand is a {@link Callable} returning its exit code
 * ({@link ExitCode}); this class maps what escapes a command to one: {@link DivergenceException},
 * {@link RunFailedException} and file-system failures ({@link Faults}) to {@link ExitCode#RUN_FAILED},
 * refused input and output folders to {@link ExitCode#USAGE}, anything else to {@link ExitCode#INTERNAL}
 * with its stack trace.
 */
@Command(name = "evanesce", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "2D FDTD field simulator for optical tunnelling and near-field geometries.",
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {
            "0:success",
            "2:bad input or usage",
            "3:run failed (e.g. the solver diverged, out of memory, a full disk or a folder that cannot be written; a sweep "
                + "with failed or, for --merge-only, missing points)",
            "1:unexpected internal error"})
public final class Main implements Callable<Integer> {

    /** The subcommands, in the order the help lists them. */
    private static final Class<?>[] COMMANDS = {RunCommand.class, CheckCommand.class, BenchCommand.class,
        org.evanesce.io.cli.StackCommand.class, org.evanesce.io.cli.AccuracyCommand.class, org.evanesce.io.cli.RedrawCommand.class,
        org.evanesce.io.cli.RenderRefused.class, org.evanesce.io.cli.SweepCommand.class, org.evanesce.io.cli.FitCommand.class,
        org.evanesce.io.cli.ToleranceCommand.class, org.evanesce.io.cli.DipShiftCommand.class};

    @Spec
    private CommandSpec spec;

    @Override
    public Integer call() {
        throw new ParameterException(spec.commandLine(), "missing command: choose one of "
                + String.join(", ", spec.subcommands().entrySet().stream()
                        .filter(c -> !c.getValue().getCommandSpec().usageMessage().hidden()).map(c -> c.getKey()).toList()));
    }

    public static void main(String[] args) {
        // a signal (Ctrl-C, kill, a batch system's limit) removes what the run left unfinished, and says so
        org.evanesce.io.output.Interruption.install(System.err);
        int code = run(args, System.out, System.err);
        org.evanesce.io.output.Interruption.finished();
        System.exit(code);
    }

    /**
     * Runs the command line in-process.
     *
     * @param out receives the commands' output (flushed before returning)
     * @param err receives error messages
     * @return the exit code (see the class comment)
     */
    public static int run(String[] args, PrintStream out, PrintStream err) {
        PrintWriter o = new PrintWriter(out, true);
        PrintWriter e = new PrintWriter(err, true);
        // the version option alone needs no subcommand (all of them had cost about half of its 0.3 s wall)
        boolean versionOnly = args.length == 1 && ("--version".equals(args[0]) || "-V".equals(args[0]));
        CommandLine cl = (versionOnly ? new CommandLine(new Main()) : commandLine(args.length > 0 ? args[0] : null))
                .setOut(o)
                .setErr(e)
                .setCaseInsensitiveEnumValuesAllowed(true)
                .setParameterExceptionHandler(Main::usageError)
                .setExecutionExceptionHandler(Main::runError);
        try {
            return cl.execute(args);
        } catch (OutOfMemoryError oom) {
            // check and run refuse a case whose estimate does not fit; this is the estimate falling short
            e.printf("evanesce: the run ran out of memory (the JVM may use %d MiB) although its estimate fitted; give the "
                    + "JVM more memory (e.g. JAVA_OPTS=-Xmx%dg) and please report the case file%n",
                    Runtime.getRuntime().maxMemory() >> 20, Math.max(2, 2 * (Runtime.getRuntime().maxMemory() >> 30)));
            return ExitCode.RUN_FAILED;
        } finally {
            o.flush();
            e.flush();
        }
    }

    /**
     * The command line with its subcommands: when {@code first} (the first argument) names one, that one alone, else
     * all. picocli builds a command's whole model (every option, by reflection) when it is added, which for all of
     * them cost about 0.16 s of CPU in each fresh JVM (measured: 0.48 s user against 0.32 s for {@code run} alone),
     * while a command line given one command's name parses and prints exactly as it would with all of them.
     */
    public static CommandLine commandLine(String first) {
        CommandLine cl = new CommandLine(new Main());
        Class<?> named = null;
        for (Class<?> c : COMMANDS) {
            Command a = c.getAnnotation(Command.class);
            if (a.name().equals(first) || java.util.Arrays.asList(a.aliases()).contains(first)) {
                named = c;
            }
        }
        for (Class<?> c : COMMANDS) {
            if (named == null || c == named) {
                cl.addSubcommand(c);
            }
        }
        return cl;
    }

    /** A usage error: one line naming the command and the reason, then exit 2. */
    private static int usageError(ParameterException ex, String[] args) {
        CommandLine cl = ex.getCommandLine();
        String name = cl.getCommandSpec().qualifiedName();
        cl.getErr().printf("%s: %s (see '%s --help')%n", name, oneLine(ex.getMessage()), name);
        return ExitCode.USAGE;
    }

    private static int runError(Exception ex, CommandLine cl, CommandLine.ParseResult parsed) {
        String name = cl.getCommandSpec().qualifiedName();
        PrintWriter err = cl.getErr();
        if (ex instanceof DivergenceException) {
            err.printf("%s: run failed: %s%n", name, ex.getMessage());
            return ExitCode.RUN_FAILED;
        }
        if (ex instanceof org.evanesce.io.run.CaseRunner.RefusedException) {
            err.printf("%s: %s%n", name, oneLine(ex.getMessage()));
            return ExitCode.USAGE;
        }
        if (ex instanceof RunFailedException) {
            err.printf("%s: run failed: %s%n", name, ex.getMessage());
            return ExitCode.RUN_FAILED;
        }
        if (ex instanceof org.evanesce.io.output.OutputRefusedException) {
            err.printf("%s: %s%n", name, oneLine(ex.getMessage()));
            return ExitCode.USAGE;
        }
        IOException io = Faults.ioCause(ex);
        if (io != null) {
            err.printf("%s: failed: %s%n", name, Faults.sentence(io));
            return ExitCode.RUN_FAILED;
        }
        err.printf("%s: internal error: %s%n", name, ex);
        ex.printStackTrace(err);
        return ExitCode.INTERNAL;
    }

    private static String oneLine(String s) {
        return s == null ? "invalid input" : s.strip().replaceAll("\\s*\\R\\s*", "; ");
    }
}
