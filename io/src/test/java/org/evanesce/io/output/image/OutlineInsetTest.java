package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import org.junit.jupiter.api.Test;

/** The scene drawn beside a far-field plot: outlines where the material changes, the contour dashed, the plot kept. */
class OutlineInsetTest {

    /** A 100 × 50 raster: material 0 round a disk of material 1 of radius 10 cells at (30, 25). */
    private static int[] disk() {
        int[] ids = new int[100 * 50];
        for (int j = 0; j < 50; j++) {
            for (int i = 0; i < 100; i++) {
                ids[j * 100 + i] = Math.hypot(i + 0.5 - 30, j + 0.5 - 25) < 10 ? 1 : 0;
            }
        }
        return ids;
    }

    @Test
    void theDrawingOutlinesTheDiskTintsItAndDashesTheContour() {
        OutlineInset inset = new OutlineInset(disk(), 100, 50, new double[] {10, 5, 90, 45}, "scene");
        BufferedImage img = inset.draw();
        // the larger side is SIZE pixels, the other in proportion
        assertEquals(OutlineInset.SIZE, img.getWidth());
        assertEquals(OutlineInset.SIZE / 2, img.getHeight());
        double scale = OutlineInset.SIZE / 100.0;
        int cx = (int) (30 * scale);
        int cy = img.getHeight() - 1 - (int) (25 * scale);
        assertEquals(OutlineInset.TINT, img.getRGB(cx, cy) & 0xFFFFFF, "inside the disk: tinted");
        assertEquals(0xFFFFFF, img.getRGB((int) (70 * scale), cy) & 0xFFFFFF, "the surrounding material: white");
        int ink = 0;
        for (int x = cx; x < cx + (int) (12 * scale); x++) {
            ink += (img.getRGB(x, cy) & 0xFFFFFF) == OutlineInset.INK ? 1 : 0;
        }
        assertTrue(ink >= 1 && ink <= 2, "one outline crossing along a radius of the disk: " + ink + " ink pixels");
        // the contour's top side at y = 45 cells: dashes of the mark's colour along it
        int top = (int) Math.round(img.getHeight() - 1 - 45 * scale);
        int marked = 0;
        for (int x = (int) (10 * scale); x <= (int) (90 * scale); x++) {
            marked += (img.getRGB(x, top) & 0xFFFFFF) == OutlineInset.MARK ? 1 : 0;
        }
        double length = 80 * scale;
        assertTrue(marked > 0.4 * length && marked < 0.6 * length, "half of the contour's side is dashed: " + marked);
    }

    @Test
    void thePlotIsKeptAndTheDrawingPlacedToItsRight() {
        BufferedImage plot = new BufferedImage(300, 200, BufferedImage.TYPE_INT_RGB);
        for (int y = 0; y < 200; y++) {
            for (int x = 0; x < 300; x++) {
                plot.setRGB(x, y, (x * 7 + y * 13) & 0xFFFFFF);
            }
        }
        BufferedImage all = new OutlineInset(disk(), 100, 50, new double[] {10, 5, 90, 45}, "scene").beside(plot);
        assertTrue(all.getWidth() >= 300 + OutlineInset.SIZE + 2 * OutlineInset.GAP, "room for the drawing");
        assertEquals(200, all.getHeight(), "as tall as the plot");
        for (int y = 0; y < 200; y += 17) {
            for (int x = 0; x < 300; x += 13) {
                assertEquals(plot.getRGB(x, y) & 0xFFFFFF, all.getRGB(x, y) & 0xFFFFFF, "plot pixel (" + x + ", " + y + ")");
            }
        }
    }

    @Test
    void aLookUpOfTheCellsDrawsWhatTheArrayDrawsAskingOnlyForTheDrawnCells() {
        // a rectangle of 1000 x 500 cells (a large grid round a contour): the drawing needs at most SIZE^2 of them
        int nx = 1000;
        int ny = 500;
        int[] ids = new int[nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                ids[j * nx + i] = Math.hypot(i + 0.5 - 300, j + 0.5 - 250) < 100 ? 1 : 0;
            }
        }
        double[] mark = {100, 50, 900, 450};
        int[] asked = new int[1];
        OutlineInset looked = new OutlineInset((i, j) -> {
            asked[0]++;
            return ids[j * nx + i];
        }, nx, ny, mark, "scene");
        assertTrue(asked[0] <= OutlineInset.SIZE * OutlineInset.SIZE, "cells asked for: " + asked[0]);
        BufferedImage a = new OutlineInset(ids, nx, ny, mark, "scene").draw();
        BufferedImage b = looked.draw();
        assertEquals(a.getWidth(), b.getWidth());
        assertEquals(a.getHeight(), b.getHeight());
        for (int y = 0; y < a.getHeight(); y++) {
            for (int x = 0; x < a.getWidth(); x++) {
                assertEquals(a.getRGB(x, y), b.getRGB(x, y), "pixel (" + x + ", " + y + ")");
            }
        }
    }

    @Test
    void aRasterThatDoesNotMatchItsSizeIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> new OutlineInset(new int[10], 3, 3, new double[4], "x"));
    }
}
