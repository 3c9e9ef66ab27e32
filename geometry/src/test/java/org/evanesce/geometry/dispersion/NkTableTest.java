package org.evanesce.geometry.dispersion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Validation of measured n, k tables: every refusal names the row's source line and the column. */
class NkTableTest {

    static List<NkTable.Row> rows(double[][] t) {
        List<NkTable.Row> out = new ArrayList<>();
        for (int i = 0; i < t.length; i++) {
            out.add(new NkTable.Row(t[i][0] * 1e-9, t[i][1], t[i][2], 10 + i));
        }
        return out;
    }

    static final double[][] GOOD = {{500, 0.9, 1.9}, {600, 0.25, 3.0}, {700, 0.14, 4.0}, {800, 0.15, 4.9}};

    @Test
    void aGoodTableInEitherOrder() {
        NkTable t = new NkTable("good.csv", rows(GOOD));
        assertEquals(4, t.rows().size());
        assertEquals(500e-9, t.span().shortest(), 1e-20);
        double[][] reversed = {GOOD[3], GOOD[2], GOOD[1], GOOD[0]};
        assertEquals(800e-9, new NkTable("rev.csv", rows(reversed)).span().longest(), 1e-20);
    }

    @Test
    void negativeKNamesTheRow() {
        double[][] t = {GOOD[0], GOOD[1], {700, 0.14, -4.0}, GOOD[3]};
        MaterialDataException e = assertThrows(MaterialDataException.class, () -> new NkTable("bad.csv", rows(t)));
        assertEquals(12, e.line());
        assertEquals("k", e.column());
        assertTrue(e.getMessage().contains("line 12") && e.getMessage().contains("-4"), e.getMessage());
    }

    @Test
    void tooFewRows() {
        double[][] t = {GOOD[0], GOOD[1], GOOD[2]};
        MaterialDataException e = assertThrows(MaterialDataException.class, () -> new NkTable("short.csv", rows(t)));
        assertTrue(e.getMessage().contains("3 rows") && e.getMessage().contains("at least 4"), e.getMessage());
    }

    @Test
    void outOfOrderAndRepeatedWavelengths() {
        double[][] t = {GOOD[0], GOOD[1], {550, 0.6, 2.5}, GOOD[3]};
        MaterialDataException e = assertThrows(MaterialDataException.class, () -> new NkTable("o.csv", rows(t)));
        assertEquals(12, e.line());
        assertTrue(e.getMessage().contains("out of order"), e.getMessage());
        double[][] d = {GOOD[0], GOOD[1], GOOD[1], GOOD[3]};
        e = assertThrows(MaterialDataException.class, () -> new NkTable("d.csv", rows(d)));
        assertEquals(12, e.line());
        assertTrue(e.getMessage().contains("repeats the wavelength of line 11"), e.getMessage());
    }

    @Test
    void nonFiniteAndNegativeValues() {
        double[][] t = {GOOD[0], {600, Double.NaN, 3.0}, GOOD[2], GOOD[3]};
        MaterialDataException e = assertThrows(MaterialDataException.class, () -> new NkTable("n.csv", rows(t)));
        assertEquals("n", e.column());
        assertEquals(11, e.line());
        double[][] w = {{-500, 0.9, 1.9}, GOOD[1], GOOD[2], GOOD[3]};
        e = assertThrows(MaterialDataException.class, () -> new NkTable("w.csv", rows(w)));
        assertEquals("wavelength", e.column());
        assertEquals(10, e.line());
    }
}
