package org.evanesce.io.bench;

import java.io.PrintWriter;
import java.util.Locale;

/**
 * Writes benchmark results row by row as they arrive, either as an aligned table for people or
 * as CSV (one header row, no comments) for programs.
 */
public final class BenchReport {

    /** How the rows are written. */
    public enum Format {
        TABLE, CSV
    }

    private static final String TABLE_HEAD = String.format(Locale.ROOT,
            "%11s %4s %6s %7s %4s %9s %9s %8s %7s %6s %9s %6s",
            "grid", "pol", "prec", "threads", "used", "steps/s", "Mcell/s", "ns/cell", "spread", "B/cell", "MiB", "metal");
    private static final String TABLE_ROW = "%11s %4s %6s %7d %4d %9.1f %9.1f %8.3f %6.1f%% %6.1f %9.1f %5.1f%%%s%n";
    private static final String CSV_HEAD = "size,polarization,precision,threads_requested,threads_used,steps_per_repeat,"
            + "warm_up_s,settled,repeats,steps_per_s,mcells_per_s,ns_per_cell,spread_percent,bytes_per_cell,bytes,java,cores,jvm_preferred_vector_bits,kernel_vector_bits,"
            + "fewer_threads_percent,metal_percent,metal_bytes,bytes_per_cell_with_metal";

    private final PrintWriter out;
    private final Format format;
    private final MachineInfo machine;
    private double maxWarmUp;
    private boolean anyUnsettled;
    private final StringBuilder fewer = new StringBuilder();

    public BenchReport(PrintWriter out, Format format, MachineInfo machine) {
        this.out = out;
        this.format = format;
        this.machine = machine;
    }

    /**
     * Writes the header: for a table, the program and machine, what is measured and the column
     * heads; for CSV, the header row only.
     */
    public void header(String programVersion, Bench.Timing timing, int cases) {
        header(programVersion, timing, cases, false);
    }

    /** As {@link #header(String, Bench.Timing, int)}, saying whether the cases' repeats were timed in turn. */
    public void header(String programVersion, Bench.Timing timing, int cases, boolean interleaved) {
        maxWarmUp = Bench.maxWarmUpSeconds(timing);
        if (format == Format.CSV) {
            out.println(CSV_HEAD);
            out.flush();
            return;
        }
        out.printf(Locale.ROOT, "evanesce %s bench: %s%n", programVersion, machine.describe());
        out.printf(Locale.ROOT, "vacuum N x N grid, %d nm cells, %d-cell CPML on all sides, continuous point source at the centre%n",
                Math.round(Bench.CELL_SIZE * 1e9), Bench.PML_LAYERS);
        out.println("metal: the percentage of cells made of Rakic's gold (whole rows, --metal-fraction); "
                + "B/cell counts its auxiliary currents spread over every cell");
        out.printf(Locale.ROOT, "%d case(s): at least %.2g s warm-up (until the rate settles), then the median of %d timed repeats over about %.2g s each case%n",
                cases, timing.warmUpSeconds(), timing.repeats(), timing.seconds());
        if (interleaved) {
            out.println("interleaved: every case warmed up first, then repeat 1 of each case, repeat 2 of each, and so on");
        }
        out.println("cell update = one cell's 3 field components, once; ns/cell is wall time with all threads; "
                + "spread = (fastest - slowest) / median");
        out.println();
        out.println(TABLE_HEAD);
        out.flush();
    }

    /** Writes one result. */
    public void row(BenchResult r) {
        BenchCase c = r.benchCase();
        String pol = c.polarization().name().toLowerCase(Locale.ROOT);
        String prec = c.precision().name().toLowerCase(Locale.ROOT);
        if (format == Format.CSV) {
            out.printf(Locale.ROOT, "%d,%s,%s,%d,%d,%d,%.3g,%b,%d,%.6g,%.6g,%.6g,%.3g,%d,%d,%s,%d,%d,%d,%.3g,%.4g,%d,%.6g%n",
                    c.size(), pol, prec, c.threads(), r.threadsUsed(), r.stepsPerRepeat(), r.warmUpSeconds(), r.settled(),
                    r.repeats(), r.stepsPerSecond(), r.megacellsPerSecond(), r.nanosPerCell(), r.spreadPercent(),
                    r.bytesPerCell(), r.bytes(), csvText(machine.java()), machine.cores(), machine.preferredVectorBits(),
                    machine.kernelVectorBits(), 100 * r.fewerThreads(), 100 * metalFraction(r), r.dispersiveBytes(),
                    r.bytesPerCellWithMetal());
        } else {
            out.printf(Locale.ROOT, TABLE_ROW, c.size() + "x" + c.size(), pol, prec, c.threads(), r.threadsUsed(),
                    r.stepsPerSecond(), r.megacellsPerSecond(), r.nanosPerCell(), r.spreadPercent(),
                    r.bytesPerCellWithMetal(), r.mebibytes(), 100 * metalFraction(r), (r.settled() ? "" : " *") + (r.fewerThreads() > 0 ? " +" : ""));
        }
        anyUnsettled |= !r.settled();
        if (r.fewerThreads() > 0) {
            fewer.append(String.format(Locale.ROOT, "%s%dx%d on %d threads: %.0f %%", fewer.length() == 0 ? "" : ", ",
                    c.size(), c.size(), r.threadsUsed(), 100 * r.fewerThreads()));
        }
        out.flush();
    }

    /** Ends the report: for a table, a note under rows whose warm-up did not settle. */
    public void footer() {
        if (format == Format.TABLE && anyUnsettled) {
            out.printf(Locale.ROOT, "* the step rate had not settled after %.2g s of warm-up: the machine is busy "
                    + "or the JIT still compiling; rerun on a quiet machine or with a longer --warm-up%n", maxWarmUp);
        }
        if (format == Format.TABLE && fewer.length() > 0) {
            out.printf(Locale.ROOT, "+ part of the timed steps ran on fewer threads, because fewer were faster (other work "
                    + "held the cores) or the solver was trying whether they would be: %s%n", fewer);
        }
        out.flush();
    }

    /** The fraction of the grid's cells actually made of metal (whole rows). */
    private static double metalFraction(BenchResult r) {
        return Bench.metalRows(r.benchCase().size(), r.benchCase().metalFraction()).length / (double) r.benchCase().size();
    }

    private static String csvText(String s) {
        return s.contains(",") || s.contains("\"") ? "\"" + s.replace("\"", "\"\"") + "\"" : s;
    }
}
