package org.evanesce.io;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

/** Runs the command line in-process for tests and keeps what it printed. */
public final class Cli {

    private Cli() {
    }

    /** An exit code with the command's standard output and error. */
    public record Outcome(int code, String out, String err) {
        @Override
        public String toString() {
            return "exit " + code + "\n--- stdout ---\n" + out + "--- stderr ---\n" + err;
        }
    }

    /** {@code evanesce ARGS}, in this JVM. */
    public static Outcome run(String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code = Main.run(args, new PrintStream(out, true, StandardCharsets.UTF_8), new PrintStream(err, true, StandardCharsets.UTF_8));
        return new Outcome(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }
}
