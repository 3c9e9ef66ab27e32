package org.evanesce.solver.grid;

/**
 * A floating-point width: of a run's field arrays (float is the default; double halves the speed)
 * or of the values a dataset stores in a file (IEEE 754 binary32 or binary64, XDMF's {@code
 * Precision="4"} or {@code "8"}).
 */
public enum Precision {
    FLOAT(4), DOUBLE(8);

    /** Bytes per stored value. */
    public final int bytes;

    Precision(int bytes) {
        this.bytes = bytes;
    }
}
