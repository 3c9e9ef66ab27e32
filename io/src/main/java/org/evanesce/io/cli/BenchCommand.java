package org.evanesce.io.cli;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.Callable;
import org.evanesce.io.bench.Bench;
import org.evanesce.io.bench.BenchCase;
import org.evanesce.io.bench.BenchReport;
import org.evanesce.io.bench.MachineInfo;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import picocli.CommandLine.Command;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;
import picocli.CommandLine.TypeConversionException;

/**
 * {@code evanesce bench}: measures the solver's speed on this machine, so that users can size
 * long runs. Every combination of the given sizes, precisions, polarizations and thread counts
 * is built, warmed up and timed (see {@link Bench}).
 */
@Command(name = "bench", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        sortOptions = false,
        description = {
            "Measure the solver's speed on this machine: cell updates per second for a vacuum grid with a CPML "
                    + "on all sides, for every combination of the sizes, precisions, polarizations and thread counts given.",
            "A cell update is one cell's three field components updated once; a step of an N x N grid is N^2 of them."})
public final class BenchCommand implements Callable<Integer> {

    private static final List<Integer> DEFAULT_SIZES = List.of(256, 1024, 4096);

    @Spec
    private CommandSpec spec;

    @Option(names = "--size", paramLabel = "N",
            description = "Grid of N x N nodes; repeat for several (default: 256, 1024, 4096).")
    private List<Integer> sizes;

    @Option(names = "--threads", paramLabel = "T", converter = ThreadCount.class,
            description = "Threads to request, a number or 'all'; repeat for several (default: 1 and all). "
                    + "Small grids may run on fewer; the 'used' column says how many.")
    private List<Integer> threads;

    @Option(names = "--precision", paramLabel = "float|double",
            description = "Field precision; repeat for both (default: float).")
    private List<Precision> precisions;

    @Option(names = "--polarization", paramLabel = "s|p",
            description = "s (Ez, Hx, Hy) or p (Hz, Ex, Ey); repeat for both (default: s).")
    private List<Polarization> polarizations;

    @Option(names = "--metal-fraction", paramLabel = "F",
            description = "Fraction of the grid's cells, 0 to 0.5, made of gold (Rakic et al. 1998: 1 Drude and 5 Lorentz "
                    + "terms), as whole rows spread over the grid; repeat for several (default: 0, vacuum only).")
    private List<Double> metalFractions;

    @Option(names = "--seconds", paramLabel = "S", defaultValue = "2",
            description = "Timed stepping per case, in seconds (default: ${DEFAULT-VALUE}).")
    private double seconds;

    @Option(names = "--warm-up", paramLabel = "S", defaultValue = "0.5",
            description = "Untimed stepping before each case's timing, in seconds; it goes on (up to 4 x S, at least 3 s) "
                    + "until the step rate settles (default: ${DEFAULT-VALUE}).")
    private double warmUp;

    @Option(names = "--repeats", paramLabel = "R", defaultValue = "5",
            description = "Timed repeats per case; the median is reported (default: ${DEFAULT-VALUE}).")
    private int repeats;

    @Option(names = "--min-cells-per-thread", paramLabel = "C",
            description = "The solver's threading threshold: fewest cells per thread before another thread is used "
                    + "(default: the solver's).")
    private Integer minCellsPerThread;

    @Option(names = "--csv", description = "Print CSV (one header row) instead of a table.")
    private boolean csv;

    @Option(names = "--interleave", description = "Warm up every case first, then time the cases' repeats in turn "
            + "(repeat 1 of each, repeat 2 of each, ...), all held in memory at once: on a machine whose speed drifts "
            + "(other work starting or stopping) the cases then compare, e.g. one thread against all.")
    private boolean interleave;

    @Override
    public Integer call() {
        if (!MachineInfo.vectorModuleLoaded()) {
            throw new ParameterException(spec.commandLine(), "the JVM was started without --add-modules "
                    + MachineInfo.VECTOR_MODULE + ", which the solver's kernels need: run the 'evanesce' launcher");
        }
        List<BenchCase> cases = cases();
        Bench.Timing timing;
        try {
            timing = new Bench.Timing(warmUp, seconds, repeats);
        } catch (IllegalArgumentException e) {
            throw new ParameterException(spec.commandLine(), e.getMessage(), e);
        }
        MachineInfo machine = MachineInfo.current();
        BenchReport report = new BenchReport(spec.commandLine().getOut(),
                csv ? BenchReport.Format.CSV : BenchReport.Format.TABLE, machine);
        report.header(VersionProvider.version(), timing, cases.size(), interleave);
        if (interleave) {
            try {
                Bench.measureInterleaved(cases, timing).forEach(report::row);
            } catch (OutOfMemoryError e) {
                long cells = cases.stream().mapToLong(BenchCase::cells).sum();
                throw new RunFailedException(String.format(
                        "the %d cases' grids (%d cells together) do not fit in the Java heap at once (max %d MiB); "
                                + "give the JVM more, e.g. JAVA_OPTS=-Xmx16g, or interleave fewer or smaller cases",
                        cases.size(), cells, machine.maxHeapBytes() >> 20), e);
            }
        } else {
            for (BenchCase c : cases) {
                try {
                    report.row(Bench.measure(c, timing));
                } catch (OutOfMemoryError e) {
                    throw new RunFailedException(String.format(
                            "a %d x %d %s grid does not fit in the Java heap (max %d MiB); "
                                    + "give the JVM more, e.g. JAVA_OPTS=-Xmx16g, or bench a smaller --size",
                            c.size(), c.size(), c.precision().name().toLowerCase(java.util.Locale.ROOT),
                            machine.maxHeapBytes() >> 20), e);
                }
            }
        }
        report.footer();
        return ExitCode.OK;
    }

    /** Every combination of the options, each validated before anything runs. */
    private List<BenchCase> cases() {
        int cores = Runtime.getRuntime().availableProcessors();
        Set<Integer> n = new LinkedHashSet<>(sizes == null ? DEFAULT_SIZES : sizes);
        Set<Integer> t = new LinkedHashSet<>(threads == null ? List.of(1, cores) : threads);
        Set<Precision> prec = new LinkedHashSet<>(precisions == null ? List.of(Precision.FLOAT) : precisions);
        Set<Polarization> pol = new LinkedHashSet<>(polarizations == null ? List.of(Polarization.S) : polarizations);
        Set<Double> metal = new LinkedHashSet<>(metalFractions == null ? List.of(0.0) : metalFractions);
        int minCells = BenchCase.SOLVER_DEFAULT;
        if (minCellsPerThread != null) {
            if (minCellsPerThread < 1) {
                throw new ParameterException(spec.commandLine(),
                        "--min-cells-per-thread " + minCellsPerThread + " must be >= 1");
            }
            minCells = minCellsPerThread;
        }
        List<BenchCase> out = new ArrayList<>();
        for (int size : n) {
            for (Precision p : prec) {
                for (Polarization q : pol) {
                    for (double fraction : metal) {
                        for (int th : t) {
                            try {
                                out.add(new BenchCase(size, th, p, q, minCells, fraction));
                            } catch (IllegalArgumentException e) {
                                throw new ParameterException(spec.commandLine(), e.getMessage(), e);
                            }
                        }
                    }
                }
            }
        }
        return out;
    }

    /** A thread count: a positive integer, or {@code all} for the available processors. */
    static final class ThreadCount implements ITypeConverter<Integer> {
        @Override
        public Integer convert(String value) {
            if (value.equalsIgnoreCase("all")) {
                return Runtime.getRuntime().availableProcessors();
            }
            int t;
            try {
                t = Integer.parseInt(value);
            } catch (NumberFormatException e) {
                throw new TypeConversionException("'" + value + "' is not a whole number or 'all'");
            }
            if (t < 1) {
                throw new TypeConversionException("threads " + t + " must be >= 1 (or 'all')");
            }
            return t;
        }
    }
}
