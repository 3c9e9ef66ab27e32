package org.evanesce.io.casefile.model;

import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.Value;

/**
 * The rectangle that is simulated, PML layers included, centred on the origin: x from −width/2
 * to width/2, y from −height/2 to height/2.
 *
 * @param width      extent along x, metres
 * @param height     extent along y, metres
 * @param background the material everywhere no shape covers
 */
public record DomainSpec(Value width, Value height, Located<String> background) {

    public double xMin() {
        return -width.si() / 2;
    }

    public double xMax() {
        return width.si() / 2;
    }

    public double yMin() {
        return -height.si() / 2;
    }

    public double yMax() {
        return height.si() / 2;
    }

    /** True when (x, y), in metres, lies in the domain or on its edge. */
    public boolean contains(double x, double y) {
        double tol = 1e-9 * Math.max(width.si(), height.si());
        return x >= xMin() - tol && x <= xMax() + tol && y >= yMin() - tol && y <= yMax() + tol;
    }
}
