package org.polebench.lot;

import java.time.Instant;
import java.util.List;
import java.util.Optional;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.lot.BoardOutcome.PartFactor;

/** Board outcomes made up in code for the lot tests: invented, as a ledger would hand them over. */
final class LotBoards {
    private LotBoards() {
    }

    static BoardOutcome board(String id, long order, Outcome outcome, double cornerHz, double gainDb,
                              PartFactor... parts) {
        return new BoardOutcome(id, "demo-lot", "bench-1", "tester", Instant.parse("2026-05-04T10:00:00Z")
                .plusSeconds(60 * order), order, outcome, Optional.of(gainDb), Optional.of(0.1), Optional.of(cornerHz),
                Optional.of(0.5), 2, true, outcome == Outcome.FAIL ? "C2" : "no fault",
                0.9, List.of(parts), Optional.empty());
    }

    static BoardOutcome at(String id, long order, Outcome outcome, String station, String instant,
                           boolean explained, String top) {
        return new BoardOutcome(id, "demo-lot", station, "tester", Instant.parse(instant), order, outcome,
                outcome == Outcome.INPUT_PROBLEM ? Optional.empty() : Optional.of(20.0), Optional.of(0.1),
                outcome == Outcome.INPUT_PROBLEM ? Optional.empty() : Optional.of(30.0), Optional.of(0.5), 2,
                explained, top, 0.8, List.of(),
                outcome == Outcome.INPUT_PROBLEM ? Optional.of("bad file") : Optional.empty());
    }

    static PartFactor part(String name, double factor, double u) {
        return new PartFactor(name, Math.log(factor), u, true);
    }
}
