package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The finite-beam reference against the plane-wave limit, energy conservation, Artmann's Goos–Hänchen shift and
 * the Gaussian-beam closed forms.
 */
class AngularSpectrumTest {

    private static final double WAVELENGTH = 1e-6;
    /** Samples per vacuum wavelength: Δx = λ0/4 is below λ0/(2 n1) for every n1 ≤ 2 used here. */
    private static final int PER_WAVELENGTH = 4;

    /**
     * A wide beam's R and T against the plane wave's: the beam averages R(θ) over an angular spread
     * σ = 1/(n1 k0 w0) ≈ 5e-4 rad at 200 λ, which moves it by about ½ R''σ² ≈ 1e-6 for these smooth curves
     * (measured at most 1.4e-6).
     */
    private static final double WIDE_BEAM = 1e-4;
    /**
     * R + T = 1 for a lossless stack: the transfer matrix holds it to 1e-14 per plane wave and the sums add
     * rounding only; measured at most 8.9e-16 over these beams, about 10 times below this.
     */
    private static final double ENERGY = 1e-14;
    /** The issue's bars for the Goos–Hänchen shift against Artmann at 20 and 50 wavelengths of waist. */
    private static final double SHIFT_20 = 0.03;
    private static final double SHIFT_50 = 0.01;
    /**
     * |U| profiles of a wide beam, in units of the peak: the reflected one differs from |r(θ)| times the incident
     * one by about |dr/dθ|·σ with σ ≈ 5e-4 rad at 200 λ (σ as above), |dr/dθ| of order 1 at 30 deg; measured 3e-6.
     */
    private static final double PROFILE = 1e-3;
    /**
     * The incident profile on the interface against the tilted Gaussian exp(−x² cos²θ / w0²): the line z = 0 leaves
     * the waist plane by ζ = x sin θ, which changes |U| at second order in ζ/z_R (about 1e-5 over three footprints
     * at 200 λ), and non-paraxial terms are of order 1/(k w0)² ≈ 3e-7 (measured 2e-7 of the peak).
     */
    private static final double GAUSSIAN = 1e-4;
    /**
     * Width and wavefront curvature of a 10 λ beam off its waist against the paraxial formulas: the paraxial
     * approximation errs by order 1/(k w0)² ≈ 3e-4 (n1 = 1.5; measured 1.4e-4).
     */
    private static final double PARAXIAL = 3e-3;

    /** A window of about {@code footprints} beam footprints, rounded up to a power of two in wavelengths. */
    private static AngularSpectrum.Result run(PlanarStack stack, Polarization pol, AngularSpectrum.GaussianBeam beam,
                                              double footprints) {
        int wavelengths = Integer.highestOneBit((int) Math.ceil(footprints * beam.footprint() / WAVELENGTH)) * 2;
        return AngularSpectrum.of(stack, pol, beam, wavelengths * PER_WAVELENGTH, wavelengths * WAVELENGTH);
    }

    private static PlanarStack gap(double n1, double gap, double thickness, double exit) {
        return new PlanarStack(n1, List.of(new PlanarStack.Layer(Complex.real(gap), thickness)), Complex.real(exit));
    }

    private static double magnitude(double[] u, int j) {
        return Math.hypot(u[2 * j], u[2 * j + 1]);
    }

    /** Root-mean-square width of |U|² about its centroid, computed here from the samples. */
    private static double rmsWidth(AngularSpectrum.Result res, double[] u) {
        double sum = 0;
        double m1 = 0;
        double m2 = 0;
        for (int j = 0; j < res.samples(); j++) {
            double p = magnitude(u, j) * magnitude(u, j);
            double x = res.x(j);
            sum += p;
            m1 += x * p;
            m2 += x * x * p;
        }
        double mean = m1 / sum;
        return Math.sqrt(m2 / sum - mean * mean);
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void aWideBeamReflectsAndTransmitsLikeThePlaneWave(Polarization pol) {
        // below the critical angle: an Airy slab 1.0 | 1.5, 2 λ | 1.0 at 30 deg; beyond it: frustrated total
        // reflection across a 0.2 λ air gap in glass at 45 deg (critical 41.8 deg)
        PlanarStack slab = gap(1.0, 1.5, 2 * WAVELENGTH, 1.0);
        PlanarStack ftir = gap(1.5, 1.0, 0.2 * WAVELENGTH, 1.5);
        Object[][] cases = {{slab, 30.0, "Airy slab"}, {ftir, 45.0, "frustrated gap"}};
        for (Object[] c : cases) {
            PlanarStack st = (PlanarStack) c[0];
            double th = Math.toRadians((Double) c[1]);
            AngularSpectrum.Result res = run(st, pol, new AngularSpectrum.GaussianBeam(200 * WAVELENGTH, th, WAVELENGTH), 10);
            PlanarStack.Response plane = st.atAngle(pol, WAVELENGTH, th);
            String what = String.format("%s, %s, 200 lambda waist at %s deg", c[2], pol, c[1]);
            System.out.printf("wide beam %s: R %.8f (plane %.8f), T %.8f (plane %.8f)%n", what, res.reflectance(),
                    plane.reflectance(), res.transmittance(), plane.transmittance());
            assertEquals(plane.reflectance(), res.reflectance(), WIDE_BEAM, what + ": R");
            assertEquals(plane.transmittance(), res.transmittance(), WIDE_BEAM, what + ": T");
        }
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void aLosslessStackConservesTheBeamsPower(Polarization pol) {
        // a 3 λ waist at 45 deg spreads over about ±2 deg, across the critical angle (41.8 deg); an exit index
        // different from the incident one tests the p weight Re(kz/ε); a focus before the interface the phases
        double th = Math.toRadians(45);
        for (double exit : new double[] {1.5, 2.0}) {
            for (double distance : new double[] {0, 30 * WAVELENGTH}) {
                AngularSpectrum.GaussianBeam beam = new AngularSpectrum.GaussianBeam(3 * WAVELENGTH, th, WAVELENGTH, distance);
                AngularSpectrum.Result res = run(gap(1.5, 1.0, 0.2 * WAVELENGTH, exit), pol, beam, 30);
                String what = String.format("%s, 1.5 | 1.0 0.2 lambda | %g, 3 lambda waist %g lambda before the gap",
                        pol, exit, distance / WAVELENGTH);
                System.out.printf("energy %s: R %.6f T %.6f, R + T - 1 = %.3g%n", what, res.reflectance(),
                        res.transmittance(), res.reflectance() + res.transmittance() - 1);
                assertTrue(res.reflectance() > 0.05 && res.transmittance() > 0.05, what + ": both beams carry power");
                assertEquals(1, res.reflectance() + res.transmittance(), ENERGY, what + ": R + T");
            }
        }
    }

    /**
     * Artmann's shifts, written here from K. Artmann, Ann. Physik 2, 87 (1948), as reviewed by R. H. Renard,
     * J. Opt. Soc. Am. 54, 1190 (1964) (from memory): D_s = λ0 tan θ / (π sqrt(n1² sin²θ − n2²)),
     * D_p = D_s · m² / ((1 + m²) sin²θ − m²), m = n2/n1.
     */
    private static double artmann(Polarization pol, double n1, double n2, double theta) {
        double sin2 = Math.sin(theta) * Math.sin(theta);
        double ds = WAVELENGTH * Math.tan(theta) / (Math.PI * Math.sqrt(n1 * n1 * sin2 - n2 * n2));
        double m2 = n2 * n2 / (n1 * n1);
        return pol == Polarization.S ? ds : ds * m2 / ((1 + m2) * sin2 - m2);
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void theReflectedBeamShiftsByArtmannsAmount(Polarization pol) {
        double th = Math.toRadians(45);
        PlanarStack st = PlanarStack.interfaceBetween(1.5, Complex.real(1.0));
        double expected = artmann(pol, 1.5, 1.0, th);
        double[] rel = new double[2];
        double[] waists = {20, 50};
        double[] bars = {SHIFT_20, SHIFT_50};
        for (int i = 0; i < 2; i++) {
            AngularSpectrum.Result res = run(st, pol, new AngularSpectrum.GaussianBeam(waists[i] * WAVELENGTH, th, WAVELENGTH), 12);
            rel[i] = (res.reflectedShift() - expected) / expected;
            System.out.printf("Goos-Hanchen %s, 1.5 -> 1.0 at 45 deg, %g lambda waist: shift %.6f lambda, Artmann %.6f lambda,"
                    + " relative difference %.3g; R = %.12f%n", pol, waists[i], res.reflectedShift() / WAVELENGTH,
                    expected / WAVELENGTH, rel[i], res.reflectance());
            assertEquals(expected, res.reflectedShift(), bars[i] * expected,
                    String.format("%s, %g lambda waist: reflected centroid shift", pol, waists[i]));
        }
        assertTrue(Math.abs(rel[1]) < Math.abs(rel[0]),
                String.format("%s: the shift approaches Artmann's as the waist grows (%.3g at 20 lambda, %.3g at 50)",
                        pol, rel[0], rel[1]));
    }

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void aWideBeamReflectsWithItsShapeBelowTheCriticalAngle(Polarization pol) {
        double th = Math.toRadians(30); // critical angle 41.8 deg
        double w0 = 200 * WAVELENGTH;
        PlanarStack st = PlanarStack.interfaceBetween(1.5, Complex.real(1.0));
        AngularSpectrum.Result res = run(st, pol, new AngularSpectrum.GaussianBeam(w0, th, WAVELENGTH), 10);
        double r = st.atAngle(pol, WAVELENGTH, th).r().abs();
        double[] inc = res.incident();
        double[] ref = res.reflected();
        double peak = 0;
        for (int j = 0; j < res.samples(); j++) {
            peak = Math.max(peak, magnitude(inc, j));
        }
        double worstShape = 0;
        double worstGaussian = 0;
        double cos = Math.cos(th);
        for (int j = 0; j < res.samples(); j++) {
            double x = res.x(j);
            worstShape = Math.max(worstShape, Math.abs(magnitude(ref, j) - r * magnitude(inc, j)) / peak);
            // the waist lies on the interface: the tilted Gaussian with unit amplitude at its centre
            worstGaussian = Math.max(worstGaussian, Math.abs(magnitude(inc, j) - Math.exp(-x * x * cos * cos / (w0 * w0))));
        }
        double wInc = rmsWidth(res, inc);
        double wRef = rmsWidth(res, ref);
        System.out.printf("profiles %s, 1.5 -> 1.0 at 30 deg, 200 lambda: | |U_r| - |r| |U_i| | <= %.3g of peak, "
                + "| |U_i| - Gaussian | <= %.3g, widths %.6f and %.6f lambda (footprint/2 = %.6f)%n", pol, worstShape,
                worstGaussian, wInc / WAVELENGTH, wRef / WAVELENGTH, w0 / cos / 2 / WAVELENGTH);
        String what = pol + ", 200 lambda waist at 30 deg, 1.5 -> 1.0";
        assertTrue(worstShape <= PROFILE, what + ": reflected |U| is |r| times the incident |U|, off by " + worstShape);
        assertTrue(worstGaussian <= GAUSSIAN, what + ": incident |U| is the tilted Gaussian, off by " + worstGaussian);
        assertEquals(wInc, wRef, PROFILE * wInc, what + ": reflected width");
        // exp(−2x²cos²θ/w0²) has rms width w0/(2 cos θ)
        assertEquals(w0 / cos / 2, wInc, GAUSSIAN * wInc, what + ": incident width");
    }

    /**
     * A beam focused before the interface, at normal incidence into a matched medium, against the paraxial Gaussian
     * beam in one transverse dimension (A. E. Siegman, <i>Lasers</i>, 1986, ch. 16–17, from memory; the width and
     * curvature do not depend on the number of transverse dimensions): at a distance s past the waist,
     * w(s) = w0 sqrt(1 + (s/z_R)²), z_R = π w0² n1 / λ0, and with exp(−iωt) a diverging wavefront adds the phase
     * +k x² / (2 R(s)), R(s) = s (1 + (z_R/s)²).
     */
    @ParameterizedTest
    @EnumSource(Polarization.class)
    void aBeamFocusedBeforeTheInterfaceArrivesWiderAndDiverging(Polarization pol) {
        double n1 = 1.5;
        double w0 = 10 * WAVELENGTH;
        double zr = Math.PI * w0 * w0 * n1 / WAVELENGTH;
        PlanarStack st = PlanarStack.interfaceBetween(n1, Complex.real(n1));
        AngularSpectrum.Result res = run(st, pol, new AngularSpectrum.GaussianBeam(w0, 0, WAVELENGTH, zr), 20);
        double expectedWidth = w0 * Math.sqrt(2);
        double width = 2 * rmsWidth(res, res.incident());
        double[] u = res.incident();
        int centre = res.samples() / 2; // x = 0
        assertEquals(0, res.x(centre), 1e-12 * WAVELENGTH);
        int off = (int) Math.round(expectedWidth / 2 / res.spacing());
        double x = res.x(centre + off);
        double phase = Complex.of(u[2 * (centre + off)], u[2 * (centre + off) + 1])
                .divide(Complex.of(u[2 * centre], u[2 * centre + 1])).arg();
        double k = n1 * 2 * Math.PI / WAVELENGTH;
        double expectedPhase = k * x * x / (2 * 2 * zr); // R(z_R) = 2 z_R
        System.out.printf("focused %s, 10 lambda waist, z_R before: width %.6f lambda (paraxial %.6f), "
                + "phase at x = %.3f lambda %.6f rad (paraxial %.6f); T = %.12f%n", pol, width / WAVELENGTH,
                expectedWidth / WAVELENGTH, x / WAVELENGTH, phase, expectedPhase, res.transmittance());
        assertEquals(expectedWidth, width, PARAXIAL * expectedWidth, pol + ": width one Rayleigh range from the waist");
        assertEquals(expectedPhase, phase, PARAXIAL * expectedPhase, pol + ": wavefront curvature, diverging");
        assertEquals(1, res.transmittance(), ENERGY, pol + ": a matched interface transmits everything");
    }

    @Test
    void samplingThatCannotHoldTheBeamIsRefused() {
        PlanarStack st = PlanarStack.interfaceBetween(1.5, Complex.real(1.0));
        AngularSpectrum.GaussianBeam beam = new AngularSpectrum.GaussianBeam(10 * WAVELENGTH, Math.toRadians(45), WAVELENGTH);
        // Δx = λ0/2 > λ0/(2 n1): the propagating spectrum does not fit
        IllegalArgumentException coarse = assertThrows(IllegalArgumentException.class,
                () -> AngularSpectrum.of(st, Polarization.S, beam, 512, 256 * WAVELENGTH));
        assertTrue(coarse.getMessage().contains("sample spacing"), coarse.getMessage());
        // 2 footprints: the periodic copies overlap
        IllegalArgumentException narrow = assertThrows(IllegalArgumentException.class,
                () -> AngularSpectrum.of(st, Polarization.S, beam, 1024, 2 * beam.footprint()));
        assertTrue(narrow.getMessage().contains("window"), narrow.getMessage());
    }
}
