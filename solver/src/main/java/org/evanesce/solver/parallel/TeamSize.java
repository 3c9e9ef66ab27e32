package org.evanesce.solver.parallel;

/**
 * Chooses, window by window, how many of a band team's threads step. On a machine whose cores
 * are busy with other work, a team that waits at a barrier every half step loses whenever one of
 * its threads is descheduled: with two cores shared with other processes, two threads stepped
 * four to six times slower than one (issue #13). The team therefore measures its own step rate
 * and runs on fewer threads while fewer are faster.
 *
 * <p>The sizes form a ladder, largest first: T, ⌈T/2⌉, ⌈T/4⌉, …, 1. A window (about
 * {@link BandTeam#WINDOW_NANOS} of stepping) runs at one size; at its end the team reports the
 * window's step rate and efficiency (the bands' working time over threads × wall time). The
 * decisions, all between windows:
 * <ul>
 * <li>At a size with a smaller one below it, when the efficiency falls below
 *     {@link #EFFICIENCY_FLOOR} (threads wait for each other; at most every {@code downGap}
 *     windows), or anyway every {@link #MAX_GAP} windows, the next window tries the smaller size.
 *     The team moves down only when the trial was at least {@link #SMALLER_WINS} times as fast as
 *     the size in use's typical window (the faster of the window just before and the median of its
 *     recent ones); a failed trial doubles {@code downGap}.</li>
 * <li>Below the full size, every {@code upGap} windows (first {@link #FIRST_UP_GAP}) the next
 *     window tries the next larger size, and the team moves up if it was at least
 *     {@link #LARGER_RETURNS} times as fast as the median of the recent windows; a failed trial doubles
 *     {@code upGap} (up to {@link #MAX_GAP}), so a machine that stays busy costs ever fewer
 *     trials. So does a move up that is undone within {@link #HELD_LONG} windows.</li>
 * </ul>
 * The efficiency that calls for a trial and the rates a trial is compared with are medians of the last
 * {@link #HISTORY} windows at the size in use (the upper middle one of an even count): a lone slow window
 * (another process, the JIT compiler or a collection holding a core for a few milliseconds) neither
 * calls for a trial nor lets one win by chance. Compared with the one window before it, such chance
 * wins had moved a quiet two-prism example (1897 × 456 cells, 2 threads at about 0.45 ms per step,
 * one at 0.8 ms; a slow window every 30–70) to one thread for 92 % of its windows: the moves down
 * made each trial's return short-lived, and the gaps between trials grew to their longest.
 * The two thresholds differ (hysteresis) so that noise between windows does not move the team
 * back and forth. Comparing adjacent windows is the method of the measurements (rates on
 * a shared machine drift by tens of percent within minutes, so only runs taken together compare).
 * Results never depend on the size: every row is updated by the same code whichever thread has it.
 *
 * <p>Not thread-safe: the team's calling thread owns it.
 */
final class TeamSize {

    /**
     * The smaller size takes over only when its trial was at least this much faster than the window
     * before it. Single 20 ms windows on a quiet 2-core virtual machine differ by tens of percent:
     * with a smaller margin (the larger size kept only when 5 % faster) chance wins moved a quiet
     * 1024² bench to one thread for 40–90 % of its steps and halved its rate. Real contention is
     * far above the margin: one thread 3–4 times as fast as two under a competing busy process.
     */
    static final double SMALLER_WINS = 1.25;
    /**
     * The larger size returns only when its trial was at least this much faster. Between the two
     * margins (larger/smaller from 1/{@link #SMALLER_WINS} to this) the team stays where it is.
     */
    static final double LARGER_RETURNS = 1.15;
    /**
     * Below this efficiency the threads wait for each other much of the time and a smaller size is
     * tried. Balanced bands on a quiet 2-core machine measured 0.93–0.99 (1024², 2 threads); under
     * a competing busy process 0.5–0.8.
     */
    static final double EFFICIENCY_FLOOR = 0.85;
    /** Windows below the full size before the first trial of a larger size (about 0.16 s). */
    static final int FIRST_UP_GAP = 8;
    /** Longest gap between trials, in windows (about 5 s); also the gap of the unconditional trials of a smaller size. */
    static final int MAX_GAP = 256;
    /**
     * A move up that is undone within this many windows (about 1.3 s) counts as a failed trial of
     * the larger size: the gap before the next trial doubles instead of starting again at
     * {@link #FIRST_UP_GAP}. On a machine so busy that adjacent windows differ by a factor of two,
     * a trial sometimes wins by chance; this keeps such chance wins from bringing the trials back.
     */
    static final int HELD_LONG = 64;

    /** Windows at the size in use whose medians decide (see the class comment). */
    static final int HISTORY = 5;

    private final int[] sizes;
    private final boolean adaptive;
    /** Rates and efficiencies of the last windows at {@link #level} (trials not counted), oldest overwritten first. */
    private final double[] recentRates = new double[HISTORY];
    private final double[] recentEfficiencies = new double[HISTORY];
    private int recent;
    private int recentNext;
    /** Index in {@link #sizes} of the size in use, and of the size the current window runs at (a trial differs). */
    private int level;
    private int running;
    private int since;
    /** Windows at {@link #level} since the team last moved (trials not counted); the start counts as long held. */
    private int held = HELD_LONG;
    private int downGap = 1;
    private int upGap = FIRST_UP_GAP;

    /**
     * @param threads  the team's size (≥ 1)
     * @param adaptive false to keep the full size whatever is measured (tests of the bands alone)
     */
    TeamSize(int threads, boolean adaptive) {
        int n = 1;
        for (int t = threads; t > 1; t = (t + 1) / 2) {
            n++;
        }
        sizes = new int[n];
        int t = threads;
        for (int k = 0; k < n; k++) {
            sizes[k] = t;
            t = (t + 1) / 2;
        }
        this.adaptive = adaptive;
    }

    /** Number of threads the next window runs on. */
    int threads() {
        return sizes[running];
    }

    /** Whether the next window is a trial of another size. */
    boolean trial() {
        return running != level;
    }

    /** Whether the next window is a trial of a larger size. */
    boolean tryingLarger() {
        return running < level;
    }

    /** The sizes of the ladder, largest first. */
    int[] sizes() {
        return sizes.clone();
    }

    /**
     * A window run at {@link #threads()} has ended.
     *
     * @param rate       its steps per unit of time (any unit, the same for every window)
     * @param efficiency its bands' working time over threads × its wall time (1 for one thread)
     */
    void windowEnded(double rate, double efficiency) {
        windowEnded(rate, efficiency, false);
    }

    /**
     * As {@link #windowEnded(double, double)}; {@code disturbed} says the JIT compilers were busy during this window
     * or the one before it (see {@link BandTeam#JIT_DISTURBS}): a trial of a larger size that fails then, or a move
     * down then, is followed by a trial of the larger size after {@link #FIRST_UP_GAP} windows, not a doubled gap.
     */
    void windowEnded(double rate, double efficiency, boolean disturbed) {
        if (!adaptive) {
            return;
        }
        if (running == level) {
            remember(rate, efficiency);
            since++;
            held++;
            boolean smaller = level + 1 < sizes.length;
            if (smaller && (since >= MAX_GAP || median(recentEfficiencies) < EFFICIENCY_FLOOR && since >= downGap)) {
                running = level + 1;
                since = 0;
            } else if (level > 0 && since >= upGap) {
                running = level - 1;
                since = 0;
            }
        } else if (running > level) {
            if (rate >= SMALLER_WINS * Math.max(lastRate(), median(recentRates))) {
                upGap = held >= HELD_LONG || disturbed ? FIRST_UP_GAP : Math.min(2 * upGap, MAX_GAP);
                move(rate, efficiency);
            } else {
                downGap = Math.min(2 * downGap, MAX_GAP);
                running = level;
            }
        } else {
            if (rate >= LARGER_RETURNS * median(recentRates)) {
                move(rate, efficiency);
            } else {
                upGap = disturbed ? FIRST_UP_GAP : Math.min(2 * upGap, MAX_GAP);
                running = level;
            }
        }
    }

    /** Makes the size of the trial just run the size in use; its window starts the new size's history. */
    private void move(double rate, double efficiency) {
        level = running;
        downGap = 1;
        held = 0;
        recent = 0;
        recentNext = 0;
        remember(rate, efficiency);
    }

    private void remember(double rate, double efficiency) {
        recentRates[recentNext] = rate;
        recentEfficiencies[recentNext] = efficiency;
        recentNext = (recentNext + 1) % HISTORY;
        recent = Math.min(recent + 1, HISTORY);
    }

    /** The rate of the last window at {@link #level} (the newest in its history). */
    private double lastRate() {
        return recentRates[(recentNext + HISTORY - 1) % HISTORY];
    }

    /** The median of the first {@link #recent} values (the upper middle one of an even count). */
    private double median(double[] values) {
        double[] v = java.util.Arrays.copyOf(values, recent);
        java.util.Arrays.sort(v);
        return v[recent / 2];
    }
}
