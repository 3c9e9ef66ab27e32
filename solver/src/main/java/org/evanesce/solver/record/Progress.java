package org.evanesce.solver.record;

import java.util.function.Consumer;
import java.util.function.LongSupplier;

/**
 * Reports a run's progress at most once per interval of wall time: steps done, fraction, rate
 * and an estimate of the time left. The solver never prints; the consumer decides where the
 * report goes (a terminal line, a log).
 */
public final class Progress implements StepListener {

    /**
     * One progress report.
     *
     * @param step           steps completed
     * @param totalSteps     steps planned
     * @param elapsedSeconds wall time since the first step
     * @param cellUpdatesPerSecond cells × steps per second of wall time so far
     * @param secondsLeft    estimate of the wall time left at the rate so far
     */
    public record Report(long step, long totalSteps, double elapsedSeconds, double cellUpdatesPerSecond, double secondsLeft) {

        public double fraction() {
            return totalSteps == 0 ? 1.0 : (double) step / totalSteps;
        }
    }

    private final long totalSteps;
    private final long intervalNanos;
    private final Consumer<Report> sink;
    private final LongSupplier clock;
    private long start = -1;
    private long startStep;
    private long last;

    /**
     * @param totalSteps      steps the run will take
     * @param intervalSeconds least wall time between reports
     * @param sink            receives the reports, on the run's thread
     */
    public Progress(long totalSteps, double intervalSeconds, Consumer<Report> sink) {
        this(totalSteps, intervalSeconds, sink, System::nanoTime);
    }

    Progress(long totalSteps, double intervalSeconds, Consumer<Report> sink, LongSupplier clock) {
        this.totalSteps = totalSteps;
        this.intervalNanos = (long) (intervalSeconds * 1e9);
        this.sink = sink;
        this.clock = clock;
    }

    @Override
    public void afterStep(StepView view) {
        long now = clock.getAsLong();
        if (start < 0) {
            start = now;
            last = now;
            startStep = view.stepCount();
            return;
        }
        boolean done = view.stepCount() >= totalSteps;
        if (now - last < intervalNanos && !done) {
            return;
        }
        last = now;
        double elapsed = (now - start) * 1e-9;
        long steps = view.stepCount() - startStep;
        double stepsPerSecond = elapsed > 0 ? steps / elapsed : 0;
        double left = stepsPerSecond > 0 ? Math.max(0, totalSteps - view.stepCount()) / stepsPerSecond : Double.NaN;
        sink.accept(new Report(view.stepCount(), totalSteps, elapsed,
                stepsPerSecond * view.nx() * (double) view.ny(), left));
    }
}
