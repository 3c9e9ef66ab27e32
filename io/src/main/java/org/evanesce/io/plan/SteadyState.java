package org.evanesce.io.plan;

import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.solver.record.FluxLine;

/**
 * A continuous wave's transform window and the check that it lies in the steady state. Flux lines and
 * maps are transformed over {@code periods} whole periods ending at the run's end; the same lines are
 * also transformed over the window's last two halves of {@code half} whole periods each (early, then
 * late). Once the fields are steady every period transforms to the same phasor, so the two halves
 * give the same normalised flux; a change between them beyond {@link #TOLERANCE} means the window still
 * held the switch-on, and the run is flagged as not settled.
 *
 * @param start   the window's start, s
 * @param end     the run's end, s: the window takes the samples up to and including it
 * @param period  the wave's period, s
 * @param periods the window's whole periods
 */
public record SteadyState(double start, double end, double period, long periods) {

    /**
     * The largest change of a normalised flux (T, R; the incident power and a map's row relative to
     * themselves, per sample) between the two halves of the window for the run to count as settled.
     * Measured on the lateral-shift example of docs/case-file.md (beam of waist 10 wavelengths, s, total
     * reflection, default ramp): ending at 90, 130 and 180 fs, R changed by 1.1e-3, 5.4e-4 and 3.4e-4 between
     * the halves while R − 1 was 7.7e-4, 2.6e-4 and 2.0e-4; the change is about one to two times the bias.
     * 1e-3 keeps the bias of a settled run near a fifth of the transmittance's discretisation error at 20
     * cells per wavelength (0.005, README); every settled run of total reflection measured (that beam, a
     * plane wave at 45°) had |R − 1| below 8e-4.
     */
    public static final double TOLERANCE = 1e-3;

    public SteadyState {
        if (!(end > start) || !(period > 0) || periods < 2) {
            throw new IllegalArgumentException(String.format("steady-state window [%g, %g) s of %d periods of %g s",
                    start, end, periods, period));
        }
    }

    /** Whole periods in each half. */
    public long half() {
        return periods / 2;
    }

    /** The early half: {start, end}, s. */
    public double[] early() {
        return new double[] {end - 2 * half() * period, end - half() * period};
    }

    /** The late half: {start, end}, s; it takes the run's last sample, at {@code end}. */
    public double[] late() {
        return new double[] {end - half() * period, end + 1e-6 * period};
    }

    /** A line transforming the early ({@code k} = 0) or late ({@code k} = 1) half, like {@code like}. */
    FluxLine halfLine(FluxLine like, int k, double[] frequencies, org.evanesce.solver.grid.Polarization pol) {
        double[] w = k == 0 ? early() : late();
        return new FluxLine(pol, like.row(), like.firstCell(), like.firstCell() + like.cells(), frequencies).window(w[0], w[1]);
    }

    /** For messages: "t = 62.1 fs to 250 fs, 2 × 44 periods". */
    public String describe() {
        return String.format(java.util.Locale.ROOT, "t = %s to %s, two halves of %d periods",
                Units.format(end - 2 * half() * period, Dimension.TIME), Units.format(end, Dimension.TIME), half());
    }
}
