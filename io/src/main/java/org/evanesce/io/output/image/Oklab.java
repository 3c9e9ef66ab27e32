package org.evanesce.io.output.image;

/**
 * Conversions between sRGB and the Oklab colour space (B. Ottosson, "A perceptual color space for
 * image processing", 2020; matrices as published there, transcribed from memory and checked in
 * {@code OklabTest} against white, black and a round trip). Oklab is close to perceptually uniform:
 * L is lightness from 0 (black) to 1 (white), and straight lines in (L, a, b) give even-looking
 * gradients, which is why the colour maps are interpolated in it.
 */
final class Oklab {

    private Oklab() {
    }

    /** sRGB transfer function (IEC 61966-2-1): encoded component in [0, 1] to linear light. */
    static double toLinear(double c) {
        return c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
    }

    /** Linear light to the encoded sRGB component; not clamped. */
    static double fromLinear(double c) {
        return c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055;
    }

    /** {L, a, b} of an sRGB colour given as 0xRRGGBB. */
    static double[] fromRgb(int rgb) {
        double r = toLinear(((rgb >> 16) & 0xff) / 255.0);
        double g = toLinear(((rgb >> 8) & 0xff) / 255.0);
        double b = toLinear((rgb & 0xff) / 255.0);
        double l = Math.cbrt(0.4122214708 * r + 0.5363325363 * g + 0.0514459929 * b);
        double m = Math.cbrt(0.2119034982 * r + 0.6806995451 * g + 0.1073969566 * b);
        double s = Math.cbrt(0.0883024619 * r + 0.2817188376 * g + 0.6299787005 * b);
        return new double[] {
            0.2104542553 * l + 0.7936177850 * m - 0.0040720468 * s,
            1.9779984951 * l - 2.4285922050 * m + 0.4505937099 * s,
            0.0259040371 * l + 0.7827717662 * m - 0.8086757660 * s,
        };
    }

    /**
     * Encoded sRGB components {r, g, b} of an Oklab colour, each nominally in [0, 1]; components
     * outside that range mean the colour is outside the sRGB gamut (not clamped here).
     */
    static double[] toSrgb(double lightness, double a, double b) {
        double l = cube(lightness + 0.3963377774 * a + 0.2158037573 * b);
        double m = cube(lightness - 0.1055613458 * a - 0.0638541728 * b);
        double s = cube(lightness - 0.0894841775 * a - 1.2914855480 * b);
        return new double[] {
            fromLinear(4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s),
            fromLinear(-1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s),
            fromLinear(-0.0041960863 * l - 0.7034186147 * m + 1.7076147010 * s),
        };
    }

    /** 0xRRGGBB of encoded components, each clamped to [0, 1] and rounded. */
    static int pack(double[] srgb) {
        int r = (int) Math.round(255 * Math.max(0, Math.min(1, srgb[0])));
        int g = (int) Math.round(255 * Math.max(0, Math.min(1, srgb[1])));
        int b = (int) Math.round(255 * Math.max(0, Math.min(1, srgb[2])));
        return (r << 16) | (g << 8) | b;
    }

    /** Euclidean distance between two Oklab colours. */
    static double distance(double[] p, double[] q) {
        double dl = p[0] - q[0];
        double da = p[1] - q[1];
        double db = p[2] - q[2];
        return Math.sqrt(dl * dl + da * da + db * db);
    }

    private static double cube(double v) {
        return v * v * v;
    }
}
