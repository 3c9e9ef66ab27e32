package org.evanesce.io.run;

import org.evanesce.io.casefile.SourceSpec;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.AngularSpectrum;
import org.evanesce.solver.reference.PlanarStack;

/** The finite-beam reference of a beam case: the angular spectrum of the case's beam through the stack under it. */
final class BeamReference {

    /** The spectrum's window, in footprints (waist / cos θ): the beams and their shifts fit with room to spare. */
    static final double WINDOW_FOOTPRINTS = 24;
    /** Samples per wavelength in the source's medium: twice what holds every propagating component. */
    static final double SAMPLES_PER_WAVELENGTH = 4;

    private BeamReference() {
    }

    /** The angular-spectrum result of the plan's beam at vacuum wavelength {@code wl} (m). */
    static AngularSpectrum.Result of(FluxPlan plan, PlanarStack stack, Polarization pol, double wl) {
        AngularSpectrum.GaussianBeam beam = beam(plan, wl);
        double window = WINDOW_FOOTPRINTS * beam.footprint();
        long needed = (long) Math.ceil(window / (wl / (SAMPLES_PER_WAVELENGTH * plan.mediumIndex())));
        int samples = Integer.highestOneBit((int) Math.min(needed, 1 << 24) - 1) << 1;
        return AngularSpectrum.of(stack, pol, beam, samples, window);
    }

    /**
     * The angular spectrum's lateral shift of the reflected beam on the line at height y, m: its
     * flux-weighted centroid there minus the specular position (see {@link #specular}).
     *
     * @param sampled the result of {@link #of} at this wavelength, whose sampling is reused
     */
    static double reflectedShift(FluxPlan plan, PlanarStack stack, Polarization pol, AngularSpectrum.Result sampled,
                                 double wl, double y) {
        double d = Math.abs(plan.exact().orElseThrow().firstInterface() - y);
        double theta = plan.beam().orElseThrow().angle().si();
        return AngularSpectrum.reflectedCentroid(stack, pol, beam(plan, wl), sampled.samples(),
                sampled.samples() * sampled.spacing(), d) - d * Math.tan(theta);
    }

    /** The case's beam for the angular spectrum: its waist, angle, and the distance from its waist to the first interface. */
    static AngularSpectrum.GaussianBeam beam(FluxPlan plan, double wl) {
        SourceSpec.GaussianBeamSource b = plan.beam().orElseThrow();
        double theta = b.angle().si();
        double distance = (plan.exact().orElseThrow().firstInterface() - b.waistAt().y().si()) * plan.direction()
                / Math.cos(theta);
        return new AngularSpectrum.GaussianBeam(b.waist().si(), theta, wl, distance);
    }

    /**
     * x where the specularly reflected axis crosses height y, m: the axis meets the first interface at
     * x_hit and leaves it mirrored.
     */
    static double specular(FluxPlan plan, double y) {
        SourceSpec.GaussianBeamSource b = plan.beam().orElseThrow();
        double interfaceY = plan.exact().orElseThrow().firstInterface();
        double tan = Math.tan(b.angle().si());
        double hit = b.waistAt().x().si() + (interfaceY - b.waistAt().y().si()) * plan.direction() * tan;
        return hit + Math.abs(interfaceY - y) * tan;
    }
}
