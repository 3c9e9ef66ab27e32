package org.evanesce.solver.source;

import org.evanesce.solver.record.FluxLine;

/**
 * An incident-power run computed instead of stepped: the transforms a source gives on the flux lines of an unbounded
 * grid filled with one lossless medium ({@link SheetResponse} for a pulsed beam's sheets, {@link PlaneWaveResponse}
 * for a plane wave's Bloch-periodic sheet).
 */
public interface ComputedIncident {

    /**
     * Sets a horizontal line's transforms at each of its frequencies, and its sample counts, to what a run of
     * {@code steps} steps of {@code dt} would have recorded on it.
     */
    void fill(FluxLine line, long steps, double dt);

    /** What the transforms are computed from, for messages and run.json: "the beam's sheets", say. */
    String from();
}
