package org.evanesce.geometry.dispersion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.PhysicalConstants;
import org.junit.jupiter.api.Test;

/** Conventions, units and validation of the continuous model. */
class DispersiveMaterialTest {

    /** Rounding of a few operations on values of order 1. */
    static final double ROUNDING = 1e-13;

    @Test
    void electronVoltConversionIsCodata() {
        // e/ħ = 1.519 267 447 e15 rad/s per eV (CODATA 2018, from memory); 1 eV ↔ 1239.841 98 nm (hc/e)
        assertEquals(1.519267447e15, Spectral.omegaOfElectronVolts(1), 1e6);
        double lambda = Spectral.wavelengthOfOmega(Spectral.omegaOfElectronVolts(1));
        assertEquals(1239.84198e-9, lambda, 1e-14);
        assertEquals(9.03, Spectral.electronVoltsOfOmega(DrudeTerm.ofElectronVolts(9.03, 0).plasmaFrequency()), 1e-12);
    }

    @Test
    void lossIsPositiveImaginaryPartForExpMinusIOmegaT() {
        // Drude with damping: ε = 1 − ωp²/(ω² + iγω) has Im ε = γωp²/(ω(ω² + γ²)) > 0
        DispersiveMaterial d = new DispersiveMaterial("d", 1, 0, List.of(new DrudeTerm(1e16, 1e14)), List.of());
        double w = 3e15;
        Complex e = d.permittivity(w);
        assertEquals(1 - 1e32 / (w * w + 1e28), e.re(), ROUNDING * 20);
        assertEquals(1e14 * 1e32 / (w * (w * w + 1e28)), e.im(), ROUNDING);
        // conductivity: iσ/(ε0ω)
        DispersiveMaterial c = new DispersiveMaterial("c", 2.25, 1e4, List.of(), List.of());
        assertEquals(1e4 / (PhysicalConstants.EPS0 * w), c.permittivity(w).im(), 1e-12);
        // random passive models: Im ε ≥ 0 and κ ≥ 0 everywhere
        Random rnd = new Random(3);
        for (int i = 0; i < 200; i++) {
            DispersiveMaterial m = AdeStabilityTest.randomMaterial(rnd, 1 + rnd.nextDouble(), true);
            double omega = AdeStabilityTest.logUniform(rnd, 1e12, 1e17);
            assertTrue(m.permittivity(omega).im() >= 0, m + " at " + omega);
            assertTrue(m.index(omega).im() >= 0);
            assertTrue(m.isPassive());
        }
    }

    @Test
    void lorentzWithoutResonanceIsDrudeAndOscillatorFormMatchesStrength() {
        DrudeTerm d = new DrudeTerm(8e15, 2e14);
        LorentzTerm l = new LorentzTerm(64e30, 0, 2e14);
        Complex a = d.susceptibility(2e15);
        Complex b = l.susceptibility(2e15);
        assertEquals(a.re(), b.re(), Math.abs(a.re()) * ROUNDING);
        assertEquals(a.im(), b.im(), Math.abs(a.im()) * ROUNDING);
        // Rakić's f ωp² / (ω0² − ω² − iγω) is Δε ω0² / (…) with Δε = f ωp²/ω0²
        LorentzTerm r = LorentzTerm.ofOscillatorElectronVolts(0.601, 9.03, 4.304, 2.494);
        assertEquals(0.601 * 9.03 * 9.03 / (4.304 * 4.304), r.strength(), 1e-12);
        // static limit: ε(ω → 0) of a Lorentz term is Δε
        LorentzTerm s = LorentzTerm.ofStrength(2.5, 1e15, 1e14);
        assertEquals(2.5, s.susceptibility(1e9).re(), 1e-9);
    }

    @Test
    void indexIsTheUpperRoot() {
        DispersiveMaterial gold = MetalLibrary.get("gold").material();
        double w = Spectral.omegaOfWavelength(633e-9);
        Complex n = gold.index(w);
        Complex back = n.square();
        Complex eps = gold.permittivity(w);
        assertTrue(n.re() > 0 && n.im() > 0);
        assertEquals(eps.re(), back.re(), 1e-12 * eps.abs());
        assertEquals(eps.im(), back.im(), 1e-12 * eps.abs());
        // a lossless dielectric: the positive root
        Complex glass = DispersiveMaterial.of(Material.ofIndex("glass", 1.515)).index(w);
        assertEquals(1.515, glass.re(), 1e-15);
        assertEquals(0, glass.im());
        // a lossless plasma below its plasma frequency: purely imaginary index, κ > 0
        Complex plasma = new DispersiveMaterial("p", 1, 0, List.of(new DrudeTerm(1e16, 0)), List.of()).index(1e15);
        assertEquals(0, plasma.re(), 1e-15);
        assertEquals(Math.sqrt(99), plasma.im(), 1e-12);
    }

    @Test
    void discreteIndexTendsToTheContinuousOne() {
        DispersiveMaterial gold = MetalLibrary.get("gold").material();
        double w = Spectral.omegaOfWavelength(633e-9);
        double dt = 0.5 * 633e-9 / 1000 / PhysicalConstants.C0;
        Complex nd = gold.discreteIndex(w, dt);
        Complex nc = gold.index(w);
        // at 1000 cells per wavelength the warping (ωΔt)²/12 ≈ 8e-7 moves ε by about that much relative
        assertTrue(nd.minus(nc).abs() / nc.abs() < 1e-5, nd + " vs " + nc);
        assertThrows(IllegalArgumentException.class, () -> gold.discretePermittivity(w, Math.PI / w));
    }

    @Test
    void courantLimitFollowsTheBackground() {
        assertEquals(1 / Math.sqrt(2), MetalLibrary.get("silver").material().courantLimit(2), 1e-15);
        assertEquals(0.5, new DispersiveMaterial("x", 0.5, 0, List.of(), List.of()).courantLimit(2), 1e-15);
    }

    @Test
    void badParametersAreRefusedWithTheirValues() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new DrudeTerm(1e16, -1));
        assertTrue(e.getMessage().contains("Drude damping") && e.getMessage().contains("-1"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> new DispersiveMaterial("m", 0, 0, List.of(), List.of()));
        assertTrue(e.getMessage().contains("'m'") && e.getMessage().contains("ε∞"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> LorentzTerm.ofStrength(-1, 1e15, 0));
        assertThrows(IllegalArgumentException.class, () -> new LorentzTerm(Double.NaN, 1e15, 0));
        assertTrue(!new DispersiveMaterial("gain", 2, -5, List.of(), List.of()).isPassive());
    }

    @Test
    void coefficientsWithoutPolesAreTheLossyDielectricOnes() {
        // Taflove & Hagness ch. 3 lossy-dielectric update, the form Engine uses: ca = (1 − L)/(1 + L),
        // cb = S/(εr(1 + L)), L = σΔt/(2ε0εr); equal bit for bit (the same operations)
        double s = 0.5;
        double dt = 1e-17;
        double eps = 2.25;
        double sigma = 3e4;
        AdeCoefficients c = AdeCoefficients.of(new DispersiveMaterial("g", eps, sigma, List.of(), List.of()), s, dt);
        double l = sigma * dt / (2 * PhysicalConstants.EPS0 * eps);
        assertEquals((1 - l) / (1 + l), c.ca());
        assertEquals(s / (eps * (1 + l)), c.cb());
        assertEquals(0, c.stateSize());
    }
}
