package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.source.GaussianBeam;
import org.evanesce.solver.source.GaussianPulse;
import org.evanesce.solver.source.IncidentSheet;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * A beam's sheet values computed row by row by the band that adds them ({@link SheetTerms#fill}) give the same run, bit
 * for bit, as all set before each step ({@link SheetTerms#fillAll}), on one thread and on two bands (common practice:
 * a change of where a value is computed must not change it). The run: a tilted pulsed Gaussian beam in glass with a
 * lossy block (a dispersive-free grid takes the row-by-row path of eFinish, a lossy one the same).
 */
class SheetTermsTest {

    private static byte[] run(Polarization pol, int threads, boolean beforeStep) throws IOException {
        int nx = 120;
        int ny = 90;
        double dx = 20e-9;
        double courant = 0.5;
        double dt = courant * dx / PhysicalConstants.C0;
        double f = PhysicalConstants.C0 / 600e-9;
        MaterialGrid g = MaterialGrid.builder(nx, ny, dx, Material.ofIndex("glass", 1.5))
                .paint((x, y) -> y > 60 && y < 70 && x > 30 && x < 90, new Material("lossy", 3.0, 2e5)).build();
        Map<Side, Boundary> sides = new EnumMap<>(Side.class);
        for (Side s : Side.values()) {
            sides.put(s, Boundary.pml(10));
        }
        GaussianBeam.Spec spec = new GaussianBeam.Spec(pol, 600e-9, 60 * dx, 40 * dx, Math.toRadians(30), true, 2.25, 2.25, 1.0,
                new GaussianPulse(f, f / 5));
        Simulation.Builder b = Simulation.builder(g).polarization(pol).courant(courant).threads(threads)
                .minCellsPerThread(100).listener(new FluxLine(pol, 50, 10, nx - 10, f));
        sides.forEach(b::boundary);
        List<IncidentSheet> sheets = GaussianBeam.sheets(spec, sides, nx, ny, 0, 0, dx, dt, 20);
        sheets.forEach(b::incident);
        b.sheetsBeforeStep = beforeStep;
        try (Simulation sim = b.build()) {
            assertEquals(threads, sim.threads(), "bands");
            sim.run(300);
            ByteArrayOutputStream out = new ByteArrayOutputStream();
            sim.saveState(out);
            return out.toByteArray();
        }
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void rowByRowGivesTheSameBitsAsBeforeTheStep(Polarization pol) throws IOException {
        byte[] before = run(pol, 1, true);
        assertTrue(before.length > 100_000, "the state holds the fields");
        assertArrayEquals(before, run(pol, 1, false), pol + ", one thread");
        assertArrayEquals(before, run(pol, 2, false), pol + ", two bands");
        assertArrayEquals(before, run(pol, 2, true), pol + ", two bands, before the step");
    }
}
