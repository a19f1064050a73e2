package org.polebench.waveform;

import java.nio.file.Path;
import java.util.OptionalDouble;
import java.util.Random;

/** Synthetic records with known truth for the waveform tests: sines in seeded white Gaussian noise. */
final class TestRecords {
    private TestRecords() {
    }

    /** One channel's truth: A·cos(2πf·t + φ) + C, plus a third harmonic of relative size h3 at phase 0. */
    record Tone(double amplitude, double phaseRad, double offset, double thirdHarmonic) {
        static Tone of(double amplitude, double phaseRad, double offset) {
            return new Tone(amplitude, phaseRad, offset, 0);
        }

        double at(double omega, double t) {
            return amplitude * Math.cos(omega * t + phaseRad) + offset
                    + thirdHarmonic * amplitude * Math.cos(3 * omega * t);
        }
    }

    static WaveformRecord record(int n, double intervalSeconds, double startSeconds, double frequencyHz, Tone in,
                                 Tone out, double sigma, Random random, OptionalDouble stated) {
        double[] x = new double[n];
        double[] y = new double[n];
        double omega = 2 * Math.PI * frequencyHz;
        for (int i = 0; i < n; i++) {
            double t = startSeconds + i * intervalSeconds;
            x[i] = in.at(omega, t) + (sigma > 0 ? sigma * random.nextGaussian() : 0);
            y[i] = out.at(omega, t) + (sigma > 0 ? sigma * random.nextGaussian() : 0);
        }
        return new WaveformRecord(Path.of("synthetic.csv"), startSeconds, intervalSeconds, x, y, stated, 0);
    }

    /** The signed difference of two angles, folded into (−π, π]. */
    static double angleError(double a, double b) {
        return SineFitter.fold(a - b);
    }
}
