package org.evanesce.io.output.hdf5;

/** How a field dataset is stored: IEEE 754 little-endian, 4 or 8 bytes a value. */
public enum Precision {
    /** float32 ({@code H5T_IEEE_F32LE}); XDMF {@code Precision="4"}. */
    SINGLE(4),
    /** float64 ({@code H5T_IEEE_F64LE}); XDMF {@code Precision="8"}. */
    DOUBLE(8);

    private final int bytes;

    Precision(int bytes) {
        this.bytes = bytes;
    }

    /** Bytes a value: 4 or 8, the number XDMF writes as {@code Precision}. */
    public int bytes() {
        return bytes;
    }
}
