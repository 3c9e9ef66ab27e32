package org.evanesce.io.output.hdf5;

import java.util.Map;

/**
 * One dataset for {@link Hdf5Writer}: a 2D field ({@link FieldDataset}, shape {@code [ny][nx]}), a
 * stack of 2D fields along a leading index axis ({@link FieldStack}, shape {@code [n][ny][nx]}), or
 * the 1D values of such an axis ({@link AxisDataset}, e.g. {@code wavelength_m}).
 */
public sealed interface Hdf5Dataset permits FieldDataset, FieldStack, AxisDataset {

    /** The dataset's name in the file's root group: letters, digits, '_', '.', '-'. */
    String name();

    /** How the values are stored. */
    Precision precision();

    /** The dataset's attributes, in the order they are written (checked and copied on construction). */
    Map<String, Object> attributes();

    /** Bytes the values take in the file. */
    long storedBytes();
}
