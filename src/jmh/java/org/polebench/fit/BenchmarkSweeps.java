package org.polebench.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * Sweeps for the benchmarks: a common-emitter stage (K = 42, two DC zeros, a zero at 4.2 Hz,
 * poles at 3, 16 and 180 Hz), 100 points log-spaced from 1 Hz to 50 kHz, normal noise of 0.05 dB
 * and 0.5° with those uncertainties stated. Each sweep draws its own noise and a ±10 % spread of
 * the poles, so no two fits see the same data. Synthetic, invented for the benchmark.
 */
final class BenchmarkSweeps {
    private BenchmarkSweeps() {
    }

    static Sweep next(Random random) {
        double scale = 1 + 0.1 * (2 * random.nextDouble() - 1);
        double[] poles = {3 * scale, 16 * scale, 180 * scale};
        double zero = 4.2 * scale;
        List<SweepPoint> points = new ArrayList<>();
        for (int i = 0; i < 100; i++) {
            double f = Math.pow(10, 4.69897 * i / 99.0);
            // H = K·(jf)²·(jf + z)/Π(jf + p), frequencies in Hz
            double re = -42 * f * f;
            double im = 0;
            double[] h = mul(re, im, zero, f);
            for (double p : poles) {
                h = div(h[0], h[1], p, f);
            }
            double gainDb = 20 * Math.log10(Math.hypot(h[0], h[1])) + 0.05 * random.nextGaussian();
            double phaseDeg = Math.toDegrees(Math.atan2(h[1], h[0])) + 0.5 * random.nextGaussian();
            points.add(new SweepPoint(f, gainDb, OptionalDouble.of(phaseDeg), OptionalDouble.of(0.05),
                    OptionalDouble.of(0.5)));
        }
        return new Sweep(Provenance.inMemory("benchmark sweep (synthetic)"), points);
    }

    private static double[] mul(double a, double b, double c, double d) {
        return new double[]{a * c - b * d, a * d + b * c};
    }

    private static double[] div(double a, double b, double c, double d) {
        double m = c * c + d * d;
        return new double[]{(a * c + b * d) / m, (b * c - a * d) / m};
    }
}
