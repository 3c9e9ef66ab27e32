package org.evanesce.solver;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.SeriesCoefficients;
import org.evanesce.geometry.dispersion.SeriesMaterial;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.kernel.Engine;
import org.evanesce.solver.record.StepListener;
import org.evanesce.solver.record.StepView;
import org.evanesce.solver.parallel.BandTeam;
import org.evanesce.solver.parallel.RowWork;
import org.evanesce.solver.source.IncidentSheet;
import org.evanesce.solver.source.SampledSheet;
import org.evanesce.solver.source.Source;

/**
 * A planned 2D Yee-grid run: fields, coefficients, boundaries, sources and threads, stepped on
 * demand. Everything that can be computed before stepping is computed by {@link Builder#build()}.
 *
 * <p>Conventions: the time step is Δt = SΔ/c0 with S the Courant number; after step n the
 * electric field is at nΔt and the magnetic field (stored as η0·H) at (n − ½)Δt.
 * Electric sources act as currents at (n + ½)Δt, magnetic sources at nΔt.
 *
 * <p>Close the simulation to stop its worker threads.
 */
public final class Simulation implements StepView, AutoCloseable {

    /**
     * The fewest cells a thread must have before the team uses another ({@link Builder#minCellsPerThread}'s
     * default): handing a band over costs more than a smaller band's step.
     */
    public static final int MIN_CELLS_PER_THREAD = 1 << 15;

    private final Engine engine;
    private final BandTeam team;
    private final double dt;
    private final double cellSize;
    private final double courant;
    private final Polarization polarization;
    private final Precision precision;
    private final Source[] sources;
    private final int[] sourceTermStart;
    /** Per source: real and imaginary amplitudes, copied once (the step loop must not allocate). */
    private final double[][] sourceRe, sourceIm;
    /** Incident-field sheets (beams), their terms after the plain sources'. */
    private final IncidentSheet[] sheets;
    private final int[] sheetTermStart;
    /** The sheets' terms' values, computed per row by the bands where the engine allows ({@link #sheetsByRow}). */
    private final SheetTerms sheetTerms;
    private final boolean sheetsByRow;
    /** Tabulated sheets (a total-field box's pulse), their terms after the incident sheets'. */
    private final SampledSheet[] tables;
    private final int[] tableTermStart;
    private final int flushInterval;
    private final double divergenceLimit;
    private final List<StepListener> listeners;
    /** The dispersive materials by material index (empty for a dielectric-only run). */
    private final Map<Integer, DispersiveMaterial> dispersive;
    private final BandTeam.Phase plain;
    private final BandTeam.Phase flushing;
    /** The recorders the worker threads share after each step (issue 18). */
    private final SharedRecorders shared;
    /** After the step's phases: the smoothing's cross terms (p), or null; then the shared recorders. */
    private final BandTeam.After coupled;
    private final BandTeam.After coupledThenShared;
    private long step;

    private Simulation(Builder b, double dt) {
        MaterialGrid g = b.grid;
        this.dt = dt;
        this.cellSize = g.cellSize();
        this.courant = b.courant;
        this.polarization = b.polarization;
        this.precision = b.precision;
        this.sources = b.sources.toArray(new Source[0]);
        this.flushInterval = b.flushInterval;
        this.listeners = new ArrayList<>(b.listeners);
        double[][] coefficients = MaterialCoefficients.of(g.materials(), b.courant, dt);
        AdeCoefficients[] ade = null;
        if (!b.dispersive.isEmpty()) {
            ade = new AdeCoefficients[g.materials().size()];
            for (Map.Entry<Integer, DispersiveMaterial> e : b.dispersive.entrySet()) {
                AdeCoefficients c = AdeCoefficients.of(e.getValue(), b.courant, dt);
                coefficients[0][e.getKey()] = c.ca();
                coefficients[1][e.getKey()] = c.cb();
                ade[e.getKey()] = c.stateSize() > 0 ? c : null;
            }
        }
        SeriesCoefficients[] series = null;
        if (!b.series.isEmpty()) {
            series = new SeriesCoefficients[g.materials().size()];
            for (Map.Entry<Integer, SeriesMaterial> e : b.series.entrySet()) {
                SeriesCoefficients c = SeriesCoefficients.of(e.getValue(), b.courant, dt);
                coefficients[0][e.getKey()] = 1;
                coefficients[1][e.getKey()] = c.cb();
                series[e.getKey()] = c;
            }
        }
        dispersive = Map.copyOf(b.dispersive);
        engine = Engine.create(g, b.polarization, b.precision, b.courant, coefficients[0], coefficients[1], ade, series,
                b.sides);
        if (b.vectorsFromStart) {
            engine.vectorAfter(0);
        } else if (b.scalarOnly) {
            engine.vectorAfter(Long.MAX_VALUE);
        }
        if (b.flatRuns != null) {
            engine.flatRuns(b.flatRuns);
        }
        sourceTermStart = new int[sources.length + 1];
        int n = 0;
        double amplitudeSum = 0;
        for (int q = 0; q < sources.length; q++) {
            sourceTermStart[q] = n;
            n += sources[q].cells().length;
            for (double a : sources[q].amplitudes()) {
                amplitudeSum += Math.abs(a);
            }
        }
        sourceTermStart[sources.length] = n;
        sheets = b.sheets.toArray(new IncidentSheet[0]);
        sheetTermStart = new int[sheets.length];
        for (int q = 0; q < sheets.length; q++) {
            sheetTermStart[q] = n;
            n += sheets[q].cells().length;
            for (int t = 0; t < sheets[q].cells().length; t++) {
                amplitudeSum += Math.hypot(sheets[q].re()[t], sheets[q].im()[t]);
            }
        }
        tables = b.tables.toArray(new SampledSheet[0]);
        tableTermStart = new int[tables.length];
        for (int q = 0; q < tables.length; q++) {
            tableTermStart[q] = n;
            n += tables[q].cells().length;
            amplitudeSum += tables[q].peak() * tables[q].cells().length;
        }
        sourceRe = new double[sources.length][];
        sourceIm = new double[sources.length][];
        for (int q = 0; q < sources.length; q++) {
            sourceRe[q] = sources[q].amplitudes();
            sourceIm[q] = sources[q].imagAmplitudes();
        }
        int[] cells = new int[n];
        Component[] comps = new Component[n];
        for (int q = 0; q < sources.length; q++) {
            int[] c = sources[q].cells();
            System.arraycopy(c, 0, cells, sourceTermStart[q], c.length);
            java.util.Arrays.fill(comps, sourceTermStart[q], sourceTermStart[q + 1], sources[q].component());
        }
        for (int q = 0; q < sheets.length; q++) {
            int[] c = sheets[q].cells();
            System.arraycopy(c, 0, cells, sheetTermStart[q], c.length);
            java.util.Arrays.fill(comps, sheetTermStart[q], sheetTermStart[q] + c.length, sheets[q].component());
        }
        for (int q = 0; q < tables.length; q++) {
            int[] c = tables[q].cells();
            System.arraycopy(c, 0, cells, tableTermStart[q], c.length);
            java.util.Arrays.fill(comps, tableTermStart[q], tableTermStart[q] + c.length, tables[q].component());
        }
        engine.setSources(cells, comps);
        sheetTerms = new SheetTerms(engine, sheets, sheetTermStart, g.nx(), g.ny());
        sheetsByRow = sheets.length > 0 && !b.sheetsBeforeStep && engine.rowSources(sheetTerms);
        divergenceLimit = b.divergenceLimit > 0 ? b.divergenceLimit : 1e15 * Math.max(1.0, amplitudeSum);
        team = new BandTeam(RowWork.of(engine.rowWork()), b.effectiveThreads(), "evanesce-band");
        shared = new SharedRecorders(this, team.threads());
        java.util.Set<Integer> special = new java.util.HashSet<>(b.dispersive.keySet());
        special.addAll(b.series.keySet());
        CrossCoupling coupling = CrossCoupling.of(g, b.polarization, engine, b.courant, special);
        coupled = coupling == null ? null : (band, j0, j1) -> coupling.apply(j0, j1);
        coupledThenShared = coupling == null ? null : (band, j0, j1) -> {
            coupling.apply(j0, j1);
            shared.run(band, j0, j1);
        };
        shared.use(listeners);
        plain = (j0, j1, phase) -> engine.sweep(j0, j1, phase, false);
        flushing = (j0, j1, phase) -> engine.sweep(j0, j1, phase, true);
    }

    public static Builder builder(MaterialGrid grid) {
        return new Builder(grid);
    }

    /**
     * Advances one time step: magnetic half-step, electric half-step, then the listeners: first, on the worker
     * threads, every {@link org.evanesce.solver.record.SharedRecorder} (its serial part before the step), then
     * the others in the order they were added.
     */
    public void step() {
        double tH = step * dt;
        double tE = (step + 0.5) * dt;
        for (int q = 0; q < sources.length; q++) {
            Source s = sources[q];
            double g = s.signal().value(s.component().electric ? tE : tH);
            double[] amp = sourceRe[q];
            double[] ampIm = sourceIm[q];
            for (int t = 0; t < amp.length; t++) {
                engine.sourceValue(sourceTermStart[q] + t, amp[t] * g, ampIm[t] * g);
            }
        }
        if (sheets.length > 0) {
            sheetTerms.prepare(tH, tE);
            if (!sheetsByRow) {
                sheetTerms.fillAll();
            }
        }
        for (int q = 0; q < tables.length; q++) {
            SampledSheet sh = tables[q];
            int count = sh.size();
            for (int t = 0; t < count; t++) {
                engine.sourceValue(tableTermStart[q] + t, sh.value(t, step));
            }
        }
        boolean flush = (step + 1) % flushInterval == 0;
        BandTeam.After after = shared.prepare();
        if (coupled != null) {
            // the cross terms complete E before any recorder reads it
            after = after == null ? coupled : coupledThenShared;
        }
        double max = team.step(flush ? flushing : plain, after);
        step++;
        if (flush && !(max <= divergenceLimit)) {
            throw diverged(max);
        }
        for (StepListener l : listeners) {
            if (!SharedRecorders.isShared(l)) {
                l.afterStep(this);
            }
        }
    }

    /** Starts every checkpoint; the format number follows. */
    private static final String CHECKPOINT_PREFIX = "evanesce checkpoint ";
    /**
     * Identifies checkpoint files and their layout. Format 2 (issue 15) adds, after the CPML arrays, the
     * auxiliary currents of the dispersive cells of each electric component (a count of materials, then
     * cells, values per cell and the values), also where there are none.
     */
    private static final String CHECKPOINT_MAGIC = CHECKPOINT_PREFIX + "2";

    /**
     * Writes the whole state of the run, so that a simulation built the same way and given it with
     * {@link #restoreState} continues bit for bit: the step count (the sources' time follows from it),
     * every field and PML auxiliary array, and the accumulated results of every
     * {@link org.evanesce.solver.record.StatefulListener} (running transforms, probe samples), in the
     * order the listeners were added. Call between steps.
     */
    public void saveState(java.io.OutputStream stream) throws java.io.IOException {
        java.io.DataOutputStream out = new java.io.DataOutputStream(new java.io.BufferedOutputStream(stream, 1 << 16));
        out.writeUTF(CHECKPOINT_MAGIC);
        out.writeInt(nx());
        out.writeInt(ny());
        out.writeUTF(polarization.name());
        out.writeUTF(precision.name());
        out.writeLong(step);
        engine.writeState(out);
        List<org.evanesce.solver.record.StatefulListener> stateful = statefulListeners();
        out.writeInt(stateful.size());
        for (org.evanesce.solver.record.StatefulListener l : stateful) {
            out.writeUTF(l.getClass().getSimpleName());
            l.writeState(out);
        }
        out.flush();
    }

    /**
     * Reads a state written by {@link #saveState} of a simulation built the same way (same grid,
     * polarization, precision, boundaries, sources and listeners).
     *
     * @throws java.io.IOException when the checkpoint is damaged or belongs to another set-up
     */
    public void restoreState(java.io.InputStream stream) throws java.io.IOException {
        java.io.DataInputStream in = new java.io.DataInputStream(new java.io.BufferedInputStream(stream, 1 << 16));
        String magic = in.readUTF();
        if (!CHECKPOINT_MAGIC.equals(magic)) {
            throw new java.io.IOException(magic.startsWith(CHECKPOINT_PREFIX)
                    ? String.format("checkpoint of format %s; this program reads format %s only (start the run again)",
                    magic.substring(CHECKPOINT_PREFIX.length()), CHECKPOINT_MAGIC.substring(CHECKPOINT_PREFIX.length()))
                    : "not an evanesce checkpoint");
        }
        int cnx = in.readInt();
        int cny = in.readInt();
        String pol = in.readUTF();
        String prec = in.readUTF();
        if (cnx != nx() || cny != ny() || !pol.equals(polarization.name()) || !prec.equals(precision.name())) {
            throw new java.io.IOException(String.format("checkpoint of a %d x %d %s %s run; this run is %d x %d %s %s", cnx, cny,
                    pol, prec, nx(), ny(), polarization, precision));
        }
        long s = in.readLong();
        engine.readState(in);
        List<org.evanesce.solver.record.StatefulListener> stateful = statefulListeners();
        int count = in.readInt();
        if (count != stateful.size()) {
            throw new java.io.IOException("checkpoint holds " + count + " recording listeners; this run has " + stateful.size());
        }
        for (org.evanesce.solver.record.StatefulListener l : stateful) {
            String kind = in.readUTF();
            if (!kind.equals(l.getClass().getSimpleName())) {
                throw new java.io.IOException("checkpoint holds a " + kind + " where this run has a " + l.getClass().getSimpleName());
            }
            l.readState(in);
        }
        step = s;
    }

    private List<org.evanesce.solver.record.StatefulListener> statefulListeners() {
        List<org.evanesce.solver.record.StatefulListener> out = new ArrayList<>();
        for (StepListener l : listeners) {
            if (l instanceof org.evanesce.solver.record.StatefulListener sl) {
                out.add(sl);
            }
        }
        return out;
    }

    /** Advances {@code steps} time steps. */
    public void run(long steps) {
        for (long s = 0; s < steps; s++) {
            step();
        }
    }

    private DivergenceException diverged(double max) {
        Component worst = null;
        int wi = -1;
        int wj = -1;
        double wv = -1;
        outer:
        for (Component c : polarization.components()) {
            for (int j = 0; j < engine.ny(); j++) {
                for (int i = 0; i < engine.nx(); i++) {
                    double v = Math.abs(engine.get(c, j * engine.nx() + i));
                    if (!(v <= wv)) {
                        wv = v;
                        worst = c;
                        wi = i;
                        wj = j;
                        if (Double.isNaN(v)) {
                            break outer;
                        }
                    }
                }
            }
        }
        String what = Double.isFinite(wv) ? String.format("|%s| = %g exceeds the divergence limit %g", worst, wv, divergenceLimit)
                : String.format("%s = %s", worst, wv);
        return new DivergenceException(String.format(
                "run diverged by step %d (t = %g s): %s at cell (%d, %d) (largest field met: %g). "
                        + "Check the Courant number (%g), materials with gain (negative conductivity), and sources.",
                step, time(), what, wi, wj, max, courant), step);
    }

    /** Adds a listener called after every step. */
    public void addListener(StepListener l) {
        listeners.add(l);
        shared.use(listeners);
    }

    @Override
    public long stepCount() {
        return step;
    }

    @Override
    public double dt() {
        return dt;
    }

    @Override
    public int nx() {
        return engine.nx();
    }

    @Override
    public int ny() {
        return engine.ny();
    }

    @Override
    public double cellSize() {
        return cellSize;
    }

    public double courant() {
        return courant;
    }

    public Polarization polarization() {
        return polarization;
    }

    public Precision precision() {
        return precision;
    }

    /**
     * Whether the update ever changes component c at node (i, j) of an nx × ny grid with these
     * sides: false outside the grid, on PEC walls, and on the ghost sites beyond the last node.
     * Sources must sit where this is true ({@link Builder#build} refuses others).
     */
    public static boolean isUpdated(Map<Side, Boundary> sides, int nx, int ny, Component c, int i, int j) {
        return Engine.wouldUpdate(sides, nx, ny, c, i, j);
    }

    /** Width in bits of the vectors the update kernels use on this JVM. */
    public static int kernelVectorBits() {
        return Engine.vectorBits();
    }

    /**
     * Number of threads that step (small grids run on one). While the machine is busy with other
     * work the team may step on fewer for a while (see {@link #stepsOnFewerThreads}).
     */
    public int threads() {
        return team.threads();
    }

    /**
     * Steps so far that ran on fewer threads than {@link #threads()}: the team measured that fewer
     * threads stepped faster (cores taken by other work), or was trying whether they would.
     */
    public long stepsOnFewerThreads() {
        return team.stepsOnFewerThreads();
    }

    @Override
    public double field(Component c, int i, int j) {
        return engine.get(c, j * engine.nx() + i);
    }

    @Override
    public void readRow(Component c, int j, int i0, int i1, double[] re, double[] im) {
        if (i0 < 0 || i1 > engine.nx() || j < 0 || j >= engine.ny() || i1 < i0) {
            throw new IndexOutOfBoundsException(String.format("row %d from %d to %d is outside the %d x %d grid", j, i0, i1,
                    engine.nx(), engine.ny()));
        }
        engine.read(c, j * engine.nx() + i0, i1 - i0, re);
        if (im != null) {
            engine.readImag(c, j * engine.nx() + i0, i1 - i0, im);
        }
    }

    @Override
    public boolean readRowFloats(Component c, int j, int i0, int i1, float[] re, float[] im, int at) {
        if (i0 < 0 || i1 > engine.nx() || j < 0 || j >= engine.ny() || i1 < i0) {
            throw new IndexOutOfBoundsException(String.format("row %d from %d to %d is outside the %d x %d grid", j, i0, i1,
                    engine.nx(), engine.ny()));
        }
        if (!engine.readFloats(c, j * engine.nx() + i0, i1 - i0, re, at)) {
            return false;
        }
        return im == null || engine.readFloatsImag(c, j * engine.nx() + i0, i1 - i0, im, at);
    }

    @Override
    public boolean complexFields() {
        return engine.isComplex();
    }

    @Override
    public boolean singlePrecision() {
        return precision == Precision.FLOAT;
    }

    @Override
    public double fieldImag(Component c, int i, int j) {
        return engine.getImag(c, j * engine.nx() + i);
    }

    /** Overwrites one value (initial conditions). */
    public void setField(Component c, int i, int j, double v) {
        engine.set(c, j * engine.nx() + i, v);
    }

    /**
     * {@inheritDoc} Summed row by row, each row's sum added in row order, so that {@link #energyOnTeam} gives the
     * same bits.
     */
    @Override
    public double energy(int i0, int j0, int i1, int j1) {
        double w = 0;
        for (int j = j0; j < j1; j++) {
            w += engine.energy(i0, j, i1, j + 1);
        }
        return 0.5 * PhysicalConstants.EPS0 * cellSize * cellSize * w;
    }

    /** Per-row energy sums of {@link #energyOnTeam}, reused. */
    private double[] rowEnergy;

    /**
     * The same value as {@link #energy} (bit for bit), its rows summed by the team's threads: for the stopping rule's
     * checks of a large grid, which on one thread took about 7 % of a two-thread run's time (the two-prism example,
     * every 32 steps). Call between steps from the thread that steps, never from a listener.
     */
    public double energyOnTeam(int i0, int j0, int i1, int j1) {
        if (team.threads() == 1) {
            return energy(i0, j0, i1, j1);
        }
        if (rowEnergy == null) {
            rowEnergy = new double[engine.ny()];
        }
        double[] rows = rowEnergy;
        team.each((band, r0, r1) -> {
            for (int j = Math.max(r0, j0); j < Math.min(r1, j1); j++) {
                rows[j] = engine.energy(i0, j, i1, j + 1);
            }
        });
        double w = 0;
        for (int j = j0; j < j1; j++) {
            w += rows[j];
        }
        return 0.5 * PhysicalConstants.EPS0 * cellSize * cellSize * w;
    }

    /**
     * What a run on an nx × ny grid will allocate for its fields, coefficients and CPML, computed
     * before anything is allocated, in bytes: {@code {arrays, pml, buildScratch}} (see
     * {@link Engine#footprint}): the arrays spanning the grid (and Bloch seam values), the CPML strips,
     * and the double-precision coefficients that exist only while {@link Builder#build()} runs.
     * {@code arrays + pml} is exactly what {@link #bytes()} reports once built: the one count of the
     * solver's memory, for estimates made before planning.
     *
     * @param nx    grid nodes along x (with Bloch-periodic sides, the grid's: one column fewer than the domain's nodes)
     * @param lossy whether any cell has conductivity (then every electric site is counted with its ca array;
     *              a p grid with conductivity at only one of its two sites needs one array less)
     */
    public static long[] footprint(int nx, int ny, Polarization polarization, Precision precision, Map<Side, Boundary> sides,
                                   boolean lossy) {
        return Engine.footprint(nx, ny, polarization, precision, sides, lossy);
    }

    /**
     * What the dispersive cells of a run will hold, in bytes, before building: the auxiliary currents
     * (1 + N_Drude + 2 N_Lorentz values per cell and electric site), a cell index per cell and the row
     * starts, per electric component of the polarization and per material with poles; twice with
     * Bloch-periodic sides. Add it to {@link #footprint}'s arrays, whose {@code lossy} says whether an ordinary
     * (pole-free) material has conductivity: where none has, the dispersive cells fold their ca' into the
     * post-pass and no ca array is kept. The sum is {@link #bytes()} once built.
     *
     * @param dispersive the materials {@link Builder#dispersive} will be given, by material index
     */
    public static long dispersiveFootprint(MaterialGrid grid, Polarization polarization, Precision precision,
                                           Map<Side, Boundary> sides, Map<Integer, DispersiveMaterial> dispersive) {
        int[] size = new int[grid.materials().size()];
        for (Map.Entry<Integer, DispersiveMaterial> e : dispersive.entrySet()) {
            size[e.getKey()] = e.getValue().stateSize();
        }
        return Engine.dispersiveFootprint(grid, polarization, precision, sides, size);
    }

    /**
     * Bytes held by the field, coefficient, CPML and Bloch seam arrays and the dispersive cells' state,
     * counted from the arrays themselves; {@link #footprint} (plus {@link #dispersiveFootprint}) gives the
     * same figure before building.
     */
    public long bytes() {
        return engine.bytes();
    }

    /** The part of {@link #bytes()} held by the dispersive cells (0 for a dielectric-only run). */
    public long dispersiveBytes() {
        return engine.dispersiveBytes();
    }

    /** The dispersive materials of this run by material index (empty when there are none). */
    public Map<Integer, DispersiveMaterial> dispersiveMaterials() {
        return dispersive;
    }

    /** Bytes per cell of the arrays that span the whole grid (outside the PML); {@link #predictBytesPerCell} beforehand. */
    public int bytesPerCell() {
        return engine.bytesPerCell();
    }

    /**
     * The bytes per cell {@link #bytesPerCell()} will report: 16 (s) or 20 (p) in float without
     * conductivity, 20 or 28 with it, twice that in double, and twice again with Bloch-periodic sides.
     */
    public static int predictBytesPerCell(Polarization polarization, Precision precision, boolean lossy, boolean blochPeriodic) {
        return Engine.predictBytesPerCell(polarization, precision, lossy, blochPeriodic);
    }

    @Override
    public void close() {
        team.close();
    }

    /** Collects and validates everything a run needs; {@link #build()} refuses inconsistent requests. */
    public static final class Builder {
        private final MaterialGrid grid;
        private Polarization polarization = Polarization.S;
        private Precision precision = Precision.FLOAT;
        private double courant = Courant.DEFAULT;
        private final Map<Side, Boundary> sides = new EnumMap<>(Side.class);
        private int threads = Runtime.getRuntime().availableProcessors();
        private int minRowsCellsPerThread = MIN_CELLS_PER_THREAD;
        private final List<Source> sources = new ArrayList<>();
        private final List<IncidentSheet> sheets = new ArrayList<>();
        private final List<SampledSheet> tables = new ArrayList<>();
        private final List<StepListener> listeners = new ArrayList<>();
        private int flushInterval = 64;
        /** Tests: the sheets' values set before each step, as engines that cannot call back have them. */
        boolean sheetsBeforeStep;
        private boolean vectorsFromStart;
        private boolean scalarOnly;
        private Boolean flatRuns;
        private double divergenceLimit;
        private final Map<Integer, DispersiveMaterial> dispersive = new TreeMap<>();
        private final Map<Integer, SeriesMaterial> series = new TreeMap<>();

        private Builder(MaterialGrid grid) {
            this.grid = grid;
            for (Side s : Side.values()) {
                sides.put(s, Boundary.pml(12));
            }
        }

        public Builder polarization(Polarization p) {
            polarization = p;
            return this;
        }

        public Builder precision(Precision p) {
            precision = p;
            return this;
        }

        /** Courant number S = c0Δt/Δ (default {@link Courant#DEFAULT}); must lie below {@link Courant#limit}. */
        public Builder courant(double s) {
            courant = s;
            return this;
        }

        public Builder boundary(Side side, Boundary b) {
            sides.put(side, b);
            return this;
        }

        /** The same boundary on all four sides. */
        public Builder boundaries(Boundary b) {
            for (Side s : Side.values()) {
                sides.put(s, b);
            }
            return this;
        }

        /** Requested threads (default: available processors). Small grids run on fewer. */
        public Builder threads(int t) {
            threads = t;
            return this;
        }

        /** Fewest cells a thread must have before another thread is used (default {@value #MIN_CELLS_PER_THREAD}; tests lower it). */
        public Builder minCellsPerThread(int cells) {
            minRowsCellsPerThread = cells;
            return this;
        }

        /**
         * Makes material {@code materialIndex} of the grid's table a dispersive material: its cells are
         * updated by the ADE scheme of {@link AdeCoefficients} (ca', cb' and, where the material has
         * Drude or Lorentz terms, auxiliary currents kept for those cells alone) instead of the grid's
         * {@link Material} at that index, whose εr and σ are then ignored (only its name and place in the
         * table count). Each electric component takes the material of its own site (Ez at the node, Ex at
         * (i+½, j), Ey at (i, j+½)), so cells are staircased: no averaging of a dispersive material with
         * a neighbour is done here (a smoothed cell must be given its own entry by the caller).
         * Works inside a CPML and with Bloch-periodic sides.
         */
        public Builder dispersive(int materialIndex, DispersiveMaterial material) {
            dispersive.put(materialIndex, material);
            return this;
        }

        /**
         * Makes material {@code materialIndex} of the grid's table materials in series
         * ({@link SeriesMaterial}: 1/ε = Σ f_k/ε_k, what a field normal to a face through its cell sees),
         * stepped as one sub-field per part ({@link SeriesCoefficients}); the table's entry is a stand-in
         * (only its name and place count). Works inside a CPML and with Bloch-periodic sides.
         */
        public Builder series(int materialIndex, SeriesMaterial material) {
            series.put(materialIndex, material);
            return this;
        }

        /** The materials in series given so far by material index (a read-only copy; empty when there are none). */
        public Map<Integer, SeriesMaterial> seriesMaterials() {
            return Map.copyOf(series);
        }

        /** The dispersive materials given so far by material index (a read-only copy; empty for a dielectric-only run). */
        public Map<Integer, DispersiveMaterial> dispersiveMaterials() {
            return Map.copyOf(dispersive);
        }

        /** Adds an incident-field sheet (e.g. one of a {@link org.evanesce.solver.source.GaussianBeam}'s pair). */
        public Builder incident(IncidentSheet s) {
            sheets.add(s);
            return this;
        }

        /** Adds a tabulated incident sheet (a total-field box's pulse). */
        public Builder incident(SampledSheet s) {
            tables.add(s);
            return this;
        }

        /** Adds every sheet of a total-field/scattered-field box. */
        public Builder totalField(org.evanesce.solver.source.TotalFieldBox box) {
            box.continuousSheets().forEach(this::incident);
            box.sampledSheets().forEach(this::incident);
            return this;
        }

        public Builder source(Source s) {
            sources.add(s);
            return this;
        }

        public Builder listener(StepListener l) {
            listeners.add(l);
            return this;
        }

        /**
         * The kernels run their vector parts from the first step, rather than their scalar parts for
         * the run's first cell updates (see Engine.VECTOR_AFTER; same bits either way): for
         * benchmarks of the steady rate and timed trials of long runs.
         */
        public Builder vectorsFromStart() {
            vectorsFromStart = true;
            scalarOnly = false;
            return this;
        }

        /**
         * The kernels run their scalar parts alone for the whole run (same bits): for runs too short to repay the
         * JIT's compiling of the vector parts (see io.run.JitWarmUp).
         */
        public Builder scalarOnly() {
            scalarOnly = true;
            vectorsFromStart = false;
            return this;
        }

        /** Cells of the grid (nx × ny nodes), for estimates of a run's work before it is built. */
        public long cells() {
            return (long) grid.nx() * grid.ny();
        }

        /** Whether the run will update its plain rows in flat runs: a narrow grid (Engine.FLAT_BELOW), or as {@link #flatRuns} set. */
        public boolean flat() {
            return flatRuns != null ? flatRuns && grid.nx() >= 2 : Engine.flatByDefault(grid.nx());
        }

        /**
         * Whether plain rows are updated in flat runs (see Engine.FLAT_BELOW; same bits either way), rather
         * than as the grid's width decides: for tests that compare both paths, and measurements.
         */
        public Builder flatRuns(boolean on) {
            flatRuns = on;
            return this;
        }

        /**
         * Steps between flushes of tiny values (subnormal guard) and divergence checks. Default 64:
         * the flush pass costs about one step's time, so about 1.5 % of the run (16 measured 6 %).
         */
        public Builder flushInterval(int steps) {
            flushInterval = steps;
            return this;
        }

        /** Field magnitude above which the run is declared diverged (default 1e15 × the sum of source amplitudes, at least 1e15). */
        public Builder divergenceLimit(double limit) {
            divergenceLimit = limit;
            return this;
        }

        /** The threads requested (the grid may step on fewer, see {@link #effectiveThreads}). */
        public int requestedThreads() {
            return threads;
        }

        /** The threads the built simulation will step on: those requested, fewer for a small grid. */
        public int effectiveThreads() {
            long cells = (long) grid.nx() * grid.ny();
            long byCells = Math.max(1, cells / Math.max(1, minRowsCellsPerThread));
            return (int) Math.max(1, Math.min(Math.min(threads, byCells), grid.ny() / 2));
        }

        /** The largest stable Courant number for this grid's materials. */
        public double courantLimit() {
            return Courant.limit(minPermittivity());
        }

        /**
         * The smallest permittivity that sets the stability limit: εr of the ordinary materials and ε∞ of
         * the dispersive ones (their poles do not lower the limit; {@code DispersiveMaterial.courantLimit}).
         */
        private double minPermittivity() {
            double m = Double.POSITIVE_INFINITY;
            List<Material> table = grid.materials();
            for (int k = 0; k < table.size(); k++) {
                DispersiveMaterial d = dispersive.get(k);
                SeriesMaterial sm = series.get(k);
                m = Math.min(m, d != null ? d.epsInfinity() : sm != null ? sm.epsInfinity() : table.get(k).relativePermittivity());
            }
            return m;
        }

        /**
         * Validates the request and plans the run.
         *
         * @throws IllegalArgumentException naming the parameter, its value and the bound
         */
        public Simulation build() {
            List<String> errors = new ArrayList<>();
            for (Integer k : series.keySet()) {
                if (k < 0 || k >= grid.materials().size() || dispersive.containsKey(k)) {
                    errors.add(String.format("series material index %d is outside the grid's table of %d materials or"
                            + " also dispersive", k, grid.materials().size()));
                }
            }
            for (Integer k : dispersive.keySet()) {
                if (k < 0 || k >= grid.materials().size()) {
                    errors.add(String.format("dispersive material index %d is outside the grid's table of %d materials",
                            k, grid.materials().size()));
                }
            }
            if (!errors.isEmpty()) {
                throw new IllegalArgumentException(String.join("\n", errors));
            }
            Courant.refusal(courant, minPermittivity()).ifPresent(errors::add);
            if (threads < 1) {
                errors.add("threads " + threads + " must be >= 1");
            }
            if (flushInterval < 1) {
                errors.add("flush interval " + flushInterval + " steps must be >= 1");
            }
            int nx = grid.nx();
            int ny = grid.ny();
            boolean blochLeft = sides.get(Side.LEFT) instanceof Boundary.Bloch;
            boolean blochRight = sides.get(Side.RIGHT) instanceof Boundary.Bloch;
            if (blochLeft != blochRight || blochLeft
                    && ((Boundary.Bloch) sides.get(Side.LEFT)).wavenumber() != ((Boundary.Bloch) sides.get(Side.RIGHT)).wavenumber()) {
                errors.add(String.format("Bloch-periodic boundaries must be given on both the left and the right side with "
                        + "the same wavenumber; got left %s, right %s", sides.get(Side.LEFT), sides.get(Side.RIGHT)));
            }
            if (sides.get(Side.BOTTOM) instanceof Boundary.Bloch || sides.get(Side.TOP) instanceof Boundary.Bloch) {
                errors.add("Bloch-periodic boundaries are supported along x (left and right) only; "
                        + "bottom and top take a PML, PEC or PMC");
            }
            int xl = layers(Side.LEFT) + layers(Side.RIGHT);
            int yl = layers(Side.BOTTOM) + layers(Side.TOP);
            if (xl > nx - 3) {
                errors.add(String.format("PML layers left + right = %d leave no interior in a grid %d nodes wide (need <= %d)",
                        xl, nx, nx - 3));
            }
            if (yl > ny - 3) {
                errors.add(String.format("PML layers bottom + top = %d leave no interior in a grid %d nodes tall (need <= %d)",
                        yl, ny, ny - 3));
            }
            for (Source s : sources) {
                if (s.isComplex() && !blochLeft) {
                    errors.add(String.format("%s has complex amplitudes, which need Bloch-periodic boundaries", s));
                }
                if (s.component().polarization != polarization) {
                    errors.add(String.format("source component %s does not belong to the %s polarization (%s)",
                            s.component(), polarization, java.util.Arrays.toString(polarization.components())));
                }
                for (int k : s.cells()) {
                    if (k < 0 || !Engine.wouldUpdate(sides, nx, ny, s.component(), k % nx, k / nx)) {
                        errors.add(String.format("source cell (%d, %d) of %s is not a site the update changes "
                                + "(outside the grid, on a PEC wall, or a ghost site beyond the last node)",
                                k % nx, k / nx, s.component()));
                        break;
                    }
                }
            }
            for (IncidentSheet s : sheets) {
                if (s.component().polarization != polarization) {
                    errors.add(String.format("incident sheet component %s does not belong to the %s polarization",
                            s.component(), polarization));
                }
                for (int k : s.cells()) {
                    if (k < 0 || !Engine.wouldUpdate(sides, nx, ny, s.component(), k % nx, k / nx)) {
                        errors.add(String.format("incident sheet cell (%d, %d) of %s is not a site the update changes",
                                k % nx, k / nx, s.component()));
                        break;
                    }
                }
            }
            for (SampledSheet s : tables) {
                if (s.component().polarization != polarization) {
                    errors.add(String.format("sampled sheet component %s does not belong to the %s polarization",
                            s.component(), polarization));
                }
                for (int k : s.cells()) {
                    if (k < 0 || !Engine.wouldUpdate(sides, nx, ny, s.component(), k % nx, k / nx)) {
                        errors.add(String.format("sampled sheet cell (%d, %d) of %s is not a site the update changes",
                                k % nx, k / nx, s.component()));
                        break;
                    }
                }
            }
            if (!errors.isEmpty()) {
                throw new IllegalArgumentException(String.join("\n", errors));
            }
            return new Simulation(this, Courant.timeStep(courant, grid.cellSize()));
        }

        private int layers(Side s) {
            return sides.get(s) instanceof Boundary.Pml p ? p.parameters().layers() : 0;
        }
    }
}
