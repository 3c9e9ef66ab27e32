package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.util.List;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.FaceMixtures;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.geometry.dispersion.SeriesMaterial;
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
 * Sites holding materials in series ({@link SeriesMaterial}, stepped by one sub-field per part): the same
 * physics as a material of the harmonic-mean permittivity where that is an ordinary dielectric (layers in
 * series: 1/ε = Σ f/ε_k, common practice), the metal itself for one part, bitwise identical for any thread
 * count, carried exactly by checkpoints, and bounded over a long run at the Courant limit's usual fraction.
 */
class SeriesEngineTest {

    private static final int NX = 40;
    private static final int NY = 48;
    private static final double DX = 10e-9;
    private static final double F = 4.74e14; // 633 nm
    static final DispersiveMaterial GOLD = MetalLibrary.get("gold").material();
    static final Material GLASS = Material.ofIndex("glass", 1.5);
    /**
     * Largest difference against the equivalent ordinary run, relative to the largest field: rounding of the
     * sub-field sums (measured 3.3e-15 to 1.5e-14 in double, 3.2e-6 in float), so 1e-13 and 3e-5.
     */
    static final double DOUBLE_ROUNDING = 1e-13;
    static final double FLOAT_ROUNDING = 3e-5;

    /** Glass, a band of rows whose sites hold {@code band}, and a gold block. */
    static MaterialGrid grid(Material band, FieldSite bandSite) {
        MaterialGrid.Builder b = MaterialGrid.builder(NX, NY, DX, GLASS);
        Material metal = MetalRuns.placeholder(GOLD);
        for (FieldSite s : FieldSite.values()) {
            for (int j = 0; j < NY; j++) {
                for (int i = 0; i < NX; i++) {
                    double x = i + s.dx;
                    double y = j + s.dy;
                    if (x > 0.4 * NX && x < 0.65 * NX && y > 0.55 * NY && y < 0.75 * NY) {
                        b.set(s, i, j, metal);
                    } else if ((bandSite == null || s == bandSite) && y > 20 && y < 23 && x > 5) {
                        b.set(s, i, j, band);
                    }
                }
            }
        }
        return b.build();
    }

    static Simulation.Builder builder(MaterialGrid g, Polarization pol, Precision precision, int threads, boolean bloch) {
        Component z = pol == Polarization.S ? Component.EZ : Component.HZ;
        double kx = 2 * Math.PI * F / PhysicalConstants.C0 * 0.7;
        Simulation.Builder b = Simulation.builder(g).polarization(pol).precision(precision).threads(threads)
                .minCellsPerThread(64).boundary(Side.BOTTOM, Boundary.pml(8)).boundary(Side.TOP, Boundary.pml(8));
        if (bloch) {
            b.boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                    .source(Source.blochRow(z, NX, 12, 0, DX, kx, TimeSignal.gaussianPulse(F, F / 3)));
        } else {
            b.boundary(Side.LEFT, Boundary.pml(8)).boundary(Side.RIGHT, Boundary.pml(8))
                    .source(Source.point(z, NX, 15, 12, 1, TimeSignal.gaussianPulse(F, F / 2)));
        }
        int gold = g.materials().indexOf(MetalRuns.placeholder(GOLD));
        if (gold >= 0) {
            b.dispersive(gold, GOLD);
        }
        return b;
    }

    /** Gold and glass in series (0.6, 0.4) at the band's sites, which run into the right CPML. */
    static Simulation faced(Polarization pol, Precision precision, int threads, boolean bloch) {
        SeriesMaterial sm = FaceMixtures.series("gold|glass", List.of(GOLD, DispersiveMaterial.of(GLASS)),
                new double[] {0.6, 0.4});
        Material standIn = new Material(sm.name(), sm.epsInfinity(), 0);
        MaterialGrid g = grid(standIn, null);
        return builder(g, pol, precision, threads, bloch).series(g.materials().indexOf(standIn), sm).build();
    }

    /** Largest |a − b| over every component, relative to the largest |a|. */
    static double relativeDifference(Simulation a, Simulation b, Polarization pol) {
        double diff = 0;
        double max = 0;
        for (Component c : pol.components()) {
            for (int j = 0; j < a.ny(); j++) {
                for (int i = 0; i < a.nx(); i++) {
                    diff = Math.max(diff, Math.abs(a.field(c, i, j) - b.field(c, i, j)));
                    max = Math.max(max, Math.abs(a.field(c, i, j)));
                }
            }
        }
        assertTrue(max > 0, "the source must have reached the grid");
        return diff / max;
    }

    @ParameterizedTest(name = "{0} {1}")
    @CsvSource({"P, DOUBLE, EY", "P, FLOAT, EX", "S, DOUBLE, EZ"})
    void dielectricsInSeriesAreTheirHarmonicMean(Polarization pol, Precision precision, FieldSite site) {
        Material air = Material.VACUUM;
        SeriesMaterial sm = FaceMixtures.series("glass|air", List.of(DispersiveMaterial.of(GLASS), DispersiveMaterial.of(air)),
                new double[] {0.3, 0.7});
        Material standIn = new Material(sm.name(), sm.epsInfinity(), 0);
        Material harmonic = new Material("harmonic", 1 / (0.3 / 2.25 + 0.7), 0);
        MaterialGrid gs = grid(standIn, site);
        MaterialGrid gh = grid(harmonic, site);
        try (Simulation s = builder(gs, pol, precision, 1, false).series(gs.materials().indexOf(standIn), sm).build();
             Simulation h = builder(gh, pol, precision, 1, false).build()) {
            s.run(400);
            h.run(400);
            double d = relativeDifference(h, s, pol);
            System.out.printf("series glass|air against the harmonic mean, %s %s at %s: %.2g%n", pol, precision, site, d);
            assertTrue(d <= (precision == Precision.DOUBLE ? DOUBLE_ROUNDING : FLOAT_ROUNDING), pol + " " + precision + ": " + d);
        }
    }

    @Test
    void oneMetalPartIsTheMetal() {
        SeriesMaterial sm = FaceMixtures.series("gold alone", List.of(GOLD), new double[] {1});
        Material standIn = new Material(sm.name(), sm.epsInfinity(), 0);
        MaterialGrid gs = grid(standIn, null);
        MaterialGrid gm = grid(MetalRuns.placeholder(GOLD), null);
        try (Simulation s = builder(gs, Polarization.P, Precision.DOUBLE, 1, false).series(gs.materials().indexOf(standIn), sm)
                .build();
             Simulation m = builder(gm, Polarization.P, Precision.DOUBLE, 1, false).build()) {
            s.run(400);
            m.run(400);
            double d = relativeDifference(m, s, Polarization.P);
            System.out.printf("series of gold alone against gold: %.2g%n", d);
            assertTrue(d <= DOUBLE_ROUNDING, "relative difference " + d);
        }
    }

    @ParameterizedTest(name = "{0} {1} bloch={2}")
    @CsvSource({"P, FLOAT, false", "P, DOUBLE, true", "S, FLOAT, true"})
    void resultsAreBitwiseIdenticalForAnyThreadCount(Polarization pol, Precision precision, boolean bloch) {
        try (Simulation one = faced(pol, precision, 1, bloch); Simulation three = faced(pol, precision, 3, bloch)) {
            assertTrue(three.threads() > 1, "the test needs several bands");
            one.run(400);
            three.run(400);
            DispersiveEngineTest.assertSameFields(one, three, pol, pol + " " + precision + " 1 against " + three.threads()
                    + " threads");
        }
    }

    @ParameterizedTest(name = "{0} {1} bloch={2}")
    @CsvSource({"P, FLOAT, false", "P, DOUBLE, true"})
    void checkpointCarriesTheSubFields(Polarization pol, Precision precision, boolean bloch) throws IOException {
        try (Simulation whole = faced(pol, precision, 1, bloch); Simulation first = faced(pol, precision, 1, bloch);
             Simulation second = faced(pol, precision, 2, bloch)) {
            whole.run(300);
            first.run(171);
            ByteArrayOutputStream saved = new ByteArrayOutputStream();
            first.saveState(saved);
            second.restoreState(new ByteArrayInputStream(saved.toByteArray()));
            second.run(300 - 171);
            DispersiveEngineTest.assertSameFields(whole, second, pol, "restored run");
        }
    }

    /** With PEC walls the box only loses energy (to the gold): the largest field after 30 000 steps is below the early one. */
    @ParameterizedTest(name = "S={0}")
    @CsvSource({"0.5", "0.7"})
    void longRunStaysBounded(double courant) {
        SeriesMaterial sm = FaceMixtures.series("gold|glass", List.of(GOLD, DispersiveMaterial.of(GLASS)),
                new double[] {0.93, 0.07});
        Material standIn = new Material(sm.name(), sm.epsInfinity(), 0);
        MaterialGrid g = grid(standIn, null);
        try (Simulation s = Simulation.builder(g).polarization(Polarization.P).precision(Precision.FLOAT).courant(courant)
                .threads(1).boundaries(Boundary.pec()).dispersive(g.materials().indexOf(MetalRuns.placeholder(GOLD)), GOLD)
                .series(g.materials().indexOf(standIn), sm)
                .source(Source.point(Component.HZ, NX, 8, 8, 1, TimeSignal.gaussianPulse(F, F))).build()) {
            s.run(400);
            double early = DispersiveEngineTest.largest(s, Polarization.P);
            s.run(30_000);
            double late = DispersiveEngineTest.largest(s, Polarization.P);
            assertTrue(early > 0 && late < early, String.format("S = %g: largest field after the pulse %g, after 30 000 more"
                    + " steps %g", courant, early, late));
        }
    }
}
