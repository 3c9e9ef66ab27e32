package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

class PixelFontTest {

    private static final int BG = 0xffffff;
    private static final int INK = 0x102030;
    private static final String COVERED = "0123456789abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ"
            + " .,-+()[]/:;=_%'\"!?|*#<>\u00b7\u00b0\u00d7\u00b5\u03b5\u03bb\u0394";

    /** Ink bounds {xMin, yMin, xMax, yMax} (inclusive) of a canvas, or null without ink. */
    private static int[] inkBounds(Canvas c) {
        int[] b = {Integer.MAX_VALUE, Integer.MAX_VALUE, -1, -1};
        for (int y = 0; y < c.height; y++) {
            for (int x = 0; x < c.width; x++) {
                if (c.get(x, y) != BG) {
                    b[0] = Math.min(b[0], x);
                    b[1] = Math.min(b[1], y);
                    b[2] = Math.max(b[2], x);
                    b[3] = Math.max(b[3], y);
                }
            }
        }
        return b[2] < 0 ? null : b;
    }

    @Test
    void everyListedCharacterHasItsOwnGlyph() {
        Map<String, Character> seen = new HashMap<>();
        for (char ch : COVERED.toCharArray()) {
            assertTrue(PixelFont.covers(ch), "no glyph for '" + ch + "'");
            if (ch == '\u00b5') {
                continue; // micro sign and Greek mu share a glyph on purpose
            }
            String key = Arrays.toString(PixelFont.mask(String.valueOf(ch), 1));
            Character other = seen.put(key, ch);
            assertTrue(other == null, "'" + ch + "' and '" + other + "' look the same");
        }
        assertFalse(PixelFont.covers('\u00e9'));
    }

    @Test
    void textInkStaysInsideItsBox() {
        String s = "x (um) 0.5 -12 Ez site";
        int scale = 2;
        Canvas c = new Canvas(600, 80, BG);
        c.text(s, 17, 23, scale, INK, Canvas.Direction.ACROSS);
        int[] b = inkBounds(c);
        assertTrue(b != null, "no ink drawn");
        assertTrue(b[0] >= 17 && b[2] < 17 + PixelFont.width(s, scale), "ink x range " + b[0] + ".." + b[2]);
        assertTrue(b[1] >= 23 && b[3] < 23 + PixelFont.height(scale), "ink y range " + b[1] + ".." + b[3]);
        assertEquals(17, b[0], "'x' starts at the left edge of its box");
        assertEquals(17 + PixelFont.width(s, scale) - 1, b[2], "'e' ends at the right edge of its box");
        assertEquals(((s.length() - 1) * PixelFont.ADVANCE + PixelFont.GLYPH_WIDTH) * scale, PixelFont.width(s, scale));
        assertEquals(0, PixelFont.width("", 3));
    }

    @Test
    void capitalsSitOnTheBaselineAndDescendersGoBelow() {
        int scale = 3;
        Canvas caps = new Canvas(100, 40, BG);
        caps.text("HE", 0, 0, scale, INK, Canvas.Direction.ACROSS);
        int[] b = inkBounds(caps);
        assertEquals(0, b[1]);
        assertEquals(PixelFont.CAP_HEIGHT * scale - 1, b[3], "capitals fill rows 0-6");
        Canvas low = new Canvas(100, 40, BG);
        low.text("gy", 0, 0, scale, INK, Canvas.Direction.ACROSS);
        assertEquals(PixelFont.GLYPH_HEIGHT * scale - 1, inkBounds(low)[3], "descenders reach the last row");
    }

    @Test
    void turnedTextReadsUpwards() {
        String s = "y (um)";
        int scale = 2;
        Canvas c = new Canvas(60, 200, BG);
        c.text(s, 10, 20, scale, INK, Canvas.Direction.UP);
        int[] b = inkBounds(c);
        int len = PixelFont.width(s, scale);
        assertTrue(b[0] >= 10 && b[2] < 10 + PixelFont.height(scale), "turned ink x range " + b[0] + ".." + b[2]);
        assertTrue(b[1] >= 20 && b[3] < 20 + len, "turned ink y range " + b[1] + ".." + b[3]);
        // the first character, 'y', is at the bottom: its descender is at the right (the line's lower side)
        boolean inkAtBottomRight = false;
        for (int x = 10 + 7 * scale; x < 10 + 9 * scale; x++) {
            for (int y = 20 + len - PixelFont.GLYPH_WIDTH * scale; y < 20 + len; y++) {
                inkAtBottomRight |= c.get(x, y) != BG;
            }
        }
        assertTrue(inkAtBottomRight, "the descender of the first character is at the bottom right");
    }

    @Test
    void unknownCharactersAreBoxes() {
        assertEquals(Arrays.toString(PixelFont.mask("\u00e9", 1)), Arrays.toString(PixelFont.mask("\u2603", 1)));
        Canvas c = new Canvas(20, 20, BG);
        c.text("\u00e9", 0, 0, 1, INK, Canvas.Direction.ACROSS);
        assertEquals(INK, c.get(0, 0));
        assertEquals(BG, c.get(2, 2));
    }

    @Test
    void drawingOffTheCanvasIsClipped() {
        Canvas c = new Canvas(10, 10, BG);
        c.text("WWWW", -8, -5, 2, INK, Canvas.Direction.ACROSS);
        c.fill(-5, 8, 100, 100, INK);
        assertEquals(INK, c.get(9, 9));
    }
}
