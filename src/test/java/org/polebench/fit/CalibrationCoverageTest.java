package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.Random;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.TestFigures;
import org.polebench.sweep.CalibrationAccuracy;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * Issue 13, the instrument's error in the uncertainty: 500 seeded sweeps of a known first-order
 * high-pass H(s) = K·s/(s + ω_p) (closed form in {@link KnownResponse}: |H| = K/√2 at f = f_p,
 * so the −3 dB corner is f_p exactly), each with one flat calibration error drawn from the
 * instrument's accuracy and added to every point, plus independent point noise of stated σ.
 *
 * <p>Band: over M = 500 sweeps the observed coverage of a true 95.45 % interval is binomial with
 * σ = √(0.9545·0.0455/500) = 0.93 %, so 95 ± 2 % is about ±2.1 σ about the nominal 95.45 %
 * (normal approximation to the binomial, common practice).
 */
class CalibrationCoverageTest {
    private static final int TRIALS = 500;
    private static final double GAIN = 10;            // 20 dB
    private static final double CORNER_HZ = 50;
    private static final double NOISE_DB = 0.05;
    private static final double NOISE_DEG = 0.5;
    private static final double[] FREQUENCIES = KnownResponse.logSpaced(5, 20_000, 41);
    private static final KnownResponse TRUTH = new KnownResponse(GAIN, 1, new double[0][],
            KnownResponse.real(-CORNER_HZ), Double.NaN);

    /** One sweep: truth + flat (gain, phase) calibration error + point noise, points stating σ. */
    private static Sweep sweep(double calDb, double calDeg, Random random, CalibrationAccuracy accuracy) {
        List<SweepPoint> points = new ArrayList<>();
        for (double f : FREQUENCIES) {
            points.add(new SweepPoint(f, TRUTH.gainDb(f) + calDb + NOISE_DB * random.nextGaussian(),
                    OptionalDouble.of(TRUTH.phaseDeg(f) + calDeg + NOISE_DEG * random.nextGaussian()),
                    OptionalDouble.of(NOISE_DB), OptionalDouble.of(NOISE_DEG)));
        }
        return new Sweep(Provenance.inMemory("calibration coverage test"), points).withCalibration(accuracy);
    }

    @Test
    void midbandAndCornerCoverTheTruthWhenTheAccuracyIsNormal() throws InputProblem {
        // a profile's ±0.1 dB, ±1° stated as an expanded uncertainty with k = 2: u = 0.05 dB, 0.5°
        double uCalDb = 0.05;
        double uCalDeg = 0.5;
        CalibrationAccuracy accuracy = new CalibrationAccuracy(OptionalDouble.of(uCalDb), OptionalDouble.of(uCalDeg),
                "test profile: ±0.1 dB, ±1°, normal");
        Random random = new Random(20_310_413L);
        SweepFitter fitter = new SweepFitter(FitSettings.defaults());
        int gainCovered = 0;
        int gainCoveredByNoiseAlone = 0;
        int cornerCovered = 0;
        int corners = 0;
        double smallestU = Double.POSITIVE_INFINITY;
        for (int t = 0; t < TRIALS; t++) {
            Sweep sweep = sweep(uCalDb * random.nextGaussian(), uCalDeg * random.nextGaussian(), random, accuracy);
            FitResult fit = fitter.fit(sweep);
            Estimate gain = fit.midbandGainDb();
            double error = Math.abs(gain.value() - 20 * Math.log10(GAIN));
            gainCovered += error <= gain.expandedUncertainty() ? 1 : 0;
            // the noise's own part: a flat gain error moves ln|K| one for one, so u² = u_noise² + u_cal²
            double uNoise = Math.sqrt(Math.max(0, gain.standardUncertainty() * gain.standardUncertainty() - uCalDb * uCalDb));
            gainCoveredByNoiseAlone += error <= gain.coverageFactor() * uNoise ? 1 : 0;
            smallestU = Math.min(smallestU, gain.standardUncertainty());
            if (fit.lowerCornerModelHz().isPresent()) {
                Estimate c = fit.lowerCornerModelHz().get();
                corners++;
                cornerCovered += Math.abs(c.value() - CORNER_HZ) <= c.expandedUncertainty() ? 1 : 0;
            }
        }
        double gainRate = gainCovered / (double) TRIALS;
        double noiseRate = gainCoveredByNoiseAlone / (double) TRIALS;
        double cornerRate = cornerCovered / (double) corners;
        String figures = String.format(Locale.ROOT, "midband coverage %.3f, with the point noise alone %.3f; "
                + "corner coverage %.3f of %d; smallest midband u %.5f dB", gainRate, noiseRate, cornerRate, corners,
                smallestU);
        TestFigures.keep(getClass(), "midbandAndCornerCoverTheTruthWhenTheAccuracyIsNormal", figures);
        assertEquals(0.95, gainRate, 0.02, figures);
        // the U is never smaller than the accuracy allows: u ≥ u_cal (exactly, up to round-off)
        assertTrue(smallestU >= uCalDb * (1 - 1e-9), figures);
        // without the calibration term the midband's U would cover far too rarely: the test can fail
        assertTrue(noiseRate < 0.8, figures);
        assertEquals(TRIALS, corners, figures);
        assertEquals(0.95, cornerRate, 0.02, figures);
    }

    /**
     * A rectangular ±a calibration error (u = a/√3, GUM 4.3.7) plus normal noise is not normal, so
     * k = 2 need not give 95.45 %: the expected coverage is P(|R + N| ≤ U) with R uniform on
     * [−a, a] and N normal with each fit's own noise part, integrated numerically per fit (midpoint
     * rule, 2000 panels: error far below the binomial spread) and averaged over the fits. The measured rate must lie within 3 binomial
     * σ of it, and never below 95 %: a rectangular term covers more than a normal one at k = 2.
     */
    @Test
    void aRectangularAccuracyCoversAsItsDistributionPredicts() throws InputProblem {
        double a = 0.1;
        double uCal = a / Math.sqrt(3);
        CalibrationAccuracy accuracy = new CalibrationAccuracy(OptionalDouble.of(uCal), OptionalDouble.of(1 / Math.sqrt(3)),
                "test profile: ±0.1 dB, ±1°, rectangular");
        Random random = new Random(20_310_414L);
        SweepFitter fitter = new SweepFitter(FitSettings.defaults());
        int covered = 0;
        double expected = 0;
        double sumU = 0;
        int panels = 2_000;
        for (int t = 0; t < TRIALS; t++) {
            Sweep sweep = sweep(a * (2 * random.nextDouble() - 1), (2 * random.nextDouble() - 1), random, accuracy);
            Estimate gain = fitter.fit(sweep).midbandGainDb();
            covered += Math.abs(gain.value() - 20 * Math.log10(GAIN)) <= gain.expandedUncertainty() ? 1 : 0;
            // this fit's own noise part (u² = u_noise² + u_cal², the gain sensitivity being 1) and U
            double sigmaNoise = Math.sqrt(Math.max(gain.standardUncertainty() * gain.standardUncertainty()
                    - uCal * uCal, 1e-30));
            double expandedU = gain.expandedUncertainty();
            NormalDistribution noise = new NormalDistribution(null, 0, sigmaNoise);
            double p = 0;
            for (int i = 0; i < panels; i++) {
                double r = -a + (i + 0.5) * 2 * a / panels;
                p += (noise.cumulativeProbability(expandedU - r) - noise.cumulativeProbability(-expandedU - r)) / panels;
            }
            expected += p / TRIALS;
            sumU += expandedU;
        }
        double expandedU = sumU / TRIALS;
        double rate = covered / (double) TRIALS;
        double binomial = Math.sqrt(expected * (1 - expected) / TRIALS);
        String figures = String.format(Locale.ROOT, "coverage %.3f, expected %.4f (mean U %.5f dB)",
                rate, expected, expandedU);
        TestFigures.keep(getClass(), "aRectangularAccuracyCoversAsItsDistributionPredicts", figures);
        assertEquals(expected, rate, Math.max(3 * binomial, 1.0 / TRIALS), figures);
        assertTrue(rate >= 0.95, figures);
    }
}
