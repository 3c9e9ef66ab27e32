package org.evanesce.io.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.api.Test;

/**
 * The key hashes each site's material ids as runs of equal ids: grids that differ in where a run starts or ends, or
 * only in how the same ids are ordered, must still get keys of their own (common practice for a cache key: equal keys
 * only for the same input). IncidentPowerCacheTest checks the keys of whole cases.
 */
class IncidentKeyTest {

    private static final Material GLASS = new Material("glass", 2.25, 0);

    private static String key(int nx, int ny, int i0, int i1, int j0, int j1) {
        MaterialGrid g = MaterialGrid.builder(nx, ny, 20e-9, Material.VACUUM)
                .paint((x, y) -> x >= i0 && x < i1 && y >= j0 && y < j1, GLASS).build();
        var setup = new IncidentKey.Setup(Polarization.S, Precision.FLOAT, 0.5,
                Map.of(Side.values()[0], Boundary.pml(4)), List.of(), List.of());
        return new IncidentKey(setup, g).hex();
    }

    @Test
    void runsOfIdsKeepEveryGridApart() {
        assertEquals(key(12, 5, 2, 5, 1, 3), key(12, 5, 2, 5, 1, 3), "the same grid, the same key");
        Set<String> keys = new HashSet<>();
        int[][] blocks = {
            {2, 5, 1, 3},   // the base block
            {2, 6, 1, 3},   // one run longer, the next shorter
            {3, 6, 1, 3},   // the same lengths, shifted
            {2, 5, 1, 4},   // one more run
            {0, 12, 1, 3},  // runs that join across rows
            {0, 12, 1, 2},
            {0, 0, 0, 0},   // homogeneous: one run
            {0, 12, 0, 5},  // homogeneous in the other material: one run of another id
        };
        for (int[] b : blocks) {
            String k = key(12, 5, b[0], b[1], b[2], b[3]);
            assertFalse(keys.contains(k), () -> "block " + java.util.Arrays.toString(b) + ": a key of its own");
            keys.add(k);
        }
        assertFalse(keys.contains(key(20, 3, 0, 0, 0, 0)), "the same count of cells in another shape");
    }
}
