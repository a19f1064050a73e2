package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.polebench.ledger.BatchTally;
import org.polebench.lot.BoardOutcome.Outcome;

class BatchTextTest {
    @Test
    void theBarShowsTheCountsAndTheTimeLeftAtTheRateSoFar() {
        // 412 of 1000 done in 103 s, none from an earlier run: 0.25 s a board, so 588 boards
        // left take 147 s (arithmetic); 24 cells × 412/1000 = 9.9, so 9 filled
        BatchTally tally = new BatchTally(1000, 398, 9, 5, 0, 0, Duration.ofSeconds(103));
        assertEquals("[#########...............] 412/1000  pass 398  fail 9  incomplete 5  about 2 min 27 s left",
                new BatchText().bar(tally));
    }

    @Test
    void theSummaryGivesTheYieldAndTheBoardsRecordedBefore() {
        BatchTally tally = new BatchTally(40, 36, 2, 1, 1, 40, Duration.ofSeconds(2));
        String summary = new BatchText().summary(tally, "W49", "polebench-ledger.db");
        // 36 of 40 passed: 90.0 % (arithmetic)
        assertTrue(summary.contains("yield 90.0 % (36 of 40 passed)"), summary);
        assertTrue(summary.contains("input problem 1"), summary);
        assertTrue(summary.contains("40 boards were already in the ledger"), summary);
        assertEquals("w-07: fail (recorded before) (3/40)", new BatchText().boardLine(
                new BatchTally(40, 1, 1, 1, 0, 3, Duration.ZERO), "w-07", Outcome.FAIL, true));
    }
}
