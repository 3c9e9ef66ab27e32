package org.evanesce.solver.source;

import java.util.Map;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.StepListener;
import org.evanesce.solver.record.StepView;

/** Shared set-up of the total-field box tests: a run with a box, and what leaks out of it. */
final class BoxRuns {

    static final int PML = 12;

    private BoxRuns() {
    }

    /** PML on every side. */
    static Map<Side, Boundary> sides() {
        return Map.of(Side.LEFT, Boundary.pml(PML), Side.RIGHT, Boundary.pml(PML), Side.BOTTOM, Boundary.pml(PML), Side.TOP,
                Boundary.pml(PML));
    }

    static Simulation.Builder builder(MaterialGrid grid, Polarization pol, Precision precision, TotalFieldBox box, int threads) {
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(precision).threads(threads)
                .minCellsPerThread(64).totalField(box);
        sides().forEach(b::boundary);
        return b;
    }

    static Component z(Polarization pol) {
        return pol == Polarization.S ? Component.EZ : Component.HZ;
    }

    /**
     * Records, for the z component at every node of a region, the running DFT at one frequency over steps
     * [from, to) and the largest magnitude over the whole run.
     */
    static final class Watch implements StepListener {
        final Component c;
        final int i0, j0, i1, j1;
        final double f;
        final long from, to;
        final double[] re, im;
        final double[] peak;
        private final double[] row;

        Watch(Component c, int i0, int j0, int i1, int j1, double f, long from, long to) {
            this.c = c;
            this.i0 = i0;
            this.j0 = j0;
            this.i1 = i1;
            this.j1 = j1;
            this.f = f;
            this.from = from;
            this.to = to;
            int n = (i1 - i0 + 1) * (j1 - j0 + 1);
            re = new double[n];
            im = new double[n];
            peak = new double[n];
            row = new double[i1 - i0 + 1];
        }

        @Override
        public void afterStep(StepView v) {
            long n = v.stepCount();
            double t = (n + (c.electric ? 0 : -0.5)) * v.dt();
            boolean dft = n >= from && n < to;
            double cs = Math.cos(2 * Math.PI * f * t);
            double sn = Math.sin(2 * Math.PI * f * t);
            int k = 0;
            for (int j = j0; j <= j1; j++) {
                v.readRow(c, j, i0, i1 + 1, row, null);
                for (int i = i0; i <= i1; i++, k++) {
                    double u = row[i - i0];
                    peak[k] = Math.max(peak[k], Math.abs(u));
                    if (dft) {
                        // exp(+iωt) picks the exp(−iωt) phasor
                        re[k] += u * cs;
                        im[k] += u * sn;
                    }
                }
            }
        }

        /** The phasor at node (i, j): 2/N Σ u e^{iωt}. */
        Complex phasor(int i, int j) {
            int k = (j - j0) * (i1 - i0 + 1) + (i - i0);
            double s = 2.0 / (to - from);
            return Complex.of(re[k] * s, im[k] * s);
        }

        double peak(int i, int j) {
            return peak[(j - j0) * (i1 - i0 + 1) + (i - i0)];
        }
    }
}
