package org.evanesce.solver.source;

/** See {@link TimeSignal#gaussianPulse}. */
public record GaussianPulse(double centreFrequency, double frequencyWidth) implements CarrierSignal {

    public GaussianPulse {
        if (!(centreFrequency >= 0) || Double.isInfinite(centreFrequency)) {
            throw new IllegalArgumentException(String.format("pulse centre frequency %g Hz must be finite and >= 0", centreFrequency));
        }
        if (!(frequencyWidth > 0) || Double.isInfinite(frequencyWidth)) {
            throw new IllegalArgumentException(String.format("pulse frequency width %g Hz must be finite and > 0", frequencyWidth));
        }
    }

    /** τ = 1/(2πσf), seconds. */
    public double tau() {
        return 1.0 / (2 * Math.PI * frequencyWidth);
    }

    /** The delay of the peak, 6τ. */
    public double delay() {
        return 6 * tau();
    }

    @Override
    public double value(double t) {
        double u = (t - delay()) / tau();
        return Math.exp(-0.5 * u * u) * Math.sin(2 * Math.PI * centreFrequency * (t - delay()));
    }

    @Override
    public double carrierFrequency() {
        return centreFrequency;
    }

    @Override
    public double envelope(double t) {
        double u = (t - delay()) / tau();
        return Math.exp(-0.5 * u * u);
    }

    @Override
    public double carrierOrigin() {
        return delay();
    }
}
