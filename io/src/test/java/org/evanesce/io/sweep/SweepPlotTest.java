package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.output.image.LinePlot;
import org.junit.jupiter.api.Test;

/** sweep.png and sweep-log.png: which rows and columns of the points' flux tables are drawn. */
class SweepPlotTest {

    /** Values are copied from the tables (and degrees converted), so they agree up to rounding. */
    private static final double COPIED = 1e-9;

    private static final List<String> HEADER = List.of("wavelength_nm", "frequency_thz", "angle_deg", "R_front", "R_front_exact",
            "T_back", "T_back_exact", "A", "incident_energy_j_per_m_hz");

    /**
     * A point swept in theta (degrees) with rows at 620, 632 and 640 nm; the angle at each wavelength is
     * theta + shift(wl), T at 632 nm is {@code t}, elsewhere something else.
     */
    private static SweepMerge.Found point(int n, double thetaDeg, boolean pulsed, double t, double designM) {
        List<String[]> rows = new ArrayList<>();
        double[] wl = {620, 632, 640};
        for (double w : wl) {
            double angle = pulsed ? thetaDeg + (w - 633) * 0.1 : thetaDeg;
            double tt = w == 632 ? t : 0.9;
            rows.add(new String[] {String.format(java.util.Locale.ROOT, "%.6f", w), "480.0",
                String.format(java.util.Locale.ROOT, "%.6f", angle), fmt(1 - tt), fmt(1 - tt * 1.01), fmt(tt), fmt(tt * 1.01),
                "0.000000000", "1e-37"});
        }
        SweepMerge.Point p = new SweepMerge.Point(new SweepPoint(n, List.of("theta"), List.of(thetaDeg + " deg")),
                new double[] {Math.toRadians(thetaDeg)}, "hash");
        return new SweepMerge.Found(p, HEADER, rows, List.of("R_front", "T_back"), Map.of(), "", Double.NaN, "", "true", designM);
    }

    private static String fmt(double v) {
        return String.format(java.util.Locale.ROOT, "%.9f", v);
    }

    private static LinePlot.Series named(LinePlot p, String name) {
        return p.series().stream().filter(s -> s.name().equals(name)).findFirst().orElseThrow(() -> new AssertionError(
                "no series " + name + " in " + p.series().stream().map(LinePlot.Series::name).toList()));
    }

    @Test
    void drawsTheRowNearestTheDesignWavelengthWithTheExactCurveAndTheAngleAtThatWavelength() {
        // design 633 nm: the nearest row is 632 nm (not the first, 620 nm)
        List<SweepMerge.Found> found = List.of(point(0, 50, true, 0.001, 633e-9), point(1, 44, true, 0.4, 633e-9));
        SweepPlot plot = SweepPlot.of(found, List.of(Dimension.ANGLE), "gap");
        assertEquals(632, plot.wavelength(), COPIED);
        LinePlot.Series t = named(plot.linear(), "T_back");
        assertArrayEquals(new double[] {0.4, 0.001}, t.y(), COPIED, "T at 632 nm, sorted along x");
        assertArrayEquals(new double[] {44 - 0.1, 50 - 0.1}, t.x(), COPIED, "a pulsed plane wave: the angle at 632 nm");
        assertEquals(LinePlot.Style.MARKERS, t.style());
        LinePlot.Series exact = named(plot.linear(), "T_back_exact");
        assertEquals(LinePlot.Style.LINES, exact.style());
        assertArrayEquals(new double[] {0.404, 0.00101}, exact.y(), COPIED);
        assertEquals(t.rgb(), exact.rgb());
        assertNotNull(named(plot.linear(), "A"), "A without an exact column: lines and markers");
        // T spans 2.6 decades: the log plot holds the T series only, as log10
        assertNotNull(plot.log());
        assertEquals(List.of("T_back", "T_back_exact"), plot.log().series().stream().map(LinePlot.Series::name).toList());
        assertArrayEquals(new double[] {Math.log10(0.4), -3}, named(plot.log(), "T_back").y(), COPIED);
    }

    @Test
    void aContinuousWaveIsDrawnAgainstTheParameterAndNoLogPlotWithinADecade() {
        List<SweepMerge.Found> found = List.of(point(0, 44, false, 0.4, 633e-9), point(1, 50, false, 0.05, 633e-9));
        SweepPlot plot = SweepPlot.of(found, List.of(Dimension.ANGLE), "");
        assertArrayEquals(new double[] {44, 50}, named(plot.linear(), "T_back").x(), COPIED, "theta in degrees");
        assertNull(plot.log(), "T from 0.05 to 0.4 (and the exact values) stay within a decade");
    }

    @Test
    void withoutADesignWavelengthTheFirstRowIsDrawn() {
        List<SweepMerge.Found> found = List.of(point(0, 44, false, 0.4, Double.NaN), point(1, 50, false, 0.05, Double.NaN));
        SweepPlot plot = SweepPlot.of(found, List.of(Dimension.ANGLE), "");
        assertEquals(620, plot.wavelength(), COPIED);
        assertArrayEquals(new double[] {0.9, 0.9}, named(plot.linear(), "T_back").y(), COPIED);
        assertTrue(SweepPlot.nearest(found.get(0), 641) == 2, "the row nearest 641 nm is 640 nm's");
    }

    @Test
    void anAskedWavelengthIsDrawnInsteadOfTheDesignOne() {
        List<SweepMerge.Found> found = List.of(point(0, 44, false, 0.4, 633e-9), point(1, 50, false, 0.05, 633e-9));
        SweepPlot plot = SweepPlot.of(found, List.of(Dimension.ANGLE), "gap", 640e-9);
        assertEquals(640, plot.wavelength(), COPIED);
        assertArrayEquals(new double[] {0.9, 0.9}, named(plot.linear(), "T_back").y(), COPIED, "T at 640 nm");
        assertTrue(plot.linear().title().endsWith("at 640 nm"), plot.linear().title());
        SweepPlot near = SweepPlot.of(found, List.of(Dimension.ANGLE), "gap", 633.4e-9);
        assertEquals(632, near.wavelength(), COPIED);
        assertTrue(near.linear().title().endsWith("at 632 nm (asked: 633.4 nm)"), near.linear().title());
    }

    @Test
    void ofTwoRowsEquallyNearTheShorterWavelengthIsDrawn() {
        // 626 nm lies 6 nm from both 620 and 632 nm; 636 nm 4 nm from both 632 and 640 nm
        SweepMerge.Found f = point(0, 44, false, 0.4, 633e-9);
        assertEquals(0, SweepPlot.nearest(f, 626), "620 nm, not 632 nm");
        assertEquals(1, SweepPlot.nearest(f, 636), "632 nm, not 640 nm");
        // the rule holds whatever the rows' order (a range written from the longer wavelength down)
        List<String[]> reversed = new ArrayList<>(f.fluxRows());
        java.util.Collections.reverse(reversed);
        SweepMerge.Found down = new SweepMerge.Found(f.point(), f.fluxHeader(), reversed, f.fluxLines(), f.decays(), f.steps(),
                f.wall(), f.reason(), f.settled(), f.design());
        assertEquals(2, SweepPlot.nearest(down, 626), "620 nm is the last row here");
        assertEquals(1, SweepPlot.nearest(down, 636));
        SweepPlot design = SweepPlot.of(List.of(point(0, 44, false, 0.4, 626e-9), point(1, 50, false, 0.05, 626e-9)),
                List.of(Dimension.ANGLE), "");
        assertEquals(620, design.wavelength(), COPIED, "a design wavelength half-way between rows: the shorter");
    }
}
