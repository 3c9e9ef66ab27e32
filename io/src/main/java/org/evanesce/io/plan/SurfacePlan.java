package org.evanesce.io.plan;

import java.util.List;
import java.util.Optional;
import org.evanesce.io.casefile.model.SurfacesSpec;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.FarFieldBox;
import org.evanesce.solver.record.FluxBox;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.source.TotalFieldBox;

/**
 * The recorders of a case's {@code surfaces} section and how their powers are normalised.
 *
 * <p>Every recorder transforms the fields at {@code frequencies} on its own cells only. The norm: for
 * {@link SurfacesSpec.Normalise#INCIDENT}, the flux through a line just ahead of the plane wave or beam in the
 * incident-power run (the grid filled with the launching medium); for {@link SurfacesSpec.Normalise#SOURCE}, the net
 * power out of a small box round every point and line source in a run of the grid filled with the medium at the
 * first source (the power the sources radiate into their own medium, measured); for
 * {@link SurfacesSpec.Normalise#ABSOLUTE} none. With a plane-wave box the incident norm is the intensity of its
 * wave ({@code boxWave}), computed, and the powers become widths in metres.
 *
 * @param frequencies  Hz
 * @param polarization the run's
 * @param normalise    how the powers are reported
 * @param segments     in the case's order
 * @param boxes        in the case's order
 * @param farFields    in the case's order
 * @param exits        in the case's order
 * @param incidentLine for incident: the line just ahead of the source in the incident-power run (or, with
 *                     {@code computedIncident}, filled after the case's run without one)
 * @param incidentDirection +1 when the launched wave travels towards +y, −1 towards −y (0 without one)
 * @param sourceBox    for source: the box round the sources in the reference run
 * @param ownReference the reference run when the case has no flux section whose incident-power run the norm rides on
 * @param steady       for a continuous wave, the transform window (the powers are then time averages), else empty (a
 *                     pulse: energies per hertz)
 * @param gridX0       x of node column 0, m
 * @param gridY0       y of node row 0, m
 * @param cellSize     Δ, m
 * @param normMedium   the material the norm is measured in (the launching medium or the sources'), or empty
 * @param boxWave      for incident with a plane-wave box: its wave, else empty
 * @param computedIncident for incident with a pulsed Gaussian beam, PMLs on every side and no flux section (unless
 *                     {@code incident_run: full}): the incident line's transforms computed from the beam's sheets
 *                     ({@link org.evanesce.solver.source.SheetResponse}) instead of an incident-power run
 */
public record SurfacePlan(double[] frequencies, Polarization polarization, SurfacesSpec.Normalise normalise,
                          List<Segment> segments, List<Box> boxes, List<FarField> farFields, List<Exit> exits,
                          Optional<FluxLine> incidentLine, int incidentDirection, Optional<FluxBox> sourceBox, Optional<Simulation.Builder> ownReference,
                          Optional<SteadyState> steady, double gridX0, double gridY0, double cellSize,
                          Optional<String> normMedium, Optional<BoxWave> boxWave,
                          Optional<org.evanesce.solver.source.SheetResponse> computedIncident) {

    /** The box that measures what the sources radiate lies this many cells clear of every source site. */
    public static final int SOURCE_MARGIN = 3;

    public SurfacePlan {
        frequencies = frequencies.clone();
        segments = List.copyOf(segments);
        boxes = List.copyOf(boxes);
        farFields = List.copyOf(farFields);
        exits = List.copyOf(exits);
    }

    /**
     * A segment's line.
     *
     * @param from position of its first sample along the line, m; {@code to} of its last
     * @param at   its fixed coordinate (x of a vertical line, y of a horizontal one), m
     */
    public record Segment(SurfacesSpec.Segment spec, FluxLine line, double from, double to, double at) { }

    /** A box as recorded: its sides at x = left … right, y = bottom … top, m. */
    public record Box(SurfacesSpec.Box spec, FluxBox box, double left, double bottom, double right, double top) { }

    /**
     * A far-field contour.
     *
     * @param medium  the material round it
     * @param index   its index
     * @param originX x of the phase origin (the contour's centre), m; {@code originY} its y
     */
    public record FarField(SurfacesSpec.FarField spec, FarFieldBox contour, String medium, double index, double left,
                           double bottom, double right, double top, double originX, double originY) { }

    /**
     * An exit spectrum's line across the width.
     *
     * @param exit          the side of the line the light leaves to
     * @param firstPosition x of its first sample, m
     * @param y             the line's height, m
     * @param periodic      whether the line is one period of Bloch-periodic sides (its plane waves are then the Bloch
     *                      orders at {@code blochWavenumber} + 2πm/period)
     * @param blochWavenumber the plane wave's in-plane wavenumber kx, rad/m (0 without periodic sides)
     */
    public record Exit(SurfacesSpec.ExitSpectrum spec, FluxLine line, String medium, double index, Side exit,
                       double firstPosition, double y, boolean periodic, double blochWavenumber) { }

    /**
     * The wave of a plane-wave box, whose intensity the incident norm divides by.
     *
     * @param box       the solver's box (its incident phasor anywhere, for the optical theorem)
     * @param medium    the material the wave comes from (the background, or the incidence layer of a layered one)
     * @param index     its index n
     * @param intensity the wave's intensity there, W/m²: A² n/(2η0) for s, A²/(2nη0) for p, A the box's amplitude
     */
    public record BoxWave(TotalFieldBox box, String medium, double index, double intensity) { }

    /** Whether the powers are widths: the incident norm with a plane-wave box. */
    public boolean widths() {
        return boxWave.isPresent();
    }

    /** Whether the powers are time averages of a continuous wave (else energies per hertz of a pulse). */
    public boolean continuous() {
        return steady.isPresent();
    }
}
