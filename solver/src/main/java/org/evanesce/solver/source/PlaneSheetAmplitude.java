package org.evanesce.solver.source;

import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;

/**
 * The amplitude of the plane wave that a current sheet across a whole row (phase e^{i kx x}, as
 * {@link Source#blochRow} makes it) launches on the grid into a lossless medium, per unit of the sheet's
 * current: what the sheet's row gives every row of an unbounded grid of that medium, each way.
 *
 * <p>The grid's own answer, not the continuous one. As {@link SheetResponse} derives it (the leapfrog update in
 * the frequency domain, the shift property of the z-transform; Oppenheim &amp; Schafer, Discrete-Time Signal
 * Processing, 3rd ed. 2010, sec. 3.4), one wavenumber κ = kxΔ gives the recurrence
 * −(U_{j+1} + U_{j−1}) + 2cos q·U_j = R_j with cos q = 1 + 2 sin²(κ/2) − 2ε sin²(ωΔt/2)/S² (the 2D Yee dispersion
 * relation, Taflove &amp; Hagness, Computational Electrodynamics, 3rd ed. 2005, eq. 4.20), whose outgoing solution
 * i e^{iq|j − j0|}/(2 sin q)·R_{j0} has the same size on every row. With σ = sin(ωΔt/2) a sheet of Ez (s) gives
 * |Ez| = σ/(S sin q)·|J|; a sheet of η0Hz (p) gives |η0Hz| = σ/(c_b sin q)·|M|, and from its update
 * |Ex| = sin(q/2)/sin q·|M| and |Ey| = sin(κ/2)/sin q·|M| at their sites; averaged onto the nodes (the mean of the
 * two sites either side, as the maps are written) these take the factors cos(κ/2) and cos(q/2). As the cells
 * shrink the ratios tend to the continuous sheet's 1/(2n cos θ) (s) and 1/(2 cos θ) (p), n the medium's index
 * and θ the angle from the sheet's normal (the jump of the tangential field across a current sheet, common
 * practice).
 */
public final class PlaneSheetAmplitude {

    private PlaneSheetAmplitude() {
    }

    /**
     * |E| on the nodes of the launched wave per unit |current| of the sheet's transform at ω: s, |Ez|/|J|; p,
     * √(|Ex|² + |Ey|²)/|M| with Ex and Ey averaged onto the nodes.
     *
     * @param courant     the Courant number S = c0Δt/Δ
     * @param gridEpsilon the medium's relative permittivity as the grid holds it
     * @param kxDelta     κ = kxΔ, the sheet's phase step from one column to the next, rad
     * @param omegaDt     ωΔt, rad
     * @throws IllegalArgumentException when the wave does not propagate on the grid at ω (cos q outside (−1, 1)):
     *                                  an evanescent or a beyond-Nyquist frequency
     */
    public static double electricPerCurrent(Polarization pol, Precision precision, double courant, double gridEpsilon,
                                            double kxDelta, double omegaDt) {
        double s = precision == Precision.FLOAT ? (float) courant : courant;
        double cb = precision == Precision.FLOAT ? (float) (courant / gridEpsilon) : courant / gridEpsilon;
        double sigma = Math.sin(omegaDt / 2);
        double sk = Math.sin(kxDelta / 2);
        double c = 1 + 2 * sk * sk - 2 * sigma * sigma / (s * cb);
        if (!(c > -1 && c < 1)) {
            throw new IllegalArgumentException(String.format("plane sheet: cos q = %g at kxΔ = %g, ωΔt = %g, ε %g, Courant "
                    + "number %g: the wave does not propagate on the grid", c, kxDelta, omegaDt, gridEpsilon, courant));
        }
        double q = Math.acos(c);
        double sq = Math.sin(q);
        if (pol == Polarization.S) {
            return Math.abs(sigma) / (s * sq);
        }
        double ex = Math.sin(q / 2) * Math.cos(kxDelta / 2);
        double ey = sk * Math.cos(q / 2);
        return Math.sqrt(ex * ex + ey * ey) / sq;
    }
}
