package org.evanesce.solver.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The double-precision kernels are exactly what {@link DoubleKernelGenerator} makes of the
 * single-precision ones, so the two can never drift apart: CI runs this with every {@code mvn test}.
 * On a failure, edit the Float* files only and run {@code tools/regen-double-kernels.sh}.
 */
class GeneratedKernelsTest {

    /** Surefire runs in the module folder (solver/); the kernel sources lie below it. */
    private static final Path KERNELS = Path.of("src/main/java/org/evanesce/solver/kernel");

    @Test
    void everyDoubleKernelIsTheGeneratorsOutputOfItsFloatSource() throws IOException {
        assertTrue(Files.isDirectory(KERNELS), "kernel sources not found at " + KERNELS.toAbsolutePath());
        List<String> d = DoubleKernelGenerator.differences(KERNELS);
        assertEquals(List.of(), d, "edit the Float* files only, then run tools/regen-double-kernels.sh");
    }

    /** A rule the generator lacks would leave a float type, a Float name or a float literal behind. */
    @Test
    void noSinglePrecisionIsLeftInTheGeneratedText() throws IOException {
        for (String src : DoubleKernelGenerator.SOURCES) {
            String out = DoubleKernelGenerator.generate(Files.readString(KERNELS.resolve(src + ".java")));
            assertEquals(List.of(), DoubleKernelGenerator.leftovers(out), src + " generated");
            assertTrue(out.contains(DoubleKernelGenerator.note(src)), src + " generated must say it was generated from "
                    + src + " (keep the source's \"Edit this file; ...\" sentence on one line)");
        }
    }

    /** The check must see a change on either side: a hand edit of a twin, or a source edited without regenerating. */
    @Test
    void aDriftOnEitherSideIsReported() throws IOException {
        Path dir = Files.createTempDirectory("kernels");
        try {
            for (String src : DoubleKernelGenerator.SOURCES) {
                Files.copy(KERNELS.resolve(src + ".java"), dir.resolve(src + ".java"));
                Files.copy(KERNELS.resolve(DoubleKernelGenerator.twin(src) + ".java"),
                        dir.resolve(DoubleKernelGenerator.twin(src) + ".java"));
            }
            assertEquals(List.of(), DoubleKernelGenerator.differences(dir));
            Path twin = dir.resolve("DoubleS.java");
            Files.writeString(twin, Files.readString(twin).replace("hCore(j);", "hCore(j); // edited by hand"));
            Path source = dir.resolve("FloatKernels.java");
            Files.writeString(source, Files.readString(source).replace("static final", "static  final"));
            List<String> d = DoubleKernelGenerator.differences(dir);
            assertEquals(2, d.size(), d::toString);
            assertTrue(d.get(0).startsWith("DoubleKernels.java") && d.get(1).startsWith("DoubleS.java"), d::toString);
        } finally {
            try (var files = Files.list(dir)) {
                for (Path p : files.toList()) {
                    Files.delete(p);
                }
            }
            Files.delete(dir);
        }
    }
}
