package org.evanesce.geometry.dispersion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.junit.jupiter.api.Test;

/**
 * The library metals against measured data. <b>Every reference value here is recalled from
 * memory</b>, and so are the Rakić parameters themselves; the tolerances are the accuracy of such
 * fits and the spread between data sets, not numerical error, and each comment gives the measured
 * deviation. What these tests catch: a wrong pole entry, a wrong unit or sign convention (any of
 * which moves ε or R by far more than the tolerance), not a 5 % disagreement between data sets.
 */
class MetalLibraryTest {

    /** |ε_model − ε_data|/|ε_data| for n, κ pairs. */
    static double relativeError(SourcedMaterial m, double nm, double n, double k) {
        Complex data = new Complex(n, k).square();
        Complex model = m.material().permittivityAtWavelength(nm * 1e-9);
        return model.minus(data).abs() / data.abs();
    }

    /** Normal-incidence reflectance |(N − 1)/(N + 1)|² from vacuum (Born &amp; Wolf sec. 1.5). */
    static double reflectance(SourcedMaterial m, double nm) {
        Complex n = m.material().index(Spectral.omegaOfWavelength(nm * 1e-9));
        Complex r = n.plus(-1).divide(n.plus(1));
        return r.abs() * r.abs();
    }

    /**
     * Aluminium against the handbook compilation (E. D. Palik (ed.), Handbook of Optical Constants of
     * Solids (1985), aluminium by D. Y. Smith, E. Shiles, M. Inokuti) that the LD fit was made to,
     * values recalled from memory with moderate confidence: 400 nm 0.49 + 4.86i, 500 nm 0.769 + 6.08i,
     * 800 nm 2.80 + 8.45i (the interband peak near 1.5 eV). Measured deviations 0.064, 0.058, 0.038.
     */
    static final double ALUMINIUM_TOLERANCE = 0.10;

    @Test
    void aluminiumAgainstTheHandbook() {
        SourcedMaterial al = MetalLibrary.get("aluminium");
        double[][] data = {{400, 0.49, 4.86}, {500, 0.769, 6.08}, {800, 2.80, 8.45}};
        for (double[] d : data) {
            double e = relativeError(al, d[0], d[1], d[2]);
            System.out.printf("aluminium %g nm: relative ε deviation from the recalled handbook value %.3f%n", d[0], e);
            assertTrue(e <= ALUMINIUM_TOLERANCE, "aluminium at " + d[0] + " nm: " + e);
        }
    }

    /**
     * Silver against the handbook value at 632.8 nm, 0.135 + 3.985i (Palik's compilation, recalled
     * from memory, moderate confidence): measured deviation 0.087. And gold and silver against
     * Johnson &amp; Christy's table (recalled, good confidence), which is <b>not</b> what Rakić et al.
     * fitted: these document the spread between data sets the issue warns about (measured gold 0.15,
     * 0.16, 0.17 at 1215.5, 821.1, 616.8 nm; silver 0.20, 0.21, 0.24 at 1215.5, 659.5, 450.9 nm).
     * The LD fits' Re ε is 15–25 % less negative than Johnson &amp; Christy's throughout.
     */
    static final double SILVER_HANDBOOK_TOLERANCE = 0.15;
    /** Spread between the LD fits and Johnson &amp; Christy (measured up to 0.24, see above). */
    static final double DATA_SET_SPREAD = 0.30;

    @Test
    void nobleMetalsAgainstMeasuredTables() {
        double ag633 = relativeError(MetalLibrary.get("silver"), 632.8, 0.135, 3.985);
        System.out.printf("silver 632.8 nm vs recalled handbook: %.3f%n", ag633);
        assertTrue(ag633 <= SILVER_HANDBOOK_TOLERANCE);
        double[][] au = {{1215.5, 0.35, 8.145}, {821.1, 0.16, 5.083}, {616.8, 0.21, 3.272}};
        double[][] ag = {{1215.5, 0.09, 8.828}, {659.5, 0.05, 4.483}, {450.9, 0.04, 2.657}};
        for (double[] d : au) {
            double e = relativeError(MetalLibrary.get("gold"), d[0], d[1], d[2]);
            System.out.printf("gold %g nm vs Johnson & Christy: %.3f%n", d[0], e);
            assertTrue(e <= DATA_SET_SPREAD, "gold at " + d[0] + " nm: " + e);
        }
        for (double[] d : ag) {
            double e = relativeError(MetalLibrary.get("silver"), d[0], d[1], d[2]);
            System.out.printf("silver %g nm vs Johnson & Christy: %.3f%n", d[0], e);
            assertTrue(e <= DATA_SET_SPREAD, "silver at " + d[0] + " nm: " + e);
        }
    }

    /**
     * Normal-incidence reflectance of evaporated films, as the usual mirror-metal curves show it
     * (recalled from memory; values read off such curves to about ±0.03, chromium and titanium less
     * surely, ±0.05): aluminium 0.92 at 400 nm, 0.91 at 633 nm, 0.87 at the 800 nm dip, 0.94 at
     * 1000 nm; silver 0.97, 0.98, 0.99 at 500, 633, 1000 nm; gold 0.48, 0.97, 0.98 at 500, 700,
     * 1000 nm; copper 0.60, 0.95, 0.97 at 500, 700, 1000 nm; chromium about 0.65 at 450, 633 and
     * 1000 nm; titanium about 0.57 at 450 and 633 nm and 0.60 at 1000 nm. Measured largest
     * deviations: aluminium 0.006, silver 0.029, gold 0.057 (500 nm), copper 0.019, chromium 0.023,
     * titanium 0.021.
     */
    static final double REFLECTANCE_TOLERANCE = 0.08;

    @Test
    void reflectanceOfEveryMetalAtThreeOrMoreWavelengths() {
        Object[][] data = {
            {"aluminium", new double[][] {{400, 0.92}, {633, 0.91}, {800, 0.87}, {1000, 0.94}}},
            {"silver", new double[][] {{500, 0.97}, {633, 0.98}, {1000, 0.99}}},
            {"gold", new double[][] {{500, 0.48}, {700, 0.97}, {1000, 0.98}}},
            {"copper", new double[][] {{500, 0.60}, {700, 0.95}, {1000, 0.97}}},
            {"chromium", new double[][] {{450, 0.65}, {633, 0.65}, {1000, 0.65}}},
            {"titanium", new double[][] {{450, 0.57}, {633, 0.57}, {1000, 0.60}}},
        };
        for (Object[] row : data) {
            SourcedMaterial m = MetalLibrary.get((String) row[0]);
            double worst = 0;
            for (double[] d : (double[][]) row[1]) {
                double r = reflectance(m, d[0]);
                worst = Math.max(worst, Math.abs(r - d[1]));
                assertEquals(d[1], r, REFLECTANCE_TOLERANCE, row[0] + " at " + d[0] + " nm");
            }
            System.out.printf("%s: largest reflectance deviation %.3f%n", row[0], worst);
        }
    }

    @Test
    void entriesNameTheirSourceAndBand() {
        for (String key : MetalLibrary.keys()) {
            SourcedMaterial m = MetalLibrary.get(key);
            assertEquals(key, m.key());
            assertFalse(m.citation().isBlank());
            assertFalse(m.fittedTo().isBlank());
            assertTrue(m.material().isPassive() && m.material().epsInfinity() >= 1, key);
            assertTrue(m.covers(WavelengthBand.ofNanometres(500, 900)), key);
            assertFalse(m.covers(WavelengthBand.ofNanometres(150, 900)), key + " should not cover 150 nm");
        }
        // Rakić's band is 0.1–6 eV: 206.6 nm to 12.4 µm
        assertEquals(206.64e-9, MetalLibrary.RAKIC_BAND.shortest(), 0.01e-9);
        assertEquals(12.398e-6, MetalLibrary.RAKIC_BAND.longest(), 0.001e-6);
        assertFalse(MetalLibrary.get("gold").covers(WavelengthBand.ofNanometres(10_000, 20_000)));
        assertTrue(MetalLibrary.get("gold").covers(WavelengthBand.ofNanometres(10_000, 12_000)));
        assertFalse(MetalLibrary.get("gold-jc").covers(WavelengthBand.ofNanometres(380, 900)));
        assertEquals("aluminium", MetalLibrary.get("Aluminum").key());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> MetalLibrary.get("brass"));
        assertTrue(e.getMessage().contains("gold, silver"), e.getMessage());
    }
}
