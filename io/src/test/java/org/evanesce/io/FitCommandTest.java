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
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code evanesce fit} against data made from an outside closed form: the transmittance of a
 * plane wave through a low-index gap between two equal media beyond the critical angle (frustrated
 * total internal reflection), for s polarization
 * T = [1 + ((α² + κ²)/(2ακ))² sinh²(κd)]⁻¹, α = k0 n1 cos θ, κ = k0 (n1² sin²θ − n2²)^½
 * (S. Zhu, A. W. Yu, D. Hawley and R. Roy, "Frustrated total internal reflection: a demonstration
 * and review", Am. J. Phys. 54, 601 (1986), eq. 3 in the s case; the same form as a particle's
 * transmission through a rectangular barrier). The fit must find the gap that made the data, give
 * the standard error that linear error propagation through the same closed form gives, flag what
 * it cannot determine, and refuse bad data with file, line and column.
 */
class FitCommandTest {

    private static final String CASE = """
            title: Two glass blocks with a gap, for fits
            parameters:
              gap: 200 nm
              wl: 633 nm
              theta: 45 deg
            design_wavelength: wl
            polarization: s
            domain: {width: 0.4 um, height: 4 um, background: glass}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
              vacuum_gap: {index: 1.0}
            shapes:
              - layer_stack:
                  start: [0, -gap/2]
                  layers: [{material: vacuum_gap, thickness: gap}]
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave:
                  y: -1 um
                  angle: theta
                  signal: {pulse: {wavelength: wl, bandwidth: 20 nm}}
            until: {steps: 10}
            """;

    /** The noise's seed (its 30 draws happen to sum to a chi-square of 61, a rare draw: the checks do not assume a typical one). */
    private static final long SEED = 20261203L;
    private static final double N1 = 1.5;
    private static final double N2 = 1.0;
    private static final double WAVELENGTH = 633e-9;

    @TempDir
    Path tmp;

    /** The closed form above, s polarization. */
    static double frustratedT(double thetaRad, double gap) {
        double k0 = 2 * Math.PI / WAVELENGTH;
        double alpha = k0 * N1 * Math.cos(thetaRad);
        double kappa = k0 * Math.sqrt(N1 * N1 * Math.sin(thetaRad) * Math.sin(thetaRad) - N2 * N2);
        double f = (alpha * alpha + kappa * kappa) / (2 * alpha * kappa);
        double sh = Math.sinh(kappa * gap);
        return 1 / (1 + f * f * sh * sh);
    }

    /** The case these tests fit (also used by ToleranceCommandTest). */
    static String caseText() {
        return CASE;
    }

    private Path caseFile() throws IOException {
        Path c = tmp.resolve("gap.yaml");
        Files.writeString(c, CASE);
        return c;
    }

    private Path data(String name, String text) throws IOException {
        Path d = tmp.resolve(name);
        Files.writeString(d, text);
        return d;
    }

    /** Angles 43..57.5 deg in 0.5 deg steps, T from the closed form at the gap, plus noise of sigma (seeded). */
    private Path angleScan(double gap, double sigma, boolean withU) throws IOException {
        StringBuilder sb = new StringBuilder("# made from the closed form (Zhu et al. 1986)\nangle (deg),T" + (withU ? ",u" : "") + "\n");
        Random rnd = new Random(SEED);
        for (int i = 0; i < 30; i++) {
            double a = 43 + 0.5 * i;
            double t = frustratedT(Math.toRadians(a), gap) + sigma * rnd.nextGaussian();
            sb.append(String.format(Locale.ROOT, "%.2f,%.12f%s%n", a, t, withU ? "," + sigma : ""));
        }
        return data("scan.csv", sb.toString());
    }

    private static double printed(String out, String name) {
        Matcher m = Pattern.compile(name + "\\s+(\\S+) nm \\+/- (\\S+) nm").matcher(out);
        assertTrue(m.find(), out);
        return Double.parseDouble(m.group(1)) * 1e-9;
    }

    @Test
    void exactDataGiveBackTheGap() throws IOException {
        Path c = caseFile();
        Path d = angleScan(230e-9, 0, false);
        Path out = tmp.resolve("fit-exact");
        Cli.Outcome o = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..400nm", "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        // the printed value has 6 digits; fit.json every digit. Measured: |gap - 230 nm| < 1e-6 nm
        String json = Files.readString(out.resolve("fit.json"));
        Matcher v = Pattern.compile("\"value\": (\\S+),").matcher(json);
        assertTrue(v.find(), json);
        assertEquals(230e-9, Double.parseDouble(v.group(1)), 1e-14, json);
        assertTrue(Files.readString(out.resolve("fit.csv")).startsWith("angle_deg,T,T_model,residual\n"));
        assertTrue(Files.size(out.resolve("fit.png")) > 1000);
        assertTrue(o.out().contains("Caution:"), o.out());
    }

    @Test
    void noisyDataGiveTheStandardErrorOfLinearPropagation() throws IOException {
        double gap = 230e-9;
        double sigma = 0.003;
        Path c = caseFile();
        Path d = angleScan(gap, sigma, true);
        Cli.Outcome o = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..400nm",
                "--out", tmp.resolve("fit-noisy").toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        double fitted = printed(o.out(), "gap");
        // one parameter, weights 1/u: sigma_d = u / sqrt(sum (dT/dd)^2) (Press et al., Numerical Recipes, 3rd ed., 15.4),
        // the derivative taken from the closed form
        double sum = 0;
        for (int i = 0; i < 30; i++) {
            double a = Math.toRadians(43 + 0.5 * i);
            double h = 1e-12;
            double dTdd = (frustratedT(a, gap + h) - frustratedT(a, gap - h)) / (2 * h);
            sum += dTdd * dTdd;
        }
        double expected = sigma / Math.sqrt(sum);
        Matcher m = Pattern.compile("gap\\s+\\S+ nm \\+/- (\\S+) nm").matcher(o.out());
        assertTrue(m.find());
        double reported = Double.parseDouble(m.group(1)) * 1e-9;
        // printed with 2 digits: within 5 %
        assertEquals(expected, reported, 0.05 * expected, o.out());
        // the noise was drawn with this sigma, so the fitted gap lies within 3 standard errors of the truth
        assertTrue(Math.abs(fitted - gap) < 3 * expected, () -> "fitted " + fitted + " expected " + gap + " +/- " + expected);
        // chi-square: the fit's is at most that of the true gap (the noise drawn, sum of squares of the normal draws),
        // and below it by a chi-square variable of one degree of freedom (Press et al. 15.6): under 10.8 in 99.9 % of draws
        Random rnd = new Random(SEED);
        double truth = 0;
        for (int i = 0; i < 30; i++) {
            double g = rnd.nextGaussian();
            truth += g * g;
        }
        double atTruth = truth;
        Matcher chi = Pattern.compile("chi-square (\\S+) for 29").matcher(o.out());
        assertTrue(chi.find(), o.out());
        double atFit = Double.parseDouble(chi.group(1));
        assertTrue(atFit <= atTruth * (1 + 1e-5) && atTruth - atFit < 10.8, () -> "chi-square " + atFit + " at the fit, "
                + atTruth + " at the true gap");
    }

    @Test
    void parametersTheDataCannotSeparateAreFlagged() throws IOException {
        Path c = caseFile();
        Path d = angleScan(230e-9, 0.003, false);
        Cli.Outcome o = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..400nm",
                "--free", "scale=0.5..1.5", "--free", "angle_offset=-2deg..2deg", "--out", tmp.resolve("fit-3").toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertTrue(o.out().contains("are correlated"), o.out());
        String json = Files.readString(tmp.resolve("fit-3/fit.json"));
        assertTrue(json.contains("are correlated"), json);
    }

    @Test
    void aValueOnItsBoundIsFlagged() throws IOException {
        Path c = caseFile();
        Path d = angleScan(230e-9, 0, false);
        Cli.Outcome o = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..210nm",
                "--out", tmp.resolve("fit-bound").toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertTrue(o.out().contains("gap = 210 nm sits on its upper bound"), o.out());
    }

    @Test
    void aCaseParameterCanBeTheSweptQuantity() throws IOException {
        // T against the gap at 45 deg, with a detector gain of 0.9 to find
        StringBuilder sb = new StringBuilder("gap (nm),T\n");
        for (int g = 100; g <= 400; g += 20) {
            sb.append(g).append(',').append(String.format(Locale.ROOT, "%.12f", 0.9 * frustratedT(Math.toRadians(45), g * 1e-9)))
                    .append('\n');
        }
        Cli.Outcome o = Cli.run("fit", caseFile().toString(), "--data", data("gaps.csv", sb.toString()).toString(),
                "--free", "scale=0.5..1.5", "--out", tmp.resolve("fit-gaps").toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        Matcher m = Pattern.compile("scale\\s+(\\S+) \\+/-").matcher(o.out());
        assertTrue(m.find(), o.out());
        assertEquals(0.9, Double.parseDouble(m.group(1)), 1e-6, o.out());
    }

    @Test
    void badDataAreRefusedWithFileLineAndColumn() throws IOException {
        Path c = caseFile();
        List<String[]> cases = List.of(
                new String[] {"angle (deg),T\n45,0.3\n46,zero\n47,0.2\n", "bad.csv:3:4: 'zero' in column 'T' is not a finite number"},
                new String[] {"angle (deg),T\n45,0.3\n47,0.2\n46,0.25\n", "bad.csv:4:1: angle = 46 breaks the order"},
                new String[] {"angle (deg),R\n45,0.3\n46,1.2\n47,0.2\n", "bad.csv:3:4: R = 1.2 is outside [0, 1]"},
                new String[] {"angle (deg),T\n45,0.3\n", "1 point(s) for 1 free parameter(s)"},
                new String[] {"angle (furlong),T\n45,0.3\n46,0.3\n", "unknown unit 'furlong'"},
                new String[] {"height (nm),T\n45,0.3\n46,0.3\n", "'height' is neither angle, wavelength nor a parameter"},
                new String[] {"angle (deg),T,sigma\n45,0.3,0.1\n46,0.3,0.1\n", "the third column is 'sigma'; expected u"},
                new String[] {"angle (deg),T,u\n45,0.3,0\n46,0.3,0.1\n", "bad.csv:2:8: u = 0; a standard uncertainty must be positive"});
        for (String[] k : cases) {
            Path d = data("bad.csv", k[0]);
            Path out = tmp.resolve("never");
            Cli.Outcome o = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", "gap=100nm..400nm", "--out", out.toString());
            assertEquals(ExitCode.USAGE, o.code(), o::toString);
            assertTrue(o.err().contains(k[1]), () -> "expected '" + k[1] + "' in\n" + o);
            assertFalse(o.err().contains("Exception"), o::toString);
            assertFalse(Files.exists(out), "nothing written");
        }
    }

    @Test
    void badFreeParametersAreRefused() throws IOException {
        Path c = caseFile();
        Path d = angleScan(230e-9, 0, false);
        String[][] cases = {
            {"gap=100nm", "expected NAME=LOW..HIGH"},
            {"gap=300nm..100nm", "the upper bound must be larger"},
            {"gap=1deg..2deg", "the bounds are an angle but gap is a length"},
            {"thickness=1nm..2nm", "has no parameter 'thickness'"},
            {"gap=100nm..150nm", "starts from the case's gap = 200 nm, outside the bounds"},
            {"scale=1nm..2nm", "scale takes plain numbers"}};
        for (String[] k : cases) {
            Cli.Outcome o = Cli.run("fit", c.toString(), "--data", d.toString(), "--free", k[0], "--out", tmp.resolve("never").toString());
            assertEquals(ExitCode.USAGE, o.code(), o::toString);
            assertTrue(o.err().contains(k[1]), () -> "expected '" + k[1] + "' in\n" + o);
            assertFalse(Files.exists(tmp.resolve("never")));
        }
    }
}
