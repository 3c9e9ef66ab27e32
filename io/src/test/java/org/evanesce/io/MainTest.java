package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** Runs the command line in-process and checks exit codes and output. */
class MainTest {

    /** The exit code and what a command printed. */


    @Test
    void versionPrintsTheMavenVersionAndTheBuild() {
        Cli.Outcome o = Cli.run("--version");
        assertEquals(Main.OK, o.code(), o::toString);
        assertTrue(o.out().startsWith("evanesce 0."), o::toString);
        String first = o.out().lines().findFirst().orElse("");
        assertTrue(first.matches("evanesce 0\\.[^ ,]+, build ([0-9a-f]{12}|unknown)( with uncommitted changes)? \\([^)]+\\)"),
                "version line: " + first);
        assertTrue(!first.startsWith("evanesce unknown") && !o.out().contains("${"), "version not filtered by Maven: " + o);
    }

    @Test
    void unknownOptionIsAUsageErrorOnOneLine() {
        Cli.Outcome o = Cli.run("bench", "--no-such-option");
        assertEquals(Main.USAGE, o.code(), o::toString);
        assertEquals("", o.out(), o::toString);
        assertEquals(1, o.err().lines().count(), o::toString);
        assertTrue(o.err().contains("--no-such-option"), o::toString);
    }

    @Test
    void missingCommandIsAUsageError() {
        Cli.Outcome o = Cli.run();
        assertEquals(Main.USAGE, o.code(), o::toString);
        assertEquals(1, o.err().lines().count(), o::toString);
    }

    @Test
    void unknownPrecisionIsAUsageError() {
        Cli.Outcome o = Cli.run("bench", "--precision", "quadruple");
        assertEquals(Main.USAGE, o.code(), o::toString);
        assertEquals(1, o.err().lines().count(), o::toString);
        assertTrue(o.err().contains("quadruple"), o::toString);
    }

    @Test
    void outOfRangeValuesAreUsageErrorsBeforeAnythingRuns() {
        for (String[] args : new String[][] {
            {"bench", "--size", "10"}, {"bench", "--threads", "0"}, {"bench", "--seconds", "0"},
            {"bench", "--repeats", "0"}, {"bench", "--min-cells-per-thread", "0"}, {"bench", "--threads", "many"},
            {"bench", "--metal-fraction", "0.7"}, {"bench", "--metal-fraction", "-0.1"}}) {
            Cli.Outcome o = Cli.run(args);
            assertEquals(Main.USAGE, o.code(), () -> String.join(" ", args) + ": " + o);
            assertEquals("", o.out(), () -> String.join(" ", args) + ": " + o);
            assertEquals(1, o.err().lines().count(), () -> String.join(" ", args) + ": " + o);
        }
    }

    @Test
    void benchReportsAPositiveRate() {
        Cli.Outcome o = Cli.run("bench", "--size", "64", "--threads", "1", "--seconds", "0.2", "--warm-up", "0.2");
        assertEquals(Main.OK, o.code(), o::toString);
        Matcher m = Pattern.compile("(?m)^\\s+64x64\\s+s\\s+float\\s+1\\s+1\\s+\\S+\\s+(\\S+)\\s").matcher(o.out());
        assertTrue(o.out().contains("Mcell/s") && m.find(), o::toString);
        assertTrue(Double.parseDouble(m.group(1)) > 0, o::toString);
    }

    @Test
    void benchCsvHasOneRowPerCase() {
        Cli.Outcome o = Cli.run("bench", "--csv", "--size", "48", "--size", "64", "--threads", "1", "--seconds", "0.05",
                "--warm-up", "0", "--repeats", "1");
        assertEquals(Main.OK, o.code(), o::toString);
        String[] lines = o.out().split("\\R");
        assertEquals(3, lines.length, o::toString);
        String[] head = lines[0].split(",");
        int mcells = java.util.Arrays.asList(head).indexOf("mcells_per_s");
        for (int r = 1; r < lines.length; r++) {
            String[] cells = lines[r].split(",");
            assertEquals(head.length, cells.length, o::toString);
            assertTrue(Double.parseDouble(cells[mcells]) > 0, o::toString);
        }
        assertTrue(lines[1].startsWith("48,s,float,1,1,") && lines[2].startsWith("64,s,float,1,1,"), o::toString);
    }

    @Test
    void benchInterleavedTimesEveryCase() {
        Cli.Outcome o = Cli.run("bench", "--csv", "--interleave", "--size", "64", "--threads", "1", "--threads", "2",
                "--min-cells-per-thread", "64", "--seconds", "0.05", "--warm-up", "0", "--repeats", "3");
        assertEquals(Main.OK, o.code(), o::toString);
        String[] lines = o.out().split("\\R");
        assertEquals(3, lines.length, o::toString);
        assertTrue(lines[1].startsWith("64,s,float,1,1,") && lines[2].startsWith("64,s,float,2,2,"), o::toString);
        String[] head = lines[0].split(",");
        int repeats = java.util.Arrays.asList(head).indexOf("repeats");
        int fewer = java.util.Arrays.asList(head).indexOf("fewer_threads_percent");
        for (int r = 1; r < lines.length; r++) {
            String[] cells = lines[r].split(",");
            assertEquals("3", cells[repeats], o::toString);
            double f = Double.parseDouble(cells[fewer]);
            assertTrue(f >= 0 && f <= 100, o::toString);
        }
    }

    /** --metal-fraction: rows of gold, their share of the cells and the bytes their auxiliary currents take. */
    @Test
    void benchWithMetalReportsItsShareAndBytes() {
        Cli.Outcome o = Cli.run("bench", "--csv", "--size", "64", "--threads", "1", "--metal-fraction", "0",
                "--metal-fraction", "0.1", "--seconds", "0.05", "--warm-up", "0", "--repeats", "1");
        assertEquals(Main.OK, o.code(), o::toString);
        String[] lines = o.out().split("\\R");
        assertEquals(3, lines.length, o::toString);
        java.util.List<String> head = java.util.Arrays.asList(lines[0].split(","));
        String[] plain = lines[1].split(",");
        String[] metal = lines[2].split(",");
        assertEquals(0.0, Double.parseDouble(plain[head.indexOf("metal_percent")]), o::toString);
        assertEquals("0", plain[head.indexOf("metal_bytes")], o::toString);
        // round(0.1 * 64) = 6 rows of 64: 9.375 % of the cells; Rakic gold keeps 12 values (48 bytes) per site,
        // held for the 62 sites of a row that the update changes (not on the PEC walls behind the CPML), one run
        // per row; with the cell indices, 65 row starts of cells and of runs, and three ints per run
        assertEquals(9.375, Double.parseDouble(metal[head.indexOf("metal_percent")]), 1e-9, o::toString);
        long bytes = Long.parseLong(metal[head.indexOf("metal_bytes")]);
        assertEquals(6L * 62 * (48 + 4) + (2 * 65 + 3 * 6) * 4, bytes, o::toString);
        double perCell = Double.parseDouble(metal[head.indexOf("bytes_per_cell_with_metal")]);
        assertEquals(Integer.parseInt(metal[head.indexOf("bytes_per_cell")]) + bytes / 4096.0, perCell, 1e-3, o::toString);
    }
}
