package org.evanesce.solver.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The field arrays' lengths put arrays allocated back to back {@link Engine#ARRAY_STAGGER_BYTES}
 * apart modulo 4 KiB (the page size whose low address bits the processor compares when it checks
 * a load against earlier stores; common practice), whatever the grid size, in float and double.
 */
class StaggeredLengthTest {

    @Test
    void successiveArraysStartTheChosenDistanceApart() {
        for (int bytes : new int[] {Float.BYTES, Double.BYTES}) {
            for (int n : new int[] {1, 37 * 121, 1000 * 1000, 1024 * 1024, 4096 * 4096, 4097 * 4095}) {
                int len = Engine.staggeredLength(n, bytes);
                assertTrue(len >= n && len < n + 4096 / bytes, n + " values -> " + len);
                long span = (long) len * bytes + 16;
                assertEquals(Engine.ARRAY_STAGGER_BYTES, Math.floorMod(span, 4096L), n + " values of " + bytes + " bytes");
            }
        }
    }

    @Test
    void theLengthsStayWithinJavaArrayLimits() {
        int n = 46340 * 46340;
        assertTrue(Engine.staggeredLength(n, Float.BYTES) >= n);
        assertTrue(Engine.staggeredLength(n, Float.BYTES) <= Integer.MAX_VALUE - 8);
    }
}
