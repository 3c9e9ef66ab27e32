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

    /**
     * |G(f)| = |∫ g(t) e^{i2πft} dt| = ½√(2π)τ (e^{−(ω − ω0)²τ²/2} − e^{−(ω + ω0)²τ²/2}) for f ≥ 0, s: the
     * continuous Fourier integral of {@link #value}, which a sum over time steps of Δt ≪ τ equals up to aliases of
     * relative size e^{−(2πτ/Δt)²/2} (Poisson summation, common practice).
     */
    public double amplitudeSpectrum(double f) {
        double tau = tau();
        double a = 2 * Math.PI * (f - centreFrequency) * tau;
        double b = 2 * Math.PI * (f + centreFrequency) * tau;
        return 0.5 * Math.sqrt(2 * Math.PI) * tau * Math.abs(Math.exp(-0.5 * a * a) - Math.exp(-0.5 * b * b));
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
