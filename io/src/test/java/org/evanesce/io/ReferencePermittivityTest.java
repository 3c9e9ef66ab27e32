package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.evanesce.io.plan.ExactStack;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.PlanarStack;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code flux.reference_permittivity}: the exact references of a run give a metal the discrete permittivity at the
 * run's time step (default) or the model's continuous one, and say which in summary.json; {@code evanesce stack --case
 * FILE --permittivity discrete} gives the very numbers of the run's {@code transfer_matrix} columns; {@code stack
 * --case} names a case's metal with its model, whichever way the case gives it. What the discrete permittivity is, and
 * the stack's numbers against a published formula, are checked in {@code StackDiscreteTest} and
 * {@code DiscretePermittivityTest}; here the plumbing from the case to the references and the command.
 */
class ReferencePermittivityTest {

    private static final Path SENSOR = Path.of("..", "cases", "plasmon-sensor-gold-water.yaml");
    /**
     * The shipped grid (5 nm cells, the film 10 cells thick) and the shortest run a ramped wave's flux window allows
     * (300 fs of 900): about 7 s of CPU. The exact columns do not depend on the run's length.
     */
    private static final Map<String, String> SHORT = Map.of("duration", "300fs");
    /** The same stack evaluated twice in doubles: equal to round-off. */
    private static final double ROUND_OFF = 1e-14;

    @TempDir
    Path tmp;

    private static String[] with(String[] head, Map<String, String> sets, String... tail) {
        List<String> a = new java.util.ArrayList<>(Arrays.asList(head));
        sets.forEach((k, v) -> {
            a.add("--set");
            a.add(k + "=" + v);
        });
        a.addAll(Arrays.asList(tail));
        return a.toArray(String[]::new);
    }

    /** The columns of a one-row CSV, by name. */
    private static Map<String, String> row(String csv) {
        String[] lines = csv.strip().split("\\R");
        String[] head = lines[0].split(",", -1);
        String[] values = lines[1].split(",", -1);
        Map<String, String> m = new java.util.LinkedHashMap<>();
        for (int k = 0; k < head.length; k++) {
            m.put(head[k], values[k]);
        }
        return m;
    }

    @Test
    void theStackCommandGivesTheRunsTransferMatrixColumns() throws IOException {
        Path out = tmp.resolve("run");
        Cli.Outcome run = Cli.run(with(new String[] {"run", SENSOR.toString(), "--out", out.toString()}, SHORT));
        assertEquals(ExitCode.OK, run.code(), run::toString);
        Map<String, String> flux = row(Files.readString(out.resolve("flux.csv")));
        Cli.Outcome stack = Cli.run(with(new String[] {"stack", "--case", SENSOR.toString()}, SHORT, "--permittivity",
                "discrete", "--polarization", "p", "--csv"));
        assertEquals(ExitCode.OK, stack.code(), stack::toString);
        Map<String, String> exact = row(stack.out());
        // flux.csv prints 9 decimals, the stack's CSV 15 significant digits; both come from the same PlanarStack
        String[][] pairs = {{"R_reflected_exact", "R_p"}, {"T_transmitted_exact", "T_p"}, {"A_exact", "A_p"}};
        for (String[] p : pairs) {
            double a = Double.parseDouble(flux.get(p[0]));
            double b = Double.parseDouble(exact.get(p[1]));
            System.out.printf("%s %.9f, stack %s %.15f, difference %.2e%n", p[0], a, p[1], b, a - b);
            // the same number, as flux.csv prints it
            assertEquals(flux.get(p[0]), String.format(Locale.ROOT, "%.9f", b), p[0] + " of the run against " + p[1]
                    + " of stack --case\n" + run + stack);
        }
        // the run's time step is the planner's, SΔ/c0 with the case's 5 nm cells and the default Courant number
        String summary = Files.readString(out.resolve("summary.json"));
        assertTrue(summary.contains("\"reference_permittivity\": \"discrete\""), summary);
        Matcher dt = Pattern.compile("\"reference_time_step_s\": ([0-9.eE+-]+)").matcher(summary);
        assertTrue(dt.find(), summary);
        Matcher cell = Pattern.compile("\"cell_size_m\": ([0-9.eE+-]+)").matcher(summary);
        assertTrue(cell.find(), summary);
        assertEquals(5e-9, Double.parseDouble(cell.group(1)), 1e-15, summary);
        assertEquals(Courant.timeStep(Courant.DEFAULT, Double.parseDouble(cell.group(1))), Double.parseDouble(dt.group(1)),
                0.0, summary);
        assertTrue(stack.err().contains("permittivity: discrete") && stack.err().contains("the case's grid: cell 5 nm, "
                + "Courant number 0.5"), stack::toString);
    }

    @Test
    void theCaseChoosesTheReferencesPermittivity() throws Exception {
        Path cont = tmp.resolve("continuous.yaml");
        Files.writeString(cont, Files.readString(SENSOR).replace("  transfer_matrix: true\n",
                "  transfer_matrix: true\n  reference_permittivity: continuous\n"));
        double wl = 633e-9;
        double theta = Math.toRadians(73); // 1.8 deg before the dip, where the choice moves R by 2.7e-4 at 5 nm cells
        CasePlan discrete = CasePlanner.plan(CaseLoader.read(SENSOR, SHORT).spec(), 1);
        CasePlan continuous = CasePlanner.plan(CaseLoader.read(cont, SHORT).spec(), 1);
        var d = discrete.flux().orElseThrow().exact().orElseThrow();
        var c = continuous.flux().orElseThrow().exact().orElseThrow();
        assertEquals(FluxSpec.ReferencePermittivity.DISCRETE, d.permittivity());
        assertEquals(FluxSpec.ReferencePermittivity.CONTINUOUS, c.permittivity());
        assertEquals(List.of("glass", "gold", "water"), d.media());
        PlanarStack ds = d.stack().apply(wl);
        PlanarStack cs = c.stack().apply(wl);
        // the metal alone changes: its index is the discrete model's at the run's time step, or the continuous one
        var gold = CaseLoader.read(SENSOR, SHORT).spec().materials().get("gold").dispersion().orElseThrow().material();
        double omega = 2 * Math.PI * PhysicalConstants.C0 / wl;
        assertEquals(gold.discreteIndex(omega, discrete.dt()), ds.layers().get(0).index());
        assertEquals(gold.index(omega), cs.layers().get(0).index());
        assertEquals(ds.exitIndex(), cs.exitIndex());
        // fits and tolerance studies read the continuous stack (ExactStack.of); the discrete one is the run's
        ExactStack fit = ExactStack.of(CaseLoader.read(cont, SHORT).spec());
        ExactStack grid = ExactStack.of(CaseLoader.read(cont, SHORT).spec(), FluxSpec.ReferencePermittivity.DISCRETE);
        assertEquals(discrete.dt(), grid.timeStep(), 0.0);
        for (Polarization p : Polarization.values()) {
            double rc = cs.atAngle(p, wl, theta).reflectance();
            double rd = ds.atAngle(p, wl, theta).reflectance();
            assertEquals(rc, fit.stack().apply(wl).atAngle(p, wl, theta).reflectance(), ROUND_OFF);
            assertEquals(rd, grid.stack().apply(wl).atAngle(p, wl, theta).reflectance(), ROUND_OFF);
            if (p == Polarization.P) {
                assertNotEquals(rc, rd, 1e-5, "the choice must move the p reflectance near the plasmon dip");
            }
        }
    }

    @Test
    void aWrongChoiceIsRefusedWithItsPlace() throws IOException {
        Path bad = tmp.resolve("bad.yaml");
        String text = Files.readString(SENSOR).replace("  transfer_matrix: true\n",
                "  transfer_matrix: true\n  reference_permittivity: grid\n");
        Files.writeString(bad, text);
        int line = Arrays.asList(text.split("\n", -1)).indexOf("  reference_permittivity: grid") + 1;
        Cli.Outcome o = Cli.run("check", bad.toString());
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("bad.yaml:" + line + ":27: flux.reference_permittivity: unknown choice 'grid'"
                + ", expected one of discrete, continuous"), o::toString);
        Path idle = tmp.resolve("idle.yaml");
        Files.writeString(idle, Files.readString(SENSOR).replace("  transfer_matrix: true\n",
                "  transfer_matrix: false\n  reference_permittivity: continuous\n"));
        Cli.Outcome w = Cli.run("check", idle.toString());
        assertEquals(ExitCode.OK, w.code(), w::toString);
        assertTrue((w.out() + w.err()).contains("warning: flux.reference_permittivity: has no effect with transfer_matrix: "
                + "false"), w::toString);
    }

    private static final String FILM_CASE = """
            design_wavelength: 633 nm
            polarization: p
            domain: {width: 20 nm, height: 1.2 um, background: glass}
            grid: {cell: 5 nm}
            materials:
              glass: {index: 1.515}
              film: METAL
            shapes:
              - layer_stack: {start: [0, 0], layers: [{material: film, thickness: 50 nm}]}
            boundaries: {left: periodic, right: periodic, bottom: pml 0.2 um, top: pml 0.2 um}
            sources:
              - plane_wave: {y: -0.3 um, angle: 70 deg, signal: {pulse: {wavelength: 633 nm, bandwidth: 50 nm}}}
            until: {steps: 10}
            """;

    /** ε for people as the stack prints it. */
    private static String eps(Complex e) {
        return String.format(Locale.ROOT, "%.4g%+.4gi", e.re(), e.im());
    }

    @Test
    void theCaseMetalIsNamedWithItsModelHoweverGiven() throws IOException {
        Files.copy(Path.of("..", "cases", "gold-jc-nk.csv"), tmp.resolve("gold-jc-nk.csv"));
        double omega = 2 * Math.PI * PhysicalConstants.C0 / 633e-9;
        double ev = 1.602176634e-19 / 1.054571817e-34; // rad/s per eV (CODATA 2018 e and ħ, exact)
        // a Drude term: ε = ε∞ − ωp²/(ω² + iγω) (exp(−iωt); the case-file docs' formula)
        Complex drude = Complex.ONE.minus(Complex.real(Math.pow(8.9 * ev, 2)).divide(
                new Complex(omega * omega, 0.07 * ev * omega)));
        String[][] kinds = {
            {"{library: gold}", "Appl. Opt. 37, 5271 (1998)", null},
            // a single measured index: the model is exact there, ε = (n + ik)²
            {"{index: 0.18+3.43i at 633 nm}", "", eps(new Complex(0.18, 3.43).square())},
            {"{drude: [{plasma_frequency: 8.9 eV, damping: 0.07 eV}]}", "terms written in the case file", eps(drude)},
            {"{table: gold-jc-nk.csv}", "gold-jc-nk.csv", null},
        };
        for (String[] k : kinds) {
            Path c = tmp.resolve("film.yaml");
            Files.writeString(c, FILM_CASE.replace("METAL", k[0]));
            for (String mode : new String[] {"continuous", "discrete"}) {
                Cli.Outcome o = Cli.run("stack", "--case", c.toString(), "--permittivity", mode);
                assertEquals(ExitCode.OK, o.code(), o::toString);
                String line = o.out().lines().filter(l -> l.startsWith("layer 1: film, ")).findFirst().orElse("");
                assertTrue(line.contains(mode.equals("discrete") ? "ε_d = " : "ε = ") && line.contains("at 633 nm")
                        && line.contains("; model: ") && line.contains(k[1]), () -> k[0] + " (" + mode + "):\n" + o);
                if (k[2] != null && mode.equals("continuous")) {
                    assertTrue(line.contains("ε = " + k[2]), () -> k[0] + ": expected ε = " + k[2] + " in\n" + o);
                }
                if (k[2] != null && mode.equals("discrete")) {
                    assertTrue(line.contains("the model's ε = " + k[2]), () -> k[0] + ": expected the model's ε in\n" + o);
                }
                assertTrue(o.out().contains("permittivity: " + mode), o::toString);
            }
        }
        // the case gives the time step: the grid options are refused beside it
        Cli.Outcome o = Cli.run("stack", "--case", tmp.resolve("film.yaml").toString(), "--permittivity", "discrete",
                "--cell", "5nm");
        assertEquals(ExitCode.USAGE, o.code(), o::toString);
        assertTrue(o.err().contains("--case gives the time step"), o::toString);
        // the case's time step (5 nm cells, Courant number 0.5) is beyond the grid's Nyquist limit at 4 nm
        Cli.Outcome n = Cli.run("stack", "--case", tmp.resolve("film.yaml").toString(), "--permittivity", "discrete",
                "--wavelength", "4nm");
        assertEquals(ExitCode.USAGE, n.code(), n::toString);
        assertTrue(n.err().contains("(the case's grid: cell 5 nm, Courant number 0.5) is too long for 4 nm"), n::toString);
        assertTrue(!n.err().contains("Exception"), n::toString);
    }
}
