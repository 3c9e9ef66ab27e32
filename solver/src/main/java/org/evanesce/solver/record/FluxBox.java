package org.evanesce.solver.record;

import org.evanesce.solver.grid.Polarization;

/**
 * The net Poynting flux out of an axis-aligned rectangle per frequency: four {@link FluxLine}s on its
 * sides, x = (l + ½)Δ … (r + ½)Δ, y = (b + ½)Δ … (t + ½)Δ, their fluxes along +x and +y combined as
 * top − bottom + right − left. With a source inside it is the power the source gives out (less what
 * the inside absorbs); with the sources outside, minus the power absorbed inside (zero for a lossless
 * inside: Poynting's theorem, Born &amp; Wolf sec. 1.1.4, common practice).
 *
 * <p>The sides' samples: for s, Ez with Hx (Hy) at integer positions along the side, x = iΔ for
 * l &lt; i ≤ r (y = jΔ for b &lt; j ≤ t), each the midpoint of a cell of the side; for p, Ex (Ey) with Hz
 * at half-integer positions, x = (i + ½)Δ for l ≤ i ≤ r, the first and last on the corners and
 * weighted ½ (trapezoid rule). Both integrate the side's flux density to second order in Δ.
 */
public final class FluxBox implements StatefulListener, SharedRecorder {

    private final Polarization pol;
    private final FluxLine bottom;
    private final FluxLine top;
    private final FluxLine left;
    private final FluxLine right;
    /** The sides in unit order: bottom, top, left, right. */
    private final FluxLine[] lines;
    /** Which sides take samples this step (set by {@link #prepare}). */
    private final boolean[] active = new boolean[4];

    /**
     * @param l left side at x = (l + ½)Δ
     * @param b bottom side at y = (b + ½)Δ
     * @param r right side at x = (r + ½)Δ, r &gt; l; needs r + 1 &lt; nx
     * @param t top side at y = (t + ½)Δ, t &gt; b; needs t + 1 &lt; ny
     */
    public FluxBox(Polarization pol, int l, int b, int r, int t, double... frequencies) {
        if (!(r > l && t > b && l >= 0 && b >= 0)) {
            throw new IllegalArgumentException(String.format("flux box sides l=%d, b=%d, r=%d, t=%d: need 0 <= l < r and 0 <= b < t",
                    l, b, r, t));
        }
        this.pol = pol;
        boolean s = pol == Polarization.S;
        int i0 = s ? l + 1 : l;
        int i1 = r + 1;
        int j0 = s ? b + 1 : b;
        int j1 = t + 1;
        bottom = new FluxLine(pol, b, i0, i1, frequencies);
        top = new FluxLine(pol, t, i0, i1, frequencies);
        left = FluxLine.vertical(pol, l, j0, j1, frequencies);
        right = FluxLine.vertical(pol, r, j0, j1, frequencies);
        lines = new FluxLine[] {bottom, top, left, right};
    }

    @Override
    public boolean prepare(StepView v, int workers) {
        boolean any = false;
        for (int k = 0; k < 4; k++) {
            // the sides share their sample times: the first side's factors serve the others
            active[k] = lines[k].prepare(v, workers, k == 0 || !active[0] ? null : lines[0]);
            any |= active[k];
        }
        return any;
    }

    /** The sides' cells one after the other: bottom, top, left, right. */
    @Override
    public int units() {
        return bottom.units() + top.units() + left.units() + right.units();
    }

    @Override
    public void share(StepView v, int u0, int u1, int worker) {
        int first = 0;
        for (int k = 0; k < 4; k++) {
            int n = lines[k].units();
            int a = Math.max(u0, first);
            int b = Math.min(u1, first + n);
            if (active[k] && a < b) {
                lines[k].share(v, a - first, b - first, worker);
            }
            first += n;
        }
    }

    /**
     * The windowed transforms of all four sides (see {@link FluxLine#window}).
     *
     * @return this box
     */
    public FluxBox window(double start, double end) {
        for (FluxLine line : sides()) {
            line.window(start, end);
        }
        return this;
    }

    /**
     * Reads the sides every {@code steps}-th step ({@link FluxLine#stride}: the same rule and caveat, for pulses only).
     *
     * @return this box
     */
    public FluxBox stride(int steps) {
        for (FluxLine line : sides()) {
            line.stride(steps);
        }
        return this;
    }

    /** The sides: bottom, top, left, right. */
    public FluxLine[] sides() {
        return new FluxLine[] {bottom, top, left, right};
    }

    /** The flux out through side k (0 bottom, 1 top, 2 left, 3 right) at frequency q, in {@link FluxLine#flux}'s units. */
    public double outThrough(int k, int q, double cellSize) {
        FluxLine line = sides()[k];
        double[] d = line.fluxDensity(q);
        double sum = 0;
        for (int c = 0; c < d.length; c++) {
            boolean end = c == 0 || c == d.length - 1;
            sum += (pol == Polarization.P && end ? 0.5 : 1.0) * d[c];
        }
        // bottom and left measure along +y and +x, into the box
        return (k == 0 || k == 2 ? -1 : 1) * sum * cellSize;
    }

    /** The net flux out of the box at frequency q, in {@link FluxLine#flux}'s units. */
    public double outward(int q, double cellSize) {
        double sum = 0;
        for (int k = 0; k < 4; k++) {
            sum += outThrough(k, q, cellSize);
        }
        return sum;
    }

    /** Bytes held by the four sides' transforms. */
    public long bytes() {
        long sum = 0;
        for (FluxLine line : sides()) {
            sum += line.bytes();
        }
        return sum;
    }

    @Override
    public void writeState(java.io.DataOutput out) throws java.io.IOException {
        for (FluxLine line : sides()) {
            line.writeState(out);
        }
    }

    @Override
    public void readState(java.io.DataInput in) throws java.io.IOException {
        for (FluxLine line : sides()) {
            line.readState(in);
        }
    }
}
