package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 13, "nothing outside the results folder is ever touched": {@code --force} replaces only a
 * finished results folder of evanesce's own; the case's folder, the current folder, their ancestors,
 * a plain file, a symbolic link and a folder with other content are refused with exit 2 naming the
 * path, and nothing at all is deleted or changed (every file's bytes are compared before and after).
 * Temporary names planted as symbolic links are never followed.
 */
class OutputSafetyTest {

    @TempDir
    Path tmp;

    /** A tiny vacuum case that runs in a fraction of a second; {@code FOLDER} is replaced per test. */
    private static final String TINY = """
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 2 um, height: 2 um}
            grid: {cell: 40 nm}
            sources:
              - point: {at: [0, 0], signal: {pulse: {wavelength: 633 nm, bandwidth: 100 nm}}}
            probes:
              - {name: p, at: [0.3 um, 0]}
            output:
              write: [probes]
            until: {steps: 40}
            """;

    /** The project: {@code tmp/work/proj/case.yaml}, the user's notes beside it and a file one level up. */
    private Path project() throws IOException {
        Path proj = Files.createDirectories(tmp.resolve("work").resolve("proj"));
        Files.writeString(proj.resolve("notes.txt"), "the user's notes");
        Files.writeString(tmp.resolve("work").resolve("thesis.tex"), "the user's thesis");
        return Files.writeString(proj.resolve("case.yaml"), TINY);
    }

    @Test
    void forceRefusesEveryFolderThatIsNotAFinishedResultsFolder() throws IOException {
        Path c = project();
        Path proj = c.getParent();
        Path mine = Files.createDirectories(tmp.resolve("mine"));
        Files.writeString(mine.resolve("data.csv"), "1,2,3");
        Path file = Files.writeString(tmp.resolve("somefile"), "a plain file");
        Map<String, String> before = snapshot(tmp);

        String[][] refused = {
            {mine.toString(), "not an evanesce results folder"},  // a folder with foreign content
            {proj.toString(), "is the case file's folder"},
            {tmp.resolve("work").toString(), "is above the case file's folder"},
            {tmp.toString(), "is above the case file's folder"},
            {file.toString(), "is a file"},
            {file.resolve("inside").toString(), "is a file, so no folder can be made inside it"},
        };
        for (String[] r : refused) {
            Cli.Outcome o = Cli.run("run", c.toString(), "--out", r[0], "--force");
            assertEquals(ExitCode.USAGE, o.code(), () -> "--out " + r[0] + " --force: " + o);
            assertTrue(o.err().contains(r[0]) && o.err().contains(r[1]), () -> "the message names the path and why: " + o);
            assertEquals(1, o.err().lines().filter(l -> l.startsWith("evanesce run:")).count(), o::toString);
            assertEquals(before, snapshot(tmp), "--out " + r[0] + " --force changed files");
        }
    }

    @Test
    void aFinishedFolderWithAFileAddedIsNotReplaced() throws IOException {
        Path c = project();
        Path out = tmp.resolve("out");
        assertEquals(ExitCode.OK, Cli.run("run", c.toString(), "--out", out.toString()).code());
        Files.writeString(out.resolve("my-plot.py"), "print('mine')");
        Files.createDirectories(out.resolve("frames"));
        Map<String, String> before = snapshot(tmp);
        Cli.Outcome o = Cli.run("run", c.toString(), "--out", out.toString(), "--force");
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("my-plot.py") && o.err().contains("frames/"), o::toString);
        assertEquals(before, snapshot(tmp));
    }

    @Test
    void theCurrentFolderAndItsAncestorsAreRefused() {
        // without --force: even if the check failed, nothing could be replaced
        Path cwd = Path.of("").toAbsolutePath();
        for (Path p : new Path[] {cwd, cwd.getParent(), cwd.getRoot()}) {
            Cli.Outcome o = Cli.run("run", "../cases/gap-tunnelling-plane-wave.yaml", "--out", p.toString());
            assertEquals(ExitCode.USAGE, o.code(), () -> p + ": " + o);
            assertTrue(o.err().contains("current folder") || o.err().contains("root of the file system")
                    || o.err().contains("case file's folder"), o::toString);
        }
        Cli.Outcome empty = Cli.run("run", "../cases/gap-tunnelling-plane-wave.yaml", "--out", "");
        assertEquals(ExitCode.USAGE, empty.code(), empty::toString);
        assertTrue(empty.err().contains("is the current folder"), empty::toString);
    }

    @Test
    void outputFolderThatNamesTheCaseFolderOrAboveIsAnErrorAtItsLine() throws IOException {
        Path proj = project().getParent();
        for (String folder : new String[] {"''", "'.'", "'..'", "'a/../..'", "' '"}) {
            Path c = Files.writeString(proj.resolve("case.yaml"), TINY.replace("  write: [probes]",
                    "  write: [probes]\n  folder: " + folder));
            Map<String, String> before = snapshot(tmp);
            Cli.Outcome o = Cli.run("run", c.toString(), "--force");
            assertEquals(ExitCode.USAGE, o.code(), () -> folder + ": " + o);
            assertTrue(o.err().contains("case.yaml:11:") && o.err().contains("output.folder"), () -> folder + ": " + o);
            assertEquals(before, snapshot(tmp), folder);
            Cli.Outcome check = Cli.run("check", c.toString());
            assertEquals(ExitCode.USAGE, check.code(), () -> "check with folder " + folder + ": " + check);
        }
        Path c = Files.writeString(proj.resolve("case.yaml"), TINY.replace("  write: [probes]", "  write: [probes]\n  folder: ../results"));
        Cli.Outcome ok = Cli.run("run", c.toString());
        assertEquals(ExitCode.OK, ok.code(), ok::toString);
        assertTrue(Files.isRegularFile(tmp.resolve("work").resolve("results").resolve("run.json")));
    }

    @Test
    void aSymbolicLinkIsNeverReplacedNorFollowed() throws IOException {
        Path c = project();
        Path real = tmp.resolve("real");
        assertEquals(ExitCode.OK, Cli.run("run", c.toString(), "--out", real.toString()).code());
        Path link = Files.createSymbolicLink(tmp.resolve("link"), real);
        Map<String, String> before = snapshot(tmp);
        Cli.Outcome o = Cli.run("run", c.toString(), "--out", link.toString(), "--force");
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("symbolic link"), o::toString);
        assertEquals(before, snapshot(tmp));
    }

    @Test
    void temporaryNamesPlantedAsLinksAreNotFollowed() throws IOException {
        Path c = project();
        Path victimDir = Files.createDirectories(tmp.resolve("victim"));
        Path victim = Files.writeString(victimDir.resolve("precious.txt"), "keep");
        Path victimFile = Files.writeString(tmp.resolve("precious.dat"), "keep too");
        // a process that has ended: its pid is in the names, so the rerun treats these as abandoned
        Process gone = new ProcessBuilder("true").start();
        long pid = gone.pid();
        try {
            gone.waitFor();
        } catch (InterruptedException e) {
            throw new AssertionError(e);
        }
        String tag = org.evanesce.io.output.OwnerTag.mine().host() + "-" + pid + "-abc";
        Path out = tmp.resolve("out");
        Path[] links = {
            Files.createSymbolicLink(tmp.resolve(".out.partial-" + tag), victimDir),
            Files.createSymbolicLink(tmp.resolve(".out.replaced-" + tag), victimDir),
            Files.createSymbolicLink(tmp.resolve(".out.checkpoint." + tag + ".tmp"), victimFile),
            Files.createSymbolicLink(tmp.resolve("out.checkpoint.part"), victimFile),  // the name versions before issue 13 used
        };
        Cli.Outcome o = Cli.run("run", c.toString(), "--out", out.toString(), "--checkpoint-minutes", "0.00001");
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertEquals("keep", Files.readString(victim));
        assertEquals("keep too", Files.readString(victimFile));
        for (Path l : links) {
            assertTrue(Files.isSymbolicLink(l), l + " is left alone (not ours: evanesce makes no links)");
        }
        assertTrue(Files.isRegularFile(out.resolve("run.json")));
    }

    /** Every file and folder under {@code dir} (not following links) with its content, for before/after checks. */
    static Map<String, String> snapshot(Path dir) throws IOException {
        Map<String, String> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                String rel = dir.relativize(p).toString();
                if (Files.isSymbolicLink(p)) {
                    m.put(rel, "link to " + Files.readSymbolicLink(p));
                } else if (Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS)) {
                    m.put(rel + "/", "");
                } else {
                    m.put(rel, new String(Files.readAllBytes(p), java.nio.charset.StandardCharsets.ISO_8859_1));
                }
            }
        }
        return m;
    }
}
