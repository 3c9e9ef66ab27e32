package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.shape.Bounds;
import org.evanesce.geometry.shape.Polygon;
import org.evanesce.geometry.shape.Rectangle;
import org.evanesce.geometry.shape.Shape;

/**
 * Shapes in a domain with periodic sides. The structure is what lies inside the domain, repeated every period P
 * along x; the sites on the seam (x = x0) have smoothing pixels that reach a half cell outside the domain, where
 * the structure is the domain's other end. So each shape is added with its images one period to either side,
 * cut to outside the domain: a layer written as a rectangle the domain's width then fills the seam's pixels as it
 * fills every other, instead of leaving a column of half-and-half cells (a slit of background in every period, a
 * first-order error: A = -0.030 at 20 cells per wavelength, -0.015 at 40, in a lossless case that must give 0).
 *
 * <p>An image lying wholly outside the domain is added as it is (it touches only the seam's pixels). One that would
 * reach into the domain (the shape crosses the domain's other end) is cut at the domain's edge for rectangles without
 * rotation and for polygons; a rotated rectangle or an ellipse crossing the far end gets no image (its seam pixels
 * see the domain's side only, as before).
 */
final class PeriodicImages {

    /** Relative tolerance, in periods, for an image touching the domain's edge. */
    private static final double EDGE = 1e-9;

    private PeriodicImages() {
    }

    /**
     * Adds {@code shape} of {@code material} to {@code scene}, then its images, in that order (so later shapes and
     * their images still cover earlier ones, as in the domain).
     *
     * @param span {x0, x0 + P}, the period along x; null without periodic sides (the shape alone)
     */
    static void add(Scene.Builder scene, Shape shape, Material material, double[] span) {
        scene.add(shape, material);
        if (span == null) {
            return;
        }
        Bounds b = shape.bounds();
        if (!Double.isFinite(b.xMin()) || !Double.isFinite(b.xMax())) {
            return; // reaches across every period already (a half-plane, a horizontal slab)
        }
        double x0 = span[0];
        double x1 = span[1];
        double p = x1 - x0;
        double tol = EDGE * p;
        for (double shift : new double[] {-p, p}) {
            Shape image = shape.translated(shift, 0);
            Bounds ib = image.bounds();
            if (ib.xMax() < x0 - p || ib.xMin() > x1 + p) {
                continue;
            }
            // the part of the image that belongs outside the domain: left of x0 (shift -P) or right of x1 (+P)
            boolean left = shift < 0;
            boolean inside = left ? ib.xMax() > x0 + tol : ib.xMin() < x1 - tol;
            if (!inside) {
                scene.add(image, material);
                continue;
            }
            Shape cut = cut(image, left ? Double.NEGATIVE_INFINITY : x1, left ? x0 : Double.POSITIVE_INFINITY);
            if (cut != null) {
                scene.add(cut, material);
            }
        }
    }

    /** {@code s} cut to from <= x <= to, or null when that is empty or cannot be cut exactly. */
    static Shape cut(Shape s, double from, double to) {
        Bounds b = s.bounds();
        double lo = Math.max(from, b.xMin());
        double hi = Math.min(to, b.xMax());
        if (!(lo < hi)) {
            return null;
        }
        if (s instanceof Rectangle r && r.rotation() == 0) {
            return Rectangle.ofCorners(lo, b.yMin(), hi, b.yMax());
        }
        if (s instanceof Polygon poly) {
            return clip(poly, lo, hi);
        }
        return null;
    }

    /** Sutherland-Hodgman clipping of a polygon to the band lo <= x <= hi; null when little or nothing is left. */
    private static Polygon clip(Polygon poly, double lo, double hi) {
        List<double[]> pts = new ArrayList<>();
        for (int k = 0; k < poly.size(); k++) {
            pts.add(new double[] {poly.x(k), poly.y(k)});
        }
        pts = clipSide(pts, lo, true);
        pts = clipSide(pts, hi, false);
        if (pts.size() < 3) {
            return null;
        }
        double[] xs = new double[pts.size()];
        double[] ys = new double[pts.size()];
        for (int k = 0; k < pts.size(); k++) {
            xs[k] = pts.get(k)[0];
            ys[k] = pts.get(k)[1];
        }
        try {
            return new Polygon(xs, ys);
        } catch (IllegalArgumentException degenerate) {
            return null;
        }
    }

    /** Keeps x >= at ({@code keepAbove}) or x <= at of a closed polygon. */
    private static List<double[]> clipSide(List<double[]> in, double at, boolean keepAbove) {
        if (Double.isInfinite(at) || in.isEmpty()) {
            return in;
        }
        List<double[]> out = new ArrayList<>();
        for (int k = 0; k < in.size(); k++) {
            double[] a = in.get(k);
            double[] b = in.get((k + 1) % in.size());
            boolean ain = keepAbove ? a[0] >= at : a[0] <= at;
            boolean bin = keepAbove ? b[0] >= at : b[0] <= at;
            if (ain) {
                out.add(a);
            }
            if (ain != bin) {
                double t = (at - a[0]) / (b[0] - a[0]);
                out.add(new double[] {at, a[1] + t * (b[1] - a[1])});
            }
        }
        return out;
    }
}
