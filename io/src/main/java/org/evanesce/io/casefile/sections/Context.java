package org.evanesce.io.casefile.sections;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Expression;
import org.evanesce.io.casefile.expr.ExpressionException;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Suggest;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.text.Scalar;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.ScalarNode;
import org.snakeyaml.engine.v2.nodes.SequenceNode;
import org.snakeyaml.engine.v2.nodes.Tag;

/**
 * State shared while one case file is read: the findings so far, the parameters, and readers
 * that turn YAML nodes into checked values, reporting what is wrong and carrying on.
 * Every reader returns null after reporting a problem.
 */
public final class Context {

    /** What kind of number a key takes. */
    enum Expect {
        LENGTH(Dimension.LENGTH, "a length such as 2 um"),
        TIME(Dimension.TIME, "a time such as 100 fs"),
        FREQUENCY(Dimension.FREQUENCY, "a frequency such as 474 THz"),
        ANGLE(Dimension.ANGLE, "an angle such as 30 (degrees) or 30 deg"),
        PLAIN(Dimension.NONE, "a plain number"),
        CONDUCTIVITY(Dimension.CONDUCTIVITY, "a conductivity such as 1e6 S/m");

        final Dimension dimension;
        final String example;

        Expect(Dimension dimension, String example) {
            this.dimension = dimension;
            this.example = example;
        }
    }

    final String source;
    public final List<Diagnostic> diagnostics = new ArrayList<>();
    /** "section-id key" for every schema key the reader looked up: the documentation test uses it. */
    final Set<String> consumed = new LinkedHashSet<>();
    ParameterTable parameters;

    public Context(String source) {
        this.source = source;
    }

    SourcePosition pos(Node n) {
        return n.getStartMark().map(m -> new SourcePosition(source, m.getLine() + 1, m.getColumn() + 1))
                .orElse(new SourcePosition(source, 1, 1));
    }

    public void error(SourcePosition at, String path, String message) {
        diagnostics.add(new Diagnostic(Diagnostic.Severity.ERROR, at, path, message));
    }

    void warn(SourcePosition at, String path, String message) {
        diagnostics.add(new Diagnostic(Diagnostic.Severity.WARNING, at, path, message));
    }

    void note(SourcePosition at, String path, String message) {
        diagnostics.add(new Diagnostic(Diagnostic.Severity.NOTE, at, path, message));
    }

    public boolean hasErrors() {
        return diagnostics.stream().anyMatch(Diagnostic::isError);
    }

    static String join(String path, String key) {
        return path.isEmpty() ? key : path + "." + key;
    }

    static boolean isNull(Node n) {
        return n instanceof ScalarNode s && (s.getTag().equals(Tag.NULL) || s.getValue().isEmpty() && s.isPlain());
    }

    /** "a list", "a mapping", "nothing" or the scalar in quotes, for messages. */
    static String describe(Node n) {
        if (n instanceof MappingNode m) {
            return m.getValue().isEmpty() ? "an empty mapping" : "a mapping";
        } else if (n instanceof SequenceNode s) {
            return s.getValue().isEmpty() ? "an empty list" : "a list";
        } else if (isNull(n)) {
            return "nothing";
        }
        return "'" + Suggest.shown(((ScalarNode) n).getValue()) + "'";
    }

    /** The node as a single scalar, or null after reporting that it is not one (null for a missing node, already reported). */
    Scalar scalar(Node node, String path, String expected) {
        if (node == null) {
            return null;
        }
        if (node instanceof ScalarNode s && !isNull(node)) {
            return Scalar.of(s, pos(node));
        }
        error(pos(node), path, "expected " + expected + ", got " + describe(node));
        return null;
    }

    /** The text of a scalar. */
    String text(Node node, String path) {
        Scalar s = scalar(node, path, "a text");
        return s == null ? null : s.text();
    }

    /** One of {@code options}, by name. */
    <T> T choice(Node node, String path, Map<String, T> options) {
        Scalar s = scalar(node, path, "one of " + String.join(", ", options.keySet()));
        if (s == null) {
            return null;
        }
        T v = options.get(s.text());
        if (v == null) {
            v = options.get(s.text().toLowerCase(Locale.ROOT));
        }
        if (v == null) {
            error(s.start(), path, "unknown choice '" + Suggest.shown(s.text()) + "'" + Suggest.didYouMean(s.text(), options.keySet())
                    + ", expected one of " + String.join(", ", options.keySet()));
        }
        return v;
    }

    /** The entries of a list. */
    List<Node> list(Node node, String path, String expected) {
        if (node == null) {
            return null;
        }
        if (node instanceof SequenceNode s) {
            return s.getValue();
        }
        error(pos(node), path, "expected a list of " + expected + ", got " + describe(node));
        return null;
    }

    /** An expression's value with its dimension. */
    Quantity quantity(Scalar s, String path) {
        try {
            return Expression.parse(s.text()).evaluate(parameters::lookup);
        } catch (ExpressionException e) {
            if (!e.isQuiet()) {
                error(s.positionAt(e.offset()), path, e.getMessage());
            }
            return null;
        }
    }

    /** A number of the expected kind, in SI units. */
    Value value(Node node, String path, Expect expect) {
        Scalar s = scalar(node, path, expect.example);
        return s == null ? null : value(s, path, expect);
    }

    Value value(Scalar s, String path, Expect expect) {
        Quantity q = quantity(s, path);
        if (q == null) {
            return null;
        }
        Dimension d = q.dimension();
        if (d.equals(expect.dimension)) {
            return new Value(q.value(), s.start());
        }
        if (expect == Expect.ANGLE && d.isNone()) {
            return new Value(Math.toRadians(q.value()), s.start());
        }
        if (d.isNone() && q.value() == 0) {
            return new Value(0, s.start());
        }
        String got = d.isNone() ? noUnit(s, q) : "got " + q + " (" + d.describe() + ")";
        error(s.start(), path, got + ", expected " + expect.example);
        return null;
    }

    /** "4 has no unit", or "n (1.5) has no unit" when the text is not the number itself. */
    static String noUnit(Scalar s, Quantity q) {
        String text = s.text().strip();
        String number = Units.number(q.value());
        boolean literal = text.matches("[-+]?[0-9.]+([eE][-+]?[0-9]+)?");
        return (literal ? text : text + " (" + number + ")") + " has no unit";
    }

    /** A value that must be positive. */
    Value positive(Node node, String path, Expect expect) {
        Value v = value(node, path, expect);
        if (v != null && !(v.si() > 0)) {
            error(v.at(), path, "must be positive, got " + Units.format(v.si(), expect.dimension));
            return null;
        }
        return v;
    }

    /** A whole number of at least {@code min}. */
    Long whole(Node node, String path, long min) {
        Value v = value(node, path, Expect.PLAIN);
        if (v == null) {
            return null;
        }
        if (v.si() != Math.rint(v.si()) || Math.abs(v.si()) > 9e15) {
            error(v.at(), path, "expected a whole number, got " + Units.number(v.si()));
            return null;
        }
        if (v.si() < min) {
            error(v.at(), path, "must be at least " + min + ", got " + Units.number(v.si()));
            return null;
        }
        return (long) v.si();
    }

    /** A point written as a list of two lengths, [x, y]. */
    Point point(Node node, String path) {
        if (node == null) {
            return null;
        }
        if (!(node instanceof SequenceNode s) || s.getValue().size() != 2) {
            error(pos(node), path, "expected a point [x, y] of two lengths such as [1 um, -2 um], got "
                    + (node instanceof SequenceNode s2 ? "a list of " + s2.getValue().size() : describe(node)));
            return null;
        }
        Value x = value(s.getValue().get(0), path + "[0]", Expect.LENGTH);
        Value y = value(s.getValue().get(1), path + "[1]", Expect.LENGTH);
        return x == null || y == null ? null : new Point(x, y);
    }

    /** Two positive lengths [a, b]. */
    Value[] pair(Node node, String path, String what) {
        if (node == null) {
            return null;
        }
        if (!(node instanceof SequenceNode s) || s.getValue().size() != 2) {
            error(pos(node), path, "expected " + what + ", got "
                    + (node instanceof SequenceNode s2 ? "a list of " + s2.getValue().size() : describe(node)));
            return null;
        }
        Value a = positive(s.getValue().get(0), path + "[0]", Expect.LENGTH);
        Value b = positive(s.getValue().get(1), path + "[1]", Expect.LENGTH);
        return a == null || b == null ? null : new Value[] {a, b};
    }
}
