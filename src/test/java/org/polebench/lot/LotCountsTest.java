package org.polebench.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.polebench.lot.LotBoards.at;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.circuit.Limits;
import org.polebench.lot.BoardOutcome.Outcome;

class LotCountsTest {
    private static final PredictedBand NO_BAND = new PredictedBand(Double.NaN, Double.NaN, Double.NaN, 0.9, 0, 0, 1);

    static LotFindings findings(List<BoardOutcome> boards) {
        return LotAnalysis.of("demo-lot", boards, TestLotStage.withLimits(Limits.none()), NO_BAND, NO_BAND, 1, 0);
    }

    @Test
    void yieldCountsEachBoardOnceByItsLastTestAndGroupsByStationAndUtcDay() {
        List<BoardOutcome> boards = List.of(
                at("B1", 1, Outcome.PASS, "north", "2026-05-04T09:00:00Z", true, "no fault"),
                at("B2", 2, Outcome.FAIL, "north", "2026-05-04T09:10:00Z", false, "C2"),
                at("B3", 3, Outcome.INCOMPLETE, "south", "2026-05-04T23:59:59Z", true, "no fault"),
                at("B4", 4, Outcome.INPUT_PROBLEM, "south", "2026-05-05T00:00:01Z", false, ""),
                at("B5", 5, Outcome.PASS, "south", "2026-05-05T08:00:00Z", true, "no fault"),
                // B2 after rework: passes; its first test stays the as-built one
                at("B2", 6, Outcome.PASS, "south", "2026-05-05T09:00:00Z", true, "no fault"));
        LotFindings lot = findings(boards);

        // by hand: last tests B1 pass, B2 pass (rework), B3 incomplete, B4 input problem, B5 pass
        assertEquals(new OutcomeCounts(3, 0, 1, 1), lot.counts());
        assertEquals(5, lot.boards());
        assertEquals(0.6, lot.counts().yield(), 1e-15);
        // first tests: B1 pass, B2 fail, B3 incomplete, B4 input problem, B5 pass: 2 of 5 first time
        assertEquals(new OutcomeCounts(2, 1, 1, 1), lot.firstPass());
        // by station of the last test: north B1; south B2 (retest), B3, B4, B5
        assertEquals(List.of(new GroupCounts("north", new OutcomeCounts(1, 0, 0, 0)),
                new GroupCounts("south", new OutcomeCounts(2, 0, 1, 1))), lot.byStation());
        // by UTC date of the last test: 4 May B1, B3 (23:59:59); 5 May B2, B4, B5
        assertEquals(List.of(new GroupCounts("2026-05-04", new OutcomeCounts(1, 0, 1, 0)),
                new GroupCounts("2026-05-05", new OutcomeCounts(2, 0, 0, 1))), lot.byDay());
        assertEquals(6, lot.tests().size());
    }

    @Test
    void paretoCountsTheMostProbableHypothesisOfFailedAndUnexplainedBoards() {
        List<BoardOutcome> boards = List.of(
                at("B1", 1, Outcome.FAIL, "", "2026-05-04T09:00:00Z", false, "C3"),
                at("B2", 2, Outcome.FAIL, "", "2026-05-04T09:01:00Z", true, "C3"),
                at("B3", 3, Outcome.PASS, "", "2026-05-04T09:02:00Z", false, "RE"),
                at("B4", 4, Outcome.FAIL, "", "2026-05-04T09:03:00Z", false, "C1"),
                at("B5", 5, Outcome.FAIL, "", "2026-05-04T09:04:00Z", false, "C3"),
                at("B6", 6, Outcome.PASS, "", "2026-05-04T09:05:00Z", true, "no fault"),
                at("B7", 7, Outcome.INPUT_PROBLEM, "", "2026-05-04T09:06:00Z", false, ""),
                at("B8", 8, Outcome.INCOMPLETE, "", "2026-05-04T09:07:00Z", false, ""));
        List<Culprit> pareto = findings(boards).culprits();

        // by hand: six boards failed or unexplained (B1 B2 B3 B4 B5 B8; the input problem is not
        // a test): C3 three, then C1, RE, none named one each in Unicode order (capitals first);
        // cumulative 3/6, 4/6 …
        assertEquals(List.of(new Culprit("C3", 3, 0.5), new Culprit("C1", 1, 4 / 6.0),
                new Culprit("RE", 1, 5 / 6.0), new Culprit(LotAnalysis.NONE_NAMED, 1, 1.0)), pareto);
    }

    @Test
    void aPairIsOneCulpritWhicheverOrderItsBoardNamedIt() {
        List<BoardOutcome> boards = List.of(
                at("B1", 1, Outcome.FAIL, "", "2026-05-04T09:00:00Z", true, "C3 and C2"),
                at("B2", 2, Outcome.FAIL, "", "2026-05-04T09:01:00Z", true, "C2 and C3"),
                at("B3", 3, Outcome.FAIL, "", "2026-05-04T09:02:00Z", true, "C1"));
        // by hand: the same two parts on B1 and B2, so two boards for one cause, then C1
        assertEquals(List.of(new Culprit("C2 and C3", 2, 2 / 3.0), new Culprit("C1", 1, 1.0)),
                findings(boards).culprits());
    }

    @Test
    void anEmptyLotHasNoYieldAndNoStatistics() {
        LotFindings lot = findings(List.of());
        assertEquals(0, lot.boards());
        // 0/0: no yield to state
        assertEquals(Double.NaN, lot.counts().yield());
        assertEquals(true, lot.quantity(LotQuantity.LOWER_CORNER).distribution().isEmpty());
    }
}
