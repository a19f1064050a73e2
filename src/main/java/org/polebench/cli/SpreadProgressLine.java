package org.polebench.cli;

import java.io.PrintWriter;
import org.polebench.report.PredictionText;
import org.polebench.spread.SpreadProgress;

/**
 * Shows a tolerance spread's progress on the error stream once it has run for a second, then at
 * most once a second: a short spread says nothing, a long one (a large stage, many boards) is
 * seen to move. The clock is read here, not in the library.
 */
final class SpreadProgressLine implements SpreadProgress {
    private static final long QUIET_NANOS = 1_000_000_000L;
    private final PrintWriter err;
    private final long start = System.nanoTime();
    private long lastShown;

    SpreadProgressLine(PrintWriter err) {
        this.err = err;
    }

    @Override
    public void drawn(int drawn, int planned) {
        long now = System.nanoTime();
        if (now - start < QUIET_NANOS || (lastShown != 0 && now - lastShown < QUIET_NANOS)) {
            return;
        }
        lastShown = now;
        err.println(PredictionText.spreadProgress(drawn, planned, (now - start) / 1e9));
        err.flush();
    }
}
