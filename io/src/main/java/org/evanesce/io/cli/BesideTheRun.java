package org.evanesce.io.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;

/**
 * An output that depends on the plan alone (the permittivity preview), written on a thread of its own while the run
 * steps, where the run leaves a core idle (a small grid steps on one thread); else written where the caller waits for
 * it, as before. Either way the file's bytes are the same. The caller waits for it before its results folder is
 * committed or removed ({@link #await}, {@link #awaitQuietly}), so nothing is written into a folder that is gone.
 */
final class BesideTheRun {

    /** Writes one output. */
    interface Output {
        void write() throws IOException;
    }

    private final Output output;
    private final CompletableFuture<Void> done;

    private BesideTheRun(Output output, CompletableFuture<Void> done) {
        this.output = output;
        this.done = done;
    }

    /**
     * Starts {@code output} on a daemon thread when the run steps on fewer threads than the machine has processors,
     * else keeps it for {@link #await}.
     */
    static BesideTheRun start(int runThreads, Output output) {
        if (runThreads >= Runtime.getRuntime().availableProcessors()) {
            return new BesideTheRun(output, null);
        }
        CompletableFuture<Void> done = new CompletableFuture<>();
        Thread t = new Thread(() -> {
            try {
                output.write();
                done.complete(null);
            } catch (IOException | RuntimeException | Error e) {
                done.completeExceptionally(e);
            }
        }, "evanesce output beside the run");
        t.setDaemon(true);
        t.start();
        return new BesideTheRun(output, done);
    }

    /** Waits for the output (writes it here when it was not started), throwing what writing it threw. */
    void await() throws IOException {
        if (done == null) {
            output.write();
            return;
        }
        try {
            joinUninterruptibly();
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof IOException io) {
                throw io;
            }
            if (c instanceof UncheckedIOException u) {
                throw u;
            }
            if (c instanceof RuntimeException re) {
                throw re;
            }
            throw (Error) c;
        }
    }

    /** Waits for a started output and drops its outcome (the run failed: its folder is removed anyway). */
    void awaitQuietly() {
        if (done != null) {
            try {
                joinUninterruptibly();
            } catch (ExecutionException e) {
                // the run's own failure is the one reported
            }
        }
    }

    private void joinUninterruptibly() throws ExecutionException {
        boolean interrupted = false;
        try {
            while (true) {
                try {
                    done.get();
                    return;
                } catch (InterruptedException e) {
                    interrupted = true;
                }
            }
        } finally {
            if (interrupted) {
                Thread.currentThread().interrupt();
            }
        }
    }
}
