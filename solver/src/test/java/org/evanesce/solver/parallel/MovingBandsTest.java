package org.evanesce.solver.parallel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumMap;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.MaterialCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.kernel.Engine;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Balancing moves the band boundaries during a run, and on a busy machine the team steps on fewer
 * threads for a while; the fields must still equal the single-band run's bit for bit (every row
 * is updated by the same code whichever band and thread hold it). Here the team balances after
 * every step and the workers are slowed by a varying amount, so the boundaries move often and
 * far; in the second variant the number of stepping threads also changes every few steps.
 */
class MovingBandsTest {

    private static final int NX = 61;
    private static final int NY = 47;
    private static final int STEPS = 240;

    @ParameterizedTest(name = "{0} {1}, {2} threads, resized {3}")
    @CsvSource({"S, FLOAT, 2, false", "P, FLOAT, 3, false", "S, DOUBLE, 3, false", "P, DOUBLE, 2, false",
        "S, FLOAT, 3, true", "P, DOUBLE, 2, true"})
    void movingBandsGiveTheSingleBandBits(Polarization pol, Precision precision, int threads, boolean resized) {
        Set<Integer> starts = new HashSet<>();
        Set<Integer> sizes = new HashSet<>();
        double[][] one = run(pol, precision, 1, false, starts, sizes);
        starts.clear();
        sizes.clear();
        double[][] many = run(pol, precision, threads, resized, starts, sizes);
        assertTrue(starts.size() >= 4, "the boundary of band 1 should have moved several times: " + starts);
        assertEquals(resized ? threads : 1, sizes.size(), "numbers of stepping threads met: " + sizes);
        for (int q = 0; q < 3; q++) {
            for (int k = 0; k < NX * NY; k++) {
                int c = q;
                int cell = k;
                assertEquals(Double.doubleToRawLongBits(one[q][k]), Double.doubleToRawLongBits(many[q][k]),
                        () -> String.format("%s %s, %d moving bands: %s differs at (%d, %d)", pol, precision, threads,
                                pol.components()[c], cell % NX, cell / NX));
            }
        }
    }

    private static double[][] run(Polarization pol, Precision precision, int threads, boolean resized, Set<Integer> starts,
            Set<Integer> sizes) {
        MaterialGrid grid = MaterialGrid.builder(NX, NY, 40e-9, Material.VACUUM)
                .paint(CellRegion.below(18.5), Material.ofIndex("glass", 1.5))
                .paint(CellRegion.box(35, 25, 70, 60), new Material("lossy", 2.0, 4e5))
                .build();
        Map<Side, Boundary> sides = new EnumMap<>(Side.class);
        for (Side s : Side.values()) {
            sides.put(s, Boundary.pml(8));
        }
        double[][] coefficients = MaterialCoefficients.of(grid.materials(), 0.6, Courant.timeStep(0.6, 40e-9));
        Engine e = Engine.create(grid, pol, precision, 0.6, coefficients[0], coefficients[1], null, sides);
        Component[] comps = pol.components();
        e.setSources(new int[] {(NY / 2) * NX + NX / 3}, new Component[] {comps[pol == Polarization.S ? 0 : 1]});
        Thread caller = Thread.currentThread();
        int[] step = {0};
        try (BandTeam team = new BandTeam(NY, threads, "moving-bands-test", 0, System::nanoTime, false)) {
            for (int n = 0; n < STEPS; n++) {
                step[0] = n;
                if (resized) {
                    // every stepping size from the whole team down to one thread, a few steps each
                    team.forceThreads(threads - (n / 7) % threads);
                }
                e.sourceValue(0, Math.sin(0.3 * n) * Math.exp(-Math.pow((n - 40) / 15.0, 2)));
                boolean flush = n % 16 == 15;
                team.step((j0, j1, p) -> {
                    double m = e.sweep(j0, j1, p, flush);
                    if (Thread.currentThread() != caller) {
                        // a worker slowed by 0-3 µs per row, changing every 20 steps
                        long until = System.nanoTime() + (j1 - j0) * 1_000L * ((step[0] / 20) % 4);
                        while (System.nanoTime() < until) {
                            Thread.onSpinWait();
                        }
                    }
                    return m;
                });
                if (team.activeThreads() > 1) {
                    starts.add(team.bandStart(1));
                }
                sizes.add(team.activeThreads());
            }
        }
        double[][] out = new double[3][NX * NY];
        for (int q = 0; q < 3; q++) {
            for (int k = 0; k < NX * NY; k++) {
                out[q][k] = e.get(comps[q], k);
            }
        }
        return out;
    }
}
