package org.evanesce.io;

import static org.evanesce.geometry.PhysicalConstants.C0;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.sun.management.GarbageCollectionNotificationInfo;
import java.io.IOException;
import java.lang.management.GarbageCollectorMXBean;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.lang.management.MemoryUsage;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import javax.management.Notification;
import javax.management.NotificationEmitter;
import javax.management.NotificationListener;
import javax.management.openmbean.CompositeData;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Issue #6: "A ten-thousand-step run with snapshots every 100 steps of a 1000 × 1000 grid stays within a
 * memory bound that does not grow with the number of frames." Tagged {@code memory}, so it runs only with
 * {@code mvn -B -ntp -Pmemory test -pl io} (a few minutes).
 *
 * <p>The case: s polarization, vacuum, a continuous point source in the middle, 1000 × 1000 nodes of 20 nm
 * with the default PML on every side, 10000 steps, {@code field_frames} every 100 steps' time over the
 * interior (100 frames), run in-process through {@code Main.run}.
 *
 * <p>The bound (heap only; the JVM's code, metaspace and thread stacks are outside it):
 * <pre>
 *   bound = baseline + memory_bytes + FRAMES_HELD × FRAME_BYTES_PER_VALUE × components × region nodes
 * </pre>
 * with {@code baseline} the heap in use after a collection just before the run (the test JVM, JUnit,
 * loaded classes), {@code memory_bytes} the simulation's field, coefficient and PML arrays as run.json
 * reports them, plus {@link #PLAN_BYTES_PER_NODE} per node for what the plan keeps beside the solver
 * (material grid, ids), and {@link #FRAMES_HELD} frames of {@link #FRAME_BYTES_PER_VALUE} bytes per
 * component and node: the node values read from the grid and averaged (two doubles), the float32 copy for
 * the file and jhdf's buffer of it (four bytes each).
 *
 * <p>What is measured: a daemon thread samples the heap in use every {@link #SAMPLE_MILLIS} ms (this
 * includes garbage not yet collected, so its peak depends on when the collector runs), and a listener
 * records the heap in use after every collection (live data, the quantity the bound describes), each
 * with the number of frames written at that moment; the heap pools' peak usage is also read after
 * resetting the peaks at frame 10 and frame 50. Asserted: the run writes all frames; the largest heap in
 * use after a collection stays within the bound; and it does not grow with the frames: its peak over
 * frames 50–100 is at most its peak over frames 10–50 plus one frame.
 */
@Tag("memory")
class FrameMemoryStudyTest {

    /** Nodes along each side (the 1000 × 1000). */
    static final int NODES = 1000;
    /** Cell size, m: 31.65 cells per 633 nm in vacuum. */
    static final double CELL = 20e-9;
    /** Steps of the run (the ten thousand). */
    static final int STEPS = 10_000;
    /** Steps between frames (the 100). */
    static final int FRAME_STEPS = 100;
    /** The program's default Courant number c0 Δt / Δ (docs/case-file.md, numerics.courant). */
    static final double COURANT = 0.5;
    /** Heap sampling period, ms. */
    static final long SAMPLE_MILLIS = 50;
    /** Frames the bound allows in memory at once: the one being taken and the previous one's buffers. */
    static final int FRAMES_HELD = 2;
    /** Bytes per component and node of one frame: two doubles (read, averaged), float32 for the file, jhdf's copy. */
    static final int FRAME_BYTES_PER_VALUE = 8 + 8 + 4 + 4;
    /**
     * Bytes per node the plan keeps beside the solver's arrays: the material grid's ids at the three field
     * sites as 16-bit chars (6 bytes), twice for the copy its builder makes.
     */
    static final int PLAN_BYTES_PER_NODE = 12;

    @TempDir
    Path tmp;


    /** One reading: when, how many frames were on disk, heap in use. */
    private record Reading(double seconds, int frames, long used) {
    }

    /** Samples the heap and counts frames while the run goes on; records collections through notifications. */
    private static final class Monitor implements Runnable, NotificationListener {
        private final Path parent;
        private final String prefix;
        private final Set<String> heapPools;
        private final long t0 = System.nanoTime();
        final List<Reading> samples = new ArrayList<>();
        final List<Reading> afterGc = new ArrayList<>();
        final AtomicInteger frames = new AtomicInteger();
        volatile boolean stop;
        long poolPeak10to50 = -1;
        long poolPeak50to100 = -1;
        private Path framesDir;
        private int phase;

        Monitor(Path out) {
            this.parent = out.getParent();
            this.prefix = "." + out.getFileName() + ".partial-";
            this.heapPools = ManagementFactory.getMemoryPoolMXBeans().stream().filter(p -> p.getType() == MemoryType.HEAP)
                    .map(MemoryPoolMXBean::getName).collect(Collectors.toSet());
        }

        double seconds() {
            return (System.nanoTime() - t0) * 1e-9;
        }

        /** Frames written so far, in the run's folder (a temporary name until the run ends). */
        int countFrames() {
            try {
                if (framesDir == null) {
                    try (DirectoryStream<Path> s = Files.newDirectoryStream(parent, prefix + "*")) {
                        for (Path p : s) {
                            framesDir = p.resolve("frames");
                        }
                    }
                }
                if (framesDir == null || !Files.isDirectory(framesDir)) {
                    return frames.get();
                }
                try (Stream<Path> s = Files.list(framesDir)) {
                    return (int) s.filter(p -> p.getFileName().toString().startsWith("frame-")).count();
                }
            } catch (IOException e) {
                return frames.get();
            }
        }

        static long poolPeaks() {
            long sum = 0;
            for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
                if (p.getType() == MemoryType.HEAP) {
                    sum += p.getPeakUsage().getUsed();
                }
            }
            return sum;
        }

        static void resetPeaks() {
            for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
                if (p.getType() == MemoryType.HEAP) {
                    p.resetPeakUsage();
                }
            }
        }

        @Override
        public void run() {
            while (!stop) {
                int n = countFrames();
                frames.set(n);
                long used = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed();
                synchronized (this) {
                    samples.add(new Reading(seconds(), n, used));
                    if (phase == 0 && n >= 10) {
                        resetPeaks();
                        phase = 1;
                    } else if (phase == 1 && n >= 50) {
                        poolPeak10to50 = poolPeaks();
                        resetPeaks();
                        phase = 2;
                    }
                }
                try {
                    Thread.sleep(SAMPLE_MILLIS);
                } catch (InterruptedException e) {
                    return;
                }
            }
        }

        /** Called after the run: the pools' peak since frame 50. */
        synchronized void finish() {
            if (phase == 2) {
                poolPeak50to100 = poolPeaks();
            }
        }

        @Override
        public void handleNotification(Notification n, Object handback) {
            if (!GarbageCollectionNotificationInfo.GARBAGE_COLLECTION_NOTIFICATION.equals(n.getType())) {
                return;
            }
            GarbageCollectionNotificationInfo info = GarbageCollectionNotificationInfo.from((CompositeData) n.getUserData());
            long used = 0;
            for (Map.Entry<String, MemoryUsage> e : info.getGcInfo().getMemoryUsageAfterGc().entrySet()) {
                if (heapPools.contains(e.getKey())) {
                    used += e.getValue().getUsed();
                }
            }
            synchronized (this) {
                afterGc.add(new Reading(seconds(), frames.get(), used));
            }
        }

        /** The largest reading with from ≤ frames < to, or -1 if none. */
        synchronized long peak(List<Reading> list, int from, int to) {
            return list.stream().filter(r -> r.frames >= from && r.frames < to).mapToLong(Reading::used).max().orElse(-1);
        }
    }


    private static long usedAfterCollection() {
        for (int k = 0; k < 3; k++) {
            System.gc();
        }
        return ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed();
    }

    static double mib(long bytes) {
        return bytes / (1024.0 * 1024.0);
    }

    @ParameterizedTest(name = "components {0}")
    @ValueSource(strings = {"[ez]", "[ez, hx, hy]"})
    @Timeout(value = 10, unit = TimeUnit.MINUTES)
    void memoryDoesNotGrowWithTheFrames(String components) throws Exception {
        int count = components.split(",").length;
        double dt = COURANT * CELL / C0;
        String text = String.format(Locale.ROOT, """
                title: frame memory study, %d x %d nodes, %d steps, a frame every %d steps
                design_wavelength: 633 nm
                polarization: s
                domain: {width: %.6f um, height: %.6f um, background: vacuum}
                grid: {cell: 20 nm}
                boundaries: {all: pml}
                sources:
                  - point: {at: [0, 0], signal: {ramped_wave: {wavelength: 633 nm}}}
                output:
                  write: [field_frames]
                  frame_interval: %.12g fs
                  components: %s
                until: {steps: %d}
                """, NODES, NODES, STEPS, FRAME_STEPS, (NODES - 1) * CELL * 1e6, (NODES - 1) * CELL * 1e6,
                FRAME_STEPS * dt * 1e15, components, STEPS);
        Path file = tmp.resolve("memory.yaml");
        Files.writeString(file, text);
        Path out = tmp.resolve("memory-out");

        long baseline = usedAfterCollection();
        Monitor monitor = new Monitor(out);
        List<NotificationEmitter> emitters = new ArrayList<>();
        for (GarbageCollectorMXBean gc : ManagementFactory.getGarbageCollectorMXBeans()) {
            if (gc instanceof NotificationEmitter e) {
                e.addNotificationListener(monitor, null, null);
                emitters.add(e);
            }
        }
        Thread sampler = new Thread(monitor, "heap-sampler");
        sampler.setDaemon(true);
        long t0 = System.nanoTime();
        sampler.start();
        Cli.Outcome o;
        try {
            o = Cli.run("run", file.toString(), "--out", out.toString());
        } finally {
            monitor.stop = true;
            sampler.join(10_000);
            monitor.finish();
            for (NotificationEmitter e : emitters) {
                e.removeNotificationListener(monitor);
            }
        }
        double wall = (System.nanoTime() - t0) * 1e-9;
        Cli.Outcome done = o;
        assertEquals(0, o.code(), () -> "memory study run: " + done);

        Map<String, Object> record = FieldOutputRunTest.json(out.resolve("run.json"));
        Map<String, Object> grid = FieldOutputRunTest.section(record, "grid");
        Map<String, Object> runSection = FieldOutputRunTest.section(record, "run");
        assertEquals(NODES, (int) FieldOutputRunTest.number(grid, "nx"), "nodes along x");
        assertEquals(NODES, (int) FieldOutputRunTest.number(grid, "ny"), "nodes along y");
        assertEquals(dt, FieldOutputRunTest.number(grid, "time_step_s"), dt * 1e-12, "time step");
        long memoryBytes = (long) FieldOutputRunTest.number(runSection, "memory_bytes");
        long written;
        try (Stream<Path> s = Files.list(out.resolve("frames"))) {
            written = s.filter(p -> p.toString().endsWith(".h5")).count();
        }
        assertEquals(STEPS / FRAME_STEPS, written, "frames written");
        long regionNodes;
        try (io.jhdf.HdfFile h = new io.jhdf.HdfFile(out.resolve("frames").resolve(String.format(Locale.ROOT,
                "frame-%09d.h5", STEPS)))) {
            int[] dims = h.getDatasetByPath("/E_z").getDimensions();
            regionNodes = (long) dims[0] * dims[1];
        }
        long frameBytes = (long) FRAME_BYTES_PER_VALUE * count * regionNodes;
        long plan = (long) PLAN_BYTES_PER_NODE * NODES * NODES;
        long bound = baseline + memoryBytes + plan + FRAMES_HELD * frameBytes;

        long liveEarly = monitor.peak(monitor.afterGc, 10, 50);
        long liveLate = monitor.peak(monitor.afterGc, 50, Integer.MAX_VALUE);
        long livePeak = monitor.peak(monitor.afterGc, 0, Integer.MAX_VALUE);
        long sampledEarly = monitor.peak(monitor.samples, 10, 50);
        long sampledLate = monitor.peak(monitor.samples, 50, Integer.MAX_VALUE);
        long sampledPeak = monitor.peak(monitor.samples, 0, Integer.MAX_VALUE);
        String figures = String.format(Locale.ROOT, "frame memory study, components %s: %d x %d nodes, %d steps, %d frames "
                + "of %d nodes written, wall %.1f s (run.json %.1f s, %.3g cell updates/s)%n"
                + "  bound %.1f MiB = baseline %.1f + memory_bytes %.1f (%d) + plan %.1f + %d frames x %.1f%n"
                + "  heap after collections (%d): peak %.1f MiB; frames 10-50 %.1f, frames 50-100 %.1f%n"
                + "  heap sampled every %d ms (%d samples, with garbage): peak %.1f MiB; frames 10-50 %.1f, frames 50-100 %.1f%n"
                + "  heap pools' peak usage: frames 10-50 %.1f MiB, frames 50-100 %.1f MiB; max heap %.1f MiB%n"
                + "  after each collection (MiB at frames written): %s",
                components, NODES, NODES, STEPS, written, regionNodes, wall, FieldOutputRunTest.number(runSection, "wall_time_s"),
                FieldOutputRunTest.number(runSection, "cell_updates_per_second"),
                mib(bound), mib(baseline), mib(memoryBytes), memoryBytes, mib(plan), FRAMES_HELD, mib(frameBytes),
                monitor.afterGc.size(), mib(livePeak), mib(liveEarly), mib(liveLate),
                SAMPLE_MILLIS, monitor.samples.size(), mib(sampledPeak), mib(sampledEarly), mib(sampledLate),
                mib(monitor.poolPeak10to50), mib(monitor.poolPeak50to100), mib(Runtime.getRuntime().maxMemory()),
                monitor.afterGc.stream().map(r -> String.format(Locale.ROOT, "%.1f@%d", mib(r.used), r.frames))
                        .collect(Collectors.joining(" ")));
        System.out.println(figures);

        assertTrue(liveEarly > 0 && liveLate > 0, "collections during frames 10-50 and 50-100 to compare\n" + figures);
        assertTrue(livePeak <= bound, "heap in use after collections within the bound\n" + figures);
        assertTrue(liveLate <= liveEarly + frameBytes, "no growth with the number of frames\n" + figures);
    }
}
