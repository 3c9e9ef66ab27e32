package org.evanesce.io.run;

import java.util.function.Consumer;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.record.Progress;

/**
 * Steps a planned case to its stopping rule: a fixed number of steps, or until the field energy
 * inside the PMLs has decayed to a fraction of its largest value (checked every few steps once
 * the sources have faded), at the latest at the time limit.
 */
public final class CaseRunner {

    /**
     * What a finished run measured.
     *
     * @param steps          steps taken
     * @param wallSeconds    wall time of the stepping
     * @param threads        threads that stepped
     * @param stopReason     why the run ended, in words
     * @param finalEnergy    energy inside the PMLs at the end, J/m (NaN if never measured)
     * @param peakEnergy     largest energy measured, J/m (NaN if never measured)
     * @param bytes          bytes of field, coefficient and PML arrays
     * @param incidentPowerRunWallSeconds wall time of the flux normalisation's incident-power run in this run (0 when there is
     *                       none, or when its result was reused)
     * @param resumedFromStep the step the run continued from a checkpoint at, or −1
     * @param stoppedByLimit the run ended at its time limit before its fields decayed as asked (a decay stop only)
     * @param incidentPowerRunFinalEnergy energy inside the PMLs of the incident-power run at its end, J/m (NaN without one)
     * @param incidentPowerRunPeakEnergy  the largest energy measured in the incident-power run, J/m (NaN without one)
     * @param incidentPower  how the incident power was obtained (measured or reused), null without flux
     */
    public record Result(long steps, double wallSeconds, int threads, String stopReason, double finalEnergy,
                         double peakEnergy, long bytes, double incidentPowerRunWallSeconds, long resumedFromStep,
                         boolean stoppedByLimit, double incidentPowerRunFinalEnergy, double incidentPowerRunPeakEnergy,
                         IncidentPowerCache.Obtained incidentPower) {

        /** The energy at the end over the largest measured, or NaN when never measured (0 when none ever arrived). */
        public double energyFraction() {
            return fraction(finalEnergy, peakEnergy);
        }

        /** The same for the incident-power run. */
        public double incidentPowerRunEnergyFraction() {
            return fraction(incidentPowerRunFinalEnergy, incidentPowerRunPeakEnergy);
        }

        private static double fraction(double last, double peak) {
            return Double.isNaN(last) || Double.isNaN(peak) ? Double.NaN : peak > 0 ? last / peak : 0.0;
        }

        /** Cell updates per second of wall time. */
        public double cellUpdatesPerSecond(long cells) {
            return wallSeconds > 0 ? cells * (double) steps / wallSeconds : Double.NaN;
        }
    }

    private CaseRunner() {
    }

    /** The solver refused the planned case (e.g. PML layers that leave no interior); exit code 2. */
    public static final class RefusedException extends RuntimeException {
        private static final long serialVersionUID = 1L;

        RefusedException(String message, Throwable cause) {
            super(message, cause);
        }
    }

    /**
     * A seam for tests: the divergence limit (field magnitude) to build a plan's run with, or NaN (the default) for
     * the solver's own, so that a test can make a run fail as diverged, which no case the reader accepts does (gain
     * and amplitudes beyond the fields' range are refused).
     */
    public static volatile java.util.function.ToDoubleFunction<CasePlan> divergenceLimitForTests = plan -> Double.NaN;

    /** Builds the planned simulation; the solver's refusals become {@link RefusedException}s naming the case file. */
    public static Simulation build(CasePlan plan) {
        try {
            double limit = divergenceLimitForTests.applyAsDouble(plan);
            if (limit > 0) {
                plan.builder().divergenceLimit(limit);
            }
            return plan.builder().build();
        } catch (IllegalArgumentException e) {
            throw new RefusedException(plan.spec().source() + ": the solver refused the case: "
                    + e.getMessage().replace("\n", "; "), e);
        }
    }

    /**
     * Builds the simulation, steps it to the plan's stopping rule and closes it.
     *
     * @param progress        receives progress reports (on this thread), or null
     * @param progressSeconds least wall time between reports
     */
    public static Result run(CasePlan plan, Consumer<Progress.Report> progress, double progressSeconds) {
        return run(plan, progress, progressSeconds, null);
    }

    /**
     * The same, and {@code atEnd} (if not null) sees the run's fields after its last step, before the
     * simulation is closed (the fields at the end are written from there).
     */
    public static Result run(CasePlan plan, Consumer<Progress.Report> progress, double progressSeconds,
                             Consumer<org.evanesce.solver.record.StepView> atEnd) {
        return run(plan, progress, progressSeconds, atEnd, null);
    }

    /**
     * The same with checkpoints: the run's whole state is saved to {@code ck.file()} (atomically) at
     * least every {@code ck.intervalSeconds()} of wall time and when its stepping ends; if that file
     * holds a checkpoint of the same case (same identity) the run continues from it, bit for bit. A
     * run stopped during its incident-power run repeats only the incident-power run.
     */
    public static Result run(CasePlan plan, Consumer<Progress.Report> progress, double progressSeconds,
                             Consumer<org.evanesce.solver.record.StepView> atEnd, Checkpoints ck) {
        return run(plan, progress, progressSeconds, atEnd, ck, IncidentPowerCache.none());
    }

    /**
     * The same, with the incident-power run's result taken from {@code incident} when it holds one of the same
     * set-up and steps (see {@link IncidentPowerCache}), else measured and kept there.
     */
    public static Result run(CasePlan plan, Consumer<Progress.Report> progress, double progressSeconds,
                             Consumer<org.evanesce.solver.record.StepView> atEnd, Checkpoints ck,
                             IncidentPowerCache incident) {
        JitWarmUp.choose(plan.builder(), plan.stop().maxSteps(), plan.spec().polarization().value(),
                plan.spec().numerics().precision().value());
        try (Simulation sim = build(plan); IncidentBeside beside = new IncidentBeside()) {
            if (progress != null) {
                sim.addListener(new Progress(plan.stop().maxSteps(), progressSeconds, progress));
            }
            long t0 = System.nanoTime();
            String reason = null;
            double energy = Double.NaN;
            double peak = 0;
            double before = 0;
            boolean byLimit = false;
            int[] r = plan.interior();
            Checkpoints.State restored = ck == null ? null : ck.restore(sim);
            long resumedFrom = restored == null ? -1 : sim.stepCount();
            if (restored != null) {
                peak = restored.peak();
                energy = restored.energy();
                reason = restored.reason();
                before = restored.wallSeconds();
            }
            long lastSave = System.nanoTime();
            if (restored == null) {
                beside.start(plan, incident, progressSeconds);
            }
            if (reason == null && plan.stop() instanceof CasePlan.Stop.Steps s) {
                // the energy is measured as in a decay stop (every chunk, at the end) so the result can say whether it settled
                while (sim.stepCount() < s.steps()) {
                    sim.run(Math.min(Checkpoints.CHUNK, s.steps() - sim.stepCount()));
                    energy = sim.energyOnTeam(r[0], r[1], r[2], r[3]);
                    peak = Math.max(peak, energy);
                    if (ck != null && ck.due(lastSave)) {
                        ck.save(sim, peak, energy, null, before + (System.nanoTime() - t0) * 1e-9);
                        lastSave = System.nanoTime();
                    }
                }
                reason = "ran the requested " + s.steps() + " steps";
            } else if (reason == null) {
                CasePlan.Stop.Decay d = (CasePlan.Stop.Decay) plan.stop();
                while (sim.stepCount() < d.limitSteps()) {
                    long chunk = Math.min(d.checkInterval(), d.limitSteps() - sim.stepCount());
                    sim.run(chunk);
                    energy = sim.energyOnTeam(r[0], r[1], r[2], r[3]);
                    peak = Math.max(peak, energy);
                    if (sim.stepCount() >= d.fadeSteps() && energy <= d.fraction() * peak) {
                        reason = String.format("the field energy fell to %.3g of its largest value (asked: below %.3g)",
                                peak > 0 ? energy / peak : 0.0, d.fraction());
                        break;
                    }
                    if (ck != null && ck.due(lastSave)) {
                        ck.save(sim, peak, energy, null, before + (System.nanoTime() - t0) * 1e-9);
                        lastSave = System.nanoTime();
                    }
                }
                if (reason == null && plan.continuous()) {
                    reason = String.format("ran to the latest time (%d steps): a continuous wave's field energy does not fall", d.limitSteps());
                } else if (reason == null) {
                    byLimit = true;
                    reason = String.format("reached the latest time (%d steps) before the energy fell below %.3g of its "
                            + "largest value (now %.3g)", d.limitSteps(), d.fraction(), peak > 0 ? energy / peak : 0.0);
                }
            }
            double wall = before + (restored != null && restored.reason() != null ? 0 : (System.nanoTime() - t0) * 1e-9);
            if (ck != null && plan.referenceRun().isPresent() && (restored == null || restored.reason() == null)) {
                // the stepping is done and the incident-power run follows: a restart from here repeats only that
                ck.save(sim, peak, energy, reason, wall);
            }
            if (atEnd != null) {
                atEnd.accept(sim);
            }
            if (restored != null && restored.reason() != null && (reason.startsWith("reached the latest time") || reason.startsWith("reached the time limit"))) {
                byLimit = true;
            }
            double[] reference = {0, Double.NaN, Double.NaN};
            IncidentPowerCache.Obtained obtained = null;
            if (plan.flux().isPresent()) {
                // a surfaces section's incident line is one of its recorders (FluxPlan.surfacesIncident)
                long steps = sim.stepCount();
                boolean besideRan = beside.steps() == steps;
                obtained = besideRan ? beside.join() : incident.obtain(plan.flux().get(), steps, c -> {
                    double[] m = measureIncidentPower(plan, steps, progress, progressSeconds, c);
                    return new IncidentPowerCache.Measured(m[0], m[1], m[2]);
                });
                IncidentPowerCache.Measured m = obtained.measured();
                reference = new double[] {obtained.reused() ? 0 : m.wallSeconds(), m.finalEnergy(), m.peakEnergy()};
                reason += obtained.reused() ? "; the incident power was reused from an incident-power run of the same set-up "
                        + "and number of steps (" + obtained.origin() + ")" : obtained.computed() ? "; the incident power was "
                        + "computed from " + obtained.computedFrom() + " (no incident-power run)" : "; the incident-power run took the same number of steps"
                        + (obtained.continuedFrom() >= 0 ? " (continuing from step " + obtained.continuedFrom()
                        + " a state kept by an earlier incident-power run of the same set-up in this process)" : "")
                        + (besideRan && !obtained.reused() && !obtained.computed() ? " (stepped beside the case's run, on a "
                        + "thread of its own)" : "");
            } else if (plan.surfaces().flatMap(org.evanesce.io.plan.SurfacePlan::computedIncident).isPresent()) {
                // a pulsed beam's incident line in closed form: no incident-power run
                var sp = plan.surfaces().get();
                long t1 = System.nanoTime();
                sp.computedIncident().get().fill(sp.incidentLine().orElseThrow(), sim.stepCount(), plan.dt());
                reference = new double[] {(System.nanoTime() - t1) * 1e-9, Double.NaN, Double.NaN};
                reason += "; the incident power was computed from the beam's sheets (no incident-power run)";
            } else if (plan.referenceRun().isPresent()) {
                reference = step(plan, plan.referenceRun().get(), sim.stepCount(), progress, progressSeconds, plan.interior());
                reason += plan.surfaces().get().incidentLine().isPresent()
                        ? "; the incident-power run took the same number of steps"
                        : "; the run measuring the sources' own power took the same number of steps";
            }
            return new Result(sim.stepCount(), wall, sim.threads(), reason, energy, peak, sim.bytes(), reference[0],
                    resumedFrom, byLimit, reference[1], reference[2], obtained);
        }
    }

    /**
     * Runs the flux normalisation's reference (the case's grid filled with the plane wave's medium, or the strip that
     * stands for it, see {@link org.evanesce.io.plan.FluxPlan.Strip}) for exactly as many steps as the case's run, so
     * both transforms cover the same time window.
     *
     * @param c where it starts (a kept state of the same set-up's run, else step 0) and where it keeps its states
     * @return its wall time, s, its energy inside the PMLs at the end and the largest measured, J/m (a strip's scaled
     *         to the full width)
     */
    static double[] measureIncidentPower(CasePlan plan, long steps, Consumer<Progress.Report> progress, double progressSeconds,
                                         IncidentPowerCache.Continuation c) {
        org.evanesce.io.plan.FluxPlan f = plan.flux().orElseThrow();
        if (f.computed().isPresent()) {
            // a pulsed beam in an unbounded medium, a plane wave with periodic sides: the recorders' transforms in closed
            // form, no grid stepped
            long t0 = System.nanoTime();
            for (org.evanesce.solver.record.FluxLine l : f.recorders()) {
                f.computed().get().fill(l, steps, plan.dt());
            }
            return new double[] {(System.nanoTime() - t0) * 1e-9, Double.NaN, Double.NaN};
        }
        if (f.strip().isPresent()) {
            var s = f.strip().get();
            int[] r = plan.interior();
            double[] m = step(plan, s.builder(), steps, null, progressSeconds, new int[] {0, r[1], s.columns(), r[3]}, c);
            for (int k = 0; k < s.lines().size(); k++) {
                f.recorders().get(k).spreadFrom(s.lines().get(k), f.kx(), f.cellSize());
            }
            double widths = (double) (r[2] - r[0]) / s.columns();
            return new double[] {m[0], m[1] * widths, m[2] * widths};
        }
        return step(plan, f.reference(), steps, progress, progressSeconds, plan.interior(), c);
    }

    /**
     * Steps kept while an incident-power run goes on, for later runs of the same set-up that stop earlier (only where
     * the run's state is at most {@link #SMALL_STATE} bytes, as a strip's is; the end state is kept whenever it fits half
     * of {@link IncidentPowerCache#SNAPSHOT_LIMIT}).
     */
    static final long KEEP_EVERY = 16L * Checkpoints.CHUNK;
    /** The largest state (fields and coefficients, bytes) kept every {@link #KEEP_EVERY} steps. */
    static final long SMALL_STATE = 1L << 20;

    private static double[] step(CasePlan plan, Simulation.Builder b, long steps, Consumer<Progress.Report> progress,
                                 double progressSeconds, int[] r) {
        return step(plan, b, steps, progress, progressSeconds, r, null);
    }

    /**
     * Steps a run (the incident-power run, or the run measuring the sources' own power) to {@code steps}, measuring its
     * energy inside {@code r} after every multiple of {@link Checkpoints#CHUNK} steps and at the end. With a
     * continuation it starts from the kept state of the same set-up with the most steps up to {@code steps}, and the
     * energies are still those measured at the same steps as from step 0, so the result is the same bit for bit.
     */
    private static double[] step(CasePlan plan, Simulation.Builder b, long steps, Consumer<Progress.Report> progress,
                                 double progressSeconds, int[] r, IncidentPowerCache.Continuation c) {
        Simulation ref;
        try {
            JitWarmUp.choose(b, steps, plan.spec().polarization().value(), plan.spec().numerics().precision().value());
            ref = b.build();
        } catch (IllegalArgumentException e) {
            throw new RefusedException(plan.spec().source() + ": the solver refused the incident-power run: "
                    + e.getMessage().replace("\n", "; "), e);
        }
        try (ref) {
            if (progress != null) {
                ref.addListener(new Progress(steps, progressSeconds, progress));
            }
            long t0 = System.nanoTime();
            double energy = Double.NaN;
            boolean measured = false;
            double chunkPeak = 0;
            // a state costs its bytes once more in memory: only runs whose state fits the cache's room keep one
            boolean keep = c != null && c.keeps() && ref.bytes() <= IncidentPowerCache.SNAPSHOT_LIMIT / 2;
            IncidentPowerCache.Snapshot from = keep ? c.start(steps) : null;
            if (from != null) {
                restore(ref, from);
                chunkPeak = from.chunkPeak();
                if (ref.stepCount() == steps && steps > 0) {
                    energy = ref.energyOnTeam(r[0], r[1], r[2], r[3]);
                    measured = true;
                }
            }
            boolean keepOnTheWay = keep && ref.bytes() <= SMALL_STATE;
            while (ref.stepCount() < steps) {
                IncidentBeside.checkCancelled();
                long n = ref.stepCount();
                // to the next multiple of CHUNK (or the end), so the energies are measured where a run from step 0 measures them
                ref.run(Math.min(Checkpoints.CHUNK - n % Checkpoints.CHUNK, steps - n));
                energy = ref.energyOnTeam(r[0], r[1], r[2], r[3]);
                measured = true;
                if (ref.stepCount() % Checkpoints.CHUNK == 0) {
                    chunkPeak = Math.max(chunkPeak, energy);
                    if (keepOnTheWay && ref.stepCount() % KEEP_EVERY == 0 && ref.stepCount() < steps) {
                        c.keep(snapshot(ref, chunkPeak));
                    }
                }
            }
            if (keep && (from == null || from.step() < steps)) {
                c.keep(snapshot(ref, chunkPeak));
            }
            double peak = measured ? Math.max(chunkPeak, energy) : chunkPeak;
            return new double[] {(System.nanoTime() - t0) * 1e-9, energy, peak};
        }
    }

    private static IncidentPowerCache.Snapshot snapshot(Simulation sim, double chunkPeak) {
        java.io.ByteArrayOutputStream b = new java.io.ByteArrayOutputStream();
        try {
            sim.saveState(b);
        } catch (java.io.IOException e) {
            throw new IllegalStateException("writing to memory cannot fail", e);
        }
        return new IncidentPowerCache.Snapshot(sim.stepCount(), b.toByteArray(), chunkPeak);
    }

    private static void restore(Simulation sim, IncidentPowerCache.Snapshot s) {
        try {
            sim.restoreState(new java.io.ByteArrayInputStream(s.state()));
        } catch (java.io.IOException e) {
            // states are kept under the key of everything the run depends on, so one always fits
            throw new IllegalStateException("a kept incident-power run state of the same key did not fit: " + e.getMessage(), e);
        }
    }
}
