package org.evanesce.io.plan;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.casefile.CaseReader;
import org.evanesce.io.casefile.LoadedCase;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.text.KeyPaths;
import org.evanesce.io.plan.checks.CaseChecks;
import org.evanesce.io.plan.grid.GridDerivation;
import org.evanesce.io.plan.grid.GridPlan;

/**
 * Where every command reads a case: the case file's sections ({@link CaseReader}), then what this layer owns:
 * the grid derived from the case's request ({@link GridDerivation}) and the checks across sections, which read
 * it. Problems from both come together, in file order, with exit code 2.
 */
public final class CaseLoader {

    private CaseLoader() {
    }

    /** Reads {@code file} with the JVM's heap as the memory limit. */
    public static LoadedCase read(Path file, Map<String, String> overrides) throws IOException, CaseFileException {
        return read(file, overrides, ReadOptions.defaults());
    }

    /** As {@link CaseReader#read}, with this layer's checks. */
    public static LoadedCase read(Path file, Map<String, String> overrides, ReadOptions options)
            throws IOException, CaseFileException {
        return CaseReader.read(file, overrides, options, CaseLoader::check);
    }

    /** As {@link CaseReader#parse}, with this layer's checks. */
    public static LoadedCase parse(String text, String source, Map<String, String> overrides, ReadOptions options)
            throws CaseFileException {
        return CaseReader.parse(text, source, overrides, options, CaseLoader::check);
    }

    /** As {@link CaseReader#reading}, with this layer's checks: for tests that look at which keys were read. */
    public static CaseReader.Reading reading(String text, String source, Map<String, String> overrides, ReadOptions options) {
        return CaseReader.reading(text, source, overrides, options, CaseLoader::check);
    }

    private static void check(CaseSpec spec, KeyPaths paths, ReadOptions options, List<Diagnostic> out) {
        GridPlan grid = GridDerivation.derive(spec, out);
        if (grid != null) {
            CaseChecks.run(spec, paths, grid, options.memoryLimit(), out);
        }
    }
}
