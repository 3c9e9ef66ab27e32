package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.Map;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.LoadedCase;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.evanesce.io.plan.PlanException;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;

/** What the case commands share: the case file, parameter overrides and threads, and reading + planning. */
final class CaseOptions {

    /** Bad input was reported; the command exits 2. */
    static final class BadInput extends Exception {
        private static final long serialVersionUID = 1L;

        BadInput(String message) {
            super(message);
        }
    }

    @Parameters(index = "0", paramLabel = "CASE", description = "The case file (YAML).")
    Path caseFile;

    @Option(names = "--set", paramLabel = "NAME=VALUE", mapFallbackValue = "",
            description = "Override a parameter of the case, e.g. --set gap=0.25um; repeat for several.")
    Map<String, String> overrides = new LinkedHashMap<>();

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (wins over the case file's; grids too small to share run on fewer).")
    Integer threads;

    /**
     * Reads, validates and plans the case, printing its findings to the command's error stream;
     * bad input becomes a usage error (exit 2).
     */
    Loaded load(CommandSpec spec) {
        try {
            return load(spec.commandLine().getErr());
        } catch (BadInput e) {
            throw new ParameterException(spec.commandLine(), e.getMessage());
        }
    }

    /** Reads, validates and plans the case, printing warnings to {@code err}. */
    Loaded load(PrintWriter err) throws BadInput {
        return load(err, ReadOptions.defaults());
    }

    /** The same with reading options (e.g. a finer resolution for an accuracy study). */
    Loaded load(PrintWriter err, ReadOptions read) throws BadInput {
        return load(err, read, overrides);
    }

    /**
     * The p run of a case with {@code polarization: both} (the case as {@link #load(CommandSpec)} read it is the
     * s run); its notes and warnings, the s run's already printed, are not printed again.
     */
    Loaded loadPolarizationP(CommandSpec spec) {
        try {
            return load(new PrintWriter(java.io.Writer.nullWriter()), ReadOptions.defaults(),
                    PolarizationRuns.overrides(overrides, org.evanesce.io.casefile.model.PolarizationChoice.P));
        } catch (BadInput e) {
            throw new ParameterException(spec.commandLine(), e.getMessage());
        }
    }

    private Loaded load(PrintWriter err, ReadOptions read, Map<String, String> overrides) throws BadInput {
        if (threads != null && threads < 1) {
            throw new BadInput("--threads " + threads + " must be >= 1");
        }
        LoadedCase loaded;
        try {
            loaded = CaseLoader.read(caseFile, overrides, read);
        } catch (NoSuchFileException e) {
            throw new BadInput(caseFile + ": no such file");
        } catch (java.nio.file.AccessDeniedException e) {
            throw new BadInput(caseFile + ": cannot read: permission denied");
        } catch (IOException e) {
            throw new BadInput(caseFile + ": cannot read: " + e.getMessage());
        } catch (CaseFileException e) {
            for (Diagnostic d : e.diagnostics()) {
                err.println(d);
            }
            throw new BadInput(e.errors().size() + " error(s) in " + caseFile + "; nothing was run or written");
        }
        for (Diagnostic d : loaded.diagnostics()) {
            err.println(d);
        }
        try {
            Integer asked = threads != null ? threads : loaded.spec().numerics().threads().map(t -> t.value()).orElse(null);
            Integer use = ThreadLimit.current().apply(asked, err::println, Runtime.getRuntime().availableProcessors());
            CasePlan plan = CasePlanner.plan(loaded.spec(), use, read.memoryLimit());
            return new Loaded(loaded, plan, sha256(caseFile));
        } catch (PlanException e) {
            for (Diagnostic d : e.diagnostics()) {
                err.println(d);
            }
            throw new BadInput(e.diagnostics().size() + " error(s) in " + caseFile + "; nothing was run or written");
        } catch (IOException e) {
            throw new BadInput(caseFile + ": cannot read: " + e.getMessage());
        }
    }

    record Loaded(LoadedCase loaded, CasePlan plan, String sha256) { }

    static String sha256(Path f) throws IOException {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(f)));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java runtime", e);
        }
    }
}
