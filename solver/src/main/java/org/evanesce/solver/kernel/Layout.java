package org.evanesce.solver.kernel;

import java.util.Map;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.boundary.PmlProfile;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;

/**
 * The lengths of the arrays one real engine allocates, decided here once for the engines'
 * constructors and for {@link Engine#footprint}.
 * <ul>
 * <li>Field and coefficient arrays: nx·ny values padded to {@link Engine#staggeredLength}; three fields,
 * one cb per electric component, one ca per electric component of a site with conductivity.</li>
 * <li>x-side CPML strips: widened to a whole number of vectors ({@link #xStripWidth}); ψ of
 * {@link #xPsiLength} values for each of the two corrected components.</li>
 * <li>y-side CPML strips: ψ of nx·layers values for each of the two components.</li>
 * <li>Every strip: six coefficient arrays of width + 1 values (see {@link PmlProfile}).</li>
 * </ul>
 *
 * @param valueBytes bytes of one value (4 or 8)
 * @param lanes      values per vector of the kernels in this precision
 */
record Layout(int nx, int ny, Polarization pol, int valueBytes, int lanes) {

    /** Length of every field and coefficient array. */
    int length() {
        return Engine.staggeredLength(nx * ny, valueBytes);
    }

    /** The polarization's electric components, in {@link Polarization#components()} order. */
    Component[] electric() {
        return java.util.Arrays.stream(pol.components()).filter(c -> c.electric).toArray(Component[]::new);
    }

    /** The polarization's magnetic components, in {@link Polarization#components()} order. */
    Component[] magnetic() {
        return java.util.Arrays.stream(pol.components()).filter(c -> !c.electric).toArray(Component[]::new);
    }

    /** Width of an x-side strip of {@code layers} cells: whole vectors where that fits inside the walls. */
    int xStripWidth(int layers) {
        return PmlProfile.paddedWidth(layers, (layers + lanes - 1) / lanes * lanes, nx);
    }

    /**
     * ψ values of an x-side strip of that width, per component: one per cell of every row, and
     * in s polarization one spare: a padded left strip's electric range [1, width] ends one past
     * its row's ψ (in the next row's local 0, which no electric update uses), also in the last
     * row. In p the electric x strip (Ey) stops at row ny − 2, so no spare is needed.
     */
    int xPsiLength(int width) {
        return ny * width + (pol == Polarization.S ? 1 : 0);
    }

    /** ψ values of a y-side strip of {@code layers} rows, per component. */
    int yPsiLength(int layers) {
        return nx * layers;
    }

    /** Values per row an engine keeps over a flat pass (edge columns; see {@link FloatFlat}). */
    static final int KEPT_PER_ROW = 3;

    /**
     * Bytes of one engine's arrays spanning the grid (three fields, cb, and ca when lossy), with the Bloch
     * seam values and the values kept over a flat pass.
     */
    long gridBytes(boolean lossy, boolean blochX) {
        long values = (long) length() * (3 + electric().length * (lossy ? 2 : 1)) + (long) KEPT_PER_ROW * ny;
        // Engine.ghostE and ghostW: ny doubles each
        return values * valueBytes + (blochX ? 2L * ny * Double.BYTES : 0);
    }

    /**
     * Bytes of one engine's CPML strips: six coefficient arrays of width + 1 values and two ψ arrays each;
     * with Bloch-periodic x sides on a grid narrow enough for flat runs ({@link Engine#FLAT_BELOW}), six
     * more per cell of a y strip (its coefficients per cell, {@link FloatStrip#perCell}).
     */
    long stripBytes(Map<Side, Boundary> sides) {
        boolean perCell = sides.get(Side.LEFT) instanceof Boundary.Bloch && nx >= 2 && nx < Engine.FLAT_BELOW;
        long v = 0;
        for (Side side : Side.values()) {
            if (sides.get(side) instanceof Boundary.Pml p) {
                int layers = p.parameters().layers();
                boolean x = side == Side.LEFT || side == Side.RIGHT;
                int w = x ? xStripWidth(layers) : layers;
                v += 6L * (w + 1) + 2L * (x ? xPsiLength(w) : yPsiLength(layers));
                if (!x && perCell) {
                    v += 6L * yPsiLength(layers);
                }
            }
        }
        return v * valueBytes;
    }

    /** Bytes of the coefficients in double that exist while an engine is built: ca and cb of nx·ny cells per electric site. */
    long scratchBytes() {
        return electric().length * 2L * Double.BYTES * nx * ny;
    }

    /** The layout of one real engine of that precision on this JVM. */
    static Layout of(int nx, int ny, Polarization pol, Precision precision) {
        int lanes = precision == Precision.FLOAT ? FloatKernels.SP.length() : DoubleKernels.SP.length();
        return new Layout(nx, ny, pol, precision.bytes, lanes);
    }

    /** Bytes per cell of the arrays spanning the whole grid (both parts with Bloch-periodic sides). */
    int bytesPerCell(boolean lossy, boolean blochX) {
        int perPart = (3 + electric().length * (lossy ? 2 : 1)) * valueBytes;
        return blochX ? 2 * perPart : perPart;
    }
}
