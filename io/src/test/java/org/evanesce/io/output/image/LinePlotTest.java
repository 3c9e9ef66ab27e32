package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class LinePlotTest {

    /** Tick and range arithmetic is exact up to rounding. */
    private static final double EXACT = 1e-12;
    /** Palette colours must differ clearly from each other and from the white background (Oklab distance). */
    private static final double MIN_COLOUR_DISTANCE = 0.08;

    @TempDir
    Path tmp;

    private static int rgb(BufferedImage img, int x, int y) {
        return img.getRGB(x, y) & 0xffffff;
    }

    /** Mean row of the pixels of colour {@code rgb} in columns [x0, x1) of the box {x, y, w, h}; NaN if none. */
    private static double meanRow(BufferedImage img, int[] box, int x0, int x1, int colour) {
        double sum = 0;
        int n = 0;
        for (int x = x0; x < x1; x++) {
            for (int y = box[1]; y < box[1] + box[3]; y++) {
                if (rgb(img, x, y) == colour) {
                    sum += y;
                    n++;
                }
            }
        }
        return n == 0 ? Double.NaN : sum / n;
    }

    private static long count(BufferedImage img, int[] box, int colour) {
        long n = 0;
        for (int y = box[1]; y < box[1] + box[3]; y++) {
            for (int x = box[0]; x < box[0] + box[2]; x++) {
                if (rgb(img, x, y) == colour) {
                    n++;
                }
            }
        }
        return n;
    }

    private static double[] ramp(int n, double a, double b) {
        double[] v = new double[n];
        for (int q = 0; q < n; q++) {
            v[q] = a + (b - a) * q / (n - 1);
        }
        return v;
    }

    @Test
    void writesAReadablePngAtomically() throws IOException {
        LinePlot p = LinePlot.builder().title("T against gap, s at 45°").xTitle("gap (λ)").yTitle("T")
                .series("exact", ramp(50, 0, 1.5), ramp(50, 1, 0), LinePlot.Style.LINES, 0x1b1b1b)
                .series("20 cells/λ", ramp(6, 0, 1.5), ramp(6, 1, 0)).build();
        Path file = tmp.resolve("sub/plot.png");
        Path written = p.writePng(file);
        assertEquals(file.toAbsolutePath().normalize(), written);
        BufferedImage back = ImageIO.read(file.toFile());
        assertNotNull(back, "the PNG must be readable");
        BufferedImage img = p.render();
        assertEquals(img.getWidth(), back.getWidth());
        assertEquals(img.getHeight(), back.getHeight());
        for (int y = 0; y < img.getHeight(); y += 7) {
            for (int x = 0; x < img.getWidth(); x += 5) {
                assertEquals(rgb(img, x, y), rgb(back, x, y), "pixel (" + x + ", " + y + ")");
            }
        }
        try (Stream<Path> s = Files.list(file.getParent())) {
            assertEquals(List.of("plot.png"), s.map(q -> q.getFileName().toString()).toList(), "no temporary file left");
        }
        // a second write replaces the first
        p.writePng(file);
        assertNotNull(ImageIO.read(file.toFile()));
    }

    @Test
    void aRisingSeriesGoesUpToTheRight() {
        LinePlot p = LinePlot.builder().series("rising", ramp(20, -3, 7), ramp(20, 10, 30)).build();
        int colour = p.series().get(0).rgb();
        BufferedImage img = p.render();
        int[] box = p.plotArea();
        int tenth = box[2] / 10;
        double leftRow = meanRow(img, box, box[0], box[0] + tenth, colour);
        double rightRow = meanRow(img, box, box[0] + box[2] - tenth, box[0] + box[2], colour);
        assertTrue(leftRow > rightRow + box[3] / 2.0,
                String.format("rows are counted down: left mean row %.1f must lie well below right %.1f", leftRow, rightRow));
        // with 4 % padding the first point sits near the bottom-left corner
        assertTrue(leftRow > box[1] + 0.85 * box[3], "left end near the bottom: row " + leftRow);
    }

    @Test
    void theLegendHasInkAndEverySeriesColour() {
        LinePlot p = LinePlot.builder()
                .series("first", new double[] {0, 1}, new double[] {0, 1})
                .series("second", new double[] {0, 1}, new double[] {1, 0}, LinePlot.Style.MARKERS)
                .series("third", new double[] {0, 1}, new double[] {0.5, 0.5}, LinePlot.Style.LINES).build();
        BufferedImage img = p.render();
        int[] legend = p.legendArea();
        assertNotNull(legend);
        assertTrue(legend[0] > p.plotArea()[0] + p.plotArea()[2], "the legend is right of the plot");
        assertTrue(count(img, legend, LinePlot.INK) > 100, "the names are written in the legend");
        for (LinePlot.Series s : p.series()) {
            assertTrue(count(img, legend, s.rgb()) > 5, "legend sample of " + s.name());
        }
        assertEquals(List.of(LinePlot.Marker.CIRCLE, LinePlot.Marker.SQUARE, LinePlot.Marker.TRIANGLE),
                p.series().stream().map(LinePlot.Series::marker).toList());
    }

    @Test
    void aConstantSeriesGetsARangeAroundItsValueAndIsDrawnInTheMiddle() {
        LinePlot p = LinePlot.builder().series("flat", ramp(5, 0, 4), new double[] {5, 5, 5, 5, 5}).build();
        assertArrayEquals(new double[] {4.5, 5.5}, p.yRange(), EXACT);
        BufferedImage img = p.render();
        int[] box = p.plotArea();
        double row = meanRow(img, box, box[0], box[0] + box[2], p.series().get(0).rgb());
        assertEquals(box[1] + (box[3] - 1) / 2.0, row, 2.0, "the flat line lies across the middle");
        LinePlot zero = LinePlot.builder().series("zero", new double[] {1}, new double[] {0}).build();
        assertArrayEquals(new double[] {-1, 1}, zero.yRange(), EXACT);
        assertArrayEquals(new double[] {0.9, 1.1}, zero.xRange(), EXACT);
    }

    @Test
    void emptySeriesAndNoSeriesStillDraw() {
        LinePlot empty = LinePlot.builder().title("nothing yet").series("none", new double[0], new double[0]).build();
        assertArrayEquals(new double[] {0, 1}, empty.xRange(), EXACT);
        assertArrayEquals(new double[] {0, 1}, empty.yRange(), EXACT);
        BufferedImage img = empty.render();
        assertTrue(count(img, empty.legendArea(), LinePlot.INK) > 0, "the empty series is still named");
        LinePlot bare = LinePlot.builder().build();
        assertNull(bare.legendArea());
        assertTrue(bare.render().getWidth() > bare.plotArea()[2]);
    }

    @Test
    void nonFinitePointsAreSkippedAndGivenRangesAreKept() {
        LinePlot p = LinePlot.builder().xRange(0, 10).yRange(-1, 1)
                .series("gappy", new double[] {0, 1, Double.NaN, 3, 4}, new double[] {0, Double.POSITIVE_INFINITY, 0, 0.5, 99})
                .build();
        assertArrayEquals(new double[] {0, 10}, p.xRange(), EXACT);
        assertArrayEquals(new double[] {-1, 1}, p.yRange(), EXACT);
        BufferedImage img = p.render();
        int[] box = p.plotArea();
        int colour = p.series().get(0).rgb();
        // nothing leaks above the plot from the point at y = 99
        int[] above = {box[0], 0, box[2], box[1] - 1};
        assertEquals(0, count(img, above, colour));
        LinePlot auto = LinePlot.builder()
                .series("gappy", new double[] {0, 1, Double.NaN, 3}, new double[] {0, Double.NaN, 5, 2}).build();
        assertArrayEquals(new double[] {-0.12, 3.12}, auto.xRange(), 1e-9);
        assertArrayEquals(new double[] {-0.08, 2.08}, auto.yRange(), 1e-9);
    }

    @Test
    void badInputIsRefusedWithTheReason() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> LinePlot.builder().series("odd", new double[] {1, 2}, new double[] {1}));
        assertTrue(e.getMessage().contains("odd") && e.getMessage().contains("2 x values"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> LinePlot.builder().yRange(1, 1));
        assertThrows(IllegalArgumentException.class, () -> LinePlot.builder().xRange(0, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> LinePlot.builder().plotSize(10, 400));
        assertThrows(IllegalArgumentException.class,
                () -> LinePlot.builder().series("c", new double[0], new double[0], LinePlot.Style.LINES, 0x1000000));
    }

    @Test
    void paletteColoursAreDistinctAndStandOutOnWhite() {
        List<Integer> pal = LinePlot.PALETTE;
        double[] white = Oklab.fromRgb(LinePlot.BACKGROUND);
        for (int a = 0; a < pal.size(); a++) {
            double[] pa = Oklab.fromRgb(pal.get(a));
            assertTrue(Oklab.distance(pa, white) > 0.25, String.format("palette colour %d (%06x) too close to white", a, pal.get(a)));
            for (int b = a + 1; b < pal.size(); b++) {
                double d = Oklab.distance(pa, Oklab.fromRgb(pal.get(b)));
                assertTrue(d > MIN_COLOUR_DISTANCE, String.format("palette colours %d and %d only %.3f apart", a, b, d));
            }
        }
        LinePlot.Builder b = LinePlot.builder();
        for (int q = 0; q < 3; q++) {
            b.series("s" + q, new double[] {q}, new double[] {q});
        }
        assertEquals(pal.subList(0, 3), b.build().series().stream().map(LinePlot.Series::rgb).toList());
    }
}
