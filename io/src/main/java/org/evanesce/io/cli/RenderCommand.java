package org.evanesce.io.cli;

import io.jhdf.HdfFile;
import io.jhdf.api.Attribute;
import io.jhdf.api.Dataset;
import io.jhdf.api.Node;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.geometry.GridSpec;
import org.evanesce.io.output.image.FieldPicture;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code evanesce render FOLDER}: redraws the pictures of a results folder from its HDF5 files
 * (maps.h5, fields.h5) with other settings, without running the case again.
 */
@Command(name = "render", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, sortOptions = false,
        description = {"Redraw the PNG pictures of a results folder from its maps.h5 and fields.h5, e.g. with another "
                + "log-scale depth, without running the case again."})
public final class RenderCommand implements Callable<Integer> {

    private static final Pattern MAP_REAL = Pattern.compile("([A-Z][a-z])_real_(.+nm)");
    private static final Pattern MAGNITUDE = Pattern.compile("E_magnitude_(.+nm)");
    private static final Pattern FIELD = Pattern.compile("([A-Z][a-z])");

    @Spec
    private CommandSpec spec;

    @Parameters(index = "0", paramLabel = "FOLDER", description = "A results folder written by 'evanesce run'.")
    private Path folder;

    @Option(names = "--log-decades", paramLabel = "D", description = "Decades below the peak in the log-magnitude maps "
            + "(default: as the run chose).")
    private Double decades;

    @Option(names = "--no-outlines", description = "Leave out the material outlines.")
    private boolean noOutlines;

    @Option(names = "--out", paramLabel = "DIR", description = "Where to write the pictures (default: FOLDER).")
    private Path out;

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        if (!Files.isDirectory(folder)) {
            throw new ParameterException(spec.commandLine(), folder + ": no such folder");
        }
        if (decades != null && !(decades > 0 && decades <= 300)) {
            throw new ParameterException(spec.commandLine(), "--log-decades " + decades + ": expected a number of decades in (0, 300]");
        }
        Path maps = folder.resolve("maps.h5");
        Path fields = folder.resolve("fields.h5");
        if (!Files.isRegularFile(maps) && !Files.isRegularFile(fields)) {
            throw new ParameterException(spec.commandLine(), folder + ": has neither maps.h5 nor fields.h5; expected a results "
                    + "folder of a case with a maps section or with 'fields' in output.write");
        }
        Path dir = out != null ? out : folder;
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new ParameterException(spec.commandLine(), "--out " + dir + ": is a file, not a folder");
        }
        Files.createDirectories(dir);
        for (String line : org.evanesce.io.output.Leftovers.clean(dir, n -> n.endsWith(".png"))) {
            o.println("note: " + line);
        }
        int written = 0;
        if (Files.isRegularFile(maps)) {
            written += readable(maps, () -> renderMaps(maps, dir));
        }
        if (Files.isRegularFile(fields)) {
            written += readable(fields, () -> renderFields(fields, folder.resolve("permittivity.h5"), dir));
        }
        o.printf(Locale.ROOT, "rendered %d pictures into %s%n", written, dir);
        return ExitCode.OK;
    }

    /** Reading one HDF5 file and drawing its pictures. */
    @FunctionalInterface
    private interface Drawing {
        int draw() throws IOException;
    }

    /**
     * Runs {@code d}; a file that jhdf cannot read, or that lacks what an evanesce run writes into it
     * (datasets, attributes), ends the command with one sentence naming the file (exit 3, see Main).
     */
    private static int readable(Path file, Drawing d) throws IOException {
        try {
            return d.draw();
        } catch (RuntimeException e) {
            String why = e.getMessage() == null ? e.getClass().getSimpleName()
                    : e.getMessage().strip().replaceAll("\\s*\\R\\s*", "; ");
            java.nio.file.FileSystemException f = new java.nio.file.FileSystemException(file.toString(), null,
                    "not a readable HDF5 file of an evanesce run (it may be cut short or damaged): " + why);
            f.initCause(e);
            throw f;
        }
    }

    private int renderMaps(Path file, Path dir) throws IOException {
        int n = 0;
        try (HdfFile h = new HdfFile(file)) {
            int[] ids = noOutlines ? null : ids(h);
            double logDecades = decades != null ? decades : ((Number) attribute(h.getDatasetByPath("/material_id"),
                    "log_decades")).doubleValue();
            for (Map.Entry<String, Node> e : h.getChildren().entrySet()) {
                if (!(e.getValue() instanceof Dataset d)) {
                    continue;
                }
                Matcher real = MAP_REAL.matcher(e.getKey());
                Matcher mag = MAGNITUDE.matcher(e.getKey());
                if (real.matches() && (real.group(1).equals("Ez") || real.group(1).equals("Hz"))) {
                    picture(d, real.group(1), (String) attribute(d, "unit"), FieldPicture.Quantity.REAL, ids, null,
                            "Re " + real.group(1) + " at " + real.group(2).replace("nm", " nm"))
                            .writePng(dir.resolve("map-" + real.group(1).toLowerCase(Locale.ROOT) + "-" + real.group(2) + ".png"));
                    n++;
                } else if (mag.matches()) {
                    picture(d, "E", (String) attribute(d, "unit"), FieldPicture.Quantity.MAGNITUDE, ids, logDecades,
                            "|E| at " + mag.group(1).replace("nm", " nm") + ", log scale")
                            .writePng(dir.resolve("map-E-" + mag.group(1) + "-log.png"));
                    n++;
                }
            }
        }
        return n;
    }

    private int renderFields(Path file, Path permittivity, Path dir) throws IOException {
        int[] ids = null;
        if (!noOutlines && Files.isRegularFile(permittivity)) {
            try (HdfFile p = new HdfFile(permittivity)) {
                ids = ids(p);
            }
        }
        int n = 0;
        try (HdfFile h = new HdfFile(file)) {
            for (Map.Entry<String, Node> e : h.getChildren().entrySet()) {
                if (e.getValue() instanceof Dataset d && FIELD.matcher(e.getKey()).matches()) {
                    int[] use = ids != null && ids.length == size(d) ? ids : null;
                    picture(d, e.getKey(), (String) attribute(d, "unit"), FieldPicture.Quantity.REAL, use, null,
                            String.format(Locale.ROOT, "%s at t = %.4g fs", e.getKey(),
                                    ((Number) attribute(d, "time_s")).doubleValue() * 1e15))
                            .writePng(dir.resolve("field-" + e.getKey().toLowerCase(Locale.ROOT) + ".png"));
                    n++;
                }
            }
        }
        return n;
    }

    private static FieldPicture picture(Dataset d, String component, String unit, FieldPicture.Quantity q, int[] ids,
                                        Double logDecades, String title) {
        int[] dims = d.getDimensions();
        int ny = dims[0];
        int nx = dims[1];
        double[] v = values(d, nx, ny);
        double[] origin = (double[]) attribute(d, "origin_m");
        double cell = ((Number) attribute(d, "cell_size_m")).doubleValue();
        FieldPicture p = FieldPicture.of(v, new GridSpec(origin[0], origin[1], cell, nx, ny), component, unit, q).title(title);
        if (ids != null && ids.length == v.length) {
            p = p.outlines(ids);
        }
        if (logDecades != null) {
            p = p.logScale(logDecades);
        }
        return p;
    }

    private static int size(Dataset d) {
        int[] dims = d.getDimensions();
        return dims[0] * dims[1];
    }

    private static double[] values(Dataset d, int nx, int ny) {
        Object data = d.getData();
        double[] v = new double[nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                v[j * nx + i] = data instanceof float[][] f ? f[j][i] : ((double[][]) data)[j][i];
            }
        }
        return v;
    }

    private static int[] ids(HdfFile h) {
        Dataset d = h.getDatasetByPath("/material_id");
        int[] dims = d.getDimensions();
        double[] v = values(d, dims[1], dims[0]);
        int[] ids = new int[v.length];
        for (int k = 0; k < v.length; k++) {
            ids[k] = (int) Math.round(v[k]);
        }
        return ids;
    }

    private static Object attribute(Node n, String name) {
        Attribute a = n.getAttribute(name);
        if (a == null) {
            throw new IllegalStateException(n.getPath() + " has no attribute " + name);
        }
        Object data = a.getData();
        if (data instanceof double[] arr && arr.length == 1 && !name.equals("origin_m")) {
            return arr[0];
        }
        return data;
    }
}
