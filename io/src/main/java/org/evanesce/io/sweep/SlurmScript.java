package org.evanesce.io.sweep;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * A Slurm job-array script for a sweep: array task i runs shard i of N ({@code --shard i/N}, the
 * points whose number % N == i) into the same sweep folder; {@code --merge-only} afterwards gathers
 * them. Paths are absolute and every argument is quoted for the shell; paths a script cannot hold
 * are refused ({@link #problem}). {@code --threads N} goes with {@code #SBATCH --cpus-per-task=N}, and
 * a task never runs more threads than Slurm gave it (the program reads {@code SLURM_CPUS_PER_TASK}).
 */
public final class SlurmScript {

    private SlurmScript() {
    }

    /**
     * The script's text.
     *
     * @param launcher the {@code evanesce} launcher script
     * @param caseFile the case file
     * @param dir      the sweep folder
     * @param tasks    array tasks (shards)
     * @param points   points in the sweep
     * @param extra    further arguments of every task (e.g. {@code --threads 8}, {@code --set name=value})
     * @param jobName  the job's name
     */
    public static String text(Path launcher, Path caseFile, Path dir, int tasks, int points, List<String> extra, String jobName) {
        return text(launcher, caseFile, dir, tasks, points, extra, jobName, List.of());
    }

    /**
     * As {@link #text(Path, Path, Path, int, int, List, String)}, with options for the merge command alone
     * (e.g. {@code --plot-wavelength 640nm}), which the tasks do not take.
     */
    public static String text(Path launcher, Path caseFile, Path dir, int tasks, int points, List<String> extra, String jobName,
            List<String> mergeOptions) {
        String run = command(launcher, caseFile, dir, extra) + " --shard \"$SLURM_ARRAY_TASK_ID/" + tasks + "\"";
        StringBuilder sb = new StringBuilder();
        sb.append("#!/bin/bash\n");
        sb.append("# evanesce sweep of ").append(caseFile).append(": ").append(points).append(" points in ").append(tasks)
                .append(" array tasks.\n");
        sb.append("# Task i runs the points whose number % ").append(tasks).append(" == i into ").append(dir).append(";\n");
        sb.append("# finished points are kept, so a task that was stopped can be submitted again (sbatch --array=i ...).\n");
        sb.append("# Submit:  sbatch ").append(quote(dir.resolve(SweepFolder.SLURM).toString())).append('\n');
        sb.append("# Merge when every task has finished (writes sweep.csv and sweep.png, lists missing points):\n");
        sb.append("#   ").append(command(launcher, caseFile, dir, extra)).append(" --merge-only");
        for (String m : mergeOptions) {
            sb.append(' ').append(quote(m));
        }
        sb.append('\n');
        sb.append("#SBATCH --job-name=").append(jobName).append('\n');
        sb.append("#SBATCH --array=0-").append(tasks - 1).append('\n');
        sb.append("#SBATCH --output=\"").append(dir.resolve("slurm-%A_%a.out")).append("\"\n");
        threads(extra).ifPresent(t -> sb.append("#SBATCH --cpus-per-task=").append(t).append('\n'));
        sb.append("set -euo pipefail\n");
        sb.append(run).append('\n');
        return sb.toString();
    }

    /**
     * Why these paths and arguments cannot go into a batch script, or null when they can. Every
     * argument is quoted for the shell, which holds any character but NUL; but a line break or another
     * control character would end a {@code #SBATCH} line or a comment early, and the sweep folder also
     * goes into {@code #SBATCH --output="..."}, whose quotes cannot hold {@code "} or {@code \}, and
     * whose {@code %} starts one of Slurm's file-name patterns.
     */
    public static String problem(Path launcher, Path caseFile, Path dir, List<String> extra) {
        String[][] all = {{"the launcher", launcher.toString()}, {"the case file", caseFile.toString()},
            {"the sweep folder", dir.toString()}};
        for (String[] a : all) {
            String bad = control(a[1]);
            if (bad != null) {
                return a[0] + " path " + printable(a[1]) + " contains " + bad + ", which a batch script cannot hold; "
                        + "rename it or choose another";
            }
        }
        for (char c : new char[] {'"', '\\', '%'}) {
            if (dir.toString().indexOf(c) >= 0) {
                return "the sweep folder " + dir + " contains '" + c + "', which Slurm's #SBATCH --output line cannot hold; "
                        + "choose another --out";
            }
        }
        for (String a : extra) {
            String bad = control(a);
            if (bad != null) {
                return "the argument " + printable(a) + " contains " + bad + ", which a batch script cannot hold";
            }
        }
        return null;
    }

    private static String control(String s) {
        for (int k = 0; k < s.length(); k++) {
            char c = s.charAt(k);
            if (c == '\n' || c == '\r') {
                return "a line break";
            }
            if (c < 0x20 || c == 0x7f) {
                return String.format(Locale.ROOT, "the control character U+%04X", (int) c);
            }
        }
        return null;
    }

    private static String printable(String s) {
        StringBuilder sb = new StringBuilder("'");
        for (char c : s.toCharArray()) {
            sb.append(c < 0x20 || c == 0x7f ? String.format(Locale.ROOT, "\\u%04x", (int) c) : String.valueOf(c));
        }
        return sb.append('\'').toString();
    }

    /** {@code 'launcher' sweep 'case' --out 'dir' ...}, every argument quoted for the shell. */
    public static String command(Path launcher, Path caseFile, Path dir, List<String> extra) {
        List<String> parts = new ArrayList<>(List.of(quote(launcher.toString()), "sweep", quote(caseFile.toString()), "--out",
                quote(dir.toString())));
        extra.forEach(a -> parts.add(quote(a)));
        return String.join(" ", parts);
    }

    /** The arguments of every task besides the case, folder and shard: threads and overrides. */
    public static List<String> extraArguments(Integer threads, Map<String, String> set) {
        List<String> out = new ArrayList<>();
        if (threads != null) {
            out.add("--threads");
            out.add(Integer.toString(threads));
        }
        set.forEach((k, v) -> {
            out.add("--set");
            out.add(k + "=" + v);
        });
        return out;
    }

    private static java.util.Optional<String> threads(List<String> extra) {
        int k = extra.indexOf("--threads");
        return k >= 0 && k + 1 < extra.size() ? java.util.Optional.of(extra.get(k + 1)) : java.util.Optional.empty();
    }

    /** A word for the shell: as it is when plainly safe, else in single quotes. */
    public static String quote(String s) {
        if (!s.isEmpty() && s.matches("[A-Za-z0-9_@%+=:,./-]+")) {
            return s;
        }
        return "'" + s.replace("'", "'\\''") + "'";
    }

    /**
     * The {@code evanesce} launcher beside the program: the repository's script found above the
     * jar (or the classes folder) this code was loaded from, or null.
     */
    public static Path findLauncher() {
        try {
            Path at = Path.of(SlurmScript.class.getProtectionDomain().getCodeSource().getLocation().toURI()).toAbsolutePath();
            for (Path p = at; p != null; p = p.getParent()) {
                Path candidate = p.resolve("evanesce");
                if (Files.isRegularFile(candidate) && Files.isExecutable(candidate)) {
                    return candidate;
                }
            }
        } catch (java.net.URISyntaxException | SecurityException | NullPointerException e) {
            return null;
        }
        return null;
    }

    /** A job name from the case file's name: letters, digits, '-', '_' and '.'. */
    public static String jobName(Path caseFile) {
        String name = caseFile.getFileName().toString();
        int dot = name.lastIndexOf('.');
        String base = (dot > 0 ? name.substring(0, dot) : name).replaceAll("[^A-Za-z0-9_.-]", "_");
        return String.format(Locale.ROOT, "evanesce-%s", base.isEmpty() ? "sweep" : base);
    }
}
