package org.evanesce.io.casefile;

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
}
