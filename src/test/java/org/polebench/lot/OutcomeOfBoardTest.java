package org.polebench.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.Instant;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.polebench.circuit.StageReader;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.lot.BoardOutcome.PartFactor;
import org.polebench.reconcile.DecisionRule;
import org.polebench.reconcile.LimitAssessment;
import org.polebench.reconcile.LimitCheck;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.reconcile.Reconciler;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.synth.BoardSynthesizer;
import org.polebench.synth.Fault;
import org.polebench.synth.SweepNoise;

/**
 * A board's outcome from its reconcile result, on a board of known truth: the Ostrova demo stage
 * synthesized with C2 fitted as 220 nF instead of 2.2 µF (invented demo data), whose corner then
 * fails the stage's 35 Hz limit (ReconcileCommandTest).
 */
class OutcomeOfBoardTest {
    @Test
    void aDecadeSlipIsAFailNamingThePartWithItsFactorAndTheDecidedCorner() throws Exception {
        StagePrediction predicted = new StageAnalysis().withSpread(new ToleranceSpread(100, 1))
                .analyse(new StageReader().read(Path.of("sample-measurements", "geophone-two-stage.stage.yaml")));
        ReconcileResult result = new Reconciler().reconcile(predicted, new BoardSynthesizer().synthesize(
                predicted.stage(), new Fault.CapacitorValue("C2", 220e-9), SweepNoise.BENCH,
                BoardSynthesizer.logSpaced(0.5, 5000, 100), 20_261_201L), DecisionRule.SIMPLE);
        Instant at = Instant.parse("2026-12-02T10:00:00Z");
        BoardOutcome outcome = new OutcomeOfBoard().of(result, "gf2-0417", "W49", "bench-2", "A. Tester", at);
        assertEquals(Outcome.FAIL, outcome.outcome());
        assertEquals("C2", outcome.topHypothesis());
        assertEquals(at, outcome.testedAt());
        PartFactor c2 = outcome.parts().stream().filter(p -> p.part().equals("C2")).findFirst().orElseThrow();
        // the synthesizer's truth: a tenth of nominal, within issue 5's 5 %
        assertEquals(0.1, Math.exp(c2.lnFactor()), 0.005);
        assertTrue(outcome.parts().stream().anyMatch(p -> p.part().equals("Q1 bias")));
        // the corner is the one the verdict decided its limit on, with the same U
        LimitCheck corner = result.conformity().verdict().checks().stream()
                .filter(c -> c.quantity().equals(LimitAssessment.LOWER_CORNER)).findFirst().orElseThrow();
        assertEquals(Optional.of(corner.value()), outcome.lowerCornerHz());
        assertEquals(corner.expandedUncertainty(), outcome.lowerCornerUHz().orElseThrow(), 1e-12);
        assertEquals(corner.coverageFactor(), outcome.coverageFactor(), 0.0);
    }

    @Test
    void anInputProblemCarriesItsMessageAndNoFigures() {
        BoardOutcome outcome = new OutcomeOfBoard().ofInputProblem("board.csv: no sweep here", "b", "L", "", "",
                Instant.EPOCH);
        assertEquals(Outcome.INPUT_PROBLEM, outcome.outcome());
        assertEquals(Optional.of("board.csv: no sweep here"), outcome.problem());
        assertTrue(outcome.parts().isEmpty() && outcome.lowerCornerHz().isEmpty());
    }
}
