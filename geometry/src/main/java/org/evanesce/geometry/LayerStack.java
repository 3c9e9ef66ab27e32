package org.evanesce.geometry;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.shape.HalfPlane;
import org.evanesce.geometry.shape.Shape;
import org.evanesce.geometry.shape.Slab;

/**
 * Parallel layers stacked along a direction d from a start point p: with s = (r − p)·d̂, the
 * first finite layer occupies 0 ≤ s ≤ t₀, the next t₀ ≤ s ≤ t₀ + t₁, and so on. Each layer is
 * infinite across d. The first layer may be semi-infinite (thickness +∞): it then fills s ≤ 0 and
 * the next layer starts at s = 0. The last layer may be semi-infinite too, filling everything
 * beyond the previous one. A stack goes into a {@link Scene} as one slab (or half-plane) per layer,
 * in stacking order.
 *
 * @param startX     x of the start point p, m
 * @param startY     y of the start point p, m
 * @param directionX x of the stacking direction (normalised here)
 * @param directionY y of the stacking direction
 * @param layers     the layers, first to last (copied)
 */
public record LayerStack(double startX, double startY, double directionX, double directionY, List<Layer> layers) {

    /**
     * One layer.
     *
     * @param material  what fills it
     * @param thickness m; finite and &gt; 0, or +∞ for a semi-infinite first or last layer
     */
    public record Layer(Material material, double thickness) {
        public Layer {
            if (material == null) {
                throw new IllegalArgumentException("layer material must be given");
            }
            if (!(thickness > 0)) {
                throw new IllegalArgumentException(String.format(
                        "layer of '%s': thickness %g m must be > 0", material.name(), thickness));
            }
        }
    }

    public LayerStack {
        if (!Double.isFinite(startX) || !Double.isFinite(startY)) {
            throw new IllegalArgumentException(String.format(
                    "layer stack start (%g, %g) m must be finite", startX, startY));
        }
        double n = Math.hypot(directionX, directionY);
        if (!Double.isFinite(directionX) || !Double.isFinite(directionY) || !(n > 0) || Double.isInfinite(n)) {
            throw new IllegalArgumentException(String.format(
                    "layer stack direction (%g, %g) must be finite and non-zero", directionX, directionY));
        }
        directionX /= n;
        directionY /= n;
        if (layers == null || layers.isEmpty()) {
            throw new IllegalArgumentException("layer stack: at least one layer is needed");
        }
        layers = List.copyOf(layers);
        for (int k = 0; k < layers.size(); k++) {
            boolean infinite = Double.isInfinite(layers.get(k).thickness());
            boolean end = k == 0 || k == layers.size() - 1;
            if (infinite && (!end || layers.size() == 1)) {
                throw new IllegalArgumentException(String.format(
                        "layer stack: layer %d ('%s') has infinite thickness; only the first or the last of two or "
                                + "more layers may", k, layers.get(k).material().name()));
            }
        }
    }

    /** A stack along the direction at {@code angle} radians counter-clockwise from +x. */
    public static LayerStack along(double startX, double startY, double angle, List<Layer> layers) {
        return new LayerStack(startX, startY, Math.cos(angle), Math.sin(angle), layers);
    }

    /** This stack rotated by {@code angle} radians counter-clockwise about (pivotX, pivotY). */
    public LayerStack rotated(double angle, double pivotX, double pivotY) {
        double[] p = Shape.rotatePoint(startX, startY, angle, pivotX, pivotY);
        double[] d = Shape.rotatePoint(directionX, directionY, angle, 0, 0);
        return new LayerStack(p[0], p[1], d[0], d[1], layers);
    }

    /** The layers as scene entries, first to last: slabs, and half-planes for semi-infinite ends. */
    public List<Scene.Entry> entries() {
        List<Scene.Entry> out = new ArrayList<>();
        double s = 0;
        for (int k = 0; k < layers.size(); k++) {
            Layer l = layers.get(k);
            double px = startX + s * directionX;
            double py = startY + s * directionY;
            Shape shape;
            if (Double.isInfinite(l.thickness())) {
                // first: fills s ≤ 0 (outward normal +d); last: fills s ≥ current (outward normal −d)
                shape = k == 0 ? new HalfPlane(px, py, directionX, directionY)
                        : new HalfPlane(px, py, -directionX, -directionY);
            } else {
                shape = new Slab(px, py, directionX, directionY, l.thickness());
                s += l.thickness();
            }
            out.add(new Scene.Entry(shape, l.material()));
        }
        return out;
    }
}
