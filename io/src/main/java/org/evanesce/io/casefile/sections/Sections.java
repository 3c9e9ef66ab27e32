package org.evanesce.io.casefile.sections;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.KeyPaths;
import org.evanesce.io.casefile.text.Located;
import org.snakeyaml.engine.v2.nodes.Node;

/**
 * This package's entry point: reads every section of a composed case file into the spec records,
 * collecting problems in the {@link Context}.
 */
public final class Sections {

    private Sections() {
    }

    /**
     * What reading the sections produced.
     *
     * @param spec  the finished case; empty when any section had an error
     * @param paths the key paths of the parts read (those of the spec's lists when it is present)
     */
    public record Result(Optional<CaseSpec> spec, KeyPaths paths) { }

    /**
     * Reads the sections under {@code root}.
     *
     * @param overrides       parameter name → expression text from the command line
     * @param resolutionScale the resolution as written is multiplied by this (an accuracy study's finer levels); 1 normally
     * @param gridOffset      the grid's nodes are moved by this fraction of a cell; 0 normally
     */
    public static Result read(Node root, Map<String, String> overrides, Context ctx, double resolutionScale, double gridOffset) {
        if (ctx.parameters == null) {
            ctx.parameters = new ParameterTable(ctx);
        }
        CaseParser p = new CaseParser(ctx);
        p.resolutionScale = resolutionScale;
        p.gridOffset = gridOffset;
        p.parse(root, overrides);
        KeyPaths paths = new KeyPaths(p.shapePaths, p.sourcePaths, p.probePaths, p.boundaryPaths);
        return new Result(ctx.hasErrors() ? Optional.empty() : Optional.of(assemble(ctx, p)), paths);
    }

    private static CaseSpec assemble(Context ctx, CaseParser p) {
        List<String> missing = new ArrayList<>();
        check(missing, p.polarization, "polarization");
        check(missing, p.designWavelength, "design_wavelength");
        check(missing, p.domain, "domain");
        check(missing, p.grid, "grid");
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
                new Located<>(p.polarization, p.polarizationAt), p.designWavelength, p.domain, p.grid, p.used, p.shapes,
                p.boundaries, p.sources, p.probes, Optional.ofNullable(p.flux), Optional.ofNullable(p.maps), p.output, p.stop,
                p.numerics, Optional.ofNullable(p.sweep), p.polarizationChoice,
                Optional.ofNullable(p.surfaces));
    }

    private static void check(List<String> missing, Object part, String name) {
        if (part == null) {
            missing.add(name);
        }
    }
}
