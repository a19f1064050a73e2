package org.polebench.report;

import java.util.Optional;

/**
 * The level of the test signal, as the operator set it.
 *
 * @param volts   the level in volts, positive
 * @param measure how the level is measured ("rms", "peak-to-peak" or "peak"); empty when the
 *                operator did not say
 */
public record TestLevel(double volts, Optional<String> measure) {
    public TestLevel {
        if (!(volts > 0) || !Double.isFinite(volts)) {
            throw new IllegalArgumentException("a test level is a positive voltage, was " + volts);
        }
    }
}
