package org.evanesce.solver.kernel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The dispersive post-pass of a block of rows at once ({@link FloatAde#rows}, {@link DoubleAde#rows}: runs that
 * continue from one row to the next joined into one) is, cell by cell, the reference it ports:
 * {@link AdeCoefficients#postPass} (E¹ = E_ord − correction, then the Drude and Lorentz currents advance), bit for
 * bit in double precision (the Double kernels are generated from the Float ones, so a dropped or reordered term
 * fails here); and in single precision the same bits as the row-by-row pass {@link FloatAde#row}. Random fields and
 * state, Rakić's gold (1 Drude + 5 Lorentz terms), a Drude-only and a Lorentz-only material, films across the whole
 * width (joined runs), blocks inside rows, narrow and wide grids (runs shorter and longer than a vector),
 * Bloch-periodic sides (a film's rows continue one another) and PEC sides (they do not), every electric site.
 */
class BlockPostPassTest {

    private static final int NY = 24;
    private static final double DX = 5e-9;
    private static final double COURANT = 0.6;
    /** Blocks of rows as an engine's sweep may pass them: one row, a few, a film's middle, up to the end. */
    private static final int[] BLOCK_ENDS = {1, 4, 5, 9, 12, 17, NY};

    @ParameterizedTest(name = "nx {0}, {1}, sides {2}")
    @CsvSource({"4, EZ, BLOCH", "4, EX, BLOCH", "4, EY, BLOCH", "5, EY, PEC", "13, EZ, BLOCH", "13, EX, PEC",
        "40, EY, BLOCH", "40, EZ, PEC", "3, EX, PEC"})
    void doubleBlocksAreTheReferenceCellByCell(int nx, Component c, String sides) throws IOException {
        Setup s = new Setup(nx, c, sides);
        Random rnd = new Random(31L * nx + c.ordinal());
        double[] field = new double[nx * NY];
        for (int k = 0; k < field.length; k++) {
            field[k] = rnd.nextGaussian();
        }
        DoubleAde ade = DoubleAde.of(s.grid, c, field, s.ade, s.sides, false);
        List<double[][]> state = randomState(s, rnd);
        ade.readState(new DataInputStream(new ByteArrayInputStream(bytes(state, true))));
        // the reference: each cell's state as AdeCoefficients lays it out, the post-pass on E_ord = field
        double[] want = field.clone();
        List<double[][]> wantState = new ArrayList<>();
        for (int g = 0; g < s.groups.size(); g++) {
            int[] cells = s.groups.get(g);
            AdeCoefficients co = s.ade[s.materialOf.get(g)];
            double[][] arrays = state.get(g);
            double[][] after = new double[arrays.length][cells.length];
            double[] cell = new double[arrays.length];
            for (int t = 0; t < cells.length; t++) {
                for (int v = 0; v < arrays.length; v++) {
                    cell[v] = arrays[v][t];
                }
                want[cells[t]] = AdeCoefficients.postPass(co, cell, 0, field[cells[t]]);
                for (int v = 0; v < arrays.length; v++) {
                    after[v][t] = cell[v];
                }
            }
            wantState.add(after);
        }
        int a = 0;
        for (int b : BLOCK_ENDS) {
            ade.rows(a, b);
            a = b;
        }
        for (int k = 0; k < field.length; k++) {
            assertEquals(Double.doubleToRawLongBits(want[k]), Double.doubleToRawLongBits(field[k]),
                    "field at cell " + k + " (" + k % nx + ", " + k / nx + ")");
        }
        ByteArrayOutputStream got = new ByteArrayOutputStream();
        ade.writeState(new DataOutputStream(got));
        assertArrayEquals(bytes(wantState, true), got.toByteArray(), "state after the post-pass");
    }

    @ParameterizedTest(name = "nx {0}, {1}, sides {2}")
    @CsvSource({"4, EZ, BLOCH", "4, EX, BLOCH", "4, EY, PEC", "5, EY, BLOCH", "13, EX, BLOCH", "40, EZ, BLOCH",
        "40, EY, PEC", "67, EX, BLOCH"})
    void floatBlocksAreTheRowByRowPass(int nx, Component c, String sides) throws IOException {
        Setup s = new Setup(nx, c, sides);
        Random rnd = new Random(17L * nx + c.ordinal());
        float[] byRow = new float[nx * NY];
        for (int k = 0; k < byRow.length; k++) {
            byRow[k] = (float) rnd.nextGaussian();
        }
        float[] byBlock = byRow.clone();
        FloatAde rows = FloatAde.of(s.grid, c, byRow, s.ade, s.sides, false);
        FloatAde blocks = FloatAde.of(s.grid, c, byBlock, s.ade, s.sides, false);
        byte[] state = bytes(randomState(s, rnd), false);
        rows.readState(new DataInputStream(new ByteArrayInputStream(state)));
        blocks.readState(new DataInputStream(new ByteArrayInputStream(state)));
        float[] before = byRow.clone();
        // three steps, so the advanced currents are used again
        for (int step = 0; step < 3; step++) {
            for (int j = 0; j < NY; j++) {
                rows.row(j);
            }
            int a = 0;
            for (int b : BLOCK_ENDS) {
                blocks.rows(a, b);
                a = b;
            }
        }
        int changed = 0;
        for (int k = 0; k < byRow.length; k++) {
            assertEquals(Float.floatToRawIntBits(byRow[k]), Float.floatToRawIntBits(byBlock[k]),
                    "field at cell " + k + " (" + k % nx + ", " + k / nx + ")");
            changed += byRow[k] != before[k] ? 1 : 0;
        }
        assertTrue(changed > 0, "the post-pass must change the dispersive cells");
        ByteArrayOutputStream a = new ByteArrayOutputStream();
        ByteArrayOutputStream b = new ByteArrayOutputStream();
        rows.writeState(new DataOutputStream(a));
        blocks.writeState(new DataOutputStream(b));
        assertArrayEquals(a.toByteArray(), b.toByteArray(), "state after the post-pass");
    }

    /** Random state per group: E⁰ near the field's size, currents smaller (their size in a run). */
    private static List<double[][]> randomState(Setup s, Random rnd) {
        List<double[][]> out = new ArrayList<>();
        for (int g = 0; g < s.groups.size(); g++) {
            int n = s.groups.get(g).length;
            double[][] arrays = new double[s.ade[s.materialOf.get(g)].stateSize()][n];
            for (int v = 0; v < arrays.length; v++) {
                for (int t = 0; t < n; t++) {
                    arrays[v][t] = (v == 0 ? 1 : 0.1) * rnd.nextGaussian();
                }
            }
            out.add(arrays);
        }
        return out;
    }

    /** The checkpoint form of {@link FloatAde#writeState} / {@link DoubleAde#writeState} for these arrays. */
    private static byte[] bytes(List<double[][]> state, boolean doubles) throws IOException {
        ByteArrayOutputStream b = new ByteArrayOutputStream();
        DataOutputStream out = new DataOutputStream(b);
        out.writeInt(state.size());
        for (double[][] arrays : state) {
            out.writeInt(arrays[0].length);
            out.writeInt(arrays.length);
            for (double[] a : arrays) {
                if (doubles) {
                    StateIO.write(out, a);
                } else {
                    float[] f = new float[a.length];
                    for (int t = 0; t < a.length; t++) {
                        f[t] = (float) a[t];
                    }
                    StateIO.write(out, f);
                }
            }
        }
        out.flush();
        return b.toByteArray();
    }

    /** The grid, its materials with poles, and each group's cells as FloatAde.of finds them (material order, rows). */
    private static final class Setup {
        final MaterialGrid grid;
        final AdeCoefficients[] ade;
        final Map<Side, Boundary> sides = new EnumMap<>(Side.class);
        final List<int[]> groups = new ArrayList<>();
        final List<Integer> materialOf = new ArrayList<>();

        Setup(int nx, Component c, String kind) {
            DispersiveMaterial gold = MetalLibrary.get("gold").material();
            DispersiveMaterial drude = new DispersiveMaterial("drude part", 1, 0, gold.drude(), List.of());
            DispersiveMaterial lorentz = new DispersiveMaterial("lorentz part", 2, 0, List.of(), gold.lorentz());
            DispersiveMaterial[] metals = {gold, drude, lorentz};
            Material[] entries = new Material[metals.length];
            for (int m = 0; m < metals.length; m++) {
                entries[m] = new Material(metals[m].name(), metals[m].epsInfinity(), 0);
            }
            MaterialGrid.Builder b = MaterialGrid.builder(nx, NY, DX, Material.ofIndex("glass", 1.5));
            for (FieldSite site : FieldSite.values()) {
                for (int j = 0; j < NY; j++) {
                    for (int i = 0; i < nx; i++) {
                        double y = j + site.dy;
                        double x = i + site.dx;
                        if (y >= 3 && y < 11) {
                            b.set(site, i, j, entries[0]); // a film across the width, 8 rows (a block ends inside it)
                        } else if (y >= 12 && y < 15 && x > 1 && x < nx - 1.5) {
                            b.set(site, i, j, entries[0]); // cells inside rows
                        } else if (y >= 15 && y < 18) {
                            b.set(site, i, j, entries[1]);
                        } else if (y >= 19 && y < 21 && x < 0.6 * nx) {
                            b.set(site, i, j, entries[2]);
                        }
                    }
                }
            }
            grid = b.build();
            double dt = COURANT * DX / PhysicalConstants.C0 / Math.sqrt(2);
            ade = new AdeCoefficients[grid.materials().size()];
            for (int m = 0; m < metals.length; m++) {
                ade[grid.materials().indexOf(entries[m])] = AdeCoefficients.of(metals[m], COURANT, dt);
            }
            Boundary x = "BLOCH".equals(kind) ? Boundary.bloch(1e6) : Boundary.pec();
            sides.put(Side.LEFT, x);
            sides.put(Side.RIGHT, x);
            sides.put(Side.BOTTOM, Boundary.pml(2));
            sides.put(Side.TOP, Boundary.pml(2));
            for (int m = 0; m < ade.length; m++) {
                if (ade[m] == null) {
                    continue;
                }
                List<Integer> cells = new ArrayList<>();
                for (int j = 0; j < NY; j++) {
                    for (int i = 0; i < nx; i++) {
                        if (grid.id(Engine.site(c), i, j) == m && Engine.wouldUpdate(sides, nx, NY, c, i, j)) {
                            cells.add(j * nx + i);
                        }
                    }
                }
                if (!cells.isEmpty()) {
                    groups.add(cells.stream().mapToInt(Integer::intValue).toArray());
                    materialOf.add(m);
                }
            }
        }
    }
}
