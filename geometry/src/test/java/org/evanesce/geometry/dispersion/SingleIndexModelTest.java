package org.evanesce.geometry.dispersion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.junit.jupiter.api.Test;

/**
 * One measured index → a passive model exact at its wavelength. The Drude closed form is checked by
 * evaluating the model back (an independent path: {@link DrudeTerm#susceptibility}).
 */
class SingleIndexModelTest {

    /** Reproduction at the measured wavelength: rounding of the closed form (measured about 1e-16). */
    static final double EXACT = 1e-12;

    @Test
    void goldAt633IsReproducedByADrudeTermAndIsPassiveEverywhere() {
        // n = 0.18 + 3.43i at 633 nm: Johnson & Christy's gold interpolated (issue 15's example)
        SingleIndexModel m = SingleIndexModel.of("gold-633", 0.18, 3.43, 633e-9);
        assertEquals(SingleIndexModel.Kind.DRUDE, m.kind());
        Complex want = new Complex(0.18, 3.43).square();
        Complex got = m.material().permittivityAtWavelength(633e-9);
        assertEquals(0, got.minus(want).abs() / want.abs(), EXACT);
        Complex n = m.material().index(Spectral.omegaOfWavelength(633e-9));
        assertEquals(0.18, n.re(), EXACT);
        assertEquals(3.43, n.im(), EXACT);
        assertPassiveEverywhere(m.material());
        Complex[] ends = m.atBandEnds(WavelengthBand.ofNanometres(500, 800));
        DrudeTerm d = m.material().drude().get(0);
        System.out.printf("gold 0.18+3.43i at 633 nm → Drude ħωp = %.4f eV, ħγ = %.4f eV; ε(500 nm) = %s,"
                        + " ε(800 nm) = %s%n", Spectral.electronVoltsOfOmega(d.plasmaFrequency()),
                Spectral.electronVoltsOfOmega(d.damping()), ends[0], ends[1]);
        // a Drude metal is more negative at longer wavelengths
        assertTrue(ends[1].re() < got.re() && got.re() < ends[0].re());
        // its provenance says it is a single-wavelength model: no band of a run is covered
        SourcedMaterial src = m.sourced("gold-633", "index: 0.18+3.43i at 633 nm");
        assertTrue(src.covers(new WavelengthBand(633e-9, 633e-9)));
        assertTrue(!src.covers(WavelengthBand.ofNanometres(630, 640)));
        assertTrue(src.notes().contains("single-wavelength"), src.notes());
    }

    @Test
    void lossyDielectricBecomesBackgroundAndConductivity() {
        SingleIndexModel m = SingleIndexModel.of("lossy glass", 1.5, 0.01, 800e-9);
        assertEquals(SingleIndexModel.Kind.CONDUCTIVE, m.kind());
        Complex want = new Complex(1.5, 0.01).square();
        Complex got = m.material().permittivityAtWavelength(800e-9);
        assertEquals(0, got.minus(want).abs() / want.abs(), EXACT);
        assertPassiveEverywhere(m.material());
        // Re ε just above 1 with no loss: still the background form, σ = 0
        SingleIndexModel air = SingleIndexModel.of("air", 1.0003, 0, 633e-9);
        assertEquals(SingleIndexModel.Kind.CONDUCTIVE, air.kind());
        assertEquals(0, air.material().conductivity());
        // Re ε < 1 without loss: an undamped Drude term
        SingleIndexModel plasma = SingleIndexModel.of("plasma", 0.5, 0, 633e-9);
        assertEquals(0, plasma.material().drude().get(0).damping());
        assertEquals(0.25, plasma.material().permittivityAtWavelength(633e-9).re(), EXACT);
    }

    @Test
    void gainAndNonsenseAreRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> SingleIndexModel.of("bad", 0.2, -3, 633e-9));
        assertTrue(e.getMessage().contains("gain"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> SingleIndexModel.of("bad", 0, 0, 633e-9));
        assertThrows(IllegalArgumentException.class, () -> SingleIndexModel.of("bad", 1, 1, -1));
    }

    /** Im ε ≥ 0 on a logarithmic sweep 1e11 – 1e18 rad/s (the analytic proof: every term's Im ≥ 0). */
    static void assertPassiveEverywhere(DispersiveMaterial m) {
        assertTrue(m.isPassive());
        for (int i = 0; i <= 700; i++) {
            double w = Math.pow(10, 11 + i / 100.0);
            assertTrue(m.permittivity(w).im() >= 0, m.name() + " at " + w + " rad/s");
        }
    }
}
