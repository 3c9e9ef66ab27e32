package org.evanesce.solver.source;

import org.evanesce.solver.grid.Component;

/**
 * A row of source terms that carries a given incident field with a per-cell delay: cell t of
 * {@link #cells} receives, as a soft current of {@link #component} (see {@link Source}),
 * e(t − d_t)·Re[(re_t + i·im_t) e^{−i2πf0(t − t0)}] with e, f0, t0 the envelope, carrier frequency
 * and carrier origin of {@link #signal}. The phasor gives each cell its carrier phase; the delay
 * moves the envelope, so a pulse crosses the row at the speed and angle of the incident wave.
 * {@link GaussianBeam} makes the pair of sheets that injects a beam on a total-field/scattered-field
 * line.
 *
 * @param component the field component driven
 * @param cells     flat cell indices j·nx + i
 * @param re        real parts of the phasors
 * @param im        imaginary parts
 * @param delays    envelope delays, s, each ≥ 0
 * @param signal    envelope and carrier
 */
public record IncidentSheet(Component component, int[] cells, double[] re, double[] im, double[] delays,
                            CarrierSignal signal) {

    public IncidentSheet {
        int n = cells.length;
        if (n == 0 || re.length != n || im.length != n || delays.length != n) {
            throw new IllegalArgumentException(String.format("incident sheet: %d cells, %d + %d phasor parts, %d delays; need "
                    + "the same number, at least one", n, re.length, im.length, delays.length));
        }
        for (int t = 0; t < n; t++) {
            if (!Double.isFinite(re[t]) || !Double.isFinite(im[t]) || !(delays[t] >= 0) || Double.isInfinite(delays[t])) {
                throw new IllegalArgumentException(String.format("incident sheet cell %d: phasor %g%+gi and delay %g s must be "
                        + "finite, the delay >= 0", t, re[t], im[t], delays[t]));
            }
        }
        cells = cells.clone();
        re = re.clone();
        im = im.clone();
        delays = delays.clone();
    }

    /** The value of term t at time s (seconds). */
    public double value(int t, double s) {
        double env = signal.envelope(s - delays[t]);
        if (env == 0) {
            return 0;
        }
        double phase = 2 * Math.PI * signal.carrierFrequency() * (s - signal.carrierOrigin());
        return env * (re[t] * Math.cos(phase) + im[t] * Math.sin(phase));
    }
}
