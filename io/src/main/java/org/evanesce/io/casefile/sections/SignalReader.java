package org.evanesce.io.casefile.sections;

import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.text.Scalar;
import org.evanesce.io.casefile.text.Value;
import org.snakeyaml.engine.v2.nodes.Node;

/** Reads a source's {@code signal} into a {@link SignalSpec}, frequencies in Hz and times in seconds. */
final class SignalReader {

    /** Ramp of a ramped wave when none is given, in periods of the wave (common practice: several). */
    static final double DEFAULT_RAMP_PERIODS = 5;

    private final Context ctx;

    SignalReader(Context ctx) {
        this.ctx = ctx;
    }

    SignalSpec read(KindEntry e) {
        Schema.Section section = switch (e.kind()) {
            case "pulse" -> Schema.PULSE;
            case "ramped_wave" -> Schema.RAMPED_WAVE;
            default -> Schema.GAUSSIAN_DERIVATIVE;
        };
        MapView v = e.view(ctx, section);
        if (v == null) {
            return null;
        }
        Value f = frequency(v);
        switch (e.kind()) {
            case "pulse": {
                Node bn = v.require("bandwidth", "a wavelength span such as 40 nm or a frequency span such as 30 THz");
                Value bw = bn == null || f == null ? null : bandwidth(bn, v.path("bandwidth"), f);
                return f == null || bw == null ? null : new SignalSpec.Pulse(f, bw, e.at());
            }
            case "ramped_wave": {
                Node rn = v.get("ramp");
                if (f == null) {
                    return null;
                }
                Value ramp;
                if (rn == null) {
                    ramp = new Value(DEFAULT_RAMP_PERIODS / f.si(), v.at());
                } else {
                    Scalar s = ctx.scalar(rn, v.path("ramp"), "a time such as 20 fs or a number of periods");
                    Quantity q = s == null ? null : ctx.quantity(s, v.path("ramp"));
                    if (q == null) {
                        return null;
                    }
                    if (q.dimension().isNone()) {
                        ramp = new Value(q.value() / f.si(), s.start());
                    } else if (q.dimension().equals(Dimension.TIME)) {
                        ramp = new Value(q.value(), s.start());
                    } else {
                        ctx.error(s.start(), v.path("ramp"), "got " + q + " (" + q.dimension().describe()
                                + "), expected a time such as 20 fs or a plain number of periods");
                        return null;
                    }
                    if (!(ramp.si() > 0)) {
                        ctx.error(s.start(), v.path("ramp"), "must be positive, got " + q);
                        return null;
                    }
                }
                return new SignalSpec.RampedWave(f, ramp, e.at());
            }
            default:
                return f == null ? null : new SignalSpec.GaussianDerivative(f, e.at());
        }
    }

    /** The signal's frequency from {@code wavelength} (vacuum) or {@code frequency}. */
    private Value frequency(MapView v) {
        String key = v.oneOf(false, "wavelength", "frequency");
        if (key == null) {
            return null;
        }
        if (key.equals("wavelength")) {
            Value wl = ctx.positive(v.get("wavelength"), v.path("wavelength"), Expect.LENGTH);
            if (wl == null) {
                return null;
            }
            return finiteReciprocal(new Value(PhysicalConstants.C0 / wl.si(), wl.at()), v.path("wavelength"), wl.si(),
                    Dimension.LENGTH);
        }
        Value f = ctx.positive(v.get("frequency"), v.path("frequency"), Expect.FREQUENCY);
        return f == null ? null : finiteReciprocal(f, v.path("frequency"), f.si(), Dimension.FREQUENCY);
    }

    /** The frequency, unless it or the wavelength c0/f is too large for a number (an error then, null). */
    private Value finiteReciprocal(Value f, String path, double given, Dimension kind) {
        if (!Double.isFinite(f.si()) || !Double.isFinite(PhysicalConstants.C0 / f.si())) {
            ctx.error(f.at(), path, Units.format(given, kind) + " gives a " + (kind == Dimension.LENGTH ? "frequency" : "wavelength")
                    + " too large for a number; expected an optical " + (kind == Dimension.LENGTH ? "wavelength" : "frequency"));
            return null;
        }
        return f;
    }

    /**
     * A pulse's bandwidth (full width at half maximum of its power spectrum) in Hz. A wavelength span
     * Δλ around λ0 becomes the frequency span between its ends, c/(λ0 − Δλ/2) − c/(λ0 + Δλ/2).
     */
    private Value bandwidth(Node node, String path, Value f) {
        Scalar s = ctx.scalar(node, path, "a wavelength span such as 40 nm or a frequency span such as 30 THz");
        Quantity q = s == null ? null : ctx.quantity(s, path);
        if (q == null) {
            return null;
        }
        if (!(q.value() > 0)) {
            ctx.error(s.start(), path, "must be positive, got " + q);
            return null;
        }
        if (q.dimension().equals(Dimension.FREQUENCY)) {
            return new Value(q.value(), s.start());
        }
        if (q.dimension().equals(Dimension.LENGTH)) {
            double wl = PhysicalConstants.C0 / f.si();
            if (q.value() >= 2 * wl) {
                ctx.error(s.start(), path, "a span of " + q + " around " + Units.format(wl, Dimension.LENGTH) + " reaches zero wavelength; expected less than "
                        + Units.format(2 * wl, Dimension.LENGTH));
                return null;
            }
            double c = PhysicalConstants.C0;
            double width = c / (wl - q.value() / 2) - c / (wl + q.value() / 2);
            if (!(width > 0) || Double.isInfinite(width)) {
                ctx.error(s.start(), path, "a span of " + q + " around " + Units.format(wl, Dimension.LENGTH)
                        + " gives no frequency width that a number can hold; expected a wavelength and a span of a few percent of it");
                return null;
            }
            return new Value(width, s.start());
        }
        ctx.error(s.start(), path, (q.dimension().isNone() ? Context.noUnit(s, q) : "got " + q + " (" + q.dimension().describe() + ")")
                + ", expected a wavelength span such as 40 nm or a frequency span such as 30 THz");
        return null;
    }
}
