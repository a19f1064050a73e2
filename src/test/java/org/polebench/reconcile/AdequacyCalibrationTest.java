package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.stream.Collectors;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.TestFigures;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.circuit.StageFile;
import org.polebench.synth.Fault;
import org.polebench.sweep.Sweep;
import org.polebench.synth.SweepNoise;

/**
 * Issue 11: the adequacy test's false-alarm rate on boards the stage does explain. Each board is
 * synthesized from a demo stage itself (full MNA response, parts drawn within tolerance, one
 * known fault or none, β drawn within ±50 %), so the truth is "explained": a board called
 * unexplained is a false alarm. 1,200 boards over three stages, four noise levels (noise-free,
 * 0.01 dB/0.1°, 0.05 dB/0.5°, 0.2 dB/2°), with and without stated point uncertainties, seeded.
 */
class AdequacyCalibrationTest {
    private static final long SEED = 11_2026L;
    static final int BOARDS = 1200;
    private static final SweepNoise[] NOISE = {SweepNoise.NONE, new SweepNoise(0.01, 0.1), SweepNoise.BENCH,
            new SweepNoise(0.2, 2)};

    @Test
    void falseAlarmRateOnBoardsTheStageExplainsIsAtMostOnePercent() throws InputProblem {
        List<StagePrediction> stages = new ArrayList<>();
        List<DemoBoards> demos = new ArrayList<>();
        for (String file : List.of(DemoBoards.GEOPHONE, DemoBoards.HYDROPHONE, DemoBoards.VIBRATION)) {
            DemoBoards demo = new DemoBoards(file);
            demos.add(demo);
            stages.add(new StageAnalysis().withSpread(new ToleranceSpread(200, 1))
                    .analyse(new StageFile(demo.stage, List.of())));
        }
        List<String> alarms = IntStream.range(0, BOARDS).parallel().mapToObj(board -> {
            SplittableRandom random = new SplittableRandom(SEED + board * 7919L);
            int s = board % 3;
            DemoBoards demo = demos.get(s);
            SweepNoise noise = NOISE[(board / 3) % NOISE.length];
            boolean stated = (board / 12) % 2 == 1 && noise.gainSigmaDb() > 0;
            try {
                List<Fault> faults = null;
                Sweep sweep = null;
                // a drawn board that cannot be biased (a resistor fault on top of β spread can
                // saturate a transistor) is drawn again: it is no board of this stage
                for (int attempt = 0; sweep == null; attempt++) {
                    faults = demo.boardWith(fault(demo, board, random), random);
                    faults.addAll(betaSpread(demo, random));
                    try {
                        sweep = demo.sweep(faults, noise, demo.band(60 + random.nextInt(81)), random.nextLong());
                    } catch (InputProblem notBiased) {
                        if (attempt > 20) {
                            throw notBiased;
                        }
                    }
                }
                if (stated) {
                    sweep = BenchEffects.withStatedUncertainty(sweep, noise.gainSigmaDb(), noise.phaseSigmaDeg());
                }
                ReconcileResult result = Reconciler.onOneThread().reconcile(stages.get(s), sweep, DecisionRule.SIMPLE);
                ModelAdequacy adequacy = result.adequacy();
                return adequacy.explained() ? null : String.format(Locale.ROOT, "board %d %s %s noise %s%s: %s",
                        board, demo.stage.name(), faults.get(faults.size() - 1 - betaCount(demo)).describe(),
                        noise.describe(), stated ? " stated" : "", adequacy);
            } catch (InputProblem problem) {
                return "board " + board + " could not be made: " + problem.getMessage();
            }
        }).filter(a -> a != null).collect(Collectors.toList());
        String summary = alarms.size() + " false alarms in " + BOARDS + " boards" + alarms.stream()
                .map(a -> "\n  " + a).collect(Collectors.joining());
        TestFigures.keep(getClass(), "falseAlarmRateOnBoardsTheStageExplainsIsAtMostOnePercent", summary);
        // issue 11: at most 1 % false alarms on at least 1,000 seeded boards
        assertTrue(alarms.size() <= BOARDS / 100, summary);
    }

    // none, a capacitor decade slip, an electrolytic at half, a flat ×10 gain, a resistor off
    private static Fault fault(DemoBoards demo, int board, SplittableRandom random) {
        int type = (board / 24) % 5;
        List<String> caps = demo.model.capacitorNames();
        switch (type) {
            case 1: {
                String part = caps.get(random.nextInt(caps.size()));
                return new Fault.CapacitorValue(part, demo.stage.capacitor(part).farads() / 10);
            }
            case 2: {
                List<String> electrolytics = demo.electrolytics();
                String part = electrolytics.get(random.nextInt(electrolytics.size()));
                return new Fault.CapacitorValue(part, demo.stage.capacitor(part).farads() * 0.5);
            }
            case 3:
                return new Fault.FlatGain(10);
            case 4: {
                // a resistor 30 % off, either way: stays biased on every demo stage
                var resistors = demo.stage.resistors();
                var resistor = resistors.get(random.nextInt(resistors.size()));
                return new Fault.ResistorValue(resistor.name(), resistor.ohms() * (random.nextBoolean() ? 0.7 : 1.3));
            }
            default:
                return new Fault.None();
        }
    }

    static int betaCount(DemoBoards demo) {
        return (int) demo.stage.transistors().stream().filter(t -> t instanceof org.polebench.circuit.Bjt).count();
    }

    // every BJT's β drawn across its ±50 % band, as ordinary part spread
    static List<Fault> betaSpread(DemoBoards demo, SplittableRandom random) {
        List<Fault> faults = new ArrayList<>();
        for (var transistor : demo.stage.transistors()) {
            if (transistor instanceof org.polebench.circuit.Bjt) {
                faults.add(new Fault.CurrentGain(transistor.name(),
                        DemoBoards.draw(((org.polebench.circuit.Bjt) transistor).betaTolerance(), random)));
            }
        }
        return faults;
    }
}
