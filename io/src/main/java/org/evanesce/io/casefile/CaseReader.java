package org.evanesce.io.casefile;

import org.evanesce.io.casefile.model.PolarizationChoice;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.sections.Context;
import org.evanesce.io.casefile.sections.Sections;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.text.KeyPaths;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.YamlLimits;
import org.snakeyaml.engine.v2.api.LoadSettings;
import org.snakeyaml.engine.v2.api.lowlevel.Compose;
import org.snakeyaml.engine.v2.exceptions.Mark;
import org.snakeyaml.engine.v2.exceptions.MarkedYamlEngineException;
import org.snakeyaml.engine.v2.exceptions.YamlEngineException;
import org.snakeyaml.engine.v2.nodes.Node;

/**
 * Reads a case file (YAML 1.2) into a validated {@link CaseSpec}.
 *
 * <p>Every problem is collected before anything is refused: a case with errors throws one
 * {@link CaseFileException} listing all of them, each as {@code file:line:column: key.path: what
 * is wrong, what was expected}, together with the warnings found alongside. A case without errors
 * comes back with its warnings and notes. Parameter overrides ({@code --set name=value} on the
 * command line) replace the file's expression for a parameter before anything is evaluated.
 *
 * <p>This class reads and checks each section; the grid and the checks across sections (placement, PMLs,
 * memory) belong to planning and come in as {@link Checks}: read cases through
 * {@code org.evanesce.io.plan.CaseLoader}, which passes them. The schema is described in {@code docs/case-file.md}.
 */
public final class CaseReader {

    private CaseReader() {
    }

    /**
     * Checks run on a case whose sections all read without error: the planning layer derives the grid there and
     * runs the cross-section checks ({@code org.evanesce.io.plan.CaseLoader} passes them; this package knows
     * nothing of planning). What they add to {@code out} joins the reading's own findings.
     */
    @FunctionalInterface
    public interface Checks {

        void run(CaseSpec spec, KeyPaths paths, ReadOptions options, List<Diagnostic> out);
    }

    /**
     * Reads {@code file}; messages name it as given.
     *
     * @param overrides parameter name → expression text, e.g. {@code gap → "0.3 um"}; each must name a
     *                  parameter the file defines
     * @param checks    run on the finished case (every section read without error)
     * @throws IOException        when the file cannot be read
     * @throws CaseFileException  when the case has errors (all of them are in the exception)
     */
    public static LoadedCase read(Path file, Map<String, String> overrides, ReadOptions options, Checks checks)
            throws IOException, CaseFileException {
        return parse(CaseText.read(file).text(), file.toString(), overrides, options, checks);
    }

    /**
     * Reads a case from text.
     *
     * @param source the name messages give the text, normally its file name
     */
    public static LoadedCase parse(String text, String source, Map<String, String> overrides, ReadOptions options,
            Checks checks) throws CaseFileException {
        Reading r = reading(text, source, overrides, options, checks);
        List<Diagnostic> all = sorted(r.context.diagnostics);
        if (r.spec == null) {
            throw new CaseFileException(all);
        }
        if (r.spec.polarizations() == PolarizationChoice.BOTH) {
            // the p run must read too (an output component of s alone, say): its errors are this reading's
            Map<String, String> p = new java.util.LinkedHashMap<>(overrides);
            p.put(PolarizationChoice.KEY, PolarizationChoice.P.caseName());
            Reading rp = reading(text, source, p, options, checks);
            if (rp.spec == null) {
                List<Diagnostic> errors = new ArrayList<>();
                for (Diagnostic d : sorted(rp.context.diagnostics)) {
                    if (d.severity() == Diagnostic.Severity.ERROR) {
                        errors.add(new Diagnostic(d.severity(), d.at(), d.path(), d.message()
                                + " (in the p run of 'polarization: both')"));
                    }
                }
                throw new CaseFileException(errors);
            }
        }
        return new LoadedCase(r.spec, all);
    }

    /** What one reading produced: the spec (null when there are errors) and its context. */
    public record Reading(CaseSpec spec, Context context) { }

    /** The whole reading with its context, for tests that look at which keys were read. */
    public static Reading reading(String text, String source, Map<String, String> overrides, ReadOptions options,
            Checks checks) {
        Context ctx = new Context(source);
        Node root = compose(text, source, ctx);
        if (root == null) {
            return new Reading(null, ctx);
        }
        Sections.Result read = Sections.read(root, overrides, ctx, options.resolutionScale(), options.gridOffset());
        if (read.spec().isEmpty()) {
            return new Reading(null, ctx);
        }
        // the cross-section checks read the finished case; they run once every section was read without errors
        checks.run(read.spec().get(), read.paths(), options, ctx.diagnostics);
        return new Reading(ctx.hasErrors() ? null : read.spec().get(), ctx);
    }

    /** A text composed without errors and its tree, which the readers only read. */
    private record Composed(String text, String source, Node root) { }

    /**
     * The last text composed without errors: a sweep reads the same text once per point (its overrides apply
     * after composing, to the parameters), so the YAML is scanned once rather than once per point.
     */
    private static volatile Composed last;

    private static Node compose(String text, String source, Context ctx) {
        Composed done = last;
        if (done != null && done.source().equals(source) && done.text().equals(text)) {
            return done.root();
        }
        LoadSettings settings = LoadSettings.builder().setLabel(source).setAllowDuplicateKeys(true).setUseMarks(true)
                .setCodePointLimit(CaseText.MAX_BYTES).setMaxAliasesForCollections(YamlLimits.MAX_COLLECTION_ALIASES).build();
        try {
            // the composer recurses once per level of nesting: measure the nesting first, without recursion
            Diagnostic tooDeep = YamlLimits.check(settings, text, source);
            if (tooDeep != null) {
                ctx.diagnostics.add(tooDeep);
                return null;
            }
            Optional<Node> root = new Compose(settings).composeString(text);
            if (root.isEmpty()) {
                ctx.error(new SourcePosition(source, 1, 1), "", "the file is empty; a case needs at least polarization, domain, "
                        + "grid, sources and until");
                return null;
            }
            last = new Composed(text, source, root.get());
            return root.get();
        } catch (MarkedYamlEngineException e) {
            Mark m = e.getProblemMark().orElse(e.getContextMark().orElse(null));
            SourcePosition at = m == null ? new SourcePosition(source, 1, 1) : new SourcePosition(source, m.getLine() + 1, m.getColumn() + 1);
            String what = e.getProblem() == null ? e.getMessage() : e.getProblem();
            ctx.error(at, "", "not valid YAML: " + what + (e.getContext() == null ? "" : " (" + e.getContext() + ")"));
            return null;
        } catch (YamlEngineException e) {
            ctx.error(new SourcePosition(source, 1, 1), "", "not valid YAML: " + e.getMessage());
            return null;
        }
    }

    /** Command-line positions first, then by line and column; ties keep the order found. */
    private static List<Diagnostic> sorted(List<Diagnostic> ds) {
        List<Diagnostic> out = new ArrayList<>(ds);
        out.sort(Comparator.comparingInt((Diagnostic d) -> d.at().line()).thenComparingInt(d -> d.at().column()));
        return out;
    }
}
