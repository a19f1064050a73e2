package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.circuit.StageFile;
import org.polebench.synth.Fault;
import org.polebench.sweep.Sweep;
import org.polebench.synth.SweepNoise;

/**
 * The ranking shares half its single faults out to a second thread with a board model of its
 * own; the result must not depend on it. Identity: the same board reconciled on one thread and
 * on two gives the same hypotheses in the same order, probabilities within 1e-3 (each board
 * model reuses high-band factors from its own history between exact evaluations, so the MAPs
 * agree to the searches' tolerance, not to the last bit) and the same adequacy answer.
 */
class RankingThreadsTest {
    @Test
    void oneThreadAndTwoRankTheSame() throws InputProblem {
        for (String file : List.of(DemoBoards.GEOPHONE, DemoBoards.HYDROPHONE, DemoBoards.VIBRATION)) {
            DemoBoards demo = new DemoBoards(file);
            StagePrediction predicted = new StageAnalysis().withSpread(new ToleranceSpread(100, 1))
                    .analyse(new StageFile(demo.stage, List.of()));
            SplittableRandom random = new SplittableRandom(31L);
            String part = demo.model.capacitorNames().get(1);
            Fault slip = new Fault.CapacitorValue(part, demo.stage.capacitor(part).farads() / 10);
            Sweep sweep = demo.sweep(demo.boardWith(slip, random), SweepNoise.BENCH, demo.band(80), random.nextLong());
            ReconcileResult one = Reconciler.onOneThread().reconcile(predicted, sweep, DecisionRule.SIMPLE);
            ReconcileResult two = new Reconciler().reconcile(predicted, sweep, DecisionRule.SIMPLE);
            assertEquals(one.adequacy().explained(), two.adequacy().explained(), file);
            List<Hypothesis> a = one.diagnosis().hypotheses();
            List<Hypothesis> b = two.diagnosis().hypotheses();
            assertEquals(a.size(), b.size(), file);
            for (int h = 0; h < a.size(); h++) {
                if (a.get(h).probability() > 1e-3 || b.get(h).probability() > 1e-3) {
                    assertEquals(a.get(h).label(), b.get(h).label(), file + " rank " + h);
                    assertEquals(a.get(h).probability(), b.get(h).probability(), 1e-3, file + " " + a.get(h).label());
                }
            }
        }
    }
}
