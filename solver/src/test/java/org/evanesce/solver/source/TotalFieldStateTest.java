package org.evanesce.solver.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A run with a total-field box (with a scatterer inside) gives the same bits for any number of threads, and
 * a run saved half-way and restored into a new simulation continues bit for bit (common practice: the
 * project's rules for every source).
 */
class TotalFieldStateTest {

    static final int NX = 77;
    static final int NY = 61;
    static final double DX = 25e-9;
    static final double F = PhysicalConstants.C0 / 600e-9;

    static Simulation build(Polarization pol, Precision precision, boolean pulse, int threads) {
        Scene scene = Scene.builder(Material.ofIndex("water", 1.33))
                .add(Ellipse.disk(38 * DX, 30 * DX, 6 * DX), Material.ofIndex("glass", 1.5)).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, DX, NX, NY), Smoothing.ANISOTROPIC);
        TimeSignal g = pulse ? TimeSignal.gaussianPulse(F, F / 4) : TimeSignal.rampedContinuous(F, 2 / F);
        TotalFieldBox box = TotalFieldBox.plan(new TotalFieldBox.Spec(pol, Math.toRadians(160), 2.0, g, 38 * DX, 30 * DX),
                grid, BoxRuns.sides(), Courant.DEFAULT, 20, 16, 57, 45);
        return BoxRuns.builder(grid, pol, precision, box, threads).build();
    }

    static void assertSameFields(Simulation a, Simulation b, String what) {
        for (Component c : a.polarization().components()) {
            for (int j = 0; j < NY; j++) {
                for (int i = 0; i < NX; i++) {
                    double u = a.field(c, i, j);
                    double v = b.field(c, i, j);
                    if (Double.doubleToRawLongBits(u) != Double.doubleToRawLongBits(v)) {
                        assertEquals(u, v, String.format("%s: %s at (%d, %d) differs", what, c, i, j));
                        throw new AssertionError(what + ": " + c + " at (" + i + ", " + j + ") differs in its bits");
                    }
                }
            }
        }
    }

    @ParameterizedTest(name = "{0} {1} pulse={2}")
    @CsvSource({"S, FLOAT, false", "P, FLOAT, true", "S, DOUBLE, true", "P, DOUBLE, false"})
    void sameBitsForAnyThreadCountAndAfterRestart(Polarization pol, Precision precision, boolean pulse) throws IOException {
        try (Simulation one = build(pol, precision, pulse, 1); Simulation three = build(pol, precision, pulse, 3);
             Simulation first = build(pol, precision, pulse, 2); Simulation second = build(pol, precision, pulse, 2)) {
            int steps = pulse ? 250 : 400;
            one.run(steps);
            three.run(steps);
            assertSameFields(one, three, pol + " " + precision + " 1 and 3 threads");
            first.run(111);
            ByteArrayOutputStream saved = new ByteArrayOutputStream();
            first.saveState(saved);
            second.restoreState(new ByteArrayInputStream(saved.toByteArray()));
            second.run(steps - 111);
            assertSameFields(one, second, pol + " " + precision + " restored at step 111");
            double peak = 0;
            for (int i = 0; i < NX; i++) {
                peak = Math.max(peak, Math.abs(one.field(pol == Polarization.S ? Component.EZ : Component.HZ, i, 30)));
            }
            assertTrue(peak > 0.5, "the wave has reached the middle row (peak " + peak + ")");
        }
    }
}
