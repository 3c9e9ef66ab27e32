package org.evanesce.io.casefile.sections;

import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.model.SurfacesSpec;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.io.casefile.expr.Suggest;
import org.evanesce.io.casefile.expr.Units;
import org.snakeyaml.engine.v2.nodes.Node;

/** Reads the {@code surfaces} section into a {@link SurfacesSpec} (where each part sits is checked in {@link SurfaceChecks}). */
final class SurfacesReader {

    /** The most angles a far-field table lists. */
    static final int MAX_ANGLES = 36_000;
    /** Angles a far-field table lists by default: one per degree. */
    static final int DEFAULT_ANGLES = 360;

    private static final Map<String, SurfacesSpec.Normalise> NORMALISE = new LinkedHashMap<>();
    private static final Map<String, SurfacesSpec.Towards> TOWARDS = new LinkedHashMap<>();

    static {
        for (SurfacesSpec.Normalise n : SurfacesSpec.Normalise.values()) {
            NORMALISE.put(n.caseName(), n);
        }
        for (SurfacesSpec.Towards t : SurfacesSpec.Towards.values()) {
            TOWARDS.put(t.caseName(), t);
        }
    }

    private final Context ctx;
    private final Map<String, SourcePosition> names = new HashMap<>();
    private boolean ok = true;

    SurfacesReader(Context ctx) {
        this.ctx = ctx;
    }

    /**
     * @param node             the section, or null when the case has none
     * @param owner            where the {@code surfaces} key is
     * @param defaultFrequency used when the section lists no frequencies (the first source's centre), or null
     * @param launched         whether the case has a plane wave, Gaussian beam or plane-wave box (the default
     *                         normalisation is then by its incident power or intensity, else by the power the sources
     *                         radiate)
     * @return the section, or null when absent or wrong (errors reported)
     */
    SurfacesSpec read(Node node, SourcePosition owner, Value defaultFrequency, boolean launched) {
        if (node == null) {
            return null;
        }
        MapView v = MapView.of(ctx, node, Schema.SURFACES, "surfaces", owner);
        if (v == null) {
            return null;
        }
        List<Value> frequencies = FluxReader.frequencies(ctx, v, defaultFrequency, Schema.SURFACE_WAVELENGTHS,
                Schema.SURFACE_FREQUENCIES);
        ok &= frequencies != null;
        Located<SurfacesSpec.Normalise> normalise = new Located<>(launched ? SurfacesSpec.Normalise.INCIDENT
                : SurfacesSpec.Normalise.SOURCE, v.at());
        Node nn = v.get("normalise");
        if (nn != null) {
            SurfacesSpec.Normalise n = ctx.choice(nn, v.path("normalise"), NORMALISE);
            ok &= n != null;
            normalise = new Located<>(n, ctx.pos(nn));
        }
        Located<FluxSpec.IncidentRun> run = FluxReader.incidentRun(ctx, v, false);
        ok &= run.value() != null;
        List<SurfacesSpec.Segment> segments = new ArrayList<>();
        for (MapView e : entries(v, "segments", Schema.SEGMENT)) {
            Located<String> name = name(e);
            Point[] ends = ends(e);
            if (name == null || ends == null) {
                continue;
            }
            boolean vertical = ends[0].x().si() == ends[1].x().si();
            boolean horizontal = ends[0].y().si() == ends[1].y().si();
            if (vertical == horizontal) {
                ctx.error(ends[0].at(), e.path("to"), String.format("a segment runs along x or along y: its ends need the same "
                        + "x (a vertical segment) or the same y (a horizontal one), got [%s, %s] and [%s, %s]%s", len(ends[0].x()),
                        len(ends[0].y()), len(ends[1].x()), len(ends[1].y()), vertical ? " (a single point)" : "; for a "
                        + "slanted surface use a box"));
                ok = false;
                continue;
            }
            segments.add(new SurfacesSpec.Segment(name, ends[0], ends[1], e.at()));
        }
        List<SurfacesSpec.Box> boxes = new ArrayList<>();
        for (MapView e : entries(v, "boxes", Schema.BOX)) {
            Located<String> name = name(e);
            Point[] ends = corners(e);
            if (name != null && ends != null) {
                boxes.add(new SurfacesSpec.Box(name, ends[0], ends[1], e.at()));
            }
        }
        List<SurfacesSpec.FarField> farFields = new ArrayList<>();
        for (MapView e : entries(v, "far_field", Schema.FAR_FIELD)) {
            Located<String> name = name(e);
            Point[] ends = corners(e);
            Located<Integer> angles = new Located<>(DEFAULT_ANGLES, e.at());
            Node an = e.get("angles");
            if (an != null) {
                Long a = ctx.whole(an, e.path("angles"), 4);
                if (a != null && a > MAX_ANGLES) {
                    ctx.error(ctx.pos(an), e.path("angles"), "at most " + MAX_ANGLES + " angles, got " + a);
                    a = null;
                }
                ok &= a != null;
                angles = a == null ? null : new Located<>(a.intValue(), ctx.pos(an));
            }
            if (name != null && ends != null && angles != null) {
                farFields.add(new SurfacesSpec.FarField(name, ends[0], ends[1], angles, e.at()));
            }
        }
        List<SurfacesSpec.ExitSpectrum> exits = new ArrayList<>();
        for (MapView e : entries(v, "exit_spectra", Schema.EXIT_SPECTRUM)) {
            Located<String> name = name(e);
            Node yn = e.require("y", "the line's height, a length such as -2 um");
            Value y = yn == null ? null : ctx.value(yn, e.path("y"), Expect.LENGTH);
            Node tn = e.require("towards", "up or down: the side the light leaves to");
            SurfacesSpec.Towards t = tn == null ? null : ctx.choice(tn, e.path("towards"), TOWARDS);
            Node an = e.get("numerical_aperture");
            Value na = an == null ? null : ctx.positive(an, e.path("numerical_aperture"), Expect.PLAIN);
            if (name == null || y == null || t == null || (an != null && na == null)) {
                ok = false;
                continue;
            }
            exits.add(new SurfacesSpec.ExitSpectrum(name, y, new Located<>(t, ctx.pos(tn)), na, e.at()));
        }
        if (segments.isEmpty() && boxes.isEmpty() && farFields.isEmpty() && exits.isEmpty() && ok) {
            ctx.error(v.at(), "surfaces", "lists no surface; expected at least one of segments, boxes, far_field, exit_spectra");
            return null;
        }
        return ok ? new SurfacesSpec(frequencies, normalise, segments, boxes, farFields, exits, v.at(), run) : null;
    }

    private List<MapView> entries(MapView v, String key, Schema.Section section) {
        List<MapView> out = new ArrayList<>();
        Node node = v.get(key);
        if (node == null) {
            return out;
        }
        List<Node> items = ctx.list(node, v.path(key), "entries such as '- {name: side, from: [...], to: [...]}'");
        if (items == null) {
            ok = false;
            return out;
        }
        for (int k = 0; k < items.size(); k++) {
            MapView e = MapView.of(ctx, items.get(k), section, v.path(key) + "[" + k + "]", ctx.pos(items.get(k)));
            if (e == null) {
                ok = false;
            } else {
                out.add(e);
            }
        }
        return out;
    }

    /** The entry's name: required, unique over every surface (it names columns and files). */
    private Located<String> name(MapView e) {
        Node nn = e.require("name", "a name such as 'left-side' (it heads columns and names files)");
        String text = nn == null ? null : ctx.text(nn, e.path("name"));
        if (text == null) {
            ok = false;
            return null;
        }
        if (!text.matches(Schema.NAME)) {
            ctx.error(ctx.pos(nn), e.path("name"), "a surface name heads columns and names files: at most " + Schema.NAME_LENGTH
                    + " letters, digits, '_', '-' and '.', got '" + Suggest.shown(text) + "'");
            ok = false;
            return null;
        }
        SourcePosition first = names.putIfAbsent(text, ctx.pos(nn));
        if (first != null) {
            ctx.error(ctx.pos(nn), e.path("name"), "duplicate surface name '" + text + "', first used at line " + first.line());
            ok = false;
            return null;
        }
        return new Located<>(text, ctx.pos(nn));
    }

    private Point[] ends(MapView e) {
        Node fn = e.require("from", "a point [x, y]");
        Node tn = e.require("to", "a point [x, y]");
        Point from = fn == null ? null : ctx.point(fn, e.path("from"));
        Point to = tn == null ? null : ctx.point(tn, e.path("to"));
        if (from == null || to == null) {
            ok = false;
            return null;
        }
        return new Point[] {from, to};
    }

    /** Two opposite corners of a rectangle with some width and height, as (lower left, upper right). */
    private Point[] corners(MapView e) {
        Point[] p = ends(e);
        if (p == null) {
            return null;
        }
        if (p[0].x().si() == p[1].x().si() || p[0].y().si() == p[1].y().si()) {
            ctx.error(p[1].at(), e.path("to"), String.format("from [%s, %s] and to [%s, %s] are opposite corners of a "
                    + "rectangle, which needs a width and a height", len(p[0].x()), len(p[0].y()), len(p[1].x()), len(p[1].y())));
            ok = false;
            return null;
        }
        Value x0 = p[0].x().si() < p[1].x().si() ? p[0].x() : p[1].x();
        Value x1 = p[0].x().si() < p[1].x().si() ? p[1].x() : p[0].x();
        Value y0 = p[0].y().si() < p[1].y().si() ? p[0].y() : p[1].y();
        Value y1 = p[0].y().si() < p[1].y().si() ? p[1].y() : p[0].y();
        return new Point[] {new Point(x0, y0), new Point(x1, y1)};
    }

    private static String len(Value v) {
        return Units.format(v.si(), org.evanesce.io.casefile.expr.Dimension.LENGTH);
    }
}
