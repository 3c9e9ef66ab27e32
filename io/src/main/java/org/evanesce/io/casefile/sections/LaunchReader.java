package org.evanesce.io.casefile.sections;

import java.util.LinkedHashMap;
import java.util.Map;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.snakeyaml.engine.v2.nodes.Node;

/** Reads the sources launched one way from a horizontal line: {@code plane_wave} and {@code gaussian_beam}. */
final class LaunchReader {

    private static final Map<String, SourceSpec.Direction> DIRECTIONS = new LinkedHashMap<>();

    static {
        DIRECTIONS.put("up", SourceSpec.Direction.UP);
        DIRECTIONS.put("down", SourceSpec.Direction.DOWN);
    }

    private final Context ctx;
    private final SignalReader signals;

    LaunchReader(Context ctx, SignalReader signals) {
        this.ctx = ctx;
        this.signals = signals;
    }

    /**
     * @param polarization the case's, or null when it could not be read
     * @return the source, or null (errors reported)
     */
    SourceSpec read(KindEntry e, Polarization polarization) {
        boolean beam = e.kind().equals("gaussian_beam");
        MapView v = e.view(ctx, beam ? Schema.GAUSSIAN_BEAM : Schema.PLANE_WAVE);
        if (v == null) {
            return null;
        }
        Node yn = v.require("y", "the height of the launching line, a length such as -2 um");
        Value y = yn == null ? null : ctx.value(yn, v.path("y"), Expect.LENGTH);
        Value angle = SourceParts.angle(ctx, v);
        Node dn = v.get("direction");
        Located<SourceSpec.Direction> direction = new Located<>(SourceSpec.Direction.UP, v.at());
        if (dn != null) {
            SourceSpec.Direction d = ctx.choice(dn, v.path("direction"), DIRECTIONS);
            direction = d == null ? null : new Located<>(d, ctx.pos(dn));
        }
        Value amp = SourceParts.amplitude(ctx, v);
        SignalSpec signal = SourceParts.signal(ctx, signals, v, "pulse: {wavelength: 633 nm, bandwidth: 20 nm}");
        // launched waves drive the z component: Ez for s, Hz for p
        Located<Component> comp = polarization == null ? null
                : new Located<>(polarization == Polarization.S ? Component.EZ : Component.HZ, v.at());
        if (signal instanceof SignalSpec.GaussianDerivative) {
            ctx.error(signal.at(), v.path("signal"), String.format("a %s needs a narrow-band signal so that it means one angle "
                    + "and one beam near its centre frequency; expected pulse or ramped_wave", beam ? "Gaussian beam" : "plane wave"));
            return null;
        }
        if (!beam) {
            return y == null || angle == null || direction == null || amp == null || signal == null || comp == null ? null
                    : new SourceSpec.PlaneWave(y, angle, direction, comp, amp, signal, e.at());
        }
        Node wn = v.require("waist", "the waist radius (1/e of the field), a length such as 5 um");
        Value waist = wn == null ? null : ctx.positive(wn, v.path("waist"), Expect.LENGTH);
        Node pn = v.require("waist_at", "the waist's centre, a point [x, y]");
        Point waistAt = pn == null ? null : ctx.point(pn, v.path("waist_at"));
        return y == null || angle == null || direction == null || amp == null || signal == null || comp == null
                || waist == null || waistAt == null ? null
                : new SourceSpec.GaussianBeamSource(y, waist, waistAt, angle, direction, comp, amp, signal, e.at());
    }
}
