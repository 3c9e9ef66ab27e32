package org.evanesce.io.casefile.sections;

import org.evanesce.io.casefile.model.SampleSpec;
import org.evanesce.io.casefile.text.Scalar;
import org.evanesce.io.casefile.text.SourcePosition;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.ExpressionException;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Suggest;
import org.hipparchus.special.Erf;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.NodeTuple;

/**
 * Reads {@code sweep.sample}: {@code count} points drawn with {@code seed} from the distributions of
 * the named parameters, and the limits of {@code require}.
 */
final class SampleReader {

    /** A truncated normal keeping less than this share of its mass is refused (io.tolerance.Distribution's rule). */
    static final double MIN_MASS = 1e-3;
    /** The seed when none is given. */
    static final long DEFAULT_SEED = 1;

    private static final Map<String, SampleSpec.Kind> KINDS = new LinkedHashMap<>();

    static {
        KINDS.put("normal", SampleSpec.Kind.NORMAL);
        KINDS.put("uniform", SampleSpec.Kind.UNIFORM);
    }

    private final Context ctx;

    SampleReader(Context ctx) {
        this.ctx = ctx;
    }

    /** The sample, or null after reporting its errors. */
    SampleSpec read(Node node, String path, SourcePosition keyAt, long maxPoints) {
        MapView v = MapView.of(ctx, node, Schema.SAMPLE, path, keyAt);
        if (v == null) {
            return null;
        }
        Node cn = v.require("count", "a whole number of points, at least 2");
        Long count = cn == null ? null : ctx.whole(cn, v.path("count"), 2);
        if (count != null && count > maxPoints) {
            ctx.error(ctx.pos(cn), v.path("count"), "at most " + maxPoints + " points, got " + count);
            count = null;
        }
        Node sn = v.get("seed");
        Long seed = sn == null ? Long.valueOf(DEFAULT_SEED) : ctx.whole(sn, v.path("seed"), 0);
        Node pn = v.require("parameters", "a mapping of parameters to distributions such as "
                + "'gap: {distribution: normal, mean: 150 nm, standard_deviation: 5 nm}'");
        List<SampleSpec.Varied> varied = new ArrayList<>();
        boolean ok = true;
        if (pn != null) {
            if (!(pn instanceof MappingNode m) || m.getValue().isEmpty()) {
                ctx.error(ctx.pos(pn), v.path("parameters"), "expected a mapping of parameters to distributions such as "
                        + "'gap: {distribution: normal, mean: 150 nm, standard_deviation: 5 nm}', got " + Context.describe(pn));
                ok = false;
            } else {
                ok &= MapView.readNamed(ctx, m, v.path("parameters"), this::varied, varied);
            }
        }
        List<SampleSpec.Limit> limits = new ArrayList<>();
        Node rn = v.get("require");
        if (rn != null) {
            if (!(rn instanceof MappingNode m) || m.getValue().isEmpty()) {
                ctx.error(ctx.pos(rn), v.path("require"), "expected a mapping of result columns to limits such as "
                        + "'T_back: {min: 0.45, max: 0.55}', got " + Context.describe(rn));
                ok = false;
            } else {
                for (NodeTuple t : m.getValue()) {
                    String column = MapView.keyText(ctx, t.getKeyNode(), v.path("require"));
                    if (column == null) {
                        ok = false;
                        continue;
                    }
                    SampleSpec.Limit l = limit(column, t.getValueNode(), v.path("require") + "." + column,
                            ctx.pos(t.getKeyNode()));
                    ok &= l != null;
                    if (l != null) {
                        limits.add(l);
                    }
                }
            }
        }
        if (!ok || count == null || seed == null || pn == null) {
            return null;
        }
        return new SampleSpec((int) (long) count, seed, varied, limits, keyAt);
    }

    private SampleSpec.Varied varied(String name, Node node, String path, SourcePosition keyAt) {
        Quantity current;
        try {
            current = ctx.parameters.lookup(name, 0);
        } catch (ExpressionException e) {
            if (!e.isQuiet()) {
                var defined = ctx.parameters.resolved().keySet();
                ctx.error(keyAt, path, "the case has no parameter '" + name + "' to draw" + Suggest.didYouMean(name, defined)
                        + (defined.isEmpty() ? "; define it under parameters" : "; it defines " + String.join(", ", defined)));
            }
            return null;
        }
        MapView v = MapView.of(ctx, node, Schema.SAMPLE_PARAMETER, path, keyAt);
        if (v == null) {
            return null;
        }
        Node dn = v.require("distribution", "normal or uniform");
        SampleSpec.Kind kind = dn == null ? null : ctx.choice(dn, v.path("distribution"), KINDS);
        Quantity mean = of(v, "mean", name, current);
        Quantity sd = of(v, "standard_deviation", name, current);
        Quantity low = of(v, "low", name, current);
        Quantity high = of(v, "high", name, current);
        if (kind == null || v.has("mean") && mean == null || v.has("standard_deviation") && sd == null
                || v.has("low") && low == null || v.has("high") && high == null) {
            return null;
        }
        String def = definition(v, kind);
        if (kind == SampleSpec.Kind.UNIFORM) {
            if (mean != null || sd != null) {
                ctx.error(v.keyAt(mean != null ? "mean" : "standard_deviation"), v.path(mean != null ? "mean" : "standard_deviation"),
                        "a uniform distribution takes low and high only");
                return null;
            }
            if (low == null || high == null) {
                ctx.error(v.at(), path, "a uniform distribution needs low and high");
                return null;
            }
            if (!(high.value() > low.value())) {
                ctx.error(v.keyAt("high"), v.path("high"), "high (" + high + ") must be larger than low (" + low + ")");
                return null;
            }
            return new SampleSpec.Varied(name, current.dimension(), kind, Double.NaN, Double.NaN, low.value(), high.value(), def,
                    keyAt);
        }
        if (mean == null || sd == null) {
            ctx.error(v.at(), path, "a normal distribution needs mean and standard_deviation (low and high truncate it)");
            return null;
        }
        if (!(sd.value() > 0)) {
            ctx.error(v.keyAt("standard_deviation"), v.path("standard_deviation"), "must be positive, got " + sd);
            return null;
        }
        double lo = low == null ? Double.NEGATIVE_INFINITY : low.value();
        double hi = high == null ? Double.POSITIVE_INFINITY : high.value();
        double mass = cdf((hi - mean.value()) / sd.value()) - cdf((lo - mean.value()) / sd.value());
        if (!(hi > lo) || mass < MIN_MASS) {
            ctx.error(v.at(), path, String.format(Locale.ROOT, "low and high keep %.2g of the normal distribution's mass; "
                    + "expected low < high around the mean, keeping at least %.0e of it", hi > lo ? mass : 0.0, MIN_MASS));
            return null;
        }
        return new SampleSpec.Varied(name, current.dimension(), kind, mean.value(), sd.value(), lo, hi, def, keyAt);
    }

    /** The standard normal distribution function, Φ(z) = (1 + erf(z/√2))/2 (Abramowitz & Stegun 26.2.29). */
    private static double cdf(double z) {
        return z == Double.POSITIVE_INFINITY ? 1 : z == Double.NEGATIVE_INFINITY ? 0 : 0.5 * (1 + Erf.erf(z / Math.sqrt(2)));
    }

    private String definition(MapView v, SampleSpec.Kind kind) {
        List<String> parts = new ArrayList<>(List.of("distribution: " + kind.name().toLowerCase(Locale.ROOT)));
        for (String k : List.of("mean", "standard_deviation", "low", "high")) {
            if (v.has(k) && v.get(k) instanceof org.snakeyaml.engine.v2.nodes.ScalarNode s) {
                parts.add(k + ": " + s.getValue().strip());
            }
        }
        return "{" + String.join(", ", parts) + "}";
    }

    /** The key's value, of the parameter's kind; null when absent or wrong (reported). */
    private Quantity of(MapView v, String key, String name, Quantity current) {
        Node n = v.get(key);
        if (n == null) {
            return null;
        }
        Scalar s = ctx.scalar(n, v.path(key), "an expression of the parameter's kind, " + current.dimension().describe()
                + " such as " + current);
        if (s == null) {
            return null;
        }
        Quantity q = ctx.quantity(s, v.path(key));
        if (q != null && !q.dimension().equals(current.dimension())) {
            String got = q.dimension().isNone() ? Context.noUnit(s, q) : "got " + q + " (" + q.dimension().describe() + ")";
            ctx.error(s.start(), v.path(key), got + ", expected " + current.dimension().describe() + " like the parameter "
                    + name + " (" + current + ")");
            return null;
        }
        return q;
    }

    private SampleSpec.Limit limit(String column, Node node, String path, SourcePosition keyAt) {
        if (!column.matches("[A-Za-z_][A-Za-z0-9_]*")) {
            ctx.error(keyAt, path, "a result column of sweep.csv is letters, digits and '_', such as T_back");
            return null;
        }
        MapView v = MapView.of(ctx, node, Schema.SAMPLE_LIMIT, path, keyAt);
        if (v == null) {
            return null;
        }
        Double min = number(v, "min");
        Double max = number(v, "max");
        if (v.has("min") && min == null || v.has("max") && max == null) {
            return null;
        }
        if (min == null && max == null) {
            ctx.error(v.at(), path, "needs min, max or both");
            return null;
        }
        double lo = min == null ? Double.NEGATIVE_INFINITY : min;
        double hi = max == null ? Double.POSITIVE_INFINITY : max;
        if (!(hi > lo)) {
            ctx.error(v.keyAt("max"), v.path("max"), "max (" + hi + ") must be larger than min (" + lo + ")");
            return null;
        }
        return new SampleSpec.Limit(column, lo, hi, keyAt);
    }

    private Double number(MapView v, String key) {
        Node n = v.get(key);
        if (n == null) {
            return null;
        }
        Scalar s = ctx.scalar(n, v.path(key), "a plain number such as 0.45");
        if (s == null) {
            return null;
        }
        Quantity q = ctx.quantity(s, v.path(key));
        if (q == null) {
            return null;
        }
        if (!q.dimension().equals(Dimension.NONE) || !Double.isFinite(q.value())) {
            ctx.error(s.start(), v.path(key), "expected a plain number (the columns are ratios without unit), got " + q);
            return null;
        }
        return q.value();
    }
}
