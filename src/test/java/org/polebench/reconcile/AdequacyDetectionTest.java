package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.stream.Collectors;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.TestFigures;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageFile;
import org.polebench.circuit.StageInput;
import org.polebench.synth.Fault;
import org.polebench.sweep.Sweep;
import org.polebench.synth.SweepNoise;

/**
 * Issue 11: the adequacy test's detection rate on boards with a known model error, the
 * counterpart of AdequacyCalibrationTest's false-alarm rate. Healthy boards (parts within
 * tolerance, β spread, 0.05 dB / 0.5°) seen through an effect no hypothesis has: a scope
 * channel's AC coupling (a first-order high-pass at 1, 3.3 or 10 Hz on the reading), the
 * generator's 50 Ω output resistance in series with the stage's source resistance (a
 * 600 Ω source becomes 650 Ω), and the sweep reconciled against another stage's file. The rule
 * checked on every board: "not explained" (or, for the AC couplings, the measuring chain on top,
 * since issue 13 gave it hypotheses), or no part named with confidence. The rates are
 * printed for the closing note; floors below keep them from falling.
 */
class AdequacyDetectionTest {
    private static final int PER_EFFECT = 30;

    @Test
    void boardsWithAModelErrorAreNotExplainedOrNotBlamedOnAPart() throws InputProblem {
        List<DemoBoards> demos = new ArrayList<>();
        List<StagePrediction> predicted = new ArrayList<>();
        for (String file : List.of(DemoBoards.GEOPHONE, DemoBoards.HYDROPHONE, DemoBoards.VIBRATION)) {
            DemoBoards demo = new DemoBoards(file);
            demos.add(demo);
            predicted.add(analyse(demo.stage));
        }
        Map<String, int[]> rates = new LinkedHashMap<>();
        List<String> confident = new ArrayList<>();
        for (String effect : List.of("ac 1 Hz", "ac 3.3 Hz", "ac 10 Hz", "generator 50 ohm", "wrong stage file")) {
            List<String[]> outcomes = IntStream.range(0, PER_EFFECT).parallel().mapToObj(i -> {
                int s = i % 3;
                DemoBoards demo = demos.get(s);
                SplittableRandom random = new SplittableRandom(77_000L + i * 31L + effect.hashCode());
                try {
                    List<Fault> faults = demo.boardWith(new Fault.None(), random);
                    faults.addAll(AdequacyCalibrationTest.betaSpread(demo, random));
                    List<Double> band = demo.band(100);
                    int against = s;
                    Sweep sweep;
                    if (effect.startsWith("generator")) {
                        DemoBoards loaded = new DemoBoards(withSource(demo.stage, demo.stage.input().sourceOhms() + 50));
                        sweep = loaded.sweep(faults, SweepNoise.BENCH, band, random.nextLong());
                    } else {
                        sweep = demo.sweep(faults, SweepNoise.BENCH, band, random.nextLong());
                    }
                    if (effect.startsWith("ac")) {
                        double corner = Double.parseDouble(effect.split(" ")[1]);
                        sweep = BenchEffects.acCoupled(sweep, corner);
                    } else if (effect.startsWith("wrong")) {
                        against = (s + 1) % 3;
                    }
                    ReconcileResult result = Reconciler.onOneThread().reconcile(predicted.get(against), sweep,
                            DecisionRule.SIMPLE);
                    Hypothesis top = result.diagnosis().top();
                    boolean named = result.adequacy().explained() && top.kind() != HypothesisKind.NONE
                            && top.kind() != HypothesisKind.BENCH
                            && top.identifiable() && top.probability() >= 0.9;
                    // caught: not explained, or put down to the measuring chain (a bench hypothesis
                    // on top; BenchHypothesesTest checks its corner)
                    boolean bench = result.adequacy().explained() && top.kind() == HypothesisKind.BENCH;
                    return new String[] {result.adequacy().explained() && !bench ? "explained" : "flagged",
                            named ? demo.stage.name().split(" ")[0] + " " + effect + ": " + top.label() + " p="
                                    + String.format(Locale.ROOT, "%.3f", top.probability()) : ""};
                } catch (InputProblem problem) {
                    throw new IllegalStateException(problem);
                }
            }).collect(Collectors.toList());
            int flagged = (int) outcomes.stream().filter(o -> o[0].equals("flagged")).count();
            rates.put(effect, new int[] {flagged, PER_EFFECT});
            outcomes.stream().filter(o -> !o[1].isEmpty()).forEach(o -> confident.add(o[1]));
        }
        String summary = rates.entrySet().stream().map(e -> e.getKey() + ": " + e.getValue()[0] + "/"
                + e.getValue()[1] + " not explained or the bench on top").collect(Collectors.joining("; "))
                + "\n  named with confidence while explained: " + confident;
        TestFigures.keep(getClass(), "boardsWithAModelErrorAreNotExplainedOrNotBlamedOnAPart", summary);
        // AC couplings at 3.3 Hz and above and the wrong stage file change the response by far
        // more than the noise: at least 80 % must be caught (measured figures in the note)
        assertTrue(rates.get("ac 3.3 Hz")[0] >= 0.8 * PER_EFFECT, summary);
        assertTrue(rates.get("ac 10 Hz")[0] >= 0.8 * PER_EFFECT, summary);
        assertTrue(rates.get("wrong stage file")[0] >= 0.8 * PER_EFFECT, summary);
    }

    private static StagePrediction analyse(Stage stage) throws InputProblem {
        return new StageAnalysis().withSpread(new ToleranceSpread(200, 1)).analyse(new StageFile(stage, List.of()));
    }

    private static Stage withSource(Stage stage, double ohms) {
        StageInput input = stage.input();
        return stage.withInput(new StageInput(input.node(), ohms, input.reference(), input.line()));
    }
}
