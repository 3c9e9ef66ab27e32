package org.evanesce.solver.kernel;

import java.util.Map;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;

/**
 * Complex fields for Bloch-periodic boundaries along x, as two real engines (the real and the
 * imaginary part) that step in lockstep row by row. The Yee update is real and linear, so the
 * parts are independent except at the seam, where a field one period away is the field here times
 * e^{±iφ}, φ = kx·P (the period P = nx·Δ):
 * <pre>
 *   E(nx, j)  = e^{+iφ} E(0, j)        read by the magnetic update of the last column
 *   H(−1, j)  = e^{−iφ} H(nx − 1, j)   read by the electric update of column 0
 * </pre>
 * with E = Ez, H = Hy for s and E = Ey, H = Hz for p (J. A. Roden et al., IEEE Trans. Microwave
 * Theory Tech. 46, 420 (1998), constant transverse wavenumber). Before each row's magnetic update
 * the seam value east of the last column is formed from the old E of column 0 of both parts; before
 * each row's electric update the value west of column 0 from the new H of the last column. Both
 * are row-local, so the row bands and the thread-independence of results carry over.
 */
final class BlochPair extends Engine {

    private final Engine re;
    private final Engine im;
    private final double cos;
    private final double sin;
    private final Component seamE;
    private final Component seamH;

    BlochPair(Engine re, Engine im, Polarization pol, double phase) {
        // the pair only schedules its parts; its own walls, strips and sources are never used
        super(re.nx, re.ny, re.courant, Map.of(Side.LEFT, Boundary.pec(), Side.RIGHT, Boundary.pec(),
                Side.BOTTOM, Boundary.pec(), Side.TOP, Boundary.pec()));
        if (!re.blochX || !im.blochX) {
            throw new IllegalArgumentException("both parts must have Bloch-periodic x sides");
        }
        this.re = re;
        this.im = im;
        cos = Math.cos(phase);
        sin = Math.sin(phase);
        seamE = pol == Polarization.S ? Component.EZ : Component.EY;
        seamH = pol == Polarization.S ? Component.HY : Component.HZ;
    }

    @Override
    protected int lanes() {
        return re.lanes();
    }

    /** The parts' dispersive cells (both parts' work falls in the pair's rows). */
    @Override
    protected void addDispersiveWork(double[] w) {
        re.addDispersiveWork(w);
        im.addDispersiveWork(w);
    }

    @Override
    protected void useScalars() {
        super.useScalars();
        re.useScalars();
        im.useScalars();
    }

    /** The parts run the rows, so they switch with the pair. */
    @Override
    protected void useVectors() {
        super.useVectors();
        re.useVectors();
        im.useVectors();
    }

    @Override
    public void flatRuns(boolean on) {
        super.flatRuns(on);
        re.flatRuns(on);
        im.flatRuns(on);
    }

    @Override
    protected double hRowFull(int j, boolean flush) {
        seamEast(j);
        return Math.max(re.hRowFull(j, flush), im.hRowFull(j, flush));
    }

    @Override
    protected double eRowFull(int j, boolean flush) {
        seamWest(j);
        return Math.max(re.eRowFull(j, flush), im.eRowFull(j, flush));
    }

    /**
     * The magnetic rows [a, b) of both parts, each part's rows at once (its own blocking and flat runs):
     * the seam values east of the last column come from the old E of column 0, which no magnetic row
     * changes, so forming them all first gives each row the value it got row by row.
     */
    @Override
    protected double hRows(int a, int b, boolean flush) {
        for (int j = a; j < b; j++) {
            seamEast(j);
        }
        return Math.max(re.hRows(a, b, flush), im.hRows(a, b, flush));
    }

    /**
     * The electric rows [a, b) of both parts, each part's rows at once: the seam values west of column 0
     * come from the new H of the last column, complete (sources included) for every row of the block
     * before its electric rows start, and no electric row changes them.
     */
    @Override
    protected double eRows(int a, int b, boolean flush) {
        for (int j = a; j < b; j++) {
            seamWest(j);
        }
        return Math.max(re.eRows(a, b, flush), im.eRows(a, b, flush));
    }

    /** Row j's electric value east of the last column, one period on from column 0, for both parts. */
    private void seamEast(int j) {
        int k = j * nx;
        double a = re.get(seamE, k);
        double b = im.get(seamE, k);
        re.ghostE[j] = cos * a - sin * b;
        im.ghostE[j] = sin * a + cos * b;
    }

    /** Row j's magnetic value west of column 0, one period back from the last column, for both parts. */
    private void seamWest(int j) {
        int k = j * nx + nx - 1;
        double a = re.get(seamH, k);
        double b = im.get(seamH, k);
        re.ghostW[j] = cos * a + sin * b;
        im.ghostW[j] = -sin * a + cos * b;
    }

    @Override
    public void setSources(int[] cells, Component[] comps) {
        re.setSources(cells, comps);
        im.setSources(cells, comps);
    }

    @Override
    public void sourceValue(int t, double vr, double vi) {
        re.sourceValue(t, vr);
        im.sourceValue(t, vi);
    }

    @Override
    public void sourceValue(int t, double v) {
        sourceValue(t, v, 0.0);
    }

    /** The parts add their sources row by row, each on its own: the values are set before each step. */
    @Override
    public boolean rowSources(RowSources r) {
        return false;
    }

    @Override
    protected void hRow(int j) {
        throw new UnsupportedOperationException("the parts update their rows");
    }

    @Override
    protected void eRow(int j) {
        throw new UnsupportedOperationException("the parts update their rows");
    }

    @Override
    protected void addSource(Component c, int k, double v) {
        throw new UnsupportedOperationException("the parts hold the sources");
    }

    @Override
    protected double flushH(int j) {
        throw new UnsupportedOperationException("the parts flush their rows");
    }

    @Override
    protected double flushE(int j) {
        throw new UnsupportedOperationException("the parts flush their rows");
    }

    @Override
    public double get(Component c, int k) {
        return re.get(c, k);
    }

    @Override
    public void set(Component c, int k, double v) {
        re.set(c, k, v);
    }

    @Override
    public boolean isComplex() {
        return true;
    }

    @Override
    public double getImag(Component c, int k) {
        return im.get(c, k);
    }

    @Override
    public void read(Component c, int k, int n, double[] dst) {
        re.read(c, k, n, dst);
    }

    @Override
    public void readImag(Component c, int k, int n, double[] dst) {
        im.read(c, k, n, dst);
    }

    @Override
    public boolean readFloats(Component c, int k, int n, float[] dst, int at) {
        return re.readFloats(c, k, n, dst, at);
    }

    @Override
    public boolean readFloatsImag(Component c, int k, int n, float[] dst, int at) {
        return im.readFloats(c, k, n, dst, at);
    }

    @Override
    public void setImag(Component c, int k, double v) {
        im.set(c, k, v);
    }

    /** |E|² and H·H' summed over both parts; the seam cells are counted without the periodic neighbour. */
    @Override
    public double energy(int i0, int j0, int i1, int j1) {
        return re.energy(i0, j0, i1, j1) + im.energy(i0, j0, i1, j1);
    }

    @Override
    public long bytes() {
        return re.bytes() + im.bytes();
    }

    @Override
    public long dispersiveBytes() {
        return re.dispersiveBytes() + im.dispersiveBytes();
    }

    @Override
    public int bytesPerCell() {
        return re.bytesPerCell() + im.bytesPerCell();
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        re.writeState(out);
        im.writeState(out);
    }

    @Override
    public void readState(java.io.DataInput in) throws java.io.IOException {
        re.readState(in);
        im.readState(in);
    }
}
