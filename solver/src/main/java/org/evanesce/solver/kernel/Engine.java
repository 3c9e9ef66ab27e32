package org.evanesce.solver.kernel;

import java.util.EnumMap;
import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.geometry.dispersion.SeriesCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.boundary.PmlProfile;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;

/**
 * The field state of one run and its row-by-row update. One leapfrog step is the magnetic
 * half-step followed by the electric half-step; they are fused row by row (magnetic row j, then
 * electric row j, which needs magnetic rows j and j−1), so each row is streamed from memory once.
 *
 * <p>Threads split the rows into bands. Because the magnetic update of a band's last row reads
 * the first electric row of the next band, each step runs in two phases separated by a barrier:
 * phase 0 updates the magnetic field of the band's last row, phase 1 does the rest of the band.
 * Phase 1 goes through the band in blocks of a few rows ({@link #blockRows}): the magnetic rows of
 * the block, then its electric rows. Engines correct the short CPML strip rows at the x sides a
 * block at a time, while the block is still in cache.
 * Every cell is computed by the same code in every partition, so results do not depend on the
 * number of threads.
 *
 * <p>Sources are soft: after its row's update, an electric source subtracts cb·v (a current
 * density) and a magnetic source subtracts s·v (a magnetic current density), v in normalised units.
 */
public abstract class Engine {

    protected final int nx;
    protected final int ny;
    protected final double courant;
    /** Walls: true where the side is a PMC (the update then runs on the wall nodes too). */
    protected final boolean pmcLeft, pmcRight, pmcBottom, pmcTop;
    /**
     * Bloch-periodic along x: column 0 is updated with the magnetic value west of it taken from
     * {@link #ghostW}, the last column is updated like an interior one, and the magnetic update of
     * the last column takes the electric value east of it from {@link #ghostE}. {@link BlochPair}
     * fills both ghosts, per row, from the other column and the other (real or imaginary) part.
     */
    protected final boolean blochX;
    /** Per row: the electric field one node east of the last column (Bloch seam). */
    final double[] ghostE;
    /** Per row: the magnetic field half a cell west of column 0 (Bloch seam). */
    final double[] ghostW;
    /** CPML profiles present on each axis (0, 1 or 2 of them). */
    protected final PmlProfile[] xProfiles, yProfiles;
    /** For each row, the index into {@link #yProfiles} of the strip containing it, or −1. */
    protected final int[] yStripOfRow;

    private int[] eRowStart = new int[0], hRowStart = new int[0];
    private int[] eCell = new int[0], hCell = new int[0];
    private Component[] eComp = new Component[0], hComp = new Component[0];
    private double[] eValue = new double[0], hValue = new double[0];
    /** For source term t: its index among electric terms (≥ 0) or −1 − its index among magnetic terms. */
    private int[] termOrder = new int[0];
    /**
     * Whether any electric site holds a dispersive cell (set by the engine's constructor); when false
     * the electric rows take no post-pass and no extra work.
     */
    protected boolean dispersive;

    /**
     * The bound the row kernels get for their vector parts: {@link #SCALAR_ONLY} while the run is
     * young, then the vector length (see {@link #vectorAfter}). Both give every cell the same bits;
     * a thread that reads a stale value computes the same result.
     */
    protected int vl = SCALAR_ONLY;
    /** Steps swept so far while scalar (counted by the band that holds row 0). */
    private long scalarSteps;

    /** A vector bound larger than any row: the kernels' vector parts never run. */
    static final int SCALAR_ONLY = 1 << 29;

    /**
     * Cell updates an engine makes with the kernels' scalar parts before the vector parts take over.
     * Vector code runs very slowly until the JIT has compiled it (a few hundred milliseconds of
     * CPU and as much garbage as the grid), while scalar loops compile at once; below this much
     * work a run is faster scalar. Measured on 2-core x86 (whole commands, paired): scalar took
     * 0.73–0.85× the CPU time and about 0.6× the peak memory on runs of 2e7–6e7 cell updates, and 1.11×
     * on 5.7e8 (docs/architecture.md). Developers may override it with
     * {@code -Devanesce.vectorAfter=N} (0: vectors from the first step).
     */
    public static final long VECTOR_AFTER = Long.getLong("evanesce.vectorAfter", 200_000_000L);

    /**
     * Grids narrower than this many cells (and at least 2 wide) update their plain rows (neither a wall
     * row nor in a y-side CPML strip) a run of rows at a time, as one flat loop over the run's cells
     * ({@link FloatFlat}), then put right the cells of columns 0 and nx−1, whose neighbours across the
     * row's end differ: same bits as row by row. Rows of a few cells are mostly loop set-up and scalar
     * tails when updated one at a time. Developers may override it with {@code -Devanesce.flatBelow=N}
     * (0: never).
     */
    static final int FLAT_BELOW = Integer.getInteger("evanesce.flatBelow", 64);

    /** Whether a grid {@code nx} nodes wide updates its plain rows in flat runs unless told otherwise. */
    public static boolean flatByDefault(int nx) {
        return nx >= 2 && nx < FLAT_BELOW;
    }

    /** Whether this engine updates its plain rows in flat runs (see {@link #FLAT_BELOW}); tests switch it. */
    protected boolean flat;

    /**
     * Sets whether plain rows are updated in flat runs (for tests comparing both paths, and measurements);
     * grids narrower than 2 cells never are. Call before the first step.
     */
    public void flatRuns(boolean on) {
        flat = on && nx >= 2;
    }

    /**
     * Cells a block of a flat engine's sweep spans at least (rows of a narrow grid are few cells each):
     * longer flat runs pay their set-up and edge fixes over more cells.
     */
    static final int FLAT_BLOCK_CELLS = 4096;

    /** This engine's threshold: {@link #VECTOR_AFTER} unless a test sets another. */
    private long vectorAfter = VECTOR_AFTER;

    /** The vector length of this engine's kernels (lanes per vector). */
    protected abstract int lanes();

    /** From now on the kernels run their vector parts. */
    protected void useVectors() {
        vl = lanes();
    }

    /** From now on the kernels run their scalar parts alone (tests: both parts must give the same bits). */
    protected void useScalars() {
        vl = SCALAR_ONLY;
    }

    /**
     * Sets the cell updates made scalar before the vector parts take over (0: vectors from the
     * start, as a benchmark of the steady rate wants; Long.MAX_VALUE: never). Call before the
     * first step.
     */
    public void vectorAfter(long cellUpdates) {
        vectorAfter = cellUpdates;
        if (cellUpdates <= 0) {
            useVectors();
        }
    }

    protected Engine(int nx, int ny, double courant, Map<Side, Boundary> sides) {
        this.nx = nx;
        this.ny = ny;
        this.courant = courant;
        pmcLeft = sides.get(Side.LEFT) instanceof Boundary.Pmc;
        pmcRight = sides.get(Side.RIGHT) instanceof Boundary.Pmc;
        pmcBottom = sides.get(Side.BOTTOM) instanceof Boundary.Pmc;
        pmcTop = sides.get(Side.TOP) instanceof Boundary.Pmc;
        blochX = sides.get(Side.LEFT) instanceof Boundary.Bloch;
        flat = flatByDefault(nx); // not flatRuns(..): a subclass overrides it
        ghostE = new double[blochX ? ny : 0];
        ghostW = new double[blochX ? ny : 0];
        xProfiles = profiles(sides, Side.LEFT, Side.RIGHT, nx, courant);
        yProfiles = profiles(sides, Side.BOTTOM, Side.TOP, ny, courant);
        yStripOfRow = new int[ny];
        java.util.Arrays.fill(yStripOfRow, -1);
        for (int s = 0; s < yProfiles.length; s++) {
            for (int jj = 0; jj < yProfiles[s].layers; jj++) {
                yStripOfRow[yProfiles[s].start + jj] = s;
            }
        }
    }

    private static PmlProfile[] profiles(Map<Side, Boundary> sides, Side lo, Side hi, int nodes, double s) {
        java.util.List<PmlProfile> l = new java.util.ArrayList<>();
        for (Side side : new Side[] {lo, hi}) {
            if (sides.get(side) instanceof Boundary.Pml p) {
                l.add(PmlProfile.of(side, p.parameters(), nodes, s));
            }
        }
        return l.toArray(new PmlProfile[0]);
    }

    /**
     * Creates the engine for a polarization and precision.
     *
     * @param caOfMaterial ca of each material of {@code grid.materials()}, by index
     * @param cbOfMaterial cb of each material, by index (the facade computes both, with the physical constants)
     * @param adeOf        by material index, the ADE coefficients of a dispersive material with poles (its ca', cb'
     *                     must be those given in caOfMaterial, cbOfMaterial), else null; null for none at all
     */
    public static Engine create(MaterialGrid grid, Polarization pol, Precision precision, double courant,
                                double[] caOfMaterial, double[] cbOfMaterial, AdeCoefficients[] adeOf,
                                Map<Side, Boundary> sides) {
        return create(grid, pol, precision, courant, caOfMaterial, cbOfMaterial, adeOf, null, sides);
    }

    /**
     * {@link #create(MaterialGrid, Polarization, Precision, double, double[], double[], AdeCoefficients[], Map)}
     * with series materials: {@code seriesOf[m]} the coefficients of a series material (whose ca, cb in
     * caOfMaterial, cbOfMaterial must be 1 and {@link SeriesCoefficients#cb()}), else null; null for none.
     */
    public static Engine create(MaterialGrid grid, Polarization pol, Precision precision, double courant,
                                double[] caOfMaterial, double[] cbOfMaterial, AdeCoefficients[] adeOf,
                                SeriesCoefficients[] seriesOf, Map<Side, Boundary> sides) {
        Map<Side, Boundary> all = new EnumMap<>(sides);
        for (Side s : Side.values()) {
            if (!all.containsKey(s)) {
                throw new IllegalArgumentException("no boundary given for side " + s);
            }
        }
        int nm = grid.materials().size();
        if (caOfMaterial.length != nm || cbOfMaterial.length != nm) {
            throw new IllegalArgumentException(String.format("%d ca and %d cb values given for %d materials",
                    caOfMaterial.length, cbOfMaterial.length, nm));
        }
        AdeCoefficients[] ade = adeOf == null ? new AdeCoefficients[nm] : adeOf.clone();
        if (ade.length != nm) {
            throw new IllegalArgumentException(String.format("%d ADE entries given for %d materials", ade.length, nm));
        }
        SeriesCoefficients[] series = seriesOf == null ? null : seriesOf.clone();
        if (series != null && series.length != nm) {
            throw new IllegalArgumentException(String.format("%d series entries given for %d materials", series.length, nm));
        }
        if (all.get(Side.LEFT) instanceof Boundary.Bloch b) {
            // each part keeps its own auxiliary currents: the real and the imaginary field are driven apart
            double phase = b.wavenumber() * grid.nx() * grid.cellSize();
            return new BlochPair(real(grid, pol, precision, courant, caOfMaterial, cbOfMaterial, ade, series, all),
                    real(grid, pol, precision, courant, caOfMaterial, cbOfMaterial, ade, series, all), pol, phase);
        }
        return real(grid, pol, precision, courant, caOfMaterial, cbOfMaterial, ade, series, all);
    }

    private static Engine real(MaterialGrid grid, Polarization pol, Precision precision, double courant, double[] ca,
                               double[] cb, AdeCoefficients[] ade, SeriesCoefficients[] series,
                               Map<Side, Boundary> all) {
        return switch (precision) {
            case FLOAT -> pol == Polarization.S ? new FloatS(grid, courant, ca, cb, ade, series, all)
                    : new FloatP(grid, courant, ca, cb, ade, series, all);
            case DOUBLE -> pol == Polarization.S ? new DoubleS(grid, courant, ca, cb, ade, series, all)
                    : new DoubleP(grid, courant, ca, cb, ade, series, all);
        };
    }

    /** The material site of an electric component. */
    static FieldSite site(Component c) {
        return switch (c) {
            case EZ -> FieldSite.EZ;
            case EX -> FieldSite.EX;
            case EY -> FieldSite.EY;
            default -> throw new IllegalArgumentException(c + " is not an electric component");
        };
    }

    /**
     * The electric update coefficients of every cell at one site, in double, from those of each
     * material: {@code out[0][k] = ca}, {@code out[1][k] = cb} of the material at cell k.
     */
    static double[][] coefficients(MaterialGrid grid, FieldSite site, double[] caOf, double[] cbOf) {
        int nx = grid.nx();
        int ny = grid.ny();
        double[][] out = new double[2][nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                int m = grid.id(site, i, j);
                out[0][j * nx + i] = caOf[m];
                out[1][j * nx + i] = cbOf[m];
            }
        }
        return out;
    }

    /**
     * What an engine of these settings will allocate, computed without building it, in bytes:
     * {@code {arrays, pml, buildScratch}}: the field and coefficient arrays over the whole grid with
     * the Bloch seam values, the CPML strips (ψ and coefficients, x strips widened to whole vectors),
     * and the double-precision coefficients that exist only while the engine is being built. A
     * Bloch-periodic grid has two engines (real and imaginary parts) and counts twice. Decided by
     * {@link Layout}, as the engines allocate: {@code arrays + pml} equals {@link #bytes()} exactly.
     *
     * @param lossy whether every electric site has a cell with conductivity (ca arrays kept); a p grid
     *              with conductivity at only one of its two sites needs one ca array less
     */
    public static long[] footprint(int nx, int ny, Polarization pol, Precision precision, Map<Side, Boundary> sides,
                                   boolean lossy) {
        Layout l = Layout.of(nx, ny, pol, precision);
        int copies = sides.get(Side.LEFT) instanceof Boundary.Bloch ? 2 : 1;
        return new long[] {copies * l.gridBytes(lossy, copies == 2), copies * l.stripBytes(sides), l.scratchBytes()};
    }

    /** The bytes per cell {@link #bytesPerCell()} will report (the arrays spanning the whole grid); as {@link #footprint}. */
    public static int predictBytesPerCell(Polarization pol, Precision precision, boolean lossy, boolean blochX) {
        return Layout.of(1, 1, pol, precision).bytesPerCell(lossy, blochX);
    }

    /** Bytes of the Bloch seam values ({@link #ghostE}, {@link #ghostW}). */
    final long seamBytes() {
        return (long) Double.BYTES * (ghostE.length + ghostW.length);
    }

    /**
     * Whether the update ever changes component c at node (i, j): false outside the grid, on PEC
     * walls, and on the sites beyond the last node that only serve as zero ghosts.
     */
    public static boolean wouldUpdate(Map<Side, Boundary> sides, int nx, int ny, Component c, int i, int j) {
        if (i < 0 || j < 0 || i >= nx || j >= ny) {
            return false;
        }
        boolean bloch = sides.get(Side.LEFT) instanceof Boundary.Bloch;
        boolean iIn = i >= (bloch || sides.get(Side.LEFT) instanceof Boundary.Pmc ? 0 : 1)
                && i <= (bloch || sides.get(Side.RIGHT) instanceof Boundary.Pmc ? nx - 1 : nx - 2);
        boolean jIn = j >= (sides.get(Side.BOTTOM) instanceof Boundary.Pmc ? 0 : 1)
                && j <= (sides.get(Side.TOP) instanceof Boundary.Pmc ? ny - 1 : ny - 2);
        return switch (c) {
            case EZ -> iIn && jIn;
            case HX -> j <= ny - 2;
            case HY -> bloch || i <= nx - 2;
            case HZ -> (bloch || i <= nx - 2) && j <= ny - 2;
            case EX -> (bloch || i <= nx - 2) && jIn;
            case EY -> j <= ny - 2 && iIn;
        };
    }

    /** Width in bits of the vectors the kernels use on this JVM (docs/architecture.md: capped at 256 by measurement). */
    public static int vectorBits() {
        return Lanes.bits();
    }

    /**
     * Bytes by which the starts of successive field and coefficient arrays are to differ, modulo
     * 4 KiB. Arrays of n·n values whose starts lie within a few dozen bytes of each other modulo
     * 4 KiB (what consecutive arrays of 1024² or 4096² values get: only the 16-byte array header
     * apart) make the processor treat loads as dependent on earlier stores to the other arrays
     * (4K aliasing). Measured on the 2-core AMD EPYC machine kind, the bench simulation at 1024²
     * (1 thread, median of 12 interleaved rounds) ran 7 % faster with its arrays 1088 bytes apart
     * than 16 apart. 1088 = 1 KiB + one cache line puts up to six arrays at least 256 bytes apart.
     */
    static final int ARRAY_STAGGER_BYTES = 1088;
    /** Header bytes of a primitive array on HotSpot with compressed class pointers (its default). */
    private static final int ARRAY_HEADER_BYTES = 16;

    /**
     * The length (≥ n) to give each field and coefficient array of n values of {@code bytes} bytes,
     * so that arrays allocated one after the other start {@link #ARRAY_STAGGER_BYTES} apart modulo
     * 4 KiB. The JVM usually places such a sequence of large arrays back to back; where it does not,
     * the starts are as arbitrary as without padding. The values past n stay zero and unused.
     */
    static int staggeredLength(int n, int bytes) {
        long span = (long) n * bytes + ARRAY_HEADER_BYTES;
        long extra = Math.floorMod(ARRAY_STAGGER_BYTES - span, 4096L) / bytes;
        return (int) Math.min(Integer.MAX_VALUE - 8, n + extra);
    }

    /** True when every value is exactly 1 (no conductivity anywhere): the kernels then skip ca. */
    static boolean allOnes(double[] a) {
        for (double v : a) {
            if (v != 1.0) {
                return false;
            }
        }
        return true;
    }

    /**
     * Extra work of a cell that a y-side CPML strip corrects, relative to a plain cell's update: the rows
     * of a y strip take about 1.3 times a plain row with the correction fused into the update
     * ({@link FloatPmlRows}; JFR samples of the two-prism example, 2 threads, under load: provisional).
     */
    static final double Y_PML_CELL_WORK = 0.3;
    /**
     * Extra work of a cell that an x-side strip corrects: its second pass down the strip's columns costs
     * about two plain cell updates per cell (the same profile).
     */
    static final double X_PML_CELL_WORK = 2.0;

    /**
     * Extra work per value a dispersive cell keeps (its E before the update, one current per Drude term, two per
     * Lorentz term), relative to a plain cell's update: in the gold-film beam example (p, Rakić's gold: 12 values
     * per electric site, about 27,000 sites in 2690 × 181 cells) the dispersive pass took 189 of 1478 stepping
     * samples against 583 for the field update of all cells, about 5.8 plain cell updates per site (JFR, 2 threads,
     * quiet 2-core machine; one profile). Without it the bands' boundary sat in the film's rows and swung across
     * them window after window (a band's time 13 ms one window, 20 ms the next).
     */
    static final double ADE_VALUE_WORK = 0.5;

    /** Adds each row's work of the dispersive cells to {@code w} (none here; the engines with such cells add theirs). */
    protected void addDispersiveWork(double[] w) {
    }

    /**
     * The expected work of each row of a step, relative: one per cell, plus {@link #Y_PML_CELL_WORK} per
     * cell of a y-side strip's row and {@link #X_PML_CELL_WORK} per cell of the x-side strips, plus the
     * dispersive cells' ({@link #ADE_VALUE_WORK}), for the
     * bands' split ({@link org.evanesce.solver.parallel.RowWork}). Only where the bands start depends on
     * it, never a result.
     */
    public double[] rowWork() {
        double[] w = new double[ny];
        int xCells = 0;
        for (PmlProfile p : xProfiles) {
            xCells += p.layers;
        }
        for (int j = 0; j < ny; j++) {
            w[j] = nx + X_PML_CELL_WORK * xCells + (yStripOfRow[j] >= 0 ? Y_PML_CELL_WORK * nx : 0);
        }
        addDispersiveWork(w);
        return w;
    }

    public final int nx() {
        return nx;
    }

    public final int ny() {
        return ny;
    }

    /**
     * Installs the source terms, sorted into rows: {@code cells[t]} is the flat cell index of
     * term t and {@code comps[t]} its component. Values are set each step with {@link #sourceValue}.
     */
    public void setSources(int[] cells, Component[] comps) {
        int n = cells.length;
        eRowStart = new int[ny + 1];
        hRowStart = new int[ny + 1];
        for (int t = 0; t < n; t++) {
            (comps[t].electric ? eRowStart : hRowStart)[cells[t] / nx + 1]++;
        }
        for (int j = 0; j < ny; j++) {
            eRowStart[j + 1] += eRowStart[j];
            hRowStart[j + 1] += hRowStart[j];
        }
        int ne = eRowStart[ny];
        eCell = new int[ne];
        eComp = new Component[ne];
        eValue = new double[ne];
        hCell = new int[n - ne];
        hComp = new Component[n - ne];
        hValue = new double[n - ne];
        int[] eNext = java.util.Arrays.copyOf(eRowStart, ny);
        int[] hNext = java.util.Arrays.copyOf(hRowStart, ny);
        termOrder = new int[n];
        for (int t = 0; t < n; t++) {
            int j = cells[t] / nx;
            if (comps[t].electric) {
                int e = eNext[j]++;
                termOrder[t] = e;
                eCell[e] = cells[t];
                eComp[e] = comps[t];
            } else {
                int h = hNext[j]++;
                termOrder[t] = -1 - h;
                hCell[h] = cells[t];
                hComp[h] = comps[t];
            }
        }
    }

    /**
     * Sets the complex value of source term t for the coming step. A real engine holds real fields
     * only: the imaginary part must be zero (complex sources need Bloch-periodic boundaries).
     */
    public void sourceValue(int t, double re, double im) {
        if (im != 0) {
            throw new IllegalStateException("a complex source value needs Bloch-periodic boundaries");
        }
        sourceValue(t, re);
    }

    /**
     * Computes the values of one row's source terms for the coming half step (with {@link #sourceValue}), called by the
     * band that updates the row, just before they are added: a beam's sheet then costs the caller nothing between
     * steps, while the other bands wait for it (see {@link #rowSources}).
     */
    public interface RowSources {
        /** Sets the values of row j's terms of one kind (electric or magnetic); other rows' values are left alone. */
        void fill(boolean electric, int j);
    }

    /** Called for each row with source terms before they are added; null: the values are set before each step. */
    private RowSources rowSources;

    /**
     * Has this engine call {@code r} for each row with source terms of a half step, from the row's band, before they are
     * added. Returns false where the engine cannot (the values must then be set before each step).
     */
    public boolean rowSources(RowSources r) {
        rowSources = r;
        return true;
    }

    /** Sets the value of source term t (in the order given to {@link #setSources}) for the coming step. */
    public void sourceValue(int t, double v) {
        int o = termOrder[t];
        if (o >= 0) {
            eValue[o] = v;
        } else {
            hValue[-1 - o] = v;
        }
    }

    /**
     * Runs one phase of one step over the band of rows [j0, j1).
     *
     * @param flush when true, values below the flush threshold are set to zero in every row the
     *              phase updates, and the largest field magnitude met is returned (NaN if any)
     * @return the largest magnitude met when flushing, else 0
     */
    public final double sweep(int j0, int j1, int phase, boolean flush) {
        if (phase == 0 && j0 == 0 && vl == SCALAR_ONLY) {
            scalarSteps++;
            if (scalarSteps * nx * ny >= vectorAfter) {
                useVectors();
            }
        }
        double max = 0;
        if (phase == 0) {
            max = hRowFull(j1 - 1, flush);
        } else {
            // Blocks keep the row-by-row order's reads: H(j) reads Ez rows j and j + 1 before
            // they are updated (E of a row comes after H of its block), and E(j) reads H rows
            // j and j − 1 after their update (in this block or the one before).
            int block = blockRows();
            for (int a = j0; a < j1; a += block) {
                int b = Math.min(a + block, j1);
                max = Math.max(max, hRows(a, Math.min(b, j1 - 1), flush));
                max = Math.max(max, eRows(a, b, flush));
            }
        }
        return max;
    }

    /**
     * Rows per block of {@link #sweep}'s phase 1: as many as fit about {@link #BLOCK_BYTES} of
     * field and coefficient rows (at least 1, at most 64, or {@link #FLAT_BLOCK_CELLS} / nx when
     * more for a flat engine), fixed at the first sweep. Every cell
     * gets the same operations whatever the block size, so results do not depend on it.
     */
    protected final int blockRows() {
        if (blockRows == 0) {
            int most = flat ? Math.max(64, FLAT_BLOCK_CELLS / nx) : 64;
            blockRows = Math.max(1, Math.min(most, (int) (BLOCK_BYTES / ((long) bytesPerCell() * nx))));
        }
        return blockRows;
    }

    /** See {@link #blockRows()}; 0 until the first sweep. Tests set it to compare block sizes. */
    int blockRows;

    /**
     * Bytes of rows a block of {@link #sweep} may span: a quarter of a megabyte, well inside the
     * per-core L2 cache of current x86 server cores (1–2 MiB, common practice), so the x-side CPML
     * strips of a block find its rows still cached. Developers may override it for measurements
     * with {@code -Devanesce.blockBytes=B}.
     */
    static final long BLOCK_BYTES = Long.getLong("evanesce.blockBytes", 256 * 1024);

    /**
     * The magnetic update of rows [a, b) (possibly empty), each with its sources and the flush
     * when asked; returns the largest magnitude flushed, as {@link #hRowFull}. Engines may update
     * the rows' cells in another grouping as long as every cell sees the same operations in the
     * same order as in {@link #hRowFull}.
     */
    protected double hRows(int a, int b, boolean flush) {
        double max = 0;
        for (int j = a; j < b; j++) {
            max = Math.max(max, hRowFull(j, flush));
        }
        return max;
    }

    /** The electric update of rows [a, b); as {@link #hRows}. */
    protected double eRows(int a, int b, boolean flush) {
        double max = 0;
        for (int j = a; j < b; j++) {
            max = Math.max(max, eRowFull(j, flush));
        }
        return max;
    }

    /**
     * The magnetic update of row j with its sources, and the flush when asked; returns the largest
     * magnitude flushed (Math.max propagates NaN), else 0.
     */
    protected double hRowFull(int j, boolean flush) {
        hRow(j);
        return hFinish(j, flush);
    }

    /** The electric update of row j with its sources, and the flush when asked; as {@link #hRowFull}. */
    protected double eRowFull(int j, boolean flush) {
        eRow(j);
        return eFinish(j, flush);
    }

    /** Adds the magnetic sources of row j, after its update, and flushes it when asked (see {@link #hRowFull}). */
    protected final double hFinish(int j, boolean flush) {
        if (rowSources != null && hRowStart[j] < hRowStart[j + 1]) {
            rowSources.fill(false, j);
        }
        for (int t = hRowStart[j]; t < hRowStart[j + 1]; t++) {
            addSource(hComp[t], hCell[t], hValue[t]);
        }
        return flush ? flushH(j) : 0;
    }

    /**
     * Adds the electric sources of row j, after its update, then runs the dispersive cells'
     * post-pass of the row (when the grid has any) and flushes it when asked. The post-pass
     * comes after everything else that changes E in the row (ordinary update with ca', cb', CPML
     * corrections, sources), and reads and writes row j alone, so results stay those of any band split.
     */
    protected final double eFinish(int j, boolean flush) {
        if (rowSources != null && eRowStart[j] < eRowStart[j + 1]) {
            rowSources.fill(true, j);
        }
        for (int t = eRowStart[j]; t < eRowStart[j + 1]; t++) {
            addSource(eComp[t], eCell[t], eValue[t]);
        }
        if (dispersive) {
            dispersiveRow(j);
        }
        return flush ? flushE(j) : 0;
    }

    /**
     * {@link #eFinish} for the rows [a, b) of a block whose electric update (CPML corrections included) is done:
     * the same bits as calling it row after row. The sources of every row, then the dispersive post-pass of the
     * whole block at once ({@link #dispersiveRows}: a film's cells in one run over several rows), then the flush
     * of each row: every cell still sees sources, post-pass and flush in that order, and each of them reads and
     * writes the cell's own row alone, so nothing of another row can have changed in between.
     */
    protected final double eFinishRows(int a, int b, boolean flush) {
        double max = 0;
        if (!dispersive) {
            for (int j = a; j < b; j++) {
                max = Math.max(max, eFinish(j, flush));
            }
            return max;
        }
        for (int j = a; j < b; j++) {
            if (rowSources != null && eRowStart[j] < eRowStart[j + 1]) {
                rowSources.fill(true, j);
            }
            for (int t = eRowStart[j]; t < eRowStart[j + 1]; t++) {
                addSource(eComp[t], eCell[t], eValue[t]);
            }
        }
        dispersiveRows(a, b);
        if (flush) {
            for (int j = a; j < b; j++) {
                max = Math.max(max, flushE(j));
            }
        }
        return max;
    }

    /** The dispersive cells' post-pass of row j ({@link AdeCoefficients#postPass} per cell); engines with poles override it. */
    protected void dispersiveRow(int j) {
    }

    /**
     * The post-pass of rows [a, b), row after row unless an engine overrides it (cells of several rows at once: each
     * cell's post-pass reads and writes its own values alone).
     */
    protected void dispersiveRows(int a, int b) {
        for (int j = a; j < b; j++) {
            dispersiveRow(j);
        }
    }

    /**
     * Bytes of the dispersive cells' auxiliary state, cell indices and row starts (included in {@link #bytes()});
     * {@link #dispersiveFootprint} gives the same figure before building.
     */
    public long dispersiveBytes() {
        return 0;
    }

    /**
     * What {@link #dispersiveBytes()} will report for a grid: for each electric site of the polarization
     * and each material with poles that has cells the update changes there, its state (stateSize values per
     * cell), one cell index per cell, ny + 1 row starts of cells and of runs (neighbouring cells of a row)
     * and three ints per run; twice with Bloch-periodic sides (two parts).
     *
     * @param stateSizeOf by material index, the state values per cell of a material with poles, else 0
     */
    public static long dispersiveFootprint(MaterialGrid grid, Polarization pol, Precision precision,
                                           Map<Side, Boundary> sides, int[] stateSizeOf) {
        int nx = grid.nx();
        int ny = grid.ny();
        long b = 0;
        for (Component c : pol.components()) {
            if (!c.electric) {
                continue;
            }
            long[] cells = new long[stateSizeOf.length];
            long[] runs = new long[stateSizeOf.length];
            for (int j = 0; j < ny; j++) {
                int previous = -1;
                for (int i = 0; i < nx; i++) {
                    int m = grid.id(site(c), i, j);
                    if (stateSizeOf[m] > 0 && wouldUpdate(sides, nx, ny, c, i, j)) {
                        cells[m]++;
                        if (previous != m) {
                            runs[m]++;
                        }
                        previous = m;
                    } else {
                        previous = -1;
                    }
                }
            }
            for (int m = 0; m < stateSizeOf.length; m++) {
                if (cells[m] > 0) {
                    // state, a cell index per cell, row starts of cells and of runs, three ints per run
                    b += cells[m] * stateSizeOf[m] * precision.bytes
                            + (long) Integer.BYTES * (cells[m] + 2L * (ny + 1) + 3 * runs[m]);
                }
            }
        }
        return sides.get(Side.LEFT) instanceof Boundary.Bloch ? 2 * b : b;
    }

    /** Magnetic update of row j, including CPML corrections. */
    protected abstract void hRow(int j);

    /** Electric update of row j, including walls and CPML corrections. */
    protected abstract void eRow(int j);

    /** Applies a soft source term to one cell. */
    protected abstract void addSource(Component c, int k, double v);

    /** Flushes tiny magnetic values of row j; returns the largest magnitude in the row. */
    protected abstract double flushH(int j);

    /** Flushes tiny electric values of row j; returns the largest magnitude in the row. */
    protected abstract double flushE(int j);

    /** The value of a component at flat cell index k. */
    public abstract double get(Component c, int k);

    /**
     * Copies n values of a component from flat cell index k onwards into {@code dst} (a recorder's row read
     * at once, rather than a call per value).
     */
    public void read(Component c, int k, int n, double[] dst) {
        for (int m = 0; m < n; m++) {
            dst[m] = get(c, k + m);
        }
    }

    /** The same for the imaginary parts: zeros for a real engine. */
    public void readImag(Component c, int k, int n, double[] dst) {
        java.util.Arrays.fill(dst, 0, n, 0.0);
    }

    /**
     * Copies n values of a component from flat cell index k onwards into {@code dst} from index {@code at}, as the
     * single-precision values they are (one array copy); returns false, copying nothing, when the fields are
     * double precision.
     */
    public boolean readFloats(Component c, int k, int n, float[] dst, int at) {
        if (this instanceof FloatEngine f) {
            System.arraycopy(f.field(c), k, dst, at, n);
            return true;
        }
        return false;
    }

    /** The same for the imaginary parts: zeros for a real single-precision engine. */
    public boolean readFloatsImag(Component c, int k, int n, float[] dst, int at) {
        if (this instanceof FloatEngine) {
            java.util.Arrays.fill(dst, at, at + n, 0f);
            return true;
        }
        return false;
    }

    /** Overwrites a component at flat cell index k (for initial conditions and tests). */
    public abstract void set(Component c, int k, double v);

    /** Whether the fields are complex (a Bloch-periodic pair); a real engine's imaginary parts are all zero. */
    public boolean isComplex() {
        return false;
    }

    /** The imaginary part of a component at flat cell index k: zero for a real engine. */
    public double getImag(Component c, int k) {
        return 0.0;
    }

    /** Overwrites the imaginary part (Bloch-periodic runs only). */
    public void setImag(Component c, int k, double v) {
        throw new IllegalStateException("imaginary parts exist only with Bloch-periodic boundaries");
    }

    /**
     * Electromagnetic energy in the cells i0 ≤ i &lt; i1, j0 ≤ j &lt; j1, in units of ε0Δ²/2 times
     * (V/m)²: Σ εr E² + H·H', with H' the magnetic field half a step later computed from the
     * current E without changing the state. This staggered product is the quantity the Yee scheme
     * conserves exactly in a closed lossless cavity (Taflove &amp; Hagness ch. 4, energy
     * argument; verified by EnergyConservationTest). Cells inside a PML are counted without the
     * stretching, so keep the region outside it.
     */
    public abstract double energy(int i0, int j0, int i1, int j1);

    /**
     * Bytes of the arrays held: fields, coefficients, CPML strips (ψ and coefficients) and the Bloch
     * seam values; {@link #footprint} gives the same figure (arrays + pml) without allocating.
     */
    public abstract long bytes();

    /** Writes the fields and the PML auxiliaries (everything a step changes) for a checkpoint. */
    public abstract void writeState(java.io.DataOutput out) throws java.io.IOException;

    /** Reads what {@link #writeState} wrote, into this engine of the same grid and sides. */
    public abstract void readState(java.io.DataInput in) throws java.io.IOException;

    /** Bytes of the arrays that exist in every cell (fields and coefficients), per cell. */
    public abstract int bytesPerCell();
}
