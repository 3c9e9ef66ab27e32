package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.io.output.Faults;
import org.evanesce.io.output.SafeFiles;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 13, faults: a full disk, a read-only or unwritable folder, an over-long name and a damaged
 * HDF5 file given to {@code redraw} end with exit 3 (exit 2 where the user gave a path evanesce
 * refuses) and one plain sentence naming the path and the cause, never a stack trace, and leave
 * nothing partial behind. A full disk is a real small tmpfs where the tests may mount one (as root),
 * and always a simulated write failure ({@link SafeFiles#NO_SPACE_PROPERTY}); the error texts are
 * also checked against the kernel's own (writing to /dev/full, creating an over-long name).
 */
class FaultsTest {

    @TempDir
    Path tmp;

    /** A tiny vacuum case; 2000 steps of probes make a probes.csv of about 90 kB. */
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
              write: [probes, fields]
            until: {steps: 2000}
            """;

    private Path caseFile() throws IOException {
        return Files.writeString(tmp.resolve("tiny.yaml"), TINY);
    }

    /** The outcome failed with exit 3 and one line naming {@code path} and containing {@code cause}. */
    private static void failedWith(Cli.Outcome o, String path, String cause) {
        assertEquals(ExitCode.RUN_FAILED, o.code(), o::toString);
        List<String> lines = o.err().lines().filter(l -> !l.contains(": note: ") && !l.startsWith("WARNING")).toList();
        assertEquals(1, lines.size(), () -> "one line on stderr: " + o);
        assertTrue(lines.get(0).contains(path) && lines.get(0).contains(cause), () -> "names " + path + " and " + cause + ": " + o);
        assertFalse(o.err().contains("\tat ") || o.err().contains("Exception"), () -> "no stack trace: " + o);
    }

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void aSimulatedFullDiskEndsWithOneSentenceAndLeavesNothing() throws IOException {
        Path c = caseFile();
        Path out = tmp.resolve("out");
        for (String file : new String[] {"probes.csv", "fields.h5", "run.json", FolderOf.CONTENTS}) {
            System.setProperty(SafeFiles.NO_SPACE_PROPERTY, "/" + java.util.regex.Pattern.quote(file) + "$");
            Cli.Outcome o;
            try {
                o = Cli.run("run", c.toString(), "--out", out.toString());
            } finally {
                System.clearProperty(SafeFiles.NO_SPACE_PROPERTY);
            }
            failedWith(o, out.resolve(file).toString(), "no space left on the device");
            assertEquals(List.of("tiny.yaml"), names(tmp), "nothing partial left after failing on " + file);
        }
    }

    @Test
    void aRealFullFileSystemEndsWithOneSentence() throws Exception {
        Path small = Files.createDirectories(tmp.resolve("small"));
        assumeTrue(mount(small, "size=16k"), "cannot mount a small tmpfs here (needs root and the right to mount): "
                + "the full-disk check ran only simulated");
        try {
            Path out = small.resolve("out");
            Cli.Outcome o = Cli.run("run", caseFile().toString(), "--out", out.toString());
            assertEquals(ExitCode.RUN_FAILED, o.code(), o::toString);
            failedWith(o, out.toString(), "no space left on the device");
            assertEquals(List.of(), names(small), "nothing partial left on the full file system");
        } finally {
            unmount(small);
        }
    }

    @Test
    void aReadOnlyFolderEndsWithOneSentence() throws Exception {
        Path ro = Files.createDirectories(tmp.resolve("ro"));
        boolean root = "root".equals(System.getProperty("user.name"));
        String cause;
        if (root) {
            // permissions do not stop root: a read-only file system does
            assumeTrue(mount(ro, "ro,size=64k"), "running as root, where a read-only folder does not stop writes, and "
                    + "no read-only tmpfs can be mounted: the read-only check was skipped");
            cause = "the file system is read-only";
        } else {
            Files.setPosixFilePermissions(ro, PosixFilePermissions.fromString("r-xr-xr-x"));
            cause = "permission denied";
        }
        try {
            Path out = ro.resolve("out");
            Cli.Outcome o = Cli.run("run", caseFile().toString(), "--out", out.toString());
            failedWith(o, out.toString(), cause);
            Cli.Outcome deeper = Cli.run("run", caseFile().toString(), "--out", ro.resolve("a").resolve("b").toString());
            failedWith(deeper, ro.resolve("a").toString(), cause);
            assertEquals(List.of(), names(ro));
        } finally {
            if (root) {
                unmount(ro);
            } else {
                Files.setPosixFilePermissions(ro, PosixFilePermissions.fromString("rwxr-xr-x"));
            }
        }
    }

    @Test
    void overLongNamesAreRefusedBeforeAnythingRuns() throws IOException {
        Path c = caseFile();
        Path longOut = tmp.resolve("x".repeat(200));
        Cli.Outcome o = Cli.run("run", c.toString(), "--out", longOut.toString());
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("200 bytes long") && o.err().contains("at most"), o::toString);
        Cli.Outcome deep = Cli.run("run", c.toString(), "--out", tmp.resolve("y".repeat(300)).resolve("out").toString());
        assertEquals(ExitCode.USAGE, deep.code(), deep::toString);
        assertEquals(List.of("tiny.yaml"), names(tmp));
    }

    @Test
    void theKernelsErrorTextsBecomeSentences() throws IOException {
        // a name longer than NAME_MAX: the kernel's ENAMETOOLONG
        FileSystemException tooLong = assertThrows(FileSystemException.class,
                () -> Files.createDirectory(tmp.resolve("z".repeat(300))));
        assertTrue(Faults.sentence(tooLong).endsWith(": a name in the path is too long for the file system"),
                Faults.sentence(tooLong));
        Path full = Path.of("/dev/full");
        assumeTrue(Files.isWritable(full), "no /dev/full on this system: its ENOSPC text was not checked");
        IOException enospc = assertThrows(IOException.class, () -> {
            try (OutputStream os = Files.newOutputStream(full)) {
                os.write(new byte[1 << 16]);
                os.flush();
            }
        });
        assertTrue(Faults.sentence(enospc).contains("no space left on the device"), Faults.sentence(enospc));
    }

    @Test
    void aDamagedHdf5FileGivenToRedrawEndsWithOneSentence() throws IOException {
        Path out = tmp.resolve("out");
        Cli.Outcome run = Cli.run("run", caseFile().toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, run.code(), run::toString);
        byte[] good = Files.readAllBytes(out.resolve("fields.h5"));

        Path cut = Files.createDirectories(tmp.resolve("cut"));
        Files.write(cut.resolve("fields.h5"), java.util.Arrays.copyOf(good, good.length / 2));
        failedWith(Cli.run("redraw", cut.toString()), cut.resolve("fields.h5").toString(), "not a readable HDF5 file");

        Path noise = Files.createDirectories(tmp.resolve("noise"));
        byte[] random = new byte[good.length];
        new Random(13).nextBytes(random);
        Files.write(noise.resolve("fields.h5"), random);
        failedWith(Cli.run("redraw", noise.toString()), noise.resolve("fields.h5").toString(), "not a readable HDF5 file");

        Cli.Outcome missing = Cli.run("redraw", tmp.resolve("nowhere").toString());
        assertEquals(ExitCode.USAGE, missing.code(), missing::toString);
        assertEquals(List.of("fields.h5"), names(cut), "no pictures half written");
    }

    /** {@code mount -t tmpfs -o OPTIONS tmpfs DIR}; false when it cannot be done here. */
    static boolean mount(Path dir, String options) throws InterruptedException {
        try {
            Process p = new ProcessBuilder("mount", "-t", "tmpfs", "-o", options, "tmpfs", dir.toString())
                    .redirectErrorStream(true).start();
            p.getInputStream().readAllBytes();
            return p.waitFor(30, TimeUnit.SECONDS) && p.exitValue() == 0;
        } catch (IOException e) {
            return false;
        }
    }

    static void unmount(Path dir) throws IOException, InterruptedException {
        Process p = new ProcessBuilder("umount", dir.toString()).redirectErrorStream(true).start();
        p.getInputStream().readAllBytes();
        p.waitFor(30, TimeUnit.SECONDS);
    }

    /** Names inside a results folder. */
    private static final class FolderOf {
        static final String CONTENTS = org.evanesce.io.output.FolderContents.NAME;
    }
}
