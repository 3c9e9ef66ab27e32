package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.Probe;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/**
 * Reflection of a normally incident plane wave from a permittivity step 1 → 4 on the grid,
 * against the exact finite-grid coefficient (Schneider, Understanding the FDTD Method, 2010),
 * not the continuum Fresnel value −1/3.
 */
class DiscreteReflectionTest {

    /** Error budget: CPML reflections (about 1e-4 of the pulse) and the DFT of a finite record; well below the 0.08 gap to Fresnel. */
    private static final double TOLERANCE = 1e-3;
    private static final int NX = 600;
    private static final int NY = 4;
    private static final int INTERFACE = 400;
    private static final int SOURCE = 150;
    private static final int PROBE = 300;
    private static final double DX = 20e-9;

    @Test
    void formulaReproducesSchneidersOneDimensionalExample() {
        // Courant number 1 in 1D, 10 cells per vacuum wavelength: |r| = 0.415 (Schneider's example, issue #2)
        double omega = 2 * Math.PI / 10;
        double k1 = YeeTheory.axisWavenumber(omega, 1.0, 1.0);
        double k2 = YeeTheory.axisWavenumber(omega, 1.0, 4.0);
        assertEquals(0.415, Dft.abs(YeeTheory.stepReflection(k1, k2)), 5e-4);
        // and the continuum limit is Fresnel's −1/3 (Hecht sec. 4.6)
        double[] r = YeeTheory.stepReflection(1e-4, 2e-4);
        assertEquals(-1.0 / 3.0, r[0], 1e-6);
    }

    @ParameterizedTest(name = "{0} {1} {2} cells per vacuum wavelength")
    @CsvSource({"S, FLOAT, 10", "P, FLOAT, 10", "S, DOUBLE, 10", "P, DOUBLE, 20"})
    void stepReflectionMatchesFiniteGridCoefficient(Polarization pol, Precision precision, int cellsPerWavelength) {
        double courant = 0.5;
        double f = PhysicalConstants.C0 / (cellsPerWavelength * DX);
        double[] withStep = record(pol, precision, courant, f, true);
        double[] without = record(pol, precision, courant, f, false);
        double[] t = times;
        double[] inc = Dft.at(without, t, f);
        double[] refl = Dft.at(diff(withStep, without), t, f);
        double omega = 2 * Math.PI * f * courant * DX / PhysicalConstants.C0;
        double k1 = YeeTheory.axisWavenumber(omega, courant, 1.0);
        double k2 = YeeTheory.axisWavenumber(omega, courant, 4.0);
        double[] rSim = Dft.mul(Dft.div(refl, inc), Dft.expi(-2 * k1 * (INTERFACE - PROBE)));
        double[] rGrid = YeeTheory.stepReflection(k1, k2);
        String ctx = String.format("%s %s, %d cells/λ, S = %g, grid %d×%d: r_sim = %.5f%+.5fi, r_grid = %.5f%+.5fi",
                pol, precision, cellsPerWavelength, courant, NX, NY, rSim[0], rSim[1], rGrid[0], rGrid[1]);
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.println(ctx + String.format(", |r_sim − r_grid| = %.2e", Dft.abs(Dft.sub(rSim, rGrid))));
        }
        assertTrue(Dft.abs(Dft.sub(rSim, rGrid)) < TOLERANCE, ctx);
        // the continuum value is measurably different at this resolution, so the test can tell them apart
        if (cellsPerWavelength == 10) {
            assertTrue(Dft.abs(Dft.sub(rSim, new double[] {-1.0 / 3.0, 0})) > 10 * TOLERANCE, ctx);
        }
    }

    private double[] times;

    private double[] record(Polarization pol, Precision precision, double courant, double f, boolean step) {
        MaterialGrid.Builder g = MaterialGrid.builder(NX, NY, DX, Material.VACUUM);
        if (step) {
            g.paint(CellRegion.rightOf(INTERFACE), new Material("step", 4.0, 0.0));
        }
        // a plane wave along x: PMC above and below keeps Ez uniform (s); PEC keeps Ey uniform (p)
        Boundary wall = pol == Polarization.S ? Boundary.pmc() : Boundary.pec();
        Component c = pol == Polarization.S ? Component.EZ : Component.EY;
        int j0 = pol == Polarization.S ? 0 : 0;
        int j1 = pol == Polarization.S ? NY - 1 : NY - 2;
        Probe probe = new Probe(c, PROBE, 1);
        Simulation.Builder b = Simulation.builder(g.build()).polarization(pol).precision(precision).courant(courant)
                .boundary(Side.LEFT, Boundary.pml(16)).boundary(Side.RIGHT, Boundary.pml(16))
                .boundary(Side.BOTTOM, wall).boundary(Side.TOP, wall)
                .source(Source.columnLine(c, NX, SOURCE, j0, j1, 1.0, TimeSignal.gaussianPulse(f, f / 5)))
                .listener(probe);
        try (Simulation s = b.build()) {
            s.run(6000);
        }
        times = probe.times();
        return probe.values();
    }

    private static double[] diff(double[] a, double[] b) {
        double[] d = new double[a.length];
        for (int n = 0; n < a.length; n++) {
            d[n] = a[n] - b[n];
        }
        return d;
    }
}
