package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
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
            {"bench", "--repeats", "0"}, {"bench", "--min-cells-per-thread", "0"}, {"bench", "--threads", "many"}}) {
            Cli.Outcome o = Cli.run(args);
            assertEquals(Main.USAGE, o.code(), () -> String.join(" ", args) + ": " + o);
            assertEquals("", o.out(), () -> String.join(" ", args) + ": " + o);
            assertEquals(1, o.err().lines().count(), () -> String.join(" ", args) + ": " + o);
        }
    }

    /**
     * The bench's grid is a vacuum without conductivity, so each cell holds the three field components of its
     * polarization and one update coefficient per electric component (the lossless Yee update; a second one,
     * ca, exists only where cells have conductivity: common practice, K. S. Yee (1966), Taflove &amp; Hagness
     * ch. 3): s (Ez, Hx, Hy; cb for Ez) 4 values, p (Hz, Ex, Ey; cb for Ex and Ey) 5 values, times 4 bytes in
     * float and 8 in double: 16, 20, 32, 40 bytes per cell, as Simulation.predictBytesPerCell documents. The
     * arrays held (bytes) cover at least the N x N grid at that size, plus the CPML's own arrays. A wrong count
     * (the fields of the other polarization, a coefficient per cell in double in a float run, a lost
     * component) changes the figure by 4 bytes or more. No timing is asserted.
     */
    @Test
    void benchReportsTheDocumentedBytesPerCell() {
        Cli.Outcome o = Cli.run("bench", "--csv", "--size", "64", "--threads", "1", "--polarization", "s",
                "--polarization", "p", "--precision", "float", "--precision", "double", "--seconds", "0.05",
                "--warm-up", "0", "--repeats", "1");
        assertEquals(Main.OK, o.code(), o::toString);
        String[] lines = o.out().split("\\R");
        assertEquals(5, lines.length, o::toString);
        List<String> head = Arrays.asList(lines[0].split(","));
        Map<String, Integer> documented = Map.of("s,float", 16, "p,float", 20, "s,double", 32, "p,double", 40);
        Set<String> seen = new HashSet<>();
        for (int r = 1; r < lines.length; r++) {
            String[] cells = lines[r].split(",");
            String key = cells[head.indexOf("polarization")] + "," + cells[head.indexOf("precision")];
            int perCell = Integer.parseInt(cells[head.indexOf("bytes_per_cell")]);
            long bytes = Long.parseLong(cells[head.indexOf("bytes")]);
            assertEquals(documented.get(key), perCell, key + ": " + o);
            assertTrue(bytes >= (long) perCell * 64 * 64, key + ": " + bytes + " bytes for a 64 x 64 grid: " + o);
            seen.add(key);
        }
        assertEquals(documented.keySet(), seen, o::toString);
    }

    @Test
    void benchCsvHasOneRowPerCase() {
        Cli.Outcome o = Cli.run("bench", "--csv", "--size", "48", "--size", "64", "--threads", "1", "--seconds", "0.05",
                "--warm-up", "0", "--repeats", "1");
        assertEquals(Main.OK, o.code(), o::toString);
        String[] lines = o.out().split("\\R");
        assertEquals(3, lines.length, o::toString);
        String[] head = lines[0].split(",");
        int mcells = Arrays.asList(head).indexOf("mcells_per_s");
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
        int repeats = Arrays.asList(head).indexOf("repeats");
        int fewer = Arrays.asList(head).indexOf("fewer_threads_percent");
        for (int r = 1; r < lines.length; r++) {
            String[] cells = lines[r].split(",");
            assertEquals("3", cells[repeats], o::toString);
            double f = Double.parseDouble(cells[fewer]);
            assertTrue(f >= 0 && f <= 100, o::toString);
        }
    }
}
