package org.evanesce.io.casefile.sections;

import org.evanesce.io.casefile.model.PolarizationChoice;
import org.evanesce.io.casefile.model.SampleSpec;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.expr.ExpressionException;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Suggest;
import org.evanesce.io.casefile.model.SweepSpec;
import org.evanesce.io.casefile.text.Scalar;
import org.evanesce.io.casefile.text.SourcePosition;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.NodeTuple;
import org.snakeyaml.engine.v2.nodes.ScalarNode;
import org.snakeyaml.engine.v2.nodes.SequenceNode;

/**
 * Reads the top-level {@code sweep} section: each key names a parameter the case defines, with a
 * list of expressions or a range ({@code from}, {@code to}, {@code count}, {@code spacing}) of the
 * parameter's kind, and {@code combine} says how the values make points. Range values become
 * expression texts (up to {@value #DIGITS} significant digits in the unit people read best), so that
 * every point is a plain set of {@code --set name=value} overrides.
 *
 * <p>The section is taken out of the root mapping before the case proper is read ({@link #take}), and
 * read once the parameters are known ({@link #read}). The other commands run the case as written; a
 * note says so.
 */
final class SweepReader {

    /** The most points a sweep may have. */
    static final long MAX_POINTS = 100_000;
    /** Significant digits of the values a range writes. */
    static final int DIGITS = 12;
    /**
     * A linear range's value closer to zero than this fraction of its larger end is zero: the sum
     * of the ends' shares leaves round-off where the exact value is 0.
     */
    static final double ZERO_FRACTION = 1e-12;

    private static final Map<String, SweepSpec.Combine> COMBINES = new LinkedHashMap<>();
    private static final Map<String, Boolean> SPACINGS = new LinkedHashMap<>();

    static {
        for (SweepSpec.Combine c : SweepSpec.Combine.values()) {
            COMBINES.put(c.caseName(), c);
        }
        SPACINGS.put("linear", false);
        SPACINGS.put("log", true);
    }

    private final Context ctx;
    private NodeTuple entry;

    SweepReader(Context ctx) {
        this.ctx = ctx;
    }

    /** The root mapping without its {@code sweep} key (kept for {@link #read}); other roots unchanged. */
    Node take(Node root) {
        if (!(root instanceof MappingNode m)) {
            return root;
        }
        List<NodeTuple> rest = new ArrayList<>();
        for (NodeTuple t : m.getValue()) {
            if (t.getKeyNode() instanceof ScalarNode s && s.getValue().equals("sweep")) {
                if (entry != null) {
                    ctx.error(ctx.pos(t.getKeyNode()), "sweep", "duplicate key, first given at line " + ctx.pos(entry.getKeyNode()).line());
                } else {
                    entry = t;
                }
            } else {
                rest.add(t);
            }
        }
        return entry == null ? root
                : new MappingNode(m.getTag(), true, rest, m.getFlowStyle(), m.getStartMark(), m.getEndMark());
    }

    /** The sweep, or null when the case has none or it has errors (reported). */
    SweepSpec read() {
        if (entry == null) {
            return null;
        }
        SourcePosition at = ctx.pos(entry.getKeyNode());
        MapView v = MapView.of(ctx, entry.getValueNode(), Schema.SWEEP, "sweep", at);
        if (v == null) {
            return null;
        }
        if (v.has("sample")) {
            return sample(v, at);
        }
        Node cn = v.get("combine");
        SweepSpec.Combine combine = cn == null ? SweepSpec.Combine.PRODUCT : ctx.choice(cn, v.path("combine"), COMBINES);
        Node pn = v.require("parameters", "a mapping of parameters to values such as 'gap: {from: 100 nm, to: 300 nm, count: 5}'");
        if (pn == null) {
            return null;
        }
        if (!(pn instanceof MappingNode m) || m.getValue().isEmpty()) {
            ctx.error(ctx.pos(pn), v.path("parameters"), "expected a mapping of parameters to values such as "
                    + "'gap: {from: 100 nm, to: 300 nm, count: 5}' or 'theta: [40 deg, 45 deg]', got " + Context.describe(pn));
            return null;
        }
        List<SweepSpec.Axis> axes = new ArrayList<>();
        boolean ok = MapView.readNamed(ctx, m, v.path("parameters"), this::axis, axes);
        if (!ok || combine == null) {
            return null;
        }
        if (combine == SweepSpec.Combine.ZIP) {
            for (SweepSpec.Axis a : axes) {
                if (a.values().size() != axes.get(0).values().size()) {
                    List<String> counts = axes.stream().map(x -> x.name() + " has " + x.values().size()).toList();
                    ctx.error(ctx.pos(cn), v.path("combine"), "zip takes the n-th value of every parameter, so all need the "
                            + "same number of values; " + String.join(", ", counts) + " (use product for every combination)");
                    return null;
                }
            }
        }
        double points = combine == SweepSpec.Combine.ZIP ? axes.get(0).values().size() : 1;
        for (SweepSpec.Axis a : axes) {
            points *= combine == SweepSpec.Combine.ZIP ? 1 : a.values().size();
        }
        if (points > MAX_POINTS) {
            ctx.error(at, "sweep", String.format(Locale.ROOT, "%.0f points, more than the %d a sweep may have; split it into "
                    + "several sweeps", points, MAX_POINTS));
            return null;
        }
        SweepSpec s = new SweepSpec(axes, combine, at);
        ctx.note(at, "sweep", String.format(Locale.ROOT, "%d points (%s of %s); this command uses the case as written, "
                + "'evanesce sweep' runs the points", s.pointCount(), combine.caseName(),
                String.join(", ", axes.stream().map(SweepSpec.Axis::name).toList())));
        return s;
    }

    /** The sample form: its parameters become axes without listed values, the points are drawn ({@link SampleSpec}). */
    private SweepSpec sample(MapView v, SourcePosition at) {
        for (String k : List.of("parameters", "combine")) {
            if (v.has(k)) {
                ctx.error(v.keyAt(k), v.path(k), "a sweep has either listed values (parameters, combine) or a sample, not "
                        + "both; move the parameters into sample.parameters as distributions");
                return null;
            }
        }
        SampleSpec sample = new SampleReader(ctx).read(v.get("sample"), v.path("sample"), v.keyAt("sample"), MAX_POINTS);
        if (sample == null) {
            return null;
        }
        List<SweepSpec.Axis> axes = new ArrayList<>();
        for (SampleSpec.Varied x : sample.parameters()) {
            axes.add(new SweepSpec.Axis(x.name(), x.dimension(), List.of(), x.definition() + ", " + sample.count()
                    + " samples, seed " + sample.seed(), x.at()));
        }
        SweepSpec s = new SweepSpec(axes, SweepSpec.Combine.ZIP, at, java.util.Optional.of(sample));
        ctx.note(at, "sweep", String.format(Locale.ROOT, "%d points drawn at random (seed %d) for %s; this command uses the "
                + "case as written, 'evanesce sweep' runs the points", sample.count(), sample.seed(),
                String.join(", ", axes.stream().map(SweepSpec.Axis::name).toList())));
        return s;
    }

    private SweepSpec.Axis axis(String name, Node node, String path, SourcePosition keyAt) {
        if (name.equals(PolarizationChoice.KEY) && !ctx.parameters.resolved().containsKey(name)) {
            return polarizations(node, path, keyAt);
        }
        Quantity current;
        try {
            current = ctx.parameters.lookup(name, 0);
        } catch (ExpressionException e) {
            if (!e.isQuiet()) {
                var defined = ctx.parameters.resolved().keySet();
                ctx.error(keyAt, path, "the case has no parameter '" + name + "' to sweep" + Suggest.didYouMean(name, defined)
                        + (defined.isEmpty() ? "; define it under parameters" : "; it defines " + String.join(", ", defined)));
            }
            return null;
        }
        if (node instanceof SequenceNode list) {
            return list(name, current, list, path, keyAt);
        }
        if (node instanceof MappingNode) {
            return range(name, current, MapView.of(ctx, node, Schema.SWEEP_RANGE, path, keyAt), keyAt);
        }
        ctx.error(ctx.pos(node), path, "expected a list of values such as [40 deg, 45 deg] or a range such as "
                + "{from: 100 nm, to: 300 nm, count: 5}, got " + Context.describe(node));
        return null;
    }

    /** The case's polarization as a swept value: a list of s, p and both. */
    private SweepSpec.Axis polarizations(Node node, String path, SourcePosition keyAt) {
        String need = "a list of polarizations such as [s, p]";
        if (!(node instanceof SequenceNode list) || list.getValue().isEmpty()) {
            ctx.error(ctx.pos(node), path, "expected " + need + " (s, p or both), got " + Context.describe(node));
            return null;
        }
        List<String> values = new ArrayList<>();
        boolean ok = true;
        for (int k = 0; k < list.getValue().size(); k++) {
            PolarizationChoice c = ctx.choice(list.getValue().get(k), path + "[" + k + "]", PolarizationChoice.BY_NAME);
            ok &= c != null;
            if (c != null) {
                values.add(c.caseName());
            }
        }
        return ok ? new SweepSpec.Axis(PolarizationChoice.KEY, Dimension.NONE, values, "[" + String.join(", ", values) + "]",
                keyAt) : null;
    }

    private SweepSpec.Axis list(String name, Quantity current, SequenceNode list, String path, SourcePosition keyAt) {
        if (list.getValue().isEmpty()) {
            ctx.error(ctx.pos(list), path, "an empty list; give at least one value");
            return null;
        }
        List<String> values = new ArrayList<>();
        boolean ok = true;
        for (int k = 0; k < list.getValue().size(); k++) {
            String p = path + "[" + k + "]";
            Scalar s = ctx.scalar(list.getValue().get(k), p, "an expression " + example(current));
            if (s == null || of(s, p, name, current) == null) {
                ok = false;
                continue;
            }
            values.add(s.text().strip());
        }
        return ok ? new SweepSpec.Axis(name, current.dimension(), values, "[" + String.join(", ", values) + "]", keyAt) : null;
    }

    private SweepSpec.Axis range(String name, Quantity current, MapView v, SourcePosition keyAt) {
        if (v == null) {
            return null;
        }
        String need = "an expression " + example(current);
        Scalar fs = ctx.scalar(v.require("from", need), v.path("from"), need);
        Scalar ts = ctx.scalar(v.require("to", need), v.path("to"), need);
        Node cn = v.require("count", "a whole number of values, at least 2");
        Long count = cn == null ? null : ctx.whole(cn, v.path("count"), 2);
        Node sn = v.get("spacing");
        Boolean log = sn == null ? Boolean.FALSE : ctx.choice(sn, v.path("spacing"), SPACINGS);
        Quantity from = fs == null ? null : of(fs, v.path("from"), name, current);
        Quantity to = ts == null ? null : of(ts, v.path("to"), name, current);
        if (count != null && count > MAX_POINTS) {
            ctx.error(ctx.pos(cn), v.path("count"), "at most " + MAX_POINTS + " values, got " + count);
            return null;
        }
        if (from == null || to == null || count == null || log == null) {
            return null;
        }
        double a = from.value();
        double b = to.value();
        if (log && !(a * b > 0)) {
            ctx.error(ctx.pos(sn), v.path("spacing"), "a logarithmic range needs both ends non-zero and of the same sign, got from "
                    + from + " to " + to + " (use spacing: linear, or move the ends)");
            return null;
        }
        List<String> values = new ArrayList<>();
        int n = (int) (long) count;
        for (int k = 0; k < n; k++) {
            double t = (double) k / (n - 1);
            double x;
            if (k == 0) {
                x = a;
            } else if (k == n - 1) {
                x = b;
            } else if (log) {
                x = a * Math.pow(b / a, t);
            } else {
                x = a * (1 - t) + b * t;
                if (Math.abs(x) < ZERO_FRACTION * Math.max(Math.abs(a), Math.abs(b))) {
                    x = 0;
                }
            }
            values.add(literal(x, current.dimension()));
        }
        String definition = "{from: " + fs.text().strip() + ", to: " + ts.text().strip() + ", count: " + n + ", spacing: "
                + (log ? "log" : "linear") + "}";
        return new SweepSpec.Axis(name, current.dimension(), values, definition, keyAt);
    }

    /** The value of {@code s}, which must have the parameter's kind; null after reporting. */
    private Quantity of(Scalar s, String path, String name, Quantity current) {
        Quantity q = ctx.quantity(s, path);
        if (q == null) {
            return null;
        }
        if (!q.dimension().equals(current.dimension())) {
            String got = q.dimension().isNone() ? Context.noUnit(s, q) : "got " + q + " (" + q.dimension().describe() + ")";
            ctx.error(s.start(), path, got + ", expected " + current.dimension().describe() + " like the parameter " + name
                    + " (" + current + ")");
            return null;
        }
        return q;
    }

    private static String example(Quantity current) {
        return "of the parameter's kind, " + current.dimension().describe() + " such as " + current;
    }

    /**
     * An expression text for the SI value {@code si} of kind {@code d}: lengths in nm, um, mm or m,
     * times in fs, ps, ns or s, frequencies in Hz, GHz, THz or PHz, angles in degrees, other kinds as
     * a number times SI units. {@value #DIGITS} significant digits, trailing zeros removed.
     */
    static String literal(double si, Dimension d) {
        if (si == 0 && d.equals(Dimension.LENGTH)) {
            return "0 nm"; // a zero among nanometre gaps reads best in their unit (Units.format says 0 um)
        }
        if (d.isNone() || d.equals(Dimension.LENGTH) || d.equals(Dimension.TIME) || d.equals(Dimension.FREQUENCY)
                || d.equals(Dimension.ANGLE) || d.equals(Dimension.CONDUCTIVITY)) {
            return Units.format(si, d, DIGITS);
        }
        StringBuilder sb = new StringBuilder(Units.number(si, DIGITS));
        units(sb, "m", d.length());
        units(sb, "s", d.time());
        units(sb, "rad", d.angle());
        units(sb, "S", d.siemens());
        return sb.toString();
    }

    private static void units(StringBuilder sb, String unit, int exponent) {
        for (int k = 0; k < Math.abs(exponent); k++) {
            sb.append(exponent > 0 ? " * " : " / ").append(unit);
        }
    }
}
