package org.evanesce.io.casefile.sections;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.io.plan.CaseLoader;
import org.junit.jupiter.api.Test;

/**
 * A wavelength range {from, to, count} gives its ends exactly and every value between them. Found by the case-file
 * fuzzer: from = 1.2e20 m, to = 636 nm gave a last wavelength of exactly 0 (from + (to − from) loses to's digits),
 * an infinite frequency and an internal error instead of a run.
 */
class SpectrumRangeTest {

    private static final String CASE = """
            title: a map over a very wide range of wavelengths
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 0.2 um, height: 2 um, background: glass}
            grid: {cells_per_wavelength: 10}
            materials:
              glass: {index: 1.5}
            boundaries: {left: periodic, right: periodic, all: pml 0.4 um}
            sources:
              - plane_wave: {y: -0.5 um, angle: 30 deg, signal: {pulse: {wavelength: 633 nm, bandwidth: 10 nm}}}
            maps:
              wavelengths: {from: FROM, to: 636 nm, count: 3}
              region: {from: [-0.1 um, -0.2 um], to: [0.1 um, 0.2 um]}
            until: {latest: 50 fs}
            """;

    @Test
    void theEndsComeOutExactlyAndEveryFrequencyIsFinite() throws Exception {
        for (String from : new String[] {"123456789012345678901234567890 nm", "600 nm"}) {
            List<Value> f = CaseLoader.parse(CASE.replace("FROM", from), "t.yaml", Map.of(), ReadOptions.defaults())
                    .spec().maps().orElseThrow().frequencies();
            assertEquals(3, f.size());
            assertEquals(PhysicalConstants.C0 / 636e-9, f.get(2).si(), 0.0, from);
            for (Value v : f) {
                assertTrue(Double.isFinite(v.si()) && v.si() > 0, () -> from + ": frequency " + v.si());
            }
        }
    }
}
