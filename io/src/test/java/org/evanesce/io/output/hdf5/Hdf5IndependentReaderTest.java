package org.evanesce.io.output.hdf5;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.io.ToolPath;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Reads the files back with the HDF5 project's own tools (h5dump, from Debian's hdf5-tools) and
 * with h5py (Debian's python3-h5py, which wraps the reference C library), not with jhdf.
 * Skipped, with the reason, where those are not installed; .ci/run installs them.
 */
class Hdf5IndependentReaderTest {

    /** h5dump on the PATH (null when none). */
    static final Path H5DUMP = ToolPath.find("h5dump").orElse(null);
    /** The first python3 on the PATH with h5py and numpy (null when none). */
    static final Path PYTHON = ToolPath.python3With("h5py, numpy").orElse(null);
    static final int NX = Hdf5WriterTest.NX;
    static final int NY = Hdf5WriterTest.NY;

    @TempDir
    Path tmp;

    @Test
    void h5dumpShowsTheTypesAndShapes() throws Exception {
        assumeTrue(H5DUMP != null, "h5dump not found on the PATH: install Debian's hdf5-tools");
        Path f = tmp.resolve("frame.h5");
        Hdf5Writer.write(f, Hdf5WriterTest.rootAttributes(), Hdf5WriterTest.sampleDatasets());
        Result r = run(List.of(H5DUMP.toString(), "-H", f.toString()));
        assertEquals(0, r.code, "h5dump -H failed:\n" + r.output);
        String dims = "SIMPLE { ( " + NY + ", " + NX + " ) / ( " + NY + ", " + NX + " ) }";
        assertDataset(r.output, "E_z", "H5T_IEEE_F32LE", dims);
        assertDataset(r.output, "H_y", "H5T_IEEE_F64LE", dims);
        assertDataset(r.output, "relative_permittivity_z", "H5T_IEEE_F32LE", dims);
        String ez = block(r.output, "E_z");
        assertAttribute(ez, "cell_size", "H5T_IEEE_F64LE", "SCALAR");
        assertAttribute(ez, "origin", "H5T_IEEE_F64LE", "SIMPLE { ( 2 ) / ( 2 ) }");
        assertAttribute(ez, "step", "H5T_STD_I32LE", "SCALAR");
        assertAttribute(ez, "cells", "H5T_STD_I64LE", "SCALAR");
        assertTrue(ez.matches("(?s).*ATTRIBUTE \"unit\" \\{\\s*DATATYPE\\s+H5T_STRING.*"), "unit is a string:\n" + ez);
    }

    private static void assertDataset(String dump, String name, String type, String space) {
        Matcher m = Pattern.compile("DATASET \"" + name + "\" \\{\\s*DATATYPE\\s+(\\S+)\\s*DATASPACE\\s+(SIMPLE \\{[^}]*\\})")
                .matcher(dump);
        assertTrue(m.find(), "dataset " + name + " in h5dump -H:\n" + dump);
        assertEquals(type, m.group(1), name + ": DATATYPE");
        assertEquals(space, m.group(2).replaceAll("\\s+", " "), name + ": DATASPACE [ny][nx]");
    }

    private static void assertAttribute(String block, String name, String type, String space) {
        Matcher m = Pattern.compile("ATTRIBUTE \"" + name + "\" \\{\\s*DATATYPE\\s+(\\S+)\\s*DATASPACE\\s+(SCALAR|SIMPLE \\{[^}]*\\})")
                .matcher(block);
        assertTrue(m.find(), "attribute " + name + ":\n" + block);
        assertEquals(type, m.group(1), name + ": DATATYPE");
        assertEquals(space, m.group(2).replaceAll("\\s+", " "), name + ": DATASPACE");
    }

    /** The text of one dataset's block in an h5dump listing, up to the next dataset. */
    private static String block(String dump, String name) {
        int start = dump.indexOf("DATASET \"" + name + "\"");
        int end = dump.indexOf("DATASET \"", start + 1);
        return dump.substring(start, end < 0 ? dump.length() : end);
    }

    /** Checks, with h5py and numpy, the file {@link Hdf5WriterTest#sampleDatasets} describes. */
    private static final String H5PY_FILE_CHECK = """
            import sys
            import h5py
            import numpy as np
            path, nx, ny = sys.argv[1], int(sys.argv[2]), int(sys.argv[3])
            problems = []
            def check(ok, what):
                if not ok:
                    problems.append(what)
            def text(v):
                return v.decode('utf-8') if isinstance(v, bytes) else str(v)
            jj, ii = np.mgrid[0:ny, 0:nx]
            ramp = (ii + 100 * jj).astype(np.float64)
            with h5py.File(path, 'r') as f:
                check(sorted(f.keys()) == ['E_z', 'H_y', 'relative_permittivity_z'], 'datasets %s' % sorted(f.keys()))
                for name, dtype in (('E_z', '<f4'), ('H_y', '<f8'), ('relative_permittivity_z', '<f4')):
                    check(f[name].shape == (ny, nx), '%s shape %s' % (name, f[name].shape))
                    check(f[name].dtype == np.dtype(dtype), '%s dtype %s' % (name, f[name].dtype))
                ez = f['E_z'][...]
                check(np.array_equal(ez, (ramp + 0.1).astype(np.float32)), 'Ez values %s' % ez)
                check(ez[2, 4] == np.float32(204.1), 'Ez[j=2][i=4] = %r' % ez[2, 4])
                hy_want = ramp + 0.3
                hy_want.flat[5] = np.nan
                hy_want.flat[-1] = -np.inf
                hy = f['H_y'][...]
                check(np.array_equal(hy, hy_want, equal_nan=True), 'Hy values %s' % hy)
                check(np.isnan(hy[0, 5]) and hy[ny - 1, nx - 1] == -np.inf, 'Hy NaN and -inf placed')
                eps_want = (np.float32(1) + np.arange(nx * ny, dtype=np.float32) / np.float32(3)).reshape(ny, nx)
                check(np.array_equal(f['relative_permittivity_z'][...], eps_want), 'Eps values')
                for name, unit in (('E_z', 'V/m'), ('H_y', 'A/m')):
                    a = f[name].attrs
                    check(text(a['component']) == name, name + ' component %r' % a['component'])
                    check(text(a['unit']) == unit, name + ' unit %r' % a['unit'])
                    check(text(a['polarization']) == 'TM', name + ' polarization')
                    check(a['cell_size'] == 2.5e-8 and a['cell_size'].dtype == np.float64, name + ' cell_size %r' % a['cell_size'])
                    check(list(a['origin']) == [-1.0e-7, 3.0e-8], name + ' origin %r' % a['origin'])
                    check(a['time'] == 1.25e-15, name + ' time %r' % a['time'])
                    check(a['step'] == 40 and a['step'].dtype == np.int32, name + ' step %r' % a['step'])
                    check(a['cells'] == 2 ** 40 and a['cells'].dtype == np.int64, name + ' cells %r' % a['cells'])
                check(text(f['relative_permittivity_z'].attrs['unit']) == '1', 'Eps unit')
                check(text(f.attrs['program']) == 'evanesce', 'root program %r' % f.attrs['program'])
                check(text(f.attrs['length_unit']) == '\\u00b5m', 'root length_unit %r' % f.attrs['length_unit'])
                check(f.attrs['frame'] == 2, 'root frame')
            print('OK' if not problems else 'FAILED: ' + '; '.join(problems))
            """;

    @Test
    void h5pyReadsShapesTypesAttributesAndValues() throws Exception {
        assumeH5py();
        Path f = tmp.resolve("frame.h5");
        Hdf5Writer.write(f, Hdf5WriterTest.rootAttributes(), Hdf5WriterTest.sampleDatasets());
        Result r = run(List.of(PYTHON.toString(), "-c", H5PY_FILE_CHECK, f.toString(), "" + NX, "" + NY));
        assertEquals("OK", r.output.strip(), "h5py check of " + NX + "x" + NY + " frame (exit " + r.code + ")");
    }

    @Test
    void h5dumpShowsAStackAndItsIndex() throws Exception {
        assumeTrue(H5DUMP != null, "h5dump not found on the PATH: install Debian's hdf5-tools");
        Path f = tmp.resolve("maps.h5");
        Hdf5Writer.write(f, Map.of(), Hdf5WriterTest.sampleStack());
        Result r = run(List.of(H5DUMP.toString(), "-H", f.toString()));
        assertEquals(0, r.code, "h5dump -H failed:\n" + r.output);
        int n = Hdf5WriterTest.WAVELENGTHS.length;
        assertDataset(r.output, "E_z_real", "H5T_IEEE_F32LE",
                "SIMPLE { ( " + n + ", " + NY + ", " + NX + " ) / ( " + n + ", " + NY + ", " + NX + " ) }");
        assertDataset(r.output, "wavelength_m", "H5T_IEEE_F64LE", "SIMPLE { ( " + n + " ) / ( " + n + " ) }");
        assertTrue(block(r.output, "E_z_real").matches("(?s).*ATTRIBUTE \"wavelength_index\" \\{\\s*DATATYPE\\s+H5T_STRING.*"),
                "the stack names its index:\n" + r.output);
    }

    /** Checks, with h5py and numpy, the file {@link Hdf5WriterTest#sampleStack} describes. */
    private static final String H5PY_STACK_CHECK = """
            import sys
            import h5py
            import numpy as np
            path, nx, ny = sys.argv[1], int(sys.argv[2]), int(sys.argv[3])
            wavelengths = [float(w) for w in sys.argv[4:]]
            problems = []
            def check(ok, what):
                if not ok:
                    problems.append(what)
            def text(v):
                return v.decode('utf-8') if isinstance(v, bytes) else str(v)
            jj, ii = np.mgrid[0:ny, 0:nx]
            with h5py.File(path, 'r') as f:
                check(sorted(f.keys()) == ['E_z_real', 'wavelength_m'], 'datasets %s' % sorted(f.keys()))
                w = f['wavelength_m']
                check(w.dtype == np.dtype('<f8') and list(w[...]) == wavelengths, 'wavelength_m %r' % w[...])
                check(text(w.attrs['unit']) == 'm', 'wavelength_m unit')
                s = f['E_z_real']
                check(s.shape == (len(wavelengths), ny, nx) and s.dtype == np.dtype('<f4'), 'stack %s %s' % (s.shape, s.dtype))
                check(text(s.attrs['wavelength_index']) == 'wavelength_m', 'wavelength_index')
                for k in range(len(wavelengths)):
                    want = (ii + 100 * jj + 1000 * k + 0.1).astype(np.float32)
                    check(np.array_equal(s[k], want), 'layer %d values' % k)
            print('OK' if not problems else 'FAILED: ' + '; '.join(problems))
            """;

    @Test
    void h5pyReadsAStackLayerByLayer() throws Exception {
        assumeH5py();
        Path f = tmp.resolve("maps.h5");
        Hdf5Writer.write(f, Map.of(), Hdf5WriterTest.sampleStack());
        List<String> command = new ArrayList<>(List.of(PYTHON.toString(), "-c", H5PY_STACK_CHECK, f.toString(), "" + NX, "" + NY));
        for (double w : Hdf5WriterTest.WAVELENGTHS) {
            command.add(Double.toString(w));
        }
        Result r = run(command);
        assertEquals("OK", r.output.strip(), "h5py check of the stack (exit " + r.code + ")");
    }

    /**
     * Follows every HDF DataItem of an .xmf file with ElementTree and h5py; one inside a HyperSlab item is
     * read through its start, stride and count, which must select one Z layer of the Topology's shape.
     */
    private static final String H5PY_XDMF_CHECK = """
            import os, sys
            import xml.etree.ElementTree as ET
            import h5py
            import numpy as np
            xmf = sys.argv[1]
            problems = []
            root = ET.parse(xmf).getroot()
            times = [float(t.get('Value')) for t in root.iter('Time')]
            if times != sorted(times) or len(set(times)) != len(times):
                problems.append('times out of order %s' % times)
            items = 0
            for grid in root.iter('Grid'):
                if grid.get('GridType') != 'Uniform':
                    continue
                dims = tuple(int(n) for n in grid.find('Topology').get('Dimensions').split())
                for attribute in grid.iter('Attribute'):
                    top = attribute.find('DataItem')
                    slab = None
                    item = top
                    if top.get('ItemType') == 'HyperSlab':
                        parts = top.findall('DataItem')
                        slab = [int(v) for v in parts[0].text.split()]
                        item = parts[1]
                        if tuple(int(n) for n in top.get('Dimensions').split()) != dims:
                            problems.append('hyperslab dimensions %s for %s' % (top.get('Dimensions'), dims))
                    if item.get('Format') != 'HDF':
                        continue
                    items += 1
                    name, path = item.text.strip().split(':', 1)
                    with h5py.File(os.path.join(os.path.dirname(xmf), name), 'r') as f:
                        d = f[path]
                        shape = (1,) + d.shape
                        if slab is not None:
                            start, stride, count = slab[0:3], slab[3:6], slab[6:9]
                            if tuple(int(n) for n in item.get('Dimensions').split()) != d.shape:
                                problems.append('%s:%s stated %s, stored %s' % (name, path, item.get('Dimensions'), d.shape))
                            picked = d[start[0]:start[0] + count[0] * stride[0]:stride[0],
                                       start[1]:start[1] + count[1] * stride[1]:stride[1],
                                       start[2]:start[2] + count[2] * stride[2]:stride[2]]
                            shape = picked.shape
                        if shape != dims:
                            problems.append('%s:%s shape %s for %s' % (name, path, shape, dims))
                        if d.dtype.itemsize != int(item.get('Precision')) or d.dtype.kind != 'f':
                            problems.append('%s:%s dtype %s' % (name, path, d.dtype))
            if items == 0:
                problems.append('no HDF DataItem')
            print('OK %d' % items if not problems else 'FAILED: ' + '; '.join(problems))
            """;

    @Test
    void h5pyFollowsEveryXdmfReference() throws Exception {
        assumeH5py();
        Path xmf = tmp.resolve("fields.xmf");
        Files.writeString(xmf, XdmfTest.writeSeries(tmp));
        Result r = run(List.of(PYTHON.toString(), "-c", H5PY_XDMF_CHECK, xmf.toString()));
        assertEquals("OK " + 2 * XdmfTest.TIMES.length, r.output.strip(), "h5py check of the time series (exit " + r.code + ")");
    }

    @Test
    void h5pyFollowsTheHyperSlabsOfAStack() throws Exception {
        assumeH5py();
        Path xmf = tmp.resolve("maps.xmf");
        Files.writeString(xmf, XdmfTest.writeStack(tmp));
        Result r = run(List.of(PYTHON.toString(), "-c", H5PY_XDMF_CHECK, xmf.toString()));
        assertEquals("OK " + Hdf5WriterTest.WAVELENGTHS.length, r.output.strip(), "h5py check of the stack's layers (exit " + r.code + ")");
    }

    private static void assumeH5py() throws Exception {
        assumeTrue(PYTHON != null, "no python3 on the PATH imports h5py and numpy: install Debian's python3-h5py and "
                + "python3-numpy");
    }

    private record Result(int code, String output) {
    }

    private static Result run(List<String> command) throws IOException, InterruptedException {
        Path log = Files.createTempFile("hdf5-reader", ".txt");
        try {
            ProcessBuilder pb = new ProcessBuilder(new ArrayList<>(command)).redirectErrorStream(true).redirectOutput(log.toFile());
            pb.environment().put("PYTHONIOENCODING", "utf-8");
            pb.environment().remove("PYTHONPATH");
            pb.environment().remove("PYTHONHOME");
            Process p = pb.start();
            if (!p.waitFor(120, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                return new Result(-1, "timed out after 120 s: " + command.get(0));
            }
            return new Result(p.exitValue(), Files.readString(log, StandardCharsets.UTF_8));
        } finally {
            Files.deleteIfExists(log);
        }
    }
}
