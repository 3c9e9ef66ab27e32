package org.evanesce.io.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.solver.record.FieldMap;
import org.junit.jupiter.api.Test;

/**
 * The stride the planner gives a field map: for the shipped evanescent-tail example (one Gaussian pulse) the largest
 * that keeps the sampling rate at twice the least that aliases nothing (Shannon 1949, Theorem 1: the mapped frequency
 * plus the pulse's top, f0 + 6σf, where its spectrum is e^−18 of its peak), and every step for a signal without that
 * bound. That such a stride leaves the transform as it was is FieldMapStrideTest's check.
 */
class MapStrideTest {

    private static final Path CASE = Path.of("..", "cases", "prism-evanescent-tail.yaml");

    @Test
    void aPulsedMapReadsAsFewStepsAsTheSamplingTheoremAllows() throws Exception {
        CasePlan plan = plan(Files.readString(CASE));
        FieldMap map = plan.fields().maps().orElseThrow().map();
        SignalSpec.Pulse pulse = (SignalSpec.Pulse) plan.spec().sources().get(0).signal();
        double top = pulse.frequency().si() + 6 * pulse.spectrumSigma();
        double f = map.frequency(0);
        int n = map.stride();
        String ctx = String.format("stride %d, Δt %.4g s, map at %.4g Hz, pulse top %.4g Hz", n, plan.dt(), f, top);
        assertTrue(n > 1, ctx + ": the example's map should skip steps");
        assertTrue(1 / (n * plan.dt()) >= 2 * (f + top), ctx + ": below twice the alias-free rate");
        assertTrue(n == MapStride.MOST || 1 / ((n + 1) * plan.dt()) < 2 * (f + top), ctx + ": not the largest stride");
    }

    @Test
    void aSignalWithoutABandTopKeepsEveryStep() throws Exception {
        String text = Files.readString(CASE).replace("signal: {pulse: {wavelength: wl, bandwidth: 60 nm}}",
                "signal: {gaussian_derivative: {wavelength: wl}}");
        assertTrue(text.contains("gaussian_derivative"), "the example's signal line changed; update this test");
        assertEquals(1, plan(text).fields().maps().orElseThrow().map().stride());
    }

    private static CasePlan plan(String text) throws Exception {
        return CasePlanner.plan(CaseLoader.parse(text, CASE.toString(), Map.of(), ReadOptions.defaults()).spec(), 1);
    }
}
