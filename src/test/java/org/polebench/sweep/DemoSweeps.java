package org.polebench.sweep;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * Invented sweeps from a closed form, for tests and the demo import samples: a non-inverting
 * stage with two low-frequency poles, two zeros at DC and one high-band pole,
 * H(s) = K·s²/((s + p1)(s + p2)) · 1/(1 + s/ph). Its phase is arg H with output leading
 * input positive, so it tends to +180° far below the corners.
 */
public final class DemoSweeps {
    /** Midband gain ratio (20 dB). */
    static final double K = 10.0;
    /** Pole frequencies in Hz: the dominant lower pole, the second lower pole, the high-band pole. */
    static final double P1_HZ = 3.0;
    static final double P2_HZ = 0.8;
    static final double PH_HZ = 80_000.0;

    private DemoSweeps() {
    }

    /** @return |H| in dB and arg H in degrees at one frequency */
    public static double[] response(double frequencyHz) {
        double w = 2 * Math.PI * frequencyHz;
        // numerator K·(jw)² = −K·w²
        double nr = -K * w * w;
        double ni = 0;
        double[] d = multiply(new double[] {2 * Math.PI * P1_HZ, w}, new double[] {2 * Math.PI * P2_HZ, w});
        d = multiply(d, new double[] {1, w / (2 * Math.PI * PH_HZ)});
        double denominator = d[0] * d[0] + d[1] * d[1];
        double hr = (nr * d[0] + ni * d[1]) / denominator;
        double hi = (ni * d[0] - nr * d[1]) / denominator;
        return new double[] {20 * Math.log10(Math.hypot(hr, hi)), Math.toDegrees(Math.atan2(hi, hr))};
    }

    private static double[] multiply(double[] a, double[] b) {
        return new double[] {a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]};
    }

    /** @return n log-spaced frequencies from lowHz to highHz */
    public static double[] logSpaced(double lowHz, double highHz, int n) {
        double[] f = new double[n];
        for (int i = 0; i < n; i++) {
            f[i] = lowHz * Math.pow(highHz / lowHz, i / (double) (n - 1));
        }
        return f;
    }

    /** The closed form at full precision, with provenance, from 0.5 Hz to 20 kHz. */
    public static Sweep twoPoleHighPass(int points, boolean withPhase) {
        List<SweepPoint> list = new ArrayList<>();
        for (double f : logSpaced(0.5, 20_000, points)) {
            double[] h = response(f);
            list.add(new SweepPoint(f, h[0], withPhase ? OptionalDouble.of(h[1]) : OptionalDouble.empty(),
                    OptionalDouble.of(0.02), withPhase ? OptionalDouble.of(0.3) : OptionalDouble.empty()));
        }
        Provenance source = new Provenance(Optional.empty(), "", "Demo analyser DA-1 (invented)", "canonical",
                Optional.of(Instant.parse("2031-04-02T14:05:00Z")), Optional.of("demo board 7"),
                List.of("DEMO DATA: invented from a closed form, not a measurement", "stage: demo-buffer"));
        return new Sweep(source, list);
    }
}
