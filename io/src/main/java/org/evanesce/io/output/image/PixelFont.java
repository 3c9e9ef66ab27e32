package org.evanesce.io.output.image;

import java.util.HashMap;
import java.util.Map;

/**
 * A small monospaced bitmap font of our own, drawn pixel by pixel so that text never depends on
 * the fonts installed on the machine (headless build and compute machines often have none).
 *
 * <p>Each glyph is {@value #GLYPH_WIDTH} × {@value #GLYPH_HEIGHT} pixels: capitals and digits fill
 * rows 0–6 (row 6 is the baseline), lower case has its x-height in rows 2–6, and descenders use
 * rows 7–8. Characters advance by {@value #ADVANCE} pixels. Every pixel is drawn as a
 * {@code scale} × {@code scale} square. Characters without a glyph are drawn as a hollow box.
 *
 * <p>Covered: digits, a–z, A–Z, space and {@code . , - + ( ) [ ] / : ; = _ % ' " ! ? | * # < >},
 * the middle dot ·, the degree sign °, the multiplication sign ×, µ, and the Greek ε, λ, Δ.
 */
public final class PixelFont {

    /** Glyph width in font pixels. */
    public static final int GLYPH_WIDTH = 5;
    /** Glyph height in font pixels, descenders included. */
    public static final int GLYPH_HEIGHT = 9;
    /** Rows from the top of a glyph to the baseline row, inclusive: capitals and digits. */
    public static final int CAP_HEIGHT = 7;
    /** Horizontal distance between the starts of neighbouring characters, in font pixels. */
    public static final int ADVANCE = 6;

    /** Rows of each glyph as bit masks, bit 4 = leftmost column. */
    private static final Map<Character, int[]> GLYPHS = new HashMap<>();
    private static final int[] MISSING = rows(
            "#####", "#...#", "#...#", "#...#", "#...#", "#...#", "#####");

    static {
        glyph(' ');
        glyph('0', ".###.", "#...#", "#..##", "#.#.#", "##..#", "#...#", ".###.");
        glyph('1', "..#..", ".##..", "..#..", "..#..", "..#..", "..#..", ".###.");
        glyph('2', ".###.", "#...#", "....#", "...#.", "..#..", ".#...", "#####");
        glyph('3', "#####", "...#.", "..#..", "...#.", "....#", "#...#", ".###.");
        glyph('4', "...#.", "..##.", ".#.#.", "#..#.", "#####", "...#.", "...#.");
        glyph('5', "#####", "#....", "####.", "....#", "....#", "#...#", ".###.");
        glyph('6', "..##.", ".#...", "#....", "####.", "#...#", "#...#", ".###.");
        glyph('7', "#####", "....#", "...#.", "..#..", ".#...", ".#...", ".#...");
        glyph('8', ".###.", "#...#", "#...#", ".###.", "#...#", "#...#", ".###.");
        glyph('9', ".###.", "#...#", "#...#", ".####", "....#", "...#.", ".##..");

        glyph('A', ".###.", "#...#", "#...#", "#####", "#...#", "#...#", "#...#");
        glyph('B', "####.", "#...#", "#...#", "####.", "#...#", "#...#", "####.");
        glyph('C', ".###.", "#...#", "#....", "#....", "#....", "#...#", ".###.");
        glyph('D', "###..", "#..#.", "#...#", "#...#", "#...#", "#..#.", "###..");
        glyph('E', "#####", "#....", "#....", "####.", "#....", "#....", "#####");
        glyph('F', "#####", "#....", "#....", "####.", "#....", "#....", "#....");
        glyph('G', ".###.", "#...#", "#....", "#.###", "#...#", "#...#", ".####");
        glyph('H', "#...#", "#...#", "#...#", "#####", "#...#", "#...#", "#...#");
        glyph('I', ".###.", "..#..", "..#..", "..#..", "..#..", "..#..", ".###.");
        glyph('J', "..###", "...#.", "...#.", "...#.", "...#.", "#..#.", ".##..");
        glyph('K', "#...#", "#..#.", "#.#..", "##...", "#.#..", "#..#.", "#...#");
        glyph('L', "#....", "#....", "#....", "#....", "#....", "#....", "#####");
        glyph('M', "#...#", "##.##", "#.#.#", "#.#.#", "#...#", "#...#", "#...#");
        glyph('N', "#...#", "#...#", "##..#", "#.#.#", "#..##", "#...#", "#...#");
        glyph('O', ".###.", "#...#", "#...#", "#...#", "#...#", "#...#", ".###.");
        glyph('P', "####.", "#...#", "#...#", "####.", "#....", "#....", "#....");
        glyph('Q', ".###.", "#...#", "#...#", "#...#", "#.#.#", "#..#.", ".##.#");
        glyph('R', "####.", "#...#", "#...#", "####.", "#.#..", "#..#.", "#...#");
        glyph('S', ".####", "#....", "#....", ".###.", "....#", "....#", "####.");
        glyph('T', "#####", "..#..", "..#..", "..#..", "..#..", "..#..", "..#..");
        glyph('U', "#...#", "#...#", "#...#", "#...#", "#...#", "#...#", ".###.");
        glyph('V', "#...#", "#...#", "#...#", "#...#", "#...#", ".#.#.", "..#..");
        glyph('W', "#...#", "#...#", "#...#", "#.#.#", "#.#.#", "#.#.#", ".#.#.");
        glyph('X', "#...#", "#...#", ".#.#.", "..#..", ".#.#.", "#...#", "#...#");
        glyph('Y', "#...#", "#...#", ".#.#.", "..#..", "..#..", "..#..", "..#..");
        glyph('Z', "#####", "....#", "...#.", "..#..", ".#...", "#....", "#####");

        glyph('a', ".....", ".....", ".###.", "....#", ".####", "#...#", ".####");
        glyph('b', "#....", "#....", "#.##.", "##..#", "#...#", "#...#", "####.");
        glyph('c', ".....", ".....", ".###.", "#....", "#....", "#...#", ".###.");
        glyph('d', "....#", "....#", ".##.#", "#..##", "#...#", "#...#", ".####");
        glyph('e', ".....", ".....", ".###.", "#...#", "#####", "#....", ".###.");
        glyph('f', "..##.", ".#..#", ".#...", "###..", ".#...", ".#...", ".#...");
        glyph('g', ".....", ".....", ".####", "#...#", "#...#", "#...#", ".####", "....#", ".###.");
        glyph('h', "#....", "#....", "#.##.", "##..#", "#...#", "#...#", "#...#");
        glyph('i', "..#..", ".....", ".##..", "..#..", "..#..", "..#..", ".###.");
        glyph('j', "...#.", ".....", "..##.", "...#.", "...#.", "...#.", "...#.", "#..#.", ".##..");
        glyph('k', "#....", "#....", "#..#.", "#.#..", "##...", "#.#..", "#..#.");
        glyph('l', ".##..", "..#..", "..#..", "..#..", "..#..", "..#..", ".###.");
        glyph('m', ".....", ".....", "##.#.", "#.#.#", "#.#.#", "#.#.#", "#.#.#");
        glyph('n', ".....", ".....", "#.##.", "##..#", "#...#", "#...#", "#...#");
        glyph('o', ".....", ".....", ".###.", "#...#", "#...#", "#...#", ".###.");
        glyph('p', ".....", ".....", "####.", "#...#", "#...#", "#...#", "####.", "#....", "#....");
        glyph('q', ".....", ".....", ".####", "#...#", "#...#", "#...#", ".####", "....#", "....#");
        glyph('r', ".....", ".....", "#.##.", "##..#", "#....", "#....", "#....");
        glyph('s', ".....", ".....", ".####", "#....", ".###.", "....#", "####.");
        glyph('t', ".#...", ".#...", "###..", ".#...", ".#...", ".#..#", "..##.");
        glyph('u', ".....", ".....", "#...#", "#...#", "#...#", "#..##", ".##.#");
        glyph('v', ".....", ".....", "#...#", "#...#", "#...#", ".#.#.", "..#..");
        glyph('w', ".....", ".....", "#...#", "#...#", "#.#.#", "#.#.#", ".#.#.");
        glyph('x', ".....", ".....", "#...#", ".#.#.", "..#..", ".#.#.", "#...#");
        glyph('y', ".....", ".....", "#...#", "#...#", "#...#", "#...#", ".####", "....#", ".###.");
        glyph('z', ".....", ".....", "#####", "...#.", "..#..", ".#...", "#####");

        glyph('.', ".....", ".....", ".....", ".....", ".....", ".##..", ".##..");
        glyph(',', ".....", ".....", ".....", ".....", ".....", ".##..", ".##..", "..#..", ".#...");
        glyph('-', ".....", ".....", ".....", "#####", ".....", ".....", ".....");
        glyph('+', ".....", "..#..", "..#..", "#####", "..#..", "..#..", ".....");
        glyph('(', "...#.", "..#..", ".#...", ".#...", ".#...", "..#..", "...#.");
        glyph(')', ".#...", "..#..", "...#.", "...#.", "...#.", "..#..", ".#...");
        glyph('[', ".###.", ".#...", ".#...", ".#...", ".#...", ".#...", ".###.");
        glyph(']', ".###.", "...#.", "...#.", "...#.", "...#.", "...#.", ".###.");
        glyph('/', "....#", "....#", "...#.", "..#..", ".#...", "#....", "#....");
        glyph(':', ".....", ".##..", ".##..", ".....", ".....", ".##..", ".##..");
        glyph(';', ".....", ".##..", ".##..", ".....", ".....", ".##..", ".##..", "..#..", ".#...");
        glyph('=', ".....", ".....", "#####", ".....", "#####", ".....", ".....");
        glyph('_', ".....", ".....", ".....", ".....", ".....", ".....", ".....", ".....", "#####");
        glyph('%', "##...", "##..#", "...#.", "..#..", ".#...", "#..##", "...##");
        glyph('\'', "..#..", "..#..", ".#...");
        glyph('"', ".#.#.", ".#.#.", "#.#..");
        glyph('!', "..#..", "..#..", "..#..", "..#..", "..#..", ".....", "..#..");
        glyph('?', ".###.", "#...#", "....#", "...#.", "..#..", ".....", "..#..");
        glyph('|', "..#..", "..#..", "..#..", "..#..", "..#..", "..#..", "..#..", "..#..", "..#..");
        glyph('*', ".....", "..#..", "#.#.#", ".###.", "#.#.#", "..#..", ".....");
        glyph('#', ".#.#.", ".#.#.", "#####", ".#.#.", "#####", ".#.#.", ".#.#.");
        glyph('<', "...#.", "..#..", ".#...", "#....", ".#...", "..#..", "...#.");
        glyph('>', ".#...", "..#..", "...#.", "....#", "...#.", "..#..", ".#...");
        glyph('\u00b7', ".....", ".....", ".....", ".##..", ".##..", ".....", ".....");
        glyph('\u00b0', ".##..", "#..#.", "#..#.", ".##..");
        glyph('\u00d7', ".....", "#...#", ".#.#.", "..#..", ".#.#.", "#...#", ".....");
        glyph('\u00b5', ".....", ".....", "#...#", "#...#", "#...#", "#..##", "###.#", "#....", "#....");
        glyph('\u03bc', ".....", ".....", "#...#", "#...#", "#...#", "#..##", "###.#", "#....", "#....");
        glyph('\u03b5', ".....", ".....", ".###.", "#....", ".##..", "#....", ".###.");
        glyph('\u03bb', "#....", ".#...", ".#...", "..#..", ".#.#.", "#...#", "#...#");
        glyph('\u0394', "..#..", "..#..", ".#.#.", ".#.#.", "#...#", "#...#", "#####");
    }

    private PixelFont() {
    }

    private static void glyph(char c, String... rows) {
        GLYPHS.put(c, rows(rows));
    }

    private static int[] rows(String... rows) {
        int[] bits = new int[GLYPH_HEIGHT];
        for (int r = 0; r < rows.length; r++) {
            if (rows[r].length() != GLYPH_WIDTH) {
                throw new IllegalStateException("glyph row \"" + rows[r] + "\" is not " + GLYPH_WIDTH + " wide");
            }
            for (int col = 0; col < GLYPH_WIDTH; col++) {
                if (rows[r].charAt(col) == '#') {
                    bits[r] |= 1 << (GLYPH_WIDTH - 1 - col);
                }
            }
        }
        return bits;
    }

    /** Whether {@code c} has a glyph of its own (others are drawn as a hollow box). */
    public static boolean covers(char c) {
        return GLYPHS.containsKey(c);
    }

    /** The most characters a title line keeps: a picture's width must not follow a case's title (any length). */
    public static final int MAX_TITLE_CHARACTERS = 120;

    /** {@code text}'s first line, stripped, cut to {@link #MAX_TITLE_CHARACTERS} with "..." at the cut; "" for null. */
    public static String titleLine(String text) {
        if (text == null) {
            return "";
        }
        String line = text.strip().lines().findFirst().orElse("").strip();
        return line.length() <= MAX_TITLE_CHARACTERS ? line : line.substring(0, MAX_TITLE_CHARACTERS - 3) + "...";
    }

    /** Width in image pixels of {@code text} at the given scale: no trailing gap; 0 when empty. */
    public static int width(String text, int scale) {
        int n = text.length();
        return n == 0 ? 0 : ((n - 1) * ADVANCE + GLYPH_WIDTH) * scale;
    }

    /** Height in image pixels of one line at the given scale, descenders included. */
    public static int height(int scale) {
        return GLYPH_HEIGHT * scale;
    }

    /**
     * The pixels of {@code text} as a mask, {@code mask[y*width + x]}, with {@code width =}
     * {@link #width} and {@code height =} {@link #height}; true where there is ink.
     */
    public static boolean[] mask(String text, int scale) {
        int w = width(text, scale);
        int h = height(scale);
        boolean[] m = new boolean[w * h];
        for (int k = 0; k < text.length(); k++) {
            int[] g = GLYPHS.getOrDefault(text.charAt(k), MISSING);
            int x0 = k * ADVANCE * scale;
            for (int r = 0; r < GLYPH_HEIGHT; r++) {
                for (int col = 0; col < GLYPH_WIDTH; col++) {
                    if ((g[r] & (1 << (GLYPH_WIDTH - 1 - col))) == 0) {
                        continue;
                    }
                    for (int dy = 0; dy < scale; dy++) {
                        int row = (r * scale + dy) * w + x0 + col * scale;
                        for (int dx = 0; dx < scale; dx++) {
                            m[row + dx] = true;
                        }
                    }
                }
            }
        }
        return m;
    }
}
