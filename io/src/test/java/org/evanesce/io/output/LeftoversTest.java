package org.evanesce.io.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 13: what a killed run left beside its target is removed when the run starts again, but only
 * what is provably evanesce's and provably abandoned: a temporary of a process that still runs (this
 * one, another on this host, or one on another host that holds its lock) stays, as do links and
 * folders holding files evanesce did not write.
 */
class LeftoversTest {

    @TempDir
    Path tmp;

    /** The pid of a process that has run and ended. */
    private static long endedPid() throws IOException, InterruptedException {
        Process p = new ProcessBuilder("true").start();
        p.waitFor();
        return p.pid();
    }

    private static OwnerTag tag(long pid) {
        return new OwnerTag(OwnerTag.mine().host(), pid, "x1");
    }

    @Test
    void abandonedTemporariesOfThisHostGoLiveOnesStay() throws Exception {
        long ended = endedPid();
        Process live = new ProcessBuilder("sleep", "60").start();
        try {
            Path deadPartial = Files.createDirectory(tmp.resolve(Leftovers.partialName("out", tag(ended))));
            Files.writeString(deadPartial.resolve(Leftovers.LOCK), "lock");
            Files.writeString(deadPartial.resolve("flux.csv"), "half");
            Path livePartial = Files.createDirectory(tmp.resolve(Leftovers.partialName("out", tag(live.pid()))));
            Files.writeString(livePartial.resolve(Leftovers.LOCK), "lock");
            Path deadTmp = Files.writeString(tmp.resolve(".out.checkpoint." + tag(ended).text() + ".tmp"), "half");
            Path liveTmp = Files.writeString(tmp.resolve(".out.checkpoint." + tag(live.pid()).text() + ".tmp"), "half");
            Path otherTarget = Files.createDirectory(tmp.resolve(Leftovers.partialName("other", tag(ended))));
            Path empty = Files.createDirectory(tmp.resolve(Leftovers.partialName("out", new OwnerTag(tag(ended).host(), ended, "y2"))));

            List<String> done = Leftovers.clean(tmp, n -> n.equals("out") || n.equals("out.checkpoint"));
            assertFalse(Files.exists(deadPartial), done.toString());
            assertFalse(Files.exists(deadTmp), done.toString());
            assertFalse(Files.exists(empty), "an empty folder of an ended run goes too: " + done);
            assertTrue(Files.isDirectory(livePartial), "a folder a live process writes stays");
            assertTrue(Files.exists(liveTmp), "a file a live process writes stays");
            assertTrue(Files.isDirectory(otherTarget), "another target's temporaries are not this run's business");
            assertEquals(3, done.size(), done.toString());

            live.destroyForcibly();
            assertTrue(live.waitFor(10, TimeUnit.SECONDS));
            Leftovers.clean(tmp, n -> n.equals("out") || n.equals("out.checkpoint"));
            assertFalse(Files.exists(livePartial), "once its writer has ended, it goes");
            assertFalse(Files.exists(liveTmp));
        } finally {
            live.destroyForcibly();
        }
    }

    @Test
    void foreignContentLinksAndOldNamesAreLeftAlone() throws Exception {
        long ended = endedPid();
        Path victim = Files.createDirectories(tmp.resolve("victim"));
        Files.writeString(victim.resolve("precious.txt"), "keep");
        Path link = Files.createSymbolicLink(tmp.resolve(Leftovers.partialName("out", tag(ended))), victim);
        Path linkTmp = Files.createSymbolicLink(tmp.resolve(".out." + tag(ended).text() + ".tmp"), victim.resolve("precious.txt"));
        // a folder under our pattern without our lock or contents list, holding a file: not provably ours
        Path odd = Files.createDirectory(tmp.resolve(Leftovers.partialName("out", new OwnerTag(tag(ended).host(), ended, "z3"))));
        Files.writeString(odd.resolve("thesis.tex"), "mine");
        // the name of versions before owner tags: removed only when empty and old
        Path oldEmpty = Files.createDirectory(tmp.resolve(".out.partial-1234567"));
        Path oldRecent = Files.createDirectory(tmp.resolve(".out.partial-7654321"));
        Path oldFull = Files.createDirectory(tmp.resolve(".out.partial-1111111"));
        Files.writeString(oldFull.resolve("x"), "x");
        FileTime hourAgo = FileTime.fromMillis(System.currentTimeMillis() - 3_600_000);
        Files.setLastModifiedTime(oldEmpty, hourAgo);
        Files.setLastModifiedTime(oldFull, hourAgo);

        List<String> done = Leftovers.clean(tmp, "out");
        assertEquals("keep", Files.readString(victim.resolve("precious.txt")));
        assertTrue(Files.isSymbolicLink(link) && Files.isSymbolicLink(linkTmp), "links are not ours");
        assertEquals("mine", Files.readString(odd.resolve("thesis.tex")));
        assertTrue(done.stream().anyMatch(l -> l.contains(odd.toString()) && l.contains("did not write")), done.toString());
        assertFalse(Files.exists(oldEmpty), done.toString());
        assertTrue(Files.exists(oldRecent) && Files.exists(oldFull.resolve("x")));
    }

    @Test
    void aReplacedFolderComesBackWhenTheRunStoppedBetweenTheRenames() throws Exception {
        long ended = endedPid();
        Path out = tmp.resolve("out");
        try (RunFolder f = RunFolder.begin(out, false)) {
            f.writeText("run.json", "{\"program\": \"evanesce\"}\n");
            f.commit();
        }
        Path aside = tmp.resolve(Leftovers.replacedName("out", tag(ended)));
        Files.move(out, aside);
        List<String> done = Leftovers.clean(tmp, "out");
        assertTrue(Files.isRegularFile(out.resolve("run.json")), "the old results are back: " + done);
        assertFalse(Files.exists(aside));

        // when the new folder did arrive, the old one goes
        Files.move(out, aside);
        try (RunFolder f = RunFolder.begin(tmp.resolve("new"), false)) {
            f.writeText("run.json", "{\"program\": \"evanesce\"}\n");
            f.commit();
        }
        Files.move(tmp.resolve("new"), out);
        Leftovers.clean(tmp, "out");
        assertFalse(Files.exists(aside));
        assertTrue(Files.isRegularFile(out.resolve("run.json")));
    }

    @Test
    void twoWritersOfOneTargetInThisProcessLeaveEachOtherAlone() throws Exception {
        Path out = tmp.resolve("out");
        try (RunFolder a = RunFolder.begin(out, false)) {
            a.writeText("run.json", "{\"program\": \"evanesce\"}\n");
            try (RunFolder b = RunFolder.begin(out, false)) {
                assertTrue(Files.isDirectory(a.dir()), "the second begin keeps the first's folder");
                assertTrue(b.cleaned().isEmpty(), b.cleaned().toString());
                b.writeText("run.json", "{\"program\": \"evanesce\"}\n");
                b.commit();
            }
            a.commit();
            assertEquals(tmp.resolve("out-2"), a.target(), "the second to finish goes beside, not over the first");
        }
    }

    @Test
    void anotherHostsFolderGoesOnlyWhenItsLockIsFree() throws Exception {
        OwnerTag elsewhere = new OwnerTag("00000000", 4242, "w1");
        assertNotEquals(OwnerTag.mine().host(), elsewhere.host(), "this test needs a host hash other than 00000000");
        Path partial = Files.createDirectory(tmp.resolve(Leftovers.partialName("out", elsewhere)));
        Path lock = Files.writeString(partial.resolve(Leftovers.LOCK), "lock");
        Process holder = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-cp",
                System.getProperty("java.class.path"), LockHolder.class.getName(), lock.toString()).start();
        try {
            BufferedReader r = new BufferedReader(new InputStreamReader(holder.getInputStream(), StandardCharsets.UTF_8));
            assertEquals("locked", r.readLine(), "the child took the lock");
            Leftovers.clean(tmp, "out");
            assertTrue(Files.isDirectory(partial), "the folder of a writer that holds its lock stays");
            holder.getOutputStream().close();
            assertTrue(holder.waitFor(30, TimeUnit.SECONDS));
            List<String> done = Leftovers.clean(tmp, "out");
            assertFalse(Files.exists(partial), "its writer ended (the lock is free): " + done);
        } finally {
            holder.destroyForcibly();
        }
        // no lock file to ask: not provably ended, so it stays (with a note)
        Path noLock = Files.createDirectory(tmp.resolve(Leftovers.partialName("out", elsewhere)));
        Files.writeString(noLock.resolve("flux.csv"), "half");
        List<String> done = Leftovers.clean(tmp, "out");
        assertTrue(Files.isDirectory(noLock));
        assertTrue(done.stream().anyMatch(l -> l.contains("another machine")), done.toString());
    }
}
