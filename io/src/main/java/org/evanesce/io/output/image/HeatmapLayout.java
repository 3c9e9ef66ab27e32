package org.evanesce.io.output.image;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;

/**
 * Where each part of a {@link Heatmap} goes, in pixels of the final image (y down), and the
 * drawing itself.
 *
 * <p>The parts are first placed relative to the plot's top-left pixel, then the whole is shifted so
 * that the outermost part is {@value #MARGIN} pixels from the edge. Rules that keep text apart:
 * everything left of the plot (y tick labels, the turned y title) ends at most half a cap height
 * below the plot; everything below the plot (x tick labels, x title) starts further down than
 * that; the colour bar column starts to the right of everything below the plot, and its label fits
 * beside the bar; the NaN swatch goes below everything in the bar column; the title goes above
 * everything.
 */
final class HeatmapLayout {

    /** Font pixel scale for all text. */
    static final int SCALE = 2;
    /** Height of a text line, descenders included. */
    static final int LINE = PixelFont.height(SCALE);
    /** Height of capitals and digits. */
    static final int CAP = PixelFont.CAP_HEIGHT * SCALE;
    static final int MARGIN = 16;
    static final int TICK = 6;
    static final int BAR_WIDTH = 24;
    static final int MIN_BAR_HEIGHT = 160;
    /** Preferred pixels per tick interval on the x axis, the y axis and the colour bar. */
    static final int X_TICK_SPACING = 110;
    static final int Y_TICK_SPACING = 70;
    static final int BAR_TICK_SPACING = 50;
    static final int BACKGROUND = 0xffffff;
    static final int INK = 0x1b1b1b;
    static final int FRAME = 0x3a3a3a;
    /** Fill of the colour bar when there are no finite values at all. */
    static final int NO_DATA = 0xe4e4e4;

    /** A rectangle [x, x + w) × [y, y + h). */
    record Box(int x, int y, int w, int h) {
        boolean intersects(Box o) {
            return x < o.x + o.w && o.x < x + w && y < o.y + o.h && o.y < y + h;
        }

        Box shift(int dx, int dy) {
            return new Box(x + dx, y + dy, w, h);
        }

        int right() {
            return x + w;
        }

        int bottom() {
            return y + h;
        }
    }

    /** A piece of text and its box. */
    record Text(String text, Box box, Canvas.Direction direction) {
        Text shift(int dx, int dy) {
            return new Text(text, box.shift(dx, dy), direction);
        }
    }

    private final Heatmap map;
    /** Pixels per cell (upscaling) and cells per pixel (downscaling); one of them is 1. */
    final int up;
    final int down;
    final int plotWidth;
    final int plotHeight;
    /** Whether values are shown as log10|v| ({@link Heatmap#isLogScale()}). */
    final boolean log;
    /**
     * Colour range; NaN when there are no finite values and no range was given, or on a log scale
     * when no finite value is non-zero. On a log scale these are exponents: log10 max|v| − d and
     * log10 max|v|.
     */
    final double low;
    final double high;
    final boolean constant;
    final long nanCount;
    /** Plot and colour bar, in image pixels. */
    final Box plot;
    final Box bar;
    /** The NaN swatch, or null when there is no NaN. */
    final Box swatch;
    final List<Text> texts = new ArrayList<>();
    /** Tick marks, in image pixels. */
    final List<Box> ticks = new ArrayList<>();
    /** Values of the ticks, in the display unit for the axes; on a log-scale bar, exponents of ten. */
    final double[] xTicks;
    final double[] yTicks;
    final double[] barTicks;
    final int width;
    final int height;

    HeatmapLayout(Heatmap map) {
        this.map = map;
        log = map.isLogScale();
        int nx = map.nx();
        int ny = map.ny();
        double d = map.cellSize();

        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        long nan = 0;
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                double v = map.value(i, j);
                if (Double.isNaN(v)) {
                    nan++;
                } else if (!Double.isInfinite(v)) {
                    min = Math.min(min, v);
                    max = Math.max(max, v);
                }
            }
        }
        nanCount = nan;
        double maxAbs = min > max ? 0 : Math.max(Math.abs(min), Math.abs(max));
        if (log) {
            high = maxAbs > 0 ? Math.log10(maxAbs) : Double.NaN;
            low = high - map.logDecades();
        } else if (!Double.isNaN(map.rangeLow())) {
            low = map.rangeLow();
            high = map.rangeHigh();
        } else if (min > max) {
            low = Double.NaN;
            high = Double.NaN;
        } else if (map.colourMap().kind() == ColourMap.Kind.SEQUENTIAL) {
            low = min;
            high = max;
        } else {
            double m = Math.max(Math.abs(min), Math.abs(max));
            low = -m;
            high = m;
        }
        constant = low == high;

        int side = Math.max(nx, ny);
        if (side > Heatmap.MAX_PLOT_SIDE) {
            down = (side + Heatmap.MAX_PLOT_SIDE - 1) / Heatmap.MAX_PLOT_SIDE;
            up = 1;
            plotWidth = (nx + down - 1) / down;
            plotHeight = (ny + down - 1) / down;
        } else {
            down = 1;
            up = (int) Math.max(1, Math.min(Math.round(Heatmap.TARGET_PLOT_SIDE / (double) side),
                    Heatmap.MAX_PLOT_SIDE / side));
            plotWidth = nx * up;
            plotHeight = ny * up;
        }
        int pw = plotWidth;
        int ph = plotHeight;

        // ---- placement relative to the plot's top-left pixel ----
        List<Box> parts = new ArrayList<>();
        parts.add(new Box(-1, -1, pw + 2, ph + 2));
        double u = map.unit().metres;
        double perMetre = up / (d * down);
        double xLeft = map.x0() - 0.5 * d;
        double yBottom = map.y0() - 0.5 * d;

        // x axis
        TickAxis xa = TickAxis.of(xLeft / u, (xLeft + nx * d) / u, u * perMetre, Math.max(1, pw / X_TICK_SPACING), true);
        xTicks = xa.values();
        int xLabelTop = ph + 1 + TICK + 6;
        int belowRight = pw;
        for (int q = 0; q < xa.values().length; q++) {
            int col = clamp((int) Math.floor((xa.values()[q] * u - xLeft) * perMetre), 0, pw - 1);
            ticks.add(new Box(col, ph + 1, 1, TICK));
            int w = PixelFont.width(xa.labels()[q], SCALE);
            Box b = new Box(col - w / 2, xLabelTop, w, LINE);
            texts.add(new Text(xa.labels()[q], b, Canvas.Direction.ACROSS));
            belowRight = Math.max(belowRight, b.right());
        }
        String xTitle = "x (" + map.unit().symbol + ")";
        int xtw = PixelFont.width(xTitle, SCALE);
        Box xtb = new Box(pw / 2 - xtw / 2, xLabelTop + LINE + 6, xtw, LINE);
        texts.add(new Text(xTitle, xtb, Canvas.Direction.ACROSS));
        belowRight = Math.max(belowRight, xtb.right());

        // y axis
        TickAxis ya = TickAxis.of(yBottom / u, (yBottom + ny * d) / u, u * perMetre, Math.max(1, ph / Y_TICK_SPACING), false);
        yTicks = ya.values();
        int yLabelRight = -1 - TICK - 5;
        int yLabelWidth = 0;
        for (int q = 0; q < ya.values().length; q++) {
            int row = ph - 1 - clamp((int) Math.floor((ya.values()[q] * u - yBottom) * perMetre), 0, ph - 1);
            ticks.add(new Box(-1 - TICK, row, TICK, 1));
            int w = PixelFont.width(ya.labels()[q], SCALE);
            yLabelWidth = Math.max(yLabelWidth, w);
            texts.add(new Text(ya.labels()[q], new Box(yLabelRight - w, row - CAP / 2, w, LINE), Canvas.Direction.ACROSS));
        }
        String yTitle = "y (" + map.unit().symbol + ")";
        int ytl = PixelFont.width(yTitle, SCALE);
        int ytTop = Math.min(ph / 2 - ytl / 2, ph + CAP / 2 - ytl);
        texts.add(new Text(yTitle, new Box(yLabelRight - yLabelWidth - 12 - LINE, ytTop, LINE, ytl), Canvas.Direction.UP));

        // colour bar column, right of everything below the plot; centred on the plot, at least
        // MIN_BAR_HEIGHT tall and as tall as its turned label
        String bl = map.colourBarLabel();
        int blLength = PixelFont.width(bl, SCALE);
        int barLeft = Math.max(pw + 28, belowRight + 20);
        int barHeight = Math.max(Math.max(ph, MIN_BAR_HEIGHT), blLength);
        int barTop = (ph - barHeight) / 2;
        Box barBox = new Box(barLeft, barTop, BAR_WIDTH, barHeight);
        parts.add(new Box(barLeft - 1, barTop - 1, BAR_WIDTH + 2, barHeight + 2));
        int barLabelLeft = barLeft + BAR_WIDTH + 1 + 5 + 5;
        int barLabelWidth = 0;
        int columnBottom = barBox.bottom() + 1;
        if (Double.isNaN(low)) {
            barTicks = new double[0];
        } else if (constant) {
            barTicks = new double[] {low};
            int row = barTop + (barHeight - 1) / 2;
            ticks.add(new Box(barLeft + BAR_WIDTH + 1, row, 5, 1));
            String s = Ticks.single(low);
            barLabelWidth = PixelFont.width(s, SCALE);
            texts.add(new Text(s, new Box(barLabelLeft, row - CAP / 2, barLabelWidth, LINE), Canvas.Direction.ACROSS));
        } else {
            double pixelsPerUnit = (barHeight - 1) / (high - low);
            int maxCount = Math.max(1, barHeight / BAR_TICK_SPACING);
            TickAxis ba = log ? powersOfTen(low, high, pixelsPerUnit, maxCount)
                    : TickAxis.of(low, high, pixelsPerUnit, maxCount, false);
            barTicks = ba.values();
            for (int q = 0; q < ba.values().length; q++) {
                int row = barTop + (int) Math.round((high - ba.values()[q]) / (high - low) * (barHeight - 1));
                ticks.add(new Box(barLeft + BAR_WIDTH + 1, row, 5, 1));
                int w = PixelFont.width(ba.labels()[q], SCALE);
                barLabelWidth = Math.max(barLabelWidth, w);
                Box b = new Box(barLabelLeft, row - CAP / 2, w, LINE);
                texts.add(new Text(ba.labels()[q], b, Canvas.Direction.ACROSS));
                columnBottom = Math.max(columnBottom, b.bottom());
            }
        }
        if (!bl.isEmpty()) {
            Box b = new Box(barLabelLeft + barLabelWidth + 12, barTop + (barHeight - blLength) / 2, LINE, blLength);
            texts.add(new Text(bl, b, Canvas.Direction.UP));
        }
        Box sw = null;
        if (nanCount > 0) {
            int top = columnBottom + 14;
            sw = new Box(barLeft, top, LINE, LINE);
            parts.add(new Box(barLeft - 1, top - 1, LINE + 2, LINE + 2));
            String s = "NaN: " + nanCount + (nanCount == 1 ? " cell" : " cells");
            texts.add(new Text(s, new Box(barLeft + LINE + 10, top + (LINE - CAP) / 2, PixelFont.width(s, SCALE), LINE),
                    Canvas.Direction.ACROSS));
        }

        // title above everything
        int minX = Integer.MAX_VALUE;
        int minY = Integer.MAX_VALUE;
        for (Box b : all(parts)) {
            minX = Math.min(minX, b.x());
            minY = Math.min(minY, b.y());
        }
        if (!map.title().isEmpty()) {
            Box b = new Box(minX, minY - 14 - LINE, PixelFont.width(map.title(), SCALE), LINE);
            texts.add(new Text(map.title(), b, Canvas.Direction.ACROSS));
            minY = b.y();
        }
        int maxX = Integer.MIN_VALUE;
        int maxY = Integer.MIN_VALUE;
        for (Box b : all(parts)) {
            maxX = Math.max(maxX, b.right());
            maxY = Math.max(maxY, b.bottom());
        }

        // ---- to image pixels ----
        int dx = MARGIN - minX;
        int dy = MARGIN - minY;
        width = maxX - minX + 2 * MARGIN;
        height = maxY - minY + 2 * MARGIN;
        plot = new Box(dx, dy, pw, ph);
        bar = barBox.shift(dx, dy);
        swatch = sw == null ? null : sw.shift(dx, dy);
        texts.replaceAll(t -> t.shift(dx, dy));
        ticks.replaceAll(b -> b.shift(dx, dy));
    }

    private List<Box> all(List<Box> parts) {
        List<Box> out = new ArrayList<>(parts);
        out.addAll(ticks);
        for (Text t : texts) {
            out.add(t.box());
        }
        return out;
    }

    /** Exponents within this of a whole number count as whole: rounding slack of log10. */
    private static final double EXPONENT_SLACK = 1e-9;

    /**
     * Ticks for a log-scale bar from 10^lo to 10^hi: whole exponents spaced 1, 2, 5, 10, ...
     * decades apart (the smallest spacing with at most {@code maxCount} ticks and room for the
     * labels), at multiples of the spacing. Labels are plain ("0.01" … "1000") when every tick
     * lies in that span, else "1e-6". When no whole exponent lies in [lo, hi], one tick at hi
     * labelled with 10^hi.
     *
     * @param pixelsPerDecade bar pixels per unit of the exponent
     */
    static TickAxis powersOfTen(double lo, double hi, double pixelsPerDecade, int maxCount) {
        long e0 = (long) Math.ceil(lo - EXPONENT_SLACK);
        long e1 = (long) Math.floor(hi + EXPONENT_SLACK);
        if (e1 < e0) {
            return new TickAxis(new double[] {hi}, new String[] {Ticks.single(Math.pow(10, hi))});
        }
        long step = 1;
        while (multiples(e0, e1, step) > maxCount || step * pixelsPerDecade < CAP + 16) {
            if (multiples(e0, e1, step) <= 1) {
                break;
            }
            step = Math.round(Ticks.next(step));
        }
        long first = Math.floorDiv(e0 + step - 1, step) * step;
        int n = (int) Math.max(1, multiples(e0, e1, step));
        double[] v = new double[n];
        if (first > e1) {
            v[0] = e1; // no multiple of the step inside: the top exponent alone
        } else {
            for (int q = 0; q < n; q++) {
                v[q] = first + q * step;
            }
        }
        boolean plain = v[0] >= -2 && v[n - 1] <= 3;
        String[] labels = new String[n];
        for (int q = 0; q < n; q++) {
            int e = (int) v[q];
            labels[q] = plain ? BigDecimal.ONE.scaleByPowerOfTen(e).toPlainString() : "1e" + e;
        }
        return new TickAxis(v, labels);
    }

    /** How many multiples of step lie in [e0, e1]. */
    private static long multiples(long e0, long e1, long step) {
        return Math.floorDiv(e1, step) - Math.floorDiv(e0 + step - 1, step) + 1;
    }

    private static int clamp(int v, int lo, int hi) {
        return Math.max(lo, Math.min(hi, v));
    }

    /**
     * Position along the colour map of value v: in [0, 1] for values in the range, beyond it for
     * values outside (the map clamps); NaN for NaN or, on a linear scale, when there is no range.
     * On a log scale (log10|v| − low) / (high − low), −∞ for zero, and 0 for every finite value
     * when no value is non-zero.
     */
    double position(double v) {
        if (log) {
            if (Double.isNaN(v) || Double.isNaN(high)) {
                return Double.isNaN(v) ? Double.NaN : 0;
            }
            return (Math.log10(Math.abs(v)) - low) / (high - low);
        }
        if (constant) {
            return Double.isNaN(v) ? Double.NaN : 0.5;
        }
        return (v - low) / (high - low);
    }

    /** The value shown by plot pixel (px, py), py down from the top. */
    double pixelValue(int px, int py) {
        int jb = plotHeight - 1 - py;
        if (down == 1) {
            return map.value(px / up, jb / up);
        }
        int i0 = px * down;
        int j0 = jb * down;
        int i1 = Math.min(map.nx(), i0 + down);
        int j1 = Math.min(map.ny(), j0 + down);
        double sum = 0;
        double pick = 0;
        for (int j = j0; j < j1; j++) {
            for (int i = i0; i < i1; i++) {
                double v = map.value(i, j);
                if (Double.isNaN(v)) {
                    return Double.NaN;
                }
                sum += log ? Math.abs(v) : v;
                if (Math.abs(v) > Math.abs(pick)) {
                    pick = v;
                }
            }
        }
        return map.downsampling() == Heatmap.Downsampling.MEAN ? sum / ((i1 - i0) * (j1 - j0)) : pick;
    }

    /**
     * The plot pixels covered by material outlines, {@code mask[py*plotWidth + px]} with py down
     * from the top; null without outlines. A cell whose left (i − 1) or lower (j − 1) neighbour
     * has another id marks its leftmost pixel column or bottom pixel row; on a reduced grid, the
     * pixel that shows it.
     */
    boolean[] outlineMask() {
        if (!map.hasOutlines()) {
            return null;
        }
        boolean[] mask = new boolean[plotWidth * plotHeight];
        int nx = map.nx();
        int ny = map.ny();
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                int id = map.outlineId(i, j);
                boolean left = i > 0 && map.outlineId(i - 1, j) != id;
                boolean below = j > 0 && map.outlineId(i, j - 1) != id;
                if (!left && !below) {
                    continue;
                }
                if (down > 1) {
                    mask[(plotHeight - 1 - j / down) * plotWidth + i / down] = true;
                    continue;
                }
                int px0 = i * up;
                int bottomRow = (plotHeight - 1 - j * up) * plotWidth;
                if (left) {
                    for (int r = 0; r < up; r++) {
                        mask[bottomRow - r * plotWidth + px0] = true;
                    }
                }
                if (below) {
                    for (int q = 0; q < up; q++) {
                        mask[bottomRow + px0 + q] = true;
                    }
                }
            }
        }
        return mask;
    }

    /** Draws everything. */
    Canvas draw() {
        Canvas c = new Canvas(width, height, BACKGROUND);
        ColourMap cm = map.colourMap();
        for (int py = 0; py < plotHeight; py++) {
            for (int px = 0; px < plotWidth; px++) {
                c.set(plot.x() + px, plot.y() + py, cm.rgb(position(pixelValue(px, py))));
            }
        }
        boolean[] outline = outlineMask();
        if (outline != null) {
            for (int py = 0; py < plotHeight; py++) {
                int row = py * plotWidth;
                for (int px = 0; px < plotWidth; px++) {
                    if (!outline[row + px]) {
                        continue;
                    }
                    // dashes run along x on a line that continues in this row, else along y (Heatmap's class comment)
                    boolean inRow = px > 0 && outline[row + px - 1] || px + 1 < plotWidth && outline[row + px + 1];
                    if (Heatmap.onDash(inRow ? px : py)) {
                        int x = plot.x() + px;
                        int y = plot.y() + py;
                        c.set(x, y, Heatmap.outlineColour(c.get(x, y)));
                    }
                }
            }
        }
        c.frame(plot.x(), plot.y(), plot.w(), plot.h(), FRAME);
        int bh = bar.h();
        for (int r = 0; r < bh; r++) {
            int rgb;
            if (Double.isNaN(low)) {
                rgb = NO_DATA;
            } else if (constant) {
                rgb = cm.rgb(0.5);
            } else {
                rgb = cm.rgb(bh == 1 ? 0.5 : 1 - r / (double) (bh - 1));
            }
            c.fill(bar.x(), bar.y() + r, bar.w(), 1, rgb);
        }
        c.frame(bar.x(), bar.y(), bar.w(), bar.h(), FRAME);
        for (Box t : ticks) {
            c.fill(t.x(), t.y(), t.w(), t.h(), FRAME);
        }
        if (swatch != null) {
            c.fill(swatch.x(), swatch.y(), swatch.w(), swatch.h(), cm.missingColour());
            c.frame(swatch.x(), swatch.y(), swatch.w(), swatch.h(), FRAME);
        }
        for (Text t : texts) {
            c.text(t.text(), t.box().x(), t.box().y(), SCALE, INK, t.direction());
        }
        return c;
    }

}
