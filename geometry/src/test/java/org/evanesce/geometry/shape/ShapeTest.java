package org.evanesce.geometry.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class ShapeTest {

    /** Exact geometry leaves only rounding: fractions are sums of a few products of order 1. */
    private static final double EXACT = 1e-12;
    /** The ellipse's orientation tensor uses 4-point Gauss–Legendre quadrature on short arcs. */
    private static final double QUADRATURE = 1e-9;
    private static final double PIXEL = 1e-8;

    /**
     * Area of {(x, y) in [0, 1]² : a x + b y ≤ c} for a, b &gt; 0 by inclusion–exclusion,
     * F(c) = [c₊² − (c − a)₊² − (c − b)₊² + (c − a − b)₊²] / (2ab) (common practice: the
     * distribution function of a sum of two uniform variables). Independent of the clipping code.
     */
    private static double unitSquareBelowLine(double a, double b, double c) {
        return (sq(c) - sq(c - a) - sq(c - b) + sq(c - a - b)) / (2 * a * b);
    }

    private static double sq(double v) {
        return v > 0 ? v * v : 0;
    }

    @ParameterizedTest(name = "angle {0} degrees")
    @ValueSource(doubles = {10, 30, 45, 63.4, 80})
    void halfPlaneAtAnAngleCutsThePixelByTheAnalyticArea(double degrees) {
        double t = Math.toRadians(degrees);
        double nx = Math.cos(t);
        double ny = Math.sin(t);
        double cx = 3 * PIXEL;
        double cy = -2 * PIXEL;
        for (double offset : new double[] {-0.6, -0.3, -0.05, 0, 0.2, 0.45, 0.7}) {
            // the line n·(r − c) = offset·Δ, filled side n·(r − c) ≤ offset·Δ
            HalfPlane h = new HalfPlane(cx + offset * PIXEL * nx, cy + offset * PIXEL * ny, nx, ny);
            PixelCut cut = h.cut(cx, cy, PIXEL);
            // in pixel units with the corner at the origin: n·(u − ½(1,1)) ≤ offset
            double expected = unitSquareBelowLine(nx, ny, offset + 0.5 * (nx + ny));
            String ctx = String.format("half-plane at %g°, offset %g cells", degrees, offset);
            assertEquals(expected, cut.fraction(), EXACT, ctx);
            if (expected > 1e-9 && expected < 1 - 1e-9) {
                assertEquals(nx, cut.normalX(), EXACT, ctx);
                assertEquals(ny, cut.normalY(), EXACT, ctx);
                assertEquals(nx * nx, cut.alignment(1, 0), EXACT, ctx);
                assertEquals(ny * ny, cut.alignment(0, 1), EXACT, ctx);
                assertEquals(nx * ny, cut.txy(), EXACT, ctx);
            }
        }
    }

    @Test
    void halfPlaneFromALineKeepsItsLeftSide() {
        HalfPlane h = HalfPlane.leftOf(0, 0, 1, 1);
        assertTrue(h.contains(0, 1));
        assertFalse(h.contains(1, 0));
        assertEquals(Math.sqrt(0.5), h.normalX(), EXACT);
        assertEquals(-Math.sqrt(0.5), h.normalY(), EXACT);
    }

    /**
     * Disk ∩ square by direct integration of the chord, ∫ (clip(y_top) − clip(y_bottom)) dx with
     * composite Simpson on 20 000 intervals: an independent check of the exact formula (common practice).
     */
    private static double diskSquareArea(double r, double x0, double y0, double x1, double y1) {
        int n = 20000;
        double h = (x1 - x0) / n;
        double s = 0;
        for (int k = 0; k <= n; k++) {
            double x = x0 + k * h;
            double half = x * x < r * r ? Math.sqrt(r * r - x * x) : 0;
            double top = Math.min(y1, half);
            double bottom = Math.max(y0, -half);
            double v = Math.max(0, top - bottom);
            s += v * (k == 0 || k == n ? 1 : k % 2 == 1 ? 4 : 2);
        }
        return s * h / 3;
    }

    @Test
    void diskCutMatchesIntegratedChordAndPointsOutward() {
        double r = 7.3 * PIXEL;
        Ellipse disk = Ellipse.disk(0, 0, r);
        for (double phi : new double[] {0.1, 0.7, 1.3, 2.9, 4.4}) {
            double cx = (r + 0.17 * PIXEL) * Math.cos(phi);
            double cy = (r + 0.17 * PIXEL) * Math.sin(phi);
            PixelCut cut = disk.cut(cx, cy, PIXEL);
            double expected = diskSquareArea(r, cx - PIXEL / 2, cy - PIXEL / 2, cx + PIXEL / 2, cy + PIXEL / 2)
                    / (PIXEL * PIXEL);
            String ctx = String.format("disk r = 7.3 cells, pixel at polar angle %g", phi);
            // Simpson's rule converges slowly where the chord has a square-root edge; 1e-6 is ample
            assertEquals(expected, cut.fraction(), 1e-6, ctx);
            assertTrue(cut.fraction() > 0.05 && cut.fraction() < 0.95, ctx);
            // the mean normal of a short arc points along the radius through the arc's middle,
            // within the arc's angular half-width (about 1/(2·7.3) rad)
            double angle = Math.atan2(cut.normalY(), cut.normalX());
            double diff = Math.abs(Math.IEEEremainder(angle - phi, 2 * Math.PI));
            assertTrue(diff < 0.07, ctx + ": normal at " + angle);
        }
    }

    /** Sum of the fill fractions of all pixels of a grid covering the shape. */
    private static double pixelArea(Shape s, double x0, double y0, int n) {
        double sum = 0;
        for (int j = 0; j < n; j++) {
            for (int i = 0; i < n; i++) {
                sum += s.cut(x0 + (i + 0.5) * PIXEL, y0 + (j + 0.5) * PIXEL, PIXEL).fraction();
            }
        }
        return sum * PIXEL * PIXEL;
    }

    @Test
    void fractionsAddUpToTheAreaForEveryShape() {
        Ellipse disk = Ellipse.disk(0.31 * PIXEL, -0.22 * PIXEL, 9.4 * PIXEL);
        assertEquals(Math.PI * 9.4 * 9.4, pixelArea(disk, -12 * PIXEL, -12 * PIXEL, 24) / (PIXEL * PIXEL), 1e-9,
                "disk of radius 9.4 cells");
        Ellipse ell = new Ellipse(0.1 * PIXEL, 0.4 * PIXEL, 10.5 * PIXEL, 3.2 * PIXEL, 0.6);
        assertEquals(Math.PI * 10.5 * 3.2, pixelArea(ell, -12 * PIXEL, -12 * PIXEL, 24) / (PIXEL * PIXEL), 1e-9,
                "ellipse 10.5 × 3.2 cells at 0.6 rad");
        Rectangle rect = new Rectangle(0.3 * PIXEL, 0, 13.7 * PIXEL, 5.1 * PIXEL, 0.4);
        assertEquals(13.7 * 5.1, pixelArea(rect, -12 * PIXEL, -12 * PIXEL, 24) / (PIXEL * PIXEL), 1e-9,
                "rectangle 13.7 × 5.1 cells at 0.4 rad");
        Polygon ell2 = lShape(false);
        assertEquals(ell2.area() / (PIXEL * PIXEL), pixelArea(ell2, -12 * PIXEL, -12 * PIXEL, 24) / (PIXEL * PIXEL),
                1e-9, "L-shaped polygon");
    }

    /** An L-shaped (concave) hexagon, counter-clockwise or clockwise. */
    private static Polygon lShape(boolean clockwise) {
        double[] xy = {-8.3, -7.1, 6.6, -7.1, 6.6, -1.2, -1.4, -1.2, -1.4, 8.9, -8.3, 8.9};
        double[] xs = new double[6];
        double[] ys = new double[6];
        for (int k = 0; k < 6; k++) {
            int q = clockwise ? 5 - k : k;
            xs[k] = xy[2 * q] * PIXEL;
            ys[k] = xy[2 * q + 1] * PIXEL;
        }
        return new Polygon(xs, ys);
    }

    @ParameterizedTest(name = "clockwise {0}")
    @ValueSource(booleans = {false, true})
    void polygonInsideTestsAndOutwardNormalsDoNotDependOnOrientation(boolean clockwise) {
        Polygon p = lShape(clockwise);
        assertTrue(p.contains(-5 * PIXEL, 5 * PIXEL));
        assertTrue(p.contains(5 * PIXEL, -5 * PIXEL));
        assertFalse(p.contains(3 * PIXEL, 3 * PIXEL), "the notch of the L is outside");
        assertEquals((14.9 * 5.9 + 6.9 * 10.1) * PIXEL * PIXEL, p.area(), 1e-9 * PIXEL * PIXEL);
        // a pixel on the right edge x = 6.6 cells: 0.3 of it inside, normal +x
        PixelCut right = p.cut(6.4 * PIXEL, -4 * PIXEL, PIXEL);
        assertEquals(0.7, right.fraction(), EXACT);
        assertEquals(1, right.normalX(), EXACT);
        assertEquals(0, right.normalY(), EXACT);
        // a pixel at the concave corner (−1.4, −1.2): three quarters inside
        PixelCut corner = p.cut(-1.4 * PIXEL, -1.2 * PIXEL, PIXEL);
        assertEquals(0.75, corner.fraction(), EXACT);
        assertEquals(0.5, corner.alignment(1, 0), EXACT, "two equal edge pieces, one along x, one along y");
        assertEquals(Math.sqrt(0.5), corner.normalX(), EXACT, "mean outward normal at the notch corner");
        assertEquals(Math.sqrt(0.5), corner.normalY(), EXACT);
    }

    @Test
    void rotationTurnsShapesAboutThePivot() {
        Rectangle r = new Rectangle(0, 0, 4, 1, Math.toRadians(30));
        double c = Math.cos(Math.toRadians(30));
        double s = Math.sin(Math.toRadians(30));
        assertTrue(r.contains(1.9 * c, 1.9 * s), "along the rotated width");
        assertFalse(r.contains(1.9, 0), "outside once rotated");
        Rectangle quarter = new Rectangle(1, 2, 4, 1, 0).rotated(Math.PI / 2, 1, 2);
        assertTrue(quarter.contains(1, 3.9));
        assertFalse(quarter.contains(2.9, 2));
        Polygon tri = Polygon.of(0, 0, 2, 0, 0, 1).rotated(Math.PI, 0, 0);
        assertTrue(tri.contains(-1.5, -0.2));
        assertFalse(tri.contains(1.5, 0.2));
        Ellipse e = new Ellipse(0, 0, 3, 1, 0).rotated(Math.PI / 2, 0, 0);
        assertTrue(e.contains(0, 2.9));
        assertFalse(e.contains(2.9, 0));
        HalfPlane h = new HalfPlane(1, 0, 1, 0).rotated(Math.PI / 2, 0, 0);
        assertTrue(h.contains(5, 0.9));
        assertFalse(h.contains(0, 1.1));
        Slab slab = new Slab(0, 0, 1, 0, 1).rotated(Math.PI / 2, 0, 0);
        assertTrue(slab.contains(7, 0.5));
        assertFalse(slab.contains(0.5, -0.5));
        assertEquals(r.bounds().xMax(), 2 * c + 0.5 * s, 1e-12);
    }

    @Test
    void spansAgreeWithInsideTests() {
        List<Shape> shapes = new ArrayList<>();
        shapes.add(lShape(true));
        shapes.add(new Ellipse(0.3, -0.1, 5, 2, 0.8));
        shapes.add(new Rectangle(0, 0, 7, 3, -0.3));
        shapes.add(new HalfPlane(0.2, 0.1, 0.6, -0.8));
        shapes.add(new Slab(-1, 0, 1, 2, 1.5));
        Random rnd = new Random(7);
        for (Shape s : shapes) {
            double scale = s instanceof Polygon ? PIXEL : 1;
            for (int trial = 0; trial < 200; trial++) {
                double y = (rnd.nextDouble() * 20 - 10) * scale;
                double x = (rnd.nextDouble() * 20 - 10) * scale;
                boolean[] inSpan = {false};
                s.spans(y, (a, b) -> inSpan[0] |= x >= a && x <= b);
                assertEquals(s.contains(x, y), inSpan[0], s + " at (" + x + ", " + y + ")");
            }
        }
    }

    @Test
    void boundaryTraceComesNearEveryCutPixel() {
        List<Shape> shapes = List.of(lShape(false), new Ellipse(0.3 * PIXEL, 0, 6.2 * PIXEL, 2.7 * PIXEL, 0.5),
                new HalfPlane(0, 0, 1, 2), Ellipse.disk(0.4 * PIXEL, 0.3 * PIXEL, 0.35 * PIXEL));
        Bounds window = new Bounds(-11 * PIXEL, -11 * PIXEL, 11 * PIXEL, 11 * PIXEL);
        for (Shape s : shapes) {
            List<double[]> segs = new ArrayList<>();
            s.traceBoundary(window, PIXEL, (x1, y1, x2, y2, m) -> {
                assertTrue(Math.hypot(x2 - x1, y2 - y1) <= PIXEL * (1 + 1e-12), "segment longer than asked");
                segs.add(new double[] {x1, y1, x2, y2, m});
            });
            for (int j = -10; j < 10; j++) {
                for (int i = -10; i < 10; i++) {
                    double cx = (i + 0.5) * PIXEL;
                    double cy = (j + 0.5) * PIXEL;
                    double f = s.cut(cx, cy, PIXEL).fraction();
                    if (f > 1e-12 && f < 1 - 1e-12) {
                        boolean near = false;
                        for (double[] g : segs) {
                            near |= Math.min(g[0], g[2]) - g[4] <= cx + PIXEL / 2
                                    && Math.max(g[0], g[2]) + g[4] >= cx - PIXEL / 2
                                    && Math.min(g[1], g[3]) - g[4] <= cy + PIXEL / 2
                                    && Math.max(g[1], g[3]) + g[4] >= cy - PIXEL / 2;
                        }
                        assertTrue(near, s + ": cut pixel (" + i + ", " + j + ") not reached by the trace");
                    }
                }
            }
        }
    }

    @Test
    void aThinStripAcrossAPixelKeepsItsOrientation() {
        // a strip 0.2 cells thick through the pixel along x: its faces' normals cancel in the mean
        // but the orientation tensor still says the interface normal is ±y
        Slab s = new Slab(0, -0.1 * PIXEL, 0, 1, 0.2 * PIXEL);
        PixelCut cut = s.cut(0, 0, PIXEL);
        assertEquals(0.2, cut.fraction(), EXACT);
        assertEquals(0, cut.normalX(), EXACT);
        assertEquals(0, cut.normalY(), EXACT);
        assertEquals(1, cut.alignment(0, 1), EXACT);
        assertEquals(2 * PIXEL, cut.boundaryLength(), EXACT * PIXEL);
    }

    @Test
    void ellipseTensorIsRadialOnATinyDiskInsideThePixel() {
        // a disk wholly inside the pixel: boundary normals average to isotropy, T = I/2
        PixelCut cut = Ellipse.disk(0.1 * PIXEL, 0, 0.2 * PIXEL).cut(0, 0, PIXEL);
        assertEquals(Math.PI * 0.04, cut.fraction(), EXACT);
        assertEquals(0.5, cut.alignment(1, 0), QUADRATURE);
        assertEquals(0.5, cut.alignment(0, 1), QUADRATURE);
        assertEquals(2 * Math.PI * 0.2 * PIXEL, cut.boundaryLength(), QUADRATURE * PIXEL);
    }

    @Test
    void constructorsRejectBadArgumentsNamingValueAndBound() {
        assertMessage(() -> new Rectangle(0, 0, -1e-6, 1e-6, 0), "rectangle width", "-1.00000e-06", "> 0");
        assertMessage(() -> new Rectangle(0, 0, 1e-6, Double.NaN, 0), "rectangle height", "NaN");
        assertMessage(() -> Ellipse.disk(0, 0, 0), "disk radius", "0.00000", "> 0");
        assertMessage(() -> new Ellipse(0, Double.POSITIVE_INFINITY, 1, 1, 0), "ellipse centre y", "Infinity");
        assertMessage(() -> new HalfPlane(0, 0, 0, 0), "half-plane outward normal", "non-zero");
        assertMessage(() -> HalfPlane.leftOf(1, 2, 1, 2), "two points must differ");
        assertMessage(() -> new Slab(0, 0, 1, 0, 0), "slab thickness", "> 0");
        assertMessage(() -> Polygon.of(0, 0, 1, 0), "2 distinct vertices", "at least 3");
        assertMessage(() -> Polygon.of(0, 0, 1, 1, 1, 0, 0, 1), "edges 0", "cross or touch");
        assertMessage(() -> Polygon.of(0, 0, 1, 0, 2, 0), "overlap", "must be simple");
        assertMessage(() -> Polygon.of(0, 0, 1, 0, 1, 0, 0, 1), "vertices 1 and 2 coincide");
        assertMessage(() -> new Bounds(1, 0, 0, 1), "minimum must not exceed");
    }

    static void assertMessage(Runnable r, String... parts) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, r::run);
        for (String p : parts) {
            assertTrue(e.getMessage().contains(p), "message '" + e.getMessage() + "' lacks '" + p + "'");
        }
    }

    @Test
    void closingVertexIsDroppedAndEitherOrientationGivesTheSameArea() {
        Polygon a = Polygon.of(0, 0, 2, 0, 2, 1, 0, 1, 0, 0);
        Polygon b = Polygon.of(0, 1, 2, 1, 2, 0, 0, 0);
        assertEquals(4, a.size());
        assertEquals(2, a.area(), 1e-15);
        assertEquals(2, b.area(), 1e-15);
        assertEquals(1, a.centroidX(), 1e-15);
        assertEquals(0.5, b.centroidY(), 1e-15);
    }
}
