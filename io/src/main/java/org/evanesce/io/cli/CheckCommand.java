package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.evanesce.io.output.image.PngFile;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.MemoryEstimate;
import org.evanesce.io.run.CaseRunner;
import org.evanesce.io.run.JitWarmUp;
import org.evanesce.io.run.RunOutputs;
import org.evanesce.solver.Simulation;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code evanesce check CASE}: validates and plans a case, prints its size, steps, memory and a
 * run-time estimate from a short timed trial, and writes the geometry preview. Runs nothing else.
 */
@Command(name = "check", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, sortOptions = false,
        description = {"Validate a case file and estimate its run: cells, steps, memory, and the run time measured by "
                + "a short trial on this machine. Writes the rasterised permittivity as a PNG preview."})
public final class CheckCommand implements Callable<Integer> {

    @Spec
    private CommandSpec spec;

    @Mixin
    private CaseOptions options;

    @Option(names = "--preview", paramLabel = "FILE",
            description = "Where to write the preview PNG (default: CASE's name with -preview.png, beside it; a file of that "
                    + "name that evanesce did not write is left alone).")
    private Path preview;

    @Option(names = "--trial-seconds", paramLabel = "S", defaultValue = "1",
            description = "Wall time of the timed trial (default: ${DEFAULT-VALUE}; 0 skips it).")
    private double trialSeconds;

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        CaseOptions.Loaded l = options.load(spec);
        CasePlan plan = l.plan();
        long cells = (long) plan.grid().nx() * plan.grid().ny();
        long maxSteps = plan.stop().maxSteps();
        o.printf(Locale.ROOT, "%s: valid (%d warning(s))%n", l.loaded().spec().source(), l.loaded().warnings().size());
        o.printf(Locale.ROOT, "grid: %d x %d = %d cells of %.4g nm; %d materials after smoothing%n",
                plan.grid().nx(), plan.grid().ny(), cells, plan.grid().cellSize() * 1e9, plan.materials().materials().size());
        o.printf(Locale.ROOT, "time step: %.4g fs; steps: %s%d%n", plan.dt() * 1e15,
                plan.stop() instanceof CasePlan.Stop.Decay ? "at most " : "", maxSteps);
        org.evanesce.io.plan.MaterialReport.lines(plan.spec(), plan.dt()).forEach(o::println);
        o.printf(Locale.ROOT, "memory: about %s in all (%s); the JVM may use %s%n",
                MemoryEstimate.format(plan.memory().total()), plan.memory().breakdown(),
                MemoryEstimate.format(Runtime.getRuntime().maxMemory()));
        boolean timeVectors = trialSeconds > 0 && JitWarmUp.worth(plan);
        if (timeVectors) {
            // the run will step the kernels' vector parts: time those
            plan.builder().vectorsFromStart();
        } else if (trialSeconds > 0) {
            plan.builder().scalarOnly();
        }
        try (Simulation sim = CaseRunner.build(plan)) {
            o.printf(Locale.ROOT, "solver: %.1f MiB of field, coefficient and PML arrays (%d bytes per cell), %d thread%s%n",
                    sim.bytes() / 1048576.0, sim.bytesPerCell(), sim.threads(), sim.threads() == 1 ? "" : "s");
            if (trialSeconds > 0) {
                if (timeVectors) {
                    JitWarmUp.run(plan.spec().polarization().value(), plan.spec().numerics().precision().value());
                }
                long t0 = System.nanoTime();
                long steps = 0;
                // the rate of the trial's second half: its first steps run while the JIT compiles (a small grid's
                // whole first second can), which a long run's steps do not
                long halfSteps = -1;
                double halfSec = 0;
                while ((System.nanoTime() - t0) * 1e-9 < trialSeconds && steps < maxSteps) {
                    sim.run(Math.min(10, maxSteps - steps));
                    steps += Math.min(10, maxSteps - steps);
                    double now = (System.nanoTime() - t0) * 1e-9;
                    if (halfSteps < 0 && now >= trialSeconds / 2) {
                        halfSteps = steps;
                        halfSec = now;
                    }
                }
                double sec = (System.nanoTime() - t0) * 1e-9;
                double rate = halfSteps > 0 && steps > halfSteps && sec > halfSec ? (steps - halfSteps) / (sec - halfSec)
                        : steps / sec;
                // a flux case runs an incident-power run of the same grid for as many steps (a plane wave's: a strip
                // of a few columns, counted at its share of the cells), unless the incident power is computed (a pulsed
                // beam, a plane wave with periodic sides: no stepping)
                var strip = plan.flux().flatMap(f -> f.strip());
                boolean computed = plan.flux().flatMap(f -> f.computed()).isPresent();
                double incidentShare = plan.flux().isEmpty() || computed ? 0 : strip.isPresent()
                        ? (double) strip.get().columns() / plan.grid().nx() : 1;
                // stepped beside the run on a thread of its own, it adds nothing unless it takes longer
                boolean beside = incidentShare > 0 && org.evanesce.io.run.IncidentBeside.besideTheRun(plan);
                double runs = beside ? Math.max(1, incidentShare) : 1 + incidentShare;
                // a trial that made every step timed the run itself, its compiling included
                double estimate = runs * (steps >= maxSteps ? sec : maxSteps / rate);
                o.printf(Locale.ROOT, "trial: %d steps in %.2f s (%.0f Mcell/s in its second half); estimated run time "
                        + "%s s%s%s%n", steps, sec, rate * cells / 1e6,
                        String.format(Locale.ROOT, estimate < 10 ? "%.1f" : "%.0f", estimate),
                        plan.stop() instanceof CasePlan.Stop.Decay ? " at most" : "",
                        plan.flux().isEmpty() ? "" : computed ? " (the incident power computed, not stepped)"
                                : (strip.isPresent() ? " (with the incident-power run on a strip" : " (with the incident-power run")
                                + (beside ? ", beside the run on a thread of its own)" : ")"));
            }
        }
        Path png = preview != null ? preview : defaultPreview(options.caseFile);
        if (preview == null && Files.exists(png, LinkOption.NOFOLLOW_LINKS) && !PngFile.writtenByUs(png)) {
            // the default name beside the case is ours only if we wrote what is there
            o.println("preview: not written: " + png.toAbsolutePath() + " exists and was not written by evanesce; "
                    + "name another file with --preview FILE");
            return ExitCode.OK;
        }
        RunOutputs.preview(plan, png);
        o.println("preview: " + png.toAbsolutePath());
        return ExitCode.OK;
    }

    static Path defaultPreview(Path caseFile) {
        String name = caseFile.getFileName().toString();
        int dot = name.lastIndexOf('.');
        return caseFile.toAbsolutePath().resolveSibling((dot > 0 ? name.substring(0, dot) : name) + "-preview.png");
    }
}
