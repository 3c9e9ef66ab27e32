package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.evanesce.io.Main;

/** What the sweep tests share: small fast cases and running the command line in-process. */
final class SweepCases {

    private SweepCases() {
    }

    /** A command's exit code and output. */
    record Outcome(int code, String out, String err) {
        @Override
        public String toString() {
            return "exit " + code + "\n--- stdout ---\n" + out + "--- stderr ---\n" + err;
        }
    }

    static Outcome run(String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code = Main.run(args, new PrintStream(out, true, StandardCharsets.UTF_8), new PrintStream(err, true, StandardCharsets.UTF_8));
        return new Outcome(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    /** Runs a command that must succeed. */
    static Outcome ok(String... args) {
        Outcome o = run(args);
        assertEquals(0, o.code(), () -> String.join(" ", args) + "\n" + o);
        return o;
    }

    /**
     * A plane wave through a vacuum gap between glass blocks (as in PlaneWaveRunTest): 5 x 153 cells of
     * 21.1 nm with periodic sides, so each run with its incident-power run takes a fraction of a second.
     * SWEEP is replaced by the sweep section's lines.
     */
    static final String GAP_CASE = """
            title: vacuum gap between glass blocks
            parameters:
              gap: 150 nm
              theta: 45 deg
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 0.1 um, height: 3.2 um, background: glass}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
              gap_vacuum: {index: 1.0}
            shapes:
              - layer_stack:
                  start: [0, -gap/2]
                  layers: [{material: gap_vacuum, thickness: gap}]
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave:
                  y: -0.7 um
                  direction: up
                  angle: theta
                  signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}
            flux:
              wavelengths: [633 nm, 640 nm]
              lines:
                - {name: front, y: -0.95 um, measures: reflected}
                - {name: back, y: 0.7 um, measures: transmitted}
              transfer_matrix: true
            until: {energy_below: 1e-6, latest: 400 fs}
            SWEEP""";

    /** Four points: gap 100 and 200 nm (slowest), theta 45 and 50 degrees. */
    static final String FOUR_POINTS = """
            sweep:
              parameters:
                gap: {from: 100 nm, to: 200 nm, count: 2}
                theta: [45 deg, 50 deg]
            """;

    static String gapCase(String sweep) {
        return GAP_CASE.replace("SWEEP", sweep);
    }

    static Path write(Path dir, String name, String text) throws IOException {
        Path f = dir.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    /** The names in a folder that start with '.' (temporaries), sorted. */
    static List<String> hidden(Path dir) throws IOException {
        List<String> out = new ArrayList<>();
        try (var s = Files.list(dir)) {
            s.map(p -> p.getFileName().toString()).filter(n -> n.startsWith(".")).sorted().forEach(out::add);
        }
        return out;
    }
}
