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
 * {@code evanesce stack --case}: the stack read from a case file gives the same numbers as the same
 * stack typed in, and the case's wavelength and angle are the defaults. The layered reference itself
 * is checked against published closed forms in the solver (FresnelTest, AirySlabTest, FrustratedTotalReflectionTest); here
 * the reading of the case is what is tested.
 */
class StackCaseTest {

    private static final String CASE = """
            title: A film between two glass blocks
            parameters:
              film: 150 nm
              theta: 50 deg
            design_wavelength: 600 nm
            polarization: p
            domain: {width: 0.4 um, height: 4 um, background: glass}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
              low: {index: 1.2}
            shapes:
              - layer_stack:
                  start: [0, 0]
                  layers: [{material: low, thickness: film}, {material: glass, thickness: 40 nm}, {material: low, thickness: 80 nm}]
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave:
                  y: -1 um
                  angle: theta
                  signal: {pulse: {wavelength: 600 nm, bandwidth: 20 nm}}
            until: {steps: 10}
            """;

    @TempDir
    Path tmp;

    private static List<String> rows(String out) {
        return out.lines().filter(l -> !l.startsWith("case:")).toList();
    }

    @Test
    void theCaseStackMatchesTheSameStackTypedIn() throws IOException {
        Path c = tmp.resolve("film.yaml");
        Files.writeString(c, CASE);
        Cli.Outcome fromCase = Cli.run("stack", "--case", c.toString(), "--set", "film=170nm", "--csv", "--angle", "30:60:5");
        Cli.Outcome typed = Cli.run("stack", "--incident", "1.5", "--layer", "1.2:170nm", "--layer", "1.5:40nm", "--layer",
                "1.2:80nm", "--exit", "1.5", "--wavelength", "600nm", "--csv", "--angle", "30:60:5");
        assertEquals(ExitCode.OK, fromCase.code(), fromCase::toString);
        assertEquals(ExitCode.OK, typed.code(), typed::toString);
        // the layer edges are found to adjacent doubles, so the thicknesses and the numbers agree to round-off
        List<String> a = rows(fromCase.out());
        List<String> b = rows(typed.out());
        assertEquals(b.size(), a.size());
        for (int r = 1; r < a.size(); r++) {
            String[] x = a.get(r).split(",", -1);
            String[] y = b.get(r).split(",", -1);
            for (int k = 0; k < x.length; k++) {
                if (!x[k].isEmpty()) {
                    assertEquals(Double.parseDouble(y[k]), Double.parseDouble(x[k]), 1e-12, a.get(r) + " vs " + b.get(r));
                }
            }
        }
    }

    @Test
    void theCaseGivesTheDefaultWavelengthAndAngle() throws IOException {
        Path c = tmp.resolve("film.yaml");
        Files.writeString(c, CASE);
        Cli.Outcome o = Cli.run("stack", "--case", c.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertTrue(o.out().contains("wavelength 600 nm; angle 50 deg;"), o.out());
        assertTrue(o.out().contains("the case's polarization is p"), o.out());
    }

    @Test
    void mixingTheCaseWithTypedLayersIsRefused() throws IOException {
        Path c = tmp.resolve("film.yaml");
        Files.writeString(c, CASE);
        Cli.Outcome o = Cli.run("stack", "--case", c.toString(), "--exit", "1.5");
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("leave out --incident, --layer and --exit"), o.err());
        Cli.Outcome m = Cli.run("stack", "--incident", "1.5", "--exit", "1.0");
        assertEquals(ExitCode.USAGE, m.code(), m::toString);
        assertTrue(m.err().contains("missing --wavelength (or give --case FILE"), m.err());
    }

    @Test
    void aBadCaseGetsOneLinePerErrorAndExit2() throws IOException {
        Path c = tmp.resolve("bad.yaml");
        Files.writeString(c, CASE.replace("polarization: p", "polarization: q").replace("until:", "untill:"));
        Cli.Outcome o = Cli.run("stack", "--case", c.toString());
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        List<String> lines = o.err().lines().filter(l -> l.startsWith(c.toString() + ":")).toList();
        assertTrue(lines.size() >= 2, o.err());
        assertTrue(lines.stream().anyMatch(l -> l.contains("polarization")), o.err());
        assertTrue(o.err().contains(" error(s) in " + c + "; nothing was computed"), o.err());
    }
}
