package org.polebench.report;

import java.util.ArrayList;
import java.util.List;
import org.polebench.measure.Provenance;
import org.polebench.measure.Sweep;
import org.polebench.measure.SweepPoint;

/**
 * Sweeps of known responses for the report tests, computed here in closed form:
 * H(f) = K·(jf)²·(jf + z)/((jf + p₁)(jf + p₂)(jf + p₃)) with frequencies in Hz (a common-emitter
 * stage: two coupling zeros at DC, a bypass zero; synthetic truth).
 */
final class ReportFixtures {
    static final double K = 42;
    static final double Z = 4.2;
    static final double[] POLES = {3, 16, 180};

    private ReportFixtures() {
    }

    static Sweep stage(boolean withPhase, double lowHz) {
        List<SweepPoint> points = new ArrayList<>();
        int n = 100;
        for (int i = 0; i < n; i++) {
            double f = lowHz * Math.pow(50_000 / lowHz, i / (double) (n - 1));
            double re = K * -f * f;
            double im = 0;
            double[] h = mul(re, im, Z, f);
            for (double p : POLES) {
                h = div(h[0], h[1], p, f);
            }
            double gainDb = 20 * Math.log10(Math.hypot(h[0], h[1]));
            double phaseDeg = Math.toDegrees(Math.atan2(h[1], h[0]));
            points.add(withPhase ? SweepPoint.of(f, gainDb, phaseDeg) : SweepPoint.magnitudeOnly(f, gainDb));
        }
        return new Sweep(Provenance.inMemory("synthetic report test sweep"), points);
    }

    private static double[] mul(double a, double b, double c, double d) {
        return new double[]{a * c - b * d, a * d + b * c};
    }

    private static double[] div(double a, double b, double c, double d) {
        double m = c * c + d * d;
        return new double[]{(a * c + b * d) / m, (b * c - a * d) / m};
    }
}
