package org.evanesce.io.casefile.model;

/**
 * The built-in materials, each a published dispersion fit evaluated at the run's vacuum
 * wavelength. All are lossless here; the fits give the real index only.
 *
 * <p>The coefficients below were written from memory, not copied from the papers; the tests
 * compare them with handbook indices (themselves from memory) at a few wavelengths.
 */
public enum LibraryMaterial {

    /** Exactly n = 1. */
    VACUUM("vacuum", 0, Double.POSITIVE_INFINITY, "n = 1 exactly") {
        @Override
        double indexMicrons(double um) {
            return 1.0;
        }
    },

    /**
     * Standard dry air (15 °C, 101 325 Pa, 450 ppm CO2): P. E. Ciddor, "Refractive index of air: new
     * equations for the visible and near infrared", Appl. Opt. 35, 1566 (1996), eq. (1) with the
     * two-term form n − 1 = k1/(k0 − σ²) + k3/(k2 − σ²), σ = 1/λ in µm⁻¹ (coefficients from memory).
     */
    AIR("air", 0.3e-6, 1.69e-6, "P. E. Ciddor, Appl. Opt. 35, 1566 (1996), standard air") {
        @Override
        double indexMicrons(double um) {
            double s2 = 1.0 / (um * um);
            return 1.0 + 0.05792105 / (238.0185 - s2) + 0.00167917 / (57.362 - s2);
        }
    },

    /**
     * Water near room temperature: M. Daimon and A. Masumura, "Measurement of the refractive index
     * of distilled water from the near-infrared region to the ultraviolet region", Appl. Opt. 46,
     * 3811 (2007), four-term Sellmeier fit n² − 1 = Σ Ai λ²/(λ² − Bi), λ in µm, Bi in µm².
     * Coefficients from memory, recalled as the fit for about 20 °C (the temperature they belong to
     * is uncertain among the paper's fits for 19–24 °C); they give n(589.3 nm) = 1.33335, within
     * 4e-4 of the handbook 1.3330 at 20 °C (from memory).
     */
    WATER("water", 0.182e-6, 1.129e-6, "M. Daimon & A. Masumura, Appl. Opt. 46, 3811 (2007), Sellmeier fit (coefficients from memory)") {
        @Override
        double indexMicrons(double um) {
            return sellmeier(um,
                    5.684027565e-1, 5.101829712e-3,
                    1.726177391e-1, 1.821153936e-2,
                    2.086189578e-2, 2.620722293e-2,
                    1.130748688e-1, 1.069792721e1);
        }
    },

    /**
     * Fused silica: I. H. Malitson, "Interspecimen comparison of the refractive index of fused
     * silica", J. Opt. Soc. Am. 55, 1205 (1965), three-term Sellmeier fit at 20 °C,
     * n² − 1 = Σ Bi λ²/(λ² − Ci²) with C in µm (coefficients from memory; they give the quoted
     * n_d = 1.4585 at 587.6 nm).
     */
    FUSED_SILICA("fused_silica", 0.21e-6, 3.71e-6, "I. H. Malitson, J. Opt. Soc. Am. 55, 1205 (1965), Sellmeier fit") {
        @Override
        double indexMicrons(double um) {
            return sellmeier(um,
                    0.6961663, 0.0684043 * 0.0684043,
                    0.4079426, 0.1162414 * 0.1162414,
                    0.8974794, 9.896161 * 9.896161);
        }
    },

    /**
     * A borosilicate crown glass (n_d = 1.5168, Abbe number 64.2): the glass maker's published
     * three-term Sellmeier fit from its data sheet for its standard borosilicate crown,
     * n² − 1 = Σ Bi λ²/(λ² − Ci), λ in µm, Ci in µm² (coefficients from memory; the data sheet's
     * fit uses wavelengths in air, a difference of 3e-4 in λ that moves n by under 1e-6 here).
     */
    BOROSILICATE_CROWN("borosilicate_crown", 0.3e-6, 2.5e-6, "the glass maker's data-sheet Sellmeier fit for borosilicate crown (n_d = 1.5168)") {
        @Override
        double indexMicrons(double um) {
            return sellmeier(um,
                    1.03961212, 0.00600069867,
                    0.231792344, 0.0200179144,
                    1.01046945, 103.560653);
        }
    };

    private final String caseName;
    private final double minWavelength;
    private final double maxWavelength;
    private final String source;

    LibraryMaterial(String caseName, double minWavelength, double maxWavelength, String source) {
        this.caseName = caseName;
        this.minWavelength = minWavelength;
        this.maxWavelength = maxWavelength;
        this.source = source;
    }

    /** The name a case file uses, e.g. {@code fused_silica}. */
    public String caseName() {
        return caseName;
    }

    /** Where the fit comes from, for run records and messages. */
    public String source() {
        return source;
    }

    /** Shortest vacuum wavelength (m) the fit was made for. */
    public double minWavelength() {
        return minWavelength;
    }

    /** Longest vacuum wavelength (m) the fit was made for. */
    public double maxWavelength() {
        return maxWavelength;
    }

    public boolean covers(double wavelength) {
        return wavelength >= minWavelength && wavelength <= maxWavelength;
    }

    /** Refractive index at vacuum wavelength {@code wavelength} in metres. */
    public double index(double wavelength) {
        return indexMicrons(wavelength * 1e6);
    }

    abstract double indexMicrons(double um);

    /** The material a case file names, or null. */
    public static LibraryMaterial byName(String name) {
        for (LibraryMaterial m : values()) {
            if (m.caseName.equals(name)) {
                return m;
            }
        }
        return null;
    }

    /** n from n² − 1 = Σ a λ²/(λ² − b) over pairs (a, b). */
    private static double sellmeier(double um, double... ab) {
        double l2 = um * um;
        double n2 = 1.0;
        for (int k = 0; k < ab.length; k += 2) {
            n2 += ab[k] * l2 / (l2 - ab[k + 1]);
        }
        return Math.sqrt(n2);
    }
}
