package org.evanesce.solver.grid;

/** Floating-point width of the field arrays. Float is the default; double halves the speed. */
public enum Precision {
    FLOAT(4), DOUBLE(8);

    /** Bytes per stored value. */
    public final int bytes;

    Precision(int bytes) {
        this.bytes = bytes;
    }
}
