package org.evanesce.io.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.evanesce.io.Cli;
import org.evanesce.io.output.BuildInfo;
import org.evanesce.io.sweep.PointHash;
import org.evanesce.io.sweep.SweepFolder;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * What identifies a run: run.json names the build (commit, time, id), the command line and the host's
 * cores; the build id is part of a sweep point's hash and of a checkpoint's identity, so a rebuilt
 * program runs old points again (and says why) instead of reusing them.
 */
class BuildIdentityTest {

    @TempDir
    Path tmp;

    private static final String CASE = """
            parameters:
              wl: 633 nm
            polarization: s
            domain: {width: 2 um, height: 2 um}
            grid: {cell: 40 nm}
            sources:
              - point: {at: [0, 0], signal: {pulse: {wavelength: wl, bandwidth: 100 nm}}}
            until: {steps: 40}
            """;

    @Test
    void theBuildPropertiesWereWrittenByTheBuild() {
        BuildInfo b = BuildInfo.current();
        // the tests run from Maven's target/classes, where the build wrote build.properties (git or not)
        assertTrue(b.commit().matches("[0-9a-f]{40}") || b.commit().equals("unknown"), b.toString());
        assertTrue(b.time().matches("\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\dZ"), b.toString());
        String expected = b.commit().equals("unknown") ? "unknown@" + b.time()
                : b.modified().equals("false") ? b.commit() : b.commit() + "+modified@" + b.time();
        assertEquals(expected, b.id(), b.toString());
    }

    @Test
    void runJsonNamesTheBuildTheCommandLineAndTheCores() throws IOException {
        Path c = tmp.resolve("tiny.yaml");
        Files.writeString(c, CASE);
        Path out = tmp.resolve("out");
        String[] args = {"run", c.toString(), "--set", "wl=600nm", "--out", out.toString(), "--threads", "1"};
        Cli.Outcome o = Cli.run(args);
        assertEquals(ExitCode.OK, o.code(), o.toString());
        Map<?, ?> run = assertInstanceOf(Map.class, SweepFolder.readJson(out.resolve("run.json")));
        BuildInfo b = BuildInfo.current();
        assertEquals(Map.of("commit", b.commit(), "modified", b.modified(), "time", b.time(), "id", b.id()), run.get("build"));
        List<String> expected = new java.util.ArrayList<>(List.of("evanesce"));
        expected.addAll(List.of(args));
        assertEquals(expected, run.get("command_line"));
        Map<?, ?> host = assertInstanceOf(Map.class, run.get("host"));
        assertEquals(Runtime.getRuntime().availableProcessors(), ((Number) host.get("cores")).intValue());
    }

    @Test
    void thePointHashIsTheDocumentedDigestAndChangesWithTheBuild() throws NoSuchAlgorithmException {
        byte[] text = CASE.getBytes(StandardCharsets.UTF_8);
        Map<String, String> ov = Map.of("wl", "600 nm", "a", "1");
        String h1 = PointHash.of(text, ov, "1.0", "abc");
        // docs/outputs.md: "evanesce sweep point\ncase N\n" + bytes + "\n" + sorted "set" lines + version + build
        MessageDigest md = MessageDigest.getInstance("SHA-256");
        md.update(("evanesce sweep point\ncase " + text.length + "\n").getBytes(StandardCharsets.UTF_8));
        md.update(text);
        md.update("\nset a=1\nset wl=600 nm\nversion 1.0\nbuild abc\n".getBytes(StandardCharsets.UTF_8));
        assertEquals(HexFormat.of().formatHex(md.digest()), h1);
        assertNotEquals(h1, PointHash.of(text, ov, "1.0", "abd"), "another build, another hash");
        assertNotEquals(h1, PointHash.of(text, ov, "1.1", "abc"), "another version, another hash");
    }

    @Test
    void aCheckpointOfAnotherBuildIsNotTheSameRun() {
        BuildInfo now = BuildInfo.current();
        BuildInfo other = new BuildInfo(now.version(), now.commit(), "true", now.time(), now.id() + "x");
        Map<String, String> ov = Map.of("gap", "300nm");
        assertEquals(RunCommand.checkpointIdentity("ab", now, ov), RunCommand.checkpointIdentity("ab", now, Map.of("gap", "300nm")));
        assertNotEquals(RunCommand.checkpointIdentity("ab", now, ov), RunCommand.checkpointIdentity("ab", other, ov));
    }

    @Test
    void aSweepRunsThePointsOfAnotherBuildAgainAndSaysWhy() throws IOException {
        Path c = tmp.resolve("tiny.yaml");
        Files.writeString(c, CASE + """
                sweep:
                  parameters:
                    wl: [600 nm, 640 nm]
                """);
        Path out = tmp.resolve("sweep");
        Cli.Outcome first = Cli.run("sweep", c.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, first.code(), first.toString());
        // point 1 as another build would have left it: its record names that build and carries that build's hash
        Path rec = out.resolve("point-0001/point.json");
        byte[] text = Files.readAllBytes(c);
        String other = PointHash.of(text, Map.of("wl", "640 nm"), BuildInfo.current().version(), "an-older-build");
        Files.writeString(rec, Files.readString(rec)
                .replaceAll("\"point_hash\": \"[0-9a-f]+\"", "\"point_hash\": \"" + other + "\"")
                .replaceAll("\"build\": \"[^\"]*\"", "\"build\": \"an-older-build\""));
        Cli.Outcome again = Cli.run("sweep", c.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, again.code(), again.toString());
        assertTrue(again.out().contains("1 finished point(s) run again (made by another build of evanesce: an-older-build, this is "
                + BuildInfo.current().id() + "): 1"), again.toString());
        assertTrue(again.out().contains("1 finished already, 1 to run"), again.toString());
        Map<?, ?> now = assertInstanceOf(Map.class, SweepFolder.readJson(rec));
        assertEquals(BuildInfo.current().id(), now.get("build"));
    }
}
