package org.evanesce.io.run;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.function.Consumer;
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
                100 * r.fraction(), r.step(), r.totalSteps(), Units.time(r.step() * dt),
                r.cellUpdatesPerSecond() / 1e6, Units.duration(r.secondsLeft()));
        if (terminal) {
            out.print("\r" + line + "   ");
            dirty = true;
        } else {
            out.println(line);
        }
        out.flush();
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
