package org.polebench.report;

import java.time.Duration;
import java.util.Locale;
import java.util.Optional;
import org.polebench.ledger.BatchTally;
import org.polebench.lot.BoardOutcome.Outcome;

/**
 * The words of {@code polebench batch}: the progress bar a terminal redraws in place, the plain
 * line per board where the output is not a terminal (a log, a CI job), and the closing summary.
 */
public final class BatchText {
    /** Cells of the bar. */
    static final int BAR_CELLS = 24;

    /**
     * @return one line, without a line end, such as
     *         {@code [#########.......] 412/1000  pass 398  fail 9  incomplete 5  about 1 min 12 s left}
     */
    public String bar(BatchTally tally) {
        int filled = tally.boards() == 0 ? BAR_CELLS : (int) ((long) BAR_CELLS * tally.done() / tally.boards());
        return "[" + "#".repeat(filled) + ".".repeat(BAR_CELLS - filled) + "] " + tally.done() + "/" + tally.boards()
                + "  " + counts(tally) + "  " + left(tally.timeLeft(), tally.done() == tally.boards());
    }

    /** @return one plain line for one board done: {@code board-0017: fail (412/1000)} */
    public String boardLine(BatchTally tally, String boardId, Outcome outcome, boolean earlier) {
        return boardId + ": " + outcome.word() + (earlier ? " (recorded before)" : "") + " (" + tally.done() + "/"
                + tally.boards() + ")";
    }

    /**
     * @param ledger where the boards were recorded, as the user named it
     * @return the closing lines: the counts, the yield, the boards the ledger already held
     */
    public String summary(BatchTally tally, String lot, String ledger) {
        StringBuilder text = new StringBuilder();
        text.append("Lot ").append(lot).append(": ").append(tally.done()).append(tally.done() == 1 ? " board" : " boards")
                .append(" in ").append(duration(tally.elapsed())).append('\n');
        text.append("  ").append(counts(tally));
        if (tally.inputProblems() > 0) {
            text.append("  (an input problem is neither a pass nor a fail: fix the file and run the batch again)");
        }
        text.append('\n');
        Optional<Double> yield = tally.yield();
        text.append("  yield ").append(yield.isPresent()
                ? String.format(Locale.ROOT, "%.1f %% (%d of %d passed)", 100 * yield.get(), tally.passed(), tally.done())
                : "n/a (no board done)").append('\n');
        if (tally.earlier() > 0) {
            text.append("  ").append(tally.earlier()).append(tally.earlier() == 1 ? " board was" : " boards were")
                    .append(" already in the ledger and counted as recorded then\n");
        }
        text.append("  recorded in ").append(ledger).append('\n');
        return text.toString();
    }

    private static String counts(BatchTally tally) {
        return "pass " + tally.passed() + "  fail " + tally.failed() + "  incomplete " + tally.incomplete()
                + (tally.inputProblems() > 0 ? "  input problem " + tally.inputProblems() : "");
    }

    private static String left(Optional<Duration> left, boolean finished) {
        if (finished) {
            return "done";
        }
        return left.map(d -> "about " + duration(d) + " left").orElse("estimating time left");
    }

    /** @return "12 s", "3 min 04 s", "1 h 02 min" */
    static String duration(Duration duration) {
        long seconds = Math.max(0, Math.round(duration.toMillis() / 1000.0));
        if (seconds < 60) {
            return seconds + " s";
        }
        if (seconds < 3600) {
            return String.format(Locale.ROOT, "%d min %02d s", seconds / 60, seconds % 60);
        }
        return String.format(Locale.ROOT, "%d h %02d min", seconds / 3600, seconds % 3600 / 60);
    }
}
