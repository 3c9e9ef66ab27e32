package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.model.SweepSpec;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.io.sweep.SweepFolder;
import org.evanesce.io.sweep.SweepPoint;
import org.hipparchus.special.Erf;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The sample form of a sweep: its draws against the moments of their distributions, its merged
 * statistics against the closed forms, and an end-to-end sample of the gap case whose yield must
 * hold the probability the normal distribution and the exact T(gap) give.
 */
class SampleSweepTest {

    @TempDir
    Path tmp;

    /** The 150 nm gap case of PlaneWaveRunTest (5 x 153 cells, a fraction of a second a point), SAMPLE replaced. */
    private static final String CASE = """
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
              transfer_matrix: true
            until: {energy_below: 1e-6, latest: 400 fs}
            sweep:
              sample:
            SAMPLE""";

    private static SweepSpec sweep(String sample) throws CaseFileException {
        return CaseLoader.parse(CASE.replace("SAMPLE", sample), "s.yaml", Map.of(), ReadOptions.defaults()).spec().sweep()
                .orElseThrow();
    }

    /** Column k of the drawn points, in SI units. */
    private static double[] drawn(SweepSpec s, int k) {
        return SweepPoint.expand(s).stream().mapToDouble(p -> Double.parseDouble(p.texts().get(k).split(" ")[0])).toArray();
    }

    private static double mean(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s / v.length;
    }

    private static double variance(double[] v) {
        double m = mean(v);
        double s = 0;
        for (double x : v) {
            s += (x - m) * (x - m);
        }
        return s / (v.length - 1);
    }

    private static double phi(double z) {
        return Math.exp(-z * z / 2) / Math.sqrt(2 * Math.PI);
    }

    private static double cdf(double z) {
        return 0.5 * (1 + Erf.erf(z / Math.sqrt(2)));
    }

    /** Draws per distribution: the sample moments then scatter by about 1 % of σ. */
    static final int DRAWS = 20_000;
    /**
     * Sample moments against the distribution's: 4.5 standard errors (the mean's σ/√n, the variance's
     * σ² √(2/(n − 1)) for a normal), so a correct generator fails about once in 10^5 runs (common practice).
     */
    static final double STANDARD_ERRORS = 4.5;

    @Test
    void drawsHaveTheMomentsOfTheirDistributions() throws CaseFileException {
        SweepSpec s = sweep("""
                    count: 20000
                    seed: 11
                    parameters:
                      gap: {distribution: normal, mean: 150 nm, standard_deviation: 5 nm}
                      theta: {distribution: uniform, low: 44 deg, high: 46 deg}
                """);
        double[] gap = drawn(s, 0);
        double[] theta = drawn(s, 1);
        assertEquals(DRAWS, gap.length);
        double sd = 5e-9;
        // normal: mean μ, variance σ² (sample variance's standard error σ² sqrt(2/(n-1)), e.g. Kendall & Stuart,
        // The Advanced Theory of Statistics, vol. 1, 10.8)
        assertEquals(150e-9, mean(gap), STANDARD_ERRORS * sd / Math.sqrt(DRAWS));
        assertEquals(sd * sd, variance(gap), STANDARD_ERRORS * sd * sd * Math.sqrt(2.0 / (DRAWS - 1)));
        // uniform on [a, b]: mean (a + b)/2, variance (b − a)²/12 (Abramowitz & Stegun 26.1.21 ff., common practice)
        double a = Math.toRadians(44);
        double b = Math.toRadians(46);
        double var = (b - a) * (b - a) / 12;
        assertEquals((a + b) / 2, mean(theta), STANDARD_ERRORS * Math.sqrt(var / DRAWS));
        assertEquals(var, variance(theta), STANDARD_ERRORS * var * Math.sqrt(0.8 / (DRAWS - 1)) * 2);
        for (double t : theta) {
            assertTrue(t >= a && t <= b, "uniform draw outside [a, b]: " + t);
        }
        // the same seed gives the same points; another seed others
        assertEquals(SweepPoint.expand(s), SweepPoint.expand(s));
    }

    @Test
    void truncatedNormalDrawsHaveTheTruncatedMean() throws CaseFileException {
        // mean of a normal truncated to [α, β] (standardised): μ + σ (φ(α) − φ(β)) / (Φ(β) − Φ(α)) (N. L. Johnson,
        // S. Kotz, N. Balakrishnan, Continuous Univariate Distributions, vol. 1, 2nd ed., 1994, eq. 13.134)
        SweepSpec s = sweep("""
                    count: 20000
                    parameters:
                      gap: {distribution: normal, mean: 150 nm, standard_deviation: 5 nm, low: 147 nm, high: 160 nm}
                """);
        double[] gap = drawn(s, 0);
        double al = -3.0 / 5;
        double be = 10.0 / 5;
        double z = cdf(be) - cdf(al);
        double mean = 150e-9 + 5e-9 * (phi(al) - phi(be)) / z;
        // variance σ²[1 + (αφ(α) − βφ(β))/Z − ((φ(α) − φ(β))/Z)²] (the same, eq. 13.135)
        double var = 25e-18 * (1 + (al * phi(al) - be * phi(be)) / z - Math.pow((phi(al) - phi(be)) / z, 2));
        assertEquals(mean, mean(gap), STANDARD_ERRORS * Math.sqrt(var / DRAWS));
        for (double g : gap) {
            assertTrue(g >= 147e-9 && g <= 160e-9, "truncated draw outside its bounds: " + g);
        }
        assertEquals(1L, s.sample().orElseThrow().seed(), "the default seed");
    }

    @Test
    void badSampleSectionsAreRefusedWithLineAndKey() throws IOException {
        String[][] cases = {
            {"    count: 1\n    parameters:\n      gap: {distribution: normal, mean: 150 nm, standard_deviation: 5 nm}\n",
                "s.yaml:32:12: sweep.sample.count"},
            {"    count: 5\n    parameters:\n      gap: {distribution: normal, mean: 150 nm, standard_deviation: 5 deg}\n",
                "sweep.sample.parameters.gap.standard_deviation"},
            {"    count: 5\n    parameters:\n      gapp: {distribution: uniform, low: 1 nm, high: 2 nm}\n",
                "the case has no parameter 'gapp' to draw"},
            {"    count: 5\n    parameters:\n      gap: {distribution: normal, mean: 150 nm, standard_deviation: 5 nm, low: 200 nm}\n",
                "of the normal distribution's mass"},
            {"    count: 5\n    parameters:\n      gap: {distribution: uniform, low: 2 nm, high: 1 nm}\n",
                "must be larger than low"},
            {"    count: 5\n    parameters:\n      gap: {distribution: gauss, mean: 1 nm, standard_deviation: 1 nm}\n",
                "unknown choice 'gauss'"},
            {"    count: 5\n    parameters:\n      gap: {distribution: uniform, low: 1 nm, high: 2 nm}\n    require:\n"
                + "      T_back: {min: 0.5, max: 0.4}\n", "sweep.sample.require.T_back.max"},
        };
        for (String[] c : cases) {
            Path f = tmp.resolve("s.yaml");
            Files.writeString(f, CASE.replace("SAMPLE", c[0]));
            Cli.Outcome o = Cli.run("check", f.toString());
            assertEquals(ExitCode.USAGE, o.code(), o::toString);
            assertTrue(o.err().contains(c[1]), () -> "expected '" + c[1] + "' in\n" + o);
        }
    }

    /** Transmittance of the vacuum gap at 633 nm and 45 degrees (Zhu et al. 1986, in PlaneWaveRunTest). */
    private static double exactT(double gap) {
        return PlaneWaveRunTest.tunnelling("s", 1.5, 1.0, gap, Math.toRadians(45), 633e-9);
    }

    /** The gap at which the exact T is {@code t} (T falls with the gap): bisection. */
    private static double gapAt(double t) {
        double lo = 1e-9;
        double hi = 1e-6;
        for (int k = 0; k < 200; k++) {
            double mid = 0.5 * (lo + hi);
            if (exactT(mid) > t) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    @Test
    void aSampleSweepsYieldHoldsTheAnalyticProbabilityAndShardsMergeToTheSameBytes() throws IOException {
        // gap ~ N(150 nm, 10 nm); the specification 0.45 <= T_exact <= 0.60 holds for gaps in [g(0.60), g(0.45)], so
        // the yield's expectation is Φ((g2 − μ)/σ) − Φ((g1 − μ)/σ)
        String sample = """
                    count: 16
                    seed: 3
                    parameters:
                      gap: {distribution: normal, mean: 150 nm, standard_deviation: 10 nm}
                    require:
                      T_back_exact: {min: 0.45, max: 0.60}
                """;
        Path f = tmp.resolve("tol.yaml");
        Files.writeString(f, CASE.replace("SAMPLE", sample));
        Path whole = tmp.resolve("whole");
        Cli.Outcome o = Cli.run("sweep", f.toString(), "--out", whole.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertTrue(o.out().contains("yield: "), o::toString);
        Object json = SweepFolder.readJson(whole.resolve(SweepFolder.SAMPLE));
        Map<?, ?> group = (Map<?, ?>) ((List<?>) ((Map<?, ?>) json).get("groups")).get(0);
        Map<?, ?> y = (Map<?, ?>) group.get("yield");
        double g1 = gapAt(0.60);
        double g2 = gapAt(0.45);
        double p = cdf((g2 - 150e-9) / 10e-9) - cdf((g1 - 150e-9) / 10e-9);
        double lo = ((Number) y.get("interval_95_low")).doubleValue();
        double hi = ((Number) y.get("interval_95_high")).doubleValue();
        assertTrue(lo <= p && p <= hi, "analytic yield " + p + " outside the sample's interval [" + lo + ", " + hi + "]: " + y);
        // the exact column is the closed form at each drawn gap, so the statistics of T_back_exact are those of T(gap)
        Map<?, ?> t = (Map<?, ?>) ((Map<?, ?>) group.get("columns")).get("T_back_exact");
        assertEquals(16, ((Number) t.get("n")).intValue());
        assertTrue(Files.isRegularFile(whole.resolve("sample-histogram-T_back.png")));
        assertTrue(Files.isRegularFile(whole.resolve("sample-histogram-T_back_exact.png")), "a limited column gets one");

        // two shards and a merge give the same bytes; so does a resumed run after a point's folder is lost
        Path shards = tmp.resolve("shards");
        assertEquals(ExitCode.OK, Cli.run("sweep", f.toString(), "--out", shards.toString(), "--shard", "0/2").code());
        assertEquals(ExitCode.OK, Cli.run("sweep", f.toString(), "--out", shards.toString(), "--shard", "1/2").code());
        assertEquals(ExitCode.OK, Cli.run("sweep", f.toString(), "--out", shards.toString(), "--merge-only").code());
        assertArrayEquals(Files.readAllBytes(whole.resolve(SweepFolder.SAMPLE)), Files.readAllBytes(shards.resolve(SweepFolder.SAMPLE)));
        org.evanesce.io.output.SafeFiles.deleteTree(whole.resolve("point-0005"));
        Cli.Outcome again = Cli.run("sweep", f.toString(), "--out", whole.toString());
        assertEquals(ExitCode.OK, again.code(), again::toString);
        assertTrue(again.out().contains("15 finished already, 1 to run"), again::toString);
        assertArrayEquals(Files.readAllBytes(shards.resolve(SweepFolder.SAMPLE)), Files.readAllBytes(whole.resolve(SweepFolder.SAMPLE)));
        assertArrayEquals(Files.readAllBytes(shards.resolve("sample-histogram-T_back.png")),
                Files.readAllBytes(whole.resolve("sample-histogram-T_back.png")));

        // a limit on a column the results will lack is refused before anything runs, naming it and the columns
        Files.writeString(f, CASE.replace("SAMPLE", sample.replace("T_back_exact:", "T_bak:")));
        Cli.Outcome bad = Cli.run("sweep", f.toString(), "--out", tmp.resolve("bad").toString());
        assertEquals(ExitCode.USAGE, bad.code(), bad::toString);
        assertTrue(bad.err().contains("tol.yaml:37:7: sweep.sample.require.T_bak") && bad.err().contains("R_front, T_back, A"),
                bad::toString);
        assertFalse(bad.err().contains("Exception"), bad::toString);
        assertFalse(Files.exists(tmp.resolve("bad")), "nothing written");
    }
}
