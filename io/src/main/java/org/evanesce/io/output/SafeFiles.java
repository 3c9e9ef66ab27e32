package org.evanesce.io.output;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Writing a file whole, for every file evanesce writes: a new temporary file beside the target
 * ({@code .NAME.HOST-PID-RANDOM.tmp}, see {@link OwnerTag}), created new (an existing file or a
 * symbolic link under that name makes the creation fail; nothing is followed), locked while it is
 * written, flushed to the disk ({@link FileChannel#force}), renamed onto the target, and the folder
 * flushed after the rename where the platform allows (inside a results folder still being written, the
 * folder is flushed once when it is finished instead: see {@link #moveOnto}). After a failure the
 * temporary is deleted and the target is as it was.
 *
 * <p>Tests can make writes fail as if the disk were full: with the system property
 * {@value #NO_SPACE_PROPERTY} set to a regular expression, writing a file whose absolute path
 * contains a match fails with "No space left on device" just before the flush.
 */
public final class SafeFiles {

    /** System property: a regular expression of paths whose writing fails as on a full disk (tests). */
    public static final String NO_SPACE_PROPERTY = "evanesce.test.noSpaceFor";

    /** Bytes a temporary name adds to the target's: '.', '.', the tag (at most 8 + 1 + 19 + 1 + 13) and '.tmp'. */
    public static final int TEMPORARY_NAME_EXTRA = 1 + 1 + 42 + 4;

    private static final Pattern TEMPORARY = Pattern.compile("\\.(.+)\\." + OwnerTag.PATTERN + "\\.tmp");

    /** Writes the content of a file to a stream (which it must not close). */
    @FunctionalInterface
    public interface Content {
        void write(OutputStream out) throws IOException;
    }

    private SafeFiles() {
    }

    /** The temporary name of a file being written under {@code name}, by this process. */
    public static String temporaryName(String name) {
        return "." + name + "." + OwnerTag.mine().text() + ".tmp";
    }

    /** The target name and tag of a temporary name, or null when it is not one of ours. */
    static String[] parseTemporary(String fileName) {
        var m = TEMPORARY.matcher(fileName);
        return m.matches() ? new String[] {m.group(1), m.group(2) + "-" + m.group(3) + "-" + m.group(4)} : null;
    }

    /** Writes {@code text} (UTF-8) to {@code target} whole. */
    public static Path writeString(Path target, String text) throws IOException {
        return write(target, text.getBytes(StandardCharsets.UTF_8));
    }

    /** Writes {@code bytes} to {@code target} whole. */
    public static Path write(Path target, byte[] bytes) throws IOException {
        return write(target, out -> out.write(bytes));
    }

    /**
     * Writes {@code target} whole (see the class comment); its folder must exist.
     *
     * @return the target
     */
    public static Path write(Path target, Content content) throws IOException {
        Path dir = target.toAbsolutePath().getParent();
        Path tmp = dir.resolve(temporaryName(target.getFileName().toString()));
        Interruption.writing(tmp);
        try {
            try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE,
                    LinkOption.NOFOLLOW_LINKS)) {
                FileLock lock = lockQuietly(ch);
                OutputStream os = new BufferedOutputStream(Channels.newOutputStream(ch), 1 << 16);
                content.write(os);
                os.flush();
                failIfAsked(target);
                ch.force(true);
                if (lock != null) {
                    lock.release();
                }
            }
            moveOnto(tmp, target);
        } catch (IOException e) {
            IOException named = naming(e, tmp, target);
            deleteQuietly(tmp, named);
            throw named;
        } catch (RuntimeException | Error e) {
            deleteQuietly(tmp, e);
            throw e;
        } finally {
            Interruption.written(tmp);
        }
        return target;
    }

    private static void deleteQuietly(Path tmp, Throwable failure) {
        try {
            Files.deleteIfExists(tmp);
        } catch (IOException suppressed) {
            failure.addSuppressed(suppressed);
        }
    }

    /**
     * A failure while writing the temporary of {@code target}, naming {@code target} (what the user knows)
     * instead of the temporary; failures that name another file are kept as they are.
     */
    public static IOException naming(IOException e, Path tmp, Path target) {
        if (e instanceof FileSystemException f && f.getFile() != null && !f.getFile().equals(tmp.toString())) {
            return e;
        }
        // the system's own error is the deepest cause (image writers wrap it in their own "I/O error")
        String reason = null;
        for (Throwable c = e; c != null; c = c.getCause()) {
            if (c instanceof IOException io) {
                String r = io instanceof FileSystemException f ? f.getReason() : io.getMessage();
                reason = r != null ? r : reason;
            }
        }
        FileSystemException out = e instanceof java.nio.file.AccessDeniedException
                ? new java.nio.file.AccessDeniedException(target.toString(), null, reason)
                : e instanceof java.nio.file.NoSuchFileException
                ? new java.nio.file.NoSuchFileException(target.toString(), null, reason)
                : new FileSystemException(target.toString(), null, reason);
        out.initCause(e);
        return out;
    }

    /**
     * Creates an empty new temporary file beside {@code target} for a writer that opens the file itself
     * (jhdf); finish with {@link #commit}.
     */
    public static Path newTemporary(Path target) throws IOException {
        Path tmp = target.toAbsolutePath().getParent().resolve(temporaryName(target.getFileName().toString()));
        Interruption.writing(tmp);
        Files.newByteChannel(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE, LinkOption.NOFOLLOW_LINKS).close();
        return tmp;
    }

    /** Flushes a complete temporary file to the disk and renames it onto {@code target} (see the class comment). */
    public static void commit(Path tmp, Path target) throws IOException {
        try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE, LinkOption.NOFOLLOW_LINKS)) {
            failIfAsked(target);
            ch.force(true);
        }
        moveOnto(tmp, target);
        Interruption.written(tmp);
    }

    /**
     * Renames a finished file or folder onto {@code target} (replacing a file there) and flushes the folder,
     * unless the folder is a results folder still being written ({@link RunFolder}): that one is flushed once,
     * with all its names, when it is finished and before it is renamed into place, so a flush per file there
     * (two thirds of a sweep's forced writes) adds nothing to what survives a power failure.
     */
    static void moveOnto(Path from, Path target) throws IOException {
        try {
            Files.move(from, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, target, StandardCopyOption.REPLACE_EXISTING);
        }
        Path dir = target.toAbsolutePath().getParent();
        if (!Leftovers.isUnfinishedFolder(dir)) {
            syncFolder(dir);
        }
    }

    /**
     * Flushes a folder's entries (names created, renamed or removed) to the disk. Where the platform
     * cannot open a folder for this (not Linux or macOS), it does nothing.
     */
    public static void syncFolder(Path dir) {
        try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
            ch.force(true);
        } catch (IOException | UnsupportedOperationException e) {
            // not possible on this platform or file system; the rename itself is still atomic
        }
    }

    /**
     * Deletes a file, or a folder with everything in it, never following a symbolic link (a link is
     * removed, not what it points to). Nothing happens when {@code p} does not exist.
     */
    public static void deleteTree(Path p) throws IOException {
        if (!Files.exists(p, LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        if (!Files.readAttributes(p, BasicFileAttributes.class, LinkOption.NOFOLLOW_LINKS).isDirectory()) {
            Files.deleteIfExists(p);
            return;
        }
        List<Path> all = new ArrayList<>();
        try (Stream<Path> s = Files.walk(p)) {
            s.forEach(all::add);
        }
        all.sort(Comparator.reverseOrder());
        for (Path q : all) {
            Files.deleteIfExists(q);
        }
    }

    private static FileLock lockQuietly(FileChannel ch) {
        try {
            return ch.tryLock();
        } catch (IOException | RuntimeException e) {
            return null;
        }
    }

    private static void failIfAsked(Path target) throws FileSystemException {
        String re = System.getProperty(NO_SPACE_PROPERTY);
        if (re != null && Pattern.compile(re).matcher(target.toAbsolutePath().toString()).find()) {
            throw new FileSystemException(target.toString(), null, "No space left on device");
        }
    }
}
