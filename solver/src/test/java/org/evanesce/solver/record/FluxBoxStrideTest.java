package org.evanesce.solver.record;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Flux boxes that read every N-th step ({@link FluxBox#stride}, as {@link FluxLineStrideTest} for lines): a point
 * source's pulse in vacuum, one box round the source and one beside it. With the planner's stride (io.plan.MapStride:
 * 1/(NΔt) ≥ 2 (f_max + f0 + 6σf)) the power out of the first box is that of every step, and the net flux out of the
 * second, lossless and source-free, stays zero against the first (Poynting's theorem: M. Born and E. Wolf,
 * Principles of Optics, 7th ed., 1999, sec. 1.1.4); a stride that folds the pulse's negative frequencies onto the
 * measured ones (1/(NΔt) = 2f) does not give the every-step power (C. E. Shannon, "Communication in the presence of
 * noise", Proc. IRE 37, 10–21, 1949, Theorem 1).
 */
class FluxBoxStrideTest {

    private static final double WAVELENGTH = 633e-9;
    private static final double COURANT = 0.5;
    private static final int PML = 16;
    private static final int N = 2 * PML + 70;
    /**
     * Power out of the source's box, stride against every step, relative: measured at most 6.1e-9 (s) and 3.3e-8 (p)
     * over three frequencies (stride 6), so 3e-7 (10×).
     */
    private static final double SAME = 3e-7;
    /** The folding stride changes the source box's power by at least this, relative (measured 0.50 (s), 0.54 (p)). */
    private static final double ALIASED = 1e-2;
    /**
     * Net flux out of the source-free box over the power out of the source's box: the grid's own energy balance
     * (exact for the discrete fields over a whole run) less the transform's truncation at the run's end; measured
     * at most 6.7e-9 (s) and 7.7e-9 (p) every step and with the stride, so 8e-8 (10×).
     */
    private static final double BALANCE = 8e-8;

    @ParameterizedTest(name = "{0}")
    @EnumSource(Polarization.class)
    void thePlannersStrideGivesTheEveryStepPower(Polarization pol) {
        double dx = WAVELENGTH / 20;
        double f = PhysicalConstants.C0 / WAVELENGTH;
        double dt = COURANT * dx / PhysicalConstants.C0;
        double[] freqs = {0.9 * f, f, 1.1 * f};
        double top = f + 6 * f / 5;
        int within = (int) Math.floor(1 / (2 * dt * (1.1 * f + top)));
        int folding = (int) Math.round(1 / (2 * f * dt));
        assertTrue(within > 1 && folding > within, "strides " + within + " and " + folding);
        int[] strides = {1, within, folding};
        FluxBox[][] boxes = run(pol, strides, freqs, 2);
        double worst = 0;
        double aliased = Double.MAX_VALUE;
        double balance = 0;
        for (int q = 0; q < freqs.length; q++) {
            double every = boxes[0][0].outward(q, dx);
            worst = Math.max(worst, Math.abs(boxes[1][0].outward(q, dx) / every - 1));
            aliased = Math.min(aliased, Math.abs(boxes[2][0].outward(q, dx) / every - 1));
            for (int k = 0; k < 2; k++) {
                balance = Math.max(balance, Math.abs(boxes[k][1].outward(q, dx) / boxes[k][0].outward(q, dx)));
            }
        }
        String ctx = String.format("%s: stride %d differs from every step by %.2e, stride %d by %.2e; source-free box %.2e",
                pol, within, worst, folding, aliased, balance);
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.println(ctx);
        }
        assertTrue(worst < SAME, ctx);
        assertTrue(aliased > ALIASED, ctx);
        assertTrue(balance < BALANCE, ctx);
        // the strided boxes are shared over the threads like the others: the same bits with one
        FluxBox[][] alone = run(pol, strides, freqs, 1);
        for (int q = 0; q < freqs.length; q++) {
            for (int k = 0; k < 4; k++) {
                assertArrayEquals(boxes[1][0].sides()[k].fluxDensity(q), alone[1][0].sides()[k].fluxDensity(q), 0.0,
                        ctx + ", 1 thread, side " + k);
            }
        }
    }

    /** Per stride: the box round the source, the box beside it. */
    private static FluxBox[][] run(Polarization pol, int[] strides, double[] freqs, int threads) {
        double dx = WAVELENGTH / 20;
        double f = PhysicalConstants.C0 / WAVELENGTH;
        int c = PML + 20;
        Simulation.Builder b = Simulation.builder(MaterialGrid.builder(N, N, dx, Material.VACUUM).build())
                .polarization(pol).courant(COURANT).boundaries(Boundary.pml(PML)).threads(threads)
                .source(Source.point(pol.components()[0], N, c, c, 1.0, TimeSignal.gaussianPulse(f, f / 5)));
        FluxBox[][] boxes = new FluxBox[strides.length][];
        for (int k = 0; k < strides.length; k++) {
            boxes[k] = new FluxBox[] {new FluxBox(pol, c - 8, c - 8, c + 8, c + 8, freqs).stride(strides[k]),
                new FluxBox(pol, c + 14, c - 10, c + 40, c + 30, freqs).stride(strides[k])};
            b.listener(boxes[k][0]).listener(boxes[k][1]);
        }
        double dt = COURANT * dx / PhysicalConstants.C0;
        try (Simulation s = b.build()) {
            // the pulse lasts 12τ, τ = 1/(2π f/5); then several crossings of the grid
            s.run((long) (12 * 5 / (2 * Math.PI) / (f * dt)) + 6L * N);
        }
        return boxes;
    }
}
