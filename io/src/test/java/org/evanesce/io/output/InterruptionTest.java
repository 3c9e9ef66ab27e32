package org.evanesce.io.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * What the stop hook removes (common practice: a stopped program cleans up its own temporaries and leaves
 * finished work alone): an unfinished results folder with a folder inside it (reported once), a temporary file
 * being written outside any results folder; not a finished folder, not a finished file.
 */
class InterruptionTest {

    @TempDir
    Path tmp;

    @Test
    void removesWhatIsUnfinishedAndNothingElse() throws IOException {
        Path done = tmp.resolve("done");
        try (RunFolder f = RunFolder.begin(done, false)) {
            f.writeText("a.txt", "finished");
            f.commit();
        }
        Files.writeString(tmp.resolve("kept.txt"), "not ours to remove");
        RunFolder outer = RunFolder.begin(tmp.resolve("outer"), false);
        RunFolder inner = RunFolder.begin(outer.dir().resolve("s"), false);
        inner.writeText("b.txt", "half");
        Path tmpFile = tmp.resolve(SafeFiles.temporaryName("run.checkpoint"));
        Interruption.writing(tmpFile);
        Files.writeString(tmpFile, "a checkpoint half written");

        List<String> removed = Interruption.removeUnfinished();

        assertEquals(List.of(outer.dir().toString()), removed, "the outer folder, once");
        assertEquals(List.of("done", "kept.txt"), names(tmp), "only the finished folder and the user's file stay");
        assertEquals("finished", Files.readString(done.resolve("a.txt")));
        assertThrows(IOException.class, outer::commit, "a stopped folder is not committed afterwards");
        inner.close();
        outer.close();
        assertEquals(List.of("done", "kept.txt"), names(tmp));
        assertTrue(Interruption.message(removed).startsWith(
                "evanesce: stopped before it finished; removed the unfinished results folder " + outer.dir()));
        assertTrue(Interruption.message(List.of()).contains("no results folder was being written"));
        assertFalse(Interruption.message(List.of("a", "b")).contains("folder a"), "plural");
    }

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }
}
