package org.evanesce.io.casefile;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import org.evanesce.io.casefile.expr.Expression;
import org.evanesce.io.casefile.expr.ExpressionException;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Suggest;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.NodeTuple;

/**
 * The case's named parameters: read, overridden from the command line, then evaluated in
 * dependency order. Undefined names and circular definitions are reported once, where they are
 * written; expressions that use a parameter whose definition failed stay quiet.
 */
final class ParameterTable {

    static final Pattern NAME = Pattern.compile("[A-Za-z_][A-Za-z0-9_]*");

    /** One definition, from the file or (overridden) from the command line; expression null if it did not parse. */
    private record Def(String name, Scalar scalar, Expression expression, boolean overridden) {
        String path() {
            return "parameters." + name;
        }
    }

    private final Context ctx;
    private final Map<String, Def> defs = new LinkedHashMap<>();
    private final Map<String, Quantity> values = new HashMap<>();
    private final Set<String> failed = new HashSet<>();

    ParameterTable(Context ctx) {
        this.ctx = ctx;
    }

    /** Reads the {@code parameters} mapping (null when absent), applies overrides and evaluates everything. */
    void read(Node node, Map<String, String> overrides) {
        Map<String, Quantity> fileValues = overrides.isEmpty() ? Map.of() : valuesInFile(node);
        if (node != null && !Context.isNull(node)) {
            if (node instanceof MappingNode m) {
                for (NodeTuple t : m.getValue()) {
                    define(t);
                }
            } else {
                ctx.error(ctx.pos(node), "parameters", "expected a mapping of names to values such as 'gap: 0.2 um', got "
                        + Context.describe(node));
            }
        }
        for (Map.Entry<String, String> o : overrides.entrySet()) {
            override(o.getKey(), o.getValue());
        }
        // overridden values first, so that one of the wrong kind is refused before anything uses it
        for (Def d : defs.values()) {
            if (d.overridden) {
                evaluate(d.name);
                checkKind(d, fileValues.get(d.name));
            }
        }
        for (String name : defs.keySet()) {
            evaluate(name);
        }
    }

    private void evaluate(String name) {
        try {
            resolve(name, new ArrayList<>());
        } catch (ExpressionException quiet) {
            // reported where it happened
        }
    }

    /** Every parameter's value as the file alone defines it (problems are left for the real reading). */
    private Map<String, Quantity> valuesInFile(Node node) {
        ParameterTable plain = new ParameterTable(new Context(ctx.source));
        plain.read(node, Map.of());
        return plain.values;
    }

    /** A command-line value must be of the same kind as the file's, so that every use stays valid. */
    private void checkKind(Def d, Quantity before) {
        Quantity after = values.get(d.name);
        if (before == null || after == null || after.dimension().equals(before.dimension())) {
            return;
        }
        ctx.error(d.scalar.start(), d.path(), "the new value " + after + " is " + after.dimension().describe()
                + " but the case file defines " + d.name + " as " + before.dimension().describe() + " (" + before + ")");
        values.remove(d.name);
        failed.add(d.name);
    }

    private void define(NodeTuple t) {
        String name = MapView.keyText(ctx, t.getKeyNode(), "parameters");
        if (name == null) {
            return;
        }
        SourcePosition at = ctx.pos(t.getKeyNode());
        String path = "parameters." + name;
        if (!NAME.matcher(name).matches()) {
            ctx.error(at, path, "a parameter name is letters, digits and '_', starting with a letter or '_'");
            return;
        }
        if (Expression.isReserved(name)) {
            ctx.error(at, path, "'" + name + "' is the name of a unit, a function or pi; choose another name");
            return;
        }
        if (defs.containsKey(name)) {
            ctx.error(at, path, "duplicate parameter, first defined at line " + defs.get(name).scalar.start().line());
            return;
        }
        Scalar s = ctx.scalar(t.getValueNode(), path, "a value such as 0.2 um or an expression such as gap/2 + 1 um");
        if (s == null) {
            failed.add(name);
            defs.put(name, new Def(name, new Scalar("", at, false), null, false));
            return;
        }
        defs.put(name, new Def(name, s, parse(s, path), false));
    }

    private Expression parse(Scalar s, String path) {
        try {
            return Expression.parse(s.text());
        } catch (ExpressionException e) {
            ctx.error(s.positionAt(e.offset()), path, e.getMessage());
            return null;
        }
    }

    private void override(String name, String text) {
        SourcePosition at = SourcePosition.commandLine(name, text);
        Def original = defs.get(name);
        if (original == null) {
            ctx.error(at, "parameters." + name, "the case has no parameter '" + name + "' to set"
                    + Suggest.didYouMean(name, defs.keySet())
                    + (defs.isEmpty() ? "; it defines none" : "; it defines " + String.join(", ", defs.keySet())));
            return;
        }
        Scalar s = new Scalar(text, at, false);
        failed.remove(name);
        defs.put(name, new Def(name, s, parse(s, original.path()), true));
    }

    private Quantity resolve(String name, List<String> stack) throws ExpressionException {
        Quantity known = values.get(name);
        if (known != null) {
            return known;
        }
        Def d = defs.get(name);
        if (failed.contains(name) || d.expression == null) {
            failed.add(name);
            throw ExpressionException.quiet(0);
        }
        int loop = stack.indexOf(name);
        if (loop >= 0) {
            List<String> cycle = new ArrayList<>(stack.subList(loop, stack.size()));
            cycle.add(name);
            Def first = defs.get(cycle.get(0));
            ctx.error(first.scalar.start(), first.path(), "circular definition: " + String.join(" -> ", cycle));
            failed.addAll(cycle);
            throw ExpressionException.quiet(0);
        }
        stack.add(name);
        try {
            Quantity q = d.expression.evaluate((ref, offset) -> {
                if (!defs.containsKey(ref)) {
                    throw new ExpressionException(offset, undefined(ref));
                }
                return resolve(ref, stack);
            });
            values.put(name, q);
            return q;
        } catch (ExpressionException e) {
            if (!e.isQuiet() && !failed.contains(name)) {
                ctx.error(d.scalar.positionAt(e.offset()), d.path(), e.getMessage());
            }
            failed.add(name);
            throw ExpressionException.quiet(e.offset());
        } finally {
            stack.remove(stack.size() - 1);
        }
    }

    private String undefined(String name) {
        return "undefined parameter '" + name + "'" + Suggest.didYouMean(name, defs.keySet());
    }

    /** The value of a parameter for expressions elsewhere in the file. */
    Quantity lookup(String name, int offset) throws ExpressionException {
        if (!defs.containsKey(name)) {
            throw new ExpressionException(offset, undefined(name));
        }
        return resolve(name, new ArrayList<>());
    }

    /** Every parameter that has a value, in file order. */
    Map<String, Parameter> resolved() {
        Map<String, Parameter> out = new LinkedHashMap<>();
        for (Def d : defs.values()) {
            Quantity q = values.get(d.name);
            if (q != null) {
                out.put(d.name, new Parameter(d.name, q, d.scalar.text(), d.scalar.start(), d.overridden));
            }
        }
        return out;
    }
}
