package org.evanesce.solver.farfield;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * One period of a Bloch-periodic line holding two plane waves leaving at the angles of two Bloch orders, κ = κ_B and
 * κ_B + 2π/L, with κ_B not a multiple of 2π/L: with the offset each lands in one bin with its own power (the
 * plane-wave intensity n cos θ |E|²/(2η0) for s, cos θ |η0H|²/(2 n η0) for p, times the period; Born &amp; Wolf sec.
 * 1.4, common practice), where bins at 2πm/L would spread them over all bins.
 */
class LineSpectrumBlochTest {

    private static final double LAMBDA = 633e-9;
    private static final double N = 1.5;
    private static final double K = N * 2 * Math.PI / LAMBDA;
    private static final int SAMPLES = 40;
    private static final double SPACING = LAMBDA / N / 20;
    private static final double PERIOD = SAMPLES * SPACING;

    /** Order powers against the closed form: sums over whole periods, exact but for rounding (measured 6e-16); 10x that. */
    private static final double ORDER = 1e-14;

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void eachBlochOrderLandsInOneBinWithItsPower(Polarization pol) {
        double kb = 0.37 * K;
        double[] kap = {kb, kb + 2 * Math.PI / PERIOD};
        double[] amp = {1.0, 0.4};
        double first = -0.3 * PERIOD;
        double[] ur = new double[SAMPLES];
        double[] ui = new double[SAMPLES];
        double[] vr = new double[SAMPLES];
        double[] vi = new double[SAMPLES];
        double k0 = 2 * Math.PI / LAMBDA;
        for (int j = 0; j < SAMPLES; j++) {
            double s = first + j * SPACING;
            for (int o = 0; o < 2; o++) {
                double kn = Math.sqrt(K * K - kap[o] * kap[o]);
                // leaving upwards (TOP, χ = +1): V = q U, q = k_n/k0 (s) or −k_n/(k0 n²) (p)
                double q = pol == Polarization.S ? kn / k0 : -kn / (k0 * N * N);
                ur[j] += amp[o] * Math.cos(kap[o] * s);
                ui[j] += amp[o] * Math.sin(kap[o] * s);
                vr[j] += q * amp[o] * Math.cos(kap[o] * s);
                vi[j] += q * amp[o] * Math.sin(kap[o] * s);
            }
        }
        LineSpectrum ls = LineSpectrum.of(pol, LAMBDA, N, Side.TOP, first, SPACING, ur, ui, vr, vi, kb, 1);
        double[] w = ls.wavenumbers();
        double[] d = ls.outgoingPerRadian();
        double total = 0;
        for (int o = 0; o < 2; o++) {
            double cos = Math.sqrt(1 - kap[o] * kap[o] / (K * K));
            double intensity = (pol == Polarization.S ? N : 1 / N) * cos * amp[o] * amp[o] / (2 * PhysicalConstants.ETA0);
            int bin = -1;
            for (int b = 0; b < w.length; b++) {
                if (Math.abs(w[b] - kap[o]) < 1e-9 * K) {
                    bin = b;
                }
            }
            // a bin's power: dP/dθ · Δκ / (k cos θ)
            double power = d[bin] * ls.binWidth() / (K * cos);
            assertEquals(intensity * PERIOD, power, ORDER * intensity * PERIOD, pol + " order " + o);
            total += intensity * PERIOD;
        }
        assertEquals(total, ls.outgoingPower(), ORDER * total, pol + ": the orders hold all the power");
    }
}
