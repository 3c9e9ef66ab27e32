package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Decaying fields pass through the subnormal range, where arithmetic is many times slower on
 * x86 (common practice: flush values far below any physical level to zero). In float, a field
 * that decays by loss or by leaving through a PML stalls at a rounding floor near 1e-8 of its
 * peak (the updates fall below the ulp of what is left), so the values that reach the subnormal
 * range are the residues: far ahead of a front, or left behind in a region the field has
 * deserted. Without the guard such a residue lingers there for the rest of the run. With it,
 * every value below 1e-30 is set to zero at the next flush (every 16 steps), so nothing lingers.
 */
class SubnormalGuardTest {

    private static final int N = 64;
    private static final int INTERVAL = 16;

    /** A quiet cavity holding only a residue far below any physical level (1e-36). */
    @ParameterizedTest
    @EnumSource(Polarization.class)
    void residueIsFlushedAndNeverLingersInTheSubnormalRange(Polarization pol) {
        long[] on = run(pol, INTERVAL, 1e-36);
        long[] off = run(pol, Integer.MAX_VALUE, 1e-36);
        assertEquals(0, on[0], pol + ": subnormal values after the first flush with the guard on");
        assertTrue(off[0] > on[1] / 10, pol + ": without the guard the residue must linger in the subnormal range: " + off[0]);
    }

    /** Returns {subnormal values counted after the first flush, values inspected}. */
    private static long[] run(Polarization pol, int flushInterval, double amplitude) {
        MaterialGrid g = MaterialGrid.builder(N, N, 50e-9, Material.VACUUM).build();
        Simulation.Builder b = Simulation.builder(g).polarization(pol).precision(Precision.FLOAT).flushInterval(flushInterval)
                .boundaries(Boundary.pec());
        Component c = pol.components()[0];
        long count = 0;
        long seen = 0;
        try (Simulation s = b.build()) {
            for (int j = 20; j < 44; j++) {
                for (int i = 20; i < 44; i++) {
                    s.setField(c, i, j, amplitude * Math.exp(-((i - 30) * (i - 30) + (j - 28) * (j - 28)) / 20.0));
                }
            }
            for (int step = 0; step < 2000; step++) {
                s.step();
                if (s.stepCount() < INTERVAL) {
                    continue;
                }
                for (Component q : pol.components()) {
                    for (int j = 0; j < N; j++) {
                        for (int i = 0; i < N; i++) {
                            double v = Math.abs(s.field(q, i, j));
                            seen++;
                            if (v > 0 && v < Float.MIN_NORMAL) {
                                count++;
                            }
                        }
                    }
                }
            }
        }
        return new long[] {count, seen};
    }
}
