package org.evanesce.io.run;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.function.Consumer;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.solver.record.Progress;

/**
 * Prints progress reports: one line rewritten in place on a terminal, or plain lines (for the
 * logs of overnight runs) when the output is not a terminal.
 */
public final class ProgressLine implements Consumer<Progress.Report> {

    private final PrintWriter out;
    private final boolean terminal;
    private final double dt;
    private boolean dirty;

    /**
     * @param terminal whether {@code out} is a terminal (then the line is rewritten with a carriage return)
     * @param dt       time step, s, to show the simulated time
     */
    public ProgressLine(PrintWriter out, boolean terminal, double dt) {
        this.out = out;
        this.terminal = terminal;
        this.dt = dt;
    }

    @Override
    public void accept(Progress.Report r) {
        String line = String.format(Locale.ROOT, "%5.1f%%  step %d/%d  t = %s  %.0f Mcell/s  left %s",
                100 * r.fraction(), r.step(), r.totalSteps(), Units.format(r.step() * dt, Dimension.TIME, 4),
                r.cellUpdatesPerSecond() / 1e6, duration(r.secondsLeft()));
        if (terminal) {
            out.print("\r" + line + "   ");
            dirty = true;
        } else {
            out.println(line);
        }
        out.flush();
    }

    /** A wall-clock duration as h:mm:ss, or "?" if unknown. */
    static String duration(double s) {
        if (!Double.isFinite(s)) {
            return "?";
        }
        long t = Math.round(s);
        return String.format(Locale.ROOT, "%d:%02d:%02d", t / 3600, t / 60 % 60, t % 60);
    }

    /** Ends the rewritten line, if any. */
    public void finish() {
        if (dirty) {
            out.println();
            out.flush();
            dirty = false;
        }
    }
}
