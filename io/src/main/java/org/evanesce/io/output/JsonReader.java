package org.evanesce.io.output;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads JSON (RFC 8259) back into the values {@link Json} writes: objects as {@link LinkedHashMap}s in file
 * order, arrays as {@link ArrayList}s, strings, booleans, null, whole numbers as {@link Integer} (else
 * {@link Long}, else {@link BigInteger}) and other numbers as {@link Double}, the types a YAML 1.2 reader's
 * JSON schema gives (which read these files before: a sweep's merge read every point's summary.json and
 * run.json through the YAML scanner, whose compilation by the JIT cost more than the reading). Strict: a
 * duplicate key, a trailing comma, a comment or anything after the value is an error naming the line and
 * column.
 */
public final class JsonReader {

    /** Text that is not JSON; the message names the line and column. */
    public static final class NotJson extends Exception {
        private static final long serialVersionUID = 1L;

        NotJson(String message) {
            super(message);
        }
    }

    /** Nesting deeper than this is refused (the program's files nest a few levels). */
    static final int MAX_DEPTH = 200;

    private final String s;
    private int i;

    private JsonReader(String s) {
        this.s = s;
    }

    /** The value of a whole JSON text. */
    public static Object read(String text) throws NotJson {
        JsonReader r = new JsonReader(text);
        r.space();
        Object v = r.value(0);
        r.space();
        if (r.i < text.length()) {
            throw r.error("more text after the value");
        }
        return v;
    }

    private Object value(int depth) throws NotJson {
        if (depth > MAX_DEPTH) {
            throw error("nested deeper than " + MAX_DEPTH + " levels");
        }
        if (i >= s.length()) {
            throw error("the text ends where a value was expected");
        }
        char c = s.charAt(i);
        switch (c) {
            case '{':
                return object(depth);
            case '[':
                return array(depth);
            case '"':
                return string();
            case 't':
                return word("true", Boolean.TRUE);
            case 'f':
                return word("false", Boolean.FALSE);
            case 'n':
                return word("null", null);
            default:
                if (c == '-' || (c >= '0' && c <= '9')) {
                    return number();
                }
                throw error("unexpected '" + c + "'");
        }
    }

    private Map<String, Object> object(int depth) throws NotJson {
        Map<String, Object> m = new LinkedHashMap<>();
        i++;
        space();
        if (peek() == '}') {
            i++;
            return m;
        }
        while (true) {
            space();
            if (peek() != '"') {
                throw error("expected a key in double quotes");
            }
            int at = i;
            String key = string();
            space();
            expect(':');
            space();
            Object v = value(depth + 1);
            if (m.containsKey(key)) {
                i = at;
                throw error("the key \"" + key + "\" appears twice");
            }
            m.put(key, v);
            space();
            if (peek() == ',') {
                i++;
            } else {
                expect('}');
                return m;
            }
        }
    }

    private List<Object> array(int depth) throws NotJson {
        List<Object> l = new ArrayList<>();
        i++;
        space();
        if (peek() == ']') {
            i++;
            return l;
        }
        while (true) {
            space();
            l.add(value(depth + 1));
            space();
            if (peek() == ',') {
                i++;
            } else {
                expect(']');
                return l;
            }
        }
    }

    private String string() throws NotJson {
        i++;
        StringBuilder sb = null;
        int start = i;
        while (true) {
            if (i >= s.length()) {
                throw error("a string is not closed");
            }
            char c = s.charAt(i);
            if (c == '"') {
                String tail = s.substring(start, i++);
                return sb == null ? tail : sb.append(tail).toString();
            } else if (c < 0x20) {
                throw error("a control character inside a string");
            } else if (c == '\\') {
                if (sb == null) {
                    sb = new StringBuilder();
                }
                sb.append(s, start, i);
                i++;
                sb.append(escape());
                start = i;
            } else {
                i++;
            }
        }
    }

    private char escape() throws NotJson {
        if (i >= s.length()) {
            throw error("a string is not closed");
        }
        char c = s.charAt(i++);
        switch (c) {
            case '"':
            case '\\':
            case '/':
                return c;
            case 'b':
                return '\b';
            case 'f':
                return '\f';
            case 'n':
                return '\n';
            case 'r':
                return '\r';
            case 't':
                return '\t';
            case 'u':
                if (i + 4 > s.length()) {
                    throw error("a \\u escape needs four hexadecimal digits");
                }
                int v = 0;
                for (int k = 0; k < 4; k++) {
                    int d = Character.digit(s.charAt(i++), 16);
                    if (d < 0) {
                        i--;
                        throw error("a \\u escape needs four hexadecimal digits");
                    }
                    v = v * 16 + d;
                }
                return (char) v;
            default:
                i--;
                throw error("unknown escape '\\" + c + "'");
        }
    }

    private Object number() throws NotJson {
        int start = i;
        if (peek() == '-') {
            i++;
        }
        if (peek() == '0') {
            i++;
        } else if (!digits()) {
            throw error("a number needs digits");
        }
        boolean whole = true;
        if (peek() == '.') {
            i++;
            whole = false;
            if (!digits()) {
                throw error("a number needs digits after its '.'");
            }
        }
        if (peek() == 'e' || peek() == 'E') {
            i++;
            whole = false;
            if (peek() == '+' || peek() == '-') {
                i++;
            }
            if (!digits()) {
                throw error("a number needs digits in its exponent");
            }
        }
        String t = s.substring(start, i);
        if (!whole) {
            return Double.valueOf(t);
        }
        if (t.length() < 10) {
            return Integer.valueOf(t);
        }
        BigInteger b = new BigInteger(t);
        if (b.bitLength() < 32) {
            return b.intValue();
        }
        return b.bitLength() < 64 ? (Object) b.longValue() : b;
    }

    private boolean digits() {
        int start = i;
        while (i < s.length() && s.charAt(i) >= '0' && s.charAt(i) <= '9') {
            i++;
        }
        return i > start;
    }

    private Object word(String w, Object v) throws NotJson {
        if (!s.startsWith(w, i)) {
            throw error("unexpected '" + s.charAt(i) + "'");
        }
        i += w.length();
        return v;
    }

    private void expect(char c) throws NotJson {
        if (peek() != c) {
            throw error(i < s.length() ? "expected '" + c + "', found '" + s.charAt(i) + "'" : "the text ends where '" + c
                    + "' was expected");
        }
        i++;
    }

    private char peek() {
        return i < s.length() ? s.charAt(i) : '\0';
    }

    private void space() {
        while (i < s.length()) {
            char c = s.charAt(i);
            if (c != ' ' && c != '\n' && c != '\r' && c != '\t') {
                return;
            }
            i++;
        }
    }

    private NotJson error(String what) {
        int line = 1;
        int col = 1;
        for (int k = 0; k < Math.min(i, s.length()); k++) {
            if (s.charAt(k) == '\n') {
                line++;
                col = 1;
            } else {
                col++;
            }
        }
        return new NotJson("line " + line + ", column " + col + ": " + what);
    }
}
