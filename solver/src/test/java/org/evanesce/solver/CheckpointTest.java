package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.util.List;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.FieldMap;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.record.Probe;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A run stopped half-way, saved, and restored into a freshly built simulation continues bit for bit
 * (issue #7): after the same total number of steps every field value, every running transform and
 * every probe sample equals the uninterrupted run's exactly, for both polarizations, both
 * precisions, PML and Bloch-periodic sides, lossy cells, and a different thread count after the
 * restart.
 */
class CheckpointTest {

    private static final int NX = 48;
    private static final int NY = 40;
    private static final double DX = 20e-9;
    private static final double F = 4e14;

    private record Run(Simulation sim, FluxLine line, FieldMap map, Probe probe) { }

    private static Run build(Polarization pol, Precision precision, boolean bloch, int threads) {
        Scene scene = Scene.builder(Material.ofIndex("glass", 1.5))
                .add(Ellipse.disk(24 * DX, 20 * DX, 6 * DX), new Material("lossy", 3.0, 2e4)).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, DX, NX, NY), Smoothing.ANISOTROPIC);
        Component z = pol == Polarization.S ? Component.EZ : Component.HZ;
        double kx = 2 * Math.PI * F / PhysicalConstants.C0 * 0.6;
        FluxLine line = new FluxLine(pol, 30, 0, NX, F, 1.1 * F);
        FieldMap map = new FieldMap(pol, 10, 25, 30, 35, F);
        Probe probe = new Probe(z, 20, 28);
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(precision).threads(threads)
                .minCellsPerThread(64).listener(line).listener(map).listener(probe)
                .boundary(Side.BOTTOM, Boundary.pml(8)).boundary(Side.TOP, Boundary.pml(8));
        if (bloch) {
            b.boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                    .source(Source.blochRow(z, NX, 12, 0, DX, kx, TimeSignal.gaussianPulse(F, F / 8)));
        } else {
            b.boundary(Side.LEFT, Boundary.pml(8)).boundary(Side.RIGHT, Boundary.pmc())
                    .source(Source.point(z, NX, 20, 12, 1, TimeSignal.gaussianPulse(F, F / 4)));
        }
        return new Run(b.build(), line, map, probe);
    }

    @ParameterizedTest(name = "{0} {1} bloch={2}")
    @CsvSource({"S, FLOAT, false", "P, FLOAT, false", "S, DOUBLE, true", "P, DOUBLE, false", "P, FLOAT, true"})
    void restoredRunContinuesBitForBit(Polarization pol, Precision precision, boolean bloch) throws IOException {
        Run whole = build(pol, precision, bloch, 1);
        whole.sim().run(300);
        Run first = build(pol, precision, bloch, 1);
        first.sim().run(137);
        ByteArrayOutputStream saved = new ByteArrayOutputStream();
        first.sim().saveState(saved);
        first.sim().close();
        Run second = build(pol, precision, bloch, 2);
        second.sim().restoreState(new ByteArrayInputStream(saved.toByteArray()));
        assertEquals(137, second.sim().stepCount());
        second.sim().run(300 - 137);
        try (Simulation a = whole.sim(); Simulation b = second.sim()) {
            for (Component c : pol.components()) {
                for (int k = 0; k < NX * NY; k++) {
                    int i = k % NX;
                    int j = k / NX;
                    assertEquals(Double.doubleToRawLongBits(a.field(c, i, j)), Double.doubleToRawLongBits(b.field(c, i, j)),
                            c + " at (" + i + ", " + j + ")");
                    assertEquals(Double.doubleToRawLongBits(a.fieldImag(c, i, j)),
                            Double.doubleToRawLongBits(b.fieldImag(c, i, j)), c + " imag at (" + i + ", " + j + ")");
                }
                assertArrayEquals(whole.map().transform(c, 0)[0], second.map().transform(c, 0)[0], 0.0, "map " + c);
                assertArrayEquals(whole.map().transform(c, 0)[1], second.map().transform(c, 0)[1], 0.0, "map " + c);
            }
            for (int q = 0; q < 2; q++) {
                assertArrayEquals(whole.line().electricTransform(q)[0], second.line().electricTransform(q)[0], 0.0);
                assertArrayEquals(whole.line().magneticTransform(q)[1], second.line().magneticTransform(q)[1], 0.0);
                assertEquals(Double.doubleToRawLongBits(whole.line().flux(q, DX)), Double.doubleToRawLongBits(second.line().flux(q, DX)));
            }
            assertArrayEquals(whole.probe().values(), second.probe().values(), 0.0);
            assertArrayEquals(whole.probe().times(), second.probe().times(), 0.0);
        }
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource({"S"})
    void aCheckpointOfAnotherSetUpIsRefused(Polarization pol) throws IOException {
        Run a = build(pol, Precision.FLOAT, false, 1);
        a.sim().run(10);
        ByteArrayOutputStream saved = new ByteArrayOutputStream();
        a.sim().saveState(saved);
        a.sim().close();
        for (Run other : List.of(build(pol, Precision.DOUBLE, false, 1), build(Polarization.P, Precision.FLOAT, false, 1),
                build(pol, Precision.FLOAT, true, 1))) {
            try (Simulation s = other.sim()) {
                assertThrows(IOException.class, () -> s.restoreState(new ByteArrayInputStream(saved.toByteArray())));
            }
        }
    }
}
