package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.TestFigures;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageFile;
import org.polebench.spread.BoardDraw;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.sweep.Sweep;
import org.polebench.synth.BoardSynthesizer;
import org.polebench.synth.Fault;
import org.polebench.synth.SweepNoise;

/**
 * Boards swept far past their upper corner (0.2 Hz to 2 MHz, as the bundled lot is), so that the
 * high band's dependence on the bias current and β carries much of the gradient. Each board is
 * the demo hydrophone stage with every resistor, capacitor and β drawn within its tolerance
 * (BoardDraw, the bias solved again from the drawn parts: nothing the back-solve's own terms
 * made), half of them healthy and half with C2 from a wrong reel (4.7 µF for 10 µF), with
 * 0.05 dB / 0.5° noise. The truth is what was drawn and fitted.
 *
 * <p>Before the bias and β columns of the board model's Jacobian included the high band, the
 * search stopped far from the MAP on such sweeps: one healthy drawn board was called
 * "generator output resistance" at p = 1.000 and a wrong-reel board "C2 and RE" at 0.70
 * (RE drawn within its 1 %).
 */
class HighBandSweepsTest {
    private static final List<Double> BAND = BoardSynthesizer.logSpaced(0.2, 2e6, 81);

    private record Board(long seed, boolean wrongReel, Sweep sweep) {
    }

    private static Set<String> parts(Hypothesis hypothesis) {
        Set<String> parts = new TreeSet<>();
        for (PartReading reading : hypothesis.faults()) {
            parts.add(reading.estimate().parameter().label());
        }
        if (hypothesis.kind() == HypothesisKind.BENCH) {
            parts.add(hypothesis.label());
        }
        return parts;
    }

    @Test
    void drawnBoardsSweptIntoTheHighBandAreRightOrUnsureNeverConfidentlyWrong() throws Exception {
        DemoBoards demo = new DemoBoards(DemoBoards.HYDROPHONE);
        Stage design = demo.stage;
        StagePrediction predicted = new StageAnalysis().withSpread(new ToleranceSpread(200, 1))
                .analyse(new StageFile(design, List.of()));
        List<Board> boards = new ArrayList<>();
        for (int i = 0; i < 16; i++) {
            long seed = 5100L + i;
            boolean wrongReel = i % 2 == 1;
            Stage built = BoardDraw.draw(design, seed);
            List<Fault> faults = wrongReel ? List.of(new Fault.CapacitorValue("C2", 4.7e-6)) : List.of();
            boards.add(new Board(seed, wrongReel,
                    new BoardSynthesizer().synthesize(built, faults, SweepNoise.BENCH, BAND, true, seed)));
        }
        List<ReconcileResult> results = boards.parallelStream().map(board -> {
            try {
                return Reconciler.onOneThread().reconcile(predicted, board.sweep(), DecisionRule.SIMPLE);
            } catch (InputProblem problem) {
                throw new IllegalStateException(problem);
            }
        }).collect(Collectors.toList());
        int right = 0;
        int wrong = 0;
        List<String> lines = new ArrayList<>();
        for (int i = 0; i < boards.size(); i++) {
            Board board = boards.get(i);
            ReconcileResult result = results.get(i);
            Hypothesis top = result.diagnosis().top();
            boolean isRight = board.wrongReel() ? parts(top).equals(Set.of("C2")) : top.kind() == HypothesisKind.NONE;
            boolean confident = result.adequacy().explained() && top.probability() >= 0.9;
            right += isRight ? 1 : 0;
            wrong += !isRight && confident ? 1 : 0;
            lines.add(String.format(Locale.ROOT, "seed %d %s: top %s p=%.3f explained=%s%s", board.seed(),
                    board.wrongReel() ? "C2 wrong reel" : "healthy", top.label(), top.probability(),
                    result.adequacy().explained(), !isRight && confident ? "  CONFIDENTLY WRONG" : ""));
        }
        String summary = right + "/" + boards.size() + " right, " + wrong + " confidently wrong\n  "
                + String.join("\n  ", lines);
        TestFigures.keep(getClass(), "drawnBoardsSweptIntoTheHighBandAreRightOrUnsureNeverConfidentlyWrong", summary);
        // the product's rule: never a confident wrong part (or bench element)
        assertTrue(wrong == 0, summary);
        // and mostly right: a Bayesian ranking at these priors may give a part within tolerance
        // now and then (RealBoardsTest allows 10 %); 13 of 16 leaves room for that
        assertTrue(right >= 13, summary);
    }

    @Test
    void aDecadeSlipThatBendsTheNoFaultFitIsStillFoundOrLeftUnsure() throws Exception {
        // the two-stage geophone, every part and β drawn, the interstage coupling C2 at a tenth
        // (220 nF for 2.2 µF), swept 0.2 Hz to 2 MHz: the no-fault fit bends β and the bias
        // currents far from their priors to mimic the slip, and every single fault is screened
        // from there. Before the second screen from the leader, board 7003 was named "C1" at
        // p = 1.000 with C2's hypothesis left unconverged hundreds of nats behind.
        DemoBoards demo = new DemoBoards(DemoBoards.GEOPHONE);
        StagePrediction predicted = new StageAnalysis().withSpread(new ToleranceSpread(200, 1))
                .analyse(new StageFile(demo.stage, List.of()));
        List<Long> seeds = List.of(7000L, 7001L, 7002L, 7003L, 7004L, 7005L, 7006L, 7007L);
        List<ReconcileResult> results = seeds.parallelStream().map(seed -> {
            try {
                Sweep sweep = new BoardSynthesizer().synthesize(BoardDraw.draw(demo.stage, seed),
                        List.of(new Fault.CapacitorValue("C2", 0.22e-6)), SweepNoise.BENCH, BAND, true, seed);
                return Reconciler.onOneThread().reconcile(predicted, sweep, DecisionRule.SIMPLE);
            } catch (InputProblem problem) {
                throw new IllegalStateException(problem);
            }
        }).collect(Collectors.toList());
        int right = 0;
        int wrong = 0;
        List<String> lines = new ArrayList<>();
        for (int i = 0; i < seeds.size(); i++) {
            Hypothesis top = results.get(i).diagnosis().top();
            boolean isRight = parts(top).equals(Set.of("C2"));
            boolean confident = results.get(i).adequacy().explained() && top.probability() >= 0.9;
            right += isRight ? 1 : 0;
            wrong += !isRight && confident ? 1 : 0;
            lines.add(String.format(Locale.ROOT, "seed %d: top %s p=%.3f%s", seeds.get(i), top.label(),
                    top.probability(), !isRight && confident ? "  CONFIDENTLY WRONG" : ""));
        }
        String summary = right + "/" + seeds.size() + " right, " + wrong + " confidently wrong\n  "
                + String.join("\n  ", lines);
        TestFigures.keep(getClass(), "aDecadeSlipThatBendsTheNoFaultFitIsStillFoundOrLeftUnsure", summary);
        assertTrue(wrong == 0, summary);
        // C1 and C2 are both 2.2 µF couplings whose slips move the corner alike; where the sweep
        // cannot tell them apart the ranking may lean to C1, unsure (seen: 6 of 8 right)
        assertTrue(right >= 5, summary);
    }

    @Test
    void everyNetworkColumnMatchesCentralDifferencesAcrossTheHighBand() throws Exception {
        DemoBoards demo = new DemoBoards(DemoBoards.HYDROPHONE);
        double[] frequencies = BAND.stream().mapToDouble(Double::doubleValue).toArray();
        BoardModel model = new BoardModel(demo.stage, demo.points, demo.model, frequencies);
        int f = frequencies.length;
        int p = model.parameterCount();
        int k = model.capacitors().size();
        int m = model.board().size();
        double[] theta = new double[p];
        // an arbitrary point off the nominal: every parameter moved a little
        for (int j = 0; j < p; j++) {
            theta[j] = 0.03 * ((j % 3) - 1) + 0.01 * j;
        }
        boolean[] columns = new boolean[m];
        java.util.Arrays.fill(columns, true);
        for (boolean exact : new boolean[] {true, false}) {
            double[][] dRe = new double[p][f];
            double[][] dIm = new double[p][f];
            // a non-exact evaluation right after another point's: the high band may be reused
            assertTrue(model.evaluate(new double[p], new double[f], new double[f], null, null, null, true));
            assertTrue(model.evaluate(theta, new double[f], new double[f], dRe, dIm, columns, exact));
            double h = 1e-5;
            for (int j = k; j < k + m; j++) {
                double[] up = theta.clone();
                double[] down = theta.clone();
                up[j] += h;
                down[j] -= h;
                double[] ur = new double[f];
                double[] ui = new double[f];
                double[] lr = new double[f];
                double[] li = new double[f];
                assertTrue(model.evaluate(up, ur, ui, null, null, null, true));
                assertTrue(model.evaluate(down, lr, li, null, null, null, true));
                for (int n = 0; n < f; n++) {
                    var ratio = new org.apache.commons.math3.complex.Complex(ur[n], ui[n])
                            .divide(new org.apache.commons.math3.complex.Complex(lr[n], li[n]));
                    // central difference, truncation h²/6·|d³lnH/dθ³| (Nocedal and Wright, 8.1),
                    // against a forward difference of step 1e-6: 1e-4 absolute on columns of
                    // order 1 (the columns that left out the high band were off by up to 0.3)
                    String where = "parameter " + j + ", " + frequencies[n] + " Hz, exact " + exact;
                    org.junit.jupiter.api.Assertions.assertEquals(Math.log(ratio.abs()) / (2 * h), dRe[j][n], 1e-4,
                            where);
                    org.junit.jupiter.api.Assertions.assertEquals(ratio.getArgument() / (2 * h), dIm[j][n], 1e-4,
                            where);
                }
            }
        }
    }
}
