package org.evanesce.geometry.dispersion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.junit.jupiter.api.Test;

/**
 * The discrete model's permittivity ε_d(ω, Δt) = ε((2/Δt) tan(ωΔt/2)) (derived in
 * {@link AdeCoefficients}) against (i) the continuous ε as Δt → 0, at second order, and (ii) what
 * the reference post-pass actually does when driven by a sinusoidal field (0-D, no space): the
 * "curl" each step implies is fitted by least squares in the steady state and turned into a
 * permittivity through the discrete Ampère law −iΩε0ε_d E = ∇×H, Ω = (2/Δt) sin(ωΔt/2), the same
 * Ω as the vacuum Yee update (Taflove &amp; Hagness 3rd ed. ch. 4, from memory).
 */
class DiscretePermittivityTest {

    /**
     * Time-domain extraction against the formula: the issue asks 1e-6 relative for this exact 0-D
     * check. Measured: 5.2e-11 at worst (the ramp's transient left in the window, and rounding).
     */
    static final double EXTRACTION_TOLERANCE = 1e-6;
    /** Fitted convergence order of |ε_d − ε| as Δt halves: 2 expected; measured 1.9995–2.0021. */
    static final double ORDER_TOLERANCE = 0.05;

    static final double LAMBDA = 633e-9;

    static List<DispersiveMaterial> models() {
        return List.of(MetalLibrary.get("gold").material(), MetalLibrary.get("silver").material(),
                MetalLibrary.get("chromium").material(),
                new DispersiveMaterial("lossy Drude + Lorentz", 2.5, 3e5,
                        List.of(DrudeTerm.ofElectronVolts(6, 0.2)),
                        List.of(LorentzTerm.ofStrengthElectronVolts(1.5, 3.0, 0.5))));
    }

    @Test
    void discreteTendsToContinuousAtSecondOrder() {
        double omega = Spectral.omegaOfWavelength(LAMBDA);
        for (DispersiveMaterial m : models()) {
            Complex exact = m.permittivity(omega);
            int levels = 6;
            double[] logDt = new double[levels];
            double[] logErr = new double[levels];
            for (int i = 0; i < levels; i++) {
                double cells = 10 * Math.pow(2, i); // 10 … 320 cells per wavelength at S = 0.5
                double dt = 0.5 * LAMBDA / cells / PhysicalConstants.C0;
                double err = m.discretePermittivity(omega, dt).minus(exact).abs();
                logDt[i] = Math.log(dt);
                logErr[i] = Math.log(err);
            }
            double order = slope(logDt, logErr);
            System.out.printf("%s: ε(633 nm) = %s, fitted order of |ε_d − ε| = %.4f%n", m.name(), exact, order);
            assertEquals(2, order, ORDER_TOLERANCE, m.name());
        }
    }

    /** Least-squares slope of y against x. */
    static double slope(double[] x, double[] y) {
        double mx = 0;
        double my = 0;
        for (int i = 0; i < x.length; i++) {
            mx += x[i] / x.length;
            my += y[i] / x.length;
        }
        double sxy = 0;
        double sxx = 0;
        for (int i = 0; i < x.length; i++) {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
        }
        return sxy / sxx;
    }

    @Test
    void timeDomainExtractionMatchesTheFormula() {
        double worst = 0;
        for (DispersiveMaterial m : models()) {
            for (double cells : new double[] {5, 20, 60}) {
                for (double wavelength : new double[] {450e-9, 633e-9, 1000e-9}) {
                    double s = 0.6;
                    double dt = s * 633e-9 / cells / PhysicalConstants.C0;
                    double omega = Spectral.omegaOfWavelength(wavelength);
                    Complex extracted = extract(m, s, dt, omega);
                    Complex formula = m.discretePermittivity(omega, dt);
                    double rel = extracted.minus(formula).abs() / formula.abs();
                    worst = Math.max(worst, rel);
                    assertTrue(rel < EXTRACTION_TOLERANCE, String.format(
                            "%s, %g cells per 633 nm, %g nm: extracted %s, formula %s, relative difference %g",
                            m.name(), cells, wavelength * 1e9, extracted, formula, rel));
                }
            }
        }
        System.out.printf("time-domain extraction against ε_d formula: worst relative difference %.3g%n", worst);
    }

    /**
     * Drives one cell's post-pass so that E^n = r(n)·cos(ωnΔt) (r a smooth ramp over 2000 steps),
     * records the curl each step implies (e_ord = ca'·E^n + cb'·curl with e_ord chosen so that the
     * post-pass returns the prescribed E^{n+1}), fits curl^{n+½} = Re(C·exp(−iω(n+½)Δt)) over the last
     * 20 000 steps, and returns ε_d = S·C/(−2i sin(ωΔt/2)) (Ampère's law with E amplitude 1).
     */
    static Complex extract(DispersiveMaterial m, double s, double dt, double omega) {
        AdeCoefficients c = AdeCoefficients.of(m, s, dt);
        double[] state = new double[c.stateSize()];
        int steps = 40_000;
        int ramp = 2000;
        int fitFrom = steps - 20_000;
        // normal equations of curl ≈ A cos φ + B sin φ, φ = ω(n+½)Δt
        double scc = 0;
        double sss = 0;
        double scs = 0;
        double syc = 0;
        double sys = 0;
        for (int n = 0; n < steps; n++) {
            double eNow = state[0];
            double target = envelope(n + 1, ramp) * Math.cos(omega * (n + 1) * dt);
            double eOrd = target + AdeCoefficients.correction(c, state, 0);
            double curl = (eOrd - c.ca() * eNow) / c.cb();
            double e1 = AdeCoefficients.postPass(c, state, 0, eOrd);
            if (Math.abs(e1 - target) > 1e-12) {
                throw new AssertionError("post-pass did not return the prescribed field at step " + n);
            }
            if (n >= fitFrom) {
                double phi = omega * (n + 0.5) * dt;
                double cs = Math.cos(phi);
                double sn = Math.sin(phi);
                scc += cs * cs;
                sss += sn * sn;
                scs += cs * sn;
                syc += curl * cs;
                sys += curl * sn;
            }
        }
        double det = scc * sss - scs * scs;
        double a = (syc * sss - sys * scs) / det;
        double b = (sys * scc - syc * scs) / det;
        // A cos φ + B sin φ = Re((A + iB) e^{−iφ})
        Complex amp = new Complex(a, b);
        Complex denom = new Complex(0, -2 * Math.sin(omega * dt / 2));
        return amp.times(s).divide(denom);
    }

    /** 0 → 1 over {@code ramp} steps (raised cosine), then 1. */
    static double envelope(int n, int ramp) {
        return n >= ramp ? 1 : 0.5 * (1 - Math.cos(Math.PI * n / ramp));
    }
}
