package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.CrossTerms;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The p update with the smoothing's off-diagonal inverse permittivity against plain two-index loops of the Yee
 * equations with the whole tensor, E = ε⁻¹ D (Yee, IEEE TAP 14, 302 (1966); the tensor: A. Farjadpour et al., Opt.
 * Lett. 31, 2972 (2006)), the other in-plane component's curl averaged over its four sites round each site (common
 * practice), each pair of sites weighed by the mean of their two elements (symmetric): bit for bit in double on 1, 2
 * and 3 threads, to float rounding in float.
 */
class CrossCouplingTest {

    private static final int NX = 41;
    private static final int NY = 37;
    private static final double S = 0.55;
    private static final double DX = 30e-9;
    private static final int STEPS = 200;
    /** Float against double: rounding of about 1e-7 per operation grown over 200 steps (as NaiveReferenceTest). */
    private static final double FLOAT_TOLERANCE = 1e-4;

    @ParameterizedTest(name = "{0} thread(s)")
    @ValueSource(ints = {1, 2, 3})
    void matchesPlainLoopsWithTheWholeTensor(int threads) {
        Scene scene = Scene.builder(Material.VACUUM).add(Ellipse.disk(20.3 * DX, 17.6 * DX, 9.4 * DX),
                new Material("glass", 2.4, 0.0)).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, DX, NX, NY), Smoothing.ANISOTROPIC);
        assertTrue(!grid.crossTerms().isEmpty(), "a smoothed disk has cross terms");
        double[][] ref = plainP(grid, true);
        double[][] diagonal = plainP(grid, false);
        double scale = 0;
        double change = 0;
        for (int q = 0; q < 3; q++) {
            for (int k = 0; k < NX * NY; k++) {
                scale = Math.max(scale, Math.abs(ref[q][k]));
                change = Math.max(change, Math.abs(ref[q][k] - diagonal[q][k]));
            }
        }
        assertTrue(scale > 1e-3, "the reference field must not have vanished");
        // the cross terms matter well above float rounding, so the float comparison below could see them missing
        assertTrue(change > 100 * FLOAT_TOLERANCE * scale, "cross terms change the field by " + change / scale);
        for (Precision p : Precision.values()) {
            try (Simulation s = Simulation.builder(grid).polarization(Polarization.P).precision(p).courant(S)
                    .boundary(Side.LEFT, Boundary.pec()).boundary(Side.BOTTOM, Boundary.pec())
                    .boundary(Side.RIGHT, Boundary.pmc()).boundary(Side.TOP, Boundary.pmc())
                    .threads(threads).minCellsPerThread(1).build()) {
                initial((c, i, j, v) -> s.setField(c, i, j, v));
                s.run(STEPS);
                Component[] comps = Polarization.P.components();
                for (int q = 0; q < 3; q++) {
                    for (int j = 0; j < NY; j++) {
                        for (int i = 0; i < NX; i++) {
                            double want = ref[q][j * NX + i];
                            double got = s.field(comps[q], i, j);
                            String ctx = String.format("p %s, %d thread(s), grid %d×%d after %d steps: %s at (%d, %d)",
                                    p, threads, NX, NY, STEPS, comps[q], i, j);
                            assertEquals(want, got, p == Precision.DOUBLE ? 0.0 : FLOAT_TOLERANCE * scale, ctx);
                        }
                    }
                }
            }
        }
    }

    /** The weight of a pair of sites: S times the mean of their (ε⁻¹)_xy, over four (the four-point mean). */
    private static double w(double a, double b) {
        return S * ((a + b) * 0.125);
    }

    interface Setter {
        void set(Component c, int i, int j, double v);
    }

    /** A Gaussian of Ex off the disk's centre, inside the walls. */
    private static void initial(Setter set) {
        for (int j = 1; j < NY; j++) {
            for (int i = 0; i <= NX - 2; i++) {
                set.set(Component.EX, i, j, Math.exp(-((i - 15.0) * (i - 15.0) + (j - 13.0) * (j - 13.0)) / 10.0));
            }
        }
    }

    /**
     * p with PEC at i = 0 and j = 0 and PMC beyond the last nodes (as NaiveReferenceTest), lossless; with
     * {@code tensor} the cross terms after each E half-step. Returns {Hz, Ex, Ey} flattened j·NX + i.
     */
    private static double[][] plainP(MaterialGrid g, boolean tensor) {
        double[][] hz = new double[NX][NY];
        double[][] ex = new double[NX][NY];
        double[][] ey = new double[NX][NY];
        initial((c, i, j, v) -> ex[i][j] = v);
        CrossTerms t = g.crossTerms();
        for (int n = 0; n < STEPS; n++) {
            for (int i = 0; i < NX - 1; i++) {
                for (int j = 0; j < NY - 1; j++) {
                    hz[i][j] = hz[i][j] + S * ((ex[i][j + 1] - ex[i][j]) - (ey[i + 1][j] - ey[i][j]));
                }
            }
            for (int i = 0; i < NX - 1; i++) {
                for (int j = 1; j < NY; j++) {
                    double cb = S / g.material(FieldSite.EX, i, j).relativePermittivity();
                    ex[i][j] = 1.0 * ex[i][j] + cb * (hz[i][j] - hz[i][j - 1]);
                }
            }
            for (int i = 1; i < NX; i++) {
                for (int j = 0; j < NY - 1; j++) {
                    double cb = S / g.material(FieldSite.EY, i, j).relativePermittivity();
                    ey[i][j] = 1.0 * ey[i][j] - cb * (hz[i][j] - hz[i - 1][j]);
                }
            }
            if (!tensor) {
                continue;
            }
            double[][] dex = new double[NX][NY];
            double[][] dey = new double[NX][NY];
            for (int i = 1; i < NX - 1; i++) {
                for (int j = 1; j < NY - 1; j++) {
                    double bx = t.at(FieldSite.EX, i, j, NX);
                    // Ey's curl −∂Hz/∂x at (i, j), (i + 1, j), (i, j − 1), (i + 1, j − 1), each pair weighed S(b_i + b_j)/8
                    dex[i][j] = w(bx, t.at(FieldSite.EY, i, j, NX)) * (hz[i - 1][j] - hz[i][j])
                            + w(bx, t.at(FieldSite.EY, i + 1, j, NX)) * (hz[i][j] - hz[i + 1][j])
                            + w(bx, t.at(FieldSite.EY, i, j - 1, NX)) * (hz[i - 1][j - 1] - hz[i][j - 1])
                            + w(bx, t.at(FieldSite.EY, i + 1, j - 1, NX)) * (hz[i][j - 1] - hz[i + 1][j - 1]);
                    double by = t.at(FieldSite.EY, i, j, NX);
                    // Ex's curl ∂Hz/∂y at (i − 1, j), (i, j), (i − 1, j + 1), (i, j + 1)
                    dey[i][j] = w(by, t.at(FieldSite.EX, i - 1, j, NX)) * (hz[i - 1][j] - hz[i - 1][j - 1])
                            + w(by, t.at(FieldSite.EX, i, j, NX)) * (hz[i][j] - hz[i][j - 1])
                            + w(by, t.at(FieldSite.EX, i - 1, j + 1, NX)) * (hz[i - 1][j + 1] - hz[i - 1][j])
                            + w(by, t.at(FieldSite.EX, i, j + 1, NX)) * (hz[i][j + 1] - hz[i][j]);
                }
            }
            for (int i = 1; i < NX - 1; i++) {
                for (int j = 1; j < NY - 1; j++) {
                    ex[i][j] = ex[i][j] + dex[i][j];
                    ey[i][j] = ey[i][j] + dey[i][j];
                }
            }
        }
        double[][] out = new double[3][NX * NY];
        double[][][] all = {hz, ex, ey};
        for (int q = 0; q < 3; q++) {
            for (int j = 0; j < NY; j++) {
                for (int i = 0; i < NX; i++) {
                    out[q][j * NX + i] = all[q][i][j];
                }
            }
        }
        return out;
    }
}
