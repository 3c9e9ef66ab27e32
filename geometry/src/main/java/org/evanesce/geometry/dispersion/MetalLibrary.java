package org.evanesce.geometry.dispersion;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Common metals for optics.
 *
 * <h2>Rakić et al. (1998), Lorentz–Drude fits</h2>
 * {@code gold}, {@code silver}, {@code aluminium}, {@code copper}, {@code chromium}, {@code titanium}:
 * the Lorentz–Drude (LD) parameters of A. D. Rakić, A. B. Djurišić, J. M. Elazar, M. L. Majewski,
 * "Optical properties of metallic films for vertical-cavity optoelectronic devices", Appl. Opt. 37,
 * 5271 (1998), their table of ωp, f_j, Γ_j, ω_j (eV), in
 * <pre>
 *     ε(ω) = 1 − f0 ωp²/(ω² + iΓ0 ω) + Σ_{j≥1} f_j ωp²/(ω_j² − ω² − iΓ_j ω)      (exp(−iωt))
 * </pre>
 * <b>All parameters are recalled from memory</b>, not read from the paper: they are the values as
 * widely reproduced, and the tests check them against measured data (also recalled) within the
 * accuracy such fits have. What the paper fitted, as recalled: optical constants compiled in
 * E. D. Palik (ed.), <i>Handbook of Optical Constants of Solids</i> (1985) and <i>II</i> (1991), over
 * "a wide spectral range from 0.1 to 6 eV" (the abstract's words as recalled), i.e. about
 * 207 nm to 12.4 µm, which is the validity band given here; the per-metal ranges in the paper may be
 * narrower. The paper also fitted a Brendel–Bormann model (Gaussian-broadened oscillators) and
 * concluded that the noble metals' interband absorption needs it: the LD fits of gold, silver and
 * copper are the weaker ones below about 550 nm. Only LD is offered here, because its terms are
 * the ones the time stepping supports.
 *
 * <h2>Johnson &amp; Christy gold</h2>
 * {@code gold-jc}: the measured table of P. B. Johnson &amp; R. W. Christy, "Optical constants of the
 * noble metals", Phys. Rev. B 6, 4370 (1972) ({@link #johnsonChristyGold()}, rows recalled from
 * memory) and a model fitted to it over 400–1000 nm by {@link PoleFit}. The two gold models differ
 * by 15–20 % in Re ε in the red and near infrared (at 633 nm: Rakić −9.8 + 2.0i, Johnson &amp;
 * Christy about −11.8 + 1.25i), which moves a plasmon resonance by degrees: a case must say which
 * it uses.
 */
public final class MetalLibrary {

    /** Citation of the LD fits. */
    public static final String RAKIC = "A. D. Rakić, A. B. Djurišić, J. M. Elazar, M. L. Majewski, \"Optical properties"
            + " of metallic films for vertical-cavity optoelectronic devices\", Appl. Opt. 37, 5271 (1998),"
            + " Lorentz-Drude model (parameters recalled from memory)";
    /** Citation of the measured gold table. */
    public static final String JOHNSON_CHRISTY = "P. B. Johnson and R. W. Christy, \"Optical constants of the noble"
            + " metals\", Phys. Rev. B 6, 4370 (1972)";
    /** What the LD fits were fitted to, as recalled. */
    public static final String RAKIC_DATA = "optical constants compiled in E. D. Palik (ed.), Handbook of Optical"
            + " Constants of Solids (1985, 1991), 0.1-6 eV (as recalled from the paper; not verified)";
    /** The band of the LD fits: 0.1–6 eV. */
    public static final WavelengthBand RAKIC_BAND = WavelengthBand.ofElectronVolts(0.1, 6.0);
    /** The band over which {@code gold-jc} is fitted. */
    public static final WavelengthBand JC_FIT_BAND = WavelengthBand.ofNanometres(400, 1000);

    private static final String NOBLE_NOTE = "LD fit; the paper found it weaker than its Brendel-Bormann fit in the"
            + " interband region (below about 550 nm)";

    private MetalLibrary() {
    }

    /** The library's keys. */
    public static List<String> keys() {
        return List.of("gold", "silver", "aluminium", "copper", "chromium", "titanium", "gold-jc");
    }

    /**
     * The library entry {@code key} (case-insensitive; {@code aluminum} is accepted).
     *
     * @throws IllegalArgumentException for an unknown key, listing the known ones
     */
    public static SourcedMaterial get(String key) {
        String k = key.toLowerCase(Locale.ROOT);
        return switch (k) {
            case "gold" -> rakic("gold", 9.03, NOBLE_NOTE,
                    0.760, 0.053, 0,
                    0.024, 0.241, 0.415,
                    0.010, 0.345, 0.830,
                    0.071, 0.870, 2.969,
                    0.601, 2.494, 4.304,
                    4.384, 2.214, 13.32);
            case "silver" -> rakic("silver", 9.01, NOBLE_NOTE,
                    0.845, 0.048, 0,
                    0.065, 3.886, 0.816,
                    0.124, 0.452, 4.481,
                    0.011, 0.065, 8.185,
                    0.840, 0.916, 9.083,
                    5.646, 2.419, 20.29);
            case "aluminium", "aluminum" -> rakic("aluminium", 14.98, "LD fit",
                    0.523, 0.047, 0,
                    0.227, 0.333, 0.162,
                    0.050, 0.312, 1.544,
                    0.166, 1.351, 1.808,
                    0.030, 3.382, 3.473);
            case "copper" -> rakic("copper", 10.83, NOBLE_NOTE,
                    0.575, 0.030, 0,
                    0.061, 0.378, 0.291,
                    0.104, 1.056, 2.957,
                    0.723, 3.213, 5.300,
                    0.638, 4.305, 11.18);
            case "chromium" -> rakic("chromium", 10.75, "LD fit",
                    0.168, 0.047, 0,
                    0.151, 3.175, 0.121,
                    0.150, 1.305, 0.543,
                    1.149, 2.676, 1.970,
                    0.825, 1.335, 8.775);
            case "titanium" -> rakic("titanium", 7.29, "LD fit",
                    0.148, 0.082, 0,
                    0.899, 2.276, 0.777,
                    0.393, 2.518, 1.545,
                    0.187, 1.663, 2.509,
                    0.001, 1.762, 19.43);
            case "gold-jc" -> JcHolder.MODEL;
            default -> throw new IllegalArgumentException(String.format(
                    "unknown library material '%s'; known: %s", key, String.join(", ", keys())));
        };
    }

    /**
     * An LD model from Rakić's table: ωp in eV, then per term (f, Γ in eV, ω in eV), the first term the
     * Drude one (its ω is 0).
     */
    private static SourcedMaterial rakic(String key, double plasmaEv, String note, double... fGammaOmega) {
        DrudeTerm drude = DrudeTerm.ofElectronVolts(Math.sqrt(fGammaOmega[0]) * plasmaEv, fGammaOmega[1]);
        List<LorentzTerm> lorentz = new ArrayList<>();
        for (int i = 3; i < fGammaOmega.length; i += 3) {
            lorentz.add(LorentzTerm.ofOscillatorElectronVolts(fGammaOmega[i], plasmaEv, fGammaOmega[i + 2],
                    fGammaOmega[i + 1]));
        }
        DispersiveMaterial m = new DispersiveMaterial(key, 1, 0, List.of(drude), lorentz);
        return new SourcedMaterial(key, m, RAKIC, RAKIC_DATA, RAKIC_BAND, note);
    }

    /**
     * Johnson &amp; Christy's gold, 381–1937 nm (their photon energies 0.64–3.25 eV), n and κ as
     * tabulated; <b>recalled from memory</b> (checked in {@code JohnsonChristyGoldTest} for
     * smoothness, a Drude-like infrared, consistency with a passive causal model, and against the
     * values the issue quotes: n 0.21, κ 3.272 at 616.8 nm and n 0.14, κ 3.697 at 659.5 nm). The
     * "line" of each row is its position in this table (1 = 1937 nm).
     */
    public static NkTable johnsonChristyGold() {
        double[][] t = {
            {1937.2, 0.92, 13.78}, {1610.2, 0.56, 11.21}, {1393.1, 0.43, 9.519}, {1215.5, 0.35, 8.145},
            {1087.6, 0.27, 7.150}, {984.0, 0.22, 6.350}, {892.0, 0.17, 5.663}, {821.1, 0.16, 5.083},
            {756.0, 0.14, 4.542}, {704.5, 0.13, 4.103}, {659.5, 0.14, 3.697}, {616.8, 0.21, 3.272},
            {582.1, 0.29, 2.863}, {548.6, 0.43, 2.455}, {520.9, 0.62, 2.081}, {495.9, 1.04, 1.833},
            {471.4, 1.31, 1.849}, {450.9, 1.38, 1.914}, {430.5, 1.45, 1.948}, {413.3, 1.46, 1.958},
            {397.4, 1.47, 1.952}, {381.5, 1.46, 1.933},
        };
        List<NkTable.Row> rows = new ArrayList<>();
        for (int i = 0; i < t.length; i++) {
            rows.add(new NkTable.Row(t[i][0] * 1e-9, t[i][1], t[i][2], i + 1));
        }
        return new NkTable("Johnson & Christy gold (recalled)", rows);
    }

    /** The gold-jc model, fitted once on first use. */
    private static final class JcHolder {
        static final SourcedMaterial MODEL = fitJc();

        private static SourcedMaterial fitJc() {
            PoleFit.Result r = PoleFit.fit("gold-jc", johnsonChristyGold(), JC_FIT_BAND, PoleFit.DEFAULT_TOLERANCE);
            return r.sourced("gold-jc", JOHNSON_CHRISTY + ", table recalled from memory");
        }
    }
}
