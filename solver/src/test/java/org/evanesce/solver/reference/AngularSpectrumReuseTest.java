package org.evanesce.solver.reference;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The shortcuts of {@link AngularSpectrum#converged} against the plain computation (fast path against a naive
 * reference, common practice): each doubling takes the stack's responses at the kx it shares with the coarser
 * sampling instead of evaluating the stack again, and makes the profiles only for the sampling it returns; the
 * flux density and the shift on a segment are then taken from the spectra it kept. None of that may change a digit:
 * the result must equal a fresh {@link AngularSpectrum#of} at the returned sampling bit for bit, and the kept-spectra
 * forms must equal the forms that sample again (up to the last bits of the window W, which the plain forms get as
 * samples × spacing, so within {@link #RELATIVE}).
 *
 * <p>The stacks: a prism coupler with a film's guided mode across a 100 nm air gap (the resonance of
 * AngularSpectrumConvergenceTest, at a narrower gap so that it takes fewer doublings: a shorter test) and a smooth glass/air face beyond the critical
 * angle (one doubling), in s and p.
 */
class AngularSpectrumReuseTest {

    private static final double WAVELENGTH = 633e-9;
    /**
     * The kept-spectra forms against sampling again, relative to the largest value: they differ only through the
     * window's last bit (measured: below 1e-15); the bound the issue allows for any change to the reference.
     */
    private static final double RELATIVE = 1e-10;

    @ParameterizedTest(name = "{0}, {1} polarization")
    @CsvSource({"coupler, s", "coupler, p", "face, s", "face, p"})
    void shortcutsChangeNoDigit(String which, String polarization) {
        Polarization pol = Polarization.valueOf(polarization.toUpperCase(java.util.Locale.ROOT));
        boolean coupler = which.equals("coupler");
        PlanarStack stack = coupler
                ? new PlanarStack(1.8, List.of(new PlanarStack.Layer(Complex.ONE, 100e-9),
                        new PlanarStack.Layer(Complex.real(1.6), 500e-9)), Complex.real(1.45))
                : new PlanarStack(1.5, List.of(), Complex.ONE);
        AngularSpectrum.GaussianBeam beam = new AngularSpectrum.GaussianBeam(coupler ? 4e-6 : 1.5e-6,
                Math.toRadians(coupler ? 59 : 50), WAVELENGTH, 2e-6);
        double window = 24 * beam.footprint();
        double n1 = stack.incidentIndex();
        int samples = Integer.highestOneBit((int) Math.ceil(window / (WAVELENGTH / (4 * n1))) - 1) << 1;
        double[] distances = {3.25e-6, 0.8e-6};
        AngularSpectrum.Converged c = AngularSpectrum.converged(stack, pol, beam, samples, window, distances,
                new AngularSpectrum.Tolerance(1e-5, 1e-4 * beam.footprint()), 1 << 20);
        String where = which + ", " + pol + ": ";
        System.out.printf("AngularSpectrumReuseTest %s%d doublings, %d samples%n", where, c.doublings(), c.result().samples());
        assertTrue(c.converged() && c.doublings() >= (coupler ? 2 : 1), where + "converged after " + c.doublings()
                + " doublings (the reuse is exercised over several)");

        AngularSpectrum.Result got = c.result();
        int n = got.samples();
        double w = -2 * got.start();
        AngularSpectrum.Result fresh = AngularSpectrum.of(stack, pol, beam, n, w);
        assertEquals(fresh.reflectance(), got.reflectance(), 0, where + "R");
        assertEquals(fresh.transmittance(), got.transmittance(), 0, where + "T");
        assertEquals(fresh.reflectedShift(), got.reflectedShift(), 0, where + "reflected shift");
        assertArrayEquals(fresh.incident(), got.incident(), 0, where + "incident profile");
        assertArrayEquals(fresh.reflected(), got.reflected(), 0, where + "reflected profile");
        assertArrayEquals(fresh.transmitted(), got.transmitted(), 0, where + "transmitted profile");
        for (int k = 0; k < distances.length; k++) {
            assertEquals(AngularSpectrum.reflectedCentroid(stack, pol, beam, n, w, distances[k]), c.reflectedCentroids()[k],
                    0, where + "reflected centroid at " + distances[k]);
            assertEquals(AngularSpectrum.specularCentroid(stack, pol, beam, n, w, distances[k]), c.specularCentroids()[k],
                    0, where + "specular centroid at " + distances[k]);
        }

        double spacingWindow = n * got.spacing();
        for (boolean mirrored : new boolean[] {false, true}) {
            double[] a = AngularSpectrum.fluxDensity(stack, pol, beam, n, spacingWindow, distances[0], mirrored);
            double[] b = AngularSpectrum.fluxDensity(stack, pol, beam, c, distances[0], mirrored);
            double peak = 0;
            for (double v : a) {
                peak = Math.max(peak, Math.abs(v));
            }
            assertArrayEquals(a, b, RELATIVE * peak, where + "flux density, mirrored " + mirrored);
        }
        double from = -4 * beam.footprint();
        double to = 6 * beam.footprint();
        double plain = AngularSpectrum.shiftOnSegment(stack, pol, beam, n, spacingWindow, distances[0], from, to);
        double kept = AngularSpectrum.shiftOnSegment(stack, pol, beam, c, distances[0], from, to);
        assertEquals(plain, kept, RELATIVE * beam.footprint(), where + "shift on a segment");
    }
}
