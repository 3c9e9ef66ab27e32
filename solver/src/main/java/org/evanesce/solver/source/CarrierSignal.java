package org.evanesce.solver.source;

/**
 * A signal that is an envelope times a sinusoidal carrier, g(t) = e(t)·sin(2πf0(t − t0)). Sources
 * whose cells need the same signal with different delays and carrier phases (an incident beam
 * crossing a line at an angle) use the parts separately.
 */
public interface CarrierSignal extends TimeSignal {

    /** f0, Hz. */
    double carrierFrequency();

    /** The envelope e(t), t in seconds. */
    double envelope(double t);

    /** t0, s: the carrier is sin(2πf0(t − t0)). */
    double carrierOrigin();
}
