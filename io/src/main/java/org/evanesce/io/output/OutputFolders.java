package org.evanesce.io.output;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Predicate;
import java.util.stream.Stream;

/**
 * Where evanesce may write an output folder. Refused (exit 2, nothing written or deleted): a folder
 * that is a protected folder (the case file's, the current one) or lies above one, a path whose
 * final name is a symbolic link, a plain file, a path inside a plain file, a name longer than a
 * file system holds, and an existing folder that is not evanesce's (see {@link FolderContents}).
 */
public final class OutputFolders {

    /** Longest file name in bytes on the usual file systems (ext4, XFS, Btrfs, tmpfs, NFS; common practice). */
    public static final int NAME_MAX = 255;
    /** Longest path in bytes the Linux kernel accepts (PATH_MAX; common practice). */
    public static final int PATH_MAX = 4096;
    /** Room for the longest suffix evanesce adds to a results folder's name beside it ({@code .checkpoint.corrupt-NN}). */
    static final int SUFFIX_ROOM = 24;
    /** Longest final name of an output folder, bytes: what the file system holds less evanesce's temporary names. */
    public static final int OUTPUT_NAME_MAX = NAME_MAX - SafeFiles.TEMPORARY_NAME_EXTRA - SUFFIX_ROOM;

    /**
     * A folder evanesce never writes over or above.
     *
     * @param folder the folder
     * @param what   what it is, for messages ("the case file's folder")
     */
    public record Protected(Path folder, String what) { }

    private OutputFolders() {
    }

    /** The current folder and the case file's folder. */
    public static List<Protected> around(Path caseFile) {
        List<Protected> p = new ArrayList<>();
        p.add(new Protected(Path.of("").toAbsolutePath(), "the current folder"));
        if (caseFile != null && caseFile.toAbsolutePath().getParent() != null) {
            p.add(new Protected(caseFile.toAbsolutePath().getParent(), "the case file's folder"));
        }
        return p;
    }

    /**
     * Checks a results folder about to be written by {@link RunFolder}.
     *
     * @param replace whether the user allowed replacing a finished folder ({@code --force})
     * @return whether a folder is there now (an empty folder, or with {@code replace} a finished one of
     *         evanesce: both are replaced when the run has finished)
     * @throws OutputRefusedException naming the path and the reason
     */
    public static boolean checkResults(Path target, boolean replace, List<Protected> protect) throws IOException {
        Path abs = checkPlace(target, protect);
        if (!Files.exists(abs, LinkOption.NOFOLLOW_LINKS)) {
            return false;
        }
        if (!Files.isDirectory(abs, LinkOption.NOFOLLOW_LINKS)) {
            throw new OutputRefusedException(abs + ": is a file, not a results folder; evanesce does not replace it. "
                    + "Choose another --out (or output.folder)");
        }
        if (isEmpty(abs)) {
            return true;
        }
        List<String> foreign = FolderContents.foreign(abs, 5);
        if (foreign.equals(List.of(FolderContents.NOT_RESULTS))) {
            throw new OutputRefusedException(abs + ": is a folder but not an evanesce results folder (" + foreign.get(0)
                    + "); evanesce replaces only a finished results folder of its own, even with --force. "
                    + "Choose another --out (or output.folder), or a new or empty folder");
        }
        if (!foreign.isEmpty()) {
            throw new OutputRefusedException(abs + ": holds files evanesce did not write (" + String.join(", ", foreign)
                    + "); evanesce replaces only a finished results folder of its own, even with --force. "
                    + "Choose another --out (or output.folder), or move those files away");
        }
        if (!replace) {
            throw new OutputRefusedException(abs + ": a finished run folder is already there; choose another --out or pass "
                    + "--force to replace it");
        }
        return true;
    }

    /**
     * Checks a folder evanesce writes into without ever replacing it whole (a sweep's folder): the place
     * rules, and when it exists without {@code marker} (e.g. {@code sweep.json}) every entry must be one
     * evanesce could have written there ({@code ours}).
     */
    public static void checkInto(Path dir, String marker, Predicate<String> ours, List<Protected> protect) throws IOException {
        Path abs = checkPlace(dir, protect);
        if (!Files.exists(abs, LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        if (!Files.isDirectory(abs, LinkOption.NOFOLLOW_LINKS)) {
            throw new OutputRefusedException(abs + ": is a file, not a folder; choose another --out");
        }
        if (Files.isRegularFile(abs.resolve(marker), LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        List<String> foreign = new ArrayList<>();
        try (Stream<Path> s = Files.list(abs)) {
            s.map(p -> p.getFileName().toString()).filter(n -> !ours.test(n)).sorted().limit(5).forEach(foreign::add);
        }
        if (!foreign.isEmpty()) {
            throw new OutputRefusedException(abs + ": holds files that are not evanesce's (" + String.join(", ", foreign)
                    + ") and no " + marker + "; choose another --out, or an empty or new folder");
        }
    }

    /**
     * The rules for any output folder, whether it exists or not: names a file system can hold, not a
     * symbolic link, not a protected folder or above one, not inside a plain file.
     *
     * @return the absolute, normalised path
     */
    static Path checkPlace(Path target, List<Protected> protect) throws IOException {
        Path abs = target.toAbsolutePath().normalize();
        if (abs.getFileName() == null) {
            throw new OutputRefusedException(abs + ": is the root of the file system; choose a folder of its own for the results");
        }
        int length = abs.toString().getBytes(StandardCharsets.UTF_8).length;
        if (length + NAME_MAX > PATH_MAX) {
            throw new OutputRefusedException(abs + ": the path is " + length + " bytes long; with the names evanesce writes "
                    + "inside it, it must stay below " + (PATH_MAX - NAME_MAX) + " bytes");
        }
        for (int k = 0; k < abs.getNameCount(); k++) {
            Path name = abs.getName(k);
            int n = name.toString().getBytes(StandardCharsets.UTF_8).length;
            int allowed = k == abs.getNameCount() - 1 ? OUTPUT_NAME_MAX : NAME_MAX;
            if (n > allowed) {
                throw new OutputRefusedException(abs + ": the name '" + shorten(name.toString()) + "' is " + n + " bytes long; "
                        + "file systems hold " + NAME_MAX + (allowed < NAME_MAX ? " and evanesce adds up to "
                        + (NAME_MAX - allowed) + " for the temporary names and checkpoints beside it, so at most " + allowed : "")
                        + "; choose a shorter name");
            }
        }
        if (Files.isSymbolicLink(abs)) {
            Path to;
            try {
                to = abs.toRealPath();
            } catch (IOException e) {
                to = null;
            }
            throw new OutputRefusedException(abs + ": is a symbolic link" + (to != null ? " (to " + to + ")" : "")
                    + "; evanesce writes results only into real folders. Give " + (to != null ? "that folder" : "a folder")
                    + " itself, or another --out");
        }
        Path existing = abs;
        while (existing != null && !Files.exists(existing, LinkOption.NOFOLLOW_LINKS)) {
            existing = existing.getParent();
        }
        if (existing != null && !existing.equals(abs) && !Files.isDirectory(existing)) {
            throw new OutputRefusedException(abs + ": " + existing + " is a file, so no folder can be made inside it; "
                    + "choose another --out");
        }
        Path real = realPath(abs);
        for (Protected p : protect) {
            Path pr = realPath(p.folder().toAbsolutePath().normalize());
            if (pr.equals(real)) {
                throw new OutputRefusedException(abs + ": is " + p.what() + "; the results need a folder of their own (e.g. "
                        + abs.resolve("results") + "). Choose another --out (or output.folder)");
            }
            if (pr.startsWith(real)) {
                throw new OutputRefusedException(abs + ": is above " + p.what() + " (" + p.folder().toAbsolutePath().normalize()
                        + "); evanesce never writes or replaces a folder that holds it. Choose another --out (or output.folder)");
            }
        }
        return abs;
    }

    /** Whether a folder has no entries. */
    static boolean isEmpty(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.findAny().isEmpty();
        }
    }

    /** The real path of {@code p}: its deepest existing ancestor resolved through links, then the rest. */
    private static Path realPath(Path p) {
        Path existing = p;
        while (existing != null && !Files.exists(existing)) {
            existing = existing.getParent();
        }
        if (existing == null) {
            return p;
        }
        try {
            return existing.toRealPath().resolve(existing.relativize(p)).normalize();
        } catch (IOException e) {
            return p;
        }
    }

    private static String shorten(String s) {
        return s.length() <= 40 ? s : s.substring(0, 20) + "…" + s.substring(s.length() - 12);
    }
}
