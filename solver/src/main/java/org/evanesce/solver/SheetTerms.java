package org.evanesce.solver;

import org.evanesce.solver.kernel.Engine;
import org.evanesce.solver.source.IncidentSheet;

/**
 * The source terms of a run's incident sheets (a beam's): each cell's value for the coming half step, Re[(re + i im)
 * e^{−iφ(t)}] times the signal's envelope at the cell's delay, φ = 2πf(t − t0). Per step the caller computes each
 * sheet's time, carrier phase and (for a sheet of one delay) its one envelope ({@link #prepare}); the cells' values
 * are then computed by the band that adds them, row by row ({@link #fill}), so that a 2690-cell sheet (the gold-film
 * beam example: an envelope, an exponential, per cell per step) no longer runs on the caller alone while the other
 * bands wait between steps. Where the engine cannot call back ({@link Engine#rowSources}) {@link #fillAll} sets every
 * value before the step, as before. Either way each value is computed by the same operations: the same bits.
 */
final class SheetTerms implements Engine.RowSources {

    private final Engine engine;
    private final IncidentSheet[] sheets;
    /** Per sheet: the index of its first term (the engine's term order). */
    private final int[] termStart;
    /** Per sheet: whether every cell has the same envelope delay. */
    private final boolean[] uniform;
    /** Per sheet: its amplitudes and delays (the step loop reads them cell by cell). */
    private final double[][] re;
    private final double[][] im;
    private final double[][] delays;
    /** Per sheet, for the coming step: the time its component is sampled at, cos φ, sin φ, and the one envelope. */
    private final double[] time;
    private final double[] cos;
    private final double[] sin;
    private final double[] common;
    /** Per row, the sheet cells of electric ([0]) and magnetic ([1]) components: start offsets, sheet and cell index. */
    private final int[][] rowStart = new int[2][];
    private final int[][] rowSheet = new int[2][];
    private final int[][] rowCell = new int[2][];

    SheetTerms(Engine engine, IncidentSheet[] sheets, int[] termStart, int nx, int ny) {
        this.engine = engine;
        this.sheets = sheets;
        this.termStart = termStart;
        int n = sheets.length;
        uniform = new boolean[n];
        re = new double[n][];
        im = new double[n][];
        delays = new double[n][];
        time = new double[n];
        cos = new double[n];
        sin = new double[n];
        common = new double[n];
        for (int q = 0; q < n; q++) {
            double[] d = sheets[q].delays();
            uniform[q] = java.util.Arrays.stream(d).allMatch(x -> x == d[0]);
            re[q] = sheets[q].re();
            im[q] = sheets[q].im();
            delays[q] = d;
        }
        for (int kind = 0; kind < 2; kind++) {
            int[] start = new int[ny + 1];
            for (IncidentSheet sh : sheets) {
                if (sh.component().electric == (kind == 0)) {
                    for (int c : sh.cells()) {
                        start[c / nx + 1]++;
                    }
                }
            }
            for (int j = 0; j < ny; j++) {
                start[j + 1] += start[j];
            }
            int[] next = java.util.Arrays.copyOf(start, ny);
            int[] sheet = new int[start[ny]];
            int[] cell = new int[start[ny]];
            for (int q = 0; q < n; q++) {
                if (sheets[q].component().electric == (kind == 0)) {
                    int[] cells = sheets[q].cells();
                    for (int t = 0; t < cells.length; t++) {
                        int e = next[cells[t] / nx]++;
                        sheet[e] = q;
                        cell[e] = t;
                    }
                }
            }
            rowStart[kind] = start;
            rowSheet[kind] = sheet;
            rowCell[kind] = cell;
        }
    }

    /** Each sheet's time, carrier phase and common envelope for the step whose H is sampled at tH and E at tE. */
    void prepare(double tH, double tE) {
        for (int q = 0; q < sheets.length; q++) {
            IncidentSheet sh = sheets[q];
            double t = sh.component().electric ? tE : tH;
            double phase = 2 * Math.PI * sh.signal().carrierFrequency() * (t - sh.signal().carrierOrigin());
            time[q] = t;
            cos[q] = Math.cos(phase);
            sin[q] = Math.sin(phase);
            // one envelope for the whole sheet when every cell has the same delay (a continuous wave's)
            common[q] = uniform[q] ? sh.signal().envelope(t - sh.delays()[0]) : Double.NaN;
        }
    }

    /** Every sheet cell's value, set before the step (for engines that do not call {@link #fill}). */
    void fillAll() {
        for (int q = 0; q < sheets.length; q++) {
            for (int t = 0; t < sheets[q].cells().length; t++) {
                set(q, t);
            }
        }
    }

    @Override
    public void fill(boolean electric, int j) {
        int kind = electric ? 0 : 1;
        int[] start = rowStart[kind];
        for (int e = start[j]; e < start[j + 1]; e++) {
            set(rowSheet[kind][e], rowCell[kind][e]);
        }
    }

    private void set(int q, int t) {
        double env = uniform[q] ? common[q] : sheets[q].signal().envelope(time[q] - delays[q][t]);
        engine.sourceValue(termStart[q] + t, env == 0 ? 0 : env * (re[q][t] * cos[q] + im[q][t] * sin[q]));
    }
}
