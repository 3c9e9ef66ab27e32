package org.evanesce.geometry;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.geometry.shape.HalfPlane;
import org.evanesce.geometry.shape.Polygon;
import org.evanesce.geometry.shape.Rectangle;
import org.junit.jupiter.api.Test;

class RasterizerTest {

    private static final double D = 20e-9;
    /** Hand-computed values are given to six significant figures. */
    private static final double HAND = 1e-5;
    /** Exact geometry: only rounding. */
    private static final double EXACT = 1e-12;
    private static final Material GLASS = new Material("glass", 4.0, 0.0);
    private static final Material LOSSY = new Material("lossy", 2.0, 5e4);

    private static GridSpec grid(int nx, int ny) {
        return new GridSpec(0, 0, D, nx, ny);
    }

    @Test
    void laterShapesWinWithoutSmoothing() {
        Scene scene = Scene.builder(Material.VACUUM)
                .add(Rectangle.ofCorners(2 * D, 2 * D, 12 * D, 12 * D), GLASS)
                .add(Rectangle.ofCorners(8 * D, 8 * D, 18 * D, 18 * D), LOSSY)
                .build();
        MaterialGrid g = Rasterizer.rasterize(scene, grid(20, 20), Smoothing.NONE);
        assertEquals(GLASS, g.material(FieldSite.EZ, 5, 5));
        assertEquals(LOSSY, g.material(FieldSite.EZ, 10, 10), "the later rectangle covers the overlap");
        assertEquals(LOSSY, g.material(FieldSite.EZ, 15, 15));
        assertEquals(Material.VACUUM, g.material(FieldSite.EZ, 19, 5));
        Scene reversed = Scene.builder(Material.VACUUM)
                .add(Rectangle.ofCorners(8 * D, 8 * D, 18 * D, 18 * D), LOSSY)
                .add(Rectangle.ofCorners(2 * D, 2 * D, 12 * D, 12 * D), GLASS)
                .build();
        assertEquals(GLASS, Rasterizer.rasterize(reversed, grid(20, 20), Smoothing.NONE).material(FieldSite.EZ, 10, 10));
        assertEquals(GLASS, scene.materialAt(5 * D, 5 * D));
        assertEquals(LOSSY, scene.materialAt(10 * D, 10 * D));
    }

    @Test
    void pointSamplingUsesEachSitesOwnPosition() {
        // glass fills x ≤ 10.3 cells: Ez sites (x = i) up to i = 10, Ex sites (x = i + ½) up to i = 9
        Scene scene = Scene.builder(Material.VACUUM).add(new HalfPlane(10.3 * D, 0, 1, 0), GLASS).build();
        MaterialGrid g = Rasterizer.rasterize(scene, new GridSpec(0, -5 * D, D, 16, 8), Smoothing.NONE);
        for (int j = 0; j < 8; j++) {
            assertEquals(GLASS, g.material(FieldSite.EZ, 10, j));
            assertEquals(Material.VACUUM, g.material(FieldSite.EZ, 11, j));
            assertEquals(GLASS, g.material(FieldSite.EX, 9, j));
            assertEquals(Material.VACUUM, g.material(FieldSite.EX, 10, j));
            assertEquals(GLASS, g.material(FieldSite.EY, 10, j));
        }
        assertEquals(2, g.materials().size());
        assertEquals(-5 * D, g.y0(), 0);
    }

    /**
     * Anisotropic smoothing on a half-plane cut cell (A. Farjadpour et al., Opt. Lett. 31, 2972
     * (2006)): ε_eff = ⟨ε⟩ for a field tangential to the interface, 1/ε_eff = ⟨1/ε⟩ for the normal
     * one, and 1/ε_eff = (u·n)²⟨1/ε⟩ + (1 − (u·n)²)/⟨ε⟩ in between. Glass ε = 4 in vacuum.
     */
    @Test
    void smoothingFormulasOnAHalfPlaneCutCell() {
        // vertical interface x = 10.3 cells, glass on the left. Ez at node 10: pixel [9.5, 10.5], f = 0.8
        Scene scene = Scene.builder(Material.VACUUM).add(new HalfPlane(10.3 * D, 0, 1, 0), GLASS).build();
        MaterialGrid g = Rasterizer.rasterize(scene, new GridSpec(0, -5 * D, D, 16, 8), Smoothing.ANISOTROPIC);
        // Ez, tangential: 0.8·4 + 0.2·1 = 3.4
        assertEquals(3.4, g.material(FieldSite.EZ, 10, 3).relativePermittivity(), HAND);
        // Ey at (10, j + ½), tangential, same pixel in x: 3.4
        assertEquals(3.4, g.material(FieldSite.EY, 10, 3).relativePermittivity(), HAND);
        // Ex at (9.5, j): pixel [9, 10], fully glass; Ex at (10.5, j): pixel [10, 11], f = 0.3,
        // normal: 1/ε = 0.3/4 + 0.7/1 = 0.775, ε = 1.29032
        assertEquals(4.0, g.material(FieldSite.EX, 9, 3).relativePermittivity(), 0);
        assertEquals(1.29032, g.material(FieldSite.EX, 10, 3).relativePermittivity(), HAND);
        assertEquals(1.0, g.material(FieldSite.EZ, 11, 3).relativePermittivity(), 0);

        // interface at 45° through the Ez site (5, 0) at the origin shift: f = ½, n = (1, 1)/√2, (u·n)² = ½
        // ⟨ε⟩ = 2.5, ⟨1/ε⟩ = 0.625; Ez: 2.5; Ex, Ey: 1/ε = ½·0.625 + ½/2.5 = 0.5125, ε = 1.95122
        Scene diagonal = Scene.builder(Material.VACUUM).add(new HalfPlane(5 * D, 0, 1, 1), GLASS).build();
        MaterialGrid h = Rasterizer.rasterize(diagonal, new GridSpec(0, 0, D, 12, 12), Smoothing.ANISOTROPIC);
        assertEquals(2.5, h.material(FieldSite.EZ, 5, 0).relativePermittivity(), HAND);
        assertEquals(2.5, h.material(FieldSite.EZ, 3, 2).relativePermittivity(), HAND, "another node on the line");
        // Ex at (4.5, 0.5)? Ex sites are at (i + ½, j); (4.5, 0) has x + y = 4.5: pixel 7/8 glass,
        // ⟨ε⟩ = 7/8·4 + 1/8 = 3.625, ⟨1/ε⟩ = 7/32 + 1/8 = 0.34375,
        // 1/ε = ½·0.34375 + ½/3.625 = 0.309806, ε = 3.22782
        assertEquals(3.22782, h.material(FieldSite.EX, 4, 0).relativePermittivity(), HAND);
        assertEquals(3.22782, h.material(FieldSite.EY, 0, 4).relativePermittivity(), HAND, "Ey by symmetry");
    }

    @Test
    void conductivityIsTheFractionWeightedMean() {
        Scene scene = Scene.builder(Material.VACUUM).add(new HalfPlane(10.25 * D, 0, 1, 0), LOSSY).build();
        MaterialGrid g = Rasterizer.rasterize(scene, grid(16, 6), Smoothing.ANISOTROPIC);
        Material m = g.material(FieldSite.EZ, 10, 2); // f = 0.75
        assertEquals(0.75 * 5e4, m.conductivity(), 1e-9);
        assertEquals(0.75 * 2 + 0.25, m.relativePermittivity(), EXACT);
        assertTrue(m.name().contains("lossy") && m.name().contains("vacuum"), m.name());
    }

    /**
     * For Ez the smoothed ε is the arithmetic mean, so Σ (ε_eff − 1)/(ε − 1) over all Ez sites is
     * the area the shapes fill, in cells: every cut pixel must have been found and weighed exactly.
     */
    @Test
    void smoothedEzSitesAddUpToTheExactArea() {
        double r = 17.37 * D;
        Scene disk = Scene.builder(Material.VACUUM).add(Ellipse.disk(30.4 * D, 29.1 * D, r), GLASS).build();
        assertEquals(Math.PI * 17.37 * 17.37, filledCells(disk, 64), 1e-8, "disk of radius 17.37 cells");
        Rectangle rect = new Rectangle(31.1 * D, 30.2 * D, 37.3 * D, 11.9 * D, 0.37);
        Scene tilted = Scene.builder(Material.VACUUM).add(rect, GLASS).build();
        assertEquals(37.3 * 11.9, filledCells(tilted, 64), 1e-8, "rectangle at 0.37 rad");
        Polygon tri = Polygon.of(5.2 * D, 4.9 * D, 58.3 * D, 11.7 * D, 21.6 * D, 55.05 * D);
        Scene prism = Scene.builder(Material.VACUUM).add(tri, GLASS).build();
        assertEquals(tri.area() / (D * D), filledCells(prism, 64), 1e-8, "triangle");
        // two overlapping disks of the same glass: the union's area 2πr² − lens, with the lens
        // 2r² acos(s/2r) − (s/2)√(4r² − s²) for centres s apart (common practice); the few pixels where
        // both boundaries meet use subsamples, hence the looser tolerance
        double rr = 10.3;
        double s = 7.9;
        Scene pair = Scene.builder(Material.VACUUM).add(Ellipse.disk(25 * D, 30 * D, rr * D), GLASS)
                .add(Ellipse.disk((25 + s) * D, 30 * D, rr * D), GLASS).build();
        double lens = 2 * rr * rr * Math.acos(s / (2 * rr)) - 0.5 * s * Math.sqrt(4 * rr * rr - s * s);
        assertEquals(2 * Math.PI * rr * rr - lens, filledCells(pair, 64), 0.02, "union of two disks");
    }

    private static double filledCells(Scene scene, int n) {
        MaterialGrid g = Rasterizer.rasterize(scene, grid(n, n), Smoothing.ANISOTROPIC);
        double sum = 0;
        for (int j = 0; j < n; j++) {
            for (int i = 0; i < n; i++) {
                sum += (g.material(FieldSite.EZ, i, j).relativePermittivity() - 1) / 3;
            }
        }
        return sum;
    }

    /** Overlapping shapes of every kind, partly outside the grid, for the naive-reference checks. */
    private static Scene busyScene() {
        Material a = new Material("a", 2.0, 1e4);
        Material c = new Material("c", 3.0, 0);
        return Scene.builder(Material.VACUUM)
                .add(LayerStack.along(0, 30.3 * D, 0.2, List.of(new LayerStack.Layer(a, 4.4 * D),
                        new LayerStack.Layer(c, 0.6 * D), new LayerStack.Layer(GLASS, 6.1 * D))))
                .add(new HalfPlane(3.3 * D, 0, -1, 0.25), c)
                .add(new Rectangle(20.2 * D, 18.7 * D, 21.5 * D, 9.3 * D, 0.52), GLASS)
                .add(Polygon.of(-5 * D, 2 * D, 30.5 * D, 9.5 * D, 14.2 * D, 14.1 * D, 40.1 * D, 44.4 * D, 3.3 * D,
                        35.2 * D), a)
                .add(new Ellipse(33.3 * D, 30.1 * D, 11.2 * D, 5.4 * D, -0.4), c)
                .add(Ellipse.disk(24.1 * D, 25.6 * D, 0.3 * D), GLASS)
                .add(Ellipse.disk(60.0 * D, 10.5 * D, 30 * D), a)
                .build();
    }

    @Test
    void pointSamplingMatchesTheSceneAtEverySite() {
        Scene scene = busyScene();
        GridSpec spec = new GridSpec(-1.3 * D, 0.4 * D, D, 48, 44);
        MaterialGrid g = Rasterizer.rasterize(scene, spec, Smoothing.NONE);
        for (FieldSite site : FieldSite.values()) {
            for (int j = 0; j < spec.ny(); j++) {
                for (int i = 0; i < spec.nx(); i++) {
                    assertEquals(scene.materialAt(spec.siteX(site, i), spec.siteY(site, j)), g.material(site, i, j),
                            site + " at (" + i + ", " + j + ")");
                }
            }
        }
    }

    /**
     * The smoothed Ez permittivity (an arithmetic mean) against a naive reference: the mean of
     * ε over 32 × 32 point samples of the scene in each pixel. Sampling errs by up to about one
     * subsample row of the pixel per interface, (εmax − εmin)/32 each, and a pixel can hold two
     * interfaces; the largest difference measured is 0.021. A missed cut pixel or a wrong base
     * material would differ by up to εmax − εmin = 3.
     */
    @Test
    void smoothedEzMatchesSupersampledMeanEverywhere() {
        int n = 32;
        double tolerance = 2 * (4.0 - 1.0) / n;
        Scene scene = busyScene();
        GridSpec spec = new GridSpec(-1.3 * D, 0.4 * D, D, 48, 44);
        MaterialGrid g = Rasterizer.rasterize(scene, spec, Smoothing.ANISOTROPIC);
        double worst = 0;
        for (int j = 0; j < spec.ny(); j++) {
            for (int i = 0; i < spec.nx(); i++) {
                double sum = 0;
                for (int b = 0; b < n; b++) {
                    for (int a = 0; a < n; a++) {
                        double x = spec.x(i) + ((a + 0.5) / n - 0.5) * D;
                        double y = spec.y(j) + ((b + 0.5) / n - 0.5) * D;
                        sum += scene.materialAt(x, y).relativePermittivity();
                    }
                }
                double diff = Math.abs(g.material(FieldSite.EZ, i, j).relativePermittivity() - sum / (n * n));
                worst = Math.max(worst, diff);
                assertTrue(diff < tolerance, String.format("Ez at (%d, %d): smoothed %g, sampled %g", i, j,
                        g.material(FieldSite.EZ, i, j).relativePermittivity(), sum / (n * n)));
            }
        }
        assertTrue(worst > 0, "the scene has cut cells");
    }

    @Test
    void straightGridAlignedInterfacesShareOneSmoothedMaterial() {
        Scene scene = Scene.builder(Material.VACUUM)
                .add(Rectangle.ofCorners(10.3 * D, 5.6 * D, 200.8 * D, 190.1 * D), GLASS).build();
        MaterialGrid g = Rasterizer.rasterize(scene, grid(256, 256), Smoothing.ANISOTROPIC);
        // background, glass, and per site a handful of edge and corner mixes
        assertTrue(g.materials().size() < 40, "table size " + g.materials().size());
    }

    @Test
    void manyCutSitesOverflowTheSixteenBitTableAndStillResolve() {
        // 900 disks of radius 4.3 cells: about 100 distinct cut sites each over the three sites
        Scene.Builder b = Scene.builder(Material.VACUUM);
        for (int q = 0; q < 30; q++) {
            for (int p = 0; p < 30; p++) {
                b.add(Ellipse.disk((12 + 20 * p + 0.01 * q) * D, (12 + 20 * q + 0.013 * p) * D, 4.3 * D), GLASS);
            }
        }
        MaterialGrid g = Rasterizer.rasterize(b.build(), grid(610, 610), Smoothing.ANISOTROPIC);
        assertTrue(g.materials().size() > MaterialGrid.NARROW_LIMIT, "table size " + g.materials().size());
        assertEquals(GLASS, g.material(FieldSite.EZ, 12, 12));
        assertEquals(Material.VACUUM, g.material(FieldSite.EZ, 2, 2));
        int id = g.id(FieldSite.EX, 16, 12);
        assertTrue(id > 1, "a cut site has its own material");
        assertEquals(id, g.ids(FieldSite.EX)[12 * 610 + 16]);
        double e = g.material(FieldSite.EX, 16, 12).relativePermittivity();
        assertTrue(e > 1 && e < 4, "smoothed ε " + e);
    }

    @Test
    void layerStackExpandsIntoSlabsInOrder() {
        Material a = new Material("a", 2.0, 0);
        Material c = new Material("c", 3.0, 0);
        LayerStack stack = new LayerStack(4 * D, 0, 2, 0, List.of(new LayerStack.Layer(a, 3 * D),
                new LayerStack.Layer(GLASS, 2 * D), new LayerStack.Layer(c, Double.POSITIVE_INFINITY)));
        assertEquals(3, stack.entries().size());
        MaterialGrid g = Rasterizer.rasterize(Scene.builder(Material.VACUUM).add(stack).build(), grid(16, 4),
                Smoothing.NONE);
        assertEquals(Material.VACUUM, g.material(FieldSite.EZ, 3, 1));
        assertEquals(a, g.material(FieldSite.EZ, 5, 1));
        assertEquals(GLASS, g.material(FieldSite.EZ, 8, 1));
        assertEquals(c, g.material(FieldSite.EZ, 15, 1));
        // rotated a quarter turn about its start, the stack runs along +y
        LayerStack up = stack.rotated(Math.PI / 2, 4 * D, 0);
        Scene s = Scene.builder(Material.VACUUM).add(up).build();
        assertEquals(GLASS, s.materialAt(4 * D, 4.5 * D));
        // a semi-infinite first layer fills everything before the start
        LayerStack both = new LayerStack(0, 0, 1, 0, List.of(new LayerStack.Layer(a, Double.POSITIVE_INFINITY),
                new LayerStack.Layer(GLASS, 1e-6), new LayerStack.Layer(c, Double.POSITIVE_INFINITY)));
        Scene sb = Scene.builder(Material.VACUUM).add(both).build();
        assertSame(a, sb.materialAt(-1, 0));
        assertSame(GLASS, sb.materialAt(0.5e-6, 0));
        assertSame(c, sb.materialAt(1, 0));
    }

    @Test
    void argumentsAreValidated() {
        assertMessage(() -> new GridSpec(0, 0, -1e-9, 10, 10), "cell size", "-1.00000e-09", "> 0");
        assertMessage(() -> new GridSpec(0, 0, 1e-9, 2, 10), "2 × 10", "at least 3");
        assertMessage(() -> new LayerStack(0, 0, 0, 0, List.of(new LayerStack.Layer(GLASS, 1))), "direction",
                "non-zero");
        assertMessage(() -> new LayerStack(0, 0, 1, 0, List.of(new LayerStack.Layer(GLASS, 1),
                new LayerStack.Layer(GLASS, Double.POSITIVE_INFINITY), new LayerStack.Layer(GLASS, 1))),
                "layer 1", "infinite thickness");
        assertMessage(() -> new LayerStack.Layer(GLASS, -2e-9), "thickness -2.00000e-09 m", "> 0");
        assertMessage(() -> GridSpec.covering(0, 0, -1, 1, 1e-9), "maximum above its minimum");
    }

    @Test
    void coveringGridReachesTheFarCorner() {
        GridSpec g = GridSpec.covering(-1e-6, 0, 1e-6, 0.5e-6, 0.1e-6);
        assertEquals(21, g.nx());
        assertEquals(6, g.ny());
        assertEquals(1e-6, g.x(20), 1e-18);
    }

    private static void assertMessage(Runnable r, String... parts) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, r::run);
        for (String p : parts) {
            assertTrue(e.getMessage().contains(p), "message '" + e.getMessage() + "' lacks '" + p + "'");
        }
    }
}
