package org.evanesce.io.casefile.sections;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Suggest;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.MapsSpec;
import org.evanesce.io.casefile.model.OutputSpec;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.Scalar;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.SequenceNode;

/** Reads the {@code output} and {@code maps} sections. */
final class OutputReader {

    /** More frames than this is almost certainly a mistyped interval; each frame is one file. */
    static final int MAX_FRAMES = 100_000;
    /** The most decades a log-scale picture shows (the pictures refuse more: doubles span about 600). */
    static final int MAX_LOG_DECADES = 300;

    private static final Map<String, OutputSpec.Item> ITEMS = new LinkedHashMap<>();
    private static final Map<String, Component> COMPONENTS = new LinkedHashMap<>();
    private static final Map<String, MapsSpec.Normalise> MAP_NORMALISE = new LinkedHashMap<>();

    static {
        for (MapsSpec.Normalise n : MapsSpec.Normalise.values()) {
            MAP_NORMALISE.put(n.caseName(), n);
        }
        for (OutputSpec.Item i : OutputSpec.Item.values()) {
            ITEMS.put(i.caseName(), i);
        }
        for (Component c : Component.values()) {
            COMPONENTS.put(c.name().toLowerCase(Locale.ROOT), c);
        }
    }

    private final Context ctx;

    OutputReader(Context ctx) {
        this.ctx = ctx;
    }

    /**
     * Why {@code folder} cannot name a results folder, or null: it must name a folder of its own, not
     * the case file's folder or one above it (the results folder is replaced as a whole with --force).
     */
    static String folderProblem(String folder) {
        if (folder.isBlank()) {
            return "'" + folder + "' names the case file's own folder; expected a folder of its own for the results, e.g. results";
        }
        if (folder.indexOf('\0') >= 0 || folder.chars().anyMatch(c -> c < 0x20)) {
            return "contains a control character (a line break, a tab, ...); expected a plain folder name";
        }
        java.nio.file.Path p;
        try {
            p = java.nio.file.Path.of(folder).normalize();
        } catch (java.nio.file.InvalidPathException e) {
            return "'" + folder + "' is not a path this system accepts (" + e.getReason() + ")";
        }
        if (!p.isAbsolute() && (p.toString().isEmpty() || p.getFileName().toString().equals(".."))) {
            return "'" + folder + "' names the case file's own folder or one above it; expected a folder of its own for the "
                    + "results, e.g. results or ../results";
        }
        return null;
    }

    /**
     * @param hasProbes    whether the case defines probes (for the warning on an empty probes output)
     * @param polarization the case's, or null when unreadable
     * @return the section, or null when wrong (errors reported)
     */
    OutputSpec readOutput(MapView v, boolean hasProbes, Polarization polarization) {
        if (v == null) {
            return new OutputSpec(Optional.empty(), List.of(new Located<>(OutputSpec.Item.PROBES,
                    new SourcePosition(ctx.source, 1, 1))), Optional.empty());
        }
        Node fn = v.get("folder");
        Optional<Located<String>> folder = Optional.empty();
        boolean ok = true;
        if (fn != null) {
            String f = ctx.text(fn, v.path("folder"));
            String wrong = f == null ? null : folderProblem(f);
            if (wrong != null) {
                ctx.error(ctx.pos(fn), v.path("folder"), wrong);
                f = null;
            }
            ok &= f != null;
            folder = f == null ? Optional.empty() : Optional.of(new Located<>(f, ctx.pos(fn)));
        }
        List<Located<OutputSpec.Item>> write = new ArrayList<>();
        Node wn = v.get("write");
        if (wn == null) {
            write.add(new Located<>(OutputSpec.Item.PROBES, v.at()));
        } else {
            List<Node> items = wn instanceof SequenceNode ? ctx.list(wn, v.path("write"), "") : List.of(wn);
            for (int k = 0; k < items.size(); k++) {
                String path = v.path("write") + (wn instanceof SequenceNode ? "[" + k + "]" : "");
                OutputSpec.Item item = ctx.choice(items.get(k), path, ITEMS);
                if (item == null) {
                    ok = false;
                } else if (write.stream().anyMatch(l -> l.value() == item)) {
                    ctx.warn(ctx.pos(items.get(k)), path, item.caseName() + " is listed twice");
                } else {
                    write.add(new Located<>(item, ctx.pos(items.get(k))));
                }
            }
        }
        if (wn != null && !hasProbes && write.stream().anyMatch(l -> l.value() == OutputSpec.Item.PROBES)) {
            ctx.warn(write.stream().filter(l -> l.value() == OutputSpec.Item.PROBES).findFirst().orElseThrow().at(),
                    v.path("write"), "probes is listed but the case defines no probes");
        }
        boolean frames = write.stream().anyMatch(l -> l.value() == OutputSpec.Item.FIELD_FRAMES);
        String when = v.oneOf(true, "frame_interval", "frame_times");
        Value interval = null;
        List<Value> times = new ArrayList<>();
        Long intervalSteps = null;
        if ("frame_interval".equals(when)) {
            // a time, or a plain whole number of steps
            Scalar sc = ctx.scalar(v.get("frame_interval"), v.path("frame_interval"), "a time such as 5 fs or a number of steps");
            Quantity q = sc == null ? null : ctx.quantity(sc, v.path("frame_interval"));
            if (q == null) {
                ok = false;
            } else if (q.dimension().isNone()) {
                intervalSteps = ctx.whole(v.get("frame_interval"), v.path("frame_interval"), 1);
                ok &= intervalSteps != null;
            } else {
                interval = ctx.positive(v.get("frame_interval"), v.path("frame_interval"), Expect.TIME);
                ok &= interval != null;
            }
        } else if ("frame_times".equals(when)) {
            Node tn = v.get("frame_times");
            List<Node> items = tn instanceof SequenceNode ? ctx.list(tn, v.path("frame_times"), "") : List.of(tn);
            for (int k = 0; k < items.size(); k++) {
                Value t = ctx.positive(items.get(k), v.path("frame_times") + (tn instanceof SequenceNode ? "[" + k + "]" : ""),
                        Expect.TIME);
                ok &= t != null;
                if (t != null) {
                    times.add(t);
                }
            }
            if (times.size() > MAX_FRAMES) {
                ctx.error(ctx.pos(tn), v.path("frame_times"), "at most " + MAX_FRAMES + " frames, got " + times.size());
                ok = false;
            }
        }
        if (frames && when == null) {
            ctx.error(v.at(), v.path("frame_interval"), "missing, expected frame_interval (a time such as 5 fs) or "
                    + "frame_times (a list of times): field_frames needs to know when to take frames");
            ok = false;
        } else if (!frames && when != null) {
            ctx.warn(ctx.pos(v.get(when)), v.path(when), "ignored: write does not list field_frames");
        }
        List<Located<Component>> components = new ArrayList<>();
        Node cn = v.get("components");
        if (cn != null) {
            List<Node> items = cn instanceof SequenceNode ? ctx.list(cn, v.path("components"), "") : List.of(cn);
            for (int k = 0; k < items.size(); k++) {
                String path = v.path("components") + (cn instanceof SequenceNode ? "[" + k + "]" : "");
                Component c = ctx.choice(items.get(k), path, COMPONENTS);
                if (c == null) {
                    ok = false;
                } else if (polarization != null && c.polarization != polarization) {
                    ctx.error(ctx.pos(items.get(k)), path, String.format("%s belongs to %s polarization but the case is %s",
                            c.name().toLowerCase(Locale.ROOT), c.polarization.name().toLowerCase(Locale.ROOT),
                            polarization.name().toLowerCase(Locale.ROOT)));
                    ok = false;
                } else if (components.stream().noneMatch(l -> l.value() == c)) {
                    components.add(new Located<>(c, ctx.pos(items.get(k))));
                }
            }
        }
        Optional<OutputSpec.Region> region = optionalRegion(v);
        ok &= region != null;
        return ok ? new OutputSpec(folder, write, Optional.ofNullable(interval), Optional.ofNullable(intervalSteps), times,
                components, region) : null;
    }

    /** The section's {@code region}: empty when not given, null when wrong (errors reported). */
    private Optional<OutputSpec.Region> optionalRegion(MapView v) {
        Node rn = v.get("region");
        if (rn == null) {
            return Optional.empty();
        }
        OutputSpec.Region r = region(rn, v.path("region"), ctx.pos(rn));
        return r == null ? null : Optional.of(r);
    }

    /** {from: [x, y], to: [x, y]}, two opposite corners. */
    OutputSpec.Region region(Node node, String path, SourcePosition owner) {
        MapView v = MapView.of(ctx, node, Schema.REGION, path, owner);
        if (v == null) {
            return null;
        }
        Node fn = v.require("from", "a corner [x, y]");
        Node tn = v.require("to", "the opposite corner [x, y]");
        Point from = fn == null ? null : ctx.point(fn, v.path("from"));
        Point to = tn == null ? null : ctx.point(tn, v.path("to"));
        if (from == null || to == null) {
            return null;
        }
        if (from.x().si() == to.x().si() || from.y().si() == to.y().si()) {
            ctx.error(to.at(), v.path("to"), "the region must have a width and a height; the corners share an x or a y");
            return null;
        }
        return new OutputSpec.Region(from, to, v.at());
    }

    /**
     * @param defaultFrequency used when the section lists none (the first source's centre), or null
     * @return the section, null when absent or wrong (errors reported)
     */
    MapsSpec readMaps(Node node, SourcePosition owner, Value defaultFrequency) {
        if (node == null) {
            return null;
        }
        MapView v = MapView.of(ctx, node, Schema.MAPS, "maps", owner);
        if (v == null) {
            return null;
        }
        List<Value> frequencies = FluxReader.frequencies(ctx, v, defaultFrequency, Schema.MAP_WAVELENGTH_RANGE,
                Schema.MAP_FREQUENCY_RANGE);
        boolean ok = frequencies != null;
        Optional<OutputSpec.Region> region = optionalRegion(v);
        ok &= region != null;
        Node ln = v.get("log_decades");
        Value decades = ln == null ? new Value(4, v.at()) : ctx.positive(ln, v.path("log_decades"), Expect.PLAIN);
        if (decades != null && decades.si() > MAX_LOG_DECADES) {
            ctx.error(decades.at(), v.path("log_decades"), "at most " + MAX_LOG_DECADES + " decades (the range of double "
                    + "numbers), got " + Units.number(decades.si()));
            decades = null;
        }
        ok &= decades != null;
        List<MapsSpec.DecayLine> lines = new ArrayList<>();
        Node dn = v.get("decay");
        if (dn != null) {
            List<Node> items = ctx.list(dn, v.path("decay"), "lines such as '- {name: gap, from: [0, 0], to: [0, 1 um]}'");
            if (items == null) {
                ok = false;
            } else {
                for (int k = 0; k < items.size(); k++) {
                    String path = v.path("decay") + "[" + k + "]";
                    MapView d = MapView.of(ctx, items.get(k), Schema.DECAY_LINE, path, ctx.pos(items.get(k)));
                    if (d == null) {
                        ok = false;
                        continue;
                    }
                    Node nn = d.get("name");
                    String name = nn == null ? "line" + (k + 1) : ctx.text(nn, d.path("name"));
                    if (name != null && !name.matches(Schema.NAME)) {
                        ctx.error(ctx.pos(nn), d.path("name"), "a decay line's name: at most " + Schema.NAME_LENGTH
                                + " letters, digits, '_', '-' and '.', got '"
                                + Suggest.shown(name) + "'");
                        name = null;
                    }
                    Node fn = d.require("from", "where the fit starts, a point [x, y]");
                    Node tn = d.require("to", "where it ends, a point [x, y]");
                    Point from = fn == null ? null : ctx.point(fn, d.path("from"));
                    Point to = tn == null ? null : ctx.point(tn, d.path("to"));
                    if (name == null || from == null || to == null) {
                        ok = false;
                        continue;
                    }
                    final String n = name;
                    if (lines.stream().anyMatch(l -> l.name().value().equals(n))) {
                        ctx.error(d.at(), d.path("name"), "duplicate decay line name '" + Suggest.shown(name) + "'");
                        ok = false;
                        continue;
                    }
                    lines.add(new MapsSpec.DecayLine(new Located<>(name, nn == null ? d.at() : ctx.pos(nn)), from, to, d.at()));
                }
            }
        }
        Located<MapsSpec.Normalise> normalise = new Located<>(MapsSpec.Normalise.ABSOLUTE, v.at());
        Node nn = v.get("normalise");
        if (nn != null) {
            MapsSpec.Normalise n = ctx.choice(nn, v.path("normalise"), MAP_NORMALISE);
            ok &= n != null;
            normalise = new Located<>(n, ctx.pos(nn));
        }
        return ok ? new MapsSpec(frequencies, region, decades, lines, normalise, v.at()) : null;
    }
}
