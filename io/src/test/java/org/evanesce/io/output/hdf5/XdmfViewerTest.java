package org.evanesce.io.output.hdf5;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.evanesce.io.ToolPath;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Opens the XDMF documents in ParaView (Debian's python3-paraview, run headless with xvfb-run),
 * a general viewer that knows nothing of this project: the time series must come out as one
 * dataset with three time steps, the grid in the XY plane with the right bounds, and node (i, j)
 * holding values[j*nx + i]; a spatial collection comes out as pieces of one dataset (ParaView 5.11
 * reads it as a vtkMultiPieceDataSet), each piece with its own fields; each layer of a 3D stack comes
 * out through its XDMF hyperslab with that layer's values. ParaView is large (about 1.3 GB), so .ci/run does not install it; this
 * test runs where it is installed and is skipped, with the reason, elsewhere.
 */
class XdmfViewerTest {

    /** ParaView's Python on the PATH (null when none). */
    static final Path PVPYTHON = ToolPath.find("pvpython").orElse(null);
    /** xvfb-run on the PATH (null when none). */
    static final Path XVFB_RUN = ToolPath.find("xvfb-run").orElse(null);

    @TempDir
    Path tmp;

    private static final String PARAVIEW_CHECK = """
            import sys
            from paraview.simple import OpenDataFile
            from paraview import servermanager as sm
            series, maps, nx, ny, x0, y0, d = sys.argv[1], sys.argv[2], int(sys.argv[3]), int(sys.argv[4]), float(sys.argv[5]), float(sys.argv[6]), float(sys.argv[7])
            times = [float(t) for t in sys.argv[8].split(',')]
            stack = sys.argv[9]
            problems = []
            def check(ok, what):
                if not ok:
                    problems.append(what)
            def close(a, b):
                return all(abs(p - q) <= 1e-9 * d for p, q in zip(a, b))
            def blocks(data):
                if data.IsA('vtkMultiBlockDataSet'):
                    out = []
                    for k in range(data.GetNumberOfBlocks()):
                        out += blocks(data.GetBlock(k))
                    return out
                if data.IsA('vtkPartitionedDataSet'):
                    out = []
                    for k in range(data.GetNumberOfPartitions()):
                        out += blocks(data.GetPartition(k))
                    return out
                return [data]
            def value(grid, name, i, j, gx0, gy0):
                pid = grid.FindPoint(gx0 + i * d, gy0 + j * d, 0.0)
                array = grid.GetPointData().GetArray(name)
                return None if pid < 0 or array is None else array.GetTuple1(pid)
            r = OpenDataFile(series)
            check(r is not None, 'no reader for ' + series)
            got = list(r.TimestepValues)
            check(got == times, 'time steps %s, want %s' % (got, times))
            for n, t in enumerate(got):
                r.UpdatePipeline(t)
                g = blocks(sm.Fetch(r))
                check(len(g) == 1, 'frame %d: %d blocks' % (n, len(g)))
                g = g[0]
                check(tuple(g.GetDimensions()) == (nx, ny, 1), 'frame %d dims %s' % (n, g.GetDimensions()))
                check(close(g.GetBounds(), (x0, x0 + (nx - 1) * d, y0, y0 + (ny - 1) * d, 0, 0)), 'frame %d bounds %s' % (n, g.GetBounds()))
                for i, j in ((0, 0), (nx - 1, 0), (4, 2), (nx - 1, ny - 1)):
                    ez = value(g, 'E_z', i, j, x0, y0)
                    hy = value(g, 'H_y', i, j, x0, y0)
                    check(ez == i + 100 * j + 1000 * n, 'frame %d E_z(i=%d, j=%d) = %r' % (n, i, j, ez))
                    check(hy == i + 100 * j + 1000 * n + 0.5, 'frame %d H_y(i=%d, j=%d) = %r' % (n, i, j, hy))
            m = OpenDataFile(maps)
            m.UpdatePipeline()
            g = blocks(sm.Fetch(m))
            check(len(g) == 2, 'maps: %d blocks' % len(g))
            if len(g) == 2:
                f, e = g
                check(tuple(f.GetDimensions()) == (nx, ny, 1) and tuple(e.GetDimensions()) == (nx + 1, ny + 1, 1), 'maps dims')
                check(close(e.GetOrigin(), (x0 - d / 2, y0 - d / 2, 0)), 'eps origin %s' % (e.GetOrigin(),))
                check(value(f, 'E_z_real', 4, 2, x0, y0) == 204.1 and value(f, 'E_z_imaginary', 4, 2, x0, y0) == 204.2,
                      'E_z_real, E_z_imaginary (4, 2)')
                check(value(e, 'relative_permittivity_z', 9, 1, x0 - d / 2, y0 - d / 2) == 109.0, 'relative_permittivity_z(9, 1)')
            # a stack's layers through XDMF hyperslabs: layer k holds float32(i + 100 j + 1000 k + 0.1)
            s = OpenDataFile(stack)
            s.UpdatePipeline()
            g = blocks(sm.Fetch(s))
            check(len(g) == 3, 'stack: %d blocks' % len(g))
            for k, piece in enumerate(g):
                check(tuple(piece.GetDimensions()) == (nx, ny, 1), 'stack layer %d dims %s' % (k, piece.GetDimensions()))
                v = value(piece, 'E_z_real', 4, 2, x0, y0)
                check(v is not None and abs(v - (204.1 + 1000 * k)) < 1e-3, 'stack layer %d E_z_real(4, 2) = %r' % (k, v))
            print('OK' if not problems else 'FAILED: ' + '; '.join(problems))
            """;

    @Test
    void paraViewOpensTheSeriesAsOneDatasetInTheXyPlane() throws Exception {
        assumeTrue(PVPYTHON != null && XVFB_RUN != null,
                "ParaView not found (pvpython, xvfb-run on the PATH): install Debian's python3-paraview and xvfb to run this check");
        Path series = tmp.resolve("fields.xmf");
        Files.writeString(series, XdmfTest.writeSeries(tmp));
        Path maps = tmp.resolve("maps.xmf");
        Files.writeString(maps, XdmfTest.writeMaps(tmp));
        Path stack = tmp.resolve("stack.xmf");
        Files.writeString(stack, XdmfTest.writeStack(tmp));
        Path script = tmp.resolve("check.py");
        Files.writeString(script, PARAVIEW_CHECK);
        StringBuilder times = new StringBuilder();
        for (double t : XdmfTest.TIMES) {
            times.append(times.length() == 0 ? "" : ",").append(t);
        }
        Path log = tmp.resolve("paraview.txt");
        Process p = new ProcessBuilder(List.of(XVFB_RUN.toString(), "-a", PVPYTHON.toString(), script.toString(),
                series.toAbsolutePath().toString(), maps.toAbsolutePath().toString(), "" + XdmfTest.NX, "" + XdmfTest.NY,
                "" + XdmfTest.X0, "" + XdmfTest.Y0, "" + XdmfTest.CELL, times.toString(), stack.toAbsolutePath().toString()))
                .redirectErrorStream(true).redirectOutput(log.toFile()).start();
        boolean done = p.waitFor(180, TimeUnit.SECONDS);
        if (!done) {
            p.destroyForcibly();
        }
        String out = Files.readString(log, StandardCharsets.UTF_8);
        String last = out.strip().lines().reduce((a, b) -> b).orElse("");
        assertEquals("OK", last, "ParaView check (" + XdmfTest.NX + "x" + XdmfTest.NY + ", "
                + (done ? "exit " + p.exitValue() : "timed out") + "):\n" + out);
    }
}
