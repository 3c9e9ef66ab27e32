package org.evanesce.io.plan;

import java.util.List;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.record.Probe;

/**
 * A case mapped onto the solver: the rasterised materials, a configured simulation builder, the
 * probes with their names, and when to stop.
 *
 * @param spec        the validated case
 * @param grid        where the nodes lie
 * @param materials   the rasterised (smoothed) materials
 * @param builder     the simulation, ready to build (sources, boundaries, numerics set)
 * @param probes      named probes, already registered as listeners on the builder
 * @param stop        when the run ends
 * @param dt          the time step, s
 * @param interior    the cells outside every PML, {i0, j0, i1, j1} (i1, j1 exclusive), for the energy
 * @param flux        the flux lines and their normalisation, when the case asks for flux
 * @param gridPermittivity the relative permittivity each material has on the grid (differs from the case's
 *                    where the dispersion correction applies), by name
 * @param fields      the field files, frames and maps the run writes
 * @param sourceSites where each source drives the grid, in the case's order
 * @param memory      the heap the run is estimated to need
 * @param surfaces    the segments, boxes, far fields and exit spectra and their norm, when the case asks for them
 * @param lightBoxes  the planned plane-wave boxes (total-field/scattered-field), in the case's order
 */
public record CasePlan(CaseSpec spec, GridSpec grid, MaterialGrid materials, Simulation.Builder builder,
                       List<NamedProbe> probes, Stop stop, double dt, int[] interior,
                       java.util.Optional<FluxPlan> flux, java.util.Map<String, Double> gridPermittivity,
                       FieldPlan fields, List<SourceSite> sourceSites, MemoryEstimate memory,
                       java.util.Optional<SurfacePlan> surfaces,
                       List<org.evanesce.solver.source.TotalFieldBox> lightBoxes) {

    /** The PML's thickness on {@code side} in cells, as planned; 0 where the side has none. */
    public int pmlCells(org.evanesce.solver.grid.Side side) {
        return switch (side) {
            case LEFT -> interior[0];
            case BOTTOM -> interior[1];
            case RIGHT -> grid.nx() - interior[2];
            case TOP -> grid.ny() - interior[3];
        };
    }

    /**
     * The reference run that follows the case's run, when there is one: the flux section's incident-power run, or
     * the surfaces' own (the grid filled with the launching medium or the sources' medium).
     */
    public java.util.Optional<Simulation.Builder> referenceRun() {
        if (flux.isPresent()) {
            return java.util.Optional.of(flux.get().reference());
        }
        return surfaces.flatMap(SurfacePlan::ownReference);
    }

    /** Whether a source drives a continuous (ramped) wave, which never decays. */
    public boolean continuous() {
        return spec.sources().stream().anyMatch(s -> s.signal() instanceof org.evanesce.io.casefile.model.SignalSpec.RampedWave);
    }

    /**
     * A probe with the name the case gave it and the site it samples: index (i, j) of its component, i.e.
     * the site at ((i + dx)Δ, (j + dy)Δ) from node 0 with the component's offsets dx, dy ({@link
     * org.evanesce.solver.grid.Component}).
     */
    public record NamedProbe(String name, Probe probe, int i, int j) { }

    /**
     * The sites a source drives: the component's indices from (i0, j0) to (i1, j1) inclusive (one site for a
     * point source, a row for a line along x, a plane wave or a beam's launching line), each index meaning
     * the site at ((i + dx)Δ, (j + dy)Δ) from node 0 as for {@link NamedProbe}.
     *
     * @param source    the source's path in the case file, e.g. {@code sources[0].point}
     * @param component the component driven (for a beam: the electric component of its launching row)
     */
    public record SourceSite(String source, org.evanesce.solver.grid.Component component, int i0, int j0, int i1, int j1) { }

    /** When a run ends. */
    public sealed interface Stop {
        /** After a fixed number of steps. */
        record Steps(long steps) implements Stop { }

        /**
         * When the field energy inside the PMLs falls below {@code fraction} of its largest value,
         * checked every {@code checkInterval} steps once the sources have faded (after
         * {@code fadeSteps}), and at the latest after {@code limitSteps}.
         */
        record Decay(double fraction, long fadeSteps, long limitSteps, int checkInterval) implements Stop { }

        /** The most steps the run can take. */
        default long maxSteps() {
            return this instanceof Steps s ? s.steps() : ((Decay) this).limitSteps();
        }
    }
}
