package org.evanesce.solver.record;

import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.farfield.ContourPoints;
import org.evanesce.solver.farfield.NearToFarField;
import org.evanesce.solver.farfield.SurfaceSamples;
import org.evanesce.solver.grid.Polarization;

/**
 * A closed rectangle whose running transforms feed the near-to-far-field transformation: the four sides of a
 * {@link FluxBox} (the same cells, the same DFTs, nothing accumulated off the contour), read back as complex
 * amplitudes of U (Ez for s, η0·Hz for p) and of the tangential in-plane field V_t (η0·H_t for s, E_t for p) at
 * the points where each side's E (averaged onto the side) and H sit together, with outward normals and the side's
 * own integration weights (midpoint rule for s, trapezoid rule for p, as {@link FluxBox}). {@link NearToFarField}
 * does the rest (Taflove &amp; Hagness, <i>Computational Electrodynamics</i>, 3rd ed., 2005, ch. 8).
 *
 * <p>The transforms are those of {@link FluxLine}: X(f) = Σ F(t) e^{i2πft} Δt. The far field's power from them is
 * in the units of {@link FluxLine#flux} ("DFT flux"); like it, 4× that is an energy per hertz for a pulse that has
 * died out and 4/(D_E D_H)× it a mean power for a continuous wave over whole periods ({@link #meanPowerScale}).
 *
 * <p>The run's worker threads share the sides' cells ({@link SharedRecorder}) row by row, each the rows it updates
 * ({@link #units}): each cell's sums see the same operations in the same order on any thread.
 */
public final class FarFieldBox implements StatefulListener, SharedRecorder {

    private final Polarization pol;
    private final FluxBox box;
    /** The box's sides: bottom, top, left, right. */
    private final FluxLine[] lines;
    /** Which sides take samples this step (set by {@link #prepare}). */
    private final boolean[] active = new boolean[4];
    /** The grid's rows, one unit of shared work each (known from the first step; 0 before). */
    private int rows;
    /** ε of the medium round the contour as the grid has it (0: the medium's index squared). */
    private double gridPermittivity;

    /** The sides as {@link FluxBox#FluxBox}: x = (l + ½)Δ … (r + ½)Δ, y = (b + ½)Δ … (t + ½)Δ. */
    public FarFieldBox(Polarization pol, int l, int b, int r, int t, double... frequencies) {
        this.pol = pol;
        this.box = new FluxBox(pol, l, b, r, t, frequencies);
        this.lines = box.sides();
    }

    /** The flux box whose sides are transformed (for the net power out). */
    public FluxBox box() {
        return box;
    }

    @Override
    public boolean prepare(StepView v, int workers) {
        boolean any = false;
        for (int k = 0; k < 4; k++) {
            // the sides share their sample times: the first side's factors serve the others
            active[k] = lines[k].prepare(v, workers, k == 0 || !active[0] ? null : lines[0]);
            any |= active[k];
        }
        rows = v.ny();
        return any;
    }

    /**
     * One unit per row of the grid (the grid's row count, from the first step on; 1 before it): a run's worker
     * threads split the units as they split the rows, so each does the contour's cells on the rows it has just
     * updated, while they are in its cache. Unit j holds the left and right sides' cells on row j (both read on
     * the same pass), and the whole bottom (top) side when j is the row it lies on.
     */
    @Override
    public int units() {
        return Math.max(1, rows);
    }

    @Override
    public void share(StepView v, int u0, int u1, int worker) {
        for (int k = 0; k < 2; k++) {
            int row = lines[k].row();
            if (active[k] && row >= u0 && row < u1) {
                lines[k].share(v, 0, lines[k].units(), worker);
            }
        }
        for (int k = 2; k < 4; k++) {
            int first = lines[k].firstCell();
            int a = Math.max(u0, first) - first;
            int b = Math.min(u1, first + lines[k].cells()) - first;
            if (active[k] && a < b) {
                lines[k].share(v, a, b, worker);
            }
        }
    }

    /**
     * The relative permittivity the grid gives the medium round the contour, when it differs from the medium's index
     * squared (a case's dispersion correction): the far field's grid wavenumbers follow it.
     */
    public FarFieldBox gridPermittivity(double epsilon) {
        if (!(epsilon > 0) || Double.isInfinite(epsilon)) {
            throw new IllegalArgumentException(String.format("far-field contour: grid permittivity %g must be finite and > 0",
                    epsilon));
        }
        gridPermittivity = epsilon;
        return this;
    }

    /** Transforms only samples in [start, end), s (see {@link FluxLine#window}). */
    public FarFieldBox window(double start, double end) {
        box.window(start, end);
        return this;
    }

    /**
     * The transformed fields on the contour at frequency q: [0] U, [1] V_t, at the same points (coordinates
     * relative to the origin).
     *
     * @param gridX0   x of node column 0, m
     * @param gridY0   y of node row 0, m
     * @param cellSize Δ, m
     * @param originX  x of the far-field phase origin, m
     * @param originY  y of it, m
     */
    public SurfaceSamples[] samples(int q, double gridX0, double gridY0, double cellSize, double originX, double originY) {
        FluxLine[] sides = box.sides(); // bottom, top, left, right
        double[][] normals = {{0, -1}, {0, 1}, {-1, 0}, {1, 0}};
        int n = 0;
        for (FluxLine s : sides) {
            n += s.cells();
        }
        double[] x = new double[n];
        double[] y = new double[n];
        double[] nx = new double[n];
        double[] ny = new double[n];
        double[] w = new double[n];
        double[] ur = new double[n];
        double[] ui = new double[n];
        double[] vr = new double[n];
        double[] vi = new double[n];
        boolean s = pol == Polarization.S;
        int p = 0;
        for (int k = 0; k < 4; k++) {
            FluxLine line = sides[k];
            long[] count = line.samples();
            // V_t brought to U's duration: a window holds one sample more of E than of H (or fewer) now and then, which
            // would weigh the transformation's two terms differently (the transforms are ½ X̂ D, D each one's own)
            double scale = count[0] == 0 || count[1] == 0 ? 1
                         : s ? (double) count[0] / count[1] : (double) count[1] / count[0];
            double[][] e = line.electricTransform(q);
            double[][] h = line.magneticTransform(q);
            double[][] u = s ? e : h;
            double[][] v = s ? h : e;
            // V_t = V · t̂, t̂ = (−n̂_y, n̂_x): +V on the bottom and right sides, −V on the top and left
            double sign = k == 0 || k == 3 ? 1 : -1;
            double along = line.isVertical() ? line.electricComponent().dy : line.electricComponent().dx;
            double across = (line.row() + 0.5) * cellSize;
            int c = line.cells();
            for (int j = 0; j < c; j++) {
                double a = (line.firstCell() + j + along) * cellSize;
                x[p] = (line.isVertical() ? gridX0 + across : gridX0 + a) - originX;
                y[p] = (line.isVertical() ? gridY0 + a : gridY0 + across) - originY;
                nx[p] = normals[k][0];
                ny[p] = normals[k][1];
                w[p] = (!s && (j == 0 || j == c - 1) ? 0.5 : 1.0) * cellSize;
                ur[p] = u[0][j];
                ui[p] = u[1][j];
                vr[p] = sign * scale * v[0][j];
                vi[p] = sign * scale * v[1][j];
                p++;
            }
        }
        ContourPoints points = new ContourPoints(x, y, nx, ny, w);
        return new SurfaceSamples[] {points.scalar(ur, ui), new SurfaceSamples(points, vr, vi)};
    }

    /**
     * The far field at frequency q of what radiates from inside the contour into a homogeneous lossless medium of
     * index n round it, phases referred to (originX, originY): the transformation for the grid's own outgoing waves
     * ({@link NearToFarField#onYeeGrid}; the Courant number from the transforms' time step), so that neither the
     * phase the grid's dispersion adds between the scatterer and the contour nor the averaging of E onto the sides
     * enters σ or the forward amplitude.
     */
    public NearToFarField farField(int q, double index, double gridX0, double gridY0, double cellSize, double originX,
                                   double originY) {
        SurfaceSamples[] uv = samples(q, gridX0, gridY0, cellSize, originX, originY);
        FluxLine side = box.sides()[0];
        double wavelength = PhysicalConstants.C0 / side.frequency(q);
        NearToFarField ff = new NearToFarField(pol, wavelength, index, uv[0], uv[1]);
        long[] n = side.samples();
        double dt = Math.sqrt(4 / (side.meanPowerScale() * n[0] * n[1]));
        // no samples yet: nothing to correct (all zero)
        double eps = gridPermittivity > 0 ? gridPermittivity : index * index;
        return dt > 0 ? ff.onYeeGrid(cellSize, PhysicalConstants.C0 * dt / cellSize, eps) : ff;
    }

    /** 4/(D_E D_H), 1/s²: turns a power from these transforms into a continuous wave's mean power ({@link FluxLine#meanPowerScale}). */
    public double meanPowerScale() {
        return box.sides()[0].meanPowerScale();
    }

    /** Bytes held by the transforms. */
    public long bytes() {
        return box.bytes();
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        box.writeState(out);
    }

    @Override
    public void readState(java.io.DataInput in) throws java.io.IOException {
        box.readState(in);
    }
}
