package org.evanesce.geometry;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.geometry.shape.Rectangle;
import org.junit.jupiter.api.Test;

/**
 * Perfect conductors on the grid: σ = +∞, never averaged into the cells their faces cut (a staircase, common
 * practice for a conductor without a conformal update), while the other faces of the same scene are still smoothed.
 */
class PerfectConductorRasterTest {

    private static final double D = 20e-9;
    private static final Material PEC = Material.perfectConductor("pec");
    private static final Material GLASS = new Material("glass", 2.25, 0.0);

    @Test
    void aPerfectConductorIsTheLimitOfInfiniteConductivity() {
        assertTrue(PEC.isPerfectConductor());
        assertEquals(Double.POSITIVE_INFINITY, PEC.conductivity());
        assertFalse(new Material("good", 1, 1e9).isPerfectConductor());
        assertThrows(IllegalArgumentException.class, () -> new Material("x", 1, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> new Material("x", 1, Double.NEGATIVE_INFINITY));
    }

    @Test
    void aConductingDiskIsAStaircaseWhileAGlassDiskBesideItIsSmoothed() {
        Scene scene = Scene.builder(Material.VACUUM)
                .add(Ellipse.disk(10.23 * D, 10.41 * D, 6.3 * D), PEC)
                .add(Ellipse.disk(30.17 * D, 10.29 * D, 6.3 * D), GLASS)
                .build();
        GridSpec grid = new GridSpec(0, 0, D, 42, 21);
        MaterialGrid smooth = Rasterizer.rasterize(scene, grid, Smoothing.ANISOTROPIC);
        MaterialGrid stair = Rasterizer.rasterize(scene, grid, Smoothing.NONE);
        int conductorSites = 0;
        int smoothedSites = 0;
        for (FieldSite s : FieldSite.values()) {
            for (int j = 0; j < 21; j++) {
                for (int i = 0; i < 42; i++) {
                    Material m = smooth.material(s, i, j);
                    if (i < 20) {
                        assertEquals(stair.material(s, i, j), m, s + " (" + i + ", " + j + "): the point-sampled material");
                        conductorSites += m.isPerfectConductor() ? 1 : 0;
                    } else if (m != GLASS && m != Material.VACUUM) {
                        smoothedSites++;
                        assertFalse(m.isPerfectConductor(), s + " (" + i + ", " + j + ")");
                    }
                }
            }
        }
        // π (6.3)² ≈ 125 sites of each kind inside the disk
        assertTrue(conductorSites > 3 * 110 && conductorSites < 3 * 140, "conductor sites: " + conductorSites);
        assertTrue(smoothedSites > 3 * 20, "the glass disk's cut sites are still smoothed: " + smoothedSites);
    }

    @Test
    void aConductorOverGlassKeepsThePointSampledMaterialWhereBothMeet() {
        // a conducting block over half of a glass block: the pixels its faces cut are point-sampled
        Scene scene = Scene.builder(Material.VACUUM)
                .add(Rectangle.ofCorners(2.3 * D, 2.3 * D, 15.6 * D, 15.6 * D), GLASS)
                .add(Rectangle.ofCorners(8.45 * D, 0, 20 * D, 20 * D), PEC)
                .build();
        GridSpec grid = new GridSpec(0, 0, D, 20, 20);
        MaterialGrid smooth = Rasterizer.rasterize(scene, grid, Smoothing.ANISOTROPIC);
        MaterialGrid stair = Rasterizer.rasterize(scene, grid, Smoothing.NONE);
        for (FieldSite s : FieldSite.values()) {
            for (int j = 0; j < 20; j++) {
                for (int i = 8; i < 10; i++) {
                    assertEquals(stair.material(s, i, j), smooth.material(s, i, j), s + " (" + i + ", " + j + ")");
                }
            }
        }
    }
}
