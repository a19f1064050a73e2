package org.polebench.waveform;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Locale;
import java.util.OptionalDouble;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.TestFigures;
import org.polebench.waveform.TestRecords.Tone;

class SineFitterTest {
    // synthetic truth: 1234.5 Hz sampled at 100 kHz for 1000 samples is 12.345 periods (not a
    // whole number), on a time axis that starts at 3.7 ms, with DC offsets on both channels
    private static final double F = 1234.5;
    private static final double DT = 1e-5;
    private static final Tone IN = Tone.of(0.5, 0.3, 0.12);
    private static final Tone OUT = Tone.of(2.7, -2.1, -0.4);

    @Test
    void threeParameterFitRecoversANoiselessSineToOnePartInABillion() throws InputProblem {
        WaveformRecord record = TestRecords.record(1000, DT, 3.7e-3, F, IN, OUT, 0, null, OptionalDouble.of(F));
        RecordFit fit = new SineFitter().fitKnown(record, F);
        assertRecovered(fit);
        assertEquals(0, fit.iterations());
    }

    @Test
    void fourParameterFitRecoversANoiselessSineAndItsFrequencyToOnePartInABillion() throws InputProblem {
        WaveformRecord record = TestRecords.record(1000, DT, 3.7e-3, F, IN, OUT, 0, null, OptionalDouble.empty());
        RecordFit fit = new SineFitter().fitFree(record);
        assertRecovered(fit);
        // synthetic truth: the frequency the record was made at
        assertEquals(F, fit.frequencyHz(), 1e-9 * F);
        assertTrue(fit.frequencyFree());
    }

    @Test
    void fourParameterFitFindsTheFrequencyOfARecordOfOneAndAHalfPeriods() throws InputProblem {
        // 1.5 periods: 150 Hz over 1000 samples of 10 µs; the FFT peak sits in the second bin
        WaveformRecord record = TestRecords.record(1000, DT, 0, 150, IN, OUT, 0, null, OptionalDouble.empty());
        RecordFit fit = new SineFitter().fitFree(record);
        assertEquals(150, fit.frequencyHz(), 1e-9 * 150, "synthetic truth");
        assertEquals(20 * Math.log10(2.7 / 0.5), fit.gainDb(), 1e-9, "synthetic truth: the amplitude ratio");
    }

    private static void assertRecovered(RecordFit fit) {
        // synthetic truth, noiseless: only rounding remains, far below 1e-9
        assertEquals(IN.amplitude(), fit.input().amplitudeVolts(), 1e-9);
        assertEquals(OUT.amplitude(), fit.output().amplitudeVolts(), 1e-9);
        assertEquals(0, TestRecords.angleError(fit.input().phaseRad(), IN.phaseRad()), 1e-9);
        assertEquals(0, TestRecords.angleError(fit.output().phaseRad(), OUT.phaseRad()), 1e-9);
        assertEquals(IN.offset(), fit.input().offsetVolts(), 1e-9);
        assertEquals(OUT.offset(), fit.output().offsetVolts(), 1e-9);
        assertEquals(20 * Math.log10(OUT.amplitude() / IN.amplitude()), fit.gainDb(), 1e-9);
        assertEquals(Math.toDegrees(TestRecords.angleError(OUT.phaseRad(), IN.phaseRad())), fit.phaseDeg(), 1e-9);
    }

    /**
     * Seeded Monte Carlo, known frequency: the spread of the fitted amplitude and phase against the
     * Cramér–Rao bound for a sine in white Gaussian noise, var(Â) = 2σ²/N and var(φ̂) = 2σ²/(N·A²)
     * (P. Händel, "Properties of the IEEE-STD-1057 four-parameter sine wave fit algorithm", IEEE
     * Trans. Instrum. Meas. 49(6), 2000; S. M. Kay, Fundamentals of Statistical Signal Processing,
     * vol. 1, 1993, example 3.14), and the stated uncertainties' coverage at k = 2.
     */
    @Test
    void threeParameterSpreadMeetsTheCramerRaoBoundAndItsUncertaintiesCoverTheTruth() throws InputProblem {
        int trials = 4000;
        int n = 1000;
        double sigma = 0.05;
        Tone in = Tone.of(1.0, 0.7, 0.05);
        Tone out = Tone.of(0.4, -1.2, -0.02);
        Random random = new Random(20261202L);
        SineFitter fitter = new SineFitter();
        double sumA = 0;
        double sumA2 = 0;
        double sumP = 0;
        double sumP2 = 0;
        int coveredA = 0;
        int coveredP = 0;
        int coveredGain = 0;
        int coveredPhase = 0;
        double trueGainDb = 20 * Math.log10(out.amplitude() / in.amplitude());
        double truePhaseDeg = Math.toDegrees(TestRecords.angleError(out.phaseRad(), in.phaseRad()));
        for (int t = 0; t < trials; t++) {
            WaveformRecord record = TestRecords.record(n, DT, 0, F, in, out, sigma, random, OptionalDouble.of(F));
            RecordFit fit = fitter.fitKnown(record, F);
            double eA = fit.input().amplitudeVolts() - in.amplitude();
            double eP = TestRecords.angleError(fit.input().phaseRad(), in.phaseRad());
            sumA += eA;
            sumA2 += eA * eA;
            sumP += eP;
            sumP2 += eP * eP;
            coveredA += Math.abs(eA) <= 2 * fit.input().amplitudeUncertaintyVolts() ? 1 : 0;
            coveredP += Math.abs(eP) <= 2 * fit.input().phaseUncertaintyRad() ? 1 : 0;
            coveredGain += Math.abs(fit.gainDb() - trueGainDb) <= 2 * fit.gainUncertaintyDb() ? 1 : 0;
            coveredPhase += Math.abs(fit.phaseDeg() - truePhaseDeg) <= 2 * fit.phaseUncertaintyDeg() ? 1 : 0;
        }
        double varA = (sumA2 - sumA * sumA / trials) / (trials - 1);
        double varP = (sumP2 - sumP * sumP / trials) / (trials - 1);
        double boundA = 2 * sigma * sigma / n;
        double boundP = 2 * sigma * sigma / (n * in.amplitude() * in.amplitude());
        String figures = String.format(Locale.ROOT, "var(A)/CRB %.4f, var(phi)/CRB %.4f, coverage k=2: A %.4f, "
                        + "phi %.4f, gain %.4f, phase %.4f (%d trials, N %d, sigma %.3g)", varA / boundA, varP / boundP,
                coveredA / (double) trials, coveredP / (double) trials, coveredGain / (double) trials,
                coveredPhase / (double) trials, trials, n, sigma);
        TestFigures.keep(getClass(), "threeParameterSpreadMeetsTheCramerRaoBoundAndItsUncertaintiesCoverTheTruth", figures);
        // the least-squares fit is efficient here: within 1.1 × the bound (issue 17); with 4000 trials
        // a sample variance scatters by √(2/4000) ≈ 2.2 %, so 0.9 below is a 4.5σ margin
        assertTrue(varA / boundA <= 1.1 && varA / boundA >= 0.9, figures);
        assertTrue(varP / boundP <= 1.1 && varP / boundP >= 0.9, figures);
        // 95 ± 2 % at k = 2: with 4000 trials the binomial scatter is 0.34 %, so ±2 % is about 6σ
        for (int covered : new int[] {coveredA, coveredP, coveredGain, coveredPhase}) {
            assertEquals(0.95, covered / (double) trials, 0.02, figures);
        }
    }

    @Test
    void fourParameterUncertaintiesCoverTheTruth() throws InputProblem {
        int trials = 2000;
        int n = 1000;
        double sigma = 0.05;
        Tone in = Tone.of(1.0, 0.7, 0.05);
        Tone out = Tone.of(0.4, -1.2, -0.02);
        Random random = new Random(17L);
        SineFitter fitter = new SineFitter();
        int coveredGain = 0;
        int coveredPhase = 0;
        int coveredFrequency = 0;
        double trueGainDb = 20 * Math.log10(out.amplitude() / in.amplitude());
        double truePhaseDeg = Math.toDegrees(TestRecords.angleError(out.phaseRad(), in.phaseRad()));
        for (int t = 0; t < trials; t++) {
            WaveformRecord record = TestRecords.record(n, DT, 0, F, in, out, sigma, random, OptionalDouble.empty());
            RecordFit fit = fitter.fitFree(record);
            coveredGain += Math.abs(fit.gainDb() - trueGainDb) <= 2 * fit.gainUncertaintyDb() ? 1 : 0;
            coveredPhase += Math.abs(fit.phaseDeg() - truePhaseDeg) <= 2 * fit.phaseUncertaintyDeg() ? 1 : 0;
            coveredFrequency += Math.abs(fit.frequencyHz() - F) <= 2 * fit.frequencyUncertaintyHz() ? 1 : 0;
        }
        String figures = String.format(Locale.ROOT, "coverage k=2: gain %.4f, phase %.4f, frequency %.4f (%d trials)",
                coveredGain / (double) trials, coveredPhase / (double) trials, coveredFrequency / (double) trials, trials);
        TestFigures.keep(getClass(), "fourParameterUncertaintiesCoverTheTruth", figures);
        // synthetic truth; 95 ± 2 % at k = 2 (binomial scatter 0.5 % with 2000 trials)
        assertEquals(0.95, coveredGain / (double) trials, 0.02, figures);
        assertEquals(0.95, coveredPhase / (double) trials, 0.02, figures);
        assertEquals(0.95, coveredFrequency / (double) trials, 0.02, figures);
    }
}
