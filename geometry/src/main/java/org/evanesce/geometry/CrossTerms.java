package org.evanesce.geometry;

import java.util.Arrays;

/**
 * The off-diagonal element of the smoothed inverse permittivity at the in-plane electric sites (Ex, Ey) of pixels
 * that a tilted or curved interface cuts: (ε⁻¹)_xy = T_xy (⟨1/ε⟩ − 1/⟨ε⟩), T the pixel's orientation tensor
 * ({@link org.evanesce.geometry.shape.PixelCut}; n_x n_y for a straight interface of normal n). With it the in-plane
 * field obeys E = ε⁻¹ D with the whole tensor of anisotropic smoothing (A. Farjadpour et al., "Improving accuracy by
 * subpixel smoothing in the finite-difference time domain", Opt. Lett. 31, 2972 (2006), eq. 1); the diagonal alone
 * leaves a first-order error for a field across a curved face. Zero, and not listed, where the interface is parallel
 * to a grid axis, at Ez sites (always tangential in 2D), and in pixels with a lossy or rule-resolved material.
 *
 * <p>Cells are flat indices {@code j*nx + i}, ascending, at least two cells inside the grid's edges (a site nearer
 * keeps the diagonal only), so that the four neighbouring sites of the other component the solver averages exist.
 * Immutable.
 */
public final class CrossTerms {

    /** None: a grid without tilted or curved faces, or not smoothed. */
    public static final CrossTerms NONE = new CrossTerms(new int[0], new double[0], new int[0], new double[0]);

    private final int[] exCells;
    private final double[] exValues;
    private final int[] eyCells;
    private final double[] eyValues;

    /**
     * @param exCells  Ex sites with a cross term, ascending (not kept: copied)
     * @param exValues (ε⁻¹)_xy at each, relative units
     * @param eyCells  Ey sites, ascending
     * @param eyValues (ε⁻¹)_xy at each
     */
    public CrossTerms(int[] exCells, double[] exValues, int[] eyCells, double[] eyValues) {
        if (exCells.length != exValues.length || eyCells.length != eyValues.length) {
            throw new IllegalArgumentException(String.format("cross terms: %d Ex cells with %d values, %d Ey cells with "
                    + "%d values", exCells.length, exValues.length, eyCells.length, eyValues.length));
        }
        this.exCells = exCells.clone();
        this.exValues = exValues.clone();
        this.eyCells = eyCells.clone();
        this.eyValues = eyValues.clone();
    }

    /** Whether there are none. */
    public boolean isEmpty() {
        return exCells.length == 0 && eyCells.length == 0;
    }

    /** The cells of a site (Ex or Ey) that carry a cross term, ascending; a copy. */
    public int[] cells(FieldSite site) {
        return (site == FieldSite.EX ? exCells : site == FieldSite.EY ? eyCells : new int[0]).clone();
    }

    /** (ε⁻¹)_xy at those cells, in the same order; a copy. */
    public double[] values(FieldSite site) {
        return (site == FieldSite.EX ? exValues : site == FieldSite.EY ? eyValues : new double[0]).clone();
    }

    /** (ε⁻¹)_xy at one site, 0 where none is listed. */
    public double at(FieldSite site, int i, int j, int nx) {
        int[] c = site == FieldSite.EX ? exCells : site == FieldSite.EY ? eyCells : null;
        if (c == null) {
            return 0;
        }
        int q = Arrays.binarySearch(c, j * nx + i);
        return q >= 0 ? (site == FieldSite.EX ? exValues : eyValues)[q] : 0;
    }
}
