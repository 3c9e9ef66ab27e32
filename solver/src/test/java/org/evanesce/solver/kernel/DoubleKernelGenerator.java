package org.evanesce.solver.kernel;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Writes the double-precision kernel classes from the single-precision ones, so the two are the
 * same code with the type changed. The Float* files are the source; the Double* files are output,
 * committed so the build needs no generation step. {@code GeneratedKernelsTest} (run by
 * {@code mvn test}, hence by CI) fails when a committed Double* file differs from what this
 * class makes of its Float* file.
 *
 * <p>Needs only the JDK. Run from the repository root:
 * <pre>
 *   java solver/src/test/java/org/evanesce/solver/kernel/DoubleKernelGenerator.java          (rewrites Double*.java)
 *   java solver/src/test/java/org/evanesce/solver/kernel/DoubleKernelGenerator.java --check  (exit 1 on a difference)
 * </pre>
 * ({@code tools/regen-double-kernels.sh} does the first.)
 */
public final class DoubleKernelGenerator {

    /** The source classes; each X has the generated twin X with Float replaced by Double. */
    static final List<String> SOURCES = List.of("FloatKernels", "FloatStrip", "FloatEngine", "FloatS", "FloatP", "FloatAde",
            "FloatSeries", "FloatPmlRows", "FloatFlat");

    /** Where the kernel classes live, relative to the repository root. */
    static final String KERNEL_DIR = "solver/src/main/java/org/evanesce/solver/kernel";

    /**
     * The rules, applied in this order to the whole text. Single precision is written so that
     * these suffice: casts to float disappear (the double value needs none), float literals
     * become double ones, and the types, class names and words change.
     */
    private static final String[][] RULES = {
        {"\\(float\\) ", ""},
        {"1e-30f\\b", "1e-300"},
        {"\\bFloat(Vector|Kernels|Strip|Engine|S|P|Ade|Series|PmlRows|Flat)\\b", "Double$1"},
        {"<Float>", "<Double>"},
        {"\\bfloatSpecies\\b", "doubleSpecies"},
        {"\\bfloat\\b", "double"},
        {"\\b(\\d+\\.\\d+)f\\b", "$1"},
        {"\\b(\\d+)f\\b", "$1.0"},
        {"\\btoFloat\\b", "toDouble"},
        {"\\bFloat\\.BYTES\\b", "Double.BYTES"},
        {"\\bSingle-precision\\b", "Double-precision"},
        {"\\bin single precision\\b", "in double precision"},
        // last, so that no rule above touches it again: the source's note names its twin
        // (on one line in the source; GeneratedKernelsTest checks that every twin carries the result)
        {"Edit this file; \\{@link Double(\\w+)\\} is generated from it \\(tools/regen-double-kernels\\.sh\\)\\.",
            "Generated from {@link Float$1} by tools/regen-double-kernels.sh: edit that file, not this one."},
    };

    private DoubleKernelGenerator() {
    }

    /** The double-precision text of a single-precision source. */
    public static String generate(String floatSource) {
        String s = floatSource;
        for (String[] rule : RULES) {
            s = Pattern.compile(rule[0]).matcher(s).replaceAll(rule[1]);
        }
        return s;
    }

    /** The twin's class name: FloatS → DoubleS. */
    static String twin(String source) {
        return "Double" + source.substring("Float".length());
    }

    /**
     * The Double* files that differ from what the generator makes of their Float* sources, as
     * "DoubleX.java: first difference at line N" entries (empty when all agree).
     */
    public static List<String> differences(Path kernelDir) throws IOException {
        List<String> out = new ArrayList<>();
        for (String src : SOURCES) {
            String want = generate(Files.readString(kernelDir.resolve(src + ".java"), StandardCharsets.UTF_8));
            Path twin = kernelDir.resolve(twin(src) + ".java");
            String have = Files.exists(twin) ? Files.readString(twin, StandardCharsets.UTF_8) : null;
            if (have == null) {
                out.add(twin.getFileName() + ": missing");
            } else if (!have.equals(want)) {
                out.add(twin.getFileName() + ": differs from the generator's output first at line " + firstDifference(have, want));
            }
        }
        return out;
    }

    private static int firstDifference(String a, String b) {
        String[] x = a.split("\n", -1);
        String[] y = b.split("\n", -1);
        int n = Math.min(x.length, y.length);
        for (int i = 0; i < n; i++) {
            if (!x[i].equals(y[i])) {
                return i + 1;
            }
        }
        return n + 1;
    }

    /** Rewrites every Double* twin from its source. */
    public static void write(Path kernelDir) throws IOException {
        for (String src : SOURCES) {
            String text = generate(Files.readString(kernelDir.resolve(src + ".java"), StandardCharsets.UTF_8));
            Files.writeString(kernelDir.resolve(twin(src) + ".java"), text, StandardCharsets.UTF_8);
        }
    }

    /** The note every generated twin carries. */
    static String note(String source) {
        return "Generated from {@link " + source + "} by tools/regen-double-kernels.sh";
    }

    /** Words of single precision that a generated file must not contain (outside its generated-from note). */
    static final Pattern LEFTOVER = Pattern.compile("\\bfloat\\b|\\bFloat\\w*|\\d+f\\b");

    /** Leftovers of single precision in a generated text, each as "line N: text" (empty when clean). */
    static List<String> leftovers(String generated) {
        List<String> out = new ArrayList<>();
        String[] lines = generated.split("\n", -1);
        for (int i = 0; i < lines.length; i++) {
            String line = lines[i].replaceAll("Generated from \\{@link Float\\w+\\}", "");
            Matcher m = LEFTOVER.matcher(line);
            if (m.find()) {
                out.add("line " + (i + 1) + ": " + lines[i].strip());
            }
        }
        return out;
    }

    /** {@code [--check] [KERNEL_DIR]}: rewrites the Double* files, or with --check reports differences (exit 1). */
    public static void main(String[] args) throws IOException {
        boolean check = args.length > 0 && args[0].equals("--check");
        int rest = check ? 1 : 0;
        Path dir = Path.of(args.length > rest ? args[rest] : KERNEL_DIR);
        if (!Files.isDirectory(dir)) {
            System.err.println("no kernel folder at " + dir.toAbsolutePath() + "; run from the repository root or give it");
            System.exit(2);
        }
        if (check) {
            List<String> d = differences(dir);
            if (!d.isEmpty()) {
                d.forEach(System.err::println);
                System.err.println("the double kernels are not the generator's output: edit the Float* files only, then run "
                        + "tools/regen-double-kernels.sh");
                System.exit(1);
            }
            System.out.println("double kernels agree with their Float* sources");
        } else {
            write(dir);
        }
    }
}
