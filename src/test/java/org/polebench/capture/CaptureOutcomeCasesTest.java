package org.polebench.capture;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.SealedCases;

/**
 * The capture command tells the ways a capture ends apart through {@link CaptureOutcome.Cases}:
 * one case per outcome, and each outcome's {@code match} calls its own (issue 12), so a new way
 * of ending is reported as itself or fails to compile, never as another.
 */
class CaptureOutcomeCasesTest {

    @SuppressWarnings("unchecked")
    @Test
    void everyOutcomeHasItsOwnCase() {
        Path sweep = Path.of("board.sweep.csv");
        Path transcript = Path.of("board.transcript.log");
        List<CaptureOutcome> outcomes = List.of(
                new CaptureOutcome.Completed(sweep, transcript, 61, 0, List.of()),
                new CaptureOutcome.Stopped(CaptureOutcome.StopReason.PORT_LOST, "the port vanished", sweep, transcript,
                        12, 61, List.of()));
        SealedCases.assertEveryTypeHasItsOwnCase(CaptureOutcome.class, CaptureOutcome.Cases.class, outcomes,
                (outcome, cases) -> outcome.match((CaptureOutcome.Cases<Object>) cases));
    }
}
