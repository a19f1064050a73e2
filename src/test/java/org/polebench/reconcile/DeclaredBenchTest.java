package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.stream.Collectors;
import java.util.stream.IntStream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.TestFigures;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchReader;
import org.polebench.bench.MeasuringChain;
import org.polebench.circuit.StageFile;
import org.polebench.fit.Estimate;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.sweep.Sweep;
import org.polebench.synth.BoardSynthesizer;
import org.polebench.synth.Fault;
import org.polebench.synth.SweepNoise;

/**
 * Issue 13: boards synthesized through a declared bench (the bundled demo bench: a 50 Ω
 * generator, an output channel AC-coupled at 3.3 Hz through 1 MΩ ∥ 15 pF) and reconciled with
 * the same bench file. The truth is the synthesizer's: the board's fault, and the same board
 * synthesized without the bench, whose fitted corner is the board-alone corner.
 */
class DeclaredBenchTest {
    private static final Path BENCH = Path.of("sample-measurements", "benches", "scope-ac-coupled.bench.yaml");
    private static final List<DemoBoards> DEMOS = new ArrayList<>();
    private static final List<StagePrediction> PREDICTED = new ArrayList<>();
    private static Bench bench;

    @BeforeAll
    static void stages() throws InputProblem {
        bench = new BenchReader().read(BENCH);
        for (String file : List.of(DemoBoards.GEOPHONE, DemoBoards.HYDROPHONE, DemoBoards.VIBRATION)) {
            DemoBoards demo = new DemoBoards(file);
            DEMOS.add(demo);
            PREDICTED.add(new StageAnalysis().withSpread(new ToleranceSpread(200, 1))
                    .analyse(new StageFile(demo.stage, List.of())));
        }
    }

    private record Outcome(String line, boolean rightWith, boolean rightWithout, boolean ownCovered,
                           boolean confidentWithoutFile) {
    }

    @Test
    void aBoardMeasuredThroughADeclaredBenchIsDiagnosedAsWithoutOneAndKeepsItsOwnCorner() {
        int boards = 24;
        List<Outcome> outcomes = IntStream.range(0, boards).parallel().mapToObj(DeclaredBenchTest::board)
                .collect(Collectors.toList());
        long with = outcomes.stream().filter(Outcome::rightWith).count();
        long without = outcomes.stream().filter(Outcome::rightWithout).count();
        long own = outcomes.stream().filter(Outcome::ownCovered).count();
        long confident = outcomes.stream().filter(Outcome::confidentWithoutFile).count();
        String summary = with + "/" + boards + " right through the declared bench, " + without
                + " right on the same boards without a bench; " + own
                + " with the board's own corner within U (k = 2) of the board-alone corner; without the file "
                + confident + " a wrong part at p > 0.9\n  "
                + outcomes.stream().map(Outcome::line).collect(Collectors.joining("\n  "));
        TestFigures.keep(getClass(), "aBoardMeasuredThroughADeclaredBenchIsDiagnosedAsWithoutOneAndKeepsItsOwnCorner",
                summary);
        // issue 13: the true fault on top as often as without a bench (allowing one board of 24)
        assertTrue(with >= without - 1, summary);
        // U at k = 2 covers about 95 % (GUM 6.3); 80 % of 24 allows their scatter
        assertTrue(own >= 0.8 * boards, summary);
        // and the same sweeps reconciled without the file: the chain or "not explained", never a
        // wrong part at p > 0.9
        assertEquals(0, confident, summary);
    }

    private static Outcome board(int i) {
        int s = i % 3;
        DemoBoards demo = DEMOS.get(s);
        SplittableRandom random = new SplittableRandom(31_000L + 41L * i);
        // every other board healthy, the others with a capacitor a decade low
        String slipped = i % 2 == 0 ? null : demo.model.capacitorNames().get((i / 2) % demo.model.capacitorNames().size());
        Fault fault = slipped == null ? new Fault.None()
                : new Fault.CapacitorValue(slipped, demo.stage.capacitor(slipped).farads() / 10);
        try {
            List<Fault> faults = demo.boardWith(fault, random);
            faults.addAll(AdequacyCalibrationTest.betaSpread(demo, random));
            List<Double> band = demo.band(100);
            long seed = random.nextLong();
            BoardSynthesizer synthesizer = new BoardSynthesizer();
            Sweep seen = synthesizer.synthesize(demo.stage, faults, SweepNoise.BENCH, band, true, seed,
                    Optional.of(MeasuringChain.of(bench, "test")));
            Sweep alone = synthesizer.synthesize(demo.stage, faults, SweepNoise.BENCH, band, true, seed);
            ReconcileResult declared = Reconciler.onOneThread().reconcile(PREDICTED.get(s), seen, DecisionRule.SIMPLE,
                    Optional.of(bench));
            ReconcileResult direct = Reconciler.onOneThread().reconcile(PREDICTED.get(s), alone, DecisionRule.SIMPLE);
            ReconcileResult undeclared = Reconciler.onOneThread().reconcile(PREDICTED.get(s), seen, DecisionRule.SIMPLE);
            Set<String> truth = slipped == null ? Set.of() : Set.of(slipped);
            boolean rightWith = right(declared, truth);
            boolean rightWithout = right(direct, truth);
            Estimate own = declared.sideBySide().backSolvedLowerCornerHz().orElseThrow();
            Estimate board = direct.sideBySide().measuredLowerCornerHz().orElseThrow();
            boolean covered = Math.abs(own.value() - board.value())
                    <= 2 * Math.hypot(own.standardUncertainty(), board.standardUncertainty());
            Hypothesis top = undeclared.diagnosis().top();
            boolean confident = undeclared.adequacy().explained() && top.identifiable() && top.probability() > 0.9
                    && top.kind() != HypothesisKind.NONE && top.kind() != HypothesisKind.BENCH && !parts(top).equals(truth);
            String line = String.format(Locale.ROOT,
                    "%s truth %s: with bench %s p=%.3f; direct %s; own corner %.3f ± %.3f Hz, alone %.3f ± %.3f Hz;"
                            + " without the file %s p=%.3f explained=%s",
                    demo.stage.name().split(" ")[0], truth, declared.diagnosis().top().label(),
                    declared.diagnosis().top().probability(), direct.diagnosis().top().label(), own.value(),
                    own.standardUncertainty(), board.value(), board.standardUncertainty(), top.label(),
                    top.probability(), undeclared.adequacy().explained());
            return new Outcome(line, rightWith, rightWithout, covered, confident);
        } catch (InputProblem problem) {
            throw new IllegalStateException(problem);
        }
    }

    private static boolean right(ReconcileResult result, Set<String> truth) {
        return parts(result.diagnosis().top()).equals(truth);
    }

    private static Set<String> parts(Hypothesis hypothesis) {
        if (hypothesis.kind() == HypothesisKind.NONE || hypothesis.kind() == HypothesisKind.BENCH) {
            return Set.of();
        }
        return hypothesis.faults().stream().map(f -> f.estimate().parameter().label()).collect(Collectors.toSet());
    }
}
