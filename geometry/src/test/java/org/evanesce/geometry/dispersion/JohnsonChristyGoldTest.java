package org.evanesce.geometry.dispersion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.junit.jupiter.api.Test;

/**
 * The recalled Johnson &amp; Christy gold table (P. B. Johnson &amp; R. W. Christy, Phys. Rev. B 6, 4370
 * (1972)), checked for consistency as far as can be done without the paper: against the two rows the
 * issue quotes (recalled independently), for smoothness, for a free-electron infrared with the
 * plasma frequency gold's electron density gives, for consistency with a causal passive model
 * (Kramers–Kronig), and against Rakić's model.
 */
class JohnsonChristyGoldTest {

    static NkTable.Row row(double nm) {
        for (NkTable.Row r : MetalLibrary.johnsonChristyGold().rows()) {
            if (Math.abs(r.wavelength() * 1e9 - nm) < 0.05) {
                return r;
            }
        }
        throw new AssertionError("no row at " + nm + " nm");
    }

    @Test
    void rowsQuotedByTheIssue() {
        // issue 15 (recalled by its author): n 0.21, k 3.272 at 616.8 nm; n 0.14, k 3.697 at 659.5 nm
        assertEquals(0.21, row(616.8).n());
        assertEquals(3.272, row(616.8).k());
        assertEquals(0.14, row(659.5).n());
        assertEquals(3.697, row(659.5).k());
        // interpolated linearly in wavelength to 632.8 nm: the issue's ε ≈ −11.7 + 1.26i
        Complex e = interpolated(632.8);
        System.out.printf("J&C gold interpolated at 632.8 nm: ε = %s, n = %s%n", e, e.sqrtUpper());
        assertEquals(-11.7, e.re(), 0.15);
        assertEquals(1.26, e.im(), 0.03);
    }

    static Complex interpolated(double nm) {
        NkTable.Row a = row(659.5);
        NkTable.Row b = row(616.8);
        double f = (nm * 1e-9 - b.wavelength()) / (a.wavelength() - b.wavelength());
        return b.permittivity().times(1 - f).plus(a.permittivity().times(f));
    }

    /**
     * Smoothness: the table's energies are about 0.125 eV apart, and away from the interband edge
     * (about 2.4 eV, below 540 nm) gold's dielectric function has no feature that narrow, so the
     * second difference of κ along the table is a small fraction of κ: measured at most 0.047 in
     * 540–1400 nm (0.144 at the edge, 0.078 at the table's infrared end, both left out). A mistyped
     * digit in a recalled row shows: κ 3.697 → 3.967 at 659.5 nm gives 0.14 there.
     */
    static final double SMOOTHNESS = 0.06;

    @Test
    void theTableIsSmooth() {
        List<NkTable.Row> rows = MetalLibrary.johnsonChristyGold().rows();
        double worst = 0;
        for (int i = 1; i + 1 < rows.size(); i++) {
            double nm = rows.get(i).wavelength() * 1e9;
            if (nm > 540 && nm < 1400) {
                double d2 = rows.get(i + 1).k() - 2 * rows.get(i).k() + rows.get(i - 1).k();
                worst = Math.max(worst, Math.abs(d2) / rows.get(i).k());
            }
        }
        System.out.printf("J&C gold 540-1400 nm: largest |Δ²κ|/κ = %.3f%n", worst);
        assertTrue(worst <= SMOOTHNESS, "largest |Δ²κ|/κ " + worst);
    }

    /**
     * Infrared rows (0.64–1.26 eV) follow the free-electron form Re ε = ε_b − ωp²/ω²; ωp should be
     * near gold's free-electron value √(ne²/(ε0 m)) with one conduction electron per atom,
     * n = ρN_A/M = 19.3 g/cm³ × 6.022e23 / 196.97 g/mol = 5.90e28 m⁻³ (density and molar mass
     * from memory, handbook values): ħωp = 9.02 eV. Measured fit: 9.07 eV from the 6 rows above
     * 980 nm (the fit's ε_b absorbs the interband background). Allowed: ±0.6 eV (an effective mass within about 15 % of m).
     */
    static final double PLASMA_TOLERANCE_EV = 0.6;

    @Test
    void infraredIsFreeElectronLike() {
        double e = PhysicalConstants.ELEMENTARY_CHARGE;
        double n = 19.3e3 * 6.02214076e23 / 196.97e-3;
        double me = 9.1093837015e-31;
        double expected = Spectral.electronVoltsOfOmega(Math.sqrt(n * e * e / (PhysicalConstants.EPS0 * me)));
        // least squares of Re ε against 1/ω² over the infrared rows
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        int m = 0;
        for (NkTable.Row r : MetalLibrary.johnsonChristyGold().rows()) {
            if (r.wavelength() > 980e-9) {
                double x = 1 / Math.pow(Spectral.electronVoltsOfOmega(r.omega()), 2);
                double y = r.permittivity().re();
                sx += x;
                sy += y;
                sxx += x * x;
                sxy += x * y;
                m++;
            }
        }
        double slope = (m * sxy - sx * sy) / (m * sxx - sx * sx);
        double plasma = Math.sqrt(-slope);
        System.out.printf("J&C gold infrared: ħωp = %.3f eV from %d rows; free-electron value %.3f eV%n",
                plasma, m, expected);
        assertEquals(expected, plasma, PLASMA_TOLERANCE_EV);
    }

    /**
     * Kramers–Kronig plausibility: a passive Drude–Lorentz model is causal, so its ε satisfies the
     * Kramers–Kronig relations by construction; that one fits the whole 381–1937 nm table within a few
     * percent shows the recalled n and κ are consistent with each other (a wrong κ in one row would
     * stand out as a local misfit). Measured worst 0.047 at 520.9 nm (one Drude, two Lorentz terms).
     */
    static final double CAUSAL_FIT_TOLERANCE = 0.08;

    @Test
    void aCausalModelFitsTheWholeTable() {
        NkTable jc = MetalLibrary.johnsonChristyGold();
        PoleFit.Result r = PoleFit.fit("kk", jc, jc.span(), CAUSAL_FIT_TOLERANCE);
        System.out.printf("J&C gold 381-1937 nm, causal passive fit: worst %.4f at %.1f nm, %d Lorentz terms%n",
                r.worstError(), r.worst().row().wavelength() * 1e9, r.material().lorentz().size());
        assertTrue(r.worstError() <= CAUSAL_FIT_TOLERANCE);
    }

    /**
     * Rakić's gold against Johnson &amp; Christy at 632.8 nm: the issue says multi-oscillator fits to
     * other data differ by 10–20 % in Re ε. Measured: Rakić −9.81 + 1.96i against −11.78 + 1.25i,
     * Re ε 16.7 % less negative.
     */
    @Test
    void rakicAndJohnsonChristyDifferAsKnown() {
        Complex jc = interpolated(632.8);
        Complex rakic = MetalLibrary.get("gold").material().permittivityAtWavelength(632.8e-9);
        double reDiff = (rakic.re() - jc.re()) / Math.abs(jc.re());
        System.out.printf("gold at 632.8 nm: Rakić %s, J&C %s, Re ε differs by %.1f %%, |Δε|/|ε| = %.3f%n",
                rakic, jc, 100 * reDiff, rakic.minus(jc).abs() / jc.abs());
        assertTrue(reDiff > 0.10 && reDiff < 0.20, "Re ε difference " + reDiff);
    }
}
