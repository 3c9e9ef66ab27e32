package org.evanesce.io.fit;

import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.AngularSpectrum;
import org.evanesce.solver.reference.PlanarStack;

/**
 * The angular-spectrum model of one point of a fit: the case's Gaussian beam through the stack
 * ({@link AngularSpectrum}). The sampling is chosen once per point, at the fit's starting values, by
 * {@link AngularSpectrum#converged} with the tolerances of a run's beam reference, and kept for every
 * later evaluation: a model whose sampling changed between trial values would jump, and the fit's
 * central differences would see the jumps.
 */
final class BeamModel {

    /** The first window, in footprints (waist / cos θ): as a run's beam reference (io.run.BeamReference). */
    static final double WINDOW_FOOTPRINTS = 24;
    /** Samples per wavelength in the incidence medium: twice what holds every propagating component (the same). */
    static final double SAMPLES_PER_WAVELENGTH = 4;
    /** R and T converge to this, absolute (the same). */
    static final double POWER_TOLERANCE = 1e-5;
    /** The largest sampling tried (the same). */
    static final int MAX_SAMPLES = 1 << 20;

    /** The sampling of one point. */
    record Sampling(int samples, double window, boolean converged) { }

    private BeamModel() {
    }

    /** The sampling for this stack and beam: the first that converges (or the largest tried). */
    static Sampling sampling(PlanarStack stack, Polarization pol, AngularSpectrum.GaussianBeam beam) {
        double window = WINDOW_FOOTPRINTS * beam.footprint();
        long needed = (long) Math.ceil(window / (beam.wavelength() / (SAMPLES_PER_WAVELENGTH * stack.incidentIndex())));
        int samples = Integer.highestOneBit((int) Math.min(needed, MAX_SAMPLES) - 1) << 1;
        AngularSpectrum.Converged c = AngularSpectrum.converged(stack, pol, beam, samples, window, new double[0],
                new AngularSpectrum.Tolerance(POWER_TOLERANCE, beam.footprint()), MAX_SAMPLES);
        return new Sampling(c.result().samples(), c.result().samples() * c.result().spacing(), c.converged());
    }

    /** {R, T} of the beam with a fixed sampling. */
    static double[] response(PlanarStack stack, Polarization pol, AngularSpectrum.GaussianBeam beam, Sampling s) {
        AngularSpectrum.Result r = AngularSpectrum.of(stack, pol, beam, s.samples(), s.window());
        return new double[] {r.reflectance(), r.transmittance()};
    }
}
