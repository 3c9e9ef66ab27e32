package org.evanesce.io.casefile.expr;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * An arithmetic expression of numbers, units and named parameters, checked for dimensions as it
 * is evaluated.
 *
 * <pre>
 *   sum     = product { ("+" | "-") product }
 *   product = unary { ("*" | "/") unary }
 *   unary   = ("-" | "+") unary | primary [ unit ]
 *   primary = number | name | function "(" sum { "," sum } ")" | "(" sum ")"
 * </pre>
 * A unit written right after a number or a closing parenthesis binds tightest: {@code 1/2 um}
 * is 1/(2 um) and {@code 5e6 S/m} is (5e6 S)/m. {@code ×} and {@code −} are accepted for
 * {@code *} and {@code -}. {@code pi} is π. Functions: {@code sqrt abs min max sin cos tan asin
 * acos atan atan2}. Angles: the trigonometric functions take an angle, and a plain number where
 * an angle is expected means degrees; the inverse functions return angles.
 * Sums and differences need both sides of the same kind: a length plus a plain number is an error.
 *
 * <p>Limits: an expression is at most {@value #MAX_LENGTH} characters long and nests at most
 * {@value #MAX_DEPTH} levels of parentheses, function calls and signs; a longer or deeper one is
 * refused at the character where it exceeds the limit. Sums and products of many terms are held as
 * one list of terms, not as a tree, so neither parsing nor evaluation recurses per term.
 */
public final class Expression {

    /** The most characters an expression may have (a case file's longest real one is a few dozen). */
    public static final int MAX_LENGTH = 10_000;
    /** The most levels of parentheses, function calls and signs an expression may nest. */
    public static final int MAX_DEPTH = 64;

    /** The function names, in the order documented. */
    public static final List<String> FUNCTIONS =
            List.of("sqrt", "abs", "min", "max", "sin", "cos", "tan", "asin", "acos", "atan", "atan2");

    /** Names a parameter may not take: units, functions and {@code pi}. */
    public static boolean isReserved(String name) {
        return Units.isUnit(name) || FUNCTIONS.contains(name) || name.equals("pi");
    }

    /** Finds a parameter's value by name. */
    @FunctionalInterface
    public interface Lookup {
        /**
         * The value of parameter {@code name}, used at character {@code offset}; throws an
         * {@link ExpressionException} (perhaps a quiet one) when it has none.
         */
        Quantity value(String name, int offset) throws ExpressionException;
    }

    private sealed interface Node permits Num, Ref, Neg, Chain, Call, WithUnit { }

    private record WithUnit(Node value, String unit, int offset) implements Node { }

    private record Num(Quantity q, int offset) implements Node { }

    private record Ref(String name, int offset) implements Node { }

    private record Neg(Node operand, int offset) implements Node { }

    /**
     * {@code terms[0] ops[0] terms[1] ops[1] terms[2] ...}, evaluated left to right; the ops are all
     * additive ({@code + -}) or all multiplicative ({@code * /}); {@code offsets[k]} is where ops[k] is written.
     */
    private record Chain(List<Node> terms, char[] ops, int[] offsets) implements Node { }

    private record Call(String function, List<Node> args, int offset) implements Node { }

    private final String text;
    private final Node root;

    private Expression(String text, Node root) {
        this.text = text;
        this.root = root;
    }

    /** Parses {@code text}; a syntax error names its character offset. */
    public static Expression parse(String text) throws ExpressionException {
        if (text.length() > MAX_LENGTH) {
            throw new ExpressionException(0, String.format("the expression is %d characters long, more than the "
                    + "limit of %d; use parameters for its parts", text.length(), MAX_LENGTH));
        }
        Parser p = new Parser(text);
        Node n = p.sum();
        p.skipSpace();
        if (p.pos < text.length()) {
            if (p.peek() == ')') {
                throw new ExpressionException(p.pos, "unbalanced ')'");
            }
            throw new ExpressionException(p.pos, "unexpected '" + p.rest() + "' after a complete expression");
        }
        return new Expression(text, n);
    }

    public String text() {
        return text;
    }

    /** The parameter names the expression uses, in order of first use. */
    public Set<String> parameterNames() {
        Set<String> out = new LinkedHashSet<>();
        collect(root, out);
        return out;
    }

    private static void collect(Node n, Set<String> out) {
        if (n instanceof Ref r) {
            out.add(r.name);
        } else if (n instanceof Neg g) {
            collect(g.operand, out);
        } else if (n instanceof Chain ch) {
            for (Node t : ch.terms) {
                collect(t, out);
            }
        } else if (n instanceof WithUnit w) {
            collect(w.value, out);
        } else if (n instanceof Call c) {
            for (Node a : c.args) {
                collect(a, out);
            }
        }
    }

    /** The value, with parameters found by {@code lookup}. */
    public Quantity evaluate(Lookup lookup) throws ExpressionException {
        Quantity q = eval(root, lookup);
        if (!Double.isFinite(q.value())) {
            throw new ExpressionException(0, "the value is not a finite number");
        }
        return q;
    }

    private static Quantity eval(Node n, Lookup lookup) throws ExpressionException {
        if (n instanceof Num num) {
            return num.q;
        } else if (n instanceof Ref r) {
            return lookup.value(r.name, r.offset);
        } else if (n instanceof Neg g) {
            Quantity q = eval(g.operand, lookup);
            return new Quantity(-q.value(), q.dimension());
        } else if (n instanceof Chain ch) {
            Quantity acc = eval(ch.terms.get(0), lookup);
            for (int k = 0; k < ch.ops.length; k++) {
                acc = binary(ch.ops[k], ch.offsets[k], acc, eval(ch.terms.get(k + 1), lookup));
            }
            return acc;
        } else if (n instanceof WithUnit w) {
            Quantity q = eval(w.value, lookup);
            Quantity scaled = Units.times(q.value(), w.unit);
            return new Quantity(scaled.value(), q.dimension().times(scaled.dimension()));
        }
        Call c = (Call) n;
        List<Quantity> args = new ArrayList<>();
        for (Node a : c.args) {
            args.add(eval(a, lookup));
        }
        return call(c, args);
    }

    private static Quantity binary(char op, int offset, Quantity x, Quantity y) throws ExpressionException {
        switch (op) {
            case '+':
            case '-':
                if (!x.dimension().equals(y.dimension())) {
                    throw new ExpressionException(offset, String.format("cannot %s %s (%s) and %s (%s); both sides of '%c' must be of the same kind",
                            op == '+' ? "add" : "subtract", x.dimension().describe(), x, y.dimension().describe(), y, op));
                }
                return new Quantity(op == '+' ? x.value() + y.value() : x.value() - y.value(), x.dimension());
            case '*':
                return new Quantity(x.value() * y.value(), x.dimension().times(y.dimension()));
            default:
                if (y.value() == 0) {
                    throw new ExpressionException(offset, "division by zero");
                }
                return new Quantity(x.value() / y.value(), x.dimension().over(y.dimension()));
        }
    }

    private static Quantity call(Call c, List<Quantity> a) throws ExpressionException {
        int arity = switch (c.function) {
            case "min", "max" -> -2;
            case "atan2" -> 2;
            default -> 1;
        };
        if (arity > 0 && a.size() != arity || arity < 0 && a.size() < -arity) {
            throw new ExpressionException(c.offset, String.format("%s takes %s argument%s, got %d", c.function,
                    arity > 0 ? Integer.toString(arity) : "at least " + (-arity), Math.abs(arity) == 1 ? "" : "s", a.size()));
        }
        Quantity x = a.get(0);
        switch (c.function) {
            case "sqrt":
                if (x.value() < 0) {
                    throw new ExpressionException(c.offset, "sqrt of a negative value " + x);
                }
                if (!x.dimension().hasSquareRoot()) {
                    throw new ExpressionException(c.offset, "sqrt of " + x.dimension().describe() + " has no unit we know (" + x + ")");
                }
                return new Quantity(Math.sqrt(x.value()), x.dimension().squareRoot());
            case "abs":
                return new Quantity(Math.abs(x.value()), x.dimension());
            case "min":
            case "max": {
                Quantity best = x;
                for (Quantity y : a) {
                    if (!y.dimension().equals(x.dimension())) {
                        throw new ExpressionException(c.offset, String.format("%s needs arguments of one kind, got %s (%s) and %s (%s)",
                                c.function, x.dimension().describe(), x, y.dimension().describe(), y));
                    }
                    best = c.function.equals("min") == (y.value() < best.value()) ? y : best;
                }
                return best;
            }
            case "sin":
            case "cos":
            case "tan": {
                double r = radians(c, x);
                double v = c.function.equals("sin") ? Math.sin(r) : c.function.equals("cos") ? Math.cos(r) : Math.tan(r);
                return Quantity.plain(v);
            }
            case "asin":
            case "acos":
            case "atan": {
                if (!x.dimension().isNone()) {
                    throw new ExpressionException(c.offset, c.function + " needs a plain number, got " + x.dimension().describe() + " (" + x + ")");
                }
                if (!c.function.equals("atan") && Math.abs(x.value()) > 1) {
                    throw new ExpressionException(c.offset, c.function + " needs a value between -1 and 1, got " + x);
                }
                double v = c.function.equals("asin") ? Math.asin(x.value()) : c.function.equals("acos") ? Math.acos(x.value()) : Math.atan(x.value());
                return new Quantity(v, Dimension.ANGLE);
            }
            default: { // atan2(y, x)
                Quantity y = a.get(0);
                Quantity xx = a.get(1);
                if (!y.dimension().equals(xx.dimension())) {
                    throw new ExpressionException(c.offset, String.format("atan2 needs arguments of one kind, got %s (%s) and %s (%s)",
                            y.dimension().describe(), y, xx.dimension().describe(), xx));
                }
                return new Quantity(Math.atan2(y.value(), xx.value()), Dimension.ANGLE);
            }
        }
    }

    /** An angle's value in radians; a plain number is read as degrees. */
    private static double radians(Call c, Quantity x) throws ExpressionException {
        if (x.dimension().equals(Dimension.ANGLE)) {
            return x.value();
        } else if (x.dimension().isNone()) {
            return Math.toRadians(x.value());
        }
        throw new ExpressionException(c.offset, c.function + " needs an angle, got " + x.dimension().describe() + " (" + x + ")");
    }

    private static final class Parser {
        final String s;
        int pos;
        /** Levels of parentheses, function calls and signs open at the current position. */
        int depth;

        Parser(String s) {
            this.s = s;
        }

        char peek() {
            return pos < s.length() ? s.charAt(pos) : '\0';
        }

        String rest() {
            String r = s.substring(pos).strip();
            return r.length() > 20 ? r.substring(0, 20) + "..." : r;
        }

        void skipSpace() {
            while (pos < s.length() && Character.isWhitespace(s.charAt(pos))) {
                pos++;
            }
        }

        /** The next non-space character normalised (× → *, − → -), or '\0' at the end. */
        char op() {
            skipSpace();
            char c = peek();
            return c == '\u00d7' ? '*' : c == '\u2212' ? '-' : c;
        }

        Node sum() throws ExpressionException {
            return chain(true);
        }

        /** A sum of products (additive) or a product of unary terms, as one list of terms. */
        Node chain(boolean additive) throws ExpressionException {
            Node first = additive ? chain(false) : unary();
            List<Node> terms = null;
            StringBuilder ops = null;
            List<Integer> offsets = null;
            for (char c = op(); additive ? c == '+' || c == '-' : c == '*' || c == '/'; c = op()) {
                if (terms == null) {
                    terms = new ArrayList<>();
                    terms.add(first);
                    ops = new StringBuilder();
                    offsets = new ArrayList<>();
                }
                offsets.add(pos++);
                ops.append(c);
                terms.add(additive ? chain(false) : unary());
            }
            return terms == null ? first
                    : new Chain(terms, ops.toString().toCharArray(), offsets.stream().mapToInt(Integer::intValue).toArray());
        }

        /** One more level of nesting at {@code at}; refused beyond {@link #MAX_DEPTH}. */
        void deeper(int at) throws ExpressionException {
            if (++depth > MAX_DEPTH) {
                throw new ExpressionException(at, "the expression nests more than " + MAX_DEPTH
                        + " levels of parentheses, function calls and signs; simplify it or use parameters");
            }
        }

        Node unary() throws ExpressionException {
            char c = op();
            if (c == '-' || c == '+') {
                int at = pos++;
                deeper(at);
                Node operand = unary();
                depth--;
                return c == '-' ? new Neg(operand, at) : operand;
            }
            return primary();
        }

        Node primary() throws ExpressionException {
            char c = op();
            int start = pos;
            if (c == '\0') {
                throw new ExpressionException(pos, pos == 0 ? "empty value" : "the expression ends where a value was expected");
            }
            if (Character.isDigit(c) || c == '.') {
                double v = number();
                return unitAfter(new Num(Quantity.plain(v), start));
            }
            if (c == '(') {
                deeper(pos);
                pos++;
                Node inner = sum();
                if (op() != ')') {
                    throw new ExpressionException(pos, "missing ')' for the '(' at character " + (start + 1));
                }
                pos++;
                depth--;
                return unitAfter(inner);
            }
            if (Character.isLetter(c) || c == '_') {
                String name = identifier();
                boolean call = op() == '(';
                if (call) {
                    if (!FUNCTIONS.contains(name)) {
                        throw new ExpressionException(start, "unknown function '" + Suggest.shown(name) + "'" + Suggest.didYouMean(name, FUNCTIONS)
                                + "; functions: " + String.join(", ", FUNCTIONS));
                    }
                    deeper(pos);
                    pos++;
                    List<Node> args = new ArrayList<>();
                    args.add(sum());
                    while (op() == ',') {
                        pos++;
                        args.add(sum());
                    }
                    if (op() != ')') {
                        throw new ExpressionException(pos, "missing ')' after the arguments of " + name);
                    }
                    pos++;
                    depth--;
                    return unitAfter(new Call(name, args, start));
                }
                if (FUNCTIONS.contains(name)) {
                    throw new ExpressionException(start, name + " is a function; write " + name + "(...)");
                }
                if (name.equals("pi")) {
                    return new Num(Quantity.plain(Math.PI), start);
                }
                Quantity unit = Units.unit(name);
                return unit != null ? new Num(unit, start) : new Ref(name, start);
            }
            throw new ExpressionException(pos, "unexpected '" + c + "'");
        }

        /** A unit written right after a number or a parenthesis multiplies it. */
        Node unitAfter(Node value) throws ExpressionException {
            skipSpace();
            char c = peek();
            if (!(Character.isLetter(c) || c == '_')) {
                return value;
            }
            int start = pos;
            String name = identifier();
            Quantity unit = Units.unit(name);
            if (unit != null) {
                return new WithUnit(value, name, start);
            }
            String hint = Suggest.closest(name, Units.all().keySet())
                    .map(u -> "unknown unit '" + Suggest.shown(name) + "' (did you mean '" + u + "'?)")
                    .orElse("'" + Suggest.shown(name) + "' is not a unit");
            throw new ExpressionException(start, hint + "; units: " + String.join(", ", Units.all().keySet())
                    + " (to multiply by a parameter write '*')");
        }

        String identifier() {
            int start = pos;
            while (pos < s.length() && (Character.isLetterOrDigit(s.charAt(pos)) || s.charAt(pos) == '_')) {
                pos++;
            }
            return s.substring(start, pos);
        }

        double number() throws ExpressionException {
            int start = pos;
            while (Character.isDigit(peek())) {
                pos++;
            }
            if (peek() == '.') {
                pos++;
                while (Character.isDigit(peek())) {
                    pos++;
                }
            }
            if ((peek() == 'e' || peek() == 'E') && pos + 1 < s.length()) {
                int save = pos;
                pos++;
                if (peek() == '+' || peek() == '-') {
                    pos++;
                }
                if (Character.isDigit(peek())) {
                    while (Character.isDigit(peek())) {
                        pos++;
                    }
                } else {
                    pos = save; // "2 e..." is not an exponent; leave it for the unit check
                }
            }
            String t = s.substring(start, pos);
            if (t.equals(".")) {
                throw new ExpressionException(start, "'.' is not a number");
            }
            return Double.parseDouble(t);
        }
    }
}
