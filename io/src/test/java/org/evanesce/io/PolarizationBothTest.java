package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Polarization as a parameter: {@code --set polarization=...}, {@code polarization: both} and a swept
 * polarization, checked against the frustrated-total-reflection closed form for s and p (Zhu et al.
 * 1986, {@link PlaneWaveRunTest#tunnelling}) and the unpolarised average of Born and Wolf,
 * <i>Principles of Optics</i>, 7th ed. (1999), §1.5.3: natural light's reflectivity is (R_s + R_p)/2.
 */
class PolarizationBothTest {

    /** The same closed form twice (flux.csv's 9 decimals, three roundings in the average). */
    static final double EXACT_TOLERANCE = 2e-9;
    /** Simulated T at 20 cells per wavelength: PlaneWaveRunTest's bound for p (the larger of the two). */
    static final double T_TOLERANCE = PlaneWaveRunTest.T_TOLERANCE_P;

    @TempDir
    Path tmp;

    /** PlaneWaveRunTest's gap case (150 nm vacuum between glass, 45 degrees), with SWEEP replaced. */
    private static final String CASE = """
            title: vacuum gap between glass blocks
            parameters:
              gap: 150 nm
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
                  angle: 45 deg
                  signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}
            flux:
              wavelengths: [633 nm]
              lines:
                - {name: front, y: -0.95 um, measures: reflected}
                - {name: back, y: 0.7 um, measures: transmitted}
              transfer_matrix: true
            until: {energy_below: 1e-6, latest: 400 fs}
            SWEEP""";

    private Path write(String name, String text) throws IOException {
        Path f = tmp.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    @Test
    void bothRunsSAndPAndAveragesThem() throws IOException {
        Path c = write("gap.yaml", CASE.replace("SWEEP", ""));
        Path out = tmp.resolve("both");
        Cli.Outcome o = Cli.run("run", c.toString(), "--set", "polarization=both", "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertTrue(o.out().contains("unpolarised average"), o::toString);
        for (Path d : List.of(out, out.resolve("s"), out.resolve("p"))) {
            assertTrue(Files.isRegularFile(d.resolve("flux.png")), () -> "flux.png in " + d);
        }
        PlaneWaveRunTest.FluxCsv f = PlaneWaveRunTest.FluxCsv.read(out.resolve("flux.csv"));
        double wl = PlaneWaveRunTest.CENTRE;
        double ts = PlaneWaveRunTest.exactT("s", 45, wl);
        double tp = PlaneWaveRunTest.exactT("p", 45, wl);
        assertEquals(ts, f.at(wl, "T_back_exact_s"), EXACT_TOLERANCE, "s exact column against Zhu et al.");
        assertEquals(tp, f.at(wl, "T_back_exact_p"), EXACT_TOLERANCE, "p exact column against Zhu et al.");
        assertEquals((ts + tp) / 2, f.at(wl, "T_back_exact"), EXACT_TOLERANCE, "unpolarised exact T (Born and Wolf §1.5.3)");
        assertEquals((ts + tp) / 2, f.at(wl, "T_back"), T_TOLERANCE, "simulated unpolarised T against the closed form");
        assertEquals((f.at(wl, "R_front_s") + f.at(wl, "R_front_p")) / 2, f.at(wl, "R_front"), EXACT_TOLERANCE,
                "R is the mean of the runs' R");
        // each half is the run --set polarization=X makes, number for number
        for (String pol : List.of("s", "p")) {
            assertTrue(Files.isRegularFile(out.resolve(pol).resolve("run.json")), pol + "/run.json");
            assertTrue(Files.readString(out.resolve(pol).resolve("run.json")).contains("\"polarization\": \"" + pol + "\""),
                    pol + "/run.json names its override");
        }
        Path single = tmp.resolve("p-only");
        assertEquals(ExitCode.OK, Cli.run("run", c.toString(), "--set", "polarization=p", "--out", single.toString()).code());
        PlaneWaveRunTest.FluxCsv p = PlaneWaveRunTest.FluxCsv.read(single.resolve("flux.csv"));
        assertEquals(p.at(wl, "T_back"), f.at(wl, "T_back_p"), 0.0, "the p half of both is the p run");
        String summary = Files.readString(out.resolve("summary.json"));
        assertTrue(summary.contains("\"polarization\": \"both\""), summary);
        String run = Files.readString(out.resolve("run.json"));
        assertTrue(run.contains("\"settled\": true"), run);
    }

    @Test
    void sweptPolarizationGivesItsOwnRowsAndAnEmptySiColumn() throws IOException {
        Path c = write("sw.yaml", CASE.replace("SWEEP", """
                sweep:
                  parameters:
                    polarization: [s, both]
                """));
        Path out = tmp.resolve("sw");
        Cli.Outcome o = Cli.run("sweep", c.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        PlaneWaveRunTest.FluxCsv csv = readSweep(out.resolve("sweep.csv"));
        double wl = PlaneWaveRunTest.CENTRE;
        double[] s = csv.rows().get(0);
        double[] both = csv.rows().get(1);
        int t = csv.header().indexOf("T_back");
        int ts = csv.header().indexOf("T_back_s");
        int tp = csv.header().indexOf("T_back_p");
        int si = csv.header().indexOf("polarization_si");
        assertTrue(t > 0 && ts > 0 && tp > 0 && si > 0, csv.header()::toString);
        assertTrue(Double.isNaN(s[si]) && Double.isNaN(both[si]), "the polarization has no SI value");
        assertEquals(s[t], both[ts], 0.0, "the both point's s half is the s point");
        assertEquals((both[ts] + both[tp]) / 2, both[t], EXACT_TOLERANCE, "the both point's T is the average");
        assertEquals((PlaneWaveRunTest.exactT("s", 45, wl) + PlaneWaveRunTest.exactT("p", 45, wl)) / 2, both[t], T_TOLERANCE);
    }

    /** sweep.csv with its text columns (point's expression texts) read as NaN. */
    private static PlaneWaveRunTest.FluxCsv readSweep(Path f) throws IOException {
        List<String> lines = Files.readAllLines(f);
        List<String> header = List.of(lines.get(0).split(","));
        List<double[]> rows = lines.subList(1, lines.size()).stream().map(l -> java.util.Arrays.stream(l.split(",", -1))
                .mapToDouble(x -> {
                    try {
                        return Double.parseDouble(x);
                    } catch (NumberFormatException e) {
                        return Double.NaN;
                    }
                }).toArray()).toList();
        return new PlaneWaveRunTest.FluxCsv(header, rows);
    }

    @Test
    void wrongPolarizationsAreRefusedWithWhereAndWhat() throws IOException {
        Path c = write("gap.yaml", CASE.replace("SWEEP", ""));
        Cli.Outcome o = Cli.run("check", c.toString(), "--set", "polarization=sp");
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("--set polarization=sp: polarization: unknown choice 'sp'") && o.err().contains("s, p, both"),
                o::toString);
        Path sw = write("bad-sweep.yaml", CASE.replace("SWEEP", "sweep:\n  parameters:\n    polarization: [s, q]\n"));
        Cli.Outcome b = Cli.run("sweep", sw.toString(), "--out", tmp.resolve("never").toString());
        assertEquals(ExitCode.USAGE, b.code(), b::toString);
        assertTrue(b.err().contains("bad-sweep.yaml:31:") && b.err().contains("unknown choice 'q'"), b::toString);
        assertTrue(!Files.exists(tmp.resolve("never")), "nothing written");
        // both must read in p too: a probe of ez exists in s only
        Path probe = write("probe.yaml", CASE.replace("SWEEP", "probes:\n  - {name: mid, at: [0, 0], component: ez}\n")
                .replace("polarization: s", "polarization: both"));
        Cli.Outcome p = Cli.run("check", probe.toString());
        assertEquals(ExitCode.USAGE, p.code(), p::toString);
        assertTrue(p.err().contains("in the p run of 'polarization: both'"), p::toString);
    }
}
