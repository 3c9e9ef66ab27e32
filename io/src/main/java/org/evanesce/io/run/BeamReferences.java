package org.evanesce.io.run;

import org.evanesce.io.plan.FluxPlan;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.AngularSpectrum;

/**
 * The finite-beam reference of a beam case at each of its frequencies ({@link BeamReference#of}), computed once for
 * flux.csv and the beam plots together, the frequencies shared out over the run's threads ({@link WorkShare}). Each
 * frequency's reference is its own computation, so the numbers do not depend on the thread count.
 */
public final class BeamReferences {

    private final AngularSpectrum.Converged[] byFrequency;

    private BeamReferences(AngularSpectrum.Converged[] byFrequency) {
        this.byFrequency = byFrequency;
    }

    /**
     * The references of the plan's beam at every frequency, or none (every entry null) without a beam and an exact stack.
     *
     * @param threads at most this many frequencies at a time; at least 1
     */
    public static BeamReferences of(FluxPlan plan, Polarization pol, int threads) {
        int count = plan.frequencies().length;
        AngularSpectrum.Converged[] out = new AngularSpectrum.Converged[count];
        if (plan.exact().isEmpty() || plan.beam().isEmpty()) {
            return new BeamReferences(out);
        }
        WorkShare.each(count, threads, q -> out[q] = one(plan, pol, q));
        return new BeamReferences(out);
    }

    private static AngularSpectrum.Converged one(FluxPlan plan, Polarization pol, int q) {
        double wl = plan.wavelength(q);
        return BeamReference.of(plan, plan.exact().orElseThrow().stack().apply(wl), pol, wl);
    }

    /** The reference at frequency number q, or null without one. */
    AngularSpectrum.Converged at(int q) {
        return byFrequency[q];
    }
}
