package org.evanesce.solver.record;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.api.Test;

/**
 * Frames are taken exactly at the asked steps, once each, and hold the fields averaged onto the
 * nodes: checked against the same fields read independently at the same step and averaged here.
 */
class SnapshotsTest {

    @Test
    void framesAtTheAskedStepsWithNodeAveragedFields() {
        int nx = 40;
        int ny = 30;
        double dx = 20e-9;
        MaterialGrid grid = Rasterizer.rasterize(Scene.builder(Material.ofIndex("g", 1.3)).build(),
                new GridSpec(0, 0, dx, nx, ny), Smoothing.ANISOTROPIC);
        Component[] comps = Polarization.P.components();
        List<Long> taken = new ArrayList<>();
        List<double[][]> frames = new ArrayList<>();
        Snapshots snaps = new Snapshots(comps, 5, 4, 25, 20, new long[] {35, 10, 20, 20, 999}, false,
                (step, times, re, im) -> {
                    taken.add(step);
                    frames.add(re);
                });
        List<double[][]> direct = new ArrayList<>();
        StepListener reader = v -> {
            if (v.stepCount() == 10 || v.stepCount() == 20 || v.stepCount() == 35) {
                double[][] d = new double[comps.length][];
                for (int c = 0; c < comps.length; c++) {
                    double[] a = new double[20 * 16];
                    for (int j = 0; j < 16; j++) {
                        for (int i = 0; i < 20; i++) {
                            // the node value: mean of the sites either side along each half-offset axis
                            Component k = comps[c];
                            int il = k.dx != 0 && i > 0 ? i - 1 : i;
                            int jl = k.dy != 0 && j > 0 ? j - 1 : j;
                            a[j * 20 + i] = (v.field(k, 5 + i, 4 + j) + v.field(k, 5 + il, 4 + j) + v.field(k, 5 + i, 4 + jl)
                                    + v.field(k, 5 + il, 4 + jl)) / 4;
                        }
                    }
                    d[c] = a;
                }
                direct.add(d);
            }
        };
        try (Simulation s = Simulation.builder(grid).polarization(Polarization.P).boundaries(Boundary.pml(6)).threads(1)
                .source(Source.point(Component.HZ, nx, 15, 12, 1, TimeSignal.gaussianPulse(3e14, 1e14)))
                .listener(snaps).listener(reader).build()) {
            s.run(40);
        }
        assertEquals(List.of(10L, 20L, 35L), taken);
        for (int f = 0; f < 3; f++) {
            for (int c = 0; c < comps.length; c++) {
                assertArrayEquals(direct.get(f)[c], frames.get(f)[c], 0.0, "frame " + f + " " + comps[c]);
            }
        }
    }
}
