package org.evanesce.solver.reference;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;

/**
 * Parallel isotropic layers between two semi-infinite media, and their exact plane-wave response
 * by the characteristic (transfer) matrix: M. Born &amp; E. Wolf, <i>Principles of Optics</i>, 7th ed.
 * (1999), sec. 1.6; P. Yeh, <i>Optical Waves in Layered Media</i> (1988), ch. 5.
 *
 * <h2>Geometry and conventions</h2>
 * z is the stack normal, pointing from the incidence medium (z &lt; 0) through the layers
 * (first layer first, starting at z = 0) into the exit medium; x lies along the interfaces, in the
 * plane of incidence. Time dependence exp(−iωt); a field varies as exp(i(kx·x + kz·z − ωt)).
 * Indices are complex {@code n + iκ} with n ≥ 0 and κ ≥ 0 (passive media; permittivity ε = (n + iκ)²),
 * every medium is non-magnetic (μ = μ0). The in-plane wavenumber kx is the same in every medium
 * (phase matching); the normal wavenumber in medium j is
 * <pre>
 *     kz_j = sqrt(n_j² k0² − kx²),  k0 = 2π/λ0,  on the branch with Im kz_j ≥ 0
 * </pre>
 * ({@link Complex#sqrtUpper()}): a wave that decays, or keeps its amplitude, along +z. Beyond the
 * critical angle kz_j is imaginary and the "angle" in medium j is complex; nothing else changes.
 *
 * <h2>Tangential fields and admittances</h2>
 * (These x, z are the reference's own axes, not the grid's.)
 * U is the tangential field that is one scalar in each polarization: E_y for <b>s</b> (E normal to
 * the plane of incidence; the simulator's Ez polarization) and H_y for <b>p</b> (H normal to the
 * plane of incidence; the simulator's Hz polarization). V = ∂U/∂z / (i k0 f), with f = 1 for s and
 * f = ε = n² for p, is the other tangential field up to a constant (Faraday's law gives
 * H_x = −(k0/(ωμ0))·V for s, Ampère's gives E_x = (k0/(ωε0))·V for p), so U and V are both continuous
 * at every interface. A wave {@code A·exp(±i kz z)} has V = ±Q·U with the dimensionless admittance
 * <pre>
 *     s:  Q = kz / k0            p:  Q = kz / (k0 n²)
 * </pre>
 * (Born &amp; Wolf's p_j = sqrt(ε/μ) cos θ_j and q_j = sqrt(μ/ε) cos θ_j, i.e. kz and kz/n² up to k0.)
 *
 * <h2>Characteristic matrix</h2>
 * A layer of thickness d, phase thickness δ = kz·d, relates (U, V) at its top to (U, V) at its bottom:
 * <pre>
 *     (U, V)_top = M (U, V)_bottom,   M = [ cos δ        −i sin δ / Q ]
 *                                         [ −i Q sin δ    cos δ       ]
 * </pre>
 * (Born &amp; Wolf sec. 1.6.2, their characteristic matrix with p_j or q_j for Q), det M = 1; a stack's
 * matrix is the product of its layers' matrices, first layer on the left. With an incident wave of unit amplitude, reflected
 * amplitude r and transmitted amplitude t, (U, V) = (1 + r, Q1(1 − r)) at the top of the stack and
 * (t, Qe·t) at its bottom, which gives
 * <pre>
 *     r = (Q1(m11 + m12 Qe) − (m21 + m22 Qe)) / D,   t = 2 Q1 / D,   D = Q1(m11 + m12 Qe) + (m21 + m22 Qe).
 * </pre>
 * <b>r and t are ratios of U amplitudes: of E for s, of H for p.</b> r is referred to the first
 * interface (z = 0), t compares the transmitted wave at the last interface with the incident one at the
 * first. For a single interface r_p equals Hecht's r_∥ (E. Hecht, <i>Optics</i>, 4th ed., sec. 4.6),
 * and t_p = (n2/n1)·t_∥ since |H| = n|E|/η0; at normal incidence r_p = −r_s, the H of a reflected
 * wave flipping where its E does not.
 *
 * <h2>Powers</h2>
 * The time-averaged Poynting flux along z of a wave U·exp(i kz z) is, for s,
 * ½ Re(E_y H_x*)·(−1) = ½ Re(kz/(ωμ0)) |U|² = (k0/(2ωμ0)) Re(Q) |U|², and for p,
 * ½ Re(E_x H_y*) = ½ Re(kz/(ωε0 ε)) |U|² = (k0/(2ωε0)) Re(Q) |U|². In both polarizations the
 * constant is the same on both sides of the stack, so
 * <pre>
 *     R = |r|²,   T = Re(Qe) / Q1 · |t|²,   A = 1 − R − T
 * </pre>
 * i.e. T = Re(kz_e/μ_e)/Re(kz_1/μ_1)·|t|² for s and T = Re(kz_e/ε_e)/Re(kz_1/ε_1)·|t|² for p (μ = 1 here).
 * R = |r|² holds because the incidence medium is transparent (Q1 real, so the incident and reflected
 * waves carry their fluxes separately); it is required to be, since a real angle of incidence and an
 * incident power are only defined there. T is the power that enters the exit medium (absorbed there if
 * that medium is lossy) and A the power absorbed in the layers; with lossless layers it is zero to
 * rounding, beyond the critical angle too (|R + T − 1| about 1e-16 for a gap or a slab, up to a few
 * 1e-14 for microns of high-index multilayer with sharp resonances; {@code EnergyAndReciprocityTest}).
 *
 * <h2>Thick evanescent layers</h2>
 * cos δ and sin δ grow as exp(Im δ) in an evanescent or lossy layer. Each layer's matrix is computed
 * multiplied by exp(−Im δ), so that a thick gap never overflows; r is unchanged by the scale and t is
 * divided by it at the end (it may underflow to zero, which is then the right answer).
 *
 * @param incidentIndex the incidence medium's real, positive refractive index
 * @param layers        the layers from the incidence side to the exit side (copied; may be empty)
 * @param exitIndex     the exit medium's complex index
 */
public record PlanarStack(double incidentIndex, List<Layer> layers, Complex exitIndex) {

    /**
     * One layer.
     *
     * @param index     complex refractive index n + iκ, n ≥ 0, κ ≥ 0, not zero
     * @param thickness m (any length unit works if the wavelength uses the same one); finite, ≥ 0
     */
    public record Layer(Complex index, double thickness) {
        public Layer {
            checkIndex(index, "layer");
            if (!(thickness >= 0) || Double.isInfinite(thickness)) {
                throw new IllegalArgumentException(String.format(
                        "layer of index %s: thickness %g m must be finite and >= 0", index, thickness));
            }
        }
    }

    /** The reflection and transmission of one plane wave (see the class comment for the conventions). */
    public record Response(Complex r, Complex t, double reflectance, double transmittance) {
        /**
         * A = 1 − R − T: the fraction of the incident power absorbed in the layers. (T is what enters the
         * exit medium, which absorbs it if it is lossy.)
         */
        public double absorptance() {
            return 1 - reflectance - transmittance;
        }
    }

    /** A 2 × 2 complex matrix (m11 m12; m21 m22). */
    public record Matrix(Complex m11, Complex m12, Complex m21, Complex m22) {
        public static final Matrix IDENTITY = new Matrix(Complex.ONE, Complex.ZERO, Complex.ZERO, Complex.ONE);

        public Matrix times(Matrix o) {
            return new Matrix(m11.times(o.m11).plus(m12.times(o.m21)), m11.times(o.m12).plus(m12.times(o.m22)),
                    m21.times(o.m11).plus(m22.times(o.m21)), m21.times(o.m12).plus(m22.times(o.m22)));
        }

        public Matrix times(double x) {
            return new Matrix(m11.times(x), m12.times(x), m21.times(x), m22.times(x));
        }

        public Complex determinant() {
            return m11.times(m22).minus(m12.times(m21));
        }
    }

    public PlanarStack {
        if (!(incidentIndex > 0) || Double.isInfinite(incidentIndex)) {
            throw new IllegalArgumentException(String.format(
                    "incidence medium: index %g must be real, finite and > 0 (a transparent medium)", incidentIndex));
        }
        if (layers == null) {
            throw new IllegalArgumentException("layers must be given (an empty list for a single interface)");
        }
        layers = List.copyOf(layers);
        checkIndex(exitIndex, "exit medium");
    }

    /** A single interface between two media. */
    public static PlanarStack interfaceBetween(double incidentIndex, Complex exitIndex) {
        return new PlanarStack(incidentIndex, List.of(), exitIndex);
    }

    /** This stack with layer {@code layer} (0 = the first after the incidence medium) of the given thickness, m. */
    public PlanarStack withThickness(int layer, double thickness) {
        if (layer < 0 || layer >= layers.size()) {
            throw new IllegalArgumentException(String.format(
                    "layer %d does not exist: the stack has %d layer(s), numbered from 0", layer, layers.size()));
        }
        List<Layer> l = new ArrayList<>(layers);
        l.set(layer, new Layer(layers.get(layer).index(), thickness));
        return new PlanarStack(incidentIndex, l, exitIndex);
    }

    /**
     * The same stack seen from the exit side: layers in reverse order, the exit medium becoming the
     * incidence medium. Needs a transparent exit medium.
     */
    public PlanarStack reversed() {
        if (exitIndex.im() != 0) {
            throw new IllegalArgumentException("reversed stack: the exit medium " + exitIndex
                    + " must be transparent (real index) to become the incidence medium");
        }
        List<Layer> l = new ArrayList<>(layers);
        Collections.reverse(l);
        return new PlanarStack(exitIndex.re(), l, Complex.real(incidentIndex));
    }

    /** The number of media: incidence medium, layers, exit medium. */
    public int media() {
        return layers.size() + 2;
    }

    /** The index of medium {@code j}: 0 is the incidence medium, 1 … N the layers, N + 1 the exit medium. */
    public Complex index(int j) {
        if (j == 0) {
            return Complex.real(incidentIndex);
        }
        if (j == layers.size() + 1) {
            return exitIndex;
        }
        if (j < 0 || j > layers.size() + 1) {
            throw new IllegalArgumentException(String.format(
                    "medium %d does not exist: media are numbered 0 (incidence) to %d (exit)", j, layers.size() + 1));
        }
        return layers.get(j - 1).index();
    }

    /** kx = n1 k0 sin θ, rad/m, for a vacuum wavelength in m and an angle of incidence in radians. */
    public double transverseWavenumber(double wavelength, double angle) {
        checkWavelength(wavelength);
        if (!(Math.abs(angle) < Math.PI / 2)) {
            throw new IllegalArgumentException(String.format(
                    "angle of incidence %g deg must be within (-90, 90) deg", Math.toDegrees(angle)));
        }
        return incidentIndex * 2 * Math.PI / wavelength * Math.sin(angle);
    }

    /** kz_j = sqrt(n_j² k0² − kx²) with Im kz_j ≥ 0, rad/m, in medium {@code j} (numbered as in {@link #index}). */
    public Complex normalWavenumber(int j, double wavelength, double kx) {
        checkWavelength(wavelength);
        double k0 = 2 * Math.PI / wavelength;
        return kz(index(j), k0, kx);
    }

    /** The response at an angle of incidence θ (radians, |θ| &lt; π/2) in the incidence medium. */
    public Response atAngle(Polarization polarization, double wavelength, double angle) {
        return atTransverseWavenumber(polarization, wavelength, transverseWavenumber(wavelength, angle));
    }

    /**
     * The response to a plane wave of vacuum wavelength {@code wavelength} (m) and in-plane wavenumber
     * {@code kx} (rad/m, |kx| &lt; n1·k0, i.e. a propagating incident wave).
     */
    public Response atTransverseWavenumber(Polarization polarization, double wavelength, double kx) {
        checkWavelength(wavelength);
        double k0 = 2 * Math.PI / wavelength;
        checkKx(kx, k0);
        Complex q1 = admittance(polarization, Complex.real(incidentIndex), k0, kx);
        Complex qe = admittance(polarization, exitIndex, k0, kx);
        double logScale = 0;
        Matrix m = Matrix.IDENTITY;
        for (Layer layer : layers) {
            Scaled s = scaledLayerMatrix(polarization, layer, k0, kx);
            m = m.times(s.matrix());
            logScale += s.logScale();
        }
        Complex a = m.m11().plus(m.m12().times(qe));
        Complex b = m.m21().plus(m.m22().times(qe));
        Complex q1a = q1.times(a);
        Complex d = q1a.plus(b);
        Complex r = q1a.minus(b).divide(d);
        Complex t = q1.times(2).divide(d).times(Math.exp(-logScale));
        double reflectance = r.norm();
        double transmittance = qe.re() / q1.re() * t.norm();
        return new Response(r, t, reflectance, transmittance);
    }

    /**
     * The characteristic matrix of the whole stack (product of the layers' matrices, first on the left),
     * unscaled: it overflows for layers many decay lengths thick, which {@link #atTransverseWavenumber}
     * avoids.
     */
    public Matrix characteristicMatrix(Polarization polarization, double wavelength, double kx) {
        checkWavelength(wavelength);
        double k0 = 2 * Math.PI / wavelength;
        checkKx(kx, k0);
        Matrix m = Matrix.IDENTITY;
        for (Layer layer : layers) {
            Scaled s = scaledLayerMatrix(polarization, layer, k0, kx);
            m = m.times(s.matrix().times(Math.exp(s.logScale())));
        }
        return m;
    }

    /**
     * The Goos–Hänchen shift of the reflected beam along the interface, m: Artmann's stationary-phase
     * result D = −d(arg r)/dkx (K. Artmann, Ann. Physik 2, 87 (1948); R. H. Renard, J. Opt. Soc. Am. 54,
     * 1190 (1964)), positive in the direction of kx. It describes beams many wavelengths wide, several
     * degrees beyond the critical angle (M. P. Araújo, S. De Leo, G. G. Maia, Phys. Rev. A 93, 023801 (2016)).
     *
     * <p>The derivative is numerical: a five-point central difference of arg r in kx, each phase
     * difference taken as arg(r(kx + h)/r(kx − h)) so that no unwrapping is needed. arg r has square-root
     * branch points where kz of some medium vanishes (kx = n_j k0), so the step h is 1e-3 of the distance
     * from kx to the nearest of them (complex distance for lossy media), at most 1e-5·n1·k0, rounded down to
     * a power of two so that the abscissae kx ± h, kx ± 2h are exact. The truncation error is then about
     * (1e-3)⁴ relative; rounding in arg r, divided by the small phase step, dominates: {@code GoosHanchenTest}
     * measures at most 2e-11 relative against the closed form for a single interface, 0.01° above the critical
     * angle included. The result at h is compared with the one at h/2; while they differ by more than 1e-7
     * relative (a resonance of the stack narrower than the step, a guided or leaky mode), h is halved, down to
     * 1e-9·n1·k0.
     *
     * @param angle angle of incidence, radians, |θ| &lt; π/2
     * @return the shift in m; NaN where r = 0 (no reflected beam)
     */
    public double goosHanchenShift(Polarization polarization, double wavelength, double angle) {
        double kx = transverseWavenumber(wavelength, angle);
        double k0 = 2 * Math.PI / wavelength;
        double nearest = incidentIndex * k0 - Math.abs(kx);
        for (int j = 1; j < media(); j++) {
            Complex n = index(j);
            double dPlus = Math.hypot(kx - n.re() * k0, n.im() * k0);
            double dMinus = Math.hypot(kx + n.re() * k0, n.im() * k0);
            nearest = Math.min(nearest, Math.min(dPlus, dMinus));
        }
        double h = Math.min(1e-3 * nearest, 1e-5 * incidentIndex * k0);
        double floor = 1e-9 * incidentIndex * k0;
        if (!(h > 0)) {
            return Double.NaN; // kx sits on a branch point: the phase has no derivative there
        }
        // a power of two no smaller than ulp(kx): kx ± h and kx ± 2h are then exact, so the stencil is symmetric
        // to the last bit (common practice; otherwise rounding of the abscissae costs ulp(kx)/h relative)
        h = Math.max(Math.scalb(1.0, Math.getExponent(h)), 4 * Math.ulp(kx));
        double previous = phaseSlope(polarization, wavelength, kx, h);
        while (true) {
            double next = phaseSlope(polarization, wavelength, kx, h / 2);
            if (Math.abs(next - previous) <= 1e-7 * Math.abs(next) || h / 2 < floor || Double.isNaN(next)) {
                return -next;
            }
            previous = next;
            h /= 2;
        }
    }

    /** d(arg r)/dkx by the five-point central difference with step h. */
    private double phaseSlope(Polarization polarization, double wavelength, double kx, double h) {
        double d1 = phaseDifference(polarization, wavelength, kx, h);
        double d2 = phaseDifference(polarization, wavelength, kx, 2 * h);
        return (8 * d1 - d2) / (12 * h);
    }

    /** arg r(kx + h) − arg r(kx − h), taken as one argument so that it never wraps for small h. */
    private double phaseDifference(Polarization polarization, double wavelength, double kx, double h) {
        Complex plus = atTransverseWavenumber(polarization, wavelength, kx + h).r();
        Complex minus = atTransverseWavenumber(polarization, wavelength, kx - h).r();
        if (minus.norm() == 0 || plus.norm() == 0) {
            return Double.NaN; // no reflected wave, no phase
        }
        return plus.divide(minus).arg();
    }

    /** A layer's matrix times exp(−logScale). */
    private record Scaled(Matrix matrix, double logScale) {
    }

    private static Scaled scaledLayerMatrix(Polarization polarization, Layer layer, double k0, double kx) {
        Complex n = layer.index();
        Complex eps = n.square();
        Complex kz = kz(n, k0, kx);
        Complex f = polarization == Polarization.S ? Complex.ONE : eps;
        Complex q = kz.divide(f.times(k0));
        Complex delta = kz.times(layer.thickness());
        double b = delta.im(); // >= 0 on our branch
        Complex cos;
        Complex sin;
        if (b < 30) {
            // direct formulas: no cancellation in sin δ for a thin layer
            double scale = Math.exp(-b);
            cos = delta.cos().times(scale);
            sin = delta.sin().times(scale);
        } else {
            // exp(iδ)·e^{−b} = e^{ia}·e^{−2b} and exp(−iδ)·e^{−b} = e^{−ia}: nothing overflows
            Complex up = Complex.polar(Math.exp(-2 * b), delta.re());
            Complex down = Complex.polar(1, -delta.re());
            cos = up.plus(down).times(0.5);
            sin = up.minus(down).divide(Complex.of(0, 2));
        }
        // sin δ / Q = k0 f d · sin δ / δ: finite where kz = 0 (grazing in this layer)
        Complex sinc = delta.re() == 0 && delta.im() == 0 ? Complex.ONE : sin.divide(delta);
        Complex m12 = f.times(k0 * layer.thickness()).times(sinc).timesI().negate();
        Complex m21 = q.times(sin).timesI().negate();
        return new Scaled(new Matrix(cos, m12, m21, cos), b);
    }

    private static Complex admittance(Polarization polarization, Complex n, double k0, double kx) {
        Complex kz = kz(n, k0, kx);
        return polarization == Polarization.S ? kz.divide(k0) : kz.divide(n.square().times(k0));
    }

    /**
     * sqrt(n²k0² − kx²) with Im ≥ 0, as sqrt((n k0 − kx)(n k0 + kx)): near a branch point (kx ≈ n k0) the
     * difference is then exact for real n, and kz carries only the relative rounding of its factors, not
     * the cancellation of two squares (which the Goos–Hänchen derivative near the critical angle would feel).
     */
    private static Complex kz(Complex n, double k0, double kx) {
        Complex nk = n.times(k0);
        return nk.minus(kx).times(nk.plus(kx)).sqrtUpper();
    }

    private static void checkIndex(Complex index, String what) {
        if (index == null || !index.isFinite() || index.re() < 0 || index.im() < 0
                || (index.re() == 0 && index.im() == 0)) {
            throw new IllegalArgumentException(String.format(
                    "%s: index %s must be finite, n + i*kappa with n >= 0 and kappa >= 0 (a passive medium), not zero",
                    what, index));
        }
    }

    private static void checkWavelength(double wavelength) {
        if (!(wavelength > 0) || Double.isInfinite(wavelength)) {
            throw new IllegalArgumentException(String.format("wavelength %g m must be finite and > 0", wavelength));
        }
    }

    private void checkKx(double kx, double k0) {
        if (!(Math.abs(kx) < incidentIndex * k0)) {
            throw new IllegalArgumentException(String.format(
                    "in-plane wavenumber %g rad/m must be below n1*k0 = %g rad/m in magnitude (a propagating incident wave)",
                    kx, incidentIndex * k0));
        }
    }
}
