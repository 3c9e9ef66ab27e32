package org.evanesce.solver.record;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Flux lines and field maps leave the imaginary parts out of their work when the fields are real
 * ({@link StepView#complexFields} false): the transforms must equal, value for value, those of the
 * general complex path fed the same real fields (imaginary parts zero). Only the sign of a zero may
 * differ (0·x − 0 against 0·x), which no flux or map value shows.
 */
class RealFieldsShortcutTest {

    /** The simulation's view, claiming complex fields so that recorders take the general path. */
    private record Complex(StepView v) implements StepView {
        @Override
        public boolean complexFields() {
            return true;
        }

        @Override
        public long stepCount() {
            return v.stepCount();
        }

        @Override
        public double dt() {
            return v.dt();
        }

        @Override
        public int nx() {
            return v.nx();
        }

        @Override
        public int ny() {
            return v.ny();
        }

        @Override
        public double cellSize() {
            return v.cellSize();
        }

        @Override
        public double field(Component c, int i, int j) {
            return v.field(c, i, j);
        }

        @Override
        public double energy(int i0, int j0, int i1, int j1) {
            return v.energy(i0, j0, i1, j1);
        }
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void theRealPathEqualsTheGeneralOne(Polarization pol) {
        double dx = 20e-9;
        double f = 4e14;
        int n = 64;
        Scene scene = Scene.builder(Material.VACUUM).add(Ellipse.disk(40 * dx, 30 * dx, 6 * dx), Material.ofIndex("glass", 1.5))
                .build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, dx, n, n), Smoothing.ANISOTROPIC);
        FluxLine fast = new FluxLine(pol, 40, 10, 54, f, 1.2 * f);
        FluxLine general = new FluxLine(pol, 40, 10, 54, f, 1.2 * f);
        FluxLine fastColumn = FluxLine.vertical(pol, 45, 10, 54, f);
        FluxLine generalColumn = FluxLine.vertical(pol, 45, 10, 54, f);
        FieldMap fastMap = new FieldMap(pol, 20, 20, 50, 45, f, 1.2 * f);
        FieldMap generalMap = new FieldMap(pol, 20, 20, 50, 45, f, 1.2 * f);
        Component z = pol == Polarization.S ? Component.EZ : Component.HZ;
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).threads(1)
                .source(Source.point(z, n, 24, 24, 1, TimeSignal.gaussianPulse(f, f / 3)))
                .listener(fast).listener(fastColumn).listener(fastMap)
                .listener(v -> {
                    StepView c = new Complex(v);
                    general.afterStep(c);
                    generalColumn.afterStep(c);
                    generalMap.afterStep(c);
                });
        for (Side s : Side.values()) {
            b.boundary(s, Boundary.pml(10));
        }
        try (Simulation sim = b.build()) {
            sim.run(400);
        }
        for (int q = 0; q < 2; q++) {
            assertEquals(general.flux(q, dx), fast.flux(q, dx), 0.0, pol + " line, frequency " + q);
            assertArrayEquals(general.electricTransform(q), fast.electricTransform(q));
            assertArrayEquals(general.magneticTransform(q), fast.magneticTransform(q));
            for (Component c : pol.components()) {
                assertArrayEquals(generalMap.transform(c, q), fastMap.transform(c, q));
            }
        }
        assertEquals(generalColumn.flux(0, dx), fastColumn.flux(0, dx), 0.0, pol + " column");
    }

    /** Equal value for value; 0.0 and −0.0 count as equal. */
    private static void assertArrayEquals(double[][] expected, double[][] actual) {
        for (int r = 0; r < expected.length; r++) {
            for (int k = 0; k < expected[r].length; k++) {
                assertEquals(expected[r][k], actual[r][k], 0.0, "part " + r + " value " + k);
            }
        }
    }
}
