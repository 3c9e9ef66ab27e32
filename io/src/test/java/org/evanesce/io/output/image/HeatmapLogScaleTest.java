package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.util.Arrays;
import org.junit.jupiter.api.Test;

class HeatmapLogScaleTest {

    /** Exponents come from log10 of doubles: compare to rounding. */
    private static final double EXACT = 1e-12;
    /**
     * Oklab distance allowed between a bar pixel and the map at a tick's exact fraction: the tick
     * row is rounded to a whole pixel, up to half a row of a bar 280 px tall (about 0.002 in
     * Oklab on this map); a row off by two or more exceeds it.
     */
    private static final double HALF_ROW = 0.004;

    private static final double MAX = 3.7;
    private static final int DECADES = 5;
    private static final int BLOCK = 5;

    /**
     * 9 column blocks of 5 × 20 cells: MAX·10^-k for k = 0..5 (the largest with a minus sign),
     * 1e-7·MAX (below the floor), 0 and NaN.
     */
    private static double[] columns() {
        double[] block = {-MAX, MAX * 1e-1, MAX * 1e-2, MAX * 1e-3, MAX * 1e-4, MAX * 1e-5, MAX * 1e-7, 0, Double.NaN};
        int nx = block.length * BLOCK;
        double[] v = new double[nx * 20];
        for (int j = 0; j < 20; j++) {
            for (int i = 0; i < nx; i++) {
                v[j * nx + i] = block[i / BLOCK];
            }
        }
        return v;
    }

    private static Heatmap logMap() {
        return Heatmap.builder(columns(), 9 * BLOCK, 20).cellSize(20e-9).logScale(DECADES)
                .colourBarLabel("|Ez| (V/m), log scale").build();
    }

    private static int rgb(BufferedImage img, int x, int y) {
        return img.getRGB(x, y) & 0xffffff;
    }

    @Test
    void aValueTenToTheMinusKBelowTheMaximumSitsAtOneMinusKOverDecades() {
        Heatmap h = logMap();
        HeatmapLayout l = h.layout();
        BufferedImage img = h.render();
        ColourMap m = ColourMap.LUMEN;
        int y = l.plot.y() + l.plot.h() / 2;
        for (int k = 0; k <= DECADES; k++) {
            int x = l.plot.x() + (k * BLOCK + 2) * l.up;
            double t = 1 - k / (double) DECADES; // 0.8, 0.6, ...: never half-way between two table entries
            assertEquals(m.rgb(t), rgb(img, x, y), "10^-" + k + " of the maximum, " + DECADES + " decades: t = " + t);
        }
        assertEquals(m.rgb(0), rgb(img, l.plot.x() + (6 * BLOCK + 2) * l.up, y), "below the floor: the floor colour");
        assertEquals(m.rgb(0), rgb(img, l.plot.x() + (7 * BLOCK + 2) * l.up, y), "zero: the floor colour");
        assertEquals(m.missingColour(), rgb(img, l.plot.x() + (8 * BLOCK + 2) * l.up, y), "NaN: the missing colour");
        assertTrue(l.texts.stream().anyMatch(t -> t.text().equals("NaN: 100 cells")));
        assertEquals(Math.log10(MAX), l.high, EXACT);
        assertEquals(Math.log10(MAX) - DECADES, l.low, EXACT);
    }

    @Test
    void theBarIsTickedAtPowersOfTenWhereTheirColoursAre() {
        Heatmap h = logMap();
        HeatmapLayout l = h.layout();
        BufferedImage img = h.render();
        // from 10^-4.43 to 10^0.57 on a 280 px bar: every whole exponent
        assertArrayEquals(new double[] {-4, -3, -2, -1, 0}, l.barTicks, EXACT);
        String[] labels = {"1e-4", "1e-3", "1e-2", "1e-1", "1e0"};
        for (int q = 0; q < labels.length; q++) {
            String label = labels[q];
            HeatmapLayout.Text text = l.texts.stream().filter(t -> t.text().equals(label)).findFirst()
                    .orElseThrow(() -> new AssertionError("no bar label " + label + " in " + l.texts));
            int row = text.box().y() + HeatmapLayout.CAP / 2;
            double t = (l.barTicks[q] - l.low) / (l.high - l.low);
            double rowT = 1 - (row - l.bar.y()) / (double) (l.bar.h() - 1);
            assertEquals(t, rowT, 0.5 / (l.bar.h() - 1) + EXACT, "tick " + label + " within half a row of its place");
            double[] bar = Oklab.fromRgb(rgb(img, l.bar.x() + l.bar.w() / 2, row));
            double[] want = Oklab.fromRgb(ColourMap.LUMEN.rgb(t));
            assertTrue(Oklab.distance(bar, want) < HALF_ROW, String.format(
                    "tick %s at bar row %d: colour %s, the map at t = %.4f is %s", label, row,
                    Arrays.toString(bar), t, Arrays.toString(want)));
            final int r = row;
            assertTrue(l.ticks.stream().anyMatch(b -> b.y() == r && b.x() == l.bar.right() + 1), "tick mark beside " + label);
        }
    }

    @Test
    void powersOfTenSpaceAndLabelTheirTicks() {
        TickAxis many = HeatmapLayout.powersOfTen(-12.3, 0.2, 20, 20);
        assertArrayEquals(new double[] {-12, -10, -8, -6, -4, -2, 0}, many.values(), EXACT,
                "20 px per decade is too tight for every decade: every second");
        assertEquals("1e-12", many.labels()[0]);
        TickAxis plain = HeatmapLayout.powersOfTen(-2, 3, 100, 10);
        assertArrayEquals(new String[] {"0.01", "0.1", "1", "10", "100", "1000"}, plain.labels());
        TickAxis none = HeatmapLayout.powersOfTen(-0.9, -0.4, 400, 5);
        assertArrayEquals(new double[] {-0.4}, none.values(), EXACT, "no whole exponent inside: one tick at the top");
        assertEquals("0.398107", none.labels()[0]);
        TickAxis sparse = HeatmapLayout.powersOfTen(-4, -1, 200, 1);
        assertEquals(1, sparse.values().length, "at most one tick wanted");
    }

    @Test
    void aReducedGridAveragesMagnitudes() {
        int nx = 2500;
        int ny = 12;
        float[] v = new float[nx * ny];
        for (int k = 0; k < v.length; k++) {
            v[k] = (k % nx + k / nx) % 2 == 0 ? 1f : -1f;
        }
        HeatmapLayout l = Heatmap.builder(v, nx, ny).cellSize(10e-9).logScale(3).build().layout();
        assertEquals(3, l.down);
        assertEquals(1.0, l.pixelValue(0, l.plotHeight - 1), EXACT, "mean |v| of a ±1 checkerboard, not its mean");
        assertEquals(1.0, l.position(1.0), EXACT);
    }

    @Test
    void zeroEverywhereIsTheFloorColourWithAnEmptyBar() {
        Heatmap h = Heatmap.builder(new double[6 * 4], 6, 4).cellSize(1e-6).logScale(3).build();
        HeatmapLayout l = h.layout();
        assertEquals(0, l.barTicks.length);
        BufferedImage img = h.render();
        assertEquals(ColourMap.LUMEN.rgb(0), rgb(img, l.plot.x() + 3, l.plot.y() + 3));
        assertEquals(HeatmapLayout.NO_DATA, rgb(img, l.bar.x() + 3, l.bar.y() + 3));
    }

    @Test
    void settingsAreChecked() {
        double[] v = new double[6];
        assertThrows(IllegalArgumentException.class, () -> Heatmap.builder(v, 2, 3).logScale(0));
        assertThrows(IllegalArgumentException.class, () -> Heatmap.builder(v, 2, 3).logScale(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> Heatmap.builder(v, 2, 3).logScale(Double.POSITIVE_INFINITY));
        assertThrows(IllegalStateException.class,
                () -> Heatmap.builder(v, 2, 3).cellSize(1).logScale(3).colourMap(ColourMap.SHOAL).build());
        assertThrows(IllegalStateException.class, () -> Heatmap.builder(v, 2, 3).cellSize(1).logScale(3).range(0, 1).build());
    }
}
