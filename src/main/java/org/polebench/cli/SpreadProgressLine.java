package org.polebench.cli;

import java.io.PrintWriter;
import org.polebench.report.PredictionText;
import org.polebench.spread.SpreadProgress;

/**
 * Shows a tolerance spread's progress on the error stream once it has run for a second, then at
 * most once a second: a short spread says nothing, a long one (a large stage, many boards) is
 * seen to move. Only where someone watches: with no terminal (a script, a log, a test) it says
 * nothing, so that what a command prints does not depend on the machine's speed. The clock is
 * read here, not in the library.
 */
final class SpreadProgressLine implements SpreadProgress {
    private static final long QUIET_NANOS = 1_000_000_000L;
    private final PrintWriter err;
    private final boolean watched;
    private final long start = System.nanoTime();
    private long lastShown;

    SpreadProgressLine(PrintWriter err) {
        this(err, System.console() != null);
    }

    /** @param watched whether to show anything (a terminal is attached) */
    SpreadProgressLine(PrintWriter err, boolean watched) {
        this.err = err;
        this.watched = watched;
    }

    @Override
    public void drawn(int drawn, int planned) {
        long now = System.nanoTime();
        if (!watched || now - start < QUIET_NANOS || (lastShown != 0 && now - lastShown < QUIET_NANOS)) {
            return;
        }
        lastShown = now;
        err.println(PredictionText.spreadProgress(drawn, planned, (now - start) / 1e9));
        err.flush();
    }
}
