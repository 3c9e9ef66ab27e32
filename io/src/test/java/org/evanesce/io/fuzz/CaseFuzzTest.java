package org.evanesce.io.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.evanesce.io.Cli;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Mutation fuzzing of case files: the shipped cases, the examples of docs/case-file.md and three
 * tiny cases are broken in every way {@link CaseMutator} knows, with a fixed seed, and each mutant
 * goes through {@code evanesce check} (and, when it passes and is small, {@code evanesce run}) in
 * this JVM. Whatever the damage, the command must exit 0 or 2 (never 1, the code of a bug), print
 * no stack trace, name the file with line and column on an error, finish within a time limit (a
 * hang is a failure), and write nothing for a case it refuses.
 *
 * <p>The commands run on a thread with a 1 MiB stack, the size the {@code java} launcher gives the
 * main thread by default, so that unbounded recursion shows here as it would for a user.
 */
class CaseFuzzTest {

    /** The seed of the mutations: fixed, so a failure reproduces. */
    static final long SEED = 0x13_2026L;
    /** Mutants checked; every kind of damage gets at least four. */
    static final int MUTANTS = 260;
    /** A command that takes longer than this is taken to hang (they take well under a second each). */
    static final long PER_CASE_SECONDS = 20;
    /** Mutants that pass check run when cells × steps is at most this (a few hundredths of a second each). */
    static final double RUN_CELL_STEPS = 2e7;
    /** The stack the launcher's main thread gets by default on 64-bit Linux (HotSpot's ThreadStackSize). */
    static final long STACK_BYTES = 1 << 20;

    private static final Path CASES = Path.of("..", "cases");
    private static final Path DOC = Path.of("..", "docs", "case-file.md");
    /** A trace line, an exception's class name, or the internal-error banner. */
    private static final Pattern TRACE = Pattern.compile("(?m)^\\s+at [\\w.$]+\\(|\\b(java|javax|org|sun)\\.[\\w.$]+(Exception|Error)\\b"
            + "|internal error|\\w+Exception\\b|StackOverflow|OutOfMemory");
    private static final Pattern GRID = Pattern.compile("grid: \\d+ x \\d+ = (\\d+) cells");
    private static final Pattern STEPS = Pattern.compile("steps: (?:at most )?(\\d+)");

    /** Tiny valid cases that exercise probes, frames, fields, flux, maps and beams, for the run subset. */
    static final List<String> TINY = List.of("""
            title: tiny point source with probes and field frames
            parameters:
              wl: 633 nm
              r: 0.2 um
            polarization: s
            domain: {width: 1.2 um, height: 1.2 um}
            grid: {cell: 40 nm}
            materials:
              lossy: {index: 1.5, conductivity: 1e3 S/m}
            shapes:
              - disk: {centre: [0.2 um, 0], radius: r, material: lossy}
              - polygon: {corners: [[-0.4 um, -0.4 um], [-0.2 um, -0.4 um], [-0.3 um, -0.2 um]], material: water}
              - rectangle: {centre: [0, -0.3 um], size: [0.3 um, 0.1 um], rotation: 10, material: fused_silica}
            boundaries: {all: pml 8}
            sources:
              - point: {at: [0, 0.1 um], signal: {pulse: {wavelength: wl, bandwidth: 100 nm}}}
            probes:
              - {name: a, at: [0, -0.1 um]}
            output:
              write: [probes, fields, field_frames, permittivity, preview]
              frame_interval: 5 fs
            until: {time: 20 fs}
            """, """
            title: tiny plane wave with flux and maps
            parameters:
              gap: 100 nm
            design_wavelength: 633 nm
            polarization: p
            domain: {width: 0.2 um, height: 2.8 um, background: glass}
            grid: {cells_per_wavelength: 8}
            materials:
              glass: {index: 1.5}
            shapes:
              - layer_stack: {start: [0, -gap/2], layers: [{material: air, thickness: gap}]}
            boundaries: {left: periodic, right: periodic, all: pml 8}
            sources:
              - plane_wave: {y: -0.6 um, angle: 30, signal: {pulse: {wavelength: 633 nm, bandwidth: 40 nm}}}
            flux:
              wavelengths: {from: 620 nm, to: 646 nm, count: 3}
              lines:
                - {y: -0.8 um, measures: reflected}
                - {y: 0.6 um, measures: transmitted}
              transfer_matrix: true
            maps:
              wavelengths: 633 nm
              log_decades: 5
              decay:
                - {from: [0, 0.1 um], to: [0, 0.4 um]}
            until: {energy_below: 1e-3, latest: 60 fs}
            """, """
            title: tiny beam with flux
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 9 um, height: 2.4 um, background: glass}
            grid: {cells_per_wavelength: 6}
            materials:
              glass: {index: 1.5}
            shapes:
              - half_plane: {through: [0, 0.3 um], fill: above, material: air}
            boundaries: {all: pml 8}
            sources:
              - gaussian_beam: {y: -0.3 um, waist: 1 um, waist_at: [0, 0.3 um], angle: 20, signal: {ramped_wave: {wavelength: 633 nm}}}
            flux:
              lines:
                - {y: -0.5 um, measures: reflected}
                - {y: 0.5 um, measures: transmitted}
            until: {time: 150 fs}
            """);

    @TempDir
    static Path work;
    private static ExecutorService runner;

    @BeforeAll
    static void startRunner() {
        runner = Executors.newSingleThreadExecutor(r -> {
            Thread t = new Thread(null, r, "fuzz-command", STACK_BYTES);
            t.setDaemon(true);
            return t;
        });
    }

    @AfterAll
    static void stopRunner() {
        runner.shutdownNow();
    }

    /** A base case to mutate: its name, its text, and whether its mutants may also run. */
    record Base(String name, String text, boolean tiny) { }

    static List<Base> bases() throws IOException {
        List<Base> out = new ArrayList<>();
        try (Stream<Path> s = Files.list(CASES)) {
            for (Path p : s.filter(f -> f.toString().endsWith(".yaml")).sorted().toList()) {
                out.add(new Base(p.getFileName().toString(), Files.readString(p), false));
            }
        }
        StringBuilder block = null;
        int k = 0;
        for (String line : Files.readAllLines(DOC)) {
            if (block == null && line.strip().equals("```yaml")) {
                block = new StringBuilder();
            } else if (block != null && line.strip().equals("```")) {
                out.add(new Base("case-file.md example " + k++, block.toString(), false));
                block = null;
            } else if (block != null) {
                block.append(line).append('\n');
            }
        }
        for (int t = 0; t < TINY.size(); t++) {
            out.add(new Base("tiny " + t, TINY.get(t), true));
        }
        return out;
    }

    /** What one command did. */
    record Outcome(Cli.Outcome cli, boolean hung, double seconds) { }

    static Outcome command(String... args) {
        long t0 = System.nanoTime();
        Future<Cli.Outcome> f = runner.submit(() -> Cli.run(args));
        try {
            return new Outcome(f.get(PER_CASE_SECONDS, TimeUnit.SECONDS), false, (System.nanoTime() - t0) * 1e-9);
        } catch (TimeoutException e) {
            // the hung command keeps its (daemon) thread; later commands get a fresh one
            f.cancel(true);
            runner.shutdownNow();
            startRunner();
            return new Outcome(null, true, PER_CASE_SECONDS);
        } catch (java.util.concurrent.ExecutionException e) {
            // what escapes Main.run kills the launcher's main thread: a trace and exit code 1
            return new Outcome(new Cli.Outcome(1, "", "escaped Main.run: " + e.getCause()), false, (System.nanoTime() - t0) * 1e-9);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError("interrupted", e);
        }
    }

    /** Problems with one command's outcome, empty when it behaved. */
    static List<String> problems(Outcome o, Path caseFile, Set<String> filesBefore, Path dir) throws IOException {
        List<String> out = new ArrayList<>();
        if (o.hung) {
            out.add("did not finish within " + PER_CASE_SECONDS + " s");
            return out;
        }
        Cli.Outcome c = o.cli;
        if (c.code() != 0 && c.code() != 2) {
            out.add("exit " + c.code() + ", expected 0 or 2");
        }
        Matcher trace = TRACE.matcher(c.out() + c.err());
        if (trace.find()) {
            out.add("output shows a trace or an exception: '" + trace.group() + "'");
        }
        if (c.code() == 2) {
            Pattern located = Pattern.compile("(?m)^" + Pattern.quote(caseFile.toString()) + ":\\d+:\\d+: (?!warning: |note: )");
            if (!located.matcher(c.err()).find()) {
                out.add("refused without an error at file:line:column");
            }
            Set<String> after = listing(dir);
            if (!after.equals(filesBefore)) {
                Set<String> added = new TreeSet<>(after);
                added.removeAll(filesBefore);
                out.add("refused but wrote " + added);
            }
        }
        return out;
    }

    static Set<String> listing(Path dir) throws IOException {
        try (Stream<Path> s = Files.walk(dir)) {
            return s.map(p -> dir.relativize(p).toString()).collect(Collectors.toCollection(TreeSet::new));
        }
    }

    @Test
    void everyBaseIsValid() throws IOException {
        for (Base b : bases()) {
            Path dir = Files.createDirectories(work.resolve("base-" + b.name().replaceAll("\\W", "_")));
            Path file = dir.resolve("case.yaml");
            Files.writeString(file, b.text());
            // the n, k tables the examples read sit beside them (docs/gold-jc-nk.csv, cases/gold-jc-nk.csv)
            for (Path folder : List.of(Path.of("..", "docs"), Path.of("..", "cases"))) {
                try (Stream<Path> tables = Files.list(folder)) {
                    for (Path t : tables.filter(p -> p.toString().endsWith(".csv")).toList()) {
                        Files.copy(t, dir.resolve(t.getFileName()), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
                    }
                }
            }
            Outcome o = command("check", file.toString(), "--trial-seconds", "0");
            // the reference's complete example shows keys this version reads but cannot run
            boolean notRunnable = o.cli.code() == 2 && o.cli.err().contains("not available in this version");
            assertTrue(o.cli.code() == 0 || notRunnable && b.name().endsWith("example 0"), b.name() + " is not a valid base:\n" + o.cli);
        }
    }

    @Test
    void mutatedCasesAreRunOrRefusedCleanly() throws IOException {
        List<Base> bases = bases();
        List<Base> tiny = bases.stream().filter(Base::tiny).toList();
        CaseMutator.Kind[] kinds = CaseMutator.Kind.values();
        assertTrue(MUTANTS >= 4 * kinds.length, "every kind needs several mutants");
        Random random = new Random(SEED);
        CaseMutator mutator = new CaseMutator(random);
        Map<CaseMutator.Kind, int[]> codes = new EnumMap<>(CaseMutator.Kind.class);
        List<String> failures = new ArrayList<>();
        int runs = 0;
        double slowest = 0;
        String slowestName = "";
        for (int m = 0; m < MUTANTS; m++) {
            CaseMutator.Kind kind = kinds[m % kinds.length];
            // a third of the mutants start from a tiny case, so that some of them also run
            Base base = m % 3 == 0 ? tiny.get(random.nextInt(tiny.size())) : bases.get(random.nextInt(bases.size()));
            byte[] mutant = mutator.mutate(base.text(), kind);
            Path dir = Files.createDirectories(work.resolve(String.format("m%03d", m)));
            Path file = dir.resolve("case.yaml");
            Files.write(file, mutant);
            String name = String.format("mutant %d (%s of %s, %d bytes)", m, kind, base.name(), mutant.length);
            Set<String> before = listing(dir);
            Outcome o = command("check", file.toString(), "--trial-seconds", "0");
            if (o.seconds > slowest) {
                slowest = o.seconds;
                slowestName = name;
            }
            List<String> p = problems(o, file, before, dir);
            if (!o.hung) {
                codes.computeIfAbsent(kind, x -> new int[4])[Math.min(3, o.cli.code())]++;
            }
            if (p.isEmpty() && o.cli.code() == 0 && base.tiny() && small(o.cli.out())) {
                Set<String> beforeRun = listing(dir);
                Outcome r = command("run", file.toString(), "--out", dir.resolve("out").toString(), "--checkpoint-minutes", "0");
                runs++;
                for (String q : problems(r, file, beforeRun, dir)) {
                    p.add("run: " + q);
                }
                if (r.cli != null && r.cli.code() == 0 && !Files.exists(dir.resolve("out").resolve("run.json"))) {
                    p.add("run: exit 0 without run.json");
                }
            }
            if (!p.isEmpty()) {
                Path kept = Path.of("target", "fuzz-failures", String.format("m%03d.yaml", m));
                Files.createDirectories(kept.getParent());
                Files.write(kept, mutant);
                failures.add(name + " (kept as " + kept + "): " + String.join("; ", p)
                        + (o.cli == null ? "" : "\n" + excerpt(o.cli.err())));
            }
        }
        Map<String, String> table = new TreeMap<>();
        codes.forEach((k, v) -> table.put(k.name(), String.format("exit 0: %d, 2: %d, other: %d", v[0], v[2], v[1] + v[3])));
        System.out.printf("CaseFuzzTest: %d mutants checked, %d also run; slowest %.2f s (%s)%n", MUTANTS, runs, slowest, slowestName);
        table.forEach((k, v) -> System.out.println("  " + k + ": " + v));
        assertEquals("", String.join("\n\n", failures), failures.size() + " mutant(s) misbehaved");
        assertTrue(runs >= 10, "too few mutants ran (" + runs + "); the run subset tests nothing");
    }

    /** Whether a checked case is small enough to run here. */
    private static boolean small(String checkOut) {
        Matcher g = GRID.matcher(checkOut);
        Matcher s = STEPS.matcher(checkOut);
        return g.find() && s.find() && Double.parseDouble(g.group(1)) * Double.parseDouble(s.group(1)) <= RUN_CELL_STEPS;
    }

    private static String excerpt(String s) {
        String t = s.length() > 1500 ? s.substring(0, 1500) + "..." : s;
        return t.lines().map(l -> l.length() > 300 ? l.substring(0, 300) + "..." : l).map(l -> "    | " + l)
                .collect(Collectors.joining("\n"));
    }

    static byte[] utf8(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }
}
