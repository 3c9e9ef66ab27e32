package org.evanesce.io.cli;

import org.evanesce.io.output.BuildInfo;
import picocli.CommandLine.IVersionProvider;

/** The program version and build (from the resources Maven writes, {@link BuildInfo}), and the JVM. */
public final class VersionProvider implements IVersionProvider {

    /** The program version, e.g. {@code 0.1.0-SNAPSHOT}; "unknown" when run from unfiltered sources. */
    public static String version() {
        return BuildInfo.current().version();
    }

    @Override
    public String[] getVersion() {
        BuildInfo b = BuildInfo.current();
        return new String[] {
            "evanesce " + b.version() + ", " + b.describe(),
            "Java " + System.getProperty("java.version") + " (" + System.getProperty("java.vm.name") + ", "
                    + System.getProperty("java.vendor") + "), " + System.getProperty("os.name") + " "
                    + System.getProperty("os.arch")
        };
    }
}
