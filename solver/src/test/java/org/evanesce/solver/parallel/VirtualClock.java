package org.evanesce.solver.parallel;

import java.util.function.LongSupplier;

/**
 * A clock for band-team tests: every thread has its own time, which stands still unless the thread
 * advances it (by the virtual cost of the work it does). A band's measured working time is then
 * exactly the cost charged for it, and the caller's step time exactly its own band's cost, on any
 * machine and under any load.
 */
final class VirtualClock implements LongSupplier {

    private final ThreadLocal<long[]> time = ThreadLocal.withInitial(() -> new long[1]);

    @Override
    public long getAsLong() {
        return time.get()[0];
    }

    /** The calling thread's time, in nanoseconds. */
    long now() {
        return getAsLong();
    }

    /** Advances the calling thread's time. */
    void advance(long nanos) {
        time.get()[0] += nanos;
    }
}
