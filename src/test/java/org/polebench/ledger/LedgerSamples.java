package org.polebench.ledger;

import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.lot.BoardOutcome.PartFactor;

/** Invented tests to record, whose every value the checks know. */
final class LedgerSamples {
    static final String STAGE_TEXT = "name: invented test stage\n";
    static final String STAGE_SHA = Sha256.of(STAGE_TEXT.getBytes(StandardCharsets.UTF_8));

    private LedgerSamples() {
    }

    /** @return the sweep identity of the invented sweep {@code key} */
    static String sweepSha(String key) {
        return Sha256.of(("invented sweep " + key).getBytes(StandardCharsets.UTF_8));
    }

    /**
     * A test of {@code board} from the invented sweep {@code sweepKey}, with C2 back-solved at
     * {@code lnC2} (u 0.05) and RE at 0 (u 0.01).
     */
    static TestRecord test(String board, String lot, String sweepKey, Outcome outcome, double lnC2, Instant at) {
        BoardOutcome o = new BoardOutcome(board, lot, "station-1", "A. Tester", at, 0, outcome, Optional.of(40.0),
                Optional.of(0.12), Optional.of(12.5), Optional.of(0.4), 2.0, outcome != Outcome.FAIL,
                outcome == Outcome.FAIL ? "C2" : "no fault", 0.93,
                List.of(new PartFactor("C2", lnC2, 0.05, true), new PartFactor("RE", 0.0, 0.01, true),
                        new PartFactor("Q1 beta", Double.NaN, Double.NaN, false)),
                Optional.empty());
        return new TestRecord(o, "test", STAGE_SHA, STAGE_TEXT, sweepSha(sweepKey), sweepKey + ".csv",
                Optional.of("# polebench sweep\n"), Optional.empty(), Optional.of("{}"));
    }
}
