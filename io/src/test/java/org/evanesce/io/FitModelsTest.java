package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.AngularSpectrum;
import org.evanesce.solver.reference.PlanarStack;
import org.evanesce.geometry.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code evanesce fit --model angular-spectrum} and {@code --model simulation}. The beam model must recover
 * the gap from a curve made by an independent evaluation: the beam through a stack built here directly
 * (not read from the case), its angular spectrum at a sampling chosen by convergence (the solver's
 * {@link AngularSpectrum}, whose R and T are checked against the plane wave and Artmann's shift in the
 * solver's tests), plus seeded Gaussian noise. The simulation model must resume from its cached runs.
 */
class FitModelsTest {

    @TempDir
    Path tmp;

    /** A 3 um beam (waist) in glass meeting a vacuum gap from y = 0 to y = gap, its waist on the first face. */
    private static final String BEAM_CASE = """
            title: A narrow beam through a gap, for fits
            parameters:
              gap: 180 nm
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 20 um, height: 8 um, background: glass}
            grid: {cells_per_wavelength: 10}
            materials:
              glass: {index: 1.5}
              vacuum_gap: {index: 1.0}
            shapes:
              - layer_stack:
                  start: [0, 0]
                  layers: [{material: vacuum_gap, thickness: gap}]
            boundaries: {all: pml 1 um}
            sources:
              - gaussian_beam:
                  y: -2 um
                  waist: 3 um
                  waist_at: [0, 0]
                  angle: 45 deg
                  signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}
            until: {steps: 10}
            """;

    static final double WAIST = 3e-6;
    static final double WAVELENGTH = 633e-9;
    static final double TRUE_GAP = 200e-9;
    static final double NOISE = 0.002;

    /** T of the beam through the gap at angle theta, from a stack built here and a converged angular spectrum. */
    static double beamT(double gap, double theta) {
        PlanarStack stack = new PlanarStack(1.5, List.of(new PlanarStack.Layer(Complex.real(1.0), gap)), Complex.real(1.5));
        AngularSpectrum.GaussianBeam beam = new AngularSpectrum.GaussianBeam(WAIST, theta, WAVELENGTH, 0);
        double window = 32 * beam.footprint();
        int samples = 1 << 13;
        AngularSpectrum.Converged c = AngularSpectrum.converged(stack, Polarization.S, beam, samples, window, new double[0],
                new AngularSpectrum.Tolerance(1e-7, beam.footprint()), 1 << 20);
        assertTrue(c.converged(), "the independent reference converged");
        return c.result().transmittance();
    }

    private static double printedValue(String json) {
        Matcher v = Pattern.compile("\"value\": (\\S+),").matcher(json);
        assertTrue(v.find(), json);
        return Double.parseDouble(v.group(1));
    }

    private static double printedError(String json) {
        Matcher v = Pattern.compile("\"standard_error\": (\\S+),").matcher(json);
        assertTrue(v.find(), json);
        return Double.parseDouble(v.group(1));
    }

    /**
     * The recovered gap lies within 4 of its standard errors of the truth (a correct fit fails that about
     * once in 15 000 seeds; Press et al., Numerical Recipes, 3rd ed., §15.6), and the plane-wave model
     * given the same beam data is further off than the beam model.
     */
    @Test
    void angularSpectrumFitRecoversTheGapOfABeamCurve() throws IOException {
        Path c = tmp.resolve("beam.yaml");
        Files.writeString(c, BEAM_CASE);
        Random rnd = new Random(17);
        StringBuilder sb = new StringBuilder("angle (deg),T,u\n");
        for (double a = 43.5; a <= 47.01; a += 0.25) {
            double t = beamT(TRUE_GAP, Math.toRadians(a)) + NOISE * rnd.nextGaussian();
            sb.append(String.format(Locale.ROOT, "%.2f,%.12f,%s%n", a, t, NOISE));
        }
        Path d = tmp.resolve("beam.csv");
        Files.writeString(d, sb.toString());
        Cli.Outcome o = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..300nm", "--model",
                "angular-spectrum", "--out", tmp.resolve("as").toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        String json = Files.readString(tmp.resolve("as/fit.json"));
        assertTrue(json.contains("angular spectrum"), json);
        double gap = printedValue(json);
        double err = printedError(json);
        assertTrue(err > 0 && err < 2e-9, "standard error " + err);
        assertEquals(TRUE_GAP, gap, 4 * err, () -> "beam model: " + o.out());
        Cli.Outcome pw = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..300nm", "--out",
                tmp.resolve("tm").toString());
        assertEquals(ExitCode.OK, pw.code(), pw::toString);
        double planeGap = printedValue(Files.readString(tmp.resolve("tm/fit.json")));
        assertTrue(Math.abs(planeGap - TRUE_GAP) > Math.abs(gap - TRUE_GAP),
                "the plane-wave model fits beam data worse: " + planeGap + " against " + gap);
    }

    @Test
    void wrongModelsAreRefused() throws IOException {
        Path c = tmp.resolve("pw.yaml");
        Files.writeString(c, FitCommandTest.caseText());
        Path d = tmp.resolve("d.csv");
        Files.writeString(d, "angle (deg),T\n44,0.5\n45,0.4\n46,0.3\n");
        Cli.Outcome a = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..300nm", "--model",
                "angular-spectrum");
        assertEquals(ExitCode.USAGE, a.code(), a::toString);
        assertTrue(a.err().contains("needs a gaussian_beam"), a::toString);
        Cli.Outcome b = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..300nm", "--model", "beam");
        assertEquals(ExitCode.USAGE, b.code(), b::toString);
        assertTrue(b.err().contains("expected transfer-matrix, angular-spectrum or simulation"), b::toString);
        Cli.Outcome s = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..300nm", "--model",
                "simulation");
        assertEquals(ExitCode.USAGE, s.code(), s::toString);
        assertTrue(s.err().contains("curve against angle"), s::toString);
        try (Stream<Path> left = Files.list(tmp)) {
            assertEquals(2, left.count(), "nothing written beside the inputs");
        }
    }

    /** The gap case of PlaneWaveRunTest at 20 cells per wavelength: a fraction of a second a run. */
    private static final String SIM_CASE = """
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
              wavelengths: [633 nm]
              lines:
                - {name: front, y: -0.95 um, measures: reflected}
                - {name: back, y: 0.7 um, measures: transmitted}
            until: {energy_below: 1e-6, latest: 400 fs}
            """;

    /**
     * T against theta from the closed form (Zhu et al. 1986) at a 170 nm gap: the simulation model's fit
     * finds the gap within the grid's error (PlaneWaveRunTest: |T − T_exact| below 0.005 at this resolution,
     * which moves the gap by under 3 nm here), and a second fit over the same cache runs no simulation and
     * gives the same bytes of fit.json; a damaged cache file is computed again.
     */
    @Test
    void simulationFitUsesAndResumesFromItsCache() throws IOException {
        Path c = tmp.resolve("sim.yaml");
        Files.writeString(c, SIM_CASE);
        StringBuilder sb = new StringBuilder("theta (deg),T\n");
        for (double a : new double[] {44, 47, 50}) {
            double t = PlaneWaveRunTest.tunnelling("s", 1.5, 1.0, 170e-9, Math.toRadians(a), 633e-9);
            sb.append(String.format(Locale.ROOT, "%.1f,%.9f%n", a, t));
        }
        Path d = tmp.resolve("sim.csv");
        Files.writeString(d, sb.toString());
        Path out = tmp.resolve("fit");
        Cli.Outcome o = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=120nm..220nm", "--model",
                "simulation", "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        String first = Files.readString(out.resolve("fit.json"));
        assertEquals(170e-9, printedValue(first), 3e-9, o::out);
        Path cache = tmp.resolve("fit.evaluations");
        long files;
        try (Stream<Path> s = Files.list(cache)) {
            files = s.count();
        }
        assertTrue(files > 3, "one cached run per point and trial: " + files);
        // a damaged cache file is not used: it is run again and replaced
        Path some;
        try (Stream<Path> s = Files.list(cache)) {
            some = s.sorted().findFirst().orElseThrow();
        }
        Files.writeString(some, Files.readString(some).replace("0.", "9."));
        Cli.Outcome again = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=120nm..220nm", "--model",
                "simulation", "--out", out.toString(), "--force");
        assertEquals(ExitCode.OK, again.code(), again::toString);
        assertEquals(1, again.out().lines().filter(l -> l.contains("simulation 1 (")).count(), again::out);
        assertFalse(again.out().contains("simulation 2 ("), again::out);
        assertEquals(first, Files.readString(out.resolve("fit.json")), "the resumed fit gives the same result");
    }
}
