package org.evanesce.solver.source;

/**
 * A source's time dependence g(t), t in seconds. Implementations are immutable.
 */
public interface TimeSignal {

    /** The signal's value at time t (seconds). */
    double value(double t);

    /**
     * A Gaussian-modulated sinusoid g(t) = exp(−(t − t0)²/(2τ²)) · sin(2πf0 (t − t0)), whose
     * spectrum is a Gaussian of standard deviation σf = 1/(2πτ) around f0. The delay t0 = 6τ
     * starts the pulse at e^−18 of its peak.
     *
     * @param centreFrequency f0 in Hz
     * @param frequencyWidth  σf in Hz (standard deviation of the spectrum's amplitude)
     */
    static TimeSignal gaussianPulse(double centreFrequency, double frequencyWidth) {
        return new GaussianPulse(centreFrequency, frequencyWidth);
    }

    /**
     * A sinusoid sin(2πf t) switched on smoothly: multiplied by the half-cosine ramp
     * (1 − cos(πt/T))/2 for t &lt; T, then 1. The smooth start keeps the source's spectrum narrow.
     *
     * @param frequency f in Hz
     * @param rampTime  T in seconds (common practice: several periods)
     */
    static TimeSignal rampedContinuous(double frequency, double rampTime) {
        return new RampedContinuous(frequency, rampTime);
    }

    /**
     * The time derivative of a Gaussian, scaled to peak 1: g(t) = −(t − t0)/τ · exp(½ − (t − t0)²/(2τ²)),
     * with t0 = 6τ. It has no DC content; its spectrum peaks at f = 1/(2πτ).
     *
     * @param width τ in seconds
     */
    static TimeSignal differentiatedGaussian(double width) {
        return new DifferentiatedGaussian(width);
    }
}
