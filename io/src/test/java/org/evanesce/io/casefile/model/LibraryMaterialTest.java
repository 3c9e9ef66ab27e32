package org.evanesce.io.casefile.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The built-in dispersion fits against indices published for the same materials. The reference
 * values are recalled (from memory) from the cited papers and data sheets and from handbooks; the
 * fits' coefficients were also written from memory, so these tests guard against a mistyped digit
 * rather than prove the coefficients.
 */
class LibraryMaterialTest {

    /** Published tables round to 5 decimals; a recalled value may be off by one in the last. */
    private static final double TABLE_TOLERANCE = 2e-5;
    /**
     * The water fit's temperature is recalled as about 20 °C but may belong to another of the
     * paper's fits (19–24 °C); dn/dT of water is about −1e-4 per kelvin near room temperature (from memory).
     */
    private static final double WATER_TOLERANCE = 5e-4;
    /** The air values are quoted to 1e-8 in n − 1; allow for a recalled last digit. */
    private static final double AIR_TOLERANCE = 3e-7;

    private static void assertIndex(LibraryMaterial m, double wavelengthNm, double expected, double tolerance) {
        assertEquals(expected, m.index(wavelengthNm * 1e-9), tolerance, m.caseName() + " at " + wavelengthNm + " nm");
    }

    /**
     * I. H. Malitson, J. Opt. Soc. Am. 55, 1205 (1965): n_F = 1.46313, n_d = 1.45846, n_C = 1.45637
     * (from memory); 1064 nm and 1550 nm from the same fit as tabulated in glass catalogues, 1.44963
     * and 1.44402 (from memory).
     */
    @Test
    void fusedSilicaMatchesMalitson() {
        for (Map.Entry<Double, Double> e : Map.of(486.13, 1.46313, 587.56, 1.45846, 656.27, 1.45637,
                1064.0, 1.44963, 1550.0, 1.44402).entrySet()) {
            assertIndex(LibraryMaterial.FUSED_SILICA, e.getKey(), e.getValue(), TABLE_TOLERANCE);
        }
    }

    /** Borosilicate crown, the maker's data sheet: n_F = 1.52238, n_d = 1.51680, n_e = 1.51872, n_C = 1.51432 (from memory). */
    @Test
    void borosilicateCrownMatchesTheDataSheet() {
        for (Map.Entry<Double, Double> e : Map.of(486.13, 1.52238, 546.07, 1.51872, 587.56, 1.51680, 656.27, 1.51432).entrySet()) {
            assertIndex(LibraryMaterial.BOROSILICATE_CROWN, e.getKey(), e.getValue(), TABLE_TOLERANCE);
        }
    }

    /** Water at 589.3 nm, 20 °C: n_D = 1.3330 (CRC Handbook of Chemistry and Physics, from memory). */
    @Test
    void waterMatchesTheHandbookSodiumLine() {
        assertIndex(LibraryMaterial.WATER, 589.3, 1.3330, WATER_TOLERANCE);
        // normal dispersion across the fit's range
        double previous = Double.POSITIVE_INFINITY;
        for (double nm = 200; nm <= 1100; nm += 50) {
            double n = LibraryMaterial.WATER.index(nm * 1e-9);
            assertTrue(n < previous, "water's index must fall with wavelength, at " + nm + " nm");
            previous = n;
        }
    }

    /** Standard air at 633 nm: n − 1 = 2.7653e-4 (P. E. Ciddor, Appl. Opt. 35, 1566 (1996), from memory). */
    @Test
    void airMatchesCiddor() {
        assertEquals(2.7653e-4, LibraryMaterial.AIR.index(633e-9) - 1, AIR_TOLERANCE);
        assertEquals(1.0, LibraryMaterial.VACUUM.index(633e-9), 0.0);
    }

    @Test
    void rangesAndNames() {
        assertTrue(LibraryMaterial.FUSED_SILICA.covers(633e-9));
        assertTrue(!LibraryMaterial.WATER.covers(1.55e-6));
        assertEquals(LibraryMaterial.BOROSILICATE_CROWN, LibraryMaterial.byName("borosilicate_crown"));
        assertEquals(null, LibraryMaterial.byName("glass"));
    }
}
