package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The PNG files {@link PngFile} encodes, read back by the Java runtime's own PNG reader (javax.imageio, an
 * independent decoder of the PNG specification, ISO/IEC 15948): every pixel as drawn, the text chunk found.
 */
class PngFileTest {

    private static BufferedImage decode(byte[] png) throws IOException {
        BufferedImage img = ImageIO.read(new ByteArrayInputStream(png));
        assertNotNull(img, "the runtime's reader recognises the file as an image");
        return img;
    }

    private static void samePixels(BufferedImage drawn, BufferedImage read, String what) {
        assertEquals(drawn.getWidth(), read.getWidth(), what + ": width");
        assertEquals(drawn.getHeight(), read.getHeight(), what + ": height");
        for (int y = 0; y < drawn.getHeight(); y++) {
            for (int x = 0; x < drawn.getWidth(); x++) {
                int a = drawn.getRGB(x, y) & 0xFFFFFF;
                int b = read.getRGB(x, y) & 0xFFFFFF;
                if (a != b) {
                    assertEquals(Integer.toHexString(a), Integer.toHexString(b), what + ": pixel (" + x + ", " + y + ")");
                }
            }
        }
    }

    @Test
    void noisePlotsAndOddSizesReadBackPixelForPixel() throws IOException {
        SplittableRandom r = new SplittableRandom(15948);
        // noise (the None filter wins), smooth gradients (Sub and Up win), a plot, and sizes of one pixel
        int[][] sizes = {{1, 1}, {1, 7}, {7, 1}, {3, 5}, {257, 129}};
        for (int[] size : sizes) {
            BufferedImage noise = new BufferedImage(size[0], size[1], BufferedImage.TYPE_INT_RGB);
            BufferedImage ramp = new BufferedImage(size[0], size[1], BufferedImage.TYPE_INT_RGB);
            for (int y = 0; y < size[1]; y++) {
                for (int x = 0; x < size[0]; x++) {
                    noise.setRGB(x, y, r.nextInt(1 << 24));
                    ramp.setRGB(x, y, ((x * 3) & 0xFF) << 16 | ((y * 5) & 0xFF) << 8 | ((x + y) & 0xFF));
                }
            }
            samePixels(noise, decode(PngFile.encode(noise)), "noise " + size[0] + " x " + size[1]);
            samePixels(ramp, decode(PngFile.encode(ramp)), "ramp " + size[0] + " x " + size[1]);
        }
        LinePlot.Builder plot = LinePlot.builder().title("a plot").xTitle("x").yTitle("y");
        double[] x = new double[200];
        double[] y = new double[200];
        for (int k = 0; k < x.length; k++) {
            x[k] = k;
            y[k] = Math.sin(k / 10.0);
        }
        plot.series("sine", x, y, LinePlot.Style.LINES, LinePlot.PALETTE.get(0));
        BufferedImage drawn = plot.build().render();
        samePixels(drawn, decode(PngFile.encode(drawn)), "a line plot");
    }

    @Test
    void anImageOfAnotherTypeIsWrittenByItsRgb() throws IOException {
        BufferedImage grey = new BufferedImage(20, 10, BufferedImage.TYPE_INT_ARGB);
        for (int y = 0; y < 10; y++) {
            for (int x = 0; x < 20; x++) {
                grey.setRGB(x, y, 0xFF000000 | (x * 12) << 16 | (y * 25) << 8 | 7);
            }
        }
        samePixels(grey, decode(PngFile.encode(grey)), "an ARGB image");
    }

    @Test
    void theFileCarriesTheMarkAndReplacesAnEarlierOne(@TempDir Path dir) throws IOException {
        BufferedImage img = new BufferedImage(30, 20, BufferedImage.TYPE_INT_RGB);
        Path file = dir.resolve("sub/picture.png");
        PngFile.write(img, file);
        assertTrue(PngFile.writtenByUs(file), "the text chunk Software: evanesce is found");
        Files.writeString(file, "not a picture");
        assertTrue(!PngFile.writtenByUs(file), "a file of other content is not ours");
        PngFile.write(img, file);
        assertTrue(PngFile.writtenByUs(file), "written again over the other file");
        samePixels(img, ImageIO.read(file.toFile()), "the written file");
        try (var list = Files.list(file.getParent())) {
            assertEquals(1, list.count(), "no temporary file is left beside it");
        }
    }
}
