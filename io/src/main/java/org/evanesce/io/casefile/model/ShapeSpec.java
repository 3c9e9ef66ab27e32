package org.evanesce.io.casefile.model;

import java.util.List;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

/**
 * A shape of the scene, in metres and radians. Later shapes in the case's list override earlier
 * ones where they overlap. Rotations are counter-clockwise (x right, y up).
 *
 * <p>The inside tests here serve validation (which material a source sits in, whether a shape
 * reaches the domain); rasterising onto the grid is the geometry module's job.
 */
public sealed interface ShapeSpec {

    /** Where the shape's entry starts in the case file. */
    SourcePosition at();

    /** The case-file kind, e.g. {@code rectangle}. */
    String kind();

    /** The material at (x, y) if this shape covers that point, else null. */
    String materialAt(double x, double y);

    /** Bounding box {xmin, ymin, xmax, ymax}; infinite for unbounded shapes. */
    double[] bounds();

    /** Every material name the shape uses, with where it was written. */
    List<Located<String>> materials();

    /**
     * A rectangle of the given size centred on {@code centre}, turned by {@code rotation} about it.
     */
    record Rectangle(Point centre, Value width, Value height, Value rotation, Located<String> material,
            SourcePosition at) implements ShapeSpec {

        @Override
        public String kind() {
            return "rectangle";
        }

        @Override
        public String materialAt(double x, double y) {
            double[] u = unrotate(x - centre.x().si(), y - centre.y().si(), rotation.si());
            return Math.abs(u[0]) <= width.si() / 2 && Math.abs(u[1]) <= height.si() / 2 ? material.value() : null;
        }

        @Override
        public double[] bounds() {
            double c = Math.abs(Math.cos(rotation.si()));
            double s = Math.abs(Math.sin(rotation.si()));
            double hx = (width.si() * c + height.si() * s) / 2;
            double hy = (width.si() * s + height.si() * c) / 2;
            return new double[] {centre.x().si() - hx, centre.y().si() - hy, centre.x().si() + hx, centre.y().si() + hy};
        }

        @Override
        public List<Located<String>> materials() {
            return List.of(material);
        }
    }

    /**
     * A polygon with corners as written, turned by {@code rotation} about {@code pivot} (the mean
     * of the corners unless the case gave one). Inside by the even-odd rule.
     */
    record Polygon(List<Point> corners, Value rotation, Point pivot, Located<String> material,
            SourcePosition at) implements ShapeSpec {

        public Polygon {
            corners = List.copyOf(corners);
        }

        @Override
        public String kind() {
            return "polygon";
        }

        /** The corners after rotation, {x, y} in metres. */
        public double[][] placedCorners() {
            double[][] out = new double[corners.size()][];
            double c = Math.cos(rotation.si());
            double s = Math.sin(rotation.si());
            double px = pivot.x().si();
            double py = pivot.y().si();
            for (int k = 0; k < out.length; k++) {
                double dx = corners.get(k).x().si() - px;
                double dy = corners.get(k).y().si() - py;
                out[k] = new double[] {px + c * dx - s * dy, py + s * dx + c * dy};
            }
            return out;
        }

        @Override
        public String materialAt(double x, double y) {
            double[][] p = placedCorners();
            boolean inside = false;
            for (int a = 0, b = p.length - 1; a < p.length; b = a++) {
                if ((p[a][1] > y) != (p[b][1] > y)
                        && x < (p[b][0] - p[a][0]) * (y - p[a][1]) / (p[b][1] - p[a][1]) + p[a][0]) {
                    inside = !inside;
                }
            }
            return inside ? material.value() : null;
        }

        @Override
        public double[] bounds() {
            double[] b = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
            for (double[] p : placedCorners()) {
                b[0] = Math.min(b[0], p[0]);
                b[1] = Math.min(b[1], p[1]);
                b[2] = Math.max(b[2], p[0]);
                b[3] = Math.max(b[3], p[1]);
            }
            return b;
        }

        @Override
        public List<Located<String>> materials() {
            return List.of(material);
        }
    }

    /** A disk (a circle's inside) of the given radius. */
    record Disk(Point centre, Value radius, Located<String> material, SourcePosition at) implements ShapeSpec {

        @Override
        public String kind() {
            return "disk";
        }

        @Override
        public String materialAt(double x, double y) {
            return Math.hypot(x - centre.x().si(), y - centre.y().si()) <= radius.si() ? material.value() : null;
        }

        @Override
        public double[] bounds() {
            double r = radius.si();
            return new double[] {centre.x().si() - r, centre.y().si() - r, centre.x().si() + r, centre.y().si() + r};
        }

        @Override
        public List<Located<String>> materials() {
            return List.of(material);
        }
    }

    /** An ellipse with semi-axes radiusX, radiusY along its own axes, turned by {@code rotation}. */
    record Ellipse(Point centre, Value radiusX, Value radiusY, Value rotation, Located<String> material,
            SourcePosition at) implements ShapeSpec {

        @Override
        public String kind() {
            return "ellipse";
        }

        @Override
        public String materialAt(double x, double y) {
            double[] u = unrotate(x - centre.x().si(), y - centre.y().si(), rotation.si());
            double a = u[0] / radiusX.si();
            double b = u[1] / radiusY.si();
            return a * a + b * b <= 1 ? material.value() : null;
        }

        @Override
        public double[] bounds() {
            double c = Math.cos(rotation.si());
            double s = Math.sin(rotation.si());
            double a = radiusX.si();
            double b = radiusY.si();
            double hx = Math.sqrt(a * a * c * c + b * b * s * s);
            double hy = Math.sqrt(a * a * s * s + b * b * c * c);
            return new double[] {centre.x().si() - hx, centre.y().si() - hy, centre.x().si() + hx, centre.y().si() + hy};
        }

        @Override
        public List<Located<String>> materials() {
            return List.of(material);
        }
    }

    /**
     * Everything on one side of a straight edge through {@code through}; {@code inward} is the
     * direction (angle from +x, counter-clockwise) that points from the edge into the filled side.
     */
    record HalfPlane(Point through, Value inward, Located<String> material, SourcePosition at) implements ShapeSpec {

        @Override
        public String kind() {
            return "half_plane";
        }

        /** Signed distance of (x, y) from the edge, positive on the filled side. */
        public double depth(double x, double y) {
            return (x - through.x().si()) * Math.cos(inward.si()) + (y - through.y().si()) * Math.sin(inward.si());
        }

        @Override
        public String materialAt(double x, double y) {
            return depth(x, y) >= 0 ? material.value() : null;
        }

        @Override
        public double[] bounds() {
            double inf = Double.POSITIVE_INFINITY;
            return new double[] {-inf, -inf, inf, inf};
        }

        @Override
        public List<Located<String>> materials() {
            return List.of(material);
        }
    }

    /**
     * Layers of given thickness stacked from {@code start}, unbounded sideways. With rotation 0 the
     * layers are horizontal and the first one lies directly above {@code start}; the stack is
     * turned by {@code rotation} about {@code start}.
     */
    record LayerStack(Point start, Value rotation, List<Layer> layers, SourcePosition at) implements ShapeSpec {

        public LayerStack {
            layers = List.copyOf(layers);
        }

        /** One layer: its material and thickness in metres. */
        public record Layer(Located<String> material, Value thickness) { }

        @Override
        public String kind() {
            return "layer_stack";
        }

        /** Total thickness, metres. */
        public double thickness() {
            return layers.stream().mapToDouble(l -> l.thickness().si()).sum();
        }

        @Override
        public String materialAt(double x, double y) {
            double h = unrotate(x - start.x().si(), y - start.y().si(), rotation.si())[1];
            double top = 0;
            for (Layer l : layers) {
                double bottom = top;
                top += l.thickness().si();
                if (h >= bottom && h < top) {
                    return l.material().value();
                }
            }
            return null;
        }

        @Override
        public double[] bounds() {
            double inf = Double.POSITIVE_INFINITY;
            return new double[] {-inf, -inf, inf, inf};
        }

        @Override
        public List<Located<String>> materials() {
            return layers.stream().map(Layer::material).toList();
        }
    }

    /** (dx, dy) turned by −angle: a point's coordinates in a frame rotated by angle. */
    private static double[] unrotate(double dx, double dy, double angle) {
        double c = Math.cos(angle);
        double s = Math.sin(angle);
        return new double[] {c * dx + s * dy, -s * dx + c * dy};
    }
}
