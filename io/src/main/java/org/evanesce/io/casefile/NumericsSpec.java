package org.evanesce.io.casefile;

import java.util.Optional;
import org.evanesce.solver.grid.Precision;

/**
 * How the run computes.
 *
 * @param precision float (default) or double field arrays
 * @param threads   worker threads; empty means as many as the machine has
 * @param courant   Courant number c0Δt/Δ; empty means the program's default
 */
public record NumericsSpec(Located<Precision> precision, Optional<Located<Integer>> threads, Optional<Value> courant) { }
