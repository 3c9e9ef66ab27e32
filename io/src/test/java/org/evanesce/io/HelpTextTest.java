package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/**
 * Every help text is a format string: picocli formats each description line with java.util.Formatter (to turn
 * {@code %n} into a line break), and a lone '%' ("95 % interval") makes it print a warning above the usage (on the
 * process's standard error, caught here) and show the raw text (common practice: '%' written "%%").
 */
class HelpTextTest {

    @Test
    void everyCommandsHelpPrintsWithoutAWarning() {
        PrintStream saved = System.err;
        ByteArrayOutputStream warnings = new ByteArrayOutputStream();
        System.setErr(new PrintStream(warnings, true, StandardCharsets.UTF_8));
        try {
            Cli.Outcome top = Cli.run("--help");
            assertEquals(0, top.code(), top::toString);
            for (Map.Entry<String, CommandLine> e : Main.commandLine(null).getSubcommands().entrySet()) {
                if (e.getValue().getCommandSpec().usageMessage().hidden()) {
                    continue; // the old names of renamed commands: they only say the new name
                }
                Cli.Outcome o = Cli.run(e.getKey(), "--help");
                assertEquals(0, o.code(), o::toString);
                assertTrue(o.out().startsWith("Usage: evanesce " + e.getKey()), o::toString);
            }
        } finally {
            System.setErr(saved);
        }
        assertFalse(warnings.toString(StandardCharsets.UTF_8).contains("picocli WARN"), warnings::toString);
    }
}
