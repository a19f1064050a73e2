package org.polebench.reconcile;

import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.polebench.analysis.StageAnalysis;
import org.polebench.analysis.StagePrediction;
import org.polebench.analysis.ToleranceSpread;
import org.polebench.measure.BoardSynthesizer;
import org.polebench.measure.Fault;
import org.polebench.measure.Sweep;
import org.polebench.measure.SweepNoise;

class HandCasesProbe {
    @Test
    void probe() throws Exception {
        for (String file : List.of(DemoBoards.GEOPHONE, DemoBoards.HYDROPHONE, DemoBoards.VIBRATION)) {
            DemoBoards demo = new DemoBoards(file);
            StagePrediction predicted = new StageAnalysis().withSpread(new ToleranceSpread(200, 1)).analyse(new org.polebench.circuit.StageFile(demo.stage, List.of()));
            SplittableRandom random = new SplittableRandom(7);
            List<Double> band = demo.band(100);
            Sweep healthy = demo.sweep(demo.boardWith(new Fault.None(), random), SweepNoise.BENCH, band, 11);
            report(file + " healthy", predicted, healthy);
            report(file + " healthy stated", predicted, BenchEffects.withStatedUncertainty(healthy, 0.05, 0.5));
            report(file + " ac 3.5Hz", predicted, BenchEffects.acCoupled(healthy, 3.5));
            report(file + " swapped", predicted, BenchEffects.swappedColumns(healthy));
            String resistor = demo.stage.resistors().get(demo.stage.resistors().size() - 1).name();
            for (var r : demo.stage.resistors()) {
                if (r.name().startsWith("RE") || r.name().startsWith("RS")) {
                    resistor = r.name();
                    break;
                }
            }
            DemoBoards wrong = new DemoBoards(demo.stage.withResistance(resistor, demo.stage.resistor(resistor).ohms() * 0.6));
            Sweep slip = wrong.sweep(wrong.boardWith(new Fault.None(), random), SweepNoise.BENCH, band, 12);
            report(file + " " + resistor + "/10", predicted, slip);
            String q = demo.stage.transistors().get(0).name();
            if (demo.stage.transistor(q) instanceof org.polebench.circuit.Bjt) {
                DemoBoards beta = new DemoBoards(demo.stage.withBeta(q, demo.stage.bjt(q).beta() * 1.7));
                report(file + " beta1.7", predicted, beta.sweep(beta.boardWith(new Fault.None(), random), SweepNoise.BENCH, band, 13));
            }
        }
    }

    private static void report(String name, StagePrediction predicted, Sweep sweep) throws Exception {
        long t = System.nanoTime();
        ReconcileResult result = Reconciler.onOneThread().reconcile(predicted, sweep, DecisionRule.SIMPLE);
        ModelAdequacy a = result.adequacy();
        Hypothesis top = result.diagnosis().top();
        System.out.printf("%-40s explained=%s looks=%s chi2=%.1f nu=%d ratio=%s pF=%s runs=%.3g findings=%s top=%s p=%.3f pairs=%s scales=%.2f/%.2f %dms%n",
                name, a.explained(), a.looksLikeStage(), a.chiSquared(), a.degreesOfFreedom(),
                a.freeFitRatio(), a.freeFitPValue(), a.structurePValue(), a.findings(), top.label(), top.probability(),
                result.diagnosis().pairsRanked(), result.diagnosis().noise().magnitudeScale(), result.diagnosis().noise().phaseScale(),
                (System.nanoTime() - t) / 1_000_000);
    }
}
