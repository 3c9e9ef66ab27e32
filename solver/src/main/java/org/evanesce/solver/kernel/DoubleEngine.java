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
 * sources, the flush, bytes, checkpoint state). {@link DoubleS} and {@link DoubleP} hold only what
 * differs: the order of the updates and the energy. Arrays are laid out as {@link Layout} says.
 * Generated from {@link FloatEngine} by tools/regen-double-kernels.sh: edit that file, not this one.
 */
abstract class DoubleEngine extends Engine {

    /** The Courant number s = c0Δt/Δ in this precision. */
    final double s;
    /** Field, cb and ca arrays by {@link Component#ordinal()}: null where absent (ca of a lossless site). */
    private final double[][] field, cbOf, caOf;
    /** The polarization's fields in {@link Polarization#components()} order; its magnetic and electric ones. */
    private final double[][] fields, magnetic, electric;
    private final Polarization pol;
    /** CPML strips on the x sides (widened to whole vectors) and the y sides, as {@link Layout} says. */
    final DoubleStrip[] xs, ys;
    /**
     * Columns [xFree0, xFree1) that no x strip corrects: rows of a y strip correct them in the same pass
     * as their plain update ({@link DoublePmlRows}); empty (xFree0 ≥ xFree1) when the x strips meet.
     */
    final int xFree0, xFree1;
    /** The dispersive cells of each electric component by {@link Component#ordinal()}: null where it has none. */
    private final DoubleAde[] ade;
    /** The series sites (a field across a metal's face) of each electric component: null where it has none. */
    private final DoubleSeries[] series;
    /**
     * Per row, three slots of ny values: the edge-column values a flat pass overwrites, kept over it
     * ({@link DoubleFlat}); slot m of row j is {@code keep[m*ny + j]}, so bands never share a slot.
     */
    final double[] keep;
    /**
     * Whether the rows of the y-side strips are updated in flat runs too (their correction over the run's
     * cells with per-cell coefficients): on flat engines with Bloch-periodic x sides, where the
     * correction covers every column of a strip row as the row path's does.
     */
    boolean yFlat;
    /** The non-null entries of {@link #ade} and {@link #series}, for the per-row passes. */
    private final DoubleAde[] adeHeld;
    private final DoubleSeries[] seriesHeld;
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
    DoubleEngine(MaterialGrid grid, Polarization pol, double courant, double[] materialCa, double[] materialCb,
            AdeCoefficients[] adeOf, SeriesCoefficients[] seriesOf, Map<Side, Boundary> sides) {
        super(grid.nx(), grid.ny(), courant, sides);
        this.pol = pol;
        s = courant;
        Layout layout = new Layout(nx, ny, pol, Double.BYTES, DoubleKernels.SP.length());
        Component[] comps = pol.components();
        Component[] el = layout.electric();
        int nc = Component.values().length;
        field = new double[nc][];
        cbOf = new double[nc][];
        caOf = new double[nc][];
        double[][][] c = new double[nc][][];
        boolean[] fold = new boolean[nc];
        for (Component e : el) {
            c[e.ordinal()] = coefficients(grid, site(e), materialCa, materialCb);
            fold[e.ordinal()] = DoubleAde.foldCa(grid, site(e), c[e.ordinal()][0], adeOf);
        }
        int len = layout.length();
        // allocated one after the other with staggered lengths (see Engine.staggeredLength), with
        // nothing else allocated between them: the fields, then cb, then ca, each in the polarization's order
        for (Component q : comps) {
            field[q.ordinal()] = new double[len];
        }
        for (Component e : el) {
            cbOf[e.ordinal()] = toDouble(c[e.ordinal()][1], len);
        }
        for (Component e : el) {
            caOf[e.ordinal()] = Engine.allOnes(c[e.ordinal()][0]) ? null : toDouble(c[e.ordinal()][0], len);
        }
        fields = arrays(comps);
        magnetic = arrays(layout.magnetic());
        electric = arrays(el);
        xs = new DoubleStrip[xProfiles.length];
        for (int q = 0; q < xs.length; q++) {
            PmlProfile p = xProfiles[q].padded(layout.xStripWidth(xProfiles[q].layers), nx);
            xs[q] = new DoubleStrip(p, layout.xPsiLength(p.width));
        }
        int free0 = 0;
        int free1 = nx;
        for (DoubleStrip x : xs) {
            // a strip corrects columns [start, start + width] at most; a low side's starts at the wall
            if (x.start == 0) {
                free0 = Math.max(free0, x.width + 1);
            } else {
                free1 = Math.min(free1, x.start);
            }
        }
        xFree0 = free0;
        xFree1 = free1;
        ys = new DoubleStrip[yProfiles.length];
        for (int q = 0; q < ys.length; q++) {
            ys[q] = new DoubleStrip(yProfiles[q], layout.yPsiLength(yProfiles[q].layers));
        }
        ade = new DoubleAde[nc];
        for (Component e : el) {
            ade[e.ordinal()] = DoubleAde.of(grid, e, field[e.ordinal()], adeOf, sides, fold[e.ordinal()]);
            dispersive |= ade[e.ordinal()] != null;
        }
        keep = new double[Layout.KEPT_PER_ROW * ny];
        flatStrips();
        series = new DoubleSeries[nc];
        for (Component e : el) {
            series[e.ordinal()] = DoubleSeries.of(grid, e, field[e.ordinal()], seriesOf, sides);
            dispersive |= series[e.ordinal()] != null;
        }
        adeHeld = java.util.Arrays.stream(ade).filter(java.util.Objects::nonNull).toArray(DoubleAde[]::new);
        seriesHeld = java.util.Arrays.stream(series).filter(java.util.Objects::nonNull).toArray(DoubleSeries[]::new);
        rowHeld = new boolean[ny];
        for (int j = 0; j < ny; j++) {
            for (DoubleAde a : adeHeld) {
                rowHeld[j] |= a.holdsRow(j);
            }
            for (DoubleSeries a : seriesHeld) {
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
            for (DoubleStrip y : ys) {
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

    private double[][] arrays(Component[] comps) {
        double[][] out = new double[comps.length][];
        for (int q = 0; q < comps.length; q++) {
            out[q] = field[comps[q].ordinal()];
        }
        return out;
    }

    /** The values of {@code a} in an array of {@code length} ≥ a.length values (zeros after them). */
    static double[] toDouble(double[] a, int length) {
        double[] f = new double[length];
        for (int i = 0; i < a.length; i++) {
            f[i] = a[i];
        }
        return f;
    }

    /** The field array of component c. */
    final double[] field(Component c) {
        double[] f = field[c.ordinal()];
        if (f == null) {
            throw new IllegalArgumentException(c + " is not one of the " + pol + " polarization's components "
                    + java.util.Arrays.toString(pol.components()));
        }
        return f;
    }

    /** cb of electric component c. */
    final double[] cb(Component c) {
        return cbOf[c.ordinal()];
    }

    /** ca of electric component c, or null where every cell of its site is lossless (ca = 1). */
    final double[] ca(Component c) {
        return caOf[c.ordinal()];
    }

    @Override
    protected void addSource(Component c, int k, double v) {
        double[] f = field(c);
        if (c.electric) {
            f[k] -= (cbOf[c.ordinal()][k] * v);
        } else {
            f[k] -= (s * v);
        }
    }

    @Override
    protected double flushH(int j) {
        return flush(magnetic, j);
    }

    @Override
    protected double flushE(int j) {
        if (rowHeld[j]) {
            for (DoubleAde a : adeHeld) {
                a.flushRow(j, vl);
            }
            for (DoubleSeries a : seriesHeld) {
                a.flushRow(j, vl);
            }
        }
        return flush(electric, j);
    }

    @Override
    protected int lanes() {
        return DoubleKernels.SP.length();
    }

    @Override
    protected void dispersiveRow(int j) {
        if (!rowHeld[j]) {
            return;
        }
        for (DoubleAde a : adeHeld) {
            a.row(j);
        }
        for (DoubleSeries a : seriesHeld) {
            a.row(j);
        }
    }

    @Override
    protected void dispersiveRows(int a, int b) {
        for (DoubleAde x : adeHeld) {
            x.rows(a, b);
        }
        for (DoubleSeries x : seriesHeld) {
            for (int j = a; j < b; j++) {
                if (rowHeld[j]) {
                    x.row(j);
                }
            }
        }
    }

    private double flush(double[][] arrays, int j) {
        int r = j * nx;
        double max = 0;
        for (double[] a : arrays) {
            max = Math.max(max, DoubleKernels.flush(a, r, r + nx, vl));
        }
        return max;
    }

    @Override
    public double get(Component c, int k) {
        return field(c)[k];
    }

    @Override
    public void read(Component c, int k, int n, double[] dst) {
        double[] f = field(c);
        for (int m = 0; m < n; m++) {
            dst[m] = f[k + m];
        }
    }

    @Override
    public void set(Component c, int k, double v) {
        field(c)[k] = v;
        if (ade[c.ordinal()] != null) {
            ade[c.ordinal()].setField(k, v);
        }
        if (series[c.ordinal()] != null) {
            series[c.ordinal()].setField(k, v);
        }
    }

    /** Counts the arrays actually held; {@link Engine#footprint} must give the same figure (arrays + pml). */
    @Override
    public long bytes() {
        long values = 0;
        for (double[][] byComponent : new double[][][] {field, cbOf, caOf}) {
            for (double[] a : byComponent) {
                values += a == null ? 0 : a.length;
            }
        }
        for (DoubleStrip x : xs) {
            values += x.values();
        }
        for (DoubleStrip y : ys) {
            values += y.values();
        }
        return (values + keep.length) * Double.BYTES + seamBytes() + dispersiveBytes();
    }

    @Override
    public long dispersiveBytes() {
        long b = 0;
        for (DoubleAde a : ade) {
            b += a == null ? 0 : a.bytes();
        }
        for (DoubleSeries a : series) {
            b += a == null ? 0 : a.bytes();
        }
        return b;
    }

    @Override
    public int bytesPerCell() {
        int arrays = 0;
        for (double[][] byComponent : new double[][][] {field, cbOf, caOf}) {
            for (double[] a : byComponent) {
                arrays += a == null ? 0 : 1;
            }
        }
        return arrays * Double.BYTES;
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        for (double[] f : fields) {
            StateIO.write(out, f);
        }
        for (DoubleStrip x : xs) {
            x.writeState(out);
        }
        for (DoubleStrip y : ys) {
            y.writeState(out);
        }
        for (Component e : pol.components()) {
            if (e.electric) {
                DoubleAde a = ade[e.ordinal()];
                if (a == null) {
                    DoubleAde.writeNone(out);
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
        for (double[] f : fields) {
            StateIO.read(in, f);
        }
        for (DoubleStrip x : xs) {
            x.readState(in);
        }
        for (DoubleStrip y : ys) {
            y.readState(in);
        }
        for (Component e : pol.components()) {
            if (e.electric) {
                DoubleAde a = ade[e.ordinal()];
                if (a == null) {
                    DoubleAde.readNone(in);
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
        for (DoubleAde a : adeHeld) {
            a.addRowWork(w, ADE_VALUE_WORK);
        }
    }
}
