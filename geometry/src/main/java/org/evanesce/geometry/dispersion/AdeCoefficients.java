package org.evanesce.geometry.dispersion;

import java.util.Arrays;
import java.util.Objects;
import org.evanesce.geometry.PhysicalConstants;

/**
 * The time stepping of a {@link DispersiveMaterial} on the Yee grid by auxiliary differential
 * equations (ADE): the per-material coefficients as plain doubles, and a reference implementation
 * of one cell's update that the engine's kernels port and the tests drive.
 *
 * <h2>Units</h2>
 * The engine's: Courant number S = c0Δt/Δ, H stored as η0·H, and the electric update
 * {@code e ← ca·e + cb·curl} where curl is the difference of η0·H across the cell (no 1/Δ). Each
 * pole's current J (A/m²) is kept as j = (Δt/ε0)·J, which has the units of E.
 *
 * <h2>Equations</h2>
 * Ampère's law at step n+½, with the conductivity and every pole current averaged over the step
 * (multiplied by Δt/ε0; S·curl = (Δt/ε0)(∇×H)):
 * <pre>
 *   ε∞(E¹ − E⁰) + (σΔt/2ε0)(E¹ + E⁰) + Σ_p (j_p¹ + j_p⁰)/2 = S·curl          (1)
 * </pre>
 * (superscripts 1, 0, −1 are steps n+1, n, n−1). A Drude term (∂J/∂t + γJ = ε0ωp²E) by the
 * trapezoidal rule, g = γΔt/2:
 * <pre>
 *   j¹ = k j⁰ + β (E¹ + E⁰),   k = (1 − g)/(1 + g),   β = (ωp²Δt²/2)/(1 + g)              (2)
 * </pre>
 * which is the Drude ADE of M. Okoniewski, M. Mrozowski, M. A. Stuchly, IEEE Microwave Guided Wave
 * Lett. 7, 121 (1997) (form from memory). A Lorentz term (∂²J/∂t² + γ∂J/∂t + ω0²J = ε0W∂E/∂t), with
 * g = γΔt/2 and w = ω0²Δt²/4:
 * <pre>
 *   (j¹ − 2j⁰ + j⁻¹) + g(j¹ − j⁻¹) + w(j¹ + 2j⁰ + j⁻¹) = (WΔt²/2)(E¹ − E⁻¹)                (3)
 * </pre>
 * This is Taflove &amp; Hagness's Lorentz ADE (<i>Computational Electrodynamics</i>, 3rd ed. (2005),
 * sec. 9.4, from memory) with one change: their restoring term ω0²Δt² j⁰ is replaced by the
 * average w(j¹ + 2j⁰ + j⁻¹). Their centred form is a leapfrog oscillator, unstable once ω0Δt &gt; 2,
 * which Rakić's gold pole at ħω0 = 13.3 eV reaches at about 6 cells per wavelength at 633 nm
 * ({@code AdeStabilityTest} shows the centred form failing there); with the average, (2) and (3) are
 * exactly the bilinear (Tustin) transform s → (2/Δt)(z − 1)/(z + 1) of the continuous terms, whose
 * poles stay inside the unit circle for any ω0, γ ≥ 0. With j¹ = α j⁰ + q⁰ + β E¹ where
 * q⁰ = ξ j⁻¹ − β E⁻¹ is kept instead of j⁻¹ and E⁻¹:
 * <pre>
 *   a = 1 + g + w,   α = (2 − 2w)/a,   ξ = −(1 − g + w)/a,   β = (WΔt²/2)/a
 * </pre>
 * Solving (1) for E¹ gives the ordinary update with modified coefficients followed by a correction
 * (l = σΔt/(2ε0ε∞), P_D = Σ_Drude β/(2ε∞), P_L = Σ_Lorentz β/(2ε∞), A = ε∞(1 + l + P_D + P_L)):
 * <pre>
 *   ca' = (1 − l − P_D)/(1 + l + P_D + P_L),   cb' = S / (ε∞(1 + l + P_D + P_L))
 *   E¹  = ca'·E⁰ + cb'·curl  −  [ Σ_Drude c_p j_p⁰ + Σ_Lorentz (c_p j_p⁰ + c_q q_p⁰) ]
 *   c_p = (1 + k_p)/(2A) (Drude),  c_p = (1 + α_p)/(2A) (Lorentz),  c_q = 1/(2A)
 * </pre>
 * Without poles ca', cb' are Engine's lossy-dielectric coefficients, computed by the same
 * operations (bitwise equal; {@code AdeCoefficientMatchTest} in solver).
 *
 * <h2>How the engine applies it</h2>
 * The ordinary E update runs with ca', cb' in the dispersive cells (CPML corrections and soft
 * sources with cb', as everywhere), then a pass over the dispersive cells only calls
 * {@link #postPass} (or its port) on each: it reads E_ord from the field array, subtracts the
 * correction, stores E¹ back, and advances the state. State per dispersive cell and E site, in
 * this order, {@link DispersiveMaterial#stateSize()} = 1 + N_D + 2 N_L values:
 * <pre>
 *   [ E⁰,  j_1 … j_ND (Drude),  j_1, q_1,  j_2, q_2, … (Lorentz) ]
 * </pre>
 * all zero at the start (fields start at zero). E⁰ is the cell's field after the previous
 * post-pass; nothing else may change the field between two post-passes without also changing E⁰
 * (a flush of tiny values should flush the state too). Rakić's gold (1 Drude + 5 Lorentz terms)
 * keeps 12 values per cell: 48 bytes in float. H updates are unchanged (non-magnetic).
 *
 * <h2>Discrete permittivity</h2>
 * For fields ∝ zⁿ, z = exp(−iωΔt): (E¹ − E⁰)/z^½ = −iΩΔt·E with Ω = (2/Δt) sin(ωΔt/2); (E¹ + E⁰)/(2z^½)
 * = cos(ωΔt/2)·E; (2) and (3) become the continuous ODEs at −iω̃, ω̃ = (2/Δt) tan(ωΔt/2), since
 * (z − 1)/(z + 1) = −i tan(ωΔt/2). Dividing (1) by −iΩΔt and using cos/Ω = 1/ω̃ gives
 * −iΩε0 ε(ω̃) E = ∇×H, i.e. ε_d(ω, Δt) = ε(ω̃) ({@link DispersiveMaterial#discretePermittivity}).
 *
 * <p>Arrays are copied in and out; instances are immutable.
 *
 * @param courant S = c0Δt/Δ
 * @param dt      Δt in seconds
 * @param ca      ca' for the ordinary update
 * @param cb      cb' for the ordinary update
 */
public record AdeCoefficients(double courant, double dt, double ca, double cb, double[] drudeDecay,
                              double[] drudeDrive, double[] drudeCorrection, double[] lorentzCurrent,
                              double[] lorentzMemory, double[] lorentzDrive, double[] lorentzCorrection,
                              double memoryCorrection) {

    public AdeCoefficients {
        int nd = drudeDecay.length;
        int nl = lorentzCurrent.length;
        if (drudeDrive.length != nd || drudeCorrection.length != nd || lorentzMemory.length != nl
                || lorentzDrive.length != nl || lorentzCorrection.length != nl) {
            throw new IllegalArgumentException("coefficient arrays of one kind of term must have equal lengths");
        }
        drudeDecay = drudeDecay.clone();
        drudeDrive = drudeDrive.clone();
        drudeCorrection = drudeCorrection.clone();
        lorentzCurrent = lorentzCurrent.clone();
        lorentzMemory = lorentzMemory.clone();
        lorentzDrive = lorentzDrive.clone();
        lorentzCorrection = lorentzCorrection.clone();
    }

    /**
     * The coefficients of {@code material} for a step Δt (s) at Courant number S.
     *
     * @throws IllegalArgumentException for a non-positive or non-finite S or Δt
     */
    public static AdeCoefficients of(DispersiveMaterial material, double courant, double dt) {
        if (!(courant > 0) || Double.isInfinite(courant) || !(dt > 0) || Double.isInfinite(dt)) {
            throw new IllegalArgumentException(String.format(
                    "Courant number %g and time step %g s must be finite and > 0", courant, dt));
        }
        double epsInf = material.epsInfinity();
        double l = material.conductivity() * dt / (2 * PhysicalConstants.EPS0 * epsInf);
        int nd = material.drude().size();
        int nl = material.lorentz().size();
        double[] k = new double[nd];
        double[] bd = new double[nd];
        double pd = 0;
        for (int p = 0; p < nd; p++) {
            DrudeTerm d = material.drude().get(p);
            double g = d.damping() * dt / 2;
            k[p] = (1 - g) / (1 + g);
            bd[p] = d.plasmaFrequency() * d.plasmaFrequency() * dt * dt / 2 / (1 + g);
            pd += bd[p] / (2 * epsInf);
        }
        double[] alpha = new double[nl];
        double[] xi = new double[nl];
        double[] bl = new double[nl];
        double pl = 0;
        for (int p = 0; p < nl; p++) {
            LorentzTerm t = material.lorentz().get(p);
            double g = t.damping() * dt / 2;
            double w = t.resonance() * t.resonance() * dt * dt / 4;
            double a = 1 + g + w;
            alpha[p] = (2 - 2 * w) / a;
            xi[p] = -(1 - g + w) / a;
            bl[p] = t.weight() * dt * dt / 2 / a;
            pl += bl[p] / (2 * epsInf);
        }
        double den = 1 + l + pd + pl;
        double ca = (1 - l - pd) / den;
        double cb = courant / (epsInf * den);
        double twoA = 2 * epsInf * den;
        double[] cd = new double[nd];
        for (int p = 0; p < nd; p++) {
            cd[p] = (1 + k[p]) / twoA;
        }
        double[] cl = new double[nl];
        for (int p = 0; p < nl; p++) {
            cl[p] = (1 + alpha[p]) / twoA;
        }
        return new AdeCoefficients(courant, dt, ca, cb, k, bd, cd, alpha, xi, bl, cl, 1 / twoA);
    }

    /** Number of Drude terms. */
    public int drudeCount() {
        return drudeDecay.length;
    }

    /** Number of Lorentz terms. */
    public int lorentzCount() {
        return lorentzCurrent.length;
    }

    /** Values of state per dispersive cell: 1 + N_D + 2 N_L (0 without poles). */
    public int stateSize() {
        int n = drudeDecay.length + 2 * lorentzCurrent.length;
        return n == 0 ? 0 : 1 + n;
    }

    /**
     * The correction Σ_Drude c_p j_p⁰ + Σ_Lorentz (c_p j_p⁰ + c_q q_p⁰) that {@link #postPass}
     * subtracts from E_ord, for the state at {@code state[offset …]}. Not modified.
     */
    public static double correction(AdeCoefficients c, double[] state, int offset) {
        double corr = 0;
        int s = offset + 1;
        for (int p = 0; p < c.drudeDecay.length; p++) {
            corr += c.drudeCorrection[p] * state[s + p];
        }
        s += c.drudeDecay.length;
        for (int p = 0; p < c.lorentzCurrent.length; p++) {
            corr += c.lorentzCorrection[p] * state[s + 2 * p] + c.memoryCorrection * state[s + 2 * p + 1];
        }
        return corr;
    }

    /**
     * One dispersive cell's post-pass, the reference the kernels port: given E_ord (the field after
     * the ordinary update with ca', cb'), returns E¹ = E_ord − {@link #correction} and advances the
     * cell's state in {@code state[offset … offset + stateSize())} in place:
     * <pre>
     *   Drude:    j ← k j + β (E¹ + E⁰)
     *   Lorentz:  (j, q) ← (α j + q + β E¹,  ξ j − β E⁰)      (the old j on the right)
     *   E⁰ ← E¹
     * </pre>
     * The sums run in the order written (Drude terms first, then Lorentz), which a port should keep
     * so that float and double paths differ only by rounding.
     */
    public static double postPass(AdeCoefficients c, double[] state, int offset, double eOrdinary) {
        double e0 = state[offset];
        double e1 = eOrdinary - correction(c, state, offset);
        int s = offset + 1;
        for (int p = 0; p < c.drudeDecay.length; p++) {
            state[s + p] = c.drudeDecay[p] * state[s + p] + c.drudeDrive[p] * (e1 + e0);
        }
        s += c.drudeDecay.length;
        for (int p = 0; p < c.lorentzCurrent.length; p++) {
            double j = state[s + 2 * p];
            double q = state[s + 2 * p + 1];
            state[s + 2 * p] = c.lorentzCurrent[p] * j + q + c.lorentzDrive[p] * e1;
            state[s + 2 * p + 1] = c.lorentzMemory[p] * j - c.lorentzDrive[p] * e0;
        }
        state[offset] = e1;
        return e1;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof AdeCoefficients c && Double.compare(courant, c.courant) == 0
                && Double.compare(dt, c.dt) == 0 && Double.compare(ca, c.ca) == 0 && Double.compare(cb, c.cb) == 0
                && Arrays.equals(drudeDecay, c.drudeDecay) && Arrays.equals(drudeDrive, c.drudeDrive)
                && Arrays.equals(drudeCorrection, c.drudeCorrection) && Arrays.equals(lorentzCurrent, c.lorentzCurrent)
                && Arrays.equals(lorentzMemory, c.lorentzMemory) && Arrays.equals(lorentzDrive, c.lorentzDrive)
                && Arrays.equals(lorentzCorrection, c.lorentzCorrection)
                && Double.compare(memoryCorrection, c.memoryCorrection) == 0;
    }

    @Override
    public int hashCode() {
        return Objects.hash(courant, dt, ca, cb, Arrays.hashCode(drudeDecay), Arrays.hashCode(lorentzCurrent),
                memoryCorrection);
    }

    @Override
    public String toString() {
        return String.format("AdeCoefficients[S=%s, dt=%s s, ca=%s, cb=%s, Drude k=%s beta=%s c=%s, Lorentz alpha=%s"
                        + " xi=%s beta=%s c=%s, cq=%s]", courant, dt, ca, cb, Arrays.toString(drudeDecay),
                Arrays.toString(drudeDrive), Arrays.toString(drudeCorrection), Arrays.toString(lorentzCurrent),
                Arrays.toString(lorentzMemory), Arrays.toString(lorentzDrive), Arrays.toString(lorentzCorrection),
                memoryCorrection);
    }

    @Override
    public double[] drudeDecay() {
        return drudeDecay.clone();
    }

    @Override
    public double[] drudeDrive() {
        return drudeDrive.clone();
    }

    @Override
    public double[] drudeCorrection() {
        return drudeCorrection.clone();
    }

    @Override
    public double[] lorentzCurrent() {
        return lorentzCurrent.clone();
    }

    @Override
    public double[] lorentzMemory() {
        return lorentzMemory.clone();
    }

    @Override
    public double[] lorentzDrive() {
        return lorentzDrive.clone();
    }

    @Override
    public double[] lorentzCorrection() {
        return lorentzCorrection.clone();
    }
}
