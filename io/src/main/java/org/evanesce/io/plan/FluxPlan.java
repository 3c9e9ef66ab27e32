package org.evanesce.io.plan;

import java.util.List;
import java.util.Optional;
import java.util.function.DoubleFunction;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.reference.PlanarStack;

/**
 * The frequency-domain flux of a plane-wave case and how it is normalised: the same lines are
 * recorded in the case's run and in an incident-power run of the same grid, source and boundaries with
 * the whole domain filled with the plane wave's medium. The incident power is the incident-power run's
 * flux through a line a few cells ahead of the source; a reflected line reports the flux of the
 * difference of the two runs' fields (the scattered field, which there is the reflected wave).
 *
 * @param frequencies    Hz
 * @param kx             the plane wave's in-plane wavenumber, rad/m
 * @param medium         the material the plane wave is launched in
 * @param mediumIndex    its index
 * @param direction      +1 when the incident wave travels towards +y, −1 towards −y
 * @param lines          the case's lines, in its order
 * @param incident       the incident-power run's line just ahead of the source
 * @param incidentY      where that line lies, m
 * @param reference      the incident-power run, ready to build (lines registered)
 * @param cellSize       Δ, m
 * @param exact          the exact reference when asked for: the stack at a vacuum wavelength, from the source's
 *                       medium towards {@code direction} (for a beam, the stack under it)
 * @param beam           the Gaussian beam, when the source is one (else a plane wave)
 * @param gridX0         x of node column 0, m
 * @param indexAt        the case's refractive index at (x, y), m (the real part, as the grid has it before any
 *                       dispersion correction)
 * @param steady         for a continuous wave: its window and the lines that transform the window's two halves;
 *                       with it the incident line gives a time-averaged power, without it (a pulse) an energy per hertz
 * @param lineLength     the length of the lines (and of the incident line) along x, m
 * @param sourceAmplitude the source's amplitude as the case states it: a plane wave's sheet current (η0 J_s in V/m
 *                       for s, the magnetic sheet current in V/m for p), a beam's z field at the waist centre (V/m)
 * @param path           a beam's path line in the incident-power run, when the case compares reflected lines with the
 *                       exact answer (see {@link Path})
 * @param setupKey       the incident-power run's key without its step count ({@link IncidentKey}): runs of equal
 *                       keys and steps give the same numbers
 * @param recorders      every recorder of the incident-power run (its lines, the incident line, a continuous wave's
 *                       halves, the path line) in the order registered: their state is its whole result
 * @param strip          for a plane wave with periodic sides whose incident power is not computed (unless the case
 *                       asks for {@code incident_run: full}): the
 *                       narrow strip whose run gives the recorders' state instead of the full-width incident-power run
 * @param computed       for a pulsed Gaussian beam with PMLs on every side, or a plane wave with periodic sides and
 *                       PMLs above and below (unless the case asks for {@code incident_run: strip} or {@code full}): the
 *                       recorders' state computed instead of stepped ({@link org.evanesce.solver.source.SheetResponse},
 *                       {@link org.evanesce.solver.source.PlaneWaveResponse})
 * @param surfacesIncident the incident line of a {@code surfaces} section normalised by the incident power, at its
 *                       frequencies: a recorder of this incident-power run (so reused and stepped on the strip with it)
 */
public record FluxPlan(double[] frequencies, double kx, String medium, double mediumIndex, int direction, List<Line> lines,
                       FluxLine incident, double incidentY, Simulation.Builder reference, double cellSize,
                       Optional<Exact> exact, Optional<SourceSpec.GaussianBeamSource> beam, double gridX0,
                       java.util.function.DoubleBinaryOperator indexAt, Optional<Steady> steady, double lineLength,
                       double sourceAmplitude, Optional<Path> path, String setupKey, List<FluxLine> recorders,
                       Optional<Strip> strip, Optional<org.evanesce.solver.source.ComputedIncident> computed,
                       Optional<FluxLine> surfacesIncident) {

    /**
     * The incident-power run of a Bloch-periodic plane wave done on a strip of a few columns: in a homogeneous medium
     * the wave's fields repeat from column to column with the phase e^{i kx x}, so the strip's run is the discrete
     * one-dimensional problem of the full width's, and each full-width recorder is its strip twin spread over the
     * width ({@link FluxLine#spreadFrom}).
     *
     * @param builder the strip's run, ready to build (its recorders registered)
     * @param lines   the strip's recorders, one per entry of {@link #recorders}, in the same order
     * @param columns the strip's width in cells
     */
    public record Strip(Simulation.Builder builder, List<FluxLine> lines, int columns) {
        public Strip {
            lines = List.copyOf(lines);
        }
    }


    /**
     * The steady-state check of a continuous wave (see {@link SteadyState}).
     *
     * @param window    the transform window
     * @param run       per case line (in order), its early and late halves in the case's run
     * @param reference the same in the incident-power run
     * @param incident  the incident line's early and late halves (incident-power run)
     */
    public record Steady(SteadyState window, List<FluxLine[]> run, List<FluxLine[]> reference, FluxLine[] incident) {
        public Steady {
            run = List.copyOf(run);
            reference = List.copyOf(reference);
            incident = incident.clone();
        }
    }

    /** Whether the source is a continuous wave (its flux transformed over whole settled periods). */
    public boolean continuous() {
        return steady.isPresent();
    }

    /**
     * The exact reference.
     *
     * @param stack          the stack at a vacuum wavelength (m)
     * @param firstInterface y of the first interface the wave meets, m
     * @param column         x of the vertical the stack was read along (a beam's axis meets the first interface
     *                       there; 0 for a plane wave)
     * @param differsAt      for a beam, the x nearest the column within its footprint (±{@link
     *                       #FOOTPRINTS_CHECKED} footprints) where the layers are not those of the column,
     *                       so the references describe the column's stack alone; NaN where they are the same (and
     *                       for a plane wave, whose scene is layered, and where the stack alone was asked for)
     * @param media          the case's materials the wave crosses, by name: the incidence medium, one per layer of
     *                       the stack, the exit medium
     * @param permittivity   which permittivity the stack's dispersive materials take
     * @param timeStep       the run's time step, s: the discrete permittivity's Δt
     */
    public record Exact(DoubleFunction<PlanarStack> stack, double firstInterface, double column, double differsAt,
                        List<String> media, FluxSpec.ReferencePermittivity permittivity,
                        double timeStep) {
        public Exact {
            media = List.copyOf(media);
        }

        /**
         * How far either side of the column a beam's layers are compared with the column's, in footprints (the
         * waist over the cosine of the angle: the 1/e² half-width of its intensity on a face): 2 holds all but
         * 3e-4 of its power (common practice).
         */
        public static final double FOOTPRINTS_CHECKED = 2;
    }

    /**
     * A line of the incident-power run farther along the incident beam's path (at the mirror image of a reflected
     * line through the first interface, where it fits): with the incident line it gives where the incident beam
     * travels on the grid, the baseline of the lateral shift.
     *
     * @param line the line, recorded in the incident-power run
     * @param y    its height, m
     */
    public record Path(FluxLine line, double y) { }

    public FluxPlan {
        frequencies = frequencies.clone();
        lines = List.copyOf(lines);
        recorders = List.copyOf(recorders);
    }

    /**
     * One line.
     *
     * @param spec      as the case gave it
     * @param row       the grid row it follows: the line is at y = y0 + (row + ½)Δ
     * @param y         that height, m
     * @param run       the line in the case's run
     * @param reference the same line in the incident-power run
     */
    public record Line(FluxSpec.Line spec, int row, double y, FluxLine run, FluxLine reference) { }

    /**
     * The angle of incidence in the source's medium at frequency number q, radians: for a plane wave
     * sin θ = kx c0 / (2π f n); a beam keeps its axis at every frequency.
     */
    public double angle(int q) {
        if (beam.isPresent()) {
            return beam.get().angle().si();
        }
        return Math.asin(kx * PhysicalConstants.C0 / (2 * Math.PI * frequencies[q] * mediumIndex));
    }

    /** The number of the frequency closest to f (Hz). */
    public int closest(double f) {
        int best = 0;
        for (int q = 1; q < frequencies.length; q++) {
            if (Math.abs(frequencies[q] - f) < Math.abs(frequencies[best] - f)) {
                best = q;
            }
        }
        return best;
    }

    /** The vacuum wavelength at frequency number q, m. */
    public double wavelength(int q) {
        return PhysicalConstants.C0 / frequencies[q];
    }
}
