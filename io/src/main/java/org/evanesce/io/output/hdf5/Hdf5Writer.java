package org.evanesce.io.output.hdf5;

import io.jhdf.HdfFile;
import io.jhdf.WritableHdfFile;
import io.jhdf.api.WritableDataset;
import java.io.IOException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.evanesce.io.output.SafeFiles;

/**
 * Writes field datasets to one HDF5 file with jhdf, atomically.
 *
 * <p>Layout: every dataset sits in the root group under its name, contiguous (no chunking or
 * compression). A {@link FieldDataset} has shape {@code [ny][nx]}: the slowest axis is y, the fastest x,
 * so element {@code [j][i]} is the value at x index i and y index j ({@code values[j*nx + i]}); a
 * {@link FieldStack} has shape {@code [n][ny][nx]}, layer k first; an {@link AxisDataset} is 1D float64. {@link Precision#SINGLE} is stored as {@code H5T_IEEE_F32LE},
 * {@link Precision#DOUBLE} as {@code H5T_IEEE_F64LE}. Attributes are written as jhdf writes them:
 * strings as fixed-length UTF-8, {@code Double}/{@code double[]} as float64 scalar/1D,
 * {@code Integer} as int32, {@code Long} as int64. jhdf adds a root attribute {@code _jHDF} with
 * its version.
 *
 * <p>Atomicity: the file is written under a temporary name in the target's folder
 * ({@code .NAME.HOST-PID-RANDOM.tmp}, created new without following links, {@link SafeFiles}),
 * flushed to disk after jhdf has closed it, and only then renamed to the target, replacing an
 * existing file there. On any failure the temporary is deleted and the
 * target is left as it was. Everything that can be checked is checked before the temporary is
 * created. The target's folder must exist.
 */
public final class Hdf5Writer {

    /** Called with the closed, complete temporary file just before it is renamed; a seam for tests. */
    @FunctionalInterface
    interface BeforeRename {
        void accept(Path temporary) throws IOException;
    }

    private Hdf5Writer() {
    }

    /**
     * Writes {@code datasets} and the root attributes to {@code target} atomically (see the class
     * comment). Neither argument is modified; the value arrays are copied into the file's layout.
     *
     * @param target         the HDF5 file to write; an existing file there is replaced on success
     * @param rootAttributes attributes of the root group (same value types as {@link FieldDataset})
     * @param datasets       the datasets, with distinct names, written in this order
     * @throws IllegalArgumentException if names repeat, an attribute is not allowed, or a finite
     *         value overflows float32 in a {@link Precision#SINGLE} dataset; nothing is written then
     * @throws IOException if the target is a folder, its folder is missing, or writing or renaming
     *         fails; the target is then unchanged and no temporary is left
     */
    public static void write(Path target, Map<String, Object> rootAttributes, List<? extends Hdf5Dataset> datasets)
            throws IOException {
        write(target, rootAttributes, datasets, temporary -> { });
    }

    static void write(Path target, Map<String, Object> rootAttributes, List<? extends Hdf5Dataset> datasets,
            BeforeRename beforeRename) throws IOException {
        if (target == null || datasets == null) {
            throw new IllegalArgumentException("target and datasets must not be null");
        }
        Path abs = target.toAbsolutePath().normalize();
        Map<String, Object> root = AttributeValues.checkedCopy("root group of " + abs, rootAttributes);
        Object[] arrays = new Object[datasets.size()];
        Set<String> names = new HashSet<>();
        for (int k = 0; k < arrays.length; k++) {
            Hdf5Dataset d = datasets.get(k);
            if (d == null) {
                throw new IllegalArgumentException("dataset " + k + " of " + abs + " is null");
            }
            if (!names.add(d.name())) {
                throw new IllegalArgumentException("dataset name " + d.name() + " appears twice in " + abs);
            }
            arrays[k] = array(d);
        }
        Path dir = abs.getParent();
        if (dir == null || !Files.isDirectory(dir)) {
            throw new FileSystemException(abs.toString(), null, "the folder for this HDF5 file does not exist");
        }
        if (Files.isDirectory(abs)) {
            throw new FileSystemException(abs.toString(), null, "is a folder; an HDF5 file cannot replace it");
        }
        Path tmp = SafeFiles.newTemporary(abs);
        try {
            try (WritableHdfFile file = HdfFile.write(tmp)) {
                for (Map.Entry<String, Object> e : root.entrySet()) {
                    file.putAttribute(e.getKey(), e.getValue());
                }
                for (int k = 0; k < arrays.length; k++) {
                    Hdf5Dataset d = datasets.get(k);
                    WritableDataset ds = file.putDataset(d.name(), arrays[k]);
                    for (Map.Entry<String, Object> e : d.attributes().entrySet()) {
                        ds.putAttribute(e.getKey(), e.getValue());
                    }
                }
            }
            beforeRename.accept(tmp);
            SafeFiles.commit(tmp, abs);
        } catch (IOException e) {
            IOException named = SafeFiles.naming(e, tmp, abs);
            try {
                Files.deleteIfExists(tmp);
            } catch (IOException suppressed) {
                named.addSuppressed(suppressed);
            }
            throw named;
        } catch (RuntimeException | Error e) {
            try {
                Files.deleteIfExists(tmp);
            } catch (IOException suppressed) {
                e.addSuppressed(suppressed);
            }
            if (e instanceof RuntimeException && !(e instanceof IllegalArgumentException)) {
                // jhdf reports its write failures unchecked (HdfWritingException), the system's error inside
                for (Throwable c = e.getCause(); c != null; c = c.getCause()) {
                    if (c instanceof IOException io) {
                        IOException named = SafeFiles.naming(io, tmp, abs);
                        named.addSuppressed(e);
                        throw named;
                    }
                }
                FileSystemException f = new FileSystemException(abs.toString(), null, "writing the HDF5 file failed: "
                        + e.getMessage());
                f.initCause(e);
                throw f;
            }
            throw e;
        }
    }

    /** The values in jhdf's layout: float[][] or double[][] for a field, [][][] for a stack, double[] for an axis. */
    private static Object array(Hdf5Dataset d) {
        if (d instanceof AxisDataset a) {
            return a.values();
        }
        if (d instanceof FieldStack s) {
            int n = s.layers().size();
            if (s.precision() == Precision.SINGLE) {
                float[][][] out = new float[n][][];
                for (int k = 0; k < n; k++) {
                    out[k] = floatRows(s.layer(k));
                }
                return out;
            }
            double[][][] out = new double[n][][];
            for (int k = 0; k < n; k++) {
                out[k] = doubleRows(s.layer(k));
            }
            return out;
        }
        FieldDataset f = (FieldDataset) d;
        return f.precision() == Precision.SINGLE ? floatRows(f) : doubleRows(f);
    }

    private static float[][] floatRows(FieldDataset d) {
        int nx = d.nx();
        double[] v = d.values();
        float[][] rows = new float[d.ny()][nx];
        for (int j = 0; j < rows.length; j++) {
            float[] row = rows[j];
            int off = j * nx;
            for (int i = 0; i < nx; i++) {
                double x = v[off + i];
                float f = (float) x;
                if (Float.isInfinite(f) && !Double.isInfinite(x)) {
                    throw new IllegalArgumentException(String.format(
                            "dataset %s: value %g at i = %d, j = %d is beyond float32's range (%g); store it as DOUBLE",
                            d.name(), x, i, j, (double) Float.MAX_VALUE));
                }
                row[i] = f;
            }
        }
        return rows;
    }

    private static double[][] doubleRows(FieldDataset d) {
        int nx = d.nx();
        double[][] rows = new double[d.ny()][];
        for (int j = 0; j < rows.length; j++) {
            rows[j] = Arrays.copyOfRange(d.values(), j * nx, j * nx + nx);
        }
        return rows;
    }
}
