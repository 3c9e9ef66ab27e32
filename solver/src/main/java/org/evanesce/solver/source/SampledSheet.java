package org.evanesce.solver.source;

import org.evanesce.solver.grid.Component;

/**
 * A row of source terms whose values are tabulated per step: at step n cell t of {@link #cells}
 * receives, as a soft current of {@link #component} (see {@link Source}), {@code values[t·length + n − first[t]]}
 * when 0 ≤ n − first[t] &lt; length, and nothing otherwise. {@link TotalFieldBox} fills such tables with a
 * pulse's incident field computed frequency by frequency, so that the sheet carries the grid's own
 * discrete plane wave at every frequency of the pulse. The values depend on the step number only: a
 * checkpoint needs nothing of the sheet.
 *
 * @param component the field component driven
 * @param cells     flat cell indices j·nx + i
 * @param first     per cell, the step of its first tabulated value (may be negative)
 * @param length    values per cell, ≥ 1
 * @param values    cell t's values at {@code [t·length, (t+1)·length)}, in single precision (the fields'
 *                  default; the tables' rounding, 6e-8 of the peak, is far below any leakage that matters)
 */
public record SampledSheet(Component component, int[] cells, long[] first, int length, float[] values) {

    public SampledSheet {
        int n = cells.length;
        if (n == 0 || first.length != n || length < 1 || values.length != (long) n * length) {
            throw new IllegalArgumentException(String.format("sampled sheet: %d cells, %d first steps, %d values per cell "
                    + "and %d values in all; need as many first steps as cells and cells x length values", n, first.length,
                    length, values.length));
        }
        for (float v : values) {
            if (!Float.isFinite(v)) {
                throw new IllegalArgumentException("sampled sheet value " + v + " is not finite");
            }
        }
        cells = cells.clone();
        first = first.clone();
        values = values.clone();
    }

    /** The value of term t at step n. */
    public double value(int t, long step) {
        long m = step - first[t];
        return m >= 0 && m < length ? values[(int) (t * (long) length + m)] : 0.0;
    }

    /** The number of cells (terms). */
    public int size() {
        return cells.length;
    }

    /** The largest magnitude tabulated (for the divergence limit). */
    public double peak() {
        double p = 0;
        for (float v : values) {
            p = Math.max(p, Math.abs(v));
        }
        return p;
    }

    @Override
    public int[] cells() {
        return cells.clone();
    }

    @Override
    public long[] first() {
        return first.clone();
    }

    @Override
    public float[] values() {
        return values.clone();
    }
}
