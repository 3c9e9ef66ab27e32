package org.evanesce.solver.farfield;

import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.jtransforms.fft.DoubleFFT_1D;

/**
 * Where light goes after it leaves through a straight line into a homogeneous, lossless half-space: the plane-wave
 * spectrum of the complex fields sampled on the line, the power per unit angle in the exit medium's angles
 * (propagating components only) and the power within an acceptance cone or numerical aperture. A pure function
 * of the samples.
 *
 * <h2>Geometry and conventions</h2>
 * The line is horizontal (the exit half-space {@link Side#TOP above} or {@link Side#BOTTOM below} it) or vertical
 * (exit to the {@link Side#RIGHT right} or {@link Side#LEFT left}); its samples are at s_j = s_0 + jΔ, j = 0 … N − 1,
 * along ŝ = +x (horizontal) or +y (vertical). n̂ is the exit normal. Time dependence exp(−iωt); U = Ez (s) or
 * η0·Hz (p), V the in-plane field's component along ŝ: η0·Hx or Ex on a horizontal line, η0·Hy or Ey on a vertical
 * one; complex amplitudes in V/m. k = n k0. Angles θ in the exit medium are measured from n̂, positive towards +ŝ:
 * a plane wave leaving at θ has the wavenumber κ = k sin θ along the line and k_n = k cos θ along n̂.
 *
 * <h2>Method</h2>
 * The spectrum of each sampled field is its discrete-time Fourier transform, A(κ) = Δ Σ_j F(s_j) e^{−iκ s_j}, at
 * κ_m = 2πm/(MΔ), M = N·oversampling (zero padding interpolates the transform of the finite line; FFT by
 * JTransforms). This is the Fourier integral of the field on the line when the field vanishes beyond its ends;
 * it covers every propagating κ (|κ| &lt; k) without aliasing when Δ ≤ λ0/(2n), which is required. For a plane
 * wave leaving the line (k_n &gt; 0 along n̂), Maxwell's curl equations give V = χ q U with q = k_n/k0 (s) or
 * −k_n/(k0 n²) (p) and the handedness χ = (n̂ × ẑ)·ŝ: +1 for TOP and LEFT, −1 for BOTTOM and RIGHT; a wave
 * arriving from the exit side has V = −χ q U. So each propagating component splits into
 * <pre>
 *     A_out = ½ (A_U + A_V/(χq)),     A_in = ½ (A_U − A_V/(χq)),
 * </pre>
 * and carries, through the line, the time-averaged power (Parseval: ∫ S_n ds = ∫ … dκ/2π)
 * <pre>
 *     dP/dκ = (1/2π) · k_n/(2 k0 f η0) · |A|²,     f = 1 (s), n² (p);     dP/dθ = dP/dκ · k cos θ,
 * </pre>
 * W/m per rad/m and W/(m·rad). Sums over the bins are the midpoint rule in κ: P = Σ_m Δκ dP/dκ(κ_m). Without V
 * (one-way mode, {@code null} arrays) every component is taken as leaving: A_out = A_U. The net flux through the
 * line is also computed directly from the samples, Σ_j Δ S_n(s_j) with S_n = χ Re(U V*)/(2η0) (s) or
 * −χ Re(V U*)/(2η0) (p) ({@link SurfaceFlux}), and from the whole spectrum, evanescent bins included, where
 * the discrete Parseval identity makes the two equal to rounding. For a field made of propagating waves only,
 * the outgoing minus the incoming power then equals the line's flux.
 *
 * <h2>Cones and apertures</h2>
 * {@link #powerWithinCone} sums the outgoing power of the bins whose κ-interval [κ_m − Δκ/2, κ_m + Δκ/2] ∩ (−k, k)
 * lies within [k sin(θ_c − α), k sin(θ_c + α)], counting a partly covered bin by the covered fraction (an error
 * of order Δκ² times the slope of dP/dκ at the cone's edges: use oversampling to shrink it); {@link #powerWithinAperture} is the cone about the normal with sin α = NA/n.
 */
public final class LineSpectrum {

    private final Polarization polarization;
    private final double index;
    private final double k0;
    private final double k;
    private final double dk;
    private final double[] wavenumber;  // κ of the propagating bins, ascending
    private final double[] outRe, outIm, inRe, inIm;
    private final double[] outPower;    // per bin, W/m
    private final double[] inPower;
    private final double lineFlux;
    private final double spectralFlux;

    private LineSpectrum(Polarization polarization, double index, double k0, double dk, double[] wavenumber,
                         double[] outRe, double[] outIm, double[] inRe, double[] inIm, double[] outPower,
                         double[] inPower, double lineFlux, double spectralFlux) {
        this.polarization = polarization;
        this.index = index;
        this.k0 = k0;
        this.k = index * k0;
        this.dk = dk;
        this.wavenumber = wavenumber;
        this.outRe = outRe;
        this.outIm = outIm;
        this.inRe = inRe;
        this.inIm = inIm;
        this.outPower = outPower;
        this.inPower = inPower;
        this.lineFlux = lineFlux;
        this.spectralFlux = spectralFlux;
    }

    /**
     * The spectrum of the fields on a line (class comment).
     *
     * @param polarization  s (U = Ez) or p (U = η0·Hz)
     * @param wavelength    λ0 in vacuum, m; finite, &gt; 0
     * @param index         n of the exit medium; real, finite, &gt; 0
     * @param exit          the side of the line where the exit half-space lies
     * @param firstPosition s_0, m: x of the first sample on a horizontal line, y on a vertical one
     * @param spacing       Δ, m; at most λ0/(2n)
     * @param uRe           Re U at the N samples; not modified
     * @param uIm           Im U; not modified
     * @param vRe           Re V (the in-plane component along the line, class comment), or null for one-way mode
     * @param vIm           Im V, or null (both or neither)
     * @param oversampling  M/N ≥ 1: zero padding for a finer grid of angles
     */
    public static LineSpectrum of(Polarization polarization, double wavelength, double index, Side exit,
                                  double firstPosition, double spacing, double[] uRe, double[] uIm, double[] vRe,
                                  double[] vIm, int oversampling) {
        return of(polarization, wavelength, index, exit, firstPosition, spacing, uRe, uIm, vRe, vIm, 0, oversampling);
    }

    /**
     * The same with the bins at κ = κ_B + 2πm/(MΔ): for fields on one period L = NΔ of a Bloch-periodic line, F(s + L)
     * = e^{iκ_B L} F(s), whose plane waves (the Bloch orders) lie exactly on those bins when M = N, where bins at
     * 2πm/(MΔ) would spread each order over all of them. The samples are multiplied by e^{−iκ_B (s_j − s_0)} before
     * the FFT; everything else is as in the class comment.
     *
     * @param wavenumberOffset κ_B, rad/m; |κ_B| &lt; π/Δ
     */
    public static LineSpectrum of(Polarization polarization, double wavelength, double index, Side exit,
                                  double firstPosition, double spacing, double[] uRe, double[] uIm, double[] vRe,
                                  double[] vIm, double wavenumberOffset, int oversampling) {
        check(polarization, wavelength, index, exit, firstPosition, spacing, uRe, uIm, vRe, vIm, oversampling);
        if (!(Math.abs(wavenumberOffset) < Math.PI / spacing)) {
            throw new IllegalArgumentException(String.format("line spectrum: wavenumber offset %g rad/m must be below pi/spacing"
                    + " = %g rad/m in magnitude", wavenumberOffset, Math.PI / spacing));
        }
        if (wavenumberOffset != 0) {
            double[][] u = demodulate(uRe, uIm, wavenumberOffset, spacing);
            uRe = u[0];
            uIm = u[1];
            if (vRe != null) {
                double[][] v = demodulate(vRe, vIm, wavenumberOffset, spacing);
                vRe = v[0];
                vIm = v[1];
            }
        }
        int n = uRe.length;
        boolean twoWay = vRe != null;
        int m = Math.multiplyExact(n, oversampling);
        double k0 = 2 * Math.PI / wavelength;
        double k = index * k0;
        double dk = 2 * Math.PI / (m * spacing);
        double chi = exit == Side.TOP || exit == Side.LEFT ? 1 : -1;
        double f = polarization == Polarization.S ? 1 : index * index;
        double[] au = transform(uRe, uIm, m);
        double[] av = twoWay ? transform(vRe, vIm, m) : null;

        // the propagating bins in ascending κ: harmonics h with |κ_B + h Δκ| < k
        double kb = wavenumberOffset;
        int hmin = (int) Math.floor((-k - kb) / dk);
        while (kb + hmin * dk <= -k) {
            hmin++;
        }
        int hmax = (int) Math.ceil((k - kb) / dk);
        while (kb + hmax * dk >= k) {
            hmax--;
        }
        int bins = Math.max(0, hmax - hmin + 1);
        double[] kappa = new double[bins];
        double[] outRe = new double[bins];
        double[] outIm = new double[bins];
        double[] inRe = new double[bins];
        double[] inIm = new double[bins];
        double[] outP = new double[bins];
        double[] inP = new double[bins];
        double perBin = dk / (2 * Math.PI) / (2 * k0 * f * PhysicalConstants.ETA0);
        for (int b = 0; b < bins; b++) {
            int h = b + hmin;
            int idx = Math.floorMod(h, m);
            double kap = kb + h * dk;
            double kn = Math.sqrt((k - kap) * (k + kap));
            // e^{−iκ s_0}: the transform's origin moved from the first sample to s = 0
            Complex phase = Complex.polar(spacing, -kap * firstPosition);
            Complex u = Complex.of(au[2 * idx], au[2 * idx + 1]).times(phase);
            Complex out = u;
            Complex in = Complex.ZERO;
            if (twoWay) {
                Complex v = Complex.of(av[2 * idx], av[2 * idx + 1]).times(phase);
                double q = polarization == Polarization.S ? kn / k0 : -kn / (k0 * index * index);
                Complex vq = v.divide(chi * q);
                out = u.plus(vq).times(0.5);
                in = u.minus(vq).times(0.5);
            }
            kappa[b] = kap;
            outRe[b] = out.re();
            outIm[b] = out.im();
            inRe[b] = in.re();
            inIm[b] = in.im();
            outP[b] = perBin * kn * out.norm();
            inP[b] = perBin * kn * in.norm();
        }
        double flux = Double.NaN;
        double spectral = Double.NaN;
        if (twoWay) {
            // S_n = χ Re(U V*)/(2η0) (s), −χ Re(V U*)/(2η0) (p); Re(U V*) = Re(V U*)
            double sign = polarization == Polarization.S ? chi : -chi;
            double direct = 0;
            for (int j = 0; j < n; j++) {
                direct += uRe[j] * vRe[j] + uIm[j] * vIm[j];
            }
            flux = sign * direct * spacing / (2 * PhysicalConstants.ETA0);
            double sum = 0;
            for (int idx = 0; idx < m; idx++) {
                sum += au[2 * idx] * av[2 * idx] + au[2 * idx + 1] * av[2 * idx + 1];
            }
            spectral = sign * sum * spacing * spacing * dk / (2 * Math.PI) / (2 * PhysicalConstants.ETA0);
        }
        return new LineSpectrum(polarization, index, k0, dk, kappa, outRe, outIm, inRe, inIm, outP, inP, flux, spectral);
    }

    /** F_j e^{−iκ_B jΔ}: new arrays {re, im}. */
    private static double[][] demodulate(double[] re, double[] im, double kb, double spacing) {
        double[] r = new double[re.length];
        double[] i = new double[re.length];
        for (int j = 0; j < re.length; j++) {
            double c = Math.cos(kb * j * spacing);
            double sn = -Math.sin(kb * j * spacing);
            r[j] = re[j] * c - im[j] * sn;
            i[j] = re[j] * sn + im[j] * c;
        }
        return new double[][] {r, i};
    }

    private static void check(Polarization polarization, double wavelength, double index, Side exit, double first,
                              double spacing, double[] uRe, double[] uIm, double[] vRe, double[] vIm, int oversampling) {
        if (polarization == null || exit == null) {
            throw new IllegalArgumentException("line spectrum: polarization and exit side are required");
        }
        if (!(wavelength > 0) || Double.isInfinite(wavelength)) {
            throw new IllegalArgumentException(String.format("line spectrum: wavelength %g m must be finite and > 0",
                    wavelength));
        }
        if (!(index > 0) || Double.isInfinite(index)) {
            throw new IllegalArgumentException(String.format(
                    "line spectrum: exit-medium index %g must be real, finite and > 0 (a lossless medium)", index));
        }
        if (!Double.isFinite(first)) {
            throw new IllegalArgumentException(String.format("line spectrum: first position %g m must be finite", first));
        }
        if (!(spacing > 0) || !(spacing <= wavelength / (2 * index))) {
            throw new IllegalArgumentException(String.format(
                    "line spectrum: spacing %g m must be > 0 and at most lambda0/(2n) = %g m, so that every propagating "
                            + "plane wave is sampled", spacing, wavelength / (2 * index)));
        }
        if (oversampling < 1 || oversampling > 1024) {
            throw new IllegalArgumentException(String.format("line spectrum: oversampling %d must be in [1, 1024]",
                    oversampling));
        }
        if (uRe == null || uIm == null || uRe.length == 0 || uIm.length != uRe.length) {
            throw new IllegalArgumentException("line spectrum: U needs real and imaginary parts of the same nonzero length");
        }
        if ((vRe == null) != (vIm == null) || (vRe != null && (vRe.length != uRe.length || vIm.length != uRe.length))) {
            throw new IllegalArgumentException(String.format(
                    "line spectrum: V must be absent (one-way mode) or have %d real and imaginary parts", uRe.length));
        }
        for (double[] a : new double[][] {uRe, uIm, vRe, vIm}) {
            if (a == null) {
                continue;
            }
            for (int j = 0; j < a.length; j++) {
                if (!Double.isFinite(a[j])) {
                    throw new IllegalArgumentException(String.format("line spectrum: sample %d is not finite (%g)", j,
                            a[j]));
                }
            }
        }
    }

    /** Σ_j F_j e^{−2πi hj/M} for h = 0 … M − 1 (JTransforms), interleaved re/im; the input is not modified. */
    private static double[] transform(double[] re, double[] im, int m) {
        double[] a = new double[2 * m];
        for (int j = 0; j < re.length; j++) {
            a[2 * j] = re[j];
            a[2 * j + 1] = im[j];
        }
        new DoubleFFT_1D(m).complexForward(a);
        return a;
    }

    public Polarization polarization() {
        return polarization;
    }

    /** n of the exit medium. */
    public double index() {
        return index;
    }

    /** The number of propagating bins (|κ| &lt; k). */
    public int bins() {
        return wavenumber.length;
    }

    /** Δκ = 2π/(MΔ), rad/m: the spacing of the bins. */
    public double binWidth() {
        return dk;
    }

    /** κ_m of the propagating bins, ascending, rad/m; a new array. */
    public double[] wavenumbers() {
        return wavenumber.clone();
    }

    /** θ_m = arcsin(κ_m/k) of the propagating bins, rad from the exit normal; a new array. */
    public double[] angles() {
        double[] a = new double[wavenumber.length];
        for (int b = 0; b < a.length; b++) {
            a[b] = Math.asin(wavenumber[b] / k);
        }
        return a;
    }

    /** A_out(κ_m), V (V/m times m), with the phase origin at s = 0. */
    public Complex outgoingAmplitude(int bin) {
        return Complex.of(outRe[bin], outIm[bin]);
    }

    /** A_in(κ_m), V; zero in one-way mode. */
    public Complex incomingAmplitude(int bin) {
        return Complex.of(inRe[bin], inIm[bin]);
    }

    /** dP/dθ of the outgoing waves at θ_m, W/(m·rad); a new array. */
    public double[] outgoingPerRadian() {
        return perRadian(outPower);
    }

    /** dP/dθ of the incoming waves (arriving from the exit side) at θ_m, W/(m·rad); a new array. */
    public double[] incomingPerRadian() {
        return perRadian(inPower);
    }

    private double[] perRadian(double[] binPower) {
        double[] d = new double[binPower.length];
        for (int b = 0; b < d.length; b++) {
            double kn = Math.sqrt((k - wavenumber[b]) * (k + wavenumber[b]));
            d[b] = binPower[b] / dk * kn; // dP/dκ · k cos θ
        }
        return d;
    }

    /** Σ over the propagating bins of the outgoing power, W/m. */
    public double outgoingPower() {
        return sum(outPower);
    }

    /** Σ over the propagating bins of the incoming power, W/m (zero in one-way mode). */
    public double incomingPower() {
        return sum(inPower);
    }

    /** The net flux through the line towards the exit side from the samples, Σ_j Δ S_n, W/m; NaN in one-way mode. */
    public double lineFlux() {
        return lineFlux;
    }

    /** The same net flux from the whole spectrum (every bin, evanescent ones included), W/m; NaN in one-way mode. */
    public double spectralFlux() {
        return spectralFlux;
    }

    private static double sum(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s;
    }

    /**
     * The outgoing power within the cone |θ − θ_c| ≤ α, W/m (class comment), the cone clipped to (−π/2, π/2).
     *
     * @param centre θ_c, rad from the exit normal
     * @param half   α ≥ 0, rad
     */
    public double powerWithinCone(double centre, double half) {
        if (!Double.isFinite(centre) || !(half >= 0) || Double.isInfinite(half)) {
            throw new IllegalArgumentException(String.format(
                    "line spectrum: cone centre %g rad must be finite and half-angle %g rad finite and >= 0", centre, half));
        }
        double lo = k * Math.sin(Math.max(centre - half, -Math.PI / 2));
        double hi = k * Math.sin(Math.min(centre + half, Math.PI / 2));
        if (centre - half >= Math.PI / 2 || centre + half <= -Math.PI / 2) {
            return 0;
        }
        double s = 0;
        for (int b = 0; b < wavenumber.length; b++) {
            // the bin stands for κ in [κ_m − Δκ/2, κ_m + Δκ/2] ∩ (−k, k)
            double from = Math.max(-k, wavenumber[b] - dk / 2);
            double to = Math.min(k, wavenumber[b] + dk / 2);
            double a = Math.max(lo, from);
            double c = Math.min(hi, to);
            if (c > a) {
                s += outPower[b] * (c - a) / (to - from);
            }
        }
        return s;
    }

    /**
     * The outgoing power collected by an aperture of numerical aperture NA = n sin α centred on the exit normal,
     * W/m. An NA at or above n collects every propagating wave.
     */
    public double powerWithinAperture(double numericalAperture) {
        if (!(numericalAperture >= 0) || Double.isInfinite(numericalAperture)) {
            throw new IllegalArgumentException(String.format(
                    "line spectrum: numerical aperture %g must be finite and >= 0", numericalAperture));
        }
        double half = numericalAperture >= index ? Math.PI / 2 : Math.asin(numericalAperture / index);
        return powerWithinCone(0, half);
    }
}
