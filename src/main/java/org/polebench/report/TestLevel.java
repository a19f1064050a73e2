package org.polebench.report;

import java.util.Optional;

/**
 * The level of the test signal, as the operator set it.
 *
 * @param volts   the level in volts, positive
 * @param measure how the level is measured ("rms", "peak-to-peak" or "peak"); empty when the
 *                operator did not say
 * @param from    where the level was given: {@link #COMMAND_LINE} or {@link #CAPTURE_PLAN}
 */
public record TestLevel(double volts, Optional<String> measure, String from) {
    /** Given with {@code --test-level}. */
    public static final String COMMAND_LINE = "command line";
    /** Read from the plan note {@code polebench capture} wrote into the sweep file. */
    public static final String CAPTURE_PLAN = "capture plan";

    public TestLevel {
        if (!(volts > 0) || !Double.isFinite(volts)) {
            throw new IllegalArgumentException("a test level is a positive voltage, was " + volts);
        }
    }
}
