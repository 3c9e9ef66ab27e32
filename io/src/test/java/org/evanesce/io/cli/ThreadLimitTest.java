package org.evanesce.io.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Issue 13: a task never uses more threads than it was given: Slurm's SLURM_CPUS_PER_TASK (or
 * SLURM_CPUS_ON_NODE inside a job) and the processors Java sees cap --threads and the case's count,
 * with a note; without a count a Slurm job uses its CPUs, and outside Slurm nothing changes.
 */
class ThreadLimitTest {

    @Test
    void slurmsCpusCapTheThreads() {
        List<String> notes = new ArrayList<>();
        ThreadLimit l = ThreadLimit.of(Map.of("SLURM_JOB_ID", "7", "SLURM_CPUS_PER_TASK", "4"), 16);
        assertEquals(4, l.max());
        assertEquals(4, l.apply(8, notes::add, 16));
        assertTrue(notes.get(0).contains("8 threads asked for") && notes.get(0).contains("SLURM_CPUS_PER_TASK=4"), notes.toString());
        assertEquals(3, l.apply(3, notes::add, 16));
        assertEquals(4, l.apply(null, notes::add, 16), "without a count the job uses its CPUs, not every core");
        assertEquals(1, notes.size());
    }

    @Test
    void theCpusOnTheNodeCountInsideAJobWithoutPerTaskCpus() {
        assertEquals(2, ThreadLimit.of(Map.of("SLURM_JOB_ID", "7", "SLURM_CPUS_ON_NODE", "2(x3)"), 16).max());
        assertEquals(16, ThreadLimit.of(Map.of("SLURM_CPUS_ON_NODE", "2"), 16).max(), "outside a job it means nothing");
        assertEquals(8, ThreadLimit.of(Map.of("SLURM_JOB_ID", "7", "SLURM_CPUS_PER_TASK", "32"), 8).max(),
                "never more than the processors");
        assertEquals(8, ThreadLimit.of(Map.of("SLURM_JOB_ID", "7", "SLURM_CPUS_PER_TASK", "x"), 8).max());
    }

    @Test
    void outsideSlurmTheProcessorsCapAndTheDefaultStays() {
        List<String> notes = new ArrayList<>();
        ThreadLimit l = ThreadLimit.of(Map.of(), 2);
        assertNull(l.apply(null, notes::add, 2), "the solver's default (all processors) stays");
        assertEquals(2, l.apply(64, notes::add, 2));
        assertTrue(notes.get(0).contains("64 threads asked for") && notes.get(0).contains("2 processors"), notes.toString());
    }
}
