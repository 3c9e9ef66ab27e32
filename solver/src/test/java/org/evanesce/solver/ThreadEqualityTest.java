package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Threaded runs must equal the single-threaded run bit for bit (common practice: awkward sizes, 1, 2 and
 * 3 threads, threading threshold lowered), with every boundary kind, losses and sources present.
 */
class ThreadEqualityTest {

    private static final int NX = 121;
    private static final int NY = 37;

    @ParameterizedTest(name = "{0} {1}")
    @CsvSource({"S, FLOAT", "P, FLOAT", "S, DOUBLE", "P, DOUBLE"})
    void threadedRunsEqualTheSingleThreadedRun(Polarization pol, Precision precision) {
        double[][] one = run(pol, precision, 1);
        for (int threads : new int[] {2, 3}) {
            double[][] many = run(pol, precision, threads);
            Component[] comps = pol.components();
            for (int c = 0; c < 3; c++) {
                for (int k = 0; k < one[c].length; k++) {
                    if (Double.doubleToRawLongBits(one[c][k]) != Double.doubleToRawLongBits(many[c][k])) {
                        assertEquals(one[c][k], many[c][k], 0.0, String.format(
                                "%s %s grid %d×%d, %d threads vs 1: %s differs at cell (%d, %d) after 300 steps",
                                pol, precision, NX, NY, threads, comps[c], k % NX, k / NX));
                    }
                }
            }
        }
    }

    /** Bloch-periodic sides couple the real and imaginary parts at the seam; the bands must not change that. */
    @ParameterizedTest(name = "Bloch {0} {1}")
    @CsvSource({"S, FLOAT", "P, DOUBLE"})
    void threadedBlochRunsEqualTheSingleThreadedRun(Polarization pol, Precision precision) {
        double[][] one = runBloch(pol, precision, 1);
        for (int threads : new int[] {2, 3}) {
            double[][] many = runBloch(pol, precision, threads);
            for (int q = 0; q < one.length; q++) {
                for (int k = 0; k < one[q].length; k++) {
                    if (Double.doubleToRawLongBits(one[q][k]) != Double.doubleToRawLongBits(many[q][k])) {
                        assertEquals(one[q][k], many[q][k], 0.0, String.format(
                                "Bloch %s %s grid %d×%d, %d threads vs 1: array %d differs at cell (%d, %d) after 300 steps",
                                pol, precision, NX, NY, threads, q, k % NX, k / NX));
                    }
                }
            }
        }
    }

    private static double[][] runBloch(Polarization pol, Precision precision, int threads) {
        MaterialGrid grid = MaterialGrid.builder(NX, NY, 40e-9, Material.VACUUM)
                .paint(CellRegion.below(12.5), new Material("glass", 2.25, 0.0))
                .paint(CellRegion.box(70, 15, 90, 25), new Material("lossy", 3.0, 2e5))
                .build();
        double f = PhysicalConstants.C0 / (20 * 40e-9);
        double kx = 0.3 / 40e-9;
        Component[] c = pol.components();
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(precision)
                .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                .boundary(Side.BOTTOM, Boundary.pml(6)).boundary(Side.TOP, Boundary.pmc())
                .threads(threads).minCellsPerThread(1)
                .source(Source.blochRow(c[0], NX, 20, 0.0, 40e-9, kx, TimeSignal.gaussianPulse(f, f / 3)))
                .source(Source.point(c[1], NX, 100, 28, 0.3, TimeSignal.differentiatedGaussian(0.3 / f)));
        try (Simulation s = b.build()) {
            s.run(300);
            double[][] out = new double[6][NX * NY];
            for (int q = 0; q < 3; q++) {
                for (int j = 0; j < NY; j++) {
                    for (int i = 0; i < NX; i++) {
                        out[q][j * NX + i] = s.field(c[q], i, j);
                        out[3 + q][j * NX + i] = s.fieldImag(c[q], i, j);
                    }
                }
            }
            return out;
        }
    }

    private static double[][] run(Polarization pol, Precision precision, int threads) {
        MaterialGrid grid = MaterialGrid.builder(NX, NY, 40e-9, Material.VACUUM)
                .paint(CellRegion.below(12.5), new Material("glass", 2.25, 0.0))
                .paint(CellRegion.box(70, 15, 90, 25), new Material("lossy", 3.0, 2e5))
                .build();
        double f = PhysicalConstants.C0 / (20 * 40e-9);
        Component[] c = pol.components();
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(precision)
                .boundary(Side.LEFT, Boundary.pml(10)).boundary(Side.RIGHT, Boundary.pmc())
                .boundary(Side.BOTTOM, Boundary.pml(6)).boundary(Side.TOP, Boundary.pec())
                .threads(threads).minCellsPerThread(1)
                .source(Source.point(c[0], NX, 30, 18, 1.0, TimeSignal.gaussianPulse(f, f / 3)))
                .source(Source.rowLine(c[1], NX, 40, 60, 24, 0.5, TimeSignal.rampedContinuous(f, 20 / f)))
                .source(Source.columnLine(c[2], NX, 100, 10, 30, 0.3, TimeSignal.differentiatedGaussian(0.3 / f)));
        try (Simulation s = b.build()) {
            assertEquals(threads, s.threads(), "threads actually used");
            s.run(300);
            double[][] out = new double[3][NX * NY];
            for (int q = 0; q < 3; q++) {
                for (int j = 0; j < NY; j++) {
                    for (int i = 0; i < NX; i++) {
                        out[q][j * NX + i] = s.field(c[q], i, j);
                    }
                }
            }
            return out;
        }
    }
}
