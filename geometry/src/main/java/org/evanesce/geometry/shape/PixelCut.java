package org.evanesce.geometry.shape;

/**
 * What a shape occupies of one square pixel, as subpixel smoothing needs it.
 *
 * <p>The interface is described by its boundary inside the pixel, Γ = ∂S ∩ P, of length
 * L = ∫_Γ ds, through two averages over it of the shape's outward unit normal n:
 * <ul>
 *   <li>the mean normal (normalX, normalY) = ∫_Γ n ds / |∫_Γ n ds|, a unit vector pointing out of
 *       the shape (zero when the boundary pieces cancel, e.g. a thin strip crossing the pixel);</li>
 *   <li>the orientation tensor T = ∫_Γ n nᵀ ds / L (symmetric, trace 1). For a straight interface
 *       T = n nᵀ, so {@link #alignment} gives (u·n)²; for a corner or a strip thinner than the
 *       pixel it weighs each piece of boundary by its length and does not depend on the sign of n.</li>
 * </ul>
 * Both are zero (and L = 0) when no boundary crosses the pixel's interior.
 *
 * @param fraction       the filled fraction f of the pixel's area, in [0, 1]
 * @param boundaryLength L in metres
 * @param normalX        x component of the mean outward normal (unit, or 0)
 * @param normalY        y component of the mean outward normal (unit, or 0)
 * @param txx            T_xx
 * @param txy            T_xy
 * @param tyy            T_yy
 */
public record PixelCut(double fraction, double boundaryLength, double normalX, double normalY,
                       double txx, double txy, double tyy) {

    /** A pixel entirely outside. */
    public static final PixelCut EMPTY = new PixelCut(0, 0, 0, 0, 0, 0, 0);
    /** A pixel entirely inside. */
    public static final PixelCut FULL = new PixelCut(1, 0, 0, 0, 0, 0, 0);

    /**
     * uᵀ T u for the unit vector u = (ux, uy): (u·n)² for a straight interface, the fraction of
     * the boundary's "normal weight" along u in general; 0 when there is no boundary.
     */
    public double alignment(double ux, double uy) {
        return ux * ux * txx + 2 * ux * uy * txy + uy * uy * tyy;
    }

    /**
     * Builds a cut from the boundary integrals: {@code nSum} = ∫ n ds (2 values) and
     * {@code nnSum} = ∫ n nᵀ ds (xx, xy, yy), both in metres.
     */
    static PixelCut of(double fraction, double length, double nx, double ny, double nnxx, double nnxy, double nnyy) {
        double f = Math.min(1.0, Math.max(0.0, fraction));
        if (!(length > 0)) {
            return new PixelCut(f, 0, 0, 0, 0, 0, 0);
        }
        double nn = Math.hypot(nx, ny);
        // pieces that cancel to within rounding leave no meaningful mean direction
        double ux = nn > 1e-9 * length ? nx / nn : 0;
        double uy = nn > 1e-9 * length ? ny / nn : 0;
        double tr = nnxx + nnyy;
        return new PixelCut(f, length, ux, uy, nnxx / tr, nnxy / tr, nnyy / tr);
    }
}
