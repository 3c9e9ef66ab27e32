package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.Probe;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A plane wave at normal incidence on a perfectly conducting half-space whose face lies on a column of nodes: the
 * tangential E is held at zero there, so the wave is reflected whole with r = −1 referred to the face (a perfect
 * conductor reflects totally with the tangential E reversed: J. D. Jackson, <i>Classical Electrodynamics</i>, 3rd
 * ed., 1999, sec. 8.1, boundary conditions at a perfect conductor, from memory). On the grid the image of the wave
 * in the face is exact, so the check is against −1 with the grid's own wavenumber (Taflove &amp; Hagness' Yee
 * dispersion, {@link YeeTheory}), not the continuum's.
 */
class PerfectConductorMirrorTest {

    /**
     * Error budget: CPML reflections and the DFT of a finite record; measured |r + 1| = 3.8e-6 (float, 10 cells per
     * wavelength) and 2.6e-6 (double, 20), s and p alike (2026-12-04). About 10x that; a face one cell out of place
     * would give |r + 1| = 1.2 at 10 cells per wavelength.
     */
    private static final double TOLERANCE = 4e-5;
    private static final int NX = 600;
    private static final int NY = 4;
    private static final int FACE = 400;
    private static final int SOURCE = 150;
    private static final int PROBE = 300;
    private static final double DX = 20e-9;

    @Test
    void aPerfectConductorHasZeroUpdateCoefficients() {
        double[][] c = MaterialCoefficients.of(List.of(Material.VACUUM, Material.perfectConductor("pec")), 0.5,
                Courant.timeStep(0.5, DX));
        assertArrayEquals(new double[] {1, 0}, c[0], "ca: vacuum, perfect conductor");
        assertArrayEquals(new double[] {0.5, 0}, c[1], "cb: vacuum, perfect conductor");
    }

    @ParameterizedTest(name = "{0} {1} {2} cells per vacuum wavelength")
    @CsvSource({"S, FLOAT, 10", "P, FLOAT, 10", "S, DOUBLE, 20", "P, DOUBLE, 20"})
    void aMirrorReflectsEverythingWithTheFieldReversed(Polarization pol, Precision precision, int cellsPerWavelength) {
        double courant = 0.5;
        double f = PhysicalConstants.C0 / (cellsPerWavelength * DX);
        double[] withMirror = record(pol, precision, courant, f, true);
        double[] t = times;
        double mirrorEnergy = energy;
        double[] without = record(pol, precision, courant, f, false);
        double[] inc = Dft.at(without, t, f);
        double[] refl = Dft.at(diff(withMirror, without), t, f);
        double omega = 2 * Math.PI * f * courant * DX / PhysicalConstants.C0;
        double k1 = YeeTheory.axisWavenumber(omega, courant, 1.0);
        double[] r = Dft.mul(Dft.div(refl, inc), Dft.expi(-2 * k1 * (FACE - PROBE)));
        double err = Dft.abs(Dft.sub(r, new double[] {-1, 0}));
        String ctx = String.format("%s %s, %d cells/λ, S = %g, grid %d×%d, face at node %d: r = %.6f%+.6fi, |r + 1| = %.2e, "
                + "energy at the end %g", pol, precision, cellsPerWavelength, courant, NX, NY, FACE, r[0], r[1], err,
                mirrorEnergy);
        System.out.println(ctx);
        assertTrue(err < TOLERANCE, ctx);
        assertTrue(Double.isFinite(mirrorEnergy), "the energy is a number with a perfect conductor in the grid: " + ctx);
    }

    private double[] times;
    private double energy;

    private double[] record(Polarization pol, Precision precision, double courant, double f, boolean mirror) {
        MaterialGrid.Builder g = MaterialGrid.builder(NX, NY, DX, Material.VACUUM);
        if (mirror) {
            g.paint(CellRegion.rightOf(FACE), Material.perfectConductor("mirror"));
        }
        // a plane wave along x: PMC above and below keeps Ez uniform (s); PEC keeps Ey uniform (p)
        Boundary wall = pol == Polarization.S ? Boundary.pmc() : Boundary.pec();
        Component c = pol == Polarization.S ? Component.EZ : Component.EY;
        int j1 = pol == Polarization.S ? NY - 1 : NY - 2;
        Probe probe = new Probe(c, PROBE, 1);
        Simulation.Builder b = Simulation.builder(g.build()).polarization(pol).precision(precision).courant(courant)
                .boundary(Side.LEFT, Boundary.pml(16)).boundary(Side.RIGHT, Boundary.pml(16))
                .boundary(Side.BOTTOM, wall).boundary(Side.TOP, wall)
                .source(Source.columnLine(c, NX, SOURCE, 0, j1, 1.0, TimeSignal.gaussianPulse(f, f / 5)))
                .listener(probe);
        try (Simulation s = b.build()) {
            s.run(6000);
            energy = s.energy(0, 0, NX, NY);
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
