package org.evanesce.io.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.shape.Bounds;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.geometry.shape.HalfPlane;
import org.evanesce.geometry.shape.Polygon;
import org.evanesce.geometry.shape.Rectangle;
import org.junit.jupiter.api.Test;

/**
 * The images a shape gets one period to either side of a periodic domain, cut to outside the domain (common
 * practice: a periodic structure is the domain's content repeated, so nothing from beyond the domain's far end
 * may come back in). Domain x from -0.25 to 0.25 (period 0.5), lengths in arbitrary units.
 */
class PeriodicImagesTest {

    private static final double[] SPAN = {-0.25, 0.25};
    private static final Material GLASS = Material.ofIndex("glass", 1.5);
    private static final double EPS = 1e-12;

    private static List<Scene.Entry> entries(org.evanesce.geometry.shape.Shape s) {
        Scene.Builder b = Scene.builder(Material.ofIndex("air", 1));
        PeriodicImages.add(b, s, GLASS, SPAN);
        return b.build().entries();
    }

    private static void assertBounds(double xMin, double xMax, Bounds b) {
        assertEquals(xMin, b.xMin(), EPS, b::toString);
        assertEquals(xMax, b.xMax(), EPS, b::toString);
    }

    @Test
    void aRectangleTheDomainsWidthGetsWholeImagesBesideIt() {
        List<Scene.Entry> e = entries(Rectangle.ofCorners(-0.25, -1, 0.25, 0));
        assertEquals(3, e.size());
        assertBounds(-0.75, -0.25, e.get(1).shape().bounds());
        assertBounds(0.25, 0.75, e.get(2).shape().bounds());
    }

    @Test
    void aRectangleWiderThanTheDomainIsCutAtItsEdges() {
        List<Scene.Entry> e = entries(Rectangle.ofCorners(-0.3, -1, 0.3, 0));
        assertEquals(3, e.size());
        assertBounds(-0.8, -0.25, e.get(1).shape().bounds());
        assertBounds(0.25, 0.8, e.get(2).shape().bounds());
    }

    @Test
    void aPolygonCrossingTheFarEndIsClipped() {
        // a triangle from x = 0 to 0.4: its -P image spans -0.5..-0.1 and is kept left of -0.25 only
        List<Scene.Entry> e = entries(Polygon.of(0, 0, 0.4, 0, 0.4, 0.4));
        assertEquals(3, e.size());
        assertBounds(-0.5, -0.25, e.get(1).shape().bounds());
        assertBounds(0.5, 0.9, e.get(2).shape().bounds());
        assertEquals(0.25, e.get(1).shape().bounds().yMax(), EPS, "the image's slope y = x + 0.5 cut at x = -0.25");
    }

    @Test
    void aDiskCrossingTheFarEndGetsNoImageOnThatSide() {
        List<Scene.Entry> e = entries(Ellipse.disk(0.2, 0, 0.1));
        // the +P image lies wholly outside (0.6..0.8); the -P image (-0.4..-0.2) would reach into the domain
        assertEquals(2, e.size());
        assertBounds(0.6, 0.8, e.get(1).shape().bounds());
    }

    @Test
    void infiniteShapesGetNoImages() {
        assertEquals(1, entries(new HalfPlane(0, 0, 0, 1)).size());
    }
}
