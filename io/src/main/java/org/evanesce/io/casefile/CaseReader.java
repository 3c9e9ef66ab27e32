package org.evanesce.io.casefile;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
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
 * <p>The schema is described in {@code docs/case-file.md}.
 */
public final class CaseReader {

    private CaseReader() {
    }

    /** Reads {@code file} with the JVM's heap as the memory limit. */
    public static LoadedCase read(Path file, Map<String, String> overrides) throws IOException, CaseFileException {
        return read(file, overrides, ReadOptions.defaults());
    }

    /**
     * Reads {@code file}; messages name it as given.
     *
     * @param overrides parameter name → expression text, e.g. {@code gap → "0.3 um"}; each must name a
     *                  parameter the file defines
     * @throws IOException        when the file cannot be read
     * @throws CaseFileException  when the case has errors (all of them are in the exception)
     */
    public static LoadedCase read(Path file, Map<String, String> overrides, ReadOptions options)
            throws IOException, CaseFileException {
        return parse(CaseText.read(file).text(), file.toString(), overrides, options);
    }

    /**
     * Reads a case from text.
     *
     * @param source the name messages give the text, normally its file name
     */
    public static LoadedCase parse(String text, String source, Map<String, String> overrides, ReadOptions options)
            throws CaseFileException {
        Reading r = reading(text, source, overrides, options);
        List<Diagnostic> all = sorted(r.context.diagnostics);
        if (r.spec == null) {
            throw new CaseFileException(all);
        }
        return new LoadedCase(r.spec, all);
    }

    /** What one reading produced: the spec (null when there are errors) and its context. */
    record Reading(CaseSpec spec, Context context) { }

    /** The whole reading with its context, for tests that look at which keys were read. */
    static Reading reading(String text, String source, Map<String, String> overrides, ReadOptions options) {
        Context ctx = new Context(source);
        ctx.parameters = new ParameterTable(ctx);
        Node root = compose(text, source, ctx);
        if (root == null) {
            return new Reading(null, ctx);
        }
        CaseParser parser = new CaseParser(ctx);
        parser.resolutionScale = options.resolutionScale();
        parser.gridOffset = options.gridOffset();
        parser.parse(root, overrides);
        new CaseChecks(ctx, parser, options).run();
        if (ctx.hasErrors()) {
            return new Reading(null, ctx);
        }
        return new Reading(assemble(ctx, parser), ctx);
    }

    private static Node compose(String text, String source, Context ctx) {
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

    private static CaseSpec assemble(Context ctx, CaseParser p) {
        List<String> missing = new ArrayList<>();
        check(missing, p.polarization, "polarization");
        check(missing, p.designWavelength, "design_wavelength");
        check(missing, p.domain, "domain");
        check(missing, p.resolution, "grid");
        check(missing, p.output, "output");
        check(missing, p.stop, "until");
        check(missing, p.numerics, "numerics");
        if (p.boundaries.size() != 4) {
            missing.add("boundaries");
        }
        if (!missing.isEmpty()) {
            // every path to a null part reports an error first; reaching here is a reader bug
            throw new IllegalStateException("case parts left unresolved without an error: " + missing);
        }
        return new CaseSpec(ctx.source, Optional.ofNullable(p.title), ctx.parameters.resolved(),
                new Located<>(p.polarization, p.polarizationAt), p.designWavelength, p.domain, p.resolution, p.used, p.shapes,
                p.boundaries, p.sources, p.probes, Optional.ofNullable(p.flux), Optional.ofNullable(p.maps), p.output, p.stop,
                p.numerics, Optional.ofNullable(p.sweep), Optional.ofNullable(p.surfaces));
    }

    private static void check(List<String> missing, Object part, String name) {
        if (part == null) {
            missing.add(name);
        }
    }

    /** Command-line positions first, then by line and column; ties keep the order found. */
    private static List<Diagnostic> sorted(List<Diagnostic> ds) {
        List<Diagnostic> out = new ArrayList<>(ds);
        out.sort(Comparator.comparingInt((Diagnostic d) -> d.at().line()).thenComparingInt(d -> d.at().column()));
        return out;
    }
}
