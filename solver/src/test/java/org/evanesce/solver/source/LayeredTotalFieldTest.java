package org.evanesce.solver.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.HalfPlane;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.reference.PlanarStack;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A total-field box across a glass/air face, lit from the glass below and beyond the critical angle too:
 * inside it the field is the layered solution (incident, reflected, transmitted or evanescent), outside it
 * nothing leaks (issue 16: −40 dB; A. Taflove &amp; S. C. Hagness, <i>Computational Electrodynamics</i>, 3rd ed.,
 * 2005, ch. 5). The grid's layered solution itself is checked against the continuum: its reflectance against
 * Fresnel's (the transfer matrix, {@link PlanarStack}; M. Born &amp; E. Wolf, <i>Principles of Optics</i>, 7th ed.,
 * 1999, §1.5) and its decay beyond the critical angle against κ = k0 √(n1² sin²θ − n2²) (ibid., §1.5.4).
 */
class LayeredTotalFieldTest {

    static final double LAMBDA = TotalFieldLeakageTest.LAMBDA;
    static final double F = TotalFieldLeakageTest.F;
    /** 20 cells per wavelength in the glass. */
    static final double DX = LAMBDA / 1.5 / 20;
    static final double N_GLASS = 1.5;
    /**
     * Leakage bound: the issue's −40 dB. Measured (2026-12-03): −137 to −145 dB in float fields at 30° and 60°
     * (s, p), −133 and −149 dB in double at 70° (s) and 50° (p). What limits it: the fields' rounding and the
     * switching-on transient; the grid's own layered solution leaves no other error.
     */
    static final double LEAKAGE_DB = -40;
    /**
     * |r| of the grid's layered solution against Fresnel's, absolute: measured at most 0.0010 (p, 35°, near
     * Brewster's angle, where |r| is 0.035) at 20 cells per wavelength in the glass, from the smoothed face row.
     */
    static final double REFLECTION_TOLERANCE = 0.01;
    /** The grid's decay constant against the continuum's, relative: measured 0.2–0.3 % (numerical dispersion). */
    static final double DECAY_TOLERANCE = 0.03;

    record Layered(MaterialGrid grid, int i0, int j0, int i1, int j1, double faceY) { }

    static Layered scene(int boxW, int boxH) {
        int margin = 8;
        int nx = boxW + 2 * (margin + BoxRuns.PML) + 1;
        int ny = boxH + 2 * (margin + BoxRuns.PML) + 1;
        int i0 = BoxRuns.PML + margin;
        int j0 = BoxRuns.PML + margin;
        double faceY = (j0 + boxH / 2 + 0.3) * DX; // not on a grid line: the face's rows are smoothed
        Scene scene = Scene.builder(Material.ofIndex("air", 1.0))
                .add(new HalfPlane(0, faceY, 0, 1), Material.ofIndex("glass", N_GLASS)).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, DX, nx, ny), Smoothing.ANISOTROPIC);
        return new Layered(grid, i0, j0, i0 + boxW, j0 + boxH, faceY);
    }

    @ParameterizedTest(name = "{0} {1} {2} deg")
    @CsvSource({"S, FLOAT, 30", "P, FLOAT, 30", "S, FLOAT, 60", "P, FLOAT, 60", "S, DOUBLE, 70", "P, DOUBLE, 50"})
    void layeredWaveStaysInside(Polarization pol, Precision precision, double incidence) {
        Layered l = scene(44, 32);
        int nx = l.grid().nx();
        int ny = l.grid().ny();
        double period = 1 / F;
        double dt = Courant.timeStep(Courant.DEFAULT, DX);
        long perPeriod = Math.round(period / dt);
        double direction = Math.toRadians(90 - incidence); // from the glass below, towards +x
        TotalFieldBox box = TotalFieldBox.plan(new TotalFieldBox.Spec(pol, direction, 1.0,
                TimeSignal.rampedContinuous(F, 3 * period), (l.i0() + 22) * DX, l.faceY()), l.grid(), BoxRuns.sides(),
                Courant.DEFAULT, l.i0(), l.j0(), l.i1(), l.j1());
        assertTrue(box.layered());
        long steps = 40 * perPeriod;
        Component z = BoxRuns.z(pol);
        BoxRuns.Watch watch = new BoxRuns.Watch(z, BoxRuns.PML + 1, BoxRuns.PML + 1, nx - BoxRuns.PML - 2,
                ny - BoxRuns.PML - 2, F, steps - 4 * perPeriod, steps);
        try (Simulation sim = BoxRuns.builder(l.grid(), pol, precision, box, 1).listener(watch).build()) {
            sim.run(steps);
        }
        double outside = 0;
        double inside = 0;
        for (int j = watch.j0; j <= watch.j1; j++) {
            for (int i = watch.i0; i <= watch.i1; i++) {
                boolean in = i > l.i0() && i < l.i1() && j > l.j0() && j < l.j1();
                boolean out = i < l.i0() - 1 || i > l.i1() + 1 || j < l.j0() - 1 || j > l.j1() + 1;
                if (out) {
                    outside = Math.max(outside, watch.phasor(i, j).abs());
                } else if (in) {
                    Complex expected = box.unitPhasor(z, i, j, F).timesI();
                    inside = Math.max(inside, watch.phasor(i, j).minus(expected).abs());
                }
            }
        }
        double db = 20 * Math.log10(outside);
        System.out.printf("layered %s %s %g°: leakage %.1f dB, inside error %.2e%n", pol, precision, incidence, db, inside);
        assertTrue(db <= LEAKAGE_DB, String.format("layered %s %s %g°: leakage %.1f dB above %g dB", pol, precision,
                incidence, db, LEAKAGE_DB));
        assertTrue(inside <= TotalFieldLeakageTest.INSIDE_TOLERANCE, String.format("layered %s %s %g°: the field inside "
                + "differs from the layered solution by %.2e", pol, precision, incidence, inside));
    }

    @ParameterizedTest(name = "{0} {1} deg")
    @CsvSource({"S, 20", "P, 20", "S, 35", "P, 35", "P, 56", "S, 50", "P, 65"})
    void gridSolutionMatchesTheContinuum(Polarization pol, double incidence) {
        Layered l = scene(40, 40);
        MaterialGrid g = l.grid();
        boolean s = pol == Polarization.S;
        double[] first = new double[g.ny()];
        double[] second = new double[g.ny()];
        for (int j = 0; j < g.ny(); j++) {
            first[j] = g.material(s ? org.evanesce.geometry.FieldSite.EZ : org.evanesce.geometry.FieldSite.EX, 0, j)
                    .relativePermittivity();
            second[j] = g.material(org.evanesce.geometry.FieldSite.EY, 0, j).relativePermittivity();
        }
        double theta = Math.toRadians(incidence);
        LayeredRows rows = new LayeredRows(pol, first, s ? null : second, Math.PI / 2 - theta, 2 * Math.PI * F, DX,
                Courant.DEFAULT, 0, 0, 0, l.faceY());
        double critical = Math.asin(1 / N_GLASS);
        PlanarStack face = PlanarStack.interfaceBetween(N_GLASS, Complex.real(1.0));
        double fresnel = face.atAngle(pol, LAMBDA, theta).r().abs();
        double r = rows.reflection.abs();
        System.out.printf("%s %g°: grid |r| %.5f, Fresnel %.5f%n", pol, incidence, r, fresnel);
        assertEquals(fresnel, r, REFLECTION_TOLERANCE, pol + " " + incidence + "°: |r|");
        if (theta > critical) {
            int jAir = g.ny() - BoxRuns.PML - 12;
            double kappa = Math.log(rows.at(Component.EZ, 0, jAir).abs() / rows.at(Component.EZ, 0, jAir + 1).abs()) / DX;
            if (!s) {
                kappa = Math.log(rows.at(Component.HZ, 0, jAir).abs() / rows.at(Component.HZ, 0, jAir + 1).abs()) / DX;
            }
            double k0 = 2 * Math.PI / LAMBDA;
            double exact = k0 * Math.sqrt(N_GLASS * N_GLASS * Math.sin(theta) * Math.sin(theta) - 1);
            System.out.printf("%s %g°: grid κ %.6g, exact %.6g 1/m%n", pol, incidence, kappa, exact);
            assertEquals(exact, kappa, DECAY_TOLERANCE * exact, pol + " " + incidence + "°: decay constant");
        }
    }
}
