package org.evanesce.io.output;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * The list of what evanesce wrote into a results folder ({@value #NAME}, one relative path a line,
 * folders with a trailing '/'), written when the folder is finished. {@code --force} replaces a
 * folder only while it holds nothing else: a file the user added, or a symbolic link, keeps it.
 */
public final class FolderContents {

    /** The list's name inside a results folder. */
    public static final String NAME = ".evanesce-contents";
    private static final String HEADER = "evanesce results folder contents 1";
    /** What {@link #foreign} says of a folder that is no results folder of evanesce at all. */
    static final String NOT_RESULTS = "no run.json or " + NAME + " of evanesce in it";

    /** Older folders (no list): files with these extensions, and folders, were all evanesce wrote. */
    private static final Pattern LEGACY_FILE = Pattern.compile("[^/]+\\.(csv|json|png|h5|xmf)");
    private static final Pattern PROGRAM = Pattern.compile("\"program\"\\s*:\\s*\"evanesce\"");

    private FolderContents() {
    }

    /** Writes the list of everything under {@code dir} (but the list itself and {@code skip}) into {@code dir}. */
    static void write(Path dir, String skip) throws IOException {
        StringBuilder sb = new StringBuilder(HEADER).append('\n');
        for (String e : entries(dir)) {
            if (!e.equals(NAME) && !e.equals(skip)) {
                sb.append(e).append('\n');
            }
        }
        SafeFiles.writeString(dir.resolve(NAME), sb.toString());
    }

    /**
     * What in {@code dir} evanesce did not write: empty when every entry is on the folder's list (or,
     * for a folder written before lists existed, when it holds evanesce's {@code run.json} or
     * {@code accuracy.json} and only files of the kinds evanesce writes). Symbolic links are never ours.
     *
     * @return up to {@code limit} names (relative paths) that are not ours, or a sentence when the folder
     *         is not a results folder at all
     */
    static List<String> foreign(Path dir, int limit) throws IOException {
        Path list = dir.resolve(NAME);
        List<String> out = new ArrayList<>();
        if (Files.isRegularFile(list, LinkOption.NOFOLLOW_LINKS)) {
            List<String> lines = Files.readAllLines(list, StandardCharsets.UTF_8);
            if (lines.isEmpty() || !lines.get(0).equals(HEADER)) {
                return List.of(NAME + " is not a contents list of this program");
            }
            Set<String> ours = new HashSet<>(lines.subList(1, lines.size()));
            for (String e : entries(dir)) {
                if (!e.equals(NAME) && !ours.contains(e) && out.size() < limit) {
                    out.add(e);
                }
            }
            return out;
        }
        boolean record = false;
        for (String r : List.of("run.json", "accuracy.json")) {
            Path f = dir.resolve(r);
            if (Files.isRegularFile(f, LinkOption.NOFOLLOW_LINKS) && Files.size(f) < (1 << 24)
                    && PROGRAM.matcher(Files.readString(f, StandardCharsets.UTF_8)).find()) {
                record = true;
            }
        }
        if (!record) {
            return List.of(NOT_RESULTS);
        }
        for (String e : entries(dir)) {
            if (!e.endsWith("/") && !LEGACY_FILE.matcher(e.substring(e.lastIndexOf('/') + 1)).matches() && out.size() < limit) {
                out.add(e);
            }
        }
        return out;
    }

    /**
     * Every entry under {@code dir}, relative, sorted; folders end in '/', and anything that is neither
     * a plain file nor a folder (a symbolic link, a device) ends in '@' so that it matches no list.
     */
    private static List<String> entries(Path dir) throws IOException {
        List<String> out = new ArrayList<>();
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                if (p.equals(dir)) {
                    continue;
                }
                String rel = dir.relativize(p).toString().replace('\\', '/');
                BasicFileAttributes a = Files.readAttributes(p, BasicFileAttributes.class, LinkOption.NOFOLLOW_LINKS);
                out.add(a.isDirectory() ? rel + "/" : a.isRegularFile() ? rel : rel + "@");
            }
        }
        out.sort(null);
        return out;
    }
}
