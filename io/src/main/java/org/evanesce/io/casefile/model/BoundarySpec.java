package org.evanesce.io.casefile.model;

import java.util.Optional;
import java.util.OptionalInt;
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
     * An absorbing layer inside the domain along this side, as written: a number of cells or a thickness in
     * metres (exactly one), which planning rounds to whole cells ({@code org.evanesce.io.plan.grid.GridDerivation}).
     *
     * @param cells     thickness in cells
     * @param thickness thickness in metres
     */
    record Pml(OptionalInt cells, Optional<Value> thickness, SourcePosition at) implements BoundarySpec {

        public Pml {
            if (cells.isPresent() == thickness.isPresent()) {
                throw new IllegalArgumentException("a PML has exactly one of a number of cells and a thickness");
            }
        }

        /** A PML of {@code cells} cells. */
        public static Pml ofCells(int cells, SourcePosition at) {
            return new Pml(OptionalInt.of(cells), Optional.empty(), at);
        }

        /** A PML {@code thickness} thick. */
        public static Pml ofThickness(Value thickness, SourcePosition at) {
            return new Pml(OptionalInt.empty(), Optional.of(thickness), at);
        }
    }

    /**
     * Bloch-periodic, on the left and right sides together: the domain's width is one period, and a
     * field one period to the right is the field here times e^{i kx W}, with kx the in-plane
     * wavenumber of the case's plane wave (0 without one).
     */
    record Periodic(SourcePosition at) implements BoundarySpec { }

    /** How the side is written in the run record; {@code pmlCells} is a PML's thickness in cells as planned. */
    default String describe(int pmlCells) {
        if (this instanceof Pml) {
            return "pml " + pmlCells + " cells";
        }
        return this instanceof Pmc ? "pmc" : this instanceof Periodic ? "periodic" : "pec";
    }
}
