package org.evanesce.solver.source;

import java.util.List;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.record.FluxLine;

/**
 * The running transforms that a plane wave's sheet (a row of current with the Bloch phase e^{iκi}, κ = kxΔ, as
 * {@link Source#blochRow} makes it) gives on a flux line of a grid with Bloch-periodic sides filled with one lossless
 * medium and open above and below, driven by a pulse, computed instead of stepped: what the incident-power run (or the strip that
 * stands for it) would record, without a grid.
 *
 * <p>The method is {@link SheetResponse}'s with a single wavenumber: every column repeats column 0 with the phase
 * e^{iκi}, so the grid is the discrete one-dimensional problem of κ, the three-point recurrence in the rows and its
 * outgoing discrete Green's function ({@link SheetResponse#lineMode}), per frequency ω with the update's factor
 * A = −2i sin(ωΔt/2) (the z-transform of the leapfrog recurrence at z = e^{iωΔt}, each field at its own sample time:
 * E at nΔt, H at (n − ½)Δt, electric currents at (n + ½)Δt, magnetic ones at nΔt; Oppenheim &amp; Schafer,
 * Discrete-Time Signal Processing, 3rd ed. 2010, sec. 3.4). The fields are complex and the signal real, so the
 * transform at a negative frequency is the conjugate system's: Resp(−ω) = conj Resp(ω).
 *
 * <p>What the lines read, as they read it: the pulse's ({@link GaussianPulse}) transform is the closed form of the
 * continuous Fourier integral (see {@link SheetResponse#sourceTransform}); a line that reads every N-th step
 * ({@link FluxLine#stride}) gets the decimated sum Σ_m F(t_{mN}) e^{iωt_{mN}} NΔt = Σ_{k&lt;N} X(ω + 2πk/(NΔt)) for E
 * and Σ_{k&lt;N} e^{iπk/N} X(ω + 2πk/(NΔt)) for H, whose sample times lie half a step off the stride's grid (each
 * term taken at its frequency folded into (−π/Δt, π/Δt]; the every-step transform of E is periodic in ω with period
 * 2π/Δt, that of H changes sign; the decimation identity of discrete-time signals, Oppenheim &amp; Schafer, sec. 4.6).
 * What differs from a stepped run: its PMLs reflect a little, its window ends with the run (the pulse must have
 * passed the lines), its fields are rounded to the run's precision.
 *
 * <p>Not for a continuous wave: its steady state is easy (the responses at ±ω0), but what the stepped run's window of
 * whole periods holds besides it is not. Near the one-dimensional problem's cut-off (cos q = 1, where an oblique
 * wave's angle reaches 90°) the response grows as 1/sin q, and what the switch-on puts there decays slowly: at 74.8°
 * in glass, 3.5 % above cut-off, the steady state differed from the stepped strip by 1.2 % in incident power after a
 * 30 fs ramp and 160 fs, by 1.9e-4 after an 80 fs ramp and 900 fs (the shipped plasmon example), while the case's own
 * run carries the same remains, which the stepped strip cancels.
 */
public final class PlaneWaveResponse implements ComputedIncident {

    /** Largest relative departure of a sheet's amplitudes from A_0 e^{iκi} taken as the Bloch phase (round-off). */
    static final double PHASE_SLACK = 1e-9;

    private final Polarization pol;
    private final double s;
    private final double cb;
    private final double kappa;
    private final int[] rows;
    private final boolean[] electric;
    /** Each sheet's amplitude at column 0. */
    private final double[] ampRe;
    private final double[] ampIm;
    private final List<Source> sources;

    /**
     * @param courant     the Courant number S = c0Δt/Δ
     * @param gridEpsilon the medium's relative permittivity as the grid holds it (lossless)
     * @param kxDelta     κ = kxΔ, the Bloch sides' phase step from one column to the next, rad
     * @param nx          the grid's width in nodes (the sources' flat indices are j·nx + i)
     * @param sources     the plane wave's sheets ({@link #supported})
     */
    public PlaneWaveResponse(Polarization pol, Precision precision, double courant, double gridEpsilon, double kxDelta,
                             int nx, List<Source> sources) {
        if (!(gridEpsilon > 0) || !(courant > 0) || !Double.isFinite(kxDelta) || !supported(pol, sources, nx, kxDelta)) {
            throw new IllegalArgumentException(String.format("plane-wave response: ε %g, Courant number %g, kxΔ %g, %d "
                    + "sources: need positive values and Bloch rows of the polarization's pair driven by pulses",
                    gridEpsilon, courant, kxDelta, sources.size()));
        }
        this.pol = pol;
        this.s = precision == Precision.FLOAT ? (float) courant : courant;
        this.cb = precision == Precision.FLOAT ? (float) (courant / gridEpsilon) : courant / gridEpsilon;
        this.kappa = kxDelta;
        this.sources = List.copyOf(sources);
        int n = sources.size();
        rows = new int[n];
        electric = new boolean[n];
        ampRe = new double[n];
        ampIm = new double[n];
        for (int k = 0; k < n; k++) {
            Source src = sources.get(k);
            int t = columnZero(src, nx);
            rows[k] = src.cells()[t] / nx;
            electric[k] = src.component().electric;
            ampRe[k] = src.amplitudes()[t];
            ampIm[k] = src.imagAmplitudes()[t];
        }
    }

    /**
     * Whether the sources can be computed: each a whole row of the polarization's tangential pair (Ez or Hx for s, Ex
     * or Hz for p) with amplitudes A_0 e^{iκi} (within {@link #PHASE_SLACK}), each driven by a pulse.
     */
    public static boolean supported(Polarization pol, List<Source> sources, int nx, double kxDelta) {
        if (sources.isEmpty()) {
            return false;
        }
        for (Source src : sources) {
            Component c = src.component();
            boolean pair = pol == Polarization.S ? c == Component.EZ || c == Component.HX : c == Component.EX || c == Component.HZ;
            if (!pair || !(src.signal() instanceof GaussianPulse) || !blochRow(src, nx, kxDelta)) {
                return false;
            }
        }
        return true;
    }

    /**
     * The lowest frequency (Hz) at which the one-dimensional problem of κ carries a wave in a medium of relative
     * permittivity ε (cos q = 1: sin(ωΔt/2) = √(S c_b)·sin(κ/2), the 2D Yee dispersion relation with ky = 0; Taflove
     * &amp; Hagness, Computational Electrodynamics, 3rd ed. 2005, eq. 4.20): an oblique wave's grazing frequency. Its
     * response there grows without bound and what a pulse puts near it leaves the lines slowly.
     */
    public static double cutoff(Precision precision, double courant, double gridEpsilon, double kxDelta, double dt) {
        double s = precision == Precision.FLOAT ? (float) courant : courant;
        double cb = precision == Precision.FLOAT ? (float) (courant / gridEpsilon) : courant / gridEpsilon;
        double sigma = Math.sqrt(s * cb) * Math.abs(Math.sin(kxDelta / 2));
        return sigma >= 1 ? Double.POSITIVE_INFINITY : 2 * Math.asin(sigma) / dt / (2 * Math.PI);
    }

    @Override
    public String from() {
        return "the plane wave's sheet";
    }

    @Override
    public void fill(FluxLine line, long steps, double dt) {
        if (line.isVertical() || line.electricComponent().polarization != pol) {
            throw new IllegalArgumentException("plane-wave response: only a horizontal " + pol + " line is computed");
        }
        if (line.windowStart() > Double.NEGATIVE_INFINITY || line.windowEnd() < Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("plane-wave response: a pulse's line reads the whole run, this one a window");
        }
        int n = line.cells();
        for (int q = 0; q < line.frequencyCount(); q++) {
            double omega = 2 * Math.PI * line.frequency(q);
            double[] x = strided(omega, dt, line.stride(), line.row());
            double[][] out = new double[4][n];
            for (int t = 0; t < n; t++) {
                double phase = kappa * (line.firstCell() + t);
                double c = Math.cos(phase);
                double sn = Math.sin(phase);
                out[0][t] = x[0] * c - x[1] * sn;
                out[1][t] = x[0] * sn + x[1] * c;
                out[2][t] = x[2] * c - x[3] * sn;
                out[3][t] = x[2] * sn + x[3] * c;
            }
            line.setTransforms(q, out[0], out[1], out[2], out[3]);
        }
        line.setSamples(steps / line.stride(), steps / line.stride(), dt);
    }

    /**
     * A pulse's transforms {E re, E im, H re, H im} at column 0 on the line above {@code row}, as a line reading every
     * {@code stride}-th step sums them (see the class comment).
     */
    double[] strided(double omega, double dt, int stride, int row) {
        double[] sum = new double[4];
        for (int k = 0; k < stride; k++) {
            double wk = omega + 2 * Math.PI * k / (stride * dt);
            long p = Math.round(wk * dt / (2 * Math.PI));
            double w = wk - 2 * Math.PI * p / dt;
            if (Math.sin(w * dt / 2) == 0) {
                continue; // a constant: the sheets' signals carry none to speak of, and the update none at all
            }
            double[] vr = new double[sources.size()];
            double[] vi = new double[sources.size()];
            for (int m = 0; m < vr.length; m++) {
                double[] g = SheetResponse.sourceTransform((GaussianPulse) sources.get(m).signal(), 0, 1, 0, w);
                vr[m] = ampRe[m] * g[0] - ampIm[m] * g[1];
                vi[m] = ampRe[m] * g[1] + ampIm[m] * g[0];
            }
            double[] x = response(w, dt, row, vr, vi);
            sum[0] += x[0];
            sum[1] += x[1];
            double sign = (p & 1) == 0 ? 1 : -1;
            double c = sign * Math.cos(Math.PI * k / stride);
            double sn = sign * Math.sin(Math.PI * k / stride);
            sum[2] += x[2] * c - x[3] * sn;
            sum[3] += x[2] * sn + x[3] * c;
        }
        return sum;
    }

    /**
     * The transforms {E re, E im, H re, H im} at column 0 on the line above {@code row} for sheet transforms v at ω
     * (any sign).
     */
    private double[] response(double omega, double dt, int row, double[] vr, double[] vi) {
        boolean negative = omega < 0;
        double sigma = Math.sin(Math.abs(omega) * dt / 2);
        double[] wi = vi;
        if (negative) {
            wi = new double[vi.length];
            for (int k = 0; k < vi.length; k++) {
                wi[k] = -vi[k];
            }
        }
        double[] out = new double[4];
        SheetResponse.lineMode(pol == Polarization.S, s, cb, sigma, Math.sin(kappa / 2), row, rows, electric, vr, wi, out);
        if (negative) {
            out[1] = -out[1];
            out[3] = -out[3];
        }
        return out;
    }

    /** The index of the source's cell in column 0. */
    private static int columnZero(Source src, int nx) {
        int[] cells = src.cells();
        for (int t = 0; t < cells.length; t++) {
            if (cells[t] % nx == 0) {
                return t;
            }
        }
        throw new IllegalArgumentException("plane-wave response: a sheet without a cell in column 0");
    }

    /** Whether the source covers one whole row, each column once, with amplitudes A_0 e^{iκi}. */
    private static boolean blochRow(Source src, int nx, double kappa) {
        int[] cells = src.cells();
        if (cells.length != nx) {
            return false;
        }
        int row = cells[0] / nx;
        boolean[] seen = new boolean[nx];
        for (int k : cells) {
            if (k / nx != row || seen[k % nx]) {
                return false;
            }
            seen[k % nx] = true;
        }
        int t0 = columnZero(src, nx);
        double a0r = src.amplitudes()[t0];
        double a0i = src.imagAmplitudes()[t0];
        double scale = Math.hypot(a0r, a0i);
        if (!(scale > 0)) {
            return false;
        }
        for (int t = 0; t < cells.length; t++) {
            double phase = kappa * (cells[t] % nx);
            double er = a0r * Math.cos(phase) - a0i * Math.sin(phase);
            double ei = a0r * Math.sin(phase) + a0i * Math.cos(phase);
            if (Math.hypot(src.amplitudes()[t] - er, src.imagAmplitudes()[t] - ei) > PHASE_SLACK * scale * Math.max(1, t)) {
                return false;
            }
        }
        return true;
    }
}
