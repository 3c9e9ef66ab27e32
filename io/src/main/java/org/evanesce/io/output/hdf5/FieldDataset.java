package org.evanesce.io.output.hdf5;

import java.util.Map;

/**
 * One 2D field dataset for {@link Hdf5Writer}.
 *
 * <p>{@code values} is row-major with x fastest: the value at cell (i, j) is {@code values[j*nx + i]},
 * i along x in {@code [0, nx)}, j along y in {@code [0, ny)}. In the HDF5 file it becomes a dataset of
 * shape {@code [ny][nx]} (slowest axis y), so a reader's {@code data[j][i]} is the same value.
 *
 * <p>The values array is not copied (field maps can be large): do not modify it until the file is
 * written. The attribute map is checked and copied; its values may be {@code String}, {@code Double},
 * non-empty {@code double[]}, {@code Integer} or {@code Long} (issue #6 names component, unit, cell
 * size, origin, time or frequency, polarization). Record equality compares the values array by reference.
 *
 * @param name       the dataset's name in the file's root group: letters, digits, '_', '.', '-'
 * @param values     row-major values, length {@code nx*ny}, not modified
 * @param nx         values along x, at least 1
 * @param ny         values along y, at least 1
 * @param precision  how the values are stored; {@link Precision#SINGLE} rounds each to the nearest float
 * @param attributes the dataset's attributes, in the order they are written
 */
public record FieldDataset(String name, double[] values, int nx, int ny, Precision precision,
        Map<String, Object> attributes) implements Hdf5Dataset {

    /** @throws IllegalArgumentException naming the dataset and the value at fault */
    public FieldDataset {
        if (name == null || !AttributeValues.NAME.matcher(name).matches()) {
            throw new IllegalArgumentException("dataset name '" + name
                    + "' is not allowed: use letters, digits, '_', '.', '-' (not starting with '.' or '-')");
        }
        if (nx < 1 || ny < 1) {
            throw new IllegalArgumentException("dataset " + name + ": nx = " + nx + ", ny = " + ny
                    + "; both must be at least 1");
        }
        if (values == null || values.length != (long) nx * ny) {
            throw new IllegalArgumentException("dataset " + name + ": " + (values == null ? "no values" : values.length + " values")
                    + " for nx*ny = " + nx + "*" + ny + " = " + (long) nx * ny);
        }
        if (precision == null) {
            throw new IllegalArgumentException("dataset " + name + ": precision must be SINGLE or DOUBLE, not null");
        }
        attributes = AttributeValues.checkedCopy("dataset " + name, attributes);
    }

    /**
     * A dataset from float values, stored as float32. The values are widened to double (exactly),
     * so the file holds the very floats given; {@code values} is not modified.
     */
    public static FieldDataset ofFloats(String name, float[] values, int nx, int ny, Map<String, Object> attributes) {
        if (values == null) {
            throw new IllegalArgumentException("dataset " + name + ": no values");
        }
        double[] wide = new double[values.length];
        for (int k = 0; k < values.length; k++) {
            wide[k] = values[k];
        }
        return new FieldDataset(name, wide, nx, ny, Precision.SINGLE, attributes);
    }

    @Override
    public long storedBytes() {
        return (long) nx * ny * precision.bytes();
    }
}
