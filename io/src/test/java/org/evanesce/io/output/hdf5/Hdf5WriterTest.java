package org.evanesce.io.output.hdf5;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.jhdf.HdfFile;
import io.jhdf.api.Attribute;
import io.jhdf.api.Dataset;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Round trips through jhdf's reader, and the atomic-write contract. */
class Hdf5WriterTest {

    /** Awkward, unequal sizes so that a transposed or ragged layout cannot pass. */
    static final int NX = 7;
    static final int NY = 3;

    @TempDir
    Path tmp;

    /** value(i, j) = i + 100 j + 0.1: not exact in float32, and i, j are readable from it. */
    static double[] ramp(int nx, int ny, double offset) {
        double[] v = new double[nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                v[j * nx + i] = i + 100 * j + offset;
            }
        }
        return v;
    }

    static Map<String, Object> fieldAttributes(String component, String unit, double time) {
        Map<String, Object> a = new LinkedHashMap<>();
        a.put("component", component);
        a.put("unit", unit);
        a.put("cell_size", 2.5e-8);
        a.put("origin", new double[] {-1.0e-7, 3.0e-8});
        a.put("time", time);
        a.put("polarization", "TM");
        a.put("step", 40);
        a.put("cells", 1L << 40);
        return a;
    }

    static Map<String, Object> rootAttributes() {
        Map<String, Object> a = new LinkedHashMap<>();
        a.put("program", "evanesce");
        a.put("length_unit", "\u00b5m");
        a.put("frame", 2);
        return a;
    }

    /** E_z single, H_y double with NaN and -inf, relative_permittivity_z from floats: the file {@link #writeSample} writes. */
    static List<FieldDataset> sampleDatasets() {
        double[] hy = ramp(NX, NY, 0.3);
        hy[5] = Double.NaN;
        hy[NX * NY - 1] = Double.NEGATIVE_INFINITY;
        float[] eps = new float[NX * NY];
        for (int k = 0; k < eps.length; k++) {
            eps[k] = 1f + k / 3f;
        }
        return List.of(
                new FieldDataset("E_z", ramp(NX, NY, 0.1), NX, NY, Precision.SINGLE, fieldAttributes("E_z", "V/m", 1.25e-15)),
                new FieldDataset("H_y", hy, NX, NY, Precision.DOUBLE, fieldAttributes("H_y", "A/m", 1.25e-15)),
                FieldDataset.ofFloats("relative_permittivity_z", eps, NX, NY, Map.of("unit", "1")));
    }

    @Test
    void datasetsAndAttributesReadBackExactlyWithJhdf() throws Exception {
        Path f = tmp.resolve("frame.h5");
        List<FieldDataset> sets = sampleDatasets();
        Hdf5Writer.write(f, rootAttributes(), sets);
        try (HdfFile h = new HdfFile(f)) {
            assertAttributes("root", rootAttributes(), h.getAttributes(), true);
            assertEquals(List.of("E_z", "H_y", "relative_permittivity_z"), new TreeSet<>(h.getChildren().keySet()).stream().toList());
            for (FieldDataset d : sets) {
                String c = d.name() + " (" + NX + "x" + NY + ", " + d.precision() + ")";
                Dataset ds = h.getDatasetByPath("/" + d.name());
                assertArrayEquals(new int[] {NY, NX}, ds.getDimensions(), c + ": shape [ny][nx]");
                assertEquals(d.precision().bytes(), ds.getDataType().getSize(), c + ": bytes a value");
                assertAttributes(c, d.attributes(), ds.getAttributes(), false);
                Object data = ds.getData();
                for (int j = 0; j < NY; j++) {
                    for (int i = 0; i < NX; i++) {
                        double want = d.values()[j * NX + i];
                        if (d.precision() == Precision.SINGLE) {
                            float got = ((float[][]) data)[j][i];
                            assertEquals(0, Float.compare((float) want, got), c + " at i=" + i + " j=" + j);
                        } else {
                            double got = ((double[][]) data)[j][i];
                            assertEquals(0, Double.compare(want, got), c + " at i=" + i + " j=" + j);
                        }
                    }
                }
            }
            float[][] eps = (float[][]) h.getDatasetByPath("/relative_permittivity_z").getData();
            assertEquals(1f + (2 * NX + 4) / 3f, eps[2][4], "ofFloats keeps the given floats, at [j][i]");
        }
        assertEquals(List.of("frame.h5"), names(), "no temporary left beside the file");
    }

    /** Wavelengths indexing {@link #sampleStack}'s layers, m. */
    static final double[] WAVELENGTHS = {630e-9, 633e-9, 636e-9};

    /** A stack E_z_real of three layers, layer k holding i + 100 j + 1000 k + 0.1, and its index wavelength_m. */
    static List<Hdf5Dataset> sampleStack() {
        return sampleStack(NX, NY);
    }

    /** As {@link #sampleStack()}, nx by ny. */
    static List<Hdf5Dataset> sampleStack(int nx, int ny) {
        List<double[]> layers = new java.util.ArrayList<>();
        for (int k = 0; k < WAVELENGTHS.length; k++) {
            layers.add(ramp(nx, ny, 1000.0 * k + 0.1));
        }
        Map<String, Object> a = fieldAttributes("E_z", "V/m s", 0.0);
        a.put("wavelength_index", "wavelength_m");
        return List.of(new AxisDataset("wavelength_m", WAVELENGTHS, Map.of("unit", "m")),
                new FieldStack("E_z_real", layers, nx, ny, Precision.SINGLE, a));
    }

    @Test
    void aStackAndItsIndexReadBackWithJhdf() throws Exception {
        Path f = tmp.resolve("maps.h5");
        List<Hdf5Dataset> sets = sampleStack();
        Hdf5Writer.write(f, Map.of(), sets);
        try (HdfFile h = new HdfFile(f)) {
            Dataset w = h.getDatasetByPath("/wavelength_m");
            assertArrayEquals(new int[] {WAVELENGTHS.length}, w.getDimensions(), "wavelength_m is 1D");
            assertArrayEquals(WAVELENGTHS, (double[]) w.getData(), 0.0, "wavelength_m values");
            assertEquals("m", w.getAttribute("unit").getData());
            Dataset s = h.getDatasetByPath("/E_z_real");
            assertArrayEquals(new int[] {WAVELENGTHS.length, NY, NX}, s.getDimensions(), "stack shape [layers][ny][nx]");
            assertEquals(4, s.getDataType().getSize(), "float32");
            assertAttributes("E_z_real", sets.get(1).attributes(), s.getAttributes(), false);
            float[][][] v = (float[][][]) s.getData();
            for (int k = 0; k < WAVELENGTHS.length; k++) {
                for (int j = 0; j < NY; j++) {
                    for (int i = 0; i < NX; i++) {
                        assertEquals((float) (i + 100 * j + 1000 * k + 0.1), v[k][j][i], "E_z_real[" + k + "][" + j + "][" + i + "]");
                    }
                }
            }
        }
        assertThrows(IllegalArgumentException.class, () -> new FieldStack("E_z_real", List.of(new double[NX * NY], new double[3]),
                NX, NY, Precision.SINGLE, Map.of()), "a layer of the wrong size");
        assertThrows(IllegalArgumentException.class, () -> new FieldStack("E_z_real", List.of(), NX, NY, Precision.SINGLE,
                Map.of()), "no layers");
        assertThrows(IllegalArgumentException.class, () -> new AxisDataset("wavelength_m", new double[0], Map.of()), "no values");
        assertThrows(IllegalArgumentException.class, () -> new AxisDataset("633.00nm/x", WAVELENGTHS, Map.of()), "a path as name");
    }

    private static void assertAttributes(String where, Map<String, Object> want, Map<String, Attribute> got, boolean root) {
        TreeSet<String> gotNames = new TreeSet<>(got.keySet());
        if (root) {
            assertTrue(gotNames.remove(AttributeValues.JHDF_RESERVED), where + ": jhdf's version attribute");
        }
        assertEquals(new TreeSet<>(want.keySet()), gotNames, where + ": attribute names");
        for (Map.Entry<String, Object> e : want.entrySet()) {
            Object v = got.get(e.getKey()).getData();
            String c = where + ", attribute " + e.getKey();
            if (e.getValue() instanceof double[] a) {
                assertArrayEquals(a, (double[]) v, c);
            } else {
                assertInstanceOf(e.getValue().getClass(), v, c + ": type");
                assertEquals(e.getValue(), v, c);
            }
        }
    }

    @Test
    void aValueArrayOfTheWrongLengthIsRefusedBeforeAnythingIsWritten() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new FieldDataset("E_z", new double[NX * NY - 1], NX, NY, Precision.DOUBLE, Map.of()));
        assertTrue(e.getMessage().contains("20 values") && e.getMessage().contains("7*3"), e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> new FieldDataset("a/b", new double[1], 1, 1, Precision.DOUBLE, Map.of()), "name with '/'");
        assertThrows(IllegalArgumentException.class,
                () -> new FieldDataset("E_z", new double[1], 1, 1, Precision.DOUBLE, Map.of("x", 1.5f)), "Float attribute");
        assertThrows(IllegalArgumentException.class,
                () -> new FieldDataset("E_z", new double[1], 1, 1, Precision.DOUBLE, Map.of("x", new double[0])));
    }

    @Test
    void invalidInputLeavesNoFileAndKeepsTheOldOne() throws Exception {
        Path f = tmp.resolve("frame.h5");
        FieldDataset ez = new FieldDataset("E_z", ramp(NX, NY, 0.1), NX, NY, Precision.DOUBLE, Map.of());
        assertThrows(IllegalArgumentException.class, () -> Hdf5Writer.write(f, Map.of(), List.of(ez, ez)), "repeated name");
        assertEquals(List.of(), names(), "nothing written for repeated names");

        Hdf5Writer.write(f, Map.of("version", 1), List.of(ez));
        byte[] before = Files.readAllBytes(f);
        double[] huge = ramp(NX, NY, 0.1);
        huge[10] = 1e39;
        FieldDataset overflow = new FieldDataset("E_z", huge, NX, NY, Precision.SINGLE, Map.of());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Hdf5Writer.write(f, Map.of(), List.of(overflow)));
        assertTrue(e.getMessage().contains("i = 3, j = 1"), "names the cell: " + e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> Hdf5Writer.write(f, Map.of("_jHDF", "x"), List.of(ez)), "jhdf's reserved root attribute");
        assertArrayEquals(before, Files.readAllBytes(f), "old file kept");
        assertEquals(List.of("frame.h5"), names());
    }

    @Test
    void anUnwritableTargetLeavesNothing() throws Exception {
        FieldDataset ez = new FieldDataset("E_z", ramp(NX, NY, 0.1), NX, NY, Precision.DOUBLE, Map.of());
        Path folder = Files.createDirectory(tmp.resolve("taken.h5"));
        assertThrows(IOException.class, () -> Hdf5Writer.write(folder, Map.of(), List.of(ez)), "target is a folder");
        assertTrue(Files.isDirectory(folder));
        assertThrows(IOException.class,
                () -> Hdf5Writer.write(tmp.resolve("missing/frame.h5"), Map.of(), List.of(ez)), "folder missing");
        assertEquals(List.of("taken.h5"), names());
    }

    @Test
    void aFailureAfterJhdfClosedTheFileDeletesTheTemporaryAndKeepsTheOldFile() throws Exception {
        Path f = tmp.resolve("frame.h5");
        FieldDataset old = new FieldDataset("E_z", ramp(NX, NY, 0.1), NX, NY, Precision.DOUBLE, Map.of());
        Hdf5Writer.write(f, Map.of(), List.of(old));
        byte[] before = Files.readAllBytes(f);
        List<Path> seen = new java.util.ArrayList<>();
        for (Exception failure : List.of(new IOException("disk full (simulated)"), new IllegalStateException("simulated"))) {
            IOException e = assertThrows(IOException.class, () -> Hdf5Writer.write(f, rootAttributes(), sampleDatasets(), t -> {
                seen.add(t);
                assertEquals(tmp, t.getParent(), "temporary in the target's folder");
                try (HdfFile h = new HdfFile(t)) {
                    assertArrayEquals(new int[] {NY, NX}, h.getDatasetByPath("/H_y").getDimensions(),
                            "the temporary is complete before the rename");
                }
                assertArrayEquals(before, Files.readAllBytes(f), "target untouched while writing");
                if (failure instanceof IOException io) {
                    throw io;
                }
                throw (RuntimeException) failure;
            }));
            assertTrue(e == failure || e.getCause() == failure, "the failure reaches the caller: " + e);
            assertArrayEquals(before, Files.readAllBytes(f), "old file kept after: " + failure);
            assertEquals(List.of("frame.h5"), names(), "temporary deleted after: " + failure);
        }
        assertEquals(2, seen.size());
    }

    @Test
    void aSuccessfulWriteReplacesALargerOldFileCompletely() throws Exception {
        Path f = tmp.resolve("frame.h5");
        Hdf5Writer.write(f, Map.of("note", "old and larger"),
                List.of(new FieldDataset("Big", new double[200 * 100], 200, 100, Precision.DOUBLE, Map.of())));
        Hdf5Writer.write(f, rootAttributes(), sampleDatasets());
        Path fresh = tmp.resolve("fresh.h5");
        Hdf5Writer.write(fresh, rootAttributes(), sampleDatasets());
        assertEquals(-1L, Files.mismatch(f, fresh), "same bytes as a fresh file: nothing of the old file remains");
        try (HdfFile h = new HdfFile(f)) {
            assertFalse(h.getChildren().containsKey("Big"));
        }
    }

    private List<String> names() throws IOException {
        try (Stream<Path> s = Files.list(tmp)) {
            return s.map(p -> p.getFileName().toString()).sorted().collect(Collectors.toList());
        }
    }
}
