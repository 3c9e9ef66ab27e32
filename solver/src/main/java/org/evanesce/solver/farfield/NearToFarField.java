package org.evanesce.solver.farfield;

import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.YeeDispersion;

/**
 * The 2D near-to-far-field transformation in the frequency domain: from the tangential fields on a closed contour
 * in a homogeneous, lossless medium of index n, the far field of whatever radiates from inside it (A. Taflove &amp;
 * S. C. Hagness, <i>Computational Electrodynamics</i>, 3rd ed., 2005, ch. 8, surface equivalence with the 2D
 * Green's function). A pure function of the samples: no grid, no time stepping.
 *
 * <h2>Conventions</h2>
 * Time dependence exp(−iωt); U = Ez (s) or η0·Hz (p), V the in-plane field, η0·H (s) or E (p), all complex
 * amplitudes in V/m; k0 = 2π/λ0, k = n k0. The contour's points carry outward unit normals n̂ and arc-length
 * weights ({@link ContourPoints}); the tangential field is V_t = V · t̂, t̂ = ẑ × n̂. Coordinates are measured from
 * an origin of the caller's choice; far-field phases refer to it. Angles φ are polar angles from +x.
 *
 * <h2>The transformation</h2>
 * Outside the contour C the field radiated from inside satisfies (∇² + k²)U = 0 and the radiation condition, so
 * Green's second identity with G = (i/4) H_0^(1)(k|r − r'|), (∇² + k²)G = −δ, gives (Kirchhoff–Helmholtz)
 * <pre>
 *     U(r) = ∮_C [U(r') ∂G/∂n' − G ∂U/∂n'] dl'.
 * </pre>
 * The normal derivative is the tangential in-plane field: ∂U/∂n = −i k0 V_t for s (η0·H = (i/k0) ẑ × ∇Ez) and
 * ∂U/∂n = i k0 n² V_t for p (E = −(i/(k0 n²)) ẑ × ∇(η0Hz)); these are the equivalent electric and magnetic currents
 * n̂ × H and −n̂ × E. With the large-argument form H_0^(1)(kρ) ~ sqrt(2/(πkρ)) e^{i(kρ − π/4)} and
 * |r − r'| ≈ ρ − r̂·r', the field far out is
 * <pre>
 *     U ~ sqrt(2/(πkρ)) e^{i(kρ − π/4)} F(φ),
 *     F(φ) = (1/4) ∮ [k (n̂'·r̂) U(r') + k0 g V_t(r')] e^{−ik r̂·r'} dl',     g = −1 (s), n² (p),
 * </pre>
 * r̂ = (cos φ, sin φ), the integral being the weighted sum over the samples (U's and V_t's at their own points).
 * F is the far-field amplitude T(ψ) of {@link org.evanesce.solver.reference.CylinderSeries} when the contour holds
 * that cylinder's scattered field and the origin is its centre.
 *
 * <h2>Derived quantities</h2>
 * <ul>
 * <li>Power per unit length per radian, W/(m·rad): dP/dφ = (2/(πk)) |F|² · c, with the intensity factor c = n/(2η0)
 * for s and 1/(2nη0) for p (|U|² c is the intensity of a plane wave of amplitude U).</li>
 * <li>The radiated power P = ∫ dP/dφ dφ, W/m, by the trapezoid rule on M = 2⌈kR + 10(kR)^{1/3} + 20⌉ angles (R the
 * largest |r'|): F is a trigonometric series in φ whose terms beyond order kR decay like J_m(kR), so the rule is
 * exact to rounding.</li>
 * <li>Normalised by a plane wave of amplitude |U_i| in the same medium: the scattering width σ(φ) = (4/k)|F|²/|U_i|²
 * (= lim 2πρ|U|²/|U_i|², metres), the total scattering width C_sca = P/(c|U_i|²) = (1/2π)∫σ dφ, and, given the
 * complex incident amplitude U_i(0) at the origin and its direction φ_i, the extinction width from the forward
 * amplitude C_ext = −(4/k) Re[F(φ_i)/U_i(0)] (optical theorem) and C_abs = C_ext − C_sca. These hold only when
 * the contour's fields are the scattered field alone (as in the scattered-field region of a total-field/
 * scattered-field run).</li>
 * </ul>
 * Discretisation: the sums are whatever rule the weights make; with the midpoint or trapezoid rule on the sides
 * of a rectangle the error falls as the spacing squared (NearToFarFieldTest). Samples from a Yee grid want
 * {@link #onYeeGrid}: the grid carries the scattered wave with its own wavenumber k̃(φ) ≠ k, and with k the forward
 * amplitude's phase is off by (k̃ − k) times the contour's distance, which the optical theorem turns into an
 * extinction 0.7–1.7 % above C_sca at 30 cells per wavelength (CylinderScatteringTest).
 */
public final class NearToFarField {

    private final Polarization polarization;
    private final double index;
    private final double k0;
    private final double k;
    private final double g;
    private final double[] ux, uy, unx, uny, uw, ure, uim;
    private final double[] vx, vy, vnx, vny, vw, vre, vim;
    /** Whether U and V_t sit at the same points (a grid contour's): the V loop then reuses U's phases. */
    private final boolean samePoints;
    /** Per thread: the phases of the U loop (re, im interleaved), for the V loop at the same points. */
    private static final ThreadLocal<double[]> PHASES = ThreadLocal.withInitial(() -> new double[0]);
    private final double reach;
    /** Δ, m, and S of the Yee grid the samples come from ({@link #onYeeGrid}); 0 and 0 for the continuum. */
    private final double cellSize, courant;
    /** The permittivity the grid has round the contour (its dispersion), n² unless a correction changed it. */
    private final double gridEpsilon;
    private final double wavelength;
    private final SurfaceSamples field, tangential;

    /**
     * @param polarization s or p
     * @param wavelength   λ0 in vacuum, m; finite, &gt; 0
     * @param index        n of the homogeneous medium round the contour; real, finite, &gt; 0
     * @param field        U (Ez for s, η0·Hz for p) at its points
     * @param tangential   V_t (η0·H_t for s, E_t for p) at its points (may differ from U's)
     */
    public NearToFarField(Polarization polarization, double wavelength, double index, SurfaceSamples field,
                          SurfaceSamples tangential) {
        this(polarization, wavelength, index, field, tangential, 0, 0, index * index);
    }

    private NearToFarField(Polarization polarization, double wavelength, double index, SurfaceSamples field,
                           SurfaceSamples tangential, double cellSize, double courant, double gridEpsilon) {
        if (polarization == null || field == null || tangential == null) {
            throw new IllegalArgumentException("near-to-far-field: polarization and both sample sets are required");
        }
        if (!(wavelength > 0) || Double.isInfinite(wavelength)) {
            throw new IllegalArgumentException(String.format("near-to-far-field: wavelength %g m must be finite and > 0",
                    wavelength));
        }
        if (!(index > 0) || Double.isInfinite(index)) {
            throw new IllegalArgumentException(String.format(
                    "near-to-far-field: medium index %g must be real, finite and > 0 (a lossless medium)", index));
        }
        this.polarization = polarization;
        this.index = index;
        this.k0 = 2 * Math.PI / wavelength;
        this.k = index * k0;
        this.g = polarization == Polarization.S ? -1 : index * index;
        ContourPoints up = field.points();
        ux = up.x();
        uy = up.y();
        unx = up.normalX();
        uny = up.normalY();
        uw = up.weight();
        ure = field.re();
        uim = field.im();
        ContourPoints vp = tangential.points();
        vx = vp.x();
        vy = vp.y();
        vnx = vp.normalX();
        vny = vp.normalY();
        vw = vp.weight();
        vre = tangential.re();
        vim = tangential.im();
        samePoints = java.util.Arrays.equals(ux, vx) && java.util.Arrays.equals(uy, vy);
        double r = 0;
        for (int j = 0; j < ux.length; j++) {
            r = Math.max(r, Math.hypot(ux[j], uy[j]));
        }
        for (int j = 0; j < vx.length; j++) {
            r = Math.max(r, Math.hypot(vx[j], vy[j]));
        }
        reach = r;
        this.cellSize = cellSize;
        this.courant = courant;
        this.gridEpsilon = gridEpsilon;
        this.wavelength = wavelength;
        this.field = field;
        this.tangential = tangential;
        if (cellSize != 0 && !(cellSize > 0 && courant > 0 && courant <= Math.sqrt(0.5) && Double.isFinite(cellSize)
                && gridEpsilon > 0 && YeeDispersion.wavenumber(gridEpsilon, 0, k0 * PhysicalConstants.C0, cellSize, courant) > 0)) {
            throw new IllegalArgumentException(String.format("near-to-far-field: a Yee grid of cell %g m and Courant number "
                    + "%g does not carry %g m light in permittivity %g (need a cell > 0, 0 < S <= 1/sqrt 2 and a propagating "
                    + "wave)", cellSize, courant, wavelength, gridEpsilon));
        }
    }

    /**
     * The same transformation for samples that a 2D Yee grid of cell Δ and Courant number S took as {@code FluxLine}
     * takes them: U and V_t at one point of the contour, each at its own time, the electric one (U for s, V_t for p)
     * the mean of its two sites across the contour. The far field at φ then refers to the grid's own outgoing wave
     * along φ, not to the continuum's:
     * <ul>
     * <li>the phase e^{−ik̃ r̂·r'} with the grid's numerical wavenumber k̃(φ) along φ (the Yee dispersion relation,
     * sin²(k̃ cos φ Δ/2) + sin²(k̃ sin φ Δ/2) = ε sin²(ωΔt/2)/S², Taflove &amp; Hagness ch. 4; {@link YeeDispersion}), so
     * that the phase the scattered wave gathers between the scatterer and the contour on the grid is taken off again
     * (with k, the forward amplitude's phase is off by (k̃ − k)R, R the contour's distance);</li>
     * <li>the two terms weighted so that the grid's own plane wave leaving through a side along φ gives the
     * continuum's 2 k_n U and one arriving gives nothing: with ξ = k̃ (n̂·r̂) Δ/2 the normal wavenumber's half-cell
     * phase, the averaged electric field is divided by cos ξ (its two sites' mean), and the tangential term is
     * scaled by (k/k̃) τ ξ/sin ξ, τ = sin(ωΔt/2)/(ωΔt/2), the ratio of the continuum's V_t/U to the grid's
     * (S sin ξ / sin(ωΔt/2) for s, over ε for p: the update lines, as {@code source.GridWave} has them), for p
     * times ε/n² when the grid's ε differs from the medium's n².</li>
     * </ul>
     * This is exact for each outgoing grid plane wave crossing a straight side; what remains is second order in Δ
     * and does not grow with the contour's size.
     *
     * @param cellSize    Δ, m
     * @param courant     S = c0Δt/Δ
     * @param gridEpsilon the relative permittivity the grid has round the contour: n², or what a dispersion
     *                    correction made of it (the grid's wavenumbers follow it; k = n k0 stays the medium's)
     */
    public NearToFarField onYeeGrid(double cellSize, double courant, double gridEpsilon) {
        if (!(cellSize > 0)) {
            throw new IllegalArgumentException(String.format("near-to-far-field: cell size %g m must be > 0", cellSize));
        }
        return new NearToFarField(polarization, wavelength, index, field, tangential, cellSize, courant, gridEpsilon);
    }

    public Polarization polarization() {
        return polarization;
    }

    /** n of the medium. */
    public double index() {
        return index;
    }

    /** k = n k0, rad/m. */
    public double wavenumber() {
        return k;
    }

    /** F(φ), V/m (class comment): U ~ sqrt(2/(πkρ)) e^{i(kρ − π/4)} F(φ) far out. */
    public Complex amplitude(double angle) {
        double c = Math.cos(angle);
        double s = Math.sin(angle);
        double kp = k;
        double tau = 1;
        boolean grid = cellSize > 0;
        if (grid) {
            kp = YeeDispersion.wavenumber(gridEpsilon, angle, k0 * PhysicalConstants.C0, cellSize, courant);
            double half = k0 * courant * cellSize / 2;
            tau = Math.sin(half) / half;
        }
        boolean electricU = polarization == Polarization.S;
        Phase uPhase = new Phase(-kp * c, -kp * s);
        Phase vPhase = new Phase(-kp * c, -kp * s);
        double re = 0;
        double im = 0;
        // the grid's factors depend on the normal only: kept while the points run along one side
        double lastNx = Double.NaN;
        double lastNy = Double.NaN;
        double factor = 1;
        double[] phases = null;
        if (samePoints) {
            phases = PHASES.get();
            if (phases.length < 2 * ux.length) {
                phases = new double[2 * ux.length];
                PHASES.set(phases);
            }
        }
        for (int j = 0; j < ux.length; j++) {
            double along = unx[j] * c + uny[j] * s;
            if (grid && electricU && (unx[j] != lastNx || uny[j] != lastNy)) {
                lastNx = unx[j];
                lastNy = uny[j];
                factor = 1 / Math.cos(kp * along * cellSize / 2);
            }
            double f = k * along * uw[j] * factor;
            uPhase.next(ux[j], uy[j]);
            double cp = uPhase.re;
            double sp = uPhase.im;
            if (phases != null) {
                phases[2 * j] = cp;
                phases[2 * j + 1] = sp;
            }
            re += f * (ure[j] * cp - uim[j] * sp);
            im += f * (ure[j] * sp + uim[j] * cp);
        }
        lastNx = Double.NaN;
        lastNy = Double.NaN;
        factor = 1;
        for (int j = 0; j < vx.length; j++) {
            if (grid && (vnx[j] != lastNx || vny[j] != lastNy)) {
                lastNx = vnx[j];
                lastNy = vny[j];
                double xi = kp * (vnx[j] * c + vny[j] * s) * cellSize / 2;
                factor = k / kp * tau * (xi == 0 ? 1 : xi / Math.sin(xi));
                if (!electricU) {
                    // p: the grid's E carries 1/ε of the grid, the continuum's 1/n²
                    factor *= gridEpsilon / (index * index) / Math.cos(xi);
                }
            }
            double f = k0 * g * vw[j] * factor;
            double cp;
            double sp;
            if (phases != null) {
                // the same points in the same order: the values vPhase would give, bit for bit
                cp = phases[2 * j];
                sp = phases[2 * j + 1];
            } else {
                vPhase.next(vx[j], vy[j]);
                cp = vPhase.re;
                sp = vPhase.im;
            }
            re += f * (vre[j] * cp - vim[j] * sp);
            im += f * (vre[j] * sp + vim[j] * cp);
        }
        return Complex.of(re / 4, im / 4);
    }

    /**
     * e^{i(a x + b y)} at points visited in order: where a point lies one equal step on from the last (the points of
     * a contour's straight side), the last value times the step's phase factor, computed afresh every
     * {@value #RESEED} points (and wherever the step changes) so that rounding cannot gather; about a fifth of the
     * cost of a cosine and sine per point.
     */
    private static final class Phase {
        private final double a, b;
        double re, im;
        private double lastX = Double.NaN, lastY = Double.NaN, stepX, stepY, stepRe, stepIm;
        private int run;

        Phase(double a, double b) {
            this.a = a;
            this.b = b;
        }

        void next(double x, double y) {
            double dx = x - lastX;
            double dy = y - lastY;
            double tol = 1e-9 * (Math.abs(stepX) + Math.abs(stepY));
            if (run > 0 && run < RESEED && Math.abs(dx - stepX) <= tol && Math.abs(dy - stepY) <= tol) {
                double r = re * stepRe - im * stepIm;
                im = re * stepIm + im * stepRe;
                re = r;
                run++;
            } else {
                double ph = a * x + b * y;
                re = Math.cos(ph);
                im = Math.sin(ph);
                boolean stepped = Double.isFinite(dx) && Double.isFinite(dy) && (dx != 0 || dy != 0);
                if (stepped) {
                    stepX = dx;
                    stepY = dy;
                    double sp = a * dx + b * dy;
                    stepRe = Math.cos(sp);
                    stepIm = Math.sin(sp);
                }
                run = stepped ? 1 : 0;
            }
            lastX = x;
            lastY = y;
        }
    }

    private static final int RESEED = 64;

    /** F at each angle; a new array. */
    public Complex[] amplitudes(double[] angles) {
        Complex[] out = new Complex[angles.length];
        for (int q = 0; q < angles.length; q++) {
            out[q] = amplitude(angles[q]);
        }
        return out;
    }

    /** |U|² times this is the intensity (W/m²) of a plane wave of amplitude U in the medium. */
    private double intensityFactor() {
        return polarization == Polarization.S ? index / (2 * PhysicalConstants.ETA0)
                                              : 1 / (2 * index * PhysicalConstants.ETA0);
    }

    /** dP/dφ = (2/(πk))|F(φ)|² c, W/(m·rad): the power per unit length radiated into unit angle at φ. */
    public double powerPerRadian(double angle) {
        return 2 / (Math.PI * k) * amplitude(angle).norm() * intensityFactor();
    }

    /** The number of angles the total power is summed over (class comment). */
    public int angles() {
        double kr = k * reach;
        int m = (int) Math.ceil(kr + 10 * Math.cbrt(kr) + 20);
        return 2 * m;
    }

    /** P = ∫ dP/dφ dφ, W/m: the power per unit length that crosses the contour outwards (lossless medium). */
    public double radiatedPower() {
        int m = angles();
        double s = 0;
        for (int q = 0; q < m; q++) {
            s += amplitude(2 * Math.PI * q / m).norm();
        }
        return 2 / (Math.PI * k) * s * (2 * Math.PI / m) * intensityFactor();
    }

    private static void checkAmplitude(double incidentAmplitude) {
        if (!(incidentAmplitude > 0) || Double.isInfinite(incidentAmplitude)) {
            throw new IllegalArgumentException(String.format(
                    "near-to-far-field: incident amplitude %g V/m must be finite and > 0", incidentAmplitude));
        }
    }

    /** σ(φ) = (4/k)|F(φ)|²/|U_i|², m, for an incident plane wave of amplitude |U_i| (V/m) in the same medium. */
    public double scatteringWidth(double angle, double incidentAmplitude) {
        checkAmplitude(incidentAmplitude);
        return 4 / k * amplitude(angle).norm() / (incidentAmplitude * incidentAmplitude);
    }

    /** C_sca = P/(c|U_i|²) = (1/2π)∫σ dφ, m. */
    public double scatteringWidthTotal(double incidentAmplitude) {
        checkAmplitude(incidentAmplitude);
        return radiatedPower() / (intensityFactor() * incidentAmplitude * incidentAmplitude);
    }

    /**
     * C_ext = −(4/k) Re[F(φ_i)/U_i(0)], m (optical theorem), for a plane wave travelling at φ_i with complex
     * amplitude U_i(0) at the coordinates' origin.
     */
    public double extinctionWidth(double incidenceAngle, Complex incidentAtOrigin) {
        if (incidentAtOrigin == null || !(incidentAtOrigin.abs() > 0) || !incidentAtOrigin.isFinite()) {
            throw new IllegalArgumentException("near-to-far-field: incident amplitude at the origin " + incidentAtOrigin
                    + " must be finite and nonzero");
        }
        return -4 / k * amplitude(incidenceAngle).divide(incidentAtOrigin).re();
    }

    /** C_abs = C_ext − C_sca, m: the power absorbed inside the contour over the incident intensity. */
    public double absorptionWidth(double incidenceAngle, Complex incidentAtOrigin) {
        return extinctionWidth(incidenceAngle, incidentAtOrigin) - scatteringWidthTotal(incidentAtOrigin.abs());
    }
}
