package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.junit.jupiter.api.Test;

class HeatmapOutlineTest {

    /**
     * Oklab lightness between an outline and the colour under it, enough to read the semi-transparent line
     * at a glance: ten times the just-noticeable difference of about 0.02 (common practice). The smallest
     * measured over every colour of both maps and their missing colours is 0.245.
     */
    private static final double MIN_CONTRAST = 0.2;

    /** Two materials, id 0 for i &lt; split and id 1 from there on. */
    private static int[] split(int nx, int ny, int column) {
        int[] ids = new int[nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = column; i < nx; i++) {
                ids[j * nx + i] = 1;
            }
        }
        return ids;
    }

    private static int rgb(BufferedImage img, int x, int y) {
        return img.getRGB(x, y) & 0xffffff;
    }

    /**
     * Every plot pixel is {@code field}, except in plot column {@code lineColumn}, which is a dashed line: the
     * outline colour over {@code field} where the dash pattern along y is on, {@code field} in its gaps.
     */
    private static void assertVerticalLine(Heatmap h, int lineColumn, int field, String where) {
        HeatmapLayout l = h.layout();
        BufferedImage img = h.render();
        int line = Heatmap.outlineColour(field);
        assertTrue(line != field, where + ": the outline differs from the field under it");
        for (int py = 0; py < l.plotHeight; py++) {
            for (int px = 0; px < l.plotWidth; px++) {
                int want = px == lineColumn && Heatmap.onDash(py) ? line : field;
                int got = rgb(img, l.plot.x() + px, l.plot.y() + py);
                if (got != want) {
                    throw new AssertionError(String.format("%s: plot pixel (%d, %d) is %06x, expected %06x (%s)",
                            where, px, py, got, want, px == lineColumn ? "outline" : "field"));
                }
            }
        }
    }

    @Test
    void aBoundaryAtColumn37IsOutlinedThereAndNowhereElse() {
        int nx = 64;
        int ny = 40;
        int[] ids = split(nx, ny, 37);
        double[] zero = new double[nx * ny];
        Heatmap light = Heatmap.builder(zero, nx, ny).cellSize(10e-9).colourMap(ColourMap.SHOAL).outlines(ids).build();
        assertEquals(10, light.layout().up, "64 cells at 10 px each");
        // zero on the diverging map is its pale middle: a dark line, on the first pixel column of cell 37
        assertVerticalLine(light, 370, ColourMap.SHOAL.rgb(0.5), "64 × 40, SHOAL, boundary at i = 37");
        // the dark bottom of the sequential map: a light line
        Heatmap dark = Heatmap.builder(zero, nx, ny).cellSize(10e-9).range(0, 1).outlines(ids).build();
        assertVerticalLine(dark, 370, ColourMap.LUMEN.rgb(0), "64 × 40, LUMEN, boundary at i = 37");
        assertNull(Heatmap.builder(zero, nx, ny).cellSize(10e-9).build().layout().outlineMask(), "no ids, no outlines");
    }

    @Test
    void onAReducedGridTheBoundaryIsOnePixelInTheBlockThatHoldsIt() {
        int nx = 2500;
        int ny = 12;
        float[] v = new float[nx * ny];
        // cells 1110, 1111, 1112 make plot column 370; the boundary lies between 1110 and 1111
        Heatmap h = Heatmap.builder(v, nx, ny).cellSize(10e-9).colourMap(ColourMap.SHOAL).outlines(split(nx, ny, 1111)).build();
        assertEquals(3, h.layout().down);
        assertVerticalLine(h, 370, ColourMap.SHOAL.rgb(0.5), "2500 × 12 reduced by 3, boundary at i = 1111");
        // on a block's own left side: cells 1110 | 1109 differ, block 370 starts at 1110
        Heatmap edge = Heatmap.builder(v, nx, ny).cellSize(10e-9).colourMap(ColourMap.SHOAL).outlines(split(nx, ny, 1110)).build();
        assertVerticalLine(edge, 370, ColourMap.SHOAL.rgb(0.5), "2500 × 12 reduced by 3, boundary at i = 1110");
    }

    /** Per pixel, from the definition in Heatmap's class comment: the reference for the per-cell loop. */
    private static boolean[] naiveMask(HeatmapLayout l, int[] ids, int nx, int ny) {
        boolean[] m = new boolean[l.plotWidth * l.plotHeight];
        for (int py = 0; py < l.plotHeight; py++) {
            int jb = l.plotHeight - 1 - py;
            for (int px = 0; px < l.plotWidth; px++) {
                boolean on = false;
                if (l.down == 1) {
                    int i = px / l.up;
                    int j = jb / l.up;
                    int id = ids[j * nx + i];
                    on = (px % l.up == 0 && i > 0 && ids[j * nx + i - 1] != id)
                            || (jb % l.up == 0 && j > 0 && ids[(j - 1) * nx + i] != id);
                } else {
                    for (int j = jb * l.down; j < Math.min(ny, (jb + 1) * l.down); j++) {
                        for (int i = px * l.down; i < Math.min(nx, (px + 1) * l.down); i++) {
                            int id = ids[j * nx + i];
                            on |= (i > 0 && ids[j * nx + i - 1] != id) || (j > 0 && ids[(j - 1) * nx + i] != id);
                        }
                    }
                }
                m[py * l.plotWidth + px] = on;
            }
        }
        return m;
    }

    @Test
    void outlinesMatchAPerPixelReferenceOnAwkwardSizes() {
        int[][] shapes = {{40, 30}, {7, 5}, {121, 37}, {1234, 40}, {2100, 1003}, {3, 1}};
        for (int[] s : shapes) {
            int nx = s[0];
            int ny = s[1];
            int[] ids = new int[nx * ny];
            for (int j = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++) {
                    double x = (i - 0.4 * nx) / nx;
                    double y = (j - 0.5 * ny) / Math.max(ny, 1);
                    int id = x * x + y * y < 0.09 ? 2 : 0; // a disk
                    if (i >= nx * 3 / 4 && j <= ny / 3) {
                        id = 1; // a box in the lower right corner
                    }
                    ids[j * nx + i] = id;
                }
            }
            HeatmapLayout l = Heatmap.builder(new double[nx * ny], nx, ny).cellSize(1e-6).outlines(ids).build().layout();
            String where = nx + " × " + ny + " cells, " + (l.down > 1 ? "reduced by " + l.down : l.up + " px per cell");
            boolean[] got = l.outlineMask();
            assertArrayEquals(naiveMask(l, ids, nx, ny), got, where);
            int count = 0;
            for (boolean b : got) {
                count += b ? 1 : 0;
            }
            assertTrue(nx * ny < 16 || count > 0, where + ": some outline drawn");
        }
    }

    @Test
    void idsComeFromTheMaterialGridAtTheChosenSite() {
        // glass for x ≥ 36.5 cells: Ez sites (x = i) from i = 37, Ex sites (x = i + ½) from i = 36
        MaterialGrid mg = MaterialGrid.builder(64, 40, 10e-9, Material.VACUUM)
                .paint(CellRegion.rightOf(36.5), Material.ofIndex("glass", 1.5)).build();
        double[] v = new double[64 * 40];
        Heatmap ez = Heatmap.builder(v, 64, 40).cellSize(10e-9).colourMap(ColourMap.SHOAL).outlines(mg, FieldSite.EZ).build();
        assertVerticalLine(ez, 370, ColourMap.SHOAL.rgb(0.5), "Ez site");
        Heatmap ex = Heatmap.builder(v, 64, 40).cellSize(10e-9).colourMap(ColourMap.SHOAL).outlines(mg, FieldSite.EX).build();
        assertVerticalLine(ex, 360, ColourMap.SHOAL.rgb(0.5), "Ex site");
        assertThrows(IllegalArgumentException.class,
                () -> Heatmap.builder(new double[63 * 40], 63, 40).cellSize(1).outlines(mg, FieldSite.EZ));
        assertThrows(IllegalArgumentException.class, () -> Heatmap.builder(v, 64, 40).cellSize(1).outlines(new int[5]));
    }

    @Test
    void theOutlineReadsOnEveryColourOfBothMaps() {
        for (ColourMap m : new ColourMap[] {ColourMap.LUMEN, ColourMap.SHOAL}) {
            for (int k = 0; k <= 40; k++) {
                double t = k / 40.0;
                assertContrast(m.rgb(t), m + " at t = " + t);
            }
            assertContrast(m.missingColour(), m + ", missing colour");
        }
    }

    private static void assertContrast(int under, String where) {
        double l = Oklab.fromRgb(under)[0];
        double line = Oklab.fromRgb(Heatmap.outlineColour(under))[0];
        assertTrue(Math.abs(l - line) >= MIN_CONTRAST, String.format(
                "%s: outline L %.3f over L %.3f, need a difference of at least %.2f", where, line, l, MIN_CONTRAST));
    }
}
