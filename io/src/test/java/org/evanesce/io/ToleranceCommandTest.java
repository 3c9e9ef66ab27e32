package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.hipparchus.special.Erf;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code evanesce tolerance}: the yield of a gap whose thickness is normally distributed, against the
 * exact yield from the frustrated-transmission closed form (Zhu et al., Am. J. Phys. 54, 601 (1986);
 * see FitCommandTest) and the normal distribution function (Hipparchus's erf as the reference
 * library): T falls monotonically with the gap, so T lies in [a, b] exactly when the gap lies between
 * the gaps where T = b and T = a.
 */
class ToleranceCommandTest {

    @TempDir
    Path tmp;

    private Path caseFile() throws IOException {
        Path c = tmp.resolve("gap.yaml");
        Files.writeString(c, FitCommandTest.caseText());
        return c;
    }

    /** The gap where the closed form's T at 45 degrees equals t (bisection; T falls with the gap). */
    private static double gapFor(double t) {
        double lo = 0;
        double hi = 2e-6;
        for (int k = 0; k < 200; k++) {
            double mid = 0.5 * (lo + hi);
            if (FitCommandTest.frustratedT(Math.toRadians(45), mid) > t) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    private static double phi(double z) {
        return 0.5 * (1 + Erf.erf(z / Math.sqrt(2)));
    }

    @Test
    void theYieldMatchesTheExactOneWithinItsSamplingError() throws IOException {
        double mean = 200e-9;
        double sd = 10e-9;
        double a = 0.36;
        double b = 0.42;
        double exact = phi((gapFor(a) - mean) / sd) - phi((gapFor(b) - mean) / sd);
        int n = 400;
        Path out = tmp.resolve("study");
        Cli.Outcome o = Cli.run("tolerance", caseFile().toString(), "--vary", "gap=normal(200nm,10nm)", "--require",
                "T=" + a + ".." + b, "--samples", Integer.toString(n), "--seed", "7", "--out", out.toString());
        assertEquals(Main.OK, o.code(), o::toString);
        Matcher m = Pattern.compile("yield: (\\d+) of 400 parts").matcher(o.out());
        assertTrue(m.find(), o.out());
        double measured = Integer.parseInt(m.group(1)) / (double) n;
        double sigma = Math.sqrt(exact * (1 - exact) / n);
        // a binomial draw lies within 3.5 of its standard deviations in 99.95 % of seeds
        assertTrue(Math.abs(measured - exact) < 3.5 * sigma, () -> "yield " + measured + ", exact " + exact + " +/- " + sigma);
        String json = Files.readString(out.resolve("tolerance.json"));
        assertTrue(json.contains("\"interval_method\": \"Wilson score (Wilson 1927)\""), json);
        assertEquals(n + 1, Files.readAllLines(out.resolve("samples.csv")).size());
        assertTrue(Files.exists(out.resolve("histogram-T.png")));
        // the same seed draws the same parts: the first 40 of them again
        Cli.Outcome again = Cli.run("tolerance", caseFile().toString(), "--vary", "gap=normal(200nm,10nm)", "--require",
                "T=" + a + ".." + b, "--samples", "40", "--seed", "7", "--out", tmp.resolve("again").toString());
        assertEquals(Main.OK, again.code(), again::toString);
        assertEquals(Files.readAllLines(out.resolve("samples.csv")).subList(0, 41), Files.readAllLines(tmp.resolve("again/samples.csv")));
    }

    @Test
    void badOptionsAreRefusedBeforeAnythingIsWritten() throws IOException {
        Path c = caseFile();
        String[][] cases = {
            {"--vary", "gap=normal(200nm)", "normal takes MEAN,SD or MEAN,SD,LOW,HIGH"},
            {"--vary", "gap=gauss(200nm,1nm)", "expected NAME=normal(MEAN,SD)"},
            {"--vary", "thickness=normal(200nm,1nm)", "has no parameter 'thickness'"},
            {"--vary", "gap=normal(2deg,1deg)", "the values are an angle but gap is a length"},
            {"--vary", "gap=normal(200nm,1nm,300nm,400nm)", "the bounds keep"},
            {"--vary", "gap=uniform(300nm,200nm)", "HIGH must be larger than LOW"},
            {"--require", "Q=0..1", "expected R, T or A with limits"}};
        for (String[] k : cases) {
            String[] args = k[0].equals("--require")
                    ? new String[] {"tolerance", c.toString(), "--vary", "gap=normal(200nm,5nm)", k[0], k[1], "--out",
                        tmp.resolve("never").toString()}
                    : new String[] {"tolerance", c.toString(), k[0], k[1], "--out", tmp.resolve("never").toString()};
            Cli.Outcome o = Cli.run(args);
            assertEquals(Main.USAGE, o.code(), o::toString);
            assertTrue(o.err().contains(k[2]), () -> "expected '" + k[2] + "' in\n" + o);
            assertFalse(o.err().contains("Exception"), o::toString);
            assertFalse(Files.exists(tmp.resolve("never")));
        }
    }
}
