package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.io.casefile.model.LibraryMaterial;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;

/**
 * {@code evanesce stack --permittivity discrete}: a metal's permittivity as a run's time stepping realises it,
 * ε_d(ω, Δt) = ε(ω̃) with ω̃ = (2/Δt) tan(ωΔt/2) (the bilinear transform's frequency warping of the trapezoidal
 * auxiliary-current update; A. Taflove &amp; S. C. Hagness, Computational Electrodynamics, 3rd ed. (2005), ch. 9, and
 * A. V. Oppenheim &amp; R. W. Schafer, Discrete-Time Signal Processing, 2nd ed. (1999), sec. 7.1.2, eq. (7.26),
 * Ω = 2 arctan(ωΔt/2) inverted; from memory). Checked on the Kretschmann sensor (1.515 glass / 50 nm Rakić gold /
 * water, 633 nm, p): the printed R against Raether's three-layer formula evaluated here with ε(ω̃), the difference
 * from the continuous answer falling at second order in Δt, the two ways of giving Δt, and the usage errors.
 */
class StackDiscreteTest {

    private static final double WL = 633e-9;
    private static final double THETA_DEG = 74.5;
    /**
     * The printed R against Raether's formula with ε(ω̃) computed here: the same physics written two ways in doubles, CSV
     * with 15 significant digits. Measured: largest difference 9.9e-16 at 10, 5 and 2.5 nm cells (2026-12-04); the
     * discrete answer differs from the continuous one by 6.2e-5 at 5 nm cells, so the tolerance separates them by far.
     */
    private static final double FORMULA = 1e-14;
    /**
     * Fitted order of |R_discrete − R_continuous| as the cell (and with it Δt) halves from 10 to 1.25 nm: 2 for a
     * second-order time discretisation (Taflove &amp; Hagness 3rd ed. ch. 9, common practice); ω̃ = ω(1 + (ωΔt)²/12 + ...)
     * so the next term is fourth order. Measured: 2.0079 (differences 2.52e-4, 6.21e-5, 1.55e-5, 3.86e-6; 2026-12-04).
     */
    private static final double ORDER_TOLERANCE = 0.08;

    private static String[] sensor(String... more) {
        List<String> a = new java.util.ArrayList<>(List.of("stack", "--incident", "1.515", "--layer", "gold:50nm", "--exit",
                "water", "--wavelength", "633nm", "--angle", Double.toString(THETA_DEG), "--polarization", "p", "--csv"));
        a.addAll(Arrays.asList(more));
        return a.toArray(String[]::new);
    }

    /** R_p of the single CSV row. */
    private static double reflectance(Cli.Outcome o) {
        assertEquals(ExitCode.OK, o.code(), o::toString);
        String[] lines = o.out().split("\\R");
        assertEquals("angle_deg,R_p,T_p,A_p,phase_r_p_deg,phase_t_p_deg,depth_nm", lines[0], o::toString);
        return Double.parseDouble(lines[1].split(",")[1]);
    }

    private static double timeStep(double cell) {
        return 0.5 * cell / PhysicalConstants.C0;
    }

    @Test
    void theDiscreteAnswerIsRaethersFormulaAtTheWarpedFrequency() {
        DispersiveMaterial gold = MetalLibrary.get("gold").material();
        Complex water = Complex.real(Math.pow(LibraryMaterial.WATER.index(WL), 2));
        double omega = 2 * Math.PI * PhysicalConstants.C0 / WL;
        double theta = Math.toRadians(THETA_DEG);
        for (double cell : new double[] {10e-9, 5e-9, 2.5e-9}) {
            double dt = timeStep(cell);
            double warped = 2 / dt * Math.tan(omega * dt / 2);
            double expected = StackLibraryTest.raether(1.515, gold.permittivity(warped), 50e-9, water, WL, theta);
            double continuous = StackLibraryTest.raether(1.515, gold.permittivity(omega), 50e-9, water, WL, theta);
            Cli.Outcome o = Cli.run(sensor("--permittivity", "discrete", "--cell", cell * 1e9 + "nm"));
            double r = reflectance(o);
            System.out.printf("cell %.3g nm: R_discrete %.15f, formula %.15f (diff %.2e); R_continuous %.15f%n",
                    cell * 1e9, r, expected, r - expected, continuous);
            assertEquals(expected, r, FORMULA, o::toString);
            assertTrue(Math.abs(r - continuous) > 100 * FORMULA, "the discrete answer must differ from the continuous one");
            // the line saying which permittivity, on standard error beside the CSV
            assertTrue(o.err().contains("permittivity: discrete") && o.err().contains("ε_d = "), o::toString);
        }
        Cli.Outcome c = Cli.run(sensor());
        assertEquals(StackLibraryTest.raether(1.515, gold.permittivity(omega), 50e-9, water, WL, theta), reflectance(c),
                FORMULA, c::toString);
        assertTrue(c.err().contains("permittivity: continuous"), c::toString);
    }

    @Test
    void theDifferenceFromTheContinuousAnswerFallsAtSecondOrder() {
        double continuous = reflectance(Cli.run(sensor()));
        double[] cells = {10, 5, 2.5, 1.25};
        double[] logDt = new double[cells.length];
        double[] logDiff = new double[cells.length];
        for (int k = 0; k < cells.length; k++) {
            double r = reflectance(Cli.run(sensor("--permittivity", "discrete", "--cell", cells[k] + "nm")));
            logDt[k] = Math.log(timeStep(cells[k] * 1e-9));
            logDiff[k] = Math.log(Math.abs(r - continuous));
            System.out.printf("cell %s nm: R_discrete - R_continuous = %.4e%n", cells[k], r - continuous);
        }
        double mx = Arrays.stream(logDt).average().orElseThrow();
        double my = Arrays.stream(logDiff).average().orElseThrow();
        double sxy = 0;
        double sxx = 0;
        for (int k = 0; k < cells.length; k++) {
            sxy += (logDt[k] - mx) * (logDiff[k] - my);
            sxx += (logDt[k] - mx) * (logDt[k] - mx);
        }
        double order = sxy / sxx;
        System.out.printf("fitted order of |R_discrete - R_continuous|: %.4f%n", order);
        assertEquals(2, order, ORDER_TOLERANCE);
    }

    @Test
    void aTimeStepAndACellWithItsCourantNumberGiveTheSameAnswer() {
        double dt = 0.4 * 4e-9 / PhysicalConstants.C0;
        Cli.Outcome a = Cli.run(sensor("--permittivity", "discrete", "--cell", "4nm", "--courant", "0.4"));
        Cli.Outcome b = Cli.run(sensor("--permittivity", "discrete", "--time-step", dt * 1e15 + "fs"));
        assertEquals(reflectance(a), reflectance(b), FORMULA, a + "\n" + b);
        assertTrue(a.err().contains("--cell 4 nm, --courant 0.4"), a::toString);
        // --cell alone takes the program's default Courant number, as a case without numerics.courant
        Cli.Outcome c = Cli.run(sensor("--permittivity", "discrete", "--cell", "4nm"));
        Cli.Outcome d = Cli.run(sensor("--permittivity", "discrete", "--cell", "4nm", "--courant", "0.5"));
        assertEquals(reflectance(d), reflectance(c), 0.0, c + "\n" + d);
        assertTrue(c.err().contains("the program's default Courant number 0.5"), c::toString);
    }

    @Test
    void whatTheDiscretePermittivityNeedsIsAskedFor() {
        String[][] bad = {
            {"needs the run's time step: give --time-step", "--permittivity", "discrete"},
            {"add --permittivity discrete", "--cell", "5nm"},
            {"add --permittivity discrete", "--permittivity", "continuous", "--time-step", "0.01fs"},
            {"give either --time-step or --cell", "--permittivity", "discrete", "--time-step", "0.01fs", "--cell", "5nm"},
            {"is too long for 633 nm", "--permittivity", "discrete", "--time-step", "2fs"},
            {"--courant 0.8: expected a Courant number", "--permittivity", "discrete", "--cell", "5nm", "--courant", "0.8"},
            {"'grid': expected continuous", "--permittivity", "grid"},
            {"'5nm' is not a time step", "--permittivity", "discrete", "--time-step", "5nm"},
            {"'-5nm' is not a length", "--permittivity", "discrete", "--cell", "-5nm"},
            {"'half' is not a number", "--permittivity", "discrete", "--cell", "5nm", "--courant", "half"},
        };
        for (String[] b : bad) {
            Cli.Outcome o = Cli.run(sensor(Arrays.copyOfRange(b, 1, b.length)));
            assertEquals(ExitCode.USAGE, o.code(), o::toString);
            assertTrue(o.err().contains(b[0]), () -> "expected '" + b[0] + "' in\n" + o);
            assertTrue(o.out().isEmpty(), o::toString);
            assertTrue(!o.err().contains("Exception"), o::toString);
        }
    }
}
