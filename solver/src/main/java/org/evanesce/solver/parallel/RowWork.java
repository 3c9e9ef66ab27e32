package org.evanesce.solver.parallel;

/**
 * The expected work of each row of a grid, relative (e.g. cells plus extra for the CPML cells the
 * row corrects), as prefix sums, so that {@link BandTeam} can start with bands of equal work rather
 * than equal row counts and, when it rebalances, move boundaries by work rather than by rows
 * (common practice for static load balancing: weight the partition by an estimate of the cost).
 * Immutable.
 */
public final class RowWork {

    /** cum[j]: the work of rows [0, j); cum[0] = 0, length rows + 1. */
    private final double[] cum;
    private final boolean uniform;

    private RowWork(double[] cum, boolean uniform) {
        this.cum = cum;
        this.uniform = uniform;
    }

    /** Every row the same work (the split by row counts). */
    public static RowWork uniform(int rows) {
        if (rows < 1) {
            throw new IllegalArgumentException("rows " + rows + " must be at least 1");
        }
        double[] c = new double[rows + 1];
        for (int j = 0; j <= rows; j++) {
            c[j] = j;
        }
        return new RowWork(c, true);
    }

    /**
     * The work of each row as given (not modified).
     *
     * @throws IllegalArgumentException when there are no rows or a value is not finite and positive
     */
    public static RowWork of(double[] perRow) {
        if (perRow.length < 1) {
            throw new IllegalArgumentException("no rows given");
        }
        double[] c = new double[perRow.length + 1];
        for (int j = 0; j < perRow.length; j++) {
            double w = perRow[j];
            if (!(w > 0) || Double.isInfinite(w)) {
                throw new IllegalArgumentException(String.format("the work of row %d is %g; expected a finite value > 0", j, w));
            }
            c[j + 1] = c[j] + w;
        }
        return new RowWork(c, false);
    }

    public int rows() {
        return cum.length - 1;
    }

    /** Whether every row has the same work (made by {@link #uniform}). */
    public boolean isUniform() {
        return uniform;
    }

    /** The work of rows [a, b). */
    public double between(int a, int b) {
        return cum[b] - cum[a];
    }

    /** The work of all rows. */
    public double total() {
        return cum[cum.length - 1];
    }

    /**
     * The row boundary j in [0, rows] whose work before it (the work of rows [0, j)) lies nearest to w,
     * the lower one on a tie.
     */
    public int rowNear(double w) {
        int lo = 0;
        int hi = cum.length - 1;
        while (hi - lo > 1) {
            int m = (lo + hi) >>> 1;
            if (cum[m] <= w) {
                lo = m;
            } else {
                hi = m;
            }
        }
        return w - cum[lo] <= cum[hi] - w ? lo : hi;
    }
}
