package org.evanesce.io.casefile.model;

import java.util.List;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

/**
 * Frequency-domain power through horizontal lines across the (periodic) width, normalised by the
 * incident power of the case's plane wave.
 *
 * @param frequencies    the frequencies at which the fields are transformed, Hz, each with where it was written
 * @param lines          at least one line
 * @param transferMatrix whether to write the exact plane-wave answer of the layered scene beside the simulated one
 * @param at             where the {@code flux} section starts
 * @param incidentRun    how the incident power is obtained ({@code incident_run})
 * @param referencePermittivity which permittivity of a dispersive material the exact references use
 *                       ({@code reference_permittivity})
 */
public record FluxSpec(List<Value> frequencies, List<Line> lines, Located<Boolean> transferMatrix, SourcePosition at,
                       Located<IncidentRun> incidentRun, Located<ReferencePermittivity> referencePermittivity) {

    public FluxSpec {
        frequencies = List.copyOf(frequencies);
        lines = List.copyOf(lines);
    }

    /** The same with the default {@code reference_permittivity: discrete}. */
    public FluxSpec(List<Value> frequencies, List<Line> lines, Located<Boolean> transferMatrix, SourcePosition at,
                    Located<IncidentRun> incidentRun) {
        this(frequencies, lines, transferMatrix, at, incidentRun, new Located<>(ReferencePermittivity.DISCRETE, at));
    }

    /** The same with the default {@code incident_run: auto}. */
    public FluxSpec(List<Value> frequencies, List<Line> lines, Located<Boolean> transferMatrix, SourcePosition at) {
        this(frequencies, lines, transferMatrix, at, new Located<>(IncidentRun.AUTO, at));
    }

    /** How the incident power is obtained. */
    public enum IncidentRun {
        /**
         * Computed where the incident medium's response is known in closed form (a plane wave with periodic sides and
         * PMLs above and below, a pulsed beam with PMLs on every side); else a plane wave's strip, a beam's full grid.
         */
        AUTO("auto"),
        /** A plane wave with periodic sides: always the strip a few cells wide with the same sides (stepped). */
        STRIP("strip"),
        /** Always the full grid filled with the incident medium. */
        FULL("full");

        private final String caseName;

        IncidentRun(String caseName) {
            this.caseName = caseName;
        }

        public String caseName() {
            return caseName;
        }
    }

    /**
     * Which permittivity of a dispersive material (a metal) the exact references (the transfer matrix, a beam's
     * angular spectrum) use; other materials are the same either way.
     */
    public enum ReferencePermittivity {
        /**
         * The discrete model's ε_d(ω, Δt) = ε((2/Δt) tan(ωΔt/2)) at the run's time step, what the grid's time stepping
         * realises: the difference columns then measure the spatial grid alone.
         */
        DISCRETE("discrete"),
        /** The model's own ε(ω): the difference columns then hold the time step's error too. */
        CONTINUOUS("continuous");

        private final String caseName;

        ReferencePermittivity(String caseName) {
            this.caseName = caseName;
        }

        public String caseName() {
            return caseName;
        }
    }

    /** What a line's power is reported as. */
    public enum Measure {
        /** The flux of the fields in the incident direction, over the incident power. */
        TRANSMITTED("transmitted"),
        /** The flux of the fields minus the incident fields, against the incident direction, over the incident power. */
        REFLECTED("reflected");

        private final String caseName;

        Measure(String caseName) {
            this.caseName = caseName;
        }

        public String caseName() {
            return caseName;
        }
    }

    /**
     * One line.
     *
     * @param name     names the line's columns in flux.csv
     * @param y        the line's height, metres
     * @param measures transmitted or reflected
     * @param at       where the entry starts
     */
    public record Line(Located<String> name, Value y, Located<Measure> measures, SourcePosition at) { }
}
