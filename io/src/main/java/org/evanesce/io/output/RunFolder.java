package org.evanesce.io.output;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.List;

/**
 * A run's output folder, written under a temporary name beside the final one and renamed into
 * place only when the run has finished (docs/architecture.md: a folder either is complete or does not exist
 * under its name). A finished folder is never overwritten unless the caller asks to replace it;
 * even then it is removed only after the new one is complete, and only while it is a finished
 * evanesce folder holding nothing else ({@link OutputFolders#checkResults}).
 *
 * <p>The temporary folder is {@code .NAME.partial-TAG} ({@link OwnerTag}); while the run writes it
 * holds {@value Leftovers#LOCK}, on which this process holds a lock. When the folder is finished the
 * list of its contents ({@link FolderContents}) is written, then the lock file removed, an old folder
 * renamed aside to {@code .NAME.replaced-TAG}, the new one renamed into place and the old one
 * deleted. A run killed at any point leaves only names that {@link Leftovers} recognises, and the
 * next {@link #begin} of the same target removes them (or puts an old folder back).
 */
public final class RunFolder implements AutoCloseable {

    private final Path target;
    private final Path work;
    private final boolean replace;
    private final List<OutputFolders.Protected> protect;
    private final List<String> cleaned;
    private FileChannel lockChannel;
    private FileLock lock;
    private Path placed;
    private boolean committed;
    private boolean abandoned;

    private RunFolder(Path target, Path work, boolean replace, List<OutputFolders.Protected> protect, List<String> cleaned) {
        this.target = target;
        this.work = work;
        this.replace = replace;
        this.protect = protect;
        this.cleaned = cleaned;
    }

    /**
     * Starts writing a run folder, with the current folder protected.
     *
     * @see #begin(Path, boolean, List)
     */
    public static RunFolder begin(Path target, boolean replace) throws IOException {
        return begin(target, replace, OutputFolders.around(null));
    }

    /**
     * Starts writing a run folder: checks the target, removes what stopped runs of the same target
     * left beside it, creates the temporary folder and takes its lock.
     *
     * @param target  the final folder
     * @param replace whether an existing finished folder may be replaced
     * @param protect folders the target must not be, nor lie above
     * @throws OutputRefusedException when evanesce will not write there (see {@link OutputFolders#checkResults})
     * @throws IOException            when the folder cannot be made (a fault: permissions, a full disk, ...)
     */
    public static RunFolder begin(Path target, boolean replace, List<OutputFolders.Protected> protect) throws IOException {
        Path abs = target.toAbsolutePath().normalize();
        OutputFolders.checkResults(abs, replace, protect);
        Path parent = abs.getParent();
        Files.createDirectories(parent);
        String name = abs.getFileName().toString();
        // the target's own leftovers, and the temporaries of its checkpoints (NAME.checkpoint, -s, -p): a run without
        // checkpoints never opens those files, so their writers' leftovers would otherwise stay
        List<String> cleaned = Leftovers.clean(parent, n -> n.equals(name) || n.startsWith(name + ".checkpoint"));
        Path work = parent.resolve(Leftovers.partialName(name, OwnerTag.mine()));
        Files.createDirectory(work);
        RunFolder rf = new RunFolder(abs, work, replace, protect, cleaned);
        Interruption.opened(rf);
        try {
            rf.lock();
        } catch (IOException | RuntimeException e) {
            rf.close();
            throw e;
        }
        return rf;
    }

    /** Creates the lock file (owner: this process and host) and holds a lock on it while the folder is written. */
    private void lock() throws IOException {
        Path f = work.resolve(Leftovers.LOCK);
        lockChannel = FileChannel.open(f, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE, LinkOption.NOFOLLOW_LINKS);
        lockChannel.write(java.nio.ByteBuffer.wrap(("evanesce run folder being written by process "
                + ProcessHandle.current().pid() + "\n").getBytes(StandardCharsets.UTF_8)));
        try {
            lock = lockChannel.tryLock();
        } catch (IOException e) {
            lock = null; // a file system without locks: other hosts then leave the folder alone, this host checks the process
        }
    }

    private void unlock() throws IOException {
        if (lockChannel != null) {
            if (lock != null && lock.isValid()) {
                lock.release();
            }
            lockChannel.close();
            lockChannel = null;
            Files.deleteIfExists(work.resolve(Leftovers.LOCK));
        }
    }

    /** What {@link #begin} removed or restored beside the target (lines for the user). */
    public List<String> cleaned() {
        return cleaned;
    }

    /** Where files are written until {@link #commit}. */
    public Path dir() {
        return work;
    }

    /**
     * The final folder: the target, or after {@link #commit} the place the results went (see there).
     */
    public Path target() {
        return placed != null ? placed : target;
    }

    /** Writes a text file atomically inside the folder (temporary name, then rename). */
    public Path writeText(String name, String text) throws IOException {
        return SafeFiles.writeString(work.resolve(name), text);
    }

    /**
     * Moves the finished folder to its final name. If the target appeared during the run and may not be
     * replaced (no {@code replace}, or it holds files evanesce did not write), the finished folder goes to
     * the first free {@code NAME-2}, {@code NAME-3}, ... instead ({@link #target()} says where): a result
     * is never lost.
     */
    public synchronized void commit() throws IOException {
        if (abandoned) {
            throw new IOException("the run was stopped before its results folder " + target + " was finished");
        }
        // the list first, then the lock goes: a run killed in between leaves a folder that is provably ours either way
        FolderContents.write(work, Leftovers.LOCK);
        unlock();
        SafeFiles.syncFolder(work);
        Path old = null;
        if (Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
            boolean mayReplace;
            try {
                mayReplace = OutputFolders.checkResults(target, replace, protect);
            } catch (OutputRefusedException e) {
                mayReplace = false;
            }
            if (!mayReplace) {
                placed = freeSibling();
                move(work, placed);
                committed = true;
                Interruption.closed(this);
                return;
            }
            old = target.resolveSibling(Leftovers.replacedName(target.getFileName().toString(), OwnerTag.mine()));
            Files.move(target, old, StandardCopyOption.ATOMIC_MOVE);
        }
        move(work, target);
        placed = target;
        committed = true;
        Interruption.closed(this);
        if (old != null) {
            SafeFiles.deleteTree(old);
        }
    }

    private Path freeSibling() {
        for (int k = 2; ; k++) {
            Path p = target.resolveSibling(target.getFileName() + "-" + k);
            if (!Files.exists(p, LinkOption.NOFOLLOW_LINKS)) {
                return p;
            }
        }
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to);
        }
        SafeFiles.syncFolder(to.getParent());
    }

    /** Removes the temporary folder unless the run was committed: an unfinished run leaves nothing. */
    @Override
    public synchronized void close() {
        Interruption.closed(this);
        if (!committed && !abandoned) {
            try {
                unlock();
            } catch (IOException e) {
                // the folder goes below either way
            }
            try {
                SafeFiles.deleteTree(work);
            } catch (IOException e) {
                throw new UncheckedIOException("could not remove the unfinished run folder " + work, e);
            }
        }
    }

    /**
     * Removes the unfinished folder when the process is stopped ({@link Interruption}), waiting for a
     * {@link #commit} in progress; later commits fail. Threads of the run may still be writing into the folder
     * while it goes, so the removal is tried a few times.
     *
     * @return the folder removed, or null when there was none left to remove (finished, closed, or inside
     *         a folder removed before it)
     */
    synchronized Path abandon() {
        if (committed || abandoned) {
            return null;
        }
        abandoned = true;
        Interruption.closed(this);
        if (!Files.exists(work, LinkOption.NOFOLLOW_LINKS)) {
            return null;
        }
        try {
            unlock();
        } catch (IOException e) {
            // the folder goes below either way
        }
        for (int attempt = 0; attempt < 3; attempt++) {
            try {
                SafeFiles.deleteTree(work);
                return work;
            } catch (IOException e) {
                // a file appeared while the folder was being emptied: try again
            }
        }
        return Files.exists(work, LinkOption.NOFOLLOW_LINKS) ? null : work;
    }
}
