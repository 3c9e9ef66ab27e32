package org.evanesce.io.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.evanesce.io.casefile.ReadOptions;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A beam's exact references (plane wave and angular spectrum) take the layers along the vertical where its axis
 * meets the first interface. Where the layers change within the beam's footprint (a corner, a finite face) those
 * references describe that vertical alone, and the plan must say so: the shipped two-prism attenuator (faces 30 um
 * wide, waist 2 um at 45 deg: a footprint of 2.83 um, checked over ±2 footprints, 5.66 um) is uniform with the
 * beam in the middle of the faces and not 4 um or less from the end of the faces (common practice: 2 footprints hold all but
 * 3e-4 of a Gaussian beam's power).
 */
class BeamStackUniformityTest {

    private static final Path CASE = Path.of("..", "cases", "two-prism-attenuator-beam.yaml");

    @ParameterizedTest(name = "offset {0}")
    @CsvSource({"0um, false", "8um, false", "11um, true", "12um, true"})
    void flagsAStackThatChangesUnderTheBeam(String offset, boolean differs) throws Exception {
        CasePlan plan = CasePlanner.plan(CaseLoader.parse(Files.readString(CASE), CASE.toString(),
                Map.of("offset", offset, "cpw", "6"), ReadOptions.defaults()).spec(), 1);
        FluxPlan.Exact e = plan.flux().orElseThrow().exact().orElseThrow();
        double footprint = 2e-6 / Math.cos(Math.toRadians(45));
        if (!differs) {
            assertTrue(Double.isNaN(e.differsAt()), () -> "offset " + offset + ": flagged at x = " + e.differsAt());
            return;
        }
        assertTrue(!Double.isNaN(e.differsAt()), "offset " + offset + ": the face's end within the footprint not flagged");
        assertTrue(Math.abs(e.differsAt() - e.column()) <= FluxPlan.Exact.FOOTPRINTS_CHECKED * footprint * (1 + 1e-9),
                () -> "flagged outside the footprint: " + e.differsAt());
        // the face ends at |x| = 15 um: the flagged vertical lies beyond it, on the side of the end
        assertEquals(Math.signum(e.column()), Math.signum(e.differsAt() - e.column()), "flagged on the far side");
        assertTrue(Math.abs(e.differsAt()) > 15e-6 - 1e-9, () -> "flagged inside the faces: " + e.differsAt());
    }
}
