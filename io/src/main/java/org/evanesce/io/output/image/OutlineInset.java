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

    private final double[] mark;
    private final String caption;
    /** Pixels per cell. */
    private final double scale;
    /** The drawing's size, pixels. */
    private final int w;
    private final int h;
    /** The material id under each pixel of the drawing, cell[y·w + x], y down. */
    private final int[] cell;
    /** The id at the first cell (the surrounding material, left white). */
    private final int around;
    /** The drawing's pixels (0xRRGGBB, y down), drawn once on first use and kept: every plot beside it shares them. */
    private int[] drawn;

    /** The material id of cell (i, j) of a rectangle of cells, row j = 0 at the bottom. */
    @FunctionalInterface
    public interface Cells {
        int id(int i, int j);
    }

    /**
     * @param ids     a material id per cell, ids[j·nx + i], row j = 0 at the bottom; not modified
     * @param nx      cells across
     * @param ny      cells up
     * @param mark    the marked rectangle {left, bottom, right, top} in cell units from the first cell's lower-left
     *                corner
     * @param caption a few words drawn above the drawing
     */
    public OutlineInset(int[] ids, int nx, int ny, double[] mark, String caption) {
        this(check(ids, nx, ny, mark), nx, ny, mark, caption);
    }

    /**
     * The same from a look-up of each cell's id: only the cells under the drawing's pixels are asked for (at most
     * {@link #SIZE}² of them, however large the rectangle).
     */
    public OutlineInset(Cells ids, int nx, int ny, double[] mark, String caption) {
        if (nx < 1 || ny < 1 || mark.length != 4) {
            throw new IllegalArgumentException(String.format("outline inset: %d x %d cells, mark of %d values", nx, ny,
                    mark.length));
        }
        this.mark = mark.clone();
        this.caption = caption;
        scale = (double) SIZE / Math.max(nx, ny);
        w = Math.max(8, (int) Math.round(nx * scale));
        h = Math.max(8, (int) Math.round(ny * scale));
        around = ids.id(0, 0);
        cell = new int[w * h];
        int[] column = new int[w];
        for (int x = 0; x < w; x++) {
            column[x] = Math.min(nx - 1, (int) ((x + 0.5) / scale));
        }
        for (int y = 0; y < h; y++) {
            int j = Math.min(ny - 1, (int) ((h - 1 - y + 0.5) / scale));
            for (int x = 0; x < w; x++) {
                cell[y * w + x] = ids.id(column[x], j);
            }
        }
    }

    private static Cells check(int[] ids, int nx, int ny, double[] mark) {
        if (nx < 1 || ny < 1 || ids.length != nx * ny || mark.length != 4) {
            throw new IllegalArgumentException(String.format("outline inset: %d ids for %d x %d cells, mark of %d values",
                    ids.length, nx, ny, mark.length));
        }
        int[] copy = ids.clone();
        return (i, j) -> copy[j * nx + i];
    }

    /** The drawing alone, framed: width and height in proportion to the cells, the larger {@link #SIZE}. */
    BufferedImage draw() {
        return image(pixels(), w, h);
    }

    /** The drawing's pixels, drawn on the first call (the same array afterwards; not to be modified). */
    private synchronized int[] pixels() {
        if (drawn != null) {
            return drawn;
        }
        int[] px = new int[w * h];
        for (int y = 0; y < h; y++) {
            for (int x = 0; x < w; x++) {
                int id = cell[y * w + x];
                boolean edge = (x + 1 < w && cell[y * w + x + 1] != id) || (y + 1 < h && cell[(y + 1) * w + x] != id);
                px[y * w + x] = edge ? INK : id == around ? 0xFFFFFF : TINT;
            }
        }
        int l = (int) Math.round(mark[0] * scale);
        int r = (int) Math.round(mark[2] * scale);
        int top = (int) Math.round(h - 1 - mark[3] * scale);
        int bottom = (int) Math.round(h - 1 - mark[1] * scale);
        for (int x = l; x <= r; x++) {
            dash(px, x, top, x - l);
            dash(px, x, bottom, x - l);
        }
        for (int y = top; y <= bottom; y++) {
            dash(px, l, y, y - top);
            dash(px, r, y, y - top);
        }
        for (int x = 0; x < w; x++) {
            px[x] = INK;
            px[(h - 1) * w + x] = INK;
        }
        for (int y = 0; y < h; y++) {
            px[y * w] = INK;
            px[y * w + w - 1] = INK;
        }
        for (int k = 0; k < px.length; k++) {
            px[k] &= 0xFFFFFF;
        }
        drawn = px;
        return px;
    }

    private void dash(int[] px, int x, int y, int along) {
        if (x >= 0 && y >= 0 && x < w && y < h && (along / DASH) % 2 == 0) {
            px[y * w + x] = MARK;
        }
    }

    /** The plot with this drawing to its right, under the caption. */
    public BufferedImage beside(BufferedImage plot) {
        int scale = LinePlot.SCALE;
        int captionHeight = PixelFont.height(scale) + 8;
        int panel = Math.max(w, PixelFont.width(caption, scale));
        int width = plot.getWidth() + panel + 2 * GAP;
        int height = Math.max(plot.getHeight(), GAP + captionHeight + h + GAP);
        BufferedImage all = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        int[] px = data(all);
        java.util.Arrays.fill(px, 0xFFFFFF);
        paste(px, width, rgb(plot), plot.getWidth(), plot.getHeight(), 0, 0);
        int x0 = plot.getWidth() + GAP;
        Canvas text = new Canvas(PixelFont.width(caption, scale), PixelFont.height(scale), 0xFFFFFF);
        text.text(caption, 0, 0, scale, INK, Canvas.Direction.ACROSS);
        paste(px, width, data(text.toImage()), text.width, text.height, x0, GAP);
        paste(px, width, pixels(), w, h, x0, GAP + captionHeight);
        return all;
    }

    /** The pixel array of an image of type {@link BufferedImage#TYPE_INT_RGB} (0xRRGGBB per pixel, rows of its width). */
    private static int[] data(BufferedImage img) {
        return ((java.awt.image.DataBufferInt) img.getRaster().getDataBuffer()).getData();
    }

    /** An image's pixels as 0xRRGGBB, rows of its width: its own array for {@code TYPE_INT_RGB}, else a converted copy. */
    private static int[] rgb(BufferedImage img) {
        if (img.getType() == BufferedImage.TYPE_INT_RGB) {
            return data(img);
        }
        int[] px = img.getRGB(0, 0, img.getWidth(), img.getHeight(), null, 0, img.getWidth());
        for (int k = 0; k < px.length; k++) {
            px[k] &= 0xFFFFFF;
        }
        return px;
    }

    private static BufferedImage image(int[] px, int w, int h) {
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        System.arraycopy(px, 0, data(img), 0, px.length);
        return img;
    }

    /** Copies a w × h picture into {@code onto} (rows of {@code width}) with its top-left corner at (x, y), row by row. */
    private static void paste(int[] onto, int width, int[] part, int w, int h, int x, int y) {
        for (int r = 0; r < h; r++) {
            System.arraycopy(part, r * w, onto, (y + r) * width + x, w);
        }
    }

    /** Writes the plot with the drawing beside it as a PNG file, atomically ({@link LinePlot#writePng}). */
    public Path writeBeside(LinePlot plot, Path file) throws IOException {
        return PngFile.write(beside(plot.render()), file);
    }
}
