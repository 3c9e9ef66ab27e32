package org.evanesce.io.sweep;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.Map;
import java.util.TreeMap;

/**
 * The identity of a point's result: the SHA-256 of the case file's text, the point's overrides
 * (the swept values and any {@code --set}, sorted by name), the program version and its build id
 * ({@link org.evanesce.io.output.BuildInfo}). Two runs with the same hash compute the same numbers
 * (results do not depend on the thread count), so a finished point folder whose {@code point.json}
 * holds the hash expected now is kept when a sweep resumes; a rebuilt program (another commit, or
 * uncommitted changes) runs the points again.
 *
 * <p>The bytes hashed are, in UTF-8 apart from the case file's own bytes:
 * <pre>
 * evanesce sweep point
 * case BYTES
 * &lt;the case file's bytes&gt;
 * set NAME=VALUE        (one line per override, sorted by name)
 * version VERSION
 * build BUILD_ID
 * </pre>
 */
public final class PointHash {

    private PointHash() {
    }

    /** The point hash as 64 lower-case hex digits. */
    public static String of(byte[] caseText, Map<String, String> overrides, String version, String buildId) {
        MessageDigest md = sha256();
        md.update(("evanesce sweep point\ncase " + caseText.length + "\n").getBytes(StandardCharsets.UTF_8));
        md.update(caseText);
        StringBuilder sb = new StringBuilder("\n");
        new TreeMap<>(overrides).forEach((k, v) -> sb.append("set ").append(k).append('=').append(v).append('\n'));
        sb.append("version ").append(version).append('\n');
        sb.append("build ").append(buildId).append('\n');
        md.update(sb.toString().getBytes(StandardCharsets.UTF_8));
        return HexFormat.of().formatHex(md.digest());
    }

    /** The SHA-256 of some bytes as 64 lower-case hex digits. */
    public static String sha256(byte[] bytes) {
        return HexFormat.of().formatHex(sha256().digest(bytes));
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java runtime", e);
        }
    }
}
