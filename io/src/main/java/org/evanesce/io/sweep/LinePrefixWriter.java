package org.evanesce.io.sweep;

import java.io.PrintWriter;
import java.io.Writer;
import java.util.function.Supplier;

/**
 * Passes a point's output on to the sweep's output with a prefix at the start of every line (the
 * sweep's progress: points done, time left). A progress line rewritten in place on a terminal
 * ({@code \r}, then the text, no line end) keeps the prefix too, or is dropped when several points
 * share the output. Whole lines are written to the target at once, so points running side by side
 * never mix within a line.
 */
final class LinePrefixWriter extends Writer {

    private final PrintWriter target;
    private final Supplier<String> prefix;
    private final boolean dropRewrites;
    private final StringBuilder line = new StringBuilder();
    private boolean rewriting;

    /**
     * @param dropRewrites drop lines rewritten in place (when points run side by side on a terminal)
     */
    LinePrefixWriter(PrintWriter target, Supplier<String> prefix, boolean dropRewrites) {
        this.target = target;
        this.prefix = prefix;
        this.dropRewrites = dropRewrites;
    }

    @Override
    public synchronized void write(char[] buf, int off, int len) {
        for (int k = off; k < off + len; k++) {
            char c = buf[k];
            if (c == '\r') {
                rewriting = true;
                line.setLength(0);
            } else if (c == '\n') {
                synchronized (target) {
                    if (!rewriting) {
                        target.print(prefix.get() + line + "\n");
                    } else if (!dropRewrites) {
                        target.print("\r" + prefix.get() + line + "\n");
                    }
                    target.flush();
                }
                line.setLength(0);
                rewriting = false;
            } else {
                line.append(c);
            }
        }
    }

    @Override
    public synchronized void flush() {
        if (rewriting && !dropRewrites && line.length() > 0) {
            synchronized (target) {
                target.print("\r" + prefix.get() + line);
                target.flush();
            }
        }
    }

    @Override
    public void close() {
        flush();
    }
}
