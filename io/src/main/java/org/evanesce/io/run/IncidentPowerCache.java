package org.evanesce.io.run;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.function.Consumer;
import java.util.function.Function;
import java.util.zip.CRC32C;
import org.evanesce.io.output.BuildInfo;
import org.evanesce.io.output.Faults;
import org.evanesce.io.output.SafeFiles;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.io.plan.IncidentKey;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.source.ComputedIncident;

/**
 * Incident-power runs done once per distinct set-up: the result of a run (the state of its recorders, its
 * energies and wall time) is kept under its key ({@link IncidentKey} with the step count and the program's
 * build), and a later case with the same key gets that result instead of a run of its own, bit for bit the
 * same as its own run would have given (results do not depend on the thread count).
 *
 * <p>Within one process the results are kept in memory (the most recent, up to {@link #MEMORY_LIMIT} bytes).
 * With a folder ({@link #inFolder}) each result is also written there, whole and atomically
 * ({@link SafeFiles}), as {@code incident-power-KEY.bin}, so resumed and sharded sweeps find it. A file is
 * used only when it passes every check: its magic line, its byte count and CRC-32C, the full key written
 * inside it and the size of every recorder's state; any other file is left alone and replaced by the new
 * result, with a note. A file that cannot be written costs only the reuse (a note), never the run.
 *
 * <p>A case whose run stopped after another number of steps than the kept results' (a sweep whose points stop when
 * their fields have decayed) continues a kept state of the same set-up's incident-power run instead of starting at
 * step 0 ({@link Continuation}): the simulation's whole state at the largest kept step up to its own, kept in memory
 * only (up to {@link #SNAPSHOT_LIMIT} bytes). Stepping on from a saved state gives the same fields and recorders, bit
 * for bit, as stepping from the start ({@code Simulation.saveState}), so the result is still exactly the case's own.
 *
 * <p>The file: {@code evanesce incident-power cache 1\n}, the key (UTF), the step count, the measurement's
 * wall time, final and peak energy (doubles), the number of recorders, each recorder's state as written by
 * {@link FluxLine#writeState} (its length, then the bytes), and last the byte count and CRC-32C of all before.
 */
public final class IncidentPowerCache {

    /** The prefix of a cache file's name, followed by the key's first {@value #NAME_DIGITS} hex digits and {@code .bin}. */
    public static final String FILE_PREFIX = "incident-power-";
    static final int NAME_DIGITS = 32;
    /** Most bytes of results kept in memory; older ones are dropped first (the files stay). */
    static final long MEMORY_LIMIT = 256L << 20;
    /** Most bytes of kept incident-power run states ({@link Continuation}) in memory; older ones are dropped first. */
    static final long SNAPSHOT_LIMIT = 64L << 20;
    private static final byte[] MAGIC = "evanesce incident-power cache 1\n".getBytes(StandardCharsets.US_ASCII);
    /** Byte count (8) and CRC-32C (8) at the end. */
    private static final int TRAILER = 16;

    /**
     * What a measured incident-power run gave besides its recorders' state.
     *
     * @param wallSeconds wall time of the run, s
     * @param finalEnergy energy inside the PMLs at its end, J/m
     * @param peakEnergy  the largest energy measured, J/m
     */
    public record Measured(double wallSeconds, double finalEnergy, double peakEnergy) { }

    /**
     * How a case got its incident power.
     *
     * @param reused     whether it was taken from an earlier run of the same key
     * @param key        the key, 64 hex digits
     * @param origin     in words: measured by this run, or where the reused result came from
     * @param measured   the measurement the numbers come from (this run's or the earlier one's)
     * @param strip      whether that measurement stepped a strip of a few columns for a Bloch-periodic plane wave
     *                   (else the full grid)
     * @param computed   whether it was computed (from a pulsed beam's sheets or a plane wave's sheet), no grid stepped
     * @param continuedFrom the step this run's own measurement started from (a state kept by an earlier run of the
     *                   same set-up), or −1 (from step 0, or not measured here)
     * @param computedFrom what a computed one was computed from ({@link ComputedIncident#from}), else empty
     */
    public record Obtained(boolean reused, String key, String origin, Measured measured, boolean strip, boolean computed,
                           long continuedFrom, String computedFrom) {
        /** {@code measured}, {@code computed} or {@code reused}, for run.json and summary.json. */
        public String how() {
            return reused ? "reused" : computed ? "computed" : "measured";
        }

        /** The {@code incident_power} record of run.json and summary.json (docs/outputs.md). */
        public Map<String, Object> record() {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("obtained", how());
            m.put("run", computed ? "computed" : strip ? "strip" : "full");
            m.put("by", (reused ? "the result of an earlier incident-power run with the same key (same grid, medium, "
                    + "sources, boundaries, numerics, lines, frequencies, steps and program build), bit for bit what this "
                    + "run's own would have been: " : "") + (computed && computedFrom.contains("plane wave") ? "computed, not stepped: "
                    + "the transforms the plane wave's sheet gives on each line of a grid of the incident medium with the "
                    + "same Bloch-periodic sides, open above and below (the discrete one-dimensional problem of its one "
                    + "in-plane wavenumber: the grid's own update in the frequency domain, the discrete Green's function "
                    + "along y, the lines' own sampling), what the strip's run records up to its PMLs' reflections and "
                    + "rounding" : computed ? "computed, not stepped: the transforms the "
                    + "beam's pulsed sheets give on each line of an unbounded grid of the incident medium (the grid's own "
                    + "update in the frequency domain, one Fourier series along x, the discrete Green's function along y), "
                    + "what an incident-power run of the whole grid records up to its PMLs' reflections and rounding"
                    : strip ? "the plane wave in the incident medium on a strip of "
                    + "a few columns with the same Bloch-periodic sides, PMLs, source row and steps (the discrete "
                    + "one-dimensional problem: the full width repeats it with the phase exp(i kx x)), its lines spread "
                    + "over the width" : "an incident-power run of this case's whole grid filled with the incident "
                    + "medium, for as many steps as the case's run"));
            m.put("origin", origin);
            m.put("key", key);
            m.put("measurement_wall_time_s", measured.wallSeconds());
            return m;
        }
    }

    private record Entry(Measured measured, byte[][] states, long bytes) { }

    /**
     * A state of an incident-power run kept to be continued by a later run of the same set-up.
     *
     * @param step      the step it was saved after
     * @param state     the simulation's whole state (fields, PML arrays, recorders), as {@code Simulation.saveState} wrote it
     * @param chunkPeak the largest energy measured at the multiples of the run's measuring interval up to {@code step}
     *                  (the energy at {@code step} itself only where it is such a multiple), J/m; 0 before any
     */
    public record Snapshot(long step, byte[] state, double chunkPeak) { }

    /**
     * Where one incident-power run may start, and where it leaves states for later runs of the same set-up (all runs
     * of one {@link IncidentKey#anySteps} key). Without reuse ({@link #none()}) it starts at step 0 and keeps nothing.
     */
    public static final class Continuation {
        private final IncidentPowerCache cache;
        private final String runKey;
        private long continuedFrom = -1;

        private Continuation(IncidentPowerCache cache, String runKey) {
            this.cache = cache;
            this.runKey = runKey;
        }

        /** The kept state with the most steps up to {@code steps}, or null: start at step 0. */
        public Snapshot start(long steps) {
            Snapshot s = cache == null ? null : cache.latest(runKey, steps);
            continuedFrom = s == null ? -1 : s.step();
            return s;
        }

        /** Whether states are kept at all (else {@link #keep} does nothing, and a run need not save any). */
        public boolean keeps() {
            return cache != null;
        }

        /** Keeps a state for later runs (dropping the oldest kept states beyond {@link #SNAPSHOT_LIMIT} bytes). */
        public void keep(Snapshot s) {
            if (cache != null) {
                cache.keepSnapshot(runKey, s);
            }
        }

        /** The step the run continued from, or −1 when it started at step 0. */
        public long continuedFrom() {
            return continuedFrom;
        }
    }

    private final Path folder;
    private final Consumer<String> notes;
    private final Map<String, Object> locks = new ConcurrentHashMap<>();
    private final LinkedHashMap<String, Entry> memory = new LinkedHashMap<>(16, 0.75f, true);
    private long memoryBytes;
    /** Kept states by run key and step ("KEY@STEP"), least recently used first. */
    private final LinkedHashMap<String, Snapshot> snapshots = new LinkedHashMap<>(16, 0.75f, true);
    private long snapshotBytes;

    private final boolean enabled;

    private IncidentPowerCache(boolean enabled, Path folder, Consumer<String> notes) {
        this.enabled = enabled;
        this.folder = folder;
        this.notes = notes;
    }

    /** No reuse: every case measures its own incident power. */
    public static IncidentPowerCache none() {
        return new IncidentPowerCache(false, null, s -> { });
    }

    /** Reuse within this process only. */
    public static IncidentPowerCache inMemory() {
        return new IncidentPowerCache(true, null, s -> { });
    }

    /**
     * Reuse within this process and through files in {@code folder} (a sweep's results folder, which must exist
     * when a result is stored; nothing is written anywhere else).
     *
     * @param notes receives one line per damaged file set aside or file that could not be written
     */
    public static IncidentPowerCache inFolder(Path folder, Consumer<String> notes) {
        return new IncidentPowerCache(true, folder.toAbsolutePath().normalize(), notes);
    }

    /** The file a key's result is kept in ({@code folder/incident-power-KEY32.bin}). */
    public Path file(String key) {
        return folder == null ? null : folder.resolve(FILE_PREFIX + key.substring(0, NAME_DIGITS) + ".bin");
    }

    /** Whether a name in a sweep folder is a cache file's. */
    public static boolean isCacheFile(String name) {
        return name.matches(FILE_PREFIX + "[0-9a-f]{" + NAME_DIGITS + "}\\.bin");
    }

    /** The full key of a plan's incident-power run of {@code steps} steps by this build of the program. */
    public static String key(FluxPlan plan, long steps) {
        BuildInfo b = BuildInfo.current();
        return IncidentKey.withSteps(plan.setupKey(), steps, b.version(), b.id());
    }

    /** The key of all a plan's incident-power runs by this build, whatever their number of steps. */
    public static String runKey(FluxPlan plan) {
        BuildInfo b = BuildInfo.current();
        return IncidentKey.anySteps(plan.setupKey(), b.version(), b.id());
    }

    /**
     * The plan's incident-power run of {@code steps} steps: restored into its recorders from an earlier result of
     * the same key, or measured by {@code measure} (which steps the plan's recorders, starting where the
     * continuation says) and kept.
     */
    public Obtained obtain(FluxPlan plan, long steps, Function<Continuation, Measured> measure) {
        String key = key(plan, steps);
        if (!enabled) {
            return new Obtained(false, key, "measured by this run", measure.apply(new Continuation(null, null)),
                    plan.strip().isPresent(), plan.computed().isPresent(), -1,
                    from(plan));
        }
        synchronized (locks.computeIfAbsent(key, k -> new Object())) {
            List<FluxLine> recorders = plan.recorders();
            Entry e;
            synchronized (memory) {
                e = memory.get(key);
            }
            String origin = "measured earlier in this process";
            if (e == null && folder != null) {
                e = read(key, recorders);
                origin = "read from " + file(key);
            }
            if (e != null && fits(e, recorders)) {
                restore(e, recorders);
                remember(key, e);
                return new Obtained(true, key, origin, e.measured(), plan.strip().isPresent(), plan.computed().isPresent(), -1,
                    from(plan));
            }
            Continuation c = new Continuation(this, runKey(plan));
            Measured m = measure.apply(c);
            e = capture(m, recorders);
            remember(key, e);
            if (folder != null) {
                write(key, steps, e);
            }
            return new Obtained(false, key, c.continuedFrom() < 0 ? "measured by this run" : "measured by this run, "
                    + "continuing from step " + c.continuedFrom() + " a state kept by an earlier incident-power run of "
                    + "the same set-up in this process", m, plan.strip().isPresent(), plan.computed().isPresent(),
                    c.continuedFrom(), from(plan));
        }
    }

    /** What the plan's incident power is computed from, or empty when it is stepped. */
    private static String from(FluxPlan plan) {
        return plan.computed().map(ComputedIncident::from).orElse("");
    }

    private Snapshot latest(String runKey, long steps) {
        Snapshot best = null;
        synchronized (snapshots) {
            for (Map.Entry<String, Snapshot> en : snapshots.entrySet()) {
                Snapshot s = en.getValue();
                if (en.getKey().startsWith(runKey + "@") && s.step() <= steps && (best == null || s.step() > best.step())) {
                    best = s;
                }
            }
            if (best != null) {
                snapshots.get(runKey + "@" + best.step()); // most recently used
            }
        }
        return best;
    }

    private void keepSnapshot(String runKey, Snapshot s) {
        if (s.state().length > SNAPSHOT_LIMIT) {
            return;
        }
        String name = runKey + "@" + s.step();
        synchronized (snapshots) {
            Snapshot old = snapshots.put(name, s);
            snapshotBytes += s.state().length - (old == null ? 0 : old.state().length);
            Iterator<Map.Entry<String, Snapshot>> it = snapshots.entrySet().iterator();
            while (snapshotBytes > SNAPSHOT_LIMIT && it.hasNext()) {
                Map.Entry<String, Snapshot> o = it.next();
                if (!o.getKey().equals(name)) {
                    snapshotBytes -= o.getValue().state().length;
                    it.remove();
                }
            }
        }
    }

    private void remember(String key, Entry e) {
        synchronized (memory) {
            if (memory.put(key, e) == null) {
                memoryBytes += e.bytes();
            }
            Iterator<Map.Entry<String, Entry>> it = memory.entrySet().iterator();
            while (memoryBytes > MEMORY_LIMIT && memory.size() > 1 && it.hasNext()) {
                Map.Entry<String, Entry> old = it.next();
                if (!old.getKey().equals(key)) {
                    memoryBytes -= old.getValue().bytes();
                    it.remove();
                }
            }
        }
    }

    private static Entry capture(Measured m, List<FluxLine> recorders) {
        byte[][] states = new byte[recorders.size()][];
        long bytes = 0;
        for (int k = 0; k < states.length; k++) {
            states[k] = state(recorders.get(k));
            bytes += states[k].length;
        }
        return new Entry(m, states, bytes);
    }

    private static byte[] state(FluxLine l) {
        ByteArrayOutputStream b = new ByteArrayOutputStream();
        try (DataOutputStream out = new DataOutputStream(b)) {
            l.writeState(out);
        } catch (IOException e) {
            throw new IllegalStateException("writing to memory cannot fail", e);
        }
        return b.toByteArray();
    }

    /** Whether each state has the size the recorder's own state has (so restoring cannot stop half-way). */
    private static boolean fits(Entry e, List<FluxLine> recorders) {
        if (e.states().length != recorders.size()) {
            return false;
        }
        for (int k = 0; k < recorders.size(); k++) {
            if (e.states()[k].length != state(recorders.get(k)).length) {
                return false;
            }
        }
        return true;
    }

    private static void restore(Entry e, List<FluxLine> recorders) {
        for (int k = 0; k < recorders.size(); k++) {
            try (DataInputStream in = new DataInputStream(new ByteArrayInputStream(e.states()[k]))) {
                recorders.get(k).readState(in);
            } catch (IOException x) {
                throw new IllegalStateException("a state of the right size did not restore: " + x.getMessage(), x);
            }
        }
    }

    private void write(String key, long steps, Entry e) {
        Path f = file(key);
        try {
            if (!Files.isDirectory(folder, LinkOption.NOFOLLOW_LINKS)) {
                return; // the folder is the sweep's; it is not made here
            }
            ByteArrayOutputStream b = new ByteArrayOutputStream();
            DataOutputStream out = new DataOutputStream(b);
            out.write(MAGIC);
            out.writeUTF(key);
            out.writeLong(steps);
            out.writeDouble(e.measured().wallSeconds());
            out.writeDouble(e.measured().finalEnergy());
            out.writeDouble(e.measured().peakEnergy());
            out.writeInt(e.states().length);
            for (byte[] s : e.states()) {
                out.writeInt(s.length);
                out.write(s);
            }
            out.flush();
            byte[] body = b.toByteArray();
            CRC32C crc = new CRC32C();
            crc.update(body);
            out.writeLong(body.length);
            out.writeLong(crc.getValue());
            out.flush();
            SafeFiles.write(f, b.toByteArray());
        } catch (IOException x) {
            notes.accept("the incident-power result could not be kept for reuse (" + Faults.sentence(x)
                    + "); later points with the same set-up measure it again");
        }
    }

    /** The entry in the key's file, or null (with a note when a file is there but does not pass its checks). */
    private Entry read(String key, List<FluxLine> recorders) {
        Path f = file(key);
        byte[] all;
        try {
            if (!Files.isRegularFile(f, LinkOption.NOFOLLOW_LINKS)) {
                return null;
            }
            all = Files.readAllBytes(f);
        } catch (NoSuchFileException x) {
            return null;
        } catch (IOException x) {
            notes.accept(f + ": the incident-power result cannot be read (" + x.getMessage() + "); measuring it again");
            return null;
        }
        String why = null;
        Entry e = null;
        try {
            e = parse(all, key);
        } catch (IOException x) {
            why = x.getMessage();
        }
        if (e != null && !fits(e, recorders)) {
            why = "its recorders do not fit this case";
            e = null;
        }
        if (why != null) {
            notes.accept(f + ": not used (" + why + "); measuring the incident power again and replacing it");
        }
        return e;
    }

    private static Entry parse(byte[] all, String key) throws IOException {
        if (all.length < MAGIC.length + TRAILER || !Arrays.equals(all, 0, MAGIC.length, MAGIC, 0, MAGIC.length)) {
            throw new IOException("not an incident-power result of this program");
        }
        int bodyLength = all.length - TRAILER;
        DataInputStream tail = new DataInputStream(new ByteArrayInputStream(all, bodyLength, TRAILER));
        long count = tail.readLong();
        long sum = tail.readLong();
        CRC32C crc = new CRC32C();
        crc.update(all, 0, bodyLength);
        if (count != bodyLength || sum != crc.getValue()) {
            throw new IOException("cut short or damaged: its check sum does not match");
        }
        DataInputStream in = new DataInputStream(new ByteArrayInputStream(all, MAGIC.length, bodyLength - MAGIC.length));
        if (!in.readUTF().equals(key)) {
            throw new IOException("it holds another set-up's result");
        }
        in.readLong();
        Measured m = new Measured(in.readDouble(), in.readDouble(), in.readDouble());
        int n = in.readInt();
        if (n < 0 || n > 10_000) {
            throw new IOException("damaged: " + n + " recorders");
        }
        List<byte[]> states = new ArrayList<>();
        long bytes = 0;
        for (int k = 0; k < n; k++) {
            int len = in.readInt();
            if (len < 0 || len > in.available()) {
                throw new IOException("damaged: a recorder's state runs past the end");
            }
            byte[] s = new byte[len];
            in.readFully(s);
            states.add(s);
            bytes += len;
        }
        if (in.available() != 0) {
            throw new IOException("damaged: bytes left over");
        }
        return new Entry(m, states.toArray(new byte[0][]), bytes);
    }
}
