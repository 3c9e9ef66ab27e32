package org.evanesce.solver.parallel;

import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import java.util.concurrent.locks.LockSupport;
import java.util.function.LongSupplier;

/**
 * Persistent worker threads that split rows into bands and run a two-phase step on them, with
 * one barrier between the phases and one hand-over to the calling thread after the step
 * (docs/architecture.md: the same workers for the whole run, no task submission per step). The calling
 * thread is worker 0; band b covers rows [bandStart(b), bandStart(b + 1)).
 *
 * <p>Waiting threads spin for a short budget and then park ({@link SpinThenPark}), so that on a
 * busy machine they do not take the cores that late threads need.
 *
 * <p>The team measures itself in windows of about {@link #WINDOW_NANOS} of stepping (the caller's
 * clock, from the start to the end of each {@link #step}; at least {@link #MIN_WINDOW_STEPS} steps):
 * <ul>
 * <li>How many threads step: {@link TeamSize} compares the step rates of adjacent windows and runs
 *     on fewer threads (down to the caller alone) while fewer are faster, as on a machine whose
 *     cores are taken by other work; the workers left out park until they are needed again.</li>
 * <li>Where the bands lie: each band times its own work (not its waits), and at the end of a
 *     window the boundaries move halfway towards the split at which every band would take the
 *     same time. On shared machines one core is often slower than the other for seconds at a
 *     time; equal bands then leave the fast thread waiting at every barrier.</li>
 * <li>How long a waiting thread spins: half the window's mean step cycle, bounded
 *     ({@link SpinThenPark#budgetFor}).</li>
 * </ul>
 * Neither the number of threads nor the split changes results: every row is updated by the same
 * code whichever band and thread hold it.
 *
 * <p>A worker's exception is never swallowed: it is rethrown from {@link #step} on the caller.
 * Close the team to stop its threads.
 */
public final class BandTeam implements AutoCloseable {

    /** The work of one band in one phase; returns a value that is combined with {@link Math#max}. */
    @FunctionalInterface
    public interface Phase {
        double run(int j0, int j1, int phase);
    }

    /**
     * Work after both phases, once every band has finished them (a further barrier): the thread of band b
     * runs it with b and its band's rows, e.g. to share the step's recorders in proportion to the band's rows.
     * Its time counts with the band's working time, so balancing moves it with the rows.
     */
    @FunctionalInterface
    public interface After {
        void run(int band, int j0, int j1);
    }

    /**
     * Stepping time per window: 20 ms spans many steps of a large grid's band and smooths over short
     * interruptions, yet follows a slow core or a busy spell within a fraction of a second (common
     * practice for dynamic load balancing: rebalance over windows much longer than one step, damped).
     */
    public static final long WINDOW_NANOS = 20_000_000;
    /**
     * Fewest steps in a window (unless the window length is 0, or the window tries more threads):
     * on a machine busy enough that one step takes longer than a window, single steps varied by a
     * factor of ten between neighbours (1024², load average 19 on 2 cores: 14–124 ms), too much to
     * compare team sizes by. A trial of more threads ends after its first step past the window
     * length all the same: on such a machine it mostly fails, and each of its steps waits for
     * threads that are descheduled.
     */
    static final int MIN_WINDOW_STEPS = 3;

    /** Developers: {@code -Devanesce.teamTrace=true} prints every window's size, rate and efficiency to standard error. */
    private static final boolean TRACE = Boolean.getBoolean("evanesce.teamTrace");

    /** A worker's hand-over: the caller raises the ticket to start the worker's next step. */
    private static final class Gate {
        volatile long ticket;
        volatile Thread sleeper;
    }

    private final int threads;
    private final int rows;
    /** The expected work of each row: where bands start, and what the balancing moves. */
    private final RowWork rowWork;
    private final String name;
    /** Band starts for each number of stepping threads k (index k, created when first used; k + 1 entries). */
    private final int[][] startFor;
    private final Thread[] workers;
    private final Gate[] gates;
    private final SpinThenPark waiting;
    private final SpinBarrier mid;
    /** Workers that finished the current step; the last one wakes a parked caller. */
    private final AtomicInteger done = new AtomicInteger();
    private volatile Thread callerSleeping;
    private final double[] results;
    /** Nanoseconds each band spent on its phases (waits excluded) in the current window; written by its own thread. */
    private final long[] busy;
    private final LongSupplier clock;
    /** The JIT compilers' working time so far (ms), and its value at the start of the window before the current one. */
    private final LongSupplier jitMillis;
    private long jitAtPreviousWindow;
    private long jitAtWindow;

    /**
     * A window is disturbed by the JIT when its compilers worked at least this fraction of the wall time of it
     * and the window before it: on a machine with few cores they take one from the team (a run's first seconds
     * compile the kernels, on a 2-core machine about 3 s of compiler time in a 7 s run of the two-prism example),
     * and a trial of more threads then fails because of a cost that soon ends.
     */
    static final double JIT_DISTURBS = 0.1;

    /** The JVM's total compilation time so far in ms, or 0 always where the JVM does not report it. */
    static final LongSupplier JIT_MILLIS = jitMillis();

    private static LongSupplier jitMillis() {
        try {
            java.lang.management.CompilationMXBean jit = java.lang.management.ManagementFactory.getCompilationMXBean();
            if (jit != null && jit.isCompilationTimeMonitoringSupported()) {
                return jit::getTotalCompilationTime;
            }
        } catch (RuntimeException | Error e) {
            // no management support in this runtime: no disturbance is ever seen
        }
        return () -> 0;
    }
    private final long windowNanos;
    private final TeamSize size;
    private final AtomicReference<Throwable> failure = new AtomicReference<>();
    /** The current step's work, stepping threads and bands; written by the caller before it raises the gates. */
    private Phase work;
    private After after;
    private int active;
    private int[] start;
    private volatile boolean closing;
    private boolean closed;
    private long ticket;
    /** Threads forced by a test (0: the measurements decide). */
    private int forced;

    private long windowWall;
    /** The wall time of the window before the current one (ns). */
    private double previousWindowWall;
    private long windowSteps;
    private long lastStepStart = Long.MIN_VALUE;
    /**
     * The caller's time between steps in this window (ns): its own work (sources, listeners, the stopping rule),
     * which the workers wait out; {@link #balance} counts it with band 0's. {@link #each}'s time, spent on every
     * band, is left out.
     */
    private long callerOutside;
    private long lastStepEnd = Long.MIN_VALUE;
    private long eachSince;
    private long cycleSum;
    private long cycles;
    /** Steps run on fewer threads than the team has, for reports. */
    private long fewerSteps;

    /**
     * @param rows    number of rows to split
     * @param threads number of bands (≥ 1, ≤ rows); one thread per band
     * @param name    prefix of the worker threads' names
     */
    public BandTeam(int rows, int threads, String name) {
        this(RowWork.uniform(rows), threads, name, WINDOW_NANOS, System::nanoTime, true, JIT_MILLIS);
    }

    /**
     * As {@link #BandTeam(int, int, String)} with the expected work of each row: the bands start with
     * equal work rather than equal rows, and balancing moves each boundary by work.
     */
    public BandTeam(RowWork rowWork, int threads, String name) {
        this(rowWork, threads, name, WINDOW_NANOS, System::nanoTime, true, JIT_MILLIS);
    }

    /**
     * As {@link #BandTeam(int, int, String)} with the window length, the clock that times the bands
     * and steps, and whether the number of stepping threads adapts given (tests drive the clock; a
     * window of 0 balances after every step). Waits always spin by the real clock.
     */
    BandTeam(int rows, int threads, String name, long windowNanos, LongSupplier clock, boolean adaptive) {
        this(RowWork.uniform(rows), threads, name, windowNanos, clock, adaptive);
    }

    /** As the constructor above with the expected work of each row (see {@link RowWork}). */
    BandTeam(RowWork rowWork, int threads, String name, long windowNanos, LongSupplier clock, boolean adaptive) {
        this(rowWork, threads, name, windowNanos, clock, adaptive, () -> 0);
    }

    /**
     * As the constructor above, with the JIT compilers' total working time so far in milliseconds (tests give
     * their own, or none: 0 always).
     */
    BandTeam(RowWork rowWork, int threads, String name, long windowNanos, LongSupplier clock, boolean adaptive,
             LongSupplier jitMillis) {
        this.jitMillis = jitMillis;
        jitAtWindow = jitMillis.getAsLong();
        jitAtPreviousWindow = jitAtWindow;
        int rows = rowWork.rows();
        if (threads < 1 || threads > rows) {
            throw new IllegalArgumentException("threads " + threads + " must lie in [1, " + rows + "]");
        }
        this.threads = threads;
        this.rows = rows;
        this.rowWork = rowWork;
        this.name = name;
        this.clock = clock;
        this.windowNanos = windowNanos;
        size = new TeamSize(threads, adaptive);
        startFor = new int[threads + 1][];
        busy = new long[threads];
        results = new double[threads];
        waiting = new SpinThenPark(System::nanoTime);
        mid = new SpinBarrier(threads, waiting);
        gates = new Gate[threads];
        workers = new Thread[threads];
        for (int b = 1; b < threads; b++) {
            final int band = b;
            gates[b] = new Gate();
            Thread t = new Thread(() -> workerLoop(band), name + "-" + b);
            t.setDaemon(true);
            workers[b] = t;
            t.start();
        }
    }

    /** The team's size: the most threads that step. */
    public int threads() {
        return threads;
    }

    /** Threads stepping in the current window (fewer than {@link #threads()} while fewer are faster). */
    public int activeThreads() {
        return forced > 0 ? forced : size.threads();
    }

    /** Steps so far that ran on fewer threads than the team has (the machine was busy, or trials). */
    public long stepsOnFewerThreads() {
        return fewerSteps;
    }

    /** First row of band b of the current step's bands (they move during a run). */
    public int bandStart(int b) {
        return bands(activeThreads())[b];
    }

    /** Forces the number of stepping threads (a size of {@link TeamSize}'s ladder or any 1..threads); 0 lets measurements decide. Tests only. */
    void forceThreads(int k) {
        if (k < 0 || k > threads) {
            throw new IllegalArgumentException("threads " + k + " must lie in [0, " + threads + "]");
        }
        forced = k;
    }

    private int[] bands(int k) {
        int[] s = startFor[k];
        if (s == null) {
            s = new int[k + 1];
            int per = rows / k;
            for (int b = 0; b < k; b++) {
                // equal rows (the last band takes the remainder), or equal work; at least one row each
                s[b] = rowWork.isUniform() ? b * per
                        : b == 0 ? 0 : Math.max(s[b - 1] + 1, Math.min(rows - (k - b), rowWork.rowNear(rowWork.total() * b / k)));
            }
            s[k] = rows;
            startFor[k] = s;
        }
        return s;
    }

    private void workerLoop(int band) {
        Gate gate = gates[band];
        long seen = 0;
        while (true) {
            seen = awaitTicket(gate, seen);
            if (closing) {
                return;
            }
            results[band] = runPhases(band);
            if (done.incrementAndGet() == active - 1) {
                Thread c = callerSleeping;
                if (c != null) {
                    LockSupport.unpark(c);
                }
            }
        }
    }

    private long awaitTicket(Gate gate, long seen) {
        long v = gate.ticket;
        if (v != seen) {
            return v;
        }
        long t0 = waiting.start();
        int n = 0;
        while ((v = gate.ticket) == seen) {
            if (!waiting.spinOn(++n, t0)) {
                gate.sleeper = Thread.currentThread();
                while ((v = gate.ticket) == seen) {
                    LockSupport.park(this);
                }
                gate.sleeper = null;
                return v;
            }
        }
        return v;
    }

    private void awaitWorkers(int count) {
        if (done.get() == count) {
            return;
        }
        long t0 = waiting.start();
        int n = 0;
        while (done.get() != count) {
            if (!waiting.spinOn(++n, t0)) {
                callerSleeping = Thread.currentThread();
                while (done.get() != count) {
                    LockSupport.park(this);
                }
                callerSleeping = null;
                return;
            }
        }
    }

    private void open(int band) {
        Gate g = gates[band];
        g.ticket = ticket;
        Thread s = g.sleeper;
        if (s != null) {
            LockSupport.unpark(s);
        }
    }

    private double runPhases(int band) {
        Phase p = work;
        int j0 = start[band];
        int j1 = start[band + 1];
        double m0 = 0;
        double m1 = 0;
        long t0 = clock.getAsLong();
        try {
            m0 = p.run(j0, j1, 0);
        } catch (Throwable e) {
            failure.compareAndSet(null, e);
        }
        long t1 = clock.getAsLong();
        if (active > 1) {
            mid.await(band);
        }
        long t2 = clock.getAsLong();
        try {
            m1 = p.run(j0, j1, 1);
        } catch (Throwable e) {
            failure.compareAndSet(null, e);
        }
        long t3 = clock.getAsLong();
        long waited = 0;
        After a = after;
        if (a != null) {
            if (active > 1) {
                mid.await(band);
                waited = clock.getAsLong() - t3;
            }
            try {
                a.run(band, j0, j1);
            } catch (Throwable e) {
                failure.compareAndSet(null, e);
            }
        }
        busy[band] += t1 - t0 + clock.getAsLong() - t2 - waited;
        return Math.max(m0, m1);
    }

    /**
     * Moves each boundary halfway towards the split that would equalise the bands' measured times
     * (work per nanosecond of each band times its share, the work of rows as {@link RowWork} expects it), keeping every band at least a quarter of
     * an equal share (at least 1 row); a boundary one row from its target stays. Called between
     * steps, while every worker waits.
     */
    private void balance(int k) {
        int[] s = bands(k);
        int minRows = Math.max(1, rows / (4 * k));
        double total = 0;
        double[] rate = new double[k];
        for (int b = 0; b < k; b++) {
            rate[b] = rowWork.between(s[b], s[b + 1]) / Math.max(1, busy[b]);
            total += rate[b];
        }
        // every band's time equal, band 0's with the caller's time between steps (at most as long as the
        // window's steps, so one long pause, e.g. a checkpoint written, moves the bands little): T = w_0 / r_0 + O
        // = w_b / r_b with the works w summing to the whole
        double outside = Math.min(callerOutside, windowWall);
        double time = (rowWork.total() + rate[0] * outside) / total;
        double share = 0;
        for (int b = 1; b < k; b++) {
            share += rate[b - 1] * (b == 1 ? Math.max(0, time - outside) : time);
            int target = rowWork.isUniform() ? (int) Math.round(share) : rowWork.rowNear(share);
            int moved = s[b] + (target - s[b]) / 2;
            if (Math.abs(target - s[b]) == 1 && !rowWork.isUniform()
                    && slower(b, target, s, rate, outside) < 0.95 * slower(b, s[b], s, rate, outside)) {
                // one row off: the halving would stay, but a heavy row (a metal film's) is worth moving
                moved = target;
            }
            s[b] = Math.max(s[b - 1] + minRows, Math.min(rows - (k - b) * minRows, moved));
        }
    }

    /**
     * The longer predicted time of bands b − 1 and b with their boundary at row x (the other boundaries as in
     * {@code s}), from the window's rates of work and the caller's time between steps (band 0's).
     */
    private double slower(int b, int x, int[] s, double[] rate, double outside) {
        double before = rowWork.between(s[b - 1], x) / rate[b - 1] + (b == 1 ? outside : 0);
        double after = rowWork.between(x, s[b + 1]) / rate[b];
        return Math.max(before, after);
    }

    /** Runs nothing in either phase (for {@link #each}). */
    private static final Phase IDLE = (j0, j1, phase) -> 0;

    /**
     * Runs {@code task} once on every stepping band, between steps, from the band's thread with its rows (as the
     * last step split them), e.g. a sum over the grid's rows; returns when all have finished. Not a step: no
     * window, balance or team size counts it. A worker's exception is rethrown here.
     */
    public void each(After task) {
        if (closed) {
            throw new IllegalStateException("band team is closed");
        }
        int k = activeThreads();
        if (k == 1) {
            task.run(0, 0, rows);
            return;
        }
        long e0 = clock.getAsLong();
        long[] kept = busy.clone();
        work = IDLE;
        after = task;
        active = k;
        start = bands(k);
        mid.parties(k);
        done.set(0);
        ticket++;
        for (int b = 1; b < k; b++) {
            open(b);
        }
        runPhases(0);
        awaitWorkers(k - 1);
        System.arraycopy(kept, 0, busy, 0, kept.length);
        eachSince += clock.getAsLong() - e0;
        rethrow();
    }

    private void rethrow() {
        Throwable t = failure.getAndSet(null);
        if (t != null) {
            if (t instanceof RuntimeException r) {
                throw r;
            }
            if (t instanceof Error e) {
                throw e;
            }
            throw new IllegalStateException("worker failed", t);
        }
    }

    /**
     * Runs phase 0 on every band, waits for all, then phase 1 on every band, and returns once all
     * bands have finished. Returns the maximum of the values the phases returned (NaN if any was NaN).
     */
    public double step(Phase phase) {
        return step(phase, null);
    }

    /**
     * As {@link #step(Phase)}, then, when {@code then} is not null and every band has finished phase 1,
     * {@code then} on every band (from the band's thread).
     */
    public double step(Phase phase, After then) {
        if (closed) {
            throw new IllegalStateException("band team is closed");
        }
        long t0 = clock.getAsLong();
        if (lastStepStart != Long.MIN_VALUE) {
            cycleSum += t0 - lastStepStart;
            cycles++;
        }
        if (lastStepEnd != Long.MIN_VALUE) {
            callerOutside += Math.max(0, t0 - lastStepEnd - eachSince);
        }
        eachSince = 0;
        lastStepStart = t0;
        int k = activeThreads();
        work = phase;
        after = then;
        active = k;
        start = bands(k);
        if (k > 1) {
            mid.parties(k);
            done.set(0);
            ticket++;
            for (int b = 1; b < k; b++) {
                open(b);
            }
        }
        double m = runPhases(0);
        if (k > 1) {
            awaitWorkers(k - 1);
        }
        rethrow();
        for (int b = 1; b < k; b++) {
            m = Math.max(m, results[b]);
        }
        lastStepEnd = clock.getAsLong();
        windowWall += lastStepEnd - t0;
        windowSteps++;
        if (k < threads) {
            fewerSteps++;
        }
        if (windowWall >= windowNanos && (windowSteps >= MIN_WINDOW_STEPS || windowNanos == 0 || size.tryingLarger())) {
            endWindow(k);
        }
        return m;
    }

    private void endWindow(int k) {
        long sum = 0;
        for (int b = 0; b < k; b++) {
            sum += busy[b];
        }
        double wall = Math.max(1, windowWall);
        double rate = windowSteps / wall;
        double efficiency = sum / (k * wall);
        String traced = TRACE ? bandTrace(k) : "";
        if (k > 1) {
            balance(k);
            if (cycles > 0) {
                waiting.cycle(cycleSum / (double) cycles);
            }
        }
        boolean trial = size.trial();
        long jit = jitMillis.getAsLong();
        boolean disturbed = (jit - jitAtPreviousWindow) * 1e6 >= JIT_DISTURBS * (wall + previousWindowWall);
        jitAtPreviousWindow = jitAtWindow;
        jitAtWindow = jit;
        previousWindowWall = wall;
        if (forced == 0) {
            size.windowEnded(rate, efficiency, disturbed);
            if (size.tryingLarger()) {
                // The larger size's bands were last balanced on the measurements that made the team
                // leave it, often taken while threads were descheduled; a trial starts from equal bands.
                startFor[size.threads()] = null;
            }
        }
        if (TRACE) {
            System.err.printf("%s window: %d threads%s, %d steps in %.1f ms, %.1f us per step, efficiency %.2f, spin %d us,"
                    + " bands %s%s -> %d threads next%n", name, k, trial ? " (trial)" : "", windowSteps, wall * 1e-6, 1e-3 / rate,
                    efficiency, waiting.budget() / 1000, traced, disturbed ? ", JIT compiling" : "", activeThreads());
        }
        java.util.Arrays.fill(busy, 0);
        callerOutside = 0;
        windowWall = 0;
        windowSteps = 0;
        cycleSum = 0;
        cycles = 0;
    }

    /** The bands' first rows and working milliseconds in the window, for the trace. */
    private String bandTrace(int k) {
        StringBuilder sb = new StringBuilder();
        for (int b = 0; b < k; b++) {
            sb.append(b == 0 ? "" : " ").append(bands(k)[b]).append(String.format(":%.1fms", busy[b] * 1e-6));
        }
        return sb.append(String.format(", caller between steps %.1fms", callerOutside * 1e-6)).toString();
    }

    @Override
    public void close() {
        if (closed) {
            return;
        }
        closed = true;
        if (threads > 1) {
            closing = true;
            ticket++;
            for (int b = 1; b < threads; b++) {
                open(b);
            }
            for (int b = 1; b < threads; b++) {
                try {
                    workers[b].join();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    return;
                }
            }
        }
    }
}
