package org.evanesce.solver.source;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.kernel.Engine;
import org.jtransforms.fft.DoubleFFT_1D;

/**
 * A plane wave (continuous or a pulse) inside a closed rectangle of the grid, the total-field/scattered-field
 * method (A. Taflove &amp; S. C. Hagness, <i>Computational Electrodynamics</i>, 3rd ed., 2005, ch. 5): the nodes
 * i0 ≤ i ≤ i1, j0 ≤ j ≤ j1 and the field sites on and inside the rectangle x_{i0} ≤ x ≤ x_{i1}, y_{j0} ≤ y ≤ y_{j1}
 * hold the total field, all others the scattered field. Each update that reaches across the rectangle's edge
 * takes the incident field's value as a correction (Ez, Ex, Ey on the edge with the incident H just outside;
 * the H just outside with the incident E on the edge), so outside the rectangle only what objects inside it
 * scatter remains.
 *
 * <p>The incident field is the grid's own solution, so that nothing leaks: in a homogeneous background the
 * discrete plane wave of {@link GridWave} (numerical wavenumber solved at the wave's direction); in a
 * background layered along y the discrete layered solution of {@link LayeredRows} (incident, reflected and
 * transmitted waves, evanescent beyond the critical angle). What limits the leakage then is the fields'
 * rounding (single precision: about 1e-7 of the field per update, accumulated over the run) and, for a
 * continuous wave, the switching on (the ramp starts everywhere on the edge at once, so what leaks is a
 * transient that leaves through the PML).
 *
 * <p>Signals: a ramped continuous wave ({@link RampedContinuous}) has at steady state the incident z component
 * (Ez for s, η0Hz for p) A·sin(2πf t) at the reference point (phasor iA with exp(−iωt)), any background.
 * A pulse ({@link GaussianPulse} or {@link DifferentiatedGaussian}, homogeneous background only) has A·g(t − T)
 * there, T = {@link #pulseDelay()} (zero when the reference point is where the wave enters the box),
 * every frequency carried as the grid's plane wave of that frequency: the incident values of each edge site
 * are tabulated per step ({@link SampledSheet}) from the pulse's discrete spectrum, each frequency given its own
 * numerical wavenumber and component ratios (a per-frequency method rather than an auxiliary 1D grid: exact
 * for every frequency, at the cost of storing each edge site's values while the pulse passes, about twice
 * the pulse's length in steps per site, in single precision).
 */
public final class TotalFieldBox {

    /**
     * @param polarization s or p
     * @param direction    φ, the direction of travel in radians from +x (layered: in the incidence medium, which is
     *                     the bottom rows' when sin φ &gt; 0 and the top rows' when sin φ &lt; 0)
     * @param amplitude    A, V/m, of the incident z component
     * @param signal       a {@link RampedContinuous} wave, a {@link GaussianPulse} or a {@link DifferentiatedGaussian}
     * @param referenceX   x of the point where the incident z component is A·g(t) (its phase origin), m
     * @param referenceY   y of that point, m
     */
    public record Spec(Polarization polarization, double direction, double amplitude, TimeSignal signal, double referenceX,
                       double referenceY) {
        public Spec {
            if (polarization == null || signal == null || !Double.isFinite(direction) || !Double.isFinite(amplitude)
                    || !Double.isFinite(referenceX) || !Double.isFinite(referenceY)) {
                throw new IllegalArgumentException(String.format("total-field box: polarization and signal are required, "
                        + "direction %g, amplitude %g and reference (%g, %g) must be finite", direction, amplitude,
                        referenceX, referenceY));
            }
            if (!(signal instanceof RampedContinuous || signal instanceof GaussianPulse
                    || signal instanceof DifferentiatedGaussian)) {
                throw new IllegalArgumentException("total-field box: the signal must be a ramped continuous wave, a Gaussian "
                        + "pulse or a differentiated Gaussian; got " + signal);
            }
        }
    }

    /** Tabulated values below this fraction of the amplitude are set to zero (single precision keeps 6e-8 of it). */
    static final double TINY = 1e-12;

    private final Spec spec;
    private final int nx;
    private final int i0, j0, i1, j1;
    private final double dx, courant, dt, x0, y0;
    /** Homogeneous background: its permittivity; NaN when layered. */
    private final double epsilon;
    private final double[] epsFirst, epsSecond;
    private final List<IncidentSheet> continuous = new ArrayList<>();
    private final List<SampledSheet> sampled = new ArrayList<>();

    /** One corrected site: the component updated, its node, the incident component it takes, where, and the sign. */
    private record Term(Component target, int i, int j, Component incident, int ii, int jj, int sign) { }

    private TotalFieldBox(Spec spec, MaterialGrid grid, double courant, int i0, int j0, int i1, int j1) {
        this.spec = spec;
        this.nx = grid.nx();
        this.i0 = i0;
        this.j0 = j0;
        this.i1 = i1;
        this.j1 = j1;
        this.dx = grid.cellSize();
        this.courant = courant;
        this.dt = Courant.timeStep(courant, dx);
        this.x0 = grid.x0();
        this.y0 = grid.y0();
        boolean s = spec.polarization() == Polarization.S;
        epsFirst = column(grid, s ? FieldSite.EZ : FieldSite.EX, i0 - 1);
        epsSecond = s ? null : column(grid, FieldSite.EY, i0 - 1);
        double[] right = column(grid, s ? FieldSite.EZ : FieldSite.EX, i1 + 1);
        if (!java.util.Arrays.equals(epsFirst, right)) {
            throw new IllegalArgumentException(String.format("total-field box from column %d to %d: the background left of it "
                    + "differs from the background right of it; the medium outside the box must be homogeneous or layered "
                    + "along y only", i0, i1));
        }
        boolean homogeneous = true;
        for (int j = 0; j < epsFirst.length - 1; j++) {
            homogeneous &= epsFirst[j] == epsFirst[0] && (s || epsSecond[j] == epsFirst[0]);
        }
        epsilon = homogeneous ? epsFirst[0] : Double.NaN;
        if (!homogeneous && !(spec.signal() instanceof RampedContinuous)) {
            throw new IllegalArgumentException("total-field box: a pulse needs a homogeneous background; in a layered one "
                    + "use a ramped continuous wave");
        }
    }

    private static double[] column(MaterialGrid grid, FieldSite site, int i) {
        double[] out = new double[grid.ny()];
        for (int j = 0; j < out.length; j++) {
            Material m = grid.material(site, i, j);
            if (m.conductivity() != 0) {
                throw new IllegalArgumentException(String.format("total-field box: the background at column %d row %d (%s) "
                        + "has conductivity %g S/m; the background must be lossless", i, j, m.name(), m.conductivity()));
            }
            out[j] = m.relativePermittivity();
        }
        return out;
    }

    /**
     * Plans the box: the corrections on the rectangle of nodes (i0, j0)–(i1, j1) of the grid.
     *
     * @param grid    the run's material grid: the background is read from the columns just left and right of the box
     * @param sides   the run's boundaries (the box must lie where the update runs, outside any PML)
     * @param courant the run's Courant number
     * @throws IllegalArgumentException when the box does not fit, the background is neither homogeneous nor layered,
     *                                  or the grid cannot carry the wave
     */
    public static TotalFieldBox plan(Spec spec, MaterialGrid grid, Map<Side, Boundary> sides, double courant, int i0, int j0,
                                     int i1, int j1) {
        int nx = grid.nx();
        int ny = grid.ny();
        int left = layers(sides, Side.LEFT);
        int right = layers(sides, Side.RIGHT);
        int bottom = layers(sides, Side.BOTTOM);
        int top = layers(sides, Side.TOP);
        if (sides.get(Side.LEFT) instanceof Boundary.Bloch) {
            throw new IllegalArgumentException("a total-field box needs non-periodic left and right sides (a PML, PEC or PMC): "
                    + "the box's plane wave is infinite only inside the box");
        }
        if (!(i0 < i1 && j0 < j1) || i0 - 1 < Math.max(1, left) || j0 - 1 < Math.max(1, bottom)
                || i1 + 1 > nx - 2 - Math.max(0, right) || j1 + 1 > ny - 2 - Math.max(0, top)) {
            throw new IllegalArgumentException(String.format("total-field box of nodes (%d, %d) to (%d, %d) must have i0 < i1, "
                    + "j0 < j1 and lie at least one cell inside the %d x %d grid's walls and PML layers (left %d, right %d, "
                    + "bottom %d, top %d)", i0, j0, i1, j1, nx, ny, left, right, bottom, top));
        }
        TotalFieldBox box = new TotalFieldBox(spec, grid, courant, i0, j0, i1, j1);
        box.build(sides, ny);
        return box;
    }

    private static int layers(Map<Side, Boundary> sides, Side s) {
        return sides.get(s) instanceof Boundary.Pml p ? p.parameters().layers() : 0;
    }

    /** The corrections of the class comment (signs derived from the kernels' update lines). */
    private List<Term> terms() {
        List<Term> t = new ArrayList<>();
        if (spec.polarization() == Polarization.S) {
            for (int j = j0; j <= j1; j++) {
                t.add(new Term(Component.EZ, i0, j, Component.HY, i0 - 1, j, 1));
                t.add(new Term(Component.HY, i0 - 1, j, Component.EZ, i0, j, 1));
                t.add(new Term(Component.EZ, i1, j, Component.HY, i1, j, -1));
                t.add(new Term(Component.HY, i1, j, Component.EZ, i1, j, -1));
            }
            for (int i = i0; i <= i1; i++) {
                t.add(new Term(Component.EZ, i, j0, Component.HX, i, j0 - 1, -1));
                t.add(new Term(Component.HX, i, j0 - 1, Component.EZ, i, j0, -1));
                t.add(new Term(Component.EZ, i, j1, Component.HX, i, j1, 1));
                t.add(new Term(Component.HX, i, j1, Component.EZ, i, j1, 1));
            }
        } else {
            for (int i = i0; i < i1; i++) {
                t.add(new Term(Component.EX, i, j0, Component.HZ, i, j0 - 1, 1));
                t.add(new Term(Component.HZ, i, j0 - 1, Component.EX, i, j0, 1));
                t.add(new Term(Component.EX, i, j1, Component.HZ, i, j1, -1));
                t.add(new Term(Component.HZ, i, j1, Component.EX, i, j1, -1));
            }
            for (int j = j0; j < j1; j++) {
                t.add(new Term(Component.EY, i0, j, Component.HZ, i0 - 1, j, -1));
                t.add(new Term(Component.HZ, i0 - 1, j, Component.EY, i0, j, -1));
                t.add(new Term(Component.EY, i1, j, Component.HZ, i1, j, 1));
                t.add(new Term(Component.HZ, i1, j, Component.EY, i1, j, 1));
            }
        }
        return t;
    }

    private void build(Map<Side, Boundary> sides, int ny) {
        List<Term> all = terms();
        for (Term t : all) {
            if (!Engine.wouldUpdate(sides, nx, ny, t.target(), t.i(), t.j())) {
                throw new IllegalStateException("total-field box site " + t + " is not updated");
            }
        }
        Spectrum sp = spec.signal() instanceof RampedContinuous ? null : spectrum(pulseLength());
        if (sp != null) {
            // the wave must reach the box's edge no earlier than step 0: delay it if the reference point is not upstream
            long earliest = Long.MAX_VALUE;
            for (Term t : all) {
                earliest = Math.min(earliest, shift(sp, t));
            }
            delaySteps = Math.max(0, -earliest);
        }
        for (Component c : spec.polarization().components()) {
            List<Term> mine = all.stream().filter(t -> t.target() == c).toList();
            if (spec.signal() instanceof RampedContinuous r) {
                continuous.add(continuousSheet(c, mine, r));
            } else {
                sampled.add(sampledSheet(c, mine, sp));
            }
        }
    }

    /** Steps by which a pulse is delayed so that it starts outside the box (see {@link #pulseDelay()}). */
    private long delaySteps;

    /**
     * For a pulse, the delay T (s, whole steps) such that the incident z component at the reference point is
     * A·g(t − T): zero when the reference point lies where the wave enters the box or upstream of it, else
     * what keeps every edge site quiet before step 0. Zero for a continuous wave.
     */
    public double pulseDelay() {
        return delaySteps * dt;
    }

    private int pulseLength() {
        TimeSignal g = spec.signal();
        double duration = g instanceof GaussianPulse p ? 2 * p.delay() : 12 * ((DifferentiatedGaussian) g).width();
        return (int) Math.ceil(duration / dt) + 1;
    }

    /** The whole steps by which a term's window follows the reference point's (its incident site's group delay). */
    private long shift(Spectrum sp, Term t) {
        Component inc = t.incident();
        double x = siteX(inc, t.ii());
        double y = siteY(inc, t.jj());
        return Math.round((x * Math.cos(spec.direction()) + y * Math.sin(spec.direction())) * sp.groupSlowness / dt);
    }

    private IncidentSheet continuousSheet(Component c, List<Term> terms, RampedContinuous signal) {
        double f = signal.frequency();
        int m = terms.size();
        int[] cells = new int[m];
        double[] re = new double[m];
        double[] im = new double[m];
        // the z component is A·sin(ωt) = Re[iA e^{−iωt}] at the reference point
        Complex scale = Complex.of(0, spec.amplitude());
        LayeredRows rows = Double.isNaN(epsilon) ? layered(f) : null;
        for (int q = 0; q < m; q++) {
            Term t = terms.get(q);
            cells[q] = t.j() * nx + t.i();
            Complex p = (rows != null ? rows.at(t.incident(), t.ii(), t.jj()) : homogeneous(t.incident(), t.ii(), t.jj(), f))
                    .times(scale).times(t.sign());
            re[q] = p.re();
            im[q] = p.im();
        }
        return new IncidentSheet(c, cells, re, im, new double[m], signal);
    }

    private LayeredRows layered(double f) {
        return new LayeredRows(spec.polarization(), epsFirst, epsSecond, spec.direction(), 2 * Math.PI * f, dx, courant, x0,
                y0, spec.referenceX(), spec.referenceY());
    }

    /**
     * The incident phasor (exp(−iωt)) of component c at its site of node (i, j) at frequency f, for an incident z
     * component of 1 at the reference point; every component at its own time level (E at whole, H at half steps).
     *
     * @throws IllegalArgumentException when the grid carries no such wave
     */
    public Complex unitPhasor(Component c, int i, int j, double f) {
        return Double.isNaN(epsilon) ? layered(f).at(c, i, j) : homogeneous(c, i, j, f);
    }

    /**
     * The incident z component's phasor (exp(−iωt); Ez for s, η0·Hz for p) at the point (x, y), m, at frequency f, in
     * a homogeneous background: i·A·e^{i k·(r − r_ref)} with the grid's own wavenumber k (the wave is A·sin(2πft) at
     * the reference point). A point anywhere, not only a node: for the optical theorem's forward amplitude.
     *
     * @throws IllegalArgumentException when the background is layered or the grid carries no such wave
     */
    public Complex zPhasorAt(double x, double y, double f) {
        if (layered()) {
            throw new IllegalArgumentException("total-field box: a layered background has no single plane wave");
        }
        double omega = 2 * Math.PI * f;
        double k = GridWave.wavenumber(epsilon, spec.direction(), omega, dx, courant);
        if (Double.isNaN(k)) {
            throw new IllegalArgumentException(String.format("the grid (cell %g m) carries no wave of %g Hz in a medium of "
                    + "ε = %g; refine the grid", dx, f, epsilon));
        }
        Complex phase = GridWave.phase(k * Math.cos(spec.direction()), k * Math.sin(spec.direction()), x - spec.referenceX(),
                y - spec.referenceY());
        return phase.times(new Complex(0, spec.amplitude()));
    }

    /**
     * The relative permittivity of the medium the incident wave comes from: the homogeneous background's, or in a
     * layered one the bottom rows' when the wave travels upwards and the top rows' when downwards.
     */
    public double incidenceMediumPermittivity() {
        if (!layered()) {
            return epsilon;
        }
        return Math.sin(spec.direction()) > 0 ? epsFirst[0] : epsFirst[epsFirst.length - 2];
    }

    private Complex homogeneous(Component c, int i, int j, double f) {
        double omega = 2 * Math.PI * f;
        double k = GridWave.wavenumber(epsilon, spec.direction(), omega, dx, courant);
        if (Double.isNaN(k)) {
            throw new IllegalArgumentException(String.format("the grid (cell %g m) carries no wave of %g Hz in a medium of "
                    + "ε = %g; refine the grid", dx, f, epsilon));
        }
        double kx = k * Math.cos(spec.direction());
        double ky = k * Math.sin(spec.direction());
        double ratio = GridWave.ratio(c, kx, ky, epsilon, dx, courant, Math.sin(omega * dt / 2));
        return GridWave.phase(kx, ky, siteX(c, i), siteY(c, j)).times(ratio);
    }

    private double siteX(Component c, int i) {
        return x0 + (i + c.dx) * dx - spec.referenceX();
    }

    private double siteY(Component c, int j) {
        return y0 + (j + c.dy) * dx - spec.referenceY();
    }

    /** The pulse's incident values per site and step (class comment). */
    private SampledSheet sampledSheet(Component c, List<Term> terms, Spectrum sp) {
        int size = sp.size;
        int m = terms.size();
        int[] cells = new int[m];
        long[] first = new long[m];
        float[] values = new float[m * size];
        double[] work = new double[2 * size];
        DoubleFFT_1D fft = new DoubleFFT_1D(size);
        for (int q = 0; q < m; q++) {
            Term t = terms.get(q);
            cells[q] = t.j() * nx + t.i();
            Component inc = t.incident();
            double x = siteX(inc, t.ii());
            double y = siteY(inc, t.jj());
            long shift = shift(sp, t);
            double delay = shift * dt + (inc.electric ? 0 : dt / 2);
            java.util.Arrays.fill(work, 0);
            for (int b = 1; b < size / 2; b++) {
                if (sp.kx[b] == 0 && sp.ky[b] == 0) {
                    continue;
                }
                double ratio = GridWave.ratio(inc, sp.kx[b], sp.ky[b], epsilon, dx, courant, sp.w[b]);
                // e^{i k̃·r} e^{−iωδ}: the site's phase and its window's time shift
                double phase = sp.kx[b] * x + sp.ky[b] * y - sp.omega[b] * delay;
                double pr = ratio * Math.cos(phase);
                double pi = ratio * Math.sin(phase);
                double rr = sp.re[b];
                double ri = sp.im[b];
                work[2 * b] = rr * pr - ri * pi;
                work[2 * b + 1] = rr * pi + ri * pr;
                // the negative frequency: the conjugate (a real field)
                work[2 * (size - b)] = work[2 * b];
                work[2 * (size - b) + 1] = -work[2 * b + 1];
            }
            fft.complexForward(work);
            for (int n = 0; n < size; n++) {
                double v = t.sign() * work[2 * n] / size;
                // the pulse's far tails (and the transform's rounding) are kept out of the fields: values near the
                // subnormal range would slow every update they touch
                values[q * size + n] = Math.abs(v) < TINY * Math.abs(spec.amplitude()) ? 0f : (float) v;
            }
            first[q] = shift + delaySteps - sp.lead;
        }
        return new SampledSheet(c, cells, first, size, values);
    }

    /**
     * The pulse sampled at whole steps in a window of {@code size} steps that starts {@code lead} steps before it
     * (the reference series), its transform R_b = Σ r_n e^{+iω_b nΔt} (so r_n = (1/N) Σ R_b e^{−iω_b nΔt}, the
     * exp(−iωt) convention), the grid's wavenumber at each frequency, and the group slowness dk̃/dω at the
     * spectrum's centroid, which sets each site's window.
     */
    private record Spectrum(int size, int lead, double[] re, double[] im, double[] omega, double[] w, double[] kx,
                            double[] ky, double groupSlowness) { }

    private Spectrum spectrum(int length) {
        // room for the pulse, the spread the grid's dispersion adds across the box, and margins
        double span = Math.hypot(i1 - i0 + 2, j1 - j0 + 2) * dx;
        int size = Integer.highestOneBit(Math.max(64, 2 * length + 64) - 1) << 1;
        for (int attempt = 0; ; attempt++) {
            Spectrum sp = spectrum(length, size);
            double spread = 0;
            double peak = 0;
            for (int b = 1; b < size / 2; b++) {
                peak = Math.max(peak, Math.hypot(sp.re[b], sp.im[b]));
            }
            for (int b = 2; b < size / 2 - 1; b++) {
                if (Math.hypot(sp.re[b], sp.im[b]) > 1e-7 * peak && sp.kx[b + 1] != 0 && sp.kx[b - 1] != 0) {
                    double k1 = Math.hypot(sp.kx[b + 1], sp.ky[b + 1]);
                    double k0 = Math.hypot(sp.kx[b - 1], sp.ky[b - 1]);
                    double slowness = (k1 - k0) / (sp.omega[b + 1] - sp.omega[b - 1]);
                    spread = Math.max(spread, Math.abs(slowness - sp.groupSlowness) * span / dt);
                }
            }
            if (2 * length + 4 * spread + 64 <= size || attempt > 6) {
                return sp;
            }
            size *= 2;
        }
    }

    private Spectrum spectrum(int length, int size) {
        int lead = (size - length) / 2;
        double[] work = new double[2 * size];
        for (int n = 0; n < size; n++) {
            work[2 * n] = spec.amplitude() * spec.signal().value((n - lead) * dt);
        }
        new DoubleFFT_1D(size).complexInverse(work, false);
        double[] re = new double[size / 2];
        double[] im = new double[size / 2];
        double[] omega = new double[size / 2];
        double[] w = new double[size / 2];
        double[] kx = new double[size / 2];
        double[] ky = new double[size / 2];
        double weight = 0;
        double moment = 0;
        for (int b = 1; b < size / 2; b++) {
            omega[b] = 2 * Math.PI * b / (size * dt);
            w[b] = Math.sin(omega[b] * dt / 2);
            double k = GridWave.wavenumber(epsilon, spec.direction(), omega[b], dx, courant);
            if (Double.isNaN(k)) {
                continue; // beyond the grid's cut-off: a well-resolved pulse has nothing there
            }
            re[b] = work[2 * b];
            im[b] = work[2 * b + 1];
            kx[b] = k * Math.cos(spec.direction());
            ky[b] = k * Math.sin(spec.direction());
            double e = re[b] * re[b] + im[b] * im[b];
            weight += e;
            moment += e * omega[b];
        }
        double centre = moment / weight;
        double h = 1e-4 * centre;
        double slowness = (GridWave.wavenumber(epsilon, spec.direction(), centre + h, dx, courant)
                - GridWave.wavenumber(epsilon, spec.direction(), centre - h, dx, courant)) / (2 * h);
        return new Spectrum(size, lead, re, im, omega, w, kx, ky, slowness);
    }

    /** The sheets of a continuous wave (empty for a pulse): add each with {@code Simulation.Builder.incident}. */
    public List<IncidentSheet> continuousSheets() {
        return List.copyOf(continuous);
    }

    /** The tabulated sheets of a pulse (empty for a continuous wave). */
    public List<SampledSheet> sampledSheets() {
        return List.copyOf(sampled);
    }

    /** Whether the background is layered (else homogeneous). */
    public boolean layered() {
        return Double.isNaN(epsilon);
    }

    /** The box's nodes {i0, j0, i1, j1}. */
    public int[] nodes() {
        return new int[] {i0, j0, i1, j1};
    }

    public Spec spec() {
        return spec;
    }
}
