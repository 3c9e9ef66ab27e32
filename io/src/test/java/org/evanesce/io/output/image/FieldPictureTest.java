package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.io.output.image.FieldPicture.Quantity;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class FieldPictureTest {

    /** Chroma of the diverging map's middle entry: its control point has none, the table entry is ½ step off. */
    private static final double NEUTRAL = 0.01;

    @TempDir
    Path tmp;

    /** 64 × 40 nodes at 10 nm: a decaying standing wave, exactly zero on the lines i = 16, 32, 48. */
    private static final GridSpec GRID = new GridSpec(-0.2e-6, 0, 10e-9, 64, 40);

    private static double[] wave() {
        double[] v = new double[GRID.nx() * GRID.ny()];
        for (int j = 0; j < GRID.ny(); j++) {
            for (int i = 0; i < GRID.nx(); i++) {
                v[j * GRID.nx() + i] = i % 16 == 0 ? 0 : Math.sin(Math.PI * i / 16) * Math.exp(-j / 8.0) * 250;
            }
        }
        return v;
    }

    private static int rgb(BufferedImage img, int x, int y) {
        return img.getRGB(x, y) & 0xffffff;
    }

    @Test
    void aRealFieldIsDivergingWithZeroAtTheMiddleColour() {
        Heatmap h = FieldPicture.of(wave(), GRID, "Ez", "V/m", Quantity.REAL).heatmap();
        assertSame(ColourMap.SHOAL, h.colourMap());
        assertEquals("Ez (V/m)", h.colourBarLabel());
        HeatmapLayout l = h.layout();
        assertEquals(-l.high, l.low, 0.0, "range symmetric about zero");
        BufferedImage img = h.render();
        int middle = ColourMap.SHOAL.rgb(0.5);
        double[] lab = Oklab.fromRgb(middle);
        assertTrue(Math.hypot(lab[1], lab[2]) < NEUTRAL && lab[0] > 0.9, "SHOAL's middle is a pale, nearly neutral parchment");
        for (int i : new int[] {16, 32, 48}) {
            for (int j = 0; j < GRID.ny(); j += 13) {
                int x = l.plot.x() + i * l.up + l.up / 2;
                int y = l.plot.y() + l.plot.h() - 1 - j * l.up - l.up / 2;
                assertEquals(middle, rgb(img, x, y), "Ez = 0 at cell (" + i + ", " + j + ")");
            }
        }
        HeatmapLayout.Text zero = l.texts.stream()
                .filter(t -> t.text().equals("0") && t.box().x() > l.bar.right()).findFirst().orElseThrow();
        int row = zero.box().y() + HeatmapLayout.CAP / 2;
        assertEquals(0.5, 1 - (row - l.bar.y()) / (double) (l.bar.h() - 1), 0.5 / (l.bar.h() - 1),
                "the bar's 0 tick is at its middle");
        assertTrue(Oklab.distance(lab, Oklab.fromRgb(rgb(img, l.bar.x() + 5, row))) < NEUTRAL, "the bar is neutral at 0");
    }

    @Test
    void aMagnitudeIsSequentialAndTheLogScaleSaysSo() {
        double[] mag = wave();
        for (int k = 0; k < mag.length; k++) {
            mag[k] = Math.abs(mag[k]);
        }
        Heatmap lin = FieldPicture.of(mag, GRID, "Ez", "V/m", Quantity.MAGNITUDE).heatmap();
        assertSame(ColourMap.LUMEN, lin.colourMap());
        assertEquals("|Ez| (V/m)", lin.colourBarLabel());
        assertEquals(0.0, lin.layout().low, 0.0, "from the minimum");
        Heatmap log = FieldPicture.of(wave(), GRID, "Ez", "V/m", Quantity.REAL).logScale(6).heatmap();
        assertSame(ColourMap.LUMEN, log.colourMap(), "log scale of a real field: its magnitude, sequential");
        assertEquals("|Ez| (V/m), log scale", log.colourBarLabel());
        assertTrue(log.isLogScale());
        assertEquals(6, log.logDecades());
        assertEquals("Hz", FieldPicture.of(mag, GRID, "Hz", "", Quantity.REAL).colourBarLabel(), "no unit, no brackets");
    }

    @Test
    void thePngReadsBackAtTheLaidOutSizeWithTheOutlineOnTheBoundary() throws IOException {
        // glass from x = 36.5 cells: at the Ex site (x = i + ½) from column 36
        MaterialGrid mg = MaterialGrid.builder(GRID, Material.VACUUM)
                .paint(CellRegion.rightOf(36.5), Material.ofIndex("glass", 1.5)).build();
        FieldPicture p = FieldPicture.of(new float[GRID.nx() * GRID.ny()], GRID, "Ex", "V/m", Quantity.REAL)
                .site(FieldSite.EX).outlines(mg).axisUnit(DisplayUnit.NM).title("Ex at t = 1 fs");
        Heatmap h = p.heatmap();
        assertEquals(GRID.x0() + 5e-9, h.x0(), 1e-18, "Ex sites are half a cell along x");
        HeatmapLayout l = h.layout();
        Path f = p.writePng(tmp.resolve("ex.png"));
        BufferedImage img = ImageIO.read(f.toFile());
        assertNotNull(img, "ImageIO reads the PNG back");
        assertEquals(l.width, img.getWidth());
        assertEquals(l.height, img.getHeight());
        try (Stream<Path> s = Files.list(tmp)) {
            assertEquals(List.of("ex.png"), s.map(q -> q.getFileName().toString()).toList(), "no temporary file left");
        }
        // a vertical outline is dashed along y: a plot row where a dash starts, and the gap after it
        int py = l.plotHeight / 2 / Heatmap.DASH_PERIOD * Heatmap.DASH_PERIOD;
        int y = l.plot.y() + py;
        assertEquals(Heatmap.outlineColour(ColourMap.SHOAL.rgb(0.5)), rgb(img, l.plot.x() + 36 * l.up, y),
                "outline on the first pixel column of cell 36");
        assertEquals(ColourMap.SHOAL.rgb(0.5), rgb(img, l.plot.x() + 36 * l.up, y + Heatmap.DASH_ON),
                "a gap of the dashes, the field shows through");
        assertEquals(ColourMap.SHOAL.rgb(0.5), rgb(img, l.plot.x() + 36 * l.up - 1, y), "no outline left of it");
        assertEquals(ColourMap.SHOAL.rgb(0.5), rgb(img, l.plot.x() + 36 * l.up + 1, y), "no outline right of it");
        assertTrue(l.texts.stream().anyMatch(t -> t.text().equals("x (nm)")));
    }

    @Test
    void settingsAreChecked() {
        assertThrows(IllegalArgumentException.class, () -> FieldPicture.of(new double[10], GRID, "Ez", "V/m", Quantity.REAL));
        assertThrows(IllegalArgumentException.class, () -> FieldPicture.of(wave(), GRID, " ", "V/m", Quantity.REAL));
        assertThrows(IllegalArgumentException.class, () -> FieldPicture.of(wave(), GRID, "Ez", "V/m", null));
        MaterialGrid small = MaterialGrid.builder(10, 10, 10e-9, Material.VACUUM).build();
        assertThrows(IllegalArgumentException.class,
                () -> FieldPicture.of(wave(), GRID, "Ez", "V/m", Quantity.REAL).outlines(small));
    }
}
