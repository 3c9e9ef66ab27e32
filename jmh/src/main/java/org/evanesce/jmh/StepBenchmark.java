package org.evanesce.jmh;

import java.util.concurrent.TimeUnit;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

/**
 * One {@link Simulation#step()} of a square vacuum grid with a 12-cell CPML on all sides and a
 * continuous point source at the centre (the same problem as {@code evanesce bench}).
 *
 * <p>Each benchmark method is one step of an N × N grid and declares N² operations, so the
 * reported score, in ns/op, is <b>nanoseconds per cell update</b> (wall time, all threads
 * together). Run with, e.g.:
 * <pre>
 * java -jar jmh/target/benchmarks.jar StepBenchmark
 * java -jar jmh/target/benchmarks.jar StepBenchmark.step1024 -p precision=FLOAT -p threads=1,4
 * </pre>
 * The forked JVMs get {@code --add-modules jdk.incubator.vector} from {@link Fork#jvmArgsAppend}.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 5, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(value = 1, jvmArgsAppend = {"--add-modules=jdk.incubator.vector", "-XX:+UseParallelGC"})
public class StepBenchmark {

    /** Cell size in metres: the 1 µm source wavelength spans 20 cells. */
    private static final double CELL_SIZE = 50e-9;
    private static final double WAVELENGTH = 1e-6;

    /** A planned run; the grid size comes from the subclass so it matches the method's operation count. */
    @State(Scope.Thread)
    public abstract static class Grid {
        @Param({"FLOAT", "DOUBLE"})
        public Precision precision;

        @Param({"S", "P"})
        public Polarization polarization;

        /** Requested threads; the solver keeps small grids on fewer (it reports how many in Simulation.threads()). */
        @Param({"1"})
        public int threads;

        private final int size;
        Simulation sim;

        Grid(int size) {
            this.size = size;
        }

        @Setup(Level.Trial)
        public void plan() {
            MaterialGrid grid = MaterialGrid.builder(size, size, CELL_SIZE, Material.VACUUM).build();
            double f = PhysicalConstants.C0 / WAVELENGTH;
            Component driven = polarization == Polarization.S ? Component.EZ : Component.HZ;
            sim = Simulation.builder(grid)
                    .polarization(polarization)
                    .precision(precision)
                    .boundaries(Boundary.pml(12))
                    .threads(threads)
                    .source(Source.point(driven, size, size / 2, size / 2, 1.0, TimeSignal.rampedContinuous(f, 5 / f)))
                    .build();
        }

        @TearDown(Level.Trial)
        public void close() {
            sim.close();
        }
    }

    /** A 256 × 256 grid (fits in the core's cache on most machines). */
    @State(Scope.Thread)
    public static class Grid256 extends Grid {
        public Grid256() {
            super(256);
        }
    }

    /** A 1024 × 1024 grid (larger than most L2 caches). */
    @State(Scope.Thread)
    public static class Grid1024 extends Grid {
        public Grid1024() {
            super(1024);
        }
    }

    @Benchmark
    @OperationsPerInvocation(256 * 256)
    public void step256(Grid256 g) {
        g.sim.step();
    }

    @Benchmark
    @OperationsPerInvocation(1024 * 1024)
    public void step1024(Grid1024 g) {
        g.sim.step();
    }
}
