package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.CaseText;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.LoadedCase;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.model.SweepSpec;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.OutputFolders;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.evanesce.io.plan.PlanException;
import org.evanesce.io.run.CaseRunner;
import org.evanesce.io.run.IncidentPowerCache;
import org.evanesce.io.run.RunOutputs;
import org.evanesce.io.sweep.Parallelism;
import org.evanesce.io.sweep.PointHash;
import org.evanesce.io.sweep.SlurmScript;
import org.evanesce.io.sweep.SampleSummary;
import org.evanesce.io.sweep.SweepExtrema;
import org.evanesce.io.sweep.SweepFolder;
import org.evanesce.io.sweep.SweepMerge;
import org.evanesce.io.sweep.SweepPoint;
import org.evanesce.io.sweep.SweepRecord;
import org.evanesce.io.sweep.SweepRunner;
import org.evanesce.solver.DivergenceException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * {@code evanesce sweep CASE}: runs every point of the case's {@code sweep} section, each into its own
 * complete results folder {@code DIR/point-NNNN/}, and merges the results into {@code DIR/sweep.csv}
 * and {@code DIR/sweep.png}. Every point is read (and, before it runs, planned) up front, so a bad
 * value stops the sweep before anything runs. Running the same sweep again keeps the points whose
 * folder holds a finished run with the expected point hash and runs the others; a changed case is
 * refused unless {@code --restart}. {@code --shard i/N} runs a part of the points (for job arrays),
 * {@code --merge-only} gathers what is finished, and {@code --slurm-script} writes a job-array script.
 */
@Command(name = "sweep", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, sortOptions = false,
        description = {"Run every point of the case's sweep section (each a set of --set overrides) into DIR/point-NNNN/, "
                + "one complete results folder per point, and merge the results into DIR/sweep.csv and DIR/sweep.png.",
            "Running the same command again continues: finished points are kept (checked by their point hash), unfinished "
                + "ones run again. A case changed since DIR/sweep.json was written is refused unless --restart."})
public final class SweepCommand implements Callable<Integer> {

    private static final Pattern SHARD = Pattern.compile("(\\d+)/(\\d+)");

    @Spec
    private CommandSpec spec;

    @Mixin
    private CaseOptions options;

    @Option(names = "--out", paramLabel = "DIR", description = "Sweep folder (default: the case's output folder + '-sweep').")
    private Path out;

    @Option(names = "--parallel", paramLabel = "N",
            description = "Points run at once, the threads shared among them (default: chosen from the grid size and the "
                    + "cores: several at once only when one point's grid is too small to use every core).")
    private Integer parallel;

    @Option(names = "--shard", paramLabel = "i/N",
            description = "Run only the points whose number %% N == i (0 <= i < N), into the same DIR: one shard per task "
                    + "of a job array; merge with --merge-only when all have finished.")
    private String shard;

    @Option(names = "--restart", description = "Accept a case or sweep that changed since DIR/sweep.json was written and "
            + "start over: points whose results do not match are run again, each old folder replaced only once its new run "
            + "has finished.")
    private boolean restart;

    @Option(names = "--merge-only", description = "Run nothing: merge the finished points into sweep.csv and sweep.png and "
            + "list the missing ones (exit 0 when complete, 3 when points are missing).")
    private boolean mergeOnly;

    @Option(names = "--plot-wavelength", paramLabel = "LENGTH", converter = PlotWavelength.class,
            description = "The vacuum wavelength sweep.png and sweep-log.png draw, e.g. 640nm: each point's flux row nearest "
                    + "to it (of two equally near, the shorter wavelength). Default: the design wavelength.")
    private Double plotWavelength;

    /** A positive length with a unit, in m. */
    static final class PlotWavelength implements picocli.CommandLine.ITypeConverter<Double> {
        @Override
        public Double convert(String value) {
            double v = StackCommand.parseLength(value);
            if (!(v > 0)) {
                throw new picocli.CommandLine.TypeConversionException("'" + value + "' is not a wavelength; expected a "
                        + "positive length with a unit, e.g. 640nm");
            }
            return v;
        }
    }

    @Option(names = "--slurm-script", paramLabel = "TASKS",
            description = "Run nothing: write DIR/sweep.slurm, a Slurm job-array script of TASKS tasks, each running one shard, "
                    + "and print the commands to submit it and to merge.")
    private Integer slurmTasks;

    @Option(names = "--launcher", paramLabel = "PATH",
            description = "The evanesce launcher the Slurm script calls (default: the repository's 'evanesce' script beside "
                    + "this program).")
    private Path launcher;

    @Option(names = "--progress-seconds", paramLabel = "S", defaultValue = "10",
            description = "Seconds between progress lines when the output is not a terminal (default: ${DEFAULT-VALUE}).")
    private double progressSeconds;

    /** The sweep's sample form, null for listed values. */
    private org.evanesce.io.casefile.model.SampleSpec sample;

    /**
     * A point after reading: its values in SI, its overrides and hash, and the case as read with its overrides
     * (null when the sweep runs nothing), which the point's run uses instead of reading the case again.
     */
    private record Read(SweepPoint point, Map<String, String> overrides, double[] si, String hash, LoadedCase loaded) { }

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        int[] shardOf = checkOptions();
        Path caseFile = options.caseFile;
        byte[] text;
        String caseText;
        try {
            CaseText read = CaseText.read(caseFile);
            text = read.bytes();
            caseText = read.text();
        } catch (NoSuchFileException e) {
            throw usage(caseFile + ": no such file");
        } catch (IOException e) {
            throw usage(caseFile + ": cannot read: " + e.getMessage());
        } catch (CaseFileException e) {
            for (Diagnostic d : e.diagnostics()) {
                err.println(d);
            }
            throw usage("1 error(s) in " + caseFile + "; nothing was run or written");
        }
        String caseSha = PointHash.sha256(text);
        String version = VersionProvider.version();
        String build = org.evanesce.io.output.BuildInfo.current().id();
        boolean runs = !mergeOnly && slurmTasks == null;
        // merging and writing a script run nothing, so this machine's memory is no limit for the grids
        ReadOptions read = runs ? ReadOptions.defaults() : new ReadOptions(Long.MAX_VALUE);

        LoadedCase asWritten = readCase(caseText, options.overrides, read, err, null);
        CaseSpec base = asWritten.spec();
        SweepSpec sweep = base.sweep().orElseThrow(() -> usage(caseFile + ": the case has no sweep section; add one "
                + "(docs/case-file.md, 'sweep') or run it with 'evanesce run'"));
        sample = sweep.sample().orElse(null);
        if (sample != null) {
            try {
                SampleSummary.checkLimits(sample, base);
            } catch (SampleSummary.UnknownColumn e) {
                throw usage(e.getMessage() + "; nothing was run or written");
            }
        }
        for (SweepSpec.Axis a : sweep.parameters()) {
            if (options.overrides.containsKey(a.name())) {
                throw usage("--set " + a.name() + "=" + options.overrides.get(a.name()) + ": " + a.name() + " is swept (" + caseFile
                        + ":" + a.at().line() + "); remove it from --set or from the sweep");
            }
        }
        Set<String> seen = new HashSet<>();
        for (Diagnostic d : withoutSweepNote(asWritten.diagnostics())) {
            err.println(d);
            seen.add(d.path() + ": " + d.message());
        }

        // every point is read before anything runs (on the threads the sweep may use; printed in point order)
        List<SweepPoint> points = SweepPoint.expand(sweep);
        int prepThreads = preparationThreads(base);
        List<SweepPreparation.Attempt<LoadedCase>> reads = SweepPreparation.each(points, prepThreads,
                p -> CaseLoader.parse(caseText, caseFile.toString(), overrides(p), read));
        List<Read> all = new ArrayList<>();
        int bad = 0;
        for (int n = 0; n < points.size(); n++) {
            SweepPoint p = points.get(n);
            Map<String, String> ov = overrides(p);
            SweepPreparation.Attempt<LoadedCase> a = reads.get(n);
            if (a.error() instanceof CaseFileException e) {
                if (bad++ < 20) {
                    for (Diagnostic d : e.errors()) {
                        err.println("point " + p.number() + " (" + p.describe() + "): " + d);
                    }
                }
                continue;
            } else if (a.error() != null) {
                throw unexpected(a.error());
            }
            LoadedCase lc = a.value();
            for (Diagnostic d : withoutSweepNote(lc.warnings())) {
                if (seen.add(d.path() + ": " + d.message())) {
                    err.println("point " + p.number() + " (" + p.describe() + "): " + d);
                }
            }
            double[] si = new double[p.names().size()];
            for (int k = 0; k < si.length; k++) {
                var param = lc.spec().parameters().get(p.names().get(k));
                si[k] = param == null ? Double.NaN : param.value().value(); // NaN: the polarization (s, p, both)
            }
            // the case as read is kept for the point's run when it was read for running (not for a merge or a script)
            all.add(new Read(p, ov, si, PointHash.of(text, ov, version, build), runs ? lc : null));
        }
        if (bad > 0) {
            throw usage(String.format(Locale.ROOT, "%d of %d points of %s have errors%s; nothing was run or written", bad,
                    points.size(), caseFile, bad > 20 ? " (the first 20 are shown)" : ""));
        }

        SweepFolder folder = new SweepFolder(out != null ? out : defaultFolder(caseFile, base));
        // refused (exit 2) before anything is written: the case's own folder or above it, a file, a link, a foreign folder
        OutputFolders.checkInto(folder.dir(), SweepFolder.RECORD, SweepFolder::ours, OutputFolders.around(caseFile));
        List<SweepRecord.Entry> entries = all.stream().map(r -> new SweepRecord.Entry(r.point(), r.hash())).toList();
        Map<String, Object> record = SweepRecord.of(version, caseFile.toAbsolutePath().normalize().toString(), caseSha,
                options.overrides, sweep, entries);
        checkRecord(folder, record);
        List<SweepMerge.Point> mergePoints = all.stream().map(r -> new SweepMerge.Point(r.point(), r.si(), r.hash())).toList();
        List<org.evanesce.io.casefile.expr.Dimension> kinds = sweep.parameters().stream().map(SweepSpec.Axis::kind).toList();
        String title = base.title().orElse(caseFile.getFileName().toString());

        if (mergeOnly) {
            if (!Files.isDirectory(folder.dir())) {
                throw usage(folder.dir() + ": no sweep folder there to merge; run the sweep (or its shards) first, or give its --out");
            }
            return merge(folder, mergePoints, kinds, title, o, err, true);
        }
        if (slurmTasks != null) {
            return slurm(folder, record, caseFile, points.size(), o);
        }
        writeRecord(folder, record);

        // this run's points: the shard's, less those finished already
        Set<Integer> mine = new LinkedHashSet<>();
        for (Read r : all) {
            if (shardOf == null || r.point().number() % shardOf[1] == shardOf[0]) {
                mine.add(r.point().number());
            }
        }
        for (String line : folder.removeLeftovers(mine, shardOf == null)) {
            o.println("note: " + line);
        }
        List<Read> todo = new ArrayList<>();
        int finishedBefore = 0;
        Map<String, List<Integer>> rerun = new LinkedHashMap<>();
        for (Read r : all) {
            if (folder.finished(r.point().number(), r.hash())) {
                finishedBefore++;
            } else if (mine.contains(r.point().number())) {
                todo.add(r);
                String why = folder.whyRunAgain(r.point().number(), version, build);
                if (why != null) {
                    rerun.computeIfAbsent(why, k -> new ArrayList<>()).add(r.point().number());
                }
            }
        }
        SweepPreparation.Plans kept = new SweepPreparation.Plans(Runtime.getRuntime().maxMemory() / SweepPreparation.PLAN_HEAP_SHARE);
        Parallelism choice = planAll(todo, base, prepThreads, kept, err);
        o.printf(Locale.ROOT, "sweep of %s: %d points (%s of %s)%s; %d finished already, %d to run%s%n", caseFile, points.size(),
                sweep.combine().caseName(), String.join(", ", points.get(0).names()),
                shardOf == null ? "" : String.format(Locale.ROOT, ", shard %d/%d has %d", shardOf[0], shardOf[1], mine.size()),
                finishedBefore, todo.size(), todo.isEmpty() ? "" : String.format(Locale.ROOT, ", %d at once with %d thread(s) "
                        + "each (%s); writing %s", choice.parallel(), choice.threadsPerPoint(), choice.reason(), folder.dir()));

        rerun.forEach((why, numbers) -> o.printf(Locale.ROOT, "%d finished point(s) run again (%s): %s%n", numbers.size(),
                why, SweepMerge.ranges(numbers)));
        SweepRunner runner = new SweepRunner(folder, points.size(), finishedBefore, o, System.console() != null);
        List<SweepRunner.Task> tasks = todo.stream().map(r -> new SweepRunner.Task(r.point(),
                SweepRunner.pointRecord(r.point(), r.overrides(), r.hash(), version, build))).toList();
        // the incident-power run is done once per distinct set-up (a sweep over the scene needs one) and kept in the folder
        IncidentPowerCache incident = IncidentPowerCache.inFolder(folder.dir(), note -> {
            synchronized (o) {
                o.println("note: " + note);
                o.flush();
            }
        });
        SweepRunner.Outcome outcome = runner.run(tasks, choice.parallel(), choice.threadsPerPoint(),
                (p, rf, pointOut, threads) -> runPoint(all.get(p.number()), caseText, caseFile, caseSha, rf, pointOut, threads,
                        incident, kept));

        boolean complete = all.stream().allMatch(r -> folder.finished(r.point().number(), r.hash()));
        int code = ExitCode.OK;
        if (shardOf == null || complete) {
            code = merge(folder, mergePoints, kinds, title, o, err, false);
        } else {
            o.printf(Locale.ROOT, "shard %d/%d: done; the sweep is not complete yet. When every shard has finished, merge with:%n"
                    + "  evanesce sweep %s --out %s --merge-only%n", shardOf[0], shardOf[1], caseFile, folder.dir());
        }
        if (!outcome.failed().isEmpty()) {
            err.printf(Locale.ROOT, "evanesce sweep: %d point(s) failed: %s (see above); the others are kept. Running the same "
                    + "command again retries them.%n", outcome.failed().size(),
                    SweepMerge.ranges(new ArrayList<>(outcome.failed().keySet())));
            code = ExitCode.RUN_FAILED;
        }
        o.println("Caution: " + RunOutputs.CAUTION);
        return code;
    }

    /** Checks the options against each other; returns the shard {i, N} or null. */
    private int[] checkOptions() {
        if (options.threads != null && options.threads < 1) {
            throw usage("--threads " + options.threads + " must be >= 1");
        }
        if (parallel != null && parallel < 1) {
            throw usage("--parallel " + parallel + " must be >= 1");
        }
        if (slurmTasks != null && slurmTasks < 1) {
            throw usage("--slurm-script " + slurmTasks + ": expected a number of array tasks, at least 1");
        }
        if (mergeOnly && (shard != null || restart || slurmTasks != null || parallel != null)) {
            throw usage("--merge-only runs nothing; it takes no --shard, --restart, --parallel or --slurm-script");
        }
        if (slurmTasks != null && shard != null) {
            throw usage("--slurm-script writes the script for every shard; it takes no --shard");
        }
        if (launcher != null && slurmTasks == null) {
            throw usage("--launcher goes with --slurm-script");
        }
        if (shard == null) {
            return null;
        }
        Matcher m = SHARD.matcher(shard.strip());
        if (!m.matches()) {
            throw usage("--shard " + shard + ": expected i/N, e.g. 0/4 for the first of four shards");
        }
        int i;
        int n;
        try {
            i = Integer.parseInt(m.group(1));
            n = Integer.parseInt(m.group(2));
        } catch (NumberFormatException e) {
            throw usage("--shard " + shard + ": numbers too large");
        }
        if (n < 1 || i >= n) {
            throw usage("--shard " + shard + ": expected 0 <= i < N with N >= 1");
        }
        return new int[] {i, n};
    }

    private Map<String, String> overrides(SweepPoint p) {
        Map<String, String> ov = new LinkedHashMap<>(options.overrides);
        ov.putAll(p.overrides());
        return ov;
    }

    /** Reads the case; errors are printed (each prefixed with {@code what}, if given) and become a usage error. */
    private LoadedCase readCase(String text, Map<String, String> ov, ReadOptions read, PrintWriter err, String what) {
        try {
            return CaseLoader.parse(text, options.caseFile.toString(), ov, read);
        } catch (CaseFileException e) {
            for (Diagnostic d : e.diagnostics()) {
                err.println((what == null ? "" : what + ": ") + d);
            }
            throw usage(e.errors().size() + " error(s) in " + options.caseFile + "; nothing was run or written");
        }
    }

    /** The reader's note that the sweep is run by this command says nothing here. */
    private static List<Diagnostic> withoutSweepNote(List<Diagnostic> ds) {
        return ds.stream().filter(d -> !(d.severity() == Diagnostic.Severity.NOTE && d.path().equals("sweep"))).toList();
    }

    /** Refuses a folder whose sweep.json records another sweep, unless --restart. */
    private void checkRecord(SweepFolder folder, Map<String, Object> record) throws IOException {
        Path f = folder.dir().resolve(SweepFolder.RECORD);
        if (!Files.isRegularFile(f)) {
            return;
        }
        List<String> diffs;
        try {
            diffs = SweepRecord.differences(SweepFolder.readJson(f), record);
        } catch (IOException e) {
            diffs = List.of("it cannot be read (" + e.getMessage() + ")");
        }
        if (diffs.isEmpty() || restart) {
            if (!diffs.isEmpty()) {
                spec.commandLine().getOut().println("--restart: " + String.join("; ", diffs) + "; starting over (finished "
                        + "points are replaced only as new ones finish)");
            }
            return;
        }
        throw usage(f + ": the sweep in this folder was made from a different case: " + String.join("; ", diffs)
                + ". Run with --restart to start over (old points are replaced only as new ones finish), or choose another --out");
    }

    private static void writeRecord(SweepFolder folder, Map<String, Object> record) throws IOException {
        byte[] bytes = Json.write(record).getBytes(StandardCharsets.UTF_8);
        Path f = folder.dir().resolve(SweepFolder.RECORD);
        if (!Files.isRegularFile(f) || !java.util.Arrays.equals(Files.readAllBytes(f), bytes)) {
            folder.write(SweepFolder.RECORD, bytes);
        }
    }

    /**
     * Plans every point about to run (a bad one stops the sweep before anything runs; on the threads the sweep may
     * use) and chooses how many run at once from the largest grid. The plans that fit {@code kept} are kept for the
     * points' runs.
     */
    private Parallelism planAll(List<Read> todo, CaseSpec base, int prepThreads, SweepPreparation.Plans kept,
                                PrintWriter err) {
        // each point's grid and memory (not its plan: only the kept ones stay in memory)
        List<SweepPreparation.Attempt<long[]>> sizes = SweepPreparation.each(todo, prepThreads, r -> {
            CasePlan plan = CasePlanner.plan(r.loaded().spec(), null);
            kept.offer(r.point().number(), plan);
            return new long[] {(long) plan.grid().nx() * plan.grid().ny(), plan.grid().ny(), plan.memory().total()};
        });
        long cells = 1;
        int rows = 2;
        long bytes = 1;
        int bad = 0;
        for (int n = 0; n < todo.size(); n++) {
            Read r = todo.get(n);
            SweepPreparation.Attempt<long[]> a = sizes.get(n);
            if (a.error() instanceof PlanException e) {
                bad++;
                for (Diagnostic d : e.diagnostics()) {
                    err.println("point " + r.point().number() + " (" + r.point().describe() + "): " + d);
                }
                continue;
            } else if (a.error() != null) {
                throw unexpected(a.error());
            }
            long[] size = a.value();
            if (size[0] > cells) {
                cells = size[0];
                rows = (int) size[1];
            }
            bytes = Math.max(bytes, size[2]);
        }
        if (bad > 0) {
            throw usage(String.format(Locale.ROOT, "%d of %d points to run cannot be planned; nothing was run", bad, todo.size()));
        }
        Integer asked = options.threads != null ? options.threads : base.numerics().threads().map(Located::value).orElse(null);
        ThreadLimit limit = ThreadLimit.current();
        Integer capped = limit.apply(asked, err::println, Runtime.getRuntime().availableProcessors());
        int cores = capped != null ? capped : Math.min(limit.max(), Runtime.getRuntime().availableProcessors());
        Parallelism choice = Parallelism.choose(cores, cells, rows, bytes, Runtime.getRuntime().maxMemory(), todo.size(), parallel);
        kept.fitBeside(choice.parallel() * bytes, Runtime.getRuntime().maxMemory());
        return choice;
    }

    /**
     * Threads for reading and planning the points: those the sweep may use (--threads or the case's, within this
     * job's limit), without a note (planning prints it).
     */
    private int preparationThreads(CaseSpec base) {
        Integer asked = options.threads != null ? options.threads : base.numerics().threads().map(Located::value).orElse(null);
        int max = Math.min(ThreadLimit.current().max(), Runtime.getRuntime().availableProcessors());
        return Math.max(1, asked != null ? Math.min(asked, max) : max);
    }

    /** An exception reading or planning a point should not end with (a fault in the program): thrown as it is. */
    private static RuntimeException unexpected(Exception e) {
        return e instanceof RuntimeException r ? r : new IllegalStateException(e);
    }

    /** One point: plan the case as read with the point's overrides (or take its kept plan), run it into the folder. */
    private void runPoint(Read r, String caseText, Path caseFile, String caseSha, org.evanesce.io.output.RunFolder rf,
                          PrintWriter pointOut, int threads, IncidentPowerCache incident, SweepPreparation.Plans kept)
            throws SweepRunner.PointFailed, IOException {
        Map<String, String> ov = r.overrides();
        try {
            LoadedCase lc = new LoadedCase(r.loaded().spec(), withoutSweepNote(r.loaded().diagnostics()));
            CasePlan plan = kept.take(r.point().number(), threads);
            if (plan == null) {
                plan = CasePlanner.plan(lc.spec(), threads);
            }
            if (lc.spec().polarizations() == org.evanesce.io.casefile.model.PolarizationChoice.BOTH) {
                Map<String, String> pov = PolarizationRuns.overrides(ov, org.evanesce.io.casefile.model.PolarizationChoice.P);
                LoadedCase lp = CaseLoader.parse(caseText, caseFile.toString(), pov, ReadOptions.defaults());
                lp = new LoadedCase(lp.spec(), withoutSweepNote(lp.diagnostics()));
                PolarizationRuns.run(new CaseOptions.Loaded(lc, plan, caseSha),
                        new CaseOptions.Loaded(lp, CasePlanner.plan(lp.spec(), threads), caseSha), ov, rf, pointOut,
                        progressSeconds, false, spec.commandLine().getParseResult().originalArgs());
                return;
            }
            CaseExecution.run(new CaseOptions.Loaded(lc, plan, caseSha), ov, rf, pointOut, progressSeconds, false, null,
                    spec.commandLine().getParseResult().originalArgs(), incident);
        } catch (CaseFileException | PlanException e) {
            throw new SweepRunner.PointFailed("the case no longer reads: " + e.getMessage().lines().findFirst().orElse(""), e);
        } catch (DivergenceException | RunFailedException | CaseRunner.RefusedException e) {
            throw new SweepRunner.PointFailed(e.getMessage(), e);
        }
    }

    /** Merges the finished points; with {@code report}, missing points make exit code 3. */
    private int merge(SweepFolder folder, List<SweepMerge.Point> points, List<org.evanesce.io.casefile.expr.Dimension> kinds,
                      String title, PrintWriter o, PrintWriter err, boolean report) throws IOException {
        SweepMerge.Result m = SweepMerge.write(folder, points, kinds, title, plotWavelength == null ? Double.NaN : plotWavelength);
        o.printf(Locale.ROOT, "merged %d of %d points into %s%s%n", m.finished(), points.size(),
                folder.dir().resolve(SweepFolder.CSV), !m.png() ? "" : " and " + SweepFolder.PNG
                + (java.nio.file.Files.exists(folder.dir().resolve(SweepFolder.LOG_PNG)) ? ", " + SweepFolder.LOG_PNG : ""));
        if (sample == null) {
            SweepExtrema.Written x = SweepExtrema.write(folder, m.csv(), points.isEmpty() ? List.of()
                    : points.get(0).point().names(), kinds);
            if (x != null) {
                o.print(x.summary());
            }
        }
        if (sample != null) {
            try {
                SampleSummary.Written w = SampleSummary.write(folder, m.csv(), sample, points.isEmpty() ? List.of()
                        : points.get(0).point().names(), points.size(), m.missing(), options.caseFile.toString(),
                        RunOutputs.CAUTION);
                o.printf(Locale.ROOT, "statistics of the %d merged sample points in %s (with histograms):%n", m.finished(),
                        folder.dir().resolve(SweepFolder.SAMPLE));
                SampleSummary.print(o, w);
            } catch (SampleSummary.UnknownColumn e) {
                throw usage(e.getMessage() + "; the points are kept: correct the case's require section and run again "
                        + "(finished points are not run again)");
            }
        }
        if (!m.unsettled().isEmpty()) {
            err.printf(Locale.ROOT, "evanesce sweep: warning: %d of %d merged points did not settle: %s (column 'settled' of "
                    + "sweep.csv; the reasons are in each point's run.json warnings)%n", m.unsettled().size(), m.finished(),
                    SweepMerge.ranges(m.unsettled()));
        }
        if (m.missing().isEmpty()) {
            return ExitCode.OK;
        }
        if (report) {
            err.printf(Locale.ROOT, "evanesce sweep: %d of %d points are missing (not finished, or computed from another "
                    + "case): %s. Run their shards again (or the sweep without --shard), then merge again.%n",
                    m.missing().size(), points.size(), SweepMerge.ranges(m.missing()));
            return ExitCode.RUN_FAILED;
        }
        return ExitCode.OK;
    }

    private int slurm(SweepFolder folder, Map<String, Object> record, Path caseFile, int points, PrintWriter o)
            throws IOException {
        Path exe = launcher != null ? launcher.toAbsolutePath().normalize() : SlurmScript.findLauncher();
        if (exe == null) {
            throw usage("cannot find the evanesce launcher beside this program; pass --launcher PATH");
        }
        if (!Files.isRegularFile(exe)) {
            throw usage("--launcher " + exe + ": no such file");
        }
        Path absCase = caseFile.toAbsolutePath().normalize();
        List<String> extra = SlurmScript.extraArguments(options.threads, options.overrides);
        String problem = SlurmScript.problem(exe, absCase, folder.dir(), extra);
        if (problem != null) {
            throw usage("--slurm-script: " + problem);
        }
        writeRecord(folder, record);
        // the plot's wavelength matters to the merge alone
        List<String> mergeOptions = plotWavelength == null ? List.of() : List.of("--plot-wavelength",
                new java.math.BigDecimal(plotWavelength * 1e9, new java.math.MathContext(12)).stripTrailingZeros().toPlainString() + "nm");
        String script = SlurmScript.text(exe, absCase, folder.dir(), slurmTasks, points, extra, SlurmScript.jobName(caseFile),
                mergeOptions);
        Path f = folder.write(SweepFolder.SLURM, script.getBytes(StandardCharsets.UTF_8));
        try {
            Files.setPosixFilePermissions(f, PosixFilePermissions.fromString("rwxr-xr-x"));
        } catch (UnsupportedOperationException e) {
            // not a POSIX file system: sbatch reads the script either way
        }
        o.printf(Locale.ROOT, "wrote %s: %d points in %d array tasks (task i runs the points whose number %% %d == i)%n", f,
                points, slurmTasks, slurmTasks);
        o.println("submit:  sbatch " + SlurmScript.quote(f.toString()));
        StringBuilder merge = new StringBuilder(SlurmScript.command(exe, absCase, folder.dir(), extra)).append(" --merge-only");
        mergeOptions.forEach(m -> merge.append(' ').append(SlurmScript.quote(m)));
        o.println("merge:   " + merge);
        return ExitCode.OK;
    }

    static Path defaultFolder(Path caseFile, CaseSpec s) {
        Path base = RunCommand.defaultFolder(caseFile, s);
        return base.resolveSibling(base.getFileName() + "-sweep");
    }

    private ParameterException usage(String message) {
        return new ParameterException(spec.commandLine(), message);
    }
}
