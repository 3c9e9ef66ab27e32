package org.evanesce.io.casefile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.FutureTask;
import java.util.concurrent.TimeUnit;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.text.YamlLimits;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.evanesce.io.plan.CaseLoader;

/**
 * The stated limits of docs/case-file.md ("Limits", "Expressions and parameters"): whatever the file
 * holds, it is read or refused with its place, never a stack overflow, a hang or an unbounded read.
 * Each reading runs on a thread with a 1 MiB stack, what the {@code java} launcher gives the main
 * thread by default, so that recursion per nesting level or per term would overflow here as it would
 * for a user.
 */
class CaseLimitsTest {

    private static final ReadOptions ENOUGH_MEMORY = new ReadOptions(1L << 34);
    /** A reading that takes longer than this is taken to hang (each takes well under a second). */
    private static final long HANG_SECONDS = 30;

    private static final String BASE = """
            polarization: s
            domain: {width: WIDTH, height: 3 um}
            grid: {cell: 20 nm}
            sources:
              - point: {at: [0, 0], signal: {pulse: {wavelength: 633 nm, bandwidth: 40 nm}}}
            until: {time: 100 fs}
            """;

    @TempDir
    Path dir;

    /** {@code task} on a thread with a 1 MiB stack, within {@link #HANG_SECONDS}. */
    private static <T> T onSmallStack(Callable<T> task) throws Exception {
        FutureTask<T> f = new FutureTask<>(task);
        Thread t = new Thread(null, f, "small-stack", 1 << 20);
        t.setDaemon(true);
        t.start();
        try {
            return f.get(HANG_SECONDS, TimeUnit.SECONDS);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof Exception x) {
                throw x;
            }
            throw new AssertionError("reading threw " + e.getCause(), e.getCause());
        }
    }

    /** The errors of a case text, read on a small stack. */
    private static List<String> errors(String text) throws Exception {
        return onSmallStack(() -> {
            CaseFileException e = assertThrows(CaseFileException.class, () -> CaseLoader.parse(text, "case.yaml", Map.of(),
                    ENOUGH_MEMORY), "expected errors");
            return e.errors().stream().map(Diagnostic::toString).toList();
        });
    }

    private static CaseSpec valid(String text) throws Exception {
        return onSmallStack(() -> CaseLoader.parse(text, "case.yaml", Map.of(), ENOUGH_MEMORY).spec());
    }

    private static String withWidth(String expression) {
        return BASE.replace("WIDTH", "\"" + expression + "\"");
    }

    @Test
    void expressionsNestUpToTheLimit() throws Exception {
        int limit = org.evanesce.io.casefile.expr.Expression.MAX_DEPTH;
        assertEquals(4e-6, valid(withWidth("(".repeat(limit) + "4 um" + ")".repeat(limit))).domain().width().si(), 1e-18);
        List<String> deeper = errors(withWidth("(".repeat(limit + 1) + "4 um" + ")".repeat(limit + 1)));
        assertEquals(1, deeper.size(), deeper::toString);
        // the 65th '(' is character 64 of the expression, after the opening quote at column 17
        assertTrue(deeper.get(0).startsWith("case.yaml:2:82: domain.width: the expression nests more than 64 levels"), deeper::toString);
        for (String e : List.of("(".repeat(40_000) + "4 um" + ")".repeat(40_000), "-".repeat(5_000) + "4 um",
                "abs(".repeat(3_000) + "4 um" + ")".repeat(3_000))) {
            List<String> found = errors(withWidth(e.length() > 9_000 ? e.substring(0, 9_000) : e));
            assertTrue(found.size() == 1 && found.get(0).contains("more than 64 levels"), found::toString);
        }
    }

    @Test
    void longExpressionsAreSumsNotRecursionUpToTheLengthLimit() throws Exception {
        // 1 um + 1 um + ... with 1 428 terms: 9 993 characters, evaluated as one list of terms
        String sum = "1 um" + " + 1 um".repeat(1_427);
        assertTrue(sum.length() <= 10_000, "length " + sum.length());
        assertEquals(1_428e-6, valid(withWidth(sum)).domain().width().si(), 1e-12);
        String longer = "1 um" + " + 1 um".repeat(20_000);
        List<String> found = errors(withWidth(longer));
        assertEquals(List.of("case.yaml:2:18: domain.width: the expression is 140004 characters long, more than the limit of "
                + "10000; use parameters for its parts"), found);
    }

    @Test
    void parameterChainsOfAnyLengthResolveAndLongCyclesAreReportedOnce() throws Exception {
        int n = 20_000;
        StringBuilder chain = new StringBuilder("parameters:\n");
        for (int k = 1; k < n; k++) {
            chain.append("  p").append(k).append(": p").append(k + 1).append(" + 1 nm\n");
        }
        chain.append("  p").append(n).append(": 1 um\n");
        CaseSpec spec = valid(chain + BASE.replace("WIDTH", "p1"));
        assertEquals(1e-6 + (n - 1) * 1e-9, spec.domain().width().si(), 1e-15);
        assertEquals(Dimension.LENGTH, spec.parameters().get("p1").value().dimension());

        String cycle = chain.toString().replace("  p" + n + ": 1 um\n", "  p" + n + ": p1\n");
        List<String> found = errors(cycle + BASE.replace("WIDTH", "p1"));
        assertEquals(List.of("case.yaml:2:7: parameters.p1: circular definition: p1 -> p2 -> p3 -> p4 -> ... (19995 more) -> "
                + "p20000 -> p1"), found);
    }

    @Test
    void yamlNestingAndAliasesHaveLimits() throws Exception {
        int limit = YamlLimits.MAX_DEPTH;
        // the top-level mapping is level 1; 'extra' opens levels 2 and up
        String ok = BASE.replace("WIDTH", "4 um") + "stop_extra: " + "[".repeat(limit - 1) + "1" + "]".repeat(limit - 1) + "\n";
        List<String> unknownOnly = errors(ok);
        assertEquals(1, unknownOnly.size(), unknownOnly::toString);
        assertTrue(unknownOnly.get(0).contains("stop_extra: unknown key"), unknownOnly::toString);
        String deep = BASE.replace("WIDTH", "4 um") + "stop_extra: " + "[".repeat(50_000) + "1" + "]".repeat(50_000) + "\n";
        assertEquals(List.of("case.yaml:7:" + (13 + limit - 1) + ": lists and mappings nest more than 32 levels deep here, the "
                + "limit; a case file needs at most six"), errors(deep));

        StringBuilder laughs = new StringBuilder(BASE.replace("WIDTH", "4 um")).append("lol0: &l0 [lol, lol, lol, lol, lol, lol, lol, lol, lol]\n");
        for (int d = 1; d <= 9; d++) {
            laughs.append("lol").append(d).append(": &l").append(d).append(" [");
            for (int r = 0; r < 9; r++) {
                laughs.append(r == 0 ? "" : ", ").append("*l").append(d - 1);
            }
            laughs.append("]\n");
        }
        List<String> bomb = errors(laughs.toString());
        assertEquals(1, bomb.size(), bomb::toString);
        assertTrue(bomb.get(0).startsWith("case.yaml:13:") && bomb.get(0).contains("more than 50 aliases of lists or mappings"),
                bomb::toString);
        assertEquals(List.of("case.yaml:7:15: the alias *r refers to the list or mapping that holds it; a case file cannot contain "
                + "itself"), errors(BASE.replace("WIDTH", "4 um") + "extra: &r [1, *r]\n"));
    }

    @Test
    void bytesThatAreNotUtf8AreRefusedWithLineColumnAndOffset() throws Exception {
        String text = BASE.replace("WIDTH", "4 um");
        byte[] good = text.getBytes(StandardCharsets.UTF_8);
        int at = text.indexOf("height") - 2; // line 2, after "domain: {width: 4 um"
        byte[] bad = new byte[good.length + 1];
        System.arraycopy(good, 0, bad, 0, at);
        bad[at] = (byte) 0xE9; // é in ISO 8859-1
        System.arraycopy(good, at, bad, at + 1, good.length - at);
        Path file = Files.write(dir.resolve("latin1.yaml"), bad);
        CaseFileException e = assertThrows(CaseFileException.class, () -> CaseLoader.read(file, Map.of(), ENOUGH_MEMORY));
        int column = at - text.indexOf('\n');
        assertEquals(List.of(file + ":2:" + column + ": the file is not UTF-8 text: byte 0xe9 at byte offset " + at
                + " is not valid UTF-8; save the file as UTF-8"), e.errors().stream().map(Diagnostic::toString).toList());

        Path utf16 = Files.write(dir.resolve("utf16.yaml"), ("\ufeff" + BASE).getBytes(StandardCharsets.UTF_16LE));
        CaseFileException e16 = assertThrows(CaseFileException.class, () -> CaseLoader.read(utf16, Map.of(), ENOUGH_MEMORY));
        assertTrue(e16.getMessage().startsWith(utf16 + ":1:1: the file is not UTF-8 text: byte 0xff at byte offset 0"), e16::getMessage);

        // a byte-order mark is UTF-8 too, and is dropped
        Path bom = Files.write(dir.resolve("bom.yaml"), ("\ufeff" + BASE.replace("WIDTH", "4 um")).getBytes(StandardCharsets.UTF_8));
        assertEquals(4e-6, CaseLoader.read(bom, Map.of(), ENOUGH_MEMORY).spec().domain().width().si(), 1e-18);
    }

    @Test
    void onlyRegularFilesWithinTheSizeLimitAreRead() throws Exception {
        assertRefused(dir, "is a folder, not a case file");
        Path devZero = Path.of("/dev/zero");
        if (Files.exists(devZero)) {
            assertRefused(devZero, "is not a regular file");
        }
        Path fifo = dir.resolve("pipe.yaml");
        if (mkfifo(fifo)) {
            // opening a pipe with no writer would block: it must be refused without being opened
            assertRefused(fifo, "is not a regular file");
        }
        // a sparse file of 1 TiB: reading it into memory would fail, so it must be refused from its size alone
        Path huge = dir.resolve("huge.yaml");
        try (RandomAccessFile f = new RandomAccessFile(huge.toFile(), "rw")) {
            f.setLength(1L << 40);
        }
        assertRefused(huge, "is 1099511627776 bytes, more than the limit of 8388608 bytes (8 MiB)");
        Path over = Files.write(dir.resolve("over.yaml"), new byte[CaseText.MAX_BYTES + 1]);
        assertRefused(over, "is 8388609 bytes, more than the limit");
        Path atLimit = dir.resolve("at-limit.yaml");
        byte[] text = BASE.replace("WIDTH", "4 um").getBytes(StandardCharsets.UTF_8);
        byte[] padded = new byte[CaseText.MAX_BYTES];
        java.util.Arrays.fill(padded, (byte) '\n');
        System.arraycopy(text, 0, padded, 0, text.length);
        Files.write(atLimit, padded);
        assertEquals(4e-6, onSmallStack(() -> CaseLoader.read(atLimit, Map.of(), ENOUGH_MEMORY)).spec().domain().width().si(), 1e-18);
        assertThrows(java.nio.file.NoSuchFileException.class, () -> CaseLoader.read(dir.resolve("missing.yaml"), Map.of(),
                ENOUGH_MEMORY));
    }

    private static void assertRefused(Path file, String expected) throws Exception {
        CaseFileException e = assertThrows(CaseFileException.class, () -> onSmallStack(() -> CaseLoader.read(file, Map.of(),
                ENOUGH_MEMORY)), file.toString());
        assertEquals(1, e.errors().size(), e::getMessage);
        assertEquals(file + ": ", e.getMessage().substring(0, file.toString().length() + 2), e::getMessage);
        assertTrue(e.getMessage().contains(expected), e::getMessage);
    }

    /** Makes a named pipe with the system's mkfifo; false where there is none. */
    private static boolean mkfifo(Path p) throws IOException, InterruptedException {
        try {
            Process pr = new ProcessBuilder("mkfifo", p.toString()).redirectErrorStream(true).start();
            return pr.waitFor(10, TimeUnit.SECONDS) && pr.exitValue() == 0 && Files.exists(p);
        } catch (IOException e) {
            return false;
        }
    }
}
