package org.evanesce.io.output.image;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * A line plot: several named series of (x, y) points drawn as straight segments between
 * consecutive points and/or point markers, on linear axes with nice ticks and light grid lines,
 * with axis titles, a title line and a legend to the right of the plot.
 *
 * <p>Series are drawn in the order added, later ones on top. A series without a colour of its own
 * takes the next colour of {@link #PALETTE} (our own eight colours, spread in Oklab hue with
 * lightness 0.45–0.72, so they are told apart on white and from each other), and every series
 * takes the next {@link Marker} shape, so series stay distinguishable in grey print. A point with a
 * NaN or infinite coordinate is skipped and breaks the line there.
 *
 * <p>Axis ranges are given, or taken from the finite points of all series with 4 % padding; a
 * range of a single value v becomes v ± 10 % of |v| (± 1 for 0), and with no finite points at all
 * each axis is [0, 1]. Lines and markers are clipped to the plot area.
 *
 * <p>As for {@link Heatmap}, text is drawn with {@link PixelFont} and the image is a
 * {@code TYPE_INT_RGB} {@link BufferedImage} written by {@link PngFile}, so plots can be
 * made on a headless machine without fonts. Immutable once built; the point arrays are copied.
 */
public final class LinePlot {

    /** How a series is drawn. */
    public enum Style {
        /** Segments between consecutive points and a marker at each point. */
        LINES_AND_MARKERS,
        /** Segments only (for densely sampled curves). */
        LINES,
        /** Markers only. */
        MARKERS
    }

    /** Point marker shapes, taken in this order by successive series. */
    public enum Marker {
        CIRCLE, SQUARE, TRIANGLE, DIAMOND, CROSS
    }

    /** One series: its name, points, colour (0xRRGGBB), style and marker. */
    public record Series(String name, double[] x, double[] y, int rgb, Style style, Marker marker) {
        public Series {
            x = x.clone();
            y = y.clone();
        }

        /** The x values (a copy). */
        @Override
        public double[] x() {
            return x.clone();
        }

        /** The y values (a copy). */
        @Override
        public double[] y() {
            return y.clone();
        }
    }

    /**
     * The default series colours, 0xRRGGBB, in the order they are given out: a deep blue, a
     * burnt orange, a leaf green, a magenta, an ochre, a teal, a dark umber and a lilac. Defined in
     * Oklab (L, C, h) like the colour maps.
     */
    public static final List<Integer> PALETTE = List.of(
            oklch(0.48, 0.150, 262),
            oklch(0.64, 0.160, 48),
            oklch(0.60, 0.150, 145),
            oklch(0.55, 0.180, 340),
            oklch(0.72, 0.140, 92),
            oklch(0.58, 0.100, 205),
            oklch(0.42, 0.060, 55),
            oklch(0.66, 0.120, 300));

    /** Font pixel scale for all text. */
    static final int SCALE = 2;
    static final int LINE = PixelFont.height(SCALE);
    static final int CAP = PixelFont.CAP_HEIGHT * SCALE;
    static final int MARGIN = 16;
    static final int TICK = 6;
    static final int BACKGROUND = 0xffffff;
    static final int INK = 0x1b1b1b;
    static final int FRAME = 0x3a3a3a;
    static final int GRID = 0xe6e6e6;
    /** Preferred pixels per tick interval. */
    static final int X_TICK_SPACING = 100;
    static final int Y_TICK_SPACING = 60;
    /** Marker half-size and line half-width in pixels. */
    static final int MARKER = 4;
    /** Length of the line sample in the legend. */
    static final int SAMPLE = 32;

    private final List<Series> series;
    private final String title;
    private final String xTitle;
    private final String yTitle;
    private final double xLow;
    private final double xHigh;
    private final double yLow;
    private final double yHigh;
    private final int plotWidth;
    private final int plotHeight;

    private LinePlot(Builder b) {
        series = List.copyOf(b.series);
        title = b.title;
        xTitle = b.xTitle;
        yTitle = b.yTitle;
        double[] xr = range(b.xLow, b.xHigh, true);
        double[] yr = range(b.yLow, b.yHigh, false);
        xLow = xr[0];
        xHigh = xr[1];
        yLow = yr[0];
        yHigh = yr[1];
        plotWidth = b.plotWidth;
        plotHeight = b.plotHeight;
    }

    /** Starts an empty plot. */
    public static Builder builder() {
        return new Builder();
    }

    /** The series, in drawing order. */
    public List<Series> series() {
        return series;
    }

    /** The title line (empty for none). */
    public String title() {
        return title;
    }

    /** The x range shown, {low, high}. */
    public double[] xRange() {
        return new double[] {xLow, xHigh};
    }

    /** The y range shown, {low, high}. */
    public double[] yRange() {
        return new double[] {yLow, yHigh};
    }

    private double[] range(double lo, double hi, boolean alongX) {
        if (!Double.isNaN(lo)) {
            return new double[] {lo, hi};
        }
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        for (Series s : series) {
            double[] xs = s.x;
            double[] ys = s.y;
            for (int q = 0; q < xs.length; q++) {
                if (Double.isFinite(xs[q]) && Double.isFinite(ys[q])) {
                    double v = alongX ? xs[q] : ys[q];
                    min = Math.min(min, v);
                    max = Math.max(max, v);
                }
            }
        }
        if (min > max) {
            return new double[] {0, 1};
        }
        if (min == max) {
            double d = min == 0 ? 1 : 0.1 * Math.abs(min);
            return new double[] {min - d, max + d};
        }
        double pad = 0.04 * (max - min);
        return new double[] {min - pad, max + pad};
    }

    /** Draws the picture. */
    public BufferedImage render() {
        return draw().toImage();
    }

    /** Horizontal pixel of x inside the plot, from its left edge (may lie outside). */
    private double column(double x) {
        return (x - xLow) / (xHigh - xLow) * (plotWidth - 1);
    }

    /** Vertical pixel of y inside the plot, from its top edge (may lie outside). */
    private double row(double y) {
        return (yHigh - y) / (yHigh - yLow) * (plotHeight - 1);
    }

    /** Where the parts go, in image pixels (y down). */
    private record Layout(TickAxis xa, TickAxis ya, int left, int top, int legendLeft, int legendWidth, int legendHeight,
                          int xLabelTop, int width, int height) { }

    private Layout layout() {
        TickAxis xa = TickAxis.of(xLow, xHigh, (plotWidth - 1) / (xHigh - xLow), Math.max(2, plotWidth / X_TICK_SPACING), true);
        TickAxis ya = TickAxis.of(yLow, yHigh, (plotHeight - 1) / (yHigh - yLow), Math.max(2, plotHeight / Y_TICK_SPACING), false);
        int yLabelWidth = 0;
        for (String s : ya.labels()) {
            yLabelWidth = Math.max(yLabelWidth, PixelFont.width(s, SCALE));
        }
        int left = MARGIN + (yTitle.isEmpty() ? 0 : LINE + 12) + yLabelWidth + 5 + TICK + 1;
        int top = MARGIN + CAP / 2 + (title.isEmpty() ? 0 : LINE + 14);
        int legendLeft = left + plotWidth + 1 + 24;
        int legendWidth = 0;
        for (Series s : series) {
            legendWidth = Math.max(legendWidth, SAMPLE + 10 + PixelFont.width(s.name, SCALE));
        }
        legendWidth += series.isEmpty() ? 0 : 20;
        int legendHeight = series.isEmpty() ? 0 : series.size() * (LINE + 8) + 12;
        int lastLabelHalf = PixelFont.width(xa.labels()[xa.values().length - 1], SCALE) / 2;
        int right = Math.max(series.isEmpty() ? 0 : legendLeft + legendWidth, left + plotWidth + lastLabelHalf);
        int xLabelTop = top + plotHeight + 1 + TICK + 6;
        int bottom = xLabelTop + LINE + (xTitle.isEmpty() ? 0 : 6 + LINE);
        int width = Math.max(right, MARGIN + PixelFont.width(title, SCALE)) + MARGIN;
        int height = Math.max(bottom, top + legendHeight) + MARGIN;
        return new Layout(xa, ya, left, top, legendLeft, legendWidth, legendHeight, xLabelTop, width, height);
    }

    /** The plot area in image pixels, {x, y, width, height} (inside the frame); for tests. */
    int[] plotArea() {
        Layout l = layout();
        return new int[] {l.left, l.top, plotWidth, plotHeight};
    }

    /** The legend box in image pixels, {x, y, width, height} (inside its frame), or null with no series; for tests. */
    int[] legendArea() {
        Layout l = layout();
        return series.isEmpty() ? null : new int[] {l.legendLeft, l.top, l.legendWidth, l.legendHeight};
    }

    /** Draws everything. */
    Canvas draw() {
        Layout l = layout();
        TickAxis xa = l.xa;
        TickAxis ya = l.ya;
        int left = l.left;
        int top = l.top;
        int legendLeft = l.legendLeft;
        int legendWidth = l.legendWidth;
        int legendHeight = l.legendHeight;
        int xLabelTop = l.xLabelTop;
        int width = l.width;
        int height = l.height;

        Canvas c = new Canvas(width, height, BACKGROUND);
        // grid lines and ticks
        for (double v : xa.values()) {
            int col = left + (int) Math.round(column(v));
            c.fill(col, top, 1, plotHeight, GRID);
            c.fill(col, top + plotHeight + 1, 1, TICK, FRAME);
        }
        for (double v : ya.values()) {
            int r = top + (int) Math.round(row(v));
            c.fill(left, r, plotWidth, 1, GRID);
            c.fill(left - 1 - TICK, r, TICK, 1, FRAME);
        }
        // data, clipped to the plot
        for (Series s : series) {
            Clip clip = new Clip(c, left, top, plotWidth, plotHeight);
            double[] xs = s.x;
            double[] ys = s.y;
            if (s.style != Style.MARKERS) {
                for (int q = 1; q < xs.length; q++) {
                    if (finite(xs[q - 1], ys[q - 1]) && finite(xs[q], ys[q])) {
                        clip.line(left + column(xs[q - 1]), top + row(ys[q - 1]),
                                left + column(xs[q]), top + row(ys[q]), s.rgb);
                    }
                }
            }
            if (s.style != Style.LINES) {
                for (int q = 0; q < xs.length; q++) {
                    if (finite(xs[q], ys[q])) {
                        marker(clip, (int) Math.round(left + column(xs[q])), (int) Math.round(top + row(ys[q])),
                                s.marker, s.rgb);
                    }
                }
            }
        }
        c.frame(left, top, plotWidth, plotHeight, FRAME);
        // tick labels and titles
        for (int q = 0; q < xa.values().length; q++) {
            int col = left + (int) Math.round(column(xa.values()[q]));
            int w = PixelFont.width(xa.labels()[q], SCALE);
            c.text(xa.labels()[q], col - w / 2, xLabelTop, SCALE, INK, Canvas.Direction.ACROSS);
        }
        for (int q = 0; q < ya.values().length; q++) {
            int r = top + (int) Math.round(row(ya.values()[q]));
            int w = PixelFont.width(ya.labels()[q], SCALE);
            c.text(ya.labels()[q], left - 1 - TICK - 5 - w, r - CAP / 2, SCALE, INK, Canvas.Direction.ACROSS);
        }
        if (!xTitle.isEmpty()) {
            int w = PixelFont.width(xTitle, SCALE);
            c.text(xTitle, left + plotWidth / 2 - w / 2, xLabelTop + LINE + 6, SCALE, INK, Canvas.Direction.ACROSS);
        }
        if (!yTitle.isEmpty()) {
            int tl = PixelFont.width(yTitle, SCALE);
            c.text(yTitle, MARGIN, top + plotHeight / 2 - tl / 2, SCALE, INK, Canvas.Direction.UP);
        }
        if (!title.isEmpty()) {
            c.text(title, MARGIN, MARGIN, SCALE, INK, Canvas.Direction.ACROSS);
        }
        // legend
        if (!series.isEmpty()) {
            c.frame(legendLeft, top, legendWidth, legendHeight, FRAME);
            Clip all = new Clip(c, 0, 0, width, height);
            for (int q = 0; q < series.size(); q++) {
                Series s = series.get(q);
                int rowTop = top + 10 + q * (LINE + 8);
                int mid = rowTop + CAP / 2;
                int x0 = legendLeft + 10;
                if (s.style != Style.MARKERS) {
                    all.line(x0, mid, x0 + SAMPLE - 1, mid, s.rgb);
                }
                if (s.style != Style.LINES) {
                    marker(all, x0 + SAMPLE / 2, mid, s.marker, s.rgb);
                }
                c.text(s.name, x0 + SAMPLE + 10, rowTop, SCALE, INK, Canvas.Direction.ACROSS);
            }
        }
        return c;
    }

    private static boolean finite(double x, double y) {
        return Double.isFinite(x) && Double.isFinite(y);
    }

    private static void marker(Clip c, int x, int y, Marker m, int rgb) {
        int r = MARKER;
        for (int dy = -r; dy <= r; dy++) {
            for (int dx = -r; dx <= r; dx++) {
                boolean ink = switch (m) {
                    case CIRCLE -> dx * dx + dy * dy <= r * r + 1;
                    case SQUARE -> Math.abs(dx) <= r - 1 && Math.abs(dy) <= r - 1;
                    case TRIANGLE -> dy >= -r && 2 * Math.abs(dx) <= dy + r;
                    case DIAMOND -> Math.abs(dx) + Math.abs(dy) <= r;
                    case CROSS -> Math.abs(Math.abs(dx) - Math.abs(dy)) <= 1;
                };
                if (ink) {
                    c.set(x + dx, y + dy, rgb);
                }
            }
        }
    }

    /** Drawing restricted to a rectangle of the canvas. */
    private record Clip(Canvas canvas, int x, int y, int w, int h) {
        void set(int px, int py, int rgb) {
            if (px >= x && px < x + w && py >= y && py < y + h) {
                canvas.set(px, py, rgb);
            }
        }

        /** A segment two pixels wide between two points given in image pixels. */
        void line(double xa, double ya, double xb, double yb, int rgb) {
            // keep far-off ends from making huge loops: clamp to a generous box around the clip
            double lim = 4.0 * (w + h) + 16;
            if (Math.abs(xa - x) > lim || Math.abs(xb - x) > lim || Math.abs(ya - y) > lim || Math.abs(yb - y) > lim) {
                double[] p = clipSegment(xa, ya, xb, yb);
                if (p == null) {
                    return;
                }
                xa = p[0];
                ya = p[1];
                xb = p[2];
                yb = p[3];
            }
            int n = (int) Math.ceil(Math.max(Math.abs(xb - xa), Math.abs(yb - ya)));
            for (int k = 0; k <= n; k++) {
                double t = n == 0 ? 0 : k / (double) n;
                int px = (int) Math.round(xa + t * (xb - xa));
                int py = (int) Math.round(ya + t * (yb - ya));
                set(px, py, rgb);
                set(px + 1, py, rgb);
                set(px, py + 1, rgb);
                set(px + 1, py + 1, rgb);
            }
        }

        /** The part of the segment inside the clip rectangle (Liang–Barsky), or null. */
        private double[] clipSegment(double xa, double ya, double xb, double yb) {
            double t0 = 0;
            double t1 = 1;
            double dx = xb - xa;
            double dy = yb - ya;
            double[] p = {-dx, dx, -dy, dy};
            double[] q = {xa - x, x + w - 1 - xa, ya - y, y + h - 1 - ya};
            for (int k = 0; k < 4; k++) {
                if (p[k] == 0) {
                    if (q[k] < 0) {
                        return null;
                    }
                } else {
                    double r = q[k] / p[k];
                    if (p[k] < 0) {
                        t0 = Math.max(t0, r);
                    } else {
                        t1 = Math.min(t1, r);
                    }
                }
            }
            if (t0 > t1) {
                return null;
            }
            return new double[] {xa + t0 * dx, ya + t0 * dy, xa + t1 * dx, ya + t1 * dy};
        }
    }

    /**
     * Writes the picture as a PNG file, atomically: written under a temporary name in the same
     * folder and renamed onto {@code file} when complete, replacing an earlier file of that name;
     * after a failure no temporary file is left. Missing parent folders are created.
     *
     * @return the absolute path written
     */
    public Path writePng(Path file) throws IOException {
        return PngFile.write(render(), file);
    }

    /**
     * Writes several plots one above the other as one PNG file (e.g. a fit over its residuals),
     * atomically like {@link #writePng(Path)}.
     *
     * @return the absolute path written
     */
    public static Path writeStacked(Path file, LinePlot... panels) throws IOException {
        List<BufferedImage> images = new ArrayList<>();
        int width = 0;
        int height = 0;
        for (LinePlot p : panels) {
            BufferedImage img = p.render();
            images.add(img);
            width = Math.max(width, img.getWidth());
            height += img.getHeight();
        }
        BufferedImage all = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        java.awt.Graphics2D g = all.createGraphics();
        try {
            g.setColor(java.awt.Color.WHITE);
            g.fillRect(0, 0, width, height);
            int y = 0;
            for (BufferedImage img : images) {
                g.drawImage(img, 0, y, null);
                y += img.getHeight();
            }
        } finally {
            g.dispose();
        }
        return PngFile.write(all, file);
    }

    private static int oklch(double lightness, double chroma, double hueDegrees) {
        double h = Math.toRadians(hueDegrees);
        return Oklab.pack(Oklab.toSrgb(lightness, chroma * Math.cos(h), chroma * Math.sin(h)));
    }

    /** Collects the series and settings of a plot. */
    public static final class Builder {
        private final List<Series> series = new ArrayList<>();
        private int nextColour;
        private String title = "";
        private String xTitle = "";
        private String yTitle = "";
        private double xLow = Double.NaN;
        private double xHigh = Double.NaN;
        private double yLow = Double.NaN;
        private double yHigh = Double.NaN;
        private int plotWidth = 640;
        private int plotHeight = 420;

        private Builder() {
        }

        /** Adds a series drawn with lines and markers in the next palette colour. */
        public Builder series(String name, double[] x, double[] y) {
            return series(name, x, y, Style.LINES_AND_MARKERS);
        }

        /** Adds a series in the given style and the next palette colour. */
        public Builder series(String name, double[] x, double[] y, Style style) {
            int rgb = PALETTE.get(nextColour % PALETTE.size());
            nextColour++;
            return add(name, x, y, style, rgb);
        }

        /** Adds a series in the given style and colour (0xRRGGBB); the palette is not advanced. */
        public Builder series(String name, double[] x, double[] y, Style style, int rgb) {
            if ((rgb & ~0xffffff) != 0) {
                throw new IllegalArgumentException(String.format(
                        "line plot series \"%s\": colour %#x is not 0xRRGGBB", name, rgb));
            }
            return add(name, x, y, style, rgb);
        }

        private Builder add(String name, double[] x, double[] y, Style style, int rgb) {
            if (name == null || x == null || y == null || style == null) {
                throw new IllegalArgumentException("line plot series: name, x, y and style must be given");
            }
            if (x.length != y.length) {
                throw new IllegalArgumentException(String.format(
                        "line plot series \"%s\": %d x values but %d y values; need one y per x", name, x.length, y.length));
            }
            Marker m = Marker.values()[series.size() % Marker.values().length];
            series.add(new Series(name.strip(), x, y, rgb, style, m));
            return this;
        }

        /** The title line (the first line of the text, cut to {@link PixelFont#MAX_TITLE_CHARACTERS}); empty (the default) for none. */
        public Builder title(String text) {
            title = PixelFont.titleLine(text);
            return this;
        }

        /** The x axis title, e.g. "gap (λ)"; empty for none. */
        public Builder xTitle(String text) {
            xTitle = text == null ? "" : text.strip();
            return this;
        }

        /** The y axis title (drawn turned up); empty for none. */
        public Builder yTitle(String text) {
            yTitle = text == null ? "" : text.strip();
            return this;
        }

        /** A fixed x range instead of one from the data; finite with low &lt; high. */
        public Builder xRange(double low, double high) {
            checkRange("x", low, high);
            xLow = low;
            xHigh = high;
            return this;
        }

        /** A fixed y range instead of one from the data; finite with low &lt; high. */
        public Builder yRange(double low, double high) {
            checkRange("y", low, high);
            yLow = low;
            yHigh = high;
            return this;
        }

        /** Size of the plot area in pixels (axes, legend and text come on top); default 640 × 420. */
        public Builder plotSize(int width, int height) {
            if (width < 40 || height < 40 || width > 8000 || height > 8000) {
                throw new IllegalArgumentException(String.format(
                        "line plot area %d × %d pixels: need 40 to 8000 on each side", width, height));
            }
            plotWidth = width;
            plotHeight = height;
            return this;
        }

        private static void checkRange(String axis, double low, double high) {
            if (!Double.isFinite(low) || !Double.isFinite(high) || !(high > low)) {
                throw new IllegalArgumentException(String.format(
                        "line plot %s range [%g, %g]: need finite ends with the upper above the lower", axis, low, high));
            }
        }

        public LinePlot build() {
            return new LinePlot(this);
        }
    }
}
