package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The contract of {@code evanesce run} and {@code check} (README exit codes, docs/architecture.md output
 * conventions): a finished folder is never overwritten without {@code --force}; a case with errors
 * reports each at file:line:column, exits 2 and writes nothing; a run that diverges exits 3 and
 * leaves no folder; {@code --set} of a parameter the case does not define exits 2.
 */
class CaseCommandsTest {

    @TempDir
    Path tmp;

    /** A tiny vacuum case that runs in a fraction of a second. */
    private static final String TINY = """
            title: tiny
            parameters:
              wl: 633 nm
            design_wavelength: wl
            polarization: s
            domain: {width: 2 um, height: 2 um}
            grid: {cell: 40 nm}
            sources:
              - point: {at: [0, 0], signal: {pulse: {wavelength: wl, bandwidth: 100 nm}}}
            probes:
              - {name: p, at: [0.3 um, 0]}
            output:
              write: [probes]
            until: {steps: 40}
            """;

    /** Errors on lines 6 and 9 (counted from 1): a negative width and a misspelt parameter. */
    private static final String BROKEN = """
            parameters:
              wl: 633 nm
              gap: 100 nm
            design_wavelength: wl
            polarization: s
            domain: {width: -2 um, height: 2 um}
            grid: {cell: 40 nm}
            shapes:
              - disk: {centre: [0, 0], radius: gapp, material: vacuum}
            sources:
              - point: {at: [0, 0], signal: {pulse: {wavelength: wl, bandwidth: 100 nm}}}
            until: {steps: 40}
            """;

    /**
     * A block with a large negative conductivity (gain) around the source: the electric update
     * factor (1 − σΔt/2ε)/(1 + σΔt/2ε) is about 1.5 per step there, so the fields pass the
     * solver's divergence limit within a few hundred steps.
     */
    private static final String GAIN = """
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 2 um, height: 2 um}
            grid: {cell: 35 nm}
            materials:
              gain: {index: 1.5, conductivity: -2e5 S/m}
            shapes:
              - rectangle: {centre: [0, 0], size: [1 um, 1 um], material: gain}
            sources:
              - point: {at: [0, 0], signal: {pulse: {wavelength: 633 nm, bandwidth: 100 nm}}}
            output:
              write: [probes, preview]
            until: {steps: 5000}
            """;



    private Path write(String name, String text) throws IOException {
        return Files.writeString(tmp.resolve(name), text);
    }

    private List<String> names(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void aFinishedFolderIsNotOverwrittenWithoutForce() throws IOException {
        Path c = write("tiny.yaml", TINY);
        Path out = tmp.resolve("out");
        Cli.Outcome first = Cli.run("run", c.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, first.code(), first::toString);
        String record = Files.readString(out.resolve("run.json"));
        String probes = Files.readString(out.resolve("probes.csv"));
        Files.writeString(out.resolve("my-notes.txt"), "keep me");

        Cli.Outcome again = Cli.run("run", c.toString(), "--out", out.toString(), "--set", "wl=800 nm");
        assertEquals(ExitCode.USAGE, again.code(), again::toString);
        assertTrue(again.err().contains("--force"), () -> "the message should say how to replace it: " + again);
        assertEquals(record, Files.readString(out.resolve("run.json")), "run.json changed");
        assertEquals(probes, Files.readString(out.resolve("probes.csv")), "probes.csv changed");
        assertEquals("keep me", Files.readString(out.resolve("my-notes.txt")));
        assertEquals(List.of("out", "tiny.yaml"), names(tmp), "leftovers of the refused run");

        // issue 13: --force replaces only a folder holding nothing but what evanesce wrote
        Cli.Outcome refused = Cli.run("run", c.toString(), "--out", out.toString(), "--set", "wl=800 nm", "--force");
        assertEquals(ExitCode.USAGE, refused.code(), refused::toString);
        assertTrue(refused.err().contains("my-notes.txt") && refused.err().contains(out.toString()), refused::toString);
        assertEquals("keep me", Files.readString(out.resolve("my-notes.txt")));
        assertEquals(record, Files.readString(out.resolve("run.json")), "run.json changed by a refused --force");
        assertEquals(List.of("out", "tiny.yaml"), names(tmp), "leftovers of the refused run");

        Files.delete(out.resolve("my-notes.txt"));
        Cli.Outcome forced = Cli.run("run", c.toString(), "--out", out.toString(), "--set", "wl=800 nm", "--force");
        assertEquals(ExitCode.OK, forced.code(), forced::toString);
        assertTrue(Files.readString(out.resolve("run.json")).contains("800 nm"), "--force did not replace run.json");
        assertEquals(List.of("out", "tiny.yaml"), names(tmp), "leftovers of the replaced run");
    }

    /** The rule that no run touches a file it did not make, for check's default preview beside the case. */
    @Test
    void checksDefaultPreviewReplacesOnlyAPictureItWrote() throws IOException {
        Path c = write("tiny.yaml", TINY);
        Path png = tmp.resolve("tiny-preview.png");
        Files.writeString(png, "a user's own file");
        Cli.Outcome kept = Cli.run("check", c.toString(), "--trial-seconds", "0");
        assertEquals(ExitCode.OK, kept.code(), kept::toString);
        assertTrue(kept.out().contains("preview: not written: " + png.toAbsolutePath()), kept::toString);
        assertEquals("a user's own file", Files.readString(png), "check replaced a file it did not write");

        Files.delete(png);
        Cli.Outcome first = Cli.run("check", c.toString(), "--trial-seconds", "0");
        assertEquals(ExitCode.OK, first.code(), first::toString);
        assertTrue(org.evanesce.io.output.image.PngFile.writtenByUs(png), "the preview carries no evanesce mark");
        assertTrue(javax.imageio.ImageIO.read(png.toFile()).getWidth() > 0, "the preview is not a readable PNG");
        Files.setLastModifiedTime(png, java.nio.file.attribute.FileTime.fromMillis(0));
        Cli.Outcome again = Cli.run("check", c.toString(), "--trial-seconds", "0");
        assertEquals(ExitCode.OK, again.code(), again::toString);
        assertTrue(Files.getLastModifiedTime(png).toMillis() > 0, "check did not replace its own earlier preview");
    }

    @Test
    void aCaseWithErrorsReportsPositionsExits2AndWritesNothing() throws IOException {
        Path c = write("broken.yaml", BROKEN);
        Path out = tmp.resolve("out");
        Path png = tmp.resolve("preview.png");
        for (String[] args : new String[][] {
            {"run", c.toString(), "--out", out.toString()},
            {"check", c.toString(), "--trial-seconds", "0", "--preview", png.toString()}}) {
            Cli.Outcome o = Cli.run(args);
            assertEquals(ExitCode.USAGE, o.code(), o::toString);
            Matcher width = Pattern.compile("(?m)^" + Pattern.quote(c.toString()) + ":6:(\\d+): domain\\.width: .*-2 um")
                    .matcher(o.err());
            assertTrue(width.find(), () -> "no file:line:column line for the negative width: " + o);
            Matcher radius = Pattern.compile("(?m)^" + Pattern.quote(c.toString()) + ":9:(\\d+): shapes\\[0]\\.disk\\.radius: .*gapp")
                    .matcher(o.err());
            assertTrue(radius.find(), () -> "no file:line:column line for the misspelt parameter: " + o);
            assertTrue(o.err().contains("2 error(s)"), o::toString);
            assertEquals(List.of("broken.yaml"), names(tmp), () -> args[0] + " wrote something: " + o);
        }
    }

    @Test
    void aDivergingRunExits3AndLeavesNoFolder() throws IOException {
        // gain is refused by the reader now, so the divergence is forced through the runner's seam for tests
        Path c = write("gain.yaml", GAIN.replace("conductivity: -2e5 S/m", "conductivity: 2e5 S/m"));
        Path out = tmp.resolve("out");
        Cli.Outcome o;
        org.evanesce.io.run.CaseRunner.divergenceLimitForTests = plan -> 1e-30;
        try {
            o = Cli.run("run", c.toString(), "--out", out.toString());
        } finally {
            org.evanesce.io.run.CaseRunner.divergenceLimitForTests = plan -> Double.NaN;
        }
        assertEquals(ExitCode.RUN_FAILED, o.code(), o::toString);
        assertTrue(o.err().contains("diverged"), o::toString);
        assertFalse(Files.exists(out), "a failed run left its folder");
        assertEquals(List.of("gain.yaml"), names(tmp), "a failed run left files behind");
    }

    @Test
    void gainIsRefusedByCheckWithItsPlace() throws IOException {
        Path c = write("gain.yaml", GAIN);
        Cli.Outcome o = Cli.run("check", c.toString(), "--trial-seconds", "0");
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains(c + ":6:36: materials.gain.conductivity: a negative conductivity (-200000 S/m) is gain"),
                o::toString);
        assertEquals(List.of("gain.yaml"), names(tmp), "a refused check wrote something");
    }

    /**
     * A map region one cell wide holds two nodes across: the maps' grid needs three along each axis, so
     * check refuses it at the region's line (a run used to fail after stepping, exit 1, results lost).
     */
    @Test
    void aMapRegionTooNarrowForAGridIsRefusedByCheck() throws IOException {
        Path c = write("narrow.yaml", TINY.replace("until: {steps: 40}", """
                maps:
                  wavelengths: wl
                  region: {from: [0, -0.5 um], to: [40 nm, 0.5 um]}
                until: {steps: 40}
                """));
        for (String[] args : new String[][] {
            {"check", c.toString(), "--trial-seconds", "0", "--preview", tmp.resolve("p.png").toString()},
            {"run", c.toString(), "--out", tmp.resolve("out").toString()}}) {
            Cli.Outcome o = Cli.run(args);
            assertEquals(ExitCode.USAGE, o.code(), o::toString);
            assertTrue(o.err().contains("narrow.yaml:16:") && o.err().contains("maps.region: the region holds 2 x 25 grid nodes; "
                    + "it must hold at least 3 x 3"), o::toString);
            assertEquals(List.of("narrow.yaml"), names(tmp), () -> args[0] + " wrote something: " + o);
        }
    }

    @Test
    void settingAnUnknownParameterIsAUsageError() throws IOException {
        Path c = write("tiny.yaml", TINY);
        Path out = tmp.resolve("out");
        Path png = tmp.resolve("preview.png");
        for (String[] args : new String[][] {
            {"run", c.toString(), "--out", out.toString(), "--set", "wavelength=700 nm"},
            {"check", c.toString(), "--trial-seconds", "0", "--preview", png.toString(), "--set", "wavelength=700 nm"}}) {
            Cli.Outcome o = Cli.run(args);
            assertEquals(ExitCode.USAGE, o.code(), o::toString);
            assertTrue(o.err().contains("'wavelength'"), () -> "the message should name the parameter: " + o);
            assertEquals(List.of("tiny.yaml"), names(tmp), () -> args[0] + " wrote something: " + o);
        }
    }

    @Test
    void settingAParameterToTheWrongKindIsAUsageError() throws IOException {
        Path c = write("tiny.yaml", TINY);
        Cli.Outcome o = Cli.run("run", c.toString(), "--out", tmp.resolve("out").toString(), "--set", "wl=3");
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("wl"), o::toString);
        assertEquals(List.of("tiny.yaml"), names(tmp), "nothing should be written: " + o);
    }

    @Test
    void aMissingCaseFileIsAUsageError() {
        Cli.Outcome o = Cli.run("run", tmp.resolve("nowhere.yaml").toString(), "--out", tmp.resolve("out").toString());
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("nowhere.yaml"), o::toString);
    }
}
