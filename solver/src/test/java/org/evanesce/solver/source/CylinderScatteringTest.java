package org.evanesce.solver.source;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.farfield.NearToFarField;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.record.FarFieldBox;
import org.evanesce.solver.reference.CylinderSeries;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Scattering by a dielectric cylinder lit by a total-field box, through the program's far-field contour
 * ({@link FarFieldBox}, the near-to-far-field transform for the grid's own waves) round the scattered field, against
 * the exact series (C. F. Bohren &amp; D. R. Huffman, <i>Absorption and Scattering of Light by Small Particles</i>,
 * 1983, ch. 8, §8.4: σ(φ), C_sca, C_ext; the optical theorem, C_ext from the forward amplitude, ibid. §8.4 and ch. 3).
 */
class CylinderScatteringTest {

    static final double LAMBDA = 600e-9;
    static final double F = PhysicalConstants.C0 / LAMBDA;
    static final double N_CYLINDER = 1.5;

    record Result(CylinderSeries exact, NearToFarField fdtd, double incidence, Complex incidentAtOrigin) { }

    /**
     * One run with far-field contours {@code gaps} cells outside the total-field box (one result per contour).
     *
     * @param sizeParameter x = k a in the vacuum round the cylinder
     * @param cells         cells per vacuum wavelength
     */
    static Result[] run(Polarization pol, double sizeParameter, int cells, double incidenceDegrees, int... gaps) {
        double dx = LAMBDA / cells;
        double radius = sizeParameter * LAMBDA / (2 * Math.PI);
        int r = (int) Math.ceil(radius / dx);
        int boxHalf = r + 4;
        int widest = 0;
        for (int g : gaps) {
            widest = Math.max(widest, g);
        }
        int half = boxHalf + widest + 5 + BoxRuns.PML;
        int n = 2 * half + 1;
        // the centre a little off the nodes, so that the cylinder is not symmetric on the grid by accident
        double cx = (half + 0.23) * dx;
        double cy = (half + 0.41) * dx;
        Scene scene = Scene.builder(Material.ofIndex("vacuum", 1.0))
                .add(Ellipse.disk(cx, cy, radius), Material.ofIndex("glass", N_CYLINDER)).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, dx, n, n), Smoothing.ANISOTROPIC);
        double period = 1 / F;
        double dt = Courant.timeStep(Courant.DEFAULT, dx);
        long perPeriod = Math.round(period / dt);
        double incidence = Math.toRadians(incidenceDegrees);
        TotalFieldBox box = TotalFieldBox.plan(new TotalFieldBox.Spec(pol, incidence, 1.0,
                TimeSignal.rampedContinuous(F, 3 * period), cx, cy), grid, BoxRuns.sides(), Courant.DEFAULT,
                half - boxHalf, half - boxHalf, half + boxHalf, half + boxHalf);
        long steps = (long) (30 + 3 * sizeParameter) * perPeriod;
        // the last four periods: whole periods of the settled wave
        double start = (steps - 4 * perPeriod - 0.25) * dt;
        FarFieldBox[] contours = new FarFieldBox[gaps.length];
        Simulation.Builder b = BoxRuns.builder(grid, pol, Precision.FLOAT, box, 1);
        for (int k = 0; k < gaps.length; k++) {
            // sides at (half ∓ (boxHalf + gap) ± ½)Δ: gap − ½ cells outside the box's edge
            int c = boxHalf + gaps[k];
            contours[k] = new FarFieldBox(pol, half - c, half - c, half + c - 1, half + c - 1, F).window(start,
                    start + 4 * period);
            b.listener(contours[k]);
        }
        try (Simulation sim = b.build()) {
            sim.run(steps);
        }
        CylinderSeries exact = CylinderSeries.dielectric(pol, radius, Complex.real(N_CYLINDER), 1.0, LAMBDA)
                .incidentAlong(incidence);
        Result[] out = new Result[gaps.length];
        for (int k = 0; k < gaps.length; k++) {
            // the transforms are ½ Û D over the window of duration D (FluxLine): the incident phasor in those units
            long[] samples = contours[k].box().sides()[0].samples();
            double duration = (pol == Polarization.S ? samples[0] : samples[1]) * dt;
            Complex incident = box.zPhasorAt(cx, cy, F).times(0.5 * duration);
            out[k] = new Result(exact, contours[k].farField(0, 1.0, 0, 0, dx, cx, cy), incidence, incident);
        }
        return out;
    }

    static Result run(Polarization pol, double sizeParameter, int cells, double incidenceDegrees) {
        return run(pol, sizeParameter, cells, incidenceDegrees, 3)[0];
    }

    /** Departures from the series: σ forward and backward, worst dB within 20 dB of the peak, C_sca, C_ext/C_sca − 1. */
    record Errors(double forward, double backward, double worstDb, double total, double theorem, double extinction) {

        static Errors of(Result r) {
            double amp = r.incidentAtOrigin().abs();
            double peak = 0;
            for (int q = 0; q < 360; q++) {
                peak = Math.max(peak, r.exact().scatteringWidth(Math.toRadians(q)));
            }
            double worstDb = 0;
            for (int q = 0; q < 360; q++) {
                double psi = Math.toRadians(q);
                double e = r.exact().scatteringWidth(psi);
                if (e >= peak / 100) {
                    double s = r.fdtd().scatteringWidth(r.incidence() + psi, amp);
                    worstDb = Math.max(worstDb, Math.abs(10 * Math.log10(s / e)));
                }
            }
            double fwd = r.fdtd().scatteringWidth(r.incidence(), amp) / r.exact().scatteringWidth(0) - 1;
            double back = r.fdtd().scatteringWidth(r.incidence() + Math.PI, amp) / r.exact().scatteringWidth(Math.PI) - 1;
            double sca = r.fdtd().scatteringWidthTotal(amp);
            double ext = r.fdtd().extinctionWidth(r.incidence(), r.incidentAtOrigin());
            return new Errors(fwd, back, worstDb, sca / r.exact().scatteringWidthTotal() - 1, ext / sca - 1,
                    ext / r.exact().extinctionWidth() - 1);
        }

        String print(String name) {
            String line = String.format("%s: forward %+.4f, backward %+.4f, worst %.3f dB, C_sca %+.4f, C_ext/C_sca %+.4f, "
                    + "C_ext %+.4f", name, forward, backward, worstDb, total, theorem, extinction);
            System.out.println(line);
            return line;
        }
    }

    /**
     * The issue's bounds: σ within 2 % at the forward and backward angles, within 0.5 dB wherever it is within 20 dB
     * of its peak, C_sca within 1 %, and C_ext from the forward amplitude equal to C_sca within 1 % (a lossless
     * cylinder absorbs nothing).
     */
    record Bounds(double edge, double db, double total, double theorem) { }

    static final Bounds ISSUE = new Bounds(0.02, 0.5, 0.01, 0.01);
    /**
     * The quick check at 30 cells per vacuum wavelength (20 in the glass), x = 2, headings 0°, 37°, 120°. Measured
     * (2026-12-04, with the smoothing's cross terms in p): forward +0.6 to +1.6 %, backward −3.3 to −0.2 % (p −2.4 %
     * at 0°, −3.3 % at 120°; p's backward σ then falls fast: −0.57 % at 45 cells, {@link #convergesAtSecondOrder}),
     * worst 0.11–0.18 dB, C_sca +0.53 to +0.82 %, C_ext/C_sca − 1 −0.06 to +0.13 % (with the continuum's transform it
     * was +0.67 to +0.86 %). σ's edges and C_sca carry the grid's error at this coarse resolution (second order);
     * bounds about 1.4x those, the theorem at the issue's 1 %. (Before the cross terms p's backward σ was −0.2 to
     * +1.6 % here but did not converge: +1.30 % at 90 cells.)
     */
    static final Bounds QUICK = new Bounds(0.045, 0.3, 0.0125, ISSUE.theorem());

    static String check(Errors e, String name, Bounds b) {
        StringBuilder fails = new StringBuilder();
        if (Math.abs(e.forward()) > b.edge() || Math.abs(e.backward()) > b.edge()) {
            fails.append(String.format("%s: σ forward %+.4f, backward %+.4f off the series; ", name, e.forward(),
                    e.backward()));
        }
        if (e.worstDb() > b.db()) {
            fails.append(String.format("%s: σ off by %.3f dB; ", name, e.worstDb()));
        }
        if (Math.abs(e.total()) > b.total() || Math.abs(e.theorem()) > b.theorem()) {
            fails.append(String.format("%s: C_sca %+.4f off the series, C_ext/C_sca − 1 = %+.4f; ", name, e.total(),
                    e.theorem()));
        }
        return fails.toString();
    }

    @ParameterizedTest(name = "{0} x={1} {2} cells/λ {3} deg")
    @CsvSource({"S, 2, 30, 0", "P, 2, 30, 0", "S, 2, 30, 37", "P, 2, 30, 120"})
    void scatteringWidthMatchesTheSeries(Polarization pol, double x, int cells, double incidence) {
        String name = pol + " x=" + x + " " + cells + " cells/λ " + incidence + "°";
        Errors e = Errors.of(run(pol, x, cells, incidence));
        e.print(name);
        String fails = check(e, name, QUICK);
        assertTrue(fails.isEmpty(), fails);
    }

    /**
     * The optical theorem on a near and a far contour of one run (3 and 30 cells outside the box, x = 2, 30 cells per
     * wavelength): C_ext from the forward amplitude equals C_sca within the issue's 1 % on both. Measured
     * (2026-12-04): near +0.13 % (s), +0.06 % (p); far +0.25 % (s), +0.26 % (p). The continuum's transform (phases
     * with k, not the grid's k̃) gave +0.67 % and +1.10 % (s), +0.86 % and +1.69 % (p): the forward amplitude's phase
     * off by (k̃ − k)R, growing with the contour's distance R.
     */
    @ParameterizedTest(name = "{0}")
    @CsvSource({"S", "P"})
    void opticalTheoremHoldsOnNearAndFarContours(Polarization pol) {
        Result[] r = run(pol, 2, 30, 0, 3, 30);
        Errors near = Errors.of(r[0]);
        Errors far = Errors.of(r[1]);
        near.print(pol + " contour 3 cells out");
        far.print(pol + " contour 30 cells out");
        assertTrue(Math.abs(near.theorem()) <= ISSUE.theorem() && Math.abs(far.theorem()) <= ISSUE.theorem(),
                String.format("%s: C_ext/C_sca − 1 = %+.4f (near), %+.4f (far)", pol, near.theorem(), far.theorem()));
    }

    /**
     * C_sca and C_ext against the series at 30 and 45 cells per wavelength (x = 2, heading 0°): within the issue's 1 %
     * at both, and C_sca's error falling at least as fast as Δ^1.5 (second order expected: the anisotropic smoothing
     * of the faces, the grid's dispersion inside the rod). Measured (2026-12-04): C_sca +0.74 % → +0.32 % (s),
     * +0.82 % → +0.33 % (p), orders 2.1 and 2.2; C_ext +0.87 % → +0.37 % (s), +0.88 % → +0.35 % (p). In p also the
     * backward σ, whose field crosses the faces, must fall at least as fast as Δ^1.5: measured −2.41 % → −0.57 %, order
     * 3.6 (the smoothing's cross terms; with the diagonal alone it converged at first order, see
     * {@link #issueBoundsAtNinetyCells}).
     */
    @ParameterizedTest(name = "{0}")
    @CsvSource({"S", "P"})
    void convergesAtSecondOrder(Polarization pol) {
        Errors coarse = Errors.of(run(pol, 2, 30, 0));
        Errors fine = Errors.of(run(pol, 2, 45, 0));
        coarse.print(pol + " x=2 30 cells/λ");
        fine.print(pol + " x=2 45 cells/λ");
        for (Errors e : new Errors[] {coarse, fine}) {
            assertTrue(Math.abs(e.total()) <= ISSUE.total() && Math.abs(e.extinction()) <= ISSUE.total(), String.format(
                    "%s: C_sca %+.4f, C_ext %+.4f off the series", pol, e.total(), e.extinction()));
        }
        double order = Math.log(Math.abs(coarse.total() / fine.total())) / Math.log(45.0 / 30);
        assertTrue(order >= MIN_ORDER, String.format("%s: C_sca's error %+.4f at 30, %+.4f at 45 cells/λ: order %.2f",
                pol, coarse.total(), fine.total(), order));
        if (pol == Polarization.P) {
            double back = Math.log(Math.abs(coarse.backward() / fine.backward())) / Math.log(45.0 / 30);
            assertTrue(back >= MIN_ORDER, String.format("p: backward σ's error %+.4f at 30, %+.4f at 45 cells/λ: order %.2f",
                    coarse.backward(), fine.backward(), back));
        }
    }

    /** The least order of convergence accepted for C_sca (measured 2.1 and 2.3 from 30 to 45 cells; second order expected). */
    static final double MIN_ORDER = 1.5;

    /**
     * The issue's bounds at 90 cells per vacuum wavelength (60 in the glass), size parameters 2 and 5, s and p, with 45
     * and 60 cells beside them to show the convergence: C_sca's error must fall from 45 to 90 cells. Measured
     * (2026-12-04, p with the smoothing's cross terms) at 45 / 60 / 90 cells: C_sca +0.32/+0.17/+0.07 % (s, x = 2),
     * +0.33/+0.18/+0.08 % (p, x = 2), −0.94/−0.53/−0.24 % (s, x = 5), −0.72/−0.40/−0.18 % (p, x = 5); C_ext/C_sca − 1
     * at most +0.09 %; at 90 cells forward +0.15, +0.11, −0.30, −0.23 %, backward −0.11, −0.06, −0.08, −0.23 %, worst
     * 0.009–0.021 dB. p's backward σ (x = 5, 22 dB below σ's peak, its field across the faces): −0.54, −0.41, −0.23 %
     * at 45, 60, 90 cells, −0.15 % at 120; with the diagonal of the smoothed permittivity alone it converged at first
     * order, −3.2, −2.4, −1.5, −1.1 % (and +1.30 % at 90 cells for x = 2), and C_sca (p, x = 5) was −0.56/−0.28/−0.09 %.
     * About 30 s of stepping on one core.
     */
    @Tag("accuracy")
    @ParameterizedTest(name = "{0} x={1} at 45, 60, 90 cells per wavelength")
    @CsvSource({"S, 2", "P, 2", "S, 5", "P, 5"})
    void issueBoundsAtNinetyCells(Polarization pol, double x) {
        Errors[] e = new Errors[3];
        int[] cells = {45, 60, 90};
        for (int k = 0; k < 3; k++) {
            e[k] = Errors.of(run(pol, x, cells[k], 0));
            e[k].print(pol + " x=" + x + " " + cells[k] + " cells/λ");
        }
        String fails = check(e[2], pol + " x=" + x + " 90 cells/λ", ISSUE);
        assertTrue(fails.isEmpty(), fails);
        assertTrue(Math.abs(e[2].total()) < Math.abs(e[0].total()), String.format(
                "%s x=%s: C_sca's error %+.4f at 45 cells/λ, %+.4f at 90: not converging", pol, x, e[0].total(), e[2].total()));
    }
}
