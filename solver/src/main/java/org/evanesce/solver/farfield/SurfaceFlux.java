package org.evanesce.solver.farfield;

import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.grid.Polarization;

/**
 * The time-averaged Poynting flux out of a contour from complex field amplitudes sampled at the same points
 * (time dependence exp(−iωt); U = Ez or η0·Hz, V_t = η0·H_t or E_t along t̂ = ẑ × n̂, in V/m):
 * S·n̂ = ½ Re(E × H*)·n̂ = −Re(U V_t*)/(2η0) for s and +Re(V_t U*)/(2η0) for p (Born &amp; Wolf, <i>Principles of
 * Optics</i>, sec. 1.1; common practice), summed with the points' weights. On a horizontal line with n̂ = +y this
 * is {@code FluxLine}'s ½ Re(Ez Hx*) for s and −½ Re(Ex Hz*) for p.
 */
public final class SurfaceFlux {

    private SurfaceFlux() {
    }

    /**
     * Σ_j w_j S·n̂_j, W/m: the net power per unit length leaving through the contour (or the open line, for a
     * line's points with their normals).
     *
     * @param field      U at the points
     * @param tangential V_t at the same points (the same {@link ContourPoints})
     * @throws IllegalArgumentException if the two sample sets are not at the same points
     */
    public static double outwardPower(Polarization polarization, SurfaceSamples field, SurfaceSamples tangential) {
        if (polarization == null || field == null || tangential == null) {
            throw new IllegalArgumentException("surface flux: polarization and both sample sets are required");
        }
        ContourPoints a = field.points();
        ContourPoints b = tangential.points();
        double[] ax = a.x();
        double[] ay = a.y();
        double[] bx = b.x();
        double[] by = b.y();
        if (ax.length != bx.length) {
            throw new IllegalArgumentException(String.format(
                    "surface flux: U has %d points and V_t %d; the flux needs both at the same points", ax.length,
                    bx.length));
        }
        double[] an = a.normalX();
        double[] bn = b.normalX();
        double[] am = a.normalY();
        double[] bm = b.normalY();
        for (int j = 0; j < ax.length; j++) {
            double scale = Math.max(1e-300, Math.hypot(ax[j], ay[j]));
            if (Math.hypot(ax[j] - bx[j], ay[j] - by[j]) > 1e-12 * scale || an[j] != bn[j] || am[j] != bm[j]) {
                throw new IllegalArgumentException(String.format(
                        "surface flux: point %d of U at (%g, %g) m and of V_t at (%g, %g) m differ in place or normal; "
                                + "interpolate both to the same points first", j, ax[j], ay[j], bx[j], by[j]));
            }
        }
        double[] w = a.weight();
        double[] ur = field.re();
        double[] ui = field.im();
        double[] vr = tangential.re();
        double[] vi = tangential.im();
        double sign = polarization == Polarization.S ? -1 : 1;
        double s = 0;
        for (int j = 0; j < w.length; j++) {
            s += w[j] * (ur[j] * vr[j] + ui[j] * vi[j]); // Re(U V*) = Re(V U*)
        }
        return sign * s / (2 * PhysicalConstants.ETA0);
    }
}
