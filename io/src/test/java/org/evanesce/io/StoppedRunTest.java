package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A run stopped by SIGTERM (what {@code kill}, a batch system's time limit and, as SIGINT, Ctrl-C send) removes its
 * unfinished results folder on the way out and says so in one line; its checkpoint stays, and the same command
 * then finishes the run from it. Before this, the stopped run left an empty {@code .NAME.partial-TAG/} beside its
 * target and printed nothing. The stopped run is a child JVM started through {@link Main#main}.
 */
class StoppedRunTest {

    @TempDir
    Path tmp;

    @Test
    void terminatedRunRemovesItsUnfinishedFolderAndSaysSo() throws IOException, InterruptedException {
        Path caseFile = tmp.resolve("gap.yaml");
        Files.writeString(caseFile, RunCheckpointTest.CASE);
        Path out = tmp.resolve("res");
        Path checkpoint = tmp.resolve("res.checkpoint");
        Path log = tmp.resolve("child.log");
        Process child = new ProcessBuilder(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "--add-modules", "jdk.incubator.vector", "-cp", System.getProperty("java.class.path"), "org.evanesce.io.Main",
                "run", caseFile.toString(), "--out", out.toString(), "--checkpoint-minutes", "0.002", "--threads", "1"))
                .redirectErrorStream(true).redirectOutput(log.toFile()).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(180);
        while (!(Files.exists(checkpoint) && unfinished(tmp)) && child.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(20);
        }
        assertTrue(child.isAlive(), "the child finished before it could be stopped; lengthen the case: " + Files.readString(log));
        assertTrue(unfinished(tmp), "no unfinished results folder appeared: " + Files.readString(log));
        child.destroy(); // SIGTERM on Linux and macOS
        assertTrue(child.waitFor(60, TimeUnit.SECONDS), "the stopped child did not exit");

        String said = Files.readString(log);
        assertFalse(unfinished(tmp), "the unfinished results folder stays after SIGTERM: " + RunCheckpointTest.hidden(tmp));
        assertFalse(Files.exists(out), "a stopped run must not leave a results folder");
        assertTrue(said.contains("evanesce: stopped before it finished; removed the unfinished results folder "
                + tmp.toRealPath().resolve(".res.partial-")) || said.contains("removed the unfinished results folder "
                + tmp.resolve(".res.partial-")), "one line says what was removed:\n" + said);
        assertFalse(said.contains("Exception"), "no stack trace:\n" + said);
        assertTrue(Files.exists(checkpoint), "the checkpoint stays for the next run");

        Cli.Outcome again = Cli.run("run", caseFile.toString(), "--out", out.toString(), "--checkpoint-minutes", "0.002",
                "--threads", "1");
        assertEquals(ExitCode.OK, again.code(), again.err());
        assertTrue(again.out().contains("continued from the checkpoint at step"), again.out());
        assertEquals(List.of(), RunCheckpointTest.hidden(tmp), "temporaries left after the rerun\n" + again.out());
    }

    private static boolean unfinished(Path dir) throws IOException {
        return RunCheckpointTest.hidden(dir).stream().anyMatch(n -> n.startsWith(".res.partial-"));
    }
}
