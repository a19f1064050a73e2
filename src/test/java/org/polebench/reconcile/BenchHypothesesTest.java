package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.stream.Collectors;
import java.util.stream.IntStream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.TestFigures;
import org.polebench.circuit.StageFile;
import org.polebench.fit.Estimate;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.sweep.Sweep;
import org.polebench.synth.Fault;
import org.polebench.synth.SweepNoise;

/**
 * Issue 13's measuring-chain hypotheses on boards seen through a scope channel's AC coupling,
 * a first-order high-pass on the reading (BenchEffects.acCoupled, a closed form), with no bench
 * file: healthy boards (parts within tolerance, β spread, 0.05 dB / 0.5°) of the three demo
 * stages, the coupling at 1, 3.3 or 10 Hz. The truth is the coupling applied and the same board
 * swept without it.
 */
class BenchHypothesesTest {
    private static final List<DemoBoards> DEMOS = new ArrayList<>();
    private static final List<StagePrediction> PREDICTED = new ArrayList<>();
    private static final double[] CORNERS_HZ = {1, 3.3, 10};

    @BeforeAll
    static void stages() throws InputProblem {
        for (String file : List.of(DemoBoards.GEOPHONE, DemoBoards.HYDROPHONE, DemoBoards.VIBRATION)) {
            DemoBoards demo = new DemoBoards(file);
            DEMOS.add(demo);
            PREDICTED.add(new StageAnalysis().withSpread(new ToleranceSpread(200, 1))
                    .analyse(new StageFile(demo.stage, List.of())));
        }
    }

    private record Outcome(String line, boolean benchOnTop, boolean cornerCovered, boolean ownCornerCovered,
                           boolean confidentPart, boolean benchOnHealthyDc) {
    }

    @Test
    void anAcCoupledChannelIsFoundWithItsCornerAndTheBoardsOwnCornerIsTheUncoupledOne() {
        int boards = 36;
        List<Outcome> outcomes = IntStream.range(0, boards).parallel().mapToObj(BenchHypothesesTest::board)
                .collect(Collectors.toList());
        long onTop = outcomes.stream().filter(Outcome::benchOnTop).count();
        long covered = outcomes.stream().filter(Outcome::cornerCovered).count();
        long own = outcomes.stream().filter(Outcome::ownCornerCovered).count();
        long confident = outcomes.stream().filter(Outcome::confidentPart).count();
        long falseBench = outcomes.stream().filter(Outcome::benchOnHealthyDc).count();
        String summary = onTop + "/" + boards + " AC-coupled channel on top, " + covered
                + " with the coupling's corner within U (k = 2), " + own
                + " with the board's own corner within U of the uncoupled sweep's; " + confident
                + " a part named at p > 0.9; the same boards DC-coupled: " + falseBench + " with the bench on top\n  "
                + outcomes.stream().map(Outcome::line).collect(Collectors.joining("\n  "));
        TestFigures.keep(getClass(), "anAcCoupledChannelIsFoundWithItsCornerAndTheBoardsOwnCornerIsTheUncoupledOne",
                summary);
        // issue 13: never a part at p > 0.9 for what the bench did
        assertEquals(0, confident, summary);
        // the chain on top on at least 80 % (a 1 Hz coupling below a 20 Hz corner is faint)
        assertTrue(onTop >= 0.8 * boards, summary);
        // U at k = 2 covers about 95 % (GUM 6.3); 80 % of the boards leaves room for the
        // boards where the chain is not on top and for 36 boards' scatter
        assertTrue(covered >= 0.8 * boards, summary);
        assertTrue(own >= 0.8 * boards, summary);
        // and the chain is not blamed on a healthy board measured DC-coupled (prior 0.05)
        assertTrue(falseBench <= 0.05 * boards, summary);
    }

    private static Outcome board(int i) {
        int s = i % 3;
        double cornerHz = CORNERS_HZ[(i / 3) % 3];
        DemoBoards demo = DEMOS.get(s);
        SplittableRandom random = new SplittableRandom(13_000L + 37L * i);
        try {
            List<Fault> faults = demo.boardWith(new Fault.None(), random);
            faults.addAll(AdequacyCalibrationTest.betaSpread(demo, random));
            Sweep dc = demo.sweep(faults, SweepNoise.BENCH, demo.band(100), random.nextLong());
            Sweep ac = BenchEffects.acCoupled(dc, cornerHz);
            ReconcileResult coupled = Reconciler.onOneThread().reconcile(PREDICTED.get(s), ac, DecisionRule.SIMPLE);
            ReconcileResult alone = Reconciler.onOneThread().reconcile(PREDICTED.get(s), dc, DecisionRule.SIMPLE);
            Hypothesis top = coupled.diagnosis().top();
            boolean bench = coupled.adequacy().explained() && top.kind() == HypothesisKind.BENCH
                    && top.faults().size() == 1;
            boolean cornerCovered = false;
            boolean ownCovered = false;
            String found = top.label();
            if (bench) {
                ParameterEstimate coupling = top.faults().get(0).estimate();
                cornerCovered = Math.abs(coupling.value() - cornerHz) <= 2 * coupling.uncertainty();
                found = String.format(Locale.ROOT, "%.3f ± %.3f Hz", coupling.value(), coupling.uncertainty());
                Estimate own = coupled.sideBySide().backSolvedLowerCornerHz().orElseThrow();
                Estimate uncoupled = alone.sideBySide().measuredLowerCornerHz().orElseThrow();
                ownCovered = Math.abs(own.value() - uncoupled.value())
                        <= 2 * Math.hypot(own.standardUncertainty(), uncoupled.standardUncertainty());
                found += String.format(Locale.ROOT, "; own corner %.3f ± %.3f Hz, uncoupled %.3f ± %.3f Hz",
                        own.value(), own.standardUncertainty(), uncoupled.value(), uncoupled.standardUncertainty());
            }
            boolean confident = coupled.adequacy().explained() && top.kind() != HypothesisKind.NONE
                    && top.kind() != HypothesisKind.BENCH && top.identifiable() && top.probability() > 0.9;
            boolean falseBench = alone.diagnosis().top().kind() == HypothesisKind.BENCH;
            String line = String.format(Locale.ROOT, "%s coupled at %.1f Hz: %s p=%.3f explained=%s (%s); DC: %s",
                    demo.stage.name().split(" ")[0], cornerHz, top.label(), top.probability(),
                    coupled.adequacy().explained(), found, alone.diagnosis().top().label());
            return new Outcome(line, bench, cornerCovered, ownCovered, confident, falseBench);
        } catch (InputProblem problem) {
            throw new IllegalStateException(problem);
        }
    }
}
