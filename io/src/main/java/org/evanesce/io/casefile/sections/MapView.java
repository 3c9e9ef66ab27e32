package org.evanesce.io.casefile.sections;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.evanesce.io.casefile.expr.Suggest;
import org.evanesce.io.casefile.text.SourcePosition;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.NodeTuple;
import org.snakeyaml.engine.v2.nodes.ScalarNode;

/**
 * A YAML mapping read against one {@link Schema.Section}: unknown and duplicated keys are
 * reported when the view is made, missing required keys when they are asked for.
 */
final class MapView {

    private final Context ctx;
    private final Schema.Section section;
    private final String path;
    private final SourcePosition at;
    private final Map<String, NodeTuple> entries = new LinkedHashMap<>();
    /** Keys whose earlier name was written (and refused): a missing key of this name is not reported again. */
    private final Set<String> writtenAsOld = new HashSet<>();

    private MapView(Context ctx, Schema.Section section, String path, SourcePosition at) {
        this.ctx = ctx;
        this.section = section;
        this.path = path;
        this.at = at;
    }

    /**
     * A view of {@code node}, or null after reporting that it is not a mapping.
     *
     * @param owner where the key that holds this mapping was written (for "missing key" messages)
     */
    static MapView of(Context ctx, Node node, Schema.Section section, String path, SourcePosition owner) {
        if (!(node instanceof MappingNode m)) {
            ctx.error(ctx.pos(node), path, "expected a mapping with keys such as " + String.join(", ", section.keys())
                    + ", got " + Context.describe(node));
            return null;
        }
        MapView v = new MapView(ctx, section, path, owner);
        for (NodeTuple t : m.getValue()) {
            String key = keyText(ctx, t.getKeyNode(), path);
            if (key == null) {
                continue;
            }
            if (v.entries.containsKey(key)) {
                ctx.error(ctx.pos(t.getKeyNode()), Context.join(path, key), "duplicate key, first given at line "
                        + ctx.pos(v.entries.get(key).getKeyNode()).line());
            } else if (section.renamed().containsKey(key)) {
                Schema.Renamed r = section.renamed().get(key);
                v.writtenAsOld.add(r.now());
                ctx.error(ctx.pos(t.getKeyNode()), Context.join(path, key), "no longer read: '" + key + "' is now '"
                        + r.now() + "'; write " + r.advice());
            } else if (!section.accepts(key)) {
                ctx.error(ctx.pos(t.getKeyNode()), Context.join(path, key), "unknown key" + Suggest.didYouMean(key, section.keys())
                        + ", expected one of " + String.join(", ", section.keys()));
            } else {
                v.entries.put(key, t);
            }
        }
        return v;
    }

    /** Reads one named entry of a mapping; null after reporting what is wrong with it. */
    interface NamedEntry<T> {
        T read(String name, Node value, String path, SourcePosition keyAt);
    }

    /**
     * Reads every entry of a mapping of names to values (sweep parameters to their values, sampled parameters
     * to their distributions) in order into {@code out}, refusing a key that is not plain text and a name given
     * twice; returns whether every entry read.
     */
    static <T> boolean readNamed(Context ctx, MappingNode m, String path, NamedEntry<T> entry, List<T> out) {
        boolean ok = true;
        Map<String, SourcePosition> seen = new LinkedHashMap<>();
        for (NodeTuple t : m.getValue()) {
            String name = keyText(ctx, t.getKeyNode(), path);
            if (name == null) {
                ok = false;
                continue;
            }
            SourcePosition keyAt = ctx.pos(t.getKeyNode());
            String p = path + "." + name;
            if (seen.containsKey(name)) {
                ctx.error(keyAt, p, "duplicate parameter, first given at line " + seen.get(name).line());
                ok = false;
                continue;
            }
            seen.put(name, keyAt);
            T x = entry.read(name, t.getValueNode(), p, keyAt);
            ok &= x != null;
            if (x != null) {
                out.add(x);
            }
        }
        return ok;
    }

    /** A mapping key as text, or null after reporting a key that is not a plain scalar. */
    static String keyText(Context ctx, Node key, String path) {
        if (key instanceof ScalarNode s && !Context.isNull(key)) {
            return s.getValue();
        }
        ctx.error(ctx.pos(key), path, "a key must be a plain name, got " + Context.describe(key));
        return null;
    }

    String path() {
        return path;
    }

    String path(String key) {
        return Context.join(path, key);
    }

    SourcePosition at() {
        return at;
    }

    private void check(String key) {
        if (!section.accepts(key)) {
            throw new IllegalStateException("key '" + key + "' is not in schema section " + section.id());
        }
    }

    boolean has(String key) {
        check(key);
        return entries.containsKey(key);
    }

    /** The value of {@code key}, or null when absent. */
    Node get(String key) {
        check(key);
        ctx.consumed.add(section.id() + " " + key);
        NodeTuple t = entries.get(key);
        return t == null ? null : t.getValueNode();
    }

    /** The value of a key that must be present; reports and returns null when it is not. */
    Node require(String key, String expected) {
        Node n = get(key);
        if (n == null && !writtenAsOld.contains(key)) {
            ctx.error(at, path(key), "missing, expected " + expected);
        }
        return n;
    }

    /** Whether the key an earlier version called {@code key} was written (and refused with advice). */
    boolean writtenAsOld(String key) {
        return writtenAsOld.contains(key);
    }

    /** Where a present key was written. */
    SourcePosition keyAt(String key) {
        return ctx.pos(entries.get(key).getKeyNode());
    }

    /**
     * Which one of mutually exclusive keys is present: its name, or null after reporting none or
     * several (unless {@code optional} and none).
     */
    String oneOf(boolean optional, String... keys) {
        List<String> present = new ArrayList<>();
        for (String k : keys) {
            ctx.consumed.add(section.id() + " " + k);
            if (has(k)) {
                present.add(k);
            }
        }
        if (present.size() == 1) {
            return present.get(0);
        }
        if (present.isEmpty()) {
            if (!optional && java.util.Arrays.stream(keys).noneMatch(writtenAsOld::contains)) {
                ctx.error(at, path, "needs one of " + String.join(" or ", keys));
            }
            return null;
        }
        ctx.error(keyAt(present.get(1)), path(present.get(1)), "give only one of " + String.join(" and ", present));
        return null;
    }
}
