package org.evanesce.io.casefile.model;

import java.util.Optional;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Precision;

/**
 * How the run computes.
 *
 * @param precision float (default) or double field arrays
 * @param threads   worker threads; empty means as many as the machine has
 * @param courant   Courant number c0Δt/Δ; empty means the program's default
 * @param dispersionCorrection whether lossless materials get the permittivity that makes the grid's wavenumbers exact
 *                  for the plane wave (empty: yes when the case has a plane wave)
 */
public record NumericsSpec(Located<Precision> precision, Optional<Located<Integer>> threads, Optional<Value> courant,
        Optional<Located<Boolean>> dispersionCorrection) {

    /** The case's choice, or on exactly when the case has a plane wave. */
    public boolean correctsDispersion(boolean hasPlaneWave) {
        return dispersionCorrection.map(Located::value).orElse(hasPlaneWave);
    }
}
