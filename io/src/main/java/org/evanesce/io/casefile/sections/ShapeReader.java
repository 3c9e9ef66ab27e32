package org.evanesce.io.casefile.sections;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.model.ShapeSpec;
import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.snakeyaml.engine.v2.nodes.Node;

/** Reads the entries of {@code shapes} into {@link ShapeSpec}s, collecting the material names they use. */
final class ShapeReader {

    /** Direction into the filled side of a half-plane before rotation, degrees from +x. */
    private static final Map<String, Double> FILL = new LinkedHashMap<>();

    static {
        FILL.put("below", -90.0);
        FILL.put("above", 90.0);
        FILL.put("left", 180.0);
        FILL.put("right", 0.0);
    }

    private final Context ctx;
    /** Every material reference written, with its key path; shared with the case parser, which resolves them. */
    private final Map<Located<String>, String> materialPaths;

    ShapeReader(Context ctx, Map<Located<String>, String> materialPaths) {
        this.ctx = ctx;
        this.materialPaths = materialPaths;
    }

    /** A material name as written, remembered for resolution. */
    Located<String> materialRef(Node node, String path) {
        String name = ctx.text(node, path);
        if (name == null) {
            return null;
        }
        Located<String> l = new Located<>(name, ctx.pos(node));
        materialPaths.put(l, path);
        return l;
    }

    ShapeSpec read(KindEntry e) {
        switch (e.kind()) {
            case "rectangle": {
                MapView v = e.view(ctx, Schema.RECTANGLE);
                if (v == null) {
                    return null;
                }
                Point c = point(v, "centre");
                Node sz = v.require("size", "[width, height]");
                Value[] size = sz == null ? null : ctx.pair(sz, v.path("size"), "[width, height] of two positive lengths");
                Value rot = rotation(v);
                Located<String> mat = material(v);
                return c == null || size == null || rot == null || mat == null ? null
                        : new ShapeSpec.Rectangle(c, size[0], size[1], rot, mat, e.at());
            }
            case "polygon": {
                MapView v = e.view(ctx, Schema.POLYGON);
                if (v == null) {
                    return null;
                }
                List<Point> corners = corners(v);
                Value rot = rotation(v);
                Node pv = v.get("pivot");
                Point pivot = pv == null ? null : ctx.point(pv, v.path("pivot"));
                if (pivot == null && pv == null && corners != null) {
                    pivot = mean(corners, v.at());
                }
                Located<String> mat = material(v);
                return corners == null || rot == null || pivot == null || mat == null ? null
                        : new ShapeSpec.Polygon(corners, rot, pivot, mat, e.at());
            }
            case "disk": {
                MapView v = e.view(ctx, Schema.DISK);
                if (v == null) {
                    return null;
                }
                Point c = point(v, "centre");
                Node rn = v.require("radius", "a length");
                Value r = rn == null ? null : ctx.positive(rn, v.path("radius"), Expect.LENGTH);
                Located<String> mat = material(v);
                return c == null || r == null || mat == null ? null : new ShapeSpec.Disk(c, r, mat, e.at());
            }
            case "ellipse": {
                MapView v = e.view(ctx, Schema.ELLIPSE);
                if (v == null) {
                    return null;
                }
                Point c = point(v, "centre");
                Node rn = v.require("radii", "[rx, ry]");
                Value[] radii = rn == null ? null : ctx.pair(rn, v.path("radii"), "[rx, ry] of two positive lengths");
                Value rot = rotation(v);
                Located<String> mat = material(v);
                return c == null || radii == null || rot == null || mat == null ? null
                        : new ShapeSpec.Ellipse(c, radii[0], radii[1], rot, mat, e.at());
            }
            case "half_plane": {
                MapView v = e.view(ctx, Schema.HALF_PLANE);
                if (v == null) {
                    return null;
                }
                Point through = point(v, "through");
                Node fn = v.require("fill", "below, above, left or right");
                Double fill = fn == null ? null : ctx.choice(fn, v.path("fill"), FILL);
                Value rot = rotation(v);
                Located<String> mat = material(v);
                if (through == null || fill == null || rot == null || mat == null) {
                    return null;
                }
                Value inward = new Value(Math.toRadians(fill) + rot.si(), ctx.pos(fn));
                return new ShapeSpec.HalfPlane(through, inward, mat, e.at());
            }
            default: {
                MapView v = e.view(ctx, Schema.LAYER_STACK);
                if (v == null) {
                    return null;
                }
                Point start = point(v, "start");
                Value rot = rotation(v);
                List<ShapeSpec.LayerStack.Layer> layers = layers(v);
                return start == null || rot == null || layers == null ? null : new ShapeSpec.LayerStack(start, rot, layers, e.at());
            }
        }
    }

    private Point point(MapView v, String key) {
        Node n = v.require(key, "a point [x, y]");
        return n == null ? null : ctx.point(n, v.path(key));
    }

    private Value rotation(MapView v) {
        Node n = v.get("rotation");
        return n == null ? new Value(0, v.at()) : ctx.value(n, v.path("rotation"), Expect.ANGLE);
    }

    private Located<String> material(MapView v) {
        Node n = v.require("material", "a material name");
        return n == null ? null : materialRef(n, v.path("material"));
    }

    private List<Point> corners(MapView v) {
        Node n = v.require("corners", "a list of at least three points");
        if (n == null) {
            return null;
        }
        List<Node> items = ctx.list(n, v.path("corners"), "points [x, y]");
        if (items == null) {
            return null;
        }
        if (items.size() < 3) {
            ctx.error(ctx.pos(n), v.path("corners"), "a polygon needs at least 3 corners, got " + items.size());
            return null;
        }
        List<Point> out = new ArrayList<>();
        boolean ok = true;
        for (int k = 0; k < items.size(); k++) {
            Point p = ctx.point(items.get(k), v.path("corners") + "[" + k + "]");
            ok &= p != null;
            out.add(p);
        }
        if (!ok) {
            return null;
        }
        double area = 0;
        for (int a = 0, b = out.size() - 1; a < out.size(); b = a++) {
            area += out.get(b).x().si() * out.get(a).y().si() - out.get(a).x().si() * out.get(b).y().si();
        }
        if (area == 0) {
            ctx.error(ctx.pos(n), v.path("corners"), "the corners enclose no area");
            return null;
        }
        return out;
    }

    private static Point mean(List<Point> corners, SourcePosition at) {
        double x = 0;
        double y = 0;
        for (Point p : corners) {
            x += p.x().si();
            y += p.y().si();
        }
        return new Point(new Value(x / corners.size(), at), new Value(y / corners.size(), at));
    }

    private List<ShapeSpec.LayerStack.Layer> layers(MapView v) {
        Node n = v.require("layers", "a list of layers, each {material, thickness}");
        if (n == null) {
            return null;
        }
        List<Node> items = ctx.list(n, v.path("layers"), "layers {material, thickness}");
        if (items == null) {
            return null;
        }
        if (items.isEmpty()) {
            ctx.error(ctx.pos(n), v.path("layers"), "a layer stack needs at least one layer");
            return null;
        }
        List<ShapeSpec.LayerStack.Layer> out = new ArrayList<>();
        boolean ok = true;
        for (int k = 0; k < items.size(); k++) {
            String path = v.path("layers") + "[" + k + "]";
            MapView l = MapView.of(ctx, items.get(k), Schema.LAYER, path, ctx.pos(items.get(k)));
            if (l == null) {
                ok = false;
                continue;
            }
            Located<String> mat = material(l);
            Node tn = l.require("thickness", "a length");
            Value t = tn == null ? null : ctx.positive(tn, l.path("thickness"), Expect.LENGTH);
            if (mat == null || t == null) {
                ok = false;
            } else {
                out.add(new ShapeSpec.LayerStack.Layer(mat, t));
            }
        }
        return ok ? out : null;
    }
}
