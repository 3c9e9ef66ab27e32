package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.junit.jupiter.api.Test;

/**
 * Which flux tables are called impossible, and which causes the warning names. The tables are made up
 * (the values are what matters here; SettlingTest sees the warning come out of a real run cut short); the
 * plans are real, so the causes are found in the case as the program plans it.
 */
class PlausibilityTest {

    /** A plane wave in glass onto a half space of GAP_MATERIAL; placeholders CPW, SIGMA, REFLECTED_Y. */
    private static final String CASE = """
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 0.2 um, height: 3.2 um, background: glass}
            grid: {cells_per_wavelength: CPW}
            materials:
              glass: {index: 1.5}
              other: {index: 1.0, conductivity: SIGMA}
            shapes:
              - half_plane: {through: [0, 0.3 um], fill: above, material: other}
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave: {y: -0.7 um, angle: 30 deg, signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}}
            flux:
              lines:
                - {name: front, y: REFLECTED_Y, measures: reflected}
                - {name: back, y: 0.7 um, measures: transmitted}
            until: {energy_below: 1e-6, latest: 400 fs}
            """;

    private static CasePlan plan(int cpw, String sigma, String reflectedY) throws Exception {
        String text = CASE.replace("CPW", Integer.toString(cpw)).replace("SIGMA", sigma).replace("REFLECTED_Y", reflectedY);
        return CasePlanner.plan(CaseLoader.parse(text, "t.yaml", Map.of(), ReadOptions.defaults()).spec(), 1);
    }

    /** One row at 633 nm with R, T and A = 1 − R − T (as FluxResults lays them out without an exact column). */
    private static FluxResults table(double r, double t) {
        return new FluxResults(List.of("R_front", "T_back", "A"),
                List.of(new FluxResults.Row(4.736e14, 633e-9, 30, 1.0, new double[] {r, t, 1 - r - t})),
                FluxResults.Incident.SPECTRAL_ENERGY, List.of());
    }

    private static final Settling SETTLED = new Settling(true, "test", 1e-9, 1e-9, Double.NaN, Map.of(), List.of());
    private static final Settling UNSETTLED = new Settling(false, "test", 0.5, 1e-9, Double.NaN, Map.of(), List.of("x"));

    @Test
    void plausibleTablesPass() throws Exception {
        CasePlan p = plan(20, "0 S/m", "-0.95 um");
        // the largest |A| of settled runs measured (9.8e-4, GapAccuracyStudyTest) is well inside the margin
        assertEquals(List.of(), Plausibility.check(p, table(0.3, 0.699), SETTLED));
        assertEquals(List.of(), Plausibility.check(p, table(0.0, 1.0 + 0.5 * Plausibility.MARGIN), SETTLED));
    }

    @Test
    void aLosslessPlaneWaveMustConserveEnergy() throws Exception {
        List<String> w = Plausibility.check(plan(20, "0 S/m", "-0.95 um"), table(0.3, 0.6), UNSETTLED);
        assertEquals(1, w.size(), w.toString());
        assertTrue(w.get(0).startsWith("implausible flux: A = 1 − R − T = 0.1000 at 633.00 nm, but the scene is lossless"),
                w.get(0));
        assertTrue(w.get(0).contains("Likely cause: the run did not settle"), w.get(0));
    }

    @Test
    void aLossyScenePassesAbsorptanceButNotRPlusTAboveOne() throws Exception {
        CasePlan lossy = plan(20, "1e5 S/m", "-0.95 um");
        assertEquals(List.of(), Plausibility.check(lossy, table(0.3, 0.6), SETTLED), "A = 0.1 is absorption there");
        List<String> w = Plausibility.check(lossy, table(0.5, 0.6), SETTLED);
        assertEquals(1, w.size(), w.toString());
        assertTrue(w.get(0).contains("A = 1 − R − T = -0.1000 at 633.00 nm, outside [0, 1] (R + T = 1.100)"), w.get(0));
        assertTrue(w.get(0).contains("none of the usual ones"), "nothing in this case explains it: " + w.get(0));
    }

    @Test
    void theCausesFoundInTheCaseAreNamed() throws Exception {
        // 8 cells per wavelength asked (52.75 nm), 8.44 planned: the cell shrinks to 50 nm so that the periodic
        // width, 0.2 um, is 4 cells; the reflected line under two cells from the source line at -0.7 um
        CasePlan p = plan(8, "0 S/m", "-0.78 um");
        List<String> w = Plausibility.check(p, table(-0.05, 1.0), SETTLED);
        assertEquals(1, w.size(), w.toString());
        String s = w.get(0);
        assertTrue(s.contains("R_front = -0.05000 at 633.00 nm, outside [0, 1]"), s);
        assertTrue(s.matches(".*line 'front' is 1\\.\\d cells from the source, in its near field.*"), s);
        assertTrue(s.contains("a coarse grid: 8.44 cells per wavelength in glass"), s);
    }
}
