package org.evanesce.io.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.model.CaseSpec;
import org.junit.jupiter.api.Test;

/**
 * The shipped plasmon-sensor beam example is layered across its whole width (a layer_stack, unbounded sideways,
 * under a half_plane of water through the film's top: docs/case-file.md), so the beam's footprint check must find
 * the same three layers at every x. The layer_stack's top and the half_plane's face round differently with x and
 * left a background sliver about 5e-23 m thick at some x: the run warned that its references were doubtful.
 */
class PlasmonBeamStackTest {

    private static final Path CASE = Path.of("..", "cases", "plasmon-sensor-gold-water-beam.yaml");

    @Test
    void theSensorIsTheSameThreeLayersEverywhere() throws Exception {
        CaseSpec spec = CaseLoader.parse(Files.readString(CASE), CASE.toString(), Map.of(), ReadOptions.defaults()).spec();
        double cell = 10e-9;
        for (double x : new double[] {-9.5e-6, -0.9535e-6, 0, 0.9535e-6, 5e-6}) {
            List<LayeredProfile.Band> bands = LayeredProfile.bandsAt(spec, x, -0.6e-6, 0.6e-6, cell);
            String what = "x = " + x + " m: " + bands;
            assertEquals(List.of("glass", "gold", "water"), bands.stream().map(LayeredProfile.Band::material).toList(), what);
            assertEquals(0, bands.get(1).yLow(), 1e-6 * cell, what);
            assertEquals(50e-9, bands.get(2).yLow(), 1e-6 * cell, what);
        }
        CasePlan plan = CasePlanner.plan(spec, 1);
        FluxPlan.Exact e = plan.flux().orElseThrow().exact().orElseThrow();
        assertTrue(Double.isNaN(e.differsAt()), () -> "flagged as changing under the beam at x = " + e.differsAt() + " m");
    }
}
