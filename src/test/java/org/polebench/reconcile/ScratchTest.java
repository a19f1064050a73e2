package org.polebench.reconcile;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.polebench.analysis.*;
import org.polebench.circuit.*;
import org.polebench.fit.*;
import org.polebench.measure.*;

class ScratchTest {
    @Test
    void run() throws Exception {
        long t0 = System.nanoTime();
        StageFile file = new StageReader().read(Path.of("sample-measurements/geophone-two-stage.stage.yaml"));
        StagePrediction p = new StageAnalysis().withSpread(new ToleranceSpread(20, 1)).analyse(file);
        long t1 = System.nanoTime();
        Sweep sweep = new SweepReader(ProfileLibrary.bundled()).read(Path.of("sample-measurements/geophone-gf2-board-0417.sweep.csv"), "auto").sweep();
        long t2 = System.nanoTime();
        FitResult fit = new SweepFitter(FitSettings.defaults().withMaxPoles(5)).fit(sweep);
        long t3 = System.nanoTime();
        Diagnosis d = new FaultRanking().rank(p.stage(), p.operatingPoints(), p.prediction().lowBand(), sweep);
        long t4 = System.nanoTime();
        ReconcileResult r = new Reconciler().reconcile(p, sweep, DecisionRule.SIMPLE);
        long t5 = System.nanoTime();
        for (int i = 0; i < 10; i++) new Reconciler().reconcile(p, sweep, DecisionRule.SIMPLE);
        long t6 = System.nanoTime();
        new SweepFitter(FitSettings.defaults().withMaxPoles(5)).fit(sweep);
        long t7 = System.nanoTime();
        for (int i = 0; i < 10; i++) new FaultRanking().rank(p.stage(), p.operatingPoints(), p.prediction().lowBand(), sweep);
        long t8 = System.nanoTime();
        java.util.List<org.apache.commons.math3.complex.Complex> start = new java.util.ArrayList<>();
        for (ComplexFrequency pole : p.prediction().poles().roots()) start.add(new org.apache.commons.math3.complex.Complex(pole.realRadPerS(), pole.imaginaryRadPerS()));
        FitSettings rs = FitSettings.defaults().withMaxPoles(5).withStartPoles(start);
        System.out.println("start " + start + " order " + p.prediction().lowBand().order());
        long a0 = System.nanoTime();
        for (int i = 0; i < 10; i++) new SweepFitter(FitSettings.defaults().withMaxPoles(5).withStartPoles(start)).fit(sweep);
        long a1 = System.nanoTime();
        for (int i = 0; i < 10; i++) new ModelMeasurement().measure(p.stage(), p.operatingPoints(), d.top().backSolve());
        long a2 = System.nanoTime();
        System.out.printf("fit with start %.1f, model measurement %.1f ms%n", (a1-a0)/1e7, (a2-a1)/1e7);
        System.out.printf("predict %.0f read %.0f fit %.0f rank %.0f reconcile(2nd) %.0f warm reconcile %.1f warm fit %.1f warm rank %.1f ms%n",
            (t1-t0)/1e6, (t2-t1)/1e6, (t3-t2)/1e6, (t4-t3)/1e6, (t5-t4)/1e6, (t6-t5)/1e7, (t7-t6)/1e6, (t8-t7)/1e7);
    }
}
