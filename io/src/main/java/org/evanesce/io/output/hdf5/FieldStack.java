package org.evanesce.io.output.hdf5;

import java.util.List;
import java.util.Map;

/**
 * Several 2D fields on the same nodes stacked along a leading index axis, e.g. one frequency-domain map
 * per wavelength: a dataset of shape {@code [layers][ny][nx]} whose element {@code [k][j][i]} is
 * {@code layers.get(k)[j*nx + i]}. What the leading index means is told by an {@link AxisDataset}
 * beside it (e.g. {@code wavelength_m}) and named in the attributes; the index never goes into a name.
 *
 * <p>The layer arrays are not copied: do not modify them until the file is written.
 *
 * @param name       the dataset's name in the file's root group: letters, digits, '_', '.', '-'
 * @param layers     at least one row-major array of length {@code nx*ny}, not modified
 * @param nx         values along x, at least 1
 * @param ny         values along y, at least 1
 * @param precision  how the values are stored
 * @param attributes the dataset's attributes (value types as for {@link FieldDataset})
 */
public record FieldStack(String name, List<double[]> layers, int nx, int ny, Precision precision,
        Map<String, Object> attributes) implements Hdf5Dataset {

    /** @throws IllegalArgumentException naming the dataset and the value at fault */
    public FieldStack {
        if (name == null || !AttributeValues.NAME.matcher(name).matches()) {
            throw new IllegalArgumentException("dataset name '" + name
                    + "' is not allowed: use letters, digits, '_', '.', '-' (not starting with '.' or '-')");
        }
        if (nx < 1 || ny < 1) {
            throw new IllegalArgumentException("dataset " + name + ": nx = " + nx + ", ny = " + ny + "; both must be at least 1");
        }
        if (layers == null || layers.isEmpty()) {
            throw new IllegalArgumentException("dataset " + name + ": needs at least one layer");
        }
        layers = List.copyOf(layers);
        for (int k = 0; k < layers.size(); k++) {
            if (layers.get(k).length != (long) nx * ny) {
                throw new IllegalArgumentException("dataset " + name + ": layer " + k + " has " + layers.get(k).length
                        + " values for nx*ny = " + nx + "*" + ny + " = " + (long) nx * ny);
            }
        }
        if (precision == null) {
            throw new IllegalArgumentException("dataset " + name + ": precision must be SINGLE or DOUBLE, not null");
        }
        attributes = AttributeValues.checkedCopy("dataset " + name, attributes);
    }

    /** The layer {@code k} as a 2D dataset description (same name and attributes), e.g. for a picture. */
    public FieldDataset layer(int k) {
        return new FieldDataset(name, layers.get(k), nx, ny, precision, attributes);
    }

    @Override
    public long storedBytes() {
        return (long) layers.size() * nx * ny * precision.bytes();
    }
}
