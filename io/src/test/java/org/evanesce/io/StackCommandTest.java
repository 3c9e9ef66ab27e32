package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.Evanescent;
import org.evanesce.solver.reference.PlanarStack;
import org.junit.jupiter.api.Test;

/** {@code evanesce stack} run in-process: the numbers it prints and its usage errors. */
class StackCommandTest {

    /** The CSV carries 15 significant digits; what it prints must be the transfer matrix's value to that. */
    private static final double PRINTED = 1e-13;
    /** The issue's bar for closed forms (the FTIR formula agrees with the matrix to ~1e-13, see the solver tests). */
    private static final double CLOSED_FORM = 1e-9;
    private static final double WAVELENGTH = 633e-9;



    private static List<String[]> csvRows(Cli.Outcome o, String expectedHeader) {
        String[] lines = o.out().split("\\R");
        assertEquals(expectedHeader, lines[0], o::toString);
        return Arrays.stream(lines).skip(1).map(l -> l.split(",", -1)).toList();
    }

    @Test
    void frustratedTotalReflectionPrintsTheTransferMatrixValues() {
        // a 200 nm air gap between two n = 1.5 prisms at 633 nm, 40 to 70 deg: below and beyond the critical
        // angle 41.81 deg
        Cli.Outcome o = Cli.run("stack", "--incident", "1.5", "--layer", "1.0:200nm", "--exit", "1.5", "--wavelength", "633nm",
                "--angle", "40:70:1", "--csv");
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertEquals("", o.err(), o::toString);
        List<String[]> rows = csvRows(o, "angle_deg,R_s,T_s,A_s,phase_r_s_deg,phase_t_s_deg,"
                + "R_p,T_p,A_p,phase_r_p_deg,phase_t_p_deg,depth_nm");
        assertEquals(31, rows.size(), o::toString);
        PlanarStack stack = new PlanarStack(1.5, List.of(new PlanarStack.Layer(Complex.real(1.0), 200e-9)),
                Complex.real(1.5));
        for (int i = 0; i < rows.size(); i++) {
            String[] r = rows.get(i);
            assertEquals(12, r.length, () -> String.join(",", r));
            double deg = Double.parseDouble(r[0]);
            assertEquals(40 + i, deg, 1e-12);
            double th = Math.toRadians(deg);
            for (Polarization pol : Polarization.values()) {
                int c = pol == Polarization.S ? 1 : 6;
                PlanarStack.Response resp = stack.atAngle(pol, WAVELENGTH, th);
                String what = pol + " at " + deg + " deg";
                assertEquals(resp.reflectance(), Double.parseDouble(r[c]), PRINTED, what + " R");
                assertEquals(resp.transmittance(), Double.parseDouble(r[c + 1]), PRINTED, what + " T");
                assertEquals(resp.absorptance(), Double.parseDouble(r[c + 2]), PRINTED, what + " A");
                assertEquals(Math.toDegrees(resp.r().arg()), Double.parseDouble(r[c + 3]), 1e-11, what + " arg r");
                assertEquals(Math.toDegrees(resp.t().arg()), Double.parseDouble(r[c + 4]), 1e-11, what + " arg t");
                if (deg > 41.82) {
                    // Zhu, Yu, Hawley, Roy, Am. J. Phys. 54, 601 (1986): 1/T = 1 + α sinh²(κd), with α for s and p
                    // (form from memory; derived and checked against the matrix in the solver's
                    // FrustratedTotalReflectionTest), n = 1.5
                    double n = 1.5;
                    double s2 = Math.sin(th) * Math.sin(th);
                    double alpha = (n * n - 1) * (n * n - 1) / (4 * n * n * (1 - s2) * (n * n * s2 - 1));
                    if (pol == Polarization.P) {
                        alpha *= Math.pow((n * n + 1) * s2 - 1, 2);
                    }
                    double sh = Math.sinh(Evanescent.decayConstant(1.5, 1.0, th, WAVELENGTH) * 200e-9);
                    assertEquals(1 / (1 + alpha * sh * sh), Double.parseDouble(r[c + 1]), CLOSED_FORM, what + " T (Zhu)");
                }
            }
            if (deg < 41.81) {
                assertEquals("", r[11], "no evanescent depth below the critical angle");
            } else {
                // Hecht, Optics, 4th ed., sec. 4.7: λ0 / (2π sqrt(n1² sin²θ − n2²))
                double depth = WAVELENGTH / (2 * Math.PI * Math.sqrt(2.25 * Math.sin(th) * Math.sin(th) - 1));
                assertEquals(depth * 1e9, Double.parseDouble(r[11]), 1e-9, "depth at " + deg + " deg");
            }
        }
    }

    @Test
    void tableNamesTheStackAndTheCriticalAngle() {
        Cli.Outcome o = Cli.run("stack", "--incident", "1.5", "--layer", "1.0:200nm", "--exit", "1.5", "--wavelength", "633nm",
                "--angle", "45");
        assertEquals(ExitCode.OK, o.code(), o::toString);
        String[] lines = o.out().split("\\R");
        assertEquals(5, lines.length, o::toString);
        assertTrue(lines[0].contains("n = 1.5") && lines[0].contains("200 nm"), o::toString);
        assertTrue(lines[1].contains("633 nm") && lines[1].contains("critical angle into layer 1: 41.8103 deg"), o::toString);
        assertTrue(lines[3].startsWith("angle_deg") && lines[3].contains("depth_nm"), o::toString);
        // 45 deg: T_s = 0.383374, T_p = 0.614141 (the transfer matrix, which the CSV test checks to 15 digits), depth 284.95 nm
        String[] cells = lines[4].trim().split("\\s+");
        assertEquals(List.of("45", "0.616626", "0.383374", "0.000000"), List.of(cells).subList(0, 4), o::toString);
        assertEquals("0.614141", cells[7], o::toString);
        assertEquals("284.95", cells[11], o::toString);
    }

    @Test
    void thicknessSweepFromContactToAMicron() {
        Cli.Outcome o = Cli.run("stack", "--incident", "1.5", "--layer", "1.0:200nm", "--exit", "1.5", "--wavelength", "633nm",
                "--angle", "45", "--thickness", "1:0:1um:10nm", "--polarization", "s", "--csv");
        assertEquals(ExitCode.OK, o.code(), o::toString);
        List<String[]> rows = csvRows(o, "thickness_nm,R_s,T_s,A_s,phase_r_s_deg,phase_t_s_deg,depth_nm");
        assertEquals(101, rows.size(), o::toString);
        assertEquals("0", rows.get(0)[0]);
        assertEquals("1000", rows.get(100)[0]);
        assertEquals(1.0, Double.parseDouble(rows.get(0)[2]), 1e-15, "optical contact transmits everything");
        double previous = 2;
        for (String[] r : rows) {
            double t = Double.parseDouble(r[2]);
            assertTrue(t < previous, "T falls as the gap widens: " + String.join(",", r));
            previous = t;
        }
        PlanarStack at500 = new PlanarStack(1.5, List.of(new PlanarStack.Layer(Complex.real(1.0), 500e-9)),
                Complex.real(1.5));
        assertEquals(at500.atAngle(Polarization.S, WAVELENGTH, Math.toRadians(45)).transmittance(),
                Double.parseDouble(rows.get(50)[2]), PRINTED);
    }

    @Test
    void wavelengthSweepWithAnAbsorbingFilm() {
        // glass | 50 nm metal-like film (index given as n,k) | air, p polarization at 44 deg: beyond the critical angle
        // of glass and air, so nothing is transmitted and A = 1 − R
        Cli.Outcome o = Cli.run("stack", "--incident", "1.515", "--layer", "0.2,3.4:50nm", "--exit", "1", "--wavelength",
                "400nm:800nm:10nm", "--angle", "44", "--polarization", "P", "--csv");
        assertEquals(ExitCode.OK, o.code(), o::toString);
        List<String[]> rows = csvRows(o, "wavelength_nm,R_p,T_p,A_p,phase_r_p_deg,phase_t_p_deg,depth_nm");
        assertEquals(41, rows.size(), o::toString);
        PlanarStack film = new PlanarStack(1.515, List.of(new PlanarStack.Layer(Complex.of(0.2, 3.4), 50e-9)),
                Complex.real(1.0));
        for (String[] r : rows) {
            double nm = Double.parseDouble(r[0]);
            PlanarStack.Response resp = film.atAngle(Polarization.P, nm * 1e-9, Math.toRadians(44));
            assertEquals(resp.reflectance(), Double.parseDouble(r[1]), PRINTED, r[0]);
            assertEquals(0.0, Double.parseDouble(r[2]), 0.0, r[0]);
            assertEquals(1 - resp.reflectance(), Double.parseDouble(r[3]), PRINTED, r[0]);
            assertEquals("", r[6], "no critical angle into an absorbing layer");
        }
    }

    @Test
    void indexForms() {
        for (String[] form : new String[][] {{"1.5+0.01i", "1.5", "0.01"}, {"0.2,3.4", "0.2", "3.4"},
            {"1e-1+2.5e0i", "0.1", "2.5"}, {"2", "2", "0"}}) {
            Cli.Outcome o = Cli.run("stack", "--incident", "1.5", "--exit", form[0], "--wavelength", "633nm", "--csv");
            assertEquals(ExitCode.OK, o.code(), () -> form[0] + ": " + o);
            double n = Double.parseDouble(form[1]);
            double k = Double.parseDouble(form[2]);
            PlanarStack.Response resp = PlanarStack.interfaceBetween(1.5, Complex.of(n, k)).atAngle(Polarization.S,
                    WAVELENGTH, 0);
            assertEquals(resp.reflectance(), Double.parseDouble(o.out().split("\\R")[1].split(",")[1]), PRINTED, form[0]);
        }
    }

    @Test
    void badInputsAreUsageErrorsOnOneLineNamingTheOption() {
        String[] base = {"stack", "--incident", "1.5", "--exit", "1.5"};
        String[][] cases = {
            {"--layer", "1.0:200", "--wavelength", "633nm", "--layer", "'1.0:200': '200' is not a length"},
            {"--wavelength", "633", "--wavelength", "'633'"},
            {"--wavelength", "0nm", "--wavelength", "0nm"},
            {"--wavelength", "633nm", "--angle", "90", "--angle", "90"},
            {"--wavelength", "633nm", "--angle", "-5", "--angle", "-5"},
            {"--wavelength", "633nm", "--angle", "40:50:0", "--angle", "'40:50:0'"},
            {"--wavelength", "633nm", "--angle", "0:80:1e-6", "--angle", "'0:80:1e-6'"},
            {"--wavelength", "400nm:800nm:10nm", "--angle", "40:50:1", "--angle", "40:50:1"},
            {"--wavelength", "633nm", "--layer", "1:10nm", "--thickness", "2:0:1um:10nm", "--thickness", "2:0:1um:10nm"},
            {"--wavelength", "633nm", "--thickness", "1:0:1um", "--thickness", "'1:0:1um'"},
            {"--wavelength", "633nm", "--polarization", "q", "--polarization", "'q'"},
            {"--wavelength", "633nm", "--layer", "1.5-0.1i:10nm", "--layer", "1.5-0.1i:10nm"},
            {"--wavelength", "633nm", "--layer", "abc:10nm", "--layer", "'abc'"},
        };
        for (String[] c : cases) {
            String[] args = new String[base.length + c.length - 2];
            System.arraycopy(base, 0, args, 0, base.length);
            System.arraycopy(c, 0, args, base.length, c.length - 2);
            Cli.Outcome o = Cli.run(args);
            String what = String.join(" ", args) + ": " + o;
            assertEquals(ExitCode.USAGE, o.code(), what);
            assertEquals("", o.out(), what);
            assertEquals(1, o.err().lines().count(), what);
            assertTrue(o.err().contains(c[c.length - 2]) && o.err().contains(c[c.length - 1]), what);
        }
        Cli.Outcome lossyIncidence = Cli.run("stack", "--incident", "1.5+0.1i", "--exit", "1", "--wavelength", "633nm");
        assertEquals(ExitCode.USAGE, lossyIncidence.code(), lossyIncidence::toString);
        assertTrue(lossyIncidence.err().contains("--incident 1.5+0.1i") && lossyIncidence.err().contains("transparent"),
                lossyIncidence::toString);
    }

    /**
     * Values at the edge of what doubles hold are refused on one line, before any row is printed: never an
     * exception, never a row of NaN. (Before: --exit 1e-300 and --wavelength 1e300m divided by zero, --incident 1e200
     * printed NaN rows, an angle a hair below 90 degrees threw.)
     */
    @Test
    void numericEdgeCasesAreRefusedNotPrintedAsNaN() {
        String[][] cases = {
            {"--incident", "1.5", "--exit", "1e-300", "--wavelength", "633nm", "--exit"},
            {"--incident", "1e200", "--exit", "1.5", "--wavelength", "633nm", "--incident"},
            {"--incident", "1e-300", "--exit", "1", "--wavelength", "633nm", "--incident"},
            {"--incident", "1.5", "--exit", "1.5", "--layer", "1e300:100nm", "--wavelength", "633nm", "--layer"},
            {"--incident", "1.5", "--exit", "1e300,1e300", "--wavelength", "633nm", "--exit"},
            {"--incident", "1.5", "--exit", "1.5", "--wavelength", "1e-300nm", "--wavelength"},
            {"--incident", "1.5", "--exit", "1.5", "--wavelength", "1e300m", "--wavelength"},
            {"--incident", "1.5", "--exit", "1.5", "--wavelength", "-633nm", "--wavelength"},
            {"--incident", "NaN", "--exit", "1.5", "--wavelength", "633nm", "--incident"},
            {"--incident", "1.5", "--exit", "Infinity", "--wavelength", "633nm", "--exit"},
            {"--incident", "1.5", "--exit", "0,1e-3", "--wavelength", "633nm", "--angle", "89.9999999", "angle"},
            {"--incident", "1.5", "--exit", "1", "--wavelength", "633nm", "--angle", "80:89.99999999:0.00000001", "--angle"},
        };
        for (String[] c : cases) {
            String[] args = new String[c.length];
            args[0] = "stack";
            System.arraycopy(c, 0, args, 1, c.length - 1);
            Cli.Outcome o = Cli.run(args);
            String what = String.join(" ", args) + ": " + o;
            assertEquals(ExitCode.USAGE, o.code(), what);
            assertEquals("", o.out(), what);
            assertEquals(1, o.err().lines().count(), what);
            assertTrue(o.err().contains(c[c.length - 1]), what);
            assertFalse(o.err().contains("Exception") || o.err().contains("NaN rows"), what);
        }
        // a zero thickness is a layer that is not there: the bare interface glass | glass reflects nothing
        Cli.Outcome zero = Cli.run("stack", "--incident", "1.5", "--layer", "1.0:0nm", "--exit", "1.5", "--wavelength", "633nm",
                "--csv");
        assertEquals(ExitCode.OK, zero.code(), zero::toString);
        assertTrue(zero.out().lines().skip(1).allMatch(l -> l.startsWith("0,0,1,0,")), zero::toString);
    }
}
