package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.synth.Fault;
import org.polebench.sweep.Sweep;
import org.polebench.synth.SweepNoise;

/**
 * Issue 11: where the sweep states no point σ, the gain and the phase noise are estimated apart
 * (two variance components). The truth is the noise the synthesizer added: with 0.05 dB on the
 * gain (the default σ) and 3° on the phase (six times the default 0.5°), the gain scale must
 * come out near 1 and the phase scale near 6, and a phase that noisy must not move the culprit.
 */
class NoiseComponentsTest {
    @Test
    void gainAndPhaseNoiseAreScaledApartAndTheCulpritStays() throws InputProblem {
        DemoBoards demo = new DemoBoards(DemoBoards.HYDROPHONE);
        SplittableRandom random = new SplittableRandom(11_11L);
        String bypass = demo.electrolytics().get(demo.electrolytics().size() - 1);
        Fault slip = new Fault.CapacitorValue(bypass, demo.stage.capacitor(bypass).farads() / 10);
        Sweep sweep = demo.sweep(demo.boardWith(slip, random), new SweepNoise(0.05, 3), demo.band(100),
                random.nextLong());
        Diagnosis diagnosis = demo.rank(sweep);
        NoiseBasis noise = diagnosis.noise();
        // the scale estimates a σ ratio from about 100 residuals each: relative spread about
        // 1/√(2·100) = 7 % (the spread of a χ² variance estimate: Kay, Fundamentals of Statistical Signal
        // Processing, vol. 1, 1993, from memory), so ±25 % is over three spreads
        assertEquals(6, noise.phaseScale(), 6 * 0.25, "phase scale");
        assertEquals(1, noise.magnitudeScale(), 0.25, "gain scale");
        assertTrue(diagnosis.top().part().orElse("").equals(bypass), diagnosis.top().label());
    }
}
