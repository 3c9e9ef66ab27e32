package org.evanesce.solver.source;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A total-field/scattered-field box with nothing inside leaks nothing into the scattered-field region
 * (A. Taflove &amp; S. C. Hagness, <i>Computational Electrodynamics</i>, 3rd ed., 2005, ch. 5: with the grid's
 * own incident field the leakage is set by rounding alone). Homogeneous background, s and p, several
 * directions, a continuous wave (its phasor after settling) and a pulse (the largest value met at any time);
 * also that the field inside the box is the incident wave.
 */
class TotalFieldLeakageTest {

    /** The issue's bound on leakage, −40 dB of the incident amplitude. */
    static final double ISSUE_BOUND_DB = -40;
    /**
     * Measured (20 cells per wavelength, 2026-12-03): continuous waves −117 to −128 dB in float fields, −125 to −134 dB
     * in double; Gaussian pulses −128 to −129 dB in float, −146 dB in double; a differentiated Gaussian −128 dB.
     * The bound is the issue's, far above what rounding leaves, so any slip in a correction's sign, site or
     * component ratio (which leaves −20 dB or worse) fails it.
     */
    static final double LEAKAGE_DB = ISSUE_BOUND_DB;
    /** The field inside the box equals the incident phasor to this fraction (measured about 1e-6 in float). */
    static final double INSIDE_TOLERANCE = 1e-4;

    static final double LAMBDA = 600e-9;
    static final double F = PhysicalConstants.C0 / LAMBDA;
    /** Cells per wavelength in vacuum. */
    static final int CELLS = 20;
    static final double DX = LAMBDA / CELLS;
    static final int MARGIN = 8;
    static final int BOX_W = 44;
    static final int BOX_H = 32;

    record Leak(double outsideDb, double insideError) { }

    static Leak continuous(Polarization pol, Precision precision, double epsilon, double degrees) {
        int nx = BOX_W + 2 * (MARGIN + BoxRuns.PML) + 1;
        int ny = BOX_H + 2 * (MARGIN + BoxRuns.PML) + 1;
        MaterialGrid grid = MaterialGrid.builder(nx, ny, DX, new Material("medium", epsilon, 0)).build();
        int i0 = BoxRuns.PML + MARGIN;
        int j0 = BoxRuns.PML + MARGIN;
        double period = 1 / F;
        double dt = Courant.timeStep(Courant.DEFAULT, DX);
        long perPeriod = Math.round(period / dt);
        TotalFieldBox.Spec spec = new TotalFieldBox.Spec(pol, Math.toRadians(degrees), 1.0,
                TimeSignal.rampedContinuous(F, 3 * period), (i0 + BOX_W / 2) * DX, (j0 + BOX_H / 2) * DX);
        TotalFieldBox box = TotalFieldBox.plan(spec, grid, BoxRuns.sides(), Courant.DEFAULT, i0, j0, i0 + BOX_W, j0 + BOX_H);
        long steps = 30 * perPeriod;
        Component z = BoxRuns.z(pol);
        BoxRuns.Watch watch = new BoxRuns.Watch(z, BoxRuns.PML + 1, BoxRuns.PML + 1, nx - BoxRuns.PML - 2,
                ny - BoxRuns.PML - 2, F, steps - 4 * perPeriod, steps);
        try (Simulation sim = BoxRuns.builder(grid, pol, precision, box, 1).listener(watch).build()) {
            sim.run(steps);
        }
        double outside = 0;
        double inside = 0;
        for (int j = watch.j0; j <= watch.j1; j++) {
            for (int i = watch.i0; i <= watch.i1; i++) {
                boolean in = i >= i0 + 1 && i <= i0 + BOX_W - 1 && j >= j0 + 1 && j <= j0 + BOX_H - 1;
                boolean out = i < i0 - 1 || i > i0 + BOX_W + 1 || j < j0 - 1 || j > j0 + BOX_H + 1;
                if (out) {
                    outside = Math.max(outside, watch.phasor(i, j).abs());
                } else if (in) {
                    // the z component's phasor: i·(unit phasor) for A sin(ωt) at the reference point
                    var expected = box.unitPhasor(z, i, j, F).timesI();
                    inside = Math.max(inside, watch.phasor(i, j).minus(expected).abs());
                }
            }
        }
        return new Leak(20 * Math.log10(outside), inside);
    }

    @ParameterizedTest(name = "{0} {1} eps={2} {3} deg")
    @CsvSource({"S, FLOAT, 1, 0", "S, FLOAT, 2.25, 30", "S, DOUBLE, 1, 127", "P, FLOAT, 1, 90", "P, FLOAT, 2.25, 45",
            "P, DOUBLE, 1, 200", "S, FLOAT, 1, 290"})
    void continuousWaveStaysInside(Polarization pol, Precision precision, double epsilon, double degrees) {
        Leak l = continuous(pol, precision, epsilon, degrees);
        System.out.printf("continuous %s %s ε=%g %g°: leakage %.1f dB, inside error %.2e%n", pol, precision, epsilon, degrees,
                l.outsideDb(), l.insideError());
        assertTrue(l.outsideDb() <= LEAKAGE_DB, String.format("%s %s ε=%g %g°: leakage %.1f dB above %g dB", pol, precision,
                epsilon, degrees, l.outsideDb(), LEAKAGE_DB));
        assertTrue(l.insideError() <= INSIDE_TOLERANCE, String.format("%s %s ε=%g %g°: field inside differs from the incident "
                + "wave by %.2e", pol, precision, epsilon, degrees, l.insideError()));
    }

    /** The largest |z| met outside the box over the whole run and inside it, for a pulse. */
    static double[] pulse(Polarization pol, Precision precision, double degrees, TimeSignal signal) {
        int nx = BOX_W + 2 * (MARGIN + BoxRuns.PML) + 1;
        int ny = BOX_H + 2 * (MARGIN + BoxRuns.PML) + 1;
        MaterialGrid grid = MaterialGrid.builder(nx, ny, DX, new Material("vacuum", 1, 0)).build();
        int i0 = BoxRuns.PML + MARGIN;
        int j0 = BoxRuns.PML + MARGIN;
        TotalFieldBox.Spec spec = new TotalFieldBox.Spec(pol, Math.toRadians(degrees), 1.0, signal, i0 * DX, j0 * DX);
        TotalFieldBox box = TotalFieldBox.plan(spec, grid, BoxRuns.sides(), Courant.DEFAULT, i0, j0, i0 + BOX_W, j0 + BOX_H);
        double dt = Courant.timeStep(Courant.DEFAULT, DX);
        double duration = signal instanceof GaussianPulse p ? 2 * p.delay() : 12 * ((DifferentiatedGaussian) signal).width();
        // the pulse's delay and length, and time to cross the grid twice
        long steps = Math.round((box.pulseDelay() + duration + 2 * Math.hypot(nx, ny) * DX / PhysicalConstants.C0) / dt);
        Component z = BoxRuns.z(pol);
        BoxRuns.Watch watch = new BoxRuns.Watch(z, BoxRuns.PML + 1, BoxRuns.PML + 1, nx - BoxRuns.PML - 2,
                ny - BoxRuns.PML - 2, F, 0, 0);
        try (Simulation sim = BoxRuns.builder(grid, pol, precision, box, 1).listener(watch).build()) {
            sim.run(steps);
        }
        double outside = 0;
        double inside = 0;
        for (int j = watch.j0; j <= watch.j1; j++) {
            for (int i = watch.i0; i <= watch.i1; i++) {
                boolean out = i < i0 - 1 || i > i0 + BOX_W + 1 || j < j0 - 1 || j > j0 + BOX_H + 1;
                if (out) {
                    outside = Math.max(outside, watch.peak(i, j));
                } else {
                    inside = Math.max(inside, watch.peak(i, j));
                }
            }
        }
        return new double[] {outside, inside};
    }

    @ParameterizedTest(name = "{0} {1} {2} deg")
    @CsvSource({"S, FLOAT, 30", "P, DOUBLE, 250"})
    void pulseStaysInside(Polarization pol, Precision precision, double degrees) {
        double[] peaks = pulse(pol, precision, degrees, TimeSignal.gaussianPulse(F, F / 5));
        double db = 20 * Math.log10(peaks[0] / peaks[1]);
        System.out.printf("pulse %s %s %g°: leakage %.1f dB (peak inside %.4f)%n", pol, precision, degrees, db, peaks[1]);
        assertTrue(db <= LEAKAGE_DB, String.format("pulse %s %s %g°: leakage %.1f dB above %g dB", pol, precision, degrees,
                db, LEAKAGE_DB));
    }

    @ParameterizedTest(name = "differentiated Gaussian {0} {1} deg")
    @CsvSource({"P, 135"})
    void broadbandPulseStaysInside(Polarization pol, double degrees) {
        // spectrum peaks at 1/(2πτ) = F/2: 40 cells per wavelength there, energy up to about 2F
        double[] peaks = pulse(pol, Precision.FLOAT, degrees, TimeSignal.differentiatedGaussian(1 / (Math.PI * F)));
        double db = 20 * Math.log10(peaks[0] / peaks[1]);
        System.out.printf("differentiated Gaussian %s %g°: leakage %.1f dB (peak inside %.4f)%n", pol, degrees, db, peaks[1]);
        assertTrue(db <= LEAKAGE_DB, String.format("differentiated Gaussian %s %g°: leakage %.1f dB above %g dB", pol,
                degrees, db, LEAKAGE_DB));
    }
}
