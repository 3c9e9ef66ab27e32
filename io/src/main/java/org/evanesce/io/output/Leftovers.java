package org.evanesce.io.output;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Predicate;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * What killed runs leave beside their targets, and removing it when a run starts again. Only what is
 * provably evanesce's and provably abandoned goes: a name of evanesce's temporary patterns whose
 * writer ({@link OwnerTag}) no longer runs, of the kind evanesce makes there (a real folder with
 * evanesce's lock file or contents list, or empty; a plain file), never through a symbolic link. A
 * temporary of a run that is still going (another process, another shard, another thread) stays.
 *
 * <ul>
 * <li>{@code .NAME.partial-TAG/}: a results folder being written ({@link RunFolder}): removed.</li>
 * <li>{@code .NAME.replaced-TAG/}: a finished folder set aside while its replacement was renamed into
 *     place: removed when NAME exists again, else renamed back to NAME (the run was stopped between
 *     the two renames, and the old results are all there is).</li>
 * <li>{@code .NAME.TAG.tmp}: a file being written ({@link SafeFiles}): removed.</li>
 * <li>{@code .NAME.partial-DIGITS/}, the name of versions before owner tags: removed when empty and
 *     older than {@value #OLD_EMPTY_SECONDS} s (such a version could not leave anything else).</li>
 * </ul>
 */
public final class Leftovers {

    /** The lock file inside a folder being written; its writer holds a lock on it. */
    public static final String LOCK = ".evanesce-lock";
    /** Age after which an empty temporary folder without an owner tag counts as abandoned, s. */
    static final long OLD_EMPTY_SECONDS = 60;

    private static final Pattern PARTIAL = Pattern.compile("\\.(.+)\\.partial-" + OwnerTag.PATTERN);
    private static final Pattern REPLACED = Pattern.compile("\\.(.+)\\.replaced-" + OwnerTag.PATTERN);
    private static final Pattern OLD_PARTIAL = Pattern.compile("\\.(.+)\\.(partial|replaced)-\\d+");

    private Leftovers() {
    }

    static String partialName(String name, OwnerTag tag) {
        return "." + name + ".partial-" + tag.text();
    }

    static String replacedName(String name, OwnerTag tag) {
        return "." + name + ".replaced-" + tag.text();
    }

    /** Whether {@code dir} is a results folder still being written ({@code .NAME.partial-TAG}, see {@link RunFolder}). */
    static boolean isUnfinishedFolder(Path dir) {
        Path name = dir.getFileName();
        return name != null && PARTIAL.matcher(name.toString()).matches();
    }

    /** Whether {@code fileName} is one of evanesce's temporary names (of any target). */
    public static boolean isTemporary(String fileName) {
        return PARTIAL.matcher(fileName).matches() || REPLACED.matcher(fileName).matches()
                || OLD_PARTIAL.matcher(fileName).matches() || SafeFiles.parseTemporary(fileName) != null;
    }

    /** Cleans the leftovers of target {@code name} in {@code dir}; see {@link #clean(Path, Predicate)}. */
    public static List<String> clean(Path dir, String name) throws IOException {
        return clean(dir, name::equals);
    }

    /**
     * Cleans the leftovers in {@code dir} of the targets whose names {@code targets} accepts (see the
     * class comment).
     *
     * @return one line per thing done or deliberately left, for the user
     */
    public static List<String> clean(Path dir, Predicate<String> targets) throws IOException {
        List<String> done = new ArrayList<>();
        if (!Files.isDirectory(dir)) {
            return done;
        }
        List<Path> entries = new ArrayList<>();
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir, p -> p.getFileName().toString().startsWith("."))) {
            ds.forEach(entries::add);
        }
        entries.sort(null);
        for (Path p : entries) {
            String n = p.getFileName().toString();
            Matcher m;
            if ((m = PARTIAL.matcher(n)).matches() && targets.test(m.group(1))) {
                partial(p, tag(m), done);
            } else if ((m = REPLACED.matcher(n)).matches() && targets.test(m.group(1))) {
                replaced(p, dir.resolve(m.group(1)), tag(m), done);
            } else if ((m = OLD_PARTIAL.matcher(n)).matches() && targets.test(m.group(1))) {
                oldEmpty(p, done);
            } else {
                String[] t = SafeFiles.parseTemporary(n);
                if (t != null && targets.test(t[0])) {
                    temporaryFile(p, OwnerTag.parse(t[1]), done);
                }
            }
        }
        return done;
    }

    private static OwnerTag tag(Matcher m) {
        return OwnerTag.parse(m.group(2) + "-" + m.group(3) + "-" + m.group(4)).orElseThrow();
    }

    private static void partial(Path p, OwnerTag tag, List<String> done) throws IOException {
        if (!Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        OwnerTag.Liveness life = tag.liveness(p.resolve(LOCK));
        if (life == OwnerTag.Liveness.UNKNOWN) {
            done.add("left " + p + " in place: it was written on another machine and its lock cannot be checked; remove it "
                    + "once no run writes there");
        }
        if (life != OwnerTag.Liveness.ENDED) {
            return;
        }
        boolean ours = Files.isRegularFile(p.resolve(LOCK), LinkOption.NOFOLLOW_LINKS)
                || OutputFolders.isEmpty(p)
                || Files.isRegularFile(p.resolve(FolderContents.NAME), LinkOption.NOFOLLOW_LINKS) && FolderContents.foreign(p, 1).isEmpty();
        if (!ours) {
            done.add("left " + p + " in place: it holds files evanesce did not write");
            return;
        }
        SafeFiles.deleteTree(p);
        done.add("removed " + p + ", left by a run that was stopped");
    }

    private static void replaced(Path p, Path target, OwnerTag tag, List<String> done) throws IOException {
        if (!Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS) || tag.liveness(null) != OwnerTag.Liveness.ENDED) {
            return;
        }
        if (!Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
            Files.move(p, target, StandardCopyOption.ATOMIC_MOVE);
            SafeFiles.syncFolder(target.getParent());
            done.add("restored " + target + " from " + p.getFileName() + ": a run was stopped while it replaced that folder");
            return;
        }
        if (!FolderContents.foreign(p, 1).isEmpty()) {
            done.add("left " + p + " in place: it holds files evanesce did not write");
            return;
        }
        SafeFiles.deleteTree(p);
        done.add("removed " + p + ", an old results folder a stopped run had already replaced");
    }

    private static void temporaryFile(Path p, Optional<OwnerTag> tag, List<String> done) throws IOException {
        if (tag.isEmpty() || !Files.isRegularFile(p, LinkOption.NOFOLLOW_LINKS)
                || tag.get().liveness(p) != OwnerTag.Liveness.ENDED) {
            return;
        }
        Files.deleteIfExists(p);
        done.add("removed " + p + ", left by a run that was stopped");
    }

    private static void oldEmpty(Path p, List<String> done) throws IOException {
        if (!Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS) || !OutputFolders.isEmpty(p)) {
            return;
        }
        FileTime t = Files.getLastModifiedTime(p, LinkOption.NOFOLLOW_LINKS);
        if (System.currentTimeMillis() - t.toMillis() < OLD_EMPTY_SECONDS * 1000) {
            return;
        }
        try {
            Files.delete(p);
            done.add("removed " + p + ", an empty folder left by a run that was stopped");
        } catch (java.nio.file.DirectoryNotEmptyException e) {
            // something is writing into it after all
        }
    }
}
