package org.evanesce.solver.source;

/** See {@link TimeSignal#rampedContinuous}. */
public record RampedContinuous(double frequency, double rampTime) implements TimeSignal {

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
        if (t <= 0) {
            return 0;
        }
        double ramp = t < rampTime ? 0.5 * (1 - Math.cos(Math.PI * t / rampTime)) : 1.0;
        return ramp * Math.sin(2 * Math.PI * frequency * t);
    }
}
