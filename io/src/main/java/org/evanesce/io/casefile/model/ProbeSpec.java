package org.evanesce.io.casefile.model;

import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.solver.grid.Component;

/**
 * Records one field component at one point at every step.
 *
 * @param name      unique among the probes; names its output
 * @param location  where, metres
 * @param component which field component
 * @param at        where the probe's entry starts
 */
public record ProbeSpec(Located<String> name, Point location, Located<Component> component, SourcePosition at) { }
