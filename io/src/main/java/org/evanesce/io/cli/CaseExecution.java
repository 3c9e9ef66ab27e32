package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.OutputSpec;
import org.evanesce.io.output.BuildInfo;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.FluxPlan;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import org.evanesce.io.output.hdf5.Xdmf;
import org.evanesce.io.run.BeamPlots;
import org.evanesce.io.run.BeamReferences;
import org.evanesce.io.run.FluxPlot;
import org.evanesce.io.run.Checkpoints;
import org.evanesce.io.run.FieldOutputs;
import org.evanesce.io.run.MapOutputs;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.record.Snapshots;
import org.evanesce.io.run.CaseRunner;
import org.evanesce.io.run.FluxResults;
import org.evanesce.io.run.FluxTable;
import org.evanesce.io.run.IncidentPowerCache;
import org.evanesce.io.run.Plausibility;
import org.evanesce.io.run.ProgressLine;
import org.evanesce.io.run.RunOutputs;
import org.evanesce.io.run.Settling;
import org.evanesce.io.run.SurfaceOutputs;
import org.evanesce.io.run.SurfaceResults;
import org.evanesce.io.run.SurfaceTable;

/** Runs one planned case and writes its results into an open (not yet committed) results folder. */
final class CaseExecution {

    /**
     * What a run produced: its record, the normalised table when the case asks for flux, whether it settled and
     * what is wrong with its results (printed, and recorded in run.json and summary.json).
     */
    record Finished(CaseRunner.Result result, FluxResults flux, Settling settling, List<String> warnings) { }

    private CaseExecution() {
    }

    /**
     * @param progressSeconds least wall time between progress lines when the output is not a terminal
     * @param table           print the flux table when the run has one
     */
    static Finished run(CaseOptions.Loaded l, Map<String, String> overrides, RunFolder rf, PrintWriter o,
                        double progressSeconds, boolean table, List<String> commandLine) throws IOException {
        return run(l, overrides, rf, o, progressSeconds, table, null, commandLine);
    }

    /**
     * The same with checkpoints (null: none).
     *
     * @param commandLine the arguments the program was given (for run.json)
     */
    static Finished run(CaseOptions.Loaded l, Map<String, String> overrides, RunFolder rf, PrintWriter o,
                        double progressSeconds, boolean table, Checkpoints checkpoints, List<String> commandLine)
            throws IOException {
        return run(l, overrides, rf, o, progressSeconds, table, checkpoints, commandLine, IncidentPowerCache.none());
    }

    /** The same, taking the incident-power run's result from {@code incident} where it holds one of the same key. */
    static Finished run(CaseOptions.Loaded l, Map<String, String> overrides, RunFolder rf, PrintWriter o,
                        double progressSeconds, boolean table, Checkpoints checkpoints, List<String> commandLine,
                        IncidentPowerCache incident) throws IOException {
        CasePlan plan = l.plan();
        // the preview depends on the plan alone: drawn beside the stepping when the run leaves a core idle
        BesideTheRun preview = !plan.spec().output().writes(OutputSpec.Item.PREVIEW) ? null
                : BesideTheRun.start(plan.builder().effectiveThreads(),
                        () -> RunOutputs.preview(plan, rf.dir().resolve("preview.png")));
        try {
            return run(l, overrides, rf, o, progressSeconds, table, checkpoints, commandLine, incident, preview);
        } finally {
            if (preview != null) {
                preview.awaitQuietly(); // a failed run: nothing may still write into its folder when it is removed
            }
        }
    }

    private static Finished run(CaseOptions.Loaded l, Map<String, String> overrides, RunFolder rf, PrintWriter o,
                                double progressSeconds, boolean table, Checkpoints checkpoints, List<String> commandLine,
                                IncidentPowerCache incident, BesideTheRun preview) throws IOException {
        CasePlan plan = l.plan();
        CaseSpec s = plan.spec();
        boolean terminal = System.console() != null;
        o.printf(Locale.ROOT, "%s: %d x %d cells of %.4g nm, up to %d steps, %s polarization%s; writing %s%n",
                s.source(), plan.grid().nx(), plan.grid().ny(), plan.grid().cellSize() * 1e9, plan.stop().maxSteps(),
                s.polarization().value().name().toLowerCase(Locale.ROOT),
                plan.flux().flatMap(FluxPlan::computed).isPresent()
                        ? ", the incident power computed from " + plan.flux().get().computed().get().from()
                        + " (no incident-power run)"
                        : plan.surfaces().flatMap(org.evanesce.io.plan.SurfacePlan::computedIncident).isPresent()
                        ? ", the incident power computed from the beam's sheets (no incident-power run)"
                        : org.evanesce.io.run.IncidentBeside.besideTheRun(plan) ? ", an incident-power run beside it on a thread of its own"
                        : plan.referenceRun().isPresent() ? plan.flux().isPresent() || plan.surfaces().orElseThrow().incidentLine()
                        .isPresent() ? ", then an incident-power run" : ", then a run measuring the sources' own power" : "",
                rf.target());
        ProgressLine progress = new ProgressLine(o, terminal, plan.dt());
        List<Xdmf.Grid> frames = new ArrayList<>();
        if (plan.fields().frameSteps().length > 0) {
            int[] b = plan.fields().box();
            plan.builder().listener(new Snapshots(plan.fields().components().toArray(new Component[0]), b[0], b[1], b[2], b[3],
                    plan.fields().frameSteps(), FieldOutputs.periodic(plan), FieldOutputs.frameSink(plan, rf.dir(), frames)));
        }
        if (s.output().writes(OutputSpec.Item.PERMITTIVITY)) {
            FieldOutputs.writePermittivity(plan, rf.dir());
        }
        CaseRunner.Result r;
        try {
            r = CaseRunner.run(plan, progress, terminal ? 0.5 : progressSeconds, !s.output().writes(OutputSpec.Item.FIELDS)
                    ? null : view -> {
                        try {
                            FieldOutputs.writeFields(plan, view, rf.dir());
                        } catch (IOException e) {
                            throw new UncheckedIOException("writing the fields at the end of the run: " + e.getMessage(), e);
                        }
                    }, checkpoints, incident);
        } catch (UncheckedIOException e) {
            throw e.getCause();
        } finally {
            progress.finish();
        }
        if (r.resumedFromStep() >= 0) {
            o.printf(Locale.ROOT, "continued from the checkpoint at step %d%n", r.resumedFromStep());
        }
        FieldOutputs.writeFrameIndex(rf.dir(), frames);
        List<MapOutputs.Decay> decays = plan.fields().maps().isPresent() ? MapOutputs.write(plan, rf.dir()) : List.of();
        FluxResults flux = null;
        if (plan.flux().isPresent()) {
            // a beam's angular-spectrum references, once for the table and the plots, on the run's threads
            FluxPlan f = plan.flux().get();
            BeamReferences references = BeamReferences.of(f, s.polarization().value(), r.threads());
            flux = FluxResults.of(f, s.polarization().value(), references);
            rf.writeText("flux.csv", flux.csv());
            FluxPlot.write(flux, s.title().orElse(""), rf.dir());
            BeamPlots.write(f, s.polarization().value(), f.closest(s.sources().get(0).signal().frequency().si()), rf.dir(),
                    references);
        }
        SurfaceResults surfaces = plan.surfaces().map(sp -> SurfaceResults.of(sp, r.threads())).orElse(null);
        if (surfaces != null) {
            SurfaceOutputs.write(surfaces, rf, plan);
        }
        Settling settling = Settling.of(plan, r, flux);
        List<String> warnings = new ArrayList<>(settling.warnings());
        warnings.addAll(Plausibility.check(plan, flux, settling));
        if (flux != null) {
            warnings.addAll(flux.warnings()); // e.g. a beam's reference that did not converge
        }
        if (flux != null || !decays.isEmpty() || surfaces != null) {
            Map<String, Object> summary = RunOutputs.summary(plan, flux, decays, settling, warnings);
            if (surfaces != null) {
                summary.put("surfaces", surfaces.summary());
            }
            if (flux != null && r.incidentPower() != null && summary.get("flux") instanceof Map<?, ?> fm) {
                @SuppressWarnings("unchecked")
                Map<String, Object> f = (Map<String, Object>) fm;
                f.put("incident_power_obtained", r.incidentPower().record());
            }
            rf.writeText("summary.json", Json.write(summary));
        }
        if (s.output().writes(OutputSpec.Item.PROBES)) {
            rf.writeText("probes.csv", RunOutputs.probesCsv(plan.probes()));
        }
        if (preview != null) {
            preview.await();
        }
        RunOutputs.writeRunRecord(rf, RunOutputs.runRecord(new RunOutputs.Invocation(BuildInfo.current(), commandLine),
                l.sha256(), plan, r, settling, l.loaded().diagnostics(), warnings, overrides));
        long cells = (long) plan.grid().nx() * plan.grid().ny();
        o.printf(Locale.ROOT, "done: %d steps in %.1f s (%.0f Mcell/s, %d thread%s)%s; %s%n", r.steps(), r.wallSeconds(),
                r.cellUpdatesPerSecond(cells) / 1e6, r.threads(), r.threads() == 1 ? "" : "s",
                r.incidentPower() != null ? r.incidentPower().reused() ? ", incident power reused"
                        : String.format(Locale.ROOT, r.incidentPower().computed() ? ", incident power computed in %.1f s"
                        : ", incident-power run %.1f s", r.incidentPowerRunWallSeconds())
                        : plan.referenceRun().isPresent() ? String.format(Locale.ROOT, ", %s %.1f s", plan.flux().isPresent()
                        ? "incident-power run" : "reference run", r.incidentPowerRunWallSeconds()) : "",
                r.stopReason());
        if (flux != null && table) {
            FluxTable.print(o, flux);
        }
        if (surfaces != null && table) {
            SurfaceTable.print(o, surfaces);
        }
        for (MapOutputs.Decay d : decays) {
            o.println(d.fit() == null ? String.format(Locale.ROOT, "decay %s at %.2f nm: no fit (%s)", d.name(),
                    d.wavelength() * 1e9, d.problem())
                    : String.format(Locale.ROOT, "decay %s at %.2f nm: L = %.5g nm ± %.2g nm%s", d.name(), d.wavelength() * 1e9,
                    d.fit().length() * 1e9, d.fit().lengthUncertainty() * 1e9, Double.isFinite(d.planeWave())
                            ? String.format(Locale.ROOT, " (plane-wave value %.5g nm, %+.2f %%)", d.planeWave() * 1e9,
                            100 * (d.fit().length() / d.planeWave() - 1)) : ""));
        }
        for (String w : warnings) {
            o.println(RunOutputs.runWarning(plan, w));
        }
        return new Finished(r, flux, settling, List.copyOf(warnings));
    }
}
