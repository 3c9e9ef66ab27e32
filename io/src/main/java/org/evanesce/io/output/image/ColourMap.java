package org.evanesce.io.output.image;

import java.util.List;

/**
 * Maps a position t in [0, 1] to a colour. A map is defined by a few control points in Oklab
 * lightness, chroma and hue (L, C, h) and interpolated linearly in Oklab (L, a, b) between them
 * (see {@link Oklab}); the result is tabulated at {@value #TABLE_SIZE} entries.
 *
 * <p>The two built-in maps are our own designs:
 * <ul>
 *   <li>{@link #LUMEN}, {@linkplain Kind#SEQUENTIAL sequential}: lightness rises steadily from a
 *       dark indigo through blue, teal and sage to a pale cream, for quantities with a natural
 *       bottom such as relative permittivity and intensity;</li>
 *   <li>{@link #SHOAL}, {@linkplain Kind#DIVERGING diverging}, for signed fields: a deep sea teal
 *       for the most negative value through a pale warm parchment at zero to a deep burnt amber for
 *       the most positive. Construction: five anchors in Oklab (L, C, h), interpolated linearly in
 *       (L, a, b): teal (0.38, 0.062, 210°), light teal (0.68, 0.080, 198°), parchment (0.955, 0.008,
 *       90°), amber (0.68, 0.115, 68°), burnt amber (0.38, 0.080, 48°). The lightness is the same at
 *       t and 1 − t (so neither sign looks stronger) and rises to the middle on both sides, each
 *       chroma is the largest (to two figures) that keeps every entry inside the sRGB gamut, and the
 *       two hue families sit roughly opposite in hue so that the sign reads even in grey-ish
 *       print; missing values are a violet (0.60, 0.16, 320°) that no entry comes near.</li>
 * </ul>
 * Each map also names a {@linkplain #missingColour() colour for missing values} (NaN) that is far
 * from every colour of the map.
 */
public final class ColourMap {

    /** How a map is meant to be used, which decides the default value range of a heat map. */
    public enum Kind {
        /** Low to high: the default range is the data's minimum to maximum. */
        SEQUENTIAL,
        /** Signed, zero in the middle: the default range is −max|v| to +max|v|. */
        DIVERGING
    }

    /**
     * One control point.
     *
     * @param position  t in [0, 1]; the first point must be at 0, the last at 1, increasing between
     * @param lightness Oklab L in [0, 1]
     * @param chroma    Oklab chroma √(a² + b²), ≥ 0
     * @param hue       hue angle in degrees, measured from +a towards +b
     */
    public record ControlPoint(double position, double lightness, double chroma, double hue) {
        public ControlPoint {
            if (!(position >= 0 && position <= 1) || !(lightness >= 0 && lightness <= 1)
                    || !(chroma >= 0) || !Double.isFinite(chroma) || !Double.isFinite(hue)) {
                throw new IllegalArgumentException(String.format(
                        "colour control point (t %g, L %g, C %g, h %g°): need t and L in [0, 1], finite C ≥ 0 and h",
                        position, lightness, chroma, hue));
            }
        }

        double[] lab() {
            double rad = Math.toRadians(hue);
            return new double[] {lightness, chroma * Math.cos(rad), chroma * Math.sin(rad)};
        }
    }

    /** Number of tabulated colours. */
    public static final int TABLE_SIZE = 1024;

    /** Sequential map for permittivity and intensity (see the class comment). */
    public static final ColourMap LUMEN = new ColourMap("lumen", Kind.SEQUENTIAL, List.of(
            new ControlPoint(0.00, 0.20, 0.070, 285),
            new ControlPoint(0.25, 0.40, 0.100, 258),
            new ControlPoint(0.50, 0.60, 0.090, 200),
            new ControlPoint(0.75, 0.80, 0.100, 118),
            new ControlPoint(1.00, 0.96, 0.040, 92)),
            new ControlPoint(0, 0.62, 0.220, 338));

    /** Diverging map for signed fields, teal through parchment to amber (see the class comment). */
    public static final ColourMap SHOAL = new ColourMap("shoal", Kind.DIVERGING, List.of(
            new ControlPoint(0.00, 0.38, 0.062, 210),
            new ControlPoint(0.25, 0.68, 0.080, 198),
            new ControlPoint(0.50, 0.955, 0.008, 90),
            new ControlPoint(0.75, 0.68, 0.115, 68),
            new ControlPoint(1.00, 0.38, 0.080, 48)),
            new ControlPoint(0, 0.60, 0.160, 320));

    private final String name;
    private final Kind kind;
    private final List<ControlPoint> points;
    private final int[] table = new int[TABLE_SIZE];
    private final double[][] lab = new double[TABLE_SIZE][];
    private final int missing;

    /**
     * A map through the given control points.
     *
     * @param name    a short label
     * @param kind    sequential or diverging
     * @param points  at least two, positions increasing from 0 to 1
     * @param missing the colour for NaN (its position is ignored)
     */
    public ColourMap(String name, Kind kind, List<ControlPoint> points, ControlPoint missing) {
        if (points.size() < 2 || points.get(0).position() != 0 || points.get(points.size() - 1).position() != 1) {
            throw new IllegalArgumentException("colour map " + name
                    + ": need at least two control points, the first at t = 0 and the last at t = 1");
        }
        for (int q = 1; q < points.size(); q++) {
            if (!(points.get(q).position() > points.get(q - 1).position())) {
                throw new IllegalArgumentException(String.format(
                        "colour map %s: control point positions must increase, but %g follows %g",
                        name, points.get(q).position(), points.get(q - 1).position()));
            }
        }
        this.name = name;
        this.kind = kind;
        this.points = List.copyOf(points);
        int seg = 0;
        for (int k = 0; k < TABLE_SIZE; k++) {
            double t = k / (double) (TABLE_SIZE - 1);
            while (seg < points.size() - 2 && t > points.get(seg + 1).position()) {
                seg++;
            }
            ControlPoint p = points.get(seg);
            ControlPoint q = points.get(seg + 1);
            double w = (t - p.position()) / (q.position() - p.position());
            double[] a = p.lab();
            double[] b = q.lab();
            double[] c = {a[0] + w * (b[0] - a[0]), a[1] + w * (b[1] - a[1]), a[2] + w * (b[2] - a[2])};
            lab[k] = c;
            table[k] = Oklab.pack(Oklab.toSrgb(c[0], c[1], c[2]));
        }
        double[] m = missing.lab();
        this.missing = Oklab.pack(Oklab.toSrgb(m[0], m[1], m[2]));
    }

    /** The map's label. */
    public String name() {
        return name;
    }

    /** Sequential or diverging. */
    public Kind kind() {
        return kind;
    }

    /** The control points, in order. */
    public List<ControlPoint> controlPoints() {
        return points;
    }

    /** 0xRRGGBB at t; t is clamped to [0, 1] and NaN gives {@link #missingColour()}. */
    public int rgb(double t) {
        if (Double.isNaN(t)) {
            return missing;
        }
        return table[index(t)];
    }

    /** 0xRRGGBB drawn for missing (NaN) values. */
    public int missingColour() {
        return missing;
    }

    /** Oklab {L, a, b} at t (before the conversion to 8-bit sRGB); a fresh array. */
    double[] lab(double t) {
        return lab[index(t)].clone();
    }

    private static int index(double t) {
        double c = Math.max(0, Math.min(1, t));
        return (int) Math.round(c * (TABLE_SIZE - 1));
    }

    @Override
    public String toString() {
        return name + " (" + kind.name().toLowerCase(java.util.Locale.ROOT) + ")";
    }
}
