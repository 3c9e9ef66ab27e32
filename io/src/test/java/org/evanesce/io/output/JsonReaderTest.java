package org.evanesce.io.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.snakeyaml.engine.v2.api.Load;
import org.snakeyaml.engine.v2.api.LoadSettings;

/**
 * The JSON reader against snakeyaml-engine, a general-purpose YAML 1.2 library whose JSON schema (YAML 1.2.2,
 * §10.2) read the program's JSON files before: on texts {@link Json} writes from seeded random values, both
 * must give equal values of the same classes (maps in the same key order); and bad texts are refused with
 * the line and column (RFC 8259's grammar).
 */
class JsonReaderTest {

    private static Object reference(String text) {
        return new Load(LoadSettings.builder().setCodePointLimit(Integer.MAX_VALUE).build()).loadFromString(text);
    }

    private static Object random(Random r, int depth) {
        int kind = depth > 3 ? r.nextInt(6) : r.nextInt(8);
        switch (kind) {
            case 0:
                return null;
            case 1:
                return r.nextBoolean();
            case 2:
                // magnitudes from 1e-300 to 1e300, signs, and plain decimals such as 2.25
                double d = r.nextInt(4) == 0 ? r.nextInt(1000) / 4.0 : Math.pow(10, r.nextInt(600) - 300) * r.nextGaussian();
                return r.nextInt(10) == 0 ? -0.0 : d;
            case 3:
                long[] ints = {0, -1, r.nextInt(), Integer.MAX_VALUE, Integer.MIN_VALUE, 1L + Integer.MAX_VALUE, r.nextLong(),
                    Long.MIN_VALUE};
                long v = ints[r.nextInt(ints.length)];
                return v == (int) v ? (Object) (int) v : (Object) v;
            case 4:
                StringBuilder sb = new StringBuilder();
                String pool = "ab \"\\/\n\t\r\u0001\u001fµλ€😀,:{}[]#";
                for (int k = r.nextInt(12); k > 0; k--) {
                    sb.appendCodePoint(pool.codePointAt(pool.offsetByCodePoints(0, r.nextInt(pool.codePointCount(0,
                            pool.length())))));
                }
                return sb.toString();
            case 5:
                double[] a = new double[r.nextInt(4)];
                for (int k = 0; k < a.length; k++) {
                    a[k] = r.nextGaussian() * 1e-7;
                }
                return a;
            case 6:
                Map<String, Object> m = new LinkedHashMap<>();
                for (int k = r.nextInt(5); k > 0; k--) {
                    m.put("key_" + r.nextInt(1000) + (r.nextBoolean() ? "_µ" : ""), random(r, depth + 1));
                }
                return m;
            default:
                List<Object> l = new ArrayList<>();
                for (int k = r.nextInt(5); k > 0; k--) {
                    l.add(random(r, depth + 1));
                }
                return l;
        }
    }

    /** Leaves of the same class and value, maps with the same keys in the same order. */
    private static void assertSame(Object expected, Object actual, String where) {
        if (expected == null || actual == null) {
            assertEquals(expected, actual, where);
            return;
        }
        assertEquals(expected.getClass(), actual.getClass(), where + ": class");
        if (expected instanceof Map<?, ?> em) {
            Map<?, ?> am = (Map<?, ?>) actual;
            assertEquals(new ArrayList<>(em.keySet()), new ArrayList<>(am.keySet()), where + ": keys in order");
            for (Object k : em.keySet()) {
                assertSame(em.get(k), am.get(k), where + "." + k);
            }
        } else if (expected instanceof List<?> el) {
            List<?> al = (List<?>) actual;
            assertEquals(el.size(), al.size(), where + ": length");
            for (int k = 0; k < el.size(); k++) {
                assertSame(el.get(k), al.get(k), where + "[" + k + "]");
            }
        } else {
            assertEquals(expected, actual, where);
        }
    }

    @Test
    void readsWhatJsonWritesAsTheYamlLibraryDoes() throws JsonReader.NotJson {
        Random r = new Random(20261204L);
        for (int n = 0; n < 2000; n++) {
            Map<String, Object> top = new LinkedHashMap<>();
            top.put("value", random(r, 0));
            top.put("more", random(r, 0));
            String text = Json.write(top);
            assertSame(reference(text), JsonReader.read(text), "text " + n + ": " + text);
        }
    }

    @Test
    void compactTextsAndEscapesReadAsTheYamlLibraryDoes() throws JsonReader.NotJson {
        for (String text : new String[] {"[]", "{}", " [1,2.5e3,-0,-0.0,1E+2,\"a\\u00e9\\/\\b\\f\"] ", "{\"a\":{\"b\":[true,false,null]}}",
            "12345678901234567890", "-2147483649", "2147483647", "0.000001"}) {
            assertSame(reference(text), JsonReader.read(text), text);
        }
    }

    @Test
    void badTextsAreRefusedWithTheirLineAndColumn() {
        String[][] cases = {
            {"{\"a\": 1,}", "line 1, column 9: expected a key in double quotes"},
            {"{\"a\": 1, \"a\": 2}", "line 1, column 10: the key \"a\" appears twice"},
            {"[1, 2]\nx", "line 2, column 1: more text after the value"},
            {"{\n  \"a\": \"open", "line 2, column 13: a string is not closed"},
            {"[01]", "line 1, column 3: expected ']', found '1'"},
            {"[1.]", "line 1, column 4: a number needs digits after its '.'"},
            {"[tru]", "line 1, column 2: unexpected 't'"},
            {"", "line 1, column 1: the text ends where a value was expected"},
            {"[\"a\\x\"]", "line 1, column 5: unknown escape '\\x'"},
            {"# comment\n{}", "line 1, column 1: unexpected '#'"},
        };
        for (String[] c : cases) {
            JsonReader.NotJson e = assertThrows(JsonReader.NotJson.class, () -> JsonReader.read(c[0]), c[0]);
            assertEquals(c[1], e.getMessage(), c[0]);
        }
        String deep = "[".repeat(JsonReader.MAX_DEPTH + 2);
        assertTrue(assertThrows(JsonReader.NotJson.class, () -> JsonReader.read(deep)).getMessage().contains("nested deeper"));
    }
}
