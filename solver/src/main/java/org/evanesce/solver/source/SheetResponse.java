package org.evanesce.solver.source;

import java.util.List;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.record.FluxLine;
import org.jtransforms.fft.DoubleFFT_1D;

/**
 * The running transforms that pulsed incident sheets ({@link IncidentSheet}, as {@link GaussianBeam} makes them)
 * give on a flux line of an unbounded grid filled with one lossless medium, computed instead of stepped: what an
 * incident-power run with absorbing sides would record, without its grid.
 *
 * <p>The method. The leapfrog update is linear and the same at every step, so the transform
 * X(f) = Σ_n F(t_n) e^{iωt_n} Δt of every field (taken at its own sample time, as {@link FluxLine} does) obeys
 * the update with each step's difference replaced by a factor: with A = −2i sin(ωΔt/2),
 * A·H = S·curl E − S·M and A·E = c_b·curl H − c_b·J exactly (the z-transform of the recurrence at
 * z = e^{iωΔt}, once the fields have died out inside the run; Oppenheim &amp; Schafer, Discrete-Time Signal
 * Processing, 3rd ed. 2010, sec. 3.4, the shift property), where J and M are the transforms of the sheets'
 * soft-current values at the times they are applied, S the Courant number and c_b = S/ε as the kernels hold them
 * (rounded to single precision for a single-precision run). A pulse's envelope is Gaussian, so each cell's source
 * transform is the closed form of the continuous Fourier integral of e(t − d)·Re[P e^{−iω0(t − t0)}] (the sum over
 * steps equals the integral up to aliases at multiples of 1/Δt, which a Gaussian of width τ ≫ Δt makes
 * e^{−(2πτ/Δt)²/2} small; Poisson summation, common practice).
 *
 * <p>Along x the medium is the same everywhere, so a Fourier series in x (FFT of length {@link #size}, at least
 * four times the grid's width so that the images of the periodic sum lie far away) separates the columns: each
 * wavenumber κ = kxΔ gives a three-point recurrence in the rows, −(U_{j+1} + U_{j−1}) + 2cos q·U_j = R_j, with
 * cos q = 1 + 2 sin²(κ/2) − 2ε sin²(ωΔt/2)/S² (the 2D Yee dispersion relation, Taflove &amp; Hagness,
 * Computational Electrodynamics, 3rd ed. 2005, eq. 4.20), whose outgoing solution is the discrete Green's function
 * U_j = Σ i e^{iq|j − j0|}/(2 sin q)·R_{j0} (Im q ≥ 0, Re q ≥ 0 for a travelling wave: outgoing with
 * e^{−iωt}). U is Ez for s (Hx follows from its update) and η0Hz for p (Ex follows from its update); R holds
 * the sheets' terms. What differs from a stepped run: the stepped run's PMLs reflect a little, its window ends
 * with the run (the pulse must have passed the lines), and its fields are rounded to the run's precision.
 */
public final class SheetResponse implements ComputedIncident {

    private final Polarization pol;
    private final double s;
    private final double cb;
    private final int nx;
    private final List<IncidentSheet> sheets;
    private final int size;
    /** Made on first use; the sheets' spectra by ω (every line is filled at the same frequencies). */
    private DoubleFFT_1D fft;
    private final java.util.Map<Double, double[][]> spectraByOmega = new java.util.HashMap<>();

    /**
     * @param courant     the Courant number S = c0Δt/Δ
     * @param gridEpsilon the medium's relative permittivity as the grid holds it (lossless)
     * @param nx          the grid's width in nodes (the sheets' flat indices are j·nx + i)
     * @param sheets      the sheets, each on one row, of the polarization's electric (Ez, Ex) or magnetic (Hx, Hz)
     *                    component, each driven by a {@link GaussianPulse}
     */
    public SheetResponse(Polarization pol, Precision precision, double courant, double gridEpsilon, int nx,
                         List<IncidentSheet> sheets) {
        if (!(gridEpsilon > 0) || !(courant > 0) || nx < 1 || sheets.isEmpty()) {
            throw new IllegalArgumentException(String.format("sheet response: ε %g, Courant number %g, %d columns, %d "
                    + "sheets: need positive values and at least one sheet", gridEpsilon, courant, nx, sheets.size()));
        }
        for (IncidentSheet sh : sheets) {
            if (!supported(pol, sh, nx)) {
                throw new IllegalArgumentException("sheet response: a sheet of " + sh.component() + " driven by "
                        + sh.signal().getClass().getSimpleName() + " is not a pulsed " + pol + " sheet on one row");
            }
        }
        this.pol = pol;
        this.s = precision == Precision.FLOAT ? (float) courant : courant;
        this.cb = precision == Precision.FLOAT ? (float) (courant / gridEpsilon) : courant / gridEpsilon;
        this.nx = nx;
        this.sheets = List.copyOf(sheets);
        this.size = Integer.highestOneBit(Math.max(4 * nx, 64) - 1) << 1;
    }

    /** Whether a sheet can be computed: a pulse, on one row, of the polarization's tangential pair. */
    public static boolean supported(Polarization pol, IncidentSheet sh, int nx) {
        Component c = sh.component();
        boolean pair = pol == Polarization.S ? c == Component.EZ || c == Component.HX : c == Component.EX || c == Component.HZ;
        int row = sh.cells()[0] / nx;
        for (int k : sh.cells()) {
            if (k / nx != row) {
                return false;
            }
        }
        return pair && sh.signal() instanceof GaussianPulse;
    }

    @Override
    public String from() {
        return "the beam's sheets";
    }

    /** The FFT length along x. */
    public int size() {
        return size;
    }

    /**
     * Sets a horizontal line's transforms at each of its frequencies to the computed ones, and its sample counts to
     * {@code steps} (each component is sampled once a step) with time step {@code dt}.
     */
    @Override
    public void fill(FluxLine line, long steps, double dt) {
        if (line.isVertical() || line.electricComponent().polarization != pol) {
            throw new IllegalArgumentException("sheet response: only a horizontal " + pol + " line is computed");
        }
        int n = line.cells();
        for (int q = 0; q < line.frequencyCount(); q++) {
            double[][] eh = fields(line.frequency(q), dt, line.row(), line.firstCell(), n);
            line.setTransforms(q, eh[0], eh[1], eh[2], eh[3]);
        }
        line.setSamples(steps, steps, dt);
    }

    /**
     * The transforms on the line at y = (row + ½)Δ, cells i0 ≤ i &lt; i0 + n, at frequency f (Hz): {E re, E im,
     * H re, H im}, E averaged onto the line as {@link FluxLine} does (s: Ez of rows row and row + 1 with Hx of row;
     * p: Ex of those rows with η0Hz of row).
     */
    double[][] fields(double f, double dt, int row, int i0, int n) {
        double omega = 2 * Math.PI * f;
        double sigma = Math.sin(omega * dt / 2);
        // the sheets' transforms along x, by row and kind
        int[] rows = new int[sheets.size()];
        boolean[] electric = new boolean[sheets.size()];
        for (int k = 0; k < sheets.size(); k++) {
            rows[k] = sheets.get(k).cells()[0] / nx;
            electric[k] = sheets.get(k).component().electric;
        }
        double[][] spectra = spectra(omega);
        double[] e = new double[2 * size];
        double[] h = new double[2 * size];
        double[] vr = new double[sheets.size()];
        double[] vi = new double[sheets.size()];
        double[] mode = new double[4];
        for (int m = 0; m < size; m++) {
            for (int k = 0; k < sheets.size(); k++) {
                vr[k] = spectra[k][2 * m];
                vi[k] = spectra[k][2 * m + 1];
            }
            lineMode(pol == Polarization.S, s, cb, sigma, Math.sin(Math.PI * m / size), row, rows, electric, vr, vi, mode);
            e[2 * m] = mode[0];
            e[2 * m + 1] = mode[1];
            h[2 * m] = mode[2];
            h[2 * m + 1] = mode[3];
        }
        DoubleFFT_1D fft = fft();
        fft.complexInverse(e, true);
        fft.complexInverse(h, true);
        double[][] out = new double[4][n];
        for (int t = 0; t < n; t++) {
            int i = i0 + t;
            out[0][t] = e[2 * i];
            out[1][t] = e[2 * i + 1];
            out[2][t] = h[2 * i];
            out[3][t] = h[2 * i + 1];
        }
        return out;
    }

    /** The sheets' transforms along x at ω (one array per sheet, re and im interleaved), kept once made. */
    private double[][] spectra(double omega) {
        double[][] kept = spectraByOmega.get(omega);
        if (kept != null) {
            return kept;
        }
        DoubleFFT_1D fft = fft();
        double[][] spectra = new double[sheets.size()][];
        for (int k = 0; k < sheets.size(); k++) {
            IncidentSheet sh = sheets.get(k);
            double[] x = new double[2 * size];
            GaussianPulse p = (GaussianPulse) sh.signal();
            for (int t = 0; t < sh.cells().length; t++) {
                int i = sh.cells()[t] % nx;
                double[] g = sourceTransform(p, sh.re()[t], sh.im()[t], sh.delays()[t], omega);
                x[2 * i] += g[0];
                x[2 * i + 1] += g[1];
            }
            fft.complexForward(x);
            spectra[k] = x;
        }
        spectraByOmega.put(omega, spectra);
        return spectra;
    }

    private DoubleFFT_1D fft() {
        if (fft == null) {
            fft = new DoubleFFT_1D(size);
        }
        return fft;
    }

    /**
     * One wavenumber κ of the response (see the class comment): {E re, E im, H re, H im} into {@code out} on the line
     * at y = (row + ½)Δ, from sheets k on rows {@code rows[k]}, electric or magnetic, whose transforms at this κ are
     * vr[k] + i·vi[k].
     *
     * @param s     the Courant number as the kernels hold it
     * @param cb    S/ε as the kernels hold it
     * @param sigma sin(ωΔt/2)
     * @param sx    sin(κ/2)
     */
    static void lineMode(boolean sPol, double s, double cb, double sigma, double sx, int row, int[] rows, boolean[] electric,
                         double[] vr, double[] vi, double[] out) {
        // A = −2iσ (purely imaginary): keep its imaginary part
        double aIm = -2 * sigma;
        double[] u = new double[6]; // U at rows row − 1, row, row + 1 (re, im)
        double c = 1 + 2 * sx * sx - 2 * sigma * sigma / (s * cb);
        // the Green's function i e^{iq|d|}/(2 sin q): g0 = i/(2 sin q) and the step factor e^{iq}
        double g0Re;
        double g0Im;
        double stepRe;
        double stepIm;
        double decay = 1;
        if (c >= 1 || c <= -1) {
            double alpha = acosh(Math.abs(c));
            double sinh = Math.max(Math.sinh(alpha), 1e-300);
            g0Re = (c > 0 ? 1 : -1) / (2 * sinh);
            g0Im = 0;
            stepRe = c > 0 ? 1 : -1;
            stepIm = 0;
            decay = Math.exp(-alpha);
        } else {
            double q = Math.acos(c);
            double sq = Math.max(Math.sin(q), 1e-300);
            g0Re = 0;
            g0Im = 1 / (2 * sq);
            stepRe = Math.cos(q);
            stepIm = Math.sin(q);
        }
        for (int k = 0; k < rows.length; k++) {
            if (vr[k] == 0 && vi[k] == 0) {
                continue;
            }
            int r = rows[k];
            if (sPol == electric[k]) {
                // s: J enters as −(A/S)·J at its row; p: M enters as −(A/c_b)·M at its row
                double coef = -aIm / (electric[k] ? s : cb);
                // multiply by i·coef
                addSource(u, row, r, -coef * vi[k], coef * vr[k], g0Re, g0Im, stepRe, stepIm, decay);
            } else if (sPol) {
                // s: M_j − M_{j−1}: +M at its row, −M at the row above
                addSource(u, row, r, vr[k], vi[k], g0Re, g0Im, stepRe, stepIm, decay);
                addSource(u, row, r + 1, -vr[k], -vi[k], g0Re, g0Im, stepRe, stepIm, decay);
            } else {
                // p: −(J_{j+1} − J_j): +J at its row, −J at the row below
                addSource(u, row, r, vr[k], vi[k], g0Re, g0Im, stepRe, stepIm, decay);
                addSource(u, row, r - 1, -vr[k], -vi[k], g0Re, g0Im, stepRe, stepIm, decay);
            }
        }
        if (sPol) {
            // E on the line: the mean of Ez on rows row and row + 1; Hx(row) = −(S/A)(Ez(row+1) − Ez(row) + M(row))
            out[0] = 0.5 * (u[2] + u[4]);
            out[1] = 0.5 * (u[3] + u[5]);
            double dr = u[4] - u[2] + sheet(rows, electric, vr, false, row);
            double di = u[5] - u[3] + sheet(rows, electric, vi, false, row);
            // −S/A = −S/(i aIm) = i S/aIm
            double f0 = s / aIm;
            out[2] = -f0 * di;
            out[3] = f0 * dr;
        } else {
            // η0Hz on the line is U(row); Ex(j) = (c_b/A)(U(j) − U(j−1) − J(j)), averaged over rows row, row + 1
            out[2] = u[2];
            out[3] = u[3];
            double lr = u[2] - u[0] - sheet(rows, electric, vr, true, row);
            double li = u[3] - u[1] - sheet(rows, electric, vi, true, row);
            double ur = u[4] - u[2] - sheet(rows, electric, vr, true, row + 1);
            double ui = u[5] - u[3] - sheet(rows, electric, vi, true, row + 1);
            // c_b/A = c_b/(i aIm) = −i c_b/aIm
            double f0 = -cb / aIm;
            double sr = 0.5 * (lr + ur);
            double si = 0.5 * (li + ui);
            out[0] = -f0 * si;
            out[1] = f0 * sr;
        }
    }

    /** The sum of the values v[k] of the sheets of one kind on one row. */
    private static double sheet(int[] rows, boolean[] electric, double[] v, boolean electricKind, int row) {
        double sum = 0;
        for (int k = 0; k < v.length; k++) {
            if (rows[k] == row && electric[k] == electricKind) {
                sum += v[k];
            }
        }
        return sum;
    }

    /**
     * Adds R·G(j − r) for j = line − 1, line, line + 1 to u ({re, im} pairs): G(d) = g0·e^{iq|d|}, the power taken
     * as repeated multiplication by the step factor (times {@code decay} for an evanescent mode, whose factor is real).
     */
    private static void addSource(double[] u, int line, int r, double rRe, double rIm, double g0Re, double g0Im,
                                  double stepRe, double stepIm, double decay) {
        for (int t = 0; t < 3; t++) {
            int d = Math.abs(line - 1 + t - r);
            double[] p = power(stepRe, stepIm, decay, d);
            double gr = g0Re * p[0] - g0Im * p[1];
            double gi = g0Re * p[1] + g0Im * p[0];
            u[2 * t] += gr * rRe - gi * rIm;
            u[2 * t + 1] += gr * rIm + gi * rRe;
        }
    }

    /** e^{iqd}: (stepRe + i stepIm)^d for a travelling mode, (±decay)^d for an evanescent one. */
    private static double[] power(double stepRe, double stepIm, double decay, int d) {
        if (stepIm == 0) {
            double mag = Math.pow(decay, d);
            return new double[] {stepRe < 0 && (d & 1) == 1 ? -mag : mag, 0};
        }
        double q = Math.atan2(stepIm, stepRe);
        return new double[] {Math.cos(q * d), Math.sin(q * d)};
    }

    private static double acosh(double x) {
        return Math.log(x + Math.sqrt(x * x - 1));
    }

    /**
     * The transform of one cell's soft-current values g(t) = e(t − d)·Re[P e^{−iω0(t − t0)}] at the times they are
     * applied: ½P e^{iω0t0} I(ω − ω0) + ½P̄ e^{−iω0t0} I(ω + ω0), I(Ω) = √(2π)τ e^{iΩ(d + c)} e^{−Ω²τ²/2}, the
     * envelope e(t) = exp(−(t − c)²/(2τ²)) (see the class comment).
     */
    static double[] sourceTransform(GaussianPulse p, double re, double im, double delay, double omega) {
        double w0 = 2 * Math.PI * p.carrierFrequency();
        double tau = p.tau();
        double centre = delay + p.delay();
        double t0 = p.carrierOrigin();
        double out0 = 0;
        double out1 = 0;
        for (int sgn = -1; sgn <= 1; sgn += 2) {
            // sgn −1: the P term at Ω = ω − ω0; +1: the conjugate term at Ω = ω + ω0
            double big = omega + sgn * w0;
            double mag = 0.5 * Math.sqrt(2 * Math.PI) * tau * Math.exp(-0.5 * big * big * tau * tau);
            if (mag == 0) {
                continue;
            }
            double phase = big * centre - sgn * w0 * t0;
            double pr = re;
            double pi = sgn < 0 ? im : -im;
            double cr = Math.cos(phase);
            double ci = Math.sin(phase);
            out0 += mag * (pr * cr - pi * ci);
            out1 += mag * (pr * ci + pi * cr);
        }
        return new double[] {out0, out1};
    }
}
