package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.CaseSpec;
import org.evanesce.io.casefile.OutputSpec;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.io.run.BeamPlots;
import org.evanesce.io.run.CaseRunner;
import org.evanesce.io.run.FluxResults;
import org.evanesce.io.run.FluxTable;
import org.evanesce.io.run.ProgressLine;
import org.evanesce.io.run.RunOutputs;

/** Runs one planned case and writes its results into an open (not yet committed) results folder. */
final class CaseExecution {

    /** What a run produced: its record and, when the case asks for flux, the normalised table. */
    record Finished(CaseRunner.Result result, FluxResults flux) { }

    private CaseExecution() {
    }

    /**
     * @param progressSeconds least wall time between progress lines when the output is not a terminal
     * @param table           print the flux table when the run has one
     */
    static Finished run(CaseOptions.Loaded l, Map<String, String> overrides, RunFolder rf, PrintWriter o,
                        double progressSeconds, boolean table) throws IOException {
        CasePlan plan = l.plan();
        CaseSpec s = plan.spec();
        boolean terminal = System.console() != null;
        o.printf(Locale.ROOT, "%s: %d x %d cells of %.4g nm, up to %d steps, %s polarization%s; writing %s%n",
                s.source(), plan.grid().nx(), plan.grid().ny(), plan.grid().cellSize() * 1e9, plan.stop().maxSteps(),
                s.polarization().value().name().toLowerCase(Locale.ROOT),
                plan.flux().isPresent() ? ", then a reference run for the incident power" : "", rf.target());
        ProgressLine progress = new ProgressLine(o, terminal, plan.dt());
        CaseRunner.Result r;
        try {
            r = CaseRunner.run(plan, progress, terminal ? 0.5 : progressSeconds);
        } finally {
            progress.finish();
        }
        FluxResults flux = plan.flux().map(f -> FluxResults.of(f, s.polarization().value())).orElse(null);
        if (flux != null) {
            rf.writeText("flux.csv", flux.csv());
            rf.writeText("summary.json", Json.write(RunOutputs.summary(plan, flux)));
            FluxPlan f = plan.flux().get();
            BeamPlots.write(f, s.polarization().value(), f.closest(s.sources().get(0).signal().frequency().si()), rf.dir());
        }
        if (s.output().writes(OutputSpec.Item.PROBES)) {
            rf.writeText("probes.csv", RunOutputs.probesCsv(plan.probes()));
        }
        if (s.output().writes(OutputSpec.Item.PREVIEW)) {
            RunOutputs.preview(plan, rf.dir().resolve("preview.png"));
        }
        RunOutputs.writeRunRecord(rf, RunOutputs.runRecord(VersionProvider.version(), l.sha256(), plan, r,
                l.loaded().diagnostics(), overrides));
        long cells = (long) plan.grid().nx() * plan.grid().ny();
        o.printf(Locale.ROOT, "done: %d steps in %.1f s (%.0f Mcell/s, %d threads)%s; %s%n", r.steps(), r.wallSeconds(),
                r.cellUpdatesPerSecond(cells) / 1e6, r.threads(),
                plan.flux().isPresent() ? String.format(Locale.ROOT, ", reference run %.1f s", r.referenceWallSeconds()) : "",
                r.stopReason());
        if (flux != null && table) {
            FluxTable.print(o, flux);
        }
        return new Finished(r, flux);
    }
}
