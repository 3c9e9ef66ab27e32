package org.evanesce.solver.source;

/** See {@link TimeSignal#rampedContinuous}. */
public record RampedContinuous(double frequency, double rampTime) implements CarrierSignal {

    public RampedContinuous {
        if (!(frequency > 0) || Double.isInfinite(frequency)) {
            throw new IllegalArgumentException(String.format("frequency %g Hz must be finite and > 0", frequency));
        }
        if (!(rampTime >= 0) || Double.isInfinite(rampTime)) {
            throw new IllegalArgumentException(String.format("ramp time %g s must be finite and >= 0", rampTime));
        }
    }

    @Override
    public double value(double t) {
        return envelope(t) * Math.sin(2 * Math.PI * frequency * t);
    }

    @Override
    public double carrierFrequency() {
        return frequency;
    }

    /** 0 before t = 0, the half-cosine ramp up to the ramp time, then 1. */
    @Override
    public double envelope(double t) {
        if (t <= 0) {
            return 0;
        }
        return t < rampTime ? 0.5 * (1 - Math.cos(Math.PI * t / rampTime)) : 1.0;
    }

    @Override
    public double carrierOrigin() {
        return 0;
    }
}
