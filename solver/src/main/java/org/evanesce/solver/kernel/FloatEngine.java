package org.evanesce.solver.kernel;

import java.util.Map;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.dispersion.AdeCoefficients;
import org.evanesce.geometry.dispersion.SeriesCoefficients;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.boundary.PmlProfile;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;

/**
 * What the single-precision engines share: the three field arrays of a polarization, the
 * electric coefficients, the CPML strips, and everything that only looks values up (get and set,
 * sources, the flush, bytes, checkpoint state). {@link FloatS} and {@link FloatP} hold only what
 * differs: the order of the updates and the energy. Arrays are laid out as {@link Layout} says.
 * Edit this file; {@link DoubleEngine} is generated from it (tools/regen-double-kernels.sh).
 */
abstract class FloatEngine extends Engine {

    /** The Courant number s = c0Δt/Δ in this precision. */
    final float s;
    /** Field, cb and ca arrays by {@link Component#ordinal()}: null where absent (ca of a lossless site). */
    private final float[][] field, cbOf, caOf;
    /** The polarization's fields in {@link Polarization#components()} order; its magnetic and electric ones. */
    private final float[][] fields, magnetic, electric;
    private final Polarization pol;
    /** CPML strips on the x sides (widened to whole vectors) and the y sides, as {@link Layout} says. */
    final FloatStrip[] xs, ys;
    /**
     * Columns [xFree0, xFree1) that no x strip corrects: rows of a y strip correct them in the same pass
     * as their plain update ({@link FloatPmlRows}); empty (xFree0 ≥ xFree1) when the x strips meet.
     */
    final int xFree0, xFree1;
    /** The dispersive cells of each electric component by {@link Component#ordinal()}: null where it has none. */
    private final FloatAde[] ade;
    /** The series sites (a field across a metal's face) of each electric component: null where it has none. */
    private final FloatSeries[] series;
    /**
     * Per row, three slots of ny values: the edge-column values a flat pass overwrites, kept over it
     * ({@link FloatFlat}); slot m of row j is {@code keep[m*ny + j]}, so bands never share a slot.
     */
    final float[] keep;
    /**
     * Whether the rows of the y-side strips are updated in flat runs too (their correction over the run's
     * cells with per-cell coefficients): on flat engines with Bloch-periodic x sides, where the
     * correction covers every column of a strip row as the row path's does.
     */
    boolean yFlat;
    /** The non-null entries of {@link #ade} and {@link #series}, for the per-row passes. */
    private final FloatAde[] adeHeld;
    private final FloatSeries[] seriesHeld;
    /**
     * Whether row j holds a dispersive or series cell of any electric component: the per-row post-pass and
     * its flush skip the other rows at one lookup (a metal film fills a few rows of a tall, narrow grid).
     */
    private final boolean[] rowHeld;

    /**
     * Arrays for grid's cells with ca and cb of each of its materials (see {@link Engine#create});
     * {@code adeOf[m]} the ADE coefficients of material m where it has poles, else null; {@code seriesOf[m]}
     * those of a series material (null for none at all)
     */
    FloatEngine(MaterialGrid grid, Polarization pol, double courant, double[] materialCa, double[] materialCb,
            AdeCoefficients[] adeOf, SeriesCoefficients[] seriesOf, Map<Side, Boundary> sides) {
        super(grid.nx(), grid.ny(), courant, sides);
        this.pol = pol;
        s = (float) courant;
        Layout layout = new Layout(nx, ny, pol, Float.BYTES, FloatKernels.SP.length());
        Component[] comps = pol.components();
        Component[] el = layout.electric();
        int nc = Component.values().length;
        field = new float[nc][];
        cbOf = new float[nc][];
        caOf = new float[nc][];
        double[][][] c = new double[nc][][];
        boolean[] fold = new boolean[nc];
        for (Component e : el) {
            c[e.ordinal()] = coefficients(grid, site(e), materialCa, materialCb);
            fold[e.ordinal()] = FloatAde.foldCa(grid, site(e), c[e.ordinal()][0], adeOf);
        }
        int len = layout.length();
        // allocated one after the other with staggered lengths (see Engine.staggeredLength), with
        // nothing else allocated between them: the fields, then cb, then ca, each in the polarization's order
        for (Component q : comps) {
            field[q.ordinal()] = new float[len];
        }
        for (Component e : el) {
            cbOf[e.ordinal()] = toFloat(c[e.ordinal()][1], len);
        }
        for (Component e : el) {
            caOf[e.ordinal()] = Engine.allOnes(c[e.ordinal()][0]) ? null : toFloat(c[e.ordinal()][0], len);
        }
        fields = arrays(comps);
        magnetic = arrays(layout.magnetic());
        electric = arrays(el);
        xs = new FloatStrip[xProfiles.length];
        for (int q = 0; q < xs.length; q++) {
            PmlProfile p = xProfiles[q].padded(layout.xStripWidth(xProfiles[q].layers), nx);
            xs[q] = new FloatStrip(p, layout.xPsiLength(p.width));
        }
        int free0 = 0;
        int free1 = nx;
        for (FloatStrip x : xs) {
            // a strip corrects columns [start, start + width] at most; a low side's starts at the wall
            if (x.start == 0) {
                free0 = Math.max(free0, x.width + 1);
            } else {
                free1 = Math.min(free1, x.start);
            }
        }
        xFree0 = free0;
        xFree1 = free1;
        ys = new FloatStrip[yProfiles.length];
        for (int q = 0; q < ys.length; q++) {
            ys[q] = new FloatStrip(yProfiles[q], layout.yPsiLength(yProfiles[q].layers));
        }
        ade = new FloatAde[nc];
        for (Component e : el) {
            ade[e.ordinal()] = FloatAde.of(grid, e, field[e.ordinal()], adeOf, sides, fold[e.ordinal()]);
            dispersive |= ade[e.ordinal()] != null;
        }
        keep = new float[Layout.KEPT_PER_ROW * ny];
        flatStrips();
        series = new FloatSeries[nc];
        for (Component e : el) {
            series[e.ordinal()] = FloatSeries.of(grid, e, field[e.ordinal()], seriesOf, sides);
            dispersive |= series[e.ordinal()] != null;
        }
        adeHeld = java.util.Arrays.stream(ade).filter(java.util.Objects::nonNull).toArray(FloatAde[]::new);
        seriesHeld = java.util.Arrays.stream(series).filter(java.util.Objects::nonNull).toArray(FloatSeries[]::new);
        rowHeld = new boolean[ny];
        for (int j = 0; j < ny; j++) {
            for (FloatAde a : adeHeld) {
                rowHeld[j] |= a.holdsRow(j);
            }
            for (FloatSeries a : seriesHeld) {
                rowHeld[j] |= a.holdsRow(j);
            }
        }
    }

    @Override
    public void flatRuns(boolean on) {
        super.flatRuns(on);
        flatStrips();
    }

    /** Sets {@link #yFlat} from {@link #flat}, making the strips' per-cell coefficients where needed. */
    private void flatStrips() {
        yFlat = flat && blochX;
        if (yFlat) {
            for (FloatStrip y : ys) {
                y.perCell(nx);
            }
        }
    }

    /**
     * The end of the run of rows from row j that lie in one y strip, in [lo, hi) and at least {@code from}
     * rows into the strip, up to b; j itself when row j is not one or the strips' rows are not flat.
     * With {@link #yFlat}, the engines' runs start at every strip row that has a y correction (magnetic
     * rows below ny − 1, interior electric rows past a strip's first), so their separate y pass has
     * nothing left to do.
     */
    final int stripRun(int j, int b, int lo, int hi, int from) {
        int q = yStripOfRow[j];
        if (!yFlat || q < 0 || j < lo || j >= hi || j - ys[q].start < from) {
            return j;
        }
        int end = Math.min(b, hi);
        int r = j + 1;
        while (r < end && yStripOfRow[r] == q) {
            r++;
        }
        return r;
    }

    /**
     * The end of the run of plain rows from row j: rows in [lo, hi) outside every y-side strip, up to b;
     * j itself when row j is not one.
     */
    final int plainRun(int j, int b, int lo, int hi) {
        if (j < lo) {
            return j;
        }
        int end = Math.min(b, hi);
        int r = j;
        while (r < end && yStripOfRow[r] < 0) {
            r++;
        }
        return Math.max(r, j);
    }

    private float[][] arrays(Component[] comps) {
        float[][] out = new float[comps.length][];
        for (int q = 0; q < comps.length; q++) {
            out[q] = field[comps[q].ordinal()];
        }
        return out;
    }

    /** The values of {@code a} in an array of {@code length} ≥ a.length values (zeros after them). */
    static float[] toFloat(double[] a, int length) {
        float[] f = new float[length];
        for (int i = 0; i < a.length; i++) {
            f[i] = (float) a[i];
        }
        return f;
    }

    /** The field array of component c. */
    final float[] field(Component c) {
        float[] f = field[c.ordinal()];
        if (f == null) {
            throw new IllegalArgumentException(c + " is not one of the " + pol + " polarization's components "
                    + java.util.Arrays.toString(pol.components()));
        }
        return f;
    }

    /** cb of electric component c. */
    final float[] cb(Component c) {
        return cbOf[c.ordinal()];
    }

    /** ca of electric component c, or null where every cell of its site is lossless (ca = 1). */
    final float[] ca(Component c) {
        return caOf[c.ordinal()];
    }

    @Override
    protected void addSource(Component c, int k, double v) {
        float[] f = field(c);
        if (c.electric) {
            f[k] -= (float) (cbOf[c.ordinal()][k] * v);
        } else {
            f[k] -= (float) (s * v);
        }
    }

    @Override
    protected double flushH(int j) {
        return flush(magnetic, j);
    }

    @Override
    protected double flushE(int j) {
        if (rowHeld[j]) {
            for (FloatAde a : adeHeld) {
                a.flushRow(j, vl);
            }
            for (FloatSeries a : seriesHeld) {
                a.flushRow(j, vl);
            }
        }
        return flush(electric, j);
    }

    @Override
    protected int lanes() {
        return FloatKernels.SP.length();
    }

    @Override
    protected void dispersiveRow(int j) {
        if (!rowHeld[j]) {
            return;
        }
        for (FloatAde a : adeHeld) {
            a.row(j);
        }
        for (FloatSeries a : seriesHeld) {
            a.row(j);
        }
    }

    @Override
    protected void dispersiveRows(int a, int b) {
        for (FloatAde x : adeHeld) {
            x.rows(a, b);
        }
        for (FloatSeries x : seriesHeld) {
            for (int j = a; j < b; j++) {
                if (rowHeld[j]) {
                    x.row(j);
                }
            }
        }
    }

    private double flush(float[][] arrays, int j) {
        int r = j * nx;
        double max = 0;
        for (float[] a : arrays) {
            max = Math.max(max, FloatKernels.flush(a, r, r + nx, vl));
        }
        return max;
    }

    @Override
    public double get(Component c, int k) {
        return field(c)[k];
    }

    @Override
    public void read(Component c, int k, int n, double[] dst) {
        float[] f = field(c);
        for (int m = 0; m < n; m++) {
            dst[m] = f[k + m];
        }
    }

    @Override
    public void set(Component c, int k, double v) {
        field(c)[k] = (float) v;
        if (ade[c.ordinal()] != null) {
            ade[c.ordinal()].setField(k, (float) v);
        }
        if (series[c.ordinal()] != null) {
            series[c.ordinal()].setField(k, (float) v);
        }
    }

    /** Counts the arrays actually held; {@link Engine#footprint} must give the same figure (arrays + pml). */
    @Override
    public long bytes() {
        long values = 0;
        for (float[][] byComponent : new float[][][] {field, cbOf, caOf}) {
            for (float[] a : byComponent) {
                values += a == null ? 0 : a.length;
            }
        }
        for (FloatStrip x : xs) {
            values += x.values();
        }
        for (FloatStrip y : ys) {
            values += y.values();
        }
        return (values + keep.length) * Float.BYTES + seamBytes() + dispersiveBytes();
    }

    @Override
    public long dispersiveBytes() {
        long b = 0;
        for (FloatAde a : ade) {
            b += a == null ? 0 : a.bytes();
        }
        for (FloatSeries a : series) {
            b += a == null ? 0 : a.bytes();
        }
        return b;
    }

    @Override
    public int bytesPerCell() {
        int arrays = 0;
        for (float[][] byComponent : new float[][][] {field, cbOf, caOf}) {
            for (float[] a : byComponent) {
                arrays += a == null ? 0 : 1;
            }
        }
        return arrays * Float.BYTES;
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        for (float[] f : fields) {
            StateIO.write(out, f);
        }
        for (FloatStrip x : xs) {
            x.writeState(out);
        }
        for (FloatStrip y : ys) {
            y.writeState(out);
        }
        for (Component e : pol.components()) {
            if (e.electric) {
                FloatAde a = ade[e.ordinal()];
                if (a == null) {
                    FloatAde.writeNone(out);
                } else {
                    a.writeState(out);
                }
                // only where this run has series sites, so that checkpoints of runs without them keep their layout
                if (series[e.ordinal()] != null) {
                    series[e.ordinal()].writeState(out);
                }
            }
        }
    }

    @Override
    public void readState(java.io.DataInput in) throws java.io.IOException {
        for (float[] f : fields) {
            StateIO.read(in, f);
        }
        for (FloatStrip x : xs) {
            x.readState(in);
        }
        for (FloatStrip y : ys) {
            y.readState(in);
        }
        for (Component e : pol.components()) {
            if (e.electric) {
                FloatAde a = ade[e.ordinal()];
                if (a == null) {
                    FloatAde.readNone(in);
                } else {
                    a.readState(in);
                }
                if (series[e.ordinal()] != null) {
                    series[e.ordinal()].readState(in);
                }
            }
        }
    }

    @Override
    protected void addDispersiveWork(double[] w) {
        for (FloatAde a : adeHeld) {
            a.addRowWork(w, ADE_VALUE_WORK);
        }
    }
}
