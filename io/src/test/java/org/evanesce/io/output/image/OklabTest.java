package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Oklab matrices (B. Ottosson, "A perceptual color space for image processing", 2020) were
 * transcribed from memory; by construction white has L = 1, a = b = 0.
 */
class OklabTest {

    /** The published matrices carry 10 digits; white comes out within about 1e-7 (from memory). */
    private static final double WHITE = 1e-6;

    @Test
    void whiteAndBlack() {
        double[] w = Oklab.fromRgb(0xffffff);
        assertEquals(1.0, w[0], WHITE);
        assertEquals(0.0, w[1], WHITE);
        assertEquals(0.0, w[2], WHITE);
        double[] k = Oklab.fromRgb(0x000000);
        assertEquals(0.0, k[0], 1e-12);
    }

    @Test
    void greysHaveNoChroma() {
        for (int g = 0; g < 256; g += 17) {
            double[] c = Oklab.fromRgb((g << 16) | (g << 8) | g);
            assertEquals(0.0, Math.hypot(c[1], c[2]), WHITE, "grey " + g);
        }
    }

    @Test
    void roundTripsEveryEighthLevel() {
        for (int r = 0; r < 256; r += 32) {
            for (int g = 0; g < 256; g += 32) {
                for (int b = 0; b < 256; b += 32) {
                    int rgb = (r << 16) | (g << 8) | b;
                    double[] c = Oklab.fromRgb(rgb);
                    assertEquals(rgb, Oklab.pack(Oklab.toSrgb(c[0], c[1], c[2])), String.format("#%06x", rgb));
                }
            }
        }
    }
}
