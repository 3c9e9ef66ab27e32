package org.evanesce.io.casefile.sections;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.io.casefile.expr.Suggest;
import org.evanesce.io.casefile.text.SourcePosition;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.NodeTuple;

/**
 * A list entry or value written as a one-key mapping whose key names its kind, e.g.
 * {@code - disk: {centre: [0, 0], radius: 1 um, material: water}}.
 *
 * @param kind  the kind's name, one of the section's keys
 * @param body  the node under the kind
 * @param at    where the kind was written
 * @param path  the key path of the body, e.g. {@code shapes[1].disk}
 */
record KindEntry(String kind, Node body, SourcePosition at, String path) {

    /** Reads the entry, or returns null after reporting what is wrong with it. */
    static KindEntry read(Context ctx, Node node, Schema.Section kinds, String path) {
        String expected = "one of " + String.join(", ", kinds.keys());
        if (!(node instanceof MappingNode m) || m.getValue().isEmpty()) {
            ctx.error(ctx.pos(node), path, "expected a mapping with one key naming the kind, " + expected
                    + ", got " + Context.describe(node));
            return null;
        }
        if (m.getValue().size() > 1) {
            List<String> keys = new ArrayList<>();
            for (NodeTuple t : m.getValue()) {
                keys.add(MapView.keyText(ctx, t.getKeyNode(), path));
            }
            ctx.error(ctx.pos(m.getValue().get(1).getKeyNode()), path, "an entry has exactly one key, its kind (" + expected
                    + "); found " + String.join(", ", keys) + " (indent the settings under '" + keys.get(0) + ":')");
            return null;
        }
        NodeTuple t = m.getValue().get(0);
        String kind = MapView.keyText(ctx, t.getKeyNode(), path);
        if (kind == null) {
            return null;
        }
        if (!kinds.accepts(kind)) {
            ctx.error(ctx.pos(t.getKeyNode()), Context.join(path, kind), "unknown kind" + Suggest.didYouMean(kind, kinds.keys())
                    + ", expected " + expected);
            return null;
        }
        ctx.consumed.add(kinds.id() + " " + kind);
        return new KindEntry(kind, t.getValueNode(), ctx.pos(t.getKeyNode()), Context.join(path, kind));
    }

    /** The body as a mapping of {@code section}'s keys. */
    MapView view(Context ctx, Schema.Section section) {
        return MapView.of(ctx, body, section, path, at);
    }
}
