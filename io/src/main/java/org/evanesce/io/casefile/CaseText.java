package org.evanesce.io.casefile;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.List;
import java.util.Locale;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.text.SourcePosition;

/**
 * A case file's bytes and text, read safely: only a regular file (not a folder, a device such as
 * {@code /dev/zero}, a pipe or a socket), at most {@value #MAX_BYTES} bytes (checked before reading
 * and again while reading, so a file that grows is still bounded), and valid UTF-8, refused with the
 * line, column and byte offset of the first byte that is not.
 *
 * @param bytes the file's bytes, for hashes
 * @param text  the text (a leading byte-order mark removed)
 */
public record CaseText(byte[] bytes, String text) {

    /** The largest case file read: 8 MiB, room for about 50 000 shapes written one per line. */
    public static final int MAX_BYTES = 8 << 20;

    /**
     * Reads {@code file}.
     *
     * @throws IOException       when the file cannot be opened or read (missing, no permission)
     * @throws CaseFileException when it is not a regular file, too large, or not UTF-8
     */
    public static CaseText read(Path file) throws IOException, CaseFileException {
        String name = file.toString();
        BasicFileAttributes a = Files.readAttributes(file, BasicFileAttributes.class);
        if (a.isDirectory()) {
            throw refused(name, "is a folder, not a case file; give the path of a .yaml file");
        }
        if (!a.isRegularFile()) {
            throw refused(name, "is not a regular file (a device, a pipe or a socket); give the path of a .yaml file");
        }
        if (a.size() > MAX_BYTES) {
            throw refused(name, tooLarge(Long.toString(a.size())));
        }
        byte[] bytes;
        try (InputStream in = Files.newInputStream(file)) {
            bytes = in.readNBytes(MAX_BYTES + 1);
        }
        if (bytes.length > MAX_BYTES) {
            throw refused(name, tooLarge("over " + MAX_BYTES));
        }
        return new CaseText(bytes, decode(bytes, name));
    }

    private static String tooLarge(String size) {
        return String.format(Locale.ROOT, "is %s bytes, more than the limit of %d bytes (%d MiB) for a case file; a case "
                + "file describes a scene in a few kilobytes", size, MAX_BYTES, MAX_BYTES >> 20);
    }

    private static CaseFileException refused(String name, String message) {
        return new CaseFileException(List.of(new Diagnostic(Diagnostic.Severity.ERROR, new SourcePosition(name, 0, 0), "",
                message)));
    }

    /**
     * The text of UTF-8 bytes; a leading byte-order mark is dropped.
     *
     * @param source the name messages give the text
     * @throws CaseFileException naming the line, column and byte offset of the first byte that is not UTF-8
     */
    public static String decode(byte[] bytes, String source) throws CaseFileException {
        CharsetDecoder d = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes);
        CharBuffer out = CharBuffer.allocate(bytes.length);
        CoderResult r = d.decode(in, out, true);
        if (r.isError()) {
            int offset = in.position();
            int line = 1;
            int lineStart = 0;
            for (int k = 0; k < offset; k++) {
                if (bytes[k] == '\n') {
                    line++;
                    lineStart = k + 1;
                }
            }
            int column = new String(bytes, lineStart, offset - lineStart, StandardCharsets.UTF_8).length() + 1;
            StringBuilder shown = new StringBuilder();
            for (int k = offset; k < Math.min(bytes.length, offset + r.length()); k++) {
                shown.append(shown.length() == 0 ? "" : " ").append(String.format("0x%02x", bytes[k] & 0xff));
            }
            throw new CaseFileException(List.of(new Diagnostic(Diagnostic.Severity.ERROR, new SourcePosition(source, line, column),
                    "", String.format(Locale.ROOT, "the file is not UTF-8 text: byte%s %s at byte offset %d %s not valid "
                            + "UTF-8; save the file as UTF-8", r.length() == 1 ? "" : "s", shown, offset,
                            r.length() == 1 ? "is" : "are"))));
        }
        d.flush(out);
        out.flip();
        String text = out.toString();
        return text.startsWith("\ufeff") ? text.substring(1) : text;
    }
}
