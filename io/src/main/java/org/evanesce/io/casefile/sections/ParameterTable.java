package org.evanesce.io.casefile.sections;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import org.evanesce.io.casefile.expr.Expression;
import org.evanesce.io.casefile.expr.ExpressionException;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Suggest;
import org.evanesce.io.casefile.model.Parameter;
import org.evanesce.io.casefile.text.Scalar;
import org.evanesce.io.casefile.text.SourcePosition;
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
            resolve(name);
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
            ctx.error(at, path, "'" + Suggest.shown(name) + "' is the name of a unit, a function or pi; choose another name");
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
            ctx.error(at, "parameters." + name, "the case has no parameter '" + Suggest.shown(name) + "' to set"
                    + Suggest.didYouMean(name, defs.keySet())
                    + (defs.isEmpty() ? "; it defines none" : "; it defines " + String.join(", ", defs.keySet())));
            return;
        }
        Scalar s = new Scalar(text, at, false);
        failed.remove(name);
        defs.put(name, new Def(name, s, parse(s, original.path()), true));
    }

    /** A parameter being resolved and the parameters its expression uses that are still to be looked at. */
    private record Frame(String name, Iterator<String> uses) { }

    /**
     * The value of parameter {@code name}, resolving the parameters it uses first. The walk through
     * the definitions is depth-first with a stack of its own, not recursive, so chains of any length
     * resolve; a circular definition is reported once, at its first parameter.
     */
    private Quantity resolve(String name) throws ExpressionException {
        Deque<Frame> stack = new ArrayDeque<>();
        Map<String, Integer> onStack = new HashMap<>();
        List<String> path = new ArrayList<>();
        enter(name, stack, onStack, path);
        while (!stack.isEmpty()) {
            Frame top = stack.peek();
            if (top.uses.hasNext()) {
                String ref = top.uses.next();
                if (!defs.containsKey(ref) || values.containsKey(ref) || failed.contains(ref)) {
                    continue; // undefined names are reported when the expression is evaluated
                }
                Integer loop = onStack.get(ref);
                if (loop != null) {
                    List<String> cycle = new ArrayList<>(path.subList(loop, path.size()));
                    cycle.add(ref);
                    Def first = defs.get(cycle.get(0));
                    ctx.error(first.scalar.start(), first.path(), "circular definition: " + cycleText(cycle));
                    failed.addAll(cycle);
                    continue;
                }
                enter(ref, stack, onStack, path);
                continue;
            }
            stack.pop();
            onStack.remove(top.name);
            path.remove(path.size() - 1);
            evaluateOnce(top.name);
        }
        Quantity q = values.get(name);
        if (q == null) {
            throw ExpressionException.quiet(0);
        }
        return q;
    }

    /** "a -> b -> a", with the middle of a long cycle left out. */
    private static String cycleText(List<String> cycle) {
        if (cycle.size() <= 8) {
            return String.join(" -> ", cycle);
        }
        return String.join(" -> ", cycle.subList(0, 4)) + " -> ... (" + (cycle.size() - 6) + " more) -> "
                + String.join(" -> ", cycle.subList(cycle.size() - 2, cycle.size()));
    }

    private void enter(String name, Deque<Frame> stack, Map<String, Integer> onStack, List<String> path) {
        Def d = defs.get(name);
        Iterator<String> uses = d.expression == null || failed.contains(name) || values.containsKey(name)
                ? java.util.Collections.emptyIterator() : d.expression.parameterNames().iterator();
        onStack.put(name, path.size());
        path.add(name);
        stack.push(new Frame(name, uses));
    }

    /** Evaluates a parameter whose uses are resolved (or failed); reports its own problems once. */
    private void evaluateOnce(String name) {
        if (values.containsKey(name) || failed.contains(name)) {
            return;
        }
        Def d = defs.get(name);
        if (d.expression == null) {
            failed.add(name);
            return;
        }
        try {
            Quantity q = d.expression.evaluate((ref, offset) -> {
                if (!defs.containsKey(ref)) {
                    throw new ExpressionException(offset, undefined(ref));
                }
                Quantity v = values.get(ref);
                if (v == null) {
                    throw ExpressionException.quiet(offset); // its own problem is reported where it is defined
                }
                return v;
            });
            values.put(name, q);
        } catch (ExpressionException e) {
            if (!e.isQuiet()) {
                ctx.error(d.scalar.positionAt(e.offset()), d.path(), e.getMessage());
            }
            failed.add(name);
        }
    }

    private String undefined(String name) {
        return "undefined parameter '" + Suggest.shown(name) + "'" + Suggest.didYouMean(name, defs.keySet());
    }

    /** The value of a parameter for expressions elsewhere in the file. */
    Quantity lookup(String name, int offset) throws ExpressionException {
        if (!defs.containsKey(name)) {
            throw new ExpressionException(offset, undefined(name));
        }
        return resolve(name);
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
