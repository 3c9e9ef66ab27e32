package org.evanesce.io.run;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.io.plan.PlaneWaves;

/**
 * Flux values that cannot be right: a T or R well outside [0, 1], R + T well above 1 (A well below 0),
 * or, for a plane wave in a lossless scene (every material of conductivity 0, periodic sides, so nothing
 * leaves sideways), A well away from 0. Each becomes a warning with the value, where it occurred, and
 * the likely causes found in the case (a run that did not settle, a line close to the source or a PML,
 * a coarse grid).
 */
public final class Plausibility {

    /**
     * How far below 0 or above 1 a T, R or A may lie (and |A| for a lossless plane wave) before it is called
     * impossible: ten times the largest |A| measured in runs that settled. The plane-wave gap accuracy study
     * (GapAccuracyStudyTest, 240 runs: 10 to 40 cells per wavelength, s and p, 45° and 60°) has |R + T − 1| at
     * most 9.8e-4; the shipped examples at their own settings |A| at most 1.1e-6 (plane wave) and 4e-4 (beams,
     * lossless), R at most 1.0001. A run of the gap example cut short is caught: A = 0.027 with 2.9e-3 of its
     * energy left, 0.995 at 60 fs.
     */
    static final double MARGIN = 0.01;

    /** A line closer than this many cells to the launching line may read the source's own near field (common practice). */
    static final double NEAR_SOURCE_CELLS = 3;
    /** A line closer than this many cells to a PML may read its reflections and absorbed fields (common practice). */
    static final int NEAR_PML_CELLS = 3;
    /** Fewer cells per wavelength than this in the densest material are coarse for flux to 1 % (README: 0.005 at 20). */
    static final double COARSE_CELLS_PER_WAVELENGTH = 10;

    private Plausibility() {
    }

    /** The warnings for a run's flux table (empty when every value is plausible). */
    public static List<String> check(CasePlan plan, FluxResults flux, Settling settling) {
        List<String> out = new ArrayList<>();
        if (flux == null || plan.flux().isEmpty()) {
            return out;
        }
        FluxPlan fp = plan.flux().get();
        CaseSpec s = plan.spec();
        boolean lossless = s.materials().values().stream().allMatch(m -> m.conductivity().si() == 0 && !m.isDispersive());
        boolean planeWave = fp.beam().isEmpty();
        List<String> found = new ArrayList<>();
        for (FluxPlan.Line l : fp.lines()) {
            String c = FluxResults.label(l);
            worst(flux, c, v -> v < -MARGIN || v > 1 + MARGIN, Math::abs).ifPresent(w -> found.add(String.format(Locale.ROOT,
                    "%s = %.4g at %.2f nm, outside [0, 1]", c, w[0], w[1] * 1e9)));
        }
        if (flux.columns().contains("A")) {
            if (lossless && planeWave) {
                worst(flux, "A", v -> Math.abs(v) > MARGIN, Math::abs).ifPresent(w -> found.add(String.format(Locale.ROOT,
                        "A = 1 − R − T = %.4g at %.2f nm, but the scene is lossless (every conductivity 0) and the sides "
                                + "periodic, so A should be 0", w[0], w[1] * 1e9)));
            } else {
                worst(flux, "A", v -> v < -MARGIN || v > 1 + MARGIN, Math::abs).ifPresent(w -> found.add(String.format(
                        Locale.ROOT, "A = 1 − R − T = %.4g at %.2f nm, outside [0, 1] (R + T = %.4g)", w[0], w[1] * 1e9,
                        1 - w[0])));
            }
        }
        if (found.isEmpty()) {
            return out;
        }
        out.add("implausible flux: " + String.join("; ", found) + ". Likely cause" + causes(plan, fp, settling));
        return out;
    }

    /** The worst value (by {@code size}) of a column among those {@code bad}, with its wavelength: {value, m}. */
    private static java.util.Optional<double[]> worst(FluxResults flux, String column,
                                                      java.util.function.DoublePredicate bad,
                                                      java.util.function.DoubleUnaryOperator size) {
        int k = flux.columns().indexOf(column);
        double[] w = null;
        for (FluxResults.Row r : flux.rows()) {
            double v = r.values()[k];
            if (Double.isFinite(v) && bad.test(v) && (w == null || size.applyAsDouble(v) > size.applyAsDouble(w[0]))) {
                w = new double[] {v, r.wavelength()};
            }
            if (!Double.isFinite(v)) {
                w = new double[] {v, r.wavelength()};
                break;
            }
        }
        return java.util.Optional.ofNullable(w);
    }

    private static String causes(CasePlan plan, FluxPlan fp, Settling settling) {
        List<String> c = new ArrayList<>();
        if (Boolean.FALSE.equals(settling.settled())) {
            c.add("the run did not settle (see the warning about it)");
        }
        double dx = fp.cellSize();
        double sourceY = PlaneWaves.launched(plan.spec()).orElseThrow().y().si();
        int[] in = plan.interior();
        for (FluxPlan.Line l : fp.lines()) {
            String name = l.spec().name().value();
            double cells = Math.abs(l.y() - sourceY) / dx;
            if (cells < NEAR_SOURCE_CELLS) {
                c.add(String.format(Locale.ROOT, "line '%s' is %.1f cells from the source, in its near field", name, cells));
            }
            // the line's fields are read on rows row and row + 1
            int below = l.row() - in[1];
            int above = in[3] - 1 - (l.row() + 1);
            if (Math.min(below, above) < NEAR_PML_CELLS) {
                c.add(String.format(Locale.ROOT, "line '%s' is %d cell(s) from the %s PML", name, Math.min(below, above),
                        below < above ? "bottom" : "top"));
            }
        }
        double nMax = 1;
        String densest = "vacuum";
        for (MaterialSpec m : plan.spec().materials().values()) {
            if (m.index() > nMax) {
                nMax = m.index();
                densest = m.name();
            }
        }
        double shortest = Double.POSITIVE_INFINITY;
        for (int q = 0; q < fp.frequencies().length; q++) {
            shortest = Math.min(shortest, fp.wavelength(q));
        }
        double cpw = shortest / nMax / dx;
        if (cpw < COARSE_CELLS_PER_WAVELENGTH) {
            c.add(String.format(Locale.ROOT, "a coarse grid: %.3g cells per wavelength in %s (at least %.0f for flux to about "
                    + "1 %%)", cpw, densest, COARSE_CELLS_PER_WAVELENGTH));
        }
        if (c.isEmpty()) {
            return ": none of the usual ones (a run that did not settle, a line close to the source or a PML, a coarse grid) "
                    + "was found; check the case's geometry and its lines' positions";
        }
        return (c.size() > 1 ? "s: " : ": ") + String.join("; ", c);
    }
}
