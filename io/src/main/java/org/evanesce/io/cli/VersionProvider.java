package org.evanesce.io.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;
import picocli.CommandLine.IVersionProvider;

/** The program version, from {@code version.properties} (filled in by Maven from the pom), and the JVM. */
public final class VersionProvider implements IVersionProvider {

    private static final String RESOURCE = "/org/evanesce/io/version.properties";

    /** The program version, e.g. {@code 0.1.0-SNAPSHOT}; "unknown" when run from unfiltered sources. */
    public static String version() {
        try (InputStream in = VersionProvider.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                return "unknown";
            }
            Properties p = new Properties();
            p.load(in);
            String v = p.getProperty("version", "unknown");
            return v.startsWith("${") ? "unknown" : v;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + RESOURCE, e);
        }
    }

    @Override
    public String[] getVersion() {
        return new String[] {
            "evanesce " + version(),
            "Java " + System.getProperty("java.version") + " (" + System.getProperty("java.vm.name") + ", "
                    + System.getProperty("java.vendor") + "), " + System.getProperty("os.name") + " "
                    + System.getProperty("os.arch")
        };
    }
}
