package org.evanesce.io.casefile;

/**
 * Settings for reading a case that do not come from the file.
 *
 * @param memoryLimit     bytes the run may use for its grid; a case whose estimate exceeds it is refused
 * @param resolutionScale the case's resolution multiplied by this: the cell size divided by it, or the cells per
 *                        wavelength multiplied by it (an accuracy study's finer levels); 1 reads the case as written
 * @param gridOffset      the grid's nodes moved by this fraction of a cell along x and y, in [0, 1); 0 as written
 */
public record ReadOptions(long memoryLimit, double resolutionScale, double gridOffset) {

    public ReadOptions {
        if (!(resolutionScale > 0) || Double.isInfinite(resolutionScale)) {
            throw new IllegalArgumentException("resolution scale " + resolutionScale + " must be positive and finite");
        }
        if (!(gridOffset >= 0 && gridOffset < 1)) {
            throw new IllegalArgumentException("grid offset " + gridOffset + " must lie in [0, 1) cells");
        }
    }

    /** The case as written, with {@code memoryLimit}. */
    public ReadOptions(long memoryLimit) {
        this(memoryLimit, 1, 0);
    }

    /** The JVM's maximum heap as the memory limit. */
    public static ReadOptions defaults() {
        return new ReadOptions(Runtime.getRuntime().maxMemory());
    }

    /** The same with the resolution multiplied by {@code scale}. */
    public ReadOptions withResolutionScale(double scale) {
        return new ReadOptions(memoryLimit, scale, gridOffset);
    }

    /** The same with the grid's nodes moved by {@code offset} of a cell along x and y. */
    public ReadOptions withGridOffset(double offset) {
        return new ReadOptions(memoryLimit, resolutionScale, offset);
    }
}
