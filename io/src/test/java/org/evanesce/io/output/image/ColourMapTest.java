package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

class ColourMapTest {

    /** Slack outside [0, 1] for a component to count as inside the sRGB gamut: below 1/4 of an 8-bit step. */
    private static final double GAMUT_SLACK = 1e-3;
    /**
     * Least Oklab distance between the missing colour and any colour of its map. About 0.02 is a
     * just-noticeable difference in Oklab (common practice); 0.15 is unmistakable.
     */
    private static final double MISSING_DISTANCE = 0.15;
    /** Lightness symmetry of the diverging map: interpolation is exact, so only rounding remains. */
    private static final double SYMMETRY = 1e-12;

    private static final int STEPS = 200;

    @Test
    void sequentialLightnessRisesSteadily() {
        double prev = -1;
        for (int k = 0; k <= STEPS; k++) {
            double l = ColourMap.LUMEN.lab(k / (double) STEPS)[0];
            assertTrue(l > prev, "lumen lightness at t = " + k / (double) STEPS + " is " + l + ", not above " + prev);
            prev = l;
        }
        // and so do the 8-bit colours actually written
        double prevRgb = -1;
        for (int k = 0; k <= 20; k++) {
            double l = Oklab.fromRgb(ColourMap.LUMEN.rgb(k / 20.0))[0];
            assertTrue(l > prevRgb, "lumen 8-bit lightness at t = " + k / 20.0);
            prevRgb = l;
        }
    }

    @Test
    void divergingLightnessIsSymmetricAndLightestInTheMiddle() {
        double mid = ColourMap.SHOAL.lab(0.5)[0];
        for (int k = 0; k <= STEPS; k++) {
            double t = k / (double) STEPS;
            double l = ColourMap.SHOAL.lab(t)[0];
            assertEquals(l, ColourMap.SHOAL.lab(1 - t)[0], SYMMETRY, "shoal lightness at t = " + t + " and 1 - t");
            assertTrue(l <= mid, "shoal at t = " + t + " is not lighter than the middle");
        }
        double[] lo = ColourMap.SHOAL.lab(0);
        double[] hi = ColourMap.SHOAL.lab(1);
        assertTrue(lo[1] < 0 && lo[2] < 0, "negative end is a teal (Oklab a < 0, b < 0)");
        assertTrue(hi[1] > 0 && hi[2] > 0, "positive end is an amber (Oklab a > 0, b > 0)");
        assertEquals(ColourMap.Kind.DIVERGING, ColourMap.SHOAL.kind());
        assertEquals(ColourMap.Kind.SEQUENTIAL, ColourMap.LUMEN.kind());
    }

    @Test
    void everyColourIsInsideTheSrgbGamut() {
        for (ColourMap m : List.of(ColourMap.LUMEN, ColourMap.SHOAL)) {
            for (int k = 0; k < ColourMap.TABLE_SIZE; k++) {
                double[] c = m.lab(k / (double) (ColourMap.TABLE_SIZE - 1));
                double[] rgb = Oklab.toSrgb(c[0], c[1], c[2]);
                for (double v : rgb) {
                    assertTrue(v > -GAMUT_SLACK && v < 1 + GAMUT_SLACK,
                            m + " entry " + k + " leaves the sRGB gamut: component " + v);
                }
            }
        }
    }

    @Test
    void theMissingColourStandsOut() {
        for (ColourMap m : List.of(ColourMap.LUMEN, ColourMap.SHOAL)) {
            double[] nan = Oklab.fromRgb(m.missingColour());
            for (int k = 0; k < ColourMap.TABLE_SIZE; k++) {
                double[] c = Oklab.fromRgb(m.rgb(k / (double) (ColourMap.TABLE_SIZE - 1)));
                assertTrue(Oklab.distance(nan, c) > MISSING_DISTANCE, m + ": missing colour too close to entry " + k);
            }
            assertEquals(m.missingColour(), m.rgb(Double.NaN));
        }
    }

    @Test
    void positionsAreClamped() {
        assertEquals(ColourMap.LUMEN.rgb(0), ColourMap.LUMEN.rgb(-3));
        assertEquals(ColourMap.LUMEN.rgb(1), ColourMap.LUMEN.rgb(Double.POSITIVE_INFINITY));
    }

    @Test
    void controlPointsAreChecked() {
        ColourMap.ControlPoint a = new ColourMap.ControlPoint(0, 0.2, 0.05, 10);
        ColourMap.ControlPoint b = new ColourMap.ControlPoint(1, 0.9, 0.05, 10);
        assertThrows(IllegalArgumentException.class, () -> new ColourMap.ControlPoint(1.5, 0.5, 0, 0));
        assertThrows(IllegalArgumentException.class,
                () -> new ColourMap("x", ColourMap.Kind.SEQUENTIAL, List.of(b, a), a));
        assertThrows(IllegalArgumentException.class,
                () -> new ColourMap("x", ColourMap.Kind.SEQUENTIAL, List.of(a), a));
        ColourMap grey = new ColourMap("grey", ColourMap.Kind.SEQUENTIAL,
                List.of(new ColourMap.ControlPoint(0, 0, 0, 0), new ColourMap.ControlPoint(1, 1, 0, 0)), a);
        assertEquals(0x000000, grey.rgb(0));
        assertEquals(0xffffff, grey.rgb(1));
    }
}
