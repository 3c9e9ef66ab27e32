package org.evanesce.solver.boundary;

/**
 * What terminates one side of the domain.
 *
 * <p>Wall positions, in cells: a PEC wall lies on the outermost nodes (i = 0 or nx − 1; j = 0 or
 * ny − 1), where the tangential E is held at zero. A PMC wall lies half a cell further out
 * (x = −½ or nx − ½, and likewise in y), where the tangential H is zero. A PML side is backed by
 * a PEC wall at its outer edge.
 */
public sealed interface Boundary {

    /** Perfect electric conductor: tangential E = 0. */
    record Pec() implements Boundary { }

    /** Perfect magnetic conductor: tangential H = 0 (a mirror of even symmetry for E tangential to it). */
    record Pmc() implements Boundary { }

    /** An absorbing convolutional PML. */
    record Pml(PmlParameters parameters) implements Boundary { }

    static Boundary pec() {
        return new Pec();
    }

    static Boundary pmc() {
        return new Pmc();
    }

    /** A CPML of {@code layers} cells with the default grading. */
    static Boundary pml(int layers) {
        return new Pml(PmlParameters.defaults(layers));
    }
}
