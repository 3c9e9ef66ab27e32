package org.evanesce.io.casefile.sections;

import java.util.Optional;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.snakeyaml.engine.v2.nodes.Node;

/** Reads {@code plane_wave_box}: a plane wave inside a rectangle (total field inside, scattered field outside). */
final class BoxReader {

    private final Context ctx;
    private final SignalReader signals;

    BoxReader(Context ctx, SignalReader signals) {
        this.ctx = ctx;
        this.signals = signals;
    }

    /**
     * @param polarization the case's, or null when it could not be read
     * @return the source, or null (errors reported)
     */
    SourceSpec read(KindEntry e, Polarization polarization) {
        MapView v = e.view(ctx, Schema.PLANE_WAVE_BOX);
        if (v == null) {
            return null;
        }
        Node fn = v.require("from", "one corner of the box, a point [x, y]");
        Point from = fn == null ? null : ctx.point(fn, v.path("from"));
        Node tn = v.require("to", "the opposite corner, a point [x, y]");
        Point to = tn == null ? null : ctx.point(tn, v.path("to"));
        Node hn = v.get("heading");
        Value heading = hn == null ? new Value(0, v.at()) : ctx.value(hn, v.path("heading"), Expect.ANGLE);
        Node rn = v.get("reference");
        Point reference = rn == null ? null : ctx.point(rn, v.path("reference"));
        Value amp = SourceParts.amplitude(ctx, v);
        SignalSpec signal = SourceParts.signal(ctx, signals, v, "ramped_wave: {wavelength: 633 nm}");
        if (signal != null && !(signal instanceof SignalSpec.RampedWave)) {
            ctx.error(signal.at(), v.path("signal"), "a plane-wave box takes a continuous wave for now; expected ramped_wave, "
                    + "got " + signal.kind());
            return null;
        }
        if (from != null && to != null && (from.x().si() == to.x().si() || from.y().si() == to.y().si())) {
            ctx.error(to.at(), v.path("to"), "the box needs a width and a height: 'from' and 'to' must differ in both x and y");
            return null;
        }
        Located<Component> comp = polarization == null ? null
                : new Located<>(polarization == Polarization.S ? Component.EZ : Component.HZ, v.at());
        if (from == null || to == null || heading == null || (rn != null && reference == null) || amp == null
                || signal == null || comp == null) {
            return null;
        }
        return new SourceSpec.PlaneWaveBox(from, to, heading, Optional.ofNullable(reference), comp, amp, signal, e.at());
    }
}
