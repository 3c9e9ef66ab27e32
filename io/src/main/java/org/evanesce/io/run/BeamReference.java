package org.evanesce.io.run;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.AngularSpectrum;
import org.evanesce.solver.reference.PlanarStack;

/**
 * The finite-beam reference of a beam case: the angular spectrum of the case's beam through the stack under it,
 * sampled until it has converged ({@link AngularSpectrum#converged}).
 */
final class BeamReference {

    /** The first window, in footprints (waist / cos θ): the beams and their shifts fit with room to spare. */
    static final double WINDOW_FOOTPRINTS = 24;
    /** Samples per wavelength in the source's medium: twice what holds every propagating component. */
    static final double SAMPLES_PER_WAVELENGTH = 4;
    /** R, T (and so A) of the reference converge to this, absolute. */
    static final double POWER_TOLERANCE = 1e-5;
    /** The reflected centroids (so the shifts) converge to this fraction of the beam's footprint. */
    static final double SHIFT_TOLERANCE_FOOTPRINTS = 1e-4;
    /**
     * The largest sampling tried: 2^20 samples (about 170 MB of work arrays for a moment), a window of 256 first
     * windows. A stack whose resonances need more is reported as not converged.
     */
    static final int MAX_SAMPLES = 1 << 20;

    private BeamReference() {
    }

    /**
     * The converged angular-spectrum result of the plan's beam at vacuum wavelength {@code wl} (m), with the
     * reflected centroid on every reflected line in the plan's order (see {@link #reflectedShift}).
     */
    static AngularSpectrum.Converged of(FluxPlan plan, PlanarStack stack, Polarization pol, double wl) {
        AngularSpectrum.GaussianBeam beam = beam(plan, wl);
        double window = WINDOW_FOOTPRINTS * beam.footprint();
        long needed = (long) Math.ceil(window / (wl / (SAMPLES_PER_WAVELENGTH * plan.mediumIndex())));
        int samples = Integer.highestOneBit((int) Math.min(needed, MAX_SAMPLES) - 1) << 1;
        List<FluxPlan.Line> reflected = reflectedLines(plan);
        double[] distances = new double[reflected.size()];
        for (int k = 0; k < distances.length; k++) {
            distances[k] = Math.abs(plan.exact().orElseThrow().firstInterface() - reflected.get(k).y());
        }
        return AngularSpectrum.converged(stack, pol, beam, samples, window, distances,
                new AngularSpectrum.Tolerance(POWER_TOLERANCE, SHIFT_TOLERANCE_FOOTPRINTS * beam.footprint()), MAX_SAMPLES);
    }

    /** The plan's reflected lines, in order. */
    static List<FluxPlan.Line> reflectedLines(FluxPlan plan) {
        List<FluxPlan.Line> out = new ArrayList<>();
        for (FluxPlan.Line l : plan.lines()) {
            if (l.spec().measures().value() == FluxSpec.Measure.REFLECTED) {
                out.add(l);
            }
        }
        return out;
    }

    /**
     * The angular spectrum's lateral shift of the reflected beam on a reflected line, m: its flux-weighted
     * centroid there minus that of the incident beam sent back unchanged by a perfect mirror
     * ({@link AngularSpectrum#specularCentroid}), the baseline the simulated shift has too ({@link #gridSpecular}).
     * The geometric d·tan θ is not that baseline for a narrow beam (3.7 against 4.0 per unit of d at 74.8° with a
     * 1 um waist in glass); measured from it, the plasmon-sensor example's reference read −0.73 um against the
     * consistent −0.86 um.
     *
     * @param reference the result of {@link #of} at this wavelength
     */
    static double reflectedShift(FluxPlan plan, AngularSpectrum.Converged reference, FluxPlan.Line line) {
        return reference.shift(reflectedLines(plan).indexOf(line));
    }

    /**
     * A beam whose plane wave at grazing incidence carries more than this fraction of the power density on its axis
     * ({@link AngularSpectrum.GaussianBeam#grazingPowerRatio}) gets {@link #lineLengthWarning}. The plasmon-sensor
     * beam example (1 um waist at 74.8° in glass) has 4.2e-4, and its shift moves by 0.02 um between its 26 um line
     * and the reference's window; the shipped beams of 2 um and more at 45° to 60° have below 1e-40.
     */
    static final double GRAZING_LIMIT = 1e-5;

    /**
     * A warning, or null: the shift on a reflected line depends on the line's length when the beam reaches grazing
     * incidence (above {@link #GRAZING_LIMIT}); it gives the angular spectrum's shift over this line's own extent
     * beside the one over its whole window (shift_name_beam_um), so the user sees how far the comparison is
     * doubtful for that reason alone.
     */
    static String lineLengthWarning(FluxPlan plan, PlanarStack stack, Polarization pol, double wl,
                                    AngularSpectrum.Converged reference, FluxPlan.Line line) {
        AngularSpectrum.GaussianBeam beam = beam(plan, wl);
        double ratio = beam.grazingPowerRatio(plan.mediumIndex());
        if (!(ratio > GRAZING_LIMIT) || !reference.converged()) {
            return null;
        }
        double dx = plan.cellSize();
        double hit = specular(plan, plan.exact().orElseThrow().firstInterface());
        double first = plan.gridX0() + (line.run().firstCell() + line.run().electricComponent().dx) * dx - hit;
        double last = first + (line.run().cells() - 1) * dx;
        AngularSpectrum.Result r = reference.result();
        double window = -2 * r.start(); // the window the reference sampled
        if (!(first >= -window / 2 && last <= window / 2)) {
            return null;
        }
        double d = Math.abs(plan.exact().orElseThrow().firstInterface() - line.y());
        double onLine = AngularSpectrum.shiftOnSegment(stack, pol, beam, reference, d, first, last);
        double whole = reference.shift(reflectedLines(plan).indexOf(line));
        return String.format(java.util.Locale.ROOT, "at %.2f nm the beam's plane waves reach grazing incidence (there %.2g of the "
                + "power density on its axis, a %.3g um waist at %.4g deg): its flux-weighted centroids on a line then "
                + "depend on the line's length, and so does the lateral shift; on line '%s' the angular spectrum gives "
                + "%.4f um over the line's own %.4g um and %.4f um over its %.4g um window (shift_%s_beam_um), so "
                + "shift_%s_um and shift_%s_beam_um are doubtful by about %.2g um for that reason alone (a wider beam, or "
                + "a smaller angle, avoids it)", wl * 1e9, ratio, beam.waist() * 1e6, Math.toDegrees(beam.angle()),
                line.spec().name().value(), onLine * 1e6, (last - first) * 1e6, whole * 1e6, window * 1e6,
                line.spec().name().value(), line.spec().name().value(), line.spec().name().value(),
                Math.abs(onLine - whole) * 1e6);
    }

    /**
     * Where the angular spectrum's mirrored incident beam crosses height y of a reflected line, m in the grid's
     * x: the axis's hit on the first interface plus {@link AngularSpectrum.Converged#specularCentroids}.
     */
    static double specularOnLine(FluxPlan plan, AngularSpectrum.Converged reference, FluxPlan.Line line) {
        double interfaceY = plan.exact().orElseThrow().firstInterface();
        return specular(plan, interfaceY) + reference.specularCentroids()[reflectedLines(plan).indexOf(line)];
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

    /**
     * Where the specular beam crosses height y on the grid at frequency number q, m: the incident beam's own
     * path, measured in the incident-power run (the homogeneous medium), carried over the same vertical travel as
     * the reflected beam's. The incident-power run's beam has its flux-weighted centroid c1 on the incident line (y1)
     * and c2 on the path line (y2, beyond the interface's height); the centroid of a beam in a homogeneous
     * medium moves in a straight line, and the grid's dispersion does not change between a wave going up and
     * one coming down (its dispersion relation is even in ky), so the specularly reflected beam, after a
     * vertical travel s = |y_int − y1| + |y − y_int| from y1, lies at c1 + (c2 − c1)·s/|y2 − y1|. That takes
     * out what the grid does to the beam's direction (at 16 cells per wavelength a beam asked for at 50° moves
     * along 49.9°) and leaves the interface's shift. Without a path line, {@code fallback}: the angular spectrum's
     * mirrored incident beam on the line ({@link #specularOnLine}), the same baseline without the grid's turn.
     */
    static double gridSpecular(FluxPlan plan, int q, double y, double fallback) {
        if (plan.path().isEmpty()) {
            return fallback;
        }
        double dx = plan.cellSize();
        double c1 = org.evanesce.solver.record.BeamProfile.of(plan.incident(), q, dx, plan.gridX0()).centroid();
        double c2 = org.evanesce.solver.record.BeamProfile.of(plan.path().get().line(), q, dx, plan.gridX0()).centroid();
        double y1 = plan.incidentY();
        double interfaceY = plan.exact().orElseThrow().firstInterface();
        double travel = Math.abs(interfaceY - y1) + Math.abs(y - interfaceY);
        return c1 + (c2 - c1) * travel / Math.abs(plan.path().get().y() - y1);
    }

    /** A warning for a reference that did not converge at vacuum wavelength wl (m). */
    static String notConverged(AngularSpectrum.Converged c, double wl) {
        double[] ch = c.change();
        String why = Double.isFinite(c.narrowest()) && 2 * Math.PI / (c.result().samples() * c.result().spacing())
                > c.narrowest() / 2
                ? String.format(java.util.Locale.ROOT, "the stack has a resonance %.3g rad/m wide (half width at half "
                        + "height of |t|^2; a weakly coupled guided mode, e.g. behind a thick gap) that needs a window of "
                        + "%.3g m", c.narrowest(), 4 * Math.PI / c.narrowest())
                : String.format(java.util.Locale.ROOT, "the last doubling changed R by %.2g, T by %.2g and the reflected "
                        + "centroids by %.3g nm (tolerances %.1g, %.1g and %.1g footprints)", ch[0], ch[1], ch[2] * 1e9,
                        POWER_TOLERANCE, POWER_TOLERANCE, SHIFT_TOLERANCE_FOOTPRINTS);
        return String.format(java.util.Locale.ROOT, "the angular-spectrum reference at %.2f nm did not converge within "
                + "%d samples (a window of %.4g mm): %s; its X_beam, X_diff and shift_*_beam_um columns are left empty "
                + "and beam_reference_converged is 0", wl * 1e9, c.result().samples(),
                c.result().samples() * c.result().spacing() * 1e3, why);
    }
}
