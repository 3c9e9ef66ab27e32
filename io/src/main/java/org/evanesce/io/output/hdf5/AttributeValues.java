package org.evanesce.io.output.hdf5;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.regex.Pattern;

/** Checks and copies HDF5 attribute maps: the value types jhdf writes and other readers read back alike. */
final class AttributeValues {

    /** Names of attributes and datasets: what HDF5, XDMF paths and file systems all take unquoted. */
    static final Pattern NAME = Pattern.compile("[A-Za-z0-9_][A-Za-z0-9_.\\-]*");

    /** The root attribute jhdf writes by itself (its version string). */
    static final String JHDF_RESERVED = "_jHDF";

    private AttributeValues() {
    }

    /**
     * Returns an unmodifiable copy of {@code attributes}, in the caller's order, with arrays copied.
     *
     * @param owner what the attributes belong to, for messages
     * @throws IllegalArgumentException if a name is not a plain name or a value is not a
     *         {@code String}, {@code Double}, non-empty {@code double[]}, {@code Integer} or {@code Long}
     */
    static Map<String, Object> checkedCopy(String owner, Map<String, Object> attributes) {
        if (attributes == null) {
            throw new IllegalArgumentException(owner + ": attributes must not be null (pass Map.of())");
        }
        Map<String, Object> copy = new LinkedHashMap<>();
        for (Map.Entry<String, Object> e : attributes.entrySet()) {
            String key = e.getKey();
            Object value = e.getValue();
            if (key == null || !NAME.matcher(key).matches() || key.equals(JHDF_RESERVED)) {
                throw new IllegalArgumentException(owner + ": attribute name '" + key
                        + "' is not allowed: use letters, digits, '_', '.', '-' (not starting with '.' or '-'), not "
                        + JHDF_RESERVED);
            }
            if (value instanceof String || value instanceof Double || value instanceof Integer || value instanceof Long) {
                copy.put(key, value);
            } else if (value instanceof double[] a) {
                if (a.length == 0) {
                    throw new IllegalArgumentException(owner + ": attribute '" + key + "' is an empty double[]");
                }
                copy.put(key, a.clone());
            } else {
                throw new IllegalArgumentException(owner + ": attribute '" + key + "' has type "
                        + (value == null ? "null" : value.getClass().getSimpleName())
                        + "; allowed are String, Double, double[], Integer, Long");
            }
        }
        return Collections.unmodifiableMap(copy);
    }
}
