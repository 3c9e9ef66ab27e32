package org.evanesce.io.plan;

import java.util.List;
import org.evanesce.io.casefile.model.SignalSpec;

/**
 * How many steps apart a field map ({@code FieldMap.stride}) or a flux line ({@code FluxLine.stride}, set by
 * {@link FluxPlanner} for the run's and the incident-power run's lines) may read the fields without changing its
 * transforms: issue 18's profiles had the evanescent-tail example's map at 30 % of the stepping samples and the
 * prism coupler's flux lines at 7.6 %, read every step although the fields change little within a step (about
 * 40 steps per period at 16 cells per wavelength).
 *
 * <p>The rule. A linear grid holds only its sources' frequencies (modulo 1/Δt). A Gaussian pulse's amplitude
 * spectrum exp(−(f − f0)²/(2σf²)) is below e^−18 (1.5e-8) of its peak beyond f_top = f0 + 6σf, the level at
 * which the solver's pulse starts (GaussianPulse.delay). Samples NΔt apart give the every-step transform at f
 * plus the spectrum at f + k/(NΔt), k ≠ 0 (Poisson summation; C. E. Shannon, "Communication in the presence of
 * noise", Proc. IRE 37, 10–21, 1949, Theorem 1), which misses the band ±[0, f_top] when 1/(NΔt) &gt; f + f_top.
 * The stride asks twice that: 1/(NΔt) ≥ {@link #MARGIN}·(f_max + f_top), f_max the highest mapped frequency,
 * and at most {@link #MOST} steps. Any other signal (a ramped wave, whose maps are windowed over whole periods,
 * or a Gaussian derivative, broadband down to DC) keeps stride 1.
 */
public final class MapStride {

    /** The sampling rate asked, over the least that avoids aliasing: 2 (common practice: twice the Nyquist rate). */
    static final double MARGIN = 2;
    /** The largest stride: the float rounding noise a sum gathers grows as √N (an 8-step stride: about 3×). */
    static final int MOST = 8;
    /** Standard deviations of the pulse spectrum to its edge: e^{−6²/2} = e^−18, where the solver's pulse starts. */
    static final double SIGMAS = 6;

    private MapStride() {
    }

    /**
     * The stride for maps at {@code frequencies} (Hz) in a run of time step {@code dt} (s) driven by
     * {@code signals}: 1 unless every signal is a Gaussian pulse.
     */
    public static int of(List<SignalSpec> signals, double[] frequencies, double dt) {
        if (signals.isEmpty()) {
            return 1;
        }
        double top = 0;
        for (SignalSpec s : signals) {
            if (!(s instanceof SignalSpec.Pulse p)) {
                return 1;
            }
            top = Math.max(top, p.frequency().si() + SIGMAS * p.spectrumSigma());
        }
        double highest = 0;
        for (double f : frequencies) {
            highest = Math.max(highest, Math.abs(f));
        }
        double n = Math.floor(1 / (MARGIN * dt * (highest + top)));
        return (int) Math.max(1, Math.min(MOST, n));
    }
}
