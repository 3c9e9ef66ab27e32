package org.evanesce.io.casefile.model;

import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

import static org.evanesce.geometry.PhysicalConstants.C0;

/**
 * A source's time dependence, frequencies in Hz and times in seconds. Wavelengths in the case file
 * are vacuum wavelengths, converted with the speed of light c0 = 299 792 458 m/s.
 */
public sealed interface SignalSpec {

    /** The frequency the signal is built around (centre, carrier or spectral peak), Hz. */
    Value frequency();

    /** Where the signal's entry starts. */
    SourcePosition at();

    /** The case-file kind, e.g. {@code pulse}. */
    String kind();

    /** The shortest vacuum wavelength the signal carries with significant power, metres. */
    double shortestWavelength();

    /** When the signal reaches its peak (a pulse) or its full amplitude (a ramped wave), seconds after the start. */
    double peakTime();

    /** Vacuum wavelength at {@link #frequency()}, metres. */
    default double wavelength() {
        return C0 / frequency().si();
    }

    /**
     * A Gaussian-modulated sinusoid around {@code frequency}; {@code bandwidth} is the full width
     * at half maximum of its power spectrum, Hz.
     */
    record Pulse(Value frequency, Value bandwidth, SourcePosition at) implements SignalSpec {

        @Override
        public String kind() {
            return "pulse";
        }

        /**
         * Standard deviation σf of the amplitude spectrum exp(−(f − f0)²/(2σf²)), Hz: its power
         * spectrum exp(−(f − f0)²/σf²) is half its peak at f − f0 = ±σf √(ln 2).
         */
        public double spectrumSigma() {
            return bandwidth.si() / (2 * Math.sqrt(Math.log(2)));
        }

        @Override
        public double shortestWavelength() {
            return C0 / (frequency.si() + bandwidth.si() / 2);
        }

        /** The envelope's peak: six times its width 1/(2πσf), as the solver's pulse (GaussianPulse.delay). */
        @Override
        public double peakTime() {
            return 6 / (2 * Math.PI * spectrumSigma());
        }
    }

    /** A sinusoid at {@code frequency} switched on smoothly over {@code rampTime} seconds. */
    record RampedWave(Value frequency, Value rampTime, SourcePosition at) implements SignalSpec {

        @Override
        public String kind() {
            return "ramped_wave";
        }

        @Override
        public double shortestWavelength() {
            return wavelength();
        }

        @Override
        public double peakTime() {
            return rampTime.si();
        }
    }

    /** The time derivative of a Gaussian whose spectrum peaks at {@code frequency}. */
    record GaussianDerivative(Value frequency, SourcePosition at) implements SignalSpec {

        @Override
        public String kind() {
            return "gaussian_derivative";
        }

        /** The Gaussian's width τ = 1/(2π f_peak), seconds. */
        public double width() {
            return 1.0 / (2 * Math.PI * frequency.si());
        }

        /** The centre of the pulse: six widths, as the solver's signal (DifferentiatedGaussian). */
        @Override
        public double peakTime() {
            return 6 * width();
        }

        /**
         * The power spectrum, ∝ x² exp(−x²) with x = f/f_peak, falls to half its peak at x = 1.6366
         * (the root of x² exp(1 − x²) = ½ above 1).
         */
        @Override
        public double shortestWavelength() {
            return wavelength() / HALF_POWER_RATIO;
        }

        /** f/f_peak where the power spectrum is half its peak, on the high side. */
        static final double HALF_POWER_RATIO = 1.6366;
    }
}
