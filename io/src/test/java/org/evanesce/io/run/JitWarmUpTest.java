package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.junit.jupiter.api.Test;

/**
 * The warm-up's grids take both ways of the kernels' loop branches, so that the run's kernels are not compiled anew
 * (a branch the JIT's profile never saw taken is compiled as a trap; common practice of HotSpot's optimising
 * compiler). Checked for every vector length the kernels may have (2 to 8 lanes: at most 256 bits, doubles or floats).
 */
class JitWarmUpTest {

    @Test
    void rowLoopsRunWithAndWithoutAScalarTail() {
        for (int vl : new int[] {2, 4, 8}) {
            // the row loops over nx − 1 (H of s, the p kernels) and nx − 2 (E of s, Ey of p) columns
            for (int less : new int[] {1, 2}) {
                int lanes = vl;
                int cut = less;
                assertTrue(Arrays.stream(JitWarmUp.widths()).anyMatch(n -> (n - cut) % lanes == 0),
                        "some warm-up grid has nx - " + less + " a multiple of " + vl + ": " + Arrays.toString(JitWarmUp.widths()));
                assertTrue(Arrays.stream(JitWarmUp.widths()).anyMatch(n -> (n - cut) % lanes != 0),
                        "some warm-up grid has a tail of nx - " + less + " columns at " + vl + " lanes");
            }
        }
    }

    @Test
    void pmlStripLoopsTakeEachWay() {
        for (int vl : new int[] {2, 4, 8}) {
            boolean oneIn = false;
            boolean oneOut = false;
            // an x strip is widened to whole vectors (Layout.xStripWidth); its loops take two vectors of columns at a
            // time, then one where an odd number of vectors is left
            for (int p : JitWarmUp.pmlThicknesses()) {
                int vectors = (p + vl - 1) / vl;
                oneIn |= vectors % 2 == 1;
                oneOut |= vectors % 2 == 0;
            }
            assertTrue(oneIn && oneOut, vl + " lanes: the one-vector loop after the two-vector one, entered and not: "
                    + Arrays.toString(JitWarmUp.pmlThicknesses()));
        }
    }

    @Test
    void warmsUpEveryPolarizationAndPrecisionOnce() {
        for (Polarization pol : Polarization.values()) {
            for (Precision precision : Precision.values()) {
                JitWarmUp.run(pol, precision);
                int done = JitWarmUp.warmUps();
                JitWarmUp.run(pol, precision);
                assertEquals(done, JitWarmUp.warmUps(), pol + " " + precision + ": warmed up a second time");
            }
        }
    }
}
