package org.polebench.synth;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.analysis.Prediction;
import org.polebench.analysis.StagePredictor;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.sweep.Sweep;

class BoardSynthesizerTest {
    private static Stage hydrophone() throws InputProblem {
        return new StageReader().read(Path.of("sample-measurements", "hydrophone-preamp-ce.stage.yaml")).stage();
    }

    @Test
    void aFlatGainFaultAddsTwentyDecibelsAtEveryPointAndLeavesThePhase() throws InputProblem {
        Stage stage = hydrophone();
        List<Double> band = BoardSynthesizer.logSpaced(1, 10_000, 21);
        BoardSynthesizer synthesizer = new BoardSynthesizer();
        Sweep clean = synthesizer.synthesize(stage, new Fault.None(), SweepNoise.NONE, band, 1);
        Sweep probe = synthesizer.synthesize(stage, new Fault.FlatGain(10), SweepNoise.NONE, band, 1);
        for (int i = 0; i < band.size(); i++) {
            // 20·log10(10) = 20 dB exactly; 1e-9 dB is round-off
            assertEquals(clean.points().get(i).gainDb() + 20, probe.points().get(i).gainDb(), 1e-9);
            assertEquals(clean.points().get(i).phaseDeg().getAsDouble(), probe.points().get(i).phaseDeg().getAsDouble(),
                    1e-9);
        }
    }

    @Test
    void theNoiseHasTheStatedDeviation() throws InputProblem {
        Stage stage = hydrophone();
        List<Double> band = BoardSynthesizer.logSpaced(1, 10_000, 2000);
        BoardSynthesizer synthesizer = new BoardSynthesizer();
        Sweep clean = synthesizer.synthesize(stage, new Fault.None(), SweepNoise.NONE, band, 1);
        Sweep noisy = synthesizer.synthesize(stage, new Fault.None(), new SweepNoise(0.05, 0.5), band, 99);
        double gain = 0;
        double phase = 0;
        for (int i = 0; i < band.size(); i++) {
            gain += Math.pow(noisy.points().get(i).gainDb() - clean.points().get(i).gainDb(), 2);
            phase += Math.pow(noisy.points().get(i).phaseDeg().getAsDouble() - clean.points().get(i).phaseDeg().getAsDouble(), 2);
        }
        // sample standard deviation of 2000 normal draws: relative spread √(1/(2·2000)) ≈ 1.6 %,
        // so 5 % (three spreads) bounds it (common practice)
        assertEquals(0.05, Math.sqrt(gain / band.size()), 0.05 * 0.05);
        assertEquals(0.5, Math.sqrt(phase / band.size()), 0.05 * 0.5);
    }

    @Test
    void theSynthesizedMidbandIsThePredictedMidbandGain() throws InputProblem {
        Stage stage = hydrophone();
        // at the geometric middle of the band, three decades from both corners, |H| is the
        // midband gain D of the port reduction, a different computation from the full MNA solve
        double d = ((Prediction) new StagePredictor().predict(
                new SmallSignalExpansion().expand(stage, new BiasSolver().solve(stage)))).midbandGainDb();
        Sweep sweep = new BoardSynthesizer().synthesize(stage, new Fault.None(), SweepNoise.NONE, List.of(1000.0, 1001.0), 1);
        // the corners lie at 21 Hz and 481 kHz (predict): their tails at 1 kHz are under 0.01 dB
        assertEquals(d, sweep.points().get(0).gainDb(), 0.01);
    }
}
