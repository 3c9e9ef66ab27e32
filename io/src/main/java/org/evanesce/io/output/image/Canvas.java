package org.evanesce.io.output.image;

import java.awt.image.BufferedImage;
import java.util.Arrays;

/**
 * An RGB pixel buffer, {@code px[y*width + x]} as 0xRRGGBB with y down, and the few drawing
 * operations the image writers need. Drawing outside the buffer is clipped silently.
 */
final class Canvas {

    /** Text direction. */
    enum Direction {
        /** Left to right. */
        ACROSS,
        /** Bottom to top: the text turned a quarter turn anticlockwise. */
        UP
    }

    final int width;
    final int height;
    private final int[] px;

    Canvas(int width, int height, int background) {
        if (width < 1 || height < 1) {
            throw new IllegalArgumentException(String.format("canvas %d × %d pixels: need at least 1 × 1", width, height));
        }
        this.width = width;
        this.height = height;
        this.px = new int[width * height];
        Arrays.fill(px, background);
    }

    void set(int x, int y, int rgb) {
        if (x >= 0 && x < width && y >= 0 && y < height) {
            px[y * width + x] = rgb;
        }
    }

    int get(int x, int y) {
        return px[y * width + x];
    }

    /** Fills the rectangle [x, x + w) × [y, y + h). */
    void fill(int x, int y, int w, int h, int rgb) {
        int xa = Math.max(0, x);
        int xb = Math.min(width, x + w);
        for (int yy = Math.max(0, y); yy < Math.min(height, y + h); yy++) {
            if (xa < xb) {
                Arrays.fill(px, yy * width + xa, yy * width + xb, rgb);
            }
        }
    }

    /** A one-pixel outline just outside the rectangle [x, x + w) × [y, y + h). */
    void frame(int x, int y, int w, int h, int rgb) {
        fill(x - 1, y - 1, w + 2, 1, rgb);
        fill(x - 1, y + h, w + 2, 1, rgb);
        fill(x - 1, y, 1, h, rgb);
        fill(x + w, y, 1, h, rgb);
    }

    /**
     * Draws {@code text} with {@link PixelFont} at the given scale. The text's box has its top-left
     * corner at (x, y); across, it is {@link PixelFont#width} wide and {@link PixelFont#height}
     * tall; up, the same box turned, so width and height swap and the first character is at the
     * bottom.
     */
    void text(String text, int x, int y, int scale, int rgb, Direction direction) {
        int w = PixelFont.width(text, scale);
        int h = PixelFont.height(scale);
        boolean[] m = PixelFont.mask(text, scale);
        for (int v = 0; v < h; v++) {
            for (int u = 0; u < w; u++) {
                if (m[v * w + u]) {
                    if (direction == Direction.ACROSS) {
                        set(x + u, y + v, rgb);
                    } else {
                        set(x + v, y + w - 1 - u, rgb);
                    }
                }
            }
        }
    }

    /** A copy as an image of type {@link BufferedImage#TYPE_INT_RGB}. */
    BufferedImage toImage() {
        BufferedImage img = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        // the image's own pixel array (one 0xRRGGBB int per pixel, rows of exactly the width), filled directly:
        // the same pixels as setRGB gives, without its conversion of each pixel through the colour model
        int[] data = ((java.awt.image.DataBufferInt) img.getRaster().getDataBuffer()).getData();
        for (int k = 0; k < px.length; k++) {
            data[k] = px[k] & 0xFFFFFF;
        }
        return img;
    }
}
