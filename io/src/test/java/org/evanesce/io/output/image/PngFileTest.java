package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The program's own PNG encoder for {@code TYPE_INT_RGB} pictures, read back by the Java runtime's PNG decoder
 * ({@code javax.imageio}, a general-purpose reference independent of the encoder): every pixel must come back
 * as written (PNG is lossless: ISO/IEC 15948), the file must carry the program's text chunk before its image
 * data, and pictures of other kinds still go through {@code javax.imageio}.
 */
class PngFileTest {

    @TempDir
    Path dir;

    private static BufferedImage random(int w, int h, long seed) {
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Random r = new Random(seed);
        for (int y = 0; y < h; y++) {
            for (int x = 0; x < w; x++) {
                img.setRGB(x, y, r.nextInt());
            }
        }
        return img;
    }

    private static int[] pixels(BufferedImage img) {
        return img.getRGB(0, 0, img.getWidth(), img.getHeight(), null, 0, img.getWidth());
    }

    private void roundTrip(BufferedImage img, String name) throws IOException {
        Path f = PngFile.write(img, dir.resolve(name));
        BufferedImage back = ImageIO.read(f.toFile());
        assertEquals(img.getWidth(), back.getWidth(), name);
        assertEquals(img.getHeight(), back.getHeight(), name);
        assertArrayEquals(pixels(img), pixels(back), name + ": every pixel as written");
        assertTrue(PngFile.writtenByUs(f), name + ": the program's text chunk before the image data");
    }

    @Test
    void randomPixelsOfOddSizesComeBackExactly() throws IOException {
        // random bytes: every filter difference wraps round modulo 256 somewhere
        roundTrip(random(1, 1, 1), "one.png");
        roundTrip(random(37, 23, 2), "odd.png");
        roundTrip(random(3, 200, 3), "tall.png");
    }

    @Test
    void aDrawnPlotComesBackExactly() throws IOException {
        double[] x = new double[50];
        double[] y = new double[50];
        for (int i = 0; i < x.length; i++) {
            x[i] = i;
            y[i] = Math.sin(i / 5.0);
        }
        LinePlot plot = LinePlot.builder().title("a plot").xTitle("x").yTitle("y").series("sin", x, y).build();
        roundTrip(plot.render(), "plot.png");
    }

    @Test
    void flatPicturesCompress() throws IOException {
        // a picture of one colour: each row after the first is all zeros after the "Up" filter
        BufferedImage img = new BufferedImage(400, 300, BufferedImage.TYPE_INT_RGB);
        for (int y = 0; y < 300; y++) {
            for (int x = 0; x < 400; x++) {
                img.setRGB(x, y, 0x3366cc);
            }
        }
        byte[] png = PngFile.rgb(img);
        // 360,300 bytes of filtered rows; measured 1,090 bytes of PNG (2026-12-04); bound well above that
        assertTrue(png.length < 4_000, "a flat 400 x 300 picture takes " + png.length + " bytes");
        BufferedImage back = ImageIO.read(new ByteArrayInputStream(png));
        assertArrayEquals(pixels(img), pixels(back));
    }

    @Test
    void otherKindsOfPictureGoThroughImageIo() throws IOException {
        BufferedImage grey = new BufferedImage(20, 10, BufferedImage.TYPE_BYTE_GRAY);
        grey.getRaster().setSample(3, 4, 0, 200);
        Path f = PngFile.write(grey, dir.resolve("grey.png"));
        assertEquals(200, ImageIO.read(f.toFile()).getRaster().getSample(3, 4, 0));
        assertTrue(PngFile.writtenByUs(f));
        // a part of a larger picture (its raster has a parent) is written through javax.imageio too
        BufferedImage big = random(30, 30, 4);
        roundTrip(big.getSubimage(5, 7, 11, 13), "part.png");
        assertTrue(Files.size(dir.resolve("part.png")) > 0);
    }
}
