package org.polebench.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.lot.BoardOutcome.Outcome;

class BoardHistoryTest {
    private static RecordedTest recorded(String sweep, Outcome outcome, double lnC2, Instant at) {
        TestRecord test = LedgerSamples.test("b7", "L", sweep, outcome, lnC2, at);
        return new RecordedTest(test.outcome(), "test", test.stageSha256(), test.sweepSha256(), test.sweepFile());
    }

    @Test
    void aReworkedPartMovesByItsRatioAndTheVerdictChange() {
        Instant at = Instant.parse("2026-12-01T08:00:00Z");
        BoardHistory history = new BoardHistory("b7", List.of(
                recorded("s1", Outcome.FAIL, Math.log(0.1), at),
                recorded("s2", Outcome.PASS, Math.log(1.02), at.plusSeconds(3600))));
        List<TestChange> changes = history.changes();
        assertEquals(1, changes.size());
        TestChange change = changes.get(0);
        assertTrue(change.verdictChanged());
        assertFalse(change.stageChanged());
        // C2 from 0.1 to 1.02 of nominal: ×10.2; the difference's u is √(0.05² + 0.05²) (the
        // two tests independent, GUM 5.1.2), so z = ln(10.2)/0.0707 — closed form
        PartMove c2 = change.moved().get(0);
        assertEquals("C2", c2.part());
        assertEquals(10.2, c2.ratio(), 1e-12);
        assertEquals(Math.log(10.2) / Math.sqrt(2 * 0.05 * 0.05), c2.zScore(), 1e-9);
        // RE sat at 0 in both: no move. β was not determined (NaN): not compared at all
        assertEquals(List.of("C2", "RE"), change.parts().stream().map(PartMove::part).toList());
        assertEquals(List.of("C2"), change.moved().stream().map(PartMove::part).toList());
    }

    @Test
    void aMoveWithinTheUncertaintiesIsNoMove() {
        Instant at = Instant.parse("2026-12-01T08:00:00Z");
        // 0.1 in ln against u of the difference 0.0707: 1.41 u, under the 2 u of a move
        TestChange change = BoardHistory.between(recorded("s1", Outcome.PASS, 0.0, at),
                recorded("s2", Outcome.PASS, 0.1, at.plusSeconds(60)));
        assertFalse(change.verdictChanged());
        assertTrue(change.moved().isEmpty());
    }
}
