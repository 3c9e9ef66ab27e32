package org.evanesce.solver.reference;

import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;

/**
 * The exact scattering of a plane wave by an infinite circular cylinder (2D, the cylinder's axis along z) in a
 * homogeneous background, by its series of cylindrical waves: a dielectric cylinder of complex index N = n + iκ
 * (κ ≥ 0) or a perfectly conducting one, in a background of real index n_b, in both in-plane polarizations.
 * C. F. Bohren &amp; D. R. Huffman, <i>Absorption and Scattering of Light by Small Particles</i>, 1983, sec. 8.4;
 * C. A. Balanis, <i>Advanced Engineering Electromagnetics</i>, 2nd ed., 2012, ch. 11.
 *
 * <h2>Conventions</h2>
 * Time dependence exp(−iωt); s = Ez polarization (E along the axis), p = Hz polarization (H along the axis). U is
 * the field along z: Ez for s, η0·Hz for p (the project stores H as η0·H). Lengths in metres. The cylinder's centre
 * is the origin of the coordinates passed to the field methods; the incident wave travels in the direction at
 * angle φ_i from +x ({@link #incidentAlong}, default 0) and has unit amplitude and zero phase at the centre:
 * U_i = exp(i k (x cos φ_i + y sin φ_i)), k = n_b k0, k0 = 2π/λ0. Multiply every field by the actual incident
 * amplitude (and phase at the centre). Angles φ are polar angles from +x; the scattering angle is ψ = φ − φ_i
 * (ψ = 0 forward, π backward). N is the cylinder's own index; the relative index is m = N/n_b and the size
 * parameter x = k a.
 *
 * <h2>The series</h2>
 * With the Jacobi–Anger expansion U_i = Σ_n i^n J_n(kr) e^{inψ} (A&amp;S 9.1.41), the fields are
 * <pre>
 *     outside (r ≥ a):  U = Σ_n i^n [J_n(kr) + c_n H_n(kr)] e^{inψ},      H_n = J_n + i Y_n = H_n^(1) (outgoing),
 *     inside  (r &lt; a):  U = Σ_n i^n d_n J_n(N k0 r) e^{inψ},
 * </pre>
 * n over all integers, c_{−n} = c_n, d_{−n} = d_n. Continuity of U and of (1/μ)∂U/∂r (s: Ez and Hφ) or of
 * (1/ε)∂U/∂r (p: Hz and Eφ) at r = a gives
 * <pre>
 *     s:   c_n = −[m J_n'(mx) J_n(x) − J_n(mx) J_n'(x)] / [m J_n'(mx) H_n(x) − J_n(mx) H_n'(x)]
 *     p:   c_n = −[J_n'(mx) J_n(x) − m J_n(mx) J_n'(x)] / [J_n'(mx) H_n(x) − m J_n(mx) H_n'(x)]
 *     PEC: c_n = −J_n(x)/H_n(x) (s, Ez = 0),   c_n = −J_n'(x)/H_n'(x) (p, ∂Hz/∂r = 0);   no field inside,
 * </pre>
 * and d_n J_n(mx) = J_n(x) + c_n H_n(x). These c_n are −b_nI (s) and −a_nII (p) of Bohren &amp; Huffman
 * (8.30)–(8.31) (equation numbers from memory), whose scattered field carries a minus sign. J_n(mx) enters only
 * through J_n'(mx)/J_n(mx) ({@link Bessel#ratios}), so the coefficients hold for any κ; the field inside needs
 * J_n(N k0 r) itself and is limited to |Im(N) k0 a| ≤ {@value Bessel#MAX_IMAGINARY}. The series is summed to
 * n_max = ⌈x + 12 x^{1/3} + 20⌉ (where |c_n| and |J_n(x)| are far below 1e-16), or less where Y_n(x) would pass
 * 1e250 (tiny cylinders; the terms dropped there are below 1e-250).
 *
 * <h2>Far field and cross-sections per unit length</h2>
 * For kr → ∞, H_n(kr) ~ sqrt(2/(πkr)) exp(i(kr − nπ/2 − π/4)) (A&amp;S 9.2.3), so
 * <pre>
 *     U_s ~ sqrt(2/(πkr)) e^{i(kr − π/4)} T(ψ),      T(ψ) = Σ_n c_n e^{inψ} = c_0 + 2 Σ_{n≥1} c_n cos nψ.
 * </pre>
 * The scattering width (2D radar cross-section per unit length), in metres:
 * σ(ψ) = lim_{r→∞} 2πr |U_s|²/|U_i|² = (4/k) |T(ψ)|². The scattered power per unit length divided by the incident
 * intensity (both in the background; the same ratio for |E|² and |H|²) is the total scattering width
 * <pre>
 *     C_sca = ∫_0^{2π} r |U_s|²/|U_i|² dφ = (1/2π) ∫_0^{2π} σ(φ) dφ = (4/k) Σ_n |c_n|²,
 * </pre>
 * in metres, the 2D counterpart of a cross-section; the efficiencies of Bohren &amp; Huffman are Q = C/(2a). The
 * optical theorem in 2D gives the extinction width from the forward amplitude, C_ext = −(4/k) Re T(0)
 * = −(4/k) Σ_n Re c_n, and C_abs = C_ext − C_sca = −(4/k) Σ_n (Re c_n + |c_n|²), the net power flowing into the
 * cylinder over the incident intensity (zero, up to rounding, without loss).
 *
 * <h2>Near fields</h2>
 * {@link #total}, {@link #scattered} and {@link #incident} give U and the in-plane field ({@link Phasors}) at any
 * point, inside or outside, from the Maxwell curl equations: for s, η0·H = (i/k0) ẑ × ∇U, i.e. η0Hx = −(i/k0)∂U/∂y,
 * η0Hy = (i/k0)∂U/∂x; for p, E = −(i/(k0 ε)) ẑ × ∇U, i.e. Ex = (i/(k0 ε))∂U/∂y, Ey = −(i/(k0 ε))∂U/∂x, with ε = n_b²
 * outside and N² inside. The scattered field is total minus incident everywhere (inside too, as in a
 * total-field/scattered-field region).
 *
 * <p>Instances are immutable.
 */
public final class CylinderSeries {

    private final Polarization polarization;
    private final double radius;
    private final Complex index; // null for a perfect conductor
    private final double backgroundIndex;
    private final double wavelength;
    private final double incidence;
    private final double k0;
    private final double k;
    private final int maxOrder;
    private final Complex[] c;
    private final Complex[] d; // null for a perfect conductor or where the field inside is out of reach

    private CylinderSeries(Polarization polarization, double radius, Complex index, double backgroundIndex,
                           double wavelength, double incidence, Complex[] c, Complex[] d) {
        this.polarization = polarization;
        this.radius = radius;
        this.index = index;
        this.backgroundIndex = backgroundIndex;
        this.wavelength = wavelength;
        this.incidence = incidence;
        this.k0 = 2 * Math.PI / wavelength;
        this.k = backgroundIndex * k0;
        this.c = c;
        this.d = d;
        this.maxOrder = c.length - 1;
    }

    /**
     * A dielectric (possibly absorbing) cylinder.
     *
     * @param polarization    s (Ez along the axis) or p (Hz along the axis)
     * @param radius          a, m; finite, &gt; 0
     * @param index           N = n + iκ of the cylinder, κ ≥ 0, not zero
     * @param backgroundIndex n_b, real, finite, &gt; 0
     * @param wavelength      λ0 in vacuum, m; finite, &gt; 0
     */
    public static CylinderSeries dielectric(Polarization polarization, double radius, Complex index,
                                            double backgroundIndex, double wavelength) {
        check(polarization, radius, backgroundIndex, wavelength);
        if (index == null || !index.isFinite() || index.im() < 0 || index.abs() == 0) {
            throw new IllegalArgumentException(String.format(
                    "cylinder index %s must be finite and nonzero with imaginary part kappa >= 0", index));
        }
        double k0 = 2 * Math.PI / wavelength;
        double x = backgroundIndex * k0 * radius;
        Complex m = index.divide(backgroundIndex);
        Complex mx = index.times(k0 * radius);
        int nmax = orders(x);
        double[] jx = Bessel.besselJ(nmax + 1, x);
        double[] yx = Bessel.besselY(nmax + 1, x);
        nmax = trimmed(nmax, yx);
        Complex[] ratio = Bessel.ratios(nmax + 1, mx);
        Complex[] jm = Math.abs(mx.im()) <= Bessel.MAX_IMAGINARY ? Bessel.besselJ(nmax + 1, mx) : null;
        Complex[] c = new Complex[nmax + 1];
        Complex[] d = jm == null ? null : new Complex[nmax + 1];
        for (int n = 0; n <= nmax; n++) {
            // (jmv, jmd) ∝ (J_n(mx), J_n'(mx)) with a common factor chosen so that neither overflows
            Complex jmv;
            Complex jmd;
            if (n == 0) {
                Complex[] pq = pair(ratio[1]); // ∝ (J_0, J_1); J_0' = −J_1
                jmv = pq[0];
                jmd = pq[1].negate();
            } else {
                Complex[] pq = pair(ratio[n]); // ∝ (J_{n−1}, J_n); J_n' = J_{n−1} − (n/z) J_n
                jmv = pq[1];
                jmd = pq[0].minus(pq[1].times(mx.reciprocal().times(n)));
            }
            Complex j = Complex.real(jx[n]);
            Complex jd = Complex.real(derivative(jx, n, x));
            Complex h = Complex.of(jx[n], yx[n]);
            Complex hd = Complex.of(derivative(jx, n, x), derivative(yx, n, x));
            Complex num;
            Complex den;
            if (polarization == Polarization.S) {
                num = m.times(jmd).times(j).minus(jmv.times(jd));
                den = m.times(jmd).times(h).minus(jmv.times(hd));
            } else {
                num = jmd.times(j).minus(m.times(jmv).times(jd));
                den = jmd.times(h).minus(m.times(jmv).times(hd));
            }
            c[n] = num.divide(den).negate();
            if (d != null) {
                Complex jmn = jm[n];
                Complex jmnd = n == 0 ? jm[1].negate() : jm[n - 1].minus(jm[n].times(mx.reciprocal().times(n)));
                Complex outside = j.plus(c[n].times(h));           // U at r = a
                Complex outsideSlope = jd.plus(c[n].times(hd));    // ∂U/∂(kr) at r = a
                // s: J + cH = d J(mx), J' + cH' = d m J'(mx);  p: J + cH = d J(mx), J' + cH' = (d/m) J'(mx)
                Complex slopeFactor = polarization == Polarization.S ? m.times(jmnd) : jmnd.divide(m);
                d[n] = jmn.abs() >= slopeFactor.abs() ? outside.divide(jmn) : outsideSlope.divide(slopeFactor);
            }
        }
        return new CylinderSeries(polarization, radius, index, backgroundIndex, wavelength, 0, c, d);
    }

    /**
     * A perfectly conducting cylinder (no field inside).
     *
     * @param polarization    s (Ez along the axis: Ez = 0 on the surface) or p (Hz along the axis: ∂Hz/∂r = 0)
     * @param radius          a, m; finite, &gt; 0
     * @param backgroundIndex n_b, real, finite, &gt; 0
     * @param wavelength      λ0 in vacuum, m; finite, &gt; 0
     */
    public static CylinderSeries conductor(Polarization polarization, double radius, double backgroundIndex,
                                           double wavelength) {
        check(polarization, radius, backgroundIndex, wavelength);
        double x = backgroundIndex * 2 * Math.PI / wavelength * radius;
        int nmax = orders(x);
        double[] jx = Bessel.besselJ(nmax + 1, x);
        double[] yx = Bessel.besselY(nmax + 1, x);
        nmax = trimmed(nmax, yx);
        Complex[] c = new Complex[nmax + 1];
        for (int n = 0; n <= nmax; n++) {
            Complex num;
            Complex den;
            if (polarization == Polarization.S) {
                num = Complex.real(jx[n]);
                den = Complex.of(jx[n], yx[n]);
            } else {
                num = Complex.real(derivative(jx, n, x));
                den = Complex.of(derivative(jx, n, x), derivative(yx, n, x));
            }
            c[n] = num.divide(den).negate();
        }
        return new CylinderSeries(polarization, radius, null, backgroundIndex, wavelength, 0, c, null);
    }

    private static void check(Polarization polarization, double radius, double backgroundIndex, double wavelength) {
        if (polarization == null) {
            throw new IllegalArgumentException("cylinder: polarization must be s or p");
        }
        if (!(radius > 0) || Double.isInfinite(radius)) {
            throw new IllegalArgumentException(String.format("cylinder radius %g m must be finite and > 0", radius));
        }
        if (!(backgroundIndex > 0) || Double.isInfinite(backgroundIndex)) {
            throw new IllegalArgumentException(String.format(
                    "cylinder background index %g must be finite and > 0", backgroundIndex));
        }
        if (!(wavelength > 0) || Double.isInfinite(wavelength)) {
            throw new IllegalArgumentException(String.format("cylinder wavelength %g m must be finite and > 0", wavelength));
        }
        double x = backgroundIndex * 2 * Math.PI / wavelength * radius;
        if (x > 1e4) {
            throw new IllegalArgumentException(String.format(
                    "cylinder size parameter n_b k0 a = %g is above 1e4 (too many terms)", x));
        }
    }

    private static int orders(double x) {
        return (int) Math.ceil(x + 12 * Math.cbrt(x) + 20);
    }

    /** The last order whose Y_n(x) (and Y_{n+1}, for the derivative) stays below 1e250 in magnitude. */
    private static int trimmed(int nmax, double[] y) {
        for (int n = 1; n <= nmax; n++) {
            if (!(Math.abs(y[n + 1]) < 1e250)) {
                return n - 1;
            }
        }
        return nmax;
    }

    /** Z_n'(x) from Z_0 … Z_{n+1}: −Z_1 for n = 0, else Z_{n−1} − (n/x) Z_n (A&amp;S 9.1.27). */
    private static double derivative(double[] z, int n, double x) {
        return n == 0 ? -z[1] : z[n - 1] - n / x * z[n];
    }

    /** From r = J_{n−1}/J_n: (J_{n−1}, J_n) up to a common factor, the larger of the two being 1. */
    private static Complex[] pair(Complex r) {
        return r.abs() >= 1 ? new Complex[] {Complex.ONE, r.reciprocal()} : new Complex[] {r, Complex.ONE};
    }

    /** The same cylinder lit by the same wave travelling at {@code angle} rad from +x. */
    public CylinderSeries incidentAlong(double angle) {
        if (!Double.isFinite(angle)) {
            throw new IllegalArgumentException(String.format("cylinder incidence angle %g rad must be finite", angle));
        }
        return new CylinderSeries(polarization, radius, index, backgroundIndex, wavelength, angle, c, d);
    }

    public Polarization polarization() {
        return polarization;
    }

    /** a, m. */
    public double radius() {
        return radius;
    }

    /** True for a perfectly conducting cylinder. */
    public boolean isConductor() {
        return index == null;
    }

    /** N of a dielectric cylinder; null for a conductor. */
    public Complex index() {
        return index;
    }

    public double backgroundIndex() {
        return backgroundIndex;
    }

    /** λ0, m. */
    public double wavelength() {
        return wavelength;
    }

    /** φ_i, rad from +x: the direction the incident wave travels. */
    public double incidenceAngle() {
        return incidence;
    }

    /** k = n_b k0, rad/m. */
    public double wavenumber() {
        return k;
    }

    /** x = k a. */
    public double sizeParameter() {
        return k * radius;
    }

    /** The largest order kept; c_n is taken as zero beyond it. */
    public int maxOrder() {
        return maxOrder;
    }

    /** c_n, the scattered wave's coefficient (class comment); c_{−n} = c_n; zero beyond {@link #maxOrder}. */
    public Complex coefficient(int n) {
        int a = Math.abs(n);
        return a <= maxOrder ? c[a] : Complex.ZERO;
    }

    /** T(ψ) = Σ c_n e^{inψ}: the far-field amplitude at scattering angle ψ (rad from the forward direction). */
    public Complex amplitude(double scatteringAngle) {
        double re = 0;
        double im = 0;
        for (int n = maxOrder; n >= 1; n--) {
            double w = 2 * Math.cos(n * scatteringAngle);
            re += w * c[n].re();
            im += w * c[n].im();
        }
        return Complex.of(re + c[0].re(), im + c[0].im());
    }

    /** σ(ψ) = (4/k)|T(ψ)|², m, at scattering angle ψ (rad from the forward direction). */
    public double scatteringWidth(double scatteringAngle) {
        return 4 / k * amplitude(scatteringAngle).norm();
    }

    /** σ towards the polar angle φ (rad from +x) for this incidence: σ(φ − φ_i), m. */
    public double scatteringWidthTowards(double angle) {
        return scatteringWidth(angle - incidence);
    }

    /** C_sca = (1/2π)∫σ dφ = (4/k) Σ_n |c_n|², m. */
    public double scatteringWidthTotal() {
        double s = 0;
        for (int n = maxOrder; n >= 1; n--) {
            s += 2 * c[n].norm();
        }
        return 4 / k * (s + c[0].norm());
    }

    /** C_ext = −(4/k) Re T(0), m (optical theorem). */
    public double extinctionWidth() {
        return -4 / k * amplitude(0).re();
    }

    /** C_abs = −(4/k) Σ_n (Re c_n + |c_n|²), m: C_ext − C_sca. */
    public double absorptionWidth() {
        double s = 0;
        for (int n = maxOrder; n >= 1; n--) {
            s += 2 * (c[n].re() + c[n].norm());
        }
        return -4 / k * (s + c[0].re() + c[0].norm());
    }

    /** The incident plane wave at (x, y) m from the centre. */
    public Phasors incident(double x, double y) {
        double cx = Math.cos(incidence);
        double cy = Math.sin(incidence);
        Complex u = Complex.polar(1, k * (x * cx + y * cy));
        // ∇U = i k (cos φ_i, sin φ_i) U
        Complex gx = u.timesI().times(k * cx);
        Complex gy = u.timesI().times(k * cy);
        return fromGradient(u, gx, gy, Complex.real(backgroundIndex * backgroundIndex));
    }

    /** The scattered field (total minus incident) at (x, y) m from the centre. */
    public Phasors scattered(double x, double y) {
        double r = Math.hypot(x, y);
        if (r >= radius) {
            return outsideScattered(x, y, r);
        }
        return total(x, y).minus(incident(x, y));
    }

    /** The total field at (x, y) m from the centre, inside or outside the cylinder. */
    public Phasors total(double x, double y) {
        double r = Math.hypot(x, y);
        if (r >= radius) {
            return incident(x, y).plus(outsideScattered(x, y, r));
        }
        if (index == null) {
            return new Phasors(polarization, Complex.ZERO, Complex.ZERO, Complex.ZERO);
        }
        if (d == null) {
            throw new IllegalArgumentException(String.format(
                    "cylinder: the field inside needs |Im N| k0 a <= %g, here %g", Bessel.MAX_IMAGINARY,
                    index.im() * k0 * radius));
        }
        Complex kin = index.times(k0);
        Complex z = kin.times(r);
        Complex[] j = Bessel.besselJ(maxOrder + 1, z);
        return series(x, y, r, d, j, kin, index.square());
    }

    private Phasors outsideScattered(double x, double y, double r) {
        double z = k * r;
        double[] jr = Bessel.besselJ(maxOrder + 1, z);
        double[] yr = Bessel.besselY(maxOrder + 1, z);
        Complex[] h = new Complex[maxOrder + 2];
        for (int n = 0; n <= maxOrder + 1; n++) {
            h[n] = Complex.of(jr[n], yr[n]);
        }
        return series(x, y, r, c, h, Complex.real(k), Complex.real(backgroundIndex * backgroundIndex));
    }

    /**
     * U = Σ ε_n i^n a_n Z_n(κr) cos nψ (ε_0 = 1, ε_n = 2) and its gradient, with Z_0 … Z_{maxOrder+1} given at κr:
     * ∂U/∂r = κ Σ ε_n i^n a_n Z_n'(κr) cos nψ, (1/r)∂U/∂ψ = −κ Σ ε_n i^n a_n n [Z_n(κr)/(κr)] sin nψ with
     * Z_n(z)/z = (Z_{n−1} + Z_{n+1})/(2n) (A&amp;S 9.1.27), finite at r = 0.
     */
    private Phasors series(double x, double y, double r, Complex[] a, Complex[] zf, Complex kappa, Complex eps) {
        double phi = r > 0 ? Math.atan2(y, x) : 0;
        double psi = phi - incidence;
        Complex u = Complex.ZERO;
        Complex dr = Complex.ZERO;
        Complex dt = Complex.ZERO; // (1/r) ∂U/∂φ, without the factor κ
        for (int n = maxOrder; n >= 0; n--) {
            double eps0 = n == 0 ? 1 : 2;
            Complex in = iPower(n).times(a[n]).times(eps0);
            double cs = Math.cos(n * psi);
            double sn = Math.sin(n * psi);
            Complex deriv;
            if (n == 0) {
                deriv = zf[1].negate();
            } else {
                Complex overZ = zf[n - 1].plus(zf[n + 1]).divide(2.0 * n);
                deriv = zf[n - 1].minus(overZ.times(n)); // Z_n' = Z_{n−1} − n Z_n/z
                dt = dt.minus(in.times(overZ).times(n * sn));
            }
            u = u.plus(in.times(zf[n]).times(cs));
            dr = dr.plus(in.times(deriv).times(cs));
        }
        dr = dr.times(kappa);
        dt = dt.times(kappa);
        double cp = Math.cos(phi);
        double sp = Math.sin(phi);
        Complex gx = dr.times(cp).minus(dt.times(sp));
        Complex gy = dr.times(sp).plus(dt.times(cp));
        return fromGradient(u, gx, gy, eps);
    }

    private static Complex iPower(int n) {
        return switch (n & 3) {
            case 0 -> Complex.ONE;
            case 1 -> Complex.I;
            case 2 -> Complex.real(-1);
            default -> Complex.of(0, -1);
        };
    }

    /** The in-plane fields from U and ∇U (class comment). */
    private Phasors fromGradient(Complex u, Complex gx, Complex gy, Complex eps) {
        if (polarization == Polarization.S) {
            Complex f = Complex.of(0, 1 / k0);
            return new Phasors(polarization, u, f.times(gy).negate(), f.times(gx));
        }
        Complex f = Complex.I.divide(eps.times(k0));
        return new Phasors(polarization, u, f.times(gy), f.times(gx).negate());
    }
}
