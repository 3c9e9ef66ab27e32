package org.evanesce.io.output;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.Comparator;
import java.util.stream.Stream;

/**
 * A run's output folder, written under a temporary name beside the final one and renamed into
 * place only when the run has finished (DESIGN.md: a folder either is complete or does not exist
 * under its name). A finished folder is never overwritten unless the caller asks to replace it;
 * even then it is removed only after the new one is complete.
 */
public final class RunFolder implements AutoCloseable {

    private final Path target;
    private final Path work;
    private final boolean replace;
    private boolean committed;

    private RunFolder(Path target, Path work, boolean replace) {
        this.target = target;
        this.work = work;
        this.replace = replace;
    }

    /**
     * Starts writing a run folder.
     *
     * @param target  the final folder
     * @param replace whether an existing finished folder may be replaced
     * @throws FileAlreadyExistsException if {@code target} exists and {@code replace} is false
     */
    public static RunFolder begin(Path target, boolean replace) throws IOException {
        Path abs = target.toAbsolutePath().normalize();
        if (Files.exists(abs) && !replace) {
            throw new FileAlreadyExistsException(abs.toString(), null,
                    "a finished run folder is already there; choose another --out or pass --force to replace it");
        }
        Path parent = abs.getParent();
        Files.createDirectories(parent);
        Path work = Files.createTempDirectory(parent, "." + abs.getFileName() + ".partial-");
        return new RunFolder(abs, work, replace);
    }

    /** Where files are written until {@link #commit}. */
    public Path dir() {
        return work;
    }

    /** The final folder. */
    public Path target() {
        return target;
    }

    /** Writes a text file atomically inside the folder (temporary name, then rename). */
    public Path writeText(String name, String text) throws IOException {
        Path f = work.resolve(name);
        Path tmp = work.resolve("." + name + ".tmp");
        Files.writeString(tmp, text);
        Files.move(tmp, f, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        return f;
    }

    /** Moves the finished folder to its final name. */
    public void commit() throws IOException {
        if (Files.exists(target)) {
            if (!replace) {
                throw new FileAlreadyExistsException(target.toString(), null, "appeared while the run was writing");
            }
            Path old = target.resolveSibling("." + target.getFileName() + ".replaced-" + System.nanoTime());
            Files.move(target, old, StandardCopyOption.ATOMIC_MOVE);
            moveIntoPlace();
            deleteTree(old);
        } else {
            moveIntoPlace();
        }
        committed = true;
    }

    private void moveIntoPlace() throws IOException {
        try {
            Files.move(work, target, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(work, target);
        }
    }

    /** Removes the temporary folder unless the run was committed: an unfinished run leaves nothing. */
    @Override
    public void close() {
        if (!committed) {
            try {
                deleteTree(work);
            } catch (IOException e) {
                throw new UncheckedIOException("could not remove the unfinished run folder " + work, e);
            }
        }
    }

    private static void deleteTree(Path p) throws IOException {
        if (!Files.exists(p)) {
            return;
        }
        try (Stream<Path> s = Files.walk(p)) {
            for (Path q : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(q);
            }
        }
    }
}
