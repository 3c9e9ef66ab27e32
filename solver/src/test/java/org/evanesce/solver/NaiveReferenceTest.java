package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.boundary.PmlParameters;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The vectorised, row-fused, banded kernels against plain two-index loops of the Yee equations
 * (Yee, IEEE TAP 14, 302 (1966); Taflove &amp; Hagness ch. 3), written out one field at a time:
 * here with PEC walls on two sides and PMC walls (zero H half a cell outside) on the other two, and
 * in {@link PlainYee} with a CPML on all four sides (Roden &amp; Gedney 2000) or Bloch-periodic x
 * sides (Roden et al. 1998) with a CPML top and bottom. In double precision the operations are
 * the same, so the bits must agree; the float engine must agree to float rounding.
 */
class NaiveReferenceTest {

    private static final int NX = 45;
    private static final int NY = 29;
    private static final double S = 0.55;
    private static final double DX = 30e-9;
    private static final int STEPS = 250;
    /** Float against double: rounding of about 1e-7 per operation, grown over 250 steps. */
    private static final double FLOAT_TOLERANCE = 1e-4;

    /** With a lossy block the kernels stream ca; without one they take the lossless path (ca = 1). */
    @ParameterizedTest(name = "{0}, lossy block: {1}")
    @CsvSource({"S, true", "P, true", "S, false", "P, false"})
    void enginesMatchPlainLoopsOfTheYeeEquations(Polarization pol, boolean lossy) {
        MaterialGrid.Builder gb = MaterialGrid.builder(NX, NY, DX, Material.VACUUM)
                .paint(CellRegion.box(10.5, 5.5, 30.2, 20.7), new Material("glass", 2.4, 0.0));
        if (lossy) {
            gb.paint(CellRegion.box(25, 12, 40, 25), new Material("lossy", 1.7, 3e5));
        }
        MaterialGrid grid = gb.build();
        double dt = S * DX / PhysicalConstants.C0;
        double[][] ref = pol == Polarization.S ? naiveS(grid, dt) : naiveP(grid, dt);
        for (Precision p : Precision.values()) {
            try (Simulation s = Simulation.builder(grid).polarization(pol).precision(p).courant(S)
                    .boundary(Side.LEFT, Boundary.pec()).boundary(Side.BOTTOM, Boundary.pec())
                    .boundary(Side.RIGHT, Boundary.pmc()).boundary(Side.TOP, Boundary.pmc())
                    .threads(2).minCellsPerThread(1).build()) {
                Component[] comps = pol.components();
                initial(pol, (c, i, j, v) -> s.setField(c, i, j, v));
                s.run(STEPS);
                double scale = 0;
                for (double[] a : ref) {
                    for (double v : a) {
                        scale = Math.max(scale, Math.abs(v));
                    }
                }
                assertTrue(scale > 1e-3, "the reference field must not have vanished");
                for (int q = 0; q < 3; q++) {
                    for (int j = 0; j < NY; j++) {
                        for (int i = 0; i < NX; i++) {
                            double want = ref[q][j * NX + i];
                            double got = s.field(comps[q], i, j);
                            Component cq = comps[q];
                            int ci = i;
                            int cj = j;
                            java.util.function.Supplier<String> ctx = () -> String.format(
                                    "%s %s grid %d×%d after %d steps: %s at (%d, %d)", pol, p, NX, NY, STEPS, cq, ci, cj);
                            if (p == Precision.DOUBLE) {
                                assertEquals(want, got, 0.0, ctx);
                            } else {
                                assertEquals(want, got, FLOAT_TOLERANCE * scale, ctx);
                            }
                        }
                    }
                }
            }
        }
    }

    /** PML layers left, right, bottom, top: both x strips wider than a vector and padded; y strips odd. */
    private static final int[] PML = {17, 6, 5, 9};
    private static final int PML_NX = 61;
    private static final int PML_NY = 47;
    private static final int BLOCH_NX = 43;
    private static final int BLOCH_NY = 51;
    /**
     * Steps of the PML and Bloch runs: the pulse reaches every layer and crosses the seam, and most
     * of it is absorbed (the largest field left is 0.01–0.12 of the initial peak).
     */
    private static final int PML_STEPS = 120;
    /**
     * Float against the double plain loops, relative to the largest field left: measured 3.4e-6
     * (s, PML), 4.3e-6 (p, PML), 1.7e-6 (s, Bloch), 1.6e-6 (p, Bloch); set about 10× above.
     */
    private static final double PML_FLOAT_TOLERANCE = 4e-5;

    /**
     * The CPML paths (x strips padded to whole vectors and y strips, corners where both act, a
     * lossy block and a dielectric reaching into the layers) and the Bloch seam (complex fields,
     * PML top and bottom) against {@link PlainYee}: bit for bit in double, to float rounding in float.
     */
    @ParameterizedTest(name = "{0}, {1}")
    @CsvSource({"S, PML", "P, PML", "S, BLOCH", "P, BLOCH"})
    void pmlAndBlochPathsMatchPlainLoops(Polarization pol, String sides) {
        boolean bloch = sides.equals("BLOCH");
        int nx = bloch ? BLOCH_NX : PML_NX;
        int ny = bloch ? BLOCH_NY : PML_NY;
        MaterialGrid grid = MaterialGrid.builder(nx, ny, DX, Material.VACUUM)
                .paint(CellRegion.below(13.4), new Material("glass", 2.1, 0.0))
                .paint(CellRegion.box(-3, 30, 14, 60), new Material("lossy", 1.8, 2e5))
                .build();
        double dt = Courant.timeStep(S, DX);
        // a phase of 2.3 rad across the period
        double kx = bloch ? 2.3 / (nx * DX) : Double.NaN;
        // the grading Boundary.pml(layers) uses (its layer count is PlainYee's to apply)
        PmlParameters grading = PmlParameters.defaults(1);
        PlainYee ref = new PlainYee(grid, pol, S, dt, PML, grading, kx);
        // Ez or Hz: a pulse of the z component leaves no static charge behind, so the field decays into the layers
        Component start = pol.components()[0];
        double ci = bloch ? 2 : nx / 2.0;
        double cj = ny / 2.0;
        for (int i = 1; i < nx - 1; i++) {
            for (int j = 1; j < ny - 1; j++) {
                ref.f[0][0][i][j] = pulse(i, j, ci, cj);
            }
        }
        ref.run(PML_STEPS);
        double scale = 0;
        for (double[][][] part : ref.f) {
            for (double[][] c : part) {
                for (double[] col : c) {
                    for (double v : col) {
                        scale = Math.max(scale, Math.abs(v));
                    }
                }
            }
        }
        assertTrue(scale > 1e-3, "the reference field must not have vanished: " + scale);
        for (Precision p : Precision.values()) {
            Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(p).courant(S)
                    .boundary(Side.BOTTOM, Boundary.pml(PML[2])).boundary(Side.TOP, Boundary.pml(PML[3]))
                    .threads(2).minCellsPerThread(1);
            if (bloch) {
                b.boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx));
            } else {
                b.boundary(Side.LEFT, Boundary.pml(PML[0])).boundary(Side.RIGHT, Boundary.pml(PML[1]));
            }
            try (Simulation sim = b.build()) {
                for (int i = 1; i < nx - 1; i++) {
                    for (int j = 1; j < ny - 1; j++) {
                        sim.setField(start, i, j, pulse(i, j, ci, cj));
                    }
                }
                sim.run(PML_STEPS);
                for (int part = 0; part < ref.f.length; part++) {
                    for (Component c : pol.components()) {
                        for (int j = 0; j < ny; j++) {
                            for (int i = 0; i < nx; i++) {
                                double want = ref.get(part, c, i, j);
                                double got = part == 0 ? sim.field(c, i, j) : sim.fieldImag(c, i, j);
                                int fi = i;
                                int fj = j;
                                String what = part == 0 ? "" : "imaginary part of ";
                                java.util.function.Supplier<String> ctx = () -> String.format(
                                        "%s %s, %s sides, grid %d×%d after %d steps: %s%s at (%d, %d)", pol, p, sides, nx, ny,
                                        PML_STEPS, what, c, fi, fj);
                                assertEquals(want, got, p == Precision.DOUBLE ? 0.0 : PML_FLOAT_TOLERANCE * scale, ctx);
                            }
                        }
                    }
                }
            }
        }
    }

    private static double pulse(int i, int j, double ci, double cj) {
        return Math.exp(-((i - ci) * (i - ci) + (j - cj) * (j - cj)) / 10.0);
    }

    interface Setter {
        void set(Component c, int i, int j, double v);
    }

    private static void initial(Polarization pol, Setter set) {
        Component c = pol.components()[pol == Polarization.S ? 0 : 1];
        for (int j = 0; j < NY; j++) {
            for (int i = 0; i < NX; i++) {
                boolean inside = pol == Polarization.S ? i >= 1 && j >= 1 : i <= NX - 2 && j >= 1;
                if (inside) {
                    set.set(c, i, j, Math.exp(-((i - 17.0) * (i - 17.0) + (j - 13.0) * (j - 13.0)) / 10.0));
                }
            }
        }
    }

    private static double[][] coefficients(MaterialGrid g, FieldSite site, double dt) {
        double[][] c = new double[2][NX * NY];
        for (int j = 0; j < NY; j++) {
            for (int i = 0; i < NX; i++) {
                Material m = g.material(site, i, j);
                double l = m.conductivity() * dt / (2 * PhysicalConstants.EPS0 * m.relativePermittivity());
                c[0][j * NX + i] = (1 - l) / (1 + l);
                c[1][j * NX + i] = S / (m.relativePermittivity() * (1 + l));
            }
        }
        return c;
    }

    /** s: Ez on nodes; PEC at i = 0 and j = 0; PMC beyond i = NX − 1 and j = NY − 1. */
    private static double[][] naiveS(MaterialGrid g, double dt) {
        double[][] ez = new double[NX][NY];
        double[][] hx = new double[NX][NY];
        double[][] hy = new double[NX][NY];
        double[][] c = coefficients(g, FieldSite.EZ, dt);
        initial(Polarization.S, (comp, i, j, v) -> ez[i][j] = v);
        for (int n = 0; n < STEPS; n++) {
            for (int i = 0; i < NX; i++) {
                for (int j = 0; j < NY - 1; j++) {
                    hx[i][j] = hx[i][j] - S * (ez[i][j + 1] - ez[i][j]);
                }
            }
            for (int i = 0; i < NX - 1; i++) {
                for (int j = 0; j < NY; j++) {
                    hy[i][j] = hy[i][j] + S * (ez[i + 1][j] - ez[i][j]);
                }
            }
            for (int i = 1; i < NX; i++) {
                for (int j = 1; j < NY; j++) {
                    int k = j * NX + i;
                    ez[i][j] = c[0][k] * ez[i][j] + c[1][k] * ((hy[i][j] - hy[i - 1][j]) - (hx[i][j] - hx[i][j - 1]));
                }
            }
        }
        return flatten(ez, hx, hy);
    }

    /** p: Hz at cell centres; PEC at i = 0 and j = 0; PMC beyond the last nodes. */
    private static double[][] naiveP(MaterialGrid g, double dt) {
        double[][] hz = new double[NX][NY];
        double[][] ex = new double[NX][NY];
        double[][] ey = new double[NX][NY];
        double[][] cx = coefficients(g, FieldSite.EX, dt);
        double[][] cy = coefficients(g, FieldSite.EY, dt);
        initial(Polarization.P, (comp, i, j, v) -> ex[i][j] = v);
        for (int n = 0; n < STEPS; n++) {
            for (int i = 0; i < NX - 1; i++) {
                for (int j = 0; j < NY - 1; j++) {
                    hz[i][j] = hz[i][j] + S * ((ex[i][j + 1] - ex[i][j]) - (ey[i + 1][j] - ey[i][j]));
                }
            }
            for (int i = 0; i < NX - 1; i++) {
                for (int j = 1; j < NY; j++) {
                    int k = j * NX + i;
                    ex[i][j] = cx[0][k] * ex[i][j] + cx[1][k] * (hz[i][j] - hz[i][j - 1]);
                }
            }
            for (int i = 1; i < NX; i++) {
                for (int j = 0; j < NY - 1; j++) {
                    int k = j * NX + i;
                    ey[i][j] = cy[0][k] * ey[i][j] - cy[1][k] * (hz[i][j] - hz[i - 1][j]);
                }
            }
        }
        return flatten(hz, ex, ey);
    }

    private static double[][] flatten(double[][] a, double[][] b, double[][] c) {
        double[][] out = new double[3][NX * NY];
        double[][][] all = {a, b, c};
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
