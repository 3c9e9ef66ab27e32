import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import jdk.jfr.consumer.RecordedEvent;
import jdk.jfr.consumer.RecordedFrame;
import jdk.jfr.consumer.RecordedStackTrace;
import jdk.jfr.consumer.RecordingFile;

/**
 * Sorts the CPU samples of a Java Flight Recorder file into the parts of a step: the field update,
 * the PML corrections, sources, each recorder kind, waits at the team's barriers, the rest of evanesce,
 * and code outside evanesce (start-up, the JIT's Java side, writers' libraries). Each sample goes to
 * the innermost evanesce frame of its stack that names a part (so Math.exp called by a recorder counts
 * for that recorder). Prints the shares of all samples and of the stepping samples (those whose stack
 * passes through Simulation.step), then the methods that took the most samples.
 *
 * <p>Run from the repository root: {@code java tools/StepProfile.java FILE.jfr [TOP]}; DEVELOPERS.md
 * gives the recipe that records FILE.jfr. The recorder samples running threads only: a parked thread
 * (a worker waiting for a late partner beyond its spin budget) takes no samples, so waits show as the
 * spinning part only.
 */
public final class StepProfile {

    private StepProfile() {
    }

    /** The part a frame names, or null when it names none. */
    static String part(String cls, String method) {
        if (!cls.startsWith("org.evanesce.")) {
            return null;
        }
        String simple = cls.substring(cls.lastIndexOf('.') + 1);
        int dollar = simple.indexOf('$');
        if (dollar >= 0) {
            simple = simple.substring(0, dollar);
        }
        if (cls.startsWith("org.evanesce.solver.record.")) {
            return "recorder " + simple;
        }
        if (cls.startsWith("org.evanesce.solver.parallel.")) {
            return simple.equals("BandTeam") && !method.startsWith("await") ? null : "waits (spinning at barriers)";
        }
        if (simple.endsWith("PmlRows")) {
            return "PML rows (update and y-side CPML in one pass)";
        }
        if (simple.endsWith("Strip") || method.toLowerCase().contains("pml") || method.toLowerCase().contains("psi")) {
            return "PML corrections";
        }
        if (method.equals("energy") || method.startsWith("energy")) {
            return "energy (settling, stopping rule)";
        }
        if (cls.startsWith("org.evanesce.solver.kernel.")) {
            if (method.startsWith("flush")) {
                return "flush (subnormals, divergence)";
            }
            if (method.toLowerCase().contains("source")) {
                return "sources";
            }
            return simple.endsWith("Ade") ? "dispersive currents" : "field update";
        }
        if (cls.startsWith("org.evanesce.solver.source.") || cls.equals("org.evanesce.solver.Simulation") && method.equals("step")) {
            return "sources";
        }
        if (cls.startsWith("org.evanesce.io.run.")) {
            return "run loop (io.run: " + simple + ")";
        }
        return null;
    }

    public static void main(String[] args) throws Exception {
        if (args.length < 1) {
            System.err.println("usage: java tools/StepProfile.java FILE.jfr [TOP]");
            System.exit(2);
        }
        int top = args.length > 1 ? Integer.parseInt(args[1]) : 15;
        Map<String, Integer> all = new TreeMap<>();
        Map<String, Integer> stepping = new TreeMap<>();
        Map<String, Integer> methods = new LinkedHashMap<>();
        int total = 0;
        int steps = 0;
        List<RecordedEvent> events;
        try {
            events = RecordingFile.readAllEvents(Path.of(args[0]));
        } catch (java.io.IOException e) {
            System.err.println("StepProfile: cannot read the flight recording " + args[0] + ": " + e.getMessage());
            System.exit(2);
            return;
        }
        for (RecordedEvent e : events) {
            if (!e.getEventType().getName().equals("jdk.ExecutionSample")) {
                continue;
            }
            RecordedStackTrace st = e.getStackTrace();
            List<RecordedFrame> frames = st == null ? List.of() : st.getFrames();
            String p = null;
            String firstOwn = null;
            boolean inStep = false;
            for (RecordedFrame f : frames) {
                String cls = f.getMethod().getType().getName();
                String m = f.getMethod().getName();
                if (firstOwn == null && cls.startsWith("org.evanesce.")) {
                    firstOwn = cls.substring(cls.lastIndexOf('.') + 1) + "." + m;
                }
                if (p == null) {
                    p = part(cls, m);
                }
                inStep |= cls.equals("org.evanesce.solver.Simulation") && m.equals("step")
                        || cls.equals("org.evanesce.solver.parallel.BandTeam") && m.equals("workerLoop");
            }
            if (p == null) {
                p = firstOwn != null ? "other evanesce" : "outside evanesce (start-up, JIT, libraries)";
            }
            total++;
            all.merge(p, 1, Integer::sum);
            if (inStep) {
                steps++;
                stepping.merge(p, 1, Integer::sum);
            }
            String key = firstOwn != null ? firstOwn : frames.isEmpty() ? "(no stack)"
                    : frames.get(0).getMethod().getType().getName() + "." + frames.get(0).getMethod().getName();
            methods.merge(key, 1, Integer::sum);
        }
        System.out.printf("%-44s %8s %8s %10s%n", "part", "samples", "of all", "of steps");
        List<String> parts = new ArrayList<>(all.keySet());
        parts.sort((a, b) -> all.get(b) - all.get(a));
        for (String p : parts) {
            int s = stepping.getOrDefault(p, 0);
            System.out.printf("%-44s %8d %7.1f%% %9.1f%%%n", p, all.get(p), 100.0 * all.get(p) / Math.max(1, total),
                    100.0 * s / Math.max(1, steps));
        }
        System.out.printf("%-44s %8d %7.1f%% %9s%n", "(all; stepping)", total, 100.0, steps + " samples");
        System.out.println();
        System.out.println("methods (innermost evanesce frame) with the most samples:");
        List<Map.Entry<String, Integer>> ranked = new ArrayList<>(methods.entrySet());
        ranked.sort((a, b) -> b.getValue() - a.getValue());
        for (Map.Entry<String, Integer> en : ranked.subList(0, Math.min(top, ranked.size()))) {
            System.out.printf("%7d %6.1f%%  %s%n", en.getValue(), 100.0 * en.getValue() / Math.max(1, total), en.getKey());
        }
    }
}
