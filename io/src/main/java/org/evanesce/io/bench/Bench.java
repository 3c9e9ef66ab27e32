package org.evanesce.io.bench;

import java.lang.management.CompilationMXBean;
import java.lang.management.ManagementFactory;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;

/**
 * Times whole solver steps on a vacuum grid with a CPML on all sides and a continuous point
 * source at the centre. The source keeps the fields from decaying, so the timing never meets
 * subnormal numbers (which the solver guards against anyway).
 *
 * <p>Method: step for the warm-up time and until the step rate has settled and the JIT compiler
 * has gone quiet, estimate the step time from the last warm-up chunk, then time {@code repeats} runs of the same number of steps, together lasting about the
 * requested seconds, and report the median rate and the spread.
 */
public final class Bench {

    /** CPML thickness on each side, in cells. */
    public static final int PML_LAYERS = 12;
    /** Cell size, in metres: the source's 1 µm vacuum wavelength spans 20 cells. */
    public static final double CELL_SIZE = 50e-9;
    /** Source wavelength in vacuum, in metres. */
    public static final double WAVELENGTH = 1e-6;
    /** Source ramp-up, in periods of the source (common practice: several periods). */
    private static final double RAMP_PERIODS = 5;

    /**
     * How long to measure.
     *
     * @param warmUpSeconds untimed stepping before the measurement, in seconds (≥ 0)
     * @param seconds       approximate total timed stepping, in seconds (&gt; 0)
     * @param repeats       number of timed repeats whose median is reported (≥ 1)
     */
    public record Timing(double warmUpSeconds, double seconds, int repeats) {
        public Timing {
            if (!(warmUpSeconds >= 0) || Double.isInfinite(warmUpSeconds)) {
                throw new IllegalArgumentException(String.format("warm-up %g s must be finite and >= 0", warmUpSeconds));
            }
            if (!(seconds > 0) || Double.isInfinite(seconds)) {
                throw new IllegalArgumentException(String.format("timed seconds %g must be finite and > 0", seconds));
            }
            if (repeats < 1) {
                throw new IllegalArgumentException("repeats " + repeats + " must be >= 1");
            }
        }
    }

    /**
     * Two successive warm-up chunks whose step times differ by less than this fraction count as
     * settled (with the JIT quiet, see {@link #JIT_QUIET_FRACTION}): before the kernels are
     * compiled the Vector API code runs up to thousands of times slower, and successive
     * interpreted chunks can agree too. 10% sits above the chunk-to-chunk noise of a quiet machine
     * (common practice).
     */
    public static final double SETTLED_TOLERANCE = 0.10;
    /**
     * A warm-up chunk counts as free of JIT compilation when the compilers spent less than this
     * fraction of the chunk's wall time (the JVM's total compilation time). Compiling the Vector
     * API kernels takes the order of a second; while it runs the step rate is meaningless.
     */
    public static final double JIT_QUIET_FRACTION = 0.02;
    /** Shortest warm-up chunk, in seconds, so that a chunk spans many steps on small grids. */
    private static final double MIN_CHUNK_SECONDS = 0.1;

    private Bench() {
    }

    /** The longest a warm-up may last waiting to settle: 4 × the requested warm-up, at least 3 s. */
    public static double maxWarmUpSeconds(Timing t) {
        return Math.max(3.0, 4 * t.warmUpSeconds());
    }

    /** The metal of {@code --metal-fraction}: Rakić et al.'s gold (1 Drude and 5 Lorentz terms, 12 values of state per site). */
    public static final String METAL = "gold";

    /**
     * The rows made of metal for a metal fraction: round(fraction × size) whole rows (every column, CPML
     * strips included), spread evenly over the grid between the bottom and top CPML and never on the
     * source's row. A row of metal holds a dispersive value at every electric site of its cells.
     */
    public static int[] metalRows(int size, double fraction) {
        int m = (int) Math.round(fraction * size);
        int lo = PML_LAYERS + 1;
        int span = size - 2 * PML_LAYERS - 2;
        m = Math.min(m, span - 1);
        int[] rows = new int[m];
        for (int k = 0; k < m; k++) {
            int j = lo + (int) ((k + 0.5) * span / m);
            rows[k] = j == size / 2 ? j + 1 : j;
        }
        return rows;
    }

    /** Plans the benchmark run for one case; the caller closes it. */
    public static Simulation simulation(BenchCase c) {
        int n = c.size();
        MaterialGrid.Builder gb = MaterialGrid.builder(n, n, CELL_SIZE, Material.VACUUM);
        DispersiveMaterial gold = MetalLibrary.get(METAL).material();
        Material metal = new Material(gold.name(), gold.epsInfinity(), 0);
        for (int j : metalRows(n, c.metalFraction())) {
            for (FieldSite site : FieldSite.values()) {
                for (int i = 0; i < n; i++) {
                    gb.set(site, i, j, metal);
                }
            }
        }
        MaterialGrid grid = gb.build();
        double f = PhysicalConstants.C0 / WAVELENGTH;
        Component driven = c.polarization() == Polarization.S ? Component.EZ : Component.HZ;
        Simulation.Builder b = Simulation.builder(grid)
                .polarization(c.polarization())
                .precision(c.precision())
                .boundaries(Boundary.pml(PML_LAYERS))
                .threads(c.threads())
                .vectorsFromStart()
                .source(Source.point(driven, n, n / 2, n / 2, 1.0, TimeSignal.rampedContinuous(f, RAMP_PERIODS / f)));
        if (c.minCellsPerThread() != BenchCase.SOLVER_DEFAULT) {
            b.minCellsPerThread(c.minCellsPerThread());
        }
        int metalIndex = grid.materials().indexOf(metal);
        if (metalIndex >= 0) {
            b.dispersive(metalIndex, gold);
        }
        return b.build();
    }

    /**
     * Builds, warms up and times one case. The warm-up runs in chunks for at least the requested
     * time and then until it has settled: two successive chunks with the JIT compiler quiet (under
     * {@link #JIT_QUIET_FRACTION} of the chunk spent compiling) whose step times agree within
     * {@link #SETTLED_TOLERANCE}; but no longer than {@link #maxWarmUpSeconds}.
     */
    public static BenchResult measure(BenchCase c, Timing t) {
        return measureInterleaved(List.of(c), t).get(0);
    }

    /**
     * Builds and warms up every case (each as {@link #measure} does), then times their repeats in
     * turn: repeat 1 of every case, then repeat 2 of every case, and so on, with every case's
     * simulation held in memory. On a machine whose speed drifts (other work starting or stopping)
     * the drift then reaches every case alike, so their rates compare.
     */
    public static List<BenchResult> measureInterleaved(List<BenchCase> cases, Timing t) {
        List<Simulation> sims = new ArrayList<>();
        try {
            List<WarmUp> warm = new ArrayList<>();
            for (BenchCase c : cases) {
                Simulation sim = simulation(c);
                sims.add(sim);
                warm.add(warmUp(sim, t));
            }
            int n = cases.size();
            long[] perRepeat = new long[n];
            long[] fewer0 = new long[n];
            double[][] rate = new double[n][t.repeats()];
            for (int k = 0; k < n; k++) {
                perRepeat[k] = Math.max(1, Math.round(t.seconds() / t.repeats() / warm.get(k).stepSeconds()));
                fewer0[k] = sims.get(k).stepsOnFewerThreads();
            }
            for (int r = 0; r < t.repeats(); r++) {
                for (int k = 0; k < n; k++) {
                    long t0 = System.nanoTime();
                    sims.get(k).run(perRepeat[k]);
                    long elapsed = Math.max(1, System.nanoTime() - t0);
                    rate[k][r] = cases.get(k).cells() * perRepeat[k] / (elapsed * 1e-9);
                }
            }
            List<BenchResult> out = new ArrayList<>();
            for (int k = 0; k < n; k++) {
                double[] x = rate[k];
                Arrays.sort(x);
                int m = x.length / 2;
                double median = x.length % 2 == 1 ? x[m] : 0.5 * (x[m - 1] + x[m]);
                Simulation sim = sims.get(k);
                out.add(new BenchResult(cases.get(k), sim.threads(), warm.get(k).seconds(), warm.get(k).settled(), perRepeat[k],
                        x.length, median, x[0], x[x.length - 1], sim.bytesPerCell(), sim.bytes(), sim.dispersiveBytes(),
                        (sim.stepsOnFewerThreads() - fewer0[k]) / (double) (perRepeat[k] * x.length)));
            }
            return out;
        } finally {
            for (Simulation sim : sims) {
                sim.close();
            }
        }
    }

    /** A finished warm-up: its length in seconds, whether it settled, and the last chunk's seconds per step. */
    private record WarmUp(double seconds, boolean settled, double stepSeconds) {
    }

    private static WarmUp warmUp(Simulation sim, Timing t) {
        CompilationMXBean jit = ManagementFactory.getCompilationMXBean();
        boolean jitVisible = jit != null && jit.isCompilationTimeMonitoringSupported();
        double chunk = Math.max(MIN_CHUNK_SECONDS, t.warmUpSeconds() / 5);
        double cap = maxWarmUpSeconds(t);
        long start = System.nanoTime();
        double previous = Double.NaN;
        boolean previousQuiet = false;
        while (true) {
            long jit0 = jitVisible ? jit.getTotalCompilationTime() : 0;
            long c0 = System.nanoTime();
            long steps = 0;
            do {
                sim.step();
                steps++;
            } while ((System.nanoTime() - c0) * 1e-9 < chunk);
            double chunkSeconds = (System.nanoTime() - c0) * 1e-9;
            double stepSeconds = chunkSeconds / steps;
            boolean quiet = !jitVisible
                    || (jit.getTotalCompilationTime() - jit0) * 1e-3 <= JIT_QUIET_FRACTION * chunkSeconds;
            double elapsed = (System.nanoTime() - start) * 1e-9;
            boolean settled = quiet && previousQuiet
                    && Math.abs(stepSeconds - previous) <= SETTLED_TOLERANCE * Math.max(stepSeconds, previous);
            if (elapsed >= t.warmUpSeconds() && settled || elapsed >= cap) {
                return new WarmUp((System.nanoTime() - start) * 1e-9, settled, stepSeconds);
            }
            previous = stepSeconds;
            previousQuiet = quiet;
        }
    }
}
