package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Locale;
import org.evanesce.io.casefile.expr.Dimension;
import org.junit.jupiter.api.Test;

/**
 * sweep-extrema.csv and sweep-sensitivity.csv from a sweep.csv holding Lorentzian dips in the angle whose
 * centre moves linearly with an index, theta0(n) = 70 deg + S (n - 1.33) with S = 120 deg per index unit,
 * width 2g = 2 deg (common practice: the Lorentzian's half width at half maximum is g).
 */
class SweepExtremaTest {

    private static final double S = 120;
    private static final double G_DEG = 1.0;
    private static final double[] INDEX = {1.33, 1.335, 1.345};

    /**
     * The dips are sampled every 0.25 deg = g/4, where the parabola misses a centre by at most 0.0374 h^2/g
     * = 2.3e-3 deg (ExtremumTest); a difference over 0.005 index units may then be off by 2 x 2.3e-3/0.005
     * = 0.94 deg per unit. Measured: 0.44 deg per unit (119.56 and 119.97).
     */
    private static final double SENSITIVITY_TOLERANCE = 1.0;
    /** 10 x 0.0374 h^2/g at h = g/4 (ExtremumTest). */
    private static final double POSITION_TOLERANCE_DEG = 0.0234;

    /**
     * The width's sampling error (ExtremumTest): the baseline, 10 g from the centre at the range's ends,
     * narrows it by 2g/101 = 0.020 deg, and linear interpolation at h = g/4 adds up to h^2/(4g) = 0.016 deg.
     * Measured: 1.982 deg against 2 deg.
     */
    private static final double WIDTH_TOLERANCE_DEG = 0.036;

    @Test
    void anAngleAndIndexSweepGivesEachDipItsWidthAndTheShiftPerIndexUnit() {
        String csv = table();
        SweepExtrema.Written w = SweepExtrema.compute(csv, List.of("n_water", "theta"), List.of(Dimension.NONE, Dimension.ANGLE));
        assertNotNull(w);
        List<String[]> rows = SampleSummary.parse(w.extrema());
        List<String> h = List.of(rows.get(0));
        assertEquals(List.of("wavelength_nm", "n_water", "theta", "parameter", "column", "kind", "parameter_si", "value",
                "bracketed", "width_si", "width_complete"), h);
        int dips = 0;
        for (String[] r : rows.subList(1, rows.size())) {
            // the _diff column is no flux result; against n_water (3 values) the angle groups have their own rows
            assertTrue(r[h.indexOf("column")].equals("R_front"), r[h.indexOf("column")]);
            if (r[h.indexOf("parameter")].equals("theta") && r[h.indexOf("kind")].equals("min")) {
                double n = Double.parseDouble(r[h.indexOf("n_water")]);
                double centre = 70 + S * (n - 1.33);
                assertEquals(centre, Math.toDegrees(Double.parseDouble(r[h.indexOf("parameter_si")])), POSITION_TOLERANCE_DEG,
                        "n " + n);
                assertEquals(2 * G_DEG, Math.toDegrees(Double.parseDouble(r[h.indexOf("width_si")])), WIDTH_TOLERANCE_DEG,
                        "n " + n);
                assertEquals("true", r[h.indexOf("bracketed")]);
                assertEquals("true", r[h.indexOf("width_complete")]);
                dips++;
            }
        }
        assertEquals(INDEX.length, dips);
        assertNotNull(w.sensitivity());
        List<String[]> s = SampleSummary.parse(w.sensitivity());
        List<String> sh = List.of(s.get(0));
        assertEquals(INDEX.length, s.size(), "one row per pair of consecutive index values\n" + w.sensitivity());
        for (String[] r : s.subList(1, s.size())) {
            assertEquals(S, Double.parseDouble(r[sh.indexOf("shift_deg_per_index_unit")]), SENSITIVITY_TOLERANCE,
                    w.sensitivity());
            assertEquals("true", r[sh.indexOf("bracketed")]);
        }
        assertTrue(w.summary().contains("dip shift per unit of n_water"), w.summary());
    }

    /** A lossless scene's A of a few 1e-6 (the gap example's) has "dips" of noise: in the file, not printed. */
    @Test
    void aDipShallowerThanTheSimulationsAccuracyIsFiledButNotPrinted() {
        StringBuilder sb = new StringBuilder("point,gap,gap_si,wavelength_nm,A,settled\n");
        double[] a = {-1e-6, -3e-6, -2e-6, -4e-6, -1e-6};
        for (int k = 0; k < a.length; k++) {
            sb.append(String.format(Locale.ROOT, "%d,%d nm,%.12e,633.000000,%.9e,true%n", k, 100 + 50 * k,
                    100e-9 + 50e-9 * k, a[k]));
        }
        SweepExtrema.Written w = SweepExtrema.compute(sb.toString(), List.of("gap"), List.of(Dimension.LENGTH));
        assertNotNull(w);
        List<String[]> rows = SampleSummary.parse(w.extrema());
        assertEquals("min", rows.get(1)[4]);
        assertEquals("true", rows.get(1)[7], "the noise dip is bracketed in the file");
        assertTrue(w.summary().contains("none: no minimum that deep lies inside the range"), w.summary());
        assertTrue(w.summary().contains("1 shallower dips (within the simulation's accuracy"), w.summary());
    }

    @Test
    void aMonotonicCurveHasItsExtremaAtTheEndsAndNoSensitivityWithoutAnIndex() {
        StringBuilder sb = new StringBuilder("point,gap,gap_si,wavelength_nm,T_back,settled\n");
        for (int k = 0; k < 5; k++) {
            double gap = 100e-9 + 50e-9 * k;
            sb.append(String.format(Locale.ROOT, "%d,%d nm,%.12e,633.000000,%.9f,true%n", k, 100 + 50 * k, gap,
                    Math.exp(-gap / 80e-9)));
        }
        SweepExtrema.Written w = SweepExtrema.compute(sb.toString(), List.of("gap"), List.of(Dimension.LENGTH));
        assertNotNull(w);
        assertNull(w.sensitivity());
        List<String[]> rows = SampleSummary.parse(w.extrema());
        assertEquals(3, rows.size());
        assertEquals("min", rows.get(1)[4]);
        assertEquals(3.0e-7, Double.parseDouble(rows.get(1)[5]), 1e-15);
        assertEquals("false", rows.get(1)[7]);
        assertEquals("", rows.get(1)[8]);
        assertEquals(1.0e-7, Double.parseDouble(rows.get(2)[5]), 1e-15);
        assertEquals("false", rows.get(2)[7]);
        assertTrue(w.summary().contains("none: no minimum that deep lies inside the range"), w.summary());
    }

    @Test
    void fewerThanThreeValuesGiveNothing() {
        String csv = "point,gap,gap_si,wavelength_nm,T_back,settled\n0,1 nm,1e-9,633,0.5,true\n1,2 nm,2e-9,633,0.4,true\n";
        assertNull(SweepExtrema.compute(csv, List.of("gap"), List.of(Dimension.LENGTH)));
    }

    private static String table() {
        StringBuilder sb = new StringBuilder(
                "point,n_water,n_water_si,theta,theta_si,wavelength_nm,R_front,R_front_diff,settled\n");
        int point = 0;
        for (double n : INDEX) {
            double centre = 70 + S * (n - 1.33);
            for (int k = 0; k <= 80; k++) {
                double deg = 60 + 0.25 * k;
                double u = (deg - centre) / G_DEG;
                double r = 1 - 0.95 / (1 + u * u);
                sb.append(String.format(Locale.ROOT, "%d,%s,%.12e,%s deg,%.12e,633.000000,%.9f,0.001,true%n", point++, n, n,
                        deg, Math.toRadians(deg), r));
            }
        }
        return sb.toString();
    }
}
