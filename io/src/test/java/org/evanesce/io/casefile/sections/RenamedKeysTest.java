package org.evanesce.io.casefile.sections;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.evanesce.io.Cli;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.StopSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Keys of earlier versions ({@code resolution}, {@code stop} and, inside the stopping rule, {@code decay} and
 * {@code limit}) are refused at their line with the key to write instead, never read with another meaning;
 * the keys that replaced them ({@code grid}, {@code until} with {@code energy_below} and {@code latest}) work.
 */
class RenamedKeysTest {

    /** The exit code for bad input (README, "Exit codes"). */
    private static final int BAD_INPUT = 2;
    private static final ReadOptions ENOUGH_MEMORY = new ReadOptions(1L << 34);

    @TempDir
    Path tmp;

    /** A valid case; GRID and UNTIL are replaced. Lines are numbered from 1. */
    private static final String BASE = """
            polarization: s
            domain: {width: 4 um, height: 3 um}
            GRID
            sources:
              - point: {at: [0, 0], signal: {pulse: {wavelength: 633 nm, bandwidth: 40 nm}}}
            UNTIL
            """;

    private static String text(String grid, String until) {
        return BASE.replace("GRID", grid).replace("UNTIL", until);
    }

    private static List<String> errors(String text) {
        CaseFileException e = assertThrows(CaseFileException.class,
                () -> CaseLoader.parse(text, "case.yaml", Map.of(), ENOUGH_MEMORY), "expected errors in\n" + text);
        return e.errors().stream().map(Diagnostic::toString).toList();
    }

    @Test
    void oldSectionsAreRefusedAtTheirLineNamingTheNewOnes() {
        assertEquals(List.of("case.yaml:3:1: resolution: no longer read: 'resolution' is now 'grid'; write grid: {cell: ...} or "
                        + "grid: {cells_per_wavelength: ...}, with the same keys"),
                errors(text("resolution: {cell: 20 nm}", "until: {time: 100 fs}")));
        assertEquals(List.of("case.yaml:6:1: stop: no longer read: 'stop' is now 'until'; write until: {time: ...}, {steps: ...} or "
                        + "{energy_below: ..., latest: ...}; decay is now energy_below and limit is now latest"),
                errors(text("grid: {cell: 20 nm}", "stop: {time: 100 fs}")));
    }

    @Test
    void oldKeysInsideTheStoppingRuleAreRefusedAtTheirColumn() {
        assertEquals(List.of(
                "case.yaml:6:9: until.decay: no longer read: 'decay' is now 'energy_below'; write energy_below: FRACTION, the same "
                        + "fraction of the largest field energy",
                "case.yaml:6:22: until.limit: no longer read: 'limit' is now 'latest'; write latest: TIME, the same simulated time"),
                errors(text("grid: {cell: 20 nm}", "until: {decay: 1e-5, limit: 2 ps}")));
        // one old key beside a new one: only the old one is reported
        assertEquals(List.of("case.yaml:6:29: until.limit: no longer read: 'limit' is now 'latest'; write latest: TIME, the same "
                        + "simulated time"),
                errors(text("grid: {cell: 20 nm}", "until: {energy_below: 1e-5, limit: 2 ps}")));
    }

    @Test
    void theCommandsExitWithBadInputAndWriteNothing() throws IOException {
        Path f = tmp.resolve("old.yaml");
        Files.writeString(f, text("resolution: {cell: 40 nm}", "stop: {decay: 1e-5, limit: 200 fs}"));
        Cli.Outcome check = Cli.run("check", f.toString());
        assertEquals(BAD_INPUT, check.code(), check.toString());
        assertTrue(check.err().contains(f + ":3:1: resolution: no longer read: 'resolution' is now 'grid'"), check.toString());
        assertTrue(check.err().contains(f + ":6:1: stop: no longer read: 'stop' is now 'until'"), check.toString());
        Path out = tmp.resolve("out");
        Cli.Outcome run = Cli.run("run", f.toString(), "--out", out.toString());
        assertEquals(BAD_INPUT, run.code(), run.toString());
        assertFalse(Files.exists(out), "a refused case writes nothing");
    }

    @Test
    void latestAloneStopsAtTheDefaultEnergyFraction() throws CaseFileException {
        CaseSpec c = CaseLoader.parse(text("grid: {cell: 20 nm}", "until: {latest: 2 ps}"), "case.yaml", Map.of(), ENOUGH_MEMORY)
                .spec();
        StopSpec.WhenEnergyBelow u = assertInstanceOf(StopSpec.WhenEnergyBelow.class, c.stop());
        assertEquals(StopSpec.DEFAULT_ENERGY_FRACTION, u.fraction().si());
        assertEquals(2e-12, u.latest().si(), 1e-27);
        assertEquals(6, u.at().line());
    }

    @Test
    void newKeysAreRead() throws CaseFileException {
        CaseSpec c = CaseLoader.parse(text("grid:\n  cell: 25 nm", "until:\n  energy_below: 1e-7\n  latest: 300 fs"),
                "case.yaml", Map.of(), ENOUGH_MEMORY).spec();
        assertEquals(25e-9, c.grid().cell().orElseThrow().si(), 1e-24);
        StopSpec.WhenEnergyBelow u = assertInstanceOf(StopSpec.WhenEnergyBelow.class, c.stop());
        assertEquals(1e-7, u.fraction().si());
        assertEquals(300e-15, u.latest().si(), 1e-30);
        assertInstanceOf(StopSpec.AfterSteps.class, CaseLoader.parse(text("grid: {cell: 20 nm}", "until: {steps: 40}"), "case.yaml",
                Map.of(), ENOUGH_MEMORY).spec().stop());
    }

    @Test
    void theReferenceListsEveryRenamedKey() throws IOException {
        String doc = Files.readString(Path.of("..", "docs", "case-file.md"));
        int at = doc.indexOf("### Keys of earlier versions");
        assertTrue(at >= 0, "docs/case-file.md has no section on keys of earlier versions");
        String section = doc.substring(at, doc.indexOf("\n### ", at + 1));
        for (Schema.Section s : Schema.ALL) {
            for (Map.Entry<String, Schema.Renamed> r : s.renamed().entrySet()) {
                String old = s == Schema.ROOT ? "`" + r.getKey() + ":" : r.getKey() + ":";
                assertTrue(section.contains(old) && section.contains(r.getValue().now()),
                        "the table of renamed keys misses " + s.id() + " " + r.getKey() + " -> " + r.getValue().now());
            }
        }
    }
}
