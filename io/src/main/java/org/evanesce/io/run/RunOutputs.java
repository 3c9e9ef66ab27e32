package org.evanesce.io.run;

import java.io.IOException;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.Parameter;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.output.image.DisplayUnit;
import org.evanesce.io.output.image.PermittivityMap;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.solver.grid.Polarization;

/** Writes a run's results into its folder: probes.csv, preview.png and run.json. */
public final class RunOutputs {

    /** Shown in run.json and by the commands: results feed real optical set-ups. */
    public static final String CAUTION = "Simulated results are not a certification of a part or system; verify by "
            + "measurement. Follow local laser-safety standards and codes and licensed laser-safety practice when "
            + "setting up lasers and optics.";

    private RunOutputs() {
    }

    /**
     * The probes' time series as CSV: one row per step, for each probe its time and value.
     * Electric components are in V/m at whole steps; magnetic components are η0·H in V/m at half steps.
     */
    public static String probesCsv(List<CasePlan.NamedProbe> probes) {
        StringBuilder sb = new StringBuilder("step");
        int n = Integer.MAX_VALUE;
        for (CasePlan.NamedProbe p : probes) {
            String c = p.probe().component().name().toLowerCase(Locale.ROOT);
            sb.append(',').append(p.name()).append(" time (s)");
            sb.append(',').append(p.name()).append(' ').append(c).append(c.startsWith("h") ? " (eta0*H in V/m)" : " (V/m)");
            n = Math.min(n, p.probe().values().length);
        }
        sb.append('\n');
        if (probes.isEmpty()) {
            return sb.toString();
        }
        double[][] t = new double[probes.size()][];
        double[][] v = new double[probes.size()][];
        for (int q = 0; q < probes.size(); q++) {
            t[q] = probes.get(q).probe().times();
            v[q] = probes.get(q).probe().values();
        }
        // %.9e as java.util.Formatter writes it, without it: the formatter took about 10 % of a 4576-step, 7-probe
        // example's samples (issue 18's profile)
        org.evanesce.io.output.Scientific f = new org.evanesce.io.output.Scientific(9);
        for (int s = 0; s < n; s++) {
            sb.append(s + 1);
            for (int q = 0; q < probes.size(); q++) {
                f.append(sb.append(','), t[q][s]);
                f.append(sb.append(','), v[q][s]);
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /** Writes the permittivity preview of the plan's grid to a PNG file. */
    public static void preview(CasePlan plan, java.nio.file.Path file) throws IOException {
        FieldSite site = plan.spec().polarization().value() == Polarization.S ? FieldSite.EZ : FieldSite.EX;
        double extent = Math.max(plan.grid().nx(), plan.grid().ny()) * plan.grid().cellSize();
        PermittivityMap.builder(plan.materials(), site)
                .unit(DisplayUnit.forExtent(extent))
                .title(plan.spec().title().orElse(plan.spec().source()))
                .build().writePng(file);
    }

    /**
     * What ran and how: the program's build, the command line, the machine.
     *
     * @param build       the program's build
     * @param commandLine the arguments as given, after the program's name
     */
    public record Invocation(org.evanesce.io.output.BuildInfo build, List<String> commandLine) {
        public Invocation {
            commandLine = List.copyOf(commandLine);
        }
    }

    /**
     * The run record (docs/architecture.md: version, case hash, resolved case, grid, steps, threads, wall time, rate,
     * warnings), with the build, command line and host, and whether the results settled.
     *
     * @param diagnostics the case file's warnings and notes
     * @param runWarnings what the finished run found wrong with its results ({@link Settling}, {@link Plausibility})
     */
    public static Map<String, Object> runRecord(Invocation inv, String caseHash, CasePlan plan, CaseRunner.Result r,
                                                Settling settling, List<Diagnostic> diagnostics, List<String> runWarnings,
                                                Map<String, String> overrides) {
        CaseSpec s = plan.spec();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("program", "evanesce");
        m.put("version", inv.build().version());
        m.put("build", inv.build().record());
        List<String> cl = new java.util.ArrayList<>(List.of("evanesce"));
        cl.addAll(inv.commandLine());
        m.put("command_line", cl);
        m.put("working_directory", java.nio.file.Path.of("").toAbsolutePath().toString());
        Map<String, Object> host = new LinkedHashMap<>();
        host.put("cores", Runtime.getRuntime().availableProcessors());
        host.put("max_heap_bytes", Runtime.getRuntime().maxMemory());
        host.put("java", System.getProperty("java.version"));
        host.put("os", System.getProperty("os.name") + " " + System.getProperty("os.arch"));
        m.put("host", host);
        m.put("case_file", s.source());
        m.put("case_sha256", caseHash);
        m.put("overrides", new LinkedHashMap<>(overrides));
        m.put("caution", CAUTION);
        Map<String, Object> resolved = new LinkedHashMap<>();
        resolved.put("title", s.title().orElse(null));
        Map<String, Object> params = new LinkedHashMap<>();
        for (Parameter p : s.parameters().values()) {
            params.put(p.name(), p.value().toString());
        }
        resolved.put("parameters", params);
        resolved.put("polarization", s.polarization().value().name().toLowerCase(Locale.ROOT));
        resolved.put("design_wavelength_m", s.designWavelength().si());
        Map<String, Object> mats = new LinkedHashMap<>();
        Map<String, Object> report = org.evanesce.io.plan.MaterialReport.summary(s, plan.dt());
        for (MaterialSpec ms : s.materials().values()) {
            Map<String, Object> e = new LinkedHashMap<>();
            // a perfect conductor has neither (σ = +∞, written as null); its report says perfect_conductor
            e.put("relative_permittivity", ms.isPerfectConductor() ? null : ms.relativePermittivity().si());
            e.put("conductivity_s_per_m", ms.conductivity().si());
            e.put("library", ms.library().map(Object::toString).orElse(null));
            @SuppressWarnings("unchecked")
            Map<String, Object> more = (Map<String, Object>) report.get(ms.name());
            more.forEach(e::putIfAbsent);
            mats.put(ms.name(), e);
        }
        resolved.put("materials", mats);
        Map<String, Object> sides = new LinkedHashMap<>();
        s.boundaries().forEach((side, b) -> sides.put(side.name().toLowerCase(Locale.ROOT), b.describe(plan.pmlCells(side))));
        resolved.put("boundaries", sides);
        resolved.put("shapes", s.shapes().size());
        resolved.put("sources", s.sources().size());
        List<Object> probes = new java.util.ArrayList<>();
        for (CasePlan.NamedProbe p : plan.probes()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("name", p.name());
            e.putAll(site(plan, p.probe().component(), p.i(), p.j()));
            probes.add(e);
        }
        resolved.put("probes", probes);
        List<Object> sources = new java.util.ArrayList<>();
        for (CasePlan.SourceSite ss : plan.sourceSites()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("source", ss.source());
            Map<String, Object> first = site(plan, ss.component(), ss.i0(), ss.j0());
            Map<String, Object> last = site(plan, ss.component(), ss.i1(), ss.j1());
            e.put("component", first.get("component"));
            e.put("site_offset_cells", first.get("site_offset_cells"));
            e.put("first_index", first.get("index"));
            e.put("last_index", last.get("index"));
            e.put("first_site_m", first.get("site_m"));
            e.put("last_site_m", last.get("site_m"));
            sources.add(e);
        }
        resolved.put("source_sites", sources);
        m.put("resolved_case", resolved);
        Map<String, Object> grid = new LinkedHashMap<>();
        grid.put("nx", plan.grid().nx());
        grid.put("ny", plan.grid().ny());
        grid.put("cell_size_m", plan.grid().cellSize());
        grid.put("x0_m", plan.grid().x0());
        grid.put("y0_m", plan.grid().y0());
        grid.put("time_step_s", plan.dt());
        grid.put("precision", s.numerics().precision().value().name().toLowerCase(Locale.ROOT));
        grid.put("materials_after_smoothing", plan.materials().materials().size());
        grid.put("dispersion_correction", s.numerics().correctsDispersion(
                org.evanesce.io.plan.PlaneWaves.launched(s).isPresent()));
        grid.put("relative_permittivity_on_grid", new LinkedHashMap<>(plan.gridPermittivity()));
        m.put("grid", grid);
        long cells = (long) plan.grid().nx() * plan.grid().ny();
        Map<String, Object> run = new LinkedHashMap<>();
        run.put("steps", r.steps());
        run.put("simulated_time_s", r.steps() * plan.dt());
        run.put("stop_reason", r.stopReason());
        run.put("threads", r.threads());
        run.put("wall_time_s", r.wallSeconds());
        run.put("cell_updates_per_second", r.cellUpdatesPerSecond(cells));
        run.put("memory_bytes", r.bytes());
        if (plan.flux().isPresent()) {
            run.put("incident_power_run_wall_time_s", r.incidentPowerRunWallSeconds());
            if (r.incidentPower() != null) {
                run.put("incident_power", r.incidentPower().record());
            }
        }
        run.put("final_energy_j_per_m", r.finalEnergy());
        run.put("peak_energy_j_per_m", r.peakEnergy());
        if (plan.flux().isPresent()) {
            run.put("incident_power_run_final_energy_j_per_m", r.incidentPowerRunFinalEnergy());
            run.put("incident_power_run_peak_energy_j_per_m", r.incidentPowerRunPeakEnergy());
        }
        run.put("settling", settling.record());
        m.put("run", run);
        List<String> all = new java.util.ArrayList<>(diagnostics.stream().map(Diagnostic::toString).toList());
        runWarnings.forEach(w -> all.add(runWarning(plan, w)));
        m.put("warnings", all);
        return m;
    }

    /**
     * Names a component's site: its index (i, j) in that component's array, the site's offset from node (i, j)
     * in cells, and where it lies, m.
     */
    static Map<String, Object> site(CasePlan plan, org.evanesce.solver.grid.Component c, int i, int j) {
        Map<String, Object> e = new LinkedHashMap<>();
        double d = plan.grid().cellSize();
        e.put("component", c.name().toLowerCase(Locale.ROOT));
        e.put("index", List.of(i, j));
        e.put("site_offset_cells", new double[] {c.dx, c.dy});
        e.put("site_m", new double[] {plan.grid().x0() + (i + c.dx) * d, plan.grid().y0() + (j + c.dy) * d});
        return e;
    }

    /** A warning about a run's results as printed and recorded: {@code CASE: warning: results: ...}. */
    public static String runWarning(CasePlan plan, String message) {
        return plan.spec().source() + ": warning: results: " + message;
    }

    /**
     * summary.json (documented in docs/outputs.md) with the flux results (or null), the decay fits of the
     * maps, whether the run settled and the warnings about its results.
     */
    public static Map<String, Object> summary(CasePlan plan, FluxResults flux, List<MapOutputs.Decay> decays,
                                              Settling settling, List<String> runWarnings) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("program", "evanesce");
        m.put("schema", "evanesce-summary-1");
        m.put("case_file", plan.spec().source());
        m.put("title", plan.spec().title().orElse(null));
        m.put("polarization", plan.spec().polarization().value().name().toLowerCase(Locale.ROOT));
        m.put("cell_size_m", plan.grid().cellSize());
        m.put("caution", CAUTION);
        m.put("settled", settling.settled());
        m.put("energy_fraction", settling.energyFraction());
        m.put("settling", settling.record());
        m.put("warnings", runWarnings.stream().map(w -> runWarning(plan, w)).toList());
        m.put("materials", org.evanesce.io.plan.MaterialReport.summary(plan.spec(), plan.dt()));
        if (flux != null) {
            m.put("flux", flux.summary(plan.flux().orElseThrow()));
        }
        if (!decays.isEmpty()) {
            m.put("decay_fits", MapOutputs.summary(decays));
            m.put("decay_fit_method", "weighted least squares of ln|E| against distance (weights |E|^2), |E| the magnitude "
                    + "of the transformed electric field interpolated between nodes every cell along the line; plane-wave "
                    + "value lambda0 / (2 pi sqrt(n1^2 sin^2 theta - n2^2)) (Hecht, Optics, sec. 4.7)");
        }
        return m;
    }

    /** Writes run.json into the folder. */
    public static void writeRunRecord(RunFolder folder, Map<String, Object> record) throws IOException {
        folder.writeText("run.json", Json.write(record));
    }
}
