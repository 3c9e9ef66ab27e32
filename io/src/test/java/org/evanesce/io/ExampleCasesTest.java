package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.snakeyaml.engine.v2.api.Load;
import org.snakeyaml.engine.v2.api.LoadSettings;

/**
 * Every example in {@code cases/} checks and runs. The examples follow a convention (cases/README.md):
 * each declares the parameters {@code cpw} (used as {@code grid.cells_per_wavelength}) and
 * {@code duration} (used as {@code until.time} or {@code until.latest}), so that {@link ExamplePhysicsTest} can
 * run it at a reduced resolution whatever its full size.
 */
class ExampleCasesTest {

    /** The examples, seen from the io module's folder, where its tests run. */
    static final Path CASES = Path.of("..", "cases");
    /** The output files each {@code output.write} item asks for. */
    static final Map<String, String> WRITTEN = Map.of("probes", "probes.csv", "preview", "preview.png");

    static List<Path> examples() throws IOException {
        try (Stream<Path> s = Files.list(CASES)) {
            return s.filter(p -> p.getFileName().toString().endsWith(".yaml")).sorted().toList();
        }
    }

    @Test
    void thereAreExamples() throws IOException {
        assertTrue(Files.isDirectory(CASES), "no cases folder at " + CASES.toAbsolutePath());
        assertTrue(examples().size() >= 4, "expected at least four examples in " + CASES.toAbsolutePath() + ": " + examples());
    }

    /** The raw YAML of an example, as a mapping. */
    private static Map<?, ?> yaml(Path example) throws IOException {
        Object doc = new Load(LoadSettings.builder().build()).loadFromString(Files.readString(example));
        return assertInstanceOf(Map.class, doc, example + ": the file is not a YAML mapping");
    }

    private static boolean mentions(Object expression, String name) {
        return expression != null && Pattern.compile("\\b" + name + "\\b").matcher(String.valueOf(expression)).find();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("examples")
    void followsTheTestConvention(Path example) throws IOException {
        Map<?, ?> doc = yaml(example);
        String how = example.getFileName() + " does not follow the examples' convention (see cases/README.md): ";
        if (!(doc.get("parameters") instanceof Map<?, ?> params)) {
            fail(how + "it has no 'parameters'; declare cpw (cells per wavelength) and duration (until.time or until.latest)");
            return;
        }
        List<String> problems = new ArrayList<>();
        if (!params.containsKey("cpw")) {
            problems.add("no parameter 'cpw' (cells per wavelength)");
        }
        if (!params.containsKey("duration")) {
            problems.add("no parameter 'duration' (until.time or until.latest)");
        }
        Object cpwUse = doc.get("grid") instanceof Map<?, ?> r ? r.get("cells_per_wavelength") : null;
        if (!mentions(cpwUse, "cpw")) {
            problems.add("grid.cells_per_wavelength should be cpw, found " + cpwUse);
        }
        Object until = doc.get("until");
        Object durationUse = until instanceof Map<?, ?> s ? (s.containsKey("time") ? s.get("time") : s.get("latest")) : null;
        if (!mentions(durationUse, "duration")) {
            problems.add("until.time (or until.latest) should be duration, found " + durationUse);
        }
        assertTrue(problems.isEmpty(), () -> how + String.join("; ", problems));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("examples")
    void checks(Path example, @TempDir Path tmp) {
        Path png = tmp.resolve("preview.png");
        Cli.Outcome o = Cli.run("check", example.toString(), "--trial-seconds", "0", "--preview", png.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertTrue(o.out().contains("valid"), o::toString);
        assertFalse(o.err().lines().anyMatch(l -> l.matches(".*:\\d+:\\d+: warning:.*")),
                () -> "an example at its own resolution should raise no warnings:\n" + o);
        assertTrue(Files.isRegularFile(png) && png.toFile().length() > 0, "no preview written: " + o);
    }

    /**
     * The run {@code o} wrote run.json with its {@code cpw} override, and every file the example's
     * {@code output.write} asks for, into {@code out} ({@link ExamplePhysicsTest} runs every example).
     */
    static void assertWroteWhatItAsks(Path example, Path out, Cli.Outcome o, String cpw) throws IOException {
        Path record = out.resolve("run.json");
        assertTrue(Files.isRegularFile(record), "no run.json: " + o);
        String json = Files.readString(record);
        assertTrue(json.contains("\"cpw\": \"" + cpw + "\""), "the override cpw=" + cpw + " is not in run.json: " + json);
        Object write = yaml(example).get("output") instanceof Map<?, ?> m ? m.get("write") : null;
        List<?> items = write instanceof List<?> l ? l : List.of("probes");
        for (Object item : items) {
            String file = WRITTEN.get(String.valueOf(item));
            assertTrue(file != null, example + ": output.write asks for '" + item + "', which this test does not know");
            Path f = out.resolve(file);
            assertTrue(Files.isRegularFile(f) && f.toFile().length() > 0, "no " + file + " in " + out + ": " + o);
        }
    }
}
