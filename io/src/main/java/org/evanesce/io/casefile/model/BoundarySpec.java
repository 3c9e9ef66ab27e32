package org.evanesce.io.casefile.model;

import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

/** What terminates one side of the domain. */
public sealed interface BoundarySpec {

    /** Where the side's setting was written (or the boundaries section, for a default). */
    SourcePosition at();

    /** Perfect electric conductor on the outermost nodes. */
    record Pec(SourcePosition at) implements BoundarySpec { }

    /** Perfect magnetic conductor half a cell outside the outermost nodes. */
    record Pmc(SourcePosition at) implements BoundarySpec { }

    /**
     * An absorbing layer inside the domain along this side.
     *
     * @param cells     thickness in cells, as the run will use it
     * @param thickness the same in metres (cells × Δ)
     */
    record Pml(int cells, Value thickness, SourcePosition at) implements BoundarySpec { }

    /**
     * Bloch-periodic, on the left and right sides together: the domain's width is one period, and a
     * field one period to the right is the field here times e^{i kx W}, with kx the in-plane
     * wavenumber of the case's plane wave (0 without one).
     */
    record Periodic(SourcePosition at) implements BoundarySpec { }

    /** How the side is written in the run record. */
    default String describe() {
        if (this instanceof Pml p) {
            return "pml " + p.cells() + " cells";
        }
        return this instanceof Pmc ? "pmc" : this instanceof Periodic ? "periodic" : "pec";
    }
}
