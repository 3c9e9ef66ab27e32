package org.evanesce.io.casefile;

/**
 * Settings for reading a case that do not come from the file.
 *
 * @param memoryLimit     bytes the run may use for its grid; a case whose estimate exceeds it is refused
 * @param resolutionScale the case's resolution multiplied by this: the cell size divided by it, or the cells per
 *                        wavelength multiplied by it (an accuracy study's finer levels); 1 reads the case as written
 */
public record ReadOptions(long memoryLimit, double resolutionScale) {

    public ReadOptions {
        if (!(resolutionScale > 0) || Double.isInfinite(resolutionScale)) {
            throw new IllegalArgumentException("resolution scale " + resolutionScale + " must be positive and finite");
        }
    }

    /** The case as written, with {@code memoryLimit}. */
    public ReadOptions(long memoryLimit) {
        this(memoryLimit, 1);
    }

    /** The JVM's maximum heap as the memory limit. */
    public static ReadOptions defaults() {
        return new ReadOptions(Runtime.getRuntime().maxMemory());
    }

    /** The same with the resolution multiplied by {@code scale}. */
    public ReadOptions withResolutionScale(double scale) {
        return new ReadOptions(memoryLimit, scale);
    }
}
