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
import org.evanesce.io.run.MapOutputs;
import org.evanesce.solver.grid.Component;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code evanesce redraw FOLDER}: redraws the pictures of a results folder from its HDF5 files
 * (maps.h5, fields.h5) with other settings, without running the case again. It reads the datasets by
 * the names docs/outputs.md gives: in maps.h5 the stacks {@code E_z_real} or {@code H_z_real} and
 * {@code E_magnitude}, one layer per entry of the index dataset {@code wavelength_m}; in fields.h5
 * every component {@code E_x} ... {@code H_z} (not the {@code _imaginary} parts).
 */
@Command(name = "redraw", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, sortOptions = false,
        description = {"Redraw the PNG pictures of a results folder from its maps.h5 and fields.h5, e.g. with another "
                + "log-scale depth, without running the case again."})
public final class RedrawCommand implements Callable<Integer> {

    /** A field component's dataset in fields.h5: "E_z", "H_x", ... */
    private static final Pattern FIELD = Pattern.compile("([EH])_([xyz])");

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
            throw new ParameterException(spec.commandLine(), folder + (Files.exists(folder)
                    ? ": is a file, not a folder; expected a results folder written by 'evanesce run'" : ": no such folder"));
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
            written += readable(maps, () -> redrawMaps(maps, dir));
        }
        if (Files.isRegularFile(fields)) {
            written += readable(fields, () -> redrawFields(fields, folder.resolve("permittivity.h5"), dir));
        }
        o.printf(Locale.ROOT, "redrew %d pictures into %s%n", written, dir);
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
        } catch (ParameterException e) {
            throw e;
        } catch (RuntimeException e) {
            String why = e.getMessage() == null ? e.getClass().getSimpleName()
                    : e.getMessage().strip().replaceAll("\\s*\\R\\s*", "; ");
            java.nio.file.FileSystemException f = new java.nio.file.FileSystemException(file.toString(), null,
                    "not a readable HDF5 file of an evanesce run (it may be cut short or damaged): " + why);
            f.initCause(e);
            throw f;
        }
    }

    private int redrawMaps(Path file, Path dir) throws IOException {
        int n = 0;
        try (HdfFile h = new HdfFile(file)) {
            int[] ids = noOutlines ? null : ids(h);
            double logDecades = decades != null ? decades : ((Number) attribute(h.getDatasetByPath("/material_id"),
                    "log_decades")).doubleValue();
            refuseEarlierLayout(file, h, MapOutputs.WAVELENGTH);
            double[] wavelengths = axis(h.getDatasetByPath("/" + MapOutputs.WAVELENGTH));
            Dataset magnitude = h.getDatasetByPath("/" + MapOutputs.MAGNITUDE);
            // the z component's real part: Ez for s, Hz for p
            Component z = h.getChildren().containsKey(MapOutputs.partName(Component.EZ, true)) ? Component.EZ : Component.HZ;
            Dataset real = h.getDatasetByPath("/" + MapOutputs.partName(z, true));
            // maps divided by the incident field (maps.normalise: incident) say so on every stack
            String per = real.getAttribute(MapOutputs.RELATIVE_TO) == null ? null : (String) attribute(real, MapOutputs.RELATIVE_TO);
            // eta0*Hz relative to |E_inc| has no unit to carry its eta0: the name keeps it (as the run draws it)
            String name = z == Component.EZ ? "Ez" : per != null ? "eta0*Hz" : "Hz";
            String over = per == null ? "" : "/" + per;
            for (int q = 0; q < wavelengths.length; q++) {
                String tag = MapOutputs.pictureTag(wavelengths[q]);
                String nm = String.format(Locale.ROOT, "%.2f nm", wavelengths[q] * 1e9);
                picture(real, q, name, (String) attribute(real, "unit"), FieldPicture.Quantity.REAL, ids, null,
                        "Re " + name + over + " at " + nm).relativeTo(per)
                        .writePng(dir.resolve("map-" + z.name().toLowerCase(Locale.ROOT) + "-" + tag + ".png"));
                picture(magnitude, q, "E", (String) attribute(magnitude, "unit"), FieldPicture.Quantity.MAGNITUDE, ids,
                        logDecades, "|E|" + over + " at " + nm + ", log scale").relativeTo(per)
                        .writePng(dir.resolve("map-E-" + tag + "-log.png"));
                n += 2;
            }
        }
        return n;
    }

    private int redrawFields(Path file, Path permittivity, Path dir) throws IOException {
        int[] ids = null;
        if (!noOutlines && Files.isRegularFile(permittivity)) {
            try (HdfFile p = new HdfFile(permittivity)) {
                ids = ids(p);
            }
        }
        int n = 0;
        try (HdfFile h = new HdfFile(file)) {
            if (h.getChildren().keySet().stream().noneMatch(k -> FIELD.matcher(k).matches())) {
                refuseEarlierLayout(file, h, "E_z");
            }
            for (Map.Entry<String, Node> e : h.getChildren().entrySet()) {
                Matcher m = FIELD.matcher(e.getKey());
                if (e.getValue() instanceof Dataset d && m.matches()) {
                    String name = m.group(1) + m.group(2);
                    int[] use = ids != null && ids.length == size(d) ? ids : null;
                    picture(d, -1, name, (String) attribute(d, "unit"), FieldPicture.Quantity.REAL, use, null,
                            String.format(Locale.ROOT, "%s at t = %.4g fs", name,
                                    ((Number) attribute(d, "time_s")).doubleValue() * 1e15))
                            .writePng(dir.resolve("field-" + name.toLowerCase(Locale.ROOT) + ".png"));
                    n++;
                }
            }
        }
        return n;
    }

    /** Dataset names of files written before the names said what they hold ("Ez", "Ez_real_633.00nm", "eps_z"). */
    private static final Pattern EARLIER = Pattern.compile("[EH][xyz](_imag|_real_.*nm)?|E_magnitude_.*nm|eps_[xyz]");

    /**
     * Refuses (exit 2, naming the file) a file whose datasets carry the names of earlier builds
     * (before the self-describing layout), when it lacks {@code expected}: such a folder is redrawn by running its case again.
     */
    private void refuseEarlierLayout(Path file, HdfFile h, String expected) {
        if (!h.getChildren().containsKey(expected)
                && h.getChildren().keySet().stream().anyMatch(k -> EARLIER.matcher(k).matches())) {
            // name an old dataset, one with the wavelength in its name where there is one
            String old = h.getChildren().keySet().stream().filter(k -> EARLIER.matcher(k).matches())
                    .sorted(java.util.Comparator.comparing((String k) -> !k.endsWith("nm")).thenComparing(k -> k)).findFirst()
                    .orElseThrow();
            throw new ParameterException(spec.commandLine(), file + ": written by an earlier build of evanesce (datasets such as "
                    + old + " instead of " + expected + ", docs/outputs.md); run its case again to redraw it");
        }
    }

    /**
     * A picture of a 2D dataset ({@code layer} -1) or of one layer of a 3D stack {@code [n][ny][nx]}.
     */
    private static FieldPicture picture(Dataset d, int layer, String component, String unit, FieldPicture.Quantity q,
                                        int[] ids, Double logDecades, String title) {
        int[] dims = d.getDimensions();
        int ny = dims[dims.length - 2];
        int nx = dims[dims.length - 1];
        double[] v = values(d, layer, nx, ny);
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

    /** Values {@code v[j*nx + i]} of a 2D dataset ({@code layer} -1) or of one layer of a 3D one. */
    private static double[] values(Dataset d, int layer, int nx, int ny) {
        Object data = d.getData();
        if (layer >= 0) {
            data = data instanceof float[][][] f ? f[layer] : ((double[][][]) data)[layer];
        }
        double[] v = new double[nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                v[j * nx + i] = data instanceof float[][] f ? f[j][i] : ((double[][]) data)[j][i];
            }
        }
        return v;
    }

    /** The values of a 1D index dataset. */
    private static double[] axis(Dataset d) {
        Object data = d.getData();
        if (data instanceof double[] v) {
            return v;
        }
        throw new IllegalStateException(d.getPath() + " is not a 1D float64 dataset");
    }

    private static int[] ids(HdfFile h) {
        Dataset d = h.getDatasetByPath("/material_id");
        int[] dims = d.getDimensions();
        double[] v = values(d, -1, dims[1], dims[0]);
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
