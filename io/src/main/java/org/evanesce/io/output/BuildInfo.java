package org.evanesce.io.output;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Properties;

/**
 * Which build of the program is running: the version from the pom and what the build wrote into
 * {@code build.properties} (io/pom.xml, maven-antrun-plugin at generate-resources): the git commit,
 * whether the working tree had uncommitted changes, the build time (UTC) and the build id.
 *
 * <p>The build id is the commit for a build of a clean tree, so rebuilding the same commit keeps the
 * id; {@code COMMIT+modified@TIME} for a tree with uncommitted changes and {@code unknown@TIME} where
 * git was not available, so that every such rebuild counts as a different program. Sweep point hashes
 * and checkpoint identities carry it: a rebuilt program never silently reuses old points or checkpoints.
 *
 * @param version  the program version, e.g. {@code 0.1.0-SNAPSHOT}
 * @param commit   the git commit id (40 hex digits), or {@code unknown}
 * @param modified {@code true} when the tree had uncommitted changes, {@code false}, or {@code unknown}
 * @param time     the build time, ISO 8601 in UTC, or {@code unknown}
 * @param id       the build id (above)
 */
public record BuildInfo(String version, String commit, String modified, String time, String id) {

    private static final String VERSION_RESOURCE = "/org/evanesce/io/version.properties";
    private static final String BUILD_RESOURCE = "/org/evanesce/io/build.properties";
    private static final String UNKNOWN = "unknown";

    /** This program's build, read from the resources on the class path ({@code unknown} where they are missing). */
    public static BuildInfo current() {
        Properties v = load(VERSION_RESOURCE);
        Properties b = load(BUILD_RESOURCE);
        return new BuildInfo(value(v, "version"), value(b, "commit"), value(b, "modified"), value(b, "time"),
                value(b, "id"));
    }

    /** For run.json: {@code commit}, {@code modified}, {@code time}, {@code id}. */
    public Map<String, Object> record() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("commit", commit);
        m.put("modified", modified);
        m.put("time", time);
        m.put("id", id);
        return m;
    }

    /** One line for people: {@code build ab7e637d01c6 (2026-01-01T10:00:00Z)}, with the uncommitted changes noted. */
    public String describe() {
        String c = commit.length() > 12 ? commit.substring(0, 12) : commit;
        return "build " + c + ("true".equals(modified) ? " with uncommitted changes" : "") + " (" + time + ")";
    }

    private static Properties load(String resource) {
        Properties p = new Properties();
        try (InputStream in = BuildInfo.class.getResourceAsStream(resource)) {
            if (in != null) {
                p.load(in);
            }
            return p;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + resource, e);
        }
    }

    /** A value, or unknown where it is missing, empty or left unfiltered ({@code ${...}}). */
    private static String value(Properties p, String key) {
        String v = p.getProperty(key, "").strip();
        return v.isEmpty() || v.startsWith("${") ? UNKNOWN : v;
    }
}
