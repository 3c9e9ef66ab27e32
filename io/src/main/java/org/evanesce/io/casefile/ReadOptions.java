package org.evanesce.io.casefile;

/**
 * Settings for reading a case that do not come from the file.
 *
 * @param memoryLimit bytes the run may use for its grid; a case whose estimate exceeds it is refused
 */
public record ReadOptions(long memoryLimit) {

    /** The JVM's maximum heap as the memory limit. */
    public static ReadOptions defaults() {
        return new ReadOptions(Runtime.getRuntime().maxMemory());
    }
}
