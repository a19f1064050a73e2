package org.polebench.report;

import org.polebench.fit.KnownResponse;
import org.polebench.sweep.Sweep;

/**
 * Sweeps of a known common-emitter response for the report tests (synthetic truth):
 * K = 42, two coupling zeros at DC, a bypass zero at 4.2 Hz, poles at 3, 16 and 180 Hz,
 * 100 points log-spaced up to 50 kHz.
 */
final class ReportFixtures {
    static final double K = 42;
    static final double Z = 4.2;
    static final double[] POLES = {3, 16, 180};

    private ReportFixtures() {
    }

    static Sweep stage(boolean withPhase, double lowHz) {
        KnownResponse truth = new KnownResponse(K, 2, KnownResponse.real(-Z),
                KnownResponse.real(-POLES[0], -POLES[1], -POLES[2]), Double.NaN);
        return truth.sweep(KnownResponse.logSpaced(lowHz, 50_000, 100), withPhase);
    }
}
