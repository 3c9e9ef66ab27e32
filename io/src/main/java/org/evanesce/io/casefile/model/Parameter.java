package org.evanesce.io.casefile.model;

import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.text.SourcePosition;

/**
 * A named parameter after evaluation.
 *
 * @param name       the name
 * @param value      the value in SI units with its dimension
 * @param expression the expression as written (in the file, or on the command line when overridden)
 * @param at         where the expression was written
 * @param overridden true when a command-line setting replaced the file's expression
 */
public record Parameter(String name, Quantity value, String expression, SourcePosition at, boolean overridden) { }
