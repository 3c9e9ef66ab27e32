package org.evanesce.io.casefile.text;

/** A value that is not a number (a name, a choice, a count) with the place it was written. */
public record Located<T>(T value, SourcePosition at) { }
