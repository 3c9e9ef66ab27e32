package org.evanesce.io.casefile.sections;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.io.casefile.expr.Suggest;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.SequenceNode;

/** Reads the {@code flux} section into a {@link FluxSpec}. */
final class FluxReader {

    /** More frequencies than this is almost certainly a mistyped count; each costs two complex values per line cell. */
    static final int MAX_FREQUENCIES = 1000;

    private static final Map<String, FluxSpec.Measure> MEASURES = new LinkedHashMap<>();
    static final Map<String, Boolean> BOOLEANS = new LinkedHashMap<>();

    static {
        for (FluxSpec.Measure m : FluxSpec.Measure.values()) {
            MEASURES.put(m.caseName(), m);
        }
        BOOLEANS.put("true", Boolean.TRUE);
        BOOLEANS.put("false", Boolean.FALSE);
    }

    private final Context ctx;

    FluxReader(Context ctx) {
        this.ctx = ctx;
    }

    /**
     * @param node             the section, or null when the case has none
     * @param owner            where the {@code flux} key is
     * @param defaultFrequency used when the section lists no frequencies (the plane wave's centre), or null
     * @return the section, or null when absent or wrong (errors reported)
     */
    FluxSpec read(Node node, SourcePosition owner, Value defaultFrequency) {
        if (node == null) {
            return null;
        }
        MapView v = MapView.of(ctx, node, Schema.FLUX, "flux", owner);
        if (v == null) {
            return null;
        }
        List<Value> frequencies = frequencies(ctx, v, defaultFrequency, Schema.WAVELENGTH_RANGE, Schema.FREQUENCY_RANGE);
        boolean ok = frequencies != null;
        List<FluxSpec.Line> lines = lines(v.require("lines", "a list of lines such as '- {y: 2 um, measures: transmitted}'"),
                v.path("lines"));
        ok &= lines != null;
        Node tn = v.get("transfer_matrix");
        Located<Boolean> tmm = new Located<>(false, v.at());
        if (tn != null) {
            Boolean b = ctx.choice(tn, v.path("transfer_matrix"), BOOLEANS);
            ok &= b != null;
            tmm = new Located<>(b != null && b, ctx.pos(tn));
        }
        Located<FluxSpec.IncidentRun> run = incidentRun(ctx, v, true);
        ok &= run.value() != null;
        Node pn = v.get("reference_permittivity");
        Located<FluxSpec.ReferencePermittivity> eps = new Located<>(FluxSpec.ReferencePermittivity.DISCRETE, v.at());
        if (pn != null) {
            Map<String, FluxSpec.ReferencePermittivity> kinds = new LinkedHashMap<>();
            for (FluxSpec.ReferencePermittivity p : FluxSpec.ReferencePermittivity.values()) {
                kinds.put(p.caseName(), p);
            }
            FluxSpec.ReferencePermittivity p = ctx.choice(pn, v.path("reference_permittivity"), kinds);
            ok &= p != null;
            eps = new Located<>(p, ctx.pos(pn));
            if (p != null && !tmm.value()) {
                ctx.warn(ctx.pos(pn), v.path("reference_permittivity"), "has no effect with transfer_matrix: false "
                        + "(it chooses the permittivity of the exact answer's metals)");
            }
        }
        return ok ? new FluxSpec(frequencies, lines, tmm, v.at(), run, eps) : null;
    }

    /**
     * A section's {@code wavelengths} or {@code frequencies} (at most one of the two), as frequencies in
     * Hz; the default when neither is given.
     *
     * @return the frequencies, or null (errors reported, or neither given and no default)
     */
    /**
     * The {@code incident_run} key of a section ({@code flux}, {@code surfaces}): {@code auto} when absent; a null
     * value after an error (reported). {@code strip} (a plane wave's stepped strip) is a choice only where
     * {@code strip} is true (flux).
     */
    static Located<FluxSpec.IncidentRun> incidentRun(Context ctx, MapView v, boolean strip) {
        Node rn = v.get("incident_run");
        if (rn == null) {
            return new Located<>(FluxSpec.IncidentRun.AUTO, v.at());
        }
        Map<String, FluxSpec.IncidentRun> runs = new LinkedHashMap<>();
        for (FluxSpec.IncidentRun r : FluxSpec.IncidentRun.values()) {
            if (strip || r != FluxSpec.IncidentRun.STRIP) {
                runs.put(r.caseName(), r);
            }
        }
        return new Located<>(ctx.choice(rn, v.path("incident_run"), runs), ctx.pos(rn));
    }

    static List<Value> frequencies(Context ctx, MapView v, Value defaultFrequency, Schema.Section wavelengthRange,
                                   Schema.Section frequencyRange) {
        String how = v.oneOf(true, "wavelengths", "frequencies");
        if (how == null) {
            return defaultFrequency == null ? null : List.of(defaultFrequency);
        }
        boolean wl = how.equals("wavelengths");
        return spectrum(ctx, v.get(how), v.path(how), wl, wl ? wavelengthRange : frequencyRange);
    }

    /** The same for any section that takes wavelengths or frequencies, with its own range section. */
    static List<Value> spectrum(Context ctx, Node node, String path, boolean wavelengths, Schema.Section rangeSection) {
        Expect kind = wavelengths ? Expect.LENGTH : Expect.FREQUENCY;
        List<Value> given = new ArrayList<>();
        if (node instanceof SequenceNode s) {
            if (s.getValue().isEmpty()) {
                ctx.error(ctx.pos(node), path, "the list is empty; give at least one " + (wavelengths ? "wavelength" : "frequency"));
                return null;
            }
            boolean ok = true;
            for (int k = 0; k < s.getValue().size(); k++) {
                Value x = ctx.positive(s.getValue().get(k), path + "[" + k + "]", kind);
                ok &= x != null;
                given.add(x);
            }
            if (!ok) {
                return null;
            }
        } else if (node instanceof MappingNode) {
            MapView r = MapView.of(ctx, node, rangeSection, path, ctx.pos(node));
            if (r == null) {
                return null;
            }
            Node fn = r.require("from", "the first value");
            Node tn = r.require("to", "the last value");
            Node cn = r.require("count", "how many values, at least 2");
            Value from = fn == null ? null : ctx.positive(fn, r.path("from"), kind);
            Value to = tn == null ? null : ctx.positive(tn, r.path("to"), kind);
            Long count = cn == null ? null : ctx.whole(cn, r.path("count"), 2);
            if (from == null || to == null || count == null) {
                return null;
            }
            if (count > MAX_FREQUENCIES) {
                ctx.error(ctx.pos(cn), r.path("count"), "at most " + MAX_FREQUENCIES + " values, got " + count);
                return null;
            }
            for (long q = 0; q < count; q++) {
                // weights, not from + (to - from) t: the ends come out exactly and every value stays between them
                // (from = 1e20 m, to = 636 nm gave a last wavelength of 0 and an infinite frequency)
                double t = (double) q / (count - 1);
                double x = q == count - 1 ? to.si() : from.si() * (1 - t) + to.si() * t;
                given.add(new Value(x, q == 0 ? from.at() : q == count - 1 ? to.at() : ctx.pos(cn)));
            }
        } else {
            Value x = ctx.positive(node, path, kind);
            if (x == null) {
                return null;
            }
            given.add(x);
        }
        if (given.size() > MAX_FREQUENCIES) {
            ctx.error(ctx.pos(node), path, "at most " + MAX_FREQUENCIES + " values, got " + given.size());
            return null;
        }
        List<Value> out = new ArrayList<>();
        for (Value x : given) {
            out.add(wavelengths ? new Value(PhysicalConstants.C0 / x.si(), x.at()) : x);
        }
        return out;
    }

    private List<FluxSpec.Line> lines(Node node, String path) {
        if (node == null) {
            return null;
        }
        List<Node> items = ctx.list(node, path, "lines such as '- {y: 2 um, measures: transmitted}'");
        if (items == null) {
            return null;
        }
        if (items.isEmpty()) {
            ctx.error(ctx.pos(node), path, "give at least one line");
            return null;
        }
        List<FluxSpec.Line> out = new ArrayList<>();
        Map<String, FluxSpec.Line> names = new HashMap<>();
        Map<FluxSpec.Measure, Integer> perMeasure = new HashMap<>();
        boolean ok = true;
        List<MapView> views = new ArrayList<>();
        List<FluxSpec.Measure> measures = new ArrayList<>();
        for (int k = 0; k < items.size(); k++) {
            MapView v = MapView.of(ctx, items.get(k), Schema.FLUX_LINE, path + "[" + k + "]", ctx.pos(items.get(k)));
            views.add(v);
            FluxSpec.Measure m = null;
            if (v != null) {
                Node mn = v.require("measures", "transmitted or reflected");
                m = mn == null ? null : ctx.choice(mn, v.path("measures"), MEASURES);
            }
            measures.add(m);
            if (m != null) {
                perMeasure.merge(m, 1, Integer::sum);
            }
        }
        for (int k = 0; k < items.size(); k++) {
            MapView v = views.get(k);
            FluxSpec.Measure m = measures.get(k);
            if (v == null || m == null) {
                ok = false;
                continue;
            }
            Node nn = v.get("name");
            Located<String> name;
            if (nn == null) {
                if (perMeasure.get(m) > 1) {
                    ctx.error(v.at(), v.path("name"), String.format("%d lines measure '%s'; give each a name", perMeasure.get(m),
                            m.caseName()));
                    ok = false;
                    continue;
                }
                name = new Located<>(m.caseName(), v.at());
            } else {
                String text = ctx.text(nn, v.path("name"));
                if (text == null) {
                    ok = false;
                    continue;
                }
                if (!text.matches(Schema.NAME)) {
                    ctx.error(ctx.pos(nn), v.path("name"), "a line name heads columns of flux.csv: at most " + Schema.NAME_LENGTH
                            + " letters, digits, '_', '-' and '.', got '" + Suggest.shown(text) + "'");
                    ok = false;
                    continue;
                }
                name = new Located<>(text, ctx.pos(nn));
            }
            if (names.containsKey(name.value())) {
                ctx.error(name.at(), v.path("name"), "duplicate line name '" + name.value() + "', first used at line "
                        + names.get(name.value()).name().at().line());
                ok = false;
                continue;
            }
            Node yn = v.require("y", "the line's height, a length such as 2 um");
            Value y = yn == null ? null : ctx.value(yn, v.path("y"), Expect.LENGTH);
            if (y == null) {
                ok = false;
                continue;
            }
            FluxSpec.Line line = new FluxSpec.Line(name, y, new Located<>(m, v.at()), v.at());
            names.put(name.value(), line);
            out.add(line);
        }
        return ok ? out : null;
    }
}
