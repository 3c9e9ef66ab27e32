package org.evanesce.solver.record;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Recorders that the worker threads share ({@link SharedRecorder}: field maps, flux lines, flux boxes) give
 * bit for bit what they give when the run's thread alone calls them after each step, for 1, 2 and 3 threads
 * on an awkward grid (121 × 37, threading threshold lowered; common practice, STYLE.md item 5), with real and
 * with complex (Bloch-periodic) fields, and for any split of their units among workers; a single-precision map
 * that holds steps before adding them gives the bits of one that adds each step at once.
 */
class SharedRecorderThreadsTest {

    private static final int NX = 121;
    private static final int NY = 37;
    private static final double CELL = 40e-9;
    private static final double F = PhysicalConstants.C0 / (20 * CELL);

    @ParameterizedTest(name = "{0}, Bloch sides {1}")
    @CsvSource({"S, false", "P, false", "S, true", "P, true"})
    void sharedRecordersEqualTheSerialOnesForAnyThreadCount(Polarization pol, boolean bloch) {
        List<double[]> serial = run(pol, bloch, 1, false);
        for (int threads : new int[] {1, 2, 3}) {
            List<double[]> shared = run(pol, bloch, threads, true);
            assertSameBits(serial, shared, String.format("%s, Bloch %s, grid %d×%d, %d threads shared vs serial", pol, bloch,
                    NX, NY, threads));
        }
    }

    /**
     * The split is the simulation's business; any split of the units over any worker numbers must do. The split
     * recorders also hold single-precision steps ({@link FieldMap#HELD_STEPS}) while the plain ones, told the
     * fields are double, add every step at once; results are read part-way through a batch and the run goes on.
     */
    @ParameterizedTest(name = "Bloch sides {0}")
    @ValueSource(booleans = {false, true})
    void anySplitOfTheUnitsGivesTheSameBits(boolean bloch) {
        Random random = new Random(18);
        MaterialGrid grid = grid();
        List<SharedRecorder> plain = recorders(Polarization.S);
        List<SharedRecorder> split = recorders(Polarization.S);
        try (Simulation s = builder(grid, Polarization.S, bloch, 1).build()) {
            assertTrue(s.singlePrecision(), "the builder's default precision is single, so the map holds steps");
            StepView unheld = new Unheld(s);
            for (int part : new int[] {203, 100}) {
                for (int n = 0; n < part; n++) {
                    s.step();
                    for (SharedRecorder r : plain) {
                        r.afterStep(unheld);
                    }
                    for (SharedRecorder r : split) {
                        if (r.prepare(s, 4)) {
                            int u = 0;
                            while (u < r.units()) {
                                int next = Math.min(r.units(), u + 1 + random.nextInt(Math.max(1, r.units() / 3)));
                                r.share(s, u, next, random.nextInt(4));
                                u = next;
                            }
                        }
                    }
                }
                assertSameBits(results(plain), results(split), "Bloch " + bloch + ": random splits over 4 workers, steps held, vs one call per step, "
                        + s.stepCount() + " steps");
            }
        }
    }

    /** A view that says the fields are double, so that a map adds every step at once. */
    private record Unheld(StepView v) implements StepView {
        @Override
        public long stepCount() {
            return v.stepCount();
        }

        @Override
        public double dt() {
            return v.dt();
        }

        @Override
        public int nx() {
            return v.nx();
        }

        @Override
        public int ny() {
            return v.ny();
        }

        @Override
        public double cellSize() {
            return v.cellSize();
        }

        @Override
        public void readRow(Component c, int j, int i0, int i1, double[] re, double[] im) {
            v.readRow(c, j, i0, i1, re, im);
        }

        @Override
        public boolean complexFields() {
            return v.complexFields();
        }

        @Override
        public double field(Component c, int i, int j) {
            return v.field(c, i, j);
        }

        @Override
        public double fieldImag(Component c, int i, int j) {
            return v.fieldImag(c, i, j);
        }

        @Override
        public double energy(int i0, int j0, int i1, int j1) {
            return v.energy(i0, j0, i1, j1);
        }
    }

    private static void assertSameBits(List<double[]> expected, List<double[]> actual, String what) {
        assertEquals(expected.size(), actual.size(), what + ": number of result arrays");
        for (int a = 0; a < expected.size(); a++) {
            double[] x = expected.get(a);
            double[] y = actual.get(a);
            boolean nonZero = false;
            for (int k = 0; k < x.length; k++) {
                nonZero |= x[k] != 0;
                if (Double.doubleToRawLongBits(x[k]) != Double.doubleToRawLongBits(y[k])) {
                    assertEquals(x[k], y[k], 0.0, String.format("%s: result array %d differs at value %d", what, a, k));
                }
            }
            assertTrue(nonZero, what + ": result array " + a + " is all zero, the check would prove nothing");
        }
    }

    private static MaterialGrid grid() {
        return MaterialGrid.builder(NX, NY, CELL, Material.VACUUM)
                .paint(CellRegion.below(12.5), new Material("glass", 2.25, 0.0))
                .paint(CellRegion.box(70, 15, 90, 25), new Material("lossy", 3.0, 2e5))
                .build();
    }

    private static Simulation.Builder builder(MaterialGrid grid, Polarization pol, boolean bloch, int threads) {
        Component[] c = pol.components();
        double kx = 0.3 / CELL;
        Simulation.Builder b = Simulation.builder(grid).polarization(pol)
                .boundary(Side.BOTTOM, Boundary.pml(6)).boundary(Side.TOP, Boundary.pml(5))
                .threads(threads).minCellsPerThread(1)
                .source(Source.point(c[0], NX, 30, 18, 1.0, TimeSignal.gaussianPulse(F, F / 3)));
        if (bloch) {
            b.boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                    .source(Source.blochRow(c[0], NX, 8, 0.0, CELL, kx, TimeSignal.gaussianPulse(F, F / 3)));
        } else {
            b.boundary(Side.LEFT, Boundary.pml(10)).boundary(Side.RIGHT, Boundary.pmc());
        }
        return b;
    }

    /** A map over part of the grid, a horizontal and a vertical line and a box, at three frequencies; the line's window cuts the run. */
    private static List<SharedRecorder> recorders(Polarization pol) {
        double[] f = {0.8 * F, F, 1.2 * F};
        List<SharedRecorder> r = new ArrayList<>();
        r.add(new FieldMap(pol, 7, 3, 113, 31, f));
        r.add(new FluxLine(pol, 20, 3, 118, f).window(40 / F * 0.05, 1.0));
        r.add(FluxLine.vertical(pol, 60, 2, 35, f));
        r.add(new FluxBox(pol, 20, 9, 100, 30, f));
        return r;
    }

    private static List<double[]> run(Polarization pol, boolean bloch, int threads, boolean shared) {
        List<SharedRecorder> recorders = recorders(pol);
        Simulation.Builder b = builder(grid(), pol, bloch, threads);
        for (SharedRecorder r : recorders) {
            // wrapped in a plain listener, a recorder runs on the run's thread after the step
            b.listener(shared ? r : v -> r.afterStep(v));
        }
        try (Simulation s = b.build()) {
            assertEquals(threads, s.threads(), "threads of the team");
            s.run(300);
        }
        return results(recorders);
    }

    private static List<double[]> results(List<SharedRecorder> recorders) {
        List<double[]> out = new ArrayList<>();
        for (SharedRecorder r : recorders) {
            if (r instanceof FieldMap m) {
                for (Component c : m.components()) {
                    for (int q = 0; q < m.frequencyCount(); q++) {
                        double[][] t = m.transform(c, q);
                        out.add(t[0]);
                        out.add(t[1]);
                    }
                }
            }
            FluxLine[] lines = r instanceof FluxBox box ? box.sides() : new FluxLine[] {(FluxLine) (r instanceof FluxLine l ? l : null)};
            for (FluxLine l : lines) {
                if (l == null) {
                    continue;
                }
                for (int q = 0; q < l.frequencyCount(); q++) {
                    out.add(l.electricTransform(q)[0]);
                    out.add(l.electricTransform(q)[1]);
                    out.add(l.magneticTransform(q)[0]);
                    out.add(l.magneticTransform(q)[1]);
                }
            }
        }
        return out;
    }
}
