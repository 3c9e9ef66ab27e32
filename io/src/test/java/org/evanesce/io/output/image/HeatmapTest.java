package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.GraphicsEnvironment;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HeatmapTest {

    /** Tick values are computed as k·step: compare to rounding. */
    private static final double EXACT = 1e-12;

    @TempDir
    Path tmp;

    private static Heatmap.Builder steps(int nx, int ny, double left, double right) {
        double[] v = new double[nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                v[j * nx + i] = i < nx / 2 ? left : right;
            }
        }
        return Heatmap.builder(v, nx, ny).cellSize(0.1e-6);
    }

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    private static int rgb(BufferedImage img, int x, int y) {
        return img.getRGB(x, y) & 0xffffff;
    }

    @Test
    void runsWithoutADisplay() {
        assertTrue(GraphicsEnvironment.isHeadless(), "tests are meant to run with -Djava.awt.headless=true (io/pom.xml)");
    }

    @Test
    void thePngReadsBackWithTheLaidOutSize() throws Exception {
        Heatmap h = steps(64, 40, 1, 2.25).title("step").colourBarLabel("relative permittivity (Ez site)").build();
        HeatmapLayout l = h.layout();
        Path f = h.writePng(tmp.resolve("step.png"));
        BufferedImage img = ImageIO.read(f.toFile());
        assertNotNull(img, "ImageIO reads the file back");
        assertEquals(l.width, img.getWidth());
        assertEquals(l.height, img.getHeight());
        assertEquals(10, l.up, "64 cells upscaled by 10 to 640 px");
        assertEquals(640, l.plot.w());
        assertEquals(400, l.plot.h());
        assertEquals(List.of("step.png"), names(tmp), "no temporary file left behind");
    }

    @Test
    void lowValuesLeftHighRightAndRowZeroAtTheBottom() {
        int nx = 20;
        int ny = 10;
        double[] v = new double[nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                v[j * nx + i] = i < nx / 2 ? 1.0 : 3.0;
            }
        }
        Arrays.fill(v, 0, nx / 2, 2.0); // the left half of row j = 0 only
        Heatmap h = Heatmap.builder(v, nx, ny).cellSize(50e-9).build();
        HeatmapLayout l = h.layout();
        BufferedImage img = h.render();
        ColourMap m = ColourMap.LUMEN;
        int cell = l.up;
        int midY = l.plot.y() + l.plot.h() / 2;
        assertEquals(m.rgb(0), rgb(img, l.plot.x() + 2 * cell, midY), "left half low");
        assertEquals(m.rgb(1), rgb(img, l.plot.x() + l.plot.w() - 2 * cell, midY), "right half high");
        int bottom = l.plot.y() + l.plot.h() - 1;
        assertEquals(m.rgb(0.5), rgb(img, l.plot.x() + 2 * cell, bottom), "row 0 is the bottom row");
        assertEquals(m.rgb(0), rgb(img, l.plot.x() + 2 * cell, l.plot.y()), "the top row is row ny - 1");
        // the colour bar runs from high at the top to low at the bottom
        assertEquals(m.rgb(1), rgb(img, l.bar.x() + l.bar.w() / 2, l.bar.y()));
        assertEquals(m.rgb(0), rgb(img, l.bar.x() + l.bar.w() / 2, l.bar.y() + l.bar.h() - 1));
    }

    @Test
    void axisTicksAreNiceAndInTheChosenUnit() {
        // 0 to 6.4 um at 50 nm: 129 × 81 nodes, like GridSpec.covering
        GridSpec g = GridSpec.covering(0, 0, 6.4e-6, 4e-6, 50e-9);
        Heatmap h = Heatmap.builder(new double[g.nx() * g.ny()], g.nx(), g.ny()).grid(g).build();
        HeatmapLayout l = h.layout();
        assertEquals(DisplayUnit.UM, h.unit());
        assertArrayEquals(new double[] {0, 2, 4, 6}, l.xTicks, EXACT);
        assertTrue(l.texts.stream().anyMatch(t -> t.text().equals("x (um)")));
        assertTrue(l.texts.stream().anyMatch(t -> t.text().equals("y (um)") && t.direction() == Canvas.Direction.UP));
        Heatmap nm = Heatmap.builder(new double[g.nx() * g.ny()], g.nx(), g.ny()).grid(g).unit(DisplayUnit.NM).build();
        assertArrayEquals(new double[] {0, 2000, 4000, 6000}, nm.layout().xTicks, EXACT);
    }

    @Test
    void constantDataIsOneColourWithOneBarTick() {
        double[] v = new double[12 * 8];
        Arrays.fill(v, 2.25);
        Heatmap h = Heatmap.builder(v, 12, 8).cellSize(1e-3).build();
        HeatmapLayout l = h.layout();
        BufferedImage img = h.render();
        int c = ColourMap.LUMEN.rgb(0.5);
        for (int y = l.plot.y(); y < l.plot.y() + l.plot.h(); y += 7) {
            for (int x = l.plot.x(); x < l.plot.x() + l.plot.w(); x += 7) {
                assertEquals(c, rgb(img, x, y), "pixel (" + x + ", " + y + ")");
            }
        }
        assertArrayEquals(new double[] {2.25}, l.barTicks);
        assertTrue(l.texts.stream().anyMatch(t -> t.text().equals("2.25")));
        assertEquals(c, rgb(img, l.bar.x() + 3, l.bar.y() + 3));
        assertEquals(DisplayUnit.MM, h.unit());
    }

    @Test
    void nanCellsGetTheMissingColourAndAreCounted() {
        double[] v = new double[10 * 10];
        for (int k = 0; k < v.length; k++) {
            v[k] = k;
        }
        v[0] = Double.NaN;
        Heatmap h = Heatmap.builder(v, 10, 10).cellSize(1e-6).build();
        HeatmapLayout l = h.layout();
        BufferedImage img = h.render();
        int miss = ColourMap.LUMEN.missingColour();
        assertEquals(miss, rgb(img, l.plot.x() + 1, l.plot.y() + l.plot.h() - 2), "cell (0, 0) at the bottom left");
        assertEquals(ColourMap.LUMEN.rgb(0), rgb(img, l.plot.x() + l.up + 1, l.plot.y() + l.plot.h() - 2),
                "cell (1, 0) holds the smallest finite value");
        assertNotNull(l.swatch);
        assertEquals(miss, rgb(img, l.swatch.x() + 2, l.swatch.y() + 2));
        assertTrue(l.texts.stream().anyMatch(t -> t.text().equals("NaN: 1 cell")));
        assertNull(steps(4, 4, 0, 1).build().layout().swatch, "no swatch without NaN");
    }

    @Test
    void allNanStillRenders() {
        double[] v = new double[5 * 3];
        Arrays.fill(v, Double.NaN);
        Heatmap h = Heatmap.builder(v, 5, 3).cellSize(1e-6).build();
        HeatmapLayout l = h.layout();
        BufferedImage img = h.render();
        assertEquals(0, l.barTicks.length);
        assertEquals(ColourMap.LUMEN.missingColour(), rgb(img, l.plot.x() + 1, l.plot.y() + 1));
        assertTrue(l.texts.stream().anyMatch(t -> t.text().equals("NaN: 15 cells")));
    }

    @Test
    void divergingRangeIsSymmetricAboutZero() {
        Heatmap h = steps(10, 4, -1, 3).colourMap(ColourMap.SHOAL).build();
        HeatmapLayout l = h.layout();
        assertEquals(-3, l.low);
        assertEquals(3, l.high);
        assertEquals(0.5, l.position(0));
        BufferedImage img = h.render();
        assertEquals(ColourMap.SHOAL.rgb(1.0 / 3), rgb(img, l.plot.x() + 1, l.plot.y() + 1));
        assertTrue(Arrays.stream(l.barTicks).anyMatch(t -> t == 0), "zero is a bar tick");
    }

    @Test
    void aGivenRangeClampsBeyondItsEnds() {
        Heatmap h = steps(10, 4, -5, 5).range(0, 1).build();
        HeatmapLayout l = h.layout();
        BufferedImage img = h.render();
        assertEquals(ColourMap.LUMEN.rgb(0), rgb(img, l.plot.x() + 1, l.plot.y() + 1));
        assertEquals(ColourMap.LUMEN.rgb(1), rgb(img, l.plot.x() + l.plot.w() - 2, l.plot.y() + 1));
    }

    @Test
    void largeGridsAreReducedByAWholeFactor() {
        int nx = 2500;
        int ny = 12;
        float[] v = new float[nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                v[j * nx + i] = (i + j) % 2 == 0 ? 1f : -1f; // a checkerboard: means 0, extremes ±1
            }
        }
        Heatmap mean = Heatmap.builder(v, nx, ny).cellSize(10e-9).colourMap(ColourMap.SHOAL).build();
        HeatmapLayout l = mean.layout();
        assertEquals(3, l.down);
        assertEquals(834, l.plotWidth);
        assertEquals(4, l.plotHeight);
        assertEquals(1.0 / 9, l.pixelValue(0, l.plotHeight - 1), EXACT, "3 × 3 block of a checkerboard: 5 − 4 over 9");
        assertEquals(-1.0 / 3, l.pixelValue(833, l.plotHeight - 1), EXACT,
                "the last block is 1 cell wide (i = 2499) and 3 tall: (−1 + 1 − 1)/3");
        HeatmapLayout peak = Heatmap.builder(v, nx, ny).cellSize(10e-9)
                .downsampling(Heatmap.Downsampling.LARGEST_MAGNITUDE).build().layout();
        assertEquals(1.0, Math.abs(peak.pixelValue(5, 1)));
        assertEquals(l.width, mean.render().getWidth());
    }

    @Test
    void textNeverOverlapsWhateverTheShape() {
        int[][] shapes = {{64, 40}, {2000, 20}, {4, 900}, {1, 1}, {300, 3}, {3, 3}, {1200, 1100}};
        for (int[] s : shapes) {
            double[] v = new double[s[0] * s[1]];
            for (int k = 0; k < v.length; k++) {
                v[k] = k % 7 == 3 ? Double.NaN : Math.sin(k) * 1e4;
            }
            HeatmapLayout l = Heatmap.builder(v, s[0], s[1]).cellSize(7e-9).origin(-1e-6, 3e-6)
                    .title("a rather long title line that is wider than a small plot")
                    .colourBarLabel("a colour bar label that is longer than the bar itself")
                    .colourMap(ColourMap.SHOAL).build().layout();
            String where = s[0] + " × " + s[1] + " cells";
            List<HeatmapLayout.Box> boxes = new java.util.ArrayList<>(l.texts.stream().map(HeatmapLayout.Text::box).toList());
            for (HeatmapLayout.Box b : boxes) {
                assertTrue(b.x() >= 0 && b.y() >= 0 && b.right() <= l.width && b.bottom() <= l.height,
                        where + ": text box " + b + " inside the " + l.width + " × " + l.height + " image");
                assertFalse(b.intersects(l.plot), where + ": text " + b + " over the plot " + l.plot);
                assertFalse(b.intersects(l.bar), where + ": text " + b + " over the bar " + l.bar);
            }
            for (int p = 0; p < boxes.size(); p++) {
                for (int q = p + 1; q < boxes.size(); q++) {
                    assertFalse(boxes.get(p).intersects(boxes.get(q)), where + ": \"" + l.texts.get(p).text()
                            + "\" and \"" + l.texts.get(q).text() + "\" overlap");
                }
            }
            assertFalse(l.plot.intersects(l.bar), where + ": bar over the plot");
            assertTrue(l.plot.w() <= Heatmap.MAX_PLOT_SIDE && l.plot.h() <= Heatmap.MAX_PLOT_SIDE, where);
        }
    }

    @Test
    void writingReplacesAtomicallyAndCleansUpAfterAFailure() throws Exception {
        Heatmap h = steps(8, 8, 0, 1).build();
        Path f = tmp.resolve("sub/map.png");
        h.writePng(f);
        long first = Files.size(f);
        steps(8, 8, 0, 1).title("second").build().writePng(f);
        assertTrue(Files.size(f) != first, "the second write replaced the first");
        assertEquals(List.of("map.png"), names(tmp.resolve("sub")));
        // a folder with content where the file should go: the rename fails, nothing is left behind
        Path blocked = tmp.resolve("blocked.png");
        Files.createDirectories(blocked.resolve("inside"));
        assertThrows(IOException.class, () -> h.writePng(blocked));
        assertEquals(List.of("blocked.png", "sub"), names(tmp));
    }

    @Test
    void settingsAreChecked() {
        assertThrows(IllegalArgumentException.class, () -> Heatmap.builder(new double[5], 2, 3));
        assertThrows(IllegalArgumentException.class, () -> Heatmap.builder(new double[0], 0, 0));
        assertThrows(IllegalStateException.class, () -> Heatmap.builder(new double[6], 2, 3).build());
        assertThrows(IllegalArgumentException.class, () -> Heatmap.builder(new double[6], 2, 3).cellSize(-1));
        assertThrows(IllegalArgumentException.class, () -> Heatmap.builder(new double[6], 2, 3).range(2, 2));
        assertThrows(IllegalArgumentException.class,
                () -> Heatmap.builder(new double[6], 2, 3).grid(new GridSpec(0, 0, 1e-6, 3, 3)));
    }

    @Test
    void permittivityPreviewOfADisk() {
        GridSpec g = GridSpec.covering(-1e-6, -1e-6, 1e-6, 1e-6, 20e-9);
        Scene scene = Scene.builder(Material.VACUUM).add(Ellipse.disk(0, 0, 0.5e-6), Material.ofIndex("glass", 1.5)).build();
        MaterialGrid mg = Rasterizer.rasterize(scene, g, Smoothing.ANISOTROPIC);
        double[] eps = PermittivityMap.values(mg, FieldSite.EZ);
        int c = (g.ny() / 2) * g.nx() + g.nx() / 2;
        assertEquals(2.25, eps[c], 1e-12, "centre of the disk");
        assertEquals(1.0, eps[0], 0.0, "corner");
        Heatmap ex = PermittivityMap.builder(mg, FieldSite.EX).title("disk").build();
        assertEquals(g.x0() + 10e-9, ex.x0(), 1e-18, "Ex sites are half a cell along x");
        assertEquals(g.y0(), ex.y0(), 0.0);
        assertEquals("relative permittivity (Ex site)", ex.colourBarLabel());
        HeatmapLayout l = ex.layout();
        assertEquals(1.0, l.low);
        assertEquals(2.25, l.high, 1e-12);
        BufferedImage img = ex.render();
        assertEquals(ColourMap.LUMEN.rgb(1), rgb(img, l.plot.x() + l.plot.w() / 2, l.plot.y() + l.plot.h() / 2));
    }
}
