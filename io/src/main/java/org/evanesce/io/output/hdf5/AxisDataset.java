package org.evanesce.io.output.hdf5;

import java.util.Map;

/**
 * The values along a {@link FieldStack}'s leading axis, stored as a 1D float64 dataset, e.g.
 * {@code wavelength_m} with a {@code unit} attribute: the k-th value belongs to layer k.
 *
 * @param name       the dataset's name in the file's root group: letters, digits, '_', '.', '-'
 * @param values     at least one value; copied
 * @param attributes the dataset's attributes (value types as for {@link FieldDataset})
 */
public record AxisDataset(String name, double[] values, Map<String, Object> attributes) implements Hdf5Dataset {

    /** @throws IllegalArgumentException naming the dataset and the value at fault */
    public AxisDataset {
        if (name == null || !AttributeValues.NAME.matcher(name).matches()) {
            throw new IllegalArgumentException("dataset name '" + name
                    + "' is not allowed: use letters, digits, '_', '.', '-' (not starting with '.' or '-')");
        }
        if (values == null || values.length == 0) {
            throw new IllegalArgumentException("dataset " + name + ": needs at least one value");
        }
        values = values.clone();
        attributes = AttributeValues.checkedCopy("dataset " + name, attributes);
    }

    @Override
    public double[] values() {
        return values.clone();
    }

    @Override
    public Precision precision() {
        return Precision.DOUBLE;
    }

    @Override
    public long storedBytes() {
        return 8L * values.length;
    }
}
