package org.evanesce.io.fuzz;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Breaks a valid case file in one of many ways, deterministically for a given {@link Random}.
 * Every {@link Kind} is a class of damage a user (or an editor, a copy, a script) can do to a
 * case file; {@link #mutate} applies one to a text and returns the bytes to write.
 */
final class CaseMutator {

    /** The classes of damage. */
    enum Kind {
        DELETE_LINE, DUPLICATE_LINE, SWAP_LINES, NUMBER_ZERO, NUMBER_NEGATIVE, NUMBER_HUGE, NUMBER_TINY, NUMBER_MAX,
        NUMBER_NAN, NUMBER_INFINITE, NUMBER_OVERFLOWING_LONG, SWAP_UNIT, LIST_FOR_MAP, MAP_FOR_LIST, SCALAR_FOR_COLLECTION,
        COLLECTION_FOR_SCALAR, DEEP_FLOW_NESTING, DEEP_BLOCK_NESTING, DEEP_PARENTHESES, LONG_SUM, LONG_UNARY_CHAIN,
        NESTED_FUNCTIONS, PARAMETER_CHAIN, UNKNOWN_KEY, NON_UTF8, LATIN1_TEXT, TRUNCATE, TABS, DUPLICATE_KEY,
        BILLION_LAUGHS, RECURSIVE_ALIAS, SCALAR_ALIASES, EMPTY, WHITESPACE_ONLY, COMMENT_ONLY, SEVERAL_DOCUMENTS,
        CONTROL_CHARACTER, NUL_BYTE, BYTE_ORDER_MARK, CRLF, CR_ONLY, FLIP_BYTE, SPECIAL_SCALAR, YAML_TAG, HEX_OCTAL,
        LONG_LINE, HUGE_COUNT, INDENT_SHIFT, STRAY_BRACKET, ANCHOR_REUSE
    }

    /** A number as written in a case: digits, a point, an exponent. */
    private static final Pattern NUMBER = Pattern.compile("(?<![\\w.])\\d+(\\.\\d*)?([eE][-+]?\\d+)?(?![\\w.])");
    private static final Pattern UNIT = Pattern.compile("(?<=\\d )(nm|um|mm|fs|ps|ns|THz|GHz|PHz|Hz|deg|rad|S/m)\\b");
    private static final Pattern KEY = Pattern.compile("^(\\s*(- )?)([A-Za-z_]+):(.*)$");
    private static final String[] UNITS = {"nm", "um", "fs", "ps", "THz", "deg", "rad", "S/m", "m", "s", "Hz"};

    private final Random random;

    CaseMutator(Random random) {
        this.random = random;
    }

    /** One mutant of {@code text} of the given kind. */
    byte[] mutate(String text, Kind kind) {
        List<String> lines = new ArrayList<>(List.of(text.split("\n", -1)));
        return switch (kind) {
            case DELETE_LINE -> { lines.remove(line(lines)); yield utf8(lines); }
            case DUPLICATE_LINE -> { int k = line(lines); lines.add(k, lines.get(k)); yield utf8(lines); }
            case SWAP_LINES -> {
                int a = line(lines);
                int b = random.nextBoolean() ? Math.min(lines.size() - 1, a + 1) : line(lines);
                String t = lines.get(a);
                lines.set(a, lines.get(b));
                lines.set(b, t);
                yield utf8(lines);
            }
            case NUMBER_ZERO -> number(text, "0");
            case NUMBER_NEGATIVE -> negate(text);
            case NUMBER_HUGE -> number(text, pick("1e30", "1e200", "123456789012345678901234567890"));
            case NUMBER_TINY -> number(text, pick("1e-30", "1e-300", "4.9e-324", "0.000000000000000000001"));
            case NUMBER_MAX -> number(text, pick("1e308", "1.7976931348623157e308", "9e307"));
            case NUMBER_NAN -> number(text, pick(".nan", "NaN", "nan"));
            case NUMBER_INFINITE -> number(text, pick(".inf", "-.inf", "Infinity", "1e309", "1e999"));
            case NUMBER_OVERFLOWING_LONG -> number(text, pick("9223372036854775808", "99999999999999999999", "2147483648"));
            case SWAP_UNIT -> swapUnit(text);
            case LIST_FOR_MAP -> bytes(replaceNth(text, "\\{([^{}]*)\\}", "[$1]"));
            case MAP_FOR_LIST -> bytes(replaceNth(text, "\\[([^\\[\\]]*)\\]", "{$1}"));
            case SCALAR_FOR_COLLECTION -> bytes(replaceNth(text, "(\\{[^{}]*\\}|\\[[^\\[\\]]*\\])", pick("3", "hello", "1 um", "~")));
            case COLLECTION_FOR_SCALAR -> valueOfKey(lines, pick("[1 um, 2 um]", "{a: 1}", "[]", "{}", "[[1]]", "- x"));
            case DEEP_FLOW_NESTING -> {
                int depth = pickInt(200, 5_000, 50_000);
                yield valueOfKey(lines, "[".repeat(depth) + "1" + "]".repeat(depth));
            }
            case DEEP_BLOCK_NESTING -> {
                int depth = pickInt(100, 2_000);
                StringBuilder sb = new StringBuilder(text).append("\nextra:\n");
                for (int d = 1; d <= depth; d++) {
                    sb.append(" ".repeat(d)).append("k").append(d).append(":\n");
                }
                sb.append(" ".repeat(depth + 1)).append("1\n");
                yield bytes(sb.toString());
            }
            case DEEP_PARENTHESES -> {
                int depth = pickInt(100, 3_000, 40_000);
                yield valueOfNumber(text, "(".repeat(depth) + "1" + ")".repeat(depth));
            }
            case LONG_SUM -> {
                int terms = pickInt(1_000, 20_000, 100_000);
                yield valueOfNumber(text, "1" + " + 1".repeat(terms));
            }
            case LONG_UNARY_CHAIN -> valueOfNumber(text, "-".repeat(pickInt(100, 20_000)) + "1");
            case NESTED_FUNCTIONS -> {
                int depth = pickInt(50, 5_000);
                yield valueOfNumber(text, "abs(".repeat(depth) + "1" + ")".repeat(depth));
            }
            case PARAMETER_CHAIN -> parameterChain(text, pickInt(100, 2_000, 10_000));
            case UNKNOWN_KEY -> {
                int k = line(lines);
                Matcher m = KEY.matcher(lines.get(k));
                String indent = m.matches() ? m.group(1).replace("- ", "  ") : "";
                lines.add(k + 1, indent + pick("colour", "widht", "resolution", "x", "stop") + ": 1");
                yield utf8(lines);
            }
            case NON_UTF8 -> insertBytes(text, pick(new byte[] {(byte) 0xFF}, new byte[] {(byte) 0xC3, 0x28},
                    new byte[] {(byte) 0xE2, (byte) 0x82}, new byte[] {(byte) 0xED, (byte) 0xA0, (byte) 0x80},
                    new byte[] {(byte) 0xF8, (byte) 0x88, (byte) 0x80, (byte) 0x80, (byte) 0x80}));
            case LATIN1_TEXT -> {
                String t = text.replaceFirst("(?m)^(title: .*)$", "$1 caf\u00e9");
                if (t.equals(text)) {
                    t = "title: caf\u00e9 \u00b5m\n" + text;
                }
                yield t.getBytes(StandardCharsets.ISO_8859_1);
            }
            case TRUNCATE -> {
                byte[] b = bytes(text);
                yield java.util.Arrays.copyOf(b, random.nextInt(b.length));
            }
            case TABS -> {
                int k = line(lines);
                lines.set(k, lines.get(k).replaceFirst("^ +", "\t").replaceFirst(": ", ":\t"));
                yield utf8(lines);
            }
            case DUPLICATE_KEY -> {
                for (int tries = 0; tries < 20; tries++) {
                    int k = line(lines);
                    Matcher m = KEY.matcher(lines.get(k));
                    if (m.matches()) {
                        lines.add(k + 1, m.group(1).replace("- ", "  ") + m.group(3) + ":" + m.group(4));
                        break;
                    }
                }
                yield utf8(lines);
            }
            case BILLION_LAUGHS -> {
                StringBuilder sb = new StringBuilder("lol0: &l0 [\"lol\", \"lol\", \"lol\", \"lol\", \"lol\", \"lol\", \"lol\", \"lol\", \"lol\"]\n");
                for (int d = 1; d <= 9; d++) {
                    sb.append("lol").append(d).append(": &l").append(d).append(" [");
                    for (int r = 0; r < 9; r++) {
                        sb.append(r == 0 ? "" : ", ").append("*l").append(d - 1);
                    }
                    sb.append("]\n");
                }
                String at = pick("top", "parameters", "shapes");
                if (at.equals("top")) {
                    yield bytes(text + "\n" + sb);
                }
                String bomb = sb.toString().replace("\n", "\n  ");
                yield bytes(text.replaceFirst("(?m)^" + at + ":.*$", at + ":\n  " + bomb + "x: *l9"));
            }
            case RECURSIVE_ALIAS -> bytes(text.replaceFirst("(?m)^(shapes|sources|parameters):.*$",
                    pick("$1: &r [*r]", "$1: &r {a: *r}", "$1: &r [1, [2, *r]]")));
            case SCALAR_ALIASES -> {
                StringBuilder sb = new StringBuilder(text).append("\nmany: [");
                for (int r = 0; r < 20_000; r++) {
                    sb.append(r == 0 ? "&s 1" : ", *s");
                }
                yield bytes(sb.append("]\n").toString());
            }
            case EMPTY -> new byte[0];
            case WHITESPACE_ONLY -> bytes(pick("\n\n\n", "   ", "\t\n \n"));
            case COMMENT_ONLY -> bytes("# a case file with nothing in it\n");
            case SEVERAL_DOCUMENTS -> bytes(pick(text + "\n---\n" + text, "---\n" + text + "\n...\n", "---\n---\n" + text));
            case CONTROL_CHARACTER -> insertText(text, pick("\u0007", "\u001b[31m", "\u007f", "\u0085", "\ufffe"));
            case NUL_BYTE -> insertBytes(text, new byte[] {0});
            case BYTE_ORDER_MARK -> pick(bytes("\ufeff" + text), bytes("\ufeff\ufeff" + text), utf16(text));
            case CRLF -> bytes(text.replace("\n", "\r\n"));
            case CR_ONLY -> bytes(text.replace("\n", "\r"));
            case FLIP_BYTE -> {
                byte[] b = bytes(text);
                b[random.nextInt(b.length)] ^= (byte) (1 << random.nextInt(8));
                yield b;
            }
            case SPECIAL_SCALAR -> valueOfKey(lines, pick("~", "null", "true", "''", "\"\"", "'\u00a0'", "\"!@#$%^&*\"",
                    "\"\\u0000\"", "yes", "|\n    block", ">-\n    folded", "1 um 2 um", "1 um # comment"));
            case YAML_TAG -> valueOfKey(lines, pick("!!binary aGVsbG8=", "!!python/object:os.system ls", "!custom 1 um",
                    "!!int 3", "!!float 2.5", "!!str 1 um", "!!set {a, b}", "!!timestamp 2001-12-14"));
            case HEX_OCTAL -> number(text, pick("0x10", "0o17", "1_000", "0b101", "+12", "012", "1e", "1.2.3", "..5"));
            case LONG_LINE -> valueOfKey(lines, "\"" + "x".repeat(pickInt(10_000, 500_000)) + "\"");
            case HUGE_COUNT -> bytes(text.replaceAll("count: \\d+", "count: " + pick("1000000", "1e9", "2147483648", "-3")));
            case INDENT_SHIFT -> {
                int k = line(lines);
                lines.set(k, (random.nextBoolean() ? " " : "   ") + lines.get(k));
                yield utf8(lines);
            }
            case STRAY_BRACKET -> insertText(text, pick("[", "]", "{", "}", "\"", "'", ": ", "- ", "&", "*", "!", "%", "@", "`", "|"));
            case ANCHOR_REUSE -> bytes(text.replaceFirst("(?m)^(domain): ", "$1: &d ").replaceFirst("(?m)^(stop):.*$",
                    "$1: *d") + "\nx: *undefined\n");
        };
    }

    private int line(List<String> lines) {
        return random.nextInt(lines.size());
    }

    @SafeVarargs
    private <T> T pick(T... options) {
        return options[random.nextInt(options.length)];
    }

    private int pickInt(int... options) {
        return options[random.nextInt(options.length)];
    }

    private static byte[] bytes(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }

    private static byte[] utf8(List<String> lines) {
        return bytes(String.join("\n", lines));
    }

    private static byte[] utf16(String s) {
        return ("\ufeff" + s).getBytes(StandardCharsets.UTF_16LE);
    }

    /** The text with the n-th (random) match of {@code regex} replaced. */
    private String replaceNth(String text, String regex, String replacement) {
        Matcher m = Pattern.compile(regex).matcher(text);
        List<int[]> found = new ArrayList<>();
        while (m.find()) {
            found.add(new int[] {m.start(), m.end()});
        }
        if (found.isEmpty()) {
            return text + "\nstray: " + replacement.replace("$1", "") + "\n";
        }
        int[] at = found.get(random.nextInt(found.size()));
        String piece = text.substring(at[0], at[1]).replaceAll(regex, replacement);
        return text.substring(0, at[0]) + piece + text.substring(at[1]);
    }

    private byte[] number(String text, String with) {
        return bytes(replaceNth(text, NUMBER.pattern(), Matcher.quoteReplacement(with)));
    }

    private byte[] negate(String text) {
        return bytes(replaceNth(text, NUMBER.pattern(), "-$0"));
    }

    private byte[] swapUnit(String text) {
        return bytes(replaceNth(text, UNIT.pattern(), pick(UNITS)));
    }

    /** The value of a random key (a line "key: value") replaced by {@code value}. */
    private byte[] valueOfKey(List<String> lines, String value) {
        for (int tries = 0; tries < 40; tries++) {
            int k = line(lines);
            Matcher m = KEY.matcher(lines.get(k));
            if (m.matches() && !m.group(4).isBlank()) {
                lines.set(k, m.group(1) + m.group(3) + ": " + value);
                return utf8(lines);
            }
        }
        lines.add("title: " + value);
        return utf8(lines);
    }

    /** A number somewhere replaced by an expression (quoted so that YAML keeps it one scalar). */
    private byte[] valueOfNumber(String text, String expression) {
        return bytes(replaceNth(text, NUMBER.pattern(), Matcher.quoteReplacement("\"" + expression + "\"")));
    }

    /** A chain of parameters p0 ← p1 ← … used by the first length of the case. */
    private byte[] parameterChain(String text, int length) {
        StringBuilder sb = new StringBuilder("parameters:\n  p0: 1 um\n");
        boolean reversed = random.nextBoolean();
        for (int k = 1; k < length; k++) {
            int q = reversed ? length - k : k;
            sb.append("  p").append(q).append(": ").append(reversed ? "p" + (q + 1) + " * 1" : "p" + (q - 1) + " + 0 um").append('\n');
        }
        if (reversed) {
            sb.append("  p").append(length).append(": 1 um\n");
        }
        String without = text.replaceAll("(?m)^parameters:.*\\n(  .*\\n)*", "");
        String last = "p" + (reversed ? 1 : length - 1);
        String used = without.replaceFirst("(?<=[\\[ ])\\d+(\\.\\d*)? (nm|um)\\b", last);
        return bytes(sb + used);
    }

    private byte[] insertBytes(String text, byte[] what) {
        byte[] b = bytes(text);
        int at = random.nextInt(b.length + 1);
        // keep a multi-byte character whole before the insertion
        while (at > 0 && at < b.length && (b[at] & 0xC0) == 0x80) {
            at--;
        }
        byte[] out = new byte[b.length + what.length];
        System.arraycopy(b, 0, out, 0, at);
        System.arraycopy(what, 0, out, at, what.length);
        System.arraycopy(b, at, out, at + what.length, b.length - at);
        return out;
    }

    private byte[] insertText(String text, String what) {
        int at = random.nextInt(text.length() + 1);
        return bytes(text.substring(0, at) + what + text.substring(at));
    }
}
