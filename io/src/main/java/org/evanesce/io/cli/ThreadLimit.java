package org.evanesce.io.cli;

import java.util.Locale;
import java.util.Map;

/**
 * The most threads a command may use: the processors Java sees (which follow the process's CPU
 * affinity and container limits), and inside a Slurm job the CPUs the job was given
 * ({@code SLURM_CPUS_PER_TASK}, set with {@code --cpus-per-task}; otherwise {@code SLURM_CPUS_ON_NODE},
 * the CPUs allocated on this node). A count asked for by {@code --threads} or the case file above it
 * is lowered to it, with a note; without one, a Slurm job uses its CPUs rather than every core.
 *
 * @param max    the most threads
 * @param reason where the limit comes from, in words
 */
record ThreadLimit(int max, String reason) {

    /** This process's limit. */
    static ThreadLimit current() {
        return of(System.getenv(), Runtime.getRuntime().availableProcessors());
    }

    /** The limit for an environment and a processor count (for tests). */
    static ThreadLimit of(Map<String, String> env, int processors) {
        ThreadLimit limit = new ThreadLimit(Math.max(1, processors), processors + " processors available to this program");
        if (env.get("SLURM_JOB_ID") == null && env.get("SLURM_CPUS_PER_TASK") == null) {
            return limit;
        }
        for (String name : new String[] {"SLURM_CPUS_PER_TASK", "SLURM_CPUS_ON_NODE"}) {
            int n = positive(env.get(name));
            if (n > 0) {
                return n < limit.max ? new ThreadLimit(n, String.format(Locale.ROOT, "%s=%d: the CPUs Slurm gave this job", name, n))
                        : limit;
            }
        }
        return limit;
    }

    /**
     * The thread count to plan with.
     *
     * @param asked    {@code --threads} or the case file's, or null
     * @param note     receives a line when the count is lowered
     * @return the count, or null to keep the solver's default (all processors, within the limit)
     */
    Integer apply(Integer asked, java.util.function.Consumer<String> note, int processors) {
        if (asked != null) {
            if (asked > max) {
                note.accept(String.format(Locale.ROOT, "note: %d threads asked for, but this job may use %d (%s); using %d",
                        asked, max, reason, max));
                return max;
            }
            return asked;
        }
        return max < processors ? max : null;
    }

    private static int positive(String s) {
        if (s == null) {
            return -1;
        }
        try {
            // Slurm writes e.g. "4" or, for several nodes, "4(x2)": the count on this node comes first
            String head = s.strip().split("[^0-9]", 2)[0];
            return head.isEmpty() ? -1 : Integer.parseInt(head);
        } catch (NumberFormatException e) {
            return -1;
        }
    }
}
