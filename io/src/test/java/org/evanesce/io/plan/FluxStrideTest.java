package org.evanesce.io.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.solver.record.FluxLine;
import org.junit.jupiter.api.Test;

/**
 * The stride the planner gives flux lines: for the shipped gap example (one Gaussian pulse) every line of the run
 * and of the incident-power run (its strip's too) reads the fields as few steps apart as the sampling theorem allows
 * with twice the least rate that aliases nothing onto the highest transformed frequency (C. E. Shannon,
 * "Communication in the presence of noise", Proc. IRE 37, 10–21, 1949, Theorem 1; the rule of {@link MapStride});
 * a continuous wave, transformed over whole periods, keeps every step. That such a stride leaves R and T as they
 * were is FluxLineStrideTest's check (solver).
 */
class FluxStrideTest {

    private static final Path PULSED = Path.of("..", "cases", "gap-tunnelling-plane-wave.yaml");
    private static final Path CONTINUOUS = Path.of("..", "cases", "plasmon-sensor-gold-water.yaml");

    @Test
    void aPulsedCasesLinesReadAsFewStepsAsTheSamplingTheoremAllows() throws Exception {
        CasePlan plan = plan(PULSED);
        FluxPlan flux = plan.flux().orElseThrow();
        SignalSpec.Pulse pulse = (SignalSpec.Pulse) plan.spec().sources().get(0).signal();
        double top = pulse.frequency().si() + 6 * pulse.spectrumSigma();
        double f = 0;
        for (double v : flux.frequencies()) {
            f = Math.max(f, v);
        }
        List<FluxLine> lines = lines(flux);
        assertTrue(flux.strip().isPresent() || flux.computed().isPresent(), "the example's incident power should come "
                + "from a strip or be computed");
        int n = flux.lines().get(0).run().stride();
        String ctx = String.format("stride %d, Δt %.4g s, highest frequency %.4g Hz, pulse top %.4g Hz", n, plan.dt(), f, top);
        assertTrue(n > 1, ctx + ": the example's lines should skip steps");
        assertTrue(1 / (n * plan.dt()) >= 2 * (f + top), ctx + ": below twice the alias-free rate");
        assertTrue(n == MapStride.MOST || 1 / ((n + 1) * plan.dt()) < 2 * (f + top), ctx + ": not the largest stride");
        for (FluxLine l : lines) {
            assertEquals(n, l.stride(), ctx + ": a line at row " + l.row() + " reads another stride");
        }
    }

    @Test
    void aContinuousWaveKeepsEveryStep() throws Exception {
        FluxPlan flux = plan(CONTINUOUS).flux().orElseThrow();
        assertTrue(flux.steady().isPresent(), "the example should be a continuous wave");
        for (FluxLine l : lines(flux)) {
            assertEquals(1, l.stride(), "a line at row " + l.row());
        }
    }

    /** The run's lines, the incident-power run's and its strip's. */
    private static List<FluxLine> lines(FluxPlan flux) {
        List<FluxLine> all = new ArrayList<>();
        for (FluxPlan.Line l : flux.lines()) {
            all.add(l.run());
            all.add(l.reference());
        }
        all.add(flux.incident());
        all.addAll(flux.recorders());
        flux.strip().ifPresent(s -> all.addAll(s.lines()));
        return all;
    }

    private static CasePlan plan(Path file) throws Exception {
        return CasePlanner.plan(CaseLoader.parse(Files.readString(file), file.toString(), Map.of(), ReadOptions.defaults())
                .spec(), 1);
    }
}
