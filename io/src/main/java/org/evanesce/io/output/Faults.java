package org.evanesce.io.output;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.DirectoryNotEmptyException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.util.Locale;

/**
 * Turns a file-system failure into one plain sentence naming the path and the cause, for the
 * commands' error output (exit code 3): "PATH: no space left on the device". The causes are the
 * operating system's error texts as Java reports them (the C library's strerror wording on Linux
 * and macOS); anything else keeps its own text.
 */
public final class Faults {

    private Faults() {
    }

    /** The IOException inside {@code t} (itself, or the cause of an {@link UncheckedIOException}), or null. */
    public static IOException ioCause(Throwable t) {
        if (t instanceof IOException io) {
            return io;
        }
        return t instanceof UncheckedIOException u ? u.getCause() : null;
    }

    /** {@code PATH: cause} for a file-system failure. */
    public static String sentence(IOException e) {
        String path = null;
        String reason = e.getMessage();
        if (e instanceof FileSystemException f) {
            path = f.getFile();
            reason = f.getReason();
            if (f.getOtherFile() != null) {
                path = path + " (to " + f.getOtherFile() + ")";
            }
        }
        String cause = cause(e, reason);
        if (path == null) {
            return cause;
        }
        return userPath(path) + ": " + cause;
    }

    /**
     * The path as the user knows it: a results folder's temporary name ({@code .NAME.partial-TAG}) and a
     * file's ({@code .NAME.TAG.tmp}) become NAME.
     */
    static String userPath(String path) {
        return TEMPORARY_FILE.matcher(PARTIAL.matcher(path).replaceAll("$1$2")).replaceAll("$1$2");
    }

    private static final java.util.regex.Pattern PARTIAL = java.util.regex.Pattern.compile(
            "(^|[/\\\\])\\.([^/\\\\]+)\\.(?:partial|replaced)-" + org.evanesce.io.output.OwnerTag.PATTERN + "(?=$|[/\\\\])");
    private static final java.util.regex.Pattern TEMPORARY_FILE = java.util.regex.Pattern.compile(
            "(^|[/\\\\])\\.([^/\\\\]+)\\." + org.evanesce.io.output.OwnerTag.PATTERN + "\\.tmp$");

    private static String cause(IOException e, String reason) {
        String r = reason == null ? "" : reason;
        String lower = r.toLowerCase(Locale.ROOT);
        if (lower.contains("no space left")) {
            return "no space left on the device (the disk is full)";
        }
        if (lower.contains("quota")) {
            return "the disk quota is used up";
        }
        if (lower.contains("read-only file system")) {
            return "the file system is read-only";
        }
        if (e instanceof AccessDeniedException || lower.contains("permission denied")
                || lower.contains("operation not permitted")) {
            return "permission denied (evanesce may not write or read there)";
        }
        if (lower.contains("file name too long") || lower.contains("name too long")) {
            return "a name in the path is too long for the file system";
        }
        if (e instanceof NoSuchFileException || lower.contains("no such file")) {
            return "no such file or folder";
        }
        if (e instanceof NotDirectoryException || lower.contains("not a directory")) {
            return "a part of the path is a file, not a folder";
        }
        if (e instanceof DirectoryNotEmptyException) {
            return "is a folder that is not empty";
        }
        if (e instanceof FileAlreadyExistsException) {
            return "already exists";
        }
        if (lower.contains("input/output error")) {
            return "input/output error (a failing disk, or a network file system that went away)";
        }
        if (lower.contains("too many open files")) {
            return "too many open files (raise the limit, ulimit -n)";
        }
        if (r.isEmpty()) {
            return e.getClass().getSimpleName();
        }
        return r.strip().replaceAll("\\s*\\R\\s*", "; ");
    }
}
