package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.TestFigures;
import org.polebench.synth.Fault;
import org.polebench.sweep.Sweep;
import org.polebench.synth.SweepNoise;

/**
 * Issue 5's acceptance check: seeded synthetic boards from the demo stages, each with one known
 * fault on top of parts drawn within tolerance, at 0.05 dB / 0.5° noise. The truth is the
 * fault the synthesizer applied (full MNA response, not the back-solve's reduced model).
 */
class SyntheticBoardsTest {
    private static final long SEED = 5_2026L;
    private static final int POINTS = 100;

    @Test
    void faultyBoardsPutTheTrueFaultOnTopAndHealthyBoardsNoFault() throws InputProblem {
        SplittableRandom random = new SplittableRandom(SEED);
        DemoBoards[] stages = {new DemoBoards(DemoBoards.GEOPHONE), new DemoBoards(DemoBoards.HYDROPHONE),
                new DemoBoards(DemoBoards.VIBRATION)};
        int faulty = 0;
        int faultyRight = 0;
        int healthy = 0;
        int healthyRight = 0;
        List<Double> valueErrors = new ArrayList<>();
        StringBuilder misses = new StringBuilder();
        for (int board = 0; board < 200; board++) {
            int type = board % 5;
            // bias faults on the hydrophone stage only: its fully bypassed emitter makes the gain
            // follow gm = IC/VT, while the other two stages' emitter and source degeneration make
            // a ×0.6 bias current look like parts within tolerance (flagged "not identifiable",
            // see NotIdentifiableTest)
            DemoBoards demo = type == 2 ? stages[1] : stages[(board / 5) % stages.length];
            Fault fault;
            HypothesisKind kind;
            String part = null;
            double trueValue;
            if (type == 0) {
                List<String> caps = demo.model.capacitorNames();
                part = caps.get(random.nextInt(caps.size()));
                trueValue = demo.stage.capacitor(part).farads() / 10;
                fault = new Fault.CapacitorValue(part, trueValue);
                kind = HypothesisKind.CAPACITOR;
            } else if (type == 1) {
                List<String> caps = demo.electrolytics();
                part = caps.get(random.nextInt(caps.size()));
                trueValue = demo.stage.capacitor(part).farads() * 0.5;
                fault = new Fault.CapacitorValue(part, trueValue);
                kind = HypothesisKind.CAPACITOR;
            } else if (type == 2) {
                part = demo.stage.transistors().get(random.nextInt(demo.stage.transistors().size())).name();
                trueValue = demo.points.point(part).currentAmps() * 0.6;
                fault = new Fault.BiasCurrent(part, 0.6);
                kind = HypothesisKind.BIAS;
            } else if (type == 3) {
                trueValue = 20;
                fault = new Fault.FlatGain(10);
                kind = HypothesisKind.GAIN;
            } else {
                trueValue = Double.NaN;
                fault = new Fault.None();
                kind = HypothesisKind.NONE;
            }
            Sweep sweep = demo.sweep(demo.boardWith(fault, random), SweepNoise.BENCH, demo.band(POINTS),
                    random.nextLong());
            Hypothesis top = demo.rank(sweep).top();
            boolean right = top.kind() == kind && (part == null || top.part().orElse("").equals(part));
            if (kind == HypothesisKind.NONE) {
                healthy++;
                healthyRight += right ? 1 : 0;
            } else {
                faulty++;
                faultyRight += right ? 1 : 0;
                if (right) {
                    double estimate = top.culprit().get().value();
                    valueErrors.add(kind == HypothesisKind.GAIN ? Math.abs(Math.pow(10, (estimate - trueValue) / 20) - 1)
                            : Math.abs(estimate / trueValue - 1));
                }
            }
            if (!right) {
                misses.append(String.format(Locale.ROOT, "%n  %s %s: top %s p=%.2f", demo.stage.name(), fault.describe(),
                        top.label(), top.probability()));
            }
        }
        double[] errors = valueErrors.stream().mapToDouble(Double::doubleValue).sorted().toArray();
        double median = errors[errors.length / 2];
        String summary = String.format(Locale.ROOT, "faulty %d/%d right, healthy %d/%d right, median value error %.4f%s",
                faultyRight, faulty, healthyRight, healthy, median, misses);
        TestFigures.keep(getClass(), "faultyBoardsPutTheTrueFaultOnTopAndHealthyBoardsNoFault", summary);
        // issue 5: at least 95 % of faulty boards with the true fault on top
        assertTrue(faultyRight >= 0.95 * faulty, summary);
        // issue 5: at least 90 % of healthy boards with "no fault" on top
        assertTrue(healthyRight >= 0.90 * healthy, summary);
        // issue 5: the culprit's value within 5 % in the median
        assertTrue(median < 0.05, summary);
        assertTrue(Arrays.stream(errors).allMatch(Double::isFinite), summary);
    }
}
