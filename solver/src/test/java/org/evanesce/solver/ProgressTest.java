package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.record.Progress;
import org.junit.jupiter.api.Test;

/** Progress is a step listener and reports the last step. */
class ProgressTest {

    @Test
    void reportsTheFinalStepWithAnEstimate() {
        List<Progress.Report> reports = new ArrayList<>();
        try (Simulation s = Simulation.builder(MaterialGrid.builder(32, 32, 1e-7, Material.VACUUM).build())
                .boundaries(Boundary.pec()).build()) {
            s.addListener(new Progress(50, 3600, reports::add));
            s.run(50);
        }
        assertEquals(1, reports.size(), "one report: the interval is long, the last step always reports");
        Progress.Report r = reports.get(0);
        assertEquals(50, r.step());
        assertEquals(1.0, r.fraction());
        assertEquals(0.0, r.secondsLeft());
    }
}
