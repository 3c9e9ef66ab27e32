package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The engine's handling of dispersive cells (issue 15), apart from the physics that
 * {@link MetalReflectanceTest} and {@link KretschmannFdtdTest} check: results bitwise identical for any
 * thread count, checkpoints that carry the auxiliary currents exactly (and refuse state that does not
 * fit), the byte count before and after building, stability over a long run, and a pole-free
 * dispersive material that is the ordinary material bit for bit.
 */
class DispersiveEngineTest {

    private static final int NX = 40;
    private static final int NY = 48;
    private static final double DX = 10e-9;
    private static final double F = 4.74e14; // 633 nm
    static final DispersiveMaterial GOLD = MetalLibrary.get("gold").material();

    /**
     * Glass with a gold block in the middle and a gold strip along the top that runs into the top and
     * right CPML (or across the Bloch seam).
     */
    static MaterialGrid grid(int nx, int ny) {
        Material glass = Material.ofIndex("glass", 1.5);
        Material metal = MetalRuns.placeholder(GOLD);
        MaterialGrid.Builder b = MaterialGrid.builder(nx, ny, DX, glass);
        for (FieldSite s : FieldSite.values()) {
            for (int j = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++) {
                    double x = i + s.dx;
                    double y = j + s.dy;
                    boolean block = x > 0.4 * nx && x < 0.65 * nx && y > 0.35 * ny && y < 0.55 * ny;
                    boolean strip = y > ny - 14.3 && y < ny - 9.6 && x > 0.5 * nx;
                    if (block || strip) {
                        b.set(s, i, j, metal);
                    }
                }
            }
        }
        return b.build();
    }

    static Simulation build(MaterialGrid grid, Polarization pol, Precision precision, boolean bloch, int threads,
                            boolean metal) {
        Component z = pol == Polarization.S ? Component.EZ : Component.HZ;
        double kx = 2 * Math.PI * F / PhysicalConstants.C0 * 0.7;
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(precision).threads(threads)
                .minCellsPerThread(64).boundary(Side.BOTTOM, Boundary.pml(8)).boundary(Side.TOP, Boundary.pml(8));
        if (bloch) {
            b.boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                    .source(Source.blochRow(z, grid.nx(), 12, 0, DX, kx, TimeSignal.gaussianPulse(F, F / 3)));
        } else {
            b.boundary(Side.LEFT, Boundary.pmc()).boundary(Side.RIGHT, Boundary.pml(8))
                    .source(Source.point(z, grid.nx(), 15, 12, 1, TimeSignal.gaussianPulse(F, F / 2)));
        }
        if (metal) {
            b.dispersive(grid.materials().indexOf(MetalRuns.placeholder(GOLD)), GOLD);
        }
        return b.build();
    }

    static void assertSameFields(Simulation a, Simulation b, Polarization pol, String what) {
        for (Component c : pol.components()) {
            for (int j = 0; j < a.ny(); j++) {
                for (int i = 0; i < a.nx(); i++) {
                    assertEquals(Double.doubleToRawLongBits(a.field(c, i, j)), Double.doubleToRawLongBits(b.field(c, i, j)),
                            what + ": " + c + " at (" + i + ", " + j + ")");
                    assertEquals(Double.doubleToRawLongBits(a.fieldImag(c, i, j)),
                            Double.doubleToRawLongBits(b.fieldImag(c, i, j)), what + ": imaginary " + c + " at (" + i + ", " + j + ")");
                }
            }
        }
    }

    /** The largest |field| over every component (real and imaginary parts); NaN if any is NaN. */
    static double largest(Simulation s, Polarization pol) {
        double m = 0;
        for (Component c : pol.components()) {
            for (int j = 0; j < s.ny(); j++) {
                for (int i = 0; i < s.nx(); i++) {
                    m = Math.max(m, Math.max(Math.abs(s.field(c, i, j)), Math.abs(s.fieldImag(c, i, j))));
                }
            }
        }
        return m;
    }

    /** Every cell gets the same operations whatever the band split (ThreadEqualityTest's rule, with metal). */
    @ParameterizedTest(name = "{0} {1} bloch={2}")
    @CsvSource({"S, FLOAT, false", "P, FLOAT, false", "S, DOUBLE, true", "P, FLOAT, true", "P, DOUBLE, false"})
    void resultsAreBitwiseIdenticalForAnyThreadCount(Polarization pol, Precision precision, boolean bloch) {
        MaterialGrid g = grid(NX, NY);
        try (Simulation one = build(g, pol, precision, bloch, 1, true);
             Simulation three = build(g, pol, precision, bloch, 3, true)) {
            assertTrue(three.threads() > 1, "the test needs several bands");
            one.run(400);
            three.run(400);
            assertTrue(largest(one, pol) > 0, "the source must have reached the grid");
            assertSameFields(one, three, pol, pol + " " + precision + " 1 against " + three.threads() + " threads");
        }
    }

    /** A run saved half-way and restored into a fresh simulation (on another thread count) continues bit for bit. */
    @ParameterizedTest(name = "{0} {1} bloch={2}")
    @CsvSource({"S, FLOAT, false", "P, DOUBLE, true", "P, FLOAT, false"})
    void checkpointCarriesTheAuxiliaryCurrents(Polarization pol, Precision precision, boolean bloch) throws IOException {
        MaterialGrid g = grid(NX, NY);
        try (Simulation whole = build(g, pol, precision, bloch, 1, true);
             Simulation first = build(g, pol, precision, bloch, 1, true);
             Simulation second = build(g, pol, precision, bloch, 2, true)) {
            whole.run(300);
            first.run(171);
            ByteArrayOutputStream saved = new ByteArrayOutputStream();
            first.saveState(saved);
            second.restoreState(new ByteArrayInputStream(saved.toByteArray()));
            second.run(300 - 171);
            assertSameFields(whole, second, pol, "restored run");
            // without the currents the run would differ: a restored field alone does not continue it
            try (Simulation fresh = build(g, pol, precision, bloch, 1, true)) {
                fresh.run(171);
                assertSameFields(first, fresh, pol, "the same 171 steps");
            }
        }
    }

    @Test
    void checkpointsOfAnotherFormatOrAnotherMaterialSetAreRefused() throws IOException {
        MaterialGrid g = grid(NX, NY);
        ByteArrayOutputStream dielectric = new ByteArrayOutputStream();
        try (Simulation plain = build(g, Polarization.S, Precision.FLOAT, false, 1, false)) {
            plain.run(20);
            plain.saveState(dielectric);
        }
        try (Simulation metal = build(g, Polarization.S, Precision.FLOAT, false, 1, true)) {
            IOException e = assertThrows(IOException.class,
                    () -> metal.restoreState(new ByteArrayInputStream(dielectric.toByteArray())));
            assertTrue(e.getMessage().contains("dispersive"), e.getMessage());
            // a checkpoint of the previous format (1, before dispersive state) is refused by its number
            ByteArrayOutputStream old = new ByteArrayOutputStream();
            new DataOutputStream(old).writeUTF("evanesce checkpoint 1");
            IOException o = assertThrows(IOException.class, () -> metal.restoreState(new ByteArrayInputStream(old.toByteArray())));
            assertTrue(o.getMessage().contains("format 1") && o.getMessage().contains("format 2"), o.getMessage());
        }
    }

    /**
     * bytes() equals footprint's arrays + pml plus dispersiveFootprint; without an ordinary lossy material
     * no ca array is kept (the metal's ca' is folded into its post-pass), so {@code lossy} is false.
     */
    @ParameterizedTest(name = "{0} {1} bloch={2}")
    @CsvSource({"S, FLOAT, false", "P, FLOAT, true", "P, DOUBLE, false"})
    void footprintCountsTheAuxiliaryState(Polarization pol, Precision precision, boolean bloch) {
        MaterialGrid g = grid(NX, NY);
        try (Simulation s = build(g, pol, precision, bloch, 1, true)) {
            Map<Side, Boundary> sides = sides(bloch, s);
            long[] f = Simulation.footprint(NX, NY, pol, precision, sides, false);
            long disp = Simulation.dispersiveFootprint(g, pol, precision, sides,
                    Map.of(g.materials().indexOf(MetalRuns.placeholder(GOLD)), GOLD));
            assertTrue(disp > 0);
            assertEquals(disp, s.dispersiveBytes());
            assertEquals(f[0] + f[1] + disp, s.bytes());
            // 12 values of state (1 Drude + 5 Lorentz terms) and a cell index per metal cell and E site
            long metalSites = 0;
            long runs = 0;
            int electricSites = pol == Polarization.S ? 1 : 2;
            int m = g.materials().indexOf(MetalRuns.placeholder(GOLD));
            for (FieldSite site : pol == Polarization.S ? new FieldSite[] {FieldSite.EZ} : new FieldSite[] {FieldSite.EX, FieldSite.EY}) {
                Component c = site == FieldSite.EZ ? Component.EZ : site == FieldSite.EX ? Component.EX : Component.EY;
                for (int j = 0; j < NY; j++) {
                    boolean inRun = false;
                    for (int i = 0; i < NX; i++) {
                        boolean metal = g.id(site, i, j) == m && Simulation.isUpdated(sides, NX, NY, c, i, j);
                        metalSites += metal ? 1 : 0;
                        runs += metal && !inRun ? 1 : 0;
                        inRun = metal;
                    }
                }
            }
            // 12 values and a cell index per site; row starts of cells and of runs; three ints per run
            long expected = (metalSites * (12L * precision.bytes + Integer.BYTES)
                    + (electricSites * 2L * (NY + 1) + 3 * runs) * Integer.BYTES) * (bloch ? 2 : 1);
            assertEquals(expected, disp);
        }
        try (Simulation plain = build(g, pol, precision, bloch, 1, false)) {
            assertEquals(0, plain.dispersiveBytes());
        }
    }

    private static Map<Side, Boundary> sides(boolean bloch, Simulation s) {
        double kx = 2 * Math.PI * F / PhysicalConstants.C0 * 0.7;
        return bloch
                ? Map.of(Side.LEFT, Boundary.bloch(kx), Side.RIGHT, Boundary.bloch(kx), Side.BOTTOM, Boundary.pml(8),
                Side.TOP, Boundary.pml(8))
                : Map.of(Side.LEFT, Boundary.pmc(), Side.RIGHT, Boundary.pml(8), Side.BOTTOM, Boundary.pml(8),
                Side.TOP, Boundary.pml(8));
    }

    /**
     * Stability over a long run: Rakić's gold (1 Drude + 5 Lorentz terms, the resonance at 13.3 eV
     * with ω0Δt ≈ 0.4 here) in a closed PEC box with glass, excited by a short pulse, then 60 000 steps
     * (about 240 periods at 633 nm) at the default Courant number 0.5 and at 0.99 of the 2D limit
     * 1/√2. The bilinear ADE is stable up to the limit (AdeStabilityTest's von Neumann analysis); here
     * every field stays finite and the largest field at the end is below the largest seen after the
     * pulse (the box only loses energy, to the metal).
     */
    @ParameterizedTest(name = "{0} {1} S={2}")
    @CsvSource({"S, FLOAT, 0.5", "P, FLOAT, 0.5", "P, DOUBLE, 0.7", "S, FLOAT, 0.7"})
    void longRunStaysBounded(Polarization pol, Precision precision, double courant) {
        MaterialGrid g = grid(32, 32);
        Component z = pol == Polarization.S ? Component.EZ : Component.HZ;
        try (Simulation s = Simulation.builder(g).polarization(pol).precision(precision).courant(courant).threads(1)
                .boundaries(Boundary.pec()).dispersive(g.materials().indexOf(MetalRuns.placeholder(GOLD)), GOLD)
                .source(Source.point(z, 32, 8, 8, 1, TimeSignal.gaussianPulse(F, F))).build()) {
            s.run(400);
            double early = largest(s, pol);
            s.run(60_000);
            double late = largest(s, pol);
            assertTrue(early > 0 && late < early, String.format("%s %s S = %g: largest field after the pulse %g, after 60 000 "
                    + "more steps %g", pol, precision, courant, early, late));
        }
    }

    /** A dispersive material without poles is its ordinary material bit for bit and holds no state. */
    @Test
    void poleFreeDispersiveMaterialIsTheOrdinaryOne() {
        Material lossy = new Material("lossy", 2.25, 3e4);
        MaterialGrid.Builder gb = MaterialGrid.builder(NX, NY, DX, Material.VACUUM);
        for (int j = 20; j < 30; j++) {
            for (int i = 0; i < NX; i++) {
                gb.set(FieldSite.EZ, i, j, lossy);
            }
        }
        MaterialGrid g = gb.build();
        try (Simulation a = Simulation.builder(g).threads(1).source(Source.point(Component.EZ, NX, 15, 12, 1,
                TimeSignal.gaussianPulse(F, F / 2))).build();
             Simulation b = Simulation.builder(g).threads(1).dispersive(g.materials().indexOf(lossy), DispersiveMaterial.of(lossy))
                     .source(Source.point(Component.EZ, NX, 15, 12, 1, TimeSignal.gaussianPulse(F, F / 2))).build()) {
            a.run(200);
            b.run(200);
            assertSameFields(a, b, Polarization.S, "pole-free dispersive against ordinary");
            assertEquals(0, b.dispersiveBytes());
        }
    }

    @Test
    void anIndexOutsideTheTableIsRefused() {
        MaterialGrid g = grid(NX, NY);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Simulation.builder(g).dispersive(7, GOLD).build());
        assertTrue(e.getMessage().contains("index 7"), e.getMessage());
    }
}
