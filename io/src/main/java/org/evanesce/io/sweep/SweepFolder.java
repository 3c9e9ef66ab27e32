package org.evanesce.io.sweep;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.io.output.Leftovers;
import org.evanesce.io.output.SafeFiles;
import org.evanesce.io.output.JsonReader;

/**
 * A sweep's folder: {@code sweep.json}, one complete run folder per finished point
 * ({@code point-NNNN/}, written under a temporary name by {@link org.evanesce.io.output.RunFolder} and
 * renamed when finished), the merged {@code sweep.csv} and {@code sweep.png}, and the incident-power results
 * its points share ({@code incident-power-KEY.bin}, {@link org.evanesce.io.run.IncidentPowerCache}). Shards of one sweep
 * may work in the same folder at once: each touches only its own points' folders, and the shared
 * files are written whole under a unique temporary name and renamed.
 */
public final class SweepFolder {

    public static final String RECORD = "sweep.json";
    public static final String CSV = "sweep.csv";
    public static final String PNG = "sweep.png";
    /** T on a log axis, written beside sweep.png when T spans more than a decade ({@link SweepPlot}). */
    public static final String LOG_PNG = "sweep-log.png";
    public static final String SLURM = "sweep.slurm";
    public static final String POINT_RECORD = "point.json";
    /** A sample sweep's statistics ({@link SampleSummary}). */
    public static final String SAMPLE = "sample.json";

    /** A point's folder: {@code point-0003}. */
    private static final Pattern POINT = Pattern.compile("point-(\\d{4,9})");
    private static final Set<String> SWEEP_FILES = Set.of(RECORD, CSV, PNG, LOG_PNG, SLURM, SAMPLE, SweepExtrema.EXTREMA,
            SweepExtrema.SENSITIVITY);

    private final Path dir;

    public SweepFolder(Path dir) {
        this.dir = dir.toAbsolutePath().normalize();
    }

    public Path dir() {
        return dir;
    }

    public Path point(int number) {
        return dir.resolve(SweepPoint.folderName(number));
    }

    /** Writes a file of the folder whole: a unique temporary name, then an atomic rename over the old one. */
    public Path write(String name, byte[] content) throws IOException {
        Files.createDirectories(dir);
        // the temporary name carries this process's tag, so shards sharing the folder never collide
        return SafeFiles.write(dir.resolve(name), content);
    }

    /**
     * Removes what killed runs left behind (see {@link Leftovers}: only temporaries whose writer has
     * provably ended): the temporary folders of the given points (an unfinished run, or a finished
     * one killed while it replaced an older one) and, when {@code sweepFiles}, half-written sweep files.
     *
     * @return one line per thing removed, restored or deliberately left
     */
    public List<String> removeLeftovers(Set<Integer> points, boolean sweepFiles) throws IOException {
        return Leftovers.clean(dir, name -> {
            Matcher m = POINT.matcher(name);
            if (m.matches()) {
                return points.contains(Integer.parseInt(m.group(1)));
            }
            return sweepFiles && (SWEEP_FILES.contains(name) || org.evanesce.io.run.IncidentPowerCache.isCacheFile(name));
        });
    }

    /** Names in the folder that are evanesce's temporaries (for checks). */
    public List<String> leftovers() throws IOException {
        List<String> out = new ArrayList<>();
        if (!Files.isDirectory(dir)) {
            return out;
        }
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir)) {
            for (Path p : ds) {
                String name = p.getFileName().toString();
                if (Leftovers.isTemporary(name)) {
                    out.add(name);
                }
            }
        }
        out.sort(null);
        return out;
    }

    /**
     * Whether evanesce could have written an entry of this name into a sweep folder: its files, point
     * folders, Slurm's logs (named by the script) and temporaries.
     */
    public static boolean ours(String name) {
        return SWEEP_FILES.contains(name) || POINT.matcher(name).matches() || name.matches("slurm-\\d+_\\d+\\.out")
                || name.matches(SampleSummary.HISTOGRAM_PATTERN)
                || Leftovers.isTemporary(name) || org.evanesce.io.run.IncidentPowerCache.isCacheFile(name);
    }

    /**
     * Whether the point's folder holds a finished run of exactly this point: its {@code point.json}
     * has {@code hash} (the folder's name alone proves nothing) and its {@code run.json} exists.
     */
    public boolean finished(int number, String hash) {
        Path p = point(number);
        if (!Files.isRegularFile(p.resolve("run.json"))) {
            return false;
        }
        try {
            Object rec = readJson(p.resolve(POINT_RECORD));
            return rec instanceof Map<?, ?> m && hash.equals(m.get("point_hash"));
        } catch (IOException e) {
            return false;
        }
    }

    /**
     * Why a point whose folder holds a finished run is not counted as finished now, for the sweep's output
     * (null when the folder holds no finished run): another build or version of the program made it, or its
     * case or values differ.
     */
    public String whyRunAgain(int number, String version, String build) {
        Path p = point(number);
        if (!Files.isRegularFile(p.resolve("run.json"))) {
            return null;
        }
        Object rec;
        try {
            rec = readJson(p.resolve(POINT_RECORD));
        } catch (IOException e) {
            return "its point.json cannot be read";
        }
        if (!(rec instanceof Map<?, ?> m)) {
            return "its point.json holds no record";
        }
        if (!version.equals(m.get("version"))) {
            return "made by evanesce " + m.get("version") + ", this is " + version;
        }
        if (!build.equals(m.get("build"))) {
            return "made by another build of evanesce: " + (m.get("build") == null ? "one that recorded no build id"
                    : m.get("build")) + ", this is " + build;
        }
        return "made from another case text or other values (its point hash differs)";
    }

    /**
     * Reads a JSON file written by {@link org.evanesce.io.output.Json} ({@link JsonReader}): maps, lists,
     * strings, numbers, booleans and null.
     *
     * @throws NoSuchFileException when it does not exist
     * @throws IOException         when it cannot be read or is not JSON
     */
    public static Object readJson(Path file) throws IOException {
        String text = Files.readString(file);
        try {
            return JsonReader.read(text);
        } catch (JsonReader.NotJson e) {
            throw new IOException(file + ": not readable JSON: " + e.getMessage(), e);
        }
    }

    static void deleteTree(Path p) throws IOException {
        SafeFiles.deleteTree(p);
    }
}
