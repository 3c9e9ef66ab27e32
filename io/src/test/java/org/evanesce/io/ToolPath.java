package org.evanesce.io;

import java.io.File;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;

/**
 * Finds the independent tools the tests use (h5dump, python3 with h5py, pvpython, xvfb-run) on the
 * PATH, as a shell would, rather than at one fixed place.
 */
public final class ToolPath {

    private ToolPath() {
    }

    /** Every executable called {@code name} on the PATH, in PATH order. */
    public static List<Path> all(String name) {
        List<Path> out = new ArrayList<>();
        String path = System.getenv("PATH");
        if (path == null) {
            return out;
        }
        for (String dir : path.split(File.pathSeparator)) {
            if (dir.isEmpty()) {
                continue;
            }
            try {
                Path p = Path.of(dir, name);
                if (Files.isRegularFile(p) && Files.isExecutable(p) && !out.contains(p)) {
                    out.add(p);
                }
            } catch (InvalidPathException e) {
                // not a folder name on this system
            }
        }
        return out;
    }

    /** The first executable called {@code name} on the PATH. */
    public static Optional<Path> find(String name) {
        return all(name).stream().findFirst();
    }

    /**
     * The first {@code python3} on the PATH that imports {@code modules} (e.g. "h5py, numpy"): a PATH may
     * hold several Pythons (a version manager's before the system's), and only some have the modules.
     */
    public static Optional<Path> python3With(String modules) {
        for (Path p : all("python3")) {
            try {
                ProcessBuilder pb = new ProcessBuilder(p.toString(), "-c", "import " + modules).redirectErrorStream(true);
                pb.environment().remove("PYTHONPATH");
                pb.environment().remove("PYTHONHOME");
                Process pr = pb.start();
                pr.getInputStream().readAllBytes();
                if (pr.waitFor(60, TimeUnit.SECONDS) && pr.exitValue() == 0) {
                    return Optional.of(p);
                }
                pr.destroyForcibly();
            } catch (IOException e) {
                // not runnable: try the next
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return Optional.empty();
            }
        }
        return Optional.empty();
    }
}
