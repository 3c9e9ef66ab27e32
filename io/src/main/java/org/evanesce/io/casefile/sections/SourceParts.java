package org.evanesce.io.casefile.sections;

import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.text.Value;
import org.snakeyaml.engine.v2.nodes.Node;

/** The keys every kind of source shares: amplitude, signal, and a tilt angle. */
final class SourceParts {

    private SourceParts() {
    }

    /** {@code amplitude}, 1 when absent; null when wrong (reported). */
    static Value amplitude(Context ctx, MapView v) {
        Node an = v.get("amplitude");
        Value a = an == null ? new Value(1, v.at()) : ctx.value(an, v.path("amplitude"), Expect.PLAIN);
        if (a != null && Math.abs(a.si()) > MAX_AMPLITUDE) {
            ctx.error(a.at(), v.path("amplitude"), "an amplitude of " + Units.number(a.si()) + " leaves the fields no room: "
                    + "single-precision fields hold values up to 3.4e38 and a source's field can grow well beyond its amplitude; "
                    + "expected at most " + Units.number(MAX_AMPLITUDE) + " (results are normalised, so 1 rarely needs changing)");
            return null;
        }
        return a;
    }

    /** The largest source amplitude: 1e30 leaves single-precision fields (up to 3.4e38) eight decades of growth. */
    static final double MAX_AMPLITUDE = 1e30;

    /** The required {@code signal}; null when missing or wrong (reported). */
    static SignalSpec signal(Context ctx, SignalReader signals, MapView v, String example) {
        Node sn = v.require("signal", "a signal such as '" + example + "'");
        if (sn == null) {
            return null;
        }
        KindEntry se = KindEntry.read(ctx, sn, Schema.SIGNAL, v.path("signal"));
        return se == null ? null : signals.read(se);
    }

    /** {@code angle}, 0 when absent, strictly between −90° and 90°; null when wrong (reported). */
    static Value angle(Context ctx, MapView v) {
        Node angn = v.get("angle");
        Value angle = angn == null ? new Value(0, v.at()) : ctx.value(angn, v.path("angle"), Expect.ANGLE);
        if (angle != null && !(Math.abs(angle.si()) < Math.PI / 2)) {
            ctx.error(angle.at(), v.path("angle"), "must lie strictly between -90 deg and 90 deg, got "
                    + Units.format(angle.si(), Dimension.ANGLE));
            return null;
        }
        return angle;
    }
}
