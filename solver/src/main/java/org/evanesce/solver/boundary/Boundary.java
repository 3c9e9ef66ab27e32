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

    /**
     * Bloch-periodic along x, given on both the left and the right side: the domain is one period
     * P = nx·Δ (node nx is node 0 one period on), and every field satisfies F(x + P) = F(x)·e^{i kx P}.
     * The fields become complex (two real field sets, coupled only at the seam); this is how a
     * plane wave at oblique incidence with in-plane wavenumber kx is simulated exactly.
     *
     * @param wavenumber kx in rad/m
     */
    record Bloch(double wavenumber) implements Boundary {
        public Bloch {
            if (!Double.isFinite(wavenumber)) {
                throw new IllegalArgumentException("Bloch wavenumber " + wavenumber + " rad/m must be finite");
            }
        }
    }

    static Boundary pec() {
        return new Pec();
    }

    static Boundary pmc() {
        return new Pmc();
    }

    /** Bloch-periodic with in-plane wavenumber kx (rad/m); put it on both the left and the right side. */
    static Boundary bloch(double wavenumber) {
        return new Bloch(wavenumber);
    }

    /** A CPML of {@code layers} cells with the default grading. */
    static Boundary pml(int layers) {
        return new Pml(PmlParameters.defaults(layers));
    }
}
