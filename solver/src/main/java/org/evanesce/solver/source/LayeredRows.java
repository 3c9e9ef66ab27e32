package org.evanesce.solver.source;

import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;

/**
 * The grid's own plane-wave solution in a background layered along y (one frequency): the incident wave,
 * what the layers reflect and transmit, and the evanescent field beyond the critical angle, as the
 * discrete scheme itself has them. This is the transfer-matrix solution of a stack (M. Born &amp; E. Wolf,
 * <i>Principles of Optics</i>, 7th ed., 1999, §1.6) written for the Yee grid row by row: with the in-plane
 * wavenumber k̃x fixed (the grid conserves it exactly at interfaces parallel to x), the update equations
 * of each row reduce to a three-term recurrence in the rows, so the solution holds for the grid's own
 * per-row permittivities (subpixel-smoothed interface rows included) with no continuum approximation.
 *
 * <p>With e^{i(k̃x x − ωt)}, W = sin(ωΔt/2), S the Courant number, sx = sin(k̃xΔ/2) and u_j the z component
 * of row j (s: Ez at y_j; p: η0Hz at y_j + Δ/2), the kernels' updates give
 * <pre>  c_{j+1} u_{j+1} − b_j u_j + c_j u_{j−1} = 0,  </pre>
 * s: c_j = 1, b_j = 2 + 4sx² − 4ε_j W²/S² (ε_j at the Ez sites of row j);
 * p: c_j = S/εx_j (Ex sites of row j), b_j = c_{j+1} + c_j + 4sx² S/εy_j − 4W²/S (Ey sites at y_j + Δ/2);
 * and the in-plane components: s: η0Hx_j = S(u_{j+1} − u_j)/(2iW), η0Hy_j = −S·sx·u_j/W; p:
 * Ex_j = i c_j (u_j − u_{j−1})/(2W), Ey_j = (S/εy_j)·sx·u_j/W, each at its own site's x.
 * In a homogeneous run of rows u_j = ρ^j with ρ + 1/ρ = b/c: ρ = e^{±ik̃yΔ} for a travelling wave
 * (|b/c| &lt; 2) and a real ρ for an evanescent one.
 *
 * <p>The solution is found from the side the light leaves: there it is one outgoing (or decaying) wave,
 * and the recurrence carries it back through the layers to the incidence side, where it splits into an
 * incident and a reflected wave; dividing by the incident wave's amplitude at the reference point gives
 * a solution whose incident z component is e^{ik̃·(r − r_ref)}. Carried this way the recurrence grows
 * the wanted solution through evanescent rows, the stable direction; values are rescaled as they grow.
 */
final class LayeredRows {

    final Polarization polarization;
    final double courant;
    final double w;
    final double kx;
    final double sx;
    final double dx;
    final double x0;
    final double xRef;
    /** Per row: s: ε at Ez; p: ε at Ex. */
    final double[] epsFirst;
    /** Per row (p only): ε at Ey. */
    final double[] epsSecond;
    /**
     * The reflected wave's z amplitude over the incident one's at the same row of the incidence medium (its
     * modulus is |r| of the layers as the grid has them).
     */
    Complex reflection = Complex.ZERO;
    /** u_j, normalised. */
    final double[] re;
    final double[] im;

    /**
     * @param epsFirst  per row, s: the grid's ε at the Ez sites; p: at the Ex sites (lossless)
     * @param epsSecond per row, p: the grid's ε at the Ey sites; null for s
     * @param direction φ of the incident wave (radians from +x) in its medium: the bottom rows' medium when
     *                  sin φ &gt; 0, the top rows' when sin φ &lt; 0
     * @param y0        y of node row 0, m
     */
    LayeredRows(Polarization pol, double[] epsFirst, double[] epsSecond, double direction, double omega, double dx,
                double courant, double x0, double y0, double xRef, double yRef) {
        this.polarization = pol;
        this.courant = courant;
        this.dx = dx;
        this.x0 = x0;
        this.xRef = xRef;
        this.epsFirst = epsFirst.clone();
        this.epsSecond = pol == Polarization.P ? epsSecond.clone() : null;
        int ny = epsFirst.length;
        double dt = courant * dx / org.evanesce.geometry.PhysicalConstants.C0;
        w = Math.sin(omega * dt / 2);
        boolean up = Math.sin(direction) > 0;
        if (Math.sin(direction) == 0) {
            throw new IllegalArgumentException("a layered background needs light that crosses the layers: the wave's "
                    + "heading must not be parallel to them (0 or 180 deg)");
        }
        int top = ny - 2;
        int firstDiff = -1;
        int lastDiff = -1;
        for (int j = 0; j <= top; j++) {
            if (differs(j, 0) && firstDiff < 0) {
                firstDiff = j;
            }
            if (differs(j, top)) {
                lastDiff = j;
            }
        }
        int jb = firstDiff - 2;
        int jt = lastDiff + 2;
        if (firstDiff < 0 || jb < 1 || jt > top - 1) {
            throw new IllegalArgumentException(String.format("a layered background needs at least three rows of the same "
                    + "medium at the bottom and the top of the grid; its first change is at row %d and its last at row %d "
                    + "of %d", firstDiff, lastDiff, ny));
        }
        double epsIncident = up ? epsFirst[0] : epsFirst[top];
        double k = GridWave.wavenumber(epsIncident, direction, omega, dx, courant);
        if (Double.isNaN(k)) {
            throw new IllegalArgumentException(String.format("the grid (cell %g m) carries no wave of ω = %g rad/s in its "
                    + "incidence medium (ε = %g); refine the grid", dx, omega, epsIncident));
        }
        kx = k * Math.cos(direction);
        sx = Math.sin(kx * dx / 2);
        re = new double[ny];
        im = new double[ny];
        Complex rhoBottom = upwardRoot(jb);
        Complex rhoTop = upwardRoot(jt);
        if (up) {
            // outgoing at the top: u_j = ρ_t^{j − jt} for j ≥ jt, then down to row 0
            for (int j = jt; j < ny; j++) {
                set(j, power(rhoTop, j - jt));
            }
            for (int j = jt; j >= 1; j--) {
                Complex v = get(j).times(b(j)).minus(get(j + 1).times(c(j + 1))).divide(c(j));
                set(j - 1, v);
                rescale(j - 1, ny, v.abs());
            }
            normalise(rhoBottom, jb, y0, yRef);
        } else {
            Complex down = rhoBottom.reciprocal();
            for (int j = 0; j <= jb; j++) {
                set(j, power(down, j - jb));
            }
            for (int j = jb; j <= ny - 2; j++) {
                Complex v = get(j).times(b(j)).minus(get(j - 1).times(c(j))).divide(c(j + 1));
                set(j + 1, v);
                rescale(0, j + 2, v.abs());
            }
            normalise(rhoTop.reciprocal(), jt, y0, yRef);
        }
    }

    private boolean differs(int j, int ref) {
        return epsFirst[j] != epsFirst[ref] || epsSecond != null && epsSecond[j] != epsSecond[ref];
    }

    /** c_j of the class comment. */
    private double c(int j) {
        return polarization == Polarization.S ? 1.0 : courant / epsFirst[Math.min(j, epsFirst.length - 1)];
    }

    /** b_j of the class comment. */
    private double b(int j) {
        double w2 = w * w / courant;
        if (polarization == Polarization.S) {
            return 2 + 4 * sx * sx - 4 * epsFirst[j] * w2 / courant;
        }
        return c(j + 1) + c(j) + 4 * sx * sx * courant / epsSecond[j] - 4 * w2;
    }

    /** The root of ρ + 1/ρ = b_j/c_j that travels or decays towards +y at row j. */
    private Complex upwardRoot(int j) {
        double a = b(j) / c(j);
        if (a < -2) {
            throw new IllegalArgumentException("the layered background is beyond the grid's resolution (no wave of this "
                    + "in-plane wavenumber at row " + j + "); refine the grid");
        }
        if (a <= 2) {
            return Complex.polar(1, Math.acos(a / 2));
        }
        return Complex.real(a / 2 - Math.sqrt(a * a / 4 - 1));
    }

    /** Divides u so that the incident part, X ρ^{j − jr} at rows near jr, has z component 1 at the reference point. */
    private void normalise(Complex rho, int jr, double y0, double yRef) {
        if (Math.abs(rho.abs() - 1) > 1e-12) {
            throw new IllegalArgumentException("the incidence medium carries no travelling wave in this direction");
        }
        Complex u1 = get(jr);
        Complex u2 = get(jr - 1);
        Complex x = u2.minus(rho.times(u1)).divide(rho.reciprocal().minus(rho));
        reflection = u1.minus(x).divide(x);
        double offset = polarization == Polarization.S ? 0 : 0.5;
        double t = (yRef - (y0 + (jr + offset) * dx)) / dx;
        Complex scale = x.times(Complex.polar(1, rho.arg() * t)).reciprocal();
        for (int j = 0; j < re.length; j++) {
            set(j, get(j).times(scale));
        }
    }

    private void rescale(int from, int to, double magnitude) {
        if (magnitude > 1e150) {
            for (int j = from; j < to; j++) {
                re[j] *= 1e-150;
                im[j] *= 1e-150;
            }
        }
    }

    private static Complex power(Complex z, int n) {
        if (z.im() == 0) {
            return Complex.real(Math.pow(z.re(), n));
        }
        return Complex.polar(Math.pow(z.abs(), n), z.arg() * n);
    }

    private Complex get(int j) {
        return j >= 0 && j < re.length ? Complex.of(re[j], im[j]) : Complex.ZERO;
    }

    private void set(int j, Complex v) {
        re[j] = v.re();
        im[j] = v.im();
    }

    /** The normalised phasor of component c at its site of node (i, j). */
    Complex at(Component c, int i, int j) {
        double xSite = x0 + (i + c.dx) * dx - xRef;
        Complex ex = Complex.polar(1, kx * xSite);
        Complex v = switch (c) {
            case EZ, HZ -> get(j);
            case HX -> get(j + 1).minus(get(j)).times(courant / (2 * w)).times(Complex.of(0, -1));
            case HY -> get(j).times(-courant * sx / w);
            case EX -> get(j).minus(get(j - 1)).times(c(j) / (2 * w)).timesI();
            case EY -> get(j).times(courant / epsSecond[j] * sx / w);
        };
        return v.times(ex);
    }
}
