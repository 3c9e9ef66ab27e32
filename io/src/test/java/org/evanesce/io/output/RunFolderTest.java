package org.evanesce.io.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RunFolderTest {

    @TempDir
    Path tmp;

    @Test
    void aFinishedFolderAppearsOnlyOnCommit() throws Exception {
        Path out = tmp.resolve("run1");
        try (RunFolder f = RunFolder.begin(out, false)) {
            f.writeText("a.txt", "hello");
            assertFalse(Files.exists(out), "nothing under the final name before commit");
            f.commit();
        }
        assertEquals("hello", Files.readString(out.resolve("a.txt")));
        assertEquals(List.of("run1"), names(tmp), "no temporary folder left behind");
    }

    @Test
    void anUnfinishedRunLeavesNothing() throws Exception {
        Path out = tmp.resolve("run2");
        try (RunFolder f = RunFolder.begin(out, false)) {
            f.writeText("a.txt", "partial");
        }
        assertFalse(Files.exists(out));
        assertTrue(names(tmp).isEmpty(), "temporary folder removed: " + names(tmp));
    }

    @Test
    void aFinishedFolderIsNeverOverwrittenSilently() throws Exception {
        Path out = tmp.resolve("run3");
        try (RunFolder f = RunFolder.begin(out, false)) {
            f.writeText("a.txt", "first");
            f.commit();
        }
        assertThrows(OutputRefusedException.class, () -> RunFolder.begin(out, false));
        try (RunFolder f = RunFolder.begin(out, true)) {
            f.writeText("a.txt", "second");
            assertEquals("first", Files.readString(out.resolve("a.txt")), "old result kept until the new one is complete");
            f.commit();
        }
        assertEquals("second", Files.readString(out.resolve("a.txt")));
        assertEquals(List.of("run3"), names(tmp));
    }

    @Test
    void aFolderWrittenBeforeContentsListsIsReplacedOnlyWhileItHoldsOurKindsOfFiles() throws Exception {
        Path out = Files.createDirectories(tmp.resolve("old").resolve("frames"));
        Path old = out.getParent();
        Files.writeString(old.resolve("run.json"), "{\n  \"program\": \"evanesce\",\n  \"version\": \"0.1\"\n}\n");
        Files.writeString(old.resolve("flux.csv"), "wavelength_nm\n");
        Files.writeString(out.resolve("frame-000000010.h5"), "x");
        Files.writeString(old.resolve("notes.txt"), "mine");
        assertThrows(OutputRefusedException.class, () -> RunFolder.begin(old, true), "a .txt file evanesce never writes");
        assertTrue(Files.exists(old.resolve("notes.txt")));
        Files.delete(old.resolve("notes.txt"));
        try (RunFolder f = RunFolder.begin(old, true)) {
            f.writeText("run.json", "{\"program\": \"evanesce\"}\n");
            f.commit();
        }
        assertFalse(Files.exists(old.resolve("frames")), "replaced whole");
        Path plain = Files.createDirectories(tmp.resolve("plain"));
        Files.writeString(plain.resolve("flux.csv"), "not ours: no run.json of evanesce");
        assertThrows(OutputRefusedException.class, () -> RunFolder.begin(plain, true));
        assertTrue(Files.exists(plain.resolve("flux.csv")));
    }

    @Test
    void anEmptyFolderIsUsedAsIfNew() throws Exception {
        Path out = Files.createDirectories(tmp.resolve("empty"));
        try (RunFolder f = RunFolder.begin(out, false)) {
            f.writeText("a.txt", "x");
            f.commit();
        }
        assertEquals("x", Files.readString(out.resolve("a.txt")));
    }

    @Test
    void checkpointTemporariesOfEndedRunsGoWhenTheTargetIsWrittenAgain() throws Exception {
        Process ended = new ProcessBuilder("true").start();
        ended.waitFor();
        OwnerTag dead = new OwnerTag(OwnerTag.mine().host(), ended.pid(), "x1");
        // a run killed while writing its checkpoint; the next run of the same target takes no checkpoints
        Files.writeString(tmp.resolve(".run5.checkpoint." + dead.text() + ".tmp"), "half");
        Files.writeString(tmp.resolve(".run5.checkpoint-p." + dead.text() + ".tmp"), "half");
        Files.writeString(tmp.resolve(".run55." + dead.text() + ".tmp"), "another target's");
        try (RunFolder f = RunFolder.begin(tmp.resolve("run5"), false)) {
            assertEquals(2, f.cleaned().size(), f.cleaned().toString());
            f.writeText("a.txt", "x");
            f.commit();
        }
        assertEquals(List.of(".run55." + dead.text() + ".tmp", "run5"), names(tmp));
    }

    @Test
    void jsonEscapesAndKeepsOrder() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("name", "a \"b\"\n");
        m.put("x", 1.5e-9);
        m.put("nan", Double.NaN);
        m.put("list", List.of(1, true));
        assertEquals("{\n  \"name\": \"a \\\"b\\\"\\n\",\n  \"x\": 1.5e-9,\n  \"nan\": null,\n  \"list\": [\n    1,\n    true\n  ]\n}\n",
                Json.write(m));
    }

    private static List<String> names(Path dir) throws Exception {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }
}
