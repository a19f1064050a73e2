package org.polebench.report;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import org.polebench.ledger.BoardHistory;
import org.polebench.ledger.PartMove;
import org.polebench.ledger.RecordedTest;
import org.polebench.ledger.TestChange;
import org.polebench.lot.BoardOutcome;
import org.polebench.units.MeasuredValueFormat;

/**
 * {@code polebench history}: a board's tests in time order, and between each two what changed —
 * the verdict, and the parts whose back-solved value moved beyond the two tests' uncertainties.
 */
public final class HistoryText {
    /** The most moved parts named per change; the JSON has them all. */
    static final int PARTS_SHOWN = 5;

    public void write(BoardHistory history, PrintWriter out) {
        List<RecordedTest> tests = history.tests();
        out.println("Board " + history.boardId() + ": " + tests.size() + (tests.size() == 1 ? " test" : " tests"));
        List<TestChange> changes = history.changes();
        for (int i = 0; i < tests.size(); i++) {
            if (i > 0) {
                change(changes.get(i - 1), out);
            }
            test(i + 1, tests.get(i), out);
        }
    }

    private static void test(int number, RecordedTest test, PrintWriter out) {
        BoardOutcome o = test.outcome();
        StringBuilder line = new StringBuilder();
        line.append(number).append(". ").append(o.testedAt()).append("  ").append(o.outcome().word());
        line.append("  lot ").append(o.lot());
        if (!o.station().isEmpty()) {
            line.append(", station ").append(o.station());
        }
        if (!o.operator().isEmpty()) {
            line.append(", operator ").append(o.operator());
        }
        out.println(line);
        out.println("   sweep " + test.sweepFile() + " (sha256 " + test.sweepSha256().substring(0, 12) + "…), "
                + "polebench " + test.toolVersion());
        if (o.problem().isPresent()) {
            out.println("   input problem: " + o.problem().get().replace("\n", "\n   "));
            return;
        }
        if (o.lowerCornerHz().isPresent()) {
            out.println("   lower corner " + MeasuredValueFormat.expanded(o.lowerCornerHz().get(),
                    o.lowerCornerUHz().orElse(0.0), o.coverageFactor(), "Hz"));
        }
        if (o.midbandGainDb().isPresent()) {
            out.println("   midband gain " + MeasuredValueFormat.expanded(o.midbandGainDb().get(),
                    o.midbandGainUDb().orElse(0.0), o.coverageFactor(), "dB"));
        }
        out.println(String.format(Locale.ROOT, "   most probable: %s (%.0f %%)%s", o.topHypothesis(),
                100 * o.topProbability(), o.explained() ? "" : "; the stage does not explain the sweep"));
    }

    private static void change(TestChange change, PrintWriter out) {
        BoardOutcome before = change.before().outcome();
        BoardOutcome after = change.after().outcome();
        out.println("   then:");
        out.println("   verdict " + (change.verdictChanged()
                ? before.outcome().word() + " → " + after.outcome().word()
                : "unchanged (" + after.outcome().word() + ")"));
        if (change.stageChanged()) {
            out.println("   the stage file changed between these tests");
        }
        List<PartMove> moved = change.moved();
        if (moved.isEmpty()) {
            out.println(change.parts().isEmpty() ? "   no back-solved parts to compare"
                    : "   no part moved beyond the two tests' uncertainties");
        }
        for (int i = 0; i < moved.size() && i < PARTS_SHOWN; i++) {
            PartMove move = moved.get(i);
            out.println(String.format(Locale.ROOT, "   %s moved ×%s (from ×%s to ×%s of nominal, %.1f u)", move.part(),
                    MeasuredValueFormat.sixFigures(round3(move.ratio())),
                    MeasuredValueFormat.sixFigures(round3(Math.exp(move.before()))),
                    MeasuredValueFormat.sixFigures(round3(Math.exp(move.after()))), move.zScore()));
        }
        if (moved.size() > PARTS_SHOWN) {
            out.println("   and " + (moved.size() - PARTS_SHOWN) + " more (--json lists them)");
        }
    }

    /** Three significant figures: a factor is known to a few per cent at best. */
    private static double round3(double value) {
        return new java.math.BigDecimal(value).round(new java.math.MathContext(3)).doubleValue();
    }
}
