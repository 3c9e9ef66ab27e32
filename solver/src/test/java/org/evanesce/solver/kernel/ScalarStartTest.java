package org.evanesce.solver.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumMap;
import java.util.Map;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.MaterialCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * An engine runs its kernels' scalar parts alone while a run is young and the vector parts after
 * {@link Engine#VECTOR_AFTER} cell updates. The two parts use the same operations in the same
 * order, so a run must give the same bits whether it is all vector, all scalar or switches midway:
 * here with CPML on three sides (PMC, PEC or CPML on the fourth), a dielectric and a lossy block
 * reaching into the layers, sources of both kinds, the periodic flush, and Bloch-periodic sides
 * (both parts of the complex pair must switch together).
 */
class ScalarStartTest {

    private static final int NX = 53;
    private static final int NY = 41;
    private static final int STEPS = 160;
    private static final int FLUSH_EVERY = 16;

    @ParameterizedTest(name = "{0} {1} {2}")
    @CsvSource({"S, FLOAT, PMC", "P, FLOAT, PML", "S, DOUBLE, PEC", "P, DOUBLE, PML",
        "S, FLOAT, BLOCH", "P, FLOAT, BLOCH", "S, DOUBLE, BLOCH", "P, DOUBLE, BLOCH"})
    void scalarVectorAndMidwaySwitchGiveTheSameBits(Polarization pol, Precision precision, String sides) {
        double[][] vector = run(pol, precision, sides, 0);
        long midway = (long) NX * NY * (STEPS / 3);
        for (long after : new long[] {Long.MAX_VALUE, midway}) {
            double[][] other = run(pol, precision, sides, after);
            for (int q = 0; q < vector.length; q++) {
                for (int k = 0; k < NX * NY; k++) {
                    int c = q;
                    int cell = k;
                    assertEquals(Double.doubleToRawLongBits(vector[q][k]), Double.doubleToRawLongBits(other[q][k]),
                            () -> String.format("%s %s %s, vectors after %d cell updates: %s differs at (%d, %d)", pol,
                                    precision, sides, after, pol.components()[c % 3], cell % NX, cell / NX));
                }
            }
        }
    }

    /** The staggered energy summed cell by cell in double (the sum before lanes); NaN for a Bloch pair. */
    private static double plainEnergy(Engine e, Polarization pol, int[] r) {
        double w = 0;
        for (int j = r[1]; j < r[3]; j++) {
            for (int i = r[0]; i < r[2]; i++) {
                if (e instanceof FloatS f) {
                    w += f.cellEnergy(i, j);
                } else if (e instanceof FloatP f) {
                    w += f.cellEnergy(i, j);
                } else if (e instanceof DoubleS d) {
                    w += d.cellEnergy(i, j);
                } else if (e instanceof DoubleP d) {
                    w += d.cellEnergy(i, j);
                } else {
                    return Double.NaN;
                }
            }
        }
        return w;
    }

    private static double[][] run(Polarization pol, Precision precision, String kind, long vectorAfter) {
        MaterialGrid grid = MaterialGrid.builder(NX, NY, 40e-9, Material.VACUUM)
                .paint(CellRegion.below(15.5), Material.ofIndex("glass", 1.5))
                .paint(CellRegion.box(30, 20, 60, 45), new Material("lossy", 2.0, 4e5))
                .build();
        boolean bloch = kind.equals("BLOCH");
        Map<Side, Boundary> sides = new EnumMap<>(Side.class);
        sides.put(Side.LEFT, bloch ? Boundary.bloch(4e6) : Boundary.pml(5));
        sides.put(Side.RIGHT, bloch ? Boundary.bloch(4e6) : Boundary.pml(12));
        sides.put(Side.BOTTOM, Boundary.pml(7));
        sides.put(Side.TOP, switch (kind) {
            case "PMC" -> Boundary.pmc();
            case "PEC" -> Boundary.pec();
            default -> Boundary.pml(9);
        });
        double courant = 0.6;
        double[][] coefficients = MaterialCoefficients.of(grid.materials(), courant, Courant.timeStep(courant, 40e-9));
        Engine e = Engine.create(grid, pol, precision, courant, coefficients[0], coefficients[1], null, sides);
        e.vectorAfter(vectorAfter);
        Component[] comps = pol.components();
        e.setSources(new int[] {20 * NX + 9, 6 * NX + 26}, new Component[] {comps[pol == Polarization.S ? 0 : 1],
            comps[pol == Polarization.S ? 1 : 0]});
        double largest = 0;
        for (int n = 0; n < STEPS; n++) {
            double v = Math.sin(0.3 * n) * Math.exp(-Math.pow((n - 40) / 15.0, 2));
            if (bloch) {
                e.sourceValue(0, v, 0.3 * v);
                e.sourceValue(1, 0.5 * v, -0.2 * v);
            } else {
                e.sourceValue(0, v);
                e.sourceValue(1, 0.5 * v);
            }
            boolean flush = n % FLUSH_EVERY == 0;
            // two bands, as two threads would sweep them
            e.sweep(0, NY / 2, 0, flush);
            e.sweep(NY / 2, NY, 0, flush);
            largest = Math.max(largest, e.sweep(0, NY / 2, 1, flush));
            largest = Math.max(largest, e.sweep(NY / 2, NY, 1, flush));
        }
        assertTrue(largest > 1e-3, "the fields must not have vanished: " + largest);
        // the energy's lanes: the vector and the scalar part give the same bits, over the whole grid and a part
        // of it whose width is no whole number of vectors; and it is the plain double sum to rounding
        for (int[] r : new int[][] {{0, 0, NX, NY}, {3, 2, NX - 4, NY - 1}}) {
            e.useVectors();
            double vector = e.energy(r[0], r[1], r[2], r[3]);
            e.useScalars();
            double scalar = e.energy(r[0], r[1], r[2], r[3]);
            e.useVectors();
            assertEquals(Double.doubleToRawLongBits(vector), Double.doubleToRawLongBits(scalar),
                    () -> String.format("%s %s %s: energy %s vector, %s scalar", pol, precision, kind, vector, scalar));
            double plain = plainEnergy(e, pol, r);
            if (Double.isNaN(plain)) {
                continue; // a Bloch pair: its parts' sums are checked as the plain engines'
            }
            assertEquals(plain, vector, (precision == Precision.FLOAT ? 1e-6 : 1e-13) * Math.abs(plain),
                    () -> String.format("%s %s %s: energy against the plain double sum", pol, precision, kind));
        }
        int parts = e.isComplex() ? 2 : 1;
        double[][] out = new double[3 * parts][NX * NY];
        for (int q = 0; q < 3; q++) {
            for (int k = 0; k < NX * NY; k++) {
                out[q][k] = e.get(comps[q], k);
                if (parts == 2) {
                    out[q + 3][k] = e.getImag(comps[q], k);
                }
            }
        }
        return out;
    }
}
