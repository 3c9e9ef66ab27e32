package org.evanesce.io.output.image;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;

/**
 * A small drawing of a scene beside a plot: the material outlines of a rectangle of the grid (a pixel is outlined
 * where its cell's material differs from the next pixel's to the right or below, as on {@link Heatmap}'s outlines),
 * the materials other than the surrounding one lightly tinted, and a marked rectangle (a far-field contour) drawn
 * dashed. The drawing is placed to the right of the plot, near its top, under a caption; the plot is not changed.
 */
public final class OutlineInset {

    /** The drawing's larger side, pixels. */
    static final int SIZE = 170;
    /** Space between the plot and the drawing, and round the drawing, pixels. */
    static final int GAP = 16;
    /** Tint of materials other than the one at the drawing's corner. */
    static final int TINT = 0xE4E4E4;
    /** Outline ink. */
    static final int INK = Heatmap.OUTLINE_DARK;
    /** The marked rectangle's colour: the first of the plots' palette. */
    static final int MARK = LinePlot.PALETTE.get(0);
    /** Dash length of the marked rectangle, pixels. */
    static final int DASH = 4;

    private final int[] ids;
    private final int nx;
    private final int ny;
    private final double[] mark;
    private final String caption;

    /**
     * @param ids     a material id per cell, ids[j·nx + i], row j = 0 at the bottom; not modified
     * @param nx      cells across
     * @param ny      cells up
     * @param mark    the marked rectangle {left, bottom, right, top} in cell units from the first cell's lower-left
     *                corner
     * @param caption a few words drawn above the drawing
     */
    public OutlineInset(int[] ids, int nx, int ny, double[] mark, String caption) {
        if (nx < 1 || ny < 1 || ids.length != nx * ny || mark.length != 4) {
            throw new IllegalArgumentException(String.format("outline inset: %d ids for %d x %d cells, mark of %d values",
                    ids.length, nx, ny, mark.length));
        }
        this.ids = ids.clone();
        this.nx = nx;
        this.ny = ny;
        this.mark = mark.clone();
        this.caption = caption;
    }

    /** The drawing alone, framed: width and height in proportion to the cells, the larger {@link #SIZE}. */
    BufferedImage draw() {
        double scale = (double) SIZE / Math.max(nx, ny);
        int w = Math.max(8, (int) Math.round(nx * scale));
        int h = Math.max(8, (int) Math.round(ny * scale));
        int around = ids[0];
        int[] cell = new int[w * h];
        for (int y = 0; y < h; y++) {
            int j = Math.min(ny - 1, (int) ((h - 1 - y + 0.5) / scale));
            for (int x = 0; x < w; x++) {
                int i = Math.min(nx - 1, (int) ((x + 0.5) / scale));
                cell[y * w + x] = ids[j * nx + i];
            }
        }
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        for (int y = 0; y < h; y++) {
            for (int x = 0; x < w; x++) {
                int id = cell[y * w + x];
                boolean edge = (x + 1 < w && cell[y * w + x + 1] != id) || (y + 1 < h && cell[(y + 1) * w + x] != id);
                img.setRGB(x, y, edge ? INK : id == around ? 0xFFFFFF : TINT);
            }
        }
        int l = (int) Math.round(mark[0] * scale);
        int r = (int) Math.round(mark[2] * scale);
        int top = (int) Math.round(h - 1 - mark[3] * scale);
        int bottom = (int) Math.round(h - 1 - mark[1] * scale);
        for (int x = l; x <= r; x++) {
            dash(img, x, top, x - l);
            dash(img, x, bottom, x - l);
        }
        for (int y = top; y <= bottom; y++) {
            dash(img, l, y, y - top);
            dash(img, r, y, y - top);
        }
        for (int x = 0; x < w; x++) {
            img.setRGB(x, 0, INK);
            img.setRGB(x, h - 1, INK);
        }
        for (int y = 0; y < h; y++) {
            img.setRGB(0, y, INK);
            img.setRGB(w - 1, y, INK);
        }
        return img;
    }

    private static void dash(BufferedImage img, int x, int y, int along) {
        if (x >= 0 && y >= 0 && x < img.getWidth() && y < img.getHeight() && (along / DASH) % 2 == 0) {
            img.setRGB(x, y, MARK);
        }
    }

    /** The plot with this drawing to its right, under the caption. */
    public BufferedImage beside(BufferedImage plot) {
        BufferedImage inset = draw();
        int scale = LinePlot.SCALE;
        int captionHeight = PixelFont.height(scale) + 8;
        int panel = Math.max(inset.getWidth(), PixelFont.width(caption, scale));
        int width = plot.getWidth() + panel + 2 * GAP;
        int height = Math.max(plot.getHeight(), GAP + captionHeight + inset.getHeight() + GAP);
        BufferedImage all = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        int[] white = new int[width * height];
        java.util.Arrays.fill(white, 0xFFFFFF);
        all.setRGB(0, 0, width, height, white, 0, width);
        paste(all, plot, 0, 0);
        int x0 = plot.getWidth() + GAP;
        Canvas text = new Canvas(PixelFont.width(caption, scale), PixelFont.height(scale), 0xFFFFFF);
        text.text(caption, 0, 0, scale, INK, Canvas.Direction.ACROSS);
        paste(all, text.toImage(), x0, GAP);
        paste(all, inset, x0, GAP + captionHeight);
        return all;
    }

    /** Copies {@code part} into {@code onto} with its top-left corner at (x, y), whole rows at a time. */
    private static void paste(BufferedImage onto, BufferedImage part, int x, int y) {
        int w = part.getWidth();
        int h = part.getHeight();
        onto.setRGB(x, y, w, h, part.getRGB(0, 0, w, h, null, 0, w), 0, w);
    }

    /** Writes the plot with the drawing beside it as a PNG file, atomically ({@link LinePlot#writePng}). */
    public Path writeBeside(LinePlot plot, Path file) throws IOException {
        return PngFile.write(beside(plot.render()), file);
    }
}
