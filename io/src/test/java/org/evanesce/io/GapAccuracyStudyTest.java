package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.evanesce.io.output.image.LinePlot;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The full accuracy study of issue #4 ("Scale"): transmittance through a gap of index 1.0 between
 * half-spaces of index 1.5, simulated against the transfer matrix, at 45° and 60°, s and p, 10, 20
 * and 40 cells per wavelength in the glass, for ten gaps from 0.02 to 1.49 vacuum wavelengths, none
 * a whole number of cells at any resolution. Opt-in (tag {@code accuracy}, run by
 * {@code mvn -Paccuracy test -pl io}); the default test run keeps the coarser checks of the
 * solver's {@code GapTunnellingTest}.
 *
 * <p>Every case runs twice: with the dispersion correction (what case files with a plane wave do by
 * default; the limits are checked on these) and with the materials as written (reported
 * beside them; without the correction s at 60° and 20 cells per wavelength misses 0.005 at the
 * steepest gap).
 *
 * <p>Writes {@code target/accuracy-study/table.csv} (one row per case and gap) and, per angle,
 * polarization and variant, {@code T-<pol>-<angle>deg[-plain].png} (T against gap: the exact curve
 * and the simulated points at each resolution) and {@code error-<pol>-<angle>deg[-plain].png}
 * (T_sim − T_exact against gap, with the Richardson value); prints a summary; then checks the
 * issue's limits.
 */
@Tag("accuracy")
class GapAccuracyStudyTest {

    private static final double[] ANGLES = {45, 60};
    private static final Polarization[] POLARIZATIONS = {Polarization.S, Polarization.P};
    private static final int[] CELLS_PER_WAVELENGTH = {10, 20, 40};
    /**
     * Gaps in vacuum wavelengths: (m + 0.3)/15 or (m + 0.7)/15, which is m + 0.3 or m + 0.7 cells at
     * 10 cells per wavelength in the glass, 2m + 0.6 or 2m + 1.4 at 20 and 4m + 1.2 or 4m + 2.8 at 40.
     */
    private static final double[] GAPS = {0.3 / 15, 2.7 / 15, 4.3 / 15, 6.7 / 15, 9.3 / 15, 11.7 / 15, 14.3 / 15,
        16.7 / 15, 19.3 / 15, 22.3 / 15};
    /** Issue #4: largest |T_sim − T_exact| for s at 20 and 40 cells per wavelength in the glass. */
    private static final double S_TOL_20 = 0.005;
    private static final double S_TOL_40 = 0.0015;
    /** Issue #4: the same for p, whose field normal to the gap's faces makes them harder. */
    private static final double P_TOL_20 = 0.010;
    private static final double P_TOL_40 = 0.003;
    /** Issue #4: R + T = 1 within this for the lossless stack. */
    private static final double ENERGY_TOL = 1e-3;
    /** Issue #4: T40 + (T40 − T20)/3 within this of exact. */
    private static final double RICHARDSON_TOL = 0.001;
    /** Dense sampling of the exact curve on the plots. */
    private static final int CURVE_POINTS = 301;

    private static final boolean[] CORRECTED = {true, false};

    private record Key(Polarization pol, double degrees, int cpw, boolean corrected) { }

    @Test
    void transmittanceThroughTheGapAgainstTheTransferMatrix() throws IOException, InterruptedException, ExecutionException {
        long start = System.nanoTime();
        for (double g : GAPS) {
            for (int cpw : CELLS_PER_WAVELENGTH) {
                double cells = g * GapStudy.N_GLASS * cpw;
                double frac = cells - Math.floor(cells);
                assertTrue(frac > 0.1 && frac < 0.9, String.format("gap %.4f λ is %.3f cells at %d cells/λ", g, cells, cpw));
            }
        }
        int threads = Runtime.getRuntime().availableProcessors();
        Map<Key, List<Future<GapStudy.Point>>> futures = new LinkedHashMap<>();
        Map<Key, GapStudy> studies = new LinkedHashMap<>();
        ExecutorService pool = Executors.newFixedThreadPool(threads);
        try {
            // the finest (longest) runs first, so the pool does not end on one long run
            for (int c = CELLS_PER_WAVELENGTH.length - 1; c >= 0; c--) {
                for (double deg : ANGLES) {
                    for (Polarization pol : POLARIZATIONS) {
                      for (boolean corr : CORRECTED) {
                        GapStudy study = new GapStudy(pol, deg, CELLS_PER_WAVELENGTH[c], corr);
                        Key k = new Key(pol, deg, CELLS_PER_WAVELENGTH[c], corr);
                        studies.put(k, study);
                        List<Future<GapStudy.Point>> list = new ArrayList<>();
                        for (int q = GAPS.length - 1; q >= 0; q--) {
                            double g = GAPS[q];
                            list.add(0, pool.submit(() -> study.measure(g)));
                        }
                        futures.put(k, list);
                      }
                    }
                }
            }
            Map<Key, List<GapStudy.Point>> results = new LinkedHashMap<>();
            for (Map.Entry<Key, List<Future<GapStudy.Point>>> e : futures.entrySet()) {
                List<GapStudy.Point> points = new ArrayList<>();
                for (Future<GapStudy.Point> fp : e.getValue()) {
                    points.add(fp.get());
                }
                results.put(e.getKey(), points);
            }
            double seconds = (System.nanoTime() - start) * 1e-9;
            report(results, studies, seconds, threads);
        } finally {
            pool.shutdownNow();
        }
    }

    private static void report(Map<Key, List<GapStudy.Point>> results, Map<Key, GapStudy> studies, double seconds,
                               int threads) throws IOException {
        Path dir = Path.of(System.getProperty("basedir", ".")).resolve("target/accuracy-study");
        Files.createDirectories(dir);
        List<String> failures = new ArrayList<>();
        StringBuilder summary = new StringBuilder(String.format(Locale.ROOT,
                "Gap accuracy study: %d simulations in %.1f s on %d threads%n",
                results.size() * (GAPS.length + 1), seconds, threads));
        Path csv = dir.resolve("table.csv");
        try (Writer w = Files.newBufferedWriter(csv, StandardCharsets.UTF_8)) {
            w.write("dispersion_correction,angle_deg,polarization,cells_per_wavelength,gap_wavelengths,gap_cells,T_sim,R_sim,T_exact,"
                    + "T_sim_minus_exact,R_plus_T,T_richardson,T_richardson_minus_exact\n");
            for (boolean corr : CORRECTED) {
            summary.append(corr ? "  with the dispersion correction (case files' default for plane waves; limits checked):\n"
                    : "  materials as written (reported only):\n");
            for (double deg : ANGLES) {
                for (Polarization pol : POLARIZATIONS) {
                    List<GapStudy.Point> p20 = results.get(new Key(pol, deg, 20, corr));
                    List<GapStudy.Point> p40 = results.get(new Key(pol, deg, 40, corr));
                    double[] worst = new double[CELLS_PER_WAVELENGTH.length];
                    double worstEnergy = 0;
                    double worstRichardson = 0;
                    for (int c = 0; c < CELLS_PER_WAVELENGTH.length; c++) {
                        int cpw = CELLS_PER_WAVELENGTH[c];
                        List<GapStudy.Point> pts = results.get(new Key(pol, deg, cpw, corr));
                        for (int q = 0; q < GAPS.length; q++) {
                            GapStudy.Point p = pts.get(q);
                            String rich = ",";
                            if (cpw == 40) {
                                double tr = p.t() + (p.t() - p20.get(q).t()) / 3;
                                worstRichardson = Math.max(worstRichardson, Math.abs(tr - p.exact()));
                                rich = String.format(Locale.ROOT, "%.7f,%.3e", tr, tr - p.exact());
                            }
                            w.write(String.format(Locale.ROOT, "%b,%.0f,%s,%d,%.6f,%.4f,%.7f,%.7f,%.7f,%.3e,%.7f,%s%n", corr, deg,
                                    pol.name().toLowerCase(Locale.ROOT), cpw, p.gapWavelengths(), p.gapCells(), p.t(), p.r(),
                                    p.exact(), p.error(), p.r() + p.t(), rich));
                            worst[c] = Math.max(worst[c], Math.abs(p.error()));
                            double energy = Math.abs(p.r() + p.t() - 1);
                            worstEnergy = Math.max(worstEnergy, energy);
                            if (corr && !(energy <= ENERGY_TOL)) {
                                failures.add(String.format(Locale.ROOT, "%s %.0f° %d cells/λ gap %.4f λ: R + T = %.6f",
                                        pol, deg, cpw, p.gapWavelengths(), p.r() + p.t()));
                            }
                        }
                    }
                    double order = GapStudy.fittedOrder(CELLS_PER_WAVELENGTH, worst);
                    summary.append(String.format(Locale.ROOT,
                            "    %s %2.0f°: largest |ΔT| %.2e (10), %.2e (20), %.2e (40) cells/λ; fitted order %.2f; "
                            + "Richardson %.2e; largest |R + T − 1| %.1e%n",
                            pol, deg, worst[0], worst[1], worst[2], order, worstRichardson, worstEnergy));
                    boolean s = pol == Polarization.S;
                    if (corr) {
                        check(failures, worst[1], s ? S_TOL_20 : P_TOL_20, pol, deg, "largest |ΔT| at 20 cells/λ");
                        check(failures, worst[2], s ? S_TOL_40 : P_TOL_40, pol, deg, "largest |ΔT| at 40 cells/λ");
                        check(failures, worstRichardson, RICHARDSON_TOL, pol, deg, "largest |T_Richardson − T_exact|");
                    }
                    plots(dir, results, studies.get(new Key(pol, deg, 40, corr)), pol, deg, corr, p20, p40);
                }
            }
            }
        }
        summary.append("  written: ").append(dir.toAbsolutePath().normalize());
        System.out.println(summary);
        assertTrue(failures.isEmpty(), String.join("\n", failures) + "\n" + summary);
    }

    private static void check(List<String> failures, double value, double limit, Polarization pol, double deg, String what) {
        if (!(value <= limit)) {
            failures.add(String.format(Locale.ROOT, "%s %.0f°: %s %.2e > %.1e", pol, deg, what, value, limit));
        }
    }

    private static void plots(Path dir, Map<Key, List<GapStudy.Point>> results, GapStudy exact, Polarization pol,
                              double deg, boolean corr, List<GapStudy.Point> p20, List<GapStudy.Point> p40) throws IOException {
        String p = pol.name().toLowerCase(Locale.ROOT);
        String name = String.format(Locale.ROOT, "%s-%.0fdeg%s", p, deg, corr ? "" : "-plain");
        double[] gx = new double[CURVE_POINTS];
        double[] gy = new double[CURVE_POINTS];
        double top = 1.5;
        for (int q = 0; q < CURVE_POINTS; q++) {
            gx[q] = top * q / (CURVE_POINTS - 1);
            gy[q] = q == 0 ? 1 : exact.exact(gx[q]);
        }
        LinePlot.Builder tPlot = LinePlot.builder()
                .title(String.format(Locale.ROOT, "T through a gap, n 1.5 / 1.0 / 1.5, %s at %.0f°", p, deg))
                .xTitle("gap (vacuum wavelengths)").yTitle("transmittance T").xRange(0, top).yRange(-0.02, 1.02)
                .series("exact (transfer matrix)", gx, gy, LinePlot.Style.LINES, 0x1b1b1b);
        LinePlot.Builder ePlot = LinePlot.builder()
                .title(String.format(Locale.ROOT, "T_sim - T_exact, %s at %.0f°%s", p, deg, corr ? "" : ", no dispersion correction"))
                .xTitle("gap (vacuum wavelengths)").yTitle("T_sim - T_exact").xRange(0, top);
        for (int cpw : CELLS_PER_WAVELENGTH) {
            List<GapStudy.Point> pts = results.get(new Key(pol, deg, cpw, corr));
            double[] x = new double[pts.size()];
            double[] t = new double[pts.size()];
            double[] e = new double[pts.size()];
            for (int q = 0; q < pts.size(); q++) {
                x[q] = pts.get(q).gapWavelengths();
                t[q] = pts.get(q).t();
                e[q] = pts.get(q).error();
            }
            String label = cpw + " cells/λ in glass";
            tPlot.series(label, x, t, LinePlot.Style.MARKERS);
            ePlot.series(label, x, e);
        }
        double[] x = new double[p40.size()];
        double[] r = new double[p40.size()];
        for (int q = 0; q < p40.size(); q++) {
            x[q] = p40.get(q).gapWavelengths();
            r[q] = p40.get(q).t() + (p40.get(q).t() - p20.get(q).t()) / 3 - p40.get(q).exact();
        }
        ePlot.series("Richardson from 20 and 40", x, r);
        tPlot.build().writePng(dir.resolve("T-" + name + ".png"));
        ePlot.build().writePng(dir.resolve("error-" + name + ".png"));
    }
}
